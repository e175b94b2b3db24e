// Package chem holds the chemistry that knows no file: the periodic table
// with standard atomic weights (elements.go), the formula parser and
// formulas in Hill order with exact counts (formula.go), and the elements'
// standard reference states with their entropies (reference_states.go).
//
// It never reads a network, reports a diagnostic or evaluates a reaction:
// callers turn a FormulaError into a diagnostic and decide what a species'
// formula means for its data. It imports nothing of ours.
package chem
