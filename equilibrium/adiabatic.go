package equilibrium

import (
	"fmt"
	"math"

	"hess/lang"
	"hess/network"
	"hess/thermo"
)

// adiabatic finds the temperature at which the feed's equilibrium products
// have the feed's enthalpy at its own temperature (H and P held): the
// adiabatic reaction or flame temperature. The search runs over the span
// where every feed species has data; a root outside it is a diagnostic.
// The products' enthalpy at equilibrium rises with T (its derivative is the
// equilibrium heat capacity, positive), so the root is bracketed and found
// by regula falsi (Illinois) with bisection as a safeguard, each solve
// warm-started from the nearest one before.
func adiabatic(net *network.Network, mx *network.Mixture, o Options) (*Composition, lang.Diagnostics, error) {
	feed, total, diags := feedOf(mx)
	if diags != nil {
		return nil, diags, nil
	}
	Tfeed, P, diags := conditions(mx, Options{P: o.P})
	if diags != nil {
		return nil, diags, nil
	}
	errAt := func(code lang.Code, span lang.Span, format string, args ...any) lang.Diagnostics {
		return lang.Diagnostics{{Code: code, Severity: lang.Error, Subject: span, Message: fmt.Sprintf(format, args...)}}
	}
	lo, hi := 0.0, math.Inf(1)
	for _, f := range feed {
		a, b, ok := f.species.DataSpan()
		if ok && len(f.species.Ranges) == 0 && a < b {
			// Data that state no range are carried beyond their default
			// span, marked extrapolated (network.Species.EvaluableAt): the
			// search may look as far as such data were ever taken to hold.
			a, b = extrapolatedTmin, extrapolatedTmax
		}
		if !ok {
			return nil, errAt("missing-thermo", f.span, "%s has no temperature model, so the feed has no enthalpy", f.species.Key), nil
		}
		lo, hi = math.Max(lo, a), math.Min(hi, b)
	}
	if !(hi > lo) {
		return nil, errAt("missing-thermo", mx.NameSpan, "the data of mixture %s's members share no temperature range", mx.Name), nil
	}
	hFeed, sp := feedEnthalpy(feed, Tfeed)
	if sp != nil {
		return nil, errAt("missing-thermo", mx.NameSpan, "%s has no enthalpy data at the feed's %s K", sp.Key, kelvin(Tfeed)), nil
	}
	var last *Composition
	rc := newRxCache(net)
	eval := func(T float64) (float64, *Composition, lang.Diagnostics, error) {
		c, diags, err := solveAt(net, rc, mx, feed, total, T, P, o.Basis, last)
		if c == nil {
			return math.NaN(), nil, diags, err
		}
		last = c
		h, sp := c.productEnthalpy()
		if sp != nil {
			return math.NaN(), nil, errAt("missing-thermo", mx.NameSpan, "%s forms at %s K and has no enthalpy data there", sp.Key, kelvin(T)), nil
		}
		if !c.Converged {
			return math.NaN(), c, nil, nil
		}
		return h - hFeed, c, nil, nil
	}
	scale := math.Max(math.Abs(hFeed), total*thermo.R*1000)
	// Bracket the root by walking from the feed's temperature towards it in
	// steps of a quarter of the temperature (at least 50 K), so that the
	// solves stay where the products have data; a step that fails is
	// halved towards the last good one.
	T0 := math.Min(math.Max(Tfeed, lo), hi)
	f0, c0, diags, err := eval(T0)
	if c0 == nil || math.IsNaN(f0) {
		return finishNoRoot(c0, diags, err, mx, T0)
	}
	dir := 1.0
	if f0 > 0 {
		dir = -1
	}
	limit := hi
	if dir < 0 {
		limit = lo
	}
	a, fa, ca := T0, f0, c0
	b, fb, cb := a, fa, ca
	for f0 != 0 {
		if a == limit {
			where, word := "highest", "less"
			if dir < 0 {
				where, word = "lowest", "more"
			}
			return nil, errAt("extrapolation", mx.NameSpan, "the products of mixture %s at %s K, the %s temperature of its members' data, still hold %.6g kJ %s than the feed: the adiabatic temperature lies beyond the data's range",
				mx.Name, kelvin(a), where, math.Abs(fa)/1000, word), nil
		}
		step := math.Max(50, 0.25*a)
		next := a + dir*step
		if dir*(next-limit) > 0 {
			next = limit
		}
		var fn float64
		var cn *Composition
		for tries := 0; ; tries++ {
			fn, cn, diags, err = eval(next)
			if cn != nil && !math.IsNaN(fn) {
				break
			}
			if tries == 40 || math.Abs(next-a) < 1e-6 {
				return finishNoRoot(cn, diags, err, mx, next)
			}
			limit = next
			next = (a + next) / 2
		}
		if (fn > 0) == (dir > 0) || fn == 0 {
			b, fb, cb = next, fn, cn
			break
		}
		a, fa, ca = next, fn, cn
	}
	if f0 == 0 {
		b, fb, cb = a, fa, ca
	}
	// Order the bracket as lo < hi with f(lo) ≤ 0 ≤ f(hi).
	cLo, fLo, cHi, fHi := ca, fa, cb, fb
	if dir < 0 {
		cLo, fLo, cHi, fHi = cb, fb, ca, fa
		a, b = b, a
	}
	lo, hi = a, b
	best, fBest := cLo, fLo
	if math.Abs(fHi) < math.Abs(fLo) {
		best, fBest = cHi, fHi
	}
	a, b, fa, fb = lo, hi, fLo, fHi
	side := 0
	for it := 0; it < 200 && math.Abs(fBest) > 1e-12*scale && b-a > 1e-9*b; it++ {
		t := (a*fb - b*fa) / (fb - fa)
		if !(t > a && t < b) || it%4 == 3 {
			t = (a + b) / 2
		}
		ft, ct, diags, err := eval(t)
		if ct == nil || math.IsNaN(ft) {
			return finishNoRoot(ct, diags, err, mx, t)
		}
		if math.Abs(ft) < math.Abs(fBest) {
			best, fBest = ct, ft
		}
		if ft < 0 {
			a, fa = t, ft
			if side == -1 {
				fb /= 2
			}
			side = -1
		} else {
			b, fb = t, ft
			if side == 1 {
				fa /= 2
			}
			side = 1
		}
	}
	best.Adiabatic = true
	best.FeedT = Tfeed
	best.heat(feed)
	return best, nil, nil
}

// finishNoRoot reports a solve that failed or did not converge during the
// temperature search: the last composition is returned unconverged, so that
// the caller says so.
func finishNoRoot(c *Composition, diags lang.Diagnostics, err error, mx *network.Mixture, T float64) (*Composition, lang.Diagnostics, error) {
	if c != nil {
		c.Adiabatic = true
		c.Converged = false
		c.Heat = math.NaN()
		c.HeatNote = fmt.Sprintf("the equilibrium at %s K did not converge during the search for the adiabatic temperature", kelvin(T))
		return c, nil, nil
	}
	return nil, diags, err
}

// extrapolatedTmin and extrapolatedTmax bound the adiabatic search where a
// feed's data state no range: constant ΔfH°, S° and Cp° carried on, each
// result marked extrapolated.
const (
	extrapolatedTmin = 10.0
	extrapolatedTmax = 10000.0
)
