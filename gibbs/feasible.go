package gibbs

import (
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
		f, x, err := lp.Simplex(c, A, bb, 1e-12, nil)
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
			}
			if x[k] > 0 {
				point[j] += x[k]
			}
		}
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
