package network

import (
	"fmt"
	"math"
	"strconv"
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
ds and dg taken as constant ΔrH° and ΔrS°, from dg alone at 298.15 K, or
from kf/kr where the species have no data; a cycle made only of rate pairs
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

// cycleAnalysis holds the cycles among the reactions with own data, for
// every quantity they carry.
type cycleAnalysis struct {
	net    *Network
	m      *StoichMatrix // columns: the reactions with own data, in source order
	tol    float64
	groups []*dataGroup
}

// dataGroup is a set of quantities that the same reactions carry, with the
// cycle basis of those reactions.
type dataGroup struct {
	cols       []int
	quantities []quantity
	data       []map[int]datum // per quantity: column -> datum
	cycles     []Cycle
	vecs       []ivec // the cycles as vectors over columns
	fits       map[int]*quantityFit
}

// residual is one cycle's sum of one quantity.
type residual struct {
	group      *dataGroup
	qi         int
	cycle      int // index in group.cycles
	sum, sigma float64
	ratio      float64 // |sum| over the threshold it must exceed
	fails      bool
	rates      bool // every datum comes from rates
}

func (r residual) q() quantity { return r.group.quantities[r.qi] }

func analyseCycles(n *Network) *cycleAnalysis {
	a := &cycleAnalysis{net: n, tol: n.Settings.Tolerance}
	var own []*Reaction
	for _, rx := range n.Reactions {
		if hasOwnData(rx) {
			own = append(own, rx)
		}
	}
	if len(own) == 0 {
		return a
	}
	a.m = NewStoichMatrix(own)
	quantities := []quantity{enthalpyQuantity}
	for _, T := range checkTemperatures(n, own) {
		quantities = append(quantities, quantity{T: T})
	}
	bySignature := map[string]*dataGroup{}
	for _, q := range quantities {
		data := map[int]datum{}
		var cols []int
		var sig strings.Builder
		for j, rx := range own {
			if d, ok := ownDatum(n, rx, q); ok {
				data[j] = d
				cols = append(cols, j)
				sig.WriteString(strconv.Itoa(j))
				sig.WriteByte(',')
			}
		}
		if len(cols) == 0 {
			continue
		}
		g, ok := bySignature[sig.String()]
		if !ok {
			g = &dataGroup{cols: cols, fits: map[int]*quantityFit{}}
			bySignature[sig.String()] = g
			a.groups = append(a.groups, g)
		}
		g.quantities = append(g.quantities, q)
		g.data = append(g.data, data)
	}
	for _, g := range a.groups {
		g.cycles = a.m.CycleBasis(g.cols)
		g.vecs = make([]ivec, len(g.cycles))
		for i, c := range g.cycles {
			v := make(ivec, len(c.Terms))
			for k, t := range c.Terms {
				v[k] = ientry{t.Column, t.Weight}
			}
			g.vecs[i] = v
		}
	}
	return a
}

// sumOf is the weighted sum of quantity qi around a vector of columns.
func (a *cycleAnalysis) sumOf(g *dataGroup, qi int, v ivec) residual {
	terms := make([]thermo.Weighted, 0, len(v))
	scale := 0.0
	rates := true
	for _, t := range v {
		d := g.data[qi][t.i]
		w := intFloat(t.v)
		terms = append(terms, thermo.Weighted{Weight: w, Value: d.v, Sigma: d.sigma})
		scale += math.Abs(w * d.v)
		rates = rates && d.rates
	}
	sum, sigma := thermo.LinearSum(terms)
	// Sums of decimal inputs carry rounding of about 1e-16 of their size.
	floor := 1e-9*scale + 1e-6
	threshold := math.Max(math.Max(a.tol, 2*sigma), floor)
	r := residual{group: g, qi: qi, sum: sum, sigma: sigma, rates: rates, ratio: math.Abs(sum) / threshold}
	r.fails = math.Abs(sum) > a.tol && math.Abs(sum) > 2*sigma && math.Abs(sum) > floor
	return r
}

// finding is one cycle that fails for some quantity.
type finding struct {
	cycle   Cycle
	results []residual // failing ones, ΔrH° first, then ΔrG° by temperature
}

func (a *cycleAnalysis) findings() []*finding {
	byKey := map[string]*finding{}
	var out []*finding
	for _, g := range a.groups {
		for ci, c := range g.cycles {
			for qi := range g.quantities {
				r := a.sumOf(g, qi, g.vecs[ci])
				r.cycle = ci
				if !r.fails {
					continue
				}
				key := c.String()
				f, ok := byKey[key]
				if !ok {
					f = &finding{cycle: c}
					byKey[key] = f
					out = append(out, f)
				}
				f.results = append(f.results, r)
			}
		}
	}
	for _, f := range out {
		sortResults(f.results)
	}
	sortFindings(out)
	return out
}

func sortResults(rs []residual) {
	for i := 1; i < len(rs); i++ {
		for k := i; k > 0 && resultBefore(rs[k], rs[k-1]); k-- {
			rs[k], rs[k-1] = rs[k-1], rs[k]
		}
	}
}

func resultBefore(a, b residual) bool {
	qa, qb := a.q(), b.q()
	if qa.enthalpy != qb.enthalpy {
		return qa.enthalpy
	}
	return qa.T < qb.T
}

func sortFindings(fs []*finding) {
	for i := 1; i < len(fs); i++ {
		for k := i; k > 0 && findingBefore(fs[k], fs[k-1]); k-- {
			fs[k], fs[k-1] = fs[k-1], fs[k]
		}
	}
}

func findingBefore(a, b *finding) bool {
	la, lb := a.cycle.Last().Column, b.cycle.Last().Column
	if la != lb {
		return la < lb
	}
	return a.cycle.String() < b.cycle.String()
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
	d := lang.Diagnostic{Subject: last.NameSpan, Context: last.Span, Message: msg.String()}
	q := shown.q()
	data := shown.group.data[shown.qi]
	for _, t := range f.cycle.Terms {
		dt := data[t.Column]
		w := t.Weight.String()
		if t.Weight.Sign() > 0 {
			w = "+" + w
		}
		d.Related = append(d.Related, lang.Related{
			Span:    t.Reaction.NameSpan,
			Message: fmt.Sprintf("%s, weight %s: %s = %s ± %s kJ/mol from %s", t.Reaction.Name, w, q, kjText(dt.v), kjText(dt.sigma), dt.from),
		})
	}
	d.Detail = a.hint(f, *shown)
	return d
}

// kjText writes an energy in J/mol as kJ/mol with two decimals (more
// significant digits for very small values).
func kjText(v float64) string {
	x := v / 1000
	if x != 0 && math.Abs(x) < 0.005 {
		return strconv.FormatFloat(x, 'g', 2, 64)
	}
	s := strconv.FormatFloat(x, 'f', 2, 64)
	if s == "-0.00" {
		s = "0.00"
	}
	return s
}

// sig3 writes a number with three significant digits.
func sig3(v float64) string { return strconv.FormatFloat(v, 'g', 3, 64) }

func plural(n int) string {
	if n == 1 {
		return ""
	}
	return "s"
}
