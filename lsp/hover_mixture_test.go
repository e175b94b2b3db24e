package lsp

import (
	"math"
	"strconv"
	"strings"
	"testing"
	"time"

	"hess/thermo"
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

// TestHoverFeedEquilibrium: the hover over a feed shows its equilibrium
// composition at its own temperature and pressure, solved by the worker
// after publishing: the water-gas shift from 1:1 CO/H2O, whose closed form
// is x = √K/(1+√K) (data: NIST-JANAF 1998 at 298.15 K, Cp = 0).
func TestHoverFeedEquilibrium(t *testing.T) {
	dir := t.TempDir()
	uri := fileURI(dir, "feed.hess")
	text := `species CO(g) { hf -110.527 kJ/mol s 197.653 J/mol/K }
species H2O(g) { hf -241.826 kJ/mol s 188.834 J/mol/K }
species CO2(g) { hf -393.522 kJ/mol s 213.795 J/mol/K }
species H2(g) { hf 0 kJ/mol s 130.680 J/mol/K }
reaction shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)
mixture feed { temperature 800 K pressure 10 bar CO(g) 1 mol H2O(g) 1 mol }
`
	c := startServer(t, Options{})
	var res InitializeResult
	c.mustCall("initialize", map[string]any{"capabilities": map[string]any{}}, &res)
	start := time.Now()
	c.open(uri, text, 1)
	c.waitDiagnostics(uri, atVersion(1))
	var got string
	for i := 0; i < 200; i++ {
		var h *Hover
		c.mustCall("textDocument/hover", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: uri}, Position: pos(5, 10)}, &h)
		if h != nil {
			got = h.Contents.Value
		}
		if !strings.Contains(got, "being computed") {
			break
		}
		time.Sleep(5 * time.Millisecond)
	}
	t.Logf("open to equilibrium hover: %v", time.Since(start))
	dH := (-393.522 + 110.527 + 241.826) * 1000
	dS := 213.795 + 130.680 - 197.653 - 188.834
	K := math.Exp(-(dH - 800*dS) / (thermo.R * 800))
	x := math.Sqrt(K) / (1 + math.Sqrt(K))
	for _, want := range []string{"a feed of 2 species", "equilibrium at 800 K, 10 bar (reactions basis)",
		"CO2(g)`: " + strconv.FormatFloat(x, 'g', 5, 64) + " mol", "heat from the feed"} {
		if !strings.Contains(got, strings.TrimPrefix(want, "`")) && !strings.Contains(got, strings.ReplaceAll(want, "`", "")) {
			t.Errorf("feed hover lacks %q:\n%s", want, got)
		}
	}
}

// TestHoverFeedTooLarge: on a network past the hover's bound (species ×
// reactions), the hover says so instead of solving.
func TestHoverFeedTooLarge(t *testing.T) {
	dir := t.TempDir()
	uri := fileURI(dir, "unit.hess")
	text := bigNetwork(2500) + "mixture feed { temperature 700 K pressure 20 bar c5i0(g) 1 mol H2(g) 2 mol }\n"
	c := startServer(t, Options{})
	var res InitializeResult
	c.mustCall("initialize", map[string]any{"capabilities": map[string]any{}}, &res)
	c.open(uri, text, 1)
	c.waitDiagnostics(uri, atVersion(1))
	line := uint32(strings.Count(text, "\n") - 1)
	var got string
	for i := 0; i < 200; i++ {
		var h *Hover
		c.mustCall("textDocument/hover", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: uri}, Position: pos(line, 10)}, &h)
		if h != nil {
			got = h.Contents.Value
		}
		if !strings.Contains(got, "being computed") {
			break
		}
		time.Sleep(5 * time.Millisecond)
	}
	if !strings.Contains(got, "too large to solve for a hover") {
		t.Errorf("hover over a feed of a large network:\n%s", got)
	}
}

// TestHoverFeedOpenToGas: a feed open to a gas held fixed is a solution
// that hess equilibrium solves with the network's activity model; the
// hover says so instead of offering the ideal feed path, which refuses it.
func TestHoverFeedOpenToGas(t *testing.T) {
	dir := t.TempDir()
	uri := fileURI(dir, "pond.hess")
	text := `species H2O(l) { gf -237.129 kJ/mol }
species H+(aq) { gf 0 kJ/mol }
species CO2(g) { gf -394.359 kJ/mol }
species CaCO3(cr) { gf -1128.79 kJ/mol }
mixture pond { temperature 298.15 K pressure 1 atm H2O(l) 1 kg CaCO3(cr) 0.01 mol CO2(g) 0.0004 atm fixed }
`
	c := startServer(t, Options{})
	var res InitializeResult
	c.mustCall("initialize", map[string]any{"capabilities": map[string]any{}}, &res)
	c.open(uri, text, 1)
	c.waitDiagnostics(uri, atVersion(1))
	var h *Hover
	c.mustCall("textDocument/hover", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: uri}, Position: pos(4, 10)}, &h)
	if h == nil || !strings.Contains(h.Contents.Value, "hess equilibrium gives its pH") || strings.Contains(h.Contents.Value, "no feed") {
		t.Errorf("hover over a feed open to a fixed gas:\n%+v", h)
	}
}
