package network

import (
	"fmt"
	"os"
	"path"
	"slices"
	"testing"

	"hess/synth"
)

// synthSource generates a network of the given size (species with NASA
// 7-term data, a tenth of the reactions with own data and a rate, spread
// over four files) and serves it from memory.
func synthSource(tb testing.TB, species, reactions int) (root string, src memSource, size int) {
	tb.Helper()
	return shapeSource(tb, synth.Spread, species, reactions)
}

// shapeCfg is the configuration of each shape the scale benchmarks
// measure: Spread with a tenth of the reactions carrying own data over four
// files, Mechanism in one file with one reaction in a hundred.
func shapeCfg(shape synth.Shape, species, reactions int) synth.Config {
	if shape == synth.Mechanism {
		return synth.Config{Shape: shape, Seed: 1, Species: species, Reactions: reactions, OwnData: reactions / 100, Files: 1}
	}
	return synth.Config{Shape: shape, Seed: 1, Species: species, Reactions: reactions, OwnData: reactions / 10, Files: 4}
}

// shapeSource generates a network of the shape and size and serves it
// from memory.
func shapeSource(tb testing.TB, shape synth.Shape, species, reactions int) (root string, src memSource, size int) {
	tb.Helper()
	g, err := synth.Generate(shapeCfg(shape, species, reactions))
	if err != nil {
		tb.Fatal(err)
	}
	src = memSource{}
	for name, b := range g.Files {
		src[path.Join("/syn", name)] = b
	}
	return path.Join("/syn", g.Root), src, g.Bytes()
}

// scaleSizes are the sizes the scale benchmarks compile: 1 000 species
// with 5 000 reactions, 10 000 with 50 000, and the 10 000 species of the
// large network with only 5 000 reactions, where the species dominate.
var scaleSizes = []struct{ species, reactions int }{{1000, 5000}, {10000, 50000}, {10000, 5000}}

// largeScaleSize is the size BenchmarkLoadSynthetic adds when the
// environment sets HESS_BENCH_LARGE=1: 40 000 species with 200 000
// reactions, four times the large network, to see whether the compile
// grows linearly (a minute or so per shape to generate and compile;
// run it with -benchtime 3x).
var largeScaleSize = struct{ species, reactions int }{40000, 200000}

// BenchmarkLoadSynthetic is a full compile with every check of generated
// networks of both shapes (synth.Spread, synth.Mechanism) at scaleSizes,
// and at largeScaleSize when HESS_BENCH_LARGE=1. ns/reaction is the cost
// per reaction, whose ratio between the sizes shows how the compiler
// scales.
func BenchmarkLoadSynthetic(b *testing.B) {
	sizes := scaleSizes
	if os.Getenv("HESS_BENCH_LARGE") == "1" {
		sizes = append(slices.Clone(sizes), largeScaleSize)
	}
	for _, shape := range []synth.Shape{synth.Spread, synth.Mechanism} {
		for _, size := range sizes {
			b.Run(fmt.Sprintf("%v/sp=%d/rx=%d", shape, size.species, size.reactions), func(b *testing.B) {
				benchLoad(b, shape, size.species, size.reactions)
			})
		}
	}
}

func benchLoad(b *testing.B, shape synth.Shape, species, reactions int) {
	root, src, bytes := shapeSource(b, shape, species, reactions)
	b.SetBytes(int64(bytes))
	b.ReportAllocs()
	for b.Loop() {
		n := Load(root, src, Options{})
		if len(n.Reactions) != reactions {
			b.Fatalf("%d reactions", len(n.Reactions))
		}
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(reactions), "ns/reaction")
}

// BenchmarkChecksSynthetic runs each check alone on the generated networks
// of 50 000 reactions of both shapes, compiled once, so that a profile of
// the full compile can be read check by check.
func BenchmarkChecksSynthetic(b *testing.B) {
	for _, shape := range []synth.Shape{synth.Spread, synth.Mechanism} {
		root, src, _ := shapeSource(b, shape, 10000, 50000)
		n := Load(root, src, Options{})
		base := n.Diagnostics
		for _, c := range checks {
			if c.Run == nil {
				continue
			}
			b.Run(shape.String()+"/"+c.Name, func(b *testing.B) {
				b.ReportAllocs()
				for b.Loop() {
					n.Diagnostics = base[:len(base):len(base)]
					c.Run(&Pass{Net: n, check: c})
				}
			})
		}
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
