package network

import (
	"fmt"
	"math"

	"hess/lang"
	"hess/thermo"
)

var determinedSpeciesCheck = &Check{
	Name:     "determined-species",
	Severity: lang.Info,
	Doc: `the reactions' own data determine a species' ΔfG°
A species with no data of its own (no gf, and not both hf and s) whose
ΔfG° at 298.15 K nevertheless follows from the reactions' own data (dg,
logk, dh with ds, or rates), together with the species that do have data
and the elements in their reference states (ΔfG° = 0), is reported with
that value. Where several routes lead to it, the value is the weighted
least-squares fit of all of them (each datum weighted by its ± value, and
at least half the tolerance), and its uncertainty is propagated from the
data. A species that the data fix only in combination with another is not
reported.`,
	Run: func(p *Pass) {
		for _, d := range determinedSpecies(p.Net) {
			p.Report(d)
		}
	},
}

// maxNamed is how many reactions a determined-species message names.
const maxNamed = 6

// determinedSpecies finds the species without ΔfG° data that the
// reactions' own ΔrG° at 298.15 K determine, and reports their fitted value.
func determinedSpecies(n *Network) []lang.Diagnostic {
	q := quantity{T: thermo.T298}
	type known struct {
		g, sigma float64
	}
	knowns := map[*Species]known{}
	status := map[*Species]int{} // 1 known, 2 unknown, 3 opaque
	classify := func(sp *Species) int {
		if s, ok := status[sp]; ok {
			return s
		}
		g, sg, ok, opaque := formationGibbs(sp)
		s := 2
		switch {
		case ok:
			s = 1
			knowns[sp] = known{g, sg}
		case opaque:
			s = 3
		}
		status[sp] = s
		return s
	}
	var rxs []*Reaction
	var data []datum
	for _, rx := range n.Reactions {
		if !hasOwnData(rx) {
			continue
		}
		d, ok := ownDatum(n, rx, q)
		if !ok {
			continue
		}
		unknowns, opaque := 0, false
		for _, t := range rx.NetTerms() {
			switch classify(t.Species) {
			case 2:
				unknowns++
			case 3:
				opaque = true
			}
		}
		if opaque || unknowns == 0 {
			continue
		}
		rxs = append(rxs, rx)
		data = append(data, d)
	}
	if len(rxs) == 0 {
		return nil
	}
	// The reduced system: one column per reaction over the unknown species;
	// b_r = y_r − Σ ν·ΔfG°(known species).
	m := &StoichMatrix{Reactions: rxs, Columns: make([][]StoichEntry, len(rxs)), row: map[*Species]int{}}
	b := make([]float64, len(rxs))
	for j, rx := range rxs {
		b[j] = data[j].v
		for _, t := range rx.NetTerms() {
			nu, _ := t.Nu.Float64()
			if status[t.Species] == 1 {
				b[j] -= nu * knowns[t.Species].g
				continue
			}
			i, ok := m.row[t.Species]
			if !ok {
				i = len(m.Species)
				m.row[t.Species] = i
				m.Species = append(m.Species, t.Species)
			}
			m.Columns[j] = append(m.Columns[j], StoichEntry{Row: i, Coef: t.Nu})
		}
		sortEntries(m.Columns[j])
	}
	cols := make([]int, len(rxs))
	for j := range cols {
		cols[j] = j
	}
	e := newEliminator(m, cols)
	var conds []ivec
	for j := range rxs {
		if c := e.add(j); c != nil {
			conds = append(conds, c)
		}
	}
	comps := components(conds)
	compOf := map[int]int{} // column -> component of conditions
	for k, comp := range comps {
		for _, ci := range comp {
			for _, t := range conds[ci] {
				compOf[t.i] = k
			}
		}
	}
	floor := math.Max(n.Settings.Tolerance/2, 1)
	adjOf := map[int]*adjustment{}
	adjFor := func(k int) *adjustment {
		if a, ok := adjOf[k]; ok {
			return a
		}
		cs := make([]ivec, len(comps[k]))
		y, sigma := map[int]float64{}, map[int]float64{}
		for i, ci := range comps[k] {
			cs[i] = conds[ci]
			for _, t := range conds[ci] {
				y[t.i] = b[t.i]
				sigma[t.i] = math.Hypot(data[t.i].sigma, floor)
			}
		}
		a, err := newAdjustment(cs, y, sigma)
		if err != nil {
			a = nil
		}
		adjOf[k] = a
		return a
	}

	var out []lang.Diagnostic
	for _, row := range e.reduced() {
		if len(row) < 2 || row[0].i >= e.nSpecies || row[1].i < e.nSpecies {
			continue // not a single species
		}
		sp := m.Species[row[0].i]
		alpha := intFloat(row[0].v)
		lambda := map[int]float64{}
		for _, t := range row[1:] {
			lambda[t.i-e.nSpecies] = intFloat(t.v) / alpha
		}
		// λᵀ(columns) = e_u, so μ_u = λᵀb; the fit replaces λ by λ' on
		// every component of conditions that λ touches.
		weights := map[int]float64{}
		for c, l := range lambda {
			weights[c] = l
		}
		seen := map[int]bool{}
		for col := range lambda {
			k, ok := compOf[col]
			if !ok || seen[k] {
				continue
			}
			seen[k] = true
			a := adjFor(k)
			if a == nil {
				continue
			}
			sub := map[int]float64{}
			for c, l := range lambda {
				if kc, in := compOf[c]; in && kc == k {
					sub[c] = l
					delete(weights, c)
				}
			}
			for c, l := range a.estimator(sub) {
				weights[c] += l
			}
		}
		value, variance := 0.0, 0.0
		speciesWeight := map[*Species]float64{}
		var order []*Species
		for col := 0; col < len(rxs); col++ {
			l, ok := weights[col]
			if !ok {
				continue
			}
			value += l * b[col]
			variance += l * l * data[col].sigma * data[col].sigma
			for _, t := range rxs[col].NetTerms() {
				if status[t.Species] == 1 {
					nu, _ := t.Nu.Float64()
					if _, seen := speciesWeight[t.Species]; !seen {
						order = append(order, t.Species)
					}
					speciesWeight[t.Species] -= l * nu
				}
			}
		}
		for _, s := range order {
			w := speciesWeight[s]
			variance += w * w * knowns[s].sigma * knowns[s].sigma
		}
		// The reactions the fitted value rests on: those with a weight.
		maxW := 0.0
		for _, l := range weights {
			maxW = math.Max(maxW, math.Abs(l))
		}
		var names []string
		var related []lang.Related
		for col := 0; col < len(rxs); col++ {
			if l, ok := weights[col]; !ok || math.Abs(l) <= 1e-9*maxW {
				continue
			}
			names = append(names, rxs[col].Name)
			related = append(related, lang.Related{Span: rxs[col].NameSpan, Message: fmt.Sprintf("%s: %s = %s kJ/mol from %s", rxs[col].Name, q, kjText(data[col].v), data[col].from)})
		}
		if len(names) > maxNamed {
			names = append(names[:maxNamed], fmt.Sprintf("%d more", len(names)-maxNamed))
		}
		out = append(out, lang.Diagnostic{Subject: sp.Span,
			Message: fmt.Sprintf("ΔfG° of %s at 298.15 K is %s ± %s kJ/mol, determined by %s (it has no data of its own)", sp.Key, kjText(value), kjText(math.Sqrt(variance)), nameList(names)),
			Related: related})
	}
	return out
}
