package network

import (
	"math"
	"sort"

	"gonum.org/v1/gonum/mat"

	"hess/thermo"
)

// ownK is a reaction's own data (dg, dh, ds, logk) as a function of
// temperature. They are the measured values for that reaction, so a table
// uses them before its species' data (see ReactionK.Row). Which model they
// make, in this order:
//
//   - a logk given at T answers at T exactly;
//   - logk at two or more temperatures: a van 't Hoff fit (LogKFit), over
//     the span of the logk temperatures;
//   - two of dh, ds and dg, or dh with a single logk: a constant ΔrH° and
//     ΔrS° (van 't Hoff with ΔrCp = 0), over the anchor temperature ±
//     thermo.DefaultSpan;
//   - dg alone, at 298.15 K only.
type ownK struct {
	rx    *Reaction
	shift float64 // Δn·ln(p°/p_data): see Network.ownDataShift
	lin   linear
	linOK bool
	fit   *LogKFit
}

// linear is a constant ΔrH° and ΔrS° with the variance of ΔrG°(T) as a
// function of T, and the temperature its data refer to.
type linear struct {
	dh, ds float64
	T0     float64
	// variance returns var(ΔrG°(T)) in (J/mol)²; stated is false when no
	// input carried an uncertainty.
	variance func(T float64) float64
	stated   bool
}

func newOwnK(rx *Reaction, shift float64) ownK {
	o := ownK{rx: rx, shift: shift}
	o.lin, o.linOK = linearData(rx)
	o.fit = FitLogK(rx.LogK)
	return o
}

// has reports whether the reaction carries own data that give ΔrG°.
func (o *ownK) has() bool {
	return o.linOK || o.fit != nil || len(o.rx.LogK) > 0 || o.rx.Dg != nil
}

// at evaluates the own data at T, converted to the network's standard
// pressure.
func (o *ownK) at(T float64) point { return shiftPoint(o.atDataPressure(T), T, o.shift) }

// atDataPressure evaluates the own data at T at the standard pressure they
// refer to.
func (o *ownK) atDataPressure(T float64) point {
	rx := o.rx
	for _, lk := range rx.LogK {
		if math.Abs(lk.T-T) <= thermo.T298Tolerance {
			p := point{dh: math.NaN(), ds: math.NaN(), dg: -thermo.R * T * math.Ln10 * lk.Value.V,
				sigma: stated(lk.Value.Sigma, lk.Value.Stated), basis: BasisReactionData}
			if o.fit != nil {
				p.dh = o.fit.DeltaH(T)
			} else if rx.Dh != nil {
				p.dh = rx.Dh.V
			}
			if !math.IsNaN(p.dh) {
				p.ds = (p.dh - p.dg) / T
			}
			return p
		}
	}
	if o.fit != nil {
		f := o.fit
		p := point{dh: f.DeltaH(T), dg: -thermo.R * T * math.Ln10 * f.Log10K(T), sigma: f.Sigma(T), basis: BasisFit}
		p.ds = (p.dh - p.dg) / T
		p.extrapolated = T < f.Tmin-thermo.T298Tolerance || T > f.Tmax+thermo.T298Tolerance
		return p
	}
	if o.linOK {
		l := o.lin
		p := point{dh: l.dh, ds: l.ds, dg: l.dh - T*l.ds, basis: BasisReactionData, sigma: math.NaN()}
		if l.stated {
			p.sigma = thermo.SigmaLog10K(T, math.Sqrt(l.variance(T)))
		}
		p.extrapolated = T < l.T0-thermo.DefaultSpan || T > l.T0+thermo.DefaultSpan
		return p
	}
	if rx.Dg != nil && thermo.AtT298(T) {
		return point{dh: math.NaN(), ds: math.NaN(), dg: rx.Dg.V,
			sigma: stated(thermo.SigmaLog10K(T, rx.Dg.Sigma), rx.Dg.Stated), basis: BasisReactionData}
	}
	return noPoint
}

// span is where the own data hold.
func (o *ownK) span() (lo, hi float64) {
	switch {
	case o.fit != nil:
		return o.fit.Tmin, o.fit.Tmax
	case o.linOK:
		return o.lin.T0 - thermo.DefaultSpan, o.lin.T0 + thermo.DefaultSpan
	}
	return math.Inf(1), math.Inf(-1)
}

// stated is sigma when an uncertainty was written, NaN otherwise.
func stated(sigma float64, ok bool) float64 {
	if !ok {
		return math.NaN()
	}
	return sigma
}

// linearData returns the reaction's constant ΔrH° and ΔrS° from two of its
// dh, ds and dg, or from dh with its one logk: ΔrG°(T0) = −R·T0·ln 10·logk
// and ΔrS° = (ΔrH° − ΔrG°(T0))/T0.
func linearData(rx *Reaction) (linear, bool) {
	switch {
	case rx.Dh != nil && rx.Ds != nil:
		dh, ds := rx.Dh, rx.Ds
		return linear{dh: dh.V, ds: ds.V, T0: thermo.T298, stated: dh.Stated || ds.Stated,
			variance: func(T float64) float64 { return sq(dh.Sigma) + sq(T*ds.Sigma) }}, true
	case rx.Dh != nil && rx.Dg != nil:
		dh, dg := rx.Dh, rx.Dg
		return linear{dh: dh.V, ds: (dh.V - dg.V) / thermo.T298, T0: thermo.T298, stated: dh.Stated || dg.Stated,
			variance: func(T float64) float64 {
				return sq((1-T/thermo.T298)*dh.Sigma) + sq(T/thermo.T298*dg.Sigma)
			}}, true
	case rx.Dg != nil && rx.Ds != nil:
		dg, ds := rx.Dg, rx.Ds
		return linear{dh: dg.V + thermo.T298*ds.V, ds: ds.V, T0: thermo.T298, stated: dg.Stated || ds.Stated,
			variance: func(T float64) float64 { return sq(dg.Sigma) + sq((thermo.T298-T)*ds.Sigma) }}, true
	case rx.Dh != nil && len(rx.LogK) == 1:
		dh, lk := rx.Dh, rx.LogK[0]
		T0 := lk.T
		f := thermo.R * T0 * math.Ln10
		g0, sg0 := -f*lk.Value.V, f*lk.Value.Sigma
		return linear{dh: dh.V, ds: (dh.V - g0) / T0, T0: T0, stated: dh.Stated || lk.Value.Stated,
			variance: func(T float64) float64 { return sq((1-T/T0)*dh.Sigma) + sq(T/T0*sg0) }}, true
	}
	return linear{}, false
}

// LogKFit is a van 't Hoff fit of a reaction's logk values at several
// temperatures: log10 K = A + B/T, and + C·log10 T where four or more
// temperatures are given (one degree of freedom left for the residual).
// A temperature given twice counts once per value, each weighted alike.
type LogKFit struct {
	A, B, C float64
	Terms   int     // 2 (A, B) or 3 (A, B, C)
	Points  int     // logk values fitted
	RMS     float64 // root-mean-square residual of log10 K; NaN when the fit is exact (no degree of freedom)
	MaxAbs  float64 // largest absolute residual of log10 K
	// Tmin and Tmax bound the logk temperatures: the fit's range.
	Tmin, Tmax float64
	cov        *mat.SymDense // covariance of the coefficients from the stated σ; nil when not every logk states one
}

// maxFitPoints bounds the logk values of one reaction that are fitted.
const maxFitPoints = 1000

// FitLogK fits logk values given at two or more distinct temperatures,
// weighted by their stated uncertainties where every one states one, and
// returns nil for fewer than two distinct temperatures or a singular fit.
func FitLogK(lks []LogK) *LogKFit {
	if len(lks) < 2 || len(lks) > maxFitPoints {
		return nil
	}
	ts := make([]float64, 0, len(lks))
	allStated := true
	for _, lk := range lks {
		if !(lk.T > 0) || math.IsNaN(lk.Value.V) || math.IsInf(lk.Value.V, 0) {
			return nil
		}
		ts = append(ts, lk.T)
		allStated = allStated && lk.Value.Stated && lk.Value.Sigma > 0
	}
	sort.Float64s(ts)
	distinct := 1
	for i := 1; i < len(ts); i++ {
		if ts[i]-ts[i-1] > thermo.T298Tolerance {
			distinct++
		}
	}
	if distinct < 2 {
		return nil
	}
	terms := 2
	if distinct >= 4 {
		terms = 3
	}
	n := len(lks)
	X := mat.NewDense(n, terms, nil)
	y := mat.NewVecDense(n, nil)
	for i, lk := range lks {
		w := 1.0
		if allStated {
			w = 1 / lk.Value.Sigma
		}
		X.Set(i, 0, w)
		X.Set(i, 1, w/lk.T)
		if terms == 3 {
			X.Set(i, 2, w*math.Log10(lk.T))
		}
		y.SetVec(i, w*lk.Value.V)
	}
	var qr mat.QR
	qr.Factorize(X)
	var beta mat.VecDense
	if err := qr.SolveVecTo(&beta, false, y); err != nil {
		return nil
	}
	f := &LogKFit{A: beta.AtVec(0), B: beta.AtVec(1), Terms: terms, Points: n, Tmin: ts[0], Tmax: ts[len(ts)-1], RMS: math.NaN()}
	if terms == 3 {
		f.C = beta.AtVec(2)
	}
	var ss float64
	for _, lk := range lks {
		r := lk.Value.V - f.Log10K(lk.T)
		ss += r * r
		f.MaxAbs = math.Max(f.MaxAbs, math.Abs(r))
	}
	if n > terms {
		f.RMS = math.Sqrt(ss / float64(n-terms))
	}
	if allStated {
		var xtx mat.SymDense
		xtx.SymOuterK(1, X.T())
		var inv mat.SymDense
		var ch mat.Cholesky
		if ch.Factorize(&xtx) && ch.InverseTo(&inv) == nil {
			f.cov = &inv
		}
	}
	for _, v := range []float64{f.A, f.B, f.C} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return nil
		}
	}
	return f
}

// Log10K is the fitted log10 K at T.
func (f *LogKFit) Log10K(T float64) float64 {
	v := f.A + f.B/T
	if f.Terms == 3 {
		v += f.C * math.Log10(T)
	}
	return v
}

// DeltaH is ΔrH° at T from the fit's slope, in J/mol: with ln K =
// ln 10·(A + B/T) + C·ln T, ΔrH° = R·T²·d ln K/dT = R·(C·T − ln 10·B).
func (f *LogKFit) DeltaH(T float64) float64 {
	return thermo.R * (f.C*T - math.Ln10*f.B)
}

// Sigma is σ(log10 K) at T propagated from the stated uncertainties of the
// logk values through the fit's covariance; NaN when not every value
// states one.
func (f *LogKFit) Sigma(T float64) float64 {
	if f.cov == nil {
		return math.NaN()
	}
	g := []float64{1, 1 / T, math.Log10(T)}[:f.Terms]
	var v float64
	for i := range g {
		for j := range g {
			v += g[i] * g[j] * f.cov.At(i, j)
		}
	}
	return math.Sqrt(math.Max(v, 0))
}
