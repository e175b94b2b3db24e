package equilibrium

import (
	"fmt"
	"math"
	"sort"

	"hess/network"
	"hess/thermo"
)

// maxAqueousSpecies bounds the species of one problem.
const maxAqueousSpecies = 4096

// aqRole is the part a species plays in the problem.
type aqRole int

const (
	roleWater aqRole = iota
	roleSolute
	rolePure
	roleGas
	roleFixed
)

// aqSpecies is one species of the problem, its role and μ°/RT at T (plus
// ln p/p° for a fixed gas; NaN where neither its data nor a reaction gives it).
type aqSpecies struct {
	sp   *network.Species
	role aqRole
	mu0  float64 // μ°/RT
}

// findWater is the network's H2O(l), or nil.
func findWater(n *network.Network) *network.Species {
	for _, sp := range n.Species {
		if sp.IsWater() {
			return sp
		}
	}
	return nil
}

// aqueousSpecies lists the problem's species, water first: the fed and
// fixed species, and the candidates made only of the elements present.
func aqueousSpecies(n *network.Network, sys AqueousSystem, water *network.Species) ([]aqSpecies, error) {
	out := []aqSpecies{{sp: water, role: roleWater}}
	seen := map[*network.Species]bool{water: true}
	elements := map[string]bool{"H": true, "O": true}
	add := func(sp *network.Species, must bool) error {
		if seen[sp] {
			return nil
		}
		r, ok := roleOf(sp, sys, water)
		if !ok || !sp.HasFormula || sp.Parts.Electron {
			if must {
				return fmt.Errorf("%w: %s cannot take part in an aqueous equilibrium (its phase is not aq, a pure phase or a gas)", ErrAqueous, sp.Key)
			}
			return nil
		}
		if len(out) >= maxAqueousSpecies {
			return fmt.Errorf("%w: more than %d species", ErrAqueous, maxAqueousSpecies)
		}
		seen[sp] = true
		out = append(out, aqSpecies{sp: sp, role: r})
		return nil
	}
	var fed []*network.Species
	for sp, amt := range sys.Feed {
		if math.IsNaN(amt) || amt < 0 || math.IsInf(amt, 0) {
			return nil, fmt.Errorf("%w: feed of %s is %g mol", ErrAqueous, sp.Key, amt)
		}
		if sp != water {
			fed = append(fed, sp)
		}
	}
	for sp, p := range sys.Fixed {
		if sp.Activity() != thermo.ActivityGas {
			return nil, fmt.Errorf("%w: %s is held fixed but is not a gas", ErrAqueous, sp.Key)
		}
		if !(p > 0) || math.IsInf(p, 0) {
			return nil, fmt.Errorf("%w: fixed partial pressure of %s is %g Pa", ErrAqueous, sp.Key, p)
		}
		fed = append(fed, sp)
	}
	sort.Slice(fed, func(i, j int) bool { return fed[i].Key < fed[j].Key })
	for _, sp := range fed {
		if err := add(sp, true); err != nil {
			return nil, err
		}
		for _, ec := range sp.Formula.Elements {
			elements[ec.Symbol] = true
		}
	}
	candidates := sys.Candidates
	if candidates == nil {
		candidates = n.Species
	}
	for _, sp := range candidates {
		if !sp.HasFormula || sp.Parts.Electron {
			continue
		}
		inside := true
		for _, ec := range sp.Formula.Elements {
			if !elements[ec.Symbol] {
				inside = false
				break
			}
		}
		if inside {
			if err := add(sp, false); err != nil {
				return nil, err
			}
		}
	}
	return out, nil
}

// roleOf is the part a species plays in the aqueous system: water, an aq
// solute, a pure solid or liquid, a gas, or a gas held fixed; false for a
// species that can take none (a solute of another solvent, an electron).
func roleOf(sp *network.Species, sys AqueousSystem, water *network.Species) (aqRole, bool) {
	if _, fixed := sys.Fixed[sp]; fixed {
		return roleFixed, true
	}
	switch sp.Activity() {
	case thermo.ActivitySolute:
		if sp.Phase.Tag != "aq" {
			return 0, false
		}
		return roleSolute, true
	case thermo.ActivityPureSolid, thermo.ActivityPureLiquid:
		if sp == water {
			return roleWater, true
		}
		return rolePure, true
	case thermo.ActivityGas:
		return roleGas, true
	}
	return 0, false
}
