package chem

import (
	"math"
	"math/big"
	"strings"
	"testing"
)

// rat parses an exact count written as "p/q" or as an integer or decimal.
func rat(t testing.TB, s string) *big.Rat {
	t.Helper()
	r, ok := new(big.Rat).SetString(s)
	if !ok {
		t.Fatalf("bad rational %q in test", s)
	}
	return r
}

// countsOf renders a formula's counts as symbol → exact rational string.
func countsOf(f Formula) map[string]string {
	m := make(map[string]string, len(f.Elements))
	for _, e := range f.Elements {
		m[e.Symbol] = e.Count.RatString()
	}
	return m
}

func TestParseFormulaValid(t *testing.T) {
	tests := []struct {
		in     string
		counts map[string]string // exact, as p/q or integer
		hill   string
	}{
		{"CO2", map[string]string{"C": "1", "O": "2"}, "CO2"},
		{"H", map[string]string{"H": "1"}, "H"},
		{"H1", map[string]string{"H": "1"}, "H"},
		{"Ca(OH)2", map[string]string{"Ca": "1", "O": "2", "H": "2"}, "CaH2O2"},
		{"K4[Fe(CN)6]", map[string]string{"K": "4", "Fe": "1", "C": "6", "N": "6"}, "C6FeK4N6"},
		{"CuSO4*5H2O", map[string]string{"Cu": "1", "S": "1", "O": "9", "H": "10"}, "CuH10O9S"},
		{"CuSO4·5H2O", map[string]string{"Cu": "1", "S": "1", "O": "9", "H": "10"}, "CuH10O9S"},
		{"CaSO4*0.5H2O", map[string]string{"Ca": "1", "S": "1", "O": "9/2", "H": "1"}, "CaHO4.5S"},
		{"Fe0.95O", map[string]string{"Fe": "19/20", "O": "1"}, "Fe0.95O"},
		{"(NH4)2SO4", map[string]string{"N": "2", "H": "8", "S": "1", "O": "4"}, "H8N2O4S"},
		{"C6H5CH3", map[string]string{"C": "7", "H": "8"}, "C7H8"},
		{"CH3COOH", map[string]string{"C": "2", "H": "4", "O": "2"}, "C2H4O2"},
		{"[Co(NH3)6]Cl3", map[string]string{"Co": "1", "N": "6", "H": "18", "Cl": "3"}, "Cl3CoH18N6"},
		{"Al2(SO4)3*18H2O", map[string]string{"Al": "2", "S": "3", "O": "30", "H": "36"}, "Al2H36O30S3"},
		{"Fe(CO)5", map[string]string{"Fe": "1", "C": "5", "O": "5"}, "C5FeO5"},
		{"Na2CO3*10H2O", map[string]string{"Na": "2", "C": "1", "O": "13", "H": "20"}, "CH20Na2O13"},
		{"CaSO4*H2O", map[string]string{"Ca": "1", "S": "1", "O": "5", "H": "2"}, "CaH2O5S"},
		{"MgSO4*2H2O·0.25NH3", map[string]string{"Mg": "1", "S": "1", "O": "6", "H": "19/4", "N": "1/4"}, "H4.75MgN0.25O6S"},
		{"Fe2O3*3.5H2O", map[string]string{"Fe": "2", "O": "13/2", "H": "7"}, "Fe2H7O6.5"},
		{"((H))", map[string]string{"H": "1"}, "H"},
		{"[(H2)3]2", map[string]string{"H": "12"}, "H12"},
		{"Ca0.5(H2O)1.5", map[string]string{"Ca": "1/2", "H": "3", "O": "3/2"}, "Ca0.5H3O1.5"},
		{"H007", map[string]string{"H": "7"}, "H7"},
		{"Cl1.50", map[string]string{"Cl": "3/2"}, "Cl1.5"},
		{"NaOH", map[string]string{"Na": "1", "O": "1", "H": "1"}, "HNaO"},
		{"C99999999999999999999", map[string]string{"C": "99999999999999999999"}, "C99999999999999999999"},
		{"H0.000000000000000000001", map[string]string{"H": "1/1000000000000000000000"}, "H0.000000000000000000001"},
		{"Og", map[string]string{"Og": "1"}, "Og"},
		// Counts beyond 64-bit decimals: products, sums and decimal places.
		{"(C4294967296)4294967296", map[string]string{"C": "18446744073709551616"}, "C18446744073709551616"},
		{"C9223372036854775807C1", map[string]string{"C": "9223372036854775808"}, "C9223372036854775808"},
		{"((H0.0000000001)0.0000000001)3", map[string]string{"H": "3/100000000000000000000"}, "H0.00000000000000000003"},
		{"H0.5C99999999999999999999H0.5", map[string]string{"C": "99999999999999999999", "H": "1"}, "C99999999999999999999H"},
		{"(H0.5)0.2", map[string]string{"H": "1/10"}, "H0.1"},
		{"(H0.5)2", map[string]string{"H": "1"}, "H"},
		{"H1.5H1.5", map[string]string{"H": "3"}, "H3"},
		{"H0.123456789012345678", map[string]string{"H": "61728394506172839/500000000000000000"}, "H0.123456789012345678"},
	}
	for _, tc := range tests {
		t.Run(tc.in, func(t *testing.T) {
			f, err := ParseFormula(tc.in, nil)
			if err != nil {
				t.Fatalf("ParseFormula(%q): %v", tc.in, err)
			}
			got := countsOf(f)
			if len(got) != len(tc.counts) {
				t.Errorf("ParseFormula(%q) counts = %v, want %v", tc.in, got, tc.counts)
			}
			for sym, want := range tc.counts {
				if c := f.Count(sym); c.Cmp(rat(t, want)) != 0 {
					t.Errorf("ParseFormula(%q).Count(%q) = %s, want %s", tc.in, sym, c.RatString(), want)
				}
			}
			if s := f.String(); s != tc.hill {
				t.Errorf("ParseFormula(%q).String() = %q, want %q", tc.in, s, tc.hill)
			}
		})
	}
}

func TestParseFormulaErrors(t *testing.T) {
	tests := []struct {
		in          string
		code        string
		offset, end int
		message     string
	}{
		{"", "bad-formula", 0, 0, "empty formula"},
		{"Xx2", "unknown-element", 0, 2, `unknown element "Xx"`},
		{"CXx", "unknown-element", 1, 3, `unknown element "Xx"`},
		{"Hello", "unknown-element", 0, 5, `unknown element "Hello"`},
		{"Ca(OH", "bad-formula", 2, 5, `unclosed "(" after "Ca"`},
		{"(H2(O", "bad-formula", 3, 5, `unclosed "(" after "(H2"`},
		{"H·(O", "bad-formula", 3, 5, `unclosed "(" after "H·"`},
		{"K4[Fe(CN)6", "bad-formula", 2, 10, `unclosed "[" after "K4"`},
		{"H2O)", "bad-formula", 3, 4, `unexpected ")"`},
		{"Ca(OH))", "bad-formula", 6, 7, `unexpected ")"`},
		{"]", "bad-formula", 0, 1, `unexpected "]"`},
		{"Ca(OH]2", "bad-formula", 5, 6, `"]" does not close "(" after "Ca"`},
		{"()", "bad-formula", 0, 2, "empty group"},
		{"H[]2", "bad-formula", 1, 3, "empty group"},
		{"H0", "bad-formula", 1, 2, "count 0 is not allowed"},
		{"(OH)0", "bad-formula", 4, 5, "count 0 is not allowed"},
		{"CuSO4*0H2O", "bad-formula", 6, 7, "count 0 is not allowed"},
		{"O0.00", "bad-formula", 1, 5, "count 0.00 is not allowed"},
		{"3H2O", "bad-formula", 0, 1, `expected an element symbol, found "3"`},
		{"(25H)", "bad-formula", 1, 3, `expected an element symbol, found "25"`},
		{"h2o", "bad-formula", 0, 1, `element symbol "h" must start with an upper-case letter`},
		{"H2co", "bad-formula", 2, 4, `element symbol "co" must start with an upper-case letter`},
		{"H2 O", "bad-formula", 2, 3, `expected an element symbol, found " "`},
		{"H2+", "bad-formula", 2, 3, `expected an element symbol, found "+"`},
		{"Hé", "bad-formula", 1, 3, `expected an element symbol, found "é"`},
		{"H\xff", "bad-formula", 1, 2, "expected an element symbol, found byte 0xff"},
		{"H2.", "bad-formula", 1, 3, `count "2." needs a digit after the point`},
		{"H.5", "bad-formula", 1, 3, `count ".5" needs a digit before the point`},
		{"*H2O", "bad-formula", 0, 1, `empty part before "*"`},
		{"·H2O", "bad-formula", 0, 2, `empty part before "·"`},
		{"CuSO4*", "bad-formula", 5, 6, `empty adduct after "*"`},
		{"CuSO4*5", "bad-formula", 5, 6, `empty adduct after "*"`},
		{"CuSO4**H2O", "bad-formula", 5, 6, `empty adduct after "*"`},
		{"CuSO4·", "bad-formula", 5, 7, `empty adduct after "·"`},
		{"(CuSO4*H2O)", "bad-formula", 6, 7, `adduct "*" inside a group`},
		{"H" + strings.Repeat("0", 30), "bad-formula", 1, 31, "count 000000000000000000000000… is not allowed"},
		{"Abcdefghijklmnopqrstuvwxyzabc", "unknown-element", 0, 29, `unknown element "Abcdefghijklmnopqrstuvwx…"`},
		{strings.Repeat("(", 65) + "H" + strings.Repeat(")", 65), "bad-formula", 64, 65, "groups nested deeper than 64"},
	}
	for _, tc := range tests {
		t.Run(tc.in, func(t *testing.T) {
			f, err := ParseFormula(tc.in, nil)
			if err == nil {
				t.Fatalf("ParseFormula(%q) = %v, want error %q", tc.in, f, tc.message)
			}
			if err.Code != tc.code || err.Offset != tc.offset || err.End != tc.end || err.Message != tc.message {
				t.Errorf("ParseFormula(%q) error = {%s %d %d %q}, want {%s %d %d %q}", tc.in,
					err.Code, err.Offset, err.End, err.Message, tc.code, tc.offset, tc.end, tc.message)
			}
			if err.Offset < 0 || err.End < err.Offset || err.End > len(tc.in) {
				t.Errorf("ParseFormula(%q) error range [%d,%d) outside the input", tc.in, err.Offset, err.End)
			}
			if !strings.Contains(err.Error(), tc.message) {
				t.Errorf("Error() = %q does not contain the message", err.Error())
			}
			if len(f.Elements) != 0 {
				t.Errorf("ParseFormula(%q) returned elements %v with an error", tc.in, f.Elements)
			}
		})
	}
}

func TestParseFormulaDeepNesting(t *testing.T) {
	in := strings.Repeat("(", maxGroupDepth) + "H" + strings.Repeat(")2", maxGroupDepth)
	f, err := ParseFormula(in, nil)
	if err != nil {
		t.Fatalf("%d nested groups: %v", maxGroupDepth, err)
	}
	want := new(big.Rat).SetInt(new(big.Int).Lsh(big.NewInt(1), maxGroupDepth))
	if c := f.Count("H"); c.Cmp(want) != 0 {
		t.Errorf("count of H = %s, want 2^%d", c.RatString(), maxGroupDepth)
	}

	for _, open := range []string{"(", "[", "(["} {
		in := strings.Repeat(open, 10000) + "H" + strings.Repeat(")", 10000)
		_, err := ParseFormula(in, nil)
		if err == nil || err.Code != "bad-formula" || !strings.Contains(err.Message, "nested deeper") {
			t.Errorf("10000 nested %q groups: error %v, want groups nested too deep", open, err)
		}
		unclosed := strings.Repeat(open, 10000)
		if _, err := ParseFormula(unclosed, nil); err == nil {
			t.Errorf("10000 unclosed %q: no error", open)
		}
	}
	closers := strings.Repeat(")", 10000)
	if _, err := ParseFormula(closers, nil); err == nil || err.Message != `unexpected ")"` {
		t.Errorf("10000 closers: error %v, want unexpected", err)
	}
}

func TestFormulaCountAbsentAndCopy(t *testing.T) {
	f, err := ParseFormula("H2O", nil)
	if err != nil {
		t.Fatal(err)
	}
	c := f.Count("N")
	if c == nil || c.Sign() != 0 {
		t.Fatalf("Count of an absent element = %v, want 0", c)
	}
	h := f.Count("H")
	h.SetInt64(99)
	if got := f.Count("H"); got.Cmp(big.NewRat(2, 1)) != 0 {
		t.Errorf("changing the result of Count changed the formula: H = %s", got.RatString())
	}
	var zero Formula
	if zero.String() != "" || zero.Count("H").Sign() != 0 {
		t.Errorf("zero Formula: String %q, Count %v", zero.String(), zero.Count("H"))
	}
	if m, ok := zero.MolarMass(nil); !ok || m != 0 {
		t.Errorf("zero Formula molar mass = %v, %v; want 0, true", m, ok)
	}
}

func TestFormulaStringFraction(t *testing.T) {
	// A Formula built by other code may carry a count no decimal writes.
	f := Formula{Elements: []ElementCount{{"C", big.NewRat(1, 3)}, {"O", big.NewRat(3, 8)}}}
	if got, want := f.String(), "C1/3O0.375"; got != want {
		t.Errorf("String() = %q, want %q", got, want)
	}
}

// Molar masses from CIAAW 2021 conventional atomic weights, as listed in
// REFERENCE-DATA.md §4 ("derived from CIAAW conventional values"), printed
// there to 3 decimals.
func TestMolarMassReference(t *testing.T) {
	tests := []struct {
		formula string
		mass    float64
	}{
		{"CO2", 44.009},
		{"H2O", 18.015},
		{"CH4", 16.043},
		{"NH3", 17.031},
		{"CO", 28.010},
		{"CaCO3", 100.086},
		{"CaO", 56.077},
		{"AgCl", 143.318},
		{"NaCl", 58.440},
		{"Fe2O3", 159.687},
	}
	const tol = 0.0005 + 1e-9 // half a unit in the third decimal
	for _, tc := range tests {
		f, err := ParseFormula(tc.formula, nil)
		if err != nil {
			t.Fatalf("%s: %v", tc.formula, err)
		}
		m, ok := f.MolarMass(BuiltinElements())
		if !ok {
			t.Fatalf("%s: no molar mass", tc.formula)
		}
		if math.Abs(m-tc.mass) > tol {
			t.Errorf("molar mass of %s = %.5f g/mol, want %.3f (CIAAW 2021, derived)", tc.formula, m, tc.mass)
		}
	}
}

func TestMolarMassDecimalAndAdduct(t *testing.T) {
	// The parser's share of a molar mass: an adduct is the sum of its parts,
	// a decimal count scales its element, a bracket multiplies its group.
	// The masses themselves are checked against outside values in
	// TestMolarMassReference and against python3-periodictable (with the
	// CIAAW revisions listed there) in TestFormulasAgainstPeriodictable.
	mass := func(s string) float64 {
		t.Helper()
		f, err := ParseFormula(s, nil)
		if err != nil {
			t.Fatalf("%s: %v", s, err)
		}
		m, ok := f.MolarMass(nil)
		if !ok {
			t.Fatalf("%s: no molar mass", s)
		}
		return m
	}
	for in, want := range map[string]float64{
		"CuSO4*5H2O":  mass("CuSO4") + 5*mass("H2O"),
		"CuSO4·5H2O":  mass("CuSO4") + 5*mass("H2O"),
		"Fe0.95O":     0.95*mass("Fe") + mass("O"),
		"K4[Fe(CN)6]": 4*mass("K") + mass("Fe") + 6*mass("CN"),
	} {
		if m := mass(in); math.Abs(m-want) > 1e-9 {
			t.Errorf("molar mass of %s = %v, want %v", in, m, want)
		}
	}
}

func TestMolarMassWithoutWeight(t *testing.T) {
	for _, in := range []string{"Tc2O7", "PuO2", "Og", "RnF2"} {
		f, err := ParseFormula(in, nil)
		if err != nil {
			t.Fatalf("%s: %v", in, err)
		}
		if m, ok := f.MolarMass(nil); ok {
			t.Errorf("molar mass of %s = %v, want none (no standard atomic weight)", in, m)
		}
	}
	// A formula parsed against a user element has no mass in a table
	// without it.
	f, err := ParseFormula("D2O", BuiltinElements().With("D", 2.014))
	if err != nil {
		t.Fatal(err)
	}
	if _, ok := f.MolarMass(BuiltinElements()); ok {
		t.Error("D2O has a molar mass in the built-in table")
	}
	huge, err := ParseFormula("C"+strings.Repeat("9", 400), nil)
	if err != nil {
		t.Fatal(err)
	}
	if m, ok := huge.MolarMass(nil); ok {
		t.Errorf("molar mass of a 400-digit count = %v, want overflow reported", m)
	}
}

func TestParseFormulaUserElements(t *testing.T) {
	// The deuterium atomic mass 2.01410 g/mol is the example in LANGUAGE.md.
	table := BuiltinElements().With("D", 2.01410).With("Lig", 123.5)
	f, err := ParseFormula("D2O", table)
	if err != nil {
		t.Fatal(err)
	}
	if got := f.String(); got != "D2O" {
		t.Errorf("String() = %q, want D2O", got)
	}
	m, ok := f.MolarMass(table)
	if want := 2*2.01410 + 15.999; !ok || math.Abs(m-want) > 1e-9 {
		t.Errorf("molar mass of D2O = %v, %v; want %v", m, ok, want)
	}

	f, err = ParseFormula("[Cu(Lig)2]Cl2", table)
	if err != nil {
		t.Fatal(err)
	}
	if got, want := f.String(), "Cl2CuLig2"; got != want {
		t.Errorf("String() = %q, want %q", got, want)
	}
	if c := f.Count("Lig"); c.Cmp(big.NewRat(2, 1)) != 0 {
		t.Errorf("count of Lig = %s, want 2", c.RatString())
	}

	if _, err := ParseFormula("D2O", nil); err == nil || err.Code != "unknown-element" {
		t.Errorf("D2O in the built-in table: error %v, want unknown-element", err)
	}
	if _, err := ParseFormula("Li", table); err != nil {
		t.Errorf("Li next to user element Lig: %v", err)
	}
	if _, err := ParseFormula("Ligx", table); err == nil || err.Message != `unknown element "Ligx"` {
		t.Errorf("Ligx: error %v, want unknown element", err)
	}

	// A user element may stand in for a chemical element (a labelled carbon).
	c13 := BuiltinElements().With("C", 13.003355)
	f, _ = ParseFormula("CO2", c13)
	if m, _ := f.MolarMass(c13); math.Abs(m-(13.003355+2*15.999)) > 1e-9 {
		t.Errorf("CO2 with labelled carbon = %v", m)
	}
	if m, _ := f.MolarMass(nil); math.Abs(m-44.009) > 0.0005 {
		t.Errorf("CO2 in the built-in table changed to %v after With", m)
	}
}

func TestParseFormulaLongInput(t *testing.T) {
	tests := []struct {
		in   string
		want string // Hill formula, or "" for an error
	}{
		{strings.Repeat("(", 100000), ""},
		{strings.Repeat("H", 100000), "H100000"},
		{strings.Repeat("H2O*", 20000) + "H", "H40001O20000"},
		{strings.Repeat("(H2)9", 10000), "H180000"},
	}
	for _, tc := range tests {
		f, err := ParseFormula(tc.in, nil)
		switch {
		case tc.want == "" && err == nil:
			t.Errorf("%.20s…: no error", tc.in)
		case tc.want != "" && err != nil:
			t.Errorf("%.20s…: %v", tc.in, err)
		case tc.want != "" && f.String() != tc.want:
			t.Errorf("%.20s…: %s, want %s", tc.in, f.String(), tc.want)
		}
	}
}

func BenchmarkParseFormula(b *testing.B) {
	inputs := []string{"CO2", "H2O", "CH4", "Ca(OH)2", "K4[Fe(CN)6]", "CuSO4*5H2O",
		"CaSO4*0.5H2O", "Fe0.95O", "(NH4)2SO4", "C6H5CH3", "Al2(SO4)3*18H2O", "[Co(NH3)6]Cl3"}
	table := BuiltinElements()
	size := 0
	for _, in := range inputs {
		size += len(in)
	}
	b.SetBytes(int64(size))
	b.ReportAllocs()
	for b.Loop() {
		for _, in := range inputs {
			if _, err := ParseFormula(in, table); err != nil {
				b.Fatal(err)
			}
		}
	}
}
