package network

import (
	"fmt"
	"slices"
	"strings"
	"sync"

	"hess/lang"
)

// Reuse of compiled reactions between loads (the language server's loads
// through ParseCaches). A reaction statement's compiled form depends on
// the statement itself (its text, file and place) and on the species the
// network declares: which keys, in which order, with which formula and
// charge (lookups, the balance facts, the hints of undefined-species). The
// parse caches hand out the same *lang.Statement for a statement whose
// text, file and place did not change, so a compile keyed by that pointer
// and by a signature of the declared species (speciesEnv) is exactly what
// compiling the statement again would give. Everything else a reaction
// depends on (other reactions: names, combinations, duplicates) is worked
// out after the build, in the serial passes, every time.

// compileMemo is one root's compiled reactions from its last completed
// compile. It serves one load at a time.
type compileMemo struct {
	mu        sync.Mutex
	env       string // speciesEnv of the compile the reactions are from
	reactions map[*lang.Statement]*memoReaction
	reused    int // reactions the latest compile took from the memo, for tests
}

// memoReaction is a built reaction of the last compile, as buildReaction
// made it: its rx is the network's own, which nothing changes after the
// build but the combination pass (rx.Combo, cleared in every copy taken).
// Its species are those of the network it was built for; a copy for
// another network finds them again by key.
type memoReaction struct {
	built builtReaction
}

// memo returns the compile memo of the network rooted at the file with the
// given identity; nil caches give nil.
func (p *ParseCaches) memo(rootID string) *compileMemo {
	if p == nil {
		return nil
	}
	p.mu.Lock()
	defer p.mu.Unlock()
	if p.memos == nil {
		p.memos = map[string]*compileMemo{}
	}
	m := p.memos[rootID]
	if m == nil {
		m = &compileMemo{}
		p.memos[rootID] = m
	}
	return m
}

// speciesEnv is the signature of what a reaction's compile reads of the
// declared species: each one's key, charge and formula, in declaration
// order.
func speciesEnv(n *Network) string {
	var b strings.Builder
	b.Grow(len(n.Species) * 24)
	for _, sp := range n.Species {
		b.WriteString(sp.Key)
		fmt.Fprintf(&b, "\x00%d\x00%t%t%t", sp.Charge, sp.HasFormula, sp.ints.known, sp.ints.ok)
		for _, e := range sp.Formula.Elements {
			fmt.Fprintf(&b, "\x00%v", e)
		}
		for _, c := range sp.ints.counts {
			fmt.Fprintf(&b, "\x00%s=%d", c.key, c.n)
		}
		b.WriteByte('\n')
	}
	return b.String()
}

// buildReactionsReusing is buildReactions taking each statement that the
// memo compiled under the same species from the memo. It returns the built
// reactions and the memo entries for the next compile, which refer to
// this compile's reactions (so that the last network is not kept).
func (c *compiler) buildReactionsReusing(sts []*lang.Statement, memo *compileMemo, env string) ([]builtReaction, map[*lang.Statement]*memoReaction) {
	memo.mu.Lock()
	var prev map[*lang.Statement]*memoReaction
	if memo.env == env {
		prev = memo.reactions
	}
	memo.mu.Unlock()
	out := make([]builtReaction, len(sts))
	reused := make([]bool, len(sts))
	parallel(len(sts), 512, func() func(i int) {
		w := c.worker(nil)
		return func(i int) {
			if m := prev[sts[i]]; m != nil {
				out[i], reused[i] = m.restore(c.net), true
				return
			}
			w.buildReaction(sts[i], &out[i])
		}
	})
	next := make(map[*lang.Statement]*memoReaction, len(sts))
	n := 0
	for i, st := range sts {
		next[st] = &memoReaction{built: out[i]}
		if reused[i] {
			n++
		}
	}
	memo.mu.Lock()
	memo.reused = n
	memo.mu.Unlock()
	return out, next
}

// commit keeps the entries of a completed compile under env.
func (m *compileMemo) commit(env string, entries map[*lang.Statement]*memoReaction) {
	m.mu.Lock()
	defer m.mu.Unlock()
	m.env, m.reactions = env, entries
}

// restore builds a fresh copy of the entry for the network n, its species
// found by key among n's (the species signature being equal, each key
// names the species of the same declaration it named before).
func (m *memoReaction) restore(n *Network) builtReaction {
	b := m.built
	b.diags = slices.Clone(m.built.diags)
	b.propDiags = slices.Clone(m.built.propDiags)
	b.mentioned = nil
	for _, sp := range m.built.mentioned {
		b.mentioned = append(b.mentioned, n.speciesByKey[sp.Key])
	}
	if rx := m.built.rx; rx != nil {
		b.rx = copyReaction(rx)
		b.rx.Combo = nil // set by the combination pass, after the build
		for _, side := range [2][]Term{b.rx.Left, b.rx.Right} {
			for i, t := range side {
				if t.Species != nil {
					side[i].Species = n.speciesByKey[t.Species.Key]
				}
			}
		}
	}
	return b
}

// copyReaction copies a reaction as built (no combination yet) so that the
// copy shares nothing that may change: terms, values, logk and rates are
// copied; coefficients are shared, as they are never changed in place.
func copyReaction(rx *Reaction) *Reaction {
	out := *rx
	out.Left = slices.Clone(rx.Left)
	out.Right = slices.Clone(rx.Right)
	out.Dg, out.Dh, out.Ds = copyValue(rx.Dg), copyValue(rx.Dh), copyValue(rx.Ds)
	out.LogK = slices.Clone(rx.LogK)
	if rx.Rate != nil {
		r := *rx.Rate
		out.Rate = &r
	}
	if rx.Reverse != nil {
		r := *rx.Reverse
		out.Reverse = &r
	}
	return &out
}

func copyValue(v *Value) *Value {
	if v == nil {
		return nil
	}
	c := *v
	return &c
}
