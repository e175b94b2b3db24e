package equilibrium

import (
	"math"

	"hess/network"
	"hess/thermo"
)

// assignMu0 sets μ°/RT of every species from its data, then from the
// reactions whose ΔrG° is known at T and whose other species have μ°; the
// rest get NaN and are returned.
func assignMu0(n *network.Network, set []aqSpecies, T float64) []*network.Species {
	// Two scales give Σ ν μ° = ΔrG° for every balanced reaction: G° = H° −
	// T·S° at any T, and ΔfG° at 298.15 K. Each species' data place it on
	// one or both; the scale that places more of them is used.
	scales := []func(*network.Species) (float64, bool){
		func(sp *network.Species) (float64, bool) { return sp.StandardGibbs(T) },
	}
	if thermo.AtT298(T) {
		scales = append(scales, func(sp *network.Species) (float64, bool) { return sp.FormationGibbs() })
	}
	var best []*network.Species
	var bestMu []float64
	for _, g := range scales {
		mu := make([]float64, len(set))
		skipped := derivedMu0(n, set, T, g, mu)
		if bestMu == nil || len(skipped) < len(best) {
			best, bestMu = skipped, mu
		}
	}
	for i := range set {
		set[i].mu0 = bestMu[i]
	}
	return best
}

// derivedMu0 fills mu with μ°/RT of every species on the scale g gives,
// then from the reactions whose ΔrG° is known at T and whose other species
// have μ°; the rest get NaN and are returned.
func derivedMu0(n *network.Network, set []aqSpecies, T float64, g func(*network.Species) (float64, bool), mu []float64) []*network.Species {
	RT := thermo.R * T
	index := map[*network.Species]int{}
	for i := range set {
		index[set[i].sp] = i
		mu[i] = math.NaN()
		if v, ok := g(set[i].sp); ok {
			mu[i] = v / RT
		}
	}
	// Derived: each pass assigns the species that one reaction leaves as its
	// only unknown. Reactions whose species are all known are left alone.
	derived := map[*network.Species]float64{}
	known := func(sp *network.Species) (float64, bool) {
		if i, ok := index[sp]; ok && !math.IsNaN(mu[i]) {
			return mu[i] * RT, true
		}
		if v, ok := derived[sp]; ok {
			return v, true
		}
		return g(sp)
	}
	for pass := 0; pass <= len(n.Reactions); pass++ {
		progress := false
		for _, rx := range n.Reactions {
			if !rx.Resolved || !rx.TwoWay {
				continue
			}
			var unknown *network.Species
			var nuUnknown float64
			sum, count := 0.0, 0
			for _, t := range rx.NetTerms() {
				nu, _ := t.Nu.Float64()
				if v, ok := known(t.Species); ok {
					sum += nu * v
					continue
				}
				count++
				unknown, nuUnknown = t.Species, nu
			}
			if count != 1 {
				continue
			}
			row := n.ReactionK(rx).Row(T)
			if !row.Valid || math.IsNaN(row.DG) {
				continue
			}
			derived[unknown] = (row.DG - sum) / nuUnknown
			if i, ok := index[unknown]; ok {
				mu[i] = derived[unknown] / RT
			}
			progress = true
		}
		if !progress {
			break
		}
	}
	var skipped []*network.Species
	for i, s := range set {
		if math.IsNaN(mu[i]) {
			skipped = append(skipped, s.sp)
		}
	}
	return skipped
}
