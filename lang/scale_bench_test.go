package lang

import (
	"testing"

	"hess/synth"
)

// synthFiles generates the network of 10 000 species and 50 000 reactions
// (5 000 with own data) that the scale benchmarks share.
func synthFiles(b *testing.B) *synth.Network {
	b.Helper()
	g, err := synth.Generate(synth.Config{Seed: 1, Species: 10000, Reactions: 50000, OwnData: 5000, Files: 4})
	if err != nil {
		b.Fatal(err)
	}
	return g
}

// BenchmarkParseSynthetic lexes and parses every file of the generated
// mechanism-sized network.
func BenchmarkParseSynthetic(b *testing.B) {
	g := synthFiles(b)
	b.SetBytes(int64(g.Bytes()))
	b.ReportAllocs()
	for b.Loop() {
		for _, name := range g.Names {
			if _, diags := Parse(name, g.Files[name]); len(diags) != 0 {
				b.Fatalf("%s: %v", name, diags[0])
			}
		}
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
