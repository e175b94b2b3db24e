package aqueous

import (
	"errors"
	"math"
	"testing"
)

// fixed parameters, so the expected values below follow from the published
// forms by hand.
var fixedParams = Params{T: 298.15, A: 0.5, B: 0.33, BDot: 0.04}

func TestLogGammaForms(t *testing.T) {
	tests := []struct {
		model Model
		z     int
		size  float64
		I     float64
		want  float64
	}{
		// Davies: −A z² (√I/(1+√I) − 0.3 I)
		{Davies{}, 1, 0, 0.25, -0.5 * (0.5/1.5 - 0.075)},
		{Davies{}, 2, 0, 0.25, -0.5 * 4 * (0.5/1.5 - 0.075)},
		{Davies{}, -1, 9, 0.01, -0.5 * (0.1/1.1 - 0.003)}, // size ignored
		{Davies{}, -3, 0, 1, -0.5 * 9 * (0.5 - 0.3)},
		// extended Debye–Hückel: −A z² √I/(1 + B å √I)
		{DebyeHuckel{}, 1, 4, 0.25, -0.5 * 0.5 / (1 + 0.33*4*0.5)},
		{DebyeHuckel{}, 2, 6, 0.04, -0.5 * 4 * 0.2 / (1 + 0.33*6*0.2)},
		{DebyeHuckel{}, -1, 0, 0.01, -0.5 * 0.1}, // no size: limiting law
		{DebyeHuckel{}, 1, -3, 0.01, -0.5 * 0.1}, // invalid size counts as 0
		// B-dot: extended Debye–Hückel + Ḃ I
		{BDot{}, 1, 4, 0.25, -0.5*0.5/(1+0.33*4*0.5) + 0.04*0.25},
		{BDot{}, 3, 9, 1, -0.5*9/(1+0.33*9) + 0.04},
		{BDot{}, -2, 5, 0.5, -0.5*4*math.Sqrt(0.5)/(1+0.33*5*math.Sqrt(0.5)) + 0.02},
		// neutral (z = 0) and zero ionic strength
		{Davies{}, 0, 0, 0.5, 0},
		{DebyeHuckel{}, 0, 4, 0.5, 0},
		{BDot{}, 0, 4, 0.5, 0},
		{BDot{}, 2, 4, 0, 0},
		{Davies{}, 1, 0, -1, 0},
		{Ideal{}, 2, 4, 0.5, 0},
	}
	for _, tc := range tests {
		got := tc.model.LogGamma(tc.z, tc.size, tc.I, fixedParams)
		if math.Abs(got-tc.want) > 1e-14 {
			t.Errorf("%s z=%d å=%g I=%g: log γ = %.15g, want %.15g", tc.model.Name(), tc.z, tc.size, tc.I, got, tc.want)
		}
	}
}

func TestNeutralSolutes(t *testing.T) {
	co2 := Solute{Setschenow: DefaultSetschenowCO2, Molality: 0.01}
	for _, m := range Models() {
		want := 0.1 * 0.5
		if m.Name() == NameIdeal {
			want = 0
		}
		if got := LogGamma(m, co2, 0.5, fixedParams); math.Abs(got-want) > 1e-15 {
			t.Errorf("%s: log γ(CO2) = %v, want %v", m.Name(), got, want)
		}
		if got := LogGamma(m, Solute{Molality: 1}, 0.5, fixedParams); got != 0 {
			t.Errorf("%s: neutral solute without ks: log γ = %v, want 0", m.Name(), got)
		}
	}
}

func TestIonicStrength(t *testing.T) {
	tests := []struct {
		name string
		s    []Solute
		want float64
	}{
		{"none", nil, 0},
		{"NaCl 0.1", []Solute{{Charge: 1, Molality: 0.1}, {Charge: -1, Molality: 0.1}}, 0.1},
		{"CaCl2 0.1", []Solute{{Charge: 2, Molality: 0.1}, {Charge: -1, Molality: 0.2}}, 0.3},
		{"MgSO4 0.1", []Solute{{Charge: 2, Molality: 0.1}, {Charge: -2, Molality: 0.1}}, 0.4},
		{"LaCl3 0.01 with CO2", []Solute{{Charge: 3, Molality: 0.01}, {Charge: -1, Molality: 0.03}, {Molality: 1}}, 0.06},
		{"bad molalities ignored", []Solute{{Charge: 1, Molality: -1}, {Charge: 1, Molality: math.NaN()}, {Charge: -1, Molality: math.Inf(1)}}, 0},
	}
	for _, tc := range tests {
		if got := IonicStrength(tc.s); math.Abs(got-tc.want) > 1e-15 {
			t.Errorf("%s: I = %v, want %v", tc.name, got, tc.want)
		}
	}
}

func TestMeanLogGamma(t *testing.T) {
	// CaCl2: ν+ = 1, ν− = 2.
	ca, cl := Solute{Charge: 2, Size: 6}, Solute{Charge: -1, Size: 3}
	m := DebyeHuckel{}
	got, err := MeanLogGamma(m, ca, cl, 0.3, fixedParams)
	want := (m.LogGamma(2, 6, 0.3, fixedParams) + 2*m.LogGamma(-1, 3, 0.3, fixedParams)) / 3
	if err != nil || math.Abs(got-want) > 1e-15 {
		t.Errorf("CaCl2: %v, %v; want %v", got, err, want)
	}
	// MgSO4 (2:2): ν+ = ν− = 1.
	got, _ = MeanLogGamma(Davies{}, Solute{Charge: 2}, Solute{Charge: -2}, 0.4, fixedParams)
	want = Davies{}.LogGamma(2, 0, 0.4, fixedParams)
	if math.Abs(got-want) > 1e-15 {
		t.Errorf("MgSO4: %v, want %v", got, want)
	}
	for _, pair := range [][2]int{{1, 1}, {-1, 1}, {0, -1}, {1, 0}} {
		if _, err := MeanLogGamma(m, Solute{Charge: pair[0]}, Solute{Charge: pair[1]}, 0.1, fixedParams); err == nil {
			t.Errorf("charges %v: no error", pair)
		}
	}
}

func TestByName(t *testing.T) {
	for _, name := range Names() {
		m, ok := ByName(name)
		if !ok || m.Name() != name {
			t.Errorf("ByName(%q) = %v, %v", name, m, ok)
		}
		if _, ok := m.(Osmotic); !ok {
			t.Errorf("%s has no osmotic relation", name)
		}
	}
	for _, bad := range []string{"", "Davies", "debye-hückel", "pitzer"} {
		if _, ok := ByName(bad); ok {
			t.Errorf("ByName(%q) succeeded", bad)
		}
	}
}

func TestValidity(t *testing.T) {
	tests := []struct {
		model Model
		I     float64
		over  bool
	}{
		{Ideal{}, 1e-3, false}, {Ideal{}, 2e-3, true},
		{Davies{}, 0.5, false}, {Davies{}, 0.62, true},
		{DebyeHuckel{}, 0.1, false}, {DebyeHuckel{}, 0.11, true},
		{BDot{}, 1, false}, {BDot{}, 1.5, true},
	}
	for _, tc := range tests {
		if got := Exceeds(tc.model, tc.I); got != tc.over {
			t.Errorf("Exceeds(%s, %g) = %v", tc.model.Name(), tc.I, got)
		}
		err := CheckIonicStrength(tc.model, tc.I)
		if (err != nil) != tc.over {
			t.Errorf("CheckIonicStrength(%s, %g) = %v", tc.model.Name(), tc.I, err)
		}
	}
	err := CheckIonicStrength(Davies{}, 0.62)
	var re *RangeError
	if !errors.As(err, &re) || re.Value != 0.62 || re.Max != 0.5 {
		t.Fatalf("error %#v", err)
	}
	if want := "ionic strength 0.62 mol/kg is beyond the range of the davies activity model (up to 0.5 mol/kg)"; err.Error() != want {
		t.Errorf("message %q\nwant    %q", err.Error(), want)
	}
}

func TestUsesIonSize(t *testing.T) {
	want := map[string]bool{NameIdeal: false, NameDavies: false, NameDebyeHuckel: true, NameBDot: true}
	for _, m := range Models() {
		if got := UsesIonSize(m); got != want[m.Name()] {
			t.Errorf("UsesIonSize(%s) = %v", m.Name(), got)
		}
	}
}

func TestLogGammaAt(t *testing.T) {
	na := Solute{Charge: 1, Size: 4}
	got, err := LogGammaAt(Davies{}, na, 0.1, 298.15)
	p, _ := ParamsAt(298.15)
	if err != nil || got != (Davies{}).LogGamma(1, 4, 0.1, p) {
		t.Errorf("LogGammaAt = %v, %v", got, err)
	}
	var re *RangeError
	if got, err := LogGammaAt(Davies{}, na, 0.1, 473.15); !errors.As(err, &re) || got != 0 {
		t.Errorf("LogGammaAt at 200 °C = %v, %v; want a range error", got, err)
	}
}
