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

// memoReaction is a built reaction as it left buildReaction, holding no
// pointer into any network: species are named by key.
type memoReaction struct {
	built     builtReaction // rx is a private copy; mentioned is nil
	left      []string      // species keys of rx.Left's terms ("" when undefined)
	right     []string
	mentioned []string
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
// reactions and the memo entries for the next compile.
func (c *compiler) buildReactionsReusing(sts []*lang.Statement, memo *compileMemo, env string) ([]builtReaction, map[*lang.Statement]*memoReaction) {
	memo.mu.Lock()
	var prev map[*lang.Statement]*memoReaction
	if memo.env == env {
		prev = memo.reactions
	}
	memo.mu.Unlock()
	out := make([]builtReaction, len(sts))
	entries := make([]*memoReaction, len(sts))
	reused := make([]bool, len(sts))
	parallel(len(sts), 512, func() func(i int) {
		w := c.worker(nil)
		return func(i int) {
			if m := prev[sts[i]]; m != nil {
				out[i], entries[i], reused[i] = m.restore(c.net), m, true
				return
			}
			w.buildReaction(sts[i], &out[i])
			entries[i] = remember(&out[i])
		}
	})
	next := make(map[*lang.Statement]*memoReaction, len(sts))
	n := 0
	for i, st := range sts {
		if entries[i] != nil {
			next[st] = entries[i]
		}
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

// remember copies a freshly built reaction into a memo entry, or returns
// nil when it holds something the memo does not copy (a combination,
// which the statement's build never sets).
func remember(b *builtReaction) *memoReaction {
	if b.rx != nil && b.rx.Combo != nil {
		return nil
	}
	m := &memoReaction{built: *b}
	m.built.diags = cloneDiagnostics(b.diags)
	m.built.propDiags = cloneDiagnostics(b.propDiags)
	m.built.mentioned = nil
	for _, sp := range b.mentioned {
		m.mentioned = append(m.mentioned, sp.Key)
	}
	if b.rx != nil {
		m.built.rx = copyReaction(b.rx)
		m.left, m.right = termKeys(b.rx.Left), termKeys(b.rx.Right)
		for _, side := range [2][]Term{m.built.rx.Left, m.built.rx.Right} {
			for i := range side {
				side[i].Species = nil
			}
		}
	}
	return m
}

// restore builds a fresh copy of the entry for the network n, its species
// found by key among n's (the species signature being equal, each key
// names the species of the same declaration it named before).
func (m *memoReaction) restore(n *Network) builtReaction {
	b := m.built
	b.diags = cloneDiagnostics(m.built.diags)
	b.propDiags = cloneDiagnostics(m.built.propDiags)
	for _, k := range m.mentioned {
		b.mentioned = append(b.mentioned, n.speciesByKey[k])
	}
	if m.built.rx != nil {
		b.rx = copyReaction(m.built.rx)
		for i, k := range m.left {
			if k != "" {
				b.rx.Left[i].Species = n.speciesByKey[k]
			}
		}
		for i, k := range m.right {
			if k != "" {
				b.rx.Right[i].Species = n.speciesByKey[k]
			}
		}
	}
	return b
}

func termKeys(ts []Term) []string {
	out := make([]string, len(ts))
	for i, t := range ts {
		if t.Species != nil {
			out[i] = t.Species.Key
		}
	}
	return out
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

// cloneDiagnostics copies a list of diagnostics with their related
// information.
func cloneDiagnostics(ds lang.Diagnostics) lang.Diagnostics {
	if ds == nil {
		return nil
	}
	out := slices.Clone(ds)
	for i := range out {
		out[i].Related = slices.Clone(out[i].Related)
	}
	return out
}
