package network

import (
	"math/big"
	"slices"
	"strings"

	"hess/thermo"
)

// A NetTerm is one species of a reaction with its net coefficient ν
// (products positive), a species written on both sides counted once. Nu
// may be shared with other terms (small whole numbers are): never change it
// in place.
type NetTerm struct {
	Species *Species
	Nu      *big.Rat
}

// NuFloat is the net coefficient as a float64, without allocating where
// it is a whole number that fits an int64.
func (t NetTerm) NuFloat() float64 { return ratFloat(t.Nu) }

// ratFloat is r as the nearest float64; whole numbers that fit an int64
// are converted without allocating.
func ratFloat(r *big.Rat) float64 {
	if r.IsInt() && r.Num().IsInt64() {
		return float64(r.Num().Int64())
	}
	f, _ := r.Float64()
	return f
}

// NetTerms returns the reaction's species with non-zero net coefficients, in
// the order they first appear (left side first). Undefined species are left
// out.
func (rx *Reaction) NetTerms() []NetTerm {
	if out, ok := rx.smallNetTerms(); ok {
		return out
	}
	var out []NetTerm
	add := func(terms []Term, sign int) {
		for _, t := range terms {
			if t.Species == nil || t.Coef == nil {
				continue
			}
			c := new(big.Rat).Set(t.Coef)
			if sign < 0 {
				c.Neg(c)
			}
			if i := slices.IndexFunc(out, func(n NetTerm) bool { return n.Species == t.Species }); i >= 0 {
				out[i].Nu.Add(out[i].Nu, c)
				continue
			}
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

// smallNetTerms is NetTerms where every coefficient is a small whole
// number: the sums are taken in integers, and a net coefficient from
// -maxSharedCoef to maxSharedCoef is a shared rational. ok is false when
// some coefficient is not such a number.
func (rx *Reaction) smallNetTerms() (out []NetTerm, ok bool) {
	var buf [12]speciesCount
	cs, ok := rx.smallNetCounts(buf[:0])
	if !ok {
		return nil, false
	}
	for _, c := range cs {
		if c.n != 0 {
			out = append(out, NetTerm{Species: c.key, Nu: sharedRat(c.n)})
		}
	}
	return out, true
}

// smallNetCounts appends to cs each species' net coefficient (zero where
// it cancels) in the order the species first appear, left side first,
// while every coefficient is a small whole number; ok is false at the
// first that is not.
func (rx *Reaction) smallNetCounts(cs []speciesCount) ([]speciesCount, bool) {
	for side, terms := range [2][]Term{rx.Left, rx.Right} {
		sign := int64(2*side - 1)
		for _, t := range terms {
			if t.Species == nil || t.Coef == nil {
				continue
			}
			n, isInt := smallInt(t.Coef)
			if !isInt {
				return cs, false
			}
			cs = addCount(cs, t.Species, sign*n)
		}
	}
	return cs, true
}

// netSpecies appends to buf the species of the reaction's net equation,
// those of NetTerms in its order, without allocating while every
// coefficient is a small whole number and the species fit buf: checks ask
// it of every reaction.
func (rx *Reaction) netSpecies(buf []*Species) []*Species {
	var cbuf [12]speciesCount
	cs, ok := rx.smallNetCounts(cbuf[:0])
	if !ok {
		for _, nt := range rx.NetTerms() {
			buf = append(buf, nt.Species)
		}
		return buf
	}
	for _, c := range cs {
		if c.n != 0 {
			buf = append(buf, c.key)
		}
	}
	return buf
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
	var small int64 // the sum while every gas coefficient is a small whole number
	exact := false
	for _, t := range terms {
		if t.Species.Activity() != thermo.ActivityGas {
			continue
		}
		if n, ok := smallInt(t.Nu); ok && !exact {
			small += n
			continue
		}
		exact = true
	}
	if !exact {
		return float64(small)
	}
	dn := new(big.Rat)
	for _, t := range terms {
		if t.Species.Activity() == thermo.ActivityGas {
			dn.Add(dn, t.Nu)
		}
	}
	return ratFloat(dn)
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
