package thermo

import (
	"math"
	"testing"
)

func TestConstants(t *testing.T) {
	// SI 2019 exact definitions and derived values, REFERENCE-DATA §4 (CRC page).
	tests := []struct {
		name      string
		got, want float64
		rel       float64
	}{
		{"R = NA·k", NA * KB, R, 1e-15},
		{"R", R, 8.31446261815324, 0},
		{"F = NA·e", F, 96485.33212, 1e-10},
		{"R in cal_th/(mol·K)", R / CalTh, 1.987204259, 1e-9},
		{"R in L·atm/(mol·K)", R * 1000 / Atm, 0.082057366, 1e-8},
		{"1 atm", Atm, 101325, 0},
		{"1 bar", Bar, 1e5, 0},
		{"1 cal_th", CalTh, 4.184, 0},
		{"T298", T298, 298.15, 0},
	}
	for _, tc := range tests {
		if math.Abs(tc.got-tc.want) > tc.rel*math.Abs(tc.want) {
			t.Errorf("%s = %.15g, want %.15g", tc.name, tc.got, tc.want)
		}
	}
}
