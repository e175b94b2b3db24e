package aqueous

import (
	"errors"
	"math"
	"testing"

	"hess/thermo"
)

func TestWaterAt25C(t *testing.T) {
	T := thermo.T298
	rho, err := Density(T)
	if err != nil {
		t.Fatal(err)
	}
	// CRC Handbook, density of water at 25 °C: 0.997047 g/cm³ (REFERENCE-DATA:
	// 0.99705). Kell's IPTS-68 fit gives 0.9970449.
	if got, want := rho/1000, 0.997047; math.Abs(got-want) > 5e-6 {
		t.Errorf("ρ(25 °C) = %.7f g/cm³, want %.6f (CRC) within 5e-6", got, want)
	}
	// Kell (1975) at 4 °C: the maximum density, 0.999972 g/cm³ (CRC, from memory).
	if rho4, _ := Density(zeroCelsius + 4); math.Abs(rho4/1000-0.999972) > 3e-6 {
		t.Errorf("ρ(4 °C) = %.7f g/cm³, want 0.999972 (CRC, from memory)", rho4/1000)
	}
	// CRC Handbook, density of water (from memory): 0.99984 at 0 °C, 0.98804 at
	// 50 °C, 0.95835 at 100 °C (g/cm³).
	for _, c := range []struct{ tC, want float64 }{{0, 0.99984}, {50, 0.98804}, {100, 0.95835}} {
		if r, _ := Density(zeroCelsius + c.tC); math.Abs(r/1000-c.want) > 2e-5 {
			t.Errorf("ρ(%g °C) = %.6f g/cm³, want %.5f (CRC, from memory)", c.tC, r/1000, c.want)
		}
	}
	for _, dt := range []float64{3, 5} {
		if r, _ := Density(zeroCelsius + dt); r > func() float64 { r4, _ := Density(zeroCelsius + 4); return r4 }() {
			t.Errorf("ρ(%g °C) exceeds ρ(4 °C): the maximum is misplaced", dt)
		}
	}

	eps, err := Permittivity(T)
	if err != nil {
		t.Fatal(err)
	}
	// Malmberg & Maryott, J. Res. NBS 56 (1956) 1, abstract: 78.30 at 25 °C,
	// their fit within 0.01.
	if math.Abs(eps-78.30) > 0.01 {
		t.Errorf("ε(25 °C) = %.3f, want 78.30 (Malmberg & Maryott 1956)", eps)
	}
	// CRC / REFERENCE-DATA: ≈ 78.4; Malmberg & Maryott lie about 0.1 below the
	// modern value, so the check is within 0.15.
	if math.Abs(eps-78.4) > 0.15 {
		t.Errorf("ε(25 °C) = %.3f, want ≈ 78.4 (CRC) within 0.15", eps)
	}
	// Malmberg & Maryott's fitted equation at its end points: 87.740 at 0 °C; at 100 °C
	// 87.740 − 40.008 + 9.398 − 1.410 = 55.720.
	for _, c := range []struct{ t, want float64 }{{0, 87.740}, {100, 55.720}} {
		if e, _ := Permittivity(zeroCelsius + c.t); math.Abs(e-c.want) > 1e-9 {
			t.Errorf("ε(%g °C) = %.4f, want %.3f", c.t, e, c.want)
		}
	}
}

func TestWaterOutOfRange(t *testing.T) {
	tests := []struct {
		name string
		f    func(float64) (float64, error)
		T    float64
		of   string
	}{
		{"permittivity below 0 °C", Permittivity, 272, PermittivityCorrelation},
		{"permittivity above 100 °C", Permittivity, 373.2, PermittivityCorrelation},
		{"density above 150 °C", Density, 424, DensityCorrelation},
		{"density NaN", Density, math.NaN(), DensityCorrelation},
		{"b-dot above 100 °C", BDotAt, 400, BDotSource},
		{"A below 0 °C", DebyeHuckelA, 250, PermittivityCorrelation},
		{"B above 100 °C", DebyeHuckelB, 380, PermittivityCorrelation},
	}
	for _, tc := range tests {
		v, err := tc.f(tc.T)
		var re *RangeError
		if !errors.As(err, &re) {
			t.Errorf("%s: err = %v, want *RangeError", tc.name, err)
			continue
		}
		if v != 0 || re.Of != tc.of || re.Quantity != "temperature" {
			t.Errorf("%s: value %v, error %+v", tc.name, v, re)
		}
	}
	// Density is valid to 150 °C even though the permittivity stops at 100.
	if _, err := Density(zeroCelsius + 150); err != nil {
		t.Errorf("Density(150 °C): %v", err)
	}
	if _, err := ParamsAt(zeroCelsius + 120); err == nil {
		t.Error("ParamsAt(120 °C) succeeded beyond the permittivity correlation")
	}
	_, err := ParamsAt(500)
	if want := "temperature 500 K is outside the range of Malmberg & Maryott (1956) permittivity of water (273.15–373.15 K)"; err == nil || err.Error() != want {
		t.Errorf("error = %v\nwant    %s", err, want)
	}
}
