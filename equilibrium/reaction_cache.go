package equilibrium

import (
	"slices"

	"gonum.org/v1/gonum/mat"

	"hess/network"
)

// rxCache holds, per reaction of one network, its ΔrG° evaluation and its
// net terms as floats, so that a sweep or an adiabatic search builds them
// once. A ReactionK remembers its last temperature, so a cache serves one
// goroutine at a time.
type rxCache struct {
	net   *network.Network
	items map[*network.Reaction]*rxItem

	// The last reactions basis built, for the species and reactions it was
	// built from: a sweep whose reactions stay the same builds it once.
	basisSpecies   []*network.Species
	basisReactions []*network.Reaction
	basis          *mat.Dense
}

type rxItem struct {
	k     *network.ReactionK
	terms []rxTerm
	ok    bool // resolved, with terms
}

type rxTerm struct {
	species *network.Species
	nu      float64
}

func newRxCache(net *network.Network) *rxCache {
	return &rxCache{net: net, items: map[*network.Reaction]*rxItem{}}
}

// cacheFor returns start's cache when it belongs to net, else a new one.
func cacheFor(net *network.Network, start *Composition) *rxCache {
	if start != nil && start.cache != nil && start.cache.net == net {
		return start.cache
	}
	return newRxCache(net)
}

func (rc *rxCache) get(rx *network.Reaction) *rxItem {
	if it, ok := rc.items[rx]; ok {
		return it
	}
	it := &rxItem{}
	if rx.Resolved {
		for _, t := range rx.NetTerms() {
			nu, _ := t.Nu.Float64()
			it.terms = append(it.terms, rxTerm{t.Species, nu})
		}
		it.ok = len(it.terms) > 0
		it.k = rc.net.ReactionK(rx)
	}
	rc.items[rx] = it
	return it
}

// deltaG is ΔrG°(T), J/mol; NaN where unknown.
func (it *rxItem) deltaG(T float64) float64 {
	if !it.ok {
		return nan
	}
	return it.k.DeltaG(T)
}

// reactionsBasis returns the conservation matrix built last time for the
// same species and reactions, or nil.
func (rc *rxCache) reactionsBasis(species []*network.Species, reactions []*network.Reaction) *mat.Dense {
	if rc.basis != nil && slices.Equal(rc.basisSpecies, species) && slices.Equal(rc.basisReactions, reactions) {
		return rc.basis
	}
	return nil
}

// keepBasis remembers a conservation matrix (which the solver only reads).
func (rc *rxCache) keepBasis(species []*network.Species, reactions []*network.Reaction, B *mat.Dense) {
	rc.basisSpecies = slices.Clone(species)
	rc.basisReactions = slices.Clone(reactions)
	rc.basis = B
}
