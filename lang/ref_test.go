package lang

import (
	"strings"
	"testing"
)

func TestSplitRef(t *testing.T) {
	tests := []struct {
		in        string
		base      string
		charge    int
		hasCharge bool
		state     string
		electron  bool
		canonical string
	}{
		{"CO2(g)", "CO2", 0, false, "g", false, "CO2(g)"},
		{"Ca(OH)2(s)", "Ca(OH)2", 0, false, "s", false, "Ca(OH)2(s)"},
		{"Ca(OH)2", "Ca(OH)2", 0, false, "", false, "Ca(OH)2"},
		{"SO4^2-(aq)", "SO4", -2, true, "aq", false, "SO4^2-(aq)"},
		{"SO4--(aq)", "SO4", -2, true, "aq", false, "SO4^2-(aq)"},
		{"SO4--", "SO4", -2, true, "", false, "SO4^2-"},
		{"Fe^3+(aq)", "Fe", 3, true, "aq", false, "Fe^3+(aq)"},
		{"Fe+++(aq)", "Fe", 3, true, "aq", false, "Fe^3+(aq)"},
		{"Fe++", "Fe", 2, true, "", false, "Fe^2+"},
		{"Ag+(aq)", "Ag", 1, true, "aq", false, "Ag+(aq)"},
		{"Na^1+(aq)", "Na", 1, true, "aq", false, "Na+(aq)"},
		{"Cl^1-", "Cl", -1, true, "", false, "Cl-"},
		{"Cl^-", "Cl", -1, true, "", false, "Cl-"},
		{"H^+(aq)", "H", 1, true, "aq", false, "H+(aq)"},
		{"OH-", "OH", -1, true, "", false, "OH-"},
		{"PO4^3-(aq)", "PO4", -3, true, "aq", false, "PO4^3-(aq)"},
		{"X^99+", "X", 99, true, "", false, "X^99+"},
		{"e-", "e", -1, true, "", true, "e-"},
		{"e-(aq)", "e", -1, true, "aq", true, "e-(aq)"},
		{"iC3H7(g)", "iC3H7", 0, false, "g", false, "iC3H7(g)"},
		{"NaCl(melt)", "NaCl", 0, false, "melt", false, "NaCl(melt)"},
		{"CuSO4*5H2O(s)", "CuSO4*5H2O", 0, false, "s", false, "CuSO4*5H2O(s)"},
		{"[Cu(NH3)4]^2+(aq)", "[Cu(NH3)4]", 2, true, "aq", false, "[Cu(NH3)4]^2+(aq)"},
		{"N2O4(l2)", "N2O4", 0, false, "l2", false, "N2O4(l2)"},
		{"Ca(OH)", "Ca(OH)", 0, false, "", false, "Ca(OH)"},
		{"X()", "X()", 0, false, "", false, "X()"},
		{"(g)", "(g)", 0, false, "", false, "(g)"},
	}
	for _, tc := range tests {
		t.Run(tc.in, func(t *testing.T) {
			p, err := SplitRef(tc.in)
			if err != nil {
				t.Fatalf("SplitRef(%q): %v", tc.in, err)
			}
			want := RefParts{Base: tc.base, Charge: tc.charge, HasCharge: tc.hasCharge, State: tc.state, Electron: tc.electron}
			if p != want {
				t.Errorf("SplitRef(%q) = %+v, want %+v", tc.in, p, want)
			}
			if got := p.Canonical(); got != tc.canonical {
				t.Errorf("Canonical() = %q, want %q", got, tc.canonical)
			}
			if got := RefText(tc.in); got != tc.canonical {
				t.Errorf("RefText(%q) = %q, want %q", tc.in, got, tc.canonical)
			}
			// The canonical form reads back to the same parts.
			again, err := SplitRef(tc.canonical)
			if err != nil || again != want {
				t.Errorf("SplitRef(%q) = %+v, %v; want %+v", tc.canonical, again, err, want)
			}
		})
	}
}

func TestSplitRefErrors(t *testing.T) {
	tests := []struct {
		in  string
		msg string
	}{
		{"Fe+-", "a charge mixes + and -"},
		{"Fe-+(aq)", "a charge mixes + and -"},
		{"Fe^+x", "a charge is written ^N+ or ^N-"},
		{"Fe^2", "a charge is written ^N+ or ^N-"},
		{"Fe^", "a charge is written ^N+ or ^N-"},
		{"Fe^x+", "with N from 1 to 99"},
		{"Fe^0+", "with N from 1 to 99"},
		{"Fe^100+", "with N from 1 to 99"},
		{"Fe^-2+", "with N from 1 to 99"},
		{"+", "a charge needs a formula before it"},
		{"--", "a charge needs a formula before it"},
		{"^2+", "a charge needs a formula before it"},
		{"+(aq)", "a charge needs a formula before it"},
		{"", "a charge needs a formula before it"},
	}
	for _, tc := range tests {
		t.Run(tc.in, func(t *testing.T) {
			_, err := SplitRef(tc.in)
			if err == nil {
				t.Fatalf("SplitRef(%q): no error", tc.in)
			}
			if !strings.Contains(err.Error(), tc.msg) {
				t.Errorf("SplitRef(%q): %q does not say %q", tc.in, err, tc.msg)
			}
			if got := RefText(tc.in); got != tc.in {
				t.Errorf("RefText(%q) = %q, want it unchanged", tc.in, got)
			}
		})
	}
}

func TestChargeText(t *testing.T) {
	for charge, want := range map[int]string{0: "", 1: "+", -1: "-", 2: "^2+", -2: "^2-", 12: "^12+", -30: "^30-"} {
		if got := ChargeText(charge); got != want {
			t.Errorf("ChargeText(%d) = %q, want %q", charge, got, want)
		}
	}
}

func TestUnquote(t *testing.T) {
	tests := []struct {
		in   string
		want string
		err  string
	}{
		{`"gases.hess"`, "gases.hess", ""},
		{`""`, "", ""},
		{`"a \"b\""`, `a "b"`, ""},
		{`"back\\slash"`, `back\slash`, ""},
		{`"\\\""`, `\"`, ""},
		{`"ΔfH° ⇌"`, "ΔfH° ⇌", ""},
		{`"a\nb"`, "", `unknown escape in string: only \" and \\ are allowed`},
		{`"a\"`, "", "string is not closed on its line"},
		{`"abc\`, "", "string is not closed on its line"},
		{`"abc`, "", "string is not closed on its line"},
		{`abc"`, "", "string is not closed on its line"},
		{`"`, "", "string is not closed on its line"},
		{`"a"b"`, "", "string has text after its closing quote"},
		{`"a\`, "", "string is not closed on its line"},
		{``, "", "string is not closed on its line"},
	}
	for _, tc := range tests {
		t.Run(tc.in, func(t *testing.T) {
			got, err := Unquote(tc.in)
			switch {
			case tc.err == "" && err != nil:
				t.Errorf("Unquote(%q): %v", tc.in, err)
			case tc.err != "" && (err == nil || err.Error() != tc.err):
				t.Errorf("Unquote(%q) error %v, want %q", tc.in, err, tc.err)
			case got != tc.want:
				t.Errorf("Unquote(%q) = %q, want %q", tc.in, got, tc.want)
			}
		})
	}
}
