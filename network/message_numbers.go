package network

// Numbers as diagnostics write them: exact counts, charges, temperatures,
// energies and ratios.

import (
	"fmt"
	"math"
	"math/big"
	"strconv"
	"strings"
)

// ratText prints an exact count: an integer, or p/q.
func ratText(r *big.Rat) string {
	if r.IsInt() {
		return r.Num().String()
	}
	return r.RatString()
}

// chargeText writes an exact net charge with its sign: "+1", "-2", "0".
func chargeText(r *big.Rat) string {
	s := ratText(r)
	if r.Sign() > 0 {
		s = "+" + s
	}
	return s
}

// kelvin writes a temperature for a message: "298.15 K", "1200 K".
func kelvin(T float64) string { return short(T) + " K" }

// short writes a number with at most four decimals and no trailing zeros.
func short(v float64) string {
	if a := math.Abs(v); a >= 1e15 || (a < 1e-4 && a > 0) {
		return strconv.FormatFloat(v, 'g', 6, 64)
	}
	return strconv.FormatFloat(math.Round(v*1e4)/1e4, 'f', -1, 64)
}

// signed writes a difference with four significant digits and its sign.
func signed(v float64) string {
	var s string
	switch a := math.Abs(v); {
	case a >= 1e4:
		s = strconv.FormatFloat(v, 'f', 0, 64)
	case a < 1e-3 && a > 0:
		s = strconv.FormatFloat(v, 'e', 2, 64)
	default:
		s = strconv.FormatFloat(v, 'g', 4, 64)
	}
	if v >= 0 {
		s = "+" + s
	}
	return s
}

// kelvinList writes temperatures as "600 K, 700 K and 800 K", the first
// few of a long list followed by how many there are.
func kelvinList(ts []float64) string {
	const shown = 4
	parts := make([]string, 0, shown)
	for i, T := range ts {
		if i == shown && len(ts) > shown+1 {
			return strings.Join(parts, ", ") + fmt.Sprintf(" and %d more", len(ts)-shown)
		}
		parts = append(parts, kelvin(T))
	}
	if len(parts) == 1 {
		return parts[0]
	}
	return strings.Join(parts[:len(parts)-1], ", ") + " and " + parts[len(parts)-1]
}

// kjText writes an energy in J/mol as kJ/mol with two decimals (more
// significant digits for very small values).
func kjText(v float64) string {
	x := v / 1000
	if x != 0 && math.Abs(x) < 0.005 {
		return strconv.FormatFloat(x, 'g', 2, 64)
	}
	s := strconv.FormatFloat(x, 'f', 2, 64)
	if s == "-0.00" {
		s = "0.00"
	}
	return s
}

// sig3 writes a number with three significant digits.
func sig3(v float64) string { return strconv.FormatFloat(v, 'g', 3, 64) }
