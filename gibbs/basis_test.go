package gibbs

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/mat"
)

func TestReactionsConservationExact(t *testing.T) {
	N := dense(chonReactions())
	B, err := ReactionsConservation(N)
	if err != nil {
		t.Fatal(err)
	}
	if r, c := B.Dims(); r != 3 || c != 7 {
		t.Fatalf("B is %d × %d, want 3 × 7", r, c)
	}
	var BN mat.Dense
	BN.Mul(B, N)
	if mat.Norm(&BN, math.Inf(1)) != 0 {
		t.Errorf("B·N ≠ 0 exactly:\n%v", mat.Formatted(&BN))
	}
	for i := 0; i < 3; i++ {
		for j := 0; j < 7; j++ {
			if v := B.At(i, j); v != math.Trunc(v) {
				t.Errorf("entry (%d,%d) = %g not an integer", i, j, v)
			}
		}
	}
	// Halves are short decimals too; a long one falls back to the SVD.
	for _, N := range []*mat.Dense{
		dense([][]float64{{-0.5}, {-0.5}, {1}}),
		dense([][]float64{{-1.0 / 3}, {1}, {0}}),
	} {
		B, err := ReactionsConservation(N)
		if err != nil {
			t.Fatal(err)
		}
		var BN mat.Dense
		BN.Mul(B, N)
		if r, _ := B.Dims(); r != 2 || mat.Norm(&BN, math.Inf(1)) > 1e-14 {
			t.Errorf("rows %d, |B·N| = %g", r, mat.Norm(&BN, math.Inf(1)))
		}
	}
}

func TestBasesAgree(t *testing.T) {
	// The four reactions span every element-conserving change of the seven
	// species, so both bases define the same feasible set and the same minimum.
	B, err := ReactionsConservation(dense(chonReactions()))
	if err != nil {
		t.Fatal(err)
	}
	// The same span through the SVD: orthonormal, non-integer rows.
	Bsvd, err := svdLeftNull(dense(chonReactions()))
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct{ T, P, sc float64 }{{900, 1, 3}, {1100, 25, 3}, {700, 10, 1}, {1000, 1, 1}, {1000, 1, 0.5}} {
		pe := chonProblem(t, tc.T, tc.P, tc.sc)
		re := mustSolve(t, pe, Options{})
		for _, basis := range []*mat.Dense{B, Bsvd} {
			pr := pe
			pr.B = basis
			rr := mustSolve(t, pr, Options{})
			for j := range re.N {
				if d := math.Abs(re.N[j] - rr.N[j]); d > 1e-10*math.Max(re.N[j], 1e-3) {
					t.Errorf("T=%g P=%g: %s elements %.12g reactions %.12g", tc.T, tc.P, chonNames[j], re.N[j], rr.N[j])
				}
			}
		}
	}
}

func TestBasisNotSpanning(t *testing.T) {
	// Only the water-gas shift is given, with CH4 in the feed. Under the
	// reactions basis CH4 cannot react (no reaction moves it), so it stays at
	// its feed amount, the shift reaches its own equilibrium (1:1 CO/H2O,
	// x = √K/(1+√K), CH4 only dilutes and Δn = 0), and O2 and C(gr), which no
	// reaction makes, are exactly 0. The elements basis instead reforms CH4.
	const T, P = 1000.0, 5.0
	pe := chonProblem(t, T, P, 1)
	pe.N0 = []float64{0.5, 1, 1, 0, 0, 0, 0}
	N := dense([][]float64{{0}, {-1}, {-1}, {1}, {1}, {0}, {0}})
	B, err := ReactionsConservation(N)
	if err != nil {
		t.Fatal(err)
	}
	pr := pe
	pr.B = B
	rr := mustSolve(t, pr, Options{})
	re := mustSolve(t, pe, Options{})
	if rr.N[0] != 0.5 && math.Abs(rr.N[0]-0.5) > 1e-15 {
		t.Errorf("CH4 under the reactions basis = %.17g, want 0.5", rr.N[0])
	}
	if rr.N[5] != 0 || rr.N[6] != 0 || !rr.Zero[5] || !rr.Zero[6] {
		t.Errorf("O2 %g, C(gr) %g must be exactly 0", rr.N[5], rr.N[6])
	}
	lnK := pe.Species[0+2].Mu0 + pe.Species[1].Mu0 - pe.Species[3].Mu0 - pe.Species[4].Mu0
	sk := math.Sqrt(math.Exp(lnK))
	relClose(t, "CO2", rr.N[3], sk/(1+sk), 1e-9)
	if math.Abs(re.N[0]-0.5) < 0.01 {
		t.Errorf("elements basis left CH4 at %g: it should reform at %g K", re.N[0], T)
	}
	// The reactions answer lies in n₀ + range(N): n − n₀ ∥ the shift.
	xi := rr.N[3]
	want := []float64{0.5, 1 - xi, 1 - xi, xi, xi, 0, 0}
	for j := range want {
		if math.Abs(rr.N[j]-want[j]) > 1e-12 {
			t.Errorf("%s = %g, want %g", chonNames[j], rr.N[j], want[j])
		}
	}
}

func TestWarmStartSweep(t *testing.T) {
	// A temperature sweep with warm starts gives the cold answers.
	var prev *Result
	for T := 700.0; T <= 1200; T += 25 {
		p := chonProblem(t, T, 10, 1.5)
		cold := mustSolve(t, p, Options{})
		warm := mustSolve(t, p, Options{Start: prev})
		for j := range cold.N {
			if d := math.Abs(cold.N[j] - warm.N[j]); d > 1e-10*math.Max(cold.N[j], 1e-3) {
				t.Errorf("T=%g %s: cold %.12g warm %.12g", T, chonNames[j], cold.N[j], warm.N[j])
			}
		}
		prev = &warm
	}
}

func TestIntegerAndRationalEliminationAgree(t *testing.T) {
	// The int64 elimination and the big.Rat one give the same rows.
	for _, N := range []*mat.Dense{
		dense(chonReactions()),
		syntheticReactions(synthetic(1, 60, 4, 1000), 200),
		dense([][]float64{{-0.5, 1}, {-0.5, 0}, {1, -1}, {0, 0.25}}),
	} {
		a, ok1 := intLeftNull(N)
		b, ok2 := exactLeftNull(N)
		if !ok1 || !ok2 {
			t.Fatalf("elimination refused: int %v rat %v", ok1, ok2)
		}
		if !mat.Equal(a, b) {
			t.Errorf("int64 and big.Rat rows differ:\n%v\n%v", mat.Formatted(a), mat.Formatted(b))
		}
	}
}
