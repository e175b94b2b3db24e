package thermo

import (
	"math"
	"testing"
)

func mustUnit(t testing.TB, s string) Unit {
	t.Helper()
	u, err := ParseUnit(s)
	if err != nil {
		t.Fatal(err)
	}
	return u
}

func TestQuantitySI(t *testing.T) {
	// CODATA key value ΔfH°(CO2, g) = −393.51 ± 0.13 kJ/mol (REFERENCE-DATA §2a).
	tests := []struct {
		q         Quantity
		v, sigma  float64
		formatted string
	}{
		{Quantity{-393.51, 0.13, mustUnit(t, "kJ/mol")}, -393510, 130, "-393.51 ± 0.13 kJ/mol"},
		{Quantity{-94.05, 0.03, mustUnit(t, "kcal/mol")}, -94.05 * 4184, 0.03 * 4184, "-94.05 ± 0.03 kcal/mol"},
		{Quantity{25, 0.5, mustUnit(t, "degC")}, 298.15, 0.5, "25 ± 0.5 degC"},
		{Quantity{760, 0, mustUnit(t, "Torr")}, 101325, 0, "760 Torr"},
	}
	for _, tc := range tests {
		v, s := tc.q.SI()
		if math.Abs(v-tc.v) > 1e-9*math.Abs(tc.v) || math.Abs(s-tc.sigma) > 1e-9*tc.sigma {
			t.Errorf("%v: SI = %v ± %v, want %v ± %v", tc.q, v, s, tc.v, tc.sigma)
		}
		if got := tc.q.String(); got != tc.formatted {
			t.Errorf("String() = %q, want %q", got, tc.formatted)
		}
	}
}

func TestQuantityIn(t *testing.T) {
	q := Quantity{1, 0.1, mustUnit(t, "atm")}
	b, err := q.In(mustUnit(t, "bar"))
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(b.Value-1.01325) > 1e-12 || math.Abs(b.Sigma-0.101325) > 1e-12 {
		t.Errorf("1 ± 0.1 atm = %v", b)
	}
	c, err := Quantity{300, 1, mustUnit(t, "K")}.In(mustUnit(t, "°C"))
	if err != nil || math.Abs(c.Value-26.85) > 1e-9 || c.Sigma != 1 {
		t.Errorf("300 ± 1 K = %v, %v; want 26.85 ± 1 °C", c, err)
	}
	if _, err := q.In(mustUnit(t, "kJ/mol")); err == nil {
		t.Error("atm to kJ/mol gave no error")
	}
}
