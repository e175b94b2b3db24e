package network

import (
	"math/big"
	"strings"

	"hess/thermo"
)

// A NetTerm is one species of a reaction with its net coefficient ν
// (products positive), a species written on both sides counted once.
type NetTerm struct {
	Species *Species
	Nu      *big.Rat
}

// NetTerms returns the reaction's species with non-zero net coefficients, in
// the order they first appear (left side first). Undefined species are left
// out.
func (rx *Reaction) NetTerms() []NetTerm {
	var out []NetTerm
	index := map[*Species]int{}
	add := func(terms []Term, sign int) {
		for _, t := range terms {
			if t.Species == nil || t.Coef == nil {
				continue
			}
			c := new(big.Rat).Set(t.Coef)
			if sign < 0 {
				c.Neg(c)
			}
			if i, ok := index[t.Species]; ok {
				out[i].Nu.Add(out[i].Nu, c)
				continue
			}
			index[t.Species] = len(out)
			out = append(out, NetTerm{Species: t.Species, Nu: c})
		}
	}
	add(rx.Left, -1)
	add(rx.Right, 1)
	kept := out[:0]
	for _, t := range out {
		if t.Nu.Sign() != 0 {
			kept = append(kept, t)
		}
	}
	return kept
}

// QuotientActivity is the activity convention the species carries in an
// equilibrium expression. A species without a known phase counts as one
// with an activity of its own (neither gas, solute nor pure), so its
// reaction's constant is of kind K.
func (sp *Species) QuotientActivity() thermo.Activity {
	if a := sp.Activity(); a != thermo.ActivityUnstated {
		return a
	}
	return thermo.ActivitySolution
}

// deltaGasMoles is Δn, the net change in moles of gas.
func deltaGasMoles(terms []NetTerm) float64 {
	dn := new(big.Rat)
	for _, t := range terms {
		if t.Species.Activity() == thermo.ActivityGas {
			dn.Add(dn, t.Nu)
		}
	}
	f, _ := dn.Float64()
	return f
}

// EquationText writes the reaction's equation with canonical species names
// and its arrow: "CO(g) + H2O(g) <-> CO2(g) + H2(g)".
func (rx *Reaction) EquationText() string {
	side := func(terms []Term) string {
		parts := make([]string, 0, len(terms))
		for _, t := range terms {
			name := "?"
			if t.Species != nil {
				name = t.Species.Key
			}
			if t.Coef != nil && t.Coef.Cmp(big.NewRat(1, 1)) != 0 {
				name = ratText(t.Coef) + " " + name
			}
			parts = append(parts, name)
		}
		return strings.Join(parts, " + ")
	}
	arrow := " -> "
	if rx.TwoWay {
		arrow = " <-> "
	}
	return side(rx.Left) + arrow + side(rx.Right)
}
