package gibbs

import (
	"math"
	"math/rand/v2"
	"testing"
)

// TestRandomFeedsConverge solves 2000 seeded random C–H–O feeds (some
// species absent, 300–3300 K, P/p° from e^-5 to e^5) and requires every
// one to converge with the stationarity and balance of an optimum.
func TestRandomFeedsConverge(t *testing.T) {
	if testing.Short() {
		t.Skip("long")
	}
	rng := rand.New(rand.NewPCG(3, 4))
	bad, n := 0, 0
	for i := 0; i < 2000; i++ {
		feed := make([]float64, 7)
		for j := range feed {
			if rng.Float64() < 0.5 {
				feed[j] = rng.Float64()
			}
		}
		T := 300 + 3000*rng.Float64()
		sp := make([]Species, 7)
		for j, d := range fuzzSpecies {
			sp[j] = Species{Name: chonNames[j], Mu0: d.h/T - d.s}
		}
		sp[6].Phase = 1
		p := Problem{
			Phases:  []Phase{{Name: "g", Kind: IdealGas}, {Name: "C(gr)", Kind: Pure}},
			Species: sp,
			B:       dense([][]float64{{1, 0, 1, 1, 0, 0, 1}, {4, 2, 0, 0, 2, 0, 0}, {0, 1, 1, 2, 0, 2, 0}}),
			N0:      feed,
			PRatio:  math.Exp(-5 + 10*rng.Float64()),
		}
		r, err := Solve(p, Options{})
		if err != nil {
			continue
		}
		n++
		if r.Converged && (r.Stationarity > 1e-8 || r.ElementResidual > 1e-11) {
			t.Errorf("feed %v T %g: stationarity %g residual %g", feed, T, r.Stationarity, r.ElementResidual)
		}
		if !r.Converged {
			bad++
			if bad < 5 {
				t.Logf("feed %v T %g P %g: res %g stat %g it %d N %v", feed, T, p.PRatio, r.ElementResidual, r.Stationarity, r.Iterations, r.N)
			}
		}
	}
	if bad > 0 {
		t.Errorf("%d of %d not converged", bad, n)
	}
}
