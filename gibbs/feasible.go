package gibbs

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/optimize/convex/lp"
)

// forcedZero finds the species that no non-negative n with B·n = b can make
// positive (fixed species are free in sign and never forced). It returns the
// mask and a feasible point positive on every other non-fixed species: the
// mean of the feed and of the vertices found.
//
// Each round maximises Σ n_j over the species not yet shown able to be
// positive, subject to B·n = b, n ≥ 0 and Σ n ≤ K (K far above the feed), with
// gonum's simplex; species positive at the optimum are marked, and the rounds
// stop when the optimum is zero. ok is false when the simplex fails
// numerically; then nothing is marked zero.
func forcedZero(B *mat.Dense, rows []int, b []float64, n0 []float64, fixed []bool) (zero []bool, point []float64, ok bool) {
	s := len(n0)
	zero = make([]bool, s)
	point = make([]float64, s)
	possible := make([]bool, s)
	total := 0.0
	undetermined := 0
	for j := range n0 {
		if fixed[j] {
			possible[j] = true
			continue
		}
		point[j] = n0[j]
		total += n0[j]
		if n0[j] > 0 {
			possible[j] = true
		} else {
			undetermined++
		}
	}
	span := newSpan(B, rows)
	for j := range n0 {
		if possible[j] {
			span.add(j)
		}
	}
	undetermined -= span.close(possible, fixed)
	if undetermined == 0 {
		return zero, point, true
	}
	if total <= 0 {
		total = 1
	}
	var nonFixed, fixedIdx []int
	for j := range n0 {
		if fixed[j] {
			fixedIdx = append(fixedIdx, j)
		} else {
			nonFixed = append(nonFixed, j)
		}
	}
	m := len(rows)
	cols := len(nonFixed) + 2*len(fixedIdx) + 1
	A := mat.NewDense(m+1, cols, nil)
	bb := make([]float64, m+1)
	for r, i := range rows {
		for c, j := range nonFixed {
			A.Set(r, c, B.At(i, j))
		}
		for f, j := range fixedIdx {
			A.Set(r, len(nonFixed)+2*f, B.At(i, j))
			A.Set(r, len(nonFixed)+2*f+1, -B.At(i, j))
		}
		bb[r] = b[r]
	}
	for c := range nonFixed {
		A.Set(m, c, 1)
	}
	A.Set(m, cols-1, 1)
	bb[m] = 1e6 * total
	c := make([]float64, cols)
	found := 1.0
	thr := 1e-9 * total
	for rounds := 0; rounds <= s; rounds++ {
		any := false
		for k, j := range nonFixed {
			c[k] = 0
			if !possible[j] {
				c[k] = -1
				any = true
			}
		}
		if !any {
			break
		}
		f, x, err := simplex(c, A, bb)
		if err != nil {
			return make([]bool, s), point, false
		}
		if -f <= thr {
			break
		}
		marked := false
		for k, j := range nonFixed {
			if !possible[j] && x[k] > thr {
				possible[j] = true
				marked = true
				span.add(j)
			}
			if x[k] > 0 {
				point[j] += x[k]
			}
		}
		span.close(possible, fixed)
		found++
		if !marked {
			// The optimum is positive but spread below the threshold on
			// every species: numerically unreliable, mark nothing zero.
			return make([]bool, s), point, false
		}
	}
	for _, j := range nonFixed {
		point[j] /= found
		zero[j] = !possible[j]
	}
	for _, j := range fixedIdx {
		point[j] = 0
	}
	return zero, point, true
}

// colSpan is an orthonormal basis (Gram–Schmidt) of the span of some columns
// of B restricted to the kept rows.
type colSpan struct {
	B    *mat.Dense
	rows []int
	q    [][]float64
}

func newSpan(B *mat.Dense, rows []int) *colSpan { return &colSpan{B: B, rows: rows} }

func (c *colSpan) col(j int) []float64 {
	v := make([]float64, len(c.rows))
	for k, i := range c.rows {
		v[k] = c.B.At(i, j)
	}
	return v
}

// residual projects v off the span in place and returns |v| before and after.
func (c *colSpan) residual(v []float64) (before, after float64) {
	before = norm(v)
	for pass := 0; pass < 2; pass++ {
		for _, q := range c.q {
			d := 0.0
			for k := range v {
				d += q[k] * v[k]
			}
			for k := range v {
				v[k] -= d * q[k]
			}
		}
	}
	return before, norm(v)
}

func (c *colSpan) add(j int) {
	v := c.col(j)
	before, after := c.residual(v)
	if after > 1e-10*before && after > 0 {
		for k := range v {
			v[k] /= after
		}
		c.q = append(c.q, v)
	}
}

// close marks possible every species whose column lies in the span of the
// possible ones: with a feasible point positive on all of those, moving along
// e_j − Σ c_i e_i (B_j = Σ c_i B_i) keeps B·n = b and, for a small step,
// n ≥ 0, so species j can be positive too. It returns how many it marked.
func (c *colSpan) close(possible, fixed []bool) int {
	marked := 0
	for j := range possible {
		if possible[j] || fixed[j] {
			continue
		}
		before, after := c.residual(c.col(j))
		if after <= 1e-10*before {
			possible[j] = true
			marked++
		}
	}
	return marked
}

func norm(v []float64) float64 {
	s := 0.0
	for _, x := range v {
		s += x * x
	}
	return math.Sqrt(s)
}

// simplex is gonum's lp.Simplex with its panics (it panics, rather than
// returning an error, on some nearly singular bases it builds itself)
// turned into errors, so that the caller falls back to marking nothing
// zero.
func simplex(c []float64, A *mat.Dense, b []float64) (f float64, x []float64, err error) {
	defer func() {
		if r := recover(); r != nil {
			f, x, err = 0, nil, fmt.Errorf("lp: %v", r)
		}
	}()
	return lp.Simplex(c, A, b, 1e-12, nil)
}
