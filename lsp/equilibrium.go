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
	// maxHoverWork bounds species × reactions of a network whose feeds are
	// solved for hovers (the reactions basis's elimination grows with it):
	// 1 000 species and 5 000 reactions take seconds, which a hover should
	// not cost; hess equilibrium still solves them.
	maxHoverWork = 1_000_000
)

// feedResults are the equilibrium compositions of one compiled network's
// feeds at their own temperature and pressure (reactions basis), solved by
// the worker after it has published the network's diagnostics, and read by
// hovers. They belong to the compiled network, so a network reused from the
// cache keeps them.
type feedResults struct {
	mu       sync.Mutex
	done     bool
	tooLarge bool
	byName   map[string]feedResult
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

// solveFeeds starts solving, on a goroutine of its own, the feeds of every
// root not yet solved, unless a solve is already running (the next cycle
// starts what it left). The worker never waits for it, so an edit's
// diagnostics never wait for a solve; one solve at a time keeps it to one
// core.
func (w *worker) solveFeeds(roots []*compiled) {
	if !w.solving.CompareAndSwap(false, true) {
		return
	}
	pending := append([]*compiled(nil), roots...)
	go func() {
		defer w.solving.Store(false)
		for _, r := range pending {
			select {
			case <-w.done:
				return
			default:
			}
			r.solveFeeds(w.done)
		}
	}()
}

// solveFeeds solves the compiled network's feeds at their own temperature
// and pressure, stopping early when done closes.
func (r *compiled) solveFeeds(done <-chan struct{}) {
	f := r.feeds
	if f == nil {
		return
	}
	f.mu.Lock()
	finished := f.done
	f.mu.Unlock()
	if finished {
		return
	}
	net := r.net
	if len(net.Species) > maxHoverSpecies || len(net.Species)*len(net.Reactions) > maxHoverWork || net.Diagnostics.HasErrors() {
		f.mu.Lock()
		f.done, f.tooLarge = true, !net.Diagnostics.HasErrors()
		f.mu.Unlock()
		return
	}
	n := 0
	for _, m := range net.Mixtures {
		if !m.IsFeed() || m.HasFixed() { // a solution open to a reservoir: hess equilibrium
			continue
		}
		if n++; n > maxHoverFeeds {
			break
		}
		if _, ok := f.get(m.Name); ok {
			continue
		}
		select {
		case <-done:
			return
		default:
		}
		c, diags, err := equilibrium.Equilibrate(net, m, equilibrium.Options{})
		f.mu.Lock()
		f.byName[m.Name] = feedResult{comp: c, diags: diags, err: err}
		f.mu.Unlock()
	}
	f.mu.Lock()
	f.done = true
	f.mu.Unlock()
}

// large reports that the network is too large for hovers' solves.
func (f *feedResults) large() bool {
	if f == nil {
		return false
	}
	f.mu.Lock()
	defer f.mu.Unlock()
	return f.tooLarge
}

// feedsOf is the feed results of a snapshot's network.
func (s *snapshot) feedsOf(net *network.Network) *feedResults {
	if s == nil {
		return nil
	}
	return s.feeds[net]
}
