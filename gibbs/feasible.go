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
	possible, undetermined, total := feedPossible(n0, fixed, point)
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
	lpp := newReachLP(B, rows, b, fixed, total)
	found, ok := lpp.rounds(possible, point, span, fixed, total)
	if !ok {
		return make([]bool, s), point, false
	}
	for _, j := range lpp.nonFixed {
		point[j] /= found
		zero[j] = !possible[j]
	}
	for _, j := range lpp.fixedIdx {
		point[j] = 0
	}
	return zero, point, true
}

// feedPossible marks the species the feed holds (and the fixed ones) able
// to be positive and copies the feed into point; it returns the marks, how
// many non-fixed species remain undetermined, and the feed's total.
func feedPossible(n0 []float64, fixed []bool, point []float64) (possible []bool, undetermined int, total float64) {
	possible = make([]bool, len(n0))
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
	return possible, undetermined, total
}

// reachLP is the linear programme of forcedZero in gonum's standard form
// (A x = b, x ≥ 0): a column per non-fixed species, two per fixed species
// (its positive and negative parts), and a slack for Σ n ≤ K.
type reachLP struct {
	A                  *mat.Dense
	b                  []float64
	nonFixed, fixedIdx []int
}

// newReachLP sets up the programme's constraints: the kept rows of B·n = b
// and Σ n + slack = 1e6 times the feed.
func newReachLP(B *mat.Dense, rows []int, b []float64, fixed []bool, total float64) *reachLP {
	lpp := &reachLP{}
	for j := range fixed {
		if fixed[j] {
			lpp.fixedIdx = append(lpp.fixedIdx, j)
		} else {
			lpp.nonFixed = append(lpp.nonFixed, j)
		}
	}
	nonFixed, fixedIdx := lpp.nonFixed, lpp.fixedIdx
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
	lpp.A, lpp.b = A, bb
	return lpp
}

// rounds maximises, round by round, the sum of the species not yet known
// able to be positive; those positive at the optimum are marked (with the
// span's closure), and each vertex is added into point. It returns how many
// points were summed (the feed and the vertices), and false when the
// simplex fails or its optimum is too spread to trust.
func (lpp *reachLP) rounds(possible []bool, point []float64, span *colSpan, fixed []bool, total float64) (found float64, ok bool) {
	_, cols := lpp.A.Dims()
	c := make([]float64, cols)
	found = 1.0
	thr := 1e-9 * total
	for rounds := 0; rounds <= len(possible); rounds++ {
		any := false
		for k, j := range lpp.nonFixed {
			c[k] = 0
			if !possible[j] {
				c[k] = -1
				any = true
			}
		}
		if !any {
			break
		}
		f, x, err := simplex(c, lpp.A, lpp.b)
		if err != nil {
			return found, false
		}
		if -f <= thr {
			break
		}
		marked := false
		for k, j := range lpp.nonFixed {
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
			return found, false
		}
	}
	return found, true
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
