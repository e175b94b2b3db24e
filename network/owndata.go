package network

import (
	"math"
	"sort"

	"hess/thermo"
)

// quantity is what a cycle of reactions sums: ΔrH°, or ΔrG° at one
// temperature.
type quantity struct {
	enthalpy bool
	T        float64 // K; for ΔrG° only
}

var enthalpyQuantity = quantity{enthalpy: true}

// symbol is the quantity's name without its temperature.
func (q quantity) symbol() string {
	if q.enthalpy {
		return "ΔrH°"
	}
	return "ΔrG°"
}

// String names the quantity with its temperature.
func (q quantity) String() string {
	if q.enthalpy {
		return "ΔrH°"
	}
	return "ΔrG° at " + kelvin(q.T)
}

// datum is a reaction's own value of a quantity, in J/mol, with its
// standard uncertainty and the data it comes from.
type datum struct {
	v, sigma float64
	from     string // "dh", "dg", "logk", "dh and ds", "dh and dg", "dg and ds", "dh and logk", "logk fit" or "rates"
	rates    bool   // from the forward and reverse rates
}

// hasOwnData reports whether a reaction carries data of its own: dg, dh,
// ds, logk, or a forward and reverse rate on a two-way step.
func hasOwnData(rx *Reaction) bool {
	return rx.Resolved && (rx.Dg != nil || rx.Dh != nil || rx.Ds != nil || len(rx.LogK) > 0 || hasRatePair(rx))
}

// A pair whose prefactor units do not fit the step's order (rate-units) is
// no usable pair: its kf/kr would be off by powers of the concentration
// unit, so the checks that compare it (detailed-balance, the cycles) stay
// quiet rather than report a consequence of that one error.
func hasRatePair(rx *Reaction) bool {
	return rx.TwoWay && rx.Rate != nil && rx.Reverse != nil &&
		unitFitsOrder(rx.Rate, rx.Left) && unitFitsOrder(rx.Reverse, rx.Right)
}

// ownDatum returns the reaction's own value of q, if its data give one,
// at the network's standard pressure. ΔrH° comes from dh. ΔrG°(T) comes
// from, in this order: a logk given at T; two of dh, ds and dg, or dh with
// its one logk, taken as a constant ΔrH° and ΔrS°; dg alone at 298.15 K;
// the van 't Hoff fit of several logk between their temperatures; the
// forward and reverse rates, where the species' data do not give ΔrG° at T
// (otherwise detailed-balance compares the rates with K).
func ownDatum(n *Network, rx *Reaction, q quantity) (datum, bool) {
	d, ok := ownDatumAtDataPressure(n, rx, q)
	if ok && !q.enthalpy && !d.rates {
		// ΔrG° at the network's standard pressure (Network.ownDataShift).
		d.v += thermo.R * q.T * n.ownDataShift(rx)
	}
	return d, ok
}

// ownDatumAtDataPressure is ownDatum at the standard pressure the
// reaction's data refer to.
func ownDatumAtDataPressure(n *Network, rx *Reaction, q quantity) (datum, bool) {
	if q.enthalpy {
		if rx.Dh == nil {
			return datum{}, false
		}
		return datum{v: rx.Dh.V, sigma: rx.Dh.Sigma, from: "dh"}, true
	}
	T := q.T
	for _, lk := range rx.LogK {
		if math.Abs(lk.T-T) <= thermo.T298Tolerance {
			f := thermo.R * T * math.Ln10
			return datum{v: -f * lk.Value.V, sigma: f * lk.Value.Sigma, from: "logk"}, true
		}
	}
	switch {
	case rx.Dh != nil && rx.Ds != nil:
		return datum{v: rx.Dh.V - T*rx.Ds.V, sigma: math.Hypot(rx.Dh.Sigma, T*rx.Ds.Sigma), from: "dh and ds"}, true
	case rx.Dh != nil && rx.Dg != nil:
		// ΔrG°(T) = (T/T298)·dg + (1 − T/T298)·dh.
		a := T / thermo.T298
		return datum{v: a*rx.Dg.V + (1-a)*rx.Dh.V, sigma: math.Hypot(a*rx.Dg.Sigma, (1-a)*rx.Dh.Sigma), from: "dh and dg"}, true
	case rx.Dg != nil && rx.Ds != nil:
		return datum{v: rx.Dg.V - (T-thermo.T298)*rx.Ds.V, sigma: math.Hypot(rx.Dg.Sigma, (T-thermo.T298)*rx.Ds.Sigma), from: "dg and ds"}, true
	case rx.Dh != nil && len(rx.LogK) == 1:
		// dh with one logk: van 't Hoff with a constant ΔrH° (linearData).
		lin, _ := linearData(rx)
		return datum{v: lin.dh - T*lin.ds, sigma: math.Sqrt(lin.variance(T)), from: "dh and logk"}, true
	case rx.Dg != nil && thermo.AtT298(T):
		return datum{v: rx.Dg.V, sigma: rx.Dg.Sigma, from: "dg"}, true
	}
	if f := FitLogK(rx.LogK); f != nil && T >= f.Tmin && T <= f.Tmax {
		// Between the temperatures of several logk: their van 't Hoff fit.
		rtl := thermo.R * T * math.Ln10
		sigma := 0.0
		if s := f.Sigma(T); !math.IsNaN(s) {
			sigma = rtl * s
		}
		return datum{v: -rtl * f.Log10K(T), sigma: sigma, from: "logk fit"}, true
	}
	if hasRatePair(rx) && !speciesGiveG(rx, T) {
		lnK, sigmaLnK, ok := rateLnK(n, rx, T)
		if ok {
			rt := thermo.R * T
			return datum{v: -rt * lnK, sigma: rt * sigmaLnK, from: "rates", rates: true}, true
		}
	}
	return datum{}, false
}

// speciesGiveG reports whether every species of the reaction has a model
// that gives G° at T.
func speciesGiveG(rx *Reaction, T float64) bool {
	for _, t := range rx.NetTerms() {
		m := t.Species.Model()
		if m == nil {
			return false
		}
		if g := m.G(T); math.IsNaN(g) || math.IsInf(g, 0) {
			return false
		}
	}
	return true
}

// concentrationFactor is how a species' concentration (mol/m³) turns into
// its activity: a = c·f. For an ideal gas f = R·T/p°; for a solute, a
// solution member or a species of unstated phase, f = 1/(1 mol/L), since
// 1 mol/L of a dilute aqueous solute is close to 1 mol/kg (common
// practice). Pure phases do not enter a rate law: ok is false.
func concentrationFactor(sp *Species, T, p0 float64) (f float64, ok bool) {
	a := sp.QuotientActivity()
	switch {
	case a.Pure():
		return 0, false
	case a == thermo.ActivityGas:
		return thermo.R * T / p0, true
	}
	return 1 / thermo.CStd, true
}

// lnActivityFromConcentration returns Σ ν·ln f over the reaction's
// species, so that ln K = ln Kc(SI) + that sum.
func lnActivityFromConcentration(n *Network, rx *Reaction, T float64) float64 {
	p0 := n.Settings.Pressure
	if !(p0 > 0) {
		p0 = thermo.Bar
	}
	s := 0.0
	for _, t := range rx.NetTerms() {
		f, ok := concentrationFactor(t.Species, T, p0)
		if !ok {
			continue
		}
		nu := ratFloat(t.Nu)
		s += nu * math.Log(f)
	}
	return s
}

// lnRate returns ln k(T) of a rate in SI and its standard uncertainty
// from those of A and Ea.
func lnRate(r *Rate, T float64) (lnk, sigma float64) {
	a := thermo.Arrhenius{A: r.A.V, N: r.N, Ea: r.Ea.V}
	lnk = a.LnRate(T)
	sA := 0.0
	if r.A.V > 0 {
		sA = r.A.Sigma / r.A.V
	}
	return lnk, math.Hypot(sA, r.Ea.Sigma/(thermo.R*T))
}

// rateLnK returns ln K(T) from a two-way step's forward and reverse rates:
// kf/kr is the concentration-basis constant in SI units, converted to
// activities species by species.
func rateLnK(n *Network, rx *Reaction, T float64) (lnK, sigma float64, ok bool) {
	if !(T > 0) || !hasRatePair(rx) {
		return 0, 0, false
	}
	lf, sf := lnRate(rx.Rate, T)
	lr, sr := lnRate(rx.Reverse, T)
	lnK = lf - lr + lnActivityFromConcentration(n, rx, T)
	if math.IsNaN(lnK) || math.IsInf(lnK, 0) {
		return 0, 0, false
	}
	return lnK, math.Hypot(sf, sr), true
}

// checkTemperatures are the temperatures at which cycles are checked for
// ΔrG°: the requested ones and every temperature a logk is given at.
func checkTemperatures(n *Network, rxs []*Reaction) []float64 {
	ts := append([]float64(nil), n.Settings.Temperatures...)
	for _, rx := range rxs {
		for _, lk := range rx.LogK {
			ts = append(ts, lk.T)
		}
	}
	sort.Float64s(ts)
	out := ts[:0]
	for _, T := range ts {
		if !(T > 0) {
			continue
		}
		if len(out) > 0 && math.Abs(out[len(out)-1]-T) <= thermo.T298Tolerance {
			continue
		}
		out = append(out, T)
	}
	return out
}
