package lang

import (
	"math/rand/v2"
	"strings"
	"testing"
	"unicode/utf8"
	"unsafe"
)

// TestSourcePositions resolves offsets of texts with short and long lines,
// non-ASCII and invalid bytes and a byte order mark through a Source, in
// and out of file order, and compares with counting from the start.
func TestSourcePositions(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	mixed := []string{"a", "bc ", "Δ", "⇌", "\xff", "\xe2\x87", "\n", "\r\n", "\t", "µ"}
	ascii := []string{"a", "bc ", "\n", "\r\n", "\t", "\n", "(g)", "\n"}
	for _, n := range []int{0, 1, 10, 3 * markEvery, 8 * markEvery} {
		for _, c := range []struct {
			bom    bool
			pieces []string
		}{{false, mixed}, {true, mixed}, {false, ascii}, {true, ascii}} {
			bom, pieces := c.bom, c.pieces
			var b strings.Builder
			if bom {
				b.WriteString("\ufeff")
			}
			for b.Len() < n {
				p := pieces[r.IntN(len(pieces))]
				if (p == "\n" || p == "\r\n") && n > markEvery && r.IntN(50) != 0 {
					p = "x" // long lines
				}
				b.WriteString(p)
			}
			text := b.String()
			src := NewSource("s.hess", text)
			check := func(off int) {
				if bom && off < 3 {
					return // inside the byte order mark
				}
				line, col := posAt([]byte(text), off)
				if p := src.Pos(off); p.Line != line || p.Column != col || p.Offset != off {
					t.Fatalf("n=%d bom=%v: offset %d resolves to %d:%d, want %d:%d", n, bom, off, p.Line, p.Column, line, col)
				}
			}
			for off := 0; off <= len(text); off += 1 + r.IntN(97) {
				check(off)
			}
			for range 200 {
				check(r.IntN(len(text) + 1))
			}
			// A span from one token to another ends after the second.
			for range 200 {
				a, c := r.IntN(len(text)+1), r.IntN(len(text)+1)
				a, c = min(a, c), max(a, c)
				if a < 3 && bom || a < len(text) && !utf8.RuneStart(text[a]) || c < len(text) && !utf8.RuneStart(text[c]) {
					continue // tokens start after the mark, at rune starts
				}
				_, size := utf8.DecodeRuneInString(text[c:])
				last := Token{Value: text[c : c+size], Offset: int32(c)}
				s := src.span(Token{Offset: int32(a)}, last)
				line, col := posAt([]byte(text), a)
				if s.Start != (Pos{line, col, a}) {
					t.Fatalf("span start %+v, want %d:%d@%d", s.Start, line, col, a)
				}
				line, col = posAt([]byte(text), c)
				col += len([]rune(last.Value))
				if s.End != (Pos{line, col, c + len(last.Value)}) {
					t.Fatalf("span end %+v, want %d:%d@%d", s.End, line, col, c+len(last.Value))
				}
			}
		}
	}
}

// TestCompactSizes keeps tokens and node headers compact: the token
// arrays and nodes are most of a parsed file's memory.
func TestCompactSizes(t *testing.T) {
	if n := unsafe.Sizeof(Token{}); n > 24 {
		t.Errorf("a Token takes %d bytes, want at most 24", n)
	}
	if n := unsafe.Sizeof(Node{}); n > 16 {
		t.Errorf("a Node takes %d bytes, want at most 16", n)
	}
}
