package network

import (
	"math/big"
	"sort"
	"strings"

	"hess/lang"
)

var elementImbalanceCheck = &Check{
	Name:     "element-imbalance",
	Severity: lang.Error,
	Doc: `a reaction does not balance in some element
For every element, the count on the left (each species' formula times its
coefficient) must equal the count on the right. Coefficients are exact
fractions, so 1/2 O2 balances exactly. The message lists each unbalanced
element with its left and right counts.`,
	Run: func(p *Pass) {
		for _, rx := range p.Net.Reactions {
			if !rx.Resolved {
				continue
			}
			if f := rx.facts(); f.intOK && f.elements {
				continue
			}
			left, right := elementCounts(rx.Left), elementCounts(rx.Right)
			var parts []string
			for _, sym := range unionKeys(left, right) {
				l, r := ratOrZero(left[sym]), ratOrZero(right[sym])
				if l.Cmp(r) != 0 {
					parts = append(parts, sym+": left "+ratText(l)+", right "+ratText(r))
				}
			}
			if len(parts) > 0 {
				p.Report(lang.Diagnostic{Subject: rx.Equation, Context: rx.Span, Message: strings.Join(parts, "; ")})
			}
		}
	},
}

var chargeImbalanceCheck = &Check{
	Name:     "charge-imbalance",
	Severity: lang.Error,
	Doc: `a reaction does not balance in charge
The net charge of the left side (each species' charge times its
coefficient, the electron e- counting -1) must equal that of the right side.
The message gives both net charges.`,
	Run: func(p *Pass) {
		for _, rx := range p.Net.Reactions {
			if !rx.Resolved {
				continue
			}
			if unchargedSpecies(rx) {
				continue
			}
			if f := rx.facts(); f.intOK && f.charge {
				continue
			}
			l, r := netCharge(rx.Left), netCharge(rx.Right)
			if l.Cmp(r) != 0 {
				p.Reportf(rx.Equation, "net charge: left %s, right %s", chargeText(l), chargeText(r))
			}
		}
	},
}

// elementCounts sums each element over a side of a reaction.
func elementCounts(terms []Term) map[string]*big.Rat {
	out := map[string]*big.Rat{}
	for _, t := range terms {
		for _, ec := range t.Species.Formula.Elements {
			acc, ok := out[ec.Symbol]
			if !ok {
				acc = new(big.Rat)
				out[ec.Symbol] = acc
			}
			acc.Add(acc, new(big.Rat).Mul(t.Coef, ec.Count))
		}
	}
	return out
}

func netCharge(terms []Term) *big.Rat {
	out := new(big.Rat)
	for _, t := range terms {
		out.Add(out, new(big.Rat).Mul(t.Coef, big.NewRat(int64(t.Species.Charge), 1)))
	}
	return out
}

func unionKeys(a, b map[string]*big.Rat) []string {
	keys := make([]string, 0, len(a)+len(b))
	for k := range a {
		keys = append(keys, k)
	}
	for k := range b {
		if _, ok := a[k]; !ok {
			keys = append(keys, k)
		}
	}
	sort.Strings(keys)
	return keys
}

func ratOrZero(r *big.Rat) *big.Rat {
	if r == nil {
		return new(big.Rat)
	}
	return r
}

// ratText prints an exact count: an integer, or p/q.
func ratText(r *big.Rat) string {
	if r.IsInt() {
		return r.Num().String()
	}
	return r.RatString()
}

func chargeText(r *big.Rat) string {
	s := ratText(r)
	if r.Sign() > 0 {
		s = "+" + s
	}
	return s
}
