package gibbs_test

import (
	"math"
	"math/rand/v2"
	"testing"

	"hess/gibbs"
	"hess/gibbs/gibbstest"
)

// TestAgainstScipy compares the solver with an independent minimisation
// (python3-scipy: SLSQP polished by fsolve on the KKT equations, in
// gibbstest) on seeded random steam–methane problems of the C–H–O system:
// 600–1200 K, 1–30 bar, steam-to-carbon 1–4, plus fixed cases where solid
// carbon forms and where it does not. Amounts must agree within 1e-7 mol
// (feed 1 mol).
func TestAgainstScipy(t *testing.T) {
	gibbstest.Require(t)
	type tc struct{ T, P, sc float64 }
	cases := []tc{
		{850, 1, 1},    // carbon forms (0.05 mol with these data)
		{750, 1, 1},    // carbon barely forms (3e-4 mol): near the carbon boundary
		{1000, 1, 0.5}, // more carbon: steam short of the range's S/C 1, on purpose
		{1100, 25, 3},  // no carbon: the reformer outlet
		{600, 1, 1},    // low temperature: CH4 and H2O dominate
		{1200, 1, 1},   // high temperature, lean steam
	}
	rng := rand.New(rand.NewPCG(12, 1))
	for i := 0; i < 8; i++ {
		cases = append(cases, tc{600 + 600*rng.Float64(), 1 + 29*rng.Float64(), 1 + 3*rng.Float64()})
	}
	sawCarbon, sawNone := false, false
	var ps []gibbs.Problem
	for _, c := range cases {
		ps = append(ps, gibbs.ChonProblem(t, c.T, c.P, c.sc))
	}
	refs, err := gibbstest.ReferenceAll(ps)
	if err != nil {
		t.Fatal(err)
	}
	for i, c := range cases {
		p, ref := ps[i], refs[i]
		got, err := gibbs.Solve(p, gibbs.Options{})
		if err != nil || !got.Converged {
			t.Fatalf("T=%.1f P=%.2f S/C=%.2f: %v converged=%v", c.T, c.P, c.sc, err, got.Converged)
		}
		if got.N[6] > 0 && c.sc >= 1 {
			sawCarbon = true
		} else {
			sawNone = true
		}
		for j := range got.N {
			if d := math.Abs(got.N[j] - ref.N[j]); d > 1e-7 {
				t.Errorf("T=%.1f P=%.2f S/C=%.2f %s: hess %.12g scipy %.12g (reference KKT residual %.2g)", c.T, c.P, c.sc, p.Species[j].Name, got.N[j], ref.N[j], ref.Residual)
			}
		}
		if testing.Verbose() {
			t.Logf("T=%.1f P=%.2f S/C=%.2f: C(gr) %.6g H2 %.6g CH4 %.6g (scipy %.6g %.6g %.6g)", c.T, c.P, c.sc, got.N[6], got.N[4], got.N[0], ref.N[6], ref.N[4], ref.N[0])
		}
	}
	if !sawCarbon || !sawNone {
		t.Errorf("the cases must include carbon forming (%v) and not (%v)", sawCarbon, sawNone)
	}
}
