package gibbs

import "math"

// result assembles the Result in the caller's units and measures the
// residuals on the full conservation matrix.
func (sv *solver) result(converged bool) Result {
	p := sv.p
	s := sv.s
	m, _ := p.B.Dims()
	r := Result{
		N:            make([]float64, s),
		PhaseAmount:  make([]float64, len(p.Phases)),
		PhasePresent: make([]bool, len(p.Phases)),
		LnActivity:   make([]float64, s),
		Potentials:   make([]float64, m),
		Zero:         append([]bool(nil), sv.zero...),
		Iterations:   sv.iterations,
		lnN:          append([]float64(nil), sv.y...),
		key:          problemKey(p),
		scale:        sv.scale,
	}
	for k, i := range sv.rows {
		r.Potentials[i] = sv.pi[k]
	}
	sv.refresh()
	for j := 0; j < s; j++ {
		v := sv.n[j] * sv.scale
		if sv.zero[j] || (sv.kind[j] == kPure && !sv.active[j]) {
			v = 0
		}
		if sv.kind[j] == kMix && !sv.phaseOn[p.Species[j].Phase] {
			v = 0
		}
		if sv.kind[j] != kFixed && !(v > 0) {
			v = 0
		}
		if sv.kind[j] == kFixed {
			// Internally the reservoir species counts as held by the
			// system; what the system took in is the opposite.
			v = -v
		}
		r.N[j] = v
		if sv.kind[j] != kFixed {
			r.PhaseAmount[p.Species[j].Phase] += v
		}
	}
	for k := range p.Phases {
		r.PhasePresent[k] = r.PhaseAmount[k] > 0
	}
	// Activities, stationarity and G.
	station := 0.0
	g := 0.0
	for j := 0; j < s; j++ {
		switch {
		case r.N[j] == 0 && sv.kind[j] != kFixed:
			r.LnActivity[j] = math.Inf(-1)
			continue
		case sv.kind[j] == kMix:
			r.LnActivity[j] = sv.lnAct(j) + (sv.mu0[j] - p.Species[j].Mu0)
		case sv.kind[j] == kFixed:
			r.LnActivity[j] = math.NaN() // the caller's: Mu0 carries it
		default:
			r.LnActivity[j] = 0
		}
		if sv.kind[j] != kMix || sv.n[j] > 1e-12 {
			// Amounts at the rounding of the balances (below 1e-12 of the
			// feed) are fixed by the balances, not their potentials.
			station = math.Max(station, math.Abs(sv.mu[j]-sv.dotB(j)))
		}
		if sv.kind[j] != kFixed {
			g += r.N[j] * sv.mu[j]
		}
	}
	r.Stationarity = station
	r.G = g
	// Residual on every row of B, relative to the feed.
	feed := 0.0
	for j, v := range p.N0 {
		if !p.Species[j].Fixed {
			feed += v
		}
	}
	res := 0.0
	for i := 0; i < m; i++ {
		d := 0.0
		for j := 0; j < s; j++ {
			v := r.N[j]
			if p.Species[j].Fixed {
				v = -v
			}
			d += p.B.At(i, j) * v
			if !p.Species[j].Fixed {
				d -= p.B.At(i, j) * p.N0[j]
			}
		}
		res = math.Max(res, math.Abs(d))
	}
	r.ElementResidual = res / math.Max(feed, 1e-300)
	tolRes := math.Max(1e-9, sv.tolY*100)
	r.Converged = converged && r.ElementResidual <= tolRes && station <= math.Max(1e-7, 1e3*sv.tolY)
	return r
}
