package gibbs

import (
	"fmt"
	"math"
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

// kind is how a species enters G: in a mixture phase, as a pure phase, or
// held at a fixed potential.
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

// run solves with the current activity coefficients and, when the problem
// has them, iterates ln γ to a fixed point around the ideal solve: each
// round evaluates the coefficients at the amounts found, loads them into
// μ° and solves again, until they change by no more than the tolerance.
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
