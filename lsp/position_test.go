package lsp

import (
	"bytes"
	"math/rand/v2"
	"path/filepath"
	"slices"
	"testing"
	"unicode/utf16"
	"unicode/utf8"
)

func TestPositions(t *testing.T) {
	// Line 0 holds a two-byte, a three-byte and a four-byte character;
	// lines end in \n, \r\n and a lone \r.
	text := []byte("aé⇌𝑂b\nxy\r\nz\rlast")
	ix := newLines(text)
	cases := []struct {
		offset int
		u16    Position
		u8     Position
	}{
		{0, pos(0, 0), pos(0, 0)},
		{1, pos(0, 1), pos(0, 1)},   // after a
		{3, pos(0, 2), pos(0, 3)},   // after é
		{6, pos(0, 3), pos(0, 6)},   // after ⇌
		{10, pos(0, 5), pos(0, 10)}, // after 𝑂: two UTF-16 units
		{11, pos(0, 6), pos(0, 11)}, // after b, before \n
		{12, pos(1, 0), pos(1, 0)},
		{14, pos(1, 2), pos(1, 2)}, // before \r\n
		{15, pos(1, 2), pos(1, 2)}, // between \r and \n: end of the line
		{16, pos(2, 0), pos(2, 0)},
		{18, pos(3, 0), pos(3, 0)}, // after the lone \r
		{22, pos(3, 4), pos(3, 4)}, // end of text
		{99, pos(3, 4), pos(3, 4)}, // beyond: end of text
		{-5, pos(0, 0), pos(0, 0)},
		{8, pos(0, 3), pos(0, 8)}, // inside 𝑂: UTF-16 counts what precedes it
	}
	for _, c := range cases {
		if got := ix.position(c.offset, encUTF16); got != c.u16 {
			t.Errorf("utf-16 position of offset %d: %+v, want %+v", c.offset, got, c.u16)
		}
		if got := ix.position(c.offset, encUTF8); got != c.u8 {
			t.Errorf("utf-8 position of offset %d: %+v, want %+v", c.offset, got, c.u8)
		}
	}
	back := []struct {
		p    Position
		enc  encoding
		want int
	}{
		{pos(0, 5), encUTF16, 10},
		{pos(0, 4), encUTF16, 6}, // inside the surrogate pair: start of 𝑂
		{pos(0, 50), encUTF16, 11},
		{pos(1, 9), encUTF16, 14}, // past the line's end: before \r\n
		{pos(9, 0), encUTF16, len(text)},
		{pos(0, 8), encUTF8, 6}, // inside 𝑂's bytes: start of 𝑂
		{pos(0, 2), encUTF8, 1}, // inside é
		{pos(3, 2), encUTF8, 20},
	}
	for _, c := range back {
		if got := ix.offset(c.p, c.enc); got != c.want {
			t.Errorf("%s offset of %+v: %d, want %d", c.enc.name(), c.p, got, c.want)
		}
	}
}

// TestPositionsRoundTrip checks every character boundary of a mixed text
// against the standard library's UTF-16 encoder.
func TestPositionsRoundTrip(t *testing.T) {
	text := []byte("species O2(g) \"𝑂₂ — oxygen\" {\r\n  hf 0 kJ/mol\n}\rreaction r: A ⇌ B\xff!\n")
	ix := newLines(text)
	line, lineStart := 0, 0
	for off := 0; off <= len(text); {
		prefix := []rune(string(text[lineStart:off]))
		want := Position{Line: uint32(line), Character: uint32(len(utf16.Encode(prefix)))}
		if got := ix.position(off, encUTF16); got != want {
			t.Fatalf("position of %d: %+v, want %+v", off, got, want)
		}
		if got := ix.offset(want, encUTF16); got != off {
			t.Fatalf("offset of %+v: %d, want %d", want, got, off)
		}
		if got := ix.offset(ix.position(off, encUTF8), encUTF8); got != off {
			t.Fatalf("utf-8 round trip of %d gives %d", off, got)
		}
		if off == len(text) {
			break
		}
		switch text[off] {
		case '\n':
			off++
			line, lineStart = line+1, off
			continue
		case '\r':
			off++
			if off < len(text) && text[off] == '\n' {
				off++
			}
			line, lineStart = line+1, off
			continue
		}
		_, size := utf8.DecodeRune(text[off:])
		off += size
	}
}

func TestNegotiate(t *testing.T) {
	if e := negotiate(nil); e != encUTF16 {
		t.Errorf("no offer: %s, want utf-16", e.name())
	}
	if e := negotiate([]string{"utf-32", "utf-16"}); e != encUTF16 {
		t.Errorf("utf-32, utf-16: %s, want utf-16", e.name())
	}
	if e := negotiate([]string{"utf-16", "utf-8"}); e != encUTF8 {
		t.Errorf("utf-8 offered: %s, want utf-8", e.name())
	}
}

func TestURIs(t *testing.T) {
	for _, path := range []string{"/tmp/plant.hess", "/tmp/a dir/ü#1.hess"} {
		uri := pathToURI(path)
		got, err := uriToPath(uri)
		if err != nil || got != path {
			t.Errorf("%s -> %s -> %s, %v", path, uri, got, err)
		}
	}
	if got, err := uriToPath("file:///tmp/a%20b/x.hess"); err != nil || got != "/tmp/a b/x.hess" {
		t.Errorf("escaped URI: %q, %v", got, err)
	}
	a, errA := uriToPath("untitled:Untitled-1")
	b, errB := uriToPath("untitled:Untitled-2")
	if errA != nil || errB != nil || a == b || !filepath.IsAbs(a) || filepath.Base(filepath.Dir(a)) != untitledDir {
		t.Errorf("untitled buffers: %q, %v; %q, %v", a, errA, b, errB)
	}
	for _, bad := range []string{"untitled:", "git:/x.hess", "file://elsewhere/x.hess", "file:x.hess", "%zz"} {
		if _, err := uriToPath(bad); err == nil {
			t.Errorf("%q accepted", bad)
		}
	}
}

// TestNewLinesFastPath checks the index of a text without carriage
// returns, found with bytes.IndexByte, against a byte-by-byte count.
func TestNewLinesFastPath(t *testing.T) {
	r := rand.New(rand.NewPCG(3, 4))
	for n := range 300 {
		text := make([]byte, n)
		for i := range text {
			text[i] = "ab\n é"[r.IntN(5)]
		}
		want := []int{0}
		for i, c := range text {
			if c == '\n' {
				want = append(want, i+1)
			}
		}
		if got := newLines(text).starts; !slices.Equal(got, want) {
			t.Fatalf("%q: line starts %v, want %v", text, got, want)
		}
	}
}

// TestEditedLinesMatchNew makes random edits with every kind of line end
// and text beyond ASCII, and checks that each edited index is the one
// newLines gives.
func TestEditedLinesMatchNew(t *testing.T) {
	pieces := []string{"\n", "\r", "\r\n", "a", "é", "😀", "xy", "", "\n\r"}
	r := rand.New(rand.NewPCG(5, 6))
	for round := range 50 {
		var text []byte
		for range r.IntN(40) {
			text = append(text, pieces[r.IntN(len(pieces))]...)
		}
		ix := newLines(text)
		for range 60 {
			from := r.IntN(len(text) + 1)
			to := from + r.IntN(len(text)-from+1)
			var ins []byte
			for range r.IntN(4) {
				ins = append(ins, pieces[r.IntN(len(pieces))]...)
			}
			next := append(append(append([]byte(nil), text[:from]...), ins...), text[to:]...)
			ix = ix.edited(next, from, to, len(ins))
			if want := newLines(next); !slices.Equal(ix.starts, want.starts) || !bytes.Equal(ix.text, next) {
				t.Fatalf("round %d: %q with [%d, %d) replaced by %q: starts %v, want %v", round, text, from, to, ins, ix.starts, want.starts)
			}
			text = next
		}
	}
}
