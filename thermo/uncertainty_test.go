package thermo

import (
	"math"
	"testing"
)

// codataGas is a CODATA key value (Cox, Wagman, Medvedev 1989, via REFERENCE-DATA
// §2a): ΔfH° ± σ in kJ/mol, S° ± σ in J/(mol·K).
type codataGas struct{ hf, sh, s, ss float64 }

var codataWGS = []struct {
	nu float64
	codataGas
}{
	{-1, codataGas{-110.53, 0.17, 197.660, 0.004}},   // CO(g)
	{-1, codataGas{-241.826, 0.040, 188.835, 0.010}}, // H2O(g)
	{1, codataGas{-393.51, 0.13, 213.785, 0.010}},    // CO2(g)
	{1, codataGas{0, 0, 130.680, 0.003}},             // H2(g)
}

// codataReaction builds the water-gas shift from constant models, with input i
// moved by d·σ (i < 0: nothing moved; which picks ΔfH° or S°).
func codataReaction(t *testing.T, i int, entropy bool, d float64) Reaction {
	t.Helper()
	var r Reaction
	for j, c := range codataWGS {
		hf, s := 1000*c.hf, c.s
		if j == i {
			if entropy {
				s += d * c.ss
			} else {
				hf += d * 1000 * c.sh
			}
		}
		m, err := NewConstant(hf, s)
		if err != nil {
			t.Fatal(err)
		}
		r.Terms = append(r.Terms, Term{Nu: c.nu, Model: m, IsGas: true,
			Sigma: SpeciesSigma{H: 1000 * c.sh, S: c.ss}})
	}
	return r
}

func TestSigmaLog10KAgainstFiniteDifferences(t *testing.T) {
	r := codataReaction(t, -1, false, 0)
	for _, T := range []float64{298.15, 700, 1000} {
		// Propagate by hand: move each input by ±σ, take the central difference of
		// log10 K, and add the contributions in quadrature.
		v := 0.0
		for i := range codataWGS {
			for _, entropy := range []bool{false, true} {
				up := codataReaction(t, i, entropy, 1).Log10K(T)
				down := codataReaction(t, i, entropy, -1).Log10K(T)
				d := (up - down) / 2
				v += d * d
			}
		}
		want := math.Sqrt(v)
		if got := r.SigmaLog10K(T); math.Abs(got/want-1) > 1e-6 {
			t.Errorf("σ(log10 K) at %g K = %.6g, finite differences give %.6g", T, got, want)
		}
		if got, want := r.SigmaDeltaG(T), r.SigmaLog10K(T)*R*T*math.Ln10; math.Abs(got/want-1) > 1e-12 {
			t.Errorf("σ(ΔrG°) = %g, σ(log10 K)·RT ln 10 = %g", got, want)
		}
	}
	// ΔrH° and ΔrS° sums of squares.
	if got, want := r.SigmaDeltaH(), 1000*math.Sqrt(0.17*0.17+0.04*0.04+0.13*0.13); math.Abs(got-want) > 1e-9 {
		t.Errorf("σ(ΔrH°) = %g, want %g", got, want)
	}
	if got, want := r.SigmaDeltaS(), math.Sqrt(0.004*0.004+0.01*0.01+0.01*0.01+0.003*0.003); math.Abs(got-want) > 1e-12 {
		t.Errorf("σ(ΔrS°) = %g, want %g", got, want)
	}
}

func TestSigmaGibbsOnly(t *testing.T) {
	// A gf-only species contributes ν²·σG², even if σH and σS are set (demo
	// uncertainties on NBS82 ΔfG° values for AgCl dissolving).
	terms := []struct{ nu, gf, sg float64 }{{-1, -109.789e3, 200}, {1, 77.107e3, 80}, {1, -131.228e3, 100}}
	build := func(k int, d float64) Reaction {
		var r Reaction
		for i, x := range terms {
			g := x.gf
			if i == k {
				g += d * x.sg
			}
			m, _ := NewGibbsOnly(g)
			r.Terms = append(r.Terms, Term{Nu: x.nu, Model: m, Sigma: SpeciesSigma{H: 5000, S: 3, G: x.sg}})
		}
		return r
	}
	v := 0.0
	for k := range terms {
		d := (build(k, 1).Log10K(T298) - build(k, -1).Log10K(T298)) / 2
		v += d * d
	}
	if got, want := build(-1, 0).SigmaLog10K(T298), math.Sqrt(v); math.Abs(got/want-1) > 1e-6 {
		t.Errorf("σ(log10 K) = %.6g, finite differences give %.6g", got, want)
	}
}

func TestLinearSum(t *testing.T) {
	// A cycle residual: overall − reform − shift, 298.15 K ΔrG° values of
	// REFERENCE-DATA §3 (derived from JANAF; 113.543 = 142.187 − 28.644) with demo
	// uncertainties.
	sum, sigma := LinearSum([]Weighted{
		{Weight: 1, Value: 113.543, Sigma: 0.3},
		{Weight: -1, Value: 142.187, Sigma: 0.4},
		{Weight: -1, Value: -28.644, Sigma: 0.12},
	})
	if math.Abs(sum) > 1e-9 || math.Abs(sigma-math.Sqrt(0.09+0.16+0.0144)) > 1e-12 {
		t.Errorf("residual %g ± %g", sum, sigma)
	}
	sum, sigma = LinearSum([]Weighted{{Weight: 2, Value: 3, Sigma: 0.5}})
	if sum != 6 || sigma != 1 {
		t.Errorf("2·(3 ± 0.5) = %g ± %g, want 6 ± 1", sum, sigma)
	}
	if sum, sigma = LinearSum(nil); sum != 0 || sigma != 0 {
		t.Errorf("empty sum %g ± %g", sum, sigma)
	}
}
