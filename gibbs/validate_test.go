package gibbs

import (
	"errors"
	"math"
	"testing"

	"gonum.org/v1/gonum/mat"
)

func TestInvalidProblems(t *testing.T) {
	good := func() Problem {
		return Problem{
			Phases:  gas(),
			Species: []Species{{Name: "A", Mu0: 0}, {Name: "B", Mu0: -1}},
			B:       dense([][]float64{{2, 1}}),
			N0:      []float64{1, 0},
			PRatio:  1,
		}
	}
	if _, err := Solve(good(), Options{}); err != nil {
		t.Fatalf("good problem: %v", err)
	}
	for name, mutate := range map[string]func(*Problem){
		"no species":       func(p *Problem) { p.Species = nil },
		"nil B":            func(p *Problem) { p.B = nil },
		"B columns":        func(p *Problem) { p.B = dense([][]float64{{2, 1, 1}}) },
		"feed length":      func(p *Problem) { p.N0 = []float64{1} },
		"negative feed":    func(p *Problem) { p.N0[0] = -1 },
		"NaN feed":         func(p *Problem) { p.N0[0] = math.NaN() },
		"empty feed":       func(p *Problem) { p.N0[0] = 0 },
		"NaN mu":           func(p *Problem) { p.Species[1].Mu0 = math.NaN() },
		"Inf B":            func(p *Problem) { p.B.Set(0, 0, math.Inf(1)) },
		"zero column":      func(p *Problem) { p.B.Set(0, 1, 0) },
		"pressure":         func(p *Problem) { p.PRatio = 0 },
		"phase index":      func(p *Problem) { p.Species[0].Phase = 3 },
		"solvent in gas":   func(p *Problem) { p.Species[0].Solvent = true },
		"two in pure":      func(p *Problem) { p.Phases[0].Kind = Pure },
		"unknown kind":     func(p *Problem) { p.Phases[0].Kind = PhaseKind(9) },
		"aqueous solvents": func(p *Problem) { p.Phases[0].Kind = Aqueous; p.SolventMolarMass = mw },
	} {
		p := good()
		mutate(&p)
		if _, err := Solve(p, Options{}); !errors.Is(err, ErrInput) {
			t.Errorf("%s: err = %v, want ErrInput", name, err)
		}
	}
}

func TestStartOfAnotherProblemIgnored(t *testing.T) {
	// A Start from a problem with another feed must not carry its zero set
	// or amounts over.
	a := calcite(0.1, 1, 1)
	ra := mustSolve(t, a, Options{})
	b := calcite(0.1, 1, 1)
	b.N0 = []float64{1, 0, 0, 0} // no N2: the gas phase cannot exist
	rb := mustSolve(t, b, Options{Start: &ra})
	if rb.N[3] != 0 || rb.N[1] != 0 {
		t.Errorf("N2 %g, CaO %g: want 0", rb.N[3], rb.N[1])
	}
}

func TestReactionsConservationInputs(t *testing.T) {
	if _, err := ReactionsConservation(nil); !errors.Is(err, ErrInput) {
		t.Errorf("nil: %v", err)
	}
	if _, err := ReactionsConservation(dense([][]float64{{math.NaN()}})); !errors.Is(err, ErrInput) {
		t.Errorf("NaN: %v", err)
	}
	// No reactions: every species is conserved on its own.
	B, err := ReactionsConservation(mat.NewDense(3, 1, nil))
	if err != nil {
		t.Fatal(err)
	}
	if r, _ := B.Dims(); r != 3 {
		t.Errorf("rows %d, want 3", r)
	}
}
