package gibbs

import (
	"math"
	"strings"
	"testing"
)

// fuzzSpecies: name, ΔfH°/R (K) and S°/R near 1000 K, rounded from the
// WebBook data of chon_test.go; enough to give μ°/RT = h/T − s a realistic
// temperature dependence for the fuzz target.
var fuzzSpecies = []struct {
	h, s float64
}{
	{-9006, 29.6},  // CH4
	{-29090, 27.9}, // H2O
	{-13290, 28.4}, // CO
	{-47330, 32.6}, // CO2
	{0, 19.8},      // H2
	{0, 29.4},      // O2
	{0, 3.0},       // C(gr)
}

func FuzzSolve(f *testing.F) {
	f.Add(0.25, 0.75, 0.0, 0.0, 0.0, 0.0, 0.0, 1000.0, 1.0, uint8(0))
	f.Add(0.7, 0.3, 0.0, 0.0, 0.0, 0.0, 0.0, 1000.0, 0.0, uint8(1))
	f.Add(0.0, 0.0, 1.0, 0.0, 0.0, 0.0, 0.0, 700.0, 3.0, uint8(0))
	f.Add(0.0, 0.0, 0.0, 0.0, 1.0, 1.0, 0.0, 3000.0, -2.0, uint8(1))
	f.Add(0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 1.0, 500.0, 0.0, uint8(0))
	f.Add(1e-20, 1.0, 0.0, 1e-30, 0.0, 0.0, 5.0, 1500.0, 2.0, uint8(1))
	f.Fuzz(func(t *testing.T, c0, c1, c2, c3, c4, c5, c6, T, lnP float64, basis uint8) {
		feed := []float64{c0, c1, c2, c3, c4, c5, c6}
		for i, v := range feed {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return
			}
			feed[i] = math.Mod(math.Abs(v), 1e6)
		}
		if !(T >= 200 && T <= 6000) || !(lnP >= -10 && lnP <= 10) {
			return
		}
		p := graphiteProblem(T, feed, math.Exp(lnP))
		switch basis % 4 {
		case 1:
			B, err := ReactionsConservation(dense(chonReactions()[:7]))
			if err != nil {
				t.Fatal(err)
			}
			p.B = B
		case 2:
			// A salt over water and a vapour: aqueous, pure and gas phases
			// with a charge row; the feed and T-like numbers reused.
			p = salt(math.Exp(-20+40*math.Mod(T, 1000)/1000), feed[3])
			p.Phases = append(p.Phases, Phase{Name: "g", Kind: IdealGas})
			p.Species = append(p.Species, Species{Name: "H2O(g)", Phase: 2, Mu0: -90 + lnP})
			p.B = dense([][]float64{{2, 0, 0, 0, 2}, {1, 0, 0, 0, 1}, {0, 1, 0, 1, 0}, {0, 0, 1, 1, 0}, {0, 1, -1, 0, 0}})
			p.N0 = []float64{feed[0], feed[1], feed[1], feed[3], feed[4]}
			p.PRatio = math.Exp(lnP)
		case 3:
			// Vapour over an ideal liquid solution.
			p = Problem{
				Phases: []Phase{{Name: "g", Kind: IdealGas}, {Name: "l", Kind: Solution}},
				Species: []Species{
					{Name: "A(g)", Phase: 0}, {Name: "B(g)", Phase: 0},
					{Name: "A(l)", Phase: 1, Mu0: 3000/T - 3}, {Name: "B(l)", Phase: 1, Mu0: 4000/T - 3},
				},
				B:      dense([][]float64{{1, 0, 1, 0}, {0, 1, 0, 1}}),
				N0:     feed[:4],
				PRatio: math.Exp(lnP),
			}
		}
		r, err := Solve(p, Options{})
		if err != nil {
			if strings.Contains(err.Error(), "internal") {
				t.Fatalf("internal error: %v", err)
			}
			return
		}
		for j, v := range r.N {
			if v < 0 || math.IsNaN(v) || math.IsInf(v, 0) {
				t.Fatalf("amount %d = %g", j, v)
			}
		}
		if r.Converged && (r.ElementResidual > 1e-9 || r.Stationarity > 1e-6) {
			t.Fatalf("converged with residual %g, stationarity %g", r.ElementResidual, r.Stationarity)
		}
	})
}

// graphiteProblem is the C–H–O gas over graphite of the fuzz and random tests
// at T (K): fuzzSpecies' μ°/RT, element rows C, H, O, the feed and P/p°.
func graphiteProblem(T float64, feed []float64, pRatio float64) Problem {
	sp := make([]Species, 7)
	for j, d := range fuzzSpecies {
		sp[j] = Species{Name: chonNames[j], Mu0: d.h/T - d.s}
	}
	sp[6].Phase = 1
	return Problem{
		Phases:  []Phase{{Name: "g", Kind: IdealGas}, {Name: "C(gr)", Kind: Pure}},
		Species: sp,
		B:       dense([][]float64{{1, 0, 1, 1, 0, 0, 1}, {4, 2, 0, 0, 2, 0, 0}, {0, 1, 1, 2, 0, 2, 0}}),
		N0:      feed,
		PRatio:  pRatio,
	}
}
