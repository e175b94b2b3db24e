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
		// Each species' kind, worked out once in declaration order: the
		// reactions then read a byte per species rather than its data.
		kinds := make([]cpKind, len(p.Net.Species))
		for i, sp := range p.Net.Species {
			kinds[i] = cpKindOf(sp)
		}
		for _, rx := range p.Net.Reactions {
			if !rx.Resolved {
				continue
			}
			var with bool
			var without []string
			var buf [12]*Species
			for _, sp := range rx.netSpecies(buf[:0]) {
				var kind cpKind
				if i := speciesIndexIn(p.Net.Species, rx, sp); i >= 0 {
					kind = kinds[i]
				} else {
					kind = cpKindOf(sp)
				}
				switch kind {
				case cpWith:
					with = true
				case cpWithout:
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

// cpKind is whether a species carries a heat capacity, as partial-cp sees
// it.
type cpKind int8

const (
	cpUnknown cpKind = iota // neither: no data to speak of
	cpWith                  // cp, or polynomial ranges
	cpWithout               // hf and s (given or derived) but no heat capacity
)

func cpKindOf(sp *Species) cpKind {
	switch {
	case len(sp.Ranges) > 0 || sp.Cp != nil:
		return cpWith
	case sp.Hf != nil && (sp.S != nil || sp.DerivedS() != nil):
		return cpWithout
	}
	return cpUnknown
}

// speciesIndexIn is the declaration index of sp, a species of rx's
// equation, among list (a network's species), from the first term of rx
// that names it; -1 when it is not one of list's.
func speciesIndexIn(list []*Species, rx *Reaction, sp *Species) int {
	for _, side := range [2][]Term{rx.Left, rx.Right} {
		for _, t := range side {
			if t.Species == sp {
				return termIndex(list, t)
			}
		}
	}
	if sp == nil {
		return -1
	}
	return termIndex(list, Term{Species: sp})
}
