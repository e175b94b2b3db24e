package chem

import (
	"math"
	"sync"
	"testing"
)

func TestBuiltinElementsComplete(t *testing.T) {
	all := BuiltinElements().Elements()
	if len(all) != 118 {
		t.Fatalf("%d elements, want 118", len(all))
	}
	seen := map[string]bool{}
	for i, e := range all {
		if e.Z != i+1 {
			t.Errorf("element %d has Z=%d", i+1, e.Z)
		}
		if !IsElementSymbol(e.Symbol) || len(e.Symbol) > 2 {
			t.Errorf("Z=%d: bad symbol %q", e.Z, e.Symbol)
		}
		if seen[e.Symbol] {
			t.Errorf("symbol %q twice", e.Symbol)
		}
		seen[e.Symbol] = true
		if e.Name == "" {
			t.Errorf("%s has no name", e.Symbol)
		}
		if e.HasWeight != (e.Weight > 0) || math.IsNaN(e.Weight) {
			t.Errorf("%s: weight %v, HasWeight %v", e.Symbol, e.Weight, e.HasWeight)
		}
		if got, ok := BuiltinElements().Lookup(e.Symbol); !ok || got != e {
			t.Errorf("Lookup(%q) = %v, %v", e.Symbol, got, ok)
		}
	}
}

// CIAAW 2021, as quoted in REFERENCE-DATA.md §4: conventional values for
// the interval elements, standard values (uncertainty dropped) otherwise.
func TestBuiltinWeightsReference(t *testing.T) {
	for sym, want := range map[string]float64{
		"H": 1.008, "C": 12.011, "N": 14.007, "O": 15.999, "S": 32.06, "Cl": 35.45,
		"Ca": 40.078, "Ag": 107.8682, "Na": 22.98976928, "Fe": 55.845,
	} {
		e, ok := BuiltinElements().Lookup(sym)
		if !ok || !e.HasWeight || e.Weight != want {
			t.Errorf("%s: %v, want weight %v (CIAAW 2021)", sym, e, want)
		}
	}
}

// CIAAW gives no standard atomic weight for elements without a stable
// isotope of characteristic terrestrial composition (from memory: Tc, Pm,
// Po to Ac, and everything after U); Th, Pa and U have one.
func TestBuiltinElementsWithoutWeight(t *testing.T) {
	without := map[int]bool{43: true, 61: true, 84: true, 85: true, 86: true, 87: true, 88: true, 89: true}
	for z := 93; z <= 118; z++ {
		without[z] = true
	}
	for _, e := range BuiltinElements().Elements() {
		if e.HasWeight == without[e.Z] {
			t.Errorf("%s (Z=%d): HasWeight %v", e.Symbol, e.Z, e.HasWeight)
		}
	}
}

func TestLookup(t *testing.T) {
	tab := BuiltinElements()
	for _, s := range []string{"", "h", "HE", "Xx", "Uue", "D"} {
		if e, ok := tab.Lookup(s); ok {
			t.Errorf("Lookup(%q) = %v, want none", s, e)
		}
	}
	if e, ok := tab.Lookup("Og"); !ok || e.Z != 118 || e.Name != "oganesson" || e.HasWeight {
		t.Errorf("Lookup(Og) = %v, %v", e, ok)
	}
	var nilTable *ElementTable
	if e, ok := nilTable.Lookup("Fe"); !ok || e.Z != 26 {
		t.Errorf("nil table Lookup(Fe) = %v, %v; want the built-in element", e, ok)
	}
}

func TestWith(t *testing.T) {
	base := BuiltinElements()
	d := base.With("D", 2.01410)
	if _, ok := base.Lookup("D"); ok {
		t.Fatal("With changed the built-in table")
	}
	e, ok := d.Lookup("D")
	if !ok || e != (Element{Symbol: "D", Weight: 2.01410, HasWeight: true}) {
		t.Errorf("D = %v, %v", e, ok)
	}
	if fe, ok := d.Lookup("Fe"); !ok || fe.Weight != 55.845 {
		t.Errorf("copy lost Fe: %v, %v", fe, ok)
	}
	both := d.With("T", 3.01605)
	if _, ok := d.Lookup("T"); ok {
		t.Error("With changed its receiver")
	}
	if _, ok := both.Lookup("D"); !ok {
		t.Error("second With lost D")
	}
	all := both.Elements()
	if len(all) != 120 || all[118].Symbol != "D" || all[119].Symbol != "T" {
		t.Errorf("Elements() ends with %v, want D and T after the 118", all[len(all)-2:])
	}

	for _, w := range []float64{0, -1, math.NaN(), math.Inf(1)} {
		e, _ := base.With("Q", w).Lookup("Q")
		if e.HasWeight {
			t.Errorf("With(Q, %v): HasWeight true", w)
		}
	}

	// Replacing a chemical element in the copy leaves the original alone.
	c13 := base.With("C", 13.003355)
	if e, _ := c13.Lookup("C"); e.Weight != 13.003355 || e.Z != 0 {
		t.Errorf("replaced C = %v", e)
	}
	if e, _ := base.Lookup("C"); e.Weight != 12.011 || e.Z != 6 {
		t.Errorf("built-in C changed to %v", e)
	}
}

func TestElementTableConcurrent(t *testing.T) {
	var wg sync.WaitGroup
	for i := range 8 {
		wg.Add(1)
		go func() {
			defer wg.Done()
			tab := BuiltinElements().With("D", 2.014+float64(i))
			for range 200 {
				if _, ok := BuiltinElements().Lookup("O"); !ok {
					t.Error("O missing")
				}
				if _, ok := tab.Lookup("D"); !ok {
					t.Error("D missing")
				}
				if _, err := ParseFormula("D2SO4*H2O", tab); err != nil {
					t.Error(err)
				}
			}
		}()
	}
	wg.Wait()
}

func TestIsElementSymbol(t *testing.T) {
	for s, want := range map[string]bool{
		"H": true, "He": true, "Uue": true, "D": true,
		"": false, "h": false, "HE": false, "Abcd": false, "C1": false, "É": false,
	} {
		if got := IsElementSymbol(s); got != want {
			t.Errorf("IsElementSymbol(%q) = %v, want %v", s, got, want)
		}
	}
}
