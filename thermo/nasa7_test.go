package thermo

import (
	"math"
	"strings"
	"testing"
)

func TestNASA7AgainstJANAF(t *testing.T) {
	// Agreement the NASA sets (from memory) have with NIST-JANAF 1998, as stated in
	// REFERENCE-DATA §5 (derived): CO2, H2, O2 within 0.14 J/(mol·K) in Cp and 0.06
	// in S; H2O within 0.03 up to 1000 K. H: NASA's ΔfH°298(CO2) = −393.510 kJ/mol
	// against JANAF's −393.522, so H is held to 0.02 kJ/mol.
	tols := map[string]struct{ cp, s float64 }{
		"CO2": {0.14, 0.06}, "H2": {0.14, 0.06}, "O2": {0.14, 0.06}, "H2O": {0.03, 0.03},
	}
	const hTol = 20.0 // J/mol
	for _, r := range janafRows {
		tol, ok := tols[r.species]
		if !ok || (r.T != 298.15 && r.T != 1000) {
			continue
		}
		m := nasa7Model(t, r.species)
		hi := NASA7Range{1000, 3500, nasa7Memory[r.species][1]}
		evals := map[string]Model{"piecewise": m}
		if r.T == 1000 {
			evals["upper range"] = hi // both sides of the 1000 K join
		}
		for name, e := range evals {
			if got := e.Cp(r.T); math.Abs(got-r.cp) > tol.cp {
				t.Errorf("%s %s %g K: Cp = %.3f, want %.3f ± %.2f (%s)", r.species, name, r.T, got, r.cp, tol.cp, r.source)
			}
			if got := e.S(r.T); math.Abs(got-r.s) > tol.s {
				t.Errorf("%s %s %g K: S = %.3f, want %.3f ± %.2f (%s)", r.species, name, r.T, got, r.s, tol.s, r.source)
			}
			want := 1000 * (janafHf298[r.species] + r.dh)
			if got := e.H(r.T); math.Abs(got-want) > hTol {
				t.Errorf("%s %s %g K: H = %.1f J/mol, want %.1f ± %.0f (%s)", r.species, name, r.T, got, want, hTol, r.source)
			}
		}
	}
}

func TestNASA7At298(t *testing.T) {
	// H2O(g) 298.15 K: NIST-JANAF 1998 Cp 33.590, S 188.834, ΔfH −241.826 (§2a), and
	// the NASA sets evaluated (REFERENCE-DATA §5 derived check, 3 decimals).
	tests := []struct {
		species  string
		cp, s, h float64 // J/(mol·K), J/(mol·K), kJ/mol
	}{
		{"H2O", 33.588, 188.828, -241.825},
		{"CO2", 37.135, 213.786, -393.508},
		{"H2", 28.836, 130.680, 0},
		{"O2", 29.378, 205.148, 0},
	}
	for _, tc := range tests {
		m := nasa7Model(t, tc.species)
		if got := m.Cp(T298); math.Abs(got-tc.cp) > 0.0006 {
			t.Errorf("%s Cp(298.15) = %.4f, want %.3f (REFERENCE-DATA §5, derived)", tc.species, got, tc.cp)
		}
		if got := m.S(T298); math.Abs(got-tc.s) > 0.0006 {
			t.Errorf("%s S(298.15) = %.4f, want %.3f (REFERENCE-DATA §5, derived)", tc.species, got, tc.s)
		}
		if got := m.H(T298) / 1000; math.Abs(got-tc.h) > 0.0006 {
			t.Errorf("%s H(298.15) = %.4f kJ/mol, want %.3f (REFERENCE-DATA §5, derived)", tc.species, got, tc.h)
		}
	}
	// The 298.15 K water row against JANAF itself: within the §5 agreement, 0.03.
	w := nasa7Model(t, "H2O")
	if got := w.Cp(T298); math.Abs(got-33.590) > 0.03 {
		t.Errorf("H2O Cp(298.15) = %.3f, want 33.590 (NIST-JANAF 1998 H-064)", got)
	}
	if got := w.S(T298); math.Abs(got-188.834) > 0.03 {
		t.Errorf("H2O S(298.15) = %.3f, want 188.834 (NIST-JANAF 1998 H-064)", got)
	}
}

func TestNASA7Errors(t *testing.T) {
	c := nasa7Memory["H2"][0]
	bad := c
	bad[6] = math.Inf(-1)
	tests := []struct {
		name   string
		ranges []NASA7Range
		want   string
	}{
		{"none", nil, "no ranges"},
		{"reversed", []NASA7Range{{1000, 200, c}}, "Tmin 1000 K is not below Tmax 200 K"},
		{"negative Tmin", []NASA7Range{{-1, 200, c}}, "not above 0 K"},
		{"infinite a7", []NASA7Range{{200, 1000, c}, {1000, 3500, bad}}, "nasa7 range 2: a7 is -Inf"},
	}
	for _, tc := range tests {
		_, err := NewNASA7(tc.ranges...)
		if err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s: error = %v, want one containing %q", tc.name, err, tc.want)
		}
	}
}
