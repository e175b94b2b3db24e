package equilibrium

import (
	"errors"
	"fmt"
	"math"

	"hess/aqueous"
	"hess/gibbs"
	"hess/network"
	"hess/thermo"
)

// WaterMolarMass is M_w of H2O in kg/mol (CIAAW 2021 conventional atomic
// weights: 2 × 1.008 + 15.999 g/mol, derived; 18.015 g/mol).
const WaterMolarMass = 0.018015

// AqueousSystem is an aqueous equilibrium problem in a network's terms: a
// mass of water with what is fed into it, gases held at fixed partial
// pressures (an open system), at one temperature and pressure.
type AqueousSystem struct {
	T float64 // K
	// P is the total pressure in Pa, for a gas phase that may form (not for
	// the fixed gases, which have their own); 0 means the network's p°.
	P float64
	// WaterKg is the mass of water, kg (> 0).
	WaterKg float64
	// Feed is the amount of each other species fed, mol (≥ 0): solutes,
	// minerals, gases. Water is WaterKg; an entry for water adds to it.
	Feed map[*network.Species]float64
	// Fixed holds gases at partial pressures, Pa.
	Fixed map[*network.Species]float64
	// Candidates are the species the equilibrium may hold besides those
	// fed; nil means every species of the network made only of the
	// elements fed: aq solutes, pure solids and liquids, gases.
	Candidates []*network.Species
}

// AqueousResult is an aqueous equilibrium: the solution's speciation, its
// pH, ionic strength and activity coefficients, each mineral's saturation
// and what the fixed gases exchanged.
type AqueousResult struct {
	T, P    float64 // K, Pa
	Model   string  // the activity model
	WaterKg float64 // water at equilibrium, kg
	// PH is −log10 a(H+) (NaN without H+(aq) among the species).
	PH float64
	// I is the ionic strength, mol/kg; Beyond that it exceeds the
	// activity model's range of validity.
	I             float64
	Beyond        bool
	WaterActivity float64
	Solutes       []AqueousSpecies
	Minerals      []MineralSaturation
	Gases         []GasAmount // a gas phase that formed, and the fixed gases
	// Skipped are candidates left out for lack of data at T.
	Skipped []*network.Species
	// Converged reports whether the solver met its tolerances;
	// Iterations and ElementResidual are the solver's.
	Converged       bool
	Iterations      int
	ElementResidual float64
}

// AqueousSpecies is one solute at equilibrium.
type AqueousSpecies struct {
	Species  *network.Species
	Amount   float64 // mol
	Molality float64 // mol/kg of water
	Gamma    float64 // activity coefficient (molality scale)
	// LogActivity is log10 a = log10(γ m/(1 mol/kg)); -Inf when absent.
	LogActivity float64
}

// MineralSaturation is a pure phase's amount and saturation index
// SI = log10(Q/K) of its dissolution, 0 where it is present at equilibrium
// and below 0 where it is absent (undersaturated).
type MineralSaturation struct {
	Species *network.Species
	Amount  float64 // mol present at equilibrium
	Present bool
	SI      float64
}

// GasAmount is a gas at equilibrium: in a gas phase (Amount, mol) or held
// fixed (Taken: the signed amount drawn from the reservoir, mol).
type GasAmount struct {
	Species  *network.Species
	Fixed    bool
	Pressure float64 // partial pressure, Pa
	Amount   float64
	Taken    float64
}

// Solute returns the result for one solute, or false.
func (r *AqueousResult) Solute(sp *network.Species) (AqueousSpecies, bool) {
	for _, s := range r.Solutes {
		if s.Species == sp {
			return s, true
		}
	}
	return AqueousSpecies{}, false
}

// Mineral returns the saturation of one pure phase, or false.
func (r *AqueousResult) Mineral(sp *network.Species) (MineralSaturation, bool) {
	for _, m := range r.Minerals {
		if m.Species == sp {
			return m, true
		}
	}
	return MineralSaturation{}, false
}

// ErrAqueous wraps every error about an aqueous system that cannot be set up.
var ErrAqueous = errors.New("aqueous equilibrium")

// ErrNoSolvent also wraps the error of a system without water.
var ErrNoSolvent = errors.New("no solvent")

// SolveAqueous finds the equilibrium of an aqueous system by minimising its
// Gibbs energy (package gibbs) over water, the solutes, the pure phases and
// a gas phase, with element and charge balances, the fixed gases held at
// their partial pressures, and the network's activity model for the
// solutes' γ (iterated to a fixed point) and water's activity. Each
// species' μ°(T) comes from its data (Species.StandardGibbs); a species
// without data gets it from a two-way reaction whose ΔrG°(T) is known and
// whose other species have it (repeatedly, so chains of reactions with
// logk serve). Candidates that still lack it are skipped and listed.
func SolveAqueous(n *network.Network, sys AqueousSystem) (*AqueousResult, error) {
	if !(sys.T > 0) || math.IsInf(sys.T, 0) {
		return nil, fmt.Errorf("%w: temperature %g K", ErrAqueous, sys.T)
	}
	if !(sys.WaterKg > 0) || math.IsInf(sys.WaterKg, 0) {
		return nil, fmt.Errorf("%w: no water: the solution needs H2O(l) as its solvent", ErrAqueous)
	}
	p0 := n.StandardPressure()
	P := sys.P
	if P == 0 {
		P = p0
	}
	if !(P > 0) || math.IsInf(P, 0) {
		return nil, fmt.Errorf("%w: pressure %g Pa", ErrAqueous, P)
	}
	model := n.ActivityModel()
	var params aqueous.Params
	if _, ideal := model.(aqueous.Ideal); !ideal {
		p, err := aqueous.ParamsAt(sys.T)
		if err != nil {
			return nil, fmt.Errorf("%w: the %s activity model: %v", ErrAqueous, model.Name(), err)
		}
		params = p
	}
	water := findWater(n)
	if water == nil {
		return nil, fmt.Errorf("%w: the network declares no H2O(l)", ErrAqueous)
	}
	set, err := aqueousSpecies(n, sys, water)
	if err != nil {
		return nil, err
	}
	skipped := assignMu0(n, set, sys.T)
	var kept []aqSpecies
	for _, s := range set {
		if !math.IsNaN(s.mu0) {
			kept = append(kept, s)
		}
	}
	if len(kept) == 0 || kept[0].role != roleWater {
		return nil, fmt.Errorf("%w: H2O(l) has no data at %s", ErrAqueous, kelvinString(sys.T))
	}
	for i := range kept {
		if kept[i].role == roleFixed {
			kept[i].mu0 += math.Log(sys.Fixed[kept[i].sp] / p0)
		}
	}
	for _, sp := range skipped {
		if _, fixed := sys.Fixed[sp]; fixed || sys.Feed[sp] > 0 {
			return nil, fmt.Errorf("%w: %s is fed or held fixed but has no data at %s (neither its own nor through a reaction)",
				ErrAqueous, sp.Key, kelvinString(sys.T))
		}
	}
	prob, err := buildProblem(kept, sys, P/p0)
	if err != nil {
		return nil, err
	}
	hook := gammaHook(kept, model, params)
	if hook != nil {
		prob.LnGamma = func(nn, out []float64) { hook(nn, out, nil) }
	}
	res, err := gibbs.Solve(prob, gibbs.Options{})
	if err != nil {
		return nil, fmt.Errorf("%w: %v", ErrAqueous, err)
	}
	if !res.Converged {
		// As Equilibrate does: from cold with a larger budget, then from
		// where the first try ended.
		budget := retryIterations(len(kept))
		if r2, err2 := gibbs.Solve(prob, gibbs.Options{MaxIterations: budget}); err2 == nil && r2.Converged {
			res = r2
		} else if r3, err3 := gibbs.Solve(prob, gibbs.Options{MaxIterations: budget, Start: &res}); err3 == nil && r3.Converged {
			res = r3
		}
	}
	return aqueousResult(kept, prob, res, sys, P, p0, model, params, skipped), nil
}

// IsAqueousFeed reports whether a feed goes to SolveAqueous rather than to
// Equilibrate: it is open to a gas held at a fixed partial pressure, or it
// lists water, H2O(l), in a network that declares aq solutes. Such a feed
// is a solution with the network's activity model, its pH and its
// minerals' saturation; any other feed keeps ideal dilute solutes.
func IsAqueousFeed(n *network.Network, m *network.Mixture) bool {
	if !m.IsFeed() {
		return false
	}
	if m.HasFixed() {
		return true
	}
	water := false
	for _, mm := range m.Members {
		water = water || mm.Species.IsWater()
	}
	if !water {
		return false
	}
	for _, sp := range n.Species {
		if sp.Activity() == thermo.ActivitySolute {
			return true
		}
	}
	return false
}

// AqueousFromMixture reads a mixture as an aqueous system. Water given as
// an amount (H2O(l) 1 kg, or in mol) is that much water; listed without a
// number it is 1 kg. Amounts in mol (or a mass) are fed as they are:
// solutes, minerals, gases. A solute given as a molality is that many mol
// in 1 kg; a pure phase listed without a number is present, 1 mol (an
// excess for most demos). Fixed gases are held at their partial pressures;
// the temperature and pressure are the mixture's.
func AqueousFromMixture(n *network.Network, m *network.Mixture) (AqueousSystem, error) {
	if !m.Usable() {
		return AqueousSystem{}, fmt.Errorf("%w: mixture %s has mistakes", ErrAqueous, m.Name)
	}
	sys := AqueousSystem{T: m.Temperature.V, Feed: map[*network.Species]float64{}, Fixed: map[*network.Species]float64{}}
	if m.Pressure != nil {
		sys.P = m.Pressure.V
	}
	water, molalities := false, false
	for i := range m.Members {
		mm := &m.Members[i]
		switch {
		case mm.Species.IsWater() && mm.Kind == network.AmountMoles:
			water = true
			sys.WaterKg += mm.Amount.V * WaterMolarMass
		case mm.Species.IsWater():
			water = true
			sys.WaterKg += 1
		case mm.Fixed && mm.Kind == network.AmountPartialPressure:
			sys.Fixed[mm.Species] = mm.Amount.V
		case mm.Kind == network.AmountMoles:
			sys.Feed[mm.Species] += mm.Amount.V
		case mm.Kind == network.AmountMolality:
			molalities = true
			sys.Feed[mm.Species] += mm.Amount.V // mol in 1 kg
		case mm.Kind == network.AmountPresent:
			sys.Feed[mm.Species] += 1
		default:
			return AqueousSystem{}, fmt.Errorf("%w: mixture %s: %s is neither water, a solute, a pure phase nor a fixed gas", ErrAqueous, m.Name, mm.Species.Key)
		}
	}
	if !water {
		return AqueousSystem{}, fmt.Errorf("%w: %w: mixture %s lists no H2O(l): a solution needs water as its solvent, such as H2O(l) 1 kg", ErrAqueous, ErrNoSolvent, m.Name)
	}
	if molalities && sys.WaterKg != 1 {
		return AqueousSystem{}, fmt.Errorf("%w: mixture %s gives molalities beside %g kg of water: give the solutes in mol", ErrAqueous, m.Name, sys.WaterKg)
	}
	return sys, nil
}

// kelvinString writes a temperature for a message, to 0.01 K.
func kelvinString(T float64) string { return fmt.Sprintf("%.2f K", T) }
