package network

import (
	"errors"
	"fmt"
	"math"

	"hess/thermo"
)

// ReverseRate is the reverse rate of a two-way step that has only a forward
// rate: kr(T) = kf(T)/Kc(T) at the given temperatures, fitted by least
// squares in ln k with the modified Arrhenius form kr = A·T^n·exp(−Ea/RT).
type ReverseRate struct {
	// Fit holds A in SI, (m³/mol)^(order−1)/s, n, Ea in J/mol and the
	// largest relative error of the fit over the temperatures.
	Fit   thermo.ArrheniusFit
	A     float64 // the prefactor in AUnit
	AUnit string  // the reverse order's unit, in the forward rate's volume unit
	Order int
	// Tmin and Tmax bound the temperatures fitted.
	Tmin, Tmax float64
}

// ErrNoReverseRate is returned by FitReverseRate for a reaction that is not
// a two-way step with a forward rate and no reverse rate.
var ErrNoReverseRate = errors.New("not a two-way step with a forward rate only")

// FitReverseRate fits the reverse rate of a two-way step with a forward
// rate and no reverse rate to kf/Kc at the given temperatures (K), Kc
// being K(T) in the forward rate's concentration units. It needs K at
// three temperatures (two with the exponent n held at the forward rate's).
func (n *Network) FitReverseRate(rx *Reaction, temps []float64) (*ReverseRate, error) {
	if rx == nil || !rx.Resolved || !rx.TwoWay || rx.Rate == nil || rx.Reverse != nil {
		return nil, ErrNoReverseRate
	}
	order, ok := reverseOrder(rx)
	if !ok {
		return nil, fmt.Errorf("reverse rate of %s: the right side's order %s is not a whole number from 0 to %d", rx.Name, ratText(stepOrder(rx.Right)), maxOrder)
	}
	var ts, ks []float64
	for _, row := range n.reactionRows(rx, temps) {
		if !row.Valid || !(row.T > 0) {
			continue
		}
		lnKc := row.Log10K*math.Ln10 - lnActivityFromConcentration(n, rx, row.T)
		lf, _ := lnRate(rx.Rate, row.T)
		k := math.Exp(lf - lnKc)
		if k > 0 && !math.IsInf(k, 0) {
			ts = append(ts, row.T)
			ks = append(ks, k)
		}
	}
	distinct := map[float64]bool{}
	for _, T := range ts {
		distinct[T] = true
	}
	var fit thermo.ArrheniusFit
	var err error
	switch {
	case len(distinct) >= 3:
		fit, err = thermo.FitArrhenius(ts, ks)
	case len(distinct) == 2:
		fit, err = thermo.FitArrheniusFixedN(ts, ks, rx.Rate.N)
	default:
		return nil, fmt.Errorf("reverse rate of %s: K(T) is known at %d temperature(s); a fit needs at least 2", rx.Name, len(distinct))
	}
	if err != nil {
		return nil, fmt.Errorf("reverse rate of %s: %w", rx.Name, err)
	}
	unit := prefactorUnit(order, volumeSymbol(rx.Rate.AUnit))
	u, err := thermo.ParseUnit(unit)
	if err != nil {
		return nil, fmt.Errorf("reverse rate of %s: unit %s: %w", rx.Name, unit, err)
	}
	out := &ReverseRate{Fit: fit, A: u.FromSI(fit.A), AUnit: unit, Order: order, Tmin: math.Inf(1), Tmax: math.Inf(-1)}
	for _, T := range ts {
		out.Tmin, out.Tmax = math.Min(out.Tmin, T), math.Max(out.Tmax, T)
	}
	return out, nil
}
