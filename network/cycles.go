package network

import (
	"math/big"
	"sort"
	"strings"
)

// Cycle is a set of reactions whose weighted sum is the empty reaction,
// Σ w·ν = 0, with the smallest integer weights. Terms are in column order,
// and the first weight is positive.
type Cycle struct {
	Terms []CycleTerm
}

// CycleTerm is one reaction of a cycle with its weight.
type CycleTerm struct {
	Column   int // column of the reaction in the matrix the cycle was found in
	Reaction *Reaction
	Weight   *big.Int
}

// String writes the cycle as a weighted sum of reaction names, such as
// "reform + shift - overall" or "2 half - burn".
func (c Cycle) String() string {
	var b strings.Builder
	for i, t := range c.Terms {
		w := new(big.Int).Abs(t.Weight)
		switch {
		case i == 0 && t.Weight.Sign() < 0:
			b.WriteString("-")
		case i > 0 && t.Weight.Sign() < 0:
			b.WriteString(" - ")
		case i > 0:
			b.WriteString(" + ")
		}
		if w.Cmp(big.NewInt(1)) != 0 {
			b.WriteString(w.String())
			b.WriteByte(' ')
		}
		b.WriteString(t.Reaction.Name)
	}
	return b.String()
}

// Last is the term of the cycle's last reaction in column order (for the
// matrix of a network, the last in the source).
func (c Cycle) Last() CycleTerm { return c.Terms[len(c.Terms)-1] }

// CycleBasis returns a basis of the cycles among the given columns (all
// columns when cols is nil): exact integer weight vectors w with
// Σ w_j·ν_j = 0, each scaled to its smallest integers, that together span
// every such vector. The basis favours short cycles: it starts from the
// fundamental cycles of an elimination (each minimal, in that no proper
// subset of its reactions forms a cycle), replaces long ones by short
// cycles found among neighbouring reactions, and then combines cycles
// where that gives fewer reactions. Cycles are ordered by their last
// column.
//
// The work is sparse: it touches only the species of the given columns,
// picking as pivot the species with the fewest occurrences, and never
// builds a dense matrix.
func (m *StoichMatrix) CycleBasis(cols []int) []Cycle {
	if cols == nil {
		cols = make([]int, len(m.Columns))
		for j := range cols {
			cols[j] = j
		}
	}
	// Fundamental cycles depend on the order the columns are taken in: each
	// dependent column closes a cycle with the independent ones before it.
	// Taking reactions among few species first (such as formation
	// reactions) makes them the independent set, and the cycles closed by
	// the others run through them.
	order := sparsestFirst(m, cols)
	e := newEliminator(m, order)
	var fundamental []ivec
	closing := map[int]bool{} // the column that closes each fundamental cycle
	for _, j := range order {
		if c := e.add(j); c != nil {
			fundamental = append(fundamental, c)
			closing[j] = true
		}
	}
	// Fundamental cycles can run far through a network whose reactions
	// form long chains. Short cycles found near the reactions of the long
	// ones take their place: the basis is then the shortest independent
	// cycles of both sets.
	var far []int
	onFar := map[int]bool{}
	for _, c := range fundamental {
		if len(c) <= shortCycle {
			continue
		}
		for _, t := range c {
			if !onFar[t.i] {
				onFar[t.i] = true
				far = append(far, t.i)
			}
		}
	}
	found := fundamental
	if len(far) > 0 {
		sort.Ints(far)
		pool := append(m.localCycles(cols, far, e.count), fundamental...)
		found = shortestIndependent(pool, len(fundamental), closing)
	}
	found = shorten(found)
	out := make([]Cycle, 0, len(found))
	for _, v := range found {
		c := Cycle{Terms: make([]CycleTerm, len(v))}
		for i, t := range v {
			c.Terms[i] = CycleTerm{Column: t.i, Reaction: m.Reactions[t.i], Weight: t.v}
		}
		out = append(out, c)
	}
	sort.SliceStable(out, func(a, b int) bool {
		la, lb := out[a].Last().Column, out[b].Last().Column
		if la != lb {
			return la < lb
		}
		if len(out[a].Terms) != len(out[b].Terms) {
			return len(out[a].Terms) < len(out[b].Terms)
		}
		return out[a].String() < out[b].String()
	})
	return out
}

// Limits of the search for short cycles: it starts from the reactions of
// fundamental cycles of more than shortCycle reactions, and looks at up to
// maxLocal neighbouring reactions of each.
const (
	shortCycle = 6
	maxLocal   = 24
)

// localCycles looks, for each column of from, for a cycle through it among
// the columns of cols nearest to it (those sharing species with it, then
// with them, sparsest first), and returns the cycles found on the way.
func (m *StoichMatrix) localCycles(cols, from []int, count []int) []ivec {
	bySpecies := map[int][]int{}
	for _, j := range cols {
		for _, t := range m.Columns[j] {
			bySpecies[t.Row] = append(bySpecies[t.Row], j)
		}
	}
	var out []ivec
	for _, j := range from {
		e := &eliminator{nSpecies: len(m.Species), m: m, count: count, pivotOf: map[int]int{}}
		seen := map[int]bool{j: true}
		queue := []int{j}
		added := 0
		for len(queue) > 0 && added < maxLocal {
			k := queue[0]
			queue = queue[1:]
			var next []int
		collect:
			for _, t := range m.Columns[k] {
				for _, l := range bySpecies[t.Row] {
					if len(queue)+len(next) >= 4*maxLocal {
						break collect
					}
					if !seen[l] {
						seen[l] = true
						next = append(next, l)
					}
				}
			}
			sort.SliceStable(next, func(a, b int) bool { return len(m.Columns[next[a]]) < len(m.Columns[next[b]]) })
			queue = append(queue, next...)
			if k == j {
				continue
			}
			if c := e.add(k); c != nil {
				out = append(out, c) // a cycle among the neighbours
			}
			added++
			if c := e.closes(j); c != nil {
				out = append(out, c)
				break
			}
		}
	}
	return out
}

// shortestIndependent picks dim linearly independent cycles from pool,
// shortest first (fewest entries, then smallest weights, then pool order).
// A cycle is fixed by its weights on the columns that close the
// fundamental cycles (on the other columns, which are independent, no
// non-zero cycle lives), so independence is tested on those weights alone.
func shortestIndependent(pool []ivec, dim int, closing map[int]bool) []ivec {
	idx := make([]int, len(pool))
	l1s := make([]*big.Int, len(pool))
	for i, v := range pool {
		idx[i] = i
		l1s[i] = l1(v)
	}
	sort.SliceStable(idx, func(a, b int) bool {
		va, vb := pool[idx[a]], pool[idx[b]]
		if len(va) != len(vb) {
			return len(va) < len(vb)
		}
		return l1s[idx[a]].Cmp(l1s[idx[b]]) < 0
	})
	span := spanTester{pivotOf: map[int]int{}}
	out := make([]ivec, 0, dim)
	for _, i := range idx {
		if len(out) == dim {
			break
		}
		var proj ivec
		for _, t := range pool[i] {
			if closing[t.i] {
				proj = append(proj, t)
			}
		}
		if span.add(proj) {
			out = append(out, pool[i])
		}
	}
	return out
}

// spanTester keeps a row-echelon basis of the vectors added to it.
type spanTester struct {
	basis   []ivec
	pivotOf map[int]int
	pivots  []int
}

// add reports whether v is independent of the vectors added before, and
// adds it if so.
func (s *spanTester) add(v ivec) bool {
	w := v
	for {
		k := -1
		for _, t := range w {
			if b, ok := s.pivotOf[t.i]; ok && (k < 0 || b < k) {
				k = b
			}
		}
		if k < 0 {
			break
		}
		p := s.pivots[k]
		a, b := w.at(p), s.basis[k].at(p)
		var g big.Int
		g.GCD(nil, nil, new(big.Int).Abs(a), new(big.Int).Abs(b))
		w = primitive(combine(new(big.Int).Quo(b, &g), w, new(big.Int).Quo(a, &g), s.basis[k]))
	}
	if len(w) == 0 {
		return false
	}
	p := w[0].i
	s.pivotOf[p] = len(s.basis)
	s.pivots = append(s.pivots, p)
	s.basis = append(s.basis, w)
	return true
}

// sparsestFirst orders columns by their number of species, ties in the
// given order.
func sparsestFirst(m *StoichMatrix, cols []int) []int {
	out := append([]int(nil), cols...)
	sort.SliceStable(out, func(a, b int) bool { return len(m.Columns[out[a]]) < len(m.Columns[out[b]]) })
	return out
}
