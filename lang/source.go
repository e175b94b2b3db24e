package lang

import (
	"math"
	"strings"
	"sync/atomic"
	"unicode/utf8"

	"github.com/alecthomas/participle/v2/lexer"
)

// MaxSourceBytes is the largest source file the lexer reads: token offsets
// are 32-bit. Callers that read files (package network) set far lower
// limits of their own.
const MaxSourceBytes = math.MaxInt32

// A Source is one source file as its syntax tree sees it: its name, its
// text, and where its lines start, from which a token's offset resolves to
// a line and column only when a span is asked for. Every node of a parsed
// file points to the file's Source. A Source does not change once built.
type Source struct {
	name string
	text string
	// gen is the number of the cached parse that made the source (see
	// Cache): how old the statements that still resolve through it are.
	gen   int
	lines []int32 // offset where each line starts; line 1 starts after a byte order mark
	// wide has a bit set for each line that holds a byte outside ASCII,
	// whose columns are counted rune by rune; on the others a column
	// is a byte count.
	wide  []uint64
	marks []colMark
	// hint is the line last resolved: spans are mostly asked for in file
	// order, so the next is often on it or the line after.
	hint atomic.Int32
}

// colMark is the column of a rune start inside a long line, so that
// resolving a position there counts the runes of at most markEvery bytes.
type colMark struct{ off, col int32 }

// markEvery is how many bytes of a long line lie between column marks.
const markEvery = 4096

// NewSource indexes the lines of text, a file called name. text must be at
// most MaxSourceBytes long.
func NewSource(name, text string) *Source {
	s := &Source{name: name, text: text}
	start := 0
	if strings.HasPrefix(text, "\ufeff") {
		// A byte order mark some editors write is not part of the text;
		// columns count from after it.
		start = 3
	}
	n := strings.Count(text, "\n") + 1
	s.lines = make([]int32, 0, n)
	s.wide = make([]uint64, (n+63)/64)
	for {
		line := len(s.lines)
		s.lines = append(s.lines, int32(start))
		i := strings.IndexByte(text[start:], '\n')
		end := len(text)
		if i >= 0 {
			end = start + i
		}
		if !isASCII(text[start:end]) {
			s.wide[line/64] |= 1 << (line % 64)
			if end-start > markEvery {
				s.markLine(start, end)
			}
		}
		if i < 0 {
			return s
		}
		start = end + 1
	}
}

// edited is the Source of text, the text of s changed where edit says,
// under s's name: the lines before the edit keep their index entries, the
// lines after it take s's shifted, and only the lines the edit touched are
// indexed again — what NewSource(s.Name(), text) gives
// (TestEditedSourceMatchesNew), without reading the whole text. A source
// with column marks (long lines beyond ASCII), or an edit that makes one,
// or one in a byte order mark, is indexed whole.
func (s *Source) edited(text string, edit textEdit) *Source {
	p := edit.prefix
	oldEnd, newEnd := len(s.text)-edit.suffix, len(text)-edit.suffix
	if len(s.marks) > 0 || p < 3 || oldEnd < p || newEnd < p {
		return NewSource(s.name, text)
	}
	d := newEnd - oldEnd
	first := s.line(p) // the first line the edit touches; its start is before p
	// Lines after the edit: those old lines that start after oldEnd.
	after := s.search(oldEnd) + 1
	n := &Source{name: s.name, text: text}
	n.lines = make([]int32, 0, len(s.lines)+strings.Count(text[s.lines[first]:newEnd], "\n")-strings.Count(s.text[s.lines[first]:oldEnd], "\n"))
	n.lines = append(n.lines, s.lines[:first+1]...)
	for at := int(s.lines[first]); ; {
		i := strings.IndexByte(text[at:newEnd], '\n')
		if i < 0 {
			break
		}
		at += i + 1
		n.lines = append(n.lines, int32(at))
	}
	touched := len(n.lines) // lines [first, touched) are indexed again
	for _, y := range s.lines[after:] {
		n.lines = append(n.lines, y+int32(d))
	}
	n.wide = make([]uint64, (len(n.lines)+63)/64)
	for i := range first {
		if !s.ascii(i) {
			n.wide[i/64] |= 1 << (i % 64)
		}
	}
	for i := first; i < touched; i++ {
		end := len(text)
		if i+1 < len(n.lines) {
			end = int(n.lines[i+1]) - 1
		}
		if !isASCII(text[n.lines[i]:end]) {
			if end-int(n.lines[i]) > markEvery {
				return NewSource(s.name, text)
			}
			n.wide[i/64] |= 1 << (i % 64)
		}
	}
	for i := touched; i < len(n.lines); i++ {
		if !s.ascii(after + i - touched) {
			n.wide[i/64] |= 1 << (i % 64)
		}
	}
	return n
}

// isASCII reports whether s holds only ASCII bytes, eight at a time.
func isASCII(s string) bool {
	i := 0
	for ; i+8 <= len(s); i += 8 {
		w := uint64(s[i]) | uint64(s[i+1])<<8 | uint64(s[i+2])<<16 | uint64(s[i+3])<<24 |
			uint64(s[i+4])<<32 | uint64(s[i+5])<<40 | uint64(s[i+6])<<48 | uint64(s[i+7])<<56
		if w&0x8080808080808080 != 0 {
			return false
		}
	}
	for ; i < len(s); i++ {
		if s[i] >= utf8.RuneSelf {
			return false
		}
	}
	return true
}

// ascii reports whether the 0-based line i holds only ASCII.
func (s *Source) ascii(i int) bool { return s.wide[i/64]&(1<<(i%64)) == 0 }

// markLine records column marks along the long line text[start:end].
func (s *Source) markLine(start, end int) {
	col := 1
	at := start
	for next := start + markEvery; next < end; next += markEvery {
		for next < end && !utf8.RuneStart(s.text[next]) {
			next++
		}
		col += utf8.RuneCountInString(s.text[at:next])
		at = next
		s.marks = append(s.marks, colMark{off: int32(at), col: int32(col)})
	}
}

// Name is the file name the source was read from.
func (s *Source) Name() string {
	if s == nil {
		return ""
	}
	return s.name
}

// textOf is the text of src from the start of the first of toks to the
// end of the last; ok is false when there are none or they are not of src.
func (s *Source) textOf(toks []Token) (text string, ok bool) {
	if s == nil || len(toks) == 0 {
		return "", false
	}
	first, end := int(toks[0].Offset), toks[len(toks)-1].End()
	if first < 0 || end > len(s.text) || first > end {
		return "", false
	}
	return s.text[first:end], true
}

// Text is the file's text, which token values and comments are slices of.
func (s *Source) Text() string {
	if s == nil {
		return ""
	}
	return s.text
}

// line returns the 0-based index of the line holding offset off.
func (s *Source) line(off int) int {
	if h := int(s.hint.Load()); h < len(s.lines) && int(s.lines[h]) <= off {
		for i := h; i < len(s.lines) && i <= h+2; i++ {
			if i+1 == len(s.lines) || off < int(s.lines[i+1]) {
				if i != h {
					s.hint.Store(int32(i))
				}
				return i
			}
		}
	}
	i := s.search(off)
	s.hint.Store(int32(i))
	return i
}

// search finds the line holding offset off by bisection.
func (s *Source) search(off int) int {
	lo, hi := 0, len(s.lines) // lines[lo] <= off < lines[hi]
	for hi-lo > 1 {
		m := int(uint(lo+hi) >> 1)
		if int(s.lines[m]) <= off {
			lo = m
		} else {
			hi = m
		}
	}
	return lo
}

// Pos resolves a byte offset to its line and column. Columns count runes
// from the start of the line (after a byte order mark on line 1).
func (s *Source) Pos(off int) Pos {
	if s == nil {
		return Pos{}
	}
	off = min(max(off, 0), len(s.text))
	return s.posOnLine(off, s.line(off))
}

// posOnLine is Pos for an offset on the 0-based line i.
func (s *Source) posOnLine(off, i int) Pos {
	start, col := int(s.lines[i]), 1
	if off <= start {
		return Pos{Line: i + 1, Column: 1, Offset: off}
	}
	if s.ascii(i) {
		return Pos{Line: i + 1, Column: 1 + off - start, Offset: off}
	}
	if off-start > markEvery && len(s.marks) > 0 {
		lo, hi := -1, len(s.marks) // marks[lo].off <= off < marks[hi].off
		for hi-lo > 1 {
			m := int(uint(lo+hi) >> 1)
			if int(s.marks[m].off) <= off {
				lo = m
			} else {
				hi = m
			}
		}
		if lo >= 0 && int(s.marks[lo].off) > start {
			start, col = int(s.marks[lo].off), int(s.marks[lo].col)
		}
	}
	return Pos{Line: i + 1, Column: col + utf8.RuneCountInString(s.text[start:off]), Offset: off}
}

// Span is the exact source range of the token t of this source.
func (s *Source) Span(t Token) Span { return s.span(t, t) }

// span is the exact source range from the start of token first to the end
// of token last, both of this source, last not before first.
func (s *Source) span(first, last Token) Span {
	if s == nil {
		return Span{}
	}
	off := min(max(int(first.Offset), 0), len(s.text))
	i := s.line(off)
	start := s.posOnLine(off, i)
	end := int(last.Offset)
	if end < off || end > len(s.text) {
		return Span{File: s.name, Start: start, End: start}
	}
	var p Pos
	switch {
	case (i+1 == len(s.lines) || end < int(s.lines[i+1])) && s.ascii(i):
		// On the same line, all ASCII.
		p = Pos{Line: start.Line, Column: start.Column + end - off, Offset: end}
		p.Column += len(last.Value)
		p.Offset += len(last.Value)
		return Span{File: s.name, Start: start, End: p}
	case i+1 == len(s.lines) || end < int(s.lines[i+1]):
		// On the same line: count on from the start.
		p = Pos{Line: start.Line, Column: start.Column + utf8.RuneCountInString(s.text[off:end]), Offset: end}
		if end-off > markEvery {
			p = s.posOnLine(end, i)
		}
	default:
		p = s.posOnLine(end, i+1+s.searchFrom(end, i+1))
	}
	p.Column += utf8.RuneCountInString(last.Value)
	p.Offset += len(last.Value)
	return Span{File: s.name, Start: start, End: p}
}

// searchFrom is the index, counted from line i, of the line holding
// offset off, which is at or after line i's start.
func (s *Source) searchFrom(off, i int) int {
	lines := s.lines[i:]
	lo, hi := 0, len(lines)
	for hi-lo > 1 {
		m := int(uint(lo+hi) >> 1)
		if int(lines[m]) <= off {
			lo = m
		} else {
			hi = m
		}
	}
	return lo
}

// position is the participle Position of offset off.
func (s *Source) position(off int) lexer.Position {
	p := s.Pos(off)
	return lexer.Position{Filename: s.Name(), Offset: p.Offset, Line: p.Line, Column: p.Column}
}
