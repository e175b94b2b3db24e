package thermo

import (
	"errors"
	"fmt"
	"math"
)

// ErrNotBracketed is returned by Brent when f has the same sign at both ends.
var ErrNotBracketed = errors.New("root not bracketed")

// brentMaxIter bounds Brent's iterations; bisection alone would halve any double
// interval to nothing well within it.
const brentMaxIter = 200

// Brent finds a root of f in [a, b], where f(a) and f(b) must differ in sign (or
// one be zero), to an absolute tolerance tol in x, by Brent's combination of
// bisection, secant and inverse quadratic interpolation steps.
func Brent(f func(float64) float64, a, b, tol float64) (float64, error) {
	fa, fb := f(a), f(b)
	switch {
	case math.IsNaN(fa) || math.IsNaN(fb):
		return math.NaN(), fmt.Errorf("brent on [%g, %g]: function is NaN at an end", a, b)
	case fa == 0:
		return a, nil
	case fb == 0:
		return b, nil
	case (fa > 0) == (fb > 0):
		return math.NaN(), fmt.Errorf("brent on [%g, %g]: f = %g and %g: %w", a, b, fa, fb, ErrNotBracketed)
	}
	if !(tol > 0) {
		tol = 1e-12 * math.Max(math.Abs(a), math.Abs(b))
	}
	c, fc := a, fa
	d := b - a
	e := d
	for range brentMaxIter {
		if (fb > 0) == (fc > 0) {
			c, fc = a, fa
			d = b - a
			e = d
		}
		if math.Abs(fc) < math.Abs(fb) {
			a, b, c = b, c, b
			fa, fb, fc = fb, fc, fb
		}
		tol1 := 2*2.220446049250313e-16*math.Abs(b) + tol/2
		m := (c - b) / 2
		if math.Abs(m) <= tol1 || fb == 0 {
			return b, nil
		}
		if math.Abs(e) >= tol1 && math.Abs(fa) > math.Abs(fb) {
			// Try interpolation: secant when a == c, inverse quadratic otherwise.
			s := fb / fa
			var p, q float64
			if a == c {
				p = 2 * m * s
				q = 1 - s
			} else {
				qa := fa / fc
				r := fb / fc
				p = s * (2*m*qa*(qa-r) - (b-a)*(r-1))
				q = (qa - 1) * (r - 1) * (s - 1)
			}
			if p > 0 {
				q = -q
			} else {
				p = -p
			}
			if 2*p < math.Min(3*m*q-math.Abs(tol1*q), math.Abs(e*q)) {
				e, d = d, p/q
			} else {
				d, e = m, m
			}
		} else {
			d, e = m, m
		}
		a, fa = b, fb
		if math.Abs(d) > tol1 {
			b += d
		} else {
			b += math.Copysign(tol1, m)
		}
		fb = f(b)
		if math.IsNaN(fb) {
			return math.NaN(), fmt.Errorf("brent: function is NaN at %g", b)
		}
	}
	return b, fmt.Errorf("brent on [%g, %g]: no convergence in %d iterations", a, c, brentMaxIter)
}

// Crossover is a temperature where a reaction's ΔrG° changes sign.
type Crossover struct {
	T float64 // K
	// FavoredAbove is true when ΔrG° < 0 above T: the reaction as written is
	// favoured at higher temperature.
	FavoredAbove bool
}

// Grid and accuracy of the crossover search.
const (
	crossoverMinSteps = 200
	crossoverMaxSteps = 20000
	// CrossoverTolerance is the accuracy, in K, to which crossovers are refined.
	CrossoverTolerance = 1e-3
)

// Crossovers finds every temperature in [Tmin, Tmax] where f changes sign. It
// samples f about every kelvin (at least 200 and at most 20 000 intervals), then
// refines each sign change by Brent's method to CrossoverTolerance. An exact zero
// on the grid is a crossover only when the signs on its two sides differ; a run of
// zeros is reported at its middle. NaN samples break the scan, and a sign change
// that cannot be refined because f is NaN inside it is left out. Two sign changes
// closer than one grid step can cancel and go unseen.
//
// Stretches of crossoverStrides grid steps (long ones first, then short)
// where f keeps well away from zero, judged by its curvature over the
// neighbouring stretches, are passed over without sampling their inner
// points; elsewhere every grid point is sampled. A feature of f narrower
// than such a stretch that dips across zero and back between samples far
// from zero can therefore go unseen; ΔrG° from polynomial data bends far
// too gently for that.
func Crossovers(f func(T float64) float64, Tmin, Tmax float64) []Crossover {
	return ScanCrossovers(f, f, Tmin, Tmax)
}

// ScanCrossovers is Crossovers with the grid sampled through scan, a
// faster evaluation of f that agrees with it to rounding (such as
// Reaction.SummedDeltaG); f itself refines each sign change, so the
// crossovers are those of f.
func ScanCrossovers(scan, f func(T float64) float64, Tmin, Tmax float64) []Crossover {
	if !finite(Tmin) || !finite(Tmax) || !(Tmin < Tmax) {
		return nil
	}
	n := int(math.Ceil(Tmax - Tmin))
	n = max(crossoverMinSteps, min(n, crossoverMaxSteps))
	step := (Tmax - Tmin) / float64(n)
	at := func(i int) float64 {
		if i == n {
			return Tmax
		}
		return Tmin + float64(i)*step
	}
	// The last samples are kept, since the look past a stretch reads
	// points that the scan comes back to; it reads no farther than one
	// long stretch behind and two ahead of the scan.
	var kept [4 * longStride]struct {
		i int
		v float64
	}
	for k := range kept {
		kept[k].i = -1
	}
	sample := func(i int) float64 {
		k := &kept[i%len(kept)]
		if k.i != i {
			k.i, k.v = i, scan(at(i))
		}
		return k.v
	}
	var out []Crossover
	prev, fprev := -1, 0.0 // last grid point with a finite non-zero value
	zeroFrom := -1         // first of the zeros seen since prev
	for i := 0; i <= n; i++ {
		x := at(i)
		v := sample(i)
		switch {
		case math.IsNaN(v):
			prev, zeroFrom = -1, -1
			continue
		case v == 0:
			if zeroFrom < 0 {
				zeroFrom = i
			}
			continue
		}
		if prev >= 0 && (v > 0) != (fprev > 0) {
			var root float64
			if zeroFrom >= 0 {
				root = (at(zeroFrom) + at(i-1)) / 2
			} else {
				r, err := Brent(f, at(prev), x, CrossoverTolerance/10)
				if err != nil {
					// f was NaN inside the interval: no refined root to report.
					prev, fprev, zeroFrom = i, v, -1
					continue
				}
				root = r
			}
			out = append(out, Crossover{T: root, FavoredAbove: v < 0})
		}
		prev, fprev, zeroFrom = i, v, -1
		for _, k := range crossoverStrides {
			if i%k == 0 && clearAhead(sample, i, n, v, k) {
				i += k - 1
				break
			}
		}
	}
	return out
}

// crossoverStrides are how many grid steps Crossovers may pass over at
// once, longest first; each divides the one before.
var crossoverStrides = [...]int{longStride, 8}

const longStride = 64

// clearAhead reports whether f, sampled on the grid [0, n], stays clear of
// zero between grid points i and i+k, where its value is v
// (finite, non-zero). The end of the stretch must have v's sign and be
// farther from zero than twice the largest second difference of the
// samples a stretch apart around it: on a stretch where the curvature is
// within sixteen times that estimate, f cannot bend across zero.
func clearAhead(sample func(int) float64, i, n int, v float64, k int) bool {
	j := i + k
	if j > n {
		return false
	}
	w := sample(j)
	if !finite(w) || w == 0 || (w > 0) != (v > 0) {
		return false
	}
	curv, seen := 0.0, false
	if i-k >= 0 {
		u := sample(i - k)
		if !finite(u) {
			return false
		}
		curv, seen = math.Abs(u-2*v+w), true
	}
	if j+k <= n {
		z := sample(j + k)
		if !finite(z) {
			return false
		}
		curv, seen = math.Max(curv, math.Abs(v-2*w+z)), true
	}
	return seen && math.Min(math.Abs(v), math.Abs(w)) > 2*curv
}
