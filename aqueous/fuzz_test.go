package aqueous

import (
	"errors"
	"math"
	"testing"
)

// FuzzModels checks that no ionic strength in [0, 1e3] mol/kg, charge, ion
// size or temperature makes a model panic or return NaN or ±Inf, that
// temperatures outside the correlations fail with a *RangeError and the zero
// Params, and that ln a_w and φ stay finite (a_w itself may overflow to +Inf
// far beyond a model's range, where φ turns negative). The seed corpus is in testdata/fuzz/FuzzModels.
func FuzzModels(f *testing.F) {
	f.Add(0.1, 298.15, int8(1), 4.0, 0.1)
	f.Add(0.0, 273.15, int8(-2), 0.0, 0.0)
	f.Add(1e3, 373.15, int8(3), 9.0, -0.2)
	f.Add(5.0, 400.0, int8(1), 1e300, 1e3)
	f.Add(1e-300, 200.0, int8(-128), -1.0, math.NaN())
	f.Fuzz(func(t *testing.T, I, T float64, z int8, size, ks float64) {
		if !(I >= 0 && I <= 1e3) {
			return
		}
		if math.IsNaN(ks) || math.Abs(ks) > 10 {
			ks = 0.1
		}
		p, err := ParamsAt(T)
		if err != nil {
			var re *RangeError
			if !errors.As(err, &re) || p != (Params{}) {
				t.Fatalf("T = %v: err %v, params %+v", T, err, p)
			}
			if T >= ParamsTMin && T <= ParamsTMax {
				t.Fatalf("T = %v in range but %v", T, err)
			}
			return
		}
		if !(T >= ParamsTMin && T <= ParamsTMax) {
			t.Fatalf("T = %v out of range but accepted", T)
		}
		for _, m := range Models() {
			lg := m.LogGamma(int(z), size, I, p)
			ln := m.LogGammaNeutral(ks, I)
			if !finite(lg) || !finite(ln) {
				t.Fatalf("%s z=%d å=%v I=%v T=%v: log γ %v, neutral %v", m.Name(), z, size, I, T, lg, ln)
			}
			solutes := []Solute{
				{Charge: int(z), Size: size, Molality: I},
				{Charge: -1, Size: 3, Molality: I},
				{Setschenow: ks, Molality: I / 10},
			}
			w := WaterActivity(m, solutes, p)
			if !finite(w.LnActivity) || !finite(w.Osmotic) || !(w.Activity >= 0) {
				t.Fatalf("%s z=%d å=%v I=%v T=%v: water %+v", m.Name(), z, size, I, T, w)
			}
		}
	})
}

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }
