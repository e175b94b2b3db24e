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

// gibbsStatus is what a species' own data say of its ΔfG° at 298.15 K.
type gibbsStatus int

const (
	gibbsKnown   gibbsStatus = iota + 1 // its data give ΔfG° (or it is an element in its reference state)
	gibbsUnknown                        // it has no data that give ΔfG°: the reactions may determine it
	gibbsOpaque                         // it has data that cannot be put on the ΔfG° scale
)

// knownGibbs is a species' ΔfG° from its own data, with its uncertainty.
type knownGibbs struct {
	g, sigma float64
}

// determination is the fit of the unknown species' ΔfG° to the reactions'
// own ΔrG° at 298.15 K, with the species of known ΔfG° fixed.
type determination struct {
	net    *Network
	q      quantity
	status map[*Species]gibbsStatus
	knowns map[*Species]knownGibbs

	// The reactions with own data that involve an unknown species and no
	// opaque one, and their datum.
	rxs  []*Reaction
	data []datum

	// The reduced system: one column per reaction over the unknown
	// species; b_r = y_r − Σ ν·ΔfG°(known species).
	m *StoichMatrix
	b []float64

	// The elimination over those columns, the conditions it leaves, their
	// connected components, and each column's component.
	e      *eliminator
	conds  []ivec
	comps  [][]int
	compOf map[int]int

	floor float64             // the least σ of a datum in the fit, J/mol
	adjOf map[int]*adjustment // per component, built when first needed
}

// determinedSpecies finds the species without ΔfG° data that the
// reactions' own ΔrG° at 298.15 K determine, and reports their fitted value.
func determinedSpecies(n *Network) []lang.Diagnostic {
	d := &determination{net: n, q: quantity{T: thermo.T298},
		status: map[*Species]gibbsStatus{}, knowns: map[*Species]knownGibbs{}}
	d.collect()
	if len(d.rxs) == 0 {
		return nil
	}
	d.reduce()
	d.eliminate()
	var out []lang.Diagnostic
	for _, row := range d.e.reduced() {
		if len(row) < 2 || row[0].i >= d.e.nSpecies || row[1].i < d.e.nSpecies {
			continue // not a single species
		}
		sp := d.m.Species[row[0].i]
		weights := d.weights(row)
		value, variance := d.value(weights)
		out = append(out, d.diagnostic(sp, weights, value, math.Sqrt(variance)))
	}
	return out
}

// classify returns a species' status, remembering its ΔfG° when known.
func (d *determination) classify(sp *Species) gibbsStatus {
	if s, ok := d.status[sp]; ok {
		return s
	}
	g, sg, ok, opaque := formationGibbs(sp)
	s := gibbsUnknown
	switch {
	case ok:
		s = gibbsKnown
		d.knowns[sp] = knownGibbs{g, sg}
	case opaque:
		s = gibbsOpaque
	}
	d.status[sp] = s
	return s
}

// collect keeps the reactions whose own data give ΔrG° at 298.15 K and
// that involve an unknown species and no opaque one.
func (d *determination) collect() {
	for _, rx := range d.net.Reactions {
		if !hasOwnData(rx) {
			continue
		}
		dt, ok := ownDatum(d.net, rx, d.q)
		if !ok {
			continue
		}
		unknowns, opaque := 0, false
		for _, t := range rx.NetTerms() {
			switch d.classify(t.Species) {
			case gibbsUnknown:
				unknowns++
			case gibbsOpaque:
				opaque = true
			}
		}
		if opaque || unknowns == 0 {
			continue
		}
		d.rxs = append(d.rxs, rx)
		d.data = append(d.data, dt)
	}
}

// reduce builds the reduced system: the known species move to the right
// side.
func (d *determination) reduce() {
	m := &StoichMatrix{Reactions: d.rxs, Columns: make([][]StoichEntry, len(d.rxs)), row: map[*Species]int{}}
	b := make([]float64, len(d.rxs))
	for j, rx := range d.rxs {
		b[j] = d.data[j].v
		for _, t := range rx.NetTerms() {
			nu := ratFloat(t.Nu)
			if d.status[t.Species] == gibbsKnown {
				b[j] -= nu * d.knowns[t.Species].g
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
	d.m, d.b = m, b
}

// eliminate reduces the system exactly, keeps the conditions (cycles among
// the reactions) it finds, and groups them into connected components.
func (d *determination) eliminate() {
	cols := make([]int, len(d.rxs))
	for j := range cols {
		cols[j] = j
	}
	d.e = newEliminator(d.m, cols)
	for j := range d.rxs {
		if c := d.e.add(j); c != nil {
			d.conds = append(d.conds, c)
		}
	}
	d.comps = components(d.conds)
	d.compOf = map[int]int{} // column -> component of conditions
	for k, comp := range d.comps {
		for _, ci := range comp {
			for _, t := range d.conds[ci] {
				d.compOf[t.i] = k
			}
		}
	}
	d.floor = math.Max(d.net.Settings.Tolerance/2, 1)
	d.adjOf = map[int]*adjustment{}
}

// adjustment returns the least-squares adjustment of component k, or nil
// when it cannot be built.
func (d *determination) adjustment(k int) *adjustment {
	if a, ok := d.adjOf[k]; ok {
		return a
	}
	cs := make([]ivec, len(d.comps[k]))
	y, sigma := map[int]float64{}, map[int]float64{}
	for i, ci := range d.comps[k] {
		cs[i] = d.conds[ci]
		for _, t := range d.conds[ci] {
			y[t.i] = d.b[t.i]
			sigma[t.i] = math.Hypot(d.data[t.i].sigma, d.floor)
		}
	}
	a, err := newAdjustment(cs, y, sigma)
	if err != nil {
		a = nil
	}
	d.adjOf[k] = a
	return a
}

// weights returns the weight of each column in the fitted ΔfG° of the
// species that the reduced row determines alone.
func (d *determination) weights(row ivec) map[int]float64 {
	alpha := intFloat(row[0].v)
	lambda := map[int]float64{}
	for _, t := range row[1:] {
		lambda[t.i-d.e.nSpecies] = intFloat(t.v) / alpha
	}
	// λᵀ(columns) = e_u, so μ_u = λᵀb; the fit replaces λ by λ' on
	// every component of conditions that λ touches.
	weights := map[int]float64{}
	for c, l := range lambda {
		weights[c] = l
	}
	seen := map[int]bool{}
	for col := range lambda {
		k, ok := d.compOf[col]
		if !ok || seen[k] {
			continue
		}
		seen[k] = true
		a := d.adjustment(k)
		if a == nil {
			continue
		}
		sub := map[int]float64{}
		for c, l := range lambda {
			if kc, in := d.compOf[c]; in && kc == k {
				sub[c] = l
				delete(weights, c)
			}
		}
		for c, l := range a.estimator(sub) {
			weights[c] += l
		}
	}
	return weights
}

// value is the fitted ΔfG° with those weights, and its variance from the
// reactions' data and the known species' ΔfG°.
func (d *determination) value(weights map[int]float64) (value, variance float64) {
	speciesWeight := map[*Species]float64{}
	var order []*Species
	for col := 0; col < len(d.rxs); col++ {
		l, ok := weights[col]
		if !ok {
			continue
		}
		value += l * d.b[col]
		variance += l * l * d.data[col].sigma * d.data[col].sigma
		for _, t := range d.rxs[col].NetTerms() {
			if d.status[t.Species] == gibbsKnown {
				nu := ratFloat(t.Nu)
				if _, seen := speciesWeight[t.Species]; !seen {
					order = append(order, t.Species)
				}
				speciesWeight[t.Species] -= l * nu
			}
		}
	}
	for _, s := range order {
		w := speciesWeight[s]
		variance += w * w * d.knowns[s].sigma * d.knowns[s].sigma
	}
	return value, variance
}

// diagnostic reports the species' fitted ΔfG° and names the reactions it
// rests on: those with a weight.
func (d *determination) diagnostic(sp *Species, weights map[int]float64, value, sigma float64) lang.Diagnostic {
	maxW := 0.0
	for _, l := range weights {
		maxW = math.Max(maxW, math.Abs(l))
	}
	var names []string
	var related []lang.Related
	for col := 0; col < len(d.rxs); col++ {
		if l, ok := weights[col]; !ok || math.Abs(l) <= 1e-9*maxW {
			continue
		}
		rx, dt := d.rxs[col], d.data[col]
		names = append(names, rx.Name)
		related = append(related, lang.Related{Span: rx.NameSpan(), Message: fmt.Sprintf("%s: %s = %s kJ/mol from %s", rx.Name, d.q, kjText(dt.v), dt.from)})
	}
	if len(names) > maxNamed {
		names = append(names[:maxNamed], fmt.Sprintf("%d more", len(names)-maxNamed))
	}
	return lang.Diagnostic{Subject: sp.Span,
		Message: fmt.Sprintf("ΔfG° of %s at 298.15 K is %s ± %s kJ/mol, determined by %s (it has no data of its own)", sp.Key, kjText(value), kjText(sigma), nameList(names)),
		Related: related}
}
