package gibbs

import (
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// synthetic builds a seeded invented system: species with random formulas
// over ne elements (0–3 atoms each, at least one), one ideal gas phase and
// a pure phase for every tenth species, μ°/RT = h/T − s with invented h and
// s, and a feed of the first ne+2 species. For benchmarks only.
func synthetic(seed uint64, s, ne int, T float64) Problem {
	rng := rand.New(rand.NewPCG(seed, 7))
	B := mat.NewDense(ne, s, nil)
	phases := []Phase{{Name: "g", Kind: IdealGas}}
	sp := make([]Species, s)
	for j := 0; j < s; j++ {
		any := false
		for i := 0; i < ne; i++ {
			c := float64(rng.IntN(4))
			if j < ne {
				c = 0
				if i == j {
					c = 2
				}
			}
			B.Set(i, j, c)
			any = any || c != 0
		}
		if !any {
			B.Set(rng.IntN(ne), j, 1)
		}
		sp[j] = Species{Name: "X", Mu0: (-40000+60000*rng.Float64())/T - 20 - 10*rng.Float64()}
		if j%10 == 9 {
			phases = append(phases, Phase{Name: "s", Kind: Pure})
			sp[j].Phase = len(phases) - 1
		}
	}
	n0 := make([]float64, s)
	for j := 0; j < ne+2 && j < s; j++ {
		n0[j] = 1
	}
	return Problem{Phases: phases, Species: sp, B: B, N0: n0, PRatio: 10}
}

// syntheticReactions returns nr element-balanced reactions (species × nr)
// spanning every element-conserving change of p: the integer null-space
// basis of the formula matrix followed by random sums of two or three of
// its vectors.
func syntheticReactions(p Problem, nr int) *mat.Dense {
	var bt mat.Dense
	bt.CloneFrom(p.B.T())
	basis, err := ReactionsConservation(&bt) // rows span null(B)
	if err != nil {
		panic(err)
	}
	k, s := basis.Dims()
	rng := rand.New(rand.NewPCG(99, 1))
	N := mat.NewDense(s, nr, nil)
	for r := 0; r < nr; r++ {
		if r < k {
			for j := 0; j < s; j++ {
				N.Set(j, r, basis.At(r, j))
			}
			continue
		}
		for t := 0; t < 2+rng.IntN(2); t++ {
			q := rng.IntN(k)
			for j := 0; j < s; j++ {
				N.Set(j, r, N.At(j, r)+basis.At(q, j))
			}
		}
	}
	return N
}

func benchSolve(b *testing.B, p Problem) {
	r, err := Solve(p, Options{})
	if err != nil || !r.Converged {
		b.Fatalf("%v converged=%v residual %g iterations %d", err, r.Converged, r.ElementResidual, r.Iterations)
	}
	b.ReportMetric(float64(r.Iterations), "newton/op")
	b.ResetTimer()
	for range b.N {
		if _, err := Solve(p, Options{}); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkSolveGas10(b *testing.B) {
	p := chonProblem(b, 1000, 10, 3)
	// Three nitrogen species join the C–H–O set (μ°/RT from rounded h/T − s, invented).
	p.Species = append(p.Species[:6:6], Species{Name: "N2", Mu0: -24.5}, Species{Name: "NH3", Mu0: -29}, Species{Name: "NO", Mu0: -17}, Species{Name: "HCN", Mu0: -16})
	p.Phases = p.Phases[:1]
	B := mat.NewDense(4, 10, []float64{
		1, 0, 1, 1, 0, 0, 0, 0, 0, 1,
		4, 2, 0, 0, 2, 0, 0, 3, 0, 1,
		0, 1, 1, 2, 0, 2, 0, 0, 1, 0,
		0, 0, 0, 0, 0, 0, 2, 1, 1, 1,
	})
	p.B = B
	p.N0 = []float64{0.25, 0.75, 0, 0, 0, 0, 0.1, 0, 0, 0}
	benchSolve(b, p)
}

func BenchmarkSolveSynthetic60Elements(b *testing.B) {
	benchSolve(b, synthetic(1, 60, 4, 1000))
}

func BenchmarkSolveSynthetic60Reactions200(b *testing.B) {
	p := synthetic(1, 60, 4, 1000)
	B, err := ReactionsConservation(syntheticReactions(p, 200))
	if err != nil {
		b.Fatal(err)
	}
	p.B = B
	benchSolve(b, p)
}

func BenchmarkReactionsConservation60x200(b *testing.B) {
	N := syntheticReactions(synthetic(1, 60, 4, 1000), 200)
	b.ResetTimer()
	for range b.N {
		if _, err := ReactionsConservation(N); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkSolveSynthetic500(b *testing.B) {
	benchSolve(b, synthetic(2, 500, 6, 1000))
}

// BenchmarkSweep50 solves the C–H–O problem at 50 temperatures, each warm
// started from the one before; compare with BenchmarkSweepPoint.
func BenchmarkSweep50(b *testing.B) {
	ps := make([]Problem, 50)
	for i := range ps {
		ps[i] = chonProblem(b, 700+10*float64(i), 10, 1.5)
	}
	b.ResetTimer()
	for range b.N {
		var prev *Result
		for _, p := range ps {
			r, err := Solve(p, Options{Start: prev})
			if err != nil || !r.Converged {
				b.Fatal(err)
			}
			prev = &r
		}
	}
}

func BenchmarkSweepPoint(b *testing.B) {
	benchSolve(b, chonProblem(b, 950, 10, 1.5))
}
