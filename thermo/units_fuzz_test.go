package thermo

import (
	"math"
	"testing"
)

// FuzzParseUnit checks that no string makes ParseUnit panic and that every
// accepted unit converts finitely and reversibly. The seed corpus is in
// testdata/fuzz/FuzzParseUnit.
func FuzzParseUnit(f *testing.F) {
	for _, s := range []string{"kJ/mol", "J/(mol*K)", "cm3/mol/s", "degC", "m⁻²", "1/s"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		u, err := ParseUnit(s)
		if err != nil {
			if u != (Unit{}) {
				t.Errorf("ParseUnit(%q) failed but returned %+v", s, u)
			}
			return
		}
		if u.Text != s {
			t.Errorf("Text = %q, want %q", u.Text, s)
		}
		if !(u.Scale > 0) || math.IsInf(u.Scale, 0) {
			t.Errorf("ParseUnit(%q): scale %v is not positive and finite", s, u.Scale)
		}
		if u.Offset != 0 && u.Dim != DimTemperature {
			t.Errorf("ParseUnit(%q): offset %v on a non-temperature unit", s, u.Offset)
		}
		if v := u.FromSI(u.ToSI(1)); math.Abs(v-1) > 1e-9 && u.Scale > 1e-300 && u.Scale < 1e300 {
			t.Errorf("ParseUnit(%q): FromSI(ToSI(1)) = %v", s, v)
		}
	})
}
