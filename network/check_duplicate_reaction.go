package network

import "hess/lang"

var duplicateReactionCheck = &Check{
	Name:     "duplicate-reaction",
	Severity: lang.Warning,
	Doc: `two reactions have the same equation
Two reactions whose net equations are equal, or one the other reversed,
describe the same process; keeping both usually means one was copied and
not changed. A multiple of a reaction (2 H2 + O2 against H2 + 1/2 O2) is a
different reaction and is not reported.`,
	Run: func(p *Pass) {
		type seenAs struct {
			rx       *Reaction
			reversed bool
		}
		seen := make(map[string]seenAs, len(p.Net.Reactions))
		for _, rx := range p.Net.Reactions {
			if !rx.Resolved {
				continue
			}
			f := rx.facts()
			if f.key == "" {
				continue
			}
			first, ok := seen[f.key]
			if !ok {
				seen[f.key] = seenAs{rx, f.reversed}
				continue
			}
			msg := "reaction " + rx.Name + " has the same equation as " + first.rx.Name
			if first.reversed != f.reversed {
				msg = "reaction " + rx.Name + " is " + first.rx.Name + " reversed"
			}
			p.Report(lang.Diagnostic{Subject: rx.NameSpan(), Context: rx.Span(), Message: msg,
				Related: []lang.Related{{Span: first.rx.NameSpan(), Message: first.rx.Name + " defined here"}}})
		}
	},
}
