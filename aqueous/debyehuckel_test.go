package aqueous

import (
	"math"
	"testing"

	"hess/thermo"
)

// TestDebyeHuckelConstants derives the textbook constants of
// A = 1.82483e6 √ρ/(εT)^{3/2} and B = 50.2916 √ρ/(εT)^{1/2} (ρ in g/cm³) from
// the CODATA constants e, ε0, k, N_A instead of trusting them. The textbook
// numbers come from older constants; they agree to 3e−5.
func TestDebyeHuckelConstants(t *testing.T) {
	for _, T := range []float64{273.15, 298.15, 333.15, 373.15} {
		p, err := ParamsAt(T)
		if err != nil {
			t.Fatal(err)
		}
		rho := p.Density / 1000 // g/cm³
		et := p.Permittivity * T
		a := 1.82483e6 * math.Sqrt(rho) / math.Pow(et, 1.5)
		b := 50.2916 * math.Sqrt(rho) / math.Sqrt(et)
		if rel := math.Abs(p.A/a - 1); rel > 3e-5 {
			t.Errorf("T %g: A = %.6f, textbook constant gives %.6f (rel %.1e)", T, p.A, a, rel)
		}
		if rel := math.Abs(p.B/b - 1); rel > 3e-5 {
			t.Errorf("T %g: B = %.6f, textbook constant gives %.6f (rel %.1e)", T, p.B, b, rel)
		}
	}
	// The constants themselves, recomputed here from CODATA 2018 (thermo and
	// Epsilon0): A·(εT)^{3/2}/√ρ and B·(εT)^{1/2}/√ρ with ρ = 1 g/cm³.
	e := thermo.ElementaryCharge
	kA := e * e * e * math.Sqrt(2*thermo.NA*1000) / (8 * math.Pi * math.Ln10 * math.Pow(Epsilon0*thermo.KB, 1.5))
	kB := math.Sqrt(2*thermo.NA*e*e*1000/(Epsilon0*thermo.KB)) * 1e-10
	if math.Abs(kA/1.82483e6-1) > 3e-5 || math.Abs(kB/50.2916-1) > 3e-5 {
		t.Errorf("CODATA constants give %.6g and %.6g, textbook 1.82483e6 and 50.2916", kA, kB)
	}
}

// TestDebyeHuckelTabulated compares A and B with published tabulations.
//
// Malmberg & Maryott's permittivity (78.30 at 25 °C) is, in their words,
// about 0.3 % below the value accepted before 1956; the geochemical
// tabulations rest on higher values (Helgeson & Kirkham's fit gives ≈ 78.47 at
// 25 °C), so their A is lower by up to 0.3 % and B by 0.1 %. Against our own
// correlations' tabulation (Robinson & Stokes) the check is tight.
func TestDebyeHuckelTabulated(t *testing.T) {
	type row struct{ tC, A, B float64 }
	// Helgeson & Kirkham, Am. J. Sci. 274 (1974) 1089, as reprinted in W. M.
	// White, Geochemistry (Wiley 2013), Table 3.2 (molality scale, saturation
	// pressure).
	// At 100 °C their permittivity lies below Malmberg & Maryott's 55.72, so
	// the sign of the gap turns: our A is 0.0039 and B 0.0008 low there.
	hk := []row{{0, 0.4911, 0.3244}, {25, 0.5092, 0.3283}, {50, 0.5336, 0.3325}, {75, 0.5639, 0.3371}, {100, 0.5998, 0.3422}}
	for _, r := range hk {
		p, err := ParamsAt(zeroCelsius + r.tC)
		if err != nil {
			t.Fatal(err)
		}
		tolA, tolB := 0.0025, 0.0006
		if r.tC == 100 {
			tolA, tolB = 0.0045, 0.001
		}
		if math.Abs(p.A-r.A) > tolA || math.Abs(p.B-r.B) > tolB {
			t.Errorf("%g °C: A = %.4f, B = %.4f; Helgeson & Kirkham %.4f, %.4f (within %.4f, %.4f)", r.tC, p.A, p.B, r.A, r.B, tolA, tolB)
		}
	}
	// A second tabulation at 0, 25, 60 °C (Kielland-table appendix of a
	// groundwater text, hydrogeologistswithoutborders.org "Appendix IV:
	// Debye–Hückel equation and Kielland table"): A 0.4883, 0.5085, 0.5425;
	// B 0.3241, 0.3281, 0.3338. It rests on an older permittivity still, and
	// lies up to 0.0035 below in A.
	other := []row{{0, 0.4883, 0.3241}, {25, 0.5085, 0.3281}, {60, 0.5425, 0.3338}}
	for _, r := range other {
		p, _ := ParamsAt(zeroCelsius + r.tC)
		if math.Abs(p.A-r.A) > 0.004 || math.Abs(p.B-r.B) > 0.0008 {
			t.Errorf("%g °C: A = %.4f, B = %.4f; tabulated %.4f, %.4f (within 0.004, 0.0008)", r.tC, p.A, p.B, r.A, r.B)
		}
	}
	// Robinson & Stokes, Electrolyte Solutions (2nd ed. rev.), appendix 7.1
	// (from memory): A and B on the molarity scale computed with Malmberg &
	// Maryott's permittivity: A 0.4918, 0.5115, 0.5494 and B 0.3248, 0.3291,
	// 0.3371 at 0, 25, 60 °C. The molarity-scale values are A/√ρ and B/√ρ
	// (ρ in g/cm³). This is the tight check of our chain.
	rs := []row{{0, 0.4918, 0.3248}, {25, 0.5115, 0.3291}, {60, 0.5494, 0.3371}}
	for _, r := range rs {
		p, _ := ParamsAt(zeroCelsius + r.tC)
		s := math.Sqrt(p.Density / 1000)
		if math.Abs(p.A/s-r.A) > 0.00015 || math.Abs(p.B/s-r.B) > 0.00015 {
			t.Errorf("%g °C: A/√ρ = %.5f, B/√ρ = %.5f; Robinson & Stokes %.4f, %.4f", r.tC, p.A/s, p.B/s, r.A, r.B)
		}
	}
}

// TestDebyeHuckelAt25C records what the correlations give against the values
// the design asks for (A = 0.5091, B = 0.3283, Helgeson & Kirkham 1974 via
// REFERENCE-DATA). Malmberg & Maryott's permittivity gives A = 0.5108 and
// B = 0.3287: 0.0017 and 0.0004 above, the whole of it from ε (78.30 against
// Helgeson & Kirkham's ≈ 78.47), which enters A as ε^{-3/2}.
func TestDebyeHuckelAt25C(t *testing.T) {
	p, err := ParamsAt(thermo.T298)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(p.A-0.5108) > 0.00005 || math.Abs(p.B-0.3287) > 0.00005 {
		t.Errorf("A = %.5f, B = %.5f; want 0.5108, 0.3287 from Malmberg & Maryott and Kell", p.A, p.B)
	}
	// With ε scaled to 78.47 the same formulas give Helgeson & Kirkham's
	// numbers within their rounding: the gap is the permittivity alone.
	a := debyeHuckelA(thermo.T298, 78.47, p.Density)
	b := debyeHuckelB(thermo.T298, 78.47, p.Density)
	if math.Abs(a-0.5091) > 0.0001 || math.Abs(b-0.3283) > 0.00005 {
		t.Errorf("with ε = 78.47: A = %.5f, B = %.5f; want 0.5091, 0.3283", a, b)
	}
}

func TestBDotTable(t *testing.T) {
	// Helgeson (1969) Ḃ (from memory): 0.0374, 0.0410, 0.0438, 0.0460 at 0, 25,
	// 60, 100 °C; linear between.
	for _, c := range []struct{ tC, want float64 }{
		{0, 0.0374}, {25, 0.0410}, {60, 0.0438}, {100, 0.0460},
		{12.5, 0.0392}, {80, 0.0449},
	} {
		got, err := BDotAt(zeroCelsius + c.tC)
		if err != nil || math.Abs(got-c.want) > 1e-12 {
			t.Errorf("Ḃ(%g °C) = %v, %v; want %v", c.tC, got, err, c.want)
		}
	}
}
