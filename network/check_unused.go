package network

import "hess/lang"

var unusedSpeciesCheck = &Check{
	Name:     "unused-species",
	Severity: lang.Warning,
	Doc: `a species appears in no reaction
A declared species that no reaction uses is often a typo in a reaction (a
different state tag, a different charge) or data left behind. A species
library shared by several networks may turn this off in the networks that
use only part of it: lint unused-species off. A species whose formula does
not parse is not reported again here.`,
	Run: func(p *Pass) {
		for _, sp := range p.Net.Species {
			if !sp.Used && sp.HasFormula {
				p.Reportf(sp.Span, "species %s appears in no reaction", sp.Key)
			}
		}
	},
}
