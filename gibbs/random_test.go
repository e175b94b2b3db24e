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
		p := graphiteProblem(T, feed, math.Exp(-5+10*rng.Float64()))
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

// TestSyntheticBasesAgree solves seeded invented 60-species systems (gas and
// pure phases) at several temperatures on the elements basis and on a
// reactions basis spanning every element-conserving change: both must
// converge to the same amounts.
func TestSyntheticBasesAgree(t *testing.T) {
	for seed := uint64(1); seed <= 12; seed++ {
		for _, T := range []float64{500, 1000, 2000} {
			pe := synthetic(seed, 60, 4, T)
			B, err := ReactionsConservation(syntheticReactions(pe, 200))
			if err != nil {
				t.Fatal(err)
			}
			pr := pe
			pr.B = B
			re, err1 := Solve(pe, Options{})
			rr, err2 := Solve(pr, Options{})
			if err1 != nil || err2 != nil || !re.Converged || !rr.Converged {
				t.Errorf("seed %d T %g: %v %v converged %v %v (residuals %g %g)", seed, T, err1, err2, re.Converged, rr.Converged, re.ElementResidual, rr.ElementResidual)
				continue
			}
			for j := range re.N {
				if d := math.Abs(re.N[j] - rr.N[j]); d > 1e-8*math.Max(re.N[j], 1e-4) {
					t.Errorf("seed %d T %g species %d: elements %.10g reactions %.10g", seed, T, j, re.N[j], rr.N[j])
					break
				}
			}
		}
	}
}

// TestSyntheticLarge solves seeded invented 500-species systems with six
// elements at three temperatures: each must converge.
func TestSyntheticLarge(t *testing.T) {
	if testing.Short() {
		t.Skip("long")
	}
	for seed := uint64(1); seed <= 6; seed++ {
		for _, T := range []float64{400, 1000, 3000} {
			r, err := Solve(synthetic(seed, 500, 6, T), Options{})
			if err != nil || !r.Converged {
				t.Errorf("seed %d T %g: %v converged %v residual %g stationarity %g iterations %d", seed, T, err, r.Converged, r.ElementResidual, r.Stationarity, r.Iterations)
			}
		}
	}
}
