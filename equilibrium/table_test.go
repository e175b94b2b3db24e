package equilibrium

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"hess/network"
	"hess/thermo"
)

// tableOf compiles src (see loadThermo) and returns the named reaction's
// table at temps.
func tableOf(t *testing.T, src, name string, temps ...float64) *Table {
	t.Helper()
	n := loadThermo(t, src)
	rx := n.LookupReaction(name)
	if rx == nil {
		t.Fatalf("no reaction %s", name)
	}
	return ReactionTable(n, rx, temps)
}

func rowAt(t *testing.T, tb *Table, T float64) network.TableRow {
	t.Helper()
	for _, r := range tb.Rows {
		if r.T == T {
			return r
		}
	}
	t.Fatalf("%s: no row at %g K", tb.Reaction.Name, T)
	return network.TableRow{}
}

// log10 K check values, REFERENCE-DATA.md §3: Σν·log10 Kf of NIST-JANAF 1998
// (derived, p° = 1 bar). log Kf is printed to 3 decimals, so the values
// carry ±0.002; the WebBook Shomate fits add up to 0.001.
const janafLog10KTol = 0.003

const shomateReactions = `
include "webbook-shomate.hess"
reaction shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)
reaction reform: CH4(g) + H2O(g) <-> CO(g) + 3 H2(g)
reaction ammonia: N2(g) + 3 H2(g) <-> 2 NH3(g)
`

// TestGasReactionsAgainstJANAF checks K of gas reactions computed end to end
// from the WebBook Shomate data in a .hess network against NIST-JANAF.
func TestGasReactionsAgainstJANAF(t *testing.T) {
	temps := []float64{600, 700, 800, 900, 1000, 1100, 1200}
	tests := []struct {
		name     string
		kind     string
		quotient string
		dn       float64
		log10K   []float64 // at temps, REFERENCE-DATA.md §3 (derived from JANAF)
	}{
		// Water-gas shift, Δn = 0.
		{"shift", "Kp", "p(CO2) p(H2) / (p(CO) p(H2O))", 0,
			[]float64{1.453, 0.975, 0.626, 0.364, 0.158, -0.004, -0.136}},
		// Steam methane reforming, Δn = +2.
		{"reform", "Kp", "p(CO) p(H2)^3 / (p(CH4) p(H2O))", 2,
			[]float64{-6.304, -3.577, -1.509, 0.113, 1.419, 2.494, 3.391}},
	}
	for _, tc := range tests {
		tb := tableOf(t, shomateReactions, tc.name, temps...)
		if tb.Kind != tc.kind || tb.Quotient != tc.quotient || tb.DeltaGasMoles != tc.dn {
			t.Errorf("%s: kind %s, quotient %q, Δn %g; want %s, %q, %g", tc.name, tb.Kind, tb.Quotient, tb.DeltaGasMoles, tc.kind, tc.quotient, tc.dn)
		}
		for i, r := range tb.Rows {
			if !r.Valid || r.Extrapolated || r.Basis != network.BasisSpecies {
				t.Errorf("%s at %g K: valid %v, extrapolated %v, basis %v", tc.name, r.T, r.Valid, r.Extrapolated, r.Basis)
			}
			if d := r.Log10K - tc.log10K[i]; math.Abs(d) > janafLog10KTol {
				t.Errorf("%s at %g K: log10 K = %.4f, JANAF %.3f (off by %.4f)", tc.name, r.T, r.Log10K, tc.log10K[i], d)
			}
			if tc.dn == 0 && r.Kc != r.K {
				t.Errorf("%s at %g K: Kc %g differs from K %g although Δn = 0", tc.name, r.T, r.Kc, r.K)
			}
		}
	}
}

// TestKcOfGasReactions checks the concentration-basis constant against
// values worked out by hand from the JANAF K (REFERENCE-DATA.md §3, derived)
// and Kc = K·(p°/(R·T·c°))^Δn with R = 8.314462618 J/(mol·K) (CODATA 2018,
// exact), p° = 1 bar, c° = 1 mol/L.
func TestKcOfGasReactions(t *testing.T) {
	tests := []struct {
		name string
		T    float64
		K    float64 // JANAF, derived
		Kc   float64 // derived by hand
	}{
		// reform at 1000 K: K = 26.2 bar², R·T·c°/p° = 83.1446 → Kc = 26.2/83.1446².
		{"reform", 1000, 26.2, 3.790e-3},
		// ammonia at 700 K: K = 8.75e-5 bar⁻², R·T·c°/p° = 58.2012 → Kc = 8.75e-5·58.2012².
		{"ammonia", 700, 8.75e-5, 0.2964},
	}
	for _, tc := range tests {
		tb := tableOf(t, shomateReactions, tc.name, tc.T)
		r := tb.Rows[0]
		// The JANAF K have three significant figures: 2·log10 K tolerance.
		if d := math.Log10(r.K / tc.K); math.Abs(d) > 2*janafLog10KTol {
			t.Errorf("%s at %g K: K = %.4g, JANAF %.3g", tc.name, tc.T, r.K, tc.K)
		}
		if d := math.Log10(r.Kc / tc.Kc); math.Abs(d) > 2*janafLog10KTol {
			t.Errorf("%s at %g K: Kc = %.4g (mol/L)^%g, derived %.4g", tc.name, tc.T, r.Kc, tb.DeltaGasMoles, tc.Kc)
		}
		// And exactly the definition, on the table's own K.
		want := r.K * math.Pow(1e5/(thermo.R*tc.T*1000), tb.DeltaGasMoles)
		if math.Abs(r.Kc/want-1) > 1e-12 {
			t.Errorf("%s: Kc = %g, K·(p°/(RTc°))^Δn = %g", tc.name, r.Kc, want)
		}
	}
}

// Calcite decomposition from NBS 1982 298.15 K data (REFERENCE-DATA.md §2a):
// CaCO3 −1206.92 kJ/mol, 92.9 J/mol/K; CaO −635.09, 39.75; CO2 −393.509,
// 213.74.
const calcite = `
species CaCO3(s) "calcite" { hf -1206.92 kJ/mol s 92.9 J/mol/K }
species CaO(s) { hf -635.09 kJ/mol s 39.75 J/mol/K }
species CO2(g) { hf -393.509 kJ/mol s 213.74 J/mol/K }
reaction calcine: CaCO3(s) <-> CaO(s) + CO2(g)
reaction carbonate: CaO(s) + CO2(g) <-> CaCO3(s)
`

// TestSolidDecomposition: a pure solid giving a gas has a quotient of one
// partial pressure. log10 K(298.15 K) = −22.845 and the constant-ΔH°/ΔS°
// temperature where K = 1 (p(CO2) = 1 bar) is 1110 K (REFERENCE-DATA.md §3,
// derived from NBS82). The measured temperature where p(CO2) reaches 1 atm
// is 1171 K (same section, a secondary compilation): ignoring ΔrCp° puts the
// estimate about 60 K low.
func TestSolidDecomposition(t *testing.T) {
	tb := tableOf(t, calcite, "calcine", 298.15)
	if tb.Kind != "Kp" || tb.Quotient != "p(CO2)" || tb.DeltaGasMoles != 1 {
		t.Errorf("kind %s, quotient %q, Δn %g; want Kp, p(CO2), 1", tb.Kind, tb.Quotient, tb.DeltaGasMoles)
	}
	// NBS82's ΔfG° = ΔfH° − T·ΔfS° holds only to about 0.03 kJ/mol per
	// species (calcite −0.025, REFERENCE-DATA.md §2a): from hf and s the
	// reaction's ΔrG° may differ by 0.05 kJ/mol, 0.009 in log10 K.
	if got := tb.Rows[0].Log10K; math.Abs(got+22.845) > 0.01 {
		t.Errorf("log10 K(298.15 K) = %.4f, want −22.845 (NBS82, derived)", got)
	}
	// hf and s hold 298.15 K ± 100 K (thermo.DefaultSpan): no crossover is
	// reported outside that, and the row at 1110 K is marked extrapolated.
	if len(tb.Crossovers) != 0 || tb.Tmin != thermo.ConstTmin || tb.Tmax != thermo.ConstTmax {
		t.Fatalf("crossovers %+v over %g–%g K, want none inside the default span", tb.Crossovers, tb.Tmin, tb.Tmax)
	}
	far := tableOf(t, calcite, "calcine", 1110)
	if r := far.Rows[0]; !r.Valid || !r.Extrapolated || math.Abs(r.Log10K) > 0.01 {
		t.Errorf("at 1110 K: %+v, want log10 K ≈ 0, extrapolated", r)
	}
	if d := 1171 - 1110.0; d < 40 || d > 80 {
		t.Errorf("constant-ΔH°/ΔS° estimate is %.0f K below the measured 1171 K; expected about 60 K", d)
	}
	back := tableOf(t, calcite, "carbonate", 298.15)
	if back.Quotient != "1 / p(CO2)" || back.DeltaGasMoles != -1 {
		t.Errorf("reverse: quotient %q, Δn %g", back.Quotient, back.DeltaGasMoles)
	}
}

// Silver chloride from CODATA key values with their uncertainties
// (REFERENCE-DATA.md §2a): AgCl(s) −127.01 ± 0.05 kJ/mol, 96.25 ± 0.20
// J/mol/K; Ag+ 105.79 ± 0.08, 73.45 ± 0.40; Cl− −167.080 ± 0.10,
// 56.60 ± 0.20 (Cl− from memory).
const silverChloride = `
species AgCl(s) { hf %v ± 0.05 kJ/mol s %v ± 0.20 J/mol/K }
species Ag+(aq) { hf %v ± 0.08 kJ/mol s %v ± 0.40 J/mol/K }
species Cl-(aq) { hf %v ± 0.10 kJ/mol s %v ± 0.20 J/mol/K }
reaction dissolve: AgCl(s) <-> Ag+(aq) + Cl-(aq)
`

var silverChlorideData = []float64{-127.01, 96.25, 105.79, 73.45, -167.080, 56.60}
var silverChlorideSigma = []float64{0.05e3, 0.20, 0.08e3, 0.40, 0.10e3, 0.20} // J/mol, J/mol/K

func silverChlorideNet(data []float64) string {
	args := make([]any, len(data))
	for i, v := range data {
		args[i] = v
	}
	return fmt.Sprintf(silverChloride, args...)
}

// TestSparinglySolubleSalt: AgCl dissolving is a Ksp. From CODATA, Ksp =
// 1.79e-10 (REFERENCE-DATA.md §3, derived); the CRC table lists 1.77e-10,
// within the CODATA uncertainty. From NBS82 gf alone, pKsp = 9.753.
func TestSparinglySolubleSalt(t *testing.T) {
	tb := tableOf(t, silverChlorideNet(silverChlorideData), "dissolve", 298.15)
	if tb.Kind != "Ksp" || tb.Quotient != "[Ag+][Cl-]" || tb.DeltaGasMoles != 0 {
		t.Errorf("kind %s, quotient %q, Δn %g; want Ksp, [Ag+][Cl-], 0", tb.Kind, tb.Quotient, tb.DeltaGasMoles)
	}
	r := tb.Rows[0]
	if math.Abs(r.Log10K-math.Log10(1.79e-10)) > 0.002 {
		t.Errorf("Ksp = %.4g, want 1.79e-10 (CODATA, derived)", r.K)
	}
	if math.Abs(r.Log10K-math.Log10(1.77e-10)) > 2*r.SigmaLog10K {
		t.Errorf("log10 Ksp = %.4f ± %.4f is more than 2σ from CRC's 1.77e-10", r.Log10K, r.SigmaLog10K)
	}
	nbs := tableOf(t, `
species AgCl(s) { gf -109.789 kJ/mol }
species Ag+(aq) { gf 77.107 kJ/mol }
species Cl-(aq) { gf -131.228 kJ/mol }
reaction dissolve: AgCl(s) <-> Ag+(aq) + Cl-(aq)
`, "dissolve", 298.15, 310)
	if r := nbs.Rows[0]; !r.Valid || r.Basis != network.BasisFormation || math.Abs(-r.Log10K-9.753) > 0.001 {
		t.Errorf("NBS82 gf: pKsp = %.4f (valid %v, basis %v), want 9.753", -r.Log10K, r.Valid, r.Basis)
	}
	if r := nbs.Rows[1]; r.Valid || len(r.Missing) != 3 {
		t.Errorf("gf alone at 310 K: valid %v, missing %d species; want invalid with all 3 missing", r.Valid, len(r.Missing))
	}
	if len(nbs.Crossovers) != 0 {
		t.Errorf("gf alone gave crossovers %+v", nbs.Crossovers)
	}
}

// Water's ionisation, NBS 1982 (REFERENCE-DATA.md §2a): H2O(l) −285.830
// kJ/mol, −237.129, 69.91 J/mol/K, Cp 75.291 (Cp from memory); OH− −229.994,
// −157.244, −10.75, Cp −148.5 (Cp from memory); H+ zero by convention.
const water = `
species H2O(l) { hf -285.830 kJ/mol gf -237.129 kJ/mol s 69.91 J/mol/K %s }
species OH-(aq) { hf -229.994 kJ/mol gf -157.244 kJ/mol s -10.75 J/mol/K %s }
species H+(aq) { hf 0 kJ/mol gf 0 kJ/mol s 0 J/mol/K %s }
reaction water: H2O(l) <-> H+(aq) + OH-(aq)
`

// TestWaterIonisation: pKw = 13.995 at 25 °C (CRC 5-20, and NBS82 derived).
// At 50 °C the CRC gives 13.264 (0.1 MPa, Bandura & Lvov 2006) and 13.275
// (saturation pressure, Marshall & Franck 1981). Constant ΔrH° and ΔrS° give
// 13.238; with constant heat capacities (ΔrCp° = −223.8 J/mol/K) 13.275.
func TestWaterIonisation(t *testing.T) {
	bare := fmt.Sprintf(water, "", "", "")
	withCp := fmt.Sprintf(water, "cp 75.291 J/mol/K", "cp -148.5 J/mol/K", "cp 0 J/mol/K")
	const t50 = 323.15
	for _, tc := range []struct {
		label      string
		src        string
		pK50, tol  float64
		pK50Source string
	}{
		{"hf/s", bare, 13.264, 0.03, "CRC 5-20 (0.1 MPa)"},
		{"hf/s/cp", withCp, 13.264, 0.015, "CRC 5-20 (0.1 MPa)"},
		{"hf/s/cp", withCp, 13.275, 0.005, "CRC 8-79 (saturation pressure)"},
	} {
		tb := tableOf(t, tc.src, "water", 298.15, t50)
		if tb.Kind != "Kc" || tb.Quotient != "[H+][OH-]" {
			t.Errorf("kind %s, quotient %q; want Kc, [H+][OH-]", tb.Kind, tb.Quotient)
		}
		if got := -tb.Rows[0].Log10K; math.Abs(got-13.995) > 0.002 {
			t.Errorf("%s: pKw(25 °C) = %.4f, want 13.995 (CRC 5-20)", tc.label, got)
		}
		if got := -tb.Rows[1].Log10K; math.Abs(got-tc.pK50) > tc.tol {
			t.Errorf("%s: pKw(50 °C) = %.4f, want %.3f ± %.3f (%s)", tc.label, got, tc.pK50, tc.tol, tc.pK50Source)
		}
	}
}

// TestCrossoverConstantData: with hf/s only, ΔrG° = ΔrH° − T·ΔrS° is linear,
// and its zero is ΔrH°/ΔrS°. Water-gas shift from NIST-JANAF 298.15 K data
// (REFERENCE-DATA.md §2a).
func TestCrossoverConstantData(t *testing.T) {
	src := `
species CO(g) { hf -110.527 kJ/mol s 197.653 J/mol/K }
species H2O(g) { hf -241.826 kJ/mol s 188.834 J/mol/K }
species CO2(g) { hf -393.522 kJ/mol s 213.795 J/mol/K }
species H2(g) { hf 0 kJ/mol s 130.680 J/mol/K }
reaction shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)
`
	tb := tableOf(t, src, "shift", 298.15)
	dh := (-393.522 + 0) - (-110.527 - 241.826)     // kJ/mol
	ds := (213.795 + 130.680) - (197.653 + 188.834) // J/mol/K
	want := 1000 * dh / ds
	// The zero lies beyond the data's default span (298.15 K ± 100 K): it is
	// no crossover of the table, but the extrapolated row there has K = 1.
	if len(tb.Crossovers) != 0 {
		t.Fatalf("crossovers %+v, want none inside 198.15–398.15 K", tb.Crossovers)
	}
	r := tableOf(t, src, "shift", want).Rows[0]
	if !r.Valid || !r.Extrapolated || math.Abs(r.DG) > 1e-6 {
		t.Errorf("at ΔrH°/ΔrS° = %.4f K: %+v, want ΔrG° = 0, extrapolated", want, r)
	}
	if r.Basis != network.BasisSpecies {
		t.Errorf("source %v, want species", r.Basis)
	}
}

// TestCrossoverFullCp: with Shomate data the shift's crossover moves from
// ΔrH°298/ΔrS°298 = 979.9 K to 1096.6 K, where JANAF's K = 1 (≈1097 K,
// REFERENCE-DATA.md §3, derived by interpolation). The reason: ΔrCp° > 0
// (3.2 J/mol/K at 298 K, rising), so ΔrH° grows less negative with T faster
// than T·ΔrS° does, and ΔrG° reaches zero later. For reforming the shift is
// the other way: 960.7 K at 298.15 K data, 892 K with Cp.
func TestCrossoverFullCp(t *testing.T) {
	n := loadThermo(t, shomateReactions)
	tests := []struct {
		name           string
		janaf          float64 // K = 1, REFERENCE-DATA.md §3
		dh298, ds298   float64 // JANAF 298.15 K, derived: kJ/mol, J/mol/K
		minOff, maxOff float64 // expected crossover − ΔrH°298/ΔrS°298, K
		favoredAbove   bool
	}{
		{"shift", 1097, -41.169, -42.012, 100, 130, false},
		{"reform", 892, 206.172, 214.608, -80, -55, true},
	}
	for _, tc := range tests {
		tb := ReactionTable(n, n.LookupReaction(tc.name), nil)
		if len(tb.Crossovers) != 1 {
			t.Fatalf("%s: crossovers %+v, want one", tc.name, tb.Crossovers)
		}
		x := tb.Crossovers[0]
		if math.Abs(x.T-tc.janaf) > 2 || x.FavoredAbove != tc.favoredAbove {
			t.Errorf("%s: crossover %.2f K (favoured above %v), JANAF ≈ %g K", tc.name, x.T, x.FavoredAbove, tc.janaf)
		}
		simple := 1000 * tc.dh298 / tc.ds298
		off := x.T - simple
		t.Logf("%s: crossover %.2f K with Shomate Cp, %.2f K from 298.15 K ΔrH°/ΔrS°: offset %+.1f K", tc.name, x.T, simple, off)
		if off < tc.minOff || off > tc.maxOff {
			t.Errorf("%s: offset %+.1f K from ΔrH°298/ΔrS°298, expected %g to %g K", tc.name, off, tc.minOff, tc.maxOff)
		}
		// At the crossover the full model has ΔrG° = 0, so there
		// ΔrH°(T)/ΔrS°(T) = T even though ΔrH°298/ΔrS°298 ≠ T.
		row := ReactionTable(n, n.LookupReaction(tc.name), []float64{x.T}).Rows[0]
		if math.Abs(row.DH/row.DS-x.T) > 0.01 || math.Abs(row.DG) > 0.05 {
			t.Errorf("%s: at %.3f K ΔrH°/ΔrS° = %.3f K, ΔrG° = %.3g J/mol", tc.name, x.T, row.DH/row.DS, row.DG)
		}
	}
}

// TestSigmaLog10KFiniteDifference: σ(log10 K) from the table equals a
// finite-difference propagation of the six CODATA uncertainties, each input
// moved in the .hess text.
func TestSigmaLog10KFiniteDifference(t *testing.T) {
	temps := []float64{298.15, 350}
	base := tableOf(t, silverChlorideNet(silverChlorideData), "dissolve", temps...)
	for ti, T := range temps {
		variance := 0.0
		for i := range silverChlorideData {
			// Step in the units written: kJ/mol for hf, J/mol/K for s.
			step := 1e-3
			up := append([]float64(nil), silverChlorideData...)
			down := append([]float64(nil), silverChlorideData...)
			up[i] += step
			down[i] -= step
			lu := tableOf(t, silverChlorideNet(up), "dissolve", T).Rows[0].Log10K
			ld := tableOf(t, silverChlorideNet(down), "dissolve", T).Rows[0].Log10K
			deriv := (lu - ld) / (2 * step) // per written unit
			sigma := silverChlorideSigma[i]
			if i%2 == 0 {
				sigma /= 1000 // J/mol → kJ/mol
			}
			variance += sq(deriv * sigma)
		}
		fd := math.Sqrt(variance)
		got := base.Rows[ti].SigmaLog10K
		t.Logf("σ(log10 Ksp) at %g K: table %.6f, finite difference %.6f", T, got, fd)
		if math.Abs(got-fd) > 1e-6*fd+1e-9 {
			t.Errorf("at %g K: σ(log10 K) = %.8f, finite difference %.8f", T, got, fd)
		}
	}
}

func TestQuotientAndKind(t *testing.T) {
	src := `
phase melt { convention solution }
species O2(g), H2(g), H2O(g), H2O(l), CO2(g), CO2(aq), NaCl(s), Na+(aq), Cl-(aq)
species FeO(melt), Fe(cr), X, Ca(OH)2(s), Ca^2+(aq), OH-(aq), SO4^2-(aq), CaSO4(s)
reaction burn: H2(g) + 1/2 O2(g) <-> H2O(g)
reaction condense: H2O(g) <-> H2O(l)
reaction absorb: CO2(g) <-> CO2(aq)
reaction salt: NaCl(s) <-> Na+(aq) + Cl-(aq)
reaction slake: Ca(OH)2(s) <-> Ca^2+(aq) + 2 OH-(aq)
reaction swap: Ca(OH)2(s) + SO4^2-(aq) <-> CaSO4(s) + 2 OH-(aq)
reaction melt: FeO(melt) + H2(g) <-> Fe(cr) + H2O(g)
reaction odd: X + O2(g) <-> X + H2(g)
reaction none: H2O(l) -> H2O(l)
`
	n := loadText(t, src)
	tests := []struct {
		name, kind, quotient string
		dn                   float64
	}{
		{"burn", "Kp", "p(H2O) / (p(H2) p(O2)^(1/2))", -0.5},
		{"condense", "Kp", "1 / p(H2O)", -1},
		{"absorb", "K", "[CO2] / p(CO2)", -1},
		{"salt", "Ksp", "[Na+][Cl-]", 0},
		{"slake", "Ksp", "[Ca^2+][OH-]^2", 0},
		{"swap", "Kc", "[OH-]^2 / [SO4^2-]", 0},
		{"melt", "K", "p(H2O) / (x(FeO) p(H2))", 0},
		{"odd", "Kp", "p(H2) / p(O2)", 0},
		{"none", "K", "1", 0},
	}
	for _, tc := range tests {
		rx := n.LookupReaction(tc.name)
		if rx == nil {
			t.Fatalf("no reaction %s", tc.name)
		}
		tb := ReactionTable(n, rx, nil)
		if tb.Kind != tc.kind || tb.Quotient != tc.quotient || tb.DeltaGasMoles != tc.dn {
			t.Errorf("%s: kind %s, quotient %q, Δn %g; want %s, %q, %g", tc.name, tb.Kind, tb.Quotient, tb.DeltaGasMoles, tc.kind, tc.quotient, tc.dn)
		}
	}
	if got := n.LookupReaction("burn").EquationText(); got != "H2(g) + 1/2 O2(g) <-> H2O(g)" {
		t.Errorf("equation %q", got)
	}
	if got := n.LookupReaction("none").EquationText(); got != "H2O(l) -> H2O(l)" {
		t.Errorf("equation %q", got)
	}
}

// TestRowBases covers rows that do not come from species models: a coupled
// reaction summed from its parts, and a reaction's own data.
func TestRowBases(t *testing.T) {
	src := `
species A(g), B(g), C(g)
reaction ab: A(g) <-> B(g) { dh 10 ± 1 kJ/mol ds 20 ± 2 J/mol/K }
reaction bc: B(g) <-> C(g) { dg -5 ± 0.5 kJ/mol dh -2 kJ/mol }
reaction ac: A(g) <-> C(g) = ab + bc
reaction gonly: A(g) <-> C(g) { dg 3 kJ/mol }
reaction measured: 2 A(g) <-> C(g) { logk 1.5 ± 0.1 at 400 K }
reaction bare: 2 B(g) <-> C(g)
`
	n := loadText(t, src)
	tbl := func(name string, temps ...float64) *Table {
		return ReactionTable(n, n.LookupReaction(name), temps)
	}
	const T = 400.0
	ab := tbl("ab", T).Rows[0]
	if ab.Basis != network.BasisReactionData || math.Abs(ab.DG-(10e3-T*20)) > 1e-9 {
		t.Errorf("ab: basis %v, ΔrG° %g", ab.Basis, ab.DG)
	}
	if want := math.Sqrt(sq(1e3)+sq(T*2)) / (thermo.R * T * math.Ln10); math.Abs(ab.SigmaLog10K-want) > 1e-12 {
		t.Errorf("ab: σ %g, want %g", ab.SigmaLog10K, want)
	}
	// bc from dh and dg: ΔrS° = (ΔrH° − ΔrG°)/298.15.
	bc := tbl("bc", T).Rows[0]
	dsBC := (-2e3 - -5e3) / 298.15
	if math.Abs(bc.DS-dsBC) > 1e-9 || math.Abs(bc.DG-(-2e3-T*dsBC)) > 1e-9 {
		t.Errorf("bc: ΔrS° %g, ΔrG° %g", bc.DS, bc.DG)
	}
	ac := tbl("ac", T, 298.15)
	for i, r := range ac.Rows {
		parts := tbl("ab", r.T).Rows[0].DG + tbl("bc", r.T).Rows[0].DG
		if r.Basis != network.BasisCombination || math.Abs(r.DG-parts) > 1e-9 {
			t.Errorf("ac row %d: basis %v, ΔrG° %g, parts sum %g", i, r.Basis, r.DG, parts)
		}
	}
	if len(ac.Crossovers) != 1 {
		t.Errorf("ac: crossovers %+v, want one (its parts are linear in T)", ac.Crossovers)
	}
	g := tbl("gonly", 298.15, T)
	if !g.Rows[0].Valid || g.Rows[1].Valid || math.Abs(g.Rows[0].DG-3e3) > 1e-9 {
		t.Errorf("gonly: rows %+v", g.Rows)
	}
	m := tbl("measured", T, 500)
	if !m.Rows[0].Valid || math.Abs(m.Rows[0].Log10K-1.5) > 1e-12 || m.Rows[0].SigmaLog10K != 0.1 || m.Rows[1].Valid {
		t.Errorf("measured: rows %+v", m.Rows)
	}
	if b := tbl("bare", T).Rows[0]; b.Valid || b.Basis != network.BasisNone || !math.IsNaN(b.K) || len(b.Missing) != 2 {
		t.Errorf("bare: row %+v", b)
	}
}

// TestFormationBasisNeedsEveryGf: at 298.15 K gf-only species combine only
// with the gf of the others, never with G° = H° − T·S°.
func TestFormationBasisNeedsEveryGf(t *testing.T) {
	n := loadText(t, `
species A(aq) { formula O2 gf -10 kJ/mol }
species B(aq) { formula O2 hf -20 kJ/mol s 50 J/mol/K }
species C(aq) { formula O2 hf -20 kJ/mol s 50 J/mol/K gf -30 kJ/mol }
reaction ab: A(aq) <-> B(aq)
reaction ac: A(aq) <-> C(aq)
`)
	ab := ReactionTable(n, n.LookupReaction("ab"), []float64{298.15}).Rows[0]
	if ab.Valid || len(ab.Missing) != 1 || ab.Missing[0].Key != "B(aq)" {
		t.Errorf("ab: valid %v, missing %v", ab.Valid, ab.Missing)
	}
	ac := ReactionTable(n, n.LookupReaction("ac"), []float64{298.15}).Rows[0]
	if !ac.Valid || ac.Basis != network.BasisFormation || math.Abs(ac.DG+20e3) > 1e-9 || !math.IsNaN(ac.DH) {
		t.Errorf("ac: %+v", ac)
	}
}

// TestDeepCombinations: coupled reactions built on one another in a chain
// where each uses the two before it are summed once per part, not once per
// path (which would be exponential).
func TestDeepCombinations(t *testing.T) {
	var b strings.Builder
	// Two isomers, so that no equation cancels; r_i converts c_i moles,
	// c_i = c_(i-1) + c_(i-2), so that each combination is exact.
	b.WriteString("species ortho(g) { formula H2 }\nspecies para(g) { formula H2 }\n")
	b.WriteString("reaction r0: ortho(g) <-> para(g) { dg 1 kJ/mol }\n")
	b.WriteString("reaction r1: ortho(g) <-> para(g) { dg 2 kJ/mol }\n")
	c0, c1 := int64(1), int64(1)
	for i := 2; i < 60; i++ {
		c0, c1 = c1, c0+c1
		fmt.Fprintf(&b, "reaction r%d: %d ortho(g) <-> %d para(g) = r%d + r%d\n", i, c1, c1, i-1, i-2)
	}
	n := loadText(t, b.String())
	tb := ReactionTable(n, n.LookupReaction("r40"), []float64{298.15})
	// r_i = r_(i-1) + r_(i-2): ΔrG° follows the Fibonacci numbers.
	f0, f1 := 1.0, 2.0
	for i := 2; i <= 40; i++ {
		f0, f1 = f1, f0+f1
	}
	if r := tb.Rows[0]; !r.Valid || r.Basis != network.BasisCombination || math.Abs(r.DG/1000-f1) > 1e-6*f1 {
		t.Errorf("r40: %+v, want ΔrG° = %g kJ/mol", r, f1)
	}
}

func sq(x float64) float64 { return x * x }
