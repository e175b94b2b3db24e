package equilibrium

import (
	"math/big"
	"strconv"
	"strings"

	"hess/lang"
	"hess/network"
	"hess/thermo"
)

// kindOf classifies the reaction's equilibrium constant (CLI.md): Kp, Ksp, Kc
// or K.
func kindOf(terms []network.NetTerm) string {
	r := thermo.Reaction{}
	for _, t := range terms {
		nu := t.NuFloat()
		r.Terms = append(r.Terms, thermo.Term{Nu: nu, Activity: t.Species.QuotientActivity()})
	}
	return string(r.Kind())
}

// quotientText writes the reaction quotient as CLI.md shows it: products
// over reactants, gases as p(X), solutes as [X], solution members as x(X),
// species of unknown phase as a(X), pure phases left out, each raised to
// its coefficient where that is not 1.
func quotientText(terms []network.NetTerm) string {
	var num, den []string
	for _, t := range terms {
		a := t.Species.QuotientActivity()
		if a.Pure() {
			continue
		}
		f := factorText(t.Species, a)
		switch {
		case t.Nu.IsInt() && t.Nu.Num().IsInt64():
			if n := t.Nu.Num().Int64(); n != 1 && n != -1 {
				f += "^" + strconv.FormatUint(absInt64(n), 10)
			}
		default:
			f += "^(" + new(big.Rat).Abs(t.Nu).RatString() + ")"
		}
		if t.Nu.Sign() > 0 {
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

// absInt64 is |n|, correct for the most negative int64 too.
func absInt64(n int64) uint64 {
	if n < 0 {
		return uint64(-(n + 1)) + 1
	}
	return uint64(n)
}

func factorText(sp *network.Species, a thermo.Activity) string {
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
		if sp.Phase != nil && sp.Phase.Convention == network.SolutionMember {
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
