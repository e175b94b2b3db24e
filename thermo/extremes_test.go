package thermo

import (
	"math"
	"testing"
)

// The expected values below are derived by hand from the polynomials in
// each case's comment; none comes from running the code.
func TestCritical(t *testing.T) {
	for _, c := range []struct {
		name string
		m    Polynomial
		want []float64
	}{
		{
			// Cp/R = 3 − 0.004·T + 4e-6·T²: dCp/dT = 0 at T = 0.004/8e-6 = 500 K;
			// Cp/R ≥ 2 > 0 everywhere.
			"nasa7 quadratic", NASA7Range{Tmin: 200, Tmax: 1000, A: [7]float64{3, -0.004, 4e-6}},
			[]float64{200, 500, 1000},
		},
		{
			// Cp/R = (x − 0.5)²(x − 1.5)² + 1 with x = T/1000, that is
			// x⁴ − 4x³ + 5.5x² − 3x + 1.5625: dCp/dx = 2(x − 0.5)(x − 1.5)(2x − 2)
			// is zero at 500, 1000 and 1500 K; Cp/R ≥ 1.
			"nasa7 quartic", NASA7Range{Tmin: 300, Tmax: 1700, A: [7]float64{1.5625, -3e-3, 5.5e-6, -4e-9, 1e-12}},
			[]float64{300, 500, 1000, 1500, 1700},
		},
		{
			// Cp/R = (x − 0.4)(x − 0.8) = x² − 1.2x + 0.32, x = T/1000: negative
			// between 400 and 800 K, least at 600 K.
			"nasa7 sign change", NASA7Range{Tmin: 200, Tmax: 1000, A: [7]float64{0.32, -1.2e-3, 1e-6}},
			[]float64{200, 400, 600, 800, 1000},
		},
		{
			// Constant Cp: only the bounds.
			"nasa7 constant", NASA7Range{Tmin: 200, Tmax: 6000, A: [7]float64{2.5, 0, 0, 0, 0, 100, 4}},
			[]float64{200, 6000},
		},
		{
			// A turning point outside the range is not a candidate: dCp/dT = 0
			// at 500 K, the range starts at 600 K.
			"nasa7 turn outside", NASA7Range{Tmin: 600, Tmax: 1000, A: [7]float64{3, -0.004, 4e-6}},
			[]float64{600, 1000},
		},
		{
			// Cp = t − 3 + 2/t², t = T/1000: t²·Cp = t³ − 3t² + 2 = (t − 1)(t² − 2t − 2),
			// zero at t = 1 and 1 + √3; dCp/dt = 1 − 4/t³, zero at t = ∛4.
			"shomate", ShomateRange{Tmin: 500, Tmax: 5000, Coef: [8]float64{-3, 1, 0, 0, 2}},
			[]float64{500, 1000, 1000 * math.Cbrt(4), 1000 * (1 + math.Sqrt(3)), 5000},
		},
	} {
		t.Run(c.name, func(t *testing.T) {
			cs := c.m.Critical()
			got := cs.List()
			if len(got) != len(c.want) {
				t.Fatalf("critical temperatures %v, want %v", got, c.want)
			}
			for i := range got {
				if math.Abs(got[i]-c.want[i]) > 1e-7*c.want[i] {
					t.Errorf("critical temperatures %v, want %v", got, c.want)
					break
				}
			}
		})
	}
}

func TestRangeExtremes(t *testing.T) {
	// near accepts any of the temperatures given with "or": equal values in
	// exact arithmetic differ in the last bits in floating point.
	nearOr := func(t *testing.T, what string, got Extreme, v float64, Ts ...float64) {
		t.Helper()
		for _, T := range Ts {
			if math.Abs(got.T-T) <= 1e-6*T && math.Abs(got.V-v) <= 1e-9*math.Max(1, math.Abs(v)) {
				return
			}
		}
		t.Errorf("%s = %g at %g K, want %g at %v K", what, got.V, got.T, v, Ts)
	}
	near := func(t *testing.T, what string, got Extreme, T, v float64) {
		t.Helper()
		nearOr(t, what, got, v, T)
	}
	// Cp/R = x⁴ − 4x³ + 5.5x² − 3x + 1.5625 (x = T/1000) on 300–1700 K: least
	// 1 at 500 K and 1500 K, greatest 1.0625 at 1000 K (the ends give 1.0576).
	q := NASA7Range{Tmin: 300, Tmax: 1700, A: [7]float64{1.5625, -3e-3, 5.5e-6, -4e-9, 1e-12, 0, 0}}
	e := RangeExtremes(q)
	nearOr(t, "nasa7 Cp min", e.CpMin, R, 500, 1500)
	near(t, "nasa7 Cp max", e.CpMax, 1000, 1.0625*R)
	// Cp > 0: H and S rise, least at Tmin and greatest at Tmax.
	near(t, "nasa7 H min", e.HMin, 300, q.H(300))
	near(t, "nasa7 H max", e.HMax, 1700, q.H(1700))
	near(t, "nasa7 S min", e.SMin, 300, q.S(300))
	near(t, "nasa7 S max", e.SMax, 1700, q.S(1700))

	// Cp/R = (x − 0.4)(x − 0.8) on 200–1000 K: least −0.04·R at 600 K; S and H
	// rise to 400 K, fall to 800 K and rise again, so the least S is at 200 K
	// or 800 K and the greatest at 400 K or 1000 K, whichever is lower/higher.
	s := NASA7Range{Tmin: 200, Tmax: 1000, A: [7]float64{0.32, -1.2e-3, 1e-6, 0, 0, 0, 0}}
	e = RangeExtremes(s)
	near(t, "sign change Cp min", e.CpMin, 600, -0.04*R)
	nearOr(t, "sign change Cp max", e.CpMax, 0.12*R, 200, 1000) // (0.2−0.4)(0.2−0.8) = (1−0.4)(1−0.8) = 0.12
	// S/R = 0.32 ln T − 1.2e-3 T + 5e-7 T²: at 200 K 1.695 − 0.24 + 0.02 = 1.4755,
	// at 800 K 2.1391 − 0.96 + 0.32 = 1.4991, so the least is at 200 K.
	near(t, "sign change S min", e.SMin, 200, s.S(200))
	// At 400 K 1.9173 − 0.48 + 0.08 = 1.5173, at 1000 K 2.2105 − 1.2 + 0.5 = 1.5105:
	// the greatest is at 400 K, inside the range.
	near(t, "sign change S max", e.SMax, 400, s.S(400))

	// Shomate Cp = t − 3 + 2/t² on 500–5000 K: least where dCp/dt = 0, t = ∛4,
	// Cp = ∛4 − 3 + 2/∛16 = 1.5874 − 3 + 0.7937 = −0.6189 J/(mol·K).
	sh := ShomateRange{Tmin: 500, Tmax: 5000, Coef: [8]float64{-3, 1, 0, 0, 2}}
	e = RangeExtremes(sh)
	c := math.Cbrt(4)
	near(t, "shomate Cp min", e.CpMin, 1000*c, c-3+2/(c*c))
	// Greatest at 500 K: 0.5 − 3 + 8 = 5.5 (at 5000 K: 5 − 3 + 0.08 = 2.08).
	near(t, "shomate Cp max", e.CpMax, 500, 5.5)
}

// TestRangeExtremesBoundSamples checks on random NASA 7-term and Shomate
// ranges that no sample of a fine grid lies beyond the extremes found.
func TestRangeExtremesBoundSamples(t *testing.T) {
	seed := uint64(88172645463325252)
	next := func() float64 { // xorshift, deterministic
		seed ^= seed << 13
		seed ^= seed >> 7
		seed ^= seed << 17
		return float64(seed>>11)/(1<<53)*2 - 1
	}
	for k := 0; k < 300; k++ {
		x := [5]float64{next(), next(), next(), next(), next()} // Cp/R in x = T/1000
		var m Polynomial = NASA7Range{Tmin: 200, Tmax: 3000, A: [7]float64{x[0], x[1] / 1e3, x[2] / 1e6, x[3] / 1e9, x[4] / 1e12, next() * 1e4, next() * 10}}
		if k%2 == 1 {
			m = ShomateRange{Tmin: 200, Tmax: 3000, Coef: [8]float64{30 * x[0], 20 * x[1], 10 * x[2], 3 * x[3], 0.1 * x[4], next() * 100, next() * 100}}
		}
		e := RangeExtremes(m)
		for i := 0; i <= 2000; i++ {
			T := 200 + 2800*float64(i)/2000
			for _, q := range []struct {
				v        float64
				min, max Extreme
			}{{m.Cp(T), e.CpMin, e.CpMax}, {m.H(T), e.HMin, e.HMax}, {m.S(T), e.SMin, e.SMax}} {
				slack := 1e-9 * math.Max(1, math.Abs(q.v))
				if q.v < q.min.V-slack || q.v > q.max.V+slack {
					t.Fatalf("%+v: %g at %g K outside [%g, %g]", m, q.v, T, q.min.V, q.max.V)
				}
			}
		}
	}
}
