package network

import (
	"math"

	"hess/thermo"
)

// Member returns the mixture's member for a species, or nil when the
// species is not listed.
func (m *Mixture) Member(sp *Species) *MixMember {
	for i := range m.Members {
		if m.Members[i].Species == sp {
			return &m.Members[i]
		}
	}
	return nil
}

// gasFractionSum is the sum of the gas mole fractions given as bare
// numbers, and how many there are.
func (m *Mixture) gasFractionSum() (sum float64, count int) {
	for _, mm := range m.Members {
		if mm.Kind == AmountFraction {
			sum += mm.Amount.V
			count++
		}
	}
	return sum, count
}

// TotalPressure is the mixture's total pressure in Pa: its pressure as
// given, else the sum of its gases' partial pressures; NaN when neither
// gives one.
func (m *Mixture) TotalPressure() float64 {
	if m.Pressure != nil {
		return m.Pressure.V
	}
	sum := 0.0
	for _, mm := range m.Members {
		if mm.Kind == AmountPartialPressure {
			sum += mm.Amount.V
		}
	}
	if sum > 0 {
		return sum
	}
	return math.NaN()
}

// Activity returns a member's activity in the mixture on the network's
// conventions: p_i/p° for a gas (p_i = y_i·P for a mole fraction, the
// fractions normalised over the mixture's gases), m/(1 mol/kg) for a
// solute times its activity coefficient under the network's activity model
// (Gamma), the mole fraction for a solution member, 1 for a pure phase, and
// for the water of an aqueous solution its activity from the model (1 under
// the ideal model).
// It is NaN when the member's amount is unusable.
func (m *Mixture) Activity(mm *MixMember, p0 float64) float64 {
	if mm == nil || (mm.Amount == nil && mm.Kind != AmountPresent) || m.mixesMoles() {
		return math.NaN()
	}
	switch mm.Kind {
	case AmountFraction:
		sum, _ := m.gasFractionSum()
		P := m.TotalPressure()
		if !(sum > 0) || !(P > 0) {
			return math.NaN()
		}
		return mm.Amount.V / sum * P / p0
	case AmountPartialPressure:
		return mm.Amount.V / p0
	case AmountMolality:
		return m.Gamma(mm) * mm.Amount.V / thermo.MStd
	case AmountSolution:
		return mm.Amount.V
	case AmountPresent:
		if s := m.solution; s != nil && s.Water == mm.Species {
			return s.WaterActivity
		}
		return 1
	case AmountMoles:
		return m.moleActivity(mm, p0)
	}
	return math.NaN()
}

// LnQuotient is ln Q = Σ ν ln a of the reaction in the mixture, activities
// taken relative to the standard pressure p0 (Pa) as Activity takes them,
// and the species of the reaction's quotient that the mixture does not list
// or gives no positive activity (pure phases included: listing one marks it
// present). ln Q means nothing unless lacking is empty.
func (m *Mixture) LnQuotient(rx *Reaction, p0 float64) (lnQ float64, lacking []*Species) {
	for _, t := range rx.NetTerms() {
		mm := m.Member(t.Species)
		if mm == nil {
			lacking = append(lacking, t.Species)
			continue
		}
		a := m.Activity(mm, p0)
		if !(a > 0) {
			lacking = append(lacking, t.Species)
			continue
		}
		nu := t.NuFloat()
		lnQ += nu * math.Log(a)
	}
	return lnQ, lacking
}
