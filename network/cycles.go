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

// ientry is one non-zero entry of a sparse integer vector.
type ientry struct {
	i int
	v *big.Int
}

// ivec is a sparse integer vector, indices ascending, no zeros.
type ivec []ientry

// combine returns a·x − b·y.
func combine(a *big.Int, x ivec, b *big.Int, y ivec) ivec {
	out := make(ivec, 0, len(x)+len(y))
	var t big.Int
	i, k := 0, 0
	for i < len(x) || k < len(y) {
		switch {
		case k == len(y) || (i < len(x) && x[i].i < y[k].i):
			out = append(out, ientry{x[i].i, new(big.Int).Mul(a, x[i].v)})
			i++
		case i == len(x) || y[k].i < x[i].i:
			out = append(out, ientry{y[k].i, new(big.Int).Neg(new(big.Int).Mul(b, y[k].v))})
			k++
		default:
			v := new(big.Int).Mul(a, x[i].v)
			v.Sub(v, t.Mul(b, y[k].v))
			if v.Sign() != 0 {
				out = append(out, ientry{x[i].i, v})
			}
			i++
			k++
		}
	}
	return out
}

// primitive divides v by the gcd of its entries and makes its first entry
// positive.
func primitive(v ivec) ivec {
	if len(v) == 0 {
		return v
	}
	g := new(big.Int).Abs(v[0].v)
	for _, e := range v[1:] {
		if g.Cmp(big.NewInt(1)) == 0 {
			break
		}
		g.GCD(nil, nil, g, new(big.Int).Abs(e.v))
	}
	neg := v[0].v.Sign() < 0
	if g.Cmp(big.NewInt(1)) == 0 && !neg {
		return v
	}
	if neg {
		g.Neg(g)
	}
	for k := range v {
		v[k].v = new(big.Int).Quo(v[k].v, g)
	}
	return v
}

// intFloat converts an integer weight to float64.
func intFloat(x *big.Int) float64 {
	if x.IsInt64() {
		return float64(x.Int64())
	}
	f, _ := new(big.Float).SetInt(x).Float64()
	return f
}

func (v ivec) at(i int) *big.Int {
	k := sort.Search(len(v), func(k int) bool { return v[k].i >= i })
	if k < len(v) && v[k].i == i {
		return v[k].v
	}
	return nil
}

// eliminator keeps a row-echelon basis of the columns seen so far. Each
// vector is augmented: its species part (indices below nSpecies) and the
// columns it is a combination of (index nSpecies + column).
type eliminator struct {
	nSpecies int
	m        *StoichMatrix
	count    []int       // occurrences of each species among the columns
	basis    []ivec      // in creation order
	pivotOf  map[int]int // species row -> basis index
	pivots   []int       // basis index -> its pivot row
}

func newEliminator(m *StoichMatrix, cols []int) *eliminator {
	return &eliminator{nSpecies: len(m.Species), m: m, count: speciesCounts(m, cols), pivotOf: map[int]int{}}
}

// speciesCounts counts each species' occurrences among the columns.
func speciesCounts(m *StoichMatrix, cols []int) []int {
	count := make([]int, len(m.Species))
	for _, j := range cols {
		for _, t := range m.Columns[j] {
			count[t.Row]++
		}
	}
	return count
}

// integerColumn returns column j scaled to integers, augmented by its own
// index.
func (e *eliminator) integerColumn(j int) ivec {
	col := e.m.Columns[j]
	lcm := big.NewInt(1)
	var g big.Int
	for _, t := range col {
		d := t.Coef.Denom()
		g.GCD(nil, nil, lcm, d)
		lcm.Mul(lcm, new(big.Int).Quo(d, &g))
	}
	v := make(ivec, 0, len(col)+1)
	for _, t := range col {
		n := new(big.Int).Mul(t.Coef.Num(), lcm)
		n.Quo(n, t.Coef.Denom())
		v = append(v, ientry{t.Row, n})
	}
	v = append(v, ientry{e.nSpecies + j, lcm})
	return primitive(v)
}

// add reduces column j against the basis. When it depends on earlier
// columns, add returns the cycle (indexed by column) it closes; otherwise
// it joins the basis and add returns nil.
func (e *eliminator) add(j int) ivec {
	w := e.reduce(e.integerColumn(j))
	if c := e.cycleOf(w); c != nil {
		return c
	}
	p := -1
	for _, t := range w {
		if t.i >= e.nSpecies {
			break
		}
		if p < 0 || e.count[t.i] < e.count[p] {
			p = t.i
		}
	}
	e.pivotOf[p] = len(e.basis)
	e.pivots = append(e.pivots, p)
	e.basis = append(e.basis, w)
	return nil
}

// closes returns the cycle column j closes with the basis, or nil, leaving
// the basis as it is.
func (e *eliminator) closes(j int) ivec { return e.cycleOf(e.reduce(e.integerColumn(j))) }

// cycleOf returns the cycle (indexed by column) of a reduced vector whose
// species part is empty, or nil.
func (e *eliminator) cycleOf(w ivec) ivec {
	if len(w) > 0 && w[0].i < e.nSpecies {
		return nil
	}
	out := make(ivec, len(w))
	for k, t := range w {
		out[k] = ientry{t.i - e.nSpecies, t.v}
	}
	return primitive(out)
}

// reduce eliminates every pivot species of the basis from w.
func (e *eliminator) reduce(w ivec) ivec {
	for {
		k := -1
		for _, t := range w {
			if t.i >= e.nSpecies {
				break
			}
			if b, ok := e.pivotOf[t.i]; ok && (k < 0 || b < k) {
				k = b
			}
		}
		if k < 0 {
			break
		}
		p := e.pivots[k]
		a, b := w.at(p), e.basis[k].at(p)
		var g big.Int
		g.GCD(nil, nil, new(big.Int).Abs(a), new(big.Int).Abs(b))
		w = primitive(combine(new(big.Int).Quo(b, &g), w, new(big.Int).Quo(a, &g), e.basis[k]))
	}
	return w
}

// Limits of the shortening passes, which keep them near linear in the
// number of cycles.
const (
	maxShortenPasses   = 8
	maxShortenPartners = 64
)

// shorten replaces basis cycles by combinations with other basis cycles
// where that gives fewer reactions (or, as many, smaller weights). Each
// replacement keeps the set a basis.
func shorten(cycles []ivec) []ivec {
	for pass := 0; pass < maxShortenPasses; pass++ {
		index := map[int][]int{}
		for c, v := range cycles {
			for _, t := range v {
				index[t.i] = append(index[t.i], c)
			}
		}
		improved := false
		for c := range cycles {
			best := cycles[c]
			bestLen, bestL1 := len(best), l1(best)
			var bestA, bestB *big.Int
			bestD := -1
			tried := 0
			for _, t := range cycles[c] {
				for _, d := range index[t.i] {
					if d == c || tried >= maxShortenPartners {
						continue
					}
					// a·x − b·y keeps every entry of y outside x: a partner
					// twice as long cannot shorten the cycle.
					if len(cycles[d]) >= 2*len(best) {
						continue
					}
					b, a := cycles[d].at(t.i), best.at(t.i)
					if b == nil || a == nil {
						continue
					}
					tried++
					var g big.Int
					g.GCD(nil, nil, new(big.Int).Abs(a), new(big.Int).Abs(b))
					ca, cb := new(big.Int).Quo(b, &g), new(big.Int).Quo(a, &g)
					n, sum := combinedShape(ca, best, cb, cycles[d])
					if n > 0 && (n < bestLen || (n == bestLen && sum.Cmp(bestL1) < 0)) {
						bestLen, bestL1, bestA, bestB, bestD = n, sum, ca, cb, d
					}
				}
				if bestD >= 0 {
					// Apply the best combination found through this reaction,
					// then look for more from the shorter cycle.
					best = primitive(combine(bestA, best, bestB, cycles[bestD]))
					bestLen, bestL1, bestD = len(best), l1(best), -1
				}
			}
			if len(best) != len(cycles[c]) || l1(best).Cmp(l1(cycles[c])) != 0 {
				cycles[c] = best
				improved = true
			}
		}
		if !improved {
			break
		}
	}
	return cycles
}

// combinedShape returns the number of entries and the sum of absolute
// values of primitive(a·x − b·y) without building it.
func combinedShape(a *big.Int, x ivec, b *big.Int, y ivec) (int, *big.Int) {
	if small, ok := combinedShapeSmall(a, x, b, y); ok {
		return small.n, big.NewInt(small.l1)
	}
	v := primitive(combine(a, x, b, y))
	return len(v), l1(v)
}

type shape struct {
	n  int
	l1 int64
}

// combinedShapeSmall is combinedShape in int64 arithmetic, for entries and
// factors below 2²⁰ in magnitude (ok is false otherwise), so that no sum of
// products overflows.
func combinedShapeSmall(a *big.Int, x ivec, b *big.Int, y ivec) (shape, bool) {
	const lim = 1 << 20
	fits := func(z *big.Int) (int64, bool) {
		if !z.IsInt64() {
			return 0, false
		}
		v := z.Int64()
		return v, v > -lim && v < lim
	}
	av, ok1 := fits(a)
	bv, ok2 := fits(b)
	if !ok1 || !ok2 {
		return shape{}, false
	}
	var g, sum int64
	n := 0
	add := func(v int64) {
		if v == 0 {
			return
		}
		if v < 0 {
			v = -v
		}
		n++
		sum += v
		g = gcd64(g, v)
	}
	i, k := 0, 0
	for i < len(x) || k < len(y) {
		switch {
		case k == len(y) || (i < len(x) && x[i].i < y[k].i):
			xv, ok := fits(x[i].v)
			if !ok {
				return shape{}, false
			}
			add(av * xv)
			i++
		case i == len(x) || y[k].i < x[i].i:
			yv, ok := fits(y[k].v)
			if !ok {
				return shape{}, false
			}
			add(-bv * yv)
			k++
		default:
			xv, ok1 := fits(x[i].v)
			yv, ok2 := fits(y[k].v)
			if !ok1 || !ok2 {
				return shape{}, false
			}
			add(av*xv - bv*yv)
			i++
			k++
		}
	}
	if g == 0 {
		return shape{}, true
	}
	return shape{n, sum / g}, true
}

func gcd64(a, b int64) int64 {
	for b != 0 {
		a, b = b, a%b
	}
	return a
}

// shorter reports whether a has fewer reactions than b, or as many with a
// smaller sum of absolute weights.
func shorter(a, b ivec) bool {
	if len(a) == 0 {
		return false
	}
	if len(a) != len(b) {
		return len(a) < len(b)
	}
	return l1(a).Cmp(l1(b)) < 0
}

func l1(v ivec) *big.Int {
	s := new(big.Int)
	for _, t := range v {
		if t.v.Sign() < 0 {
			s.Sub(s, t.v)
		} else {
			s.Add(s, t.v)
		}
	}
	return s
}

// reduced brings the basis to reduced row-echelon form: afterwards no
// basis vector holds the pivot of another. It returns the basis.
func (e *eliminator) reduced() []ivec {
	for k := len(e.basis) - 1; k >= 0; k-- {
		for {
			w := e.basis[k]
			j := -1
			for _, t := range w {
				if t.i >= e.nSpecies {
					break
				}
				if b, ok := e.pivotOf[t.i]; ok && b != k {
					j = b
					break
				}
			}
			if j < 0 {
				break
			}
			p := e.pivots[j]
			a, b := w.at(p), e.basis[j].at(p)
			var g big.Int
			g.GCD(nil, nil, new(big.Int).Abs(a), new(big.Int).Abs(b))
			e.basis[k] = primitive(combine(new(big.Int).Quo(b, &g), w, new(big.Int).Quo(a, &g), e.basis[j]))
		}
	}
	return e.basis
}
