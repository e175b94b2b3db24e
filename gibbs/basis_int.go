package gibbs

import (
	"math"

	"gonum.org/v1/gonum/mat"
)

// intLimit bounds the operands of the fraction-free elimination so that a
// product of two and the difference of two products fit in an int64.
const intLimit = 1 << 30

// intLeftNull is exactLeftNull in int64 arithmetic: each reaction is scaled to
// integers (entries are short decimals), Nᵀ is brought to reduced row
// echelon form without fractions (rows kept divided by their gcd), and the
// null-space vectors are read off as integers. ok is false when an entry is
// not a short decimal or a number outgrows intLimit; the caller then
// eliminates in big.Rat.
func intLeftNull(N *mat.Dense) (*mat.Dense, bool) {
	s, _ := N.Dims()
	a, ok := intTranspose(N)
	if !ok {
		return nil, false
	}
	pivots, ok := intEchelon(a, s)
	if !ok {
		return nil, false
	}
	return intNullRows(a, pivots, s)
}

// intTranspose is Nᵀ (reactions × species) with each reaction scaled by the
// least power of ten (up to 1e6) that makes it integral, divided by its gcd;
// ok is false when no such power exists or an entry reaches intLimit.
func intTranspose(N *mat.Dense) ([][]int64, bool) {
	s, r := N.Dims()
	a := make([][]int64, r)
	for i := range a {
		a[i] = make([]int64, s)
		scale := 1.0
		for ; scale <= 1e6; scale *= 10 {
			ok := true
			for j := 0; j < s; j++ {
				v := N.At(j, i) * scale
				if v != math.Trunc(v) || math.Abs(v) >= intLimit {
					ok = false
					break
				}
			}
			if ok {
				break
			}
		}
		if scale > 1e6 {
			return nil, false
		}
		for j := 0; j < s; j++ {
			a[i][j] = int64(N.At(j, i) * scale)
		}
		reduceRow(a[i])
	}
	return a, true
}

// intEchelon brings a (rows × s) to reduced row echelon form without
// fractions: each pivot row is subtracted from the others cross-multiplied,
// and every row is kept divided by its gcd. It returns the pivot columns in
// order; ok is false when an operand reaches intLimit.
func intEchelon(a [][]int64, s int) (pivots []int, ok bool) {
	r := len(a)
	pivots = make([]int, 0, min(r, s))
	row := 0
	for col := 0; col < s && row < r; col++ {
		p := -1
		for i := row; i < r; i++ {
			if a[i][col] != 0 {
				p = i
				break
			}
		}
		if p < 0 {
			continue
		}
		a[row], a[p] = a[p], a[row]
		pr := a[row]
		for i := 0; i < r; i++ {
			f := a[i][col]
			if i == row || f == 0 {
				continue
			}
			q := pr[col]
			if absI(q) >= intLimit || absI(f) >= intLimit {
				return nil, false
			}
			ri := a[i]
			for j := 0; j < s; j++ {
				if absI(ri[j]) >= intLimit || absI(pr[j]) >= intLimit {
					return nil, false
				}
				ri[j] = q*ri[j] - f*pr[j]
			}
			reduceRow(ri)
		}
		pivots = append(pivots, col)
		row++
	}
	return pivots, true
}

// intNullRows reads the null-space vectors off the echelon form, one per
// free column, as integer rows with no common factor. With no free column
// nothing is conserved: one zero row keeps the shape valid.
func intNullRows(a [][]int64, pivots []int, s int) (*mat.Dense, bool) {
	isPivot := make([]bool, s)
	for _, c := range pivots {
		isPivot[c] = true
	}
	free := s - len(pivots)
	B := mat.NewDense(max(free, 1), s, nil)
	if free == 0 {
		return B, true
	}
	// Row p reads a_pp·x_p + Σ_free a_pf·x_f = 0. With x_f = L (the lcm of
	// the pivots), x_p = −a_pf·L/a_pp, all integers.
	L := int64(1)
	for pi, c := range pivots {
		d := absI(a[pi][c])
		L = L / gcd(L, d) * d
		if L >= intLimit {
			return nil, false
		}
	}
	k := 0
	v := make([]int64, s)
	for f := 0; f < s; f++ {
		if isPivot[f] {
			continue
		}
		for j := range v {
			v[j] = 0
		}
		v[f] = L
		for pi, c := range pivots {
			if a[pi][f] == 0 {
				continue
			}
			if absI(a[pi][f]) >= intLimit {
				return nil, false
			}
			v[c] = -a[pi][f] * (L / a[pi][c])
		}
		reduceRow(v)
		for j, x := range v {
			B.Set(k, j, float64(x))
		}
		k++
	}
	return B, true
}

func absI(x int64) int64 {
	if x < 0 {
		return -x
	}
	return x
}

func gcd(a, b int64) int64 {
	a, b = absI(a), absI(b)
	for b != 0 {
		a, b = b, a%b
	}
	return a
}

// reduceRow divides a row by the gcd of its entries.
func reduceRow(v []int64) {
	g := int64(0)
	for _, x := range v {
		if x != 0 {
			g = gcd(g, x)
			if g == 1 {
				return
			}
		}
	}
	if g > 1 {
		for j := range v {
			v[j] /= g
		}
	}
}
