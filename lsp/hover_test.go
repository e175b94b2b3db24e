package lsp

import (
	"strings"
	"testing"
)

func TestHoverMarkdown(t *testing.T) {
	dir := t.TempDir()
	uri := fileURI(dir, "salt.hess")
	text := `species CuSO4*5H2O(s) "blue_vitriol [demo]" { hf -2279.6 ± 1.5 kJ/mol s 300.4 J/mol/K source "demo *table*" }
species H2O(l) { hf -285.83 kJ/mol s 69.95 J/mol/K }
species CuSO4(s) { hf -771.36 kJ/mol s 109.2 J/mol/K }
reaction dry: CuSO4*5H2O(s) <-> CuSO4(s) + 5 H2O(l)
reaction wet: CuSO4(s) + 5 H2O(l) <-> CuSO4*5H2O(s) = - dry
reaction ghost: Q(g) <-> Q(g)
`
	c := startServer(t, Options{})
	var res InitializeResult
	c.mustCall("initialize", map[string]any{"capabilities": map[string]any{
		"textDocument": map[string]any{"hover": map[string]any{"contentFormat": []string{"markdown", "plaintext"}}},
	}}, &res)
	c.open(uri, text, 1)
	c.waitDiagnostics(uri, atVersion(1))
	hover := func(line, char uint32) string {
		var h *Hover
		c.mustCall("textDocument/hover", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: uri}, Position: pos(line, char)}, &h)
		if h == nil {
			return ""
		}
		if h.Contents.Kind != "markdown" {
			t.Errorf("hover kind %q, want markdown when the client offers it", h.Contents.Kind)
		}
		return h.Contents.Value
	}
	got := hover(0, 10)
	for _, want := range []string{"species `CuSO4*5H2O(s)` (blue\\_vitriol \\[demo\\])", "formula CuH10O9S", "molar mass 249.6",
		"phase s (pure)", "hf -2279.6 ± 1.5 kJ/mol", "source: demo \\*table\\*"} {
		if !strings.Contains(got, want) {
			t.Errorf("species hover lacks %q:\n%s", want, got)
		}
	}
	got = hover(4, 10)
	for _, want := range []string{"reaction `wet`: `CuSO4(s) + 5 H2O(l) <-> CuSO4*5H2O(s)`", "combination: - dry",
		"balanced: Cu 1, H 10, O 9, S 1 on each side, charge 0", "(K)"} {
		if !strings.Contains(got, want) {
			t.Errorf("reaction hover lacks %q:\n%s", want, got)
		}
	}
	if got := hover(5, 17); !strings.Contains(got, "species `Q(g)` is not declared") {
		t.Errorf("hover over an undeclared species:\n%s", got)
	}
	got = hover(5, 11)
	if !strings.Contains(got, "balance unknown") || !strings.Contains(got, "cannot be computed") {
		t.Errorf("hover over a reaction with an undeclared species:\n%s", got)
	}
	var loc *Location
	c.mustCall("textDocument/definition", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: uri}, Position: pos(5, 17)}, &loc)
	if loc != nil {
		t.Errorf("definition of an undeclared species: %+v, want null", loc)
	}
	c.mustCall("textDocument/definition", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: uri}, Position: pos(4, 66)}, &loc)
	if loc == nil || loc.URI != uri || loc.Range != rng(3, 9, 3, 12) {
		t.Errorf("definition of dry from the combination: %+v", loc)
	}
}
