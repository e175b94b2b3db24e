package thermo

import (
	"math"
	"strings"
	"testing"
)

// Two ranges with the same parameters except A, which is larger by dA above the
// join: then exactly ΔCp = dA, ΔH = T·dA, ΔS = dA·ln(T/1000) at any T (the NIST
// Shomate form; the parameters are CO's WebBook low range, used as test input).
func joinedShomate(t *testing.T, lo, hi [2]float64, dA float64) *Piecewise {
	t.Helper()
	c := shomateWB["CO"][0].Coef
	up := c
	up[0] += dA
	m, err := NewShomate(ShomateRange{hi[0], hi[1], up}, ShomateRange{lo[0], lo[1], c})
	if err != nil {
		t.Fatal(err)
	}
	return m
}

func TestJoins(t *testing.T) {
	tests := []struct {
		name     string
		lo, hi   [2]float64
		kind     JoinKind
		gap, atT float64
	}{
		{"meet", [2]float64{298, 1300}, [2]float64{1300, 3000}, JoinMeet, 0, 1300},
		{"gap", [2]float64{298, 1000}, [2]float64{1100, 3000}, JoinGap, 100, 1050},
		{"overlap", [2]float64{298, 1200}, [2]float64{1000, 3000}, JoinOverlap, -200, 1100},
	}
	const dA = 1.5
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			m := joinedShomate(t, tc.lo, tc.hi, dA)
			js := m.Joins()
			if len(js) != 1 {
				t.Fatalf("Joins() gave %d joins, want 1", len(js))
			}
			j := js[0]
			if j.Kind != tc.kind || j.Gap != tc.gap || j.T != tc.atT || j.Lower != 0 || j.Upper != 1 {
				t.Errorf("join = %+v, want kind %v gap %g at %g K", j, tc.kind, tc.gap, tc.atT)
			}
			if j.LowerTmax != tc.lo[1] || j.UpperTmin != tc.hi[0] {
				t.Errorf("bounds %g, %g; want %g, %g", j.LowerTmax, j.UpperTmin, tc.lo[1], tc.hi[0])
			}
			if math.Abs(j.DCp-dA) > 1e-9 || math.Abs(j.DH-tc.atT*dA) > 1e-6 ||
				math.Abs(j.DS-dA*math.Log(tc.atT/1000)) > 1e-9 {
				t.Errorf("jumps Cp %g H %g S %g; want %g, %g, %g",
					j.DCp, j.DH, j.DS, dA, tc.atT*dA, dA*math.Log(tc.atT/1000))
			}
		})
	}
}

func TestJoinsOfPublishedFits(t *testing.T) {
	// The WebBook CO2 ranges meet at 1200 K. Each range is within the fits'
	// accuracy of NIST-JANAF there (REFERENCE-DATA §1 verification: |ΔCp| ≤ 0.05
	// except CH4, |ΔS| ≤ 0.02 J/(mol·K), |Δ(H−H298)| ≤ 0.056 kJ/mol), so the jumps
	// between them cannot exceed twice those.
	js := shomateModel(t, "CO2").Joins()
	if len(js) != 1 || js[0].Kind != JoinMeet || js[0].T != 1200 {
		t.Fatalf("CO2 joins = %+v, want one meeting at 1200 K", js)
	}
	j := js[0]
	if math.Abs(j.DCp) > 0.1 || math.Abs(j.DS) > 0.04 || math.Abs(j.DH) > 112 {
		t.Errorf("CO2 join jumps Cp %.4f S %.4f H %.1f J/mol are larger than the fits' accuracy", j.DCp, j.DS, j.DH)
	}
	if got := len(shomateModel(t, "H2").Joins()); got != 2 {
		t.Errorf("H2 has %d joins, want 2", got)
	}
}

func TestPiecewiseChoosesRange(t *testing.T) {
	m := joinedShomate(t, [2]float64{298, 1000}, [2]float64{1100, 3000}, 1)
	lo, hi := m.Pieces()[0], m.Pieces()[1]
	tests := []struct {
		T    float64
		want Model
	}{
		{200, lo}, {298, lo}, {1000, lo}, {1040, lo}, {1060, hi}, {1100, hi}, {5000, hi},
	}
	for _, tc := range tests {
		if got, want := m.Cp(tc.T), tc.want.Cp(tc.T); got != want {
			t.Errorf("Cp(%g) = %g, want %g from the nearest range", tc.T, got, want)
		}
	}
	if a, b := m.Range(); a != 298 || b != 3000 {
		t.Errorf("Range() = %g, %g; want 298, 3000", a, b)
	}
}

func TestNewPiecewiseErrors(t *testing.T) {
	if _, err := NewPiecewise(); err == nil {
		t.Error("NewPiecewise() with no ranges gave no error")
	}
	if _, err := NewPiecewise(nil); err == nil || !strings.Contains(err.Error(), "no model") {
		t.Errorf("NewPiecewise(nil) error = %v", err)
	}
	g, _ := NewGibbsOnly(-1)
	if _, err := NewPiecewise(g); err == nil || !strings.Contains(err.Error(), "not below") {
		t.Errorf("NewPiecewise(gf-only) error = %v, want a range error", err)
	}
}
