// Package network turns network files into a checked model: it reads a
// root file and its includes through a Source (load.go, source.go),
// compiles names, units and data into the model (compile*.go, model.go),
// and runs the registered checks (checks.go, check_*.go), which report
// every problem as a lang.Diagnostic. It also holds what the checks and the
// language server share: one reaction's standard properties and K at any
// temperature (reaction_k.go, table_rows.go), net stoichiometry and
// activity conventions (activity.go), a mixture's activities and quotient
// (mixture_activity.go), the stoichiometric matrix and its cycles, own-data
// least squares, rate orders and reverse-rate fits, and positions to names
// for editors (symbols.go).
//
// It never writes output and never panics on input. Formulas and elements
// are chem's; tables and a mixture's approach to equilibrium are built on
// it by package equilibrium, which it never imports.
package network
