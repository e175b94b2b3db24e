package lang

import (
	"fmt"
	"os"
	"path/filepath"
	"reflect"
	"runtime"
	"strings"
	"testing"
)

// parseOK parses src and fails the test on any diagnostic.
func parseOK(t *testing.T, src string) *File {
	t.Helper()
	f, diags := Parse("t.hess", []byte(src))
	if len(diags) != 0 {
		t.Fatalf("Parse(%q): unexpected diagnostics:\n%s", src, diagList(diags))
	}
	return f
}

func diagList(ds Diagnostics) string {
	var b strings.Builder
	for _, d := range ds {
		fmt.Fprintf(&b, "%d:%d: %s: %s\n", d.Subject.Start.Line, d.Subject.Start.Column, d.Code, d.Message)
	}
	return b.String()
}

// qtext prints a quantity as value[±sigma][ unit], or "nil".
func qtext(q *Quantity) string {
	if q == nil {
		return "nil"
	}
	return quantityText(q)
}

func eq(t *testing.T, what string, got, want any) {
	t.Helper()
	if fmt.Sprint(got) != fmt.Sprint(want) {
		t.Errorf("%s = %v, want %v", what, got, want)
	}
}

func TestParseStatements(t *testing.T) {
	tests := []struct {
		name  string
		src   string
		check func(t *testing.T, st *Statement)
	}{
		{"include", `include "gases.hess"`, func(t *testing.T, st *Statement) {
			eq(t, "path", st.Include.Path.Raw, `"gases.hess"`)
		}},
		{"settings", `settings {
			pressure 1 bar
			temperatures 298.15 K, 700 K to 1200 K by 100 K
			tolerance 0.5 kJ/mol
			lint unused-species off
			lint data-conflict error
		}`, func(t *testing.T, st *Statement) {
			it := st.Settings.Items
			if len(it) != 5 {
				t.Fatalf("%d settings, want 5", len(it))
			}
			eq(t, "pressure", qtext(it[0].Pressure), "1 bar")
			ts := it[1].Temperatures
			if len(ts) != 2 {
				t.Fatalf("%d temperature items, want 2", len(ts))
			}
			eq(t, "single", qtext(ts[0].From)+"|"+qtext(ts[0].To)+"|"+qtext(ts[0].By), "298.15 K|nil|nil")
			eq(t, "range", qtext(ts[1].From)+"|"+qtext(ts[1].To)+"|"+qtext(ts[1].By), "700 K|1200 K|100 K")
			eq(t, "tolerance", qtext(it[2].Tolerance), "0.5 kJ/mol")
			eq(t, "lint", it[3].Lint.Check.Name+" "+it[3].Lint.Level.Name, "unused-species off")
			eq(t, "lint 2", it[4].Lint.Check.Name+" "+it[4].Lint.Level.Name, "data-conflict error")
		}},
		{"empty settings", `settings {}`, func(t *testing.T, st *Statement) {
			eq(t, "items", len(st.Settings.Items), 0)
		}},
		{"element", `element D { mass 2.01410 g/mol }`, func(t *testing.T, st *Statement) {
			eq(t, "symbol", st.Element.Symbol.Name, "D")
			eq(t, "mass", qtext(st.Element.Mass), "2.01410 g/mol")
		}},
		{"element without mass", `element Xx {}`, func(t *testing.T, st *Statement) {
			eq(t, "mass", qtext(st.Element.Mass), "nil")
		}},
		{"phase", `phase melt { convention solution }`, func(t *testing.T, st *Statement) {
			eq(t, "name", st.Phase.Name.Name, "melt")
			eq(t, "convention", st.Phase.Convention.Name, "solution")
		}},
		{"phase ideal-gas", `phase vap { convention ideal-gas }`, func(t *testing.T, st *Statement) {
			eq(t, "convention", st.Phase.Convention.Name, "ideal-gas")
		}},
		{"species with data", `species CH4(g) "methane" {
			formula CH4
			hf -74.87 ± 0.3 kJ/mol
			gf -50.5 +- 0.1 kJ/mol
			s 186.25 J/mol/K
			cp 35.7 J/(mol*K)
			source "demo table"
			note "invented"
		}`, func(t *testing.T, st *Statement) {
			s := st.Species
			eq(t, "refs", len(s.Refs), 1)
			eq(t, "ref", s.Refs[0].Text, "CH4(g)")
			eq(t, "label", s.Label.Raw, `"methane"`)
			eq(t, "body", s.HasBody, true)
			p := s.Props
			if len(p) != 7 {
				t.Fatalf("%d properties, want 7", len(p))
			}
			eq(t, "formula", p[0].Formula.Formula.Text, "CH4")
			eq(t, "hf", p[1].Value.Key+" "+qtext(p[1].Value.Value), "hf -74.87 ± 0.3 kJ/mol")
			eq(t, "gf", p[2].Value.Key+" "+qtext(p[2].Value.Value), "gf -50.5 ± 0.1 kJ/mol")
			eq(t, "s", p[3].Value.Key+" "+qtext(p[3].Value.Value), "s 186.25 J/mol/K")
			eq(t, "cp", p[4].Value.Key+" "+qtext(p[4].Value.Value), "cp 35.7 J/(mol*K)")
			eq(t, "source", p[5].Text.Key+" "+p[5].Text.Text.Raw, `source "demo table"`)
			eq(t, "note", p[6].Text.Key+" "+p[6].Text.Text.Raw, `note "invented"`)
		}},
		{"polynomials", `species H2O(g) {
			shomate 500 K to 1700 K { 30.1 6.8 6.8 -2.5 0.08 -250.9 223.4 -241.8 }
			nasa7 200 K to 1000 K { 4.2 -2.0e-3 6.5e-6 -5.5e-9 1.8e-12 -3.0e4 -0.85 }
		}`, func(t *testing.T, st *Statement) {
			p := st.Species.Props
			eq(t, "kinds", p[0].Poly.Kind+" "+p[1].Poly.Kind, "shomate nasa7")
			eq(t, "range", qtext(p[0].Poly.From)+" to "+qtext(p[0].Poly.To), "500 K to 1700 K")
			eq(t, "coefficients", len(p[0].Poly.Coeffs), 8)
			eq(t, "last", p[1].Poly.Coeffs[6].Text, "-0.85")
			eq(t, "nasa7 coefficients", len(p[1].Poly.Coeffs), 7)
		}},
		{"bare species list", `species A(g), B(g), e-, OH-(aq)`, func(t *testing.T, st *Statement) {
			s := st.Species
			var names []string
			for _, r := range s.Refs {
				names = append(names, r.Text)
			}
			eq(t, "refs", names, []string{"A(g)", "B(g)", "e-", "OH-(aq)"})
			eq(t, "body", s.HasBody, false)
			eq(t, "label", s.Label == nil, true)
		}},
		{"empty species block", `species X(g) {}`, func(t *testing.T, st *Statement) {
			eq(t, "body", st.Species.HasBody, true)
			eq(t, "props", len(st.Species.Props), 0)
		}},
		{"reaction", `reaction reform: CH4(g) + H2O(g) <-> CO(g) + 3 H2(g)`, func(t *testing.T, st *Statement) {
			r := st.Reaction
			eq(t, "name", r.Name.Name, "reform")
			eq(t, "left", SideText(r.Left), "CH4(g) + H2O(g)")
			eq(t, "right", SideText(r.Right), "CO(g) + 3 H2(g)")
			eq(t, "coef", r.Right[1].Coef.Text, "3")
			eq(t, "no coef", r.Left[0].Coef == nil, true)
			eq(t, "arrow", r.Arrow.Text+" "+fmt.Sprint(r.Arrow.TwoWay()), "<-> true")
			eq(t, "combo", r.Combo == nil, true)
			eq(t, "body", r.HasBody, false)
		}},
		{"reaction with ions", `reaction ppt: Ag+(aq) + Cl-(aq) -> AgCl(s)`, func(t *testing.T, st *Statement) {
			r := st.Reaction
			eq(t, "left", SideText(r.Left), "Ag+(aq) + Cl-(aq)")
			eq(t, "arrow", r.Arrow.Text+" "+fmt.Sprint(r.Arrow.TwoWay()), "-> false")
		}},
		{"charged species before arrow", `reaction n: H+(aq) + OH- -> H2O(l)`, func(t *testing.T, st *Statement) {
			eq(t, "left", SideText(st.Reaction.Left), "H+(aq) + OH-")
		}},
		{"unicode arrows", `reaction u: A(g) ⇌ B(g)`, func(t *testing.T, st *Statement) {
			eq(t, "arrow", st.Reaction.Arrow.Text+" "+fmt.Sprint(st.Reaction.Arrow.TwoWay()), "⇌ true")
		}},
		{"unicode one-way", `reaction u: A(g) → B(g)`, func(t *testing.T, st *Statement) {
			eq(t, "arrow", st.Reaction.Arrow.Text+" "+fmt.Sprint(st.Reaction.Arrow.TwoWay()), "→ false")
		}},
		{"fraction and glued coefficients", `reaction w: H2(g) + 1/2 O2(g) -> H2O(g) + 2e-`, func(t *testing.T, st *Statement) {
			r := st.Reaction
			eq(t, "fraction", r.Left[1].Coef.Text, "1/2")
			eq(t, "electrons", r.Right[1].Coef.Text+" "+r.Right[1].Species.Text, "2 e-")
		}},
		{"combination", `reaction overall: CH4(g) + 2 H2O(g) <-> CO2(g) + 4 H2(g) = reform + 2 shift - 1/2 other`, func(t *testing.T, st *Statement) {
			c := st.Reaction.Combo
			if c == nil || len(c.Terms) != 3 {
				t.Fatalf("combination %v", c)
			}
			var got []string
			for _, ct := range c.Terms {
				coef := ""
				if ct.Coef != nil {
					coef = ct.Coef.Text
				}
				got = append(got, fmt.Sprintf("[%s|%s|%s]", ct.Sign, coef, ct.Name.Name))
			}
			eq(t, "terms", got, []string{"[||reform]", "[+|2|shift]", "[-|1/2|other]"})
		}},
		{"reaction block", `reaction r: A(g) <-> B(g) {
			dg -10 kJ/mol
			dh -20 ± 1 kJ/mol
			ds -33 J/mol/K
			logk 3.2
			logk 1.5 +- 0.1 at 500 K
			rate A 3.5e15 cm3/mol/s n -0.5 Ea 80 kJ/mol
			reverse A 1e10 1/s Ea 90 kJ/mol
			source "demo"
		}`, func(t *testing.T, st *Statement) {
			p := st.Reaction.Props
			if len(p) != 8 {
				t.Fatalf("%d properties, want 8", len(p))
			}
			eq(t, "dg", p[0].Value.Key+" "+qtext(p[0].Value.Value), "dg -10 kJ/mol")
			eq(t, "dh", p[1].Value.Key+" "+qtext(p[1].Value.Value), "dh -20 ± 1 kJ/mol")
			eq(t, "ds", p[2].Value.Key+" "+qtext(p[2].Value.Value), "ds -33 J/mol/K")
			eq(t, "logk", p[3].LogK.Value.Text+fmt.Sprint(p[3].LogK.Sigma == nil, p[3].LogK.At == nil), "3.2true true")
			eq(t, "logk at", p[4].LogK.Value.Text+" "+p[4].LogK.Sigma.Text+" "+qtext(p[4].LogK.At), "1.5 0.1 500 K")
			r := p[5].Rate
			eq(t, "rate", r.Kind+" "+qtext(r.A)+" "+r.N.Text+" "+qtext(r.Ea), "rate 3.5e15 cm3/mol/s -0.5 80 kJ/mol")
			v := p[6].Rate
			eq(t, "reverse", v.Kind+" "+qtext(v.A)+" "+fmt.Sprint(v.N == nil)+" "+qtext(v.Ea), "reverse 1e10 1/s true 90 kJ/mol")
			eq(t, "source", p[7].Text.Text.Raw, `"demo"`)
		}},
		{"mixture", `mixture outlet {
			temperature 800 K
			pressure 20 bar
			CH4(g) 0.3
			H2(g) 2 bar
			Na+(aq) 0.1 mol/kg
			C(cr)
			NaCl(melt) 0.2
		}`, func(t *testing.T, st *Statement) {
			m := st.Mixture
			eq(t, "name", m.Name.Name, "outlet")
			it := m.Items
			if len(it) != 7 {
				t.Fatalf("%d items, want 7", len(it))
			}
			eq(t, "temperature", qtext(it[0].Temperature), "800 K")
			eq(t, "pressure", qtext(it[1].Pressure), "20 bar")
			member := func(i int) string {
				return it[i].Member.Species.Text + " " + qtext(it[i].Member.Amount)
			}
			eq(t, "fraction", member(2), "CH4(g) 0.3")
			eq(t, "partial pressure", member(3), "H2(g) 2 bar")
			eq(t, "molality", member(4), "Na+(aq) 0.1 mol/kg")
			eq(t, "pure", member(5), "C(cr) nil")
			eq(t, "solution", member(6), "NaCl(melt) 0.2")
		}},
		{"keywords as names", `reaction s: A -> n`, func(t *testing.T, st *Statement) {
			eq(t, "name", st.Reaction.Name.Name, "s")
			eq(t, "sides", SideText(st.Reaction.Left)+" "+SideText(st.Reaction.Right), "A n")
		}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			f := parseOK(t, tc.src)
			if len(f.Statements) != 1 {
				t.Fatalf("%d statements, want 1", len(f.Statements))
			}
			st := f.Statements[0]
			if st.Broken {
				t.Fatal("statement is marked broken")
			}
			set := 0
			for _, p := range []bool{st.Include != nil, st.Settings != nil, st.Element != nil, st.Phase != nil,
				st.Species != nil, st.Reaction != nil, st.Mixture != nil} {
				if p {
					set++
				}
			}
			if set != 1 {
				t.Fatalf("%d statement fields set, want 1", set)
			}
			if got := st.Span(); got.Start.Offset != 0 || got.End.Offset != len(tc.src) {
				t.Errorf("statement span %d..%d, want 0..%d", got.Start.Offset, got.End.Offset, len(tc.src))
			}
			tc.check(t, st)
		})
	}
}

func TestParseManyStatements(t *testing.T) {
	src := "# demo\ninclude \"a.hess\"\nspecies A(g) species B(g)\nreaction r: A(g) -> B(g) reaction q: B(g) -> A(g)\n"
	f := parseOK(t, src)
	if len(f.Statements) != 5 {
		t.Fatalf("%d statements, want 5", len(f.Statements))
	}
	if len(f.Comments) != 1 || f.Comments[0].Text != "# demo" {
		t.Errorf("comments %v", f.Comments)
	}
	if f.Name != "t.hess" {
		t.Errorf("file name %q", f.Name)
	}
}

func TestSpans(t *testing.T) {
	src := "species CO2(g) {\n  hf -393.51 ± 0.13 kJ/mol  # demo\n}\n" +
		"reaction ΔX: Fe^3+(aq) + e- -> Fe+(aq) = a - 2 b\n"
	f := parseOK(t, src)
	sp := f.Statements[0].Species
	rx := f.Statements[1].Reaction
	text := func(s Span) string { return src[s.Start.Offset:s.End.Offset] }
	tests := []struct {
		name     string
		span     Span
		text     string
		start    Pos
		end      Pos
		endEmpty bool
	}{
		{"species statement", f.Statements[0].Span(), "species CO2(g) {\n  hf -393.51 ± 0.13 kJ/mol  # demo\n}", Pos{1, 1, 0}, Pos{3, 2, 54}, false},
		{"species node", sp.Span(), "species CO2(g) {\n  hf -393.51 ± 0.13 kJ/mol  # demo\n}", Pos{1, 1, 0}, Pos{3, 2, 54}, false},
		{"ref", sp.Refs[0].Span(), "CO2(g)", Pos{1, 9, 8}, Pos{1, 15, 14}, false},
		{"property", sp.Props[0].Span(), "hf -393.51 ± 0.13 kJ/mol", Pos{2, 3, 19}, Pos{2, 27, 44}, false},
		{"quantity", sp.Props[0].Value.Value.Span(), "-393.51 ± 0.13 kJ/mol", Pos{2, 6, 22}, Pos{2, 27, 44}, false},
		{"sigma", sp.Props[0].Value.Value.Sigma.Span(), "0.13", Pos{2, 16, 33}, Pos{2, 20, 37}, false},
		{"unit", sp.Props[0].Value.Value.Unit.Span(), "kJ/mol", Pos{2, 21, 38}, Pos{2, 27, 44}, false},
		{"quantity end", sp.Props[0].Value.Value.EndSpan(), "", Pos{2, 27, 44}, Pos{2, 27, 44}, true},
		{"reaction name", rx.Name.Span(), "ΔX", Pos{4, 10, 64}, Pos{4, 12, 67}, false},
		{"term", rx.Left[0].Span(), "Fe^3+(aq)", Pos{4, 14, 69}, Pos{4, 23, 78}, false},
		{"electron", rx.Left[1].Span(), "e-", Pos{4, 26, 81}, Pos{4, 28, 83}, false},
		{"arrow", rx.Arrow.Span(), "->", Pos{4, 29, 84}, Pos{4, 31, 86}, false},
		{"combination", rx.Combo.Span(), "a - 2 b", Pos{4, 42, 97}, Pos{4, 49, 104}, false},
		{"combo term", rx.Combo.Terms[1].Span(), "- 2 b", Pos{4, 44, 99}, Pos{4, 49, 104}, false},
		{"reaction end", rx.EndSpan(), "", Pos{4, 49, 104}, Pos{4, 49, 104}, true},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			if got := text(tc.span); got != tc.text {
				t.Errorf("span covers %q, want %q", got, tc.text)
			}
			if tc.span.Start != tc.start || tc.span.End != tc.end {
				t.Errorf("span %+v..%+v, want %+v..%+v", tc.span.Start, tc.span.End, tc.start, tc.end)
			}
			if tc.span.File != "t.hess" {
				t.Errorf("span file %q", tc.span.File)
			}
		})
	}
	var nilNode *Node
	if nilNode.Span() != (Span{}) {
		t.Error("nil node has a span")
	}
	empty := Node{g: f.Statements[1].g, start: f.Statements[1].start, end: f.Statements[1].start}
	if s := empty.Span(); s.Start != s.End || s.Start.Offset != 55 {
		t.Errorf("tokenless node span %+v", s)
	}
}

func TestSyntaxErrors(t *testing.T) {
	tests := []struct {
		name string
		src  string
		msg  string // the whole message
		line int
		col  int
	}{
		{"not a statement", "hello world", `expected a statement (include, settings, element, phase, species, reaction, mixture), found "hello"`, 1, 1},
		{"missing colon", "reaction r1 A(g) -> B(g)", `expected ":", found "A(g)"`, 1, 13},
		{"missing arrow", "reaction r: A(g) B(g)", `expected an arrow (<-> or ->), found "B(g)"`, 1, 18},
		{"dangling plus", "reaction r: A(g) + -> B(g)", `expected a species, found "->"`, 1, 20},
		{"missing right side", "reaction r: A(g) ->", `expected a species, found end of statement`, 1, 20},
		{"missing reaction name", "reaction : A -> B", `expected a name, found ":"`, 1, 10},
		{"combination without sign", "reaction r: A -> B = a b", `expected end of statement, found "b"`, 1, 24},
		{"combination trailing sign", "reaction r: A -> B = a +", `expected a name, found end of statement`, 1, 25},
		{"unknown species property", "species X(g) {\n  bogus 3\n}", `expected a species property (formula, hf, gf, s, cp, size, setschenow, shomate, nasa7, source, note) or "}", found "bogus"`, 2, 3},
		{"unknown reaction property", "reaction r: A -> B {\n  k 3\n}", `expected a reaction property (dg, dh, ds, logk, rate, reverse, source) or "}", found "k"`, 2, 3},
		{"unknown setting", "settings { temperature 3 K }", `expected a setting (pressure, temperatures, tolerance, lint) or "}", found keyword "temperature"`, 1, 12},
		{"bad mixture item", "mixture m { 0.3 }", `expected a mixture item (temperature, pressure, or a species) or "}", found number 0.3`, 1, 13},
		{"missing number", "settings { pressure bar }", `expected a number, found "bar"`, 1, 21},
		{"missing temperature", "mixture m { temperature }", `expected a number, found "}"`, 1, 25},
		{"missing sigma", "species X(g) { hf 1 ± kJ/mol }", `expected a number, found "kJ/mol"`, 1, 23},
		{"sigma without number in a setting", "settings { pressure 1 ± bar }", `expected a number, found "bar"`, 1, 25},
		{"range without step", "settings { temperatures 1 K to 2 K }", `expected "by", found "}"`, 1, 36},
		{"list ends in comma", "settings { temperatures 1 K, }", `expected a temperature, found "}"`, 1, 30},
		{"missing Ea", "reaction r: A -> B { rate A 1 1/s }", `expected "Ea", found "}"`, 1, 35},
		{"bad coefficient", "species X(g) { shomate 1 K to 2 K { 1 x } }", `expected a coefficient or "}", found "x"`, 1, 39},
		{"polynomial without to", "species X(g) { nasa7 1 K 2 K { } }", `expected "to", found number 2`, 1, 26},
		{"element extra", "element D { mass 1 g/mol 3 }", `expected "}", found number 3`, 1, 26},
		{"element unknown", "element D { weight 1 }", `expected "mass" or "}", found "weight"`, 1, 13},
		{"phase without convention", "phase p { convention }", `expected a name, found "}"`, 1, 22},
		{"include without path", "include", `expected a string, found end of statement`, 1, 8},
		{"include two paths", `include "a" "b"`, `expected end of statement, found string "b"`, 1, 13},
		{"species without name", "species {", `expected a species, found "{"`, 1, 9},
		{"open block at end", "mixture m {", `expected a mixture item (temperature, pressure, or a species) or "}", found end of statement; the mixture block opened at line 1, column 11 has no closing "}"`, 1, 12},
		{"lint without level", "settings { lint unused-species }", `expected a name, found "}"`, 1, 32},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			f, diags := Parse("t.hess", []byte(tc.src))
			if len(diags) != 1 {
				t.Fatalf("got %d diagnostics, want 1:\n%s", len(diags), diagList(diags))
			}
			d := diags[0]
			if d.Code != "syntax" || d.Severity != Error {
				t.Errorf("diagnostic is %s %s", d.Code, d.Severity)
			}
			if d.Message != tc.msg {
				t.Errorf("message\n got  %s\n want %s", d.Message, tc.msg)
			}
			if d.Subject.Start.Line != tc.line || d.Subject.Start.Column != tc.col {
				t.Errorf("at %d:%d, want %d:%d", d.Subject.Start.Line, d.Subject.Start.Column, tc.line, tc.col)
			}
			if d.Subject.File != "t.hess" {
				t.Errorf("subject file %q", d.Subject.File)
			}
			if !d.Context.IsValid() || d.Context.Start.Offset > d.Subject.Start.Offset || d.Context.End.Offset < d.Subject.Start.Offset {
				t.Errorf("context %+v does not cover subject %+v", d.Context, d.Subject)
			}
			if f == nil {
				t.Fatal("Parse returned a nil file")
			}
			for _, st := range f.Statements {
				if !st.Broken {
					t.Error("a statement that failed is not marked broken")
				}
				if len(st.Tokens()) == 0 {
					t.Error("a broken statement keeps no tokens")
				}
			}
		})
	}
}

func TestRecovery(t *testing.T) {
	src := `# a network with three broken statements
species A(g), B(g), C(g)
reaction good1: A(g) -> B(g)
reaction bad1 A(g) -> B(g)
species D(g) { hf -1 kJ/mol }
reaction bad2: A(g) + -> C(g)
mixture m { temperature 300 K }
settings { pressure bar }
reaction good2: B(g) <-> C(g)
`
	f, diags := Parse("t.hess", []byte(src))
	if len(diags) != 3 {
		t.Fatalf("got %d diagnostics, want 3:\n%s", len(diags), diagList(diags))
	}
	for i, line := range []int{4, 6, 8} {
		if diags[i].Code != "syntax" || diags[i].Subject.Start.Line != line {
			t.Errorf("diagnostic %d: %s at line %d, want syntax at line %d", i, diags[i].Code, diags[i].Subject.Start.Line, line)
		}
	}
	var good []string
	broken := 0
	for _, st := range f.Statements {
		switch {
		case st.Broken:
			broken++
		case st.Reaction != nil:
			good = append(good, "reaction "+st.Reaction.Name.Name)
		case st.Species != nil:
			good = append(good, "species "+st.Species.Refs[0].Text)
		case st.Mixture != nil:
			good = append(good, "mixture "+st.Mixture.Name.Name)
		}
	}
	eq(t, "good statements", good, []string{"species A(g)", "reaction good1", "species D(g)", "mixture m", "reaction good2"})
	eq(t, "broken statements", broken, 3)
	// A broken statement keeps what was read of it.
	for _, st := range f.Statements {
		if st.Broken && st.Reaction != nil && st.Reaction.Name != nil && st.Reaction.Name.Name == "bad2" {
			return
		}
	}
	t.Error("the broken reaction bad2 kept no partial tree")
}

func TestMissingBraceStopsAtNextLine(t *testing.T) {
	src := "species X(g) {\n  hf 1 kJ/mol\nreaction r: X(g) -> Y(g)\nmixture m { temperature 300 K\n  species Y(g)\n"
	f, diags := Parse("t.hess", []byte(src))
	if len(diags) != 2 {
		t.Fatalf("got %d diagnostics, want 2:\n%s", len(diags), diagList(diags))
	}
	want := `expected a species property (formula, hf, gf, s, cp, size, setschenow, shomate, nasa7, source, note) or "}", found end of statement; the species block opened at line 1, column 14 has no closing "}"`
	if diags[0].Message != want || diags[0].Subject.Start != (Pos{2, 14, 28}) {
		t.Errorf("first diagnostic %q at %+v", diags[0].Message, diags[0].Subject.Start)
	}
	if diags[1].Subject.Start.Line != 4 {
		t.Errorf("second diagnostic at line %d, want 4", diags[1].Subject.Start.Line)
	}
	if len(f.Statements) != 4 {
		t.Fatalf("%d statements, want 4", len(f.Statements))
	}
	if r := f.Statements[1]; r.Broken || r.Reaction == nil || r.Reaction.Name.Name != "r" {
		t.Errorf("the reaction after the open block was not read: %+v", r)
	}
	if s := f.Statements[3]; s.Broken || s.Species == nil || s.Species.Refs[0].Text != "Y(g)" {
		t.Errorf("the species after the open mixture was not read: %+v", s)
	}
	// On the same line a statement keyword inside a block does not start a
	// statement: the block's error covers it.
	f, diags = Parse("t.hess", []byte("species X(g) { hf 1 kJ/mol reaction r: A -> B }\n"))
	if len(diags) != 1 || len(f.Statements) != 1 {
		t.Errorf("got %d diagnostics and %d statements, want 1 and 1", len(diags), len(f.Statements))
	}
}

func TestLexAndParseDiagnosticsTogether(t *testing.T) {
	f, diags := Parse("t.hess", []byte("species A(g) \"x\x00\"\nreaction r: A(g) -> \nspecies B(g)"))
	if len(diags) != 2 {
		t.Fatalf("got %d diagnostics, want 2:\n%s", len(diags), diagList(diags))
	}
	if !strings.Contains(diags[0].Message, "control character") || !strings.Contains(diags[1].Message, "expected a species") {
		t.Errorf("diagnostics:\n%s", diagList(diags))
	}
	if len(f.Statements) != 3 {
		t.Errorf("%d statements, want 3", len(f.Statements))
	}
}

func TestGrammarGolden(t *testing.T) {
	checkGolden(t, filepath.Join("testdata", "grammar.ebnf"), []byte(Grammar()+"\n"))
}

// referenceParse parses src the plain way, as a check on Parse: the whole
// file is lexed first, cut into statements by the same rule, and each
// statement is parsed on its own, serially, by its kind's parser.
func referenceParse(src []byte) ([]*Statement, []string) {
	toks, _, lexDiags := Lex("f.hess", src)
	source := NewSource("f.hess", string(src))
	var msgs []string
	for _, d := range lexDiags {
		msgs = append(msgs, fmt.Sprintf("%d:%d: %s", d.Subject.Start.Line, d.Subject.Start.Column, d.Message))
	}
	toks = toks[:len(toks)-1]
	var chunks [][]Token
	depth, start := 0, 0
	for i, t := range toks {
		if i > start && t.Type == Keyword && statementKeywords[t.Value] && (depth <= 0 || source.Pos(int(t.Offset)).Line != source.Pos(int(toks[i-1].Offset)).Line) {
			chunks = append(chunks, toks[start:i])
			start, depth = i, 0
		}
		if t.Type == Punct && t.Value == "{" {
			depth++
		}
		if t.Type == Punct && t.Value == "}" {
			depth--
		}
	}
	if start < len(toks) {
		chunks = append(chunks, toks[start:])
	}
	var stmts []*Statement
	for _, c := range chunks {
		if c[0].Type != Keyword || !statementKeywords[c[0].Value] {
			msgs = append(msgs, fmt.Sprintf("%d:%d: expected a statement (include, settings, element, phase, species, reaction, mixture), found %s%s",
				source.Pos(int(c[0].Offset)).Line, source.Pos(int(c[0].Offset)).Column, describe(c[0]), keywordHint(c[0])))
			continue
		}
		eof := Token{Type: EOF, Offset: int32(c[len(c)-1].End())}
		stream := append(append([]Token(nil), c...), eof)
		g := &tokenGroup{src: source, toks: stream}
		st := &Statement{Node: Node{g: g, start: 0, end: int32(len(c))}}
		cur := newCursor(g, 0, len(stream), nil)
		err := statementParsers[c[0].Value](cur, st)
		if err == nil && !isEnd(*cur.Peek()) {
			err = &syntaxError{found: *cur.Peek()}
		}
		if err != nil {
			d := syntaxDiag(source, c, err)
			msgs = append(msgs, fmt.Sprintf("%d:%d: %s", d.Subject.Start.Line, d.Subject.Start.Column, d.Message))
			st = &Statement{Broken: true}
		}
		stmts = append(stmts, st)
	}
	return stmts, msgs
}

// short quotes src for a message, cut to its first 200 bytes.
func short(src []byte) string {
	if len(src) > 200 {
		return fmt.Sprintf("%q… (%d bytes)", src[:200], len(src))
	}
	return fmt.Sprintf("%q", src)
}

// checkConformance compares Parse with referenceParse on src.
func checkConformance(t *testing.T, src []byte) {
	t.Helper()
	want, wantMsgs := referenceParse(src)
	f, diags := Parse("f.hess", src)
	var msgs []string
	for _, d := range diags {
		msgs = append(msgs, fmt.Sprintf("%d:%d: %s", d.Subject.Start.Line, d.Subject.Start.Column, d.Message))
	}
	if fmt.Sprintf("%q", msgs) != fmt.Sprintf("%q", wantMsgs) {
		t.Fatalf("diagnostics differ from the reference parse of %s\n got  %q\n want %q", short(src), msgs, wantMsgs)
	}
	if len(f.Statements) != len(want) {
		t.Fatalf("%d statements, reference has %d", len(f.Statements), len(want))
	}
	for i, st := range f.Statements {
		if st.Broken != want[i].Broken {
			t.Fatalf("statement %d: broken %v, reference %v", i, st.Broken, want[i].Broken)
		}
		if !st.Broken && !sameTree(reflect.ValueOf(st), reflect.ValueOf(want[i])) {
			t.Fatalf("statement %d differs from the reference parse of %s", i, short(src))
		}
	}
}

func TestParserConformance(t *testing.T) {
	var srcs [][]byte
	inputs, _ := filepath.Glob(filepath.Join("testdata", "format", "*.hess"))
	for _, in := range inputs {
		b, err := os.ReadFile(in)
		if err != nil {
			t.Fatal(err)
		}
		srcs = append(srcs, b)
	}
	srcs = append(srcs, []byte(`reaction r5: A(g) -> B(g) = reform shift
reaction r6: A(g) -> B(g) C(g)
include "a" "b"
species X(g) { hf 1 kJ/mol } extra
mixture m { temperature 1 K } }
settings { temperatures 1 K, 2 K to 3 K by 1 K } {
hello
species A(g),
reaction r7: A(g) -> B(g) { rate A 1 1/s n 2 }
`))
	big, _ := generateNetwork(256 << 10)
	srcs = append(srcs, big)
	for i, src := range srcs {
		t.Run(fmt.Sprint(i), func(t *testing.T) { checkConformance(t, src) })
	}
}

func TestEveryStatementKeywordHasAParser(t *testing.T) {
	if len(statementParsers) != len(statementKeywords) {
		t.Errorf("%d statement parsers for %d statement keywords", len(statementParsers), len(statementKeywords))
	}
	for k := range statementKeywords {
		if statementParsers[k] == nil {
			t.Errorf("no parser for statement keyword %q", k)
		}
	}
}

func TestBatchBoundary(t *testing.T) {
	// Statements are parsed in groups; a group can end between two tokens
	// that the lexer read in one go (`2species` is a number and a keyword).
	for _, n := range []int{groupStatements - 2, groupStatements - 1, groupStatements, 2*groupStatements - 1, 500} {
		src := strings.Repeat("species A(g)\n", n) + "species X(g) 2species Y(g)\nspecies Z(g)\n"
		t.Run(fmt.Sprint(n), func(t *testing.T) { checkConformance(t, []byte(src)) })
		f, diags := Parse("t.hess", []byte(src))
		if len(diags) != 1 || len(f.Statements) != n+3 {
			t.Errorf("n=%d: %d statements, diagnostics:\n%s", n, len(f.Statements), diagList(diags))
		}
	}
}

// TestParallelParseMatchesSerial parses a file of many groups, with syntax
// errors spread through it, on one processor and on four: the statements,
// their text and the diagnostics must be the same, in the same order.
func TestParallelParseMatchesSerial(t *testing.T) {
	var b strings.Builder
	for i := range 3000 {
		switch i % 97 {
		case 13:
			fmt.Fprintf(&b, "reaction r%d: A(g) -> -> B(g)\n", i)
		case 41:
			fmt.Fprintf(&b, "species S%d(g) { hf 1 kJ/mol\n", i) // missing }
		default:
			fmt.Fprintf(&b, "reaction r%d: 2 A(g) + B(g) <-> C(g) { dg %d kJ/mol }\n", i, i)
		}
	}
	src := []byte(b.String())
	defer runtime.GOMAXPROCS(runtime.GOMAXPROCS(0))
	var runs [2]string
	for i, procs := range []int{1, 4} {
		runtime.GOMAXPROCS(procs)
		f, diags := Parse("t.hess", src)
		var out strings.Builder
		for _, st := range f.Statements {
			fmt.Fprintf(&out, "%v %v %q\n", st.Span(), st.Broken, src[st.Span().Start.Offset:st.Span().End.Offset])
		}
		for _, d := range diags {
			fmt.Fprintf(&out, "%s %v %s\n", d.Code, d.Subject, d.Message)
		}
		runs[i] = out.String()
	}
	if runs[0] != runs[1] {
		t.Errorf("one processor and four parse differently")
	}
	if n := strings.Count(runs[0], "\n"); n < 3000+60 {
		t.Errorf("%d lines of statements and diagnostics, want at least 3060", n)
	}
}

// TestBrokenNodesKeepTheirStart checks that a node left part-way by a
// syntax error, read by hand or by participle, has an empty span where it
// started.
func TestBrokenNodesKeepTheirStart(t *testing.T) {
	src := "settings {\n  pressure\n}\nmixture m {\n  temperature\n}\nspecies A(g) {\n  hf\n}\nreaction r: A(g) -> \n"
	f, diags := Parse("b.hess", []byte(src))
	if len(diags) != 4 {
		t.Fatalf("want 4 syntax errors, got %v", diags)
	}
	at := func(s string) Span {
		off := strings.Index(src, s)
		line := strings.Count(src[:off], "\n") + 1
		col := off - strings.LastIndex(src[:off], "\n")
		p := Pos{Line: line, Column: col, Offset: off}
		return Span{File: "b.hess", Start: p, End: p}
	}
	st := f.Statements
	checks := []struct {
		name string
		got  Span
		want Span
	}{
		{"settings", st[0].Settings.Span(), at("settings")},
		{"setting", st[0].Settings.Items[0].Span(), at("pressure")},
		{"mixture", st[1].Mixture.Span(), at("mixture")},
		{"species", st[2].Species.Span(), at("species")},
		{"reaction", st[3].Reaction.Span(), at("reaction")},
	}
	for _, c := range checks {
		if c.got != c.want {
			t.Errorf("%s: span %+v, want %+v", c.name, c.got, c.want)
		}
	}
}
