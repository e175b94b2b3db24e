package network

import (
	"fmt"
	"math"
	"strings"

	"hess/lang"
	"hess/thermo"
)

var cycleInconsistentCheck = &Check{
	Name:     "cycle-inconsistent",
	Severity: lang.Error,
	Doc: `reactions' own data do not add up around a cycle
Reactions that carry their own data (dg, dh and ds, logk, or a forward and
reverse rate) may form cycles: weighted sums that are the empty reaction,
such as reform + shift - overall. Around every cycle ΔrG° must sum to zero
at each temperature (the requested ones and those of every logk), and
ΔrH° must sum to zero where every reaction of the cycle carries dh
(Hess's law). ΔrG° comes from a logk at that temperature, from two of dh,
ds and dg (or dh with one logk) taken as constant ΔrH° and ΔrS°, from dg
alone at 298.15 K, from the van 't Hoff fit of several logk between their
temperatures, or from kf/kr where the species have no data, all converted
to the network's standard pressure; a cycle made only of rate pairs
is the Wegscheider condition, that the product of kf/kr around it is 1.
Cycles are an exact basis with the smallest integer weights. A cycle is
reported when its sum exceeds both the tolerance setting and twice its
uncertainty (propagated from the data's ± values). The detail names the
likely bad datum: a weighted least-squares fit of species potentials to
all reactions' own data, whose largest normalised residual points at the
culprit; reactions on cycles that close are cleared, and where the data
cannot tell reactions apart they are named as equally suspect.`,
	Run: func(p *Pass) {
		a := analyseCycles(p.Net)
		for _, d := range a.diagnostics() {
			p.Report(d)
		}
	},
}

func (a *cycleAnalysis) diagnostics() []lang.Diagnostic {
	var out []lang.Diagnostic
	for _, f := range a.findings() {
		out = append(out, a.diagnostic(f))
	}
	return out
}

func (a *cycleAnalysis) diagnostic(f *finding) lang.Diagnostic {
	var enth *residual
	var gibbs []residual
	for i := range f.results {
		if f.results[i].q().enthalpy {
			enth = &f.results[i]
		} else {
			gibbs = append(gibbs, f.results[i])
		}
	}
	var worstG *residual
	for i := range gibbs {
		if worstG == nil || gibbs[i].ratio > worstG.ratio {
			worstG = &gibbs[i]
		}
	}
	var msg strings.Builder
	shown := enth
	if enth == nil {
		shown = worstG
	}
	var notes []string
	if enth == nil && worstG.rates {
		rt := thermo.R * worstG.q().T
		fmt.Fprintf(&msg, "cycle %s breaks the Wegscheider condition: the product of (kf/kr)^weight is %s at %s, not 1",
			f.cycle, sig3(math.Exp(-worstG.sum/rt)), kelvin(worstG.q().T))
		notes = append(notes, fmt.Sprintf("ΣΔrG° = %s ± %s kJ/mol", kjText(worstG.sum), kjText(worstG.sigma)))
	} else {
		var parts []string
		if enth != nil {
			parts = append(parts, fmt.Sprintf("ΣΔrH° = %s ± %s kJ/mol", kjText(enth.sum), kjText(enth.sigma)))
		}
		if worstG != nil {
			parts = append(parts, fmt.Sprintf("ΣΔrG° = %s ± %s kJ/mol at %s", kjText(worstG.sum), kjText(worstG.sigma), kelvin(worstG.q().T)))
		}
		fmt.Fprintf(&msg, "cycle %s does not close: %s", f.cycle, strings.Join(parts, "; "))
	}
	if len(gibbs) > 1 {
		notes = append(notes, fmt.Sprintf("ΣΔrG° also misses zero at %d more temperature%s", len(gibbs)-1, plural(len(gibbs)-1)))
	}
	notes = append(notes, fmt.Sprintf("tolerance %s kJ/mol", kjText(a.tol)))
	fmt.Fprintf(&msg, " (%s)", strings.Join(notes, "; "))

	last := f.cycle.Last().Reaction
	d := lang.Diagnostic{Subject: last.NameSpan(), Context: last.Span(), Message: msg.String()}
	q := shown.q()
	data := shown.group.data[shown.qi]
	for _, t := range f.cycle.Terms {
		dt := data[t.Column]
		w := t.Weight.String()
		if t.Weight.Sign() > 0 {
			w = "+" + w
		}
		d.Related = append(d.Related, lang.Related{
			Span:    t.Reaction.NameSpan(),
			Message: fmt.Sprintf("%s, weight %s: %s = %s ± %s kJ/mol from %s", t.Reaction.Name, w, q, kjText(dt.v), kjText(dt.sigma), dt.from),
		})
	}
	d.Detail = a.hint(f, *shown)
	return d
}

func plural(n int) string {
	if n == 1 {
		return ""
	}
	return "s"
}
