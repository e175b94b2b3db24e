package lsp

import (
	"strings"
	"testing"
)

// TestHoverMixture: the hover over a mixture name shows the numbers of
// `hess approach` for each reaction and the summary line.
func TestHoverMixture(t *testing.T) {
	dir := t.TempDir()
	uri := fileURI(dir, "shift.hess")
	// NIST-JANAF 1998 values at 298.15 K; an invented composition with
	// every gas at 1 bar, so Q = 1 and ΔrG = ΔrG°(298.15 K) = −28.644 kJ/mol
	// (REFERENCE-DATA §3, derived from JANAF).
	text := `species CO(g) { hf -110.527 kJ/mol s 197.653 J/mol/K }
species H2O(g) { hf -241.826 kJ/mol s 188.834 J/mol/K }
species CO2(g) { hf -393.522 kJ/mol s 213.795 J/mol/K }
species H2(g) { hf 0 kJ/mol s 130.680 J/mol/K }
reaction shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)
mixture unit { temperature 298.15 K CO(g) 1 bar H2O(g) 1 bar CO2(g) 1 bar H2(g) 1 bar }
mixture bad { temperature 298.15 K CO(g) -1 bar H2O(g) 1 bar CO2(g) 1 bar H2(g) 1 bar }
species Na+(aq) { gf -261.905 kJ/mol }
species Cl-(aq) { gf -131.228 kJ/mol }
mixture brine { temperature 298.15 K Na+(aq) 0.1 mol/kg Cl-(aq) 0.1 mol/kg }
`
	c := startServer(t, Options{})
	var res InitializeResult
	c.mustCall("initialize", map[string]any{"capabilities": map[string]any{}}, &res)
	c.open(uri, text, 1)
	c.waitDiagnostics(uri, atVersion(1))
	hover := func(line, char uint32) string {
		var h *Hover
		c.mustCall("textDocument/hover", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: uri}, Position: pos(line, char)}, &h)
		if h == nil {
			return ""
		}
		return h.Contents.Value
	}
	got := hover(5, 10)
	for _, want := range []string{"mixture unit at 298.15 K, 4 bar", "shift: Q = 1, K = 1.04",
		"ΔrG = -28.64 kJ/mol, forward", "0 reverse, 0 at equilibrium", "1 reaction runs forward"} {
		if !strings.Contains(got, want) {
			t.Errorf("mixture hover lacks %q:\n%s", want, got)
		}
	}
	if got := hover(6, 10); !strings.Contains(got, "has errors, so it gives no numbers") {
		t.Errorf("hover over a bad mixture:\n%s", got)
	}
	// A solution shows its ionic strength (½ Σ m z² = 0.1 mol/kg) and γ;
	// the network chooses no model, so γ = 1.
	if got := hover(9, 10); !strings.Contains(got, "ideal activity model, I = 0.1 mol/kg") || !strings.Contains(got, "γ(Na+(aq)) = 1") {
		t.Errorf("hover over a solution:\n%s", got)
	}
}
