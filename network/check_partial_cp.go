package network

import (
	"strings"

	"hess/lang"
)

var partialCpCheck = &Check{
	Name:     "partial-cp",
	Severity: lang.Warning,
	Doc: `some species of a reaction carry heat capacities and others do not
A reaction's ΔrCp° sums the heat capacities of all its species. Where some
species carry one (cp, or shomate or nasa7 ranges) and others have hf and s
alone, those others count with Cp° = 0, so ΔrH° and ΔrS°, and K away from
298.15 K, are off by their missing heat capacities; a mixture of the two
kinds is seldom meant. The message names the species without a heat
capacity: give them cp or a polynomial, or drop cp from the others so that
the reaction is consistently taken at constant ΔrH° and ΔrS°.`,
	Run: func(p *Pass) {
		for _, rx := range p.Net.Reactions {
			if !rx.Resolved {
				continue
			}
			var with bool
			var without []string
			var buf [12]*Species
			for _, sp := range rx.netSpecies(buf[:0]) {
				switch {
				case len(sp.Ranges) > 0 || sp.Cp != nil:
					with = true
				case sp.Hf != nil && (sp.S != nil || sp.DerivedS() != nil):
					without = append(without, sp.Key)
				}
			}
			if with && len(without) > 0 {
				verb := "have"
				if len(without) == 1 {
					verb = "has"
				}
				p.Reportf(rx.Equation(), "some species of %s carry a heat capacity, but %s %s none (taken as Cp° = 0)",
					rx.Name, strings.Join(without, ", "), verb)
			}
		}
	},
}
