package thermo

import (
	"errors"
	"math"
	"sort"
	"strings"
	"testing"
)

func TestParseUnitAccepted(t *testing.T) {
	// Scales are the SI definitions (SI Brochure 2019): 1 cal_th = 4.184 J,
	// 1 atm = 101 325 Pa, 1 bar = 10⁵ Pa, 1 Torr = 101 325/760 Pa, 1 L = 10⁻³ m³
	// (CRC, REFERENCE-DATA §4).
	tests := []struct {
		in    string
		dim   Dim
		scale float64
	}{
		{"J", DimEnergy, 1},
		{"J/mol", DimEnergyPerMole, 1},
		{"kJ/mol", DimEnergyPerMole, 1e3},
		{"cal/mol", DimEnergyPerMole, 4.184},
		{"kcal/mol", DimEnergyPerMole, 4184},
		{"J/mol/K", DimEntropy, 1},
		{"J/(mol*K)", DimEntropy, 1},
		{"J/(mol·K)", DimEntropy, 1},
		{"J*mol^-1*K^-1", DimEntropy, 1},
		{"J·mol^-1·K^-1", DimEntropy, 1},
		{"J·mol⁻¹·K⁻¹", DimEntropy, 1},
		{"cal/mol/K", DimEntropy, 4.184},
		{"K", DimTemperature, 1},
		{"Pa", DimPressure, 1},
		{"kPa", DimPressure, 1e3},
		{"MPa", DimPressure, 1e6},
		{"bar", DimPressure, 1e5},
		{"atm", DimPressure, 101325},
		{"Torr", DimPressure, 101325.0 / 760},
		{"g/mol", DimMolarMass, 1e-3},
		{"kg/mol", DimMolarMass, 1},
		{"mol/kg", DimMolality, 1},
		{"Å", DimLength, 1e-10},
		{"\u212b", DimLength, 1e-10},
		{"angstrom", DimLength, 1e-10},
		{"nm", DimLength, 1e-9},
		{"pm", DimLength, 1e-12},
		{"mol/L", DimConcentration, 1e3},
		{"1/s", RatePrefactorDim(1), 1},
		{"s^-1", RatePrefactorDim(1), 1},
		{"cm3/mol/s", RatePrefactorDim(2), 1e-6},
		{"cm^3/mol/s", RatePrefactorDim(2), 1e-6},
		{"cm³/mol/s", RatePrefactorDim(2), 1e-6},
		{"m3/mol/s", RatePrefactorDim(2), 1},
		{"L/mol/s", RatePrefactorDim(2), 1e-3},
		{"L/(mol*s)", RatePrefactorDim(2), 1e-3},
		{"cm6/mol2/s", RatePrefactorDim(3), 1e-12},
		{"(cm3/mol)^2/s", RatePrefactorDim(3), 1e-12},
		{"cm^6*mol^-2*s^-1", RatePrefactorDim(3), 1e-12},
		{"mol/cm3/s", RatePrefactorDim(0), 1e6},
		{"1", DimNone, 1},
		{"kg*m^2/s^2", DimEnergy, 1},
		{"kg·m²·s⁻²·mol⁻¹", DimEnergyPerMole, 1},
		{"m^+3", Dim{0, 3, 0, 0, 0}, 1},
		{"((J))", DimEnergy, 1},
	}
	for _, tc := range tests {
		u, err := ParseUnit(tc.in)
		if err != nil {
			t.Errorf("ParseUnit(%q): %v", tc.in, err)
			continue
		}
		if u.Dim != tc.dim || math.Abs(u.Scale/tc.scale-1) > 1e-14 || u.Offset != 0 || u.Text != tc.in {
			t.Errorf("ParseUnit(%q) = %+v, want dim %v scale %g", tc.in, u, tc.dim, tc.scale)
		}
	}
}

func TestParseUnitCelsius(t *testing.T) {
	// 0 °C = 273.15 K exactly (SI definition of the Celsius scale).
	for _, in := range []string{"degC", "°C"} {
		u, err := ParseUnit(in)
		if err != nil {
			t.Fatalf("ParseUnit(%q): %v", in, err)
		}
		if u.Dim != DimTemperature || u.ToSI(25) != 298.15 || u.ToSI(0) != 273.15 {
			t.Errorf("%s: 25 → %v K, 0 → %v K; want 298.15 and 273.15", in, u.ToSI(25), u.ToSI(0))
		}
		if got := u.FromSI(373.15); math.Abs(got-100) > 1e-12 {
			t.Errorf("%s: FromSI(373.15) = %v, want 100", in, got)
		}
	}
}

func TestParseUnitEquivalent(t *testing.T) {
	groups := [][]string{
		{"J/mol/K", "J/(mol*K)", "J*mol^-1*K^-1", "J/(mol·K)", "J·K^-1/mol"},
		{"cm3", "cm^3", "cm³", "(cm)^3", "cm*cm*cm"},
		{"kJ/mol", "kJ*mol^-1", "kJ·mol⁻¹", "(kJ)/(mol)"},
		{"L/mol/s", "L*mol^-1*s^-1", "L/(mol*s)", "L·mol⁻¹·s⁻¹", "L/s/mol"},
	}
	for _, g := range groups {
		first, err := ParseUnit(g[0])
		if err != nil {
			t.Fatalf("ParseUnit(%q): %v", g[0], err)
		}
		for _, s := range g[1:] {
			u, err := ParseUnit(s)
			if err != nil {
				t.Errorf("ParseUnit(%q): %v", s, err)
				continue
			}
			if u.Dim != first.Dim || math.Abs(u.Scale/first.Scale-1) > 1e-14 {
				t.Errorf("%q = %v × %g, want %v × %g like %q", s, u.Dim, u.Scale, first.Dim, first.Scale, g[0])
			}
		}
	}
}

func TestParseUnitErrors(t *testing.T) {
	tests := []struct{ in, want string }{
		{"", "empty unit"},
		{"kj", `unknown unit "kj"`},
		{"kj/mol", `unknown unit symbol "kj" in "kj/mol"`},
		{"J/mole", `unknown unit symbol "mole" in "J/mole"`},
		{"F", `unknown unit "F"`},
		{"J mol", "white space"},
		{" J", "white space"},
		{"J/", "expected a unit symbol at the end"},
		{"/mol", "expected a unit symbol, found \"/\""},
		{"J//mol", "expected a unit symbol, found \"/\""},
		{"J**mol", "expected a unit symbol"},
		{"(J/mol", `missing ")"`},
		{"J/mol)", `unexpected ")"`},
		{"()", "expected a unit symbol"},
		{"J^", "integer power"},
		{"J^x", "integer power"},
		{"J^-", "integer power"},
		{"J^1.5", `unexpected "."`},
		{"cm3^2", "second power"},
		{"m^123", "power larger than 99"},
		{"J/mol*K", "ambiguous"},
		{"2/s", `number "2" in a unit`},
		{"10/s", `number "10" in a unit`},
		{"degC/s", `"degC" is valid only alone`},
		{"°C*mol", `"°C" is valid only alone`},
		{"degC^2", `"degC" is valid only alone`},
		{"J-mol", `unexpected "-"`},
		{"m⁻", "superscript digit"},
		{"(((((((((((((((((((J)))))))))))))))))))", "nested deeper"},
		{"m^99*m^99", "exponent out of range"},
		{strings.Repeat("J", 300), "longer than"},
		{"J\xff", "not valid UTF-8"},
	}
	for _, tc := range tests {
		_, err := ParseUnit(tc.in)
		if err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("ParseUnit(%q) error = %v, want one containing %q", tc.in, err, tc.want)
		}
	}
}

func TestUnitRoundTrip(t *testing.T) {
	for _, s := range []string{"kJ/mol", "kcal/mol", "atm", "Torr", "degC", "cm3/mol/s"} {
		u, err := ParseUnit(s)
		if err != nil {
			t.Fatal(err)
		}
		for _, v := range []float64{-393.51, 0, 1, 6.02e23} {
			if got := u.FromSI(u.ToSI(v)); math.Abs(got-v) > 1e-12*math.Max(1, math.Abs(v)) {
				t.Errorf("%s: FromSI(ToSI(%g)) = %g", s, v, got)
			}
		}
	}
}

func TestDimString(t *testing.T) {
	tests := []struct {
		d    Dim
		want string
	}{
		{DimNone, "1"},
		{DimEnergyPerMole, "kg·m²·s⁻²·mol⁻¹"},
		{DimEntropy, "kg·m²·s⁻²·mol⁻¹·K⁻¹"},
		{DimTemperature, "K"},
		{Dim{0, 12, 0, 0, 0}, "m¹²"},
		{RatePrefactorDim(2), "m³·s⁻¹·mol⁻¹"},
	}
	for _, tc := range tests {
		if got := tc.d.String(); got != tc.want {
			t.Errorf("%v.String() = %q, want %q", [5]int8(tc.d), got, tc.want)
		}
		// The rendering parses back to the same dimension.
		if u, err := ParseUnit(tc.d.String()); err != nil || u.Dim != tc.d {
			t.Errorf("ParseUnit(%q) = %v, %v", tc.d.String(), u.Dim, err)
		}
	}
}

func TestDimName(t *testing.T) {
	tests := []struct {
		d    Dim
		want string
	}{
		{DimEnergyPerMole, "energy per mole"},
		{DimEntropy, "entropy or heat capacity"},
		{DimPressure, "pressure"},
		{DimTemperature, "temperature"},
		{DimMolarMass, "molar mass"},
		{DimMolality, "molality"},
		{RatePrefactorDim(2), "second-order rate prefactor"},
		{Dim{0, 5, 0, 0, 0}, "m⁵"},
	}
	for _, tc := range tests {
		if got := DimName(tc.d); got != tc.want {
			t.Errorf("DimName(%v) = %q, want %q", tc.d, got, tc.want)
		}
	}
}

func TestRatePrefactorDim(t *testing.T) {
	tests := []struct {
		order int
		unit  string
	}{
		{0, "mol/m3/s"}, {1, "1/s"}, {2, "m3/mol/s"}, {3, "m6/mol2/s"}, {4, "m9/mol3/s"},
	}
	for _, tc := range tests {
		u, err := ParseUnit(tc.unit)
		if err != nil {
			t.Fatal(err)
		}
		if got := RatePrefactorDim(tc.order); got != u.Dim {
			t.Errorf("RatePrefactorDim(%d) = %v, want %v (%s)", tc.order, got, u.Dim, tc.unit)
		}
	}
	if RatePrefactorDim(1000) != RatePrefactorDim(42) {
		t.Error("orders beyond 42 are not clamped")
	}
}

// TestUnknownSymbolError: the message names the unit once, and the error
// carries the symbol and where it stands.
func TestUnknownSymbolError(t *testing.T) {
	for _, tc := range []struct {
		in, msg, sym string
		off          int
	}{
		{"C", `unknown unit "C"`, "C", 0},
		{"kj/mol", `unknown unit symbol "kj" in "kj/mol"`, "kj", 0},
		{"J/(mol*Kelvin)", `unknown unit symbol "Kelvin" in "J/(mol*Kelvin)"`, "Kelvin", 7},
	} {
		_, err := ParseUnit(tc.in)
		var e *UnknownSymbolError
		if !errors.As(err, &e) {
			t.Errorf("ParseUnit(%q) = %v, not an UnknownSymbolError", tc.in, err)
			continue
		}
		if err.Error() != tc.msg || e.Symbol != tc.sym || e.Offset != tc.off || e.Unit != tc.in {
			t.Errorf("ParseUnit(%q): %q %+v; want %q, %q at %d", tc.in, err, e, tc.msg, tc.sym, tc.off)
		}
	}
	if got := UnitSymbols(); len(got) != len(unitSymbols) || !sort.StringsAreSorted(got) {
		t.Errorf("UnitSymbols = %v", got)
	}
}
