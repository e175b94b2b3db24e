package network

import (
	"fmt"
	"slices"
	"strconv"
	"sync"

	"hess/chem"
	"hess/lang"
)

// Reuse of compiled reactions between loads (the language server's loads
// through ParseCaches). A reaction statement's compiled form depends on
// the statement itself (its text, file and place) and on the species the
// network declares: which keys, in which order, with which formula and
// charge (lookups, the balance facts, the hints of undefined-species). The
// parse caches hand out the same *lang.Statement for a statement whose
// text, file and place did not change (and a copy with the same lineage
// for one an edit moved), so a compile found by that statement, under the
// same signature of the declared species (speciesEnv), is exactly what
// compiling the statement again would give. Everything else a reaction
// depends on (other reactions: names, combinations, duplicates) is worked
// out after the build, in the serial passes, every time.

// compileMemo is one root's compiled species data and reactions from its
// last completed compile. It serves one load at a time.
type compileMemo struct {
	mu  sync.Mutex
	env string // speciesEnv of the compile the reactions are from
	// reactions are the last compile's, by their statements' lineage: a
	// statement in place is the same statement, and one that an edit
	// before it moved is a copy with the same text and lineage, whose
	// build is the same but for its node when it refers to no position but
	// its statement's (positionFree).
	reactions map[uint64]*memoReaction
	reused    int // reactions the latest compile took from the memo, for tests

	elements      string // elementsEnv of the compile the species are from
	species       map[*lang.Species]*memoSpecies
	reusedSpecies int // species statements the latest compile took from the memo
	// from maps each species of the latest compile whose data were taken
	// from the memo to the species they were taken from.
	from *speciesOrigins
	// pressure is the standard pressure of the latest compile's network,
	// which its species' models were built for.
	pressure float64
	// refs are the species each species reference of the latest compile
	// made (prepareRefs).
	refs map[*lang.SpeciesRef]*Species

	checks checkMemo // species-local check findings (check_reuse.go)
}

// memoReaction is a built reaction of the last compile, as buildReaction
// made it: its rx is the network's own, which nothing changes after the
// build but the combination pass (rx.Combo, cleared in every copy taken).
// Its species are those of the network it was built for; a copy for
// another network finds them again by declaration index (sameSpecies).
type memoReaction struct {
	st    *lang.Statement // the statement it was built from
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
// declared species: each one's key, charge and formula (as small whole
// counts when it has them), in declaration order.
func speciesEnv(n *Network) string {
	b := make([]byte, 0, len(n.Species)*32)
	for _, sp := range n.Species {
		b = append(b, sp.Key...)
		b = append(b, 0)
		b = strconv.AppendInt(b, int64(sp.Charge), 10)
		b = append(b, 0)
		for _, f := range [3]bool{sp.HasFormula, sp.ints.known, sp.ints.ok} {
			b = strconv.AppendBool(b, f)
		}
		// Small whole counts (ints.ok) are the formula; else the formula
		// itself.
		for _, e := range sp.Formula.Elements {
			if sp.ints.ok {
				break
			}
			b = append(b, 0)
			b = append(b, e.Symbol...)
			b = append(b, '=')
			if e.Count != nil {
				b = e.Count.Num().Append(b, 10)
				b = append(b, '/')
				b = e.Count.Denom().Append(b, 10)
			}
		}
		for _, c := range sp.ints.counts {
			b = append(b, 0)
			b = append(b, c.key...)
			b = append(b, '=')
			b = strconv.AppendInt(b, c.n, 10)
		}
		b = append(b, '\n')
	}
	return string(b)
}

// buildReactionsReusing is buildReactions taking each statement that the
// memo compiled under the same species from the memo. It returns the built
// reactions and the memo entries for the next compile, which refer to
// this compile's reactions (so that the last network is not kept).
func (c *compiler) buildReactionsReusing(sts []*lang.Statement, memo *compileMemo, env string) ([]builtReaction, map[uint64]*memoReaction) {
	memo.mu.Lock()
	var prev map[uint64]*memoReaction
	if memo.env == env {
		prev = memo.reactions
	}
	memo.mu.Unlock()
	out := make([]builtReaction, len(sts))
	reused := make([]bool, len(sts))
	parallel(len(sts), 512, func() func(i int) {
		w := c.worker(nil)
		return func(i int) {
			// The statement itself, or a moved copy of it whose build
			// refers to no position but the statement's.
			if m := prev[sts[i].Lineage()]; m != nil && (m.st == sts[i] || positionFree(m.built)) {
				out[i], reused[i] = m.restore(c.net, sts[i].Reaction), true
				return
			}
			w.buildReaction(sts[i], &out[i])
		}
	})
	next := make(map[uint64]*memoReaction, len(sts))
	entries := make([]memoReaction, len(sts)) // one allocation for all
	n := 0
	for i, st := range sts {
		entries[i] = memoReaction{st: st, built: out[i]}
		next[st.Lineage()] = &entries[i]
		if reused[i] {
			n++
		}
	}
	memo.mu.Lock()
	memo.reused = n
	memo.mu.Unlock()
	return out, next
}

// positionFree reports whether a built reaction refers to no position but
// its statement's node: no diagnostics, no species mentioned by a broken
// statement, no own data or rates (whose values keep their spans), no
// source note. Such a build is the same for any statement of the same
// text, once its node and name are the new statement's.
func positionFree(b builtReaction) bool {
	rx := b.rx
	return rx != nil && len(b.diags) == 0 && len(b.propDiags) == 0 && len(b.mentioned) == 0 &&
		rx.Dg == nil && rx.Dh == nil && rx.Ds == nil && len(rx.LogK) == 0 && rx.Rate == nil && rx.Reverse == nil &&
		rx.Source == ""
}

// commit keeps the entries of a completed compile: its reactions under
// env, its species under elements.
func (m *compileMemo) commit(env string, entries map[uint64]*memoReaction, elements string, species map[*lang.Species]*memoSpecies, from *speciesOrigins, pressure float64, refs map[*lang.SpeciesRef]*Species) {
	m.mu.Lock()
	defer m.mu.Unlock()
	m.env, m.reactions = env, entries
	m.elements, m.species, m.from, m.pressure, m.refs = elements, species, from, pressure, refs
}

// restore builds a fresh copy of the entry for the network n and the
// statement st (the one it was built from, or a moved one of the same
// text), its species those of n declared where they were (sameSpecies).
func (m *memoReaction) restore(n *Network, st *lang.Reaction) builtReaction {
	b := m.built
	b.diags = slices.Clone(m.built.diags)
	b.propDiags = slices.Clone(m.built.propDiags)
	b.mentioned = nil
	for _, sp := range m.built.mentioned {
		b.mentioned = append(b.mentioned, sameSpecies(n, sp))
	}
	if rx := m.built.rx; rx != nil {
		b.rx = copyReaction(rx)
		b.rx.Combo = nil // set by the combination pass, after the build
		// The statement's node and name now, so that a moved statement's
		// build resolves its spans there and keeps no older text alive.
		b.rx.node, b.rx.Name = st, st.Name.Name
		for _, side := range [2][]Term{b.rx.Left, b.rx.Right} {
			for i, t := range side {
				if t.Species != nil {
					side[i].Species = sameSpecies(n, t.Species)
				}
			}
		}
	}
	return b
}

// sameSpecies is the species of n declared where sp was declared in the
// network it is of. The memo's reactions are taken only when the two
// networks' species signatures are equal (speciesEnv: every key, in
// declaration order), so that is the species with sp's key, found by
// declaration index without reading either species' key.
func sameSpecies(n *Network, sp *Species) *Species {
	if i := sp.index; i >= 0 && i < len(n.Species) {
		return n.Species[i]
	}
	return n.speciesByKey[sp.Key]
}

// copyReaction copies a reaction as built (no combination yet) so that the
// copy shares nothing that may change: terms, values, logk and rates are
// copied; coefficients are shared, as they are never changed in place.
func copyReaction(rx *Reaction) *Reaction {
	out, terms := newReaction(len(rx.Left) + len(rx.Right)) // one allocation, as a build makes
	*out = *rx
	if rx.Left != nil {
		out.Left = append(terms[:0:len(rx.Left)], rx.Left...)
	}
	if rx.Right != nil {
		out.Right = append(terms[len(rx.Left):len(rx.Left):len(terms)], rx.Right...)
	}
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
	return out
}

func copyValue(v *Value) *Value {
	if v == nil {
		return nil
	}
	c := *v
	return &c
}

// A species statement's data (speciesStatement: label, values, ranges,
// source and note, formula) depend on the statement itself (text, file,
// place: the pointer the parse caches hand out), on which of its species
// were declared (not duplicates of earlier ones), and on the element table
// that formulas are read against (elementsEnv); nothing else of the
// network. The data are never changed after the statement's compile, so a
// later network's species may share them with the last one's.

// memoSpecies is a species statement of the last compile: its declared
// species, as that network holds them, and the diagnostics of its data.
type memoSpecies struct {
	declared []*Species
	diags    lang.Diagnostics
}

// elementsEnv is the signature of the element table formulas are read
// against.
func elementsEnv(n *Network) string {
	if n.Elements == chem.BuiltinElements() {
		return "builtin"
	}
	return fmt.Sprint(n.Elements.Elements())
}

// speciesDataReusing is speciesData taking the data of each statement that
// the memo compiled with the same species declared and the same elements
// from the memo. It returns the entries for the next compile, and which
// species took their data from which of the last compile's.
func (c *compiler) speciesDataReusing(list []declaredSpecies, memo *compileMemo, elements string) (map[*lang.Species]*memoSpecies, *speciesOrigins) {
	memo.mu.Lock()
	var prev map[*lang.Species]*memoSpecies
	if memo.elements == elements {
		prev = memo.species
	}
	memo.mu.Unlock()
	diags := make([]lang.Diagnostics, len(list))
	reused := make([]bool, len(list))
	parallel(len(list), 256, func() func(i int) {
		w := c.speciesWorker()
		return func(i int) {
			if m := prev[list[i].st]; m != nil && sameKeys(m.declared, list[i].declared) {
				for j, sp := range list[i].declared {
					copySpeciesData(sp, m.declared[j])
				}
				diags[i], reused[i] = slices.Clone(m.diags), true
				return
			}
			w.out = &diags[i]
			w.speciesStatement(list[i])
		}
	})
	next := make(map[*lang.Species]*memoSpecies, len(list))
	entries := make([]memoSpecies, len(list)) // one allocation for all
	from := &speciesOrigins{species: c.net.Species, old: make([]*Species, len(c.net.Species))}
	n := 0
	for i, d := range list {
		c.net.Diagnostics = append(c.net.Diagnostics, diags[i]...)
		entries[i] = memoSpecies{declared: d.declared, diags: diags[i]}
		next[d.st] = &entries[i]
		if reused[i] {
			n++
			for j, sp := range d.declared {
				from.old[sp.index] = prev[d.st].declared[j]
			}
		}
	}
	memo.mu.Lock()
	memo.reusedSpecies = n
	memo.mu.Unlock()
	return next, from
}

// sameKeys reports whether two lists declare the same species keys.
func sameKeys(a, b []*Species) bool {
	if len(a) != len(b) {
		return false
	}
	for i := range a {
		if a[i].Key != b[i].Key {
			return false
		}
	}
	return true
}

// copySpeciesData gives dst the data that speciesStatement read into src:
// every field it sets. (TestIncrementalLoadMatchesFresh compares every
// field of the species with a fresh compile's, so a field added to that
// statement's compile and not here fails it.)
func copySpeciesData(dst, src *Species) {
	dst.Label = src.Label
	dst.Formula, dst.HasFormula = src.Formula, src.HasFormula
	dst.ints.copyFrom(&src.ints)
	dst.Hf, dst.Gf, dst.S, dst.Cp = src.Hf, src.Gf, src.S, src.Cp
	dst.Size, dst.Setschenow = src.Size, src.Setschenow
	dst.Ranges = slices.Clone(src.Ranges)
	dst.Source, dst.Note = src.Source, src.Note
	dst.BrokenData = src.BrokenData
}

// speciesOrigins maps each species of one compile, by declaration index,
// to the species of the compile before whose data it took (nil where it
// took none).
type speciesOrigins struct {
	species []*Species // the compile's, in declaration order
	old     []*Species
}

// of is the species whose data sp took, nil when it took none or is not
// a species of the compile o is of.
func (o *speciesOrigins) of(sp *Species) *Species {
	if o == nil || sp.index < 0 || sp.index >= len(o.old) || o.species[sp.index] != sp {
		return nil
	}
	return o.old[sp.index]
}
