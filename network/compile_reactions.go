package network

import (
	"fmt"
	"math"
	"math/big"
	"sort"
	"strings"
	"sync"

	"hess/lang"
	"hess/suggest"
)

// builtReaction is a reaction statement compiled on its own, before the
// serial pass that names it in the network.
type builtReaction struct {
	rx       *Reaction // nil when the statement has no name
	complete bool      // the statement has a valid name and two sides
	diags    lang.Diagnostics
	// propDiags come from the reaction's properties; they are reported
	// only when the reaction is kept.
	propDiags lang.Diagnostics
	// mentioned are the declared species named anywhere in a statement
	// that did not parse: it may well use them, so they are not reported
	// as unused on account of its syntax error.
	mentioned []*Species
}

// buildReactions compiles every reaction statement on its own, in
// parallel: species are all declared by now, so lookups only read the
// network.
//
// Each worker also marks, by declaration index, the species of the
// complete reactions it built, and the marks are returned merged (used):
// marking them in the species themselves would write to a species for
// every term, in no useful order, where the merged marks are applied in
// declaration order (markUsed).
//
// The species of every term are looked up first, in a pass of their own
// (resolveTerms): the lookups then share the caches with nothing else,
// where between the lookups of a reaction's build its allocations stream
// fresh memory through them.
func (c *compiler) buildReactions(sts []*lang.Statement) (out []builtReaction, used []bool) {
	resolved, starts := c.resolveTerms(sts)
	out = make([]builtReaction, len(sts))
	var mu sync.Mutex
	var marks [][]bool
	parallel(len(sts), 512, func() func(i int) {
		w := c.worker(nil)
		w.used = make([]bool, len(c.net.Species))
		mu.Lock()
		marks = append(marks, w.used)
		mu.Unlock()
		return func(i int) { w.buildReactionResolved(sts[i], &out[i], resolved[starts[i]:starts[i+1]]) }
	})
	if len(marks) == 0 {
		return out, nil
	}
	used = marks[0]
	for _, m := range marks[1:] {
		for i, u := range m {
			used[i] = used[i] || u
		}
	}
	return out, used
}

// resolveTerms finds, for every term of the statements that parsed, its
// species' declaration index when the term writes the species as its
// declaration did, and -1 otherwise (the build looks those up itself).
// The indexes of statement i's terms, left side then right, are
// resolved[starts[i]:starts[i+1]]; a statement that did not parse has none.
func (c *compiler) resolveTerms(sts []*lang.Statement) (resolved []int32, starts []int32) {
	starts = make([]int32, len(sts)+1)
	total := 0
	for i, st := range sts {
		starts[i] = int32(total)
		if r := st.Reaction; !st.Broken && total <= math.MaxInt32-len(r.Left)-len(r.Right) {
			total += len(r.Left) + len(r.Right)
		}
	}
	starts[len(sts)] = int32(total)
	resolved = make([]int32, total)
	parallel(len(sts), 512, func() func(i int) {
		return func(i int) {
			r, at := sts[i].Reaction, starts[i]
			if int(starts[i+1]-at) != len(r.Left)+len(r.Right) {
				return
			}
			for _, side := range [2][]*lang.Term{r.Left, r.Right} {
				for _, t := range side {
					resolved[at] = -1
					if t != nil && t.Species != nil {
						if j, ok := c.declared[t.Species.Text]; ok {
							resolved[at] = j
						}
					}
					at++
				}
			}
		}
	})
	return resolved, starts
}

// newReaction allocates a reaction together with room for n terms, so
// that a reaction and its equation lie side by side in memory (the checks
// read both for every reaction, and one allocation costs less than
// three), for the common sizes of equation; otherwise the terms apart.
func newReaction(n int) (*Reaction, []Term) {
	switch {
	case n <= 4:
		a := new(struct {
			rx    Reaction
			terms [4]Term
		})
		return &a.rx, a.terms[:n:n]
	case n <= 6:
		a := new(struct {
			rx    Reaction
			terms [6]Term
		})
		return &a.rx, a.terms[:n:n]
	case n <= 8:
		a := new(struct {
			rx    Reaction
			terms [8]Term
		})
		return &a.rx, a.terms[:n:n]
	}
	return new(Reaction), make([]Term, n)
}

// markUsed sets Used on the species used marks, by declaration index.
func (c *compiler) markUsed(used []bool) {
	for i, u := range used {
		if u {
			c.net.Species[i].Used = true
		}
	}
}

// buildReaction compiles one reaction statement into b.
func (c *compiler) buildReaction(st *lang.Statement, b *builtReaction) {
	c.buildReactionResolved(st, b, nil)
}

// buildReactionResolved is buildReaction given what resolveTerms found
// for the statement's terms (nil for nothing found).
func (c *compiler) buildReactionResolved(st *lang.Statement, b *builtReaction, resolved []int32) {
	r := st.Reaction
	if st.Broken {
		b.mentioned = c.mentioned(st)
	}
	if r.Name == nil {
		return
	}
	c.out = &b.diags
	validName := c.name(r.Name, "reaction")
	b.complete = !st.Broken && validName && r.Arrow != nil && len(r.Left) > 0 && len(r.Right) > 0
	if !b.complete {
		b.rx = &Reaction{Name: r.Name.Name, node: r}
		return
	}
	rx, terms := newReaction(len(r.Left) + len(r.Right))
	rx.Name, rx.node = r.Name.Name, r
	b.rx = rx
	rx.TwoWay = r.Arrow.TwoWay()
	rx.equation = true
	var cbuf [12]int64
	coefs := cbuf[:0]
	var ibuf [12]int32
	idx := ibuf[:0]
	var preLeft, preRight []int32
	if len(resolved) == len(terms) {
		preLeft, preRight = resolved[:len(r.Left)], resolved[len(r.Left):]
	}
	left, coefs, idx, ok := c.side(r.Left, true, preLeft, terms[:0:len(r.Left)], coefs, idx)
	right, coefs, idx, ok := c.side(r.Right, ok, preRight, terms[len(r.Left):len(r.Left):len(terms)], coefs, idx)
	rx.Left, rx.Right, rx.Resolved = left, right, ok
	if c.used != nil {
		for _, at := range idx {
			if at >= 0 {
				c.used[at] = true
			}
		}
	}
	if ok {
		rx.stoich = c.facts.stoich(rx, coefs, idx)
	}
	c.out = &b.propDiags
	c.reactionProperties(rx, r.Props)
}

// addReaction names a built reaction in the network, in source order, so
// that the first of two reactions with one name is the one kept. marked
// says that the species of its equation are marked used already (see
// buildReactions).
func (c *compiler) addReaction(b builtReaction, marked bool) {
	for _, sp := range b.mentioned {
		sp.Used = true
	}
	rx := b.rx
	if rx == nil {
		return
	}
	c.net.Diagnostics = append(c.net.Diagnostics, b.diags...)
	if b.complete && !marked {
		for _, side := range [][]Term{rx.Left, rx.Right} {
			for _, t := range side {
				if t.Species != nil {
					t.Species.Used = true
				}
			}
		}
	}
	if old, dup := c.net.reactionByName[rx.Name]; dup {
		d := c.report(duplicateReactionNameCheck, rx.NameSpan(), "reaction name %s is used twice", rx.Name)
		d.Related = []lang.Related{{Span: old.NameSpan(), Message: "first used here"}}
		return
	}
	c.net.reactionByName[rx.Name] = rx
	if !b.complete {
		return
	}
	c.net.Reactions = append(c.net.Reactions, rx)
	c.net.Diagnostics = append(c.net.Diagnostics, b.propDiags...)
}

// mentioned returns the declared species that a statement's tokens name,
// also where two terms are written as one token ("CO(g)+O2(g)").
func (c *compiler) mentioned(st *lang.Statement) []*Species {
	var out []*Species
	for _, t := range st.Tokens() {
		for _, piece := range strings.Split(t.Value, ")+") {
			if piece != t.Value {
				piece = strings.TrimSuffix(piece, ")") + ")"
			}
			piece = strings.Trim(piece, "+")
			if sp := c.lookup(piece); sp != nil {
				out = append(out, sp)
			}
		}
	}
	return out
}

// lookup finds a declared species by reference, through the compiler's
// cache when it keeps one.
func (c *compiler) lookup(ref string) *Species {
	sp, _ := c.lookupIndex(ref)
	return sp
}

// lookupIndex is lookup that also gives the species' declaration index
// (-1 for none), reading the species only when the reference is not
// written as its declaration was.
func (c *compiler) lookupIndex(ref string) (*Species, int32) {
	if i, ok := c.declared[ref]; ok {
		return c.net.Species[i], i
	}
	var sp *Species
	switch {
	case c.refs == nil:
		sp = c.net.LookupSpecies(ref)
	default:
		var ok bool
		if sp, ok = c.refs[ref]; !ok {
			sp = c.net.LookupSpecies(ref)
			if sp != nil {
				// A copy of the key: ref lies somewhere in the source, and
				// the comparisons of later lookups would read it from there.
				c.refs[strings.Clone(ref)] = sp
			}
		}
	}
	if sp == nil || sp.index > math.MaxInt32 {
		return sp, -1
	}
	return sp, int32(sp.index)
}

// side resolves one side of a reaction: coefficients read and species
// looked up. resolved stays true while every species is declared and has
// a formula. The coefficients are appended to coefs while all are small
// integers; coefs becomes nil at the first that is not. Each term's
// species' declaration index (-1 for none) is appended to idx. The terms
// are appended to out, which has room for them. side returns out, coefs
// and idx so appended. pre, when not nil, holds what resolveTerms found
// for each term.
func (c *compiler) side(terms []*lang.Term, resolved bool, pre []int32, out []Term, coefs []int64, idx []int32) ([]Term, []int64, []int32, bool) {
	for k, t := range terms {
		term := Term{Coef: sharedRat(1)}
		n, small := int64(1), true
		if t.Coef != nil {
			n, small = smallCoef(t.Coef.Text)
		}
		switch {
		case small:
			term.Coef = sharedRat(n)
		default:
			q, err := parseRat(t.Coef.Text)
			switch {
			case err != nil:
				c.report(syntaxCheck, t.Coef.Span(), "%v", err)
				resolved = false
			case q.Sign() <= 0:
				c.report(syntaxCheck, t.Coef.Span(), "a coefficient must be positive, found %s; move the species to the other side", t.Coef.Text)
				resolved = false
			default:
				term.Coef = q
			}
			n, small = smallInt(term.Coef)
		}
		if coefs != nil {
			if small {
				coefs = append(coefs, n)
			} else {
				coefs = nil
			}
		}
		var sp *Species
		var at int32
		if pre != nil && pre[k] >= 0 {
			sp, at = c.net.Species[pre[k]], pre[k]
		} else {
			sp, at = c.lookupIndex(t.Species.Text)
		}
		idx = append(idx, at)
		term.at = at + 1
		switch {
		case sp == nil:
			c.undefinedSpecies(t.Species)
			resolved = false
		case c.facts != nil && at >= 0 && int(at) < len(c.facts.facts):
			term.Species = sp
			if !c.facts.facts[at].hasFormula {
				resolved = false
			}
		default:
			term.Species = sp
			if !sp.HasFormula {
				resolved = false
			}
		}
		out = append(out, term)
	}
	return out, coefs, idx, resolved
}

// sharedCoefs are the whole numbers -maxSharedCoef to maxSharedCoef as
// exact rationals (sharedCoefs[maxSharedCoef+n] is n), shared by every
// term and net term that has one of them: a Term's Coef and a NetTerm's Nu
// are never changed in place.
var sharedCoefs = func() []*big.Rat {
	out := make([]*big.Rat, 2*maxSharedCoef+1)
	for i := range out {
		out[i] = big.NewRat(int64(i-maxSharedCoef), 1)
	}
	return out
}()

// sharedRat is n as an exact rational: a shared one where n is within
// ±maxSharedCoef.
func sharedRat(n int64) *big.Rat {
	if n < -maxSharedCoef || n > maxSharedCoef {
		return big.NewRat(n, 1)
	}
	return sharedCoefs[maxSharedCoef+n]
}

const maxSharedCoef = 99

// smallCoef reads a coefficient written as a whole number from 1 to
// maxSharedCoef in at most two digits, without allocating; ok is false
// for anything else, which parseRat reads.
func smallCoef(text string) (n int64, ok bool) {
	if len(text) == 0 || len(text) > 2 {
		return 0, false
	}
	for i := range len(text) {
		if !('0' <= text[i] && text[i] <= '9') {
			return 0, false
		}
		n = 10*n + int64(text[i]-'0')
	}
	return n, n > 0
}

func (c *compiler) undefinedSpecies(ref *lang.SpeciesRef) {
	parts, err := lang.SplitRef(ref.Text)
	if err != nil {
		c.report(badFormulaCheck, ref.Span(), "%s: %v", ref.Text, err)
		return
	}
	msg := fmt.Sprintf("species %s is not declared", parts.Canonical())
	var near []string
	for _, sp := range c.net.Species {
		if sp.Parts.Base == parts.Base && sp.Charge == parts.Charge {
			near = append(near, sp.Key)
		}
	}
	if len(near) > 0 {
		sort.Strings(near)
		msg += "; declared: " + strings.Join(near, ", ")
	} else if c.near != nil {
		if key := c.near.species.closestSpecies(c.net.Species, ref.Text, parts.Base); key != "" {
			msg += "; " + suggest.DidYouMean(key)
		}
	}
	c.report(undefinedSpeciesCheck, ref.Span(), "%s", msg)
}

func (c *compiler) reactionProperties(rx *Reaction, props []*lang.ReactionProperty) {
	var seen givenOnce
	for _, pr := range props {
		name := pr.Tokens()[0].Value
		if name != "logk" {
			if first, dup := seen.add(name, &pr.Node); dup {
				d := c.report(syntaxCheck, keywordSpan(&pr.Node), "%s is given twice for reaction %s", name, rx.Name)
				d.Related = []lang.Related{{Span: keywordSpan(first), Message: "first given here"}}
				continue
			}
		}
		switch {
		case pr.Value != nil:
			kind := energyKind
			if pr.Value.Key == "ds" {
				kind = entropyKind
			}
			v, ok := c.quantity(pr.Value.Value, kind, pr.Value.Key, false)
			if !ok {
				rx.BrokenData = true
				continue
			}
			switch pr.Value.Key {
			case "dg":
				rx.Dg = v
			case "dh":
				rx.Dh = v
			case "ds":
				rx.Ds = v
			}
		case pr.LogK != nil:
			if !c.logK(rx, pr.LogK) {
				rx.BrokenData = true
			}
		case pr.Rate != nil:
			if rate := c.rate(pr.Rate); rate != nil {
				if pr.Rate.Kind == "rate" {
					rx.Rate = rate
				} else {
					rx.Reverse = rate
				}
			}
		case pr.Text != nil:
			rx.Source, _ = lang.Unquote(pr.Text.Text.Raw)
		}
	}
}

// logK adds a measured log10 K to the reaction; false when it did not
// compile (its error is reported).
func (c *compiler) logK(rx *Reaction, l *lang.LogK) bool {
	v, ok := c.number(l.Value)
	if !ok {
		return false
	}
	lk := LogK{Value: Value{V: v, Span: l.Value.Span()}, T: 298.15, Span: l.Span()}
	if l.Sigma != nil {
		s, ok := c.number(l.Sigma)
		if !ok {
			return false
		}
		lk.Value.Sigma, lk.Value.Stated = s, true
	}
	if l.At != nil {
		t, ok := c.quantity(l.At, temperatureKind, "logk temperature", false)
		if !ok {
			return false
		}
		if t.V <= 0 {
			c.report(implausibleValueCheck, l.At.Span(), "temperature %s is not above absolute zero", quantityText(l.At))
			return false
		}
		lk.T = t.V
	}
	for _, old := range rx.LogK {
		if old.T == lk.T {
			d := c.report(syntaxCheck, l.Span(), "logk at %g K is given twice for reaction %s", lk.T, rx.Name)
			d.Related = []lang.Related{{Span: old.Span, Message: "first given here"}}
			return true // the first one holds
		}
	}
	rx.LogK = append(rx.LogK, lk)
	return true
}

func (c *compiler) rate(r *lang.Rate) *Rate {
	ea, ok := c.quantity(r.Ea, energyKind, "Ea", false)
	if !ok {
		return nil
	}
	a, ok := c.prefactor(r.A)
	if !ok {
		return nil
	}
	rate := &Rate{A: *a, AUnit: r.A.Unit.Text, Ea: *ea, Span: r.Span()}
	if r.N != nil {
		n, ok := c.number(r.N)
		if !ok {
			return nil
		}
		rate.N = n
	}
	return rate
}

func (c *compiler) combination(r *lang.Reaction) {
	if r.Combo == nil {
		return
	}
	rx := c.net.reactionByName[r.Name.Name]
	if rx == nil || rx.node != r {
		return
	}
	for i, t := range r.Combo.Terms {
		if i > 0 && t.Sign == "" {
			c.report(syntaxCheck, t.Span(), "terms of a combination are joined by + or -")
			rx.Combo = nil
			return
		}
		w := big.NewRat(1, 1)
		if t.Coef != nil {
			v, err := parseRat(t.Coef.Text)
			if err != nil {
				c.report(syntaxCheck, t.Coef.Span(), "%v", err)
				rx.Combo = nil
				return
			}
			w = v
		}
		if t.Sign == "-" {
			w.Neg(w)
		}
		ct := ComboTerm{Weight: w, Name: t.Name.Name, Span: t.Span()}
		ct.Reaction = c.net.reactionByName[ct.Name]
		if ct.Reaction == nil {
			msg := fmt.Sprintf("reaction %s is not defined", ct.Name)
			if c.near != nil {
				if near := c.near.reactions.closestReaction(c.net.Reactions, ct.Name); near != "" {
					msg += "; " + suggest.DidYouMean(near)
				}
			}
			c.report(undefinedReactionCheck, t.Name.Span(), "%s", msg)
		} else if ct.Reaction == rx {
			c.report(undefinedReactionCheck, t.Name.Span(), "reaction %s cannot be a combination of itself", ct.Name)
			ct.Reaction = nil
		}
		rx.Combo = append(rx.Combo, ct)
	}
}
