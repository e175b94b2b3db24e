package network

import (
	"math"

	"hess/lang"
)

var duplicateReactionCheck = &Check{
	Name:     "duplicate-reaction",
	Severity: lang.Warning,
	Doc: `two reactions have the same equation
Two reactions whose net equations are equal, or one the other reversed,
describe the same process; keeping both usually means one was copied and
not changed. A multiple of a reaction (2 H2 + O2 against H2 + 1/2 O2) is a
different reaction and is not reported.`,
	Run: func(p *Pass) {
		// The first reaction of each key, by its index in the network: a
		// map of 24-byte entries, which a large network's walk reaches in
		// no useful order.
		seen := make(map[string]int32, len(p.Net.Reactions))
		for i, rx := range p.Net.Reactions {
			if !rx.Resolved {
				continue
			}
			f := rx.facts()
			if f.key == "" {
				continue
			}
			at, ok := seen[f.key]
			if !ok {
				if i <= math.MaxInt32 {
					seen[f.key] = int32(i)
				}
				continue
			}
			first := p.Net.Reactions[at]
			msg := "reaction " + rx.Name + " has the same equation as " + first.Name
			if first.facts().reversed != f.reversed {
				msg = "reaction " + rx.Name + " is " + first.Name + " reversed"
			}
			p.Report(lang.Diagnostic{Subject: rx.NameSpan(), Context: rx.Span(), Message: msg,
				Related: []lang.Related{{Span: first.NameSpan(), Message: first.Name + " defined here"}}})
		}
	},
}
