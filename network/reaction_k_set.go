package network

import (
	"math"
	"math/big"
)

// maxKeptPoints bounds the points a KSet keeps at its grid temperatures
// (56 bytes each): past it, parts built later keep none and are evaluated
// again at each temperature, as a reaction outside a set is. (Taking the
// points back from older parts instead would make a long chain evaluated
// from its far end give up and rebuild them at every temperature.)
const maxKeptPoints = 1 << 20

// A KSet builds the calculations (ReactionK) of many reactions of one
// network, as a table or a plot does: each part of a coupled reaction is
// built once and shared by every reaction that uses it, and its values at
// the set's grid temperatures are kept, so that a chain of coupled
// reactions costs in proportion to its length rather than its square.
// Only parts reached without a cycle are shared: those depend on nothing
// but their own reaction. A KSet is not safe for concurrent use; each
// goroutine takes its own.
type KSet struct {
	net    *Network
	parts  map[*Reaction]*ReactionK
	index  map[float64]int // grid temperature → its place
	size   int             // points per part
	lastT  float64         // the temperature last looked up in index
	lastJ  int             // its place, -1 for none
	points int             // points held
}

// gridPoint is a kept point and whether it was computed.
type gridPoint struct {
	p    point
	done bool
}

// NewKSet returns a set whose parts keep their values at the given
// temperatures (K); grid may be nil.
func (n *Network) NewKSet(grid []float64) *KSet {
	s := &KSet{net: n, parts: map[*Reaction]*ReactionK{}, lastT: math.NaN(), lastJ: -1}
	if len(grid) > 0 && len(grid) <= maxKeptPoints {
		s.index = make(map[float64]int, len(grid))
		for _, T := range grid {
			if _, dup := s.index[T]; !dup {
				s.index[T] = len(s.index)
			}
		}
		s.size = len(s.index)
	}
	return s
}

// K is the calculation of rx, which must not be nil, as Network.ReactionK
// gives it, with the parts of a coupled reaction shared through the set.
func (s *KSet) K(rx *Reaction) *ReactionK { return s.net.reactionK(rx, s) }

// shared is the part already built for rx, or nil (also on a nil set).
func (s *KSet) shared(rx *Reaction) *ReactionK {
	if s == nil {
		return nil
	}
	return s.parts[rx]
}

// share keeps c as the part for rx (nothing on a nil set).
func (s *KSet) share(rx *Reaction, c *ReactionK) {
	if s == nil {
		return
	}
	c.set = s
	s.parts[rx] = c
}

// at is the part c's point at T when T is a grid temperature, computed
// once; false when T is not one.
func (s *KSet) at(c *ReactionK, T float64) (point, bool) {
	if T != s.lastT { // NaN at first: never equal
		j, ok := s.index[T]
		if !ok {
			j = -1
		}
		s.lastT, s.lastJ = T, j
	}
	j := s.lastJ
	if j < 0 {
		return point{}, false
	}
	if c.grid == nil {
		if s.points+s.size > maxKeptPoints {
			return point{}, false
		}
		c.grid = make([]gridPoint, s.size)
		s.points += s.size
	}
	if g := c.grid[j]; g.done {
		return g.p, true
	}
	p := c.eval(T)
	c.grid[j] = gridPoint{p: p, done: true}
	return p, true
}

// addsUpFromSpecies reports whether c is a coupled reaction without own
// data whose parts all take their values from their species (directly or
// as such a coupled reaction in turn) and add up to c's own equation: then
// ΔrG° from c's species is its parts' sum, up to rounding.
func (c *ReactionK) addsUpFromSpecies() bool {
	if !c.partsOK || !c.absOK || c.own.has() {
		return false
	}
	sum := map[*Species]*big.Rat{}
	for i, ct := range c.rx.Combo {
		p := c.parts[i]
		if p.own.has() || !p.absOK || (p.partsOK && !p.flat) {
			return false
		}
		for _, t := range p.terms {
			v, ok := sum[t.Species]
			if !ok {
				v = new(big.Rat)
				sum[t.Species] = v
			}
			v.Add(v, new(big.Rat).Mul(ct.Weight, t.Nu))
		}
	}
	for _, t := range c.terms {
		v, ok := sum[t.Species]
		if !ok || v.Cmp(t.Nu) != 0 {
			return false
		}
		delete(sum, t.Species)
	}
	for _, v := range sum {
		if v.Sign() != 0 {
			return false
		}
	}
	return true
}

// SumsSpecies reports whether the reaction's ΔrG° over its Span is the sum
// of its species' models (Species), up to rounding: the span is the
// species', or the reaction is coupled from parts that take their values
// from species and add up to its equation. A search over the span may
// then evaluate the species' sum instead of the parts one by one.
func (c *ReactionK) SumsSpecies() bool {
	switch c.SpanSource() {
	case BasisSpecies:
		return c.absOK
	case BasisCombination:
		return c.flat
	}
	return false
}
