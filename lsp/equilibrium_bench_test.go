package lsp

import (
	"os"
	"path/filepath"
	"testing"

	"hess/equilibrium"
	"hess/network"
)

// BenchmarkFeedSolveLarge measures what a hover's equilibrium costs the
// worker on the 5 000-reaction demo network: one feed (a C5 alkane with
// hydrogen at 700 K) brought to equilibrium over every reaction, as
// solveFeeds does after publishing. Until it finishes the next edit's
// compile waits, so this is the latency a feed can add to an edit.
func BenchmarkFeedSolveLarge(b *testing.B) {
	text := bigNetwork(benchFeedReactions) + "mixture feed { temperature 700 K pressure 20 bar c5i0(g) 1 mol H2(g) 2 mol }\n"
	path := filepath.Join(b.TempDir(), "unit.hess")
	if err := os.WriteFile(path, []byte(text), 0o644); err != nil {
		b.Fatal(err)
	}
	net := network.Load(path, network.Disk{}, network.Options{})
	mx := net.LookupMixture("feed")
	if mx == nil || !mx.IsFeed() {
		b.Fatal("no feed")
	}
	b.Logf("%d species, %d reactions", len(net.Species), len(net.Reactions))
	for b.Loop() {
		c, diags, err := equilibrium.Equilibrate(net, mx, equilibrium.Options{})
		if err != nil || len(diags) > 0 || c == nil {
			b.Fatalf("%v %v", err, diags)
		}
	}
}

// benchFeedReactions sizes BenchmarkFeedSolveLarge's network; at 2 000
// reactions (some 400 species) it sits just inside the hover's bound.
var benchFeedReactions = 5000

// BenchmarkFeedSolveAtBound is BenchmarkFeedSolveLarge just inside the bound.
func BenchmarkFeedSolveAtBound(b *testing.B) {
	benchFeedReactions = 2000
	defer func() { benchFeedReactions = 5000 }()
	BenchmarkFeedSolveLarge(b)
}
