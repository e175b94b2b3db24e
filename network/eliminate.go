package network

import (
	"math/big"
	"sort"
)

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
