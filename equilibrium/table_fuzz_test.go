package equilibrium

import (
	"math"
	"testing"

	"hess/network"
)

// FuzzReactionTable compiles arbitrary text and computes every reaction's
// table at ordinary and odd temperatures: it must never panic, a valid row
// has a finite ΔrG°, and a crossover lies inside the data's span.
func FuzzReactionTable(f *testing.F) {
	f.Add(shomateReactions[len("\ninclude \"webbook-shomate.hess\""):] + `
species CO(g) { shomate 298 K to 1300 K { 25.6 6.1 4.05 -2.67 0.131 -118 227 -110.5 } }
species H2O(g) { nasa7 200 K to 1000 K { 4.2 -2.0e-3 6.5e-6 -5.5e-9 1.8e-12 -3.0e4 -0.85 } }
species CO2(g) { hf -393.5 kJ/mol s 213.8 J/mol/K cp 37 J/mol/K }
species H2(g) { gf 0 kJ/mol }`)
	f.Add(calcite)
	f.Add(silverChlorideNet(silverChlorideData))
	f.Add(`species A(g), B(g), C(g)
reaction ab: A(g) <-> B(g) { dh 10 kJ/mol ds 20 J/mol/K }
reaction bc: B(g) <-> C(g) { logk 2 at 400 K }
reaction ac: A(g) <-> C(g) = ab + bc
reaction loop: A(g) <-> C(g) = loop - ab`)
	f.Fuzz(func(t *testing.T, src string) {
		temps := []float64{298.15, 400, 1000, 0, -5, math.NaN(), math.Inf(1), 1e7}
		n := network.Load("net.hess", memSource{"net.hess": []byte(src)}, network.Options{Temperatures: temps})
		for _, rx := range n.Reactions {
			tb := ReactionTable(n, rx, temps)
			for _, r := range tb.Rows {
				if r.Valid && (math.IsNaN(r.DG) || math.IsInf(r.DG, 0)) {
					t.Fatalf("%s at %g K: valid row with ΔrG° %g", rx.Name, r.T, r.DG)
				}
			}
			for _, c := range tb.Crossovers {
				if c.T < tb.Tmin || c.T > tb.Tmax {
					t.Fatalf("%s: crossover %g K outside %g–%g K", rx.Name, c.T, tb.Tmin, tb.Tmax)
				}
			}
		}
	})
}
