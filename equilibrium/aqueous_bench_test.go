package equilibrium

import (
	"testing"

	"hess/network"
)

// BenchmarkSolveAqueous times one aqueous equilibrium: calcite open to CO2
// under Davies (nine species, a pure phase, a fixed gas, γ iterated), and
// 5 mol/kg HCl under b-dot.
func BenchmarkSolveAqueous(b *testing.B) {
	b.Run("calcite-open-davies", func(b *testing.B) {
		n := loadAqueous(b, "carbonate.hess", "davies")
		sys, err := AqueousFromMixture(n, n.LookupMixture("open-calcite"))
		if err != nil {
			b.Fatal(err)
		}
		b.ReportAllocs()
		for i := 0; i < b.N; i++ {
			if _, err := SolveAqueous(n, sys); err != nil {
				b.Fatal(err)
			}
		}
	})
	b.Run("hcl-5molal-bdot", func(b *testing.B) {
		n := loadAqueous(b, "water.hess", "b-dot")
		sys := AqueousSystem{T: 298.15, WaterKg: 1, Feed: map[*network.Species]float64{
			species(b, n, "H+(aq)"): 5, species(b, n, "Cl-(aq)"): 5}}
		b.ReportAllocs()
		for i := 0; i < b.N; i++ {
			if _, err := SolveAqueous(n, sys); err != nil {
				b.Fatal(err)
			}
		}
	})
}
