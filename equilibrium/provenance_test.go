package equilibrium

import (
	"math"
	"testing"

	"hess/network"
	"hess/thermo"
)

// Calcite dissolution with species data (demo values of the kind NBS82
// tabulates) and a measured log10 K of its own: the measured value answers,
// and the species' value is reported beside it.
const calciteOwn = `
species CaCO3(cr) { hf -1207.6 kJ/mol s 91.7 J/mol/K }
species Ca++(aq) { hf -543.0 kJ/mol s -56.2 J/mol/K }
species CO3--(aq) { hf -675.23 kJ/mol s -50.0 J/mol/K }
reaction calcite: CaCO3(cr) <-> Ca++(aq) + CO3--(aq) { logk -8.48 ± 0.02 }
`

func TestProvenanceOwnDataFirst(t *testing.T) {
	n := loadText(t, calciteOwn)
	r := ReactionTable(n, n.LookupReaction("calcite"), []float64{thermo.T298}).Rows[0]
	if !r.Valid || r.Basis != network.BasisReactionData || r.Basis.String() != "reaction" {
		t.Fatalf("row %+v, want from the reaction's own data", r)
	}
	if math.Abs(r.Log10K+8.48) > 1e-12 || math.Abs(r.SigmaLog10K-0.02) > 1e-12 {
		t.Errorf("log10 K = %.6f ± %.4f, want the measured −8.48 ± 0.02", r.Log10K, r.SigmaLog10K)
	}
	// The species give ΔrG° = ΣνΔfH° − T·ΣνS° by hand.
	dh := (-543.0 - 675.23 + 1207.6) * 1000
	ds := -56.2 - 50.0 - 91.7
	want := -(dh - thermo.T298*ds) / (thermo.R * thermo.T298 * math.Ln10)
	if math.Abs(r.SpeciesLog10K-want) > 1e-9 {
		t.Errorf("species log10 K = %.6f, by hand %.6f", r.SpeciesLog10K, want)
	}
	// The species alone still answer where asked for them.
	sp := n.ReactionK(n.LookupReaction("calcite")).SpeciesRow(thermo.T298)
	if !sp.Valid || sp.Basis != network.BasisSpecies || math.Abs(sp.Log10K-want) > 1e-9 {
		t.Errorf("species row %+v", sp)
	}
}

// TestVantHoffFromDhAndLogK: dh with one logk extrapolates like dh with dg,
// log10 K(T) = log10 K(T0) − ΔrH°/(R ln 10)·(1/T − 1/T0).
func TestVantHoffFromDhAndLogK(t *testing.T) {
	n := loadText(t, `
species ortho(aq) { formula C4H10 }
species para(aq) { formula C4H10 }
reaction ab: ortho(aq) <-> para(aq) { dh -20 kJ/mol logk 2.0 }
`)
	tb := ReactionTable(n, n.LookupReaction("ab"), []float64{298.15, 350, 450})
	for _, r := range tb.Rows {
		want := 2.0 + 20000/(thermo.R*math.Ln10)*(1/r.T-1/298.15)
		if !r.Valid || math.Abs(r.Log10K-want) > 1e-9 || math.Abs(r.DH+20000) > 1e-9 {
			t.Errorf("%g K: %+v, want log10 K %.6f", r.T, r, want)
		}
		if r.Extrapolated != (r.T > 398.15) {
			t.Errorf("%g K: extrapolated %v; dh with logk holds 298.15 K ± 100 K", r.T, r.Extrapolated)
		}
	}
	if math.Abs(tb.Tmin-198.15) > 1e-9 || math.Abs(tb.Tmax-398.15) > 1e-9 || tb.RangeSource != network.BasisReactionData {
		t.Errorf("range %g–%g K from %v", tb.Tmin, tb.Tmax, tb.RangeSource)
	}
}

// TestLogKFit: logk at several temperatures are fitted. Values made from
// log10 K = −12.5 + 1480/T + 3.9·log10 T at five temperatures are
// recovered with the three-term form; three values get the two-term form
// with its residual; the fit's range is the logk temperatures'.
func TestLogKFit(t *testing.T) {
	exact := func(T float64) float64 { return -12.5 + 1480/T + 3.9*math.Log10(T) }
	lks := []network.LogK{}
	for _, T := range []float64{298.15, 323.15, 348.15, 373.15, 398.15} {
		lks = append(lks, network.LogK{Value: network.Value{V: exact(T)}, T: T})
	}
	f := network.FitLogK(lks)
	if f == nil || f.Terms != 3 || math.Abs(f.A+12.5) > 1e-6 || math.Abs(f.B-1480) > 1e-4 || math.Abs(f.C-3.9) > 1e-6 {
		t.Fatalf("fit %+v", f)
	}
	if f.RMS > 1e-9 || f.Tmin != 298.15 || f.Tmax != 398.15 {
		t.Errorf("residual %g, range %g–%g", f.RMS, f.Tmin, f.Tmax)
	}
	// ΔrH° = R·(C·T − ln 10·B) against the numerical slope of ln K.
	T, h := 330.0, 1e-3
	lnK := func(T float64) float64 { return math.Ln10 * exact(T) }
	want := thermo.R * T * T * (lnK(T+h) - lnK(T-h)) / (2 * h)
	if got := f.DeltaH(T); math.Abs(got-want) > 1e-3 {
		t.Errorf("ΔrH°(330 K) = %.4f J/mol, slope gives %.4f", got, want)
	}
	three := network.FitLogK(lks[:3])
	if three == nil || three.Terms != 2 || !(three.RMS > 0) || three.MaxAbs <= 0 {
		t.Errorf("three-point fit %+v, want two terms with a residual", three)
	}
	if network.FitLogK(lks[:1]) != nil {
		t.Error("one logk is no fit")
	}

	n := loadText(t, `
species ortho(aq) { formula C4H10 }
species para(aq) { formula C4H10 }
reaction ab: ortho(aq) <-> para(aq) { logk 2.0 logk 1.75 at 323.15 K logk 1.55 at 348.15 K logk 1.38 at 373.15 K }
`)
	tb := ReactionTable(n, n.LookupReaction("ab"), []float64{298.15, 330, 400})
	if tb.Fit == nil || tb.Fit.Points != 4 || tb.Tmin != 298.15 || tb.Tmax != 373.15 || tb.RangeSource != network.BasisFit {
		t.Fatalf("table fit %+v over %g–%g K", tb.Fit, tb.Tmin, tb.Tmax)
	}
	if r := tb.Rows[0]; r.Basis != network.BasisReactionData || r.Log10K != 2.0 {
		t.Errorf("at a logk's own temperature: %+v, want the measured value", r)
	}
	if r := tb.Rows[1]; r.Basis != network.BasisFit || r.Extrapolated || math.Abs(r.Log10K-tb.Fit.Log10K(330)) > 1e-12 {
		t.Errorf("330 K: %+v", r)
	}
	if r := tb.Rows[2]; !r.Extrapolated || r.Basis != network.BasisFit {
		t.Errorf("400 K lies beyond the logk temperatures: %+v", r)
	}
	if !math.IsNaN(tb.Rows[1].SigmaLog10K) {
		t.Errorf("σ = %g, want unknown: no logk states an uncertainty", tb.Rows[1].SigmaLog10K)
	}
}

// TestEntropyFromHfAndGf: hf and gf without s give S° by arithmetic. Water
// vapour, NIST-JANAF (1998): ΔfH° = −241.826, ΔfG° = −228.582 kJ/mol,
// S° = 188.834 J/mol/K; CODATA element entropies H2 130.680, O2 205.152.
func TestEntropyFromHfAndGf(t *testing.T) {
	n := loadText(t, `
settings { temperatures 298.15 K, 350 K }
species H2(g) { hf 0 kJ/mol s 130.680 J/mol/K }
species O2(g) { hf 0 kJ/mol s 205.152 J/mol/K }
species H2O(g) { hf -241.826 kJ/mol gf -228.582 kJ/mol }
reaction w: H2(g) + 1/2 O2(g) <-> H2O(g)
`)
	s := n.LookupSpecies("H2O(g)").DerivedS()
	if s == nil || math.Abs(s.V-188.834) > 0.005 {
		t.Fatalf("derived S° = %v, want 188.834 J/mol/K (NIST-JANAF) within the rounding of hf and gf", s)
	}
	tb := ReactionTable(n, n.LookupReaction("w"), []float64{298.15, 350})
	for _, r := range tb.Rows {
		if !r.Valid || r.Basis != network.BasisSpecies {
			t.Errorf("%g K: %+v", r.T, r)
		}
	}
	// At 298.15 K, ΔrG° is gf itself.
	if got := tb.Rows[0].DG; math.Abs(got+228582) > 1e-6 {
		t.Errorf("ΔrG°(298.15 K) = %.3f J/mol, want −228582", got)
	}
}

// TestSigmaUnknownWithoutUncertainty: σ(log10 K) is unknown (NaN, null in
// JSON), not 0, when no datum states an uncertainty, and 0 when one states
// ± 0.
func TestSigmaUnknownWithoutUncertainty(t *testing.T) {
	n := loadText(t, `
species ortho(g) { formula C4H10 hf -10 kJ/mol s 100 J/mol/K }
species para(g) { formula C4H10 hf -20 kJ/mol s 100 J/mol/K }
species meta(g) { formula C4H10 hf -20 ± 0 kJ/mol s 100 J/mol/K }
reaction ab: ortho(g) <-> para(g)
reaction ac: ortho(g) <-> meta(g)
`)
	if r := ReactionTable(n, n.LookupReaction("ab"), []float64{298.15}).Rows[0]; !math.IsNaN(r.SigmaLog10K) {
		t.Errorf("ab: σ = %g, want unknown", r.SigmaLog10K)
	}
	if r := ReactionTable(n, n.LookupReaction("ac"), []float64{298.15}).Rows[0]; r.SigmaLog10K != 0 {
		t.Errorf("ac: σ = %g, want 0 (stated ± 0)", r.SigmaLog10K)
	}
}

// TestCancellingSides: a reaction whose sides cancel has ΔrG° = 0 and
// K = 1 at every temperature.
func TestCancellingSides(t *testing.T) {
	n := loadText(t, `
species N2(g) { hf 0 kJ/mol s 191.609 J/mol/K }
reaction idle: N2(g) <-> N2(g)
`)
	for _, r := range ReactionTable(n, n.LookupReaction("idle"), []float64{298.15, 5000}).Rows {
		if !r.Valid || r.DG != 0 || r.K != 1 || r.Log10K != 0 {
			t.Errorf("%g K: %+v, want ΔrG° = 0, K = 1", r.T, r)
		}
	}
}

// TestEveryEquilibriumTemperature: where K(T) = Q twice inside the data's
// range, both temperatures are given. ΔrCp° = 500 J/mol/K with ΔrH° = ΔrS°
// = 0 at 298.15 K makes ΔrG°(T) = ΔrCp°·[(T − T0) − T ln(T/T0)], a cap with
// its top at T0; Q = 0.525/0.475 meets it on both sides.
func TestEveryEquilibriumTemperature(t *testing.T) {
	n := loadText(t, `
species ortho(g) { formula C4H10 hf 0 kJ/mol s 100 J/mol/K cp 10 J/mol/K }
species para(g) { formula C4H10 hf 0 kJ/mol s 100 J/mol/K cp 510 J/mol/K }
reaction ab: ortho(g) <-> para(g)
mixture m { temperature 300 K pressure 1 bar ortho(g) 0.475 para(g) 0.525 }
`)
	a := Approach(n, n.Mixtures[0])
	r := a.Reactions[0]
	if len(r.EquilibriumTs) != 2 {
		t.Fatalf("equilibrium temperatures %v, want two", r.EquilibriumTs)
	}
	lnQ := math.Log(0.525 / 0.475)
	for _, T := range r.EquilibriumTs {
		dg := 500*((T-thermo.T298)-T*math.Log(T/thermo.T298)) + thermo.R*T*lnQ
		if math.Abs(dg) > 1e-3 || T < thermo.ConstTmin || T > thermo.ConstTmax {
			t.Errorf("T_eq %.4f K: ΔrG = %g J/mol, range %g–%g K", T, dg, r.Tmin, r.Tmax)
		}
	}
	if !(r.EquilibriumTs[0] < thermo.T298 && r.EquilibriumTs[1] > thermo.T298) || r.EquilibriumT != r.EquilibriumTs[1] {
		t.Errorf("T_eq %v, nearest %g", r.EquilibriumTs, r.EquilibriumT)
	}
}
