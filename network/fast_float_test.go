package network

import (
	"fmt"
	"math"
	"math/rand/v2"
	"strconv"
	"testing"
)

// fastFloatAgrees fails when fastFloat reads s and strconv.ParseFloat (the
// reference) reads it otherwise, or does not read it at all.
func fastFloatAgrees(t *testing.T, s string) {
	t.Helper()
	v, ok := fastFloat(s)
	if !ok {
		return
	}
	want, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Errorf("fastFloat(%q) = %v, strconv refuses it: %v", s, v, err)
		return
	}
	if math.Float64bits(v) != math.Float64bits(want) {
		t.Errorf("fastFloat(%q) = %v (%#x), strconv %v (%#x)", s, v, math.Float64bits(v), want, math.Float64bits(want))
	}
}

func TestFastFloat(t *testing.T) {
	for _, tc := range []struct {
		in   string
		want float64
		ok   bool
	}{
		{"1.234567890E+00", 1.23456789, true},
		{"-2.5e-3", -0.0025, true},
		{"+7", 7, true},
		{"0", 0, true},
		{"-0.0", math.Copysign(0, -1), true},
		{".5", 0.5, true},
		{"5.", 5, true},
		{"0.000000000000000000001", 1e-21, true},
		{"1e22", 1e22, true},
		{"1e23", 0, false},                 // 10^23 is not exact
		{"12345678901234567890", 0, false}, // 20 significant digits
		{"9007199254740993", 0, false},     // above 2^53
		{"1/3", 0, false},                  // a fraction
		{"0x10", 0, false},                 // hexadecimal
		{"1_000", 0, false},                // underscores
		{"1e", 0, false}, {"e5", 0, false}, {".", 0, false}, {"-", 0, false}, {"1..2", 0, false},
		{"1e+00005", 0, false}, // long exponent: the slow path
	} {
		v, ok := fastFloat(tc.in)
		if ok != tc.ok || (ok && math.Float64bits(v) != math.Float64bits(tc.want)) {
			t.Errorf("fastFloat(%q) = %v, %v; want %v, %v", tc.in, v, ok, tc.want, tc.ok)
		}
		fastFloatAgrees(t, tc.in)
	}
	// Random numbers in the forms generators and people write them.
	r := rand.New(rand.NewPCG(1, 2))
	for range 200000 {
		x := (r.Float64() - 0.5) * math.Pow(10, float64(r.IntN(40)-20))
		var s string
		switch r.IntN(4) {
		case 0:
			s = strconv.FormatFloat(x, 'E', r.IntN(17), 64)
		case 1:
			s = strconv.FormatFloat(x, 'f', r.IntN(20), 64)
		case 2:
			s = strconv.FormatFloat(x, 'g', -1, 64)
		default:
			s = fmt.Sprintf("%d.%0*de%d", r.IntN(1000), r.IntN(6)+1, r.IntN(100000), r.IntN(45)-22)
		}
		fastFloatAgrees(t, s)
	}
}

func FuzzFastFloat(f *testing.F) {
	for _, s := range []string{"1.234567890E+00", "-0.5", "1e22", "123456789012345678", ".5e-22"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) { fastFloatAgrees(t, s) })
}
