package gibbs

import (
	"math"

	"gonum.org/v1/gonum/mat"
)

// newtonStep is one Newton iteration's unknowns, their solution and the
// measures of the step that decide convergence and damping.
type newtonStep struct {
	// Unknown layout: λ corrections (one per kept row), Δln N per present
	// mixture phase (phaseIdx), Δn per present pure or fixed species (pureIdx).
	phaseIdx, pureIdx []int
	x                 []float64 // the solution, in that layout
	dL                []float64 // Δln N of each phase (0 where absent)
	maxDy             float64   // largest |Δln n| of a mixture species or |Δln N|
	maxAbs            float64   // largest |n Δln n| of a mixture species
	maxDn             float64   // largest |Δn| of a pure or fixed species moving
	waiting           bool      // a pure species at zero waits to leave
}

// newton iterates on the current set of present phases until the step is
// below tolerance. Pure species whose amount reaches zero leave the set.
// Each iteration assembles and solves the reduced system (newtonSystem),
// updates the potentials, turns the solution into steps of ln n and n,
// lets a pure phase leave or enter where it must, tests convergence, and
// takes the damped step; a mixture phase that falls out of reach leaves.
func (sv *solver) newton() bool {
	m := len(sv.rows)
	sv.bestDy, sv.stagnant = math.Inf(1), 0
	for sv.iterations < sv.maxIter {
		sv.iterations++
		st := sv.unknowns()
		if m+len(st.phaseIdx)+len(st.pureIdx) == 0 {
			return true
		}
		sv.stationarity()
		A, rhs := sv.newtonSystem(&st)
		x, ls, ok := solveSym(A, rhs)
		if !ok {
			return false
		}
		if ls && len(st.phaseIdx) > 1 && inconsistent(A, x, rhs) {
			// The present mixture phases cannot coexist (two phases of the
			// same single species, as vapour over a solution off its
			// boiling point): the least-squares step would stall. The
			// smallest leaves; the stability test brings it back if it belongs.
			if !sv.dropSmallest(st.phaseIdx) {
				return false
			}
			continue
		}
		st.x = x
		for r := 0; r < m; r++ {
			sv.pi[r] += x[r]
		}
		if !sv.mixtureSteps(&st) {
			return false
		}
		if drop := sv.pureSteps(&st); drop >= 0 {
			sv.active[drop] = false
			sv.n[drop] = 0
			sv.waits[drop] = 0
			continue
		}
		if st.maxDy < 1 {
			// A pure phase clearly unstable against the current potentials
			// enters without waiting for convergence.
			if wk := sv.clearlyUnstablePure(); wk >= 0 {
				if !sv.enterPure(wk) {
					return false
				}
				sv.refresh()
				continue
			}
		}
		done, fail := sv.progress(&st)
		if fail {
			return false
		}
		omega, hit := sv.damping(&st)
		sv.takeStep(&st, omega, hit)
		if done {
			sv.refresh()
			return true
		}
		sv.dropVanished(&st)
		sv.refresh()
	}
	return false
}

// unknowns lists the present mixture phases and the present pure and fixed
// species: the unknowns of this iteration besides the potentials.
func (sv *solver) unknowns() newtonStep {
	var st newtonStep
	for k := range sv.phases {
		if sv.phaseOn[k] {
			st.phaseIdx = append(st.phaseIdx, k)
		}
	}
	st.pureIdx = sv.pureSet()
	return st
}

// stationarity sets ρ_j = μ_j − Σ_i B_ij λ_i. The unknowns are corrections
// δ to the current potentials, so the right-hand side carries ρ, small near
// the solution, and trace species keep their precision.
func (sv *solver) stationarity() {
	for j := 0; j < sv.s; j++ {
		sv.rho[j] = 0
		if !sv.zero[j] {
			sv.rho[j] = sv.mu[j] - sv.dotB(j)
		}
	}
}

// newtonSystem assembles the symmetric system in the unknowns of st: the
// conservation rows (Σ_j B_ij n_j weighted sums and the residuals of b),
// one row per present mixture phase (its species' amounts; the solvent of
// an aqueous phase enters only here) and one per present pure or fixed
// species (its column of B, and its ρ).
func (sv *solver) newtonSystem(st *newtonStep) (*mat.SymDense, []float64) {
	m := len(sv.rows)
	size := m + len(st.phaseIdx) + len(st.pureIdx)
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
	for pi, k := range st.phaseIdx {
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
	for qi, j := range st.pureIdx {
		K := m + len(st.phaseIdx) + qi
		for r := 0; r < m; r++ {
			if sv.bm[r][j] != 0 {
				A.SetSym(r, K, sv.bm[r][j])
			}
		}
		rhs[K] = sv.rho[j]
	}
	return A, rhs
}

// mixtureSteps reads Δln N of each present mixture phase from the solution
// and sets every mixture species' step of ln n: Δln N for a solvent,
// Δln N − ρ_j + Σ_i B_ij δλ_i otherwise. It reports false on a NaN step.
func (sv *solver) mixtureSteps(st *newtonStep) bool {
	m := len(sv.rows)
	x := st.x
	st.dL = make([]float64, len(sv.p.Phases))
	for pi, k := range st.phaseIdx {
		st.dL[k] = x[m+pi]
	}
	for _, k := range st.phaseIdx {
		st.maxDy = math.Max(st.maxDy, math.Abs(st.dL[k]))
		for _, j := range sv.phases[k] {
			if sv.solvent[j] {
				sv.dy[j] = st.dL[k]
			} else {
				d := st.dL[k] - sv.rho[j]
				for r := 0; r < m; r++ {
					d += sv.bm[r][j] * x[r]
				}
				sv.dy[j] = d
			}
			if math.IsNaN(sv.dy[j]) {
				return false
			}
			st.maxDy = math.Max(st.maxDy, math.Abs(sv.dy[j]))
			st.maxAbs = math.Max(st.maxAbs, sv.n[j]*math.Abs(sv.dy[j]))
		}
	}
	return true
}

// pureSteps sets the step of every present pure and fixed species. A pure
// phase at zero that the step would make negative waits at zero while the
// rest moves (far from the solution the sign of its step means little);
// it returns the waiting species that should now leave (the one with the
// most negative step), or −1.
func (sv *solver) pureSteps(st *newtonStep) (drop int) {
	base := len(sv.rows) + len(st.phaseIdx)
	drop = -1
	for qi, j := range st.pureIdx {
		d := st.x[base+qi]
		sv.dy[j] = d
		if sv.kind[j] == kPure && sv.n[j] <= 0 && d < 0 {
			sv.waits[j]++
			if (sv.waits[j] > 8 && sv.lastOmega == 1) || sv.waits[j] > 100 || st.maxDy < 1e-2 {
				if drop < 0 || d < sv.dy[drop] {
					drop = j
				}
			}
			sv.dy[j] = 0
			st.waiting = true
			continue
		}
		sv.waits[j] = 0
		st.maxDn = math.Max(st.maxDn, math.Abs(d))
	}
	return drop
}

// clearlyUnstablePure is the absent pure species with the most negative
// μ°_k − B_k·λ below −1e-2, or −1.
func (sv *solver) clearlyUnstablePure() int {
	worst, wk := -1e-2, -1
	for j := 0; j < sv.s; j++ {
		if sv.kind[j] == kPure && !sv.zero[j] && !sv.active[j] {
			if d := sv.mu0[j] - sv.dotB(j); d < worst {
				worst, wk = d, j
			}
		}
	}
	return wk
}

// progress tests the step: done when it and the conservation residual are
// within tolerance, fail when the amounts diverge or a first start wanders.
//
// Stagnation: species whose amounts the conservation rows fix (not their
// potentials) cannot be resolved below the rounding of those rows; once the
// steps stop shrinking and change no amount by more than that rounding, the
// solve has converged.
func (sv *solver) progress(st *newtonStep) (done, fail bool) {
	res := sv.residual()
	if st.maxDy < 0.5*sv.bestDy {
		sv.bestDy, sv.stagnant = st.maxDy, 0
	} else {
		sv.stagnant++
	}
	if res > 1e3 || math.IsNaN(res) {
		return false, true // diverging: the amounts are of order the feed
	}
	if sv.firstTry && sv.iterations > 40 && res > 1e-2 {
		return false, true // wandering: the second start will do better
	}
	done = st.maxDy <= sv.tolY && st.maxDn <= sv.tolY && res <= sv.tolRes && !st.waiting
	if !done && sv.stagnant >= 3 && st.maxAbs <= 1e-12 && st.maxDy <= 1e-3 && st.maxDn <= sv.tolY && res <= 1e-13 && !st.waiting {
		done = true
	}
	return done, false
}

// damping is the step length ω (Gordon and McBride): major species move at
// most e² per step, a rising minor species stops at x = 1e-4; pure amounts
// grow at most as a major mixture species may and stay ≥ 0. hit is the pure
// species the step brings to exactly zero, or −1.
func (sv *solver) damping(st *newtonStep) (omega float64, hit int) {
	omega = 1.0
	for _, k := range st.phaseIdx {
		if a := math.Abs(st.dL[k]); a*omega > 2 {
			omega = 2 / a
		}
		for _, j := range sv.phases[k] {
			lx := sv.y[j] - sv.lnN[k]
			d := sv.dy[j]
			if lx > majorLnX {
				if math.Abs(d)*omega > 2 {
					omega = 2 / math.Abs(d)
				}
			} else if rel := d - st.dL[k]; rel > 0 && lx+omega*rel > minorCapLnX {
				omega = (minorCapLnX - lx) / rel
			}
		}
	}
	for _, j := range st.pureIdx {
		// Pure amounts grow at most as a major mixture species may.
		if d := math.Abs(sv.dy[j]); sv.kind[j] == kPure && d*omega > 6*math.Max(sv.n[j], 0.1) {
			omega = 6 * math.Max(sv.n[j], 0.1) / d
		}
	}
	hit = -1
	for _, j := range st.pureIdx {
		if sv.kind[j] != kPure {
			continue
		}
		if d := sv.dy[j]; d < 0 && sv.n[j]+omega*d <= 0 {
			omega = sv.n[j] / -d
			hit = j
		}
	}
	return omega, hit
}

// takeStep moves ln n of the mixture species (not below −1e5) and the pure
// and fixed amounts by ω times their steps; the pure species hit lands on
// exactly zero and none goes negative.
func (sv *solver) takeStep(st *newtonStep, omega float64, hit int) {
	sv.lastOmega = omega
	for _, k := range st.phaseIdx {
		for _, j := range sv.phases[k] {
			sv.y[j] += omega * sv.dy[j]
			if sv.y[j] < -1e5 {
				sv.y[j] = -1e5
			}
		}
	}
	for _, j := range st.pureIdx {
		sv.n[j] += omega * sv.dy[j]
	}
	if hit >= 0 {
		sv.n[hit] = 0
	}
	for _, j := range st.pureIdx {
		if sv.kind[j] == kPure && sv.n[j] < 0 {
			sv.n[j] = 0
		}
	}
}

// dropVanished removes each shrinking mixture phase whose amount has fallen
// out of reach (its largest species below e^vanishLnN of the feed).
func (sv *solver) dropVanished(st *newtonStep) {
	for _, k := range st.phaseIdx {
		mx := math.Inf(-1)
		for _, j := range sv.phases[k] {
			mx = math.Max(mx, sv.y[j])
		}
		if mx < vanishLnN && st.dL[k] < 0 {
			sv.phaseOn[k] = false
		}
	}
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
