package network

import (
	"fmt"
	"path/filepath"
	"strings"
	"testing"
)

func loadNearText(t *testing.T, src string) *Network {
	t.Helper()
	root, err := filepath.Abs("near.hess")
	if err != nil {
		t.Fatal(err)
	}
	return Load(root, Overlay{Files: map[string][]byte{root: []byte(src)}, Base: Disk{}}, Options{})
}

// TestSpeciesSuggestion: an undeclared species names the declared one it is
// close to, with or without its state tag; a far name gets no suggestion.
func TestSpeciesSuggestion(t *testing.T) {
	n := loadNearText(t, `species CaCO3(cr), CaO(cr), CO2(g), H2O(l)
reaction a: CaC03 <-> CaO(cr) + CO2(g)
reaction b: CaCO3(cr) <-> CaO(cr) + C02(g)
reaction c: caco3(cr) <-> CaO(cr) + CO2(g)
reaction d: Xe(g) <-> Xe(g)
`)
	want := map[int]string{
		2: `species CaC03 is not declared; did you mean "CaCO3(cr)"?`,
		3: `species C02(g) is not declared; did you mean "CO2(g)"?`,
		4: `did you mean "CaCO3(cr)"?`,
	}
	got := map[int]string{}
	for _, d := range n.Diagnostics {
		if d.Code == "undefined-species" {
			got[d.Subject.Start.Line] = d.Message
		}
	}
	for line, w := range want {
		if !strings.Contains(got[line], w) {
			t.Errorf("line %d: %q, want %q", line, got[line], w)
		}
	}
	if strings.Contains(got[5], "did you mean") {
		t.Errorf("line 5: %q suggests a far name", got[5])
	}
}

// TestSpeciesSuggestionScale: the suggestion comes from an index, so many
// undeclared references among many species stay cheap, and it still finds
// the near name.
func TestSpeciesSuggestionScale(t *testing.T) {
	var b strings.Builder
	for i := 0; i < 3000; i++ {
		fmt.Fprintf(&b, "species Q%dXO(g)\n", i)
	}
	for i := 0; i < 3000; i++ {
		fmt.Fprintf(&b, "reaction r%d: Q%dX0(g) <-> Q%dXO(g)\n", i, i, i)
	}
	n := loadNearText(t, b.String())
	var hits int
	for _, d := range n.Diagnostics {
		if d.Code == "undefined-species" && strings.Contains(d.Message, "did you mean") {
			hits++
		}
	}
	if hits != 3000 {
		t.Errorf("%d of 3000 undeclared references got a suggestion", hits)
	}
}

// TestUnitSuggestion: unit messages name the unit once and suggest the
// unit that was likely meant.
func TestUnitSuggestion(t *testing.T) {
	n := loadNearText(t, `settings { temperatures 25 C }
species H2O(g) {
  hf -241.826 kJ
  s 188.834 kj/mol/K
  cp 33.6 J/molK
}
species H2(g) { hf 0 kJ/mol  s 130.68 J/K }
species O2(g) { hf 0 kJ/mol  s 205.15 J/mol/K }
reaction burn: 2 H2(g) + O2(g) <-> 2 H2O(g)
`)
	want := map[int]string{
		1: `unknown unit "C"; did you mean "degC"?`,
		3: `found kJ (energy); did you mean "kJ/mol"?`,
		4: `unknown unit symbol "kj" in "kj/mol/K"; did you mean "kJ/mol/K"?`,
		5: `did you mean "J/mol/K"?`,
		7: `did you mean "J/mol/K"?`,
	}
	got := map[int]string{}
	for _, d := range n.Diagnostics {
		if d.Code == "unit-mismatch" {
			got[d.Subject.Start.Line] = d.Message
		}
	}
	for line, w := range want {
		if !strings.Contains(got[line], w) {
			t.Errorf("line %d: %q, want %q", line, got[line], w)
		}
	}
	for line, msg := range got {
		if strings.Count(msg, `"C"`) > 1 || strings.HasPrefix(msg, "C:") || strings.HasPrefix(msg, "kj/mol/K:") {
			t.Errorf("line %d repeats the unit: %q", line, msg)
		}
	}
}

// TestOtherNameSuggestions: combination terms, state tags and lint
// settings name what was likely meant.
func TestOtherNameSuggestions(t *testing.T) {
	n := loadNearText(t, `settings { lint unused-specis off }
phase melt { convention pure }
species CO(g), O2(g), CO2(g), H2(g), H2O(g)
species Fe(meltt), Fe(gas)
reaction burn: 2 CO(g) + O2(g) <-> 2 CO2(g)
reaction shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)
reaction both: 2 H2(g) + O2(g) <-> 2 H2O(g) = brun - 2 shift
`)
	want := []string{
		`lint names no known check "unused-specis"; did you mean "unused-species"?`,
		`state tag (meltt) is neither built in (g, l, s, cr, aq) nor a declared phase; did you mean (melt)?`,
		`state tag (gas) is neither built in (g, l, s, cr, aq) nor a declared phase; did you mean (g)?`,
		`reaction brun is not defined; did you mean "burn"?`,
	}
	var all []string
	for _, d := range n.Diagnostics {
		all = append(all, d.Message)
	}
	for _, w := range want {
		found := false
		for _, m := range all {
			if strings.Contains(m, w) {
				found = true
			}
		}
		if !found {
			t.Errorf("no diagnostic says %q; got:\n%s", w, strings.Join(all, "\n"))
		}
	}
}

// BenchmarkUndeclaredSuggestions compiles 10 000 species and 2 000
// reactions whose every species reference is a slip (0 for O), so that each
// of the 4 000 references looks for a suggestion; compare with the same
// network written correctly (sub-benchmark "correct").
func BenchmarkUndeclaredSuggestions(b *testing.B) {
	for _, tc := range []struct{ name, o string }{{"slips", "0"}, {"correct", "O"}} {
		var s strings.Builder
		for a := 1; a <= 20; a++ {
			for h := 1; h <= 50; h++ {
				for o := 1; o <= 10; o++ {
					fmt.Fprintf(&s, "species C%dH%dO%d(g)\n", a, h, o)
				}
			}
		}
		for i := 0; i < 2000; i++ {
			a, h := i%20+1, i%50+1
			fmt.Fprintf(&s, "reaction r%d: C%dH%d%s2(g) <-> C%dH%d%s3(g)\n", i, a, h, tc.o, a, h, tc.o)
		}
		src := []byte(s.String())
		root, _ := filepath.Abs("bench.hess")
		b.Run(tc.name, func(b *testing.B) {
			for i := 0; i < b.N; i++ {
				Load(root, Overlay{Files: map[string][]byte{root: src}, Base: Disk{}}, Options{})
			}
		})
	}
}
