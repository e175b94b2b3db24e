package gibbs

import (
	"encoding/binary"
	"fmt"
	"hash/fnv"
	"math"
	"sort"

	"gonum.org/v1/gonum/mat"
)

const (
	defaultTol     = 1e-11
	defaultMaxIter = 500
	majorLnX       = -18.420680743952367 // ln 1e-8: below this a mixture species is minor
	minorCapLnX    = -9.210340371976182  // ln 1e-4: a rising minor species stops here in one step
	vanishLnN      = -32.236191301916641 // ln 1e-14 of the (scaled) feed: a mixture phase below it leaves
	appearLnN      = -18.420680743952367 // ln 1e-8: amount given a phase that appears
	maxGammaLoops  = 200
)

type kind uint8

const (
	kMix kind = iota
	kPure
	kFixed
)

// solver holds one solve's state. Amounts are scaled by the feed total.
type solver struct {
	p       *Problem
	s       int
	rows    []int       // conservation rows kept (independent, non-empty)
	bm      [][]float64 // kept rows × species
	b       []float64   // scaled totals of kept rows
	scale   float64
	kind    []kind
	solvent []bool
	zero    []bool
	mu0     []float64 // μ°/RT, plus ln P/p° for gases, plus ln γ
	phases  [][]int   // species of each mixture phase (not zero)
	mix     []bool    // phase is a mixture phase
	aqueous []bool
	solv    []int // solvent species of each aqueous phase, or -1

	y          []float64 // ln n of mixture species
	n          []float64 // amounts (scaled)
	active     []bool    // pure species present
	phaseOn    []bool
	lnN        []float64 // ln of each mixture phase's amount
	mu         []float64
	pi         []float64
	tolY, tolS float64
	tolRes     float64
	lnMw, lnP  float64
	iterations int
	maxIter    int
	dy         []float64
	rho        []float64
	waits      []int
	lastOmega  float64
	entries    []int
	bestDy     float64
	stagnant   int
	firstTry   bool
	phaseDrops []int
}

// Solve minimises G/RT of p. It returns an error only for an invalid or
// infeasible problem; a solve that does not meet its tolerances returns a
// Result with Converged false and its residuals.
func Solve(p Problem, opts Options) (res Result, err error) {
	defer func() {
		// The solver is written not to panic; this guards the library's
		// promise against a numerical path not foreseen.
		if r := recover(); r != nil {
			res, err = Result{}, fmt.Errorf("gibbs: internal error: %v", r)
		}
	}()
	if err := p.validate(); err != nil {
		return Result{}, err
	}
	if opts.Tol <= 0 || math.IsNaN(opts.Tol) {
		opts.Tol = defaultTol
	}
	if opts.MaxIterations <= 0 {
		opts.MaxIterations = defaultMaxIter
	}
	sv, err := newSolver(&p, opts, false)
	if err != nil {
		return Result{}, err
	}
	if opts.Start == nil {
		sv.maxIter = max(opts.MaxIterations/2, 1)
		sv.firstTry = true
	}
	converged := sv.run(opts)
	if !converged && opts.Start == nil {
		// A second start with only the feed's pure phases present: the
		// first may have held a set of pure phases it could not leave.
		if sv2, err := newSolver(&p, opts, true); err == nil {
			sv2.iterations = sv.iterations
			if sv2.run(opts) {
				return sv2.result(true), nil
			}
		}
	}
	return sv.result(converged), nil
}

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

func newSolver(p *Problem, opts Options, feedPures bool) (*solver, error) {
	s := len(p.Species)
	m, _ := p.B.Dims()
	sv := &solver{p: p, s: s, maxIter: opts.MaxIterations}
	sv.kind = make([]kind, s)
	sv.solvent = make([]bool, s)
	fixed := make([]bool, s)
	total := 0.0
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
	if !(total > 0) {
		return nil, fmt.Errorf("%w: the feed is empty", ErrInput)
	}
	sv.scale = total
	bAll := make([]float64, m)
	for i := 0; i < m; i++ {
		for j := 0; j < s; j++ {
			if !fixed[j] {
				bAll[i] += p.B.At(i, j) * p.N0[j] / total
			}
		}
	}
	all := make([]int, s)
	for j := range all {
		all[j] = j
	}
	allRows := make([]int, m)
	for i := range allRows {
		allRows[i] = i
	}
	rows := independentRows(p.B, allRows, all, 1e-12)
	key := problemKey(p)
	var point []float64
	if st := opts.Start; st != nil && st.key == key && len(st.Zero) == s && len(st.lnN) == s {
		sv.zero = append([]bool(nil), st.Zero...)
	} else {
		bs := make([]float64, len(rows))
		for k, i := range rows {
			bs[k] = bAll[i]
		}
		n0s := make([]float64, s)
		for j := range n0s {
			if !fixed[j] {
				n0s[j] = p.N0[j] / total
			}
		}
		z, pt, _ := forcedZero(p.B, rows, bs, n0s, fixed)
		sv.zero, point = z, pt
	}
	// Drop the zero species' columns and the rows that become empty or dependent.
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
	// Phases.
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
	sv.lnP = math.Log(p.PRatio)
	if p.SolventMolarMass > 0 {
		sv.lnMw = math.Log(p.SolventMolarMass)
	}
	sv.tolY = opts.Tol
	maxMu := 0.0
	for _, sp := range p.Species {
		maxMu = math.Max(maxMu, math.Abs(sp.Mu0))
	}
	if maxMu > 100 {
		sv.tolY *= maxMu / 100
	}
	sv.tolS = math.Max(1e-9, sv.tolY)
	sv.tolRes = math.Max(1e-14, sv.tolY*1e-3)
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
	if st := opts.Start; st != nil && st.key == key && len(st.lnN) == s && len(st.PhasePresent) == np {
		sv.warm(st)
	} else {
		sv.cold(point, feedPures)
	}
	return sv, nil
}

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

// refresh recomputes mixture amounts, phase totals and chemical potentials.
func (sv *solver) refresh() {
	for k, list := range sv.phases {
		if !sv.phaseOn[k] {
			for _, j := range list {
				sv.n[j] = 0
			}
			continue
		}
		mx := math.Inf(-1)
		for _, j := range list {
			mx = math.Max(mx, sv.y[j])
		}
		sum := 0.0
		for _, j := range list {
			sum += math.Exp(sv.y[j] - mx)
			sv.n[j] = math.Exp(sv.y[j])
		}
		sv.lnN[k] = mx + math.Log(sum)
	}
	for j := 0; j < sv.s; j++ {
		if sv.zero[j] {
			sv.mu[j] = 0
			continue
		}
		sv.mu[j] = sv.chemPot(j)
	}
}

// chemPot is μ_j/RT at the current state for a species of a present phase,
// and the potential it would have at its current ln n otherwise.
func (sv *solver) chemPot(j int) float64 {
	if sv.kind[j] != kMix {
		return sv.mu0[j]
	}
	return sv.mu0[j] + sv.lnAct(j)
}

// lnAct is ln a_j of a mixture species without its ln γ_j.
func (sv *solver) lnAct(j int) float64 {
	k := sv.p.Species[j].Phase
	switch sv.p.Phases[k].Kind {
	case IdealGas:
		return sv.y[j] - sv.lnN[k] + sv.lnP
	case Solution:
		return sv.y[j] - sv.lnN[k]
	case Aqueous:
		w := sv.solv[k]
		if j == w {
			sum := 0.0
			for _, i := range sv.phases[k] {
				if i != w {
					sum += math.Exp(sv.y[i] - sv.y[w])
				}
			}
			return -sum
		}
		return sv.y[j] - sv.y[w] - sv.lnMw
	}
	return 0
}

// setGamma loads μ°/RT plus ln γ into mu0.
func (sv *solver) setGamma(lng []float64) {
	for j, sp := range sv.p.Species {
		sv.mu0[j] = sp.Mu0
		if sv.kind[j] == kMix && lng != nil {
			sv.mu0[j] += lng[j]
		}
	}
}

func (sv *solver) run(opts Options) bool {
	sv.setGamma(nil)
	if sv.p.LnGamma == nil {
		sv.refresh()
		return sv.activeSet()
	}
	lng := make([]float64, sv.s)
	prev := make([]float64, sv.s)
	amounts := make([]float64, sv.s)
	for loop := 0; loop < maxGammaLoops; loop++ {
		for j := range amounts {
			amounts[j] = sv.n[j] * sv.scale
			if sv.kind[j] == kFixed {
				amounts[j] = 0
			}
		}
		for j := range lng {
			lng[j] = 0
		}
		sv.p.LnGamma(amounts, lng)
		diff := 0.0
		for j := range lng {
			if sv.kind[j] != kMix || sv.zero[j] {
				lng[j] = 0
				continue
			}
			if math.IsNaN(lng[j]) || math.IsInf(lng[j], 0) || math.Abs(lng[j]) > 1e6 {
				return false
			}
			diff = math.Max(diff, math.Abs(lng[j]-prev[j]))
		}
		copy(prev, lng)
		sv.setGamma(lng)
		sv.refresh()
		ok := sv.activeSet()
		if !ok {
			return false
		}
		if loop > 0 && diff <= sv.tolY {
			return true
		}
		if sv.iterations >= sv.maxIter {
			return false
		}
	}
	return false
}

// activeSet runs Newton to convergence on the present phases, then adds the
// most unstable absent phase, until none is unstable.
func (sv *solver) activeSet() bool {
	for sv.iterations < sv.maxIter {
		if !sv.newton() {
			return false
		}
		// Pure species: the most negative μ°_k − B_k·λ.
		worst, wk := -sv.tolS, -1
		for j := 0; j < sv.s; j++ {
			if sv.kind[j] != kPure || sv.zero[j] || sv.active[j] {
				continue
			}
			d := sv.mu0[j] - sv.dotB(j)
			if sv.entries[j] >= 3 && d > -1e-6 {
				// It has come and gone repeatedly at rounding level
				// (anti-cycling): only a clear instability brings it back.
				continue
			}
			if d < worst {
				worst, wk = d, j
			}
		}
		// Mixture phases: Σ x*_j > 1 (ideal), or the solvent's μ° test (aqueous).
		pk, pworst := -1, sv.tolS
		for k, list := range sv.phases {
			if sv.phaseOn[k] || len(list) == 0 {
				continue
			}
			var excess float64
			if sv.aqueous[k] {
				w := sv.solv[k]
				excess = sv.dotB(w) - sv.mu0[w]
			} else {
				sum := 0.0
				for _, j := range list {
					sum += math.Exp(math.Min(sv.dotB(j)-sv.gasMu0(j), 700))
				}
				excess = math.Log(sum)
			}
			if sv.phaseDrops[k] >= 3 && excess < 1e-6 {
				continue // anti-cycling, as for pure phases
			}
			if excess > pworst {
				pworst, pk = excess, k
			}
		}
		if wk < 0 && pk < 0 {
			return sv.cleanup()
		}
		if wk >= 0 && (pk < 0 || -worst >= pworst) {
			if !sv.enterPure(wk) {
				return false
			}
		} else {
			sv.addPhase(pk)
		}
		sv.refresh()
	}
	return false
}

func (sv *solver) gasMu0(j int) float64 {
	k := sv.p.Species[j].Phase
	if sv.p.Phases[k].Kind == IdealGas {
		return sv.mu0[j] + sv.lnP
	}
	return sv.mu0[j]
}

func (sv *solver) addPhase(k int) {
	sv.phaseOn[k] = true
	if sv.aqueous[k] {
		w := sv.solv[k]
		sv.y[w] = appearLnN
		for _, j := range sv.phases[k] {
			if j != w {
				sv.y[j] = appearLnN + sv.lnMw + math.Max(math.Min(sv.dotB(j)-sv.mu0[j], 50), -700)
			}
		}
		return
	}
	lx := make([]float64, len(sv.phases[k]))
	mx := math.Inf(-1)
	for i, j := range sv.phases[k] {
		lx[i] = math.Min(sv.dotB(j)-sv.gasMu0(j), 700)
		mx = math.Max(mx, lx[i])
	}
	sum := 0.0
	for _, v := range lx {
		sum += math.Exp(v - mx)
	}
	for i, j := range sv.phases[k] {
		sv.y[j] = appearLnN + lx[i] - mx - math.Log(sum)
	}
}

func (sv *solver) dotB(j int) float64 {
	v := 0.0
	for r := range sv.rows {
		v += sv.bm[r][j] * sv.pi[r]
	}
	return v
}

// newton iterates on the current set of present phases until the step is
// below tolerance. Pure species whose amount reaches zero leave the set.
func (sv *solver) newton() bool {
	m := len(sv.rows)
	sv.bestDy, sv.stagnant = math.Inf(1), 0
	for sv.iterations < sv.maxIter {
		sv.iterations++
		// Unknown layout: λ (m), Δln N per present mixture phase, Δn per present pure or fixed species.
		var phaseIdx, pureIdx []int
		for k := range sv.phases {
			if sv.phaseOn[k] {
				phaseIdx = append(phaseIdx, k)
			}
		}
		for j := 0; j < sv.s; j++ {
			if (sv.kind[j] == kPure || sv.kind[j] == kFixed) && sv.active[j] && !sv.zero[j] {
				pureIdx = append(pureIdx, j)
			}
		}
		size := m + len(phaseIdx) + len(pureIdx)
		if size == 0 {
			return true
		}
		// The unknowns are corrections δ to the current potentials, so the
		// right-hand side carries ρ_j = μ_j − Σ_i B_ij λ_i, small near the
		// solution, and trace species keep their precision.
		for j := 0; j < sv.s; j++ {
			sv.rho[j] = 0
			if !sv.zero[j] {
				sv.rho[j] = sv.mu[j] - sv.dotB(j)
			}
		}
		A := mat.NewSymDense(size, nil)
		rhs := make([]float64, size)
		for r := 0; r < m; r++ {
			res := sv.b[r]
			for j := 0; j < sv.s; j++ {
				res -= sv.bm[r][j] * sv.n[j]
			}
			rhs[r] = res
		}
		col := make([]int, 0, m)
		for pi, k := range phaseIdx {
			L := m + pi
			for _, j := range sv.phases[k] {
				w := sv.n[j]
				if w == 0 {
					continue
				}
				col = col[:0]
				for r := 0; r < m; r++ {
					if sv.bm[r][j] != 0 {
						col = append(col, r)
					}
				}
				for _, a := range col {
					A.SetSym(a, L, A.At(a, L)+sv.bm[a][j]*w)
				}
				rhs[L] += w * sv.rho[j]
				if sv.solvent[j] {
					continue
				}
				for ia, a := range col {
					ba := sv.bm[a][j] * w
					rhs[a] += ba * sv.rho[j]
					for _, c := range col[ia:] {
						A.SetSym(a, c, A.At(a, c)+ba*sv.bm[c][j])
					}
				}
			}
		}
		for qi, j := range pureIdx {
			K := m + len(phaseIdx) + qi
			for r := 0; r < m; r++ {
				if sv.bm[r][j] != 0 {
					A.SetSym(r, K, sv.bm[r][j])
				}
			}
			rhs[K] = sv.rho[j]
		}
		x, ls, ok := solveSym(A, rhs)
		if !ok {
			return false
		}
		if ls && len(phaseIdx) > 1 && inconsistent(A, x, rhs) {
			// The present mixture phases cannot coexist (two phases of the
			// same single species, as vapour over a solution off its
			// boiling point): the least-squares step would stall. The
			// smallest leaves; the stability test brings it back if it belongs.
			if !sv.dropSmallest(phaseIdx) {
				return false
			}
			continue
		}
		for r := 0; r < m; r++ {
			sv.pi[r] += x[r]
		}
		dL := make([]float64, len(sv.p.Phases))
		for pi, k := range phaseIdx {
			dL[k] = x[m+pi]
		}
		// Steps of ln n and the convergence test.
		maxDy, maxAbs := 0.0, 0.0
		for _, k := range phaseIdx {
			maxDy = math.Max(maxDy, math.Abs(dL[k]))
			for _, j := range sv.phases[k] {
				if sv.solvent[j] {
					sv.dy[j] = dL[k]
				} else {
					d := dL[k] - sv.rho[j]
					for r := 0; r < m; r++ {
						d += sv.bm[r][j] * x[r]
					}
					sv.dy[j] = d
				}
				if math.IsNaN(sv.dy[j]) {
					return false
				}
				maxDy = math.Max(maxDy, math.Abs(sv.dy[j]))
				maxAbs = math.Max(maxAbs, sv.n[j]*math.Abs(sv.dy[j]))
			}
		}
		maxDn := 0.0
		drop, waiting := -1, false
		for qi, j := range pureIdx {
			d := x[m+len(phaseIdx)+qi]
			sv.dy[j] = d
			if sv.kind[j] == kPure && sv.n[j] <= 0 && d < 0 {
				// A pure phase at zero that the step would make negative
				// waits at zero while the rest moves (far from the solution
				// the sign of its step means little), then leaves.
				sv.waits[j]++
				if (sv.waits[j] > 8 && sv.lastOmega == 1) || sv.waits[j] > 100 || maxDy < 1e-2 {
					if drop < 0 || d < sv.dy[drop] {
						drop = j
					}
				}
				sv.dy[j] = 0
				waiting = true
				continue
			}
			sv.waits[j] = 0
			maxDn = math.Max(maxDn, math.Abs(d))
		}
		if drop >= 0 {
			sv.active[drop] = false
			sv.n[drop] = 0
			sv.waits[drop] = 0
			continue
		}
		if maxDy < 1 {
			// A pure phase clearly unstable against the current potentials
			// enters without waiting for convergence.
			worst, wk := -1e-2, -1
			for j := 0; j < sv.s; j++ {
				if sv.kind[j] == kPure && !sv.zero[j] && !sv.active[j] {
					if d := sv.mu0[j] - sv.dotB(j); d < worst {
						worst, wk = d, j
					}
				}
			}
			if wk >= 0 {
				if !sv.enterPure(wk) {
					return false
				}
				sv.refresh()
				continue
			}
		}
		res := sv.residual()
		// Stagnation: species whose amounts the conservation rows fix
		// (not their potentials) cannot be resolved below the rounding of
		// those rows; once the steps stop shrinking and change no amount by
		// more than that rounding, the solve has converged.
		if maxDy < 0.5*sv.bestDy {
			sv.bestDy, sv.stagnant = maxDy, 0
		} else {
			sv.stagnant++
		}
		if res > 1e3 || math.IsNaN(res) {
			return false // diverging: the amounts are of order the feed
		}
		if sv.firstTry && sv.iterations > 40 && res > 1e-2 {
			return false // wandering: the second start will do better
		}
		done := maxDy <= sv.tolY && maxDn <= sv.tolY && res <= sv.tolRes && !waiting
		if !done && sv.stagnant >= 3 && maxAbs <= 1e-12 && maxDy <= 1e-3 && maxDn <= sv.tolY && res <= 1e-13 && !waiting {
			done = true
		}
		// Damping (Gordon and McBride): major species move at most e² per
		// step, a rising minor species stops at x = 1e-4; pure amounts stay ≥ 0.
		omega := 1.0
		for _, k := range phaseIdx {
			if a := math.Abs(dL[k]); a*omega > 2 {
				omega = 2 / a
			}
			for _, j := range sv.phases[k] {
				lx := sv.y[j] - sv.lnN[k]
				d := sv.dy[j]
				if lx > majorLnX {
					if math.Abs(d)*omega > 2 {
						omega = 2 / math.Abs(d)
					}
				} else if rel := d - dL[k]; rel > 0 && lx+omega*rel > minorCapLnX {
					omega = (minorCapLnX - lx) / rel
				}
			}
		}
		for _, j := range pureIdx {
			// Pure amounts grow at most as a major mixture species may.
			if d := math.Abs(sv.dy[j]); sv.kind[j] == kPure && d*omega > 6*math.Max(sv.n[j], 0.1) {
				omega = 6 * math.Max(sv.n[j], 0.1) / d
			}
		}
		hit := -1
		for _, j := range pureIdx {
			if sv.kind[j] != kPure {
				continue
			}
			if d := sv.dy[j]; d < 0 && sv.n[j]+omega*d <= 0 {
				omega = sv.n[j] / -d
				hit = j
			}
		}
		sv.lastOmega = omega
		for _, k := range phaseIdx {
			for _, j := range sv.phases[k] {
				sv.y[j] += omega * sv.dy[j]
				if sv.y[j] < -1e5 {
					sv.y[j] = -1e5
				}
			}
		}
		for _, j := range pureIdx {
			sv.n[j] += omega * sv.dy[j]
		}
		if hit >= 0 {
			sv.n[hit] = 0
		}
		for _, j := range pureIdx {
			if sv.kind[j] == kPure && sv.n[j] < 0 {
				sv.n[j] = 0
			}
		}
		if done {
			sv.refresh()
			return true
		}
		for _, k := range phaseIdx {
			// A mixture phase whose amount falls out of reach leaves.
			mx := math.Inf(-1)
			for _, j := range sv.phases[k] {
				mx = math.Max(mx, sv.y[j])
			}
			if mx < vanishLnN && dL[k] < 0 {
				sv.phaseOn[k] = false
			}
		}
		sv.refresh()
	}
	return false
}

// residual is the largest relative conservation residual of the kept rows.
func (sv *solver) residual() float64 {
	worst := 0.0
	for r := range sv.rows {
		res, mag := sv.b[r], math.Abs(sv.b[r])
		for j := 0; j < sv.s; j++ {
			t := sv.bm[r][j] * sv.n[j]
			res -= t
			mag = math.Max(mag, math.Abs(t))
		}
		worst = math.Max(worst, math.Abs(res)/math.Max(mag, 1))
	}
	return worst
}

// solveSym solves the symmetric (indefinite) system after symmetric
// equilibration, by LU, falling back to the SVD's least-squares solution
// when the matrix is singular.
func solveSym(A *mat.SymDense, rhs []float64) (x []float64, leastSquares, ok bool) {
	n := A.SymmetricDim()
	d := make([]float64, n)
	for i := 0; i < n; i++ {
		mx := 0.0
		for j := 0; j < n; j++ {
			mx = math.Max(mx, math.Abs(A.At(i, j)))
		}
		if mx == 0 || math.IsNaN(mx) || math.IsInf(mx, 0) {
			d[i] = 1
		} else {
			d[i] = 1 / math.Sqrt(mx)
		}
	}
	S := mat.NewDense(n, n, nil)
	for i := 0; i < n; i++ {
		for j := 0; j < n; j++ {
			S.Set(i, j, d[i]*A.At(i, j)*d[j])
		}
	}
	b := mat.NewVecDense(n, nil)
	for i := range rhs {
		b.SetVec(i, d[i]*rhs[i])
	}
	var xv mat.VecDense
	var lu mat.LU
	lu.Factorize(S)
	if err := lu.SolveVecTo(&xv, false, b); err != nil || lu.Cond() > 1e15 {
		var svd mat.SVD
		if !svd.Factorize(S, mat.SVDThin) {
			return nil, false, false
		}
		vals := svd.Values(nil)
		rank := 0
		for _, v := range vals {
			if v > 1e-13*vals[0] {
				rank++
			}
		}
		if rank == 0 {
			return nil, false, false
		}
		svd.SolveVecTo(&xv, b, rank)
		leastSquares = true
	}
	// One step of iterative refinement on the scaled system.
	var r, dx mat.VecDense
	r.MulVec(S, &xv)
	r.SubVec(b, &r)
	if err := lu.SolveVecTo(&dx, false, &r); !leastSquares && err == nil && lu.Cond() <= 1e15 {
		xv.AddVec(&xv, &dx)
	}
	out := make([]float64, n)
	for i := range out {
		out[i] = d[i] * xv.AtVec(i)
		if math.IsNaN(out[i]) || math.IsInf(out[i], 0) {
			return nil, false, false
		}
	}
	return out, leastSquares, true
}

// state is what cleanup restores.
type state struct {
	y, n, pi   []float64
	active, on []bool
}

func (sv *solver) save() state {
	return state{
		y: append([]float64(nil), sv.y...), n: append([]float64(nil), sv.n...),
		pi: append([]float64(nil), sv.pi...), active: append([]bool(nil), sv.active...),
		on: append([]bool(nil), sv.phaseOn...),
	}
}

func (sv *solver) restore(st state) {
	copy(sv.y, st.y)
	copy(sv.n, st.n)
	copy(sv.pi, st.pi)
	copy(sv.active, st.active)
	copy(sv.phaseOn, st.on)
	sv.refresh()
}

// cleanup tries, once each, to remove present pure phases whose amount is at
// rounding level (the remains of a phase boundary): the removal stands when
// the solve without it converges and finds it stable as absent.
func (sv *solver) cleanup() bool {
	for j := 0; j < sv.s; j++ {
		if sv.kind[j] != kPure || !sv.active[j] || sv.n[j] > 1e-12 {
			continue
		}
		saved := sv.save()
		budget := sv.maxIter
		sv.maxIter = min(sv.maxIter, sv.iterations+40)
		sv.active[j] = false
		sv.n[j] = 0
		sv.refresh()
		ok := sv.newton() && sv.mu0[j]-sv.dotB(j) >= -sv.tolS
		sv.maxIter = budget
		if !ok {
			sv.restore(saved)
		}
	}
	return true
}

// inconsistent reports whether x leaves a residual of the Newton system
// that is not rounding: the system had no solution, only a least-squares one.
func inconsistent(A *mat.SymDense, x, rhs []float64) bool {
	n := len(rhs)
	worst, scale := 0.0, 0.0
	for i := 0; i < n; i++ {
		v := -rhs[i]
		mag := math.Abs(rhs[i])
		for j := 0; j < n; j++ {
			t := A.At(i, j) * x[j]
			v += t
			mag = math.Max(mag, math.Abs(t))
		}
		worst = math.Max(worst, math.Abs(v)/math.Max(mag, 1e-300))
		scale = math.Max(scale, mag)
	}
	return worst > 1e-6 && scale > 0
}

// dropSmallest removes the present mixture phase with the smallest amount.
func (sv *solver) dropSmallest(phaseIdx []int) bool {
	best, bk := math.Inf(1), -1
	for _, k := range phaseIdx {
		if sv.lnN[k] < best {
			best, bk = sv.lnN[k], k
		}
	}
	if bk < 0 {
		return false
	}
	sv.phaseOn[bk] = false
	sv.phaseDrops[bk]++
	sv.refresh()
	return true
}
