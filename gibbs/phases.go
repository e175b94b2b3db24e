package gibbs

import "math"

// activeSet runs Newton to convergence on the present phases, then adds the
// most unstable absent phase, until none is unstable.
func (sv *solver) activeSet() bool {
	for sv.iterations < sv.maxIter {
		if !sv.newton() {
			return false
		}
		worst, wk := sv.unstablePure()
		pk, pworst := sv.unstablePhase()
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

// unstablePure is the absent pure species with the most negative
// μ°_k − B_k·λ below −tolS, and that value; wk is −1 when none is unstable.
func (sv *solver) unstablePure() (worst float64, wk int) {
	worst, wk = -sv.tolS, -1
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
	return worst, wk
}

// unstablePhase is the absent mixture phase most able to form, and by how
// much: ln Σ_j x*_j > 0 for an ideal phase (x*_j = exp(B_j·λ − μ°_j)), the
// solvent's B_w·λ − μ°_w > 0 for an aqueous one; pk is −1 when none exceeds
// tolS.
func (sv *solver) unstablePhase() (pk int, pworst float64) {
	pk, pworst = -1, sv.tolS
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
	return pk, pworst
}

// addPhase makes mixture phase k present at a small amount (e^appearLnN of
// the feed), its species in the proportions the current potentials give:
// mole fractions exp(Σ_i B_ij λ_i − μ°_j) normalised for an ideal phase,
// molalities exp(Σ_i B_ij λ_i − μ°_j) for the solutes of an aqueous one.
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

// state is what cleanup restores.
type state struct {
	y, n, pi   []float64
	active, on []bool
}

// save copies the state cleanup may restore.
func (sv *solver) save() state {
	return state{
		y: append([]float64(nil), sv.y...), n: append([]float64(nil), sv.n...),
		pi: append([]float64(nil), sv.pi...), active: append([]bool(nil), sv.active...),
		on: append([]bool(nil), sv.phaseOn...),
	}
}

// restore puts back a saved state and recomputes the potentials.
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
