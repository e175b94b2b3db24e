package equilibrium

import (
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"hess/lang"
	"hess/network"
)

// TestAqueousFeed reads feeds given in amounts as aqueous systems: water as
// a mass, calcite in mol, air's CO2 held fixed. Calcite saturates in both
// half a kilogram and a kilogram of water, so the molalities (intensive)
// agree with those of the mixture that lists water and calcite without
// numbers, and the amounts dissolved scale with the water.
func TestAqueousFeed(t *testing.T) {
	root, err := filepath.Abs(filepath.Join("testdata", "aqueous", "carbonate.hess"))
	if err != nil {
		t.Fatal(err)
	}
	src, err := os.ReadFile(root)
	if err != nil {
		t.Fatal(err)
	}
	text := strings.Replace(string(src), "settings {", "settings {\n  activity davies", 1) + `
mixture half {
  temperature 25 degC
  pressure 1 atm
  H2O(l) 0.5 kg
  CaCO3(cr) 0.01 mol
  CO2(g) 0.000316228 atm fixed
}
mixture closed {
  temperature 25 degC
  pressure 1 atm
  H2O(l) 55.50847 mol
  CaCO3(cr) 0.001 mol
}
`
	n := network.Load(root, network.Overlay{Files: map[string][]byte{root: []byte(text)}, Base: network.Disk{}}, network.Options{})
	for _, d := range n.Diagnostics {
		if d.Severity == lang.Error {
			t.Fatalf("%s:%d: %s: %s", d.Subject.File, d.Subject.Start.Line, d.Code, d.Message)
		}
	}
	calcite, ca := species(t, n, "CaCO3(cr)"), species(t, n, "Ca^2+(aq)")
	for _, c := range []struct {
		name    string
		aqueous bool
	}{{"half", true}, {"closed", true}, {"open-calcite", false}} {
		if got := IsAqueousFeed(n, n.LookupMixture(c.name)); got != c.aqueous {
			t.Errorf("%s: IsAqueousFeed %v, want %v", c.name, got, c.aqueous)
		}
	}
	half, err := AqueousFromMixture(n, n.LookupMixture("half"))
	if err != nil {
		t.Fatal(err)
	}
	// 0.5 kg → mol through the formula's molar mass → kg through M_w: the
	// two molar masses agree to their rounding.
	if math.Abs(half.WaterKg-0.5) > 1e-4 || half.Feed[calcite] != 0.01 || len(half.Fixed) != 1 {
		t.Fatalf("half: %+v", half)
	}
	closed, err := AqueousFromMixture(n, n.LookupMixture("closed"))
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(closed.WaterKg-1) > 1e-4 || closed.Feed[calcite] != 0.001 || len(closed.Fixed) != 0 {
		t.Fatalf("closed: %+v", closed)
	}
	open, err := AqueousFromMixture(n, n.LookupMixture("open-calcite"))
	if err != nil {
		t.Fatal(err)
	}
	rHalf, rOpen := solve(t, n, half), solve(t, n, open)
	a, _ := rHalf.Solute(ca)
	b, _ := rOpen.Solute(ca)
	if math.Abs(a.Molality/b.Molality-1) > 1e-8 || math.Abs(rHalf.PH-rOpen.PH) > 1e-8 {
		t.Errorf("half a kg: Ca %g mol/kg, pH %.8f; 1 kg: %g, %.8f", a.Molality, rHalf.PH, b.Molality, rOpen.PH)
	}
	if math.Abs(a.Amount/b.Amount*rOpen.WaterKg/rHalf.WaterKg-1) > 1e-8 {
		t.Errorf("Ca dissolved %g mol in %g kg, %g in %g kg: not in proportion", a.Amount, rHalf.WaterKg, b.Amount, rOpen.WaterKg)
	}
	// Closed to the air, 1 mmol of calcite in a kilogram of water: the
	// solubility without CO2 is about 0.1 mmol/kg, so calcite stays.
	rClosed := solve(t, n, closed)
	if m, _ := rClosed.Mineral(calcite); !m.Present || math.Abs(m.SI) > 1e-6 {
		t.Errorf("closed: calcite %+v, want present at saturation", m)
	}
}
