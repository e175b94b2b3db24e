package lsp

import (
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"github.com/sourcegraph/jsonrpc2"

	"hess/lang"
)

// gasesLib is an included species library (demo data of the hydrogen
// plant scenario).
const gasesLib = `# Gas species of the shift converter (demo library)
species CO(g) "carbon monoxide" {
  hf -110.527 kJ/mol
  s 197.653 J/mol/K
  cp 29.142 J/mol/K
  source "demo table, 298.15 K"
}
species H2O(g) "steam" {
  hf -241.826 kJ/mol
  s 188.834 J/mol/K  cp 33.590 J/mol/K
}
species CO2(g) "carbon dioxide" {
  hf -393.522 kJ/mol
  s 213.795 J/mol/K
  cp 37.129 J/mol/K
  source "demo table, 298.15 K"
}
species H2(g) "hydrogen" {
  hf 0 kJ/mol
  s 130.680 J/mol/K  cp 28.836 J/mol/K
}
species CH4(g) "methane" {
  hf -74.873 kJ/mol
  s 186.251 J/mol/K
}
`

// plantBroken has two errors: a missing unit on a line whose label holds
// a character outside the Basic Multilingual Plane (two UTF-16 units, one
// code point, four bytes) and an imbalance on a line with ⇌ (one UTF-16
// unit, three bytes).
const plantBroken = `# Shift converter of a small hydrogen plant (demo scenario)
include "gases.hess"

species O2(g) "oxygen, 𝑂₂ for the burner" { hf 0 s 205.152 J/mol/K cp 29.376 J/mol/K }

reaction shift: CO(g) + H2O(g) ⇌ CO2(g) + H2(g)
reaction burn: 2 H2(g) + O2(g) ⇌ H2O(g)
`

func writeFile(t testing.TB, dir, name, text string) string {
	t.Helper()
	path := filepath.Join(dir, name)
	if err := os.WriteFile(path, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

// TestSession drives one whole editing session over a pipe.
func TestSession(t *testing.T) {
	dir := t.TempDir()
	writeFile(t, dir, "gases.hess", gasesLib)
	plantPath := writeFile(t, dir, "plant.hess", plantBroken)
	plant, gases := fileURI(dir, "plant.hess"), fileURI(dir, "gases.hess")

	c := startServer(t, Options{Version: "test"})
	res := c.initialize()
	if got := res.Capabilities.PositionEncoding; got != "utf-16" {
		t.Errorf("positionEncoding %q, want utf-16 when the client offers none", got)
	}
	caps := res.Capabilities
	if caps.TextDocumentSync.Change != syncIncremental || !caps.TextDocumentSync.OpenClose || !caps.HoverProvider ||
		!caps.DefinitionProvider || !caps.DocumentSymbolProvider || !caps.DocumentFormattingProvider {
		t.Errorf("capabilities %+v", caps)
	}
	if res.ServerInfo.Name != "hess" || res.ServerInfo.Version != "test" {
		t.Errorf("serverInfo %+v", res.ServerInfo)
	}

	// Open the broken file: both errors, with UTF-16 ranges.
	c.open(plant, plantBroken, 1)
	p := c.waitDiagnostics(plant, atVersion(1))
	var errs []Diagnostic
	for _, d := range p.Diagnostics {
		if d.Severity == severityError {
			errs = append(errs, d)
		}
	}
	if len(errs) != 2 {
		t.Fatalf("want 2 errors, got %+v", p.Diagnostics)
	}
	if d := errs[0]; d.Code != "missing-unit" || d.Range != rng(3, 48, 3, 49) || d.Source != "hess" {
		t.Errorf("first error %+v, want missing-unit at 3:48-3:49 (UTF-16; 3:47 would be code points, 3:52 bytes)", d)
	}
	if d := errs[1]; d.Code != "element-imbalance" || d.Range != rng(6, 15, 6, 39) || !strings.Contains(d.Message, "H: left 4, right 2") {
		t.Errorf("second error %+v, want element-imbalance at 6:15-6:39", d)
	}
	// The included file's findings are published under its own URI.
	g := c.waitDiagnostics(gases, anyPublish)
	if !slices.Equal(codes(g), []string{"unused-species"}) || g.Version != nil {
		t.Errorf("gases.hess: %+v", g)
	}

	// Fix both by incremental changes; the second edit lies after ⇌ and
	// the first after the astral character, so both need UTF-16 columns.
	c.change(plant, 2,
		insert(pos(3, 49), " kJ/mol"),
		insert(pos(6, 33), "2 "),
	)
	p = c.waitDiagnostics(plant, atVersion(2))
	if len(p.Diagnostics) != 0 {
		t.Fatalf("after the fix: %+v", p.Diagnostics)
	}
	fixed := strings.Replace(strings.Replace(plantBroken, "hf 0 s", "hf 0 kJ/mol s", 1), "⇌ H2O(g)", "⇌ 2 H2O(g)", 1)

	// Use methane: the warning in the included file goes away, and its URI
	// gets an empty list.
	c.change(plant, 3, insert(pos(7, 0), "reaction reform: CH4(g) + H2O(g) <-> CO(g) + 3 H2(g)\n"))
	fixed += "reaction reform: CH4(g) + H2O(g) <-> CO(g) + 3 H2(g)\n"
	if g := c.waitDiagnostics(gases, anyPublish); len(g.Diagnostics) != 0 {
		t.Errorf("gases.hess after methane is used: %+v", g)
	}
	c.waitDiagnostics(plant, atVersion(3))

	// Hover over a species reference (CO2(g) on line 5).
	var h Hover
	c.mustCall("textDocument/hover", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: plant}, Position: pos(5, 36)}, &h)
	for _, want := range []string{"species CO2(g) (carbon dioxide)", "formula CO2", "molar mass 44.009", "phase g (ideal-gas)",
		"hf -393.522 kJ/mol", "s 213.795 J/mol/K", "cp 37.129 J/mol/K", "source: demo table, 298.15 K"} {
		if !strings.Contains(h.Contents.Value, want) {
			t.Errorf("species hover lacks %q:\n%s", want, h.Contents.Value)
		}
	}
	if h.Contents.Kind != "plaintext" || h.Range == nil || *h.Range != rng(5, 33, 5, 39) {
		t.Errorf("species hover kind %q range %+v", h.Contents.Kind, h.Range)
	}

	// Hover over a reaction name: balance, ΔrG°, K and kind.
	c.mustCall("textDocument/hover", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: plant}, Position: pos(5, 11)}, &h)
	for _, want := range []string{"reaction shift: CO(g) + H2O(g) ⇌ CO2(g) + H2(g)", "balanced: C 1, H 2, O 2 on each side, charge 0",
		"ΔrG°(298.15 K) = -28.64 kJ/mol, K = 1.04e+05 (Kp), from species data", "two-way"} {
		if !strings.Contains(h.Contents.Value, want) {
			t.Errorf("reaction hover lacks %q:\n%s", want, h.Contents.Value)
		}
	}

	// Go to the definition of H2O(g), declared in the included file.
	var loc Location
	c.mustCall("textDocument/definition", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: plant}, Position: pos(5, 25)}, &loc)
	if loc.URI != gases || loc.Range != rng(7, 8, 7, 14) {
		t.Errorf("definition of H2O(g): %+v, want %s 7:8-7:14", loc, gases)
	}
	// And of the include path: the included file.
	c.mustCall("textDocument/definition", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: plant}, Position: pos(1, 12)}, &loc)
	if loc.URI != gases || loc.Range != rng(0, 0, 0, 0) {
		t.Errorf("definition of the include: %+v", loc)
	}

	// Document symbols.
	var syms []DocumentSymbol
	c.mustCall("textDocument/documentSymbol", DocumentSymbolParams{TextDocument: TextDocumentIdentifier{URI: plant}}, &syms)
	var names []string
	for _, s := range syms {
		names = append(names, s.Name)
	}
	if want := []string{"gases.hess", "O2(g)", "shift", "burn", "reform"}; !slices.Equal(names, want) {
		t.Errorf("symbols %v, want %v", names, want)
	}
	if len(syms) == 5 && (syms[2].Kind != symbolKindFunction || syms[2].SelectionRange != rng(5, 9, 5, 14) || syms[2].Range != rng(5, 0, 5, 47)) {
		t.Errorf("symbol shift: %+v", syms[2])
	}

	// Completion after "C" at the start of a new term.
	c.change(plant, 4, insert(pos(8, 0), "reaction more: C"))
	var list CompletionList
	c.mustCall("textDocument/completion", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: plant}, Position: pos(8, 16)}, &list)
	var labels []string
	for _, it := range list.Items {
		labels = append(labels, it.Label)
		if it.TextEdit == nil || it.TextEdit.Range != rng(8, 15, 8, 16) {
			t.Errorf("completion %s edits %+v, want the range of the word C", it.Label, it.TextEdit)
		}
	}
	slices.Sort(labels)
	if want := []string{"CH4(g)", "CO(g)", "CO2(g)"}; !slices.Equal(labels, want) {
		t.Errorf("completion of C in a reaction: %v, want %v", labels, want)
	}
	c.change(plant, 5, TextDocumentContentChangeEvent{Range: &Range{Start: pos(8, 0), End: pos(8, 16)}, Text: ""})
	c.waitDiagnostics(plant, atVersion(5))

	// Formatting: the edits turn the text into the canonical layout.
	var edits []TextEdit
	c.mustCall("textDocument/formatting", DocumentFormattingParams{TextDocument: TextDocumentIdentifier{URI: plant}, Options: FormattingOptions{TabSize: 2, InsertSpaces: true}}, &edits)
	got := applyEdits(t, fixed, edits)
	want, diags := lang.FormatSource(plantPath, []byte(fixed))
	if diags.HasErrors() || got != string(want) {
		t.Errorf("formatted text:\n%s\nwant:\n%s", got, want)
	}
	if got == fixed {
		t.Errorf("formatting changed nothing; the test text should not be canonical")
	}

	// Shutdown, then exit: status 0.
	var null any = "unset"
	c.mustCall("shutdown", nil, &null)
	if null != nil {
		t.Errorf("shutdown result %v, want null", null)
	}
	if err := c.call("textDocument/hover", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: plant}}, &h); !isCode(err, jsonrpc2.CodeInvalidRequest) {
		t.Errorf("request after shutdown: %v, want InvalidRequest", err)
	}
	c.notify("exit", nil)
	if st := <-c.status; st != 0 {
		t.Errorf("exit status %d after shutdown, want 0", st)
	}
	c.status <- 0 // for the cleanup
}

// applyEdits applies non-overlapping UTF-16 edits to text.
func applyEdits(t *testing.T, text string, edits []TextEdit) string {
	t.Helper()
	b := []byte(text)
	slices.SortFunc(edits, func(a, b TextEdit) int {
		if a.Range.Start.Line != b.Range.Start.Line {
			return int(b.Range.Start.Line) - int(a.Range.Start.Line)
		}
		return int(b.Range.Start.Character) - int(a.Range.Start.Character)
	})
	for _, e := range edits {
		ix := newLines(b)
		from, to := ix.offset(e.Range.Start, encUTF16), ix.offset(e.Range.End, encUTF16)
		b = append(b[:from:from], append([]byte(e.NewText), b[to:]...)...)
	}
	return string(b)
}

func isCode(err error, code int64) bool {
	e, ok := err.(*jsonrpc2.Error)
	return ok && e.Code == code
}

// TestUntitledBuffer drafts a network in a buffer that has no file yet: it
// gets its diagnostics, hover answers in it, and an include in it is
// reported as not found.
func TestUntitledBuffer(t *testing.T) {
	const uri = "untitled:Untitled-1"
	text := "species H2(g) { hf 0 kJ/mol  s 130.68 J/mol/K }\n" +
		"species O2(g) { hf 0 kJ/mol  s 205.15 J/mol/K }\n" +
		"species H2O(g) { hf -241.826 kJ/mol  s 188.835 J/mol/K }\n" +
		"reaction burn: H2(g) + O2(g) -> H2O(g)\n"
	c := startServer(t, Options{})
	c.initialize()
	c.open(uri, text, 1)
	p := c.waitDiagnostics(uri, atVersion(1))
	if !slices.Equal(codes(p), []string{"element-imbalance"}) {
		t.Fatalf("untitled buffer: %+v", p.Diagnostics)
	}
	var h Hover
	c.mustCall("textDocument/hover", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: uri}, Position: pos(3, 17)}, &h)
	if !strings.Contains(h.Contents.Value, "species H2(g)") {
		t.Errorf("hover in an untitled buffer:\n%s", h.Contents.Value)
	}
	c.change(uri, 2, TextDocumentContentChangeEvent{Text: "include \"gases.hess\"\n" + text})
	p = c.waitDiagnostics(uri, atVersion(2))
	if !slices.Contains(codes(p), "include-missing") {
		t.Errorf("include in an untitled buffer: %+v", p.Diagnostics)
	}
}
