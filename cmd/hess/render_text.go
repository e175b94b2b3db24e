package main

import (
	"bufio"
	"bytes"
	"fmt"
	"io"
	"strconv"
	"strings"
	"unicode/utf8"

	"hess/lang"
)

// renderText writes the report for a person in the GNU Coding Standards
// form, the check's name last:
//
//	plant.hess:4:16: error: O: left 3, right 2 [element-imbalance]
//	    reaction burn: CO(g) + O2(g) <-> CO2(g)
//	                   ^~~~~~~~~~~~~~~~~~~~~~~~
//	  the left side has 1 O more than the right
//	gases.hess:2:9: note: O2(g) declared here
//
// The source line is indented by four spaces and cut to a window around
// the subject (see markLine), the marker is a caret and tildes under the
// subject's columns, the detail is indented by two, and each related
// location is a note line of its own. A closing line counts the findings.
// Colour is used only when color is true. Output goes out as it is made,
// so its size in memory is one diagnostic's, whatever the report's.
func renderText(w io.Writer, r *report, color bool) error {
	if r == nil {
		r = &report{}
	}
	p := palette{on: color}
	src := newSourceLines(r.Source)
	bw := bufio.NewWriterSize(w, 64<<10)
	var b strings.Builder
	for i := range r.Diagnostics {
		b.Reset()
		writeTextDiagnostic(&b, &r.Diagnostics[i], src, p)
		if _, err := bw.WriteString(b.String()); err != nil {
			return fmt.Errorf("writing text report: %w", err)
		}
	}
	bw.WriteString(p.summary(summaryLine(r)))
	bw.WriteByte('\n')
	if err := bw.Flush(); err != nil {
		return fmt.Errorf("writing text report: %w", err)
	}
	return nil
}

// summaryLine counts the report's findings, such as "2 errors, 1 warning
// in 3 files". Only non-zero counts are listed, in the order errors,
// warnings, infos (diagnostics of info severity are counted as "info" and
// "infos", matching the severity name and the JSON summary); a report with
// none of them reads "no problems in 1 file".
func summaryLine(r *report) string {
	if r == nil {
		r = &report{}
	}
	var parts []string
	for _, c := range []struct {
		sev        lang.Severity
		one, other string
	}{
		{lang.Error, "error", "errors"},
		{lang.Warning, "warning", "warnings"},
		{lang.Info, "info", "infos"},
	} {
		if n := r.Diagnostics.Count(c.sev); n > 0 {
			parts = append(parts, countNoun(n, c.one, c.other))
		}
	}
	files := countNoun(len(r.Files), "file", "files")
	if len(parts) == 0 {
		return "no problems in " + files
	}
	return strings.Join(parts, ", ") + " in " + files
}

// countNoun writes n with the singular or plural noun.
func countNoun(n int, one, other string) string {
	if n == 1 {
		return "1 " + one
	}
	return strconv.Itoa(n) + " " + other
}

func writeTextDiagnostic(b *strings.Builder, d *lang.Diagnostic, src *sourceLines, p palette) {
	if loc := spanLocation(d.Subject); loc != "" {
		b.WriteString(p.location(loc))
		b.WriteString(": ")
	}
	b.WriteString(p.severity(d.Severity, d.Severity.String()))
	b.WriteString(": ")
	b.WriteString(displayMessage(d.Message))
	if d.Code != "" {
		b.WriteString(" ")
		b.WriteString(p.code("[" + string(d.Code) + "]"))
	}
	b.WriteByte('\n')

	writeSnippet(b, d, src, p)

	if d.Detail != "" {
		for _, line := range strings.Split(strings.TrimRight(d.Detail, "\n"), "\n") {
			b.WriteString("  ")
			b.WriteString(displayMessage(line))
			b.WriteByte('\n')
		}
	}
	for _, rel := range d.Related {
		if loc := spanLocation(rel.Span); loc != "" {
			b.WriteString(p.location(loc))
			b.WriteString(": ")
		}
		b.WriteString(p.note("note"))
		b.WriteString(": ")
		b.WriteString(displayMessage(rel.Message))
		b.WriteByte('\n')
	}
}

// spanLocation formats where a span starts as file:line:col, leaving out
// the parts it lacks: "file" for a file without a position, "" for neither.
func spanLocation(s lang.Span) string {
	file := displayText(s.File)
	if !s.IsValid() {
		return file
	}
	loc := strconv.Itoa(s.Start.Line)
	if s.Start.Column > 0 {
		loc += ":" + strconv.Itoa(s.Start.Column)
	}
	if file == "" {
		return loc
	}
	return file + ":" + loc
}

// snippetIndent starts each line of a snippet.
const snippetIndent = "    "

// writeSnippet prints the window of the subject's first source line, and
// below it a caret under the subject's first column and tildes under the
// rest. An ellipsis stands for text cut off at either end.
func writeSnippet(b *strings.Builder, d *lang.Diagnostic, src *sourceLines, p palette) {
	s := d.Subject
	if !s.IsValid() {
		return
	}
	line, ascii, ok := src.line(s.File, s.Start.Line)
	if !ok {
		return
	}
	end := spanEnd(s)
	endCol := end.Column
	if end.Line != s.Start.Line {
		endCol = -1 // to the end of the first line
	}
	w := markLine(line, ascii, s.Start.Column, endCol)

	b.WriteString(snippetIndent)
	pad := w.pad
	if w.before {
		b.WriteString(p.elision(ellipsis))
		pad = " " + pad
	}
	b.WriteString(w.text)
	if w.after {
		b.WriteString(p.elision(ellipsis))
	}
	b.WriteByte('\n')
	b.WriteString(snippetIndent)
	b.WriteString(pad)
	b.WriteString(p.severity(d.Severity, "^"+strings.Repeat("~", w.marks-1)))
	b.WriteByte('\n')
}

const (
	ellipsis = "…"

	// snippetContext is how many columns a snippet shows on each side of
	// the marked columns: enough for a statement's keyword and name on a
	// line of ordinary length, while a line of any length prints in
	// bounded space.
	snippetContext = 60
	// snippetMarkMax is the most columns a marker covers; a longer
	// subject is marked from its start and cut off.
	snippetMarkMax = 120
	// snippetSlack is the most columns shown beyond snippetContext rather
	// than replaced by an ellipsis.
	snippetSlack = 16
)

// window is one source line laid out for a snippet.
type window struct {
	text          string // the columns shown, unprintable code points replaced
	pad           string // reaches the first marked column within text
	marks         int    // columns marked, at least 1
	before, after bool   // text was cut off at the start, at the end
}

// markLine lays out the window of one source line around the columns
// [from, to): snippetContext columns either side, at most snippetMarkMax
// marked. Every unprintable code point is replaced (so each still takes one
// column); the padding has a space per code point, a tab where the line has
// one, so the marker lines up. A to of -1 or past the line's end marks to
// the end of the line; an empty or reversed range marks one column; a from
// outside the line is clamped to it. ascii says the line has no multi-byte
// code point, so columns are byte offsets; the work is then proportional to
// the window, not the line.
func markLine(line []byte, ascii bool, from, to int) window {
	if from < 1 {
		from = 1
	}
	iFrom, from := seekColumn(line, ascii, 0, 1, from)
	start := from - snippetContext
	if start <= 1+snippetSlack {
		start = 1 // a short cut-off is shown rather than elided
	}
	iStart, _ := seekColumn(line, ascii, 0, 1, start)
	markTo := from + snippetMarkMax
	if to >= 0 && to < markTo {
		markTo = to
	}
	iTo, cTo := seekColumn(line, ascii, iFrom, from, markTo)
	iEnd, cEnd := seekColumn(line, ascii, iTo, cTo, cTo+snippetContext)
	if iRest, _ := seekColumn(line, ascii, iEnd, cEnd, cEnd+snippetSlack); iRest == len(line) {
		iEnd = iRest
	}

	w := window{marks: max(1, cTo-from), before: iStart > 0, after: iEnd < len(line)}
	var shown, lead strings.Builder
	for i := iStart; i < iEnd; {
		r, size := utf8.DecodeRune(line[i:])
		if i < iFrom {
			if r == '\t' {
				lead.WriteByte('\t')
			} else {
				lead.WriteByte(' ')
			}
		}
		i += size
		shown.WriteRune(printableRune(r, size))
	}
	w.text, w.pad = shown.String(), lead.String()
	return w
}

// seekColumn moves from byte i, which starts column col, to column target
// (target ≥ col), stopping at the end of the line, and returns the byte
// offset and the column reached. Past the last code point is the column
// after it.
func seekColumn(line []byte, ascii bool, i, col, target int) (int, int) {
	if ascii {
		n := min(target-col, len(line)-i)
		return i + n, col + n
	}
	for col < target && i < len(line) {
		_, size := utf8.DecodeRune(line[i:])
		i += size
		col++
	}
	return i, col
}

// printableRune returns r, or U+FFFD where r is an invalid byte, a control
// character other than tab, or a bidirectional formatting character that
// could make the line display differently from how it reads.
func printableRune(r rune, size int) rune {
	switch {
	case r == utf8.RuneError && size <= 1:
		return utf8.RuneError
	case r == '\t':
		return r
	case r < 0x20, r == 0x7f, r >= 0x80 && r < 0xa0:
		return utf8.RuneError
	case r >= 0x202a && r <= 0x202e, r >= 0x2066 && r <= 0x2069:
		return utf8.RuneError
	}
	return r
}

// maxMessageBytes bounds how much of a message, detail line or note the
// text report prints; a message quoting a huge name from a hostile file is
// cut there with an ellipsis.
const maxMessageBytes = 4096

// displayMessage is displayText for a message, cut to maxMessageBytes.
func displayMessage(s string) string {
	if len(s) > maxMessageBytes {
		cut := maxMessageBytes
		for cut > 0 && !utf8.RuneStart(s[cut]) {
			cut--
		}
		s = s[:cut] + ellipsis
	}
	return displayText(s)
}

// displayText makes a message, detail or file name safe to print on one
// line of a terminal: invalid bytes and control characters become U+FFFD.
func displayText(s string) string {
	if !needsCleaning(s) {
		return s
	}
	var b strings.Builder
	for i := 0; i < len(s); {
		r, size := utf8.DecodeRuneInString(s[i:])
		i += size
		if r == '\t' {
			b.WriteByte(' ')
			continue
		}
		b.WriteRune(printableRune(r, size))
	}
	return b.String()
}

// needsCleaning reports whether displayText would change s.
func needsCleaning(s string) bool {
	for i := 0; i < len(s); {
		r, size := utf8.DecodeRuneInString(s[i:])
		i += size
		if r == '\t' || (r == utf8.RuneError && size <= 1) || printableRune(r, size) != r {
			return true
		}
	}
	return false
}

// sourceLines finds numbered lines of the report's source files, indexing
// each file's line starts once.
type sourceLines struct {
	get   func(file string) []byte
	files map[string]*lineIndex
}

type lineIndex struct {
	text   []byte
	starts []int        // byte offset of each line's first byte
	ascii  map[int]bool // whether a line looked up has only ASCII bytes
}

func newSourceLines(get func(file string) []byte) *sourceLines {
	return &sourceLines{get: get, files: map[string]*lineIndex{}}
}

// line returns the text of 1-based line n of file without its line ending,
// whether it is all ASCII, and false when the source or the line is not
// available.
func (s *sourceLines) line(file string, n int) ([]byte, bool, bool) {
	if s == nil || s.get == nil || n < 1 {
		return nil, false, false
	}
	idx, ok := s.files[file]
	if !ok {
		if text := s.get(file); text != nil {
			idx = &lineIndex{text: text, starts: []int{0}, ascii: map[int]bool{}}
			for i, c := range text {
				if c == '\n' {
					idx.starts = append(idx.starts, i+1)
				}
			}
		}
		s.files[file] = idx
	}
	if idx == nil || n > len(idx.starts) {
		return nil, false, false
	}
	start := idx.starts[n-1]
	end := len(idx.text)
	if n < len(idx.starts) {
		end = idx.starts[n] - 1
	}
	line := bytes.TrimSuffix(idx.text[start:end], []byte("\r"))
	ascii, ok := idx.ascii[n]
	if !ok {
		ascii = isASCII(line)
		idx.ascii[n] = ascii
	}
	return line, ascii, true
}

// isASCII reports whether b holds only ASCII bytes.
func isASCII(b []byte) bool {
	for _, c := range b {
		if c >= utf8.RuneSelf {
			return false
		}
	}
	return true
}
