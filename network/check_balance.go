package network

import (
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
