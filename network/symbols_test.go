package network

import (
	"path/filepath"
	"strings"
	"testing"
)

// memFiles is a file source held in memory, by absolute path.
type memFiles map[string]string

func (m memFiles) ReadFile(path string) ([]byte, error) {
	if s, ok := m[path]; ok {
		return []byte(s), nil
	}
	return Disk{}.ReadFile(filepath.Join("/nonexistent", path))
}

const symbolsRoot = `include "lib/gases.hess"
include "missing.hess"
element D { mass 2.014 g/mol }
phase melt { convention solution }
species D2(g), HD(g)
reaction shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)
reaction back: CO2(g) + H2(g) <-> CO(g) + H2O(g) = - shift
reaction odd: CO(g) <-> C(cr) + X(g)
mixture outlet { temperature 600 K CO(g) 0.2 H2(g) 0.8 }
`

const symbolsLib = `species CO(g) "carbon monoxide" { hf -110.5 kJ/mol s 197.7 J/mol/K }
species H2O(g) { hf -241.8 kJ/mol s 188.8 J/mol/K }
species CO2(g) { hf -393.5 kJ/mol s 213.8 J/mol/K }
species H2(g) { hf 0 kJ/mol s 130.7 J/mol/K }
species C(cr)
`

func symbolsNetwork(t *testing.T) *Network {
	t.Helper()
	return Load("/w/plant.hess", memFiles{"/w/plant.hess": symbolsRoot, "/w/lib/gases.hess": symbolsLib}, Options{})
}

// at is the byte offset of the n-th occurrence (from 1) of sub in text,
// plus shift.
func at(t *testing.T, text, sub string, n, shift int) int {
	t.Helper()
	off := -1
	for i := 0; i < n; i++ {
		j := strings.Index(text[off+1:], sub)
		if j < 0 {
			t.Fatalf("%q occurs fewer than %d times", sub, n)
		}
		off += 1 + j
	}
	return off + shift
}

func TestSymbolAt(t *testing.T) {
	net := symbolsNetwork(t)
	cases := []struct {
		file, sub string
		n, shift  int
		kind      SymbolKind
		name      string
		decl      bool
		defFile   string // "" when the symbol has no definition
	}{
		{"/w/plant.hess", "CO2(g)", 1, 2, SymbolSpecies, "CO2(g)", false, "/w/lib/gases.hess"},
		{"/w/plant.hess", "CO2(g)", 1, 6, SymbolSpecies, "CO2(g)", false, "/w/lib/gases.hess"}, // just after the name
		{"/w/plant.hess", "shift", 1, 0, SymbolReaction, "shift", true, "/w/plant.hess"},
		{"/w/plant.hess", "shift", 2, 3, SymbolReaction, "shift", false, "/w/plant.hess"}, // in the combination
		{"/w/plant.hess", "X(g)", 1, 1, SymbolSpecies, "X(g)", false, ""},                 // undeclared
		{"/w/plant.hess", "HD(g)", 1, 0, SymbolSpecies, "HD(g)", true, "/w/plant.hess"},
		{"/w/plant.hess", "lib/gases", 1, 0, SymbolInclude, "lib/gases.hess", false, "/w/lib/gases.hess"},
		{"/w/plant.hess", "melt", 1, 1, SymbolPhase, "melt", true, "/w/plant.hess"},
		{"/w/plant.hess", "D {", 1, 0, SymbolElement, "D", true, "/w/plant.hess"},
		{"/w/plant.hess", "outlet", 1, 0, SymbolMixture, "outlet", true, "/w/plant.hess"},
		{"/w/plant.hess", "H2(g) 0.8", 1, 0, SymbolSpecies, "H2(g)", false, "/w/lib/gases.hess"},
		{"/w/lib/gases.hess", "H2O(g)", 1, 0, SymbolSpecies, "H2O(g)", true, "/w/lib/gases.hess"},
	}
	for _, c := range cases {
		text := symbolsRoot
		if c.file != "/w/plant.hess" {
			text = symbolsLib
		}
		off := at(t, text, c.sub, c.n, c.shift)
		s, ok := net.SymbolAt(c.file, off)
		if !ok || s.Kind != c.kind || s.Name != c.name || s.Declaration != c.decl {
			t.Errorf("%s at %q+%d: %+v (found %v), want kind %d name %s declaration %v", c.file, c.sub, c.shift, s, ok, c.kind, c.name, c.decl)
			continue
		}
		if s.Span.Start.Offset > off || off > s.Span.End.Offset {
			t.Errorf("%q: span %+v does not cover offset %d", c.sub, s.Span, off)
		}
		def, ok := s.Definition()
		if (c.defFile != "") != ok || (ok && def.File != c.defFile) {
			t.Errorf("%q: definition %+v (%v), want in %q", c.sub, def, ok, c.defFile)
		}
	}
	for _, off := range []int{at(t, symbolsRoot, "reaction", 1, 3), at(t, symbolsRoot, "<->", 1, 1), len(symbolsRoot) + 10, -1} {
		if s, ok := net.SymbolAt("/w/plant.hess", off); ok {
			t.Errorf("offset %d: found %+v, want nothing", off, s)
		}
	}
	if _, ok := net.SymbolAt("/w/other.hess", 3); ok {
		t.Errorf("a file outside the network has symbols")
	}
	if def, _ := (Symbol{Kind: SymbolSpecies, Species: net.LookupSpecies("CO(g)")}).Definition(); def.Start.Line != 1 || def.Start.Column != 9 {
		t.Errorf("CO(g) is declared at %+v, want 1:9", def.Start)
	}
}

func TestIncludes(t *testing.T) {
	net := symbolsNetwork(t)
	got := strings.Join(net.Includes(), " ")
	if want := "/w/lib/gases.hess /w/missing.hess"; got != want {
		t.Errorf("includes %q, want %q (missing ones too)", got, want)
	}
}

func TestOutline(t *testing.T) {
	net := symbolsNetwork(t)
	var got []string
	for _, d := range net.Outline("/w/plant.hess") {
		got = append(got, d.Name+"|"+d.Detail)
	}
	want := []string{
		"lib/gases.hess|include", "missing.hess|include", "D|element", "melt|solution",
		"D2(g)|D2", "HD(g)|DH", "shift|CO(g) + H2O(g) <-> CO2(g) + H2(g)",
		"back|CO2(g) + H2(g) <-> CO(g) + H2O(g)", "odd|CO(g) <-> C(cr) + X(g)", "outlet|mixture",
	}
	if strings.Join(got, "\n") != strings.Join(want, "\n") {
		t.Errorf("outline:\n%s\nwant:\n%s", strings.Join(got, "\n"), strings.Join(want, "\n"))
	}
	lib := net.Outline("/w/lib/gases.hess")
	if len(lib) != 5 || lib[0].Detail != "carbon monoxide" || lib[1].Detail != "H2O" {
		t.Errorf("library outline: %+v", lib)
	}
	for _, d := range append(lib, net.Outline("/w/plant.hess")...) {
		if d.NameSpan.Start.Offset < d.Span.Start.Offset || d.NameSpan.End.Offset > d.Span.End.Offset {
			t.Errorf("%s: name %+v outside the declaration %+v", d.Name, d.NameSpan, d.Span)
		}
	}
}

func TestBalance(t *testing.T) {
	net := Load("/w/b.hess", memFiles{"/w/b.hess": `species Fe^3+(aq), Fe^2+(aq), e-, O2(g), H2O(l), H2(g)
reaction red: Fe^3+(aq) + e- <-> Fe^2+(aq)
reaction burn: H2(g) + O2(g) <-> H2O(l)
reaction half: H2(g) + 1/2 O2(g) <-> H2O(l)
reaction ghost: Y(g) <-> H2(g)
`}, Options{})
	text := func(rx *Reaction) string {
		els, l, r, ok := rx.Balance()
		if !ok {
			return "unknown"
		}
		var parts []string
		for _, e := range els {
			parts = append(parts, e.Symbol+" "+e.Left.RatString()+"/"+e.Right.RatString())
		}
		return strings.Join(parts, ", ") + "; charge " + l.RatString() + "/" + r.RatString()
	}
	for name, want := range map[string]string{
		"red":  "Fe 1/1; charge 2/2",
		"burn": "H 2/2, O 2/1; charge 0/0",
		"half": "H 2/2, O 1/1; charge 0/0",
	} {
		if got := text(net.LookupReaction(name)); got != want {
			t.Errorf("%s: %s, want %s", name, got, want)
		}
	}
	if rx := net.LookupReaction("ghost"); rx == nil || text(rx) != "unknown" {
		t.Errorf("a reaction with an undeclared species has a balance")
	}
}
