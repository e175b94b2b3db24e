package network

import (
	"math"
	"strconv"

	"hess/lang"
)

// rescaleTolerance is how far from 1 a mixture's gas mole fractions may sum
// without a warning: floating-point rounding only.
const rescaleTolerance = 1e-6

var mixtureRescaledCheck = &Check{
	Name:     "mixture-rescaled",
	Severity: lang.Warning,
	Doc: `a mixture's gas mole fractions do not sum to 1 and are rescaled
Gas mole fractions are divided by their sum before they are multiplied by
the mixture's pressure, so that they sum to 1. Where the fractions as
written do not sum to 1, each partial pressure differs from what was
written by that factor: a member was left out, a value mistyped, or the
composition is on a different basis (dry gas, ppm). The message gives the
sum; list the missing members, correct the values, or give partial
pressures instead.`,
	Run: func(p *Pass) {
		for _, m := range p.Net.Mixtures {
			if !m.Usable() {
				continue // its amounts are reported as they are
			}
			sum, n := 0.0, 0
			for _, mm := range m.Members {
				if mm.Kind == AmountFraction && mm.Amount != nil {
					sum += mm.Amount.V
					n++
				}
			}
			if n == 0 || !(sum > 0) || math.IsInf(sum, 0) || math.Abs(sum-1) <= rescaleTolerance {
				continue
			}
			p.Reportf(m.NameSpan, "the gas mole fractions of mixture %s sum to %s; each is divided by that sum",
				m.Name, strconv.FormatFloat(sum, 'g', 6, 64))
		}
	},
}
