package equilibrium

import (
	"fmt"
	"path"
	"strings"
	"testing"

	"hess/network"
	"hess/synth"
	"hess/thermo"
)

// synthFeed compiles a generated network (hess/synth, spread shape:
// NASA 7-term data on every species, 200–6000 K) with a feed of 1 mol of
// each of its first three species at 1000 K and 1 bar.
func synthFeed(tb testing.TB, species, reactions int) (*network.Network, *network.Mixture) {
	tb.Helper()
	g, err := synth.Generate(synth.Config{Seed: 3, Files: 1, Species: species, Reactions: reactions, OwnData: reactions / 10})
	if err != nil {
		tb.Fatal(err)
	}
	src := memSource{}
	for name, b := range g.Files {
		src[path.Join("/syn", name)] = b
	}
	root := path.Join("/syn", g.Root)
	n := network.Load(root, src, network.Options{})
	var feed strings.Builder
	feed.WriteString("\nmixture feed {\n  temperature 1000 K\n  pressure 1 bar\n")
	k := 0
	for _, sp := range n.Species {
		if sp.Activity() == thermo.ActivityGas && sp.Used && k < 3 {
			fmt.Fprintf(&feed, "  %s 1 mol\n", sp.Key)
			k++
		}
	}
	feed.WriteString("}\n")
	src[root] = append(src[root], feed.String()...)
	n = network.Load(root, src, network.Options{})
	mx := n.LookupMixture("feed")
	if mx == nil || !mx.IsFeed() {
		tb.Fatal("no feed")
	}
	return n, mx
}

func benchEquilibrate(b *testing.B, species, reactions int, basis Basis) {
	n, mx := synthFeed(b, species, reactions)
	b.ReportAllocs()
	for b.Loop() {
		c, diags, err := Equilibrate(n, mx, Options{Basis: basis})
		if err != nil || len(diags) > 0 || !c.Converged {
			b.Fatalf("%v %v converged=%v", err, diags, c != nil && c.Converged)
		}
	}
}

// BenchmarkEquilibrate*: one feed brought to equilibrium through the whole
// bridge (system built from the network, μ°, basis, solve, result).
func BenchmarkEquilibrateGas10(b *testing.B) { benchEquilibrate(b, 10, 20, BasisElements) }
func BenchmarkEquilibrateSynthetic60Elements(b *testing.B) {
	benchEquilibrate(b, 60, 200, BasisElements)
}
func BenchmarkEquilibrateSynthetic60Reactions200(b *testing.B) {
	benchEquilibrate(b, 60, 200, BasisReactions)
}
func BenchmarkEquilibrateSynthetic500(b *testing.B) { benchEquilibrate(b, 500, 1500, BasisElements) }

// BenchmarkEquilibrateSweep50 is a 50-point temperature sweep (700–1190 K)
// on the 60-species network with warm starts; compare with
// BenchmarkEquilibrateSynthetic60Elements (one cold point).
func BenchmarkEquilibrateSweep50(b *testing.B) {
	n, mx := synthFeed(b, 60, 200)
	b.ReportAllocs()
	for b.Loop() {
		var prev *Composition
		for i := 0; i < 50; i++ {
			c, diags, err := Equilibrate(n, mx, Options{T: 700 + 10*float64(i), Basis: BasisElements, Start: prev})
			if err != nil || len(diags) > 0 || !c.Converged {
				b.Fatalf("%v %v", err, diags)
			}
			prev = c
		}
	}
}
