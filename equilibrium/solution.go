package equilibrium

import (
	"math"

	"hess/network"
)

// SolutionActivities is the aqueous part of a mixture as the network's
// activity model sees it: the ionic strength, each solute's activity
// coefficient and water's activity.
type SolutionActivities struct {
	Model string  // the activity model's name
	I     float64 // ionic strength, mol/kg
	// Solutes in the mixture's order.
	Solutes []SoluteActivity
	// Water is the solution's water (nil when the mixture lists none) and
	// WaterActivity its activity.
	Water         *network.Species
	WaterActivity float64
	// Beyond reports I above the model's range of validity; Err that the
	// model could not be evaluated at the temperature (γ are then 1).
	Beyond bool
	Err    error
}

// SoluteActivity is one solute's molality (mol/kg), activity coefficient and
// activity.
type SoluteActivity struct {
	Species  *network.Species
	Molality float64
	Gamma    float64
	Activity float64
}

// solutionActivities reads the mixture's solution, or nil when it lists no
// solute. Beyond is judged as the activity-range check judges it: the
// default ideal model only where the network chose it explicitly.
func solutionActivities(n *network.Network, m *network.Mixture) *SolutionActivities {
	s := m.Solution()
	if s == nil {
		return nil
	}
	out := &SolutionActivities{Model: s.Model.Name(), I: s.I, Water: s.Water, WaterActivity: s.WaterActivity,
		Beyond: s.I > s.Model.ValidUpTo() && (n.Settings.Activity != "" || s.Model.Name() != "ideal"), Err: s.Err}
	for i := range m.Members {
		mm := &m.Members[i]
		if mm.Kind != network.AmountMolality {
			continue
		}
		g := m.Gamma(mm)
		out.Solutes = append(out.Solutes, SoluteActivity{Species: mm.Species, Molality: mm.Amount.V, Gamma: g, Activity: g * mm.Amount.V})
	}
	return out
}

// Log10Gamma is log10 γ of a solute.
func (a SoluteActivity) Log10Gamma() float64 { return math.Log10(a.Gamma) }
