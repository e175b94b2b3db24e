package equilibrium

import (
	"math"
	"testing"

	"hess/network"
)

// FuzzApproach compiles arbitrary text and evaluates each of its mixtures:
// it must never panic, a mixture that is not usable gives no numbers, and a
// direction always agrees with the sign of ΔrG.
func FuzzApproach(f *testing.F) {
	f.Add(`species CO(g) { hf -110.527 kJ/mol s 197.653 J/mol/K }
species H2O(g) { hf -241.826 kJ/mol s 188.834 J/mol/K }
species CO2(g) { hf -393.522 kJ/mol s 213.795 J/mol/K }
species H2(g) { hf 0 kJ/mol s 130.680 J/mol/K }
reaction shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)
mixture m { temperature 900 K pressure 20 bar CO(g) 0.1 H2O(g) 0.3 CO2(g) 0.2 H2(g) 0.4 }`)
	f.Add(`species AgCl(s) { gf -109.789 kJ/mol }
species Ag+(aq) { gf 77.107 kJ/mol }
species Cl-(aq) { gf -131.228 kJ/mol }
reaction d: AgCl(s) <-> Ag+(aq) + Cl-(aq)
mixture b { temperature 25 degC AgCl(s) Ag+(aq) 1e-5 mol/kg Cl-(aq) 0.1 mol/kg }`)
	f.Add(`phase melt { convention solution }
species A(melt) { hf 1 kJ/mol s 10 J/mol/K } species B(g) { hf 0 kJ/mol s 100 J/mol/K }
reaction r: A(melt) <-> B(g)
mixture x { temperature 1e4 K A(melt) 1 B(g) 1e-300 Pa pressure 0 bar }`)
	f.Add("mixture m { CO2 0.1 K 3 bar H2(g) temperature -4 K }")
	f.Fuzz(func(t *testing.T, src string) {
		n := network.Load("net.hess", memSource{"net.hess": []byte(src)}, network.Options{})
		for _, m := range n.Mixtures {
			a := Approach(n, m)
			if a == nil {
				if m.Usable() {
					t.Fatalf("usable mixture %s gave no result", m.Name)
				}
				continue
			}
			for _, r := range a.Reactions {
				switch r.Direction {
				case Forward:
					if !(r.DG < 0) {
						t.Fatalf("%s forward with ΔrG = %g", r.Reaction.Name, r.DG)
					}
				case Reverse:
					if !(r.DG > 0) {
						t.Fatalf("%s reverse with ΔrG = %g", r.Reaction.Name, r.DG)
					}
				case AtEquilibrium:
					if !(math.Abs(r.DG) <= n.Settings.Tolerance) {
						t.Fatalf("%s at equilibrium with ΔrG = %g", r.Reaction.Name, r.DG)
					}
				}
			}
		}
	})
}
