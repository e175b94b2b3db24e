package network

import (
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/blas"
	"gonum.org/v1/gonum/blas/blas64"
	"gonum.org/v1/gonum/lapack/lapack64"
)

// adjustment is the weighted least-squares fit of species potentials to
// reaction values, written in its condition form. Fitting potentials μ to
// values y (y_r ≈ Σ ν_rs μ_s, weights 1/σ_r²) gives fitted values ŷ that
// are the nearest to y, in the σ-weighted norm, of those that satisfy
// every condition Σ_r c_r ŷ_r = 0, one condition per independent cycle.
// The condition form has one unknown per cycle rather than per species,
// so a large network whose data form few cycles stays cheap.
//
// With C the columns × conditions matrix, Σ = diag(σ²), M = CᵀΣC and
// z = M⁻¹Cᵀy: the residual is e = ΣCz, its covariance ΣCM⁻¹CᵀΣ, and the
// normalised residual of column r is c_rᵀz / sqrt(c_rᵀM⁻¹c_r), where c_r
// is row r of C (σ_r cancels).
type adjustment struct {
	conds  []ivec
	cols   []int                // the columns of the conditions, ascending
	rows   map[int][]condWeight // column -> the conditions it is in
	sigma2 map[int]float64
	z      []float64
	u      blas64.Triangular // Cholesky factor: M = UᵀU
}

type condWeight struct {
	k int
	w float64
}

// newAdjustment fits values y with standard uncertainties sigma (both by
// column; every σ must be positive) subject to conds, which must be
// linearly independent.
func newAdjustment(conds []ivec, y, sigma map[int]float64) (*adjustment, error) {
	a := &adjustment{conds: conds, rows: map[int][]condWeight{}, sigma2: map[int]float64{}}
	k := len(conds)
	if k == 0 {
		return nil, fmt.Errorf("adjustment: no conditions")
	}
	for c, v := range conds {
		for _, t := range v {
			w := intFloat(t.v)
			a.rows[t.i] = append(a.rows[t.i], condWeight{c, w})
			s, ok := sigma[t.i]
			if !ok || !(s > 0) {
				return nil, fmt.Errorf("adjustment: column %d has no positive uncertainty", t.i)
			}
			a.sigma2[t.i] = s * s
		}
	}
	for col := range a.rows {
		a.cols = append(a.cols, col)
	}
	sort.Ints(a.cols)
	m := blas64.Symmetric{Uplo: blas.Upper, N: k, Stride: k, Data: make([]float64, k*k)}
	w := make([]float64, k)
	for _, col := range a.cols {
		cw := a.rows[col]
		s2 := a.sigma2[col]
		for _, p := range cw {
			w[p.k] += p.w * y[col]
			for _, q := range cw {
				if q.k >= p.k {
					m.Data[p.k*k+q.k] += p.w * q.w * s2
				}
			}
		}
	}
	u, ok := lapack64.Potrf(m)
	if !ok {
		return nil, fmt.Errorf("adjustment: the %d conditions are not independent", k)
	}
	a.u = u
	lapack64.Potrs(u, blas64.General{Rows: k, Cols: 1, Stride: 1, Data: w})
	a.z = w
	return a, nil
}

// residual is y_r − ŷ_r for column r (zero for a column in no condition).
func (a *adjustment) residual(col int) float64 {
	s := 0.0
	for _, p := range a.rows[col] {
		s += p.w * a.z[p.k]
	}
	return a.sigma2[col] * s
}

// normalised is the residual of column r divided by its standard
// deviation under the fit: how many standard deviations the datum lies off
// the values the other data imply. It is zero for a column in no condition.
func (a *adjustment) normalised(col int) float64 {
	cw := a.rows[col]
	if len(cw) == 0 {
		return 0
	}
	num := 0.0
	x := make([]float64, len(a.z))
	for _, p := range cw {
		num += p.w * a.z[p.k]
		x[p.k] = p.w
	}
	// c_rᵀM⁻¹c_r = |U⁻ᵀc_r|².
	blas64.Trsv(blas.Trans, a.u, blas64.Vector{N: len(x), Inc: 1, Data: x})
	q := 0.0
	for _, v := range x {
		q += v * v
	}
	if !(q > 0) {
		return 0
	}
	return num / math.Sqrt(q)
}

// estimator returns the weights λ' with λ'ᵀy = λᵀŷ: the fitted value of the
// combination λ of columns as a linear function of the data,
// λ' = λ − C·M⁻¹·CᵀΣλ.
func (a *adjustment) estimator(lambda map[int]float64) map[int]float64 {
	k := len(a.conds)
	g := make([]float64, k)
	keys := make([]int, 0, len(lambda))
	for col := range lambda {
		keys = append(keys, col)
	}
	sort.Ints(keys)
	for _, col := range keys {
		l := lambda[col]
		for _, p := range a.rows[col] {
			g[p.k] += p.w * a.sigma2[col] * l
		}
	}
	h := g
	lapack64.Potrs(a.u, blas64.General{Rows: k, Cols: 1, Stride: 1, Data: h})
	out := make(map[int]float64, len(lambda))
	for col, l := range lambda {
		out[col] = l
	}
	for _, col := range a.cols {
		cw := a.rows[col]
		s := 0.0
		for _, p := range cw {
			s += p.w * h[p.k]
		}
		if s != 0 {
			out[col] -= s
		}
	}
	return out
}

// components groups conditions that share a column, transitively: the
// fit of one group does not depend on the others.
func components(conds []ivec) [][]int {
	parent := make([]int, len(conds))
	for i := range parent {
		parent[i] = i
	}
	var find func(int) int
	find = func(i int) int {
		for parent[i] != i {
			parent[i] = parent[parent[i]]
			i = parent[i]
		}
		return i
	}
	owner := map[int]int{}
	for c, v := range conds {
		for _, t := range v {
			if o, ok := owner[t.i]; ok {
				parent[find(c)] = find(o)
			} else {
				owner[t.i] = c
			}
		}
	}
	index := map[int]int{}
	var out [][]int
	for c := range conds {
		r := find(c)
		i, ok := index[r]
		if !ok {
			i = len(out)
			index[r] = i
			out = append(out, nil)
		}
		out[i] = append(out[i], c)
	}
	return out
}
