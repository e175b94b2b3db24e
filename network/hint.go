package network

import (
	"fmt"
	"math"
	"math/big"
	"sort"
	"strings"
)

// quantityFit is the least-squares fit of one quantity's data over the
// parts of the cycle basis that hold a failing cycle: which reactions the
// residuals point at, and which lie on cycles that close.
type quantityFit struct {
	a        *cycleAnalysis
	g        *dataGroup
	qi       int
	compOf   []int   // per cycle: its component
	comps    [][]int // per component: its cycles
	verdicts map[int]*verdict
	cleared  map[int]bool // columns on a cycle that closes
	failing  []bool       // per cycle
}

// verdict is what the data of one component of cycles say about their
// misfit. Reactions are taken out one at a time, each time the one with
// the largest normalised residual in a fit of what is left, until every
// cycle closes; the search stops where two or more reactions are equally
// suspect.
type verdict struct {
	culprits []int           // columns taken out, in order
	z        map[int]float64 // the normalised residual each had when taken out
	tied     []int           // the equally suspect columns where the search stopped
	tiedZ    float64
	closed   bool            // without the culprits every cycle closes
	first    map[int]float64 // normalised residuals in the fit of all the data
}

// maxCulprits bounds how many reactions the hint takes out of one
// component of cycles.
const maxCulprits = 8

// fitSigmaFloor is the smallest standard uncertainty a datum gets in the
// fit: half the tolerance, so data given without ± still weigh in.
func (a *cycleAnalysis) fitSigmaFloor() float64 { return math.Max(a.tol/2, 1) }

func (a *cycleAnalysis) fit(g *dataGroup, qi int) *quantityFit {
	if f, ok := g.fits[qi]; ok {
		return f
	}
	f := &quantityFit{a: a, g: g, qi: qi, compOf: make([]int, len(g.cycles)), verdicts: map[int]*verdict{},
		cleared: map[int]bool{}, failing: make([]bool, len(g.cycles))}
	g.fits[qi] = f
	for ci, v := range g.vecs {
		f.failing[ci] = a.sumOf(g, qi, v).fails
		if !f.failing[ci] {
			for _, t := range v {
				f.cleared[t.i] = true
			}
		}
	}
	f.comps = components(g.vecs)
	for k, comp := range f.comps {
		for _, ci := range comp {
			f.compOf[ci] = k
		}
	}
	return f
}

// fails reports whether the quantity's sum around v misses zero.
func (f *quantityFit) fails(v ivec) bool { return f.a.sumOf(f.g, f.qi, v).fails }

// adjust fits the quantity's data subject to conds.
func (f *quantityFit) adjust(conds []ivec) *adjustment {
	y, sigma := map[int]float64{}, map[int]float64{}
	floor := f.a.fitSigmaFloor()
	for _, v := range conds {
		for _, t := range v {
			d := f.g.data[f.qi][t.i]
			y[t.i] = d.v
			sigma[t.i] = math.Hypot(d.sigma, floor)
		}
	}
	adj, err := newAdjustment(conds, y, sigma)
	if err != nil {
		return nil
	}
	return adj
}

// without returns a basis of the combinations of conds that do not use
// column col: each condition through col is combined with the first one
// through it, which is then dropped.
func without(conds []ivec, col int) []ivec {
	pivot := -1
	for i, v := range conds {
		if v.at(col) != nil {
			pivot = i
			break
		}
	}
	if pivot < 0 {
		return conds
	}
	pv := conds[pivot]
	out := make([]ivec, 0, len(conds)-1)
	for i, v := range conds {
		if i == pivot {
			continue
		}
		if w := v.at(col); w != nil {
			a := pv.at(col)
			var g big.Int
			g.GCD(nil, nil, new(big.Int).Abs(a), new(big.Int).Abs(w))
			v = primitive(combine(new(big.Int).Quo(a, &g), v, new(big.Int).Quo(w, &g), pv))
		}
		if len(v) > 0 {
			out = append(out, v)
		}
	}
	return out
}

// componentConds returns copies of the cycles of component k.
func (f *quantityFit) componentConds(k int) []ivec {
	out := make([]ivec, len(f.comps[k]))
	for i, ci := range f.comps[k] {
		out[i] = f.g.vecs[ci]
	}
	return out
}

func (f *quantityFit) verdict(k int) *verdict {
	if v, ok := f.verdicts[k]; ok {
		return v
	}
	v := &verdict{z: map[int]float64{}}
	f.verdicts[k] = v
	conds := f.componentConds(k)
	freed := map[int]bool{}
	for iter := 0; ; iter++ {
		var failing []ivec
		for _, c := range conds {
			if f.fails(c) {
				failing = append(failing, c)
			}
		}
		if len(failing) == 0 {
			v.closed = true
			return v
		}
		if iter >= maxCulprits {
			return v
		}
		adj := f.adjust(conds)
		if adj == nil {
			return v
		}
		var cands []int
		seen := map[int]bool{}
		for _, pass := range []bool{true, false} {
			for _, c := range failing {
				for _, t := range c {
					if !seen[t.i] && !freed[t.i] && (!pass || !f.cleared[t.i]) {
						seen[t.i] = true
						cands = append(cands, t.i)
					}
				}
			}
			if len(cands) > 0 {
				break
			}
		}
		sort.Ints(cands)
		z := make(map[int]float64, len(cands))
		top := 0.0
		for _, col := range cands {
			z[col] = math.Abs(adj.normalised(col))
			top = math.Max(top, z[col])
		}
		if iter == 0 {
			v.first = z
		}
		var tied []int
		for _, col := range cands {
			if z[col] >= top*(1-1e-6) {
				tied = append(tied, col)
			}
		}
		if len(tied) != 1 {
			v.tied, v.tiedZ = tied, top
			return v
		}
		x := tied[0]
		v.culprits = append(v.culprits, x)
		v.z[x] = top
		freed[x] = true
		conds = without(conds, x)
	}
}

// fromOthers is the value of column col's quantity that the other data
// imply once the other culprits are left out, with its uncertainty.
func (f *quantityFit) fromOthers(k, col int, culprits []int) (v, sigma float64) {
	conds := f.componentConds(k)
	for _, c := range culprits {
		if c != col {
			conds = without(conds, c)
		}
	}
	for _, vec := range conds {
		w := vec.at(col)
		if w == nil {
			continue
		}
		wr := intFloat(w)
		variance := 0.0
		for _, t := range vec {
			if t.i == col {
				continue
			}
			d := f.g.data[f.qi][t.i]
			c := intFloat(t.v) / wr
			v -= c * d.v
			variance += c * c * d.sigma * d.sigma
		}
		return v, math.Sqrt(variance)
	}
	return math.NaN(), math.NaN()
}

// hint names the likely bad datum of a failing cycle for the quantity of r.
func (a *cycleAnalysis) hint(fd *finding, r residual) string {
	f := a.fit(r.group, r.qi)
	q := r.q()
	k := f.compOf[r.cycle]
	v := f.verdict(k)
	on := map[int]bool{}
	for _, t := range fd.cycle.Terms {
		on[t.Column] = true
	}
	name := func(col int) string { return a.m.Reactions[col].Name }
	var b strings.Builder
	var culprits []int
	for _, c := range v.culprits {
		if on[c] {
			culprits = append(culprits, c)
		}
	}
	var tied []string
	for _, c := range v.tied {
		if on[c] {
			tied = append(tied, name(c))
		}
	}
	switch {
	case len(culprits) > 0:
		for i, c := range culprits {
			if i > 0 {
				b.WriteString("; ")
			}
			val, sg := f.fromOthers(k, c, v.culprits)
			fmt.Fprintf(&b, "likely culprit: %s (normalised residual %.1f)", name(c), v.z[c])
			if v.closed && len(v.culprits) == 1 {
				fmt.Fprintf(&b, ": without its %s every cycle closes", q)
				if !math.IsNaN(val) {
					b.WriteString(",")
				}
			}
			if !math.IsNaN(val) {
				fmt.Fprintf(&b, " and the other data give it %s ± %s kJ/mol", kjText(val), kjText(sg))
			}
		}
		if v.closed && len(v.culprits) > 1 {
			names := make([]string, len(v.culprits))
			for i, c := range v.culprits {
				names[i] = name(c)
			}
			fmt.Fprintf(&b, "; without the data of %s every cycle closes", nameList(names))
		}
	case len(tied) > 1:
		fmt.Fprintf(&b, "the data cannot single out one reaction: %s are equally suspect (normalised residual %.1f each)", nameList(tied), v.tiedZ)
	default:
		type scored struct {
			name string
			z    float64
		}
		var ss []scored
		for _, t := range fd.cycle.Terms {
			if z, ok := v.first[t.Column]; ok {
				ss = append(ss, scored{t.Reaction.Name, z})
			}
		}
		sort.SliceStable(ss, func(i, j int) bool { return ss[i].z > ss[j].z })
		if len(ss) > 3 {
			ss = ss[:3]
		}
		parts := make([]string, len(ss))
		for i, s := range ss {
			parts[i] = fmt.Sprintf("%s (normalised residual %.1f)", s.name, s.z)
		}
		if len(parts) == 0 {
			b.WriteString("no datum of this cycle stands out")
		} else {
			b.WriteString("most suspect: " + strings.Join(parts, ", ") + "; no small set of data explains every misfit")
		}
	}
	var cleared []string
	for _, t := range fd.cycle.Terms {
		if f.cleared[t.Column] {
			cleared = append(cleared, t.Reaction.Name)
		}
	}
	if len(cleared) > 0 {
		verb := "lies on a cycle that closes"
		if len(cleared) > 1 {
			verb = "lie on cycles that close"
		}
		fmt.Fprintf(&b, "\n%s %s", nameList(cleared), verb)
	}
	return b.String()
}

// nameList joins names as "a", "a and b" or "a, b and c".
func nameList(names []string) string {
	switch len(names) {
	case 0:
		return ""
	case 1:
		return names[0]
	}
	return strings.Join(names[:len(names)-1], ", ") + " and " + names[len(names)-1]
}
