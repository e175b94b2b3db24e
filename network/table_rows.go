package network

import (
	"math"

	"hess/thermo"
)

// reactionRows computes a reaction's table rows at the given temperatures
// (K), as the tables do, without their crossover search: checks that
// compare values at given temperatures need only the rows.
func (n *Network) reactionRows(rx *Reaction, temps []float64) []TableRow {
	if rx == nil {
		return nil
	}
	c := n.ReactionK(rx)
	rows := make([]TableRow, 0, len(temps))
	for _, T := range temps {
		rows = append(rows, c.Row(T))
	}
	return rows
}

// okAt reports whether the reaction's ΔrG° is known at T, as at(T).ok()
// does, computing only ΔrG° from the species when their models give it.
func (c *ReactionK) okAt(T float64) bool {
	if c.absOK && T > 0 {
		if g := c.abs.DeltaG(T); !math.IsNaN(g) && !math.IsInf(g, 0) {
			return true
		}
	}
	return c.at(T).ok()
}

// speciesGiveDeltaG reports whether the species' models alone give the
// reaction's ΔrG° at every one of temps: each species has a model that
// holds beyond 298.15 K with a finite G° there, and no species is written
// on both sides (so none cancels out). False means the full calculation
// must decide. known caches each species' answer across calls with the
// same temps.
func speciesGiveDeltaG(rx *Reaction, temps []float64, known map[*Species]bool) bool {
	if len(rx.Left)+len(rx.Right) == 0 {
		return false
	}
	for _, l := range rx.Left {
		for _, r := range rx.Right {
			if l.Species == r.Species {
				return false
			}
		}
	}
	for _, side := range [2][]Term{rx.Left, rx.Right} {
		for _, t := range side {
			if t.Species == nil || t.Coef == nil || t.Coef.Sign() == 0 {
				return false
			}
			ok, seen := known[t.Species]
			if !seen {
				ok = modelGivesG(t.Species.Model(), temps)
				known[t.Species] = ok
			}
			if !ok {
				return false
			}
		}
	}
	return true
}

// modelGivesG reports whether m holds beyond 298.15 K and gives a finite
// G° at each of temps.
func modelGivesG(m thermo.Model, temps []float64) bool {
	if m == nil || isGibbsOnly(m) {
		return false
	}
	for _, T := range temps {
		if !(T > 0) {
			continue
		}
		if g := m.G(T); math.IsNaN(g) || math.IsInf(g, 0) {
			return false
		}
	}
	return true
}
