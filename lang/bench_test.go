package lang

import (
	"bytes"
	"fmt"
	"testing"
	"time"
)

// generateNetwork writes a demo network of about size bytes: species with
// data, plain and coupled reactions, reactions with rate blocks, mixtures
// and comments, all invented. It returns the source and its statement count.
func generateNetwork(size int) ([]byte, int) {
	var b bytes.Buffer
	b.Grow(size + 512)
	b.WriteString("# generated demo network (invented data)\nsettings {\n  pressure 1 bar\n  temperatures 298.15 K, 500 K to 1500 K by 100 K\n}\n")
	n := 1
	for i := 0; b.Len() < size; i++ {
		switch i % 8 {
		case 0:
			fmt.Fprintf(&b, "species S%d(g) \"demo %d\" {\n  hf %d.%02d ± 0.5 kJ/mol  # invented\n  s %d.5 J/mol/K\n  cp 29.1 J/mol/K\n}\n", i, i, -(i % 400), i%100, 100+i%150)
		case 1:
			fmt.Fprintf(&b, "species T%d(g) {\n  shomate 298 K to 1200 K {\n    30.1 6.83 6.79 -2.53\n    0.082 -250.9 223.4 -241.8\n  }\n}\n", i)
		case 2, 3, 5:
			fmt.Fprintf(&b, "reaction r%d: S%d(g) + 2 H2O(g) <-> CO2(g) + 4 H2(g)\n", i, i-2)
		case 4:
			fmt.Fprintf(&b, "reaction r%d: CH4(g) + 1/2 O2(g) -> CO(g) + 2 H2(g) {\n  rate A 3.5e15 cm3/mol/s n -0.5 Ea 80 kJ/mol\n  logk 12.5 at 1000 K\n}\n", i)
		case 6:
			fmt.Fprintf(&b, "# coupled step %d\nreaction c%d: S%d(g) + 4 H2O(g) <-> 2 CO2(g) + 8 H2(g) = r%d + r%d\n", i, i, i-6, i-4, i-3)
		case 7:
			fmt.Fprintf(&b, "mixture m%d {\n  temperature 900 K\n  pressure 20 bar\n  CH4(g) 0.2\n  H2O(g) 0.6\n  H2(g) 2 bar\n}\n", i)
		}
		n++
	}
	return b.Bytes(), n
}

func TestGenerateNetworkParses(t *testing.T) {
	src, n := generateNetwork(64 << 10)
	f := parseOK(t, string(src))
	if len(f.Statements) != n {
		t.Fatalf("%d statements, want %d", len(f.Statements), n)
	}
	checkFormatted(t, "generated.hess", src)
}

// reportCPU adds the process CPU time per operation since start (all
// threads, garbage collection included) to a benchmark's results.
func reportCPU(b *testing.B, start time.Duration) {
	if now, ok := processCPU(); ok {
		b.ReportMetric(float64(now-start)/float64(b.N)/1e6, "cpu-ms/op")
	}
}

func BenchmarkLex(b *testing.B) {
	src, _ := generateNetwork(1 << 20)
	b.SetBytes(int64(len(src)))
	b.ReportAllocs()
	b.ResetTimer()
	start, _ := processCPU()
	for i := 0; i < b.N; i++ {
		toks, _, _ := Lex("bench.hess", src)
		if len(toks) < 2 {
			b.Fatal("no tokens")
		}
	}
	reportCPU(b, start)
}

func BenchmarkParse(b *testing.B) {
	src, n := generateNetwork(1 << 20)
	b.SetBytes(int64(len(src)))
	b.ReportAllocs()
	b.ResetTimer()
	start, _ := processCPU()
	for i := 0; i < b.N; i++ {
		f, diags := Parse("bench.hess", src)
		if len(diags) != 0 || len(f.Statements) != n {
			b.Fatalf("%d statements, %d diagnostics", len(f.Statements), len(diags))
		}
	}
	reportCPU(b, start)
}

func BenchmarkFormat(b *testing.B) {
	src, _ := generateNetwork(1 << 20)
	f, _ := Parse("bench.hess", src)
	b.SetBytes(int64(len(src)))
	b.ReportAllocs()
	b.ResetTimer()
	start, _ := processCPU()
	for i := 0; i < b.N; i++ {
		if len(Format(f)) == 0 {
			b.Fatal("no output")
		}
	}
	reportCPU(b, start)
}
