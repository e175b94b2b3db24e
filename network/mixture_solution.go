package network

import (
	"math"

	"hess/aqueous"
	"hess/lang"
	"hess/thermo"
)

// ActivityModel returns the network's activity model of aqueous solutes (its
// activity setting; ideal by default).
func (n *Network) ActivityModel() aqueous.Model {
	if m, ok := aqueous.ByName(n.Settings.Activity); ok {
		return m
	}
	return aqueous.Ideal{}
}

// Angstrom is 1 Å in m.
const Angstrom = 1e-10

// SoluteOf returns the species as the activity models see it at molality m
// (mol/kg): its charge, its ion-size parameter in Å and its Setschenow
// coefficient in kg/mol (0 where not given).
func (sp *Species) SoluteOf(m float64) aqueous.Solute {
	s := aqueous.Solute{Charge: sp.Charge, Molality: m}
	if sp.Size != nil {
		s.Size = sp.Size.V / Angstrom
	}
	if sp.Setschenow != nil {
		s.Setschenow = sp.Setschenow.V
	}
	return s
}

// IsWater reports whether the species is liquid water, the solvent of an
// aqueous solution: formula H2O, no charge, a pure liquid.
func (sp *Species) IsWater() bool {
	return sp.HasFormula && sp.Charge == 0 && sp.Activity() == thermo.ActivityPureLiquid &&
		sp.Formula.String() == "H2O"
}

// Solution is the aqueous part of a mixture under the network's activity
// model: ionic strength from the solutes' molalities, each solute's log10 γ
// and the activity of water.
type Solution struct {
	Model aqueous.Model
	// I is the ionic strength, mol/kg.
	I float64
	// LogGamma is log10 γ of each solute the mixture lists, keyed by species.
	LogGamma map[*Species]float64
	// Water is the water the mixture lists (nil if none); WaterActivity its
	// activity from the model (1 under the ideal model, which keeps a pure
	// phase's activity); WaterMethod how it was found.
	Water         *Species
	WaterActivity float64
	WaterMethod   aqueous.WaterMethod
	// Err is set when the model cannot be evaluated at the mixture's
	// temperature (its water correlations cover 0–100 °C); γ are then 1.
	Err error
}

// Solutes reports whether the mixture lists any solute with a molality.
func (m *Mixture) Solutes() bool {
	for _, mm := range m.Members {
		if mm.Kind == AmountMolality {
			return true
		}
	}
	return false
}

// Solution returns the aqueous part of the mixture as the network's activity
// model sees it, or nil when the mixture lists no solute.
func (m *Mixture) Solution() *Solution { return m.solution }

// buildSolutions works out every mixture's solution once the network is
// compiled, so that activities and checks read the same numbers.
func buildSolutions(n *Network) {
	model := n.ActivityModel()
	for _, m := range n.Mixtures {
		m.solution = solutionOf(m, model)
	}
}

func solutionOf(m *Mixture, model aqueous.Model) *Solution {
	if !m.Solutes() {
		return nil
	}
	s := &Solution{Model: model, LogGamma: map[*Species]float64{}, WaterActivity: 1}
	var solutes []aqueous.Solute
	var species []*Species
	for _, mm := range m.Members {
		switch {
		case mm.Kind == AmountMolality:
			solutes = append(solutes, mm.Species.SoluteOf(mm.Amount.V))
			species = append(species, mm.Species)
		case mm.Kind == AmountPresent && mm.Species.IsWater():
			s.Water = mm.Species
		}
	}
	s.I = aqueous.IonicStrength(solutes)
	if _, ideal := model.(aqueous.Ideal); ideal {
		for _, sp := range species {
			s.LogGamma[sp] = 0
		}
		return s
	}
	T := math.NaN()
	if m.Temperature != nil {
		T = m.Temperature.V
	}
	p, err := aqueous.ParamsAt(T)
	if err != nil {
		s.Err = err
		for _, sp := range species {
			s.LogGamma[sp] = 0
		}
		return s
	}
	for i, sp := range species {
		s.LogGamma[sp] = aqueous.LogGamma(model, solutes[i], s.I, p)
	}
	if s.Water != nil {
		w := aqueous.WaterActivity(model, solutes, p)
		s.WaterActivity, s.WaterMethod = w.Activity, w.Method
	}
	return s
}

// Gamma returns the activity coefficient of a member in the mixture: γ of a
// solute under the network's activity model, 1 for every other member.
func (m *Mixture) Gamma(mm *MixMember) float64 {
	if m.solution == nil || mm == nil || mm.Kind != AmountMolality {
		return 1
	}
	if lg, ok := m.solution.LogGamma[mm.Species]; ok {
		return math.Pow(10, lg)
	}
	return 1
}

// activityRangeProblem is the finding of the activity-range check for one
// mixture, or false.
// The ideal model warns only where the network chose it explicitly: the
// default is not a choice to warn about.
func activityRangeProblem(m *Mixture, explicit bool) (lang.Span, string, bool) {
	s := m.solution
	if s == nil {
		return lang.Span{}, "", false
	}
	if _, ideal := s.Model.(aqueous.Ideal); ideal && s.Err == nil && !explicit {
		return lang.Span{}, "", false
	}
	if s.Err != nil {
		return m.NameSpan, "mixture " + m.Name + ": " + s.Err.Error() + "; activity coefficients are taken as 1", true
	}
	if err := aqueous.CheckIonicStrength(s.Model, s.I); err != nil {
		if _, ideal := s.Model.(aqueous.Ideal); ideal && !explicit {
			return lang.Span{}, "", false
		}
		return m.NameSpan, "mixture " + m.Name + ": " + err.Error(), true
	}
	return lang.Span{}, "", false
}
