package network

import (
	"math"
	"math/big"

	"hess/chem"
	"hess/thermo"
)

// isReferenceElement reports whether the species is an element in its
// reference state (H2(g), C(cr), Br2(l), …), whose ΔfH° and ΔfG° are zero
// by convention.
func isReferenceElement(sp *Species) bool {
	if !sp.HasFormula || sp.Charge != 0 || sp.Parts.Electron || len(sp.Formula.Elements) != 1 || sp.Phase == nil {
		return false
	}
	ec := sp.Formula.Elements[0]
	rs, ok := chem.LookupReferenceState(ec.Symbol)
	if !ok || ec.Count.Cmp(big.NewRat(rs.Atoms, 1)) != 0 {
		return false
	}
	switch tag := sp.Phase.Tag; rs.Phase {
	case "cr":
		return tag == "cr" || tag == "s"
	default:
		return tag == rs.Phase
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
	return formationEntropyOffsetAt(sp, thermo.Bar)
}

// formationEntropyOffsetAt is formationEntropyOffset with the elements'
// entropies at the standard pressure p0 (Pa): the tabulated values refer to
// 1 bar, and a gaseous element's S° moves by −R·ln(p0/1 bar).
func formationEntropyOffsetAt(sp *Species, p0 float64) (offset, sigma float64, ok bool) {
	if !sp.HasFormula || sp.Parts.Electron {
		return 0, 0, false
	}
	variance := 0.0
	for _, ec := range sp.Formula.Elements {
		rs, found := chem.LookupReferenceState(ec.Symbol)
		if !found {
			return 0, 0, false
		}
		n := ratFloat(ec.Count)
		f := n / float64(rs.Atoms)
		offset += f * referenceEntropyAt(rs, p0)
		variance += f * f * rs.SigmaS * rs.SigmaS
	}
	if sp.Charge != 0 {
		if sp.Phase == nil || sp.Phase.Convention != Solute {
			return 0, 0, false
		}
		h, _ := chem.LookupReferenceState("H")
		f := -float64(sp.Charge) / 2
		offset += f * referenceEntropyAt(h, p0)
		variance += f * f * h.SigmaS * h.SigmaS
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
	case m != nil && sp.DataAt(thermo.T298):
		h = m.H(thermo.T298)
	default:
		return 0, 0, 0, 0, false
	}
	switch {
	case sp.S != nil:
		s, sigmaS = sp.S.V, sp.S.Sigma
	case m != nil && sp.DataAt(thermo.T298):
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

// referenceEntropyAt is an element's reference-state entropy at the
// standard pressure p0 (Pa): the tabulated value (at 1 bar) for a condensed
// reference state, shifted by R·ln(1 bar/p0) for a gas.
func referenceEntropyAt(rs chem.ReferenceState, p0 float64) float64 {
	if rs.Phase != "g" || !(p0 > 0) {
		return rs.S
	}
	return rs.S + thermo.StandardPressureEntropyShift(thermo.Bar, p0)
}
