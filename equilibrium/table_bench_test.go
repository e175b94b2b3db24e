package equilibrium

import "testing"

// BenchmarkReactionTableHover is what a hover costs: one reaction's table at
// one temperature, crossover search included, from Shomate data.
func BenchmarkReactionTableHover(b *testing.B) {
	n := loadThermo(b, shomateReactions)
	rx := n.LookupReaction("reform")
	temps := []float64{298.15}
	b.ReportAllocs()
	for b.Loop() {
		ReactionTable(n, rx, temps)
	}
}

// BenchmarkReactionTableConstant is the same with hf/s data, whose range
// (10 K to 10 000 K) makes the crossover search longest.
func BenchmarkReactionTableConstant(b *testing.B) {
	n := loadThermo(b, calcite)
	rx := n.LookupReaction("calcine")
	temps := []float64{298.15}
	b.ReportAllocs()
	for b.Loop() {
		ReactionTable(n, rx, temps)
	}
}

// BenchmarkReactionTableRows is a full table: 100 temperatures.
func BenchmarkReactionTableRows(b *testing.B) {
	n := loadThermo(b, shomateReactions)
	rx := n.LookupReaction("reform")
	temps := make([]float64, 100)
	for i := range temps {
		temps[i] = 500 + 10*float64(i)
	}
	b.ReportAllocs()
	for b.Loop() {
		ReactionTable(n, rx, temps)
	}
}
