package network

import (
	"fmt"
	"math"
)

// polySamples is how many temperatures of each polynomial range the
// implausible-value check evaluates, bounds included.
const polySamples = 50

// implausiblePolynomials reports polynomial ranges that give, somewhere
// between their bounds, a heat capacity at or below zero or a negative
// entropy for a neutral species, or an enthalpy, entropy or heat capacity
// beyond the bounds of implausible-value. Each range reports its worst
// value of each kind.
func implausiblePolynomials(p *Pass) {
	for _, sp := range p.Net.Species {
		for _, r := range sp.Ranges {
			m := r.model()
			if m == nil {
				continue
			}
			var minCp, minS, maxS, maxCp, maxH = math.Inf(1), math.Inf(1), math.Inf(-1), math.Inf(-1), 0.0
			var tMinCp, tMinS, tMaxS, tMaxCp, tMaxH float64
			for i := range polySamples {
				T := r.Tmin + (r.Tmax-r.Tmin)*float64(i)/float64(polySamples-1)
				cp, s, h := m.Cp(T), m.S(T), m.H(T)
				if cp < minCp {
					minCp, tMinCp = cp, T
				}
				if cp > maxCp {
					maxCp, tMaxCp = cp, T
				}
				if s < minS {
					minS, tMinS = s, T
				}
				if s > maxS {
					maxS, tMaxS = s, T
				}
				if math.Abs(h) > math.Abs(maxH) {
					maxH, tMaxH = h, T
				}
			}
			// Most ranges are fine: the range's description is written
			// only for a report.
			where := func() string {
				return fmt.Sprintf("%s range %s to %s of %s", r.Kind, kelvin(r.Tmin), kelvin(r.Tmax), sp.Key)
			}
			neutral := sp.Charge == 0
			if neutral && minCp <= 0 {
				p.Reportf(r.Header, "%s gives Cp° = %.4g J/mol/K at %s; Cp° must be positive", where(), minCp, kelvin(tMinCp))
			}
			if neutral && minS < 0 {
				p.Reportf(r.Header, "%s gives S° = %.4g J/mol/K at %s; S° of a neutral species cannot be negative", where(), minS, kelvin(tMinS))
			}
			if maxCp > maxEntropy {
				p.Reportf(r.Header, "%s gives Cp° = %.4g J/mol/K at %s, above %g J/mol/K; check the coefficients", where(), maxCp, kelvin(tMaxCp), maxEntropy)
			}
			if maxS > maxEntropy {
				p.Reportf(r.Header, "%s gives S° = %.4g J/mol/K at %s, above %g J/mol/K; check the coefficients", where(), maxS, kelvin(tMaxS), maxEntropy)
			}
			if math.Abs(maxH) > maxFormationEnergy {
				p.Reportf(r.Header, "%s gives H° = %.4g kJ/mol at %s, beyond ±%g kJ/mol; check the coefficients", where(), maxH/1000, kelvin(tMaxH), maxFormationEnergy/1000)
			}
		}
	}
}
