package network

import (
	"math"

	"hess/lang"
	"hess/thermo"
)

// Dimensions of a feed's amounts: an amount of substance (mol, kmol) and a
// mass (g, kg), converted to mol through the species' molar mass.
var (
	dimAmountOfSubstance = thermo.Dim{0, 0, 0, 1, 0}
	dimMassOnly          = thermo.Dim{1, 0, 0, 0, 0}
)

// parseAmountUnit reads a mixture amount's unit: every unit ParseUnit
// knows, and kmol (1000 mol), which a feed of a plant is often given in.
func parseAmountUnit(text string) (thermo.Unit, error) {
	if text == "kmol" {
		return thermo.Unit{Text: text, Dim: dimAmountOfSubstance, Scale: 1000}, nil
	}
	return thermo.ParseUnit(text)
}

// feedAmount reads an amount in mol, kmol, g or kg: the member is part of a
// feed, whatever its phase. A mass becomes mol through the molar mass of
// the species' formula.
func (c *compiler) feedAmount(mm *MixMember, q *lang.Quantity, unit thermo.Unit) bool {
	sp := mm.Species
	if sp.Activity() == thermo.ActivityUnstated {
		c.report(mixtureAmountCheck, mm.Span, "%s has no known phase, so it cannot be fed", sp.Key)
		return false
	}
	v := unit.ToSI(mm.Amount.V)
	if unit.Dim == dimMassOnly {
		mass, ok := 0.0, false
		if sp.HasFormula {
			var g float64
			g, ok = sp.Formula.MolarMass(c.net.Elements)
			mass = g / 1000 // kg/mol
		}
		if !ok || !(mass > 0) {
			c.report(mixtureAmountCheck, q.Unit.Span(), "%s has no molar mass, so its amount cannot be given as a mass (%s): give it in mol", sp.Key, q.Unit.Text)
			return false
		}
		v /= mass
	}
	if v < 0 || math.IsNaN(v) || math.IsInf(v, 0) {
		c.report(mixtureAmountCheck, q.Span(), "amount of %s is negative (%s)", sp.Key, quantityText(q))
		return false
	}
	mm.Amount.V = v
	mm.Kind = AmountMoles
	return true
}

// IsFeed reports whether the mixture can be fed to an equilibrium
// calculation: every member gives an amount in mol (or a mass), or every
// member is a gas given as a mole fraction or a partial pressure (a feed
// of 1 mol in all). Beside amounts, gases held at a fixed partial pressure
// are reservoirs the feed is open to, not part of it (an aqueous feed).
func (m *Mixture) IsFeed() bool {
	if m == nil || len(m.Members) == 0 {
		return false
	}
	moles, gas, fixed := 0, 0, 0
	for _, mm := range m.Members {
		switch {
		case mm.Kind == AmountMoles:
			moles++
		case mm.Fixed && mm.Kind == AmountPartialPressure:
			fixed++
			gas++
		case mm.Kind == AmountFraction, mm.Kind == AmountPartialPressure:
			gas++
		}
	}
	return moles == len(m.Members) || gas == len(m.Members) || (moles > 0 && moles+fixed == len(m.Members))
}

// HasFixed reports whether the mixture holds a member at a fixed partial
// pressure (open to a reservoir).
func (m *Mixture) HasFixed() bool { return m.hasFixed() }

// FeedAmounts returns the amount of each member in mol when the mixture is
// a feed of amounts or of gases alone (nil otherwise, and for a feed open
// to a fixed reservoir, which only an aqueous equilibrium reads): amounts as given, or for a gas mixture its mole
// fractions (or partial pressures) scaled to 1 mol in all. The order is the
// members' order.
func (m *Mixture) FeedAmounts() []float64 {
	if !m.IsFeed() || m.hasFixed() {
		return nil
	}
	out := make([]float64, len(m.Members))
	total := 0.0
	for i, mm := range m.Members {
		if mm.Amount == nil {
			return nil
		}
		out[i] = mm.Amount.V
		total += out[i]
	}
	if !(total > 0) || math.IsInf(total, 0) {
		return nil
	}
	if m.Members[0].Kind != AmountMoles {
		for i := range out {
			out[i] /= total
		}
	}
	return out
}

// hasMoles counts the members given as amounts and the others.
func (m *Mixture) hasMoles() (moles, others int) {
	for _, mm := range m.Members {
		switch mm.Kind {
		case AmountMoles:
			moles++
		case AmountInvalid:
			// reported where it was read
		case AmountPartialPressure:
			if !mm.Fixed { // a fixed gas is a reservoir, not a member fed
				others++
			}
		default:
			others++
		}
	}
	return moles, others
}

// moleActivity is a member's activity in a mixture given by amounts: y·P/p°
// for a gas, 1 for a pure phase with a positive amount, the mole fraction
// in a solution phase, and for a solute its molality in the mixture's
// H2O(l). NaN where the amounts give none.
func (m *Mixture) moleActivity(mm *MixMember, p0 float64) float64 {
	if mm.Amount == nil || !(mm.Amount.V > 0) {
		return math.NaN()
	}
	sp := mm.Species
	sum := func(keep func(*Species) bool) float64 {
		t := 0.0
		for _, o := range m.Members {
			if o.Kind == AmountMoles && o.Amount != nil && keep(o.Species) {
				t += o.Amount.V
			}
		}
		return t
	}
	switch sp.Activity() {
	case thermo.ActivityGas:
		P := m.TotalPressure()
		n := sum(func(o *Species) bool { return o.Activity() == thermo.ActivityGas })
		if !(P > 0) || !(n > 0) {
			return math.NaN()
		}
		return mm.Amount.V / n * P / p0
	case thermo.ActivityPureSolid, thermo.ActivityPureLiquid:
		return 1
	case thermo.ActivitySolution:
		n := sum(func(o *Species) bool { return o.Phase == sp.Phase })
		return mm.Amount.V / n
	case thermo.ActivitySolute:
		for _, o := range m.Members {
			if o.Kind == AmountMoles && o.Species.Key == "H2O(l)" && o.Amount != nil && o.Amount.V > 0 {
				return mm.Amount.V / (o.Amount.V * WaterMolarMass) / thermo.MStd
			}
		}
	}
	return math.NaN()
}

// WaterMolarMass is the molar mass of water in kg/mol (CIAAW 2021
// conventional atomic weights: 2 × 1.008 + 15.999 g/mol).
const WaterMolarMass = 0.018015

// mixesMoles reports whether the mixture gives some members as amounts and
// others otherwise (reported by mixture-fractions): no activity is defined.
func (m *Mixture) mixesMoles() bool {
	moles, others := m.hasMoles()
	return moles > 0 && others > 0
}

// DataAt reports whether the species' own data hold at T, without
// extrapolation: what a feed member, and every species of an equilibrium
// calculation on the elements, needs.
func (s *Species) DataAt(T float64) bool {
	return s.Model() != nil && coveredBy(s.coverage(), T)
}

// DataSpan is the lowest and highest temperature where the species' data
// hold (they may have gaps between); ok is false without a model.
func (s *Species) DataSpan() (lo, hi float64, ok bool) {
	spans := s.coverage()
	if len(spans) == 0 {
		return 0, 0, false
	}
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, sp := range spans {
		lo, hi = math.Min(lo, sp[0]), math.Max(hi, sp[1])
	}
	return lo, hi, true
}

// GivesAmounts reports whether the mixture gives its members as amounts (a
// feed in mol), rather than as fractions, pressures or molalities.
func (m *Mixture) GivesAmounts() bool {
	moles, _ := m.hasMoles()
	return moles > 0
}

// EvaluableAt reports whether the species' data give its thermodynamic
// functions at T, and whether that is an extrapolation. Data with a stated
// range (Shomate or NASA 7-term) answer only inside it. Data that state no
// range (hf and s, with or without a constant cp) hold, by the documented
// default, within thermo.DefaultSpan of 298.15 K; beyond it they still
// answer, as a constant ΔfH°, S° and Cp° carried on, and say so
// (extrapolated), as tables mark such rows. Data for 298.15 K alone (gf)
// answer nowhere else.
func (s *Species) EvaluableAt(T float64) (ok, extrapolated bool) {
	if s.DataAt(T) {
		return true, false
	}
	m := s.Model()
	if m == nil || len(s.Ranges) > 0 {
		return false, false
	}
	if lo, hi := m.Range(); lo == hi {
		return false, false
	}
	v := m.G(T)
	return !math.IsNaN(v) && !math.IsInf(v, 0), true
}
