package gibbs

import (
	"fmt"
	"math"
	"math/big"
	"strconv"

	"gonum.org/v1/gonum/mat"
)

// exactLimit bounds the rational elimination (rows × columns × rank) before
// ReactionsConservation falls back to the singular value decomposition.
const exactLimit = 20_000_000

// ReactionsConservation returns a conservation matrix B (rows × species)
// whose rows span the left null space of the stoichiometric matrix N
// (species × reactions): B·N = 0 and {n : B·n = B·n₀} = n₀ + range(N). A
// Problem with this B lets the amounts change only along the reactions.
//
// Entries of N that are short decimals (integers, halves, 0.1…) are
// eliminated exactly in rational arithmetic and the rows come out as
// integers with no common factor; very large matrices, and entries that are
// not short decimals, use the singular value decomposition (orthonormal rows).
func ReactionsConservation(N *mat.Dense) (B *mat.Dense, err error) {
	defer func() {
		if r := recover(); r != nil {
			B, err = nil, fmt.Errorf("gibbs: internal error: %v", r)
		}
	}()
	if N == nil {
		return nil, fmt.Errorf("%w: no stoichiometric matrix", ErrInput)
	}
	s, r := N.Dims()
	if s == 0 || s > maxSpecies || r > 4*maxSpecies {
		return nil, fmt.Errorf("%w: stoichiometric matrix %d × %d", ErrInput, s, r)
	}
	for i := 0; i < s; i++ {
		for j := 0; j < r; j++ {
			if v := N.At(i, j); math.IsNaN(v) || math.IsInf(v, 0) {
				return nil, fmt.Errorf("%w: stoichiometric entry (%d, %d) is %g", ErrInput, i, j, v)
			}
		}
	}
	if r == 0 {
		B := mat.NewDense(s, s, nil)
		for i := 0; i < s; i++ {
			B.Set(i, i, 1)
		}
		return B, nil
	}
	if B, ok := intLeftNull(N); ok {
		return B, nil
	}
	if float64(s)*float64(r)*float64(min(s, r)) <= exactLimit {
		if B, ok := exactLeftNull(N); ok {
			return B, nil
		}
	}
	return svdLeftNull(N)
}

// shortRat reads v as the shortest decimal that prints it; ok is false when
// that decimal is long (v is not a stoichiometric number but a float result).
func shortRat(v float64) (*big.Rat, bool) {
	t := strconv.FormatFloat(v, 'g', -1, 64)
	if len(t) > 12 {
		return nil, false
	}
	q, ok := new(big.Rat).SetString(t)
	return q, ok
}

// exactLeftNull is the left null space of N by elimination in big.Rat:
// Nᵀ read as short decimals, brought to reduced row echelon form, and one
// integer row with no common factor read off per free column. ok is false
// when an entry is not a short decimal.
func exactLeftNull(N *mat.Dense) (*mat.Dense, bool) {
	s, _ := N.Dims()
	a, ok := ratTranspose(N)
	if !ok {
		return nil, false
	}
	pivots := ratEchelon(a, s)
	return ratNullRows(a, pivots, s), true
}

// ratTranspose is A = Nᵀ (r × s) in rationals; null(A) is the left null
// space of N.
func ratTranspose(N *mat.Dense) ([][]*big.Rat, bool) {
	s, r := N.Dims()
	a := make([][]*big.Rat, r)
	for i := range a {
		a[i] = make([]*big.Rat, s)
		for j := 0; j < s; j++ {
			q, ok := shortRat(N.At(j, i))
			if !ok {
				return nil, false
			}
			a[i][j] = q
		}
	}
	return a, true
}

// ratEchelon brings a (rows × s) to reduced row echelon form (pivots 1)
// and returns the pivot columns in order.
func ratEchelon(a [][]*big.Rat, s int) []int {
	r := len(a)
	pivots := make([]int, 0, min(r, s))
	row := 0
	tmp := new(big.Rat)
	for col := 0; col < s && row < r; col++ {
		p := -1
		for i := row; i < r; i++ {
			if a[i][col].Sign() != 0 {
				p = i
				break
			}
		}
		if p < 0 {
			continue
		}
		a[row], a[p] = a[p], a[row]
		inv := new(big.Rat).Inv(a[row][col])
		for j := col; j < s; j++ {
			a[row][j].Mul(a[row][j], inv)
		}
		for i := 0; i < r; i++ {
			if i == row || a[i][col].Sign() == 0 {
				continue
			}
			f := new(big.Rat).Set(a[i][col])
			for j := col; j < s; j++ {
				if a[row][j].Sign() == 0 {
					continue
				}
				a[i][j].Sub(a[i][j], tmp.Mul(f, a[row][j]))
			}
		}
		pivots = append(pivots, col)
		row++
	}
	return pivots
}

// ratNullRows reads one null-space vector per free column off the echelon
// form (x_f = 1, x_p = −a_pf) and stores it as integers with no common
// factor.
func ratNullRows(a [][]*big.Rat, pivots []int, s int) *mat.Dense {
	isPivot := make([]bool, s)
	for _, c := range pivots {
		isPivot[c] = true
	}
	free := s - len(pivots)
	B := mat.NewDense(max(free, 1), s, nil)
	if free == 0 {
		// Every species can change freely: nothing is conserved. One zero row
		// keeps the shape valid; the solver drops it.
		return B
	}
	k := 0
	vec := make([]*big.Rat, s)
	for f := 0; f < s; f++ {
		if isPivot[f] {
			continue
		}
		for j := range vec {
			vec[j] = new(big.Rat)
		}
		vec[f].SetInt64(1)
		for pi, c := range pivots {
			vec[c].Neg(a[pi][f])
		}
		for j, v := range integerRow(vec) {
			x, _ := new(big.Float).SetInt(v).Float64()
			B.Set(k, j, x)
		}
		k++
	}
	return B
}

// integerRow scales a rational vector to integers with no common factor:
// by the lcm of the denominators, then down by the gcd of the numerators.
func integerRow(vec []*big.Rat) []*big.Int {
	l := big.NewInt(1)
	g := new(big.Int)
	for _, q := range vec {
		d := q.Denom()
		g.GCD(nil, nil, l, d)
		l.Div(l.Mul(l, d), g)
	}
	ints := make([]*big.Int, len(vec))
	var h *big.Int
	for j, q := range vec {
		v := new(big.Int).Mul(q.Num(), l)
		v.Div(v, q.Denom())
		ints[j] = v
		if v.Sign() != 0 {
			if h == nil {
				h = new(big.Int).Abs(v)
			} else {
				h.GCD(nil, nil, h, new(big.Int).Abs(v))
			}
		}
	}
	for _, v := range ints {
		if h != nil && h.Sign() != 0 {
			v.Div(v, h)
		}
	}
	return ints
}

// svdLeftNull is the left null space of N from its full singular value
// decomposition: the left singular vectors beyond the numerical rank, as
// orthonormal rows.
func svdLeftNull(N *mat.Dense) (*mat.Dense, error) {
	s, r := N.Dims()
	var svd mat.SVD
	if !svd.Factorize(N, mat.SVDFull) {
		return nil, fmt.Errorf("gibbs: singular value decomposition of the stoichiometric matrix failed")
	}
	vals := svd.Values(nil)
	tol := float64(max(s, r)) * 1e-13
	if len(vals) > 0 {
		tol *= vals[0]
	}
	rank := 0
	for _, v := range vals {
		if v > tol {
			rank++
		}
	}
	var U mat.Dense
	svd.UTo(&U)
	free := s - rank
	B := mat.NewDense(max(free, 1), s, nil)
	for k := 0; k < free; k++ {
		for j := 0; j < s; j++ {
			B.Set(k, j, U.At(j, rank+k))
		}
	}
	return B, nil
}

// independentRows returns indices of rows of B restricted to the columns
// cols that are linearly independent (Gaussian elimination with partial
// pivoting, relative tolerance tol), in increasing order.
func independentRows(B *mat.Dense, rows, cols []int, tol float64) []int {
	// Work on the transpose: columns of the work matrix are rows of B.
	m := len(rows)
	a := make([][]float64, m)
	maxAbs := 0.0
	for k, i := range rows {
		a[k] = make([]float64, len(cols))
		for c, j := range cols {
			v := B.At(i, j)
			a[k][c] = v
			maxAbs = math.Max(maxAbs, math.Abs(v))
		}
	}
	if maxAbs == 0 {
		return nil
	}
	thr := tol * maxAbs
	var keep []int
	// Eliminate row by row in order: a row is kept when what remains of it
	// after subtracting the kept rows is not negligible.
	var basis [][]float64
	var pivCol []int
	for k := 0; k < m; k++ {
		v := append([]float64(nil), a[k]...)
		for b, piv := range basis {
			f := v[pivCol[b]] / piv[pivCol[b]]
			if f != 0 {
				for c := range v {
					v[c] -= f * piv[c]
				}
			}
		}
		best, bc := 0.0, -1
		for c, x := range v {
			if math.Abs(x) > best {
				best, bc = math.Abs(x), c
			}
		}
		if bc >= 0 && best > thr {
			basis = append(basis, v)
			pivCol = append(pivCol, bc)
			keep = append(keep, rows[k])
		}
	}
	return keep
}
