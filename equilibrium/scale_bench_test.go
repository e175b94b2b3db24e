package equilibrium

import (
	"path"
	"testing"

	"hess/network"
	"hess/synth"
)

// synthSource generates a network (see hess/synth) spread over files under
// /syn.
func synthSource(tb testing.TB, species, reactions int) (root string, src memSource) {
	tb.Helper()
	g, err := synth.Generate(synth.Config{Seed: 1, Species: species, Reactions: reactions, OwnData: reactions / 10, Files: 4})
	if err != nil {
		tb.Fatal(err)
	}
	src = memSource{}
	for name, b := range g.Files {
		src[path.Join("/syn", name)] = b
	}
	return path.Join("/syn", g.Root), src
}

// BenchmarkTableSynthetic computes the K(T) table of every reaction of
// the generated network at its 10 temperatures (300 K to 1200 K), crossover
// search included, as `hess table` does.
func BenchmarkTableSynthetic(b *testing.B) {
	root, src := synthSource(b, 10000, 50000)
	n := network.Load(root, src, network.Options{})
	temps := n.Settings.Temperatures
	if len(temps) != 10 {
		b.Fatalf("%d temperatures", len(temps))
	}
	b.ReportAllocs()
	for b.Loop() {
		for _, rx := range n.Reactions {
			if t := ReactionTable(n, rx, temps); !t.Rows[0].Valid {
				b.Fatalf("%s: no K at %g K", rx.Name, temps[0])
			}
		}
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(len(n.Reactions)), "ns/reaction")
}
