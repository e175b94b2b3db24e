package lsp

import (
	"strings"
	"testing"

	"hess/synth"
)

// BenchmarkEditToDiagnosticsSynthetic is one keystroke on a generated
// 5 000-reaction document (1 000 species with NASA 7-term data, 500
// reactions with own data and rates, all in one file): the edit toggles a
// coefficient on one reaction line, unbalancing it, and the round ends when
// the client has the new diagnostics.
func BenchmarkEditToDiagnosticsSynthetic(b *testing.B) {
	g, err := synth.Generate(synth.Config{Seed: 1, Species: 1000, Reactions: 5000, OwnData: 500, Files: 1})
	if err != nil {
		b.Fatal(err)
	}
	text := string(g.Files[g.Root])
	lines := strings.Split(text, "\n")
	line := -1
	for i := len(lines) - 1; i >= 0; i-- {
		if strings.HasPrefix(lines[i], "reaction ") && !strings.HasSuffix(lines[i], "{") {
			line = i
			break
		}
	}
	if line < 0 {
		b.Fatal("no plain reaction line")
	}
	at := uint32(strings.Index(lines[line], ": ") + 2)
	uri := fileURI(b.TempDir(), "mechanism.hess")
	c := startServer(b, Options{})
	c.initialize()
	c.open(uri, text, 1)
	base := len(c.waitDiagnostics(uri, atVersion(1)).Diagnostics)
	b.ReportMetric(float64(len(text))/1e6, "MB/doc")
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		v := int32(i + 2)
		if i%2 == 0 {
			c.change(uri, v, insert(pos(uint32(line), at), "2 "))
		} else {
			c.change(uri, v, TextDocumentContentChangeEvent{Range: &Range{Start: pos(uint32(line), at), End: pos(uint32(line), at+2)}})
		}
		p := c.waitDiagnostics(uri, atVersion(v))
		if broken := i%2 == 0; broken != (len(p.Diagnostics) > base) {
			b.Fatalf("round %d: %d diagnostics, %d before the edit", i, len(p.Diagnostics), base)
		}
	}
}
