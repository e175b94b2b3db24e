module hess

go 1.26

require (
	github.com/alecthomas/participle/v2 v2.1.4
	gonum.org/v1/gonum v0.17.0
)
