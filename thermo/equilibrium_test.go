package thermo

import (
	"math"
	"testing"
)

func wgs(t testing.TB) Reaction {
	return Reaction{Terms: []Term{
		gas(-1, shomateModel(t, "CO")), gas(-1, shomateModel(t, "H2O")),
		gas(1, shomateModel(t, "CO2")), gas(1, shomateModel(t, "H2")),
	}}
}

func smr(t testing.TB) Reaction {
	return Reaction{Terms: []Term{
		gas(-1, shomateModel(t, "CH4")), gas(-1, shomateModel(t, "H2O")),
		gas(1, shomateModel(t, "CO")), gas(3, shomateModel(t, "H2")),
	}}
}

func ammonia(t testing.TB, scale float64) Reaction {
	return Reaction{Terms: []Term{
		gas(-scale, shomateModel(t, "N2")), gas(-3*scale, shomateModel(t, "H2")),
		gas(2*scale, shomateModel(t, "NH3")),
	}}
}

// log10 K check values, REFERENCE-DATA §3: Σν·log10 Kf from NIST-JANAF 1998
// (derived, p° = 1 bar, ±0.002 from the tables' rounding: each log Kf is
// printed to three decimals). The WebBook Shomate fits reproduce JANAF within
// that at every temperature checked, so the tolerance is the rounding alone.
const log10KTol = 0.002

func TestLog10KFromShomate(t *testing.T) {
	tests := []struct {
		name string
		r    Reaction
		want map[float64]float64
	}{
		{"water-gas shift CO + H2O ⇌ CO2 + H2", wgs(t), map[float64]float64{
			500: 2.139, 600: 1.453, 700: 0.975, 800: 0.626, 900: 0.364,
			1000: 0.158, 1100: -0.004, 1200: -0.136, 1500: -0.412,
		}},
		{"steam methane reforming CH4 + H2O ⇌ CO + 3 H2", smr(t), map[float64]float64{
			500: -10.068, 600: -6.304, 700: -3.577, 800: -1.509, 900: 0.113,
			1000: 1.419, 1100: 2.494, 1200: 3.391, 1500: 5.373,
		}},
		{"½N2 + 3/2 H2 ⇌ NH3", ammonia(t, 0.5), map[float64]float64{
			298.15: 2.867, 500: -0.501, 600: -1.382, 700: -2.029, 800: -2.524,
			900: -2.916, 1000: -3.234, 1100: -3.496, 1200: -3.716, 1500: -4.203,
		}},
	}
	for _, tc := range tests {
		for T, want := range tc.want {
			if got := tc.r.Log10K(T); math.Abs(got-want) > log10KTol {
				t.Errorf("%s at %g K: log10 K = %.4f, want %.3f ± %.2f (REFERENCE-DATA §3, derived from JANAF)",
					tc.name, T, got, want, log10KTol)
			}
		}
	}
}

func TestAmmoniaSynthesisK(t *testing.T) {
	// N2 + 3 H2 ⇌ 2 NH3, K in bar⁻², REFERENCE-DATA §3 (derived from JANAF log Kf,
	// three significant figures). Tolerance: the JANAF rounding of log10 K
	// (twice ½N2 + 3/2H2's 0.002, since K here is for 2 NH3) plus the
	// rounding of K to three figures, at most log10(1.005/1.00) = 0.0022.
	want := map[float64]float64{
		298.15: 5.42e5, 500: 0.0995, 600: 1.72e-3, 700: 8.75e-5, 800: 8.95e-6,
		900: 1.47e-6, 1000: 3.40e-7, 1100: 1.02e-7, 1200: 3.70e-8, 1500: 3.93e-9,
	}
	r := ammonia(t, 1)
	if dn := r.DeltaNGas(); dn != -2 {
		t.Fatalf("Δn = %g, want -2", dn)
	}
	for T, k := range want {
		if got := r.K(T); math.Abs(math.Log10(got/k)) > 2*log10KTol+0.0022 {
			t.Errorf("K(%g K) = %.3g bar⁻², want %.3g (REFERENCE-DATA §3, derived)", T, got, k)
		}
	}
}

func TestKc(t *testing.T) {
	r := smr(t)
	if dn := r.DeltaNGas(); dn != 2 {
		t.Fatalf("SMR Δn = %g, want 2", dn)
	}
	// At 1000 K, log10 K(SMR) = 1.419 (REFERENCE-DATA §3, derived); Kc follows
	// from the definition Kc = K·(p°/(R·T·c°))^Δn with p° = 10⁵ Pa, c° = 1000 mol/m³
	// and R = 8.314 462 618 153 24 J/(mol·K) (SI 2019).
	const T = 1000.0
	x := 1e5 / (8.31446261815324 * T * 1000)
	want := math.Pow(10, 1.419) * x * x
	if got := r.Kc(T, Bar); math.Abs(math.Log10(got/want)) > log10KTol {
		t.Errorf("Kc(1000 K) = %.4g (mol/L)², want %.4g", got, want)
	}
	if got, exact := r.Kc(T, Bar), r.K(T)*x*x; math.Abs(got/exact-1) > 1e-12 {
		t.Errorf("Kc = %.15g, K·(p°/RTc°)² = %.15g", got, exact)
	}
	if r.Kc(T, 0) != r.Kc(T, Bar) {
		t.Error("Kc with p0 = 0 does not default to 1 bar")
	}
	if got := r.Kc(T, Atm) / r.Kc(T, Bar); math.Abs(got-1.01325*1.01325) > 1e-12 {
		t.Errorf("Kc(atm)/Kc(bar) = %.15g, want 1.01325²", got)
	}
	if got := r.KcSI(T, Bar) / r.Kc(T, Bar); math.Abs(got/1e6-1) > 1e-12 {
		t.Errorf("KcSI/Kc = %g, want (1000 mol/m³ per mol/L)² = 1e6", got)
	}
	if w := wgs(t); w.Kc(T, Bar) != w.K(T) {
		t.Errorf("WGS (Δn = 0): Kc = %g differs from K = %g", w.Kc(T, Bar), w.K(T))
	}
}

func TestCrossoversFromShomate(t *testing.T) {
	// REFERENCE-DATA §3 (derived by linear interpolation of ΔrG° between JANAF
	// rows): K_WGS = 1 at ≈1097 K, K_SMR = 1 at ≈892 K, Kf(NH3) = 1 at ≈455 K. The
	// interpolation is good to a few kelvin.
	tests := []struct {
		name         string
		r            Reaction
		lo, hi, want float64
		favoredAbove bool
	}{
		{"WGS", wgs(t), 500, 1500, 1097, false},
		{"SMR", smr(t), 500, 1500, 892, true},
		{"½N2 + 3/2 H2 ⇌ NH3", ammonia(t, 0.5), 298.15, 1000, 455, false},
	}
	for _, tc := range tests {
		cs := Crossovers(tc.r.DeltaG, tc.lo, tc.hi)
		if len(cs) != 1 {
			t.Errorf("%s: crossovers %+v, want one", tc.name, cs)
			continue
		}
		c := cs[0]
		if math.Abs(c.T-tc.want) > 3 || c.FavoredAbove != tc.favoredAbove {
			t.Errorf("%s: crossover %.2f K favoredAbove %v, want %g ± 3 K, %v (REFERENCE-DATA §3)",
				tc.name, c.T, c.FavoredAbove, tc.want, tc.favoredAbove)
		}
		if g := tc.r.DeltaG(c.T); math.Abs(g) > 0.01*math.Abs(tc.r.DeltaS(c.T)) {
			t.Errorf("%s: ΔrG°(%.4f K) = %g J/mol, not zero within 0.01 K", tc.name, c.T, g)
		}
	}
	// The WGS reaction's range is set by H2O(g), whose fit starts at 500 K.
	if lo, hi := wgs(t).Range(); lo != 500 || hi != 6000 {
		t.Errorf("WGS range %g–%g K, want 500–6000", lo, hi)
	}
}

// Calcite decomposition CaCO3(cr) ⇌ CaO(cr) + CO2(g) with constant ΔH°, ΔS°
// from NBS82 298.15 K data (ΔfH° kJ/mol, S° J/(mol·K)): CaCO3 −1206.92, 92.9;
// CaO −635.09, 39.75; CO2 −393.509, 213.74.
func calcite(t *testing.T) Reaction {
	t.Helper()
	mk := func(hf, s float64) Model {
		m, err := NewConstant(1000*hf, s)
		if err != nil {
			t.Fatal(err)
		}
		return m
	}
	return Reaction{Terms: []Term{
		{Nu: -1, Model: mk(-1206.92, 92.9), Activity: ActivityPureSolid},
		{Nu: 1, Model: mk(-635.09, 39.75), Activity: ActivityPureSolid},
		gas(1, mk(-393.509, 213.74)),
	}}
}

func TestConstantCrossover(t *testing.T) {
	r := calcite(t)
	dh, ds := r.DeltaH(T298), r.DeltaS(T298)
	// NBS82 derived (REFERENCE-DATA §3): ΔrH° = 178.321 kJ, ΔrS° = 160.59 J/K.
	if math.Abs(dh-178321) > 0.5 || math.Abs(ds-160.59) > 0.005 {
		t.Errorf("ΔrH° = %.1f J/mol, ΔrS° = %.3f J/(mol·K); want 178321, 160.59", dh, ds)
	}
	// The root search itself, over a span wide enough to hold the root (the
	// constant data's own range, 298.15 K ± DefaultSpan, does not).
	cs := Crossovers(r.DeltaG, 10, 10000)
	if len(cs) != 1 {
		t.Fatalf("crossovers %+v, want one", cs)
	}
	if want := dh / ds; math.Abs(cs[0].T-want) > 0.01 || !cs[0].FavoredAbove {
		t.Errorf("crossover %.4f K favoredAbove %v, want ΔrH°/ΔrS° = %.4f K, true", cs[0].T, cs[0].FavoredAbove, want)
	}
	// REFERENCE-DATA §3: "K = 1 at 1110 K" (derived, NBS82 at 298 K only).
	if math.Abs(cs[0].T-1110) > 1 {
		t.Errorf("crossover %.2f K, want ≈1110 K", cs[0].T)
	}
	if r.Kind() != KindKp || r.DeltaNGas() != 1 {
		t.Errorf("calcite: kind %s Δn %g, want Kp, 1", r.Kind(), r.DeltaNGas())
	}
}

func TestReactionAt298FromJANAF(t *testing.T) {
	// Water-gas shift from NIST-JANAF 1998 298.15 K values (§2a, ΔfH° kJ/mol, S°
	// J/(mol·K)); REFERENCE-DATA §3 (derived): ΔrH° = −41.169, ΔrG° = −28.644 kJ/mol.
	mk := func(hf, s float64) Model {
		m, err := NewConstant(1000*hf, s)
		if err != nil {
			t.Fatal(err)
		}
		return m
	}
	r := Reaction{Terms: []Term{
		gas(-1, mk(-110.527, 197.653)), gas(-1, mk(-241.826, 188.834)),
		gas(1, mk(-393.522, 213.795)), gas(1, mk(0, 130.680)),
	}}
	if got := r.DeltaH(T298) / 1000; math.Abs(got+41.169) > 0.0015 {
		t.Errorf("ΔrH° = %.4f kJ/mol, want −41.169", got)
	}
	if got := r.DeltaG(T298) / 1000; math.Abs(got+28.644) > 0.002 {
		t.Errorf("ΔrG° = %.4f kJ/mol, want −28.644", got)
	}
	// log10 K(298.15) = 5.018 (REFERENCE-DATA §3, derived from JANAF log Kf).
	if got := r.Log10K(T298); math.Abs(got-5.018) > 0.002 {
		t.Errorf("log10 K = %.4f, want 5.018", got)
	}
}

func TestGibbsOnlyReactions(t *testing.T) {
	gf := func(v float64) Model {
		m, err := NewGibbsOnly(1000 * v)
		if err != nil {
			t.Fatal(err)
		}
		return m
	}
	// NBS82 ΔfG° (kJ/mol): AgCl(s) −109.789, Ag+(aq) 77.107, Cl−(aq) −131.228,
	// H2O(l) −237.129, OH−(aq) −157.244, H+(aq) 0. REFERENCE-DATA §3 (derived):
	// pKsp(AgCl) = 9.753, pKw = 13.995.
	agcl := Reaction{Terms: []Term{
		{Nu: -1, Model: gf(-109.789), Activity: ActivityPureSolid},
		{Nu: 1, Model: gf(77.107), Activity: ActivitySolute},
		{Nu: 1, Model: gf(-131.228), Activity: ActivitySolute},
	}}
	water := Reaction{Terms: []Term{
		{Nu: -1, Model: gf(-237.129), Activity: ActivityPureLiquid},
		{Nu: 1, Model: gf(0), Activity: ActivitySolute},
		{Nu: 1, Model: gf(-157.244), Activity: ActivitySolute},
	}}
	tests := []struct {
		name string
		r    Reaction
		pK   float64
		kind Kind
	}{
		{"AgCl(s) ⇌ Ag+ + Cl−", agcl, 9.753, KindKsp},
		{"H2O(l) ⇌ H+ + OH−", water, 13.995, KindKc},
	}
	for _, tc := range tests {
		if got := -tc.r.Log10K(T298); math.Abs(got-tc.pK) > 0.001 {
			t.Errorf("%s: pK = %.4f, want %.3f (REFERENCE-DATA §3)", tc.name, got, tc.pK)
		}
		if got := tc.r.Kind(); got != tc.kind {
			t.Errorf("%s: kind %s, want %s", tc.name, got, tc.kind)
		}
		if !math.IsNaN(tc.r.DeltaG(300)) || !math.IsNaN(tc.r.DeltaH(T298)) {
			t.Errorf("%s: gf-only data gave ΔrG°(300 K) = %g, ΔrH° = %g; want NaN", tc.name, tc.r.DeltaG(300), tc.r.DeltaH(T298))
		}
		if lo, hi := tc.r.Range(); lo != T298 || hi != T298 {
			t.Errorf("%s: range %g–%g, want the single point 298.15 K", tc.name, lo, hi)
		}
		if cs := Crossovers(tc.r.DeltaG, 250, 350); len(cs) != 0 {
			t.Errorf("%s: crossovers %+v from 298.15 K data alone", tc.name, cs)
		}
	}
	// 25 °C read through the unit parser is still the reference temperature.
	u, _ := ParseUnit("degC")
	if got := -agcl.Log10K(u.ToSI(25)); math.Abs(got-9.753) > 0.001 {
		t.Errorf("pKsp at 25 degC = %v", got)
	}
}
