package network

import (
	"fmt"
	"math"

	"hess/thermo"
)

// implausiblePolynomials reports polynomial ranges that give, somewhere
// between their bounds, a heat capacity at or below zero or a negative
// entropy for a neutral species, or an enthalpy, entropy or heat capacity
// beyond the bounds of implausible-value. Each range reports its worst
// value of each kind, found exactly (thermo.RangeExtremes): at a bound, or
// where Cp° or its slope changes sign.
func implausiblePolynomials(p *Pass) {
	p.eachSpecies("implausible-value/polynomials", func(sp *Species) {
		for _, r := range sp.Ranges {
			m, ok := r.model().(thermo.Polynomial)
			if !ok {
				continue
			}
			e := thermo.RangeExtremes(m)
			minCp, tMinCp, maxCp, tMaxCp := e.CpMin.V, e.CpMin.T, e.CpMax.V, e.CpMax.T
			minS, tMinS, maxS, tMaxS := e.SMin.V, e.SMin.T, e.SMax.V, e.SMax.T
			worstH := e.HMax
			if a, b := math.Abs(e.HMin.V), math.Abs(e.HMax.V); a > b || a == b && e.HMin.T < e.HMax.T {
				worstH = e.HMin
			}
			maxH, tMaxH := worstH.V, worstH.T
			// Most ranges are fine: the range's description is written
			// only for a report.
			where := func() string {
				return fmt.Sprintf("%s range %s to %s of %s", r.Kind, kelvin(r.Tmin), kelvin(r.Tmax), sp.Key)
			}
			neutral := sp.Charge == 0
			if neutral && minCp <= 0 {
				p.Reportf(r.Header(), "%s gives Cp° = %.4g J/mol/K at %s; Cp° must be positive", where(), minCp, kelvin(tMinCp))
			}
			if neutral && minS < 0 {
				p.Reportf(r.Header(), "%s gives S° = %.4g J/mol/K at %s; S° of a neutral species cannot be negative", where(), minS, kelvin(tMinS))
			}
			if maxCp > maxEntropy {
				p.Reportf(r.Header(), "%s gives Cp° = %.4g J/mol/K at %s, above %g J/mol/K; check the coefficients", where(), maxCp, kelvin(tMaxCp), maxEntropy)
			}
			if maxS > maxEntropy {
				p.Reportf(r.Header(), "%s gives S° = %.4g J/mol/K at %s, above %g J/mol/K; check the coefficients", where(), maxS, kelvin(tMaxS), maxEntropy)
			}
			if math.Abs(maxH) > maxFormationEnergy {
				p.Reportf(r.Header(), "%s gives H° = %.4g kJ/mol at %s, beyond ±%g kJ/mol; check the coefficients", where(), maxH/1000, kelvin(tMaxH), maxFormationEnergy/1000)
			}
		}
	})
}
