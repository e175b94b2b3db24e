package gibbs

import (
	"encoding/binary"
	"fmt"
	"hash/fnv"
	"math"
	"sort"
)

// problemKey hashes what a warm start must share with the problem it seeds:
// B, the feed and which species are fixed.
func problemKey(p *Problem) uint64 {
	h := fnv.New64a()
	var buf [8]byte
	m, s := p.B.Dims()
	for i := 0; i < m; i++ {
		for j := 0; j < s; j++ {
			binary.LittleEndian.PutUint64(buf[:], math.Float64bits(p.B.At(i, j)))
			h.Write(buf[:])
		}
	}
	for j, v := range p.N0 {
		if p.Species[j].Fixed {
			v = 0
		}
		binary.LittleEndian.PutUint64(buf[:], math.Float64bits(v))
		h.Write(buf[:])
		if p.Species[j].Fixed {
			h.Write([]byte{1})
		} else {
			h.Write([]byte{0})
		}
	}
	return h.Sum64()
}

// newSolver sets up one solve of p: the species' kinds and the feed's
// scale, the species forced to zero (reused from a warm start of the same
// problem), the independent conservation rows kept, the phases' species
// lists, the tolerances, and the starting point (warm from opts.Start, or
// cold; feedPures starts with only the feed's pure phases present).
func newSolver(p *Problem, opts Options, feedPures bool) (*solver, error) {
	s := len(p.Species)
	sv := &solver{p: p, s: s, maxIter: opts.MaxIterations}
	fixed, total := sv.classify()
	if !(total > 0) {
		return nil, fmt.Errorf("%w: the feed is empty", ErrInput)
	}
	sv.scale = total
	bAll := scaledTotals(p, fixed, total)
	rows := independentRows(p.B, allIndices(len(bAll)), allIndices(s), 1e-12)
	key := problemKey(p)
	var point []float64
	if st := opts.Start; st != nil && st.key == key && len(st.Zero) == s && len(st.lnN) == s {
		sv.zero = append([]bool(nil), st.Zero...)
	} else {
		sv.zero, point = sv.findZero(rows, bAll, fixed, total)
	}
	sv.keepRows(rows, bAll)
	sv.listPhases()
	sv.setTolerances(opts.Tol)
	sv.allocate()
	np := len(p.Phases)
	if st := opts.Start; st != nil && st.key == key && len(st.lnN) == s && len(st.PhasePresent) == np {
		sv.warm(st)
	} else {
		sv.cold(point, feedPures)
	}
	return sv, nil
}

// classify sets each species' kind and solvent mark; it returns which
// species are fixed and the feed's total over the others.
func (sv *solver) classify() (fixed []bool, total float64) {
	p, s := sv.p, sv.s
	sv.kind = make([]kind, s)
	sv.solvent = make([]bool, s)
	fixed = make([]bool, s)
	for j, sp := range p.Species {
		switch {
		case sp.Fixed:
			sv.kind[j] = kFixed
			fixed[j] = true
		case p.Phases[sp.Phase].Kind == Pure:
			sv.kind[j] = kPure
		default:
			sv.kind[j] = kMix
			sv.solvent[j] = sp.Solvent
		}
		if !sp.Fixed {
			total += p.N0[j]
		}
	}
	return fixed, total
}

// scaledTotals is b = B·n₀ over the species not fixed, per unit of feed.
func scaledTotals(p *Problem, fixed []bool, total float64) []float64 {
	m, s := p.B.Dims()
	bAll := make([]float64, m)
	for i := 0; i < m; i++ {
		for j := 0; j < s; j++ {
			if !fixed[j] {
				bAll[i] += p.B.At(i, j) * p.N0[j] / total
			}
		}
	}
	return bAll
}

// allIndices is 0, 1, …, n−1.
func allIndices(n int) []int {
	out := make([]int, n)
	for i := range out {
		out[i] = i
	}
	return out
}

// findZero finds the species the constraints (the independent rows) force
// to zero, and a feasible point positive on every other one (nil when
// linear programming found no vertex beyond the feed).
func (sv *solver) findZero(rows []int, bAll []float64, fixed []bool, total float64) (zero []bool, point []float64) {
	p := sv.p
	bs := make([]float64, len(rows))
	for k, i := range rows {
		bs[k] = bAll[i]
	}
	n0s := make([]float64, sv.s)
	for j := range n0s {
		if !fixed[j] {
			n0s[j] = p.N0[j] / total
		}
	}
	zero, point, _ = forcedZero(p.B, rows, bs, n0s, fixed)
	return zero, point
}

// keepRows drops the zero species' columns and the rows that become empty
// or dependent, and stores what remains of B and b.
func (sv *solver) keepRows(rows []int, bAll []float64) {
	p, s := sv.p, sv.s
	var keepCols []int
	for j := 0; j < s; j++ {
		if !sv.zero[j] {
			keepCols = append(keepCols, j)
		}
	}
	sv.rows = independentRows(p.B, rows, keepCols, 1e-12)
	sv.bm = make([][]float64, len(sv.rows))
	sv.b = make([]float64, len(sv.rows))
	for k, i := range sv.rows {
		sv.bm[k] = make([]float64, s)
		for j := 0; j < s; j++ {
			if !sv.zero[j] {
				sv.bm[k][j] = p.B.At(i, j)
			}
		}
		sv.b[k] = bAll[i]
	}
}

// listPhases lists the species of each mixture phase that are not zero
// and each aqueous phase's solvent. An aqueous phase whose solvent is
// forced to zero cannot form: its solutes become zero too.
func (sv *solver) listPhases() {
	p := sv.p
	np := len(p.Phases)
	sv.phases = make([][]int, np)
	sv.mix = make([]bool, np)
	sv.aqueous = make([]bool, np)
	sv.solv = make([]int, np)
	for k, ph := range p.Phases {
		sv.mix[k] = ph.Kind != Pure
		sv.aqueous[k] = ph.Kind == Aqueous
		sv.solv[k] = -1
	}
	for j, sp := range p.Species {
		if sv.kind[j] != kMix || sv.zero[j] {
			continue
		}
		sv.phases[sp.Phase] = append(sv.phases[sp.Phase], j)
		if sp.Solvent {
			sv.solv[sp.Phase] = j
		}
	}
	for k := range p.Phases {
		if sv.aqueous[k] && len(sv.phases[k]) > 0 && sv.solv[k] < 0 {
			// Every solute may be present but the solvent cannot: no
			// aqueous phase can form; its solutes are zero too.
			for _, j := range sv.phases[k] {
				sv.zero[j] = true
			}
			sv.phases[k] = nil
		}
	}
}

// setTolerances sets ln P/p°, ln M_w and the tolerances: on ln n (scaled up
// when the μ°/RT are large, whose rounding it must exceed), on the
// stability tests and on the conservation residual.
func (sv *solver) setTolerances(tol float64) {
	p := sv.p
	sv.lnP = math.Log(p.PRatio)
	if p.SolventMolarMass > 0 {
		sv.lnMw = math.Log(p.SolventMolarMass)
	}
	sv.tolY = tol
	maxMu := 0.0
	for _, sp := range p.Species {
		maxMu = math.Max(maxMu, math.Abs(sp.Mu0))
	}
	if maxMu > 100 {
		sv.tolY *= maxMu / 100
	}
	sv.tolS = math.Max(1e-9, sv.tolY)
	sv.tolRes = math.Max(1e-14, sv.tolY*1e-3)
}

// allocate makes the per-species, per-phase and per-row state.
func (sv *solver) allocate() {
	s, np := sv.s, len(sv.p.Phases)
	sv.y = make([]float64, s)
	sv.n = make([]float64, s)
	sv.active = make([]bool, s)
	sv.phaseOn = make([]bool, np)
	sv.lnN = make([]float64, np)
	sv.mu = make([]float64, s)
	sv.dy = make([]float64, s)
	sv.rho = make([]float64, s)
	sv.waits = make([]int, s)
	sv.entries = make([]int, s)
	sv.phaseDrops = make([]int, np)
	sv.mu0 = make([]float64, s)
	sv.pi = make([]float64, len(sv.rows))
}

// cold starts from point (or the feed): every mixture species at its
// amount plus a floor, so that none starts at zero, every mixture phase
// with species present, and the pure phases that can exist present.
func (sv *solver) cold(point []float64, feedPures bool) {
	nm := 0
	for k := range sv.phases {
		nm += len(sv.phases[k])
	}
	floor := 0.1 / float64(max(nm, 1))
	for j := 0; j < sv.s; j++ {
		if sv.zero[j] {
			continue
		}
		v := 0.0
		if point != nil {
			v = point[j]
		} else if !sv.p.Species[j].Fixed {
			v = sv.p.N0[j] / sv.scale
		}
		switch sv.kind[j] {
		case kMix:
			sv.y[j] = math.Log(v + floor)
		case kPure:
			// Pure phases that can exist start present, as many as the
			// phase rule allows (keepIndependent); the others enter by the
			// stability test.
			if feedPures {
				v = sv.p.N0[j] / sv.scale
			}
			if v > 0 {
				sv.active[j] = true
				sv.n[j] = v
			}
		case kFixed:
			sv.active[j] = true
		}
	}
	for k := range sv.phases {
		sv.phaseOn[k] = sv.mix[k] && len(sv.phases[k]) > 0
	}
	sv.keepIndependent()
	sv.refresh()
}

// keepIndependent reduces the present pure and fixed species to an
// independent set: fixed species first, then pure ones by decreasing amount.
func (sv *solver) keepIndependent() {
	set := sv.pureSet()
	sort.SliceStable(set, func(a, b int) bool {
		ja, jb := set[a], set[b]
		if (sv.kind[ja] == kFixed) != (sv.kind[jb] == kFixed) {
			return sv.kind[ja] == kFixed
		}
		return sv.n[ja] > sv.n[jb]
	})
	limit := len(sv.rows)
	for k := range sv.phases {
		if sv.phaseOn[k] {
			limit--
		}
	}
	sv.independentPures(set, max(limit, 0))
}

// warm starts from a previous result of the same problem: its ln n, its
// pure phases and its phase assemblage.
func (sv *solver) warm(st *Result) {
	for j := 0; j < sv.s; j++ {
		if sv.zero[j] {
			continue
		}
		switch sv.kind[j] {
		case kMix:
			sv.y[j] = st.lnN[j]
		case kPure:
			if st.N[j] > 0 {
				sv.active[j] = true
				sv.n[j] = st.N[j] / sv.scale
			}
		case kFixed:
			sv.active[j] = true
			sv.n[j] = -st.N[j] / sv.scale
		}
	}
	for k := range sv.phases {
		sv.phaseOn[k] = sv.mix[k] && len(sv.phases[k]) > 0 && st.PhasePresent[k]
	}
	sv.keepIndependent()
	sv.refresh()
}
