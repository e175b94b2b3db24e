package network

import (
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
// network's standard pressure), the network's standard pressure and
// tolerance; and whether some reaction uses it and the temperatures the
// network is checked at are the same. Such a check must read nothing else
// of the network.

// checkMemo holds the last completed check run's per-species findings, by
// check part; it belongs to a compileMemo.
type checkMemo struct {
	mu       sync.Mutex
	pressure float64 // the network's standard pressure, tolerance and temperatures then
	tol      float64
	temps    []float64
	found    map[string]map[*Species]lang.Diagnostics // by part, then species: only those with findings
	// species are the species of the network the findings are of: each
	// was looked at, so one of them absent from found had none. (The
	// species a compile took its data from may be of a network whose
	// checks never completed; those are not among these.)
	species []*Species
	reused  int // findings lists reused by the latest run, for tests
}

// speciesChecks is one check run's view of the memo: the previous
// findings when the network's settings match, and the new ones.
type speciesChecks struct {
	from        *speciesOrigins // a species of this network -> the one of the last whose data it took
	prev        map[string]map[*Species]lang.Diagnostics
	prevSpecies []*Species // the species prev is of (checkMemo.species)

	mu     sync.Mutex
	next   map[string]map[*Species]lang.Diagnostics
	reused int
}

// startSpeciesChecks prepares a check run over n with the memo; nil
// without one.
func startSpeciesChecks(n *Network, memo *compileMemo) *speciesChecks {
	if memo == nil {
		return nil
	}
	memo.mu.Lock()
	from := memo.from
	memo.mu.Unlock()
	cm := &memo.checks
	cm.mu.Lock()
	defer cm.mu.Unlock()
	sc := &speciesChecks{from: from, next: map[string]map[*Species]lang.Diagnostics{}}
	if cm.pressure == n.StandardPressure() && cm.tol == n.Settings.Tolerance && slices.Equal(cm.temps, n.Temperatures) {
		sc.prev, sc.prevSpecies = cm.found, cm.species
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
	cm.found, cm.species, cm.reused = sc.next, n.Species, sc.reused
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
	// The findings of a run are kept for the species that had some: every
	// species of that run's network was looked at (or its findings taken),
	// so one of them that is not in prev had none. ran is false when the
	// part did not run last time.
	prev, ran := sc.prev[part]
	next := map[*Species]lang.Diagnostics{}
	reused := 0
	for _, sp := range p.Net.Species {
		if old := sc.from.of(sp); ran && old != nil && sc.lookedAt(old) && old.p0 == sp.p0 && old.Activity() == sp.Activity() && old.Used == sp.Used {
			if ds := prev[old]; len(ds) > 0 {
				*p.out = append(*p.out, ds...)
				next[sp] = ds
			}
			reused++
			continue
		}
		start := len(*p.out)
		fn(sp)
		if len(*p.out) > start {
			next[sp] = slices.Clip((*p.out)[start:len(*p.out):len(*p.out)])
		}
	}
	sc.mu.Lock()
	sc.next[part] = next
	sc.reused += reused
	sc.mu.Unlock()
}

// lookedAt reports whether sp is a species of the network whose findings
// prev holds.
func (sc *speciesChecks) lookedAt(sp *Species) bool { return declaredIn(sc.prevSpecies, sp) }
