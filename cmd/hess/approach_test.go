package main

import (
	"bytes"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestApproachGolden renders the examples' mixtures in every format and
// compares with testdata/approach/NAME.FORMAT.golden. Run with -update after
// review.
func TestApproachGolden(t *testing.T) {
	exampleGoldens(t, "approach", map[string]string{
		"reformer": "examples/hydrogen-plant/reformer.hess",
		"scrubber": "examples/flue-gas-scrubber.hess",
	})
}

// TestApproachJSONFields decodes the JSON document and checks the fields
// CLI.md names and how they relate.
func TestApproachJSONFields(t *testing.T) {
	inRoot(t)
	var stdout, stderr bytes.Buffer
	code := run([]string{"approach", "--format", "json", "--mixture", "reformer-outlet", "examples/hydrogen-plant/reformer.hess"}, &stdout, &stderr)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr.String())
	}
	var doc struct {
		Network  string `json:"network"`
		Mixtures []struct {
			Name        string           `json:"name"`
			T           float64          `json:"T_K"`
			PressureBar float64          `json:"pressure_bar"`
			Reactions   []map[string]any `json:"reactions"`
		} `json:"mixtures"`
	}
	if err := json.Unmarshal(stdout.Bytes(), &doc); err != nil {
		t.Fatalf("%v\n%s", err, stdout.String())
	}
	if doc.Network != "examples/hydrogen-plant/reformer.hess" || len(doc.Mixtures) != 1 {
		t.Fatalf("network %q with %d mixtures", doc.Network, len(doc.Mixtures))
	}
	m := doc.Mixtures[0]
	if m.Name != "reformer-outlet" || m.T != 1123.15 || m.PressureBar != 25 {
		t.Errorf("mixture %s at %g K, %g bar; want reformer-outlet at 1123.15 K (850 degC), 25 bar", m.Name, m.T, m.PressureBar)
	}
	fields := []string{"name", "Q", "K", "log10QoverK", "dG_kJ_mol", "direction", "equilibriumT_K", "approach_K",
		"equilibriumTs_K", "extrapolated", "reason"}
	for _, r := range m.Reactions {
		if len(r) != len(fields) {
			t.Errorf("reaction has fields %v, want exactly %v", r, fields)
		}
		for _, f := range fields {
			if _, ok := r[f]; !ok {
				t.Errorf("reaction %v lacks %s", r["name"], f)
			}
		}
		if r["reason"] != nil {
			// No quotient (the sampled gas lists no graphite): the
			// reason stands for the numbers.
			if r["Q"] != nil {
				t.Errorf("%v: a reason %v beside Q %v", r["name"], r["reason"], r["Q"])
			}
			continue
		}
		q, k := r["Q"].(float64), r["K"].(float64)
		if d := math.Log10(q/k) - r["log10QoverK"].(float64); math.Abs(d) > 1e-8 {
			t.Errorf("%v: log10(Q/K) off by %g", r["name"], d)
		}
		// ΔrG = RT ln(Q/K) (R = 8.314462618 J/mol/K, CODATA 2018 exact).
		dg := 8.31446261815324 * m.T * math.Log(q/k) / 1000
		if d := dg - r["dG_kJ_mol"].(float64); math.Abs(d) > 1e-6 {
			t.Errorf("%v: ΔrG %v kJ/mol, RT ln(Q/K) = %v", r["name"], r["dG_kJ_mol"], dg)
		}
		want := "forward"
		switch {
		case math.Abs(dg) <= 0.5:
			want = "equilibrium"
		case dg > 0:
			want = "reverse"
		}
		if r["direction"] != want {
			t.Errorf("%v: direction %v, want %s (ΔrG %.3f kJ/mol, tolerance 0.5)", r["name"], r["direction"], want, dg)
		}
		// Plant practice: the approach is positive while the reaction is
		// short of equilibrium (Q < K), negative past it.
		if teq, ok := r["equilibriumT_K"].(float64); ok {
			want := math.Abs(m.T - teq)
			if q > k {
				want = -want
			}
			if d := want - r["approach_K"].(float64); math.Abs(d) > 1e-6 {
				t.Errorf("%v: approach_K %v, want %v (|T − equilibriumT_K|, negative past equilibrium)", r["name"], r["approach_K"], want)
			}
		}
	}
}

// TestApproachRefusals: a network with a bad mixture exits 1 with its
// diagnostics and prints no numbers; an unknown mixture name is a usage
// problem.
func TestApproachRefusals(t *testing.T) {
	inRoot(t)
	dir := t.TempDir()
	gases, err := filepath.Abs("examples/hydrogen-plant/gases.hess")
	if err != nil {
		t.Fatal(err)
	}
	bad := filepath.Join(dir, "bad.hess")
	src := "include \"" + filepath.ToSlash(gases) + "\"\nreaction shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)\n" +
		"reaction reform: CH4(g) + H2O(g) <-> CO(g) + 3 H2(g)\n" +
		"mixture m {\n  temperature 900 K\n  pressure 10 bar\n  CH4(g) 0.1 CO(g) -0.1 H2O(g) 0.3 CO2(g) 0.2 H2(g) 0.4\n}\n"
	if err := os.WriteFile(bad, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	var stdout, stderr bytes.Buffer
	// The library lies outside the network's folder: --include-path allows it.
	if code := run([]string{"approach", "--include-path", filepath.Dir(gases), bad}, &stdout, &stderr); code != exitFindings {
		t.Errorf("bad mixture: exit %d, want %d", code, exitFindings)
	}
	if stdout.Len() != 0 {
		t.Errorf("bad mixture printed numbers:\n%s", stdout.String())
	}
	if !strings.Contains(stderr.String(), "error: mole fraction of CO(g) is negative (-0.1) [mixture-amount]") {
		t.Errorf("stderr lacks the diagnostic:\n%s", stderr.String())
	}

	stdout.Reset()
	stderr.Reset()
	if code := run([]string{"approach", "--mixture", "nowhere", "examples/hydrogen-plant/reformer.hess"}, &stdout, &stderr); code != exitTrouble {
		t.Errorf("unknown mixture: exit %d, want %d", code, exitTrouble)
	}
	if !strings.Contains(stderr.String(), `no mixture named "nowhere"`) {
		t.Errorf("stderr: %s", stderr.String())
	}

	stdout.Reset()
	stderr.Reset()
	if code := run([]string{"approach", "--help"}, &stdout, &stderr); code != exitOK {
		t.Errorf("--help: exit %d", code)
	}
	if !strings.Contains(stdout.String(), "licensed engineering practice") {
		t.Errorf("help lacks the caution:\n%s", stdout.String())
	}
}

// TestApproachSummaryLine counts directions in the summary line.
func TestApproachSummaryLine(t *testing.T) {
	inRoot(t)
	var stdout, stderr bytes.Buffer
	if code := run([]string{"approach", "--mixture", "shift-outlet", "examples/hydrogen-plant/reformer.hess"}, &stdout, &stderr); code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr.String())
	}
	if !strings.Contains(stdout.String(), "  1 reaction runs forward, 3 reverse, 0 at equilibrium; 2 not in this mixture\n") {
		t.Errorf("summary line missing:\n%s", stdout.String())
	}
}

// TestApproachGaps: reactions without K and without a quotient are named in
// notes and counted in the summary, and their numbers are n/a (null in
// JSON).
func TestApproachGaps(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "warm.hess")
	src := `species AgCl(s) { gf -109.789 kJ/mol }
species Ag+(aq) { gf 77.107 kJ/mol }
species Cl-(aq) { gf -131.228 kJ/mol }
species AgBr(s) { gf -96.90 kJ/mol }
species Br-(aq) { gf -103.96 kJ/mol }
reaction dissolve: AgCl(s) <-> Ag+(aq) + Cl-(aq)
reaction bromide: AgBr(s) <-> Ag+(aq) + Br-(aq)
# invented warm brine
mixture warm { temperature 333.15 K AgCl(s) Ag+(aq) 1e-5 mol/kg Cl-(aq) 0.1 mol/kg }
`
	if err := os.WriteFile(path, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	var stdout, stderr bytes.Buffer
	if code := run([]string{"approach", path}, &stdout, &stderr); code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr.String())
	}
	for _, want := range []string{
		"dissolve 1.0000e-06 n/a n/a n/a n/a n/a n/a",
		"bromide: no quotient here (the mixture lacks AgBr(s), Br-(aq))",
		"dissolve: K cannot be computed at 333.15 K (no data for AgCl(s), Ag+(aq), Cl-(aq))",
		"0 reactions run forward, 0 reverse, 0 at equilibrium; 1 without K at 333.15 K; 1 not in this mixture",
	} {
		if !strings.Contains(strings.Join(strings.Fields(stdout.String()), " "), want) {
			t.Errorf("text lacks %q:\n%s", want, stdout.String())
		}
	}
	if !strings.Contains(stderr.String(), "info: mixture warm gives no quotient for bromide") {
		t.Errorf("stderr lacks the not-in-mixture note:\n%s", stderr.String())
	}
	stdout.Reset()
	if code := run([]string{"approach", "--format", "json", path}, &stdout, &stderr); code != exitOK {
		t.Fatalf("exit %d", code)
	}
	var doc struct {
		Mixtures []struct {
			PressureBar *float64         `json:"pressure_bar"`
			Reactions   []map[string]any `json:"reactions"`
		}
	}
	if err := json.Unmarshal(stdout.Bytes(), &doc); err != nil {
		t.Fatal(err)
	}
	// Every reaction is listed: the one without a quotient with its reason.
	if len(doc.Mixtures) != 1 || len(doc.Mixtures[0].Reactions) != 2 {
		t.Fatalf("%s", stdout.String())
	}
	absent := doc.Mixtures[0].Reactions[1]
	if absent["name"] != "bromide" || absent["Q"] != nil || absent["reason"] != "no quotient: the mixture lacks AgBr(s), Br-(aq)" {
		t.Errorf("reaction without a quotient: %v", absent)
	}
	if doc.Mixtures[0].PressureBar != nil {
		t.Errorf("a brine with no pressure: pressure_bar %v, want null", *doc.Mixtures[0].PressureBar)
	}
	r := doc.Mixtures[0].Reactions[0]
	for _, f := range []string{"K", "log10QoverK", "dG_kJ_mol", "direction", "equilibriumT_K", "approach_K"} {
		if r[f] != nil {
			t.Errorf("%s = %v, want null", f, r[f])
		}
	}
	if r["Q"] != 1e-6 {
		t.Errorf("Q = %v, want 1e-06", r["Q"])
	}
	if r["reason"] != "K cannot be computed at 333.15 K (no data for AgCl(s), Ag+(aq), Cl-(aq))" || r["extrapolated"] != false {
		t.Errorf("reason %v, extrapolated %v", r["reason"], r["extrapolated"])
	}
	stdout.Reset()
	if code := run([]string{"approach", "--format", "csv", path}, &stdout, &stderr); code != exitOK {
		t.Fatalf("exit %d", code)
	}
	if !strings.Contains(stdout.String(), `warm,333.15,,bromide,,,,,,,,,"no quotient: the mixture lacks AgBr(s), Br-(aq)"`) {
		t.Errorf("CSV lacks the reaction without a quotient:\n%s", stdout.String())
	}
}

// TestApproachSolutionJSON: the scrubber's sump lists its solutes under the
// Davies model; the JSON gives the ionic strength, I = ½ Σ m z² over the
// listed molalities, and each solute's γ, and the quotients use γ·m.
func TestApproachSolutionJSON(t *testing.T) {
	inRoot(t)
	var stdout, stderr bytes.Buffer
	if code := run([]string{"approach", "--format", "json", "--mixture", "sump", "examples/flue-gas-scrubber.hess"}, &stdout, &stderr); code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr.String())
	}
	var doc struct {
		Mixtures []struct {
			Reactions []map[string]any `json:"reactions"`
			Solution  struct {
				Model   string  `json:"activityModel"`
				I       float64 `json:"ionicStrength_mol_kg"`
				Water   string  `json:"water"`
				Aw      float64 `json:"waterActivity"`
				Solutes []struct {
					Species  string  `json:"species"`
					Molality float64 `json:"molality"`
					Gamma    float64 `json:"activityCoefficient"`
				} `json:"solutes"`
			} `json:"solution"`
		} `json:"mixtures"`
	}
	if err := json.Unmarshal(stdout.Bytes(), &doc); err != nil {
		t.Fatal(err)
	}
	s := doc.Mixtures[0].Solution
	charge := map[string]float64{"SO2(aq)": 0, "CO2(aq)": 0, "H+(aq)": 1, "OH-(aq)": -1, "HSO3-(aq)": -1,
		"SO3^2-(aq)": -2, "HCO3-(aq)": -1, "Ca^2+(aq)": 2}
	I := 0.0
	a := map[string]float64{}
	for _, so := range s.Solutes {
		z, ok := charge[so.Species]
		if !ok {
			t.Fatalf("unexpected solute %s", so.Species)
		}
		I += so.Molality * z * z / 2
		a[so.Species] = so.Gamma * so.Molality
		if z != 0 && !(so.Gamma < 1) {
			t.Errorf("%s: γ = %g, want below 1 for an ion", so.Species, so.Gamma)
		}
	}
	if s.Model != "davies" || math.Abs(s.I-I) > 1e-12 || len(s.Solutes) != 8 || s.Water != "H2O(l)" || !(s.Aw < 1) {
		t.Fatalf("solution %+v; want davies, I = %g", s, I)
	}
	for _, r := range doc.Mixtures[0].Reactions {
		if r["name"] == "co2-acid" {
			want := a["HCO3-(aq)"] * a["H+(aq)"] / (a["CO2(aq)"] * s.Aw)
			if q := r["Q"].(float64); math.Abs(q/want-1) > 1e-8 {
				t.Errorf("co2-acid Q = %g, want γ·m product %g", q, want)
			}
		}
	}
}
