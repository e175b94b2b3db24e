package gibbs

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"
)

// PhaseKind says how a phase's species are counted in G.
type PhaseKind int

const (
	// IdealGas: activity y_j·P/p°.
	IdealGas PhaseKind = iota
	// Pure: a pure condensed phase of one species, activity 1, present or absent.
	Pure
	// Solution: an ideal condensed mixture, activity = mole fraction.
	Solution
	// Aqueous: one solvent species (Species.Solvent) and dilute solutes with
	// activity m_j/(1 mol/kg); ln a_w = −M_w Σ m_j.
	Aqueous
)

func (k PhaseKind) String() string {
	switch k {
	case IdealGas:
		return "gas"
	case Pure:
		return "pure"
	case Solution:
		return "solution"
	case Aqueous:
		return "aqueous"
	}
	return fmt.Sprintf("PhaseKind(%d)", int(k))
}

// Phase is one phase of the system.
type Phase struct {
	Name string
	Kind PhaseKind
}

// Species is one species. Mu0 is μ°(T)/RT, dimensionless, at the problem's
// temperature (for gases at the standard pressure p°; for solutes on the
// molality scale, 1 mol/kg).
type Species struct {
	Name  string
	Phase int // index into Problem.Phases
	Mu0   float64
	// Solvent marks the solvent of an Aqueous phase (exactly one per such phase).
	Solvent bool
	// Fixed holds the species at a fixed chemical potential: the system is
	// open to a reservoir of it. Mu0 must then be μ/RT of the reservoir
	// (μ°/RT + ln a, e.g. + ln(p/p°) for a gas at partial pressure p). Its
	// result amount is the signed net amount taken in from the reservoir
	// (negative: given off), it belongs to no phase's amount, and its feed
	// amount is ignored. Phase is ignored for a fixed species.
	Fixed bool
}

// Problem is a Gibbs minimisation at fixed T and P.
type Problem struct {
	Phases  []Phase
	Species []Species
	// B is the conservation matrix (rows × species): element and charge rows,
	// or a reactions basis from ReactionsConservation. Rows may be linearly
	// dependent; they are reduced.
	B *mat.Dense
	// N0 is the feed, mol (≥ 0); the conserved totals are b = B·N0.
	N0 []float64
	// PRatio is P/p° (> 0); it matters only to gas phases.
	PRatio float64
	// SolventMolarMass is M_w in kg/mol for Aqueous phases (0.01801528 for water).
	SolventMolarMass float64
	// LnGamma, when set, returns ln γ_j for every species at amounts n (mol;
	// fixed species 0); out has the length of Species and is zeroed before
	// each call. For a solvent it is ln of the ratio of its activity to the
	// ideal-dilute one. Entries for pure and fixed species are ignored. The
	// solver iterates the ideal solve to a fixed point of the coefficients
	// (at most 200 rounds); a model that does not settle gives Converged false.
	LnGamma func(n []float64, out []float64)
}

// Options tunes Solve. The zero value is sensible.
type Options struct {
	// Tol is the convergence tolerance on ln n of every mixture species, on
	// the relative conservation residual and on the stability tests
	// (default 1e-11).
	Tol float64
	// MaxIterations bounds the Newton iterations over all active sets (default 500).
	MaxIterations int
	// Start is a previous result of the same problem shape (for example at a
	// neighbouring temperature); its amounts and phase assemblage seed the solve.
	Start *Result
}

// Result is the equilibrium found.
type Result struct {
	// N is the amount of each species, mol: ≥ 0, exactly 0 for species the
	// constraints force to zero and for absent phases; for a fixed species
	// the signed amount taken from the reservoir.
	N            []float64
	PhaseAmount  []float64 // mol in each phase (0 where absent; fixed species count in none)
	PhasePresent []bool
	// LnActivity is ln a_j at the solution (mixture species: ln(y_j P/p°),
	// ln x_j, ln m_j or ln a_w, plus ln γ_j; pure present: 0; species with
	// amount 0: -Inf; fixed species: NaN, their activity being the caller's).
	LnActivity []float64
	// Potentials are the Lagrange multipliers λ/RT, one per row of B (for
	// element rows: the element potentials; for a reactions basis, the
	// potentials of its rows). At the solution μ_j/RT = Σ_i B_ij λ_i for every
	// present species. Rows removed as dependent or empty get 0, and where
	// rows are dependent the split among them is one of many.
	Potentials []float64
	// Zero marks species the conservation constraints force to exactly zero.
	Zero []bool
	// Converged is true when every tolerance was met.
	Converged  bool
	Iterations int
	// ElementResidual is max_i |(B·n − b)_i| / max(Σ n₀, 1e-300).
	ElementResidual float64
	// Stationarity is the largest |μ_j − Σ_i B_ij λ_i| over present species
	// (mixture species: those above 1e-12 of the feed; below, the balances
	// fix the amount to their rounding).
	Stationarity float64
	// G is G/RT at the solution, mol (excluding fixed species).
	G float64

	lnN   []float64 // log amounts of mixture species (scaled), for warm starts
	key   uint64    // hash of B and b the zero set was found for
	scale float64
}

// ErrInput wraps every error about an invalid problem. (A valid problem is
// always feasible: the feed itself meets B·n = B·N0.)
var ErrInput = errors.New("gibbs: invalid problem")

const maxSpecies = 1 << 16

func (p *Problem) validate() error {
	s := len(p.Species)
	if s == 0 {
		return fmt.Errorf("%w: no species", ErrInput)
	}
	if s > maxSpecies {
		return fmt.Errorf("%w: %d species (limit %d)", ErrInput, s, maxSpecies)
	}
	if p.B == nil {
		return fmt.Errorf("%w: no conservation matrix", ErrInput)
	}
	m, c := p.B.Dims()
	if c != s {
		return fmt.Errorf("%w: conservation matrix has %d columns for %d species", ErrInput, c, s)
	}
	if m > maxSpecies {
		return fmt.Errorf("%w: %d conservation rows", ErrInput, m)
	}
	if len(p.N0) != s {
		return fmt.Errorf("%w: feed has %d amounts for %d species", ErrInput, len(p.N0), s)
	}
	if !(p.PRatio > 0) || math.IsInf(p.PRatio, 0) {
		return fmt.Errorf("%w: P/p° = %g", ErrInput, p.PRatio)
	}
	for i := 0; i < m; i++ {
		for j := 0; j < s; j++ {
			if v := p.B.At(i, j); math.IsNaN(v) || math.IsInf(v, 0) {
				return fmt.Errorf("%w: conservation matrix entry (%d, %d) is %g", ErrInput, i, j, v)
			}
		}
	}
	solvents := make([]int, len(p.Phases))
	counts := make([]int, len(p.Phases))
	for j, sp := range p.Species {
		if math.IsNaN(sp.Mu0) || math.IsInf(sp.Mu0, 0) || math.Abs(sp.Mu0) > 1e12 {
			return fmt.Errorf("%w: species %d (%s): μ°/RT = %g", ErrInput, j, sp.Name, sp.Mu0)
		}
		v := p.N0[j]
		if math.IsNaN(v) || math.IsInf(v, 0) || (v < 0 && !sp.Fixed) {
			return fmt.Errorf("%w: species %d (%s): feed %g mol", ErrInput, j, sp.Name, v)
		}
		zero := true
		for i := 0; i < m; i++ {
			if p.B.At(i, j) != 0 {
				zero = false
				break
			}
		}
		if zero {
			return fmt.Errorf("%w: species %d (%s) takes part in no conservation row", ErrInput, j, sp.Name)
		}
		if sp.Fixed {
			continue
		}
		if sp.Phase < 0 || sp.Phase >= len(p.Phases) {
			return fmt.Errorf("%w: species %d (%s): phase %d out of range", ErrInput, j, sp.Name, sp.Phase)
		}
		ph := p.Phases[sp.Phase]
		counts[sp.Phase]++
		if sp.Solvent {
			if ph.Kind != Aqueous {
				return fmt.Errorf("%w: species %d (%s): solvent outside an aqueous phase", ErrInput, j, sp.Name)
			}
			solvents[sp.Phase]++
		}
	}
	for k, ph := range p.Phases {
		switch ph.Kind {
		case IdealGas, Solution:
		case Pure:
			if counts[k] > 1 {
				return fmt.Errorf("%w: pure phase %d (%s) holds %d species", ErrInput, k, ph.Name, counts[k])
			}
		case Aqueous:
			if counts[k] > 0 && solvents[k] != 1 {
				return fmt.Errorf("%w: aqueous phase %d (%s) has %d solvents (want 1)", ErrInput, k, ph.Name, solvents[k])
			}
			if !(p.SolventMolarMass > 0) || math.IsInf(p.SolventMolarMass, 0) {
				return fmt.Errorf("%w: solvent molar mass %g kg/mol", ErrInput, p.SolventMolarMass)
			}
		default:
			return fmt.Errorf("%w: phase %d (%s): unknown kind %d", ErrInput, k, ph.Name, int(ph.Kind))
		}
	}
	return nil
}
