package network

import (
	"fmt"
	"path"
	"testing"

	"hess/synth"
)

// synthSource generates a network of the given size (species with NASA
// 7-term data, a tenth of the reactions with own data and a rate, spread
// over four files) and serves it from memory.
func synthSource(tb testing.TB, species, reactions int) (root string, src memSource, size int) {
	tb.Helper()
	g, err := synth.Generate(synth.Config{Seed: 1, Species: species, Reactions: reactions, OwnData: reactions / 10, Files: 4})
	if err != nil {
		tb.Fatal(err)
	}
	src = memSource{}
	for name, b := range g.Files {
		src[path.Join("/syn", name)] = b
	}
	return path.Join("/syn", g.Root), src, g.Bytes()
}

// BenchmarkLoadSynthetic is a full compile with every check of generated
// networks: 1 000 species and 5 000 reactions, and 10 000 species and
// 50 000 reactions. ns/reaction is the cost per reaction, whose ratio
// between the two sizes shows how the compiler scales.
func BenchmarkLoadSynthetic(b *testing.B) {
	for _, size := range []struct{ species, reactions int }{{1000, 5000}, {10000, 50000}} {
		b.Run(fmt.Sprintf("rx=%d", size.reactions), func(b *testing.B) {
			root, src, bytes := synthSource(b, size.species, size.reactions)
			b.SetBytes(int64(bytes))
			b.ReportAllocs()
			for b.Loop() {
				n := Load(root, src, Options{})
				if len(n.Reactions) != size.reactions {
					b.Fatalf("%d reactions", len(n.Reactions))
				}
			}
			b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(size.reactions), "ns/reaction")
		})
	}
}

// BenchmarkChecksSynthetic runs each check alone on the generated network
// of 50 000 reactions, compiled once, so that a profile of the full
// compile can be read check by check.
func BenchmarkChecksSynthetic(b *testing.B) {
	root, src, _ := synthSource(b, 10000, 50000)
	n := Load(root, src, Options{})
	base := n.Diagnostics
	for _, c := range checks {
		if c.Run == nil {
			continue
		}
		b.Run(c.Name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				n.Diagnostics = base[:len(base):len(base)]
				c.Run(&Pass{Net: n, check: c})
			}
		})
	}
}

// BenchmarkCycleCheckSynthetic runs the cycle check alone on the generated
// network, whose 5 000 reactions with own data close cycles among
// themselves.
func BenchmarkCycleCheckSynthetic(b *testing.B) {
	root, src, _ := synthSource(b, 10000, 50000)
	n := Load(root, src, Options{})
	base := n.Diagnostics
	b.ReportAllocs()
	for b.Loop() {
		n.Diagnostics = base[:len(base):len(base)]
		cycleInconsistentCheck.Run(&Pass{Net: n, check: cycleInconsistentCheck})
	}
}
