package lsp

import (
	"sync"

	"hess/equilibrium"
	"hess/lang"
	"hess/network"
)

// Bounds on the equilibrium work the worker does for hovers: the feeds of
// a network solved, and the size of a network whose feeds are solved at all.
const (
	maxHoverFeeds   = 32
	maxHoverSpecies = 5000
)

// feedResults are the equilibrium compositions of one compiled network's
// feeds at their own temperature and pressure (reactions basis), solved by
// the worker after it has published the network's diagnostics, and read by
// hovers. They belong to the compiled network, so a network reused from the
// cache keeps them.
type feedResults struct {
	mu     sync.Mutex
	done   bool
	byName map[string]feedResult
}

type feedResult struct {
	comp  *equilibrium.Composition
	diags lang.Diagnostics
	err   error
}

// get returns a mixture's result; ok is false while it is not solved.
func (f *feedResults) get(name string) (feedResult, bool) {
	if f == nil {
		return feedResult{}, false
	}
	f.mu.Lock()
	defer f.mu.Unlock()
	r, ok := f.byName[name]
	return r, ok
}

// solveFeeds solves the feeds of every root not yet solved. It stops early
// (leaving the rest for the next cycle) when another cycle is waiting, so
// that a solve never holds up the diagnostics of an edit by more than one
// feed's solve.
func (w *worker) solveFeeds(roots []*compiled) {
	for _, r := range roots {
		if r.feeds == nil {
			continue
		}
		r.feeds.mu.Lock()
		done := r.feeds.done
		r.feeds.mu.Unlock()
		if done {
			continue
		}
		net := r.net
		if len(net.Species) > maxHoverSpecies || net.Diagnostics.HasErrors() {
			r.feeds.mu.Lock()
			r.feeds.done = true
			r.feeds.mu.Unlock()
			continue
		}
		n := 0
		for _, m := range net.Mixtures {
			if !m.IsFeed() {
				continue
			}
			if n++; n > maxHoverFeeds {
				break
			}
			if _, ok := r.feeds.get(m.Name); ok {
				continue
			}
			if len(w.wake) > 0 {
				return
			}
			c, diags, err := equilibrium.Equilibrate(net, m, equilibrium.Options{})
			r.feeds.mu.Lock()
			r.feeds.byName[m.Name] = feedResult{comp: c, diags: diags, err: err}
			r.feeds.mu.Unlock()
		}
		r.feeds.mu.Lock()
		r.feeds.done = true
		r.feeds.mu.Unlock()
	}
}

// feedsOf is the feed results of a snapshot's network.
func (s *snapshot) feedsOf(net *network.Network) *feedResults {
	if s == nil {
		return nil
	}
	return s.feeds[net]
}
