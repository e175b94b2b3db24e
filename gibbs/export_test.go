package gibbs

// ChonProblem lets the external tests build the C–H–O problems.
var ChonProblem = chonProblem
