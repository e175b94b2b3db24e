package chem

import (
	"sort"
	"strings"
)

// A ReferenceState is an element's standard reference state at 298.15 K:
// the substance (atoms per formula unit and phase) whose ΔfH° and ΔfG° are
// zero by convention, and its standard entropy with the source of the value.
type ReferenceState struct {
	Atoms  int64
	Phase  string  // "g", "l" or "cr" (cr also matches s)
	S      float64 // S° of the substance at 298.15 K, J/(mol·K) per formula unit
	SigmaS float64
	Source string
}

// Reference-state entropies, from the CODATA Key Values for Thermodynamics
// (Cox, Wagman and Medvedev, 1989) unless noted. Values marked "from
// memory" were recalled, not read from a copy of the tables.
var referenceStates = map[string]ReferenceState{
	"H":  {2, "g", 130.680, 0.003, "CODATA 1989"},
	"O":  {2, "g", 205.152, 0.005, "CODATA 1989"},
	"N":  {2, "g", 191.609, 0.004, "CODATA 1989"},
	"C":  {1, "cr", 5.74, 0.10, "CODATA 1989 (graphite)"},
	"Cl": {2, "g", 223.081, 0.010, "CODATA 1989"},
	"Ag": {1, "cr", 42.55, 0.20, "CODATA 1989"},
	"Ca": {1, "cr", 41.59, 0.40, "CODATA 1989 (from memory; NIST-JANAF 41.588)"},
	"F":  {2, "g", 202.791, 0.005, "CODATA 1989 (from memory)"},
	"Br": {2, "l", 152.21, 0.30, "CODATA 1989 (from memory)"},
	"I":  {2, "cr", 116.14, 0.30, "CODATA 1989 (from memory)"},
	"S":  {1, "cr", 32.054, 0.050, "CODATA 1989 (rhombic; from memory)"},
	"Na": {1, "cr", 51.30, 0.20, "CODATA 1989 (from memory)"},
	"K":  {1, "cr", 64.68, 0.20, "CODATA 1989 (from memory)"},
	"Mg": {1, "cr", 32.67, 0.10, "CODATA 1989 (from memory)"},
	"Al": {1, "cr", 28.30, 0.10, "CODATA 1989 (from memory)"},
	"Si": {1, "cr", 18.81, 0.08, "CODATA 1989 (from memory)"},
	"Zn": {1, "cr", 41.63, 0.15, "CODATA 1989 (from memory)"},
	"Cu": {1, "cr", 33.15, 0.08, "CODATA 1989 (from memory)"},
	"Hg": {1, "l", 75.90, 0.12, "CODATA 1989 (from memory)"},
	"Pb": {1, "cr", 64.80, 0.30, "CODATA 1989 (from memory)"},
	"He": {1, "g", 126.153, 0.002, "CODATA 1989 (from memory)"},
	"Ne": {1, "g", 146.328, 0.003, "CODATA 1989 (from memory)"},
	"Ar": {1, "g", 154.846, 0.003, "CODATA 1989 (from memory)"},
	"Kr": {1, "g", 164.085, 0.003, "CODATA 1989 (from memory)"},
	"Xe": {1, "g", 169.685, 0.003, "CODATA 1989 (from memory)"},
}

// LookupReferenceState returns the reference state of the element symbol,
// and false for an element with no tabulated reference entropy.
func LookupReferenceState(symbol string) (ReferenceState, bool) {
	rs, ok := referenceStates[symbol]
	return rs, ok
}

// ReferenceElements names the elements with a reference entropy, sorted
// and separated by spaces.
func ReferenceElements() string {
	syms := make([]string, 0, len(referenceStates))
	for s := range referenceStates {
		syms = append(syms, s)
	}
	sort.Strings(syms)
	return strings.Join(syms, " ")
}
