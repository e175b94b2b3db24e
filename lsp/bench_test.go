package lsp

import (
	"fmt"
	"strings"
	"testing"

	"hess/network"
)

// bigNetwork writes a demo network of a hydrocracking unit with the given
// number of reactions: alkane isomer groups C_nH_2n+2 (ten isomers each)
// that interconvert, and hydrocracking steps C_n + H2 -> C_a + C_(n-a).
// Its last line is a reaction whose coefficient the benchmark toggles.
func bigNetwork(reactions int) string {
	var b strings.Builder
	b.WriteString("# Hydrocracking unit, isomer and cracking network (generated demo data)\n")
	b.WriteString("settings {\n  temperatures 298.15 K, 600 K to 800 K by 100 K\n}\n\n")
	b.WriteString("species H2(g) \"hydrogen\" {\n  hf 0 kJ/mol\n  s 130.68 J/mol/K\n  cp 28.8 J/mol/K\n}\n")
	const isomers = 10
	var rx strings.Builder
	n, groups := 0, 3
	emit := func(g int, format string, args ...any) {
		if n < reactions-1 {
			fmt.Fprintf(&rx, "reaction r%d: "+format+"\n", append([]any{n}, args...)...)
			n++
			groups = max(groups, g)
		}
	}
	for g := 1; n < reactions-1; g++ {
		for i := 0; i < isomers; i++ {
			for j := i + 1; j < isomers; j++ {
				emit(g, "c%di%d(g) <-> c%di%d(g)", g, i, g, j)
			}
		}
		for a := 1; a <= 5 && a < g; a++ {
			emit(g, "c%di%d(g) + H2(g) <-> c%di%d(g) + c%di%d(g)", g, a%isomers, a, 0, g-a, 1)
		}
	}
	for g := 1; g <= groups; g++ {
		for i := 0; i < isomers; i++ {
			fmt.Fprintf(&b, "species c%di%d(g) {\n  formula C%dH%d\n  hf %.2f kJ/mol\n  s %.2f J/mol/K\n  cp %.1f J/mol/K\n}\n",
				g, i, g, 2*g+2, -20.0*float64(g)-0.7*float64(i), 150+40*float64(g)+0.5*float64(i), 20+20*float64(g))
		}
	}
	b.WriteString(rx.String())
	b.WriteString("reaction last: c3i0(g) + H2(g) <-> c1i0(g) + c2i0(g)\n")
	return b.String()
}

// BenchmarkEditToDiagnostics measures one keystroke on a 5 000-reaction
// document: an incremental change sent, the document compiled, and its
// diagnostics received by the client. The edit toggles an element
// imbalance on the last line, so every round publishes a changed list.
func BenchmarkEditToDiagnostics(b *testing.B) {
	dir := b.TempDir()
	text := bigNetwork(5000)
	uri := fileURI(dir, "unit.hess")
	c := startServer(b, Options{})
	c.initialize()
	c.open(uri, text, 1)
	// Its species hold data near 298 K only, so the settings' higher
	// temperatures give extrapolation warnings: those are the baseline.
	base := len(c.waitDiagnostics(uri, atVersion(1)).Diagnostics)
	last := uint32(strings.Count(text, "\n") - 1)
	at := uint32(len("reaction last: "))
	b.ReportMetric(float64(len(text))/1e6, "MB/doc")
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		v := int32(i + 2)
		if i%2 == 0 {
			c.change(uri, v, insert(pos(last, at), "2 "))
		} else {
			c.change(uri, v, TextDocumentContentChangeEvent{Range: &Range{Start: pos(last, at), End: pos(last, at+2)}})
		}
		p := c.waitDiagnostics(uri, atVersion(v))
		if broken := i%2 == 0; broken != (len(p.Diagnostics) > base) {
			b.Fatalf("round %d: %d diagnostics, %d before the edit", i, len(p.Diagnostics), base)
		}
	}
}

// BenchmarkCompileOnly compiles the same 5 000-reaction document without
// the server, for the share of BenchmarkEditToDiagnostics that is the
// compiler's.
func BenchmarkCompileOnly(b *testing.B) {
	text := []byte(bigNetwork(5000))
	src := network.Overlay{Files: map[string][]byte{"/w/unit.hess": text}, Base: noFiles{}}
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		if net := network.Load("/w/unit.hess", src, network.Options{}); len(net.Reactions) != 5000 {
			b.Fatalf("%d reactions", len(net.Reactions))
		}
	}
}
