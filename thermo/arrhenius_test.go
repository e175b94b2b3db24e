package thermo

import (
	"math"
	"strings"
	"testing"
)

// A known rate (invented demo parameters, SI): A = 2.5e5 m³/(mol·s·K^1.5),
// n = 1.5, Ea = 85 kJ/mol. Fitting points generated from it must give it back.
var demoRate = Arrhenius{A: 2.5e5, N: 1.5, Ea: 85e3}

func demoPoints(from, to float64, n int, noise float64) (T, k []float64) {
	for i := range n {
		x := from + (to-from)*float64(i)/float64(n-1)
		f := 1.0
		if noise != 0 {
			f += noise * math.Cos(float64(7*i)) // deterministic scatter
		}
		T = append(T, x)
		k = append(k, demoRate.Rate(x)*f)
	}
	return T, k
}

func TestFitArrheniusRecovers(t *testing.T) {
	T, k := demoPoints(300, 1500, 25, 0)
	fit, err := FitArrhenius(T, k)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(fit.A/demoRate.A-1) > 1e-7 || math.Abs(fit.N-demoRate.N) > 1e-8 || math.Abs(fit.Ea-demoRate.Ea) > 1e-3 {
		t.Errorf("fit A %.10g n %.10g Ea %.10g; want %g, %g, %g", fit.A, fit.N, fit.Ea, demoRate.A, demoRate.N, demoRate.Ea)
	}
	if fit.MaxRelErr > 1e-9 || fit.Points != 25 {
		t.Errorf("max relative error %g over %d points, want ≈0 over 25", fit.MaxRelErr, fit.Points)
	}
}

func TestFitArrheniusNoisy(t *testing.T) {
	T, k := demoPoints(400, 1200, 30, 0.02)
	fit, err := FitArrhenius(T, k)
	if err != nil {
		t.Fatal(err)
	}
	// The scatter is at most 2 %, so the fit misses no point by much more, and at
	// least one point lies 1 % or more off the best line.
	if fit.MaxRelErr > 0.03 || fit.MaxRelErr < 0.01 {
		t.Errorf("max relative error %.4f, want between 0.01 and 0.03", fit.MaxRelErr)
	}
	for _, x := range []float64{400, 800, 1200} {
		if r := fit.Rate(x) / demoRate.Rate(x); math.Abs(r-1) > 0.02 {
			t.Errorf("fitted k(%g) off the true rate by %.3f", x, r-1)
		}
	}
}

func TestFitArrheniusFixedN(t *testing.T) {
	T, k := demoPoints(500, 700, 2, 0)
	fit, err := FitArrheniusFixedN(T, k, 1.5)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(fit.A/demoRate.A-1) > 1e-8 || fit.N != 1.5 || math.Abs(fit.Ea-demoRate.Ea) > 1e-3 {
		t.Errorf("fit %+v, want %+v", fit.Arrhenius, demoRate)
	}
	if _, err := FitArrheniusFixedN(T, k, math.NaN()); err == nil {
		t.Error("NaN exponent gave no error")
	}
}

func TestFitArrheniusErrors(t *testing.T) {
	tests := []struct {
		name string
		T, k []float64
		want string
	}{
		{"lengths", []float64{300, 400, 500}, []float64{1, 2}, "3 temperatures but 2 rate constants"},
		{"too few", []float64{300, 400}, []float64{1, 2}, "2 distinct temperatures, need at least 3"},
		{"repeated T", []float64{300, 300, 400, 400}, []float64{1, 1.1, 2, 2.1}, "2 distinct temperatures"},
		{"zero k", []float64{300, 400, 500}, []float64{1, 0, 2}, "point 2: rate constant 0 is not positive"},
		{"negative T", []float64{300, -400, 500}, []float64{1, 2, 3}, "point 2: temperature -400 K"},
		{"NaN k", []float64{300, 400, 500}, []float64{1, 2, math.NaN()}, "point 3"},
	}
	for _, tc := range tests {
		_, err := FitArrhenius(tc.T, tc.k)
		if err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s: error %v, want %q", tc.name, err, tc.want)
		}
	}
}

func TestArrheniusRate(t *testing.T) {
	a, err := NewArrhenius(1e10, 0, 100e3)
	if err != nil {
		t.Fatal(err)
	}
	// k = A·exp(−Ea/RT) at 1000 K, R from SI 2019.
	want := 1e10 * math.Exp(-100e3/(8.31446261815324*1000))
	if got := a.Rate(1000); math.Abs(got/want-1) > 1e-14 {
		t.Errorf("k(1000) = %g, want %g", got, want)
	}
	if !math.IsNaN(a.Rate(0)) || !math.IsNaN(a.LnRate(-1)) {
		t.Error("rate at T ≤ 0 is not NaN")
	}
	for _, p := range [][3]float64{{0, 0, 1}, {-1, 0, 1}, {1, math.NaN(), 1}, {1, 0, math.Inf(1)}} {
		if _, err := NewArrhenius(p[0], p[1], p[2]); err == nil {
			t.Errorf("NewArrhenius(%v) gave no error", p)
		}
	}
}

func TestDetailedBalance(t *testing.T) {
	// 2 NH3 ⇌ N2 + 3 H2 run as an elementary step (demo forward rate): a reverse
	// rate kf/KcSI is in detailed balance; one twice as fast is not.
	r := ammonia(t, -1)
	const T = 800.0
	kf := demoRate.Rate(T)
	kc := r.KcSI(T, Bar)
	if got := DetailedBalanceRatio(kf, kf/kc, kc); math.Abs(got-1) > 1e-12 {
		t.Errorf("ratio %g, want 1", got)
	}
	if got := DetailedBalanceRatio(kf, 2*kf/kc, kc); math.Abs(got-0.5) > 1e-12 {
		t.Errorf("ratio %g, want 0.5", got)
	}
}
