package main

import (
	"encoding/json"
	"math"
	"path/filepath"
	"strings"
	"testing"
)

// TestEquilibriumAqueousEndToEnd drives the built binary on the shipped
// limestone pond: calcite in water open to air's CO2 at 10^-3.5 atm, 25 °C,
// Davies activities. The textbook worked result is pH ≈ 8.3 and dissolved
// calcium ≈ 0.5 mmol/kg (aquatic chemistry texts such as Stumm & Morgan,
// Aquatic Chemistry; REFERENCE-DATA §7, from memory), checked within the
// rounding of those figures, as the aqueous solver's own tests do. The
// text is frozen in a golden file; CSV and Markdown are checked by shape.
func TestEquilibriumAqueousEndToEnd(t *testing.T) {
	const pond = "examples/limestone-pond.hess"
	r := runHess(t, "equilibrium", "--format", "json", pond)
	if r.code != 0 || r.stderr != "" {
		t.Fatalf("json: exit %d\n%s", r.code, r.stderr)
	}
	var doc struct {
		Results []struct {
			Mixture       string   `json:"mixture"`
			Basis         string   `json:"basis"`
			Converged     bool     `json:"converged"`
			PH            *float64 `json:"pH"`
			I             *float64 `json:"ionicStrength_mol_kg"`
			ActivityModel string   `json:"activityModel"`
			Species       []struct {
				Name         string   `json:"name"`
				Phase        string   `json:"phase"`
				Amount       *float64 `json:"amount_mol"`
				MoleFraction *float64 `json:"moleFraction"`
				Activity     *float64 `json:"activity"`
				Molality     *float64 `json:"molality"`
				Gamma        *float64 `json:"activityCoefficient"`
			} `json:"species"`
			Minerals []struct {
				Name    string   `json:"name"`
				Present bool     `json:"present"`
				SI      *float64 `json:"saturationIndex"`
			} `json:"minerals"`
			FixedGases []struct {
				Name    string   `json:"name"`
				TakenIn *float64 `json:"takenIn_mol"`
			} `json:"fixedGases"`
		} `json:"results"`
	}
	if err := json.Unmarshal([]byte(r.stdout), &doc); err != nil {
		t.Fatalf("json: %v\n%s", err, r.stdout)
	}
	if len(doc.Results) != 2 {
		t.Fatalf("want 2 results, got %d", len(doc.Results))
	}
	for _, res := range doc.Results {
		if !res.Converged || res.PH == nil || res.I == nil || res.ActivityModel != "davies" || len(res.Minerals) != 1 ||
			res.Minerals[0].SI == nil || len(res.FixedGases) != 1 || res.FixedGases[0].TakenIn == nil {
			t.Fatalf("%s: aqueous fields missing: %s", res.Mixture, r.stdout)
		}
		solutes := 0
		for _, s := range res.Species {
			if s.Amount == nil || s.MoleFraction == nil || s.Activity == nil || s.Phase == "" {
				t.Errorf("%s: %s lacks a species field", res.Mixture, s.Name)
			}
			if s.Phase == "aq" && s.Name != "H2O(l)" {
				solutes++
				if s.Molality == nil || s.Gamma == nil || math.Abs(*s.Gamma**s.Molality / *s.Activity - 1) > 1e-6 {
					t.Errorf("%s: %s: molality, γ and activity disagree", res.Mixture, s.Name)
				}
			}
		}
		if solutes != 6 {
			t.Errorf("%s: %d solutes, want 6", res.Mixture, solutes)
		}
	}
	pond0 := doc.Results[0]
	if math.Abs(*pond0.PH-8.3) > 0.05 {
		t.Errorf("pond: pH %.3f, want 8.3 ± 0.05 (Stumm & Morgan)", *pond0.PH)
	}
	for _, s := range pond0.Species {
		if s.Name == "Ca^2+(aq)" && math.Abs(*s.Molality*1000-0.5) > 0.05 {
			t.Errorf("pond: Ca %.4f mmol/kg, want 0.5 ± 0.05 (Stumm & Morgan)", *s.Molality*1000)
		}
	}
	if m := pond0.Minerals[0]; !m.Present || math.Abs(*m.SI) > 1e-6 {
		t.Errorf("pond: calcite %+v, want present with saturation index 0", m)
	}
	if m := doc.Results[1].Minerals[0]; m.Present || !(*m.SI < -0.5) {
		t.Errorf("pinch: calcite present %v, SI %g; want absent and undersaturated", m.Present, *m.SI)
	}
	// What the air gives: each mol of calcite dissolved takes one of CO2
	// (CaCO3 + CO2 + H2O -> Ca2+ + 2 HCO3-) beside the CO2(aq) held by the
	// air, within the carbonate and hydroxide left over.
	if g := *doc.Results[1].FixedGases[0].TakenIn; math.Abs(g-1.1e-4) > 5e-6 {
		t.Errorf("pinch: CO2 taken in %g mol, want about 1.1e-4", g)
	}

	r = runHess(t, "equilibrium", pond)
	if r.code != 0 || r.stderr != "" {
		t.Fatalf("text: exit %d\n%s", r.code, r.stderr)
	}
	compareGolden(t, filepath.Join("testdata", "equilibrium", "pond.text.golden"), []byte(r.stdout))
	r = runHess(t, "equilibrium", "--format", "csv", pond)
	if r.code != 0 || !strings.Contains(r.stdout, ",activity coefficient,saturation index,pH,ionic strength [mol/kg],activity model,") ||
		!strings.Contains(r.stdout, "pond,298.15,1.01325,elements,false,true,mineral,CaCO3(cr),CaCO3(cr),true,") {
		t.Errorf("CSV: exit %d\n%s", r.code, r.stdout)
	}
	r = runHess(t, "equilibrium", "--format", "markdown", pond)
	if r.code != 0 || !strings.Contains(r.stdout, "| species | phase | amount [mol] | mole fraction | activity | molality [mol/kg] | activity coefficient |") ||
		!strings.Contains(r.stdout, "saturation index") || !strings.Contains(r.stdout, "Caution:") {
		t.Errorf("Markdown: exit %d\n%s", r.code, r.stdout)
	}
}

// TestEquilibriumAqueousRange: a 1 mol/kg brine under Davies (valid to
// about 0.5 mol/kg) is solved and printed, with the activity-range warning
// naming I and the model on stderr.
func TestEquilibriumAqueousRange(t *testing.T) {
	r := runHess(t, "equilibrium", "--format", "json", "testdata/equilibrium/aqueous-brine.hess")
	if r.code != 0 || !strings.Contains(r.stdout, `"ionicStrength_mol_kg": 1`) {
		t.Fatalf("exit %d\n%s", r.code, r.stdout)
	}
	for _, want := range []string{"[activity-range]", "warning", "ionic strength 1 mol/kg", "davies"} {
		if !strings.Contains(r.stderr, want) {
			t.Errorf("stderr lacks %q:\n%s", want, r.stderr)
		}
	}
	r = runHess(t, "equilibrium", "--adiabatic", "testdata/equilibrium/aqueous-brine.hess")
	if r.code != exitFindings || r.stdout != "" || !strings.Contains(r.stderr, "aqueous feed") {
		t.Errorf("--adiabatic on an aqueous feed: exit %d\n%s%s", r.code, r.stdout, r.stderr)
	}
}
