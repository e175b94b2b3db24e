package lang

import (
	"bytes"
	"runtime"
	"strings"
	"testing"
)

// parseBounded parses src and checks the result is bounded: no panic, a
// file, at most one diagnostic per source byte (plus one), statements in
// order, and Format not panicking.
func parseBounded(t *testing.T, src []byte) (*File, Diagnostics) {
	t.Helper()
	f, diags := Parse("r.hess", src)
	if f == nil {
		t.Fatal("Parse returned a nil file")
	}
	if len(diags) > len(src)+1 {
		t.Errorf("%d diagnostics for %d bytes", len(diags), len(src))
	}
	for _, d := range diags {
		if d.Subject.End.Offset > len(src) || d.Subject.Start.Offset > d.Subject.End.Offset {
			t.Fatalf("diagnostic %q outside the source: %+v", d.Message, d.Subject)
		}
	}
	_ = Format(f)
	return f, diags
}

func TestRobustMalformedUTF8(t *testing.T) {
	srcs := map[string]string{
		"lone continuation": "species \x80\x80(g)",
		"truncated rune":    "reaction r: A(g) \xe2\x87 B(g)",
		"overlong":          "species A(g) \"\xc0\xaf\"",
		"surrogate":         "# \xed\xa0\x80\nspecies A(g)",
		"bad tail":          "species A(g) { hf 1 kJ/mol }\xff",
		"all bytes":         allBytes(),
	}
	for name, src := range srcs {
		t.Run(name, func(t *testing.T) {
			_, diags := parseBounded(t, []byte(src))
			if !diags.HasErrors() {
				t.Error("malformed UTF-8 passed without an error")
			}
		})
	}
}

func allBytes() string {
	var b strings.Builder
	for i := 0; i < 256; i++ {
		b.WriteByte(byte(i))
	}
	return strings.Repeat(b.String(), 4)
}

func TestRobustNUL(t *testing.T) {
	for _, src := range []string{
		"\x00",
		strings.Repeat("\x00", 10000),
		"species A(g)\x00 { hf 1\x00 kJ/mol }",
		"\"\x00\" # \x00",
	} {
		_, diags := parseBounded(t, []byte(src))
		if !diags.HasErrors() {
			t.Errorf("NUL in %q passed without an error", src)
		}
		if len(diags) > maxLexDiagnostics+4 {
			t.Errorf("%d diagnostics for %d bytes", len(diags), len(src))
		}
	}
}

func TestRobustDeepNesting(t *testing.T) {
	const depth = 10000
	t.Run("parentheses in a species reference", func(t *testing.T) {
		ref := strings.Repeat("(", depth) + "CH4" + strings.Repeat(")", depth) + "(g)"
		src := "species " + ref + "\nreaction r: " + ref + " -> " + ref + "\n"
		f, diags := parseBounded(t, []byte(src))
		if len(diags) != 0 || len(f.Statements) != 2 {
			t.Fatalf("got %d statements and diagnostics:\n%s", len(f.Statements), diagList(diags))
		}
		if got := f.Statements[0].Species.Refs[0].Text; got != ref {
			t.Errorf("reference not kept whole (%d bytes)", len(got))
		}
		p, err := SplitRef(ref)
		if err != nil || p.State != "g" {
			t.Errorf("SplitRef: %+v, %v", p, err)
		}
		out := checkFormatted(t, "deep.hess", []byte(src))
		if !bytes.Contains(out, []byte(ref)) {
			t.Error("formatted output lost the reference")
		}
	})
	t.Run("braces", func(t *testing.T) {
		src := "species X(g) " + strings.Repeat("{", depth) + strings.Repeat("}", depth) + "\nspecies Y(g)\n"
		f, diags := parseBounded(t, []byte(src))
		if len(diags) != 1 {
			t.Fatalf("got diagnostics:\n%s", diagList(diags))
		}
		if len(f.Statements) != 2 || f.Statements[1].Broken {
			t.Errorf("the statement after the nesting was not read")
		}
	})
	t.Run("unclosed braces", func(t *testing.T) {
		src := "mixture m " + strings.Repeat("{ ", depth) + "\nreaction r: A -> B"
		f, diags := parseBounded(t, []byte(src))
		if len(diags) != 1 || len(f.Statements) != 2 || f.Statements[1].Broken {
			t.Errorf("got %d statements and diagnostics:\n%s", len(f.Statements), diagList(diags))
		}
	})
	t.Run("closing braces", func(t *testing.T) {
		src := strings.Repeat("}", depth) + " species A(g)"
		f, diags := parseBounded(t, []byte(src))
		if len(diags) != 1 || len(f.Statements) != 1 {
			t.Errorf("got %d statements and diagnostics:\n%s", len(f.Statements), diagList(diags))
		}
	})
}

func TestRobustNumbers(t *testing.T) {
	src := "species X(g) { hf 1e999 kJ/mol s -1e-999 J/mol/K cp 123456789012345678901234567890 J/mol/K }\n" +
		"reaction r: 99999999999999999999/3 A(g) -> 1e999 B(g) { logk 1e999 at 1e999 K }\n"
	f, diags := parseBounded(t, []byte(src))
	if len(diags) != 0 {
		t.Fatalf("diagnostics:\n%s", diagList(diags))
	}
	if got := f.Statements[0].Species.Props[0].Value.Value.Value.Text; got != "1e999" {
		t.Errorf("number kept as %q", got)
	}
	checkFormatted(t, "numbers.hess", []byte(src))
}

func TestRobustEmptyAndComments(t *testing.T) {
	for name, src := range map[string]string{
		"empty":            "",
		"white space":      " \t\r\n\n  ",
		"only comments":    "# one\n# two\n\n# three",
		"comment and CRLF": "# one\r\n\r\n",
		"many comments":    strings.Repeat("# demo comment\n", 10000),
	} {
		t.Run(name, func(t *testing.T) {
			f, diags := parseBounded(t, []byte(src))
			if len(diags) != 0 || len(f.Statements) != 0 {
				t.Errorf("got %d statements and diagnostics:\n%s", len(f.Statements), diagList(diags))
			}
			if want := strings.Count(src, "#"); len(f.Comments) != want {
				t.Errorf("got %d comments, want %d", len(f.Comments), want)
			}
			checkFormatted(t, name, []byte(src))
		})
	}
}

func TestRobustManyBrokenStatements(t *testing.T) {
	src := strings.Repeat("reaction r A -> B\nspecies A(g) {\n", 5000)
	f, diags := parseBounded(t, []byte(src))
	if len(diags) != 10000 || len(f.Statements) != 10000 {
		t.Errorf("got %d statements and %d diagnostics, want 10000 each", len(f.Statements), len(diags))
	}
}

func TestRobustLongLine(t *testing.T) {
	// One reaction with many terms on a single 2 MB line.
	var b strings.Builder
	b.WriteString("reaction big: A(g)")
	for i := 0; b.Len() < 2<<20; i++ {
		b.WriteString(" + 2 B(g)")
	}
	b.WriteString(" -> C(g)")
	f, diags := parseBounded(t, []byte(b.String()))
	if len(diags) != 0 || len(f.Statements) != 1 {
		t.Fatalf("got %d statements and diagnostics:\n%s", len(f.Statements), diagList(diags))
	}
	if got := f.Statements[0].Span().End.Column; got != b.Len()+1 {
		t.Errorf("end column %d, want %d", got, b.Len()+1)
	}
}

// TestRobustLargeFile parses a generated 50 MB network and checks the
// statement count and that the syntax tree's memory stays within a fixed
// multiple of the source size.
func TestRobustLargeFile(t *testing.T) {
	if testing.Short() {
		t.Skip("large file: skipped in -short mode")
	}
	if raceEnabled {
		t.Skip("large file: too slow under the race detector")
	}
	src, want := generateNetwork(50 << 20)
	runtime.GC()
	var before, after runtime.MemStats
	runtime.ReadMemStats(&before)
	f, diags := Parse("large.hess", src)
	runtime.GC()
	runtime.ReadMemStats(&after)
	if len(diags) != 0 {
		t.Fatalf("%d diagnostics, first: %s", len(diags), diagList(diags[:1]))
	}
	if len(f.Statements) != want {
		t.Fatalf("%d statements, want %d", len(f.Statements), want)
	}
	last := f.Statements[len(f.Statements)-1]
	if end := last.Span().End.Offset; end > len(src) || end < len(src)-2 {
		t.Errorf("last statement ends at %d of %d bytes", end, len(src))
	}
	retained := int64(after.HeapAlloc) - int64(before.HeapAlloc)
	perByte := float64(retained) / float64(len(src))
	t.Logf("%d bytes, %d statements, syntax tree %.0f MB (%.1f bytes per source byte)", len(src), want, float64(retained)/(1<<20), perByte)
	if perByte > 64 {
		t.Errorf("syntax tree takes %.1f bytes per source byte, more than 64", perByte)
	}
	runtime.KeepAlive(f)
	runtime.KeepAlive(src)
}
