package lang

import (
	"strings"
	"testing"
)

// TestUnclosedBlock: a statement that ends inside a block names the block
// and where it opened, and points there.
func TestUnclosedBlock(t *testing.T) {
	for _, tc := range []struct {
		src, want string
		line, col int
	}{
		{"species H2(g) {\n  hf 0 kJ/mol\n\nspecies O2(g)\n", `the species block opened at line 1, column 15 has no closing "}"`, 1, 15},
		{"reaction r: A(g) <-> B(g) {\n  dh 1 kJ/mol\n", `the reaction block opened at line 1, column 27 has no closing "}"`, 1, 27},
		{"species X(g) {\n  shomate 298 K to 1000 K { 1 2 3 4 5 6 7 8\n}\n", `the species block opened at line 1, column 14`, 1, 14},
		{"mixture m {\n  temperature 300 K\n", `the mixture block opened at line 1, column 11`, 1, 11},
		{"settings {\n  pressure 1 bar\n", `the settings block opened at line 1, column 10`, 1, 10},
	} {
		_, diags := Parse("t.hess", []byte(tc.src))
		if len(diags) != 1 || !strings.Contains(diags[0].Message, tc.want) {
			t.Errorf("%q: diagnostics %v, want one with %q", tc.src, diags, tc.want)
			continue
		}
		rel := diags[0].Related
		if len(rel) != 1 || rel[0].Span.Start.Line != tc.line || rel[0].Span.Start.Column != tc.col {
			t.Errorf("%q: related %v, want the brace at %d:%d", tc.src, rel, tc.line, tc.col)
		}
	}
	// A block that is closed, and an error that is not at the end, say
	// nothing of braces.
	for _, src := range []string{"species X(g) { hf 0 kJ/mol } }\n", "species X(g) { hf kJ/mol }\n"} {
		_, diags := Parse("t.hess", []byte(src))
		for _, d := range diags {
			if strings.Contains(d.Message, "no closing") {
				t.Errorf("%q: %q", src, d.Message)
			}
		}
	}
}

// TestPlusSpacing: terms joined by "+" without spaces are a syntax error
// that says spaces are needed, whichever side lacks them.
func TestPlusSpacing(t *testing.T) {
	for _, tc := range []struct {
		src, want string
	}{
		{"reaction b: 2 CO(g)+O2(g) -> 2 CO2(g)\n", `"CO(g)+O2(g)" is two terms: terms need spaces around "+" (write CO(g) + O2(g))`},
		{"reaction b: CH4(g) + H2O(g) <-> CO(g)+3 H2(g)\n", `terms need spaces around "+"`},
		{"reaction b: 2 CO(g) +O2(g) -> 2 CO2(g)\n", `found "+O2(g)"; terms need spaces around "+"`},
		{"reaction b: 2 CO(g)+ O2(g) -> 2 CO2(g)\n", `found "O2(g)"; terms need spaces around "+"`},
	} {
		_, diags := Parse("t.hess", []byte(tc.src))
		if len(diags) != 1 || diags[0].Code != "syntax" || !strings.Contains(diags[0].Message, tc.want) {
			t.Errorf("%q: diagnostics %v, want a syntax error with %q", tc.src, diags, tc.want)
		}
	}
	// Charges are not terms.
	for _, src := range []string{"reaction d: AgCl(s) <-> Ag+(aq) + Cl-(aq)\n", "reaction e: Na+(aq) + e- <-> Na(s)\n"} {
		if _, diags := Parse("t.hess", []byte(src)); len(diags) > 0 {
			t.Errorf("%q: %v", src, diags)
		}
	}
}
