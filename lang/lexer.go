package lang

import (
	"fmt"
	"strings"
	"unicode/utf8"

	"github.com/alecthomas/participle/v2/lexer"
)

// Comment is one `#` comment, kept for the formatter. Text includes the `#`
// and excludes the line end.
type Comment struct {
	Span Span
	Text string
}

// Lex splits src into tokens (ending with an EOF token) and comments. It never
// fails: malformed input (invalid UTF-8, control characters, unterminated
// strings) is reported as syntax diagnostics and lexing carries on.
func Lex(file string, src []byte) ([]lexer.Token, []Comment, Diagnostics) {
	l := newLexState(file, src)
	l.toks = make([]lexer.Token, 0, len(src)/5+1)
	for l.more() {
	}
	l.toks = append(l.toks, l.eof())
	return l.toks, l.comments, l.diags
}

type lexState struct {
	file     string
	src      []byte
	str      string // src as one string: token values and comments are slices of it
	off      int
	line     int
	col      int
	toks     []lexer.Token
	comments []Comment
	diags    Diagnostics
	badRuns  int // runs of invalid characters seen
}

func newLexState(file string, src []byte) *lexState {
	l := &lexState{file: file, src: src, str: string(src), line: 1, col: 1}
	if len(src) >= 3 && src[0] == 0xef && src[1] == 0xbb && src[2] == 0xbf {
		// A byte order mark some editors write is not part of the text;
		// columns count from after it.
		l.off = 3
	}
	return l
}

func (l *lexState) position() lexer.Position {
	return lexer.Position{Filename: l.file, Offset: l.off, Line: l.line, Column: l.col}
}

func (l *lexState) pos() Pos { return Pos{Line: l.line, Column: l.col, Offset: l.off} }

// eof is the EOF token at the current position.
func (l *lexState) eof() lexer.Token { return lexer.Token{Type: lexer.EOF, Pos: l.position()} }

// advance moves past n bytes that contain no newline.
func (l *lexState) advance(n int) {
	end := l.off + n
	for l.off < end {
		if l.src[l.off] < utf8.RuneSelf {
			l.off++
		} else {
			_, size := utf8.DecodeRune(l.src[l.off:end])
			l.off += size
		}
		l.col++
	}
}

func (l *lexState) errorf(start Pos, format string, args ...any) {
	l.diags = append(l.diags, Diagnostic{
		Code:     CodeSyntax,
		Severity: Error,
		Message:  fmt.Sprintf(format, args...),
		Subject:  Span{File: l.file, Start: start, End: l.pos()},
	})
}

// isDelimiter reports whether r is a one-character token that also ends a word.
func isDelimiter(r rune) bool {
	switch r {
	case '{', '}', ':', ',', '=', '±':
		return true
	}
	return false
}

func isSpace(c byte) bool { return c == ' ' || c == '\t' || c == '\r' || c == '\n' }

// isControl reports whether r is a control character that may not appear in
// a source file outside white space.
func isControl(r rune) bool { return r < 0x20 || r == 0x7f }

// more lexes on until at least one token has been added or the input ends;
// it reports whether any input was left to lex.
func (l *lexState) more() bool {
	n := len(l.toks)
	for l.off < len(l.src) && len(l.toks) == n {
		c := l.src[l.off]
		switch {
		case c == '\n':
			l.off++
			l.line++
			l.col = 1
		case isSpace(c):
			l.off++
			l.col++
		case c == '#':
			l.comment()
		case c == '"':
			l.string()
		case c < utf8.RuneSelf && !isControl(rune(c)) && !isDelimiter(rune(c)):
			l.word()
		default:
			r, size := utf8.DecodeRune(l.src[l.off:])
			switch {
			case r == utf8.RuneError && size <= 1:
				l.badRun(isInvalidAt, "invalid UTF-8 byte", "invalid UTF-8 bytes", fmt.Sprintf("0x%02x", c))
			case isControl(r):
				l.badRun(isControlAt, "invalid control character", "invalid control characters", fmt.Sprintf("U+%04X", r))
			case isDelimiter(r):
				l.emit(Punct, size)
			default:
				l.word()
			}
		}
	}
	return len(l.toks) > n || l.off < len(l.src)
}

// maxLexDiagnostics caps the runs of invalid characters the lexer reports
// for one file, so a binary file does not bury the reader.
const maxLexDiagnostics = 100

func isInvalidAt(b []byte) bool {
	r, size := utf8.DecodeRune(b)
	return r == utf8.RuneError && size <= 1
}

func isControlAt(b []byte) bool {
	return b[0] < utf8.RuneSelf && isControl(rune(b[0])) && !isSpace(b[0])
}

// badRun skips a run of bytes for which bad holds (each one byte long) and
// reports it once: one and many name the kind, first is the run's first byte.
func (l *lexState) badRun(bad func([]byte) bool, one, many, first string) {
	start := l.pos()
	n := 0
	for l.off+n < len(l.src) && bad(l.src[l.off+n:]) {
		n++
	}
	l.advance(n)
	l.badRuns++
	switch {
	case l.badRuns > maxLexDiagnostics:
		return
	case l.badRuns == maxLexDiagnostics:
		l.errorf(start, "too many invalid characters; no more are reported in this file")
	case n == 1:
		l.errorf(start, "%s %s", one, first)
	default:
		l.errorf(start, "%d %s starting with %s", n, many, first)
	}
}

func (l *lexState) emit(typ lexer.TokenType, n int) {
	tok := lexer.Token{Type: typ, Value: l.str[l.off : l.off+n], Pos: l.position()}
	l.toks = append(l.toks, tok)
	l.advance(n)
}

// checkText reports the first invalid UTF-8 byte or control character
// (other than tab) in the text of a comment or string that starts at the
// current position; what names the construct in the message.
func (l *lexState) checkText(text []byte, what string) {
	for i := 0; i < len(text); {
		r, w := utf8.DecodeRune(text[i:])
		var msg string
		switch {
		case r == utf8.RuneError && w <= 1:
			msg = fmt.Sprintf("%s has invalid UTF-8 byte 0x%02x", what, text[i])
		case isControl(r) && r != '\t':
			msg = fmt.Sprintf("%s has invalid control character U+%04X", what, r)
		default:
			i += w
			continue
		}
		at := l.pos()
		at.Offset += i
		at.Column += utf8.RuneCount(text[:i])
		end := Pos{Line: at.Line, Column: at.Column + 1, Offset: at.Offset + 1}
		l.diags = append(l.diags, Diagnostic{
			Code:     CodeSyntax,
			Severity: Error,
			Message:  msg,
			Subject:  Span{File: l.file, Start: at, End: end},
		})
		return
	}
}

func (l *lexState) comment() {
	end := l.off
	for end < len(l.src) && l.src[end] != '\n' {
		end++
	}
	text := l.src[l.off:end]
	if len(text) > 0 && text[len(text)-1] == '\r' {
		text = text[:len(text)-1]
	}
	l.checkText(text, "comment")
	start := l.pos()
	s := l.str[l.off : l.off+len(text)]
	l.advance(len(text))
	l.comments = append(l.comments, Comment{Span: Span{File: l.file, Start: start, End: l.pos()}, Text: s})
	l.advance(end - l.off)
}

func (l *lexState) string() {
	start := l.pos()
	i := l.off + 1
	closed := false
	for i < len(l.src) && l.src[i] != '\n' {
		if l.src[i] == '\\' && i+1 < len(l.src) && l.src[i+1] != '\n' {
			i += 2
			continue
		}
		if l.src[i] == '"' {
			i++
			closed = true
			break
		}
		i++
	}
	if !closed && i > l.off+1 && l.src[i-1] == '\r' && (i == len(l.src) || l.src[i] == '\n') {
		i-- // the CR of a CRLF line end is not part of an unclosed string
	}
	raw := l.src[l.off:i]
	nerr := len(l.diags)
	l.checkText(raw, "string")
	l.emit(String, i-l.off)
	switch {
	case !closed:
		l.errorf(start, "string is not closed on its line")
	case len(l.diags) > nerr:
		// already reported
	default:
		if _, err := Unquote(string(raw)); err != nil {
			l.errorf(start, "%v", err)
		}
	}
}

// word lexes a run of characters up to white space, a delimiter, a quote or
// a comment, and classifies it.
func (l *lexState) word() {
	end := l.off
	for end < len(l.src) {
		c := l.src[end]
		if c < utf8.RuneSelf {
			if isSpace(c) || c == '"' || c == '#' || isControl(rune(c)) || isDelimiter(rune(c)) {
				break
			}
			end++
			continue
		}
		r, size := utf8.DecodeRune(l.src[end:])
		if isDelimiter(r) || (r == utf8.RuneError && size <= 1) || isControl(r) {
			break
		}
		end += size
	}
	w := l.str[l.off:end]
	for {
		// ASCII `+-` touching a number is an uncertainty sign, like `±`:
		// `1+-0.5`, `+-0.5`.
		if len(w) > 2 && w[0] == '+' && w[1] == '-' && (isDigit(w[2]) || w[2] == '.') {
			l.emit(Punct, 2)
			w = w[2:]
			continue
		}
		// Numbers are decimal: `0x1p3` is one bad number, not 0 with a unit.
		if n := numberPrefix(w); n > 0 && n < len(w) && (w[n] == 'x' || w[n] == 'X') && strings.TrimLeft(w[:n], "+-") == "0" {
			start := l.pos()
			l.emit(Number, len(w))
			l.errorf(start, "hexadecimal numbers are not part of the language: write numbers in decimal, such as 8 or 1.5e3")
			return
		}
		// A number that runs into letters is two tokens: `298.15K`, `2H2O(g)`.
		if n := numberPrefix(w); n > 0 && n < len(w) && (startsLetter(w[n:]) || strings.HasPrefix(w[n:], "+-")) {
			l.emit(Number, n)
			w = w[n:]
			continue
		}
		l.emit(classify(w), len(w))
		return
	}
}

func startsLetter(s string) bool {
	r, _ := utf8.DecodeRuneInString(s)
	return r == '°' || r == '_' || ('a' <= r && r <= 'z') || ('A' <= r && r <= 'Z')
}

func classify(w string) lexer.TokenType {
	switch w {
	case "+", "-", "+-", "<->", "->", "⇌", "→":
		return Punct
	}
	if n := numberPrefix(w); n == len(w) {
		return Number
	}
	if keywords[w] {
		return Keyword
	}
	if _, _, ok := cutStateTag(w); ok {
		return Ref
	}
	return Word
}

// numberPrefix returns the length of the longest prefix of w that is a
// number: an optionally signed decimal with optional exponent, or an
// unsigned fraction p/q.
func numberPrefix(w string) int {
	i := 0
	if i < len(w) && (w[i] == '+' || w[i] == '-') {
		i++
	}
	digits := 0
	for i < len(w) && isDigit(w[i]) {
		i++
		digits++
	}
	if i < len(w) && w[i] == '/' && digits > 0 && w[0] != '+' && w[0] != '-' {
		j := i + 1
		for j < len(w) && isDigit(w[j]) {
			j++
		}
		if j > i+1 {
			return j
		}
	}
	if i < len(w) && w[i] == '.' {
		i++
		for i < len(w) && isDigit(w[i]) {
			i++
			digits++
		}
	}
	if digits == 0 {
		return 0
	}
	if i < len(w) && (w[i] == 'e' || w[i] == 'E') {
		j := i + 1
		if j < len(w) && (w[j] == '+' || w[j] == '-') {
			j++
		}
		k := j
		for k < len(w) && isDigit(w[k]) {
			k++
		}
		if k > j {
			i = k
		}
	}
	return i
}

func isDigit(c byte) bool { return '0' <= c && c <= '9' }
