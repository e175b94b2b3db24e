package thermo

import (
	"math"
	"math/rand/v2"
	"testing"
)

// TestFiniteOnIsSound checks that wherever FiniteOn says a model is finite
// on [lo, hi], Cp°, H°, S° and G° evaluate finite at the bounds and at
// points between, on random NASA, Shomate, constant and piecewise models
// whose coefficients range up to and past the bound, and that it declines
// what it cannot prove.
func TestFiniteOnIsSound(t *testing.T) {
	r := rand.New(rand.NewPCG(11, 12))
	coef := func() float64 {
		// Magnitudes from 1e-5 to 1e250, either sign, now and then huge.
		return math.Copysign(math.Pow(10, -5+255*r.Float64()), r.Float64()-0.5)
	}
	proved := 0
	for range 20000 {
		var m Model
		switch r.IntN(4) {
		case 0:
			n := NASA7Range{Tmin: 200, Tmax: 1000}
			for i := range n.A {
				n.A[i] = coef()
			}
			m = n
		case 1:
			s := ShomateRange{Tmin: 298, Tmax: 1200}
			for i := range s.Coef {
				s.Coef[i] = coef()
			}
			m = s
		case 2:
			m = Constant{Hf: coef(), S298: coef(), Cp298: coef()}
		default:
			a := NASA7Range{Tmin: 200, Tmax: 1000}
			b := NASA7Range{Tmin: 1000, Tmax: 6000}
			for i := range a.A {
				a.A[i], b.A[i] = coef()/1e50, coef()/1e50
			}
			pw, err := NewPiecewise(a, b)
			if err != nil {
				t.Fatal(err)
			}
			m = pw
		}
		lo := math.Pow(10, -4+9*r.Float64())
		hi := lo * math.Pow(10, 3*r.Float64())
		if !FiniteOn(m, lo, hi) {
			continue
		}
		proved++
		for k := 0; k <= 20; k++ {
			T := lo * math.Pow(hi/lo, float64(k)/20)
			for _, v := range []float64{m.Cp(T), m.H(T), m.S(T), m.G(T)} {
				if math.IsNaN(v) || math.IsInf(v, 0) {
					t.Fatalf("FiniteOn(%#v, %g, %g) but a value at %g K is %v", m, lo, hi, T, v)
				}
			}
		}
	}
	if proved < 1000 {
		t.Fatalf("only %d of 20000 random models proved finite: the test exercises too little", proved)
	}
	for _, tc := range []struct {
		m      Model
		lo, hi float64
	}{
		{NASA7Range{Tmin: 200, Tmax: 1000, A: [7]float64{1e201}}, 300, 400}, // a coefficient past the bound
		{NASA7Range{Tmin: 200, Tmax: 1000, A: [7]float64{math.NaN()}}, 300, 400},
		{NASA7Range{Tmin: 200, Tmax: 1000}, 300, 2e5},  // too hot to prove
		{NASA7Range{Tmin: 200, Tmax: 1000}, 1e-4, 400}, // too cold to prove
		{GibbsOnly{Gf: 1}, 298, 299},                   // a form it does not know
	} {
		if FiniteOn(tc.m, tc.lo, tc.hi) {
			t.Errorf("FiniteOn(%#v, %g, %g) is true, want false", tc.m, tc.lo, tc.hi)
		}
	}
}
