package thermo

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"
)

// ArrheniusFit is a least-squares fit of a modified Arrhenius rate to points.
type ArrheniusFit struct {
	Arrhenius
	// MaxRelErr is the largest |k_fit(T)/k − 1| over the points.
	MaxRelErr float64
	// Points is how many points were fitted.
	Points int
}

// FitArrhenius fits ln A, n and Ea to rate constants k (SI) at temperatures T (K)
// by linear least squares on ln k = ln A + n·ln T − Ea/(R·T). It needs at least
// three distinct temperatures and positive rate constants.
func FitArrhenius(T, k []float64) (ArrheniusFit, error) {
	return fitArrhenius(T, k, math.NaN())
}

// FitArrheniusFixedN fits ln A and Ea with the temperature exponent held at n. It
// needs at least two distinct temperatures.
func FitArrheniusFixedN(T, k []float64, n float64) (ArrheniusFit, error) {
	if !finite(n) {
		return ArrheniusFit{}, fmt.Errorf("arrhenius fit: exponent n=%v is not finite", n)
	}
	return fitArrhenius(T, k, n)
}

func fitArrhenius(T, k []float64, fixedN float64) (ArrheniusFit, error) {
	fitN := math.IsNaN(fixedN)
	need := 2
	if fitN {
		need = 3
	}
	if len(T) != len(k) {
		return ArrheniusFit{}, fmt.Errorf("arrhenius fit: %d temperatures but %d rate constants", len(T), len(k))
	}
	distinct := map[float64]bool{}
	logMean := 0.0
	for i := range T {
		if !finite(T[i]) || !(T[i] > 0) {
			return ArrheniusFit{}, fmt.Errorf("arrhenius fit: point %d: temperature %v K is not positive", i+1, T[i])
		}
		if !finite(k[i]) || !(k[i] > 0) {
			return ArrheniusFit{}, fmt.Errorf("arrhenius fit: point %d: rate constant %v is not positive", i+1, k[i])
		}
		distinct[T[i]] = true
		logMean += math.Log(T[i])
	}
	if len(distinct) < need {
		return ArrheniusFit{}, fmt.Errorf("arrhenius fit: %d distinct temperatures, need at least %d", len(distinct), need)
	}
	// Centre the regressors on a reference temperature so that the columns are far
	// from collinear: ln k = b0 + n·u + b2·w with u = ln(T/Tref), w = Tref/T − 1.
	tref := math.Exp(logMean / float64(len(T)))
	cols := 2
	if fitN {
		cols = 3
	}
	a := mat.NewDense(len(T), cols, nil)
	b := mat.NewVecDense(len(T), nil)
	for i := range T {
		u, w := math.Log(T[i]/tref), tref/T[i]-1
		y := math.Log(k[i])
		a.Set(i, 0, 1)
		if fitN {
			a.Set(i, 1, u)
			a.Set(i, 2, w)
		} else {
			a.Set(i, 1, w)
			y -= fixedN * u
		}
		b.SetVec(i, y)
	}
	var x mat.VecDense
	if err := x.SolveVec(a, b); err != nil {
		var cond mat.Condition
		if errors.As(err, &cond) {
			return ArrheniusFit{}, fmt.Errorf("arrhenius fit: the points do not determine the parameters (condition number %.3g)", float64(cond))
		}
		return ArrheniusFit{}, fmt.Errorf("arrhenius fit: %w", err)
	}
	n, b2 := fixedN, x.AtVec(1)
	if fitN {
		n, b2 = x.AtVec(1), x.AtVec(2)
	}
	// Back to ln A, n, Ea: b2 = −Ea/(R·Tref); b0 − b2 = ln A + n·ln Tref.
	ea := -b2 * R * tref
	lnA := x.AtVec(0) - b2 - n*math.Log(tref)
	fit := ArrheniusFit{Arrhenius: Arrhenius{A: math.Exp(lnA), N: n, Ea: ea}, Points: len(T)}
	if !finite(fit.A) || !(fit.A > 0) {
		return ArrheniusFit{}, fmt.Errorf("arrhenius fit: prefactor ln A = %.4g is out of range", lnA)
	}
	for i := range T {
		rel := math.Abs(fit.Rate(T[i])/k[i] - 1)
		fit.MaxRelErr = math.Max(fit.MaxRelErr, rel)
	}
	return fit, nil
}
