package lang

import (
	"fmt"
	"testing"

	"hess/synth"
)

// scaleNetworks are the generated networks the scale benchmarks share:
// both shapes at 5 000 and 50 000 reactions, configured as the network
// package's scale benchmarks configure them.
var scaleNetworks = []synth.Config{
	{Shape: synth.Spread, Seed: 1, Species: 1000, Reactions: 5000, OwnData: 500, Files: 4},
	{Shape: synth.Spread, Seed: 1, Species: 10000, Reactions: 50000, OwnData: 5000, Files: 4},
	{Shape: synth.Mechanism, Seed: 1, Species: 1000, Reactions: 5000, OwnData: 50},
	{Shape: synth.Mechanism, Seed: 1, Species: 10000, Reactions: 50000, OwnData: 500},
}

func scaleName(c synth.Config) string { return fmt.Sprintf("%v/rx=%d", c.Shape, c.Reactions) }

func generate(tb testing.TB, c synth.Config) *synth.Network {
	tb.Helper()
	g, err := synth.Generate(c)
	if err != nil {
		tb.Fatal(err)
	}
	return g
}

// synthFiles generates the spread network of 10 000 species and 50 000
// reactions (5 000 with own data).
func synthFiles(b *testing.B) *synth.Network { return generate(b, scaleNetworks[1]) }

// BenchmarkParseSynthetic lexes and parses every file of each generated
// network. Its ratio to BenchmarkScanFloorSynthetic on the same network is
// what parsing costs over touching each byte once.
func BenchmarkParseSynthetic(b *testing.B) {
	for _, c := range scaleNetworks {
		b.Run(scaleName(c), func(b *testing.B) {
			g := generate(b, c)
			b.SetBytes(int64(g.Bytes()))
			b.ReportAllocs()
			for b.Loop() {
				for _, name := range g.Names {
					if _, diags := Parse(name, g.Files[name]); len(diags) != 0 {
						b.Fatalf("%s: %v", name, diags[0])
					}
				}
			}
		})
	}
}

// BenchmarkLexSynthetic runs the lexer alone over each generated network.
func BenchmarkLexSynthetic(b *testing.B) {
	for _, c := range scaleNetworks {
		b.Run(scaleName(c), func(b *testing.B) {
			g := generate(b, c)
			b.SetBytes(int64(g.Bytes()))
			b.ReportAllocs()
			for b.Loop() {
				for _, name := range g.Names {
					if toks, _, _ := Lex(name, g.Files[name]); len(toks) == 0 {
						b.Fatal("no tokens")
					}
				}
			}
		})
	}
}

// BenchmarkScanFloorSynthetic is the floor under lexing: floorScan over
// the bytes of each generated network, which classifies the same tokens as
// the lexer without allocating or keeping them.
func BenchmarkScanFloorSynthetic(b *testing.B) {
	for _, c := range scaleNetworks {
		b.Run(scaleName(c), func(b *testing.B) {
			g := generate(b, c)
			b.SetBytes(int64(g.Bytes()))
			b.ReportAllocs()
			for b.Loop() {
				for _, name := range g.Names {
					if counts := floorScan(g.Files[name]); counts.total() == 0 && len(g.Files[name]) > 0 {
						b.Fatal("no tokens")
					}
				}
			}
		})
	}
}

// BenchmarkFormatSynthetic formats every file of the generated network,
// parsed once.
func BenchmarkFormatSynthetic(b *testing.B) {
	g := synthFiles(b)
	var files []*File
	for _, name := range g.Names {
		f, _ := Parse(name, g.Files[name])
		files = append(files, f)
	}
	b.SetBytes(int64(g.Bytes()))
	b.ReportAllocs()
	for b.Loop() {
		for _, f := range files {
			if len(Format(f)) == 0 && len(f.Statements) > 0 {
				b.Fatal("no output")
			}
		}
	}
}
