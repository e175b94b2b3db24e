package equilibrium

import (
	"math"
	"testing"

	"hess/network"
)

// FuzzSolveAqueous compiles arbitrary text and solves each mixture as an
// aqueous system: it must never panic; a solve either fails with an error
// or returns a result whose numbers are finite where the species are
// present, and a converged result is neutral.
func FuzzSolveAqueous(f *testing.F) {
	f.Add(`settings { activity davies }
species H2O(l) { gf -237.129 kJ/mol }
species H+(aq) { gf 0 kJ/mol }
species OH-(aq) { gf -157.244 kJ/mol }
species Cl-(aq) { gf -131.228 kJ/mol }
reaction w: H2O(l) <-> H+(aq) + OH-(aq)
mixture m { temperature 25 degC H2O(l) H+(aq) 0.01 mol/kg Cl-(aq) 0.01 mol/kg }`)
	f.Add(`settings { pressure 1 atm activity b-dot }
species H2O(l) { gf -237.129 kJ/mol }
species H+(aq) { gf 0 kJ/mol size 9 Å }
species CO2(g) { gf -394.359 kJ/mol }
species CaCO3(cr) { gf -1128.79 kJ/mol }
species CO2(aq), HCO3-(aq), CO3^2-(aq), Ca^2+(aq), OH-(aq)
reaction w: H2O(l) <-> H+(aq) + OH-(aq) { logk -14 }
reaction a: CO2(g) <-> CO2(aq) { logk -1.47 }
reaction b: CO2(aq) + H2O(l) <-> H+(aq) + HCO3-(aq) { logk -6.35 }
reaction c: HCO3-(aq) <-> H+(aq) + CO3^2-(aq) { logk -10.33 }
reaction d: CaCO3(cr) <-> Ca^2+(aq) + CO3^2-(aq) { logk -8.48 }
mixture m { temperature 25 degC H2O(l) CaCO3(cr) CO2(g) 0.0003 atm fixed }`)
	f.Add(`species H2O(l) { hf -285.83 kJ/mol s 69.91 J/mol/K }
species Na+(aq) { gf -261.9 kJ/mol } species Cl-(aq) { gf -131.2 kJ/mol }
reaction x: Na+(aq) + Cl-(aq) <-> Na+(aq) + Cl-(aq)
mixture m { temperature 99 degC H2O(l) Na+(aq) 6 mol/kg Cl-(aq) 6 mol/kg }`)
	f.Fuzz(func(t *testing.T, src string) {
		if len(src) > 4000 {
			return
		}
		n := network.Load("f.hess", memSource{"f.hess": []byte(src)}, network.Options{})
		for _, m := range n.Mixtures {
			sys, err := AqueousFromMixture(n, m)
			if err != nil {
				continue
			}
			r, err := SolveAqueous(n, sys)
			if err != nil {
				continue
			}
			if !r.Converged {
				continue
			}
			q, scale := 0.0, 0.0
			for _, s := range r.Solutes {
				if math.IsNaN(s.Molality) || math.IsInf(s.Molality, 0) || math.IsNaN(s.Gamma) {
					t.Fatalf("%s: molality %g, γ %g", s.Species.Key, s.Molality, s.Gamma)
				}
				q += float64(s.Species.Charge) * s.Molality
				scale += math.Abs(float64(s.Species.Charge)) * s.Molality
			}
			if math.Abs(q) > 1e-9*scale+1e-12 {
				t.Fatalf("net charge %g mol/kg of %g", q, scale)
			}
		}
	})
}
