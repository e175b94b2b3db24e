package lsp

import (
	"bytes"
	"sort"
	"unicode/utf8"
)

// encoding is the unit in which Position.Character counts.
type encoding int

const (
	encUTF16 encoding = iota // UTF-16 code units: the protocol's default
	encUTF8                  // bytes of UTF-8
)

// name is the encoding's name in the protocol.
func (e encoding) name() string {
	if e == encUTF8 {
		return "utf-8"
	}
	return "utf-16"
}

// negotiate picks the position encoding from those the client offers:
// UTF-8 when offered (it is what the compiler's byte offsets are), else the
// protocol's mandatory UTF-16.
func negotiate(offered []string) encoding {
	for _, e := range offered {
		if e == "utf-8" {
			return encUTF8
		}
	}
	return encUTF16
}

// lines indexes a text by line for converting between byte offsets and
// protocol positions. Lines end at \n, \r\n or a lone \r, as the protocol
// counts them.
type lines struct {
	text   []byte
	starts []int // byte offset of each line's first character
}

func newLines(text []byte) *lines {
	starts := make([]int, 1, 1+len(text)/32)
	if bytes.IndexByte(text, '\r') < 0 {
		// Only \n ends a line: find each with the library's fast search
		// (a document of megabytes is indexed on every change).
		for at := 0; ; {
			i := bytes.IndexByte(text[at:], '\n')
			if i < 0 {
				return &lines{text: text, starts: starts}
			}
			at += i + 1
			starts = append(starts, at)
		}
	}
	for i := 0; i < len(text); i++ {
		switch text[i] {
		case '\n':
			starts = append(starts, i+1)
		case '\r':
			if i+1 < len(text) && text[i+1] == '\n' {
				i++
			}
			starts = append(starts, i+1)
		}
	}
	return &lines{text: text, starts: starts}
}

// edited is the index of text, which is l's text with the bytes [from,
// to) replaced by n others: the line starts before from are l's, those
// after the replacement l's shifted, and only the replaced bytes and the
// byte before them are read again (TestEditedLinesMatchNew). A line
// starts after a \n, and after a \r that no \n follows, so a start at x
// depends on the bytes at x-1 and x alone.
func (l *lines) edited(text []byte, from, to, n int) *lines {
	if from < 1 {
		return newLines(text)
	}
	d := n - (to - from)
	newEnd := from + n
	// Starts before from are l's; starts in [from, newEnd] are found again;
	// starts after newEnd are l's after to, shifted.
	keep := sort.SearchInts(l.starts, from)
	after := sort.SearchInts(l.starts, to+1)
	starts := make([]int, keep, len(l.starts)+n/16+1)
	copy(starts, l.starts[:keep])
	for i := from - 1; i < newEnd; i++ {
		switch text[i] {
		case '\n':
			starts = append(starts, i+1)
		case '\r':
			if i+1 >= len(text) || text[i+1] != '\n' {
				starts = append(starts, i+1)
			}
		}
	}
	for _, y := range l.starts[after:] {
		starts = append(starts, y+d)
	}
	return &lines{text: text, starts: starts}
}

// lineEnd is the byte offset where line i's content ends (before its line
// ending).
func (l *lines) lineEnd(i int) int {
	if i+1 >= len(l.starts) {
		return len(l.text)
	}
	end := l.starts[i+1]
	if end > 0 && l.text[end-1] == '\n' {
		end--
	}
	if end > l.starts[i] && l.text[end-1] == '\r' {
		end--
	}
	return end
}

// position converts a byte offset into a protocol position in enc. Every
// span the compiler reports reaches the client through this function. An
// offset beyond the text is the end of the text; one inside a character
// or a line ending counts to the end of what precedes it.
func (l *lines) position(offset int, enc encoding) Position {
	if offset < 0 {
		offset = 0
	}
	if offset > len(l.text) {
		offset = len(l.text)
	}
	line := sort.Search(len(l.starts), func(i int) bool { return l.starts[i] > offset }) - 1
	start := l.starts[line]
	if end := l.lineEnd(line); offset > end {
		offset = end
	}
	if enc == encUTF8 {
		return Position{Line: uint32(line), Character: uint32(offset - start)}
	}
	units := 0
	for i := start; i < offset; {
		r, size := utf8.DecodeRune(l.text[i:])
		if i+size > offset {
			break
		}
		units += utf16Len(r)
		i += size
	}
	return Position{Line: uint32(line), Character: uint32(units)}
}

// offset converts a protocol position in enc into a byte offset. A line
// beyond the last is the end of the text, a character beyond the line's
// end is the line's end (as the protocol asks), and a character in the
// middle of a UTF-8 sequence or a surrogate pair falls back to the start of
// that character.
func (l *lines) offset(p Position, enc encoding) int {
	if int64(p.Line) >= int64(len(l.starts)) {
		return len(l.text)
	}
	line := int(p.Line)
	start, end := l.starts[line], l.lineEnd(line)
	if enc == encUTF8 {
		off := start + int(min(p.Character, uint32(end-start)))
		for off > start && off < len(l.text) && !utf8.RuneStart(l.text[off]) {
			off--
		}
		return off
	}
	units := uint32(0)
	i := start
	for i < end && units < p.Character {
		r, size := utf8.DecodeRune(l.text[i:end])
		n := uint32(utf16Len(r))
		if units+n > p.Character {
			break
		}
		units += n
		i += size
	}
	return i
}

// utf16Len is the number of UTF-16 code units that encode r (an invalid
// byte decodes as U+FFFD, one unit).
func utf16Len(r rune) int {
	if r >= 0x10000 {
		return 2
	}
	return 1
}

// end is the position just after the last character.
func (l *lines) end(enc encoding) Position { return l.position(len(l.text), enc) }
