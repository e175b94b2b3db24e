package network

import (
	"fmt"
	"sort"
	"strings"

	"hess/lang"
	"hess/thermo"
)

// AmountKind is how a mixture member's amount enters its activity.
type AmountKind int

// Kinds of mixture amounts.
const (
	AmountInvalid         AmountKind = iota // the amount does not fit the member's phase
	AmountFraction                          // a gas mole fraction, normalised over the mixture's gases
	AmountPartialPressure                   // a gas partial pressure, Pa
	AmountMolality                          // a solute molality, mol/kg
	AmountSolution                          // a solution member's mole fraction
	AmountPresent                           // a pure phase marked present (activity 1)
	AmountMoles                             // an amount of substance, mol (a feed; any phase)
)

// mixture reads a mixture block: its temperature and pressure in SI, and
// each member's amount classified by the member's activity convention.
// Problems of single members are reported here; problems of the mixture as
// a whole are the mixture checks' (check_mixture.go).
func (c *compiler) mixture(m *lang.Mixture) {
	if !c.name(m.Name, "mixture") {
		return
	}
	mx := &Mixture{Name: m.Name.Name, Span: m.Span(), NameSpan: m.Name.Span(), Valid: true}
	if first := c.net.LookupMixture(mx.Name); first != nil {
		d := c.report(syntaxCheck, mx.NameSpan, "mixture name %s is used twice", mx.Name)
		d.Related = []lang.Related{{Span: first.NameSpan, Message: "first mixture of that name"}}
		mx.Valid = false
	}
	seen := map[*Species]lang.Span{}
	for _, it := range m.Items {
		switch {
		case it.Temperature != nil:
			if mx.wroteT {
				c.report(syntaxCheck, it.Span(), "mixture %s gives its temperature twice", mx.Name)
				mx.Valid = false
				continue
			}
			mx.wroteT = true
			v, ok := c.quantity(it.Temperature, temperatureKind, "a mixture's temperature", false)
			if ok && !(v.V > 0) {
				c.report(implausibleValueCheck, it.Temperature.Span(), "mixture temperature %s is not above 0 K", quantityText(it.Temperature))
				ok = false
			} else if ok && !c.temperatureInRange(v.V, it.Temperature) {
				ok = false
			}
			if !ok {
				mx.Valid = false
				continue
			}
			mx.Temperature = v
		case it.Pressure != nil:
			if mx.wroteP {
				c.report(syntaxCheck, it.Span(), "mixture %s gives its pressure twice", mx.Name)
				mx.Valid = false
				continue
			}
			mx.wroteP = true
			v, ok := c.quantity(it.Pressure, pressureKind, "a mixture's pressure", false)
			if ok && !(v.V > 0) {
				c.report(implausibleValueCheck, it.Pressure.Span(), "mixture pressure %s is not above 0", quantityText(it.Pressure))
				ok = false
			}
			if !ok {
				mx.Valid = false
				continue
			}
			mx.Pressure = v
		case it.Member != nil:
			mm, ok := c.mixMember(mx, it.Member, seen)
			if !ok {
				mx.Valid = false
			}
			if mm.Species != nil {
				mx.Members = append(mx.Members, mm)
			}
		}
	}
	c.net.Mixtures = append(c.net.Mixtures, mx)
}

// mixMember reads one member. It reports false when the member is unusable;
// the member is still returned (with AmountInvalid) when its species is
// declared, so that later checks know it was listed.
func (c *compiler) mixMember(mx *Mixture, m *lang.MixMember, seen map[*Species]lang.Span) (MixMember, bool) {
	sp := c.net.LookupSpecies(m.Species.Text)
	if sp == nil {
		c.undefinedSpecies(m.Species)
		return MixMember{}, false
	}
	mm := MixMember{Species: sp, Span: m.Span()}
	if first, dup := seen[sp]; dup {
		d := c.report(mixtureAmountCheck, m.Species.Span(), "%s is listed twice in mixture %s", sp.Key, mx.Name)
		d.Related = []lang.Related{{Span: first, Message: "first listed here"}}
		return mm, false
	}
	seen[sp] = m.Species.Span()
	q := m.Amount
	var unit thermo.Unit
	if q != nil {
		if q.Sigma != nil {
			c.report(mixtureAmountCheck, q.Sigma.Span(), "a mixture amount takes no uncertainty")
			return mm, false
		}
		v, ok := c.number(q.Value)
		if !ok {
			return mm, false
		}
		mm.Amount = &Value{V: v, Span: q.Span()}
		if q.Unit != nil {
			mm.Unit = q.Unit.Text
			u, err := parseAmountUnit(q.Unit.Text)
			if err != nil {
				c.unitNotUnit(q)
				return mm, false
			}
			unit = u
		}
	}
	mm.Fixed = m.Fixed
	return mm, c.memberKind(&mm, m, unit)
}

// memberKind classifies a member's amount by its species' activity
// convention, converting it to SI. It reports false, having reported why,
// when the amount does not fit the convention.
func (c *compiler) memberKind(mm *MixMember, m *lang.MixMember, unit thermo.Unit) bool {
	sp, q := mm.Species, m.Amount
	name := sp.Key
	if q != nil && q.Unit != nil && (unit.Dim == dimAmountOfSubstance || unit.Dim == dimMassOnly) {
		return c.feedAmount(mm, q, unit)
	}
	switch sp.Activity() {
	case thermo.ActivityGas:
		switch {
		case q == nil:
			c.report(mixtureAmountCheck, m.Span(), "%s is a gas: give its mole fraction (a bare number) or its partial pressure (such as 0.5 bar)", name)
			return false
		case q.Unit == nil:
			if mm.Amount.V < 0 {
				c.report(mixtureAmountCheck, q.Span(), "mole fraction of %s is negative (%s)", name, q.Value.Text)
				return false
			}
			mm.Kind = AmountFraction // zero is judged with the other fractions
		case unit.Dim == thermo.DimPressure:
			mm.Amount.V = unit.ToSI(mm.Amount.V)
			if !(mm.Amount.V > 0) {
				c.report(mixtureAmountCheck, q.Span(), "partial pressure of %s must be above 0, found %s", name, quantityText(q))
				return false
			}
			mm.Kind = AmountPartialPressure
		default:
			c.report(mixtureAmountCheck, q.Unit.Span(), "%s is a gas: its amount is a mole fraction (a bare number) or a partial pressure, not %s (%s)",
				name, thermo.DimName(unit.Dim), q.Unit.Text)
			return false
		}
	case thermo.ActivitySolute:
		switch {
		case q == nil:
			c.report(mixtureAmountCheck, m.Span(), "%s is a solute: give its molality, such as 0.01 mol/kg", name)
			return false
		case q.Unit == nil:
			c.report(missingUnitCheck, q.Span(), "molality of %s needs a unit, such as mol/kg", name)
			return false
		case unit.Dim == thermo.DimMolality:
			mm.Amount.V = unit.ToSI(mm.Amount.V)
			if !(mm.Amount.V > 0) {
				c.report(mixtureAmountCheck, q.Span(), "molality of %s must be above 0, found %s", name, quantityText(q))
				return false
			}
			mm.Kind = AmountMolality
		default:
			c.report(mixtureAmountCheck, q.Unit.Span(), "%s is a solute: its amount is a molality in mol/kg, not %s (%s)",
				name, thermo.DimName(unit.Dim), q.Unit.Text)
			return false
		}
	case thermo.ActivitySolution:
		switch {
		case q == nil:
			c.report(mixtureAmountCheck, m.Span(), "%s is a member of solution phase %s: give its mole fraction (a bare number)", name, sp.Phase.Tag)
			return false
		case q.Unit != nil:
			c.report(mixtureAmountCheck, q.Unit.Span(), "%s is a member of solution phase %s: its mole fraction is a bare number, without %s",
				name, sp.Phase.Tag, q.Unit.Text)
			return false
		case !(mm.Amount.V > 0 && mm.Amount.V <= 1):
			c.report(mixtureAmountCheck, q.Span(), "mole fraction of %s must be above 0 and at most 1, found %s", name, q.Value.Text)
			return false
		}
		mm.Kind = AmountSolution
	case thermo.ActivityPureSolid, thermo.ActivityPureLiquid:
		if q != nil {
			c.report(mixtureAmountCheck, q.Span(), "%s is a pure phase: list it without a number to mark it present (its activity is 1)", name)
			return false
		}
		mm.Kind = AmountPresent
	default:
		c.report(mixtureAmountCheck, m.Species.Span(), "%s has no known phase, so its activity in a mixture is unknown", name)
		return false
	}
	return true
}

// unitNotUnit reports a mixture amount whose unit token is no unit. After
// a number the lexer reads the next word as its unit, so a species written
// without its state tag lands here.
func (c *compiler) unitNotUnit(q *lang.Quantity) {
	text := q.Unit.Text
	if parts, err := lang.SplitRef(text); err == nil && parts.State == "" {
		c.report(mixtureAmountCheck, q.Unit.Span(), "%s", untaggedMessage(c.net, text, q.Value.Text))
		return
	}
	_, err := thermo.ParseUnit(text)
	c.report(unitMismatchCheck, q.Unit.Span(), "%s", unitErrorMessage(err))
}

// untaggedMessage explains a species written without its state tag after
// the number before it.
func untaggedMessage(n *Network, word, number string) string {
	msg := fmt.Sprintf("%s after %s is read as the unit of %s, and is no unit: write the species with its state tag", word, number, number)
	var near []string
	if parts, err := lang.SplitRef(word); err == nil {
		for _, sp := range n.Species {
			if sp.Parts.Base == parts.Base && sp.Charge == parts.Charge {
				near = append(near, sp.Key)
			}
		}
	}
	if len(near) > 0 {
		sort.Strings(near)
		msg += ", such as " + strings.Join(near, " or ")
	}
	return msg
}
