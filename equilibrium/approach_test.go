package equilibrium

import (
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"hess/network"
	"hess/thermo"
)

// loadPlant compiles a network that includes the hydrogen plant's gas
// library (NIST WebBook Shomate fits and a NASA 7-term steam set) followed
// by body, and fails on any error.
func loadPlant(t *testing.T, body string) *network.Network {
	t.Helper()
	gases, err := filepath.Abs(filepath.Join("..", "examples", "hydrogen-plant", "gases.hess"))
	if err != nil {
		t.Fatal(err)
	}
	src := fmt.Sprintf("settings {\n  pressure 1 bar\n  tolerance 0.5 kJ/mol\n}\ninclude %q\n", gases) +
		"reaction reform: CH4(g) + H2O(g) <-> CO(g) + 3 H2(g)\n" +
		"reaction shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)\n" + body
	path := filepath.Join(t.TempDir(), "plant.hess")
	if err := os.WriteFile(path, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	n := network.Load(path, network.Disk{}, examplesAllowed)
	if n.Diagnostics.HasErrors() {
		for _, d := range n.Diagnostics {
			t.Errorf("%s:%d:%d: %s[%s]: %s", d.Subject.File, d.Subject.Start.Line, d.Subject.Start.Column, d.Severity, d.Code, d.Message)
		}
		t.FailNow()
	}
	return n
}

func approachOf(t *testing.T, n *network.Network, mixture, reaction string) (*MixtureApproach, ReactionApproach) {
	t.Helper()
	m := n.LookupMixture(mixture)
	if m == nil {
		t.Fatalf("no mixture %s", mixture)
	}
	a := Approach(n, m)
	if a == nil {
		t.Fatalf("mixture %s cannot be evaluated", mixture)
	}
	for _, r := range a.Reactions {
		if r.Reaction.Name == reaction {
			return a, r
		}
	}
	t.Fatalf("mixture %s has no result for %s", mixture, reaction)
	return nil, ReactionApproach{}
}

// With every activity 1 the quotient is 1: ΔrG equals ΔrG°, and K equals Q
// where ΔrG° = 0, so the equilibrium temperature is the crossover.
func TestApproachUnitQuotient(t *testing.T) {
	n := loadPlant(t, `
# every gas at p° (partial pressures, so Q = 1 whatever the total)
mixture unit {
  temperature 950 K
  CH4(g) 1 bar  H2O(g) 1 bar  CO(g) 1 bar  CO2(g) 1 bar  H2(g) 1 bar
}
`)
	// Crossovers from REFERENCE-DATA §3 (derived from NIST-JANAF log Kf by
	// linear interpolation of ΔrG°): shift ≈ 1097 K, reform ≈ 892 K.
	for _, tc := range []struct {
		name   string
		janafT float64
	}{{"shift", 1097}, {"reform", 892}} {
		_, r := approachOf(t, n, "unit", tc.name)
		if r.LnQ != 0 {
			t.Errorf("%s: ln Q = %g, want 0", tc.name, r.LnQ)
		}
		if r.DG != r.DG0 {
			t.Errorf("%s: ΔrG = %g J/mol, ΔrG° = %g J/mol; want equal at Q = 1", tc.name, r.DG, r.DG0)
		}
		table := ReactionTable(n, n.LookupReaction(tc.name), nil)
		if len(table.Crossovers) != 1 {
			t.Fatalf("%s: crossovers %v, want one", tc.name, table.Crossovers)
		}
		if d := math.Abs(r.EquilibriumT - table.Crossovers[0].T); d > 2*thermo.CrossoverTolerance {
			t.Errorf("%s: equilibrium T %.4f K, crossover %.4f K", tc.name, r.EquilibriumT, table.Crossovers[0].T)
		}
		if math.Abs(r.EquilibriumT-tc.janafT) > 3 {
			t.Errorf("%s: equilibrium T %.1f K, NIST-JANAF-derived crossover ≈ %.0f K", tc.name, r.EquilibriumT, tc.janafT)
		}
		// Q = 1 < K at 950 K for both (reform is favoured above its
		// crossover, the exothermic shift below its own): both are short
		// of equilibrium, so both approaches are positive, reform's T − T_eq
		// and shift's T_eq − T.
		if got, want := r.ApproachK(950), math.Abs(950-r.EquilibriumT); got != want || !(got > 0) {
			t.Errorf("%s: approach %g K, want +%g (short of equilibrium)", tc.name, got, want)
		}
	}
}

// At fixed mole fractions, Q of a gas reaction scales with (P/p°)^Δn, and
// the direction flips at the pressure where Q reaches K.
func TestApproachPressureScaling(t *testing.T) {
	// Invented reformer-outlet fractions; they need not sum to 1.
	const fractions = "CH4(g) 0.05  H2O(g) 0.35  CO(g) 0.10  CO2(g) 0.06  H2(g) 0.44"
	mix := func(name string, p float64) string {
		return fmt.Sprintf("mixture %s {\n  temperature 900 K\n  pressure %.17g bar\n  %s\n}\n", name, p, fractions)
	}
	n := loadPlant(t, mix("p1", 1)+mix("p30", 30))
	_, r1 := approachOf(t, n, "p1", "reform")
	_, r30 := approachOf(t, n, "p30", "reform")
	// Δn = 2 for reform: ln Q grows by 2 ln 30.
	if d := r30.LnQ - r1.LnQ - 2*math.Log(30); math.Abs(d) > 1e-12 {
		t.Errorf("reform: ln Q(30 bar) − ln Q(1 bar) − 2 ln 30 = %g", d)
	}
	_, s1 := approachOf(t, n, "p1", "shift")
	_, s30 := approachOf(t, n, "p30", "shift")
	if math.Abs(s30.LnQ-s1.LnQ) > 1e-12 {
		t.Errorf("shift (Δn = 0): ln Q moved from %g to %g with pressure", s1.LnQ, s30.LnQ)
	}
	if r1.LnK != r30.LnK {
		t.Errorf("K moved with the mixture's pressure: %g, %g", r1.LnK, r30.LnK)
	}

	// Theory: ΔrG = 0 where Q(1 bar)·(P/1 bar)² = K, so P* = √(K/Q(1 bar))
	// bar; below it reform runs forward, above it in reverse. Both from
	// outside the code: log10 K(900 K) = 0.113 for CH4 + H2O ⇌ CO + 3 H2
	// (REFERENCE-DATA §3, derived from NIST-JANAF, ±0.002), and Q(1 bar) by
	// hand from the fractions, which sum to 1.
	qByHand := 0.10 * math.Pow(0.44, 3) / (0.05 * 0.35)
	if d := r1.LnQ - math.Log(qByHand); math.Abs(d) > 1e-12 {
		t.Errorf("reform: ln Q(1 bar) = %.12g, by hand %.12g", r1.LnQ, math.Log(qByHand))
	}
	pStar := math.Sqrt(math.Pow(10, 0.113) / qByHand)
	n = loadPlant(t, mix("below", pStar/1.5)+mix("at", pStar)+mix("above", pStar*1.5))
	for _, tc := range []struct {
		mixture string
		want    Direction
	}{{"below", Forward}, {"at", AtEquilibrium}, {"above", Reverse}} {
		_, r := approachOf(t, n, tc.mixture, "reform")
		if r.Direction != tc.want {
			t.Errorf("reform at %s P* = %.4g bar: %v (ΔrG = %.3f kJ/mol), want %v", tc.mixture, pStar, r.Direction, r.DG/1000, tc.want)
		}
	}
	_, at := approachOf(t, n, "at", "reform")
	// JANAF's rounding of log10 K (0.002) allows ΔrG = R·T·ln 10·0.002 =
	// 34.5 J/mol, and moves T_eq by 0.002·ln 10/(ΔrH°/(R·T²)) = 0.14 K
	// (ΔrH° = 224.5 kJ/mol at 900 K, REFERENCE-DATA §3).
	if lim := thermo.R * 900 * math.Ln10 * 0.002; math.Abs(at.DG) > lim {
		t.Errorf("reform at P*: ΔrG = %g J/mol, want 0 within %.1f", at.DG, lim)
	}
	if math.Abs(at.EquilibriumT-900) > 0.15 {
		t.Errorf("reform at P*: equilibrium T %.4f K, want the mixture's 900 K", at.EquilibriumT)
	}
}

// A composition built to satisfy the published water-gas-shift constant is
// at equilibrium.
//
// NIST-JANAF log10 Kf at 1000 K (REFERENCE-DATA §2b): CO2 20.679, H2 0,
// CO 10.461, H2O 10.060, so log10 K = 20.679 − 10.461 − 10.060 = 0.158
// (derived, REFERENCE-DATA §3), K = 10^0.158 = 1.43880. Choosing
// y(CO) = 0.10, y(H2O) = 0.20, y(CO2) = 0.20 and y(H2) = 0.1·K = 0.14388
// gives Q = (0.20·0.14388)/(0.10·0.20) = 1.4388, log10 Q = 0.15800. Each
// log Kf is rounded to 3 decimals, so the source fixes log10 K only to about
// ±0.002: |ΔrG| = RT ln 10 |log10 Q − log10 K| may be up to
// 8.314·1000·2.3026·0.002 = 38 J/mol.
func TestApproachWorkedShift(t *testing.T) {
	n := loadPlant(t, `
mixture shifted {
  temperature 1000 K
  pressure 20 bar
  CO(g) 0.10  H2O(g) 0.20  CO2(g) 0.20  H2(g) 0.14388
}
`)
	_, r := approachOf(t, n, "shifted", "shift")
	if math.Abs(r.LnQ/math.Ln10-0.158) > 1e-5 {
		t.Fatalf("log10 Q = %.6f, want 0.15800 by construction", r.LnQ/math.Ln10)
	}
	allowed := thermo.R * 1000 * math.Ln10 * 0.002
	if math.Abs(r.DG) > allowed {
		t.Errorf("|ΔrG| = %.1f J/mol, the source's rounding allows %.1f", math.Abs(r.DG), allowed)
	}
	if r.Direction != AtEquilibrium {
		t.Errorf("direction %v, want equilibrium", r.Direction)
	}
}

// Quotients follow each phase's activity convention: p/p° for a gas,
// m/(1 mol/kg) for a solute, x for a solution member, 1 for a pure phase.
func TestApproachConventions(t *testing.T) {
	src := `
settings { pressure 1 bar  tolerance 0.5 kJ/mol }
phase melt { convention solution }
species AgCl(s) { gf -109.789 kJ/mol  source "NBS 1982" }
species Ag+(aq) { gf 77.107 kJ/mol  source "NBS 1982" }
species Cl-(aq) { gf -131.228 kJ/mol  source "NBS 1982" }
species CO2(g) { gf -394.359 kJ/mol  source "NBS 1982" }
species CO2(melt) { gf -390 kJ/mol  note "invented for a convention test" }
reaction dissolve: AgCl(s) <-> Ag+(aq) + Cl-(aq)
reaction melt-in: CO2(g) <-> CO2(melt)
# invented brine and melt compositions
mixture brine {
  temperature 298.15 K
  AgCl(s)  Ag+(aq) 2e-5 mol/kg  Cl-(aq) 0.5 mol/kg
}
mixture melt {
  temperature 298.15 K
  pressure 2 atm
  CO2(g) 1  CO2(melt) 0.25
}
`
	path := filepath.Join(t.TempDir(), "conv.hess")
	if err := os.WriteFile(path, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	n := network.Load(path, network.Disk{}, examplesAllowed)
	for _, d := range n.Diagnostics {
		if d.Code != "not-in-mixture" { // each mixture holds one reaction's species
			t.Errorf("%s[%s]: %s", d.Severity, d.Code, d.Message)
		}
	}
	_, r := approachOf(t, n, "brine", "dissolve")
	if want := math.Log(2e-5 * 0.5); math.Abs(r.LnQ-want) > 1e-12 {
		t.Errorf("dissolve: ln Q = %g, want ln(2e-5·0.5) = %g", r.LnQ, want)
	}
	// NBS82-derived Ksp of AgCl at 25 °C is 1.77e-10 (REFERENCE-DATA §3):
	// Q = 1e-5 is far above it, so silver chloride precipitates.
	if r.Direction != Reverse {
		t.Errorf("dissolve: %v, want reverse", r.Direction)
	}
	if math.Abs(r.LnK/math.Ln10-(-9.753)) > 0.002 {
		t.Errorf("dissolve: log10 K = %.4f, NBS82-derived −9.753", r.LnK/math.Ln10)
	}
	_, r = approachOf(t, n, "melt", "melt-in")
	if want := math.Log(0.25 / (2 * thermo.Atm / thermo.Bar)); math.Abs(r.LnQ-want) > 1e-12 {
		t.Errorf("melt-in: ln Q = %g, want ln(0.25/(2 atm/1 bar)) = %g", r.LnQ, want)
	}
}

// A mixture with a mistake in it gives diagnostics and no numbers.
func TestApproachRefusesBadMixtures(t *testing.T) {
	for _, tc := range []struct {
		name, body, code, text string
	}{
		{"negative", "CO(g) -0.1 H2O(g) 0.3 CO2(g) 0.2 H2(g) 0.4", "mixture-amount", "mole fraction of CO(g) is negative"},
		{"zero-sum", "CO(g) 0 H2O(g) 0 CO2(g) 0 H2(g) 0", "mixture-fractions", "sum to 0"},
		{"unknown", "CO(g) 0.1 H2O(g) 0.3 CO2(g) 0.2 H2(g) 0.4 N2(g) 0.1", "undefined-species", "N2(g) is not declared"},
		{"untagged", "CO(g) 0.1 H2O(g) 0.3 CO2(g) 0.2 H2(g) 0.4 CO2", "mixture-amount", "CO2 after 0.4 is read as the unit"},
		{"mixed", "CO(g) 0.1 H2O(g) 0.3 CO2(g) 2 bar H2(g) 0.4", "mixture-fractions", "mole fractions and 1 as partial pressures"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			gases, _ := filepath.Abs(filepath.Join("..", "examples", "hydrogen-plant", "gases.hess"))
			src := fmt.Sprintf("include %q\nreaction shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)\n"+
				"mixture m {\n  temperature 900 K\n  pressure 10 bar\n  %s\n}\n", gases, tc.body)
			path := filepath.Join(t.TempDir(), "bad.hess")
			if err := os.WriteFile(path, []byte(src), 0o644); err != nil {
				t.Fatal(err)
			}
			n := network.Load(path, network.Disk{}, examplesAllowed)
			found := false
			for _, d := range n.Diagnostics {
				if string(d.Code) == tc.code && strings.Contains(d.Message, tc.text) {
					found = true
				}
			}
			if !found {
				t.Errorf("no %s %q among %v", tc.code, tc.text, n.Diagnostics)
			}
			if m := n.LookupMixture("m"); m != nil && Approach(n, m) != nil {
				t.Errorf("a bad mixture was evaluated")
			}
		})
	}
}

// A molality written without its unit is missing-unit, never a number.
func TestApproachSoluteNeedsUnit(t *testing.T) {
	src := `
species Ag+(aq) { gf 77.107 kJ/mol }
species Cl-(aq) { gf -131.228 kJ/mol }
species AgCl(s) { gf -109.789 kJ/mol }
reaction dissolve: AgCl(s) <-> Ag+(aq) + Cl-(aq)
mixture brine { temperature 25 degC  AgCl(s)  Ag+(aq) 1e-5  Cl-(aq) 0.1 mol/kg }
`
	path := filepath.Join(t.TempDir(), "brine.hess")
	if err := os.WriteFile(path, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	n := network.Load(path, network.Disk{}, examplesAllowed)
	found := false
	for _, d := range n.Diagnostics {
		found = found || (d.Code == "missing-unit" && strings.Contains(d.Message, "molality of Ag+(aq) needs a unit"))
	}
	if !found {
		t.Errorf("no missing-unit for the bare molality: %v", n.Diagnostics)
	}
	if Approach(n, n.LookupMixture("brine")) != nil {
		t.Error("a mixture with a bare molality was evaluated")
	}
}

// A reaction whose data do not reach the mixture's temperature keeps its
// quotient but has no K, ΔrG or direction; a reaction whose species the
// mixture lacks has no quotient.
func TestApproachWithoutData(t *testing.T) {
	src := `
species AgCl(s) { gf -109.789 kJ/mol  source "NBS 1982" }
species Ag+(aq) { gf 77.107 kJ/mol  source "NBS 1982" }
species Cl-(aq) { gf -131.228 kJ/mol  source "NBS 1982" }
species Br-(aq) { gf -103.96 kJ/mol  source "NBS 1982 (from memory)" }
species AgBr(s) { gf -96.90 kJ/mol  source "NBS 1982 (from memory)" }
reaction dissolve: AgCl(s) <-> Ag+(aq) + Cl-(aq)
reaction bromide: AgBr(s) <-> Ag+(aq) + Br-(aq)
# invented warm brine: gf alone holds at 298.15 K only
mixture warm { temperature 60 degC  AgCl(s)  Ag+(aq) 1e-5 mol/kg  Cl-(aq) 0.1 mol/kg }
`
	path := filepath.Join(t.TempDir(), "warm.hess")
	if err := os.WriteFile(path, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	n := network.Load(path, network.Disk{}, examplesAllowed)
	a, r := approachOf(t, n, "warm", "dissolve")
	if math.Abs(r.LnQ-math.Log(1e-6)) > 1e-12 {
		t.Errorf("ln Q = %g, want ln 1e-6", r.LnQ)
	}
	if !math.IsNaN(r.LnK) || !math.IsNaN(r.DG) || r.Direction != DirectionUnknown || !math.IsNaN(r.EquilibriumT) {
		t.Errorf("no data at 333.15 K, yet ln K %g, ΔrG %g, %v, T_eq %g", r.LnK, r.DG, r.Direction, r.EquilibriumT)
	}
	if len(r.Missing) != 3 {
		t.Errorf("missing %v, want the three gf-only species", r.Missing)
	}
	if len(a.Absent) != 1 || a.Absent[0].Reaction.Name != "bromide" || len(a.Absent[0].Lacking) != 2 {
		t.Errorf("absent %+v, want bromide lacking AgBr(s) and Br-(aq)", a.Absent)
	}
	if f, rv, eq, unk := a.Counts(); f+rv+eq != 0 || unk != 1 {
		t.Errorf("counts %d %d %d %d", f, rv, eq, unk)
	}
}

// Gas mole fractions are normalised: an analysis in percent and the same
// analysis as fractions give one quotient.
func TestApproachNormalisesFractions(t *testing.T) {
	// Invented dry-gas analysis, in percent and as fractions.
	n := loadPlant(t, `
mixture percent { temperature 900 K pressure 5 bar CH4(g) 5 H2O(g) 35 CO(g) 10 CO2(g) 6 H2(g) 44 }
mixture fraction { temperature 900 K pressure 5 bar CH4(g) 0.05 H2O(g) 0.35 CO(g) 0.10 CO2(g) 0.06 H2(g) 0.44 }
`)
	_, p := approachOf(t, n, "percent", "reform")
	_, f := approachOf(t, n, "fraction", "reform")
	if math.Abs(p.LnQ-f.LnQ) > 1e-12 {
		t.Errorf("ln Q from percent %g, from fractions %g", p.LnQ, f.LnQ)
	}
	// Q = y(CO) y(H2)^3 / (y(CH4) y(H2O)) · (P/p°)^2 by hand.
	want := math.Log(0.10 * math.Pow(0.44, 3) / (0.05 * 0.35) * 25)
	if math.Abs(f.LnQ-want) > 1e-12 {
		t.Errorf("ln Q = %.15g, by hand %.15g", f.LnQ, want)
	}
}

// examplesAllowed lets networks written to a test's temporary folder
// include the shipped example libraries.
var examplesAllowed = network.Options{IncludePaths: []string{"../examples"}}

// The approach is positive short of equilibrium and negative past it, for
// the endothermic reformer and the exothermic shift alike (plant practice).
func TestApproachSign(t *testing.T) {
	n := loadPlant(t, `
# invented compositions: little product (short of equilibrium) and much
# product (past it), in bar
mixture short {
  temperature 950 K
  CH4(g) 1 bar  H2O(g) 1 bar  CO(g) 0.1 bar  CO2(g) 0.1 bar  H2(g) 1 bar
}
mixture past {
  temperature 950 K
  CH4(g) 0.01 bar  H2O(g) 0.01 bar  CO(g) 1 bar  CO2(g) 1 bar  H2(g) 3 bar
}
`)
	for _, tc := range []struct {
		mixture, reaction string
		positive          bool
	}{
		{"short", "reform", true}, {"short", "shift", true},
		{"past", "reform", false}, {"past", "shift", false},
	} {
		_, r := approachOf(t, n, tc.mixture, tc.reaction)
		got := r.ApproachK(950)
		if math.IsNaN(got) || (got > 0) != tc.positive || math.Abs(got) != math.Abs(950-r.EquilibriumT) {
			t.Errorf("%s in %s: approach %g K (T_eq %g K, ln Q %g, ln K %g), want %s", tc.reaction, tc.mixture,
				got, r.EquilibriumT, r.LnQ, r.LnK, map[bool]string{true: "positive", false: "negative"}[tc.positive])
		}
	}
}
