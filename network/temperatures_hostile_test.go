package network

import (
	"strings"
	"testing"
)

// Temperature lists that once looped without end, built millions of
// entries, printed +Inf or read 0 K must end at once with an error that
// says what is wrong.
func TestTemperatureListBounds(t *testing.T) {
	for _, tc := range []struct {
		text string
		want string // part of the error; "" for none
		n    int
	}{
		{"1e308 K to 1e308 K by 1 K", "above 1000000 K", 0},
		{"300 K to 300 K by 1e-20 K", "too small to tell temperatures apart", 0},
		{"300 K to 3000 K by 0.01 K", "would hold 270001 temperatures, more than 10000", 0},
		{"300 K, 400 K to 500 K by 1e-11 K", "would hold 10000000000002 temperatures", 0},
		{"1e308 K", "temperature 1e308 K is above 1000000 K", 0},
		{"1e-320 K", "too small to compute with", 0},
		{"1e-300 K", "below 0.001 K", 0},
		{"300 K to 400 K by 25 K", "", 5},
		{"300 K to 300 K by 1 K", "", 1},
		{"0.1 K to 0.3 K by 0.1 K", "", 3},
	} {
		ts, err := ParseTemperatures(tc.text)
		if tc.want == "" {
			if err != nil || len(ts) != tc.n {
				t.Errorf("%q: got %d temperatures, %v; want %d", tc.text, len(ts), err, tc.n)
			}
			continue
		}
		if err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%q: error %v, want one containing %q", tc.text, err, tc.want)
		}
	}
}

// Numbers are decimal: a hexadecimal float is reported once, at the number,
// not as a stray unit.
func TestHexNumberReportedAtNumber(t *testing.T) {
	src := "species H2(g) { hf 0x1p3 kJ/mol }\n"
	net := Load("/hostile/hex.hess", Overlay{Files: map[string][]byte{"/hostile/hex.hess": []byte(src)}}, Options{})
	var msgs []string
	for _, d := range net.Diagnostics {
		if d.Code == "syntax" {
			msgs = append(msgs, d.Message)
			if d.Subject.Start.Column != 20 {
				t.Errorf("hex number reported at column %d, want 20: %s", d.Subject.Start.Column, d.Message)
			}
		}
	}
	if len(msgs) != 1 || !strings.Contains(msgs[0], "hexadecimal") {
		t.Errorf("syntax diagnostics %q, want one about the hexadecimal number", msgs)
	}
}

// Messages print temperatures beyond float rounding range as numbers, not +Inf.
func TestShortLargeNumbers(t *testing.T) {
	for v, want := range map[float64]string{1e308: "1e+308", 298.15: "298.15", 1e-300: "1e-300"} {
		if got := short(v); got != want {
			t.Errorf("short(%g) = %q, want %q", v, got, want)
		}
	}
}

// A value that overflows when converted to SI is reported, not carried on
// as +Inf.
func TestConversionOverflowReported(t *testing.T) {
	src := "species H2(g) { hf 1e308 kJ/mol }\n"
	net := Load("/hostile/big.hess", Overlay{Files: map[string][]byte{"/hostile/big.hess": []byte(src)}}, Options{})
	for _, d := range net.Diagnostics {
		if strings.Contains(d.Message, "out of range once converted") {
			return
		}
	}
	t.Errorf("no out-of-range diagnostic: %v", net.Diagnostics)
}

// A mixture's temperature keeps to the same bounds as a temperature list.
func TestMixtureTemperatureBounds(t *testing.T) {
	src := "species H2(g) { hf 0 kJ/mol s 130.68 J/mol/K }\nmixture m { temperature 1e308 K pressure 1 bar H2(g) 1 mol }\n"
	net := Load("/hostile/mix.hess", Overlay{Files: map[string][]byte{"/hostile/mix.hess": []byte(src)}}, Options{})
	for _, d := range net.Diagnostics {
		if strings.Contains(d.Message, "temperature 1e308 K is above 1000000 K") {
			return
		}
	}
	t.Errorf("no bound on the mixture's temperature: %v", net.Diagnostics)
}
