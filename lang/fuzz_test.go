package lang

import (
	"bytes"
	"fmt"
	"strings"
	"testing"
	"unicode/utf8"
)

// posAt computes the line and column (in code points) of byte offset off;
// a leading byte order mark takes no column.
func posAt(src []byte, off int) (line, col int) {
	line, col = 1, 1
	i := 0
	if bytes.HasPrefix(src, []byte("\ufeff")) && off >= 3 {
		i = 3
	}
	for i < off {
		if src[i] == '\n' {
			line++
			col = 1
			i++
			continue
		}
		_, w := utf8.DecodeRune(src[i:off])
		i += w
		col++
	}
	return line, col
}

// checkLex checks the lexer's promises on src: tokens come in order without
// overlap, each token's value is the source text at its offset, positions
// agree with the offsets, and every byte not in a token or comment is white
// space or reported by a diagnostic.
func checkLex(t *testing.T, src []byte) {
	toks, comments, diags := Lex("f.hess", src)
	source := NewSource("f.hess", string(src))
	if len(toks) == 0 || toks[len(toks)-1].Type != EOF {
		t.Fatalf("token list does not end with EOF")
	}
	covered := make([]bool, len(src))
	mark := func(from, to int, what string) {
		if from < 0 || to > len(src) || from > to {
			t.Fatalf("%s range %d..%d outside the source (%d bytes)", what, from, to, len(src))
		}
		for i := from; i < to; i++ {
			covered[i] = true
		}
	}
	end := 0
	if bytes.HasPrefix(src, []byte("\ufeff")) {
		mark(0, 3, "byte order mark")
		end = 3
	}
	for i, k := range toks {
		off := int(k.Offset)
		if off < end {
			t.Fatalf("token %d %q at %d overlaps the previous token ending at %d", i, k.Value, off, end)
		}
		if off+len(k.Value) > len(src) || string(src[off:off+len(k.Value)]) != k.Value {
			t.Fatalf("token %d %q is not the source text at offset %d", i, k.Value, off)
		}
		if k.Type != EOF && k.Value == "" {
			t.Fatalf("token %d at %d is empty", i, off)
		}
		if line, col := posAt(src, off); source.Pos(off).Line != line || source.Pos(off).Column != col {
			p := source.Pos(off)
			t.Fatalf("token %d %q at offset %d says %d:%d, want %d:%d", i, k.Value, off, p.Line, p.Column, line, col)
		}
		if s := source.Span(k); s.End.Offset != off+len(k.Value) {
			t.Fatalf("token %d span ends at %d", i, s.End.Offset)
		}
		mark(off, off+len(k.Value), "token")
		end = off + len(k.Value)
	}
	if eof := toks[len(toks)-1]; int(eof.Offset) != len(src) {
		t.Fatalf("EOF at offset %d, want %d", eof.Offset, len(src))
	}
	for _, c := range comments {
		s := c.Span
		if s.Start.Offset < 0 || s.End.Offset > len(src) || string(src[s.Start.Offset:s.End.Offset]) != c.Text || c.Text == "" || c.Text[0] != '#' {
			t.Fatalf("comment %q does not match the source at %d..%d", c.Text, s.Start.Offset, s.End.Offset)
		}
		mark(s.Start.Offset, s.End.Offset, "comment")
	}
	for _, d := range diags {
		if d.Code != "syntax" || d.Severity != Error || d.Message == "" {
			t.Fatalf("bad lexer diagnostic %+v", d)
		}
		mark(d.Subject.Start.Offset, d.Subject.End.Offset, "diagnostic")
	}
	checked := len(src)
	for _, d := range diags {
		if strings.HasPrefix(d.Message, "too many invalid characters") {
			// Past the cap bad bytes are skipped without a report.
			checked = d.Subject.Start.Offset
		}
	}
	for i, ok := range covered[:checked] {
		if !ok && !isSpace(src[i]) {
			t.Fatalf("byte %d (%q) is in no token, comment or diagnostic", i, src[i])
		}
	}
}

func FuzzLex(f *testing.F) {
	f.Add([]byte("species CO2(g) { hf -393.51 ± 0.13 kJ/mol } # c"))
	f.Fuzz(func(t *testing.T, src []byte) { checkLex(t, src) })
}

func FuzzParse(f *testing.F) {
	f.Add([]byte("reaction r: A(g) + 2 B(g) <-> C(g) = x - 1/2 y { logk 3 at 300 K }"))
	f.Fuzz(func(t *testing.T, src []byte) {
		file, diags := Parse("f.hess", src)
		if file == nil {
			t.Fatal("Parse returned a nil file")
		}
		for _, d := range diags {
			s := d.Subject
			if !s.IsValid() || s.Start.Offset < 0 || s.End.Offset > len(src) || s.Start.Offset > s.End.Offset {
				t.Fatalf("diagnostic %q has span %+v outside the source (%d bytes)", d.Message, s, len(src))
			}
			if d.Message == "" || d.Severity != Error {
				t.Fatalf("bad diagnostic %+v", d)
			}
		}
		prev := 0
		for i, st := range file.Statements {
			if st == nil || len(st.Tokens()) == 0 {
				t.Fatalf("statement %d is empty", i)
			}
			s := st.Span()
			if s.Start.Offset < prev || s.End.Offset > len(src) {
				t.Fatalf("statement %d span %+v out of order", i, s)
			}
			prev = s.End.Offset
			if !st.Broken && !diags.HasErrors() && file.Statements[i].Position().Offset != s.Start.Offset {
				t.Fatalf("statement %d position disagrees with its span", i)
			}
		}
		if !diags.HasErrors() {
			for i, st := range file.Statements {
				if st.Broken {
					t.Fatalf("statement %d is broken without an error", i)
				}
			}
		}
		_ = Format(file) // must not panic, even on broken statements
		checkConformance(t, src)
	})
}

func FuzzFormat(f *testing.F) {
	f.Add([]byte("species Fe+++(aq) # c\nreaction r: Fe+++(aq) + e- ⇌ Fe++(aq)\n"))
	f.Fuzz(func(t *testing.T, src []byte) {
		file, diags := Parse("f.hess", src)
		if diags.HasErrors() {
			return
		}
		out := Format(file)
		again, diags := Parse("f.hess", out)
		if len(diags) != 0 {
			t.Fatalf("formatted output does not parse:\n%s\ninput %q\noutput %q", diagList(diags), src, out)
		}
		out2 := Format(again)
		if !bytes.Equal(out, out2) {
			t.Fatalf("formatting is not idempotent\ninput %q\nonce  %q\ntwice %q", src, out, out2)
		}
		if a, b := fmt.Sprintf("%q", commentTexts(file)), fmt.Sprintf("%q", commentTexts(again)); a != b {
			t.Fatalf("comments changed\ninput %q\noutput %q\nbefore %s\nafter  %s", src, out, a, b)
		}
		if len(file.Statements) != len(again.Statements) {
			t.Fatalf("%d statements became %d\ninput %q\noutput %q", len(file.Statements), len(again.Statements), src, out)
		}
	})
}
