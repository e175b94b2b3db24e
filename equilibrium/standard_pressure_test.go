package equilibrium

import (
	"math"
	"strings"
	"testing"

	"hess/lang"
	"hess/network"
	"hess/thermo"
)

// Water formation from NIST-JANAF (1998) 298.15 K data at 1 bar:
// H2 130.680, O2 205.152, H2O(g) 188.834 J/mol/K; ΔfH°(H2O, g) =
// −241.826 kJ/mol. The 1-atm library has each gas entropy lowered by
// R·ln 1.01325 (0.10945 J/mol/K), as a table written at 1 atm gives them.
const (
	gasesAt1Bar = `settings { standard-pressure 1 bar }
species H2(g) { hf 0 kJ/mol s 130.680 J/mol/K }
species O2(g) { hf 0 kJ/mol s 205.152 J/mol/K }
species H2O(g) { hf -241.826 kJ/mol s 188.834 J/mol/K }
`
	gasesAt1Atm = `settings { standard-pressure 1 atm }
species H2(g) { hf 0 kJ/mol s 130.57055 J/mol/K }
species O2(g) { hf 0 kJ/mol s 205.04255 J/mol/K }
species H2O(g) { hf -241.826 kJ/mol s 188.72455 J/mol/K }
`
)

func loadFiles(t *testing.T, files map[string]string) *network.Network {
	t.Helper()
	src := memSource{}
	for name, text := range files {
		src[name] = []byte(text)
	}
	n := network.Load("root.hess", src, network.Options{})
	for _, d := range n.Diagnostics {
		if d.Severity == lang.Error {
			t.Fatalf("%v", d)
		}
	}
	return n
}

func log10KOf(t *testing.T, n *network.Network, name string, T float64) float64 {
	t.Helper()
	tb := ReactionTable(n, n.LookupReaction(name), []float64{T})
	if tb == nil || !tb.Rows[0].Valid {
		t.Fatalf("%s: no row at %g K", name, T)
	}
	return tb.Rows[0].Log10K
}

// TestStandardPressureLibraries: the same reaction from a 1-atm library and
// from a 1-bar one gives the same K once converted, and changing only the
// root's pressure moves log10 K by −Δn·log10(1.01325).
func TestStandardPressureLibraries(t *testing.T) {
	const rx = "reaction w: H2(g) + 1/2 O2(g) <-> H2O(g)\n"
	bar := loadFiles(t, map[string]string{"root.hess": `include "lib.hess"` + "\n" + rx, "lib.hess": gasesAt1Bar})
	atm := loadFiles(t, map[string]string{"root.hess": `include "lib.hess"` + "\n" + rx, "lib.hess": gasesAt1Atm})
	rootAtm := loadFiles(t, map[string]string{"root.hess": "settings { pressure 1 atm }\n" + `include "lib.hess"` + "\n" + rx, "lib.hess": gasesAt1Bar})
	for _, T := range []float64{298.15, 350} {
		kb, ka := log10KOf(t, bar, "w", T), log10KOf(t, atm, "w", T)
		if math.Abs(kb-ka) > 1e-6 {
			t.Errorf("%g K: log10 K from the 1-bar library %.7f, from the 1-atm one %.7f", T, kb, ka)
		}
		// Δn = −1/2: log10 K(1 atm) − log10 K(1 bar) = +½·log10(1.01325).
		want := 0.5 * math.Log10(thermo.Atm/thermo.Bar)
		if got := log10KOf(t, rootAtm, "w", T) - kb; math.Abs(got-want) > 1e-9 {
			t.Errorf("%g K: root at 1 atm moves log10 K by %.7f, want %.7f", T, got, want)
		}
	}
	// The 1-bar log10 K at 298.15 K from the same data: ΔrG° = ΔrH° − T·ΔrS°.
	ds := 188.834 - 130.680 - 0.5*205.152
	want := -(-241826 - thermo.T298*ds) / (thermo.R * thermo.T298 * math.Ln10)
	if got := log10KOf(t, bar, "w", thermo.T298); math.Abs(got-want) > 1e-9 {
		t.Errorf("log10 K = %.9f, by hand %.9f", got, want)
	}
	for _, d := range atm.Diagnostics {
		if d.Code == "misplaced-settings" {
			t.Errorf("a library's standard-pressure block is misplaced: %v", d)
		}
	}
}

// TestStandardPressureOwnData: a logk written in a 1-atm file is converted
// to the network's 1 bar by −Δn·log10(1.01325), and an included file's
// settings block holding anything else is still misplaced.
func TestStandardPressureOwnData(t *testing.T) {
	n := loadFiles(t, map[string]string{
		"root.hess": `include "lib.hess"` + "\n",
		"lib.hess": `settings { standard-pressure 1 atm }
species CaCO3(cr), CaO(cr), CO2(g)
reaction calcine: CaCO3(cr) <-> CaO(cr) + CO2(g) { logk -22.8 }
`})
	got := log10KOf(t, n, "calcine", thermo.T298)
	// Δn = +1: K(1 bar) = K(1 atm)·(1.01325/1).
	if want := -22.8 + math.Log10(thermo.Atm/thermo.Bar); math.Abs(got-want) > 1e-9 {
		t.Errorf("log10 K at 1 bar = %.7f, want %.7f", got, want)
	}
	bad := network.Load("root.hess", memSource{
		"root.hess": []byte(`include "lib.hess"` + "\n"),
		"lib.hess":  []byte("settings { standard-pressure 1 atm\n tolerance 1 kJ/mol }\n"),
	}, network.Options{})
	found := false
	for _, d := range bad.Diagnostics {
		found = found || d.Code == "misplaced-settings"
	}
	if !found {
		t.Errorf("a library's block with tolerance is not misplaced-settings: %v", bad.Diagnostics)
	}
}

// TestUnstatedPressureWarning: a file with gas data that states no
// standard pressure beside one that does is named.
func TestUnstatedPressureWarning(t *testing.T) {
	n := network.Load("root.hess", memSource{
		"root.hess": []byte(`include "lib.hess"
species N2(g) { hf 0 kJ/mol s 191.609 J/mol/K }
species NO(g) { hf 91.29 kJ/mol s 210.76 J/mol/K }
reaction fix: 1/2 N2(g) + 1/2 O2(g) <-> NO(g)
`),
		"lib.hess": []byte(gasesAt1Atm),
	}, network.Options{})
	var msgs []string
	for _, d := range n.Diagnostics {
		if d.Code == "unstated-pressure" {
			msgs = append(msgs, d.Message)
		}
	}
	if len(msgs) != 1 || !strings.Contains(msgs[0], "root.hess state no standard pressure") || !strings.Contains(msgs[0], "lib.hess states 1.01325 bar") {
		t.Errorf("unstated-pressure: %q", msgs)
	}
}
