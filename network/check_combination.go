package network

import (
	"fmt"
	"math/big"
	"strings"

	"hess/lang"
)

var combinationMismatchCheck = &Check{
	Name:     "combination-mismatch",
	Severity: lang.Error,
	Doc: `a coupled reaction's equation is not the sum it claims
A coupled reaction written with a combination, such as
reaction overall: CH4(g) + 2 H2O(g) <-> CO2(g) + 4 H2(g) = reform + shift,
takes its data from its parts: ΔrG° adds and K multiplies with the weights.
That holds only when the written equation is exactly the weighted sum of
the parts' equations. The comparison is of net coefficients (products
positive) in exact fractions; the message lists each species whose
coefficient differs, as written and in the sum.`,
	Run: func(p *Pass) {
		for _, rx := range p.Net.Reactions {
			if len(rx.Combo) == 0 || !rx.Resolved {
				continue
			}
			sum, ok := comboSum(rx)
			if !ok {
				continue
			}
			written := map[*Species]*big.Rat{}
			var order []*Species
			for _, t := range rx.NetTerms() {
				written[t.Species] = t.Nu
				order = append(order, t.Species)
			}
			for _, sp := range sum.order {
				if _, seen := written[sp]; !seen {
					order = append(order, sp)
				}
			}
			var parts []string
			for _, sp := range order {
				w, s := ratOrZero(written[sp]), ratOrZero(sum.nu[sp])
				if w.Cmp(s) != 0 {
					parts = append(parts, fmt.Sprintf("%s written %s, sum %s", sp.Key, ratText(w), ratText(s)))
				}
			}
			if len(parts) == 0 {
				continue
			}
			combo := rx.Combo[0].Span.Join(rx.Combo[len(rx.Combo)-1].Span)
			d := lang.Diagnostic{Subject: combo, Context: rx.Span(),
				Message: fmt.Sprintf("%s is not %s: %s (net coefficients, products positive)", rx.Name, comboText(rx.Combo), strings.Join(parts, "; "))}
			for _, ct := range rx.Combo {
				d.Related = append(d.Related, lang.Related{Span: ct.Reaction.NameSpan(), Message: ct.Reaction.Name + ": " + ct.Reaction.EquationText()})
			}
			p.Report(d)
		}
	},
}

// netSum is a weighted sum of reactions' net coefficients.
type netSum struct {
	nu    map[*Species]*big.Rat
	order []*Species
}

// comboSum adds up a coupled reaction's parts with their weights. ok is
// false when a part is undefined or does not resolve.
func comboSum(rx *Reaction) (netSum, bool) {
	s := netSum{nu: map[*Species]*big.Rat{}}
	for _, ct := range rx.Combo {
		if ct.Reaction == nil || ct.Weight == nil || !ct.Reaction.Resolved {
			return s, false
		}
		for _, t := range ct.Reaction.NetTerms() {
			acc, ok := s.nu[t.Species]
			if !ok {
				acc = new(big.Rat)
				s.nu[t.Species] = acc
				s.order = append(s.order, t.Species)
			}
			acc.Add(acc, new(big.Rat).Mul(ct.Weight, t.Nu))
		}
	}
	return s, true
}

// comboText writes a combination as in the source: "reform + 2 shift - dry".
func comboText(terms []ComboTerm) string {
	var b strings.Builder
	for i, ct := range terms {
		w := new(big.Rat).Abs(ct.Weight)
		switch {
		case ct.Weight.Sign() < 0 && i == 0:
			b.WriteString("-")
		case ct.Weight.Sign() < 0:
			b.WriteString(" - ")
		case i > 0:
			b.WriteString(" + ")
		}
		if w.Cmp(big.NewRat(1, 1)) != 0 {
			b.WriteString(ratText(w) + " ")
		}
		b.WriteString(ct.Name)
	}
	return b.String()
}
