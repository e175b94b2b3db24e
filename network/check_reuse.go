package network

import (
	"maps"
	"slices"
	"sync"

	"hess/lang"
)

// Reuse of species-local check findings between loads (the language
// server's). A check that looks at one species at a time, through
// Pass.eachSpecies, finds for a species exactly what it found last time
// when the species' data are the last compile's (its statement reused in
// place: same data, key and spans; speciesDataReusing) and what its model
// is built from besides is the same: the standard pressure of its file
// (p0), its activity convention (whether its model is shifted to the
// network's standard pressure), the network's standard pressure,
// tolerance and every file's standard pressure; and whether some reaction
// uses it and the temperatures the network is checked at are the same. Such a check must read nothing else
// of the network.

// checkMemo holds the last completed check run's per-species findings, by
// check part; it belongs to a compileMemo.
type checkMemo struct {
	mu       sync.Mutex
	pressure float64 // the network's standard pressure, tolerance and temperatures then
	tol      float64
	temps    []float64
	data     map[string]DataPressure                   // the files' standard pressures then
	found    map[string]map[*Species]lang.Diagnostics  // by part, then species
	foundRx  map[string]map[*Reaction]lang.Diagnostics // by part, then reaction
	reused   int                                       // findings lists reused by the latest run, for tests
}

// speciesChecks is one check run's view of the memo: the previous
// findings when the network's settings match, and the new ones.
type speciesChecks struct {
	from   map[*Species]*Species   // a species of this network -> the one of the last whose data it took
	rxFrom map[*Reaction]*Reaction // a reaction of this network -> the one of the last it was copied from
	prev   map[string]map[*Species]lang.Diagnostics
	prevRx map[string]map[*Reaction]lang.Diagnostics

	mu     sync.Mutex
	next   map[string]map[*Species]lang.Diagnostics
	nextRx map[string]map[*Reaction]lang.Diagnostics
	reused int
}

// startSpeciesChecks prepares a check run over n with the memo; nil
// without one.
func startSpeciesChecks(n *Network, memo *compileMemo) *speciesChecks {
	if memo == nil {
		return nil
	}
	memo.mu.Lock()
	from, rxFrom := memo.from, memo.rxFrom
	memo.mu.Unlock()
	cm := &memo.checks
	cm.mu.Lock()
	defer cm.mu.Unlock()
	sc := &speciesChecks{from: from, rxFrom: rxFrom,
		next: map[string]map[*Species]lang.Diagnostics{}, nextRx: map[string]map[*Reaction]lang.Diagnostics{}}
	if cm.pressure == n.StandardPressure() && cm.tol == n.Settings.Tolerance && slices.Equal(cm.temps, n.Temperatures) && maps.Equal(cm.data, n.Settings.DataPressures) {
		sc.prev, sc.prevRx = cm.found, cm.foundRx
	}
	return sc
}

// finish keeps a completed run's findings in the memo.
func (sc *speciesChecks) finish(n *Network, memo *compileMemo) {
	if sc == nil {
		return
	}
	cm := &memo.checks
	cm.mu.Lock()
	defer cm.mu.Unlock()
	cm.pressure, cm.tol, cm.temps = n.StandardPressure(), n.Settings.Tolerance, slices.Clone(n.Temperatures)
	cm.data = maps.Clone(n.Settings.DataPressures)
	cm.found, cm.foundRx, cm.reused = sc.next, sc.nextRx, sc.reused
}

// eachSpecies calls fn for every species of the network in order, as a
// species-local check part named part: fn reports what it finds for that
// species alone. With a memo, a species whose findings can be taken from
// the last run (see checkMemo) is not looked at again.
func (p *Pass) eachSpecies(part string, fn func(sp *Species)) {
	sc := p.species
	if sc == nil || p.out == nil {
		for _, sp := range p.Net.Species {
			fn(sp)
		}
		return
	}
	prev := sc.prev[part]
	next := make(map[*Species]lang.Diagnostics, len(p.Net.Species))
	reused := 0
	for _, sp := range p.Net.Species {
		if old := sc.from[sp]; old != nil && old.p0 == sp.p0 && old.Activity() == sp.Activity() && old.Used == sp.Used {
			if ds, ok := prev[old]; ok {
				*p.out = append(*p.out, ds...)
				next[sp] = ds
				reused++
				continue
			}
		}
		start := len(*p.out)
		fn(sp)
		next[sp] = slices.Clip((*p.out)[start:len(*p.out):len(*p.out)])
	}
	sc.mu.Lock()
	sc.next[part] = next
	sc.reused += reused
	sc.mu.Unlock()
}

// eachReaction calls fn for every reaction of the network in order, as a
// reaction-local check part named part: fn reports what it finds for that
// reaction alone, reading nothing but the reaction (its terms, own data,
// rates, balance facts) and its species' keys, charges, formulas and
// activity conventions; with data, also its species' data and models, and
// then never for a reaction that is a combination. With a memo, a reaction
// copied from the last compile (its statement in place, the declared
// species' keys, charges and formulas the same: buildReactionsReusing)
// whose species keep their activity conventions (and with data: took
// their data from the species the last one used, at the same file
// pressure, and neither is a combination), under the same settings, gets
// last run's findings.
func (p *Pass) eachReaction(part string, data bool, fn func(rx *Reaction)) {
	sc := p.species
	if sc == nil || p.out == nil {
		for _, rx := range p.Net.Reactions {
			fn(rx)
		}
		return
	}
	prev := sc.prevRx[part]
	next := make(map[*Reaction]lang.Diagnostics, len(p.Net.Reactions))
	reused := 0
	for _, rx := range p.Net.Reactions {
		if old := sc.rxFrom[rx]; old != nil && sameActivities(old, rx) && (!data || sc.sameData(old, rx)) {
			if ds, ok := prev[old]; ok {
				*p.out = append(*p.out, ds...)
				next[rx] = ds
				reused++
				continue
			}
		}
		start := len(*p.out)
		fn(rx)
		next[rx] = slices.Clip((*p.out)[start:len(*p.out):len(*p.out)])
	}
	sc.mu.Lock()
	sc.nextRx[part] = next
	sc.reused += reused
	sc.mu.Unlock()
}

// sameActivities reports whether the species of two copies of a reaction
// have the same activity conventions, term by term.
func sameActivities(a, b *Reaction) bool {
	if len(a.Left) != len(b.Left) || len(a.Right) != len(b.Right) {
		return false
	}
	for _, side := range [2][2][]Term{{a.Left, b.Left}, {a.Right, b.Right}} {
		for i, t := range side[0] {
			u := side[1][i]
			if (t.Species == nil) != (u.Species == nil) {
				return false
			}
			if t.Species != nil && t.Species.Activity() != u.Species.Activity() {
				return false
			}
		}
	}
	return true
}

// sameData reports whether the species of a reaction took their data from
// those of the reaction it was copied from, at the same file pressure, and
// neither reaction is a combination.
func (sc *speciesChecks) sameData(old, rx *Reaction) bool {
	if old.Combo != nil || rx.Combo != nil {
		return false
	}
	for _, side := range [2][2][]Term{{old.Left, rx.Left}, {old.Right, rx.Right}} {
		for i, t := range side[1] {
			o := side[0][i].Species
			if t.Species == nil {
				continue // sameActivities: o is nil too
			}
			if sc.from[t.Species] != o || t.Species.p0 != o.p0 {
				return false
			}
		}
	}
	return true
}
