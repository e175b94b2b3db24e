package gibbs

import (
	"math"

	"gonum.org/v1/gonum/mat"
)

// Pure and fixed species contribute linear terms to G: among them the
// problem is a linear programme, and the Newton system is singular whenever
// the present ones have dependent columns (CaCO3 = CaO + CO2 with the CO2
// held fixed, two polymorphs). The present set is therefore kept
// independent; a pure species that becomes stable but whose column depends
// on the present ones enters by an exchange, as a simplex pivot does.

// pureSet lists the present pure and fixed species.
func (sv *solver) pureSet() []int {
	var out []int
	for j := 0; j < sv.s; j++ {
		if (sv.kind[j] == kPure || sv.kind[j] == kFixed) && sv.active[j] && !sv.zero[j] {
			out = append(out, j)
		}
	}
	return out
}

// combination returns c with B_k = Σ c_l B_l over the columns cols, and
// whether B_k lies in their span.
func (sv *solver) combination(k int, cols []int) ([]float64, bool) {
	m := len(sv.rows)
	if len(cols) == 0 || len(cols) > m {
		return nil, false
	}
	M := mat.NewDense(m, len(cols), nil)
	b := mat.NewVecDense(m, nil)
	norm := 0.0
	for r := 0; r < m; r++ {
		for c, j := range cols {
			M.Set(r, c, sv.bm[r][j])
		}
		b.SetVec(r, sv.bm[r][k])
		norm = math.Max(norm, math.Abs(sv.bm[r][k]))
	}
	var x mat.VecDense
	if err := x.SolveVec(M, b); err != nil {
		return nil, false
	}
	worst := 0.0
	for r := 0; r < m; r++ {
		v := -sv.bm[r][k]
		for c, j := range cols {
			v += sv.bm[r][j] * x.AtVec(c)
		}
		worst = math.Max(worst, math.Abs(v))
	}
	if worst > 1e-10*math.Max(norm, 1) {
		return nil, false
	}
	out := make([]float64, len(cols))
	for c := range out {
		out[c] = x.AtVec(c)
	}
	return out, true
}

// enterPure makes pure species k present. When its column depends on the
// present pure and fixed species it is formed from them as far as their
// amounts allow, and the one exhausted first leaves. It reports false when
// nothing bounds the exchange (the problem is unbounded).
func (sv *solver) enterPure(k int) bool {
	sv.entries[k]++
	cols := sv.pureSet()
	c, dep := sv.combination(k, cols)
	if !dep {
		sv.active[k] = true
		sv.n[k] = 0
		return true
	}
	t, leave := math.Inf(1), -1
	for i, j := range cols {
		if sv.kind[j] == kFixed || c[i] <= 1e-14 {
			continue
		}
		if v := sv.n[j] / c[i]; v < t {
			t, leave = v, j
		}
	}
	if leave < 0 {
		return false
	}
	for i, j := range cols {
		sv.n[j] -= t * c[i]
	}
	sv.n[leave] = 0
	sv.active[leave] = false
	sv.active[k] = true
	sv.n[k] = t
	return true
}

// independentPures keeps, in the given order, the pure species whose
// columns are independent of those kept before, at most limit of them (fixed
// species are always kept); the others leave the set.
func (sv *solver) independentPures(order []int, limit int) {
	var kept []int
	for _, j := range order {
		if _, dep := sv.combination(j, kept); dep || (len(kept) >= limit && sv.kind[j] == kPure) {
			if sv.kind[j] == kPure {
				sv.active[j] = false
				sv.n[j] = 0
			}
			continue
		}
		kept = append(kept, j)
	}
}
