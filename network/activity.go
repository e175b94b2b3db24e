package network

import (
	"math/big"
	"strings"

	"hess/lang"
	"hess/thermo"
)

// netTerm is one species of a reaction with its net coefficient ν (products
// positive), a species written on both sides counted once.
type netTerm struct {
	species *Species
	nu      *big.Rat
}

// netTerms returns the reaction's species with non-zero net coefficients, in
// the order they first appear (left side first). Undefined species are left
// out.
func netTerms(rx *Reaction) []netTerm {
	var out []netTerm
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
				out[i].nu.Add(out[i].nu, c)
				continue
			}
			index[t.Species] = len(out)
			out = append(out, netTerm{species: t.Species, nu: c})
		}
	}
	add(rx.Left, -1)
	add(rx.Right, 1)
	kept := out[:0]
	for _, t := range out {
		if t.nu.Sign() != 0 {
			kept = append(kept, t)
		}
	}
	return kept
}

// quotientActivity is the activity a term carries in the equilibrium
// expression. A species without a known phase counts as one with an
// activity of its own (neither gas, solute nor pure), so its reaction's
// constant is of kind K.
func quotientActivity(sp *Species) thermo.Activity {
	if a := sp.Activity(); a != thermo.ActivityUnstated {
		return a
	}
	return thermo.ActivitySolution
}

// kindOf classifies the reaction's equilibrium constant (CLI.md): Kp, Ksp, Kc
// or K.
func kindOf(terms []netTerm) string {
	r := thermo.Reaction{}
	for _, t := range terms {
		nu, _ := t.nu.Float64()
		r.Terms = append(r.Terms, thermo.Term{Nu: nu, Activity: quotientActivity(t.species)})
	}
	return string(r.Kind())
}

// deltaGasMoles is Δn, the net change in moles of gas.
func deltaGasMoles(terms []netTerm) float64 {
	dn := new(big.Rat)
	for _, t := range terms {
		if t.species.Activity() == thermo.ActivityGas {
			dn.Add(dn, t.nu)
		}
	}
	f, _ := dn.Float64()
	return f
}

// quotientText writes the reaction quotient as CLI.md shows it: products
// over reactants, gases as p(X), solutes as [X], solution members as x(X),
// species of unknown phase as a(X), pure phases left out, each raised to
// its coefficient where that is not 1.
func quotientText(terms []netTerm) string {
	var num, den []string
	for _, t := range terms {
		a := quotientActivity(t.species)
		if a.Pure() {
			continue
		}
		f := factorText(t.species, a)
		abs := new(big.Rat).Abs(t.nu)
		if abs.Cmp(big.NewRat(1, 1)) != 0 {
			if abs.IsInt() {
				f += "^" + abs.Num().String()
			} else {
				f += "^(" + abs.RatString() + ")"
			}
		}
		if t.nu.Sign() > 0 {
			num = append(num, f)
		} else {
			den = append(den, f)
		}
	}
	n, d := joinFactors(num), joinFactors(den)
	switch {
	case d == "" && n == "":
		return "1"
	case d == "":
		return n
	case n == "":
		n = "1"
	}
	if len(den) > 1 {
		d = "(" + d + ")"
	}
	return n + " / " + d
}

func factorText(sp *Species, a thermo.Activity) string {
	name := sp.Parts.Base + lang.ChargeText(sp.Charge)
	if sp.Parts.Electron {
		name = "e-"
	}
	switch a {
	case thermo.ActivityGas:
		return "p(" + name + ")"
	case thermo.ActivitySolute:
		return "[" + name + "]"
	case thermo.ActivitySolution:
		if sp.Phase != nil && sp.Phase.Convention == SolutionMember {
			return "x(" + name + ")"
		}
	}
	return "a(" + name + ")"
}

// joinFactors writes a product: concentrations in brackets stand side by
// side ([Ag+][Cl-]); other factors are separated by a space.
func joinFactors(fs []string) string {
	var b strings.Builder
	for i, f := range fs {
		if i > 0 && !(strings.HasPrefix(f, "[") && strings.HasPrefix(fs[i-1], "[")) {
			b.WriteByte(' ')
		}
		b.WriteString(f)
	}
	return b.String()
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
