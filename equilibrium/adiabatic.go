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
	lo, hi, diags := searchSpan(mx, feed)
	if diags != nil {
		return nil, diags, nil
	}
	hFeed, sp := feedEnthalpy(feed, Tfeed)
	if sp != nil {
		return nil, lang.Diagnostics{errorAt("missing-thermo", mx.NameSpan, "%s has no enthalpy data at the feed's %s K", sp.Key, kelvin(Tfeed))}, nil
	}
	s := &adiabaticSearch{net: net, rc: newRxCache(net), mx: mx, feed: feed, total: total, P: P, basis: o.Basis, hFeed: hFeed}
	lower, upper, end := s.bracket(math.Min(math.Max(Tfeed, lo), hi), lo, hi)
	if end != nil {
		return end.c, end.diags, end.err
	}
	best, end := s.refine(lower, upper)
	if end != nil {
		return end.c, end.diags, end.err
	}
	best.Adiabatic = true
	best.FeedT = Tfeed
	best.heat(feed)
	return best, nil, nil
}

// searchSpan is the span of temperatures, K, where every member of the
// feed has data: the adiabatic search looks nowhere else. Diagnostics name
// a member without a temperature model, or a feed whose members' data
// share no temperature.
func searchSpan(mx *network.Mixture, feed []feedItem) (lo, hi float64, diags lang.Diagnostics) {
	lo, hi = 0.0, math.Inf(1)
	for _, f := range feed {
		a, b, ok := f.species.DataSpan()
		if ok && len(f.species.Ranges) == 0 && a < b {
			// Data that state no range are carried beyond their default
			// span, marked extrapolated (network.Species.EvaluableAt): the
			// search may look as far as such data were ever taken to hold.
			a, b = extrapolatedTmin, extrapolatedTmax
		}
		if !ok {
			return 0, 0, lang.Diagnostics{errorAt("missing-thermo", f.span, "%s has no temperature model, so the feed has no enthalpy", f.species.Key)}
		}
		lo, hi = math.Max(lo, a), math.Min(hi, b)
	}
	if !(hi > lo) {
		return 0, 0, lang.Diagnostics{errorAt("missing-thermo", mx.NameSpan, "the data of mixture %s's members share no temperature range", mx.Name)}
	}
	return lo, hi, nil
}

// adiabaticSearch is the state of one search for an adiabatic temperature:
// the feed and its conditions, its enthalpy at its own temperature, and the
// last composition solved, from which the next solve starts.
type adiabaticSearch struct {
	net   *network.Network
	rc    *rxCache
	mx    *network.Mixture
	feed  []feedItem
	total float64 // mol
	P     float64 // Pa
	basis Basis
	hFeed float64 // J, at the feed's temperature
	last  *Composition
}

// adiabaticPoint is one solve of the search: the temperature, K, the
// products' enthalpy less the feed's, J, and the products.
type adiabaticPoint struct {
	T, f float64
	c    *Composition
}

// searchEnd is what adiabatic returns when the search stops before the
// root is found.
type searchEnd struct {
	c     *Composition
	diags lang.Diagnostics
	err   error
}

// eval solves the equilibrium at T and returns the products' enthalpy less
// the feed's, J, with the products. A failed solve returns NaN with no
// products (and its diagnostics or error); an unconverged one returns NaN
// with its products.
func (s *adiabaticSearch) eval(T float64) (float64, *Composition, lang.Diagnostics, error) {
	c, diags, err := solveAt(s.net, s.rc, s.mx, s.feed, s.total, T, s.P, s.basis, s.last)
	if c == nil {
		return math.NaN(), nil, diags, err
	}
	s.last = c
	h, sp := c.productEnthalpy()
	if sp != nil {
		return math.NaN(), nil, lang.Diagnostics{errorAt("missing-thermo", s.mx.NameSpan, "%s forms at %s K and has no enthalpy data there", sp.Key, kelvin(T))}, nil
	}
	if !c.Converged {
		return math.NaN(), c, nil, nil
	}
	return h - s.hFeed, c, nil, nil
}

// noRoot ends the search at T after a solve that failed or did not
// converge (finishNoRoot).
func (s *adiabaticSearch) noRoot(c *Composition, diags lang.Diagnostics, err error, T float64) *searchEnd {
	c, diags, err = finishNoRoot(c, diags, err, s.mx, T)
	return &searchEnd{c: c, diags: diags, err: err}
}

// bracket brackets the root by walking from T0 towards it over [lo, hi] in
// steps of a quarter of the temperature (at least 50 K), so that the solves
// stay where the products have data; a step that fails is halved towards
// the last good one. It returns the bracket ordered lower.T ≤ upper.T with
// f(lower) ≤ 0 ≤ f(upper), or how the search ended without one: a root
// beyond the data's range is a diagnostic.
func (s *adiabaticSearch) bracket(T0, lo, hi float64) (lower, upper adiabaticPoint, end *searchEnd) {
	f0, c0, diags, err := s.eval(T0)
	if c0 == nil || math.IsNaN(f0) {
		return lower, upper, s.noRoot(c0, diags, err, T0)
	}
	dir := 1.0
	if f0 > 0 {
		dir = -1
	}
	limit := hi
	if dir < 0 {
		limit = lo
	}
	a := adiabaticPoint{T: T0, f: f0, c: c0}
	b := a
	for f0 != 0 {
		if a.T == limit {
			where, word := "highest", "less"
			if dir < 0 {
				where, word = "lowest", "more"
			}
			return lower, upper, &searchEnd{diags: lang.Diagnostics{errorAt("extrapolation", s.mx.NameSpan, "the products of mixture %s at %s K, the %s temperature of its members' data, still hold %.6g kJ %s than the feed: the adiabatic temperature lies beyond the data's range",
				s.mx.Name, kelvin(a.T), where, math.Abs(a.f)/1000, word)}}
		}
		step := math.Max(50, 0.25*a.T)
		next := a.T + dir*step
		if dir*(next-limit) > 0 {
			next = limit
		}
		var fn float64
		var cn *Composition
		for tries := 0; ; tries++ {
			fn, cn, diags, err = s.eval(next)
			if cn != nil && !math.IsNaN(fn) {
				break
			}
			if tries == 40 || math.Abs(next-a.T) < 1e-6 {
				return lower, upper, s.noRoot(cn, diags, err, next)
			}
			limit = next
			next = (a.T + next) / 2
		}
		if (fn > 0) == (dir > 0) || fn == 0 {
			b = adiabaticPoint{T: next, f: fn, c: cn}
			break
		}
		a = adiabaticPoint{T: next, f: fn, c: cn}
	}
	if f0 == 0 {
		b = a
	}
	if dir < 0 {
		return b, a, nil
	}
	return a, b, nil
}

// refine narrows the bracket by regula falsi (Illinois: the value at an
// end kept twice running is halved), bisecting every fourth step or when
// the secant falls outside. It stops after 200 steps, when the smallest
// |f| falls below 1e-12 of the feed's enthalpy scale, or when the bracket
// is narrower than 1e-9 of its upper end, and returns the products of the
// smallest |f| seen, or how the search ended without them.
func (s *adiabaticSearch) refine(lower, upper adiabaticPoint) (*Composition, *searchEnd) {
	scale := math.Max(math.Abs(s.hFeed), s.total*thermo.R*1000)
	best, fBest := lower.c, lower.f
	if math.Abs(upper.f) < math.Abs(lower.f) {
		best, fBest = upper.c, upper.f
	}
	a, b, fa, fb := lower.T, upper.T, lower.f, upper.f
	side := 0
	for it := 0; it < 200 && math.Abs(fBest) > 1e-12*scale && b-a > 1e-9*b; it++ {
		t := (a*fb - b*fa) / (fb - fa)
		if !(t > a && t < b) || it%4 == 3 {
			t = (a + b) / 2
		}
		ft, ct, diags, err := s.eval(t)
		if ct == nil || math.IsNaN(ft) {
			return nil, s.noRoot(ct, diags, err, t)
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
	return best, nil
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
