package gibbs

import (
	"math"
	"testing"
)

func TestVapourLiquidPhaseVanishes(t *testing.T) {
	// An ideal binary with an ideal gas over an ideal liquid solution
	// (Raoult: y_i P = x_i P_i,sat, μ°_liquid/RT = ln(P_sat/p°) with μ°_gas = 0).
	// Feed 0.5/0.5 with P_sat 3 and 0.5: dew pressure 1/Σ(z/P_sat) = 6/7,
	// bubble pressure Σ z P_sat = 1.75. Below the dew pressure the liquid
	// must vanish, above the bubble pressure the gas; between, the vapour
	// fraction V solves Rachford–Rice Σ z(K−1)/(1+V(K−1)) = 0, K = P_sat/P.
	psat := []float64{3, 0.5}
	z := []float64{0.5, 0.5}
	for _, P := range []float64{0.3, 0.8, 1.0, 1.2, 1.7, 2.5} {
		p := Problem{
			Phases: []Phase{{Name: "g", Kind: IdealGas}, {Name: "l", Kind: Solution}},
			Species: []Species{
				{Name: "A(g)", Phase: 0, Mu0: 0}, {Name: "B(g)", Phase: 0, Mu0: 0},
				{Name: "A(l)", Phase: 1, Mu0: math.Log(psat[0])}, {Name: "B(l)", Phase: 1, Mu0: math.Log(psat[1])},
			},
			B:      dense([][]float64{{1, 0, 1, 0}, {0, 1, 0, 1}}),
			N0:     []float64{z[0], z[1], 0, 0},
			PRatio: P,
		}
		r := mustSolve(t, p, Options{})
		dew, bubble := 1/(z[0]/psat[0]+z[1]/psat[1]), z[0]*psat[0]+z[1]*psat[1]
		switch {
		case P < dew:
			if r.PhasePresent[1] || r.N[2] != 0 || r.N[3] != 0 {
				t.Errorf("P=%g below the dew pressure: liquid %v %g %g", P, r.PhasePresent[1], r.N[2], r.N[3])
			}
		case P > bubble:
			if r.PhasePresent[0] || r.N[0] != 0 || r.N[1] != 0 {
				t.Errorf("P=%g above the bubble pressure: gas %v %g %g", P, r.PhasePresent[0], r.N[0], r.N[1])
			}
		default:
			rr := func(V float64) float64 {
				s := 0.0
				for i := range z {
					K := psat[i] / P
					s += z[i] * (K - 1) / (1 + V*(K-1))
				}
				return s
			}
			lo, hi := 0.0, 1.0
			for i := 0; i < 200; i++ {
				if mid := (lo + hi) / 2; rr(mid) > 0 {
					lo = mid
				} else {
					hi = mid
				}
			}
			V := (lo + hi) / 2
			relClose(t, "vapour", r.PhaseAmount[0], V, 1e-9)
			K := psat[0] / P
			relClose(t, "y_A", r.N[0]/r.PhaseAmount[0], z[0]*K/(1+V*(K-1)), 1e-9)
		}
	}
}
