package gibbs

import "math"

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

// gasMu0 is μ°/RT of species j at the pressure of the problem: with
// ln P/p° for a gas.
func (sv *solver) gasMu0(j int) float64 {
	k := sv.p.Species[j].Phase
	if sv.p.Phases[k].Kind == IdealGas {
		return sv.mu0[j] + sv.lnP
	}
	return sv.mu0[j]
}

// dotB is Σ_i B_ij λ_i over the kept rows: the potential the current
// element potentials give species j.
func (sv *solver) dotB(j int) float64 {
	v := 0.0
	for r := range sv.rows {
		v += sv.bm[r][j] * sv.pi[r]
	}
	return v
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
