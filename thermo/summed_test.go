package thermo

import (
	"math"
	"testing"
)

// summedCases are reactions over every kind of model SummedDeltaG sums or
// passes through: multi-range Shomate and NASA 7-term fits (the test
// fixtures of reference_data_test.go), a single range, a piecewise model
// with a gap between its ranges, and constant-Cp data.
func summedCases(t *testing.T) map[string]Reaction {
	t.Helper()
	gapped := joinedShomate(t, [2]float64{298, 900}, [2]float64{1100, 3000}, 2)
	constant, err := NewConstantCp(-50e3, 180, 40)
	if err != nil {
		t.Fatal(err)
	}
	return map[string]Reaction{
		"shomate": {Terms: []Term{
			{Nu: -1, Model: shomateModel(t, "CH4")}, {Nu: -1, Model: shomateModel(t, "H2O")},
			{Nu: 1, Model: shomateModel(t, "CO")}, {Nu: 3, Model: shomateModel(t, "H2")},
		}},
		"nasa7": {Terms: []Term{
			{Nu: -2, Model: nasa7Model(t, "H2")}, {Nu: -1, Model: nasa7Model(t, "O2")},
			{Nu: 2, Model: nasa7Model(t, "H2O")},
		}},
		"mixed": {Terms: []Term{
			{Nu: -1, Model: shomateModel(t, "CO")}, {Nu: -1, Model: nasa7Model(t, "H2O")},
			{Nu: 1, Model: shomateModel(t, "CO2")}, {Nu: 1, Model: nasa7Model(t, "H2")},
			{Nu: 0.5, Model: gapped}, {Nu: -0.5, Model: shomateWB["N2"][0]},
			{Nu: 0.25, Model: constant}, {Nu: 0, Model: nil},
		}},
	}
}

// TestSummedDeltaGAgrees compares SummedDeltaG with DeltaG on a fine grid
// that crosses every range boundary, runs outside the data, and goes back
// down again, so that the kept sums are chosen afresh both ways.
func TestSummedDeltaGAgrees(t *testing.T) {
	for name, r := range summedCases(t) {
		fast := r.SummedDeltaG()
		var temps []float64
		for T := 100.0; T <= 7000; T += 0.7 {
			temps = append(temps, T)
		}
		temps = append(temps, 298, 900, 1000, 1100, 1200, 1700, 3000, 3500, 6000, 150, 5000, 1000)
		for _, T := range temps {
			want, got := r.DeltaG(T), fast(T)
			scale := 0.0
			for _, tm := range r.Terms {
				if tm.Model != nil {
					scale += math.Abs(tm.Nu * tm.Model.G(T))
				}
			}
			if math.Abs(got-want) > 1e-12*scale+1e-9 {
				t.Fatalf("%s at %g K: summed ΔrG° = %.12g J/mol, term by term %.12g", name, T, got, want)
			}
		}
		if g := fast(-1); !math.IsNaN(g) {
			t.Errorf("%s at -1 K: %g, want NaN", name, g)
		}
	}
	nilModel := Reaction{Terms: []Term{{Nu: 1, Model: nil}}}
	if g := nilModel.SummedDeltaG()(500); !math.IsNaN(g) {
		t.Errorf("a term without a model gives %g, want NaN", g)
	}
}

// TestScanCrossoversMatches finds the crossovers of each case, shifted so
// that ΔrG° changes sign inside the data, by scanning the summed ΔrG° and
// by scanning DeltaG itself: the two must give the same temperatures.
func TestScanCrossoversMatches(t *testing.T) {
	for name, r := range summedCases(t) {
		// A constant term that puts a sign change at 1234.5 K.
		shift, err := NewConstant(-r.DeltaG(1234.5), 0)
		if err != nil {
			t.Fatal(err)
		}
		r.Terms = append(r.Terms, Term{Nu: 1, Model: shift})
		want := Crossovers(r.DeltaG, 300, 3000)
		got := ScanCrossovers(r.SummedDeltaG(), r.DeltaG, 300, 3000)
		if len(want) == 0 {
			t.Fatalf("%s: no crossover found", name)
		}
		if len(got) != len(want) {
			t.Fatalf("%s: %d crossovers by the summed scan, %d by DeltaG", name, len(got), len(want))
		}
		for i := range want {
			if got[i] != want[i] {
				t.Errorf("%s: crossover %d at %+v by the summed scan, %+v by DeltaG", name, i, got[i], want[i])
			}
		}
	}
}
