package network

import (
	"math"
	"strconv"
	"strings"

	"hess/thermo"
)

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
