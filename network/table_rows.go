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
func speciesGiveDeltaG(rx *Reaction, temps []float64, known *givesG) bool {
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
			if !known.ofTerm(t, temps) {
				return false
			}
		}
	}
	return true
}

// givesG caches modelGivesG for the species of one network at one list of
// temperatures, by declaration index.
type givesG struct {
	species []*Species // the network's, in declaration order
	answer  []int8     // by index: 0 not yet asked, 1 gives G°, -1 does not
}

func newGivesG(n *Network) *givesG {
	return &givesG{species: n.Species, answer: make([]int8, len(n.Species))}
}

// of is modelGivesG(sp.Model(), temps), worked out once per species of the
// network (a species from elsewhere is worked out every time).
func (g *givesG) of(sp *Species, temps []float64) bool {
	if !declaredIn(g.species, sp) {
		return modelGivesG(sp.Model(), temps)
	}
	i := sp.index
	if g.answer[i] == 0 {
		g.answer[i] = -1
		if modelGivesG(sp.Model(), temps) {
			g.answer[i] = 1
		}
	}
	return g.answer[i] > 0
}

// ofTerm is of for a term's species, found by the index the term holds.
func (g *givesG) ofTerm(t Term, temps []float64) bool {
	if i := termIndex(g.species, t); i >= 0 && g.answer[i] != 0 {
		return g.answer[i] > 0
	}
	return g.of(t.Species, temps)
}

// fill works out the answer for every species of the network, in
// declaration order: the species and their models lie in memory nearly in
// that order, where a walk through the reactions reaches them in none.
func (g *givesG) fill(temps []float64) {
	for _, sp := range g.species {
		g.of(sp, temps)
	}
}

// modelGivesG reports whether m holds beyond 298.15 K and gives a finite
// G° at each of temps.
func modelGivesG(m thermo.Model, temps []float64) bool {
	if m == nil || isGibbsOnly(m) {
		return false
	}
	// Most models are finite by their form over the whole span of temps
	// (thermo.FiniteOn); only the others are evaluated at each.
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, T := range temps {
		if T > 0 {
			lo, hi = math.Min(lo, T), math.Max(hi, T)
		}
	}
	if lo <= hi && thermo.FiniteOn(m, lo, hi) {
		return true
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

// declaredIn reports whether sp is one of a network's species, list being
// that network's Species (a species' index is its place there).
func declaredIn(list []*Species, sp *Species) bool {
	i := sp.index
	return i >= 0 && i < len(list) && list[i] == sp
}
