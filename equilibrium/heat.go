package equilibrium

import (
	"fmt"
	"math"

	"hess/network"
)

// enthalpy is Σ n_j H°_j(T) over a list of species and amounts, J; NaN and
// the first species lacking enthalpy data at T otherwise. Ideal phases:
// no enthalpy of mixing, and a gas's enthalpy does not depend on pressure.
func enthalpy(species []*network.Species, n []float64, T float64) (float64, *network.Species) {
	h := 0.0
	for j, sp := range species {
		if n[j] == 0 {
			continue
		}
		if !evaluable(sp, T) || isGibbsOnlyModel(sp) {
			return math.NaN(), sp
		}
		h += n[j] * sp.Model().H(T)
	}
	return h, nil
}

// isGibbsOnlyModel reports a species known by ΔfG° alone, which has no
// enthalpy.
func isGibbsOnlyModel(sp *network.Species) bool {
	lo, hi := sp.Model().Range()
	return lo == hi
}

// feedEnthalpy is the feed's enthalpy at its own temperature, J.
func feedEnthalpy(feed []feedItem, T float64) (float64, *network.Species) {
	species := make([]*network.Species, len(feed))
	n := make([]float64, len(feed))
	for i, f := range feed {
		species[i], n[i] = f.species, f.amount
	}
	return enthalpy(species, n, T)
}

// productEnthalpy is the products' enthalpy at the composition's T, J.
func (c *Composition) productEnthalpy() (float64, *network.Species) {
	return enthalpy(c.sys.species, c.res.N, c.T)
}

// heat sets the heat to take the feed from its own temperature to the
// products at T.
func (c *Composition) heat(feed []feedItem) {
	c.Heat = math.NaN()
	hf, sp := feedEnthalpy(feed, c.FeedT)
	if sp != nil {
		c.HeatNote = fmt.Sprintf("%s has no enthalpy data at the feed's %s K", sp.Key, kelvin(c.FeedT))
		return
	}
	hp, sp := c.productEnthalpy()
	if sp != nil {
		c.HeatNote = fmt.Sprintf("%s has no enthalpy data at %s K", sp.Key, kelvin(c.T))
		return
	}
	c.Heat = hp - hf
}
