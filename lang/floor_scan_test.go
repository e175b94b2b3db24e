package lang

import (
	"testing"
)

// tokenCounts counts a scan's tokens by kind.
type tokenCounts struct{ words, numbers, strings, puncts, comments, lines int }

func (c tokenCounts) total() int { return c.words + c.numbers + c.strings + c.puncts }

// floorScan is the least a lexer of the language must do: one pass over
// the bytes that finds where each token starts and ends and whether it is a
// word, a number, a string or punctuation, skipping comments, with no
// allocation, no positions kept, no keyword lookup and no validation. It
// is the floor BenchmarkScanFloorSynthetic measures, not a lexer: it does
// not report errors or decode UTF-8.
func floorScan(src []byte) tokenCounts {
	var c tokenCounts
	for i := 0; i < len(src); {
		switch b := src[i]; b {
		case ' ', '\t', '\r':
			i++
		case '\n':
			c.lines++
			i++
		case '#':
			c.comments++
			for i < len(src) && src[i] != '\n' {
				i++
			}
		case '"':
			c.strings++
			for i++; i < len(src) && src[i] != '"' && src[i] != '\n'; i++ {
			}
			if i < len(src) && src[i] == '"' {
				i++
			}
		case '{', '}', ':', ',', '=':
			c.puncts++
			i++
		default:
			start := i
			for i < len(src) && !floorStops(src[i]) {
				i++
			}
			w := src[start:i]
			switch {
			case len(w) <= 3 && (w[0] == '+' || w[0] == '-' || w[0] == '<') && (len(w) == 1 || w[len(w)-1] == '>'):
				c.puncts++ // + - -> <->
			case floorNumber(w):
				c.numbers++
			default:
				c.words++
			}
		}
	}
	return c
}

// floorNumber reports whether a run is a number: it starts with a digit,
// a point or a sign before one, and holds only what numbers and fractions
// are written with (so 1/s is a word).
func floorNumber(w []byte) bool {
	d := w
	if d[0] == '-' || d[0] == '+' {
		d = d[1:]
	}
	if len(d) == 0 || !(d[0] >= '0' && d[0] <= '9' || d[0] == '.') {
		return false
	}
	for _, b := range d {
		if !(b >= '0' && b <= '9' || b == '.' || b == 'e' || b == 'E' || b == '+' || b == '-' || b == '/') {
			return false
		}
	}
	return true
}

// floorStops reports whether b ends a word or number.
func floorStops(b byte) bool {
	switch b {
	case ' ', '\t', '\r', '\n', '{', '}', ':', ',', '=', '#', '"':
		return true
	}
	return false
}

// TestFloorScanCountsTokens keeps the floor honest: on the generated
// networks it must find the tokens the lexer finds, kind by kind.
func TestFloorScanCountsTokens(t *testing.T) {
	for _, c := range scaleNetworks {
		c.Species, c.Reactions, c.OwnData = 200, 1000, c.OwnData/50
		g := generate(t, c)
		for _, name := range g.Names {
			toks, _, diags := Lex(name, g.Files[name])
			if len(diags) != 0 {
				t.Fatalf("%s: %v", name, diags[0])
			}
			var want tokenCounts
			for _, tok := range toks {
				switch tok.Type {
				case Word, Ref, Keyword:
					want.words++
				case Number:
					want.numbers++
				case String:
					want.strings++
				case Punct:
					want.puncts++
				case EOF:
				default:
					t.Fatalf("token type %d", tok.Type)
				}
			}
			got := floorScan(g.Files[name])
			got.comments, got.lines = 0, 0
			if got != want {
				t.Errorf("%v %s: floor counted %+v, the lexer %+v", c.Shape, name, got, want)
			}
		}
	}
}
