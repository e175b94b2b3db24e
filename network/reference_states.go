package network

import (
	"math"
	"math/big"
	"sort"
	"strings"

	"hess/thermo"
)

// referenceState is an element's standard reference state at 298.15 K:
// the substance (atoms per formula unit and phase) whose ΔfH° and ΔfG° are
// zero by convention, and its standard entropy.
type referenceState struct {
	atoms  int64
	phase  string  // "g", "l" or "cr" (cr also matches s)
	S      float64 // S° of the substance at 298.15 K, J/(mol·K) per formula unit
	sigmaS float64
	source string
}

// Reference-state entropies, from the CODATA Key Values for Thermodynamics
// (Cox, Wagman and Medvedev, 1989) unless noted. Values marked "from
// memory" were recalled, not read from a copy of the tables.
var referenceStates = map[string]referenceState{
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

// referenceElementList names the elements with a reference entropy, for
// the explanation of formation-inconsistent.
func referenceElementList() string {
	syms := make([]string, 0, len(referenceStates))
	for s := range referenceStates {
		syms = append(syms, s)
	}
	sort.Strings(syms)
	return strings.Join(syms, " ")
}

// isReferenceElement reports whether the species is an element in its
// reference state (H2(g), C(cr), Br2(l), …), whose ΔfH° and ΔfG° are zero
// by convention.
func isReferenceElement(sp *Species) bool {
	if !sp.HasFormula || sp.Charge != 0 || sp.Parts.Electron || len(sp.Formula.Elements) != 1 || sp.Phase == nil {
		return false
	}
	ec := sp.Formula.Elements[0]
	rs, ok := referenceStates[ec.Symbol]
	if !ok || ec.Count.Cmp(big.NewRat(rs.atoms, 1)) != 0 {
		return false
	}
	switch tag := sp.Phase.Tag; rs.phase {
	case "cr":
		return tag == "cr" || tag == "s"
	default:
		return tag == rs.phase
	}
}

// formationEntropyOffset returns Σ S° of the elements that form one mole
// of the species in their reference states, in J/(mol·K), so that ΔfS° =
// S° − offset, and its standard uncertainty. For an aqueous ion of charge z
// the H+(aq) convention adds −(z/2)·S°(H2): the ion forms with z H+(aq)
// (S° = 0 by convention) giving z/2 H2(g). ok is false for the electron, a
// charged species outside a solute phase, and a species with an element of
// no tabulated reference entropy.
func formationEntropyOffset(sp *Species) (offset, sigma float64, ok bool) {
	if !sp.HasFormula || sp.Parts.Electron {
		return 0, 0, false
	}
	variance := 0.0
	for _, ec := range sp.Formula.Elements {
		rs, found := referenceStates[ec.Symbol]
		if !found {
			return 0, 0, false
		}
		n, _ := ec.Count.Float64()
		f := n / float64(rs.atoms)
		offset += f * rs.S
		variance += f * f * rs.sigmaS * rs.sigmaS
	}
	if sp.Charge != 0 {
		if sp.Phase == nil || sp.Phase.Convention != Solute {
			return 0, 0, false
		}
		h := referenceStates["H"]
		f := -float64(sp.Charge) / 2
		offset += f * h.S
		variance += f * f * h.sigmaS * h.sigmaS
	}
	return offset, math.Sqrt(variance), true
}

// formationAt298 returns a species' ΔfH° and S° at 298.15 K, from hf and s
// where given, else from its polynomial model where that covers 298.15 K.
func formationAt298(sp *Species) (h, sigmaH, s, sigmaS float64, ok bool) {
	var m thermo.Model
	if len(sp.Ranges) > 0 {
		m = sp.Model()
	}
	switch {
	case sp.Hf != nil:
		h, sigmaH = sp.Hf.V, sp.Hf.Sigma
	case m != nil && covers(m, thermo.T298):
		h = m.H(thermo.T298)
	default:
		return 0, 0, 0, 0, false
	}
	switch {
	case sp.S != nil:
		s, sigmaS = sp.S.V, sp.S.Sigma
	case m != nil && covers(m, thermo.T298):
		s = m.S(thermo.T298)
	default:
		return 0, 0, 0, 0, false
	}
	if math.IsNaN(h) || math.IsNaN(s) {
		return 0, 0, 0, 0, false
	}
	return h, sigmaH, s, sigmaS, true
}

// formationGibbs returns a species' ΔfG° at 298.15 K from its data: zero
// for an element in its reference state; gf where given; else
// hf − T·(S° − Σ S° of the elements). ok is false when the data do not
// give it; opaque is true when the species has data that cannot be put on
// the ΔfG° scale (an element with no reference entropy).
func formationGibbs(sp *Species) (g, sigma float64, ok, opaque bool) {
	if isReferenceElement(sp) {
		return 0, 0, true, false
	}
	if sp.Gf != nil {
		return sp.Gf.V, sp.Gf.Sigma, true, false
	}
	h, sh, s, ss, have := formationAt298(sp)
	if !have {
		return 0, 0, false, len(sp.Ranges) > 0
	}
	off, so, known := formationEntropyOffset(sp)
	if !known {
		return 0, 0, false, true
	}
	T := thermo.T298
	g = h - T*(s-off)
	sigma = math.Sqrt(sh*sh + T*T*(ss*ss+so*so))
	return g, sigma, true, false
}
