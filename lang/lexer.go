package lang

import (
	"fmt"
	"strings"
	"unicode/utf8"
)

// Comment is one `#` comment, kept for the formatter. Text includes the `#`
// and excludes the line end.
type Comment struct {
	Span Span
	Text string
}

// Lex splits src into tokens (ending with an EOF token) and comments. It never
// fails: malformed input (invalid UTF-8, control characters, unterminated
// strings) is reported as syntax diagnostics and lexing carries on. The
// tokens' offsets resolve to lines and columns through NewSource(file, src).
func Lex(file string, src []byte) ([]Token, []Comment, Diagnostics) {
	if len(src) > MaxSourceBytes {
		return []Token{{Type: EOF}}, nil, Diagnostics{tooLarge(file)}
	}
	l := newLexState(NewSource(file, string(src)))
	l.toks = make([]Token, 0, len(src)/5+1)
	for l.more() {
	}
	l.toks = append(l.toks, l.eof())
	return l.toks, l.comments, l.diags
}

// tooLarge is the diagnostic for a file longer than MaxSourceBytes.
func tooLarge(file string) Diagnostic {
	p := Pos{Line: 1, Column: 1}
	return Diagnostic{
		Code: CodeSyntax, Severity: Error, Subject: Span{File: file, Start: p, End: p},
		Message: fmt.Sprintf("the file is larger than %d bytes, the most the lexer reads", MaxSourceBytes),
	}
}

// lexState lexes one source file, appending tokens to toks.
type lexState struct {
	src      *Source
	str      string // the text: token values and comments are slices of it
	off      int
	nl       bool // no token yet on the current line
	toks     []Token
	comments []Comment
	diags    Diagnostics
	badRuns  int // runs of invalid characters seen
	// runs are where the first maxLexDiagnostics of them start, for
	// re-parsing (reparse.go).
	runs []int32
}

func newLexState(src *Source) *lexState {
	l := &lexState{src: src, str: src.text, nl: true}
	if len(src.lines) > 0 {
		l.off = int(src.lines[0]) // after a byte order mark
	}
	return l
}

func (l *lexState) pos() Pos { return l.src.Pos(l.off) }

// eof is the EOF token at the current position.
func (l *lexState) eof() Token { return Token{Type: EOF, Offset: int32(l.off), FirstOnLine: l.nl} }

// advance moves past n bytes that contain no newline.
func (l *lexState) advance(n int) { l.off += n }

func (l *lexState) errorf(start int, format string, args ...any) {
	l.diags = append(l.diags, Diagnostic{
		Code:     CodeSyntax,
		Severity: Error,
		Message:  fmt.Sprintf(format, args...),
		Subject:  Span{File: l.src.name, Start: l.src.Pos(start), End: l.pos()},
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
	for l.off < len(l.str) && len(l.toks) == n {
		c := l.str[l.off]
		switch {
		case c == '\n':
			l.off++
			l.nl = true
		case isSpace(c):
			l.off++
		case c == '#':
			l.comment()
		case c == '"':
			l.string()
		case c < utf8.RuneSelf && !isControl(rune(c)) && !isDelimiter(rune(c)):
			l.word()
		default:
			r, size := utf8.DecodeRuneInString(l.str[l.off:])
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
	return len(l.toks) > n || l.off < len(l.str)
}

// maxLexDiagnostics caps the runs of invalid characters the lexer reports
// for one file, so a binary file does not bury the reader.
const maxLexDiagnostics = 100

func isInvalidAt(b string) bool {
	r, size := utf8.DecodeRuneInString(b)
	return r == utf8.RuneError && size <= 1
}

func isControlAt(b string) bool {
	return b[0] < utf8.RuneSelf && isControl(rune(b[0])) && !isSpace(b[0])
}

// badRun skips a run of bytes for which bad holds (each one byte long) and
// reports it once: one and many name the kind, first is the run's first byte.
func (l *lexState) badRun(bad func(string) bool, one, many, first string) {
	start := l.off
	n := 0
	for l.off+n < len(l.str) && bad(l.str[l.off+n:]) {
		n++
	}
	l.advance(n)
	l.badRuns++
	if l.badRuns <= maxLexDiagnostics {
		l.runs = append(l.runs, int32(start))
	}
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

func (l *lexState) emit(typ TokenType, n int) {
	l.toks = append(l.toks, Token{Value: l.str[l.off : l.off+n], Offset: int32(l.off), Type: typ, FirstOnLine: l.nl})
	l.nl = false
	l.off += n
}

// checkText reports the first invalid UTF-8 byte or control character
// (other than tab) in the text of a comment or string that starts at the
// current position; what names the construct in the message.
func (l *lexState) checkText(text string, what string) {
	for i := 0; i < len(text); {
		if text[i] >= 0x20 && text[i] < utf8.RuneSelf && text[i] != 0x7f {
			i++
			continue
		}
		r, w := utf8.DecodeRuneInString(text[i:])
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
		at := l.src.Pos(l.off + i)
		end := Pos{Line: at.Line, Column: at.Column + 1, Offset: at.Offset + 1}
		l.diags = append(l.diags, Diagnostic{
			Code:     CodeSyntax,
			Severity: Error,
			Message:  msg,
			Subject:  Span{File: l.src.name, Start: at, End: end},
		})
		return
	}
}

func (l *lexState) comment() {
	end := len(l.str)
	if i := strings.IndexByte(l.str[l.off:], '\n'); i >= 0 {
		end = l.off + i
	}
	text := l.str[l.off:end]
	if len(text) > 0 && text[len(text)-1] == '\r' {
		text = text[:len(text)-1]
	}
	l.checkText(text, "comment")
	l.comments = append(l.comments, Comment{Span: l.src.Span(Token{Value: text, Offset: int32(l.off)}), Text: text})
	l.off = end
}

func (l *lexState) string() {
	start := l.off
	i := l.off + 1
	closed := false
	for i < len(l.str) && l.str[i] != '\n' {
		if l.str[i] == '\\' && i+1 < len(l.str) && l.str[i+1] != '\n' {
			i += 2
			continue
		}
		if l.str[i] == '"' {
			i++
			closed = true
			break
		}
		i++
	}
	if !closed && i > l.off+1 && l.str[i-1] == '\r' && (i == len(l.str) || l.str[i] == '\n') {
		i-- // the CR of a CRLF line end is not part of an unclosed string
	}
	raw := l.str[l.off:i]
	nerr := len(l.diags)
	l.checkText(raw, "string")
	l.emit(String, i-l.off)
	switch {
	case !closed:
		l.errorf(start, "string is not closed on its line")
	case len(l.diags) > nerr:
		// already reported
	default:
		if _, err := Unquote(raw); err != nil {
			l.errorf(start, "%v", err)
		}
	}
}

// word lexes a run of characters up to white space, a delimiter, a quote or
// a comment, and classifies it.
func (l *lexState) word() {
	end := l.off
	for end < len(l.str) {
		c := l.str[end]
		if c < utf8.RuneSelf {
			if wordEnds[c] {
				break
			}
			end++
			continue
		}
		r, size := utf8.DecodeRuneInString(l.str[end:])
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
		n := numberPrefix(w)
		// Numbers are decimal: `0x1p3` is one bad number, not 0 with a unit.
		if n > 0 && n < len(w) && (w[n] == 'x' || w[n] == 'X') && strings.TrimLeft(w[:n], "+-") == "0" {
			start := l.off
			l.emit(Number, len(w))
			l.errorf(start, "hexadecimal numbers are not part of the language: write numbers in decimal, such as 8 or 1.5e3")
			return
		}
		// A number that runs into letters is two tokens: `298.15K`, `2H2O(g)`.
		if n > 0 && n < len(w) && (startsLetter(w[n:]) || strings.HasPrefix(w[n:], "+-")) {
			l.emit(Number, n)
			w = w[n:]
			continue
		}
		if n == len(w) {
			l.emit(Number, n)
			return
		}
		l.emit(classify(w), len(w))
		return
	}
}

func startsLetter(s string) bool {
	r, _ := utf8.DecodeRuneInString(s)
	return r == '°' || r == '_' || ('a' <= r && r <= 'z') || ('A' <= r && r <= 'Z')
}

// wordEnds holds the ASCII characters that end a word.
var wordEnds = func() (t [utf8.RuneSelf]bool) {
	for c := range t {
		t[c] = isSpace(byte(c)) || c == '"' || c == '#' || isControl(rune(c)) || isDelimiter(rune(c))
	}
	return t
}()

func classify(w string) TokenType {
	switch w {
	case "+", "-", "+-", "<->", "->", "⇌", "→":
		return Punct
	}
	if n := numberPrefix(w); n == len(w) {
		return Number
	}
	if IsKeyword(w) {
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
