package thermo

import (
	"math"
	"strings"
	"testing"
)

func TestKind(t *testing.T) {
	m, _ := NewConstant(0, 100) // placeholder data; Kind looks only at activities
	term := func(nu float64, a Activity) Term { return Term{Nu: nu, Model: m, Activity: a} }
	tests := []struct {
		name  string
		terms []Term
		want  Kind
	}{
		{"gases only", []Term{term(-1, ActivityGas), term(1, ActivityGas)}, KindKp},
		{"solid to solid and gas", []Term{term(-1, ActivityPureSolid), term(1, ActivityPureSolid), term(1, ActivityGas)}, KindKp},
		{"solid dissolving", []Term{term(-1, ActivityPureSolid), term(1, ActivitySolute), term(2, ActivitySolute)}, KindKsp},
		{"liquid into solutes", []Term{term(-1, ActivityPureLiquid), term(1, ActivitySolute), term(1, ActivitySolute)}, KindKc},
		{"solutes only", []Term{term(-1, ActivitySolute), term(1, ActivitySolute)}, KindKc},
		{"gas and solutes", []Term{term(-1, ActivityGas), term(-1, ActivityPureLiquid), term(1, ActivitySolute), term(1, ActivitySolute)}, KindK},
		{"pure phases only", []Term{term(-1, ActivityPureSolid), term(1, ActivityPureSolid)}, KindK},
		{"solution member", []Term{term(-1, ActivitySolution), term(1, ActivityGas)}, KindK},
		{"stated by IsGas", []Term{{Nu: -1, Model: m, IsGas: true}, {Nu: 1, Model: m, IsGas: true}}, KindKp},
	}
	for _, tc := range tests {
		if got := (Reaction{Terms: tc.terms}).Kind(); got != tc.want {
			t.Errorf("%s: Kind = %s, want %s", tc.name, got, tc.want)
		}
	}
}

func TestDeltaNGas(t *testing.T) {
	m, _ := NewConstant(0, 100)
	r := Reaction{Terms: []Term{
		{Nu: -1, Model: m, IsGas: true},
		{Nu: -0.5, Model: m, Activity: ActivityGas},
		{Nu: 3, Model: m, Activity: ActivityPureSolid},
		{Nu: 1, Model: m, Activity: ActivitySolute},
	}}
	if got := r.DeltaNGas(); got != -1.5 {
		t.Errorf("Δn = %g, want -1.5", got)
	}
}

func TestReactionSums(t *testing.T) {
	// Invented constant-Cp species (demo numbers): A ⇌ 2 B.
	a, _ := NewConstantCp(-50e3, 200, 30)
	b, _ := NewConstantCp(-10e3, 150, 20)
	r := Reaction{Terms: []Term{gas(-1, a), gas(2, b)}}
	const T = 800.0
	dh := 2*(-10e3+20*(T-T298)) - (-50e3 + 30*(T-T298))
	ds := 2*(150+20*math.Log(T/T298)) - (200 + 30*math.Log(T/T298))
	for _, c := range []struct {
		name      string
		got, want float64
	}{
		{"ΔrCp", r.DeltaCp(T), 10},
		{"ΔrH", r.DeltaH(T), dh},
		{"ΔrS", r.DeltaS(T), ds},
		{"ΔrG", r.DeltaG(T), dh - T*ds},
		{"ln K", r.LnK(T), -(dh - T*ds) / (R * T)},
		{"log10 K", r.Log10K(T), -(dh - T*ds) / (R * T * math.Ln10)},
	} {
		if math.Abs(c.got-c.want) > 1e-9*math.Max(1, math.Abs(c.want)) {
			t.Errorf("%s = %.12g, want %.12g", c.name, c.got, c.want)
		}
	}
}

func TestReactionValidate(t *testing.T) {
	m, _ := NewConstant(0, 1)
	tests := []struct {
		r    Reaction
		want string
	}{
		{Reaction{Terms: []Term{{Nu: 1}}}, "term 1: no thermodynamic model"},
		{Reaction{Terms: []Term{{Nu: 1, Model: m}, {Nu: math.NaN(), Model: m}}}, "term 2: coefficient NaN"},
	}
	for _, tc := range tests {
		if err := tc.r.Validate(); err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("Validate() = %v, want %q", err, tc.want)
		}
		if !math.IsNaN(tc.r.DeltaG(500)) {
			t.Errorf("ΔrG° of an invalid reaction = %g, want NaN", tc.r.DeltaG(500))
		}
	}
	if err := (Reaction{Terms: []Term{{Nu: 1, Model: m}}}).Validate(); err != nil {
		t.Errorf("valid reaction: %v", err)
	}
}

func TestStandardPressureEntropyShift(t *testing.T) {
	// REFERENCE-DATA §4 (derived): going from p° = 1 atm to 1 bar raises a gas's
	// S° by R·ln(1.01325) = +0.1094 J/(mol·K).
	if got := StandardPressureEntropyShift(Atm, Bar); math.Abs(got-0.1094) > 0.00005 {
		t.Errorf("shift = %.5f J/(mol·K), want +0.1094", got)
	}
	if got := StandardPressureEntropyShift(Bar, Atm); math.Abs(got+0.1094) > 0.00005 {
		t.Errorf("reverse shift = %.5f, want −0.1094", got)
	}
}

func TestShiftStandardPressure(t *testing.T) {
	base := shomateModel(t, "CO2")
	m, err := ShiftStandardPressure(base, Atm, Bar)
	if err != nil {
		t.Fatal(err)
	}
	dS := R * math.Log(Atm/Bar)
	const T = 1000.0
	if math.Abs(m.S(T)-base.S(T)-dS) > 1e-12 || m.H(T) != base.H(T) || m.Cp(T) != base.Cp(T) {
		t.Errorf("shifted S %g H %g Cp %g", m.S(T)-base.S(T), m.H(T)-base.H(T), m.Cp(T)-base.Cp(T))
	}
	if got := m.G(T) - base.G(T); math.Abs(got+T*dS) > 1e-9 {
		t.Errorf("shifted G by %g, want %g", got, -T*dS)
	}
	// For ammonia synthesis (Δn = −2), moving every gas from 1 atm to 1 bar data
	// multiplies K by (1 atm/1 bar)^Δn (a change of reference pressure).
	r := ammonia(t, 1)
	shifted := Reaction{Terms: make([]Term, len(r.Terms))}
	for i, tm := range r.Terms {
		s, err := ShiftStandardPressure(tm.Model, Atm, Bar)
		if err != nil {
			t.Fatal(err)
		}
		tm.Model = s
		shifted.Terms[i] = tm
	}
	if got, want := shifted.K(800)/r.K(800), math.Pow(Atm/Bar, -2); math.Abs(got/want-1) > 1e-12 {
		t.Errorf("K ratio %.15g, want %.15g", got, want)
	}
	for _, p := range [][2]float64{{0, Bar}, {Atm, -1}, {math.Inf(1), Bar}, {math.NaN(), Bar}} {
		if _, err := ShiftStandardPressure(base, p[0], p[1]); err == nil {
			t.Errorf("ShiftStandardPressure(%v, %v) gave no error", p[0], p[1])
		}
	}
	if _, err := ShiftStandardPressure(nil, Atm, Bar); err == nil {
		t.Error("ShiftStandardPressure(nil) gave no error")
	}
}

func TestConstantModels(t *testing.T) {
	m, err := NewConstantCp(-100e3, 50, 40)
	if err != nil {
		t.Fatal(err)
	}
	if m.H(T298) != -100e3 || m.S(T298) != 50 || m.Cp(700) != 40 {
		t.Errorf("at 298.15 K: H %g S %g; Cp %g", m.H(T298), m.S(T298), m.Cp(700))
	}
	// Data without a stated range hold 298.15 K ± 100 K (DefaultSpan).
	if lo, hi := m.Range(); math.Abs(lo-198.15) > 1e-9 || math.Abs(hi-398.15) > 1e-9 {
		t.Errorf("range %g–%g, want 198.15–398.15 K", lo, hi)
	}
	c, _ := NewConstant(-100e3, 50)
	if c.H(2000) != -100e3 || c.S(2000) != 50 || c.G(2000) != -100e3-2000*50 {
		t.Errorf("hf/s model varies with T: H %g S %g", c.H(2000), c.S(2000))
	}
	for _, bad := range [][3]float64{{math.NaN(), 1, 0}, {0, math.Inf(1), 0}, {0, 1, math.NaN()}} {
		if _, err := NewConstantCp(bad[0], bad[1], bad[2]); err == nil {
			t.Errorf("NewConstantCp(%v) gave no error", bad)
		}
	}
	if _, err := NewGibbsOnly(math.Inf(-1)); err == nil {
		t.Error("NewGibbsOnly(-Inf) gave no error")
	}
}
