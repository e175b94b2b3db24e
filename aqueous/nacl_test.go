package aqueous

import (
	"math"
	"testing"

	"hess/thermo"
)

// Measured mean activity coefficients of NaCl in water at 25 °C, from
// Robinson & Stokes, Electrolyte Solutions (2nd ed. rev., 1959), appendix
// tables, as listed in REFERENCE-DATA (from memory). Their appendix 8.10 starts
// at 0.1 mol/kg; the lower molalities are R&S's text tables of the dilute
// range (from memory). The CRC table of Hamer & Wu (J. Phys. Chem. Ref. Data 1
// (1972) 1047) agrees within 0.001 (from memory).
var naclGamma = []struct{ m, gamma float64 }{
	{0.001, 0.965},
	{0.005, 0.927},
	{0.01, 0.902},
	{0.05, 0.819},
	{0.1, 0.778},
	{0.5, 0.681},
	{1.0, 0.657},
}

// Kielland's ion-size parameters (J. Am. Chem. Soc. 59 (1937) 1675), as
// reprinted in W. M. White, Geochemistry (Wiley 2013) from Garrels & Christ:
// Na+ 4.0–4.5 Å (4 taken), Cl− 3 Å.
var (
	sodium   = Solute{Charge: 1, Size: 4}
	chloride = Solute{Charge: -1, Size: 3}
)

func naclMeanGamma(t *testing.T, m Model, molality float64) float64 {
	t.Helper()
	p, err := ParamsAt(thermo.T298)
	if err != nil {
		t.Fatal(err)
	}
	lg, err := MeanLogGamma(m, sodium, chloride, molality, p) // I = m for a 1:1 salt
	if err != nil {
		t.Fatal(err)
	}
	return math.Pow(10, lg)
}

// TestNaClMeanActivity checks each model within what it is known to reach:
//   - Davies: within 0.005 up to 0.1 mol/kg (the design's requirement), and
//     at its nominal limit, 0.5 mol/kg, it overshoots NaCl by 0.052 (0.733
//     against 0.681): Davies is a generic curve, not a fit to one salt, so
//     0.06 there;
//   - extended Debye–Hückel with Kielland's sizes: within 0.005 up to
//     0.01 mol/kg; with these sizes it undershoots NaCl by about 0.017 at
//     0.1 mol/kg, so 0.02 there (a larger å would fit NaCl better, but the
//     sizes are per ion, not fitted to one salt);
//   - B-dot with the same sizes and Helgeson's Ḃ: within 0.005 up to
//     0.01 mol/kg, 0.012 to 0.1 and 0.03 to 1 mol/kg, its range.
func TestNaClMeanActivity(t *testing.T) {
	tol := map[string]func(m float64) float64{
		NameDavies: func(m float64) float64 {
			if m <= 0.1 {
				return 0.005
			}
			return 0.06
		},
		NameDebyeHuckel: func(m float64) float64 {
			if m <= 0.01 {
				return 0.005
			}
			return 0.02
		},
		NameBDot: func(m float64) float64 {
			switch {
			case m <= 0.01:
				return 0.005
			case m <= 0.1:
				return 0.012
			}
			return 0.03
		},
	}
	for name, tolOf := range tol {
		model, _ := ByName(name)
		for _, c := range naclGamma {
			if c.m > model.ValidUpTo() {
				continue
			}
			got := naclMeanGamma(t, model, c.m)
			t.Logf("%s: γ±(NaCl, %g) = %.4f, measured %.3f", name, c.m, got, c.gamma)
			if d := math.Abs(got - c.gamma); d > tolOf(c.m) {
				t.Errorf("%s: γ±(NaCl, %g mol/kg) = %.4f, measured %.3f (R&S): off by %.4f > %.3g",
					name, c.m, got, c.gamma, d, tolOf(c.m))
			}
		}
	}
}

// TestNaClIdealFails shows the ideal model failing by design: already at
// 0.001 mol/kg it misses the measured γ± by more than Davies' 0.005.
func TestNaClIdealFails(t *testing.T) {
	for _, c := range naclGamma {
		got := naclMeanGamma(t, Ideal{}, c.m)
		if got != 1 {
			t.Errorf("ideal γ± = %v, want 1", got)
		}
		if math.Abs(got-c.gamma) <= 0.005 {
			t.Errorf("ideal model within 0.005 of γ±(NaCl, %g) = %.3f: the measured data say otherwise", c.m, c.gamma)
		}
	}
}

// TestNaClOsmotic compares the osmotic coefficient from the Gibbs–Duhem
// relation with NaCl at 25 °C: φ = 0.9324 at 0.1 mol/kg and 0.9355 at
// 1 mol/kg, so a_w = 0.9669 (Robinson & Stokes appendix 8.10, from memory).
func TestNaClOsmotic(t *testing.T) {
	p, _ := ParamsAt(thermo.T298)
	nacl := func(m float64) []Solute {
		na, cl := sodium, chloride
		na.Molality, cl.Molality = m, m
		return []Solute{na, cl}
	}
	for _, c := range []struct {
		model Model
		m     float64
		phi   float64
		tol   float64
	}{
		{Davies{}, 0.1, 0.9324, 0.005},
		{DebyeHuckel{}, 0.1, 0.9324, 0.01},
		{BDot{}, 0.1, 0.9324, 0.01},
		{BDot{}, 1.0, 0.9355, 0.03},
	} {
		w := WaterActivity(c.model, nacl(c.m), p)
		if w.Method != WaterGibbsDuhem {
			t.Errorf("%s: method %v", c.model.Name(), w.Method)
		}
		if math.Abs(w.Osmotic-c.phi) > c.tol {
			t.Errorf("%s: φ(NaCl, %g) = %.4f, measured %.4f (R&S), tolerance %g", c.model.Name(), c.m, w.Osmotic, c.phi, c.tol)
		}
	}
	// The common-practice approximation at 1 mol/kg NaCl: 1 − 0.017·2 = 0.966,
	// against a_w = 0.9669 (R&S, from memory).
	w := WaterActivity(noOsmotic{Davies{}}, nacl(1), p)
	if w.Method != WaterApproximate || math.Abs(w.Activity-0.966) > 1e-12 || math.Abs(w.Activity-0.9669) > 0.002 {
		t.Errorf("approximate a_w = %v (%v), want 0.966", w.Activity, w.Method)
	}
}

// noOsmotic hides a model's osmotic relation.
type noOsmotic struct{ Model }
