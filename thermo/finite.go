package thermo

import "math"

// Bounds within which FiniteOn can prove a model finite: temperatures from
// 1 mK to 100 000 K and coefficients of magnitude at most 1e200. The
// largest term any form here evaluates is a coefficient times T^5 (G° =
// H° − T·S° of a NASA range), at most 1e200·1e25, and the smallest
// divisor t² = (T/1000)² of a Shomate range is 1e-12, so no term, sum or
// product of them can overflow, and ln T is finite.
const (
	finiteTmin  = 1e-3
	finiteTmax  = 1e5
	finiteCoeff = 1e200
)

// FiniteOn reports that m's Cp°, H°, S° and G° are finite at every
// temperature from lo to hi K, when it can prove it from the form alone:
// NASA 7-term and Shomate ranges, constant Cp and piecewise models of
// them, with temperatures and coefficients within the bounds above. A
// piecewise model answers outside its ranges with its nearest range's
// formula, so each range is judged on the whole of [lo, hi]. False means
// only that the values must be evaluated to be known.
func FiniteOn(m Model, lo, hi float64) bool {
	if !(lo >= finiteTmin && hi <= finiteTmax && lo <= hi) {
		return false
	}
	switch m := m.(type) {
	case NASA7Range:
		return moderate(m.A[:]...)
	case ShomateRange:
		return moderate(m.Coef[:]...)
	case Constant:
		return moderate(m.Hf, m.S298, m.Cp298)
	case *Piecewise:
		for _, p := range m.pieces {
			if !FiniteOn(p, lo, hi) {
				return false
			}
		}
		return len(m.pieces) > 0
	}
	return false
}

// moderate reports whether every coefficient is finite and at most
// finiteCoeff in magnitude.
func moderate(cs ...float64) bool {
	for _, c := range cs {
		if !(math.Abs(c) <= finiteCoeff) {
			return false
		}
	}
	return true
}
