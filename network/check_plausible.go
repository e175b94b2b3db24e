package network

import (
	"math"

	"hess/lang"
)

var implausibleValueCheck = &Check{
	Name:     "implausible-value",
	Severity: lang.Warning,
	Doc: `a value no real substance has
Flags data that are almost certainly typing or unit mistakes: a temperature
at or below absolute zero, a heat capacity at or below zero or a negative
standard entropy for a neutral species (aqueous ions may have either, since
their values are relative to H+(aq)), also where a shomate or nasa7 range
gives one between its bounds, a formation enthalpy or Gibbs
energy beyond ±50 000 kJ/mol, an entropy or heat capacity above
5 000 J/mol/K, a non-positive pressure, mass or rate prefactor. The bounds
are common practice, wide enough for large minerals.`,
	Run: func(p *Pass) {
		for _, sp := range p.Net.Species {
			if sp.Cp != nil && sp.Cp.V <= 0 && sp.Charge == 0 {
				p.Reportf(sp.Cp.Span, "heat capacity of %s is %g J/mol/K; Cp° must be positive", sp.Key, sp.Cp.V)
			}
			if sp.S != nil && sp.S.V < 0 && sp.Charge == 0 {
				p.Reportf(sp.S.Span, "entropy of neutral species %s is %g J/mol/K; S° of a neutral species cannot be negative", sp.Key, sp.S.V)
			}
			for _, v := range []*Value{sp.Hf, sp.Gf} {
				if v != nil && math.Abs(v.V) > maxFormationEnergy {
					p.Reportf(v.Span, "%g kJ/mol for %s is beyond ±%g kJ/mol; check the unit", v.V/1000, sp.Key, maxFormationEnergy/1000)
				}
			}
			for _, v := range []*Value{sp.S, sp.Cp} {
				if v != nil && v.V > maxEntropy {
					p.Reportf(v.Span, "%g J/mol/K for %s is above %g J/mol/K; check the unit", v.V, sp.Key, maxEntropy)
				}
			}
		}
		implausiblePolynomials(p)
	},
}

// Bounds for implausible-value (common practice, not physical limits).
const (
	maxFormationEnergy = 5e7    // J/mol
	maxEntropy         = 5000.0 // J/mol/K
)
