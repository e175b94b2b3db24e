package network

import (
	"fmt"
	"strings"
	"testing"
)

// TestImplausiblePolynomialBetweenSamples puts a narrow dip of Cp° below
// zero between two temperatures that a grid of 50 points over the range
// would sample (200 K to 1000 K in steps of 16.33 K): Cp°/R =
// 1e-4·(T − 257)² − 0.001 is negative only from 253.84 K to 260.16 K and
// least, −0.001·R = −0.008314 J/mol/K, at 257 K (derived by hand).
func TestImplausiblePolynomialBetweenSamples(t *testing.T) {
	const c, t0, depth = 1e-4, 257.0, 1e-3
	a1, a2, a3 := c*t0*t0-depth, -2*c*t0, c
	text := fmt.Sprintf(`settings {
  lint unused-species off
}
species X2(g) {
  nasa7 200 K to 1000 K {
    %v %v %v 0
    0 0 20
  }
}
`, a1, a2, a3)
	n := loadText(t, text)
	var got []string
	for _, d := range n.Diagnostics {
		if d.Code == "implausible-value" {
			got = append(got, d.Message)
		}
	}
	want := "nasa7 range 200 K to 1000 K of X2(g) gives Cp° = -0.008314 J/mol/K at 257 K; Cp° must be positive"
	if len(got) != 1 || got[0] != want {
		t.Errorf("implausible-value reports:\n%s\nwant:\n%s", strings.Join(got, "\n"), want)
	}
}
