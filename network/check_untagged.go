package network

import "hess/lang"

var untaggedSpeciesCheck = &Check{
	Name:     "untagged-species",
	Severity: lang.Warning,
	Doc: `a species has no state tag
Without a state tag ((g), (aq), (s), …) a species has no activity
convention of its own. hess then takes its activity as a mole fraction
(the solution convention), so it counts in K and Q like a member of an
ideal solution, and tables name that convention. Usually the tag was
forgotten: a gas, a solute and a pure solid enter K in very different ways.
The electron e- needs no tag.`,
	Run: func(p *Pass) {
		for _, sp := range p.Net.Species {
			if sp.Parts.Electron || sp.Parts.State != "" {
				continue
			}
			p.Reportf(sp.Span, "species %s has no state tag: its activity is taken as a mole fraction (solution convention)", sp.Key)
		}
	},
}
