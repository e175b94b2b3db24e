package network

import (
	"math/big"
	"sort"
	"strings"

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
		seen := map[string]*Reaction{}
		for _, rx := range p.Net.Reactions {
			if !rx.Resolved {
				continue
			}
			fwd, rev := netKeys(rx)
			if fwd == "" {
				continue
			}
			if first, ok := seen[fwd]; ok {
				p.Report(lang.Diagnostic{Subject: rx.NameSpan, Context: rx.Span,
					Message: "reaction " + rx.Name + " has the same equation as " + first.Name,
					Related: []lang.Related{{Span: first.NameSpan, Message: first.Name + " defined here"}}})
				continue
			}
			if first, ok := seen[rev]; ok {
				p.Report(lang.Diagnostic{Subject: rx.NameSpan, Context: rx.Span,
					Message: "reaction " + rx.Name + " is " + first.Name + " reversed",
					Related: []lang.Related{{Span: first.NameSpan, Message: first.Name + " defined here"}}})
				continue
			}
			seen[fwd] = rx
		}
	},
}

// netKeys returns a canonical text of the reaction's net stoichiometry
// (products positive) and of its reverse.
func netKeys(rx *Reaction) (fwd, rev string) {
	if f, r, ok := netKeysInt(rx); ok {
		return f, r
	}
	net := map[string]*big.Rat{}
	add := func(terms []Term, sign int64) {
		for _, t := range terms {
			acc, ok := net[t.Species.Key]
			if !ok {
				acc = new(big.Rat)
				net[t.Species.Key] = acc
			}
			acc.Add(acc, new(big.Rat).Mul(t.Coef, big.NewRat(sign, 1)))
		}
	}
	add(rx.Left, -1)
	add(rx.Right, 1)
	keys := make([]string, 0, len(net))
	for k, v := range net {
		if v.Sign() != 0 {
			keys = append(keys, k)
		}
	}
	if len(keys) == 0 {
		return "", ""
	}
	sort.Strings(keys)
	var f, r strings.Builder
	for _, k := range keys {
		v := net[k]
		f.WriteString(k + "=" + v.RatString() + ";")
		r.WriteString(k + "=" + new(big.Rat).Neg(v).RatString() + ";")
	}
	return f.String(), r.String()
}
