package main

import (
	"bytes"
	"fmt"
	"io"
	"strconv"
	"strings"
	"unicode/utf8"

	"hess/lang"
)

// renderText writes the report for a person: one GNU-style line per
// diagnostic (file:line:col: severity[code]: message), the source line with
// a marker under the subject range, the detail, the related locations, and
// a closing summary line. Colour is used only when color is true.
func renderText(w io.Writer, r *report, color bool) error {
	if r == nil {
		r = &report{}
	}
	p := palette{on: color}
	src := newSourceLines(r.Source)
	var b strings.Builder
	for i := range r.Diagnostics {
		writeTextDiagnostic(&b, &r.Diagnostics[i], src, p)
	}
	b.WriteString(p.summary(summaryLine(r)))
	b.WriteByte('\n')
	if _, err := io.WriteString(w, b.String()); err != nil {
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
	label := d.Severity.String()
	if d.Code != "" {
		label += "[" + d.Code + "]"
	}
	if loc := spanLocation(d.Subject); loc != "" {
		b.WriteString(p.location(loc))
		b.WriteString(": ")
	}
	b.WriteString(p.severity(d.Severity, label))
	b.WriteString(": ")
	b.WriteString(displayText(d.Message))
	b.WriteByte('\n')

	writeSnippet(b, d, src, p)

	if d.Detail != "" {
		for _, line := range strings.Split(strings.TrimRight(d.Detail, "\n"), "\n") {
			b.WriteString("  ")
			b.WriteString(displayText(line))
			b.WriteByte('\n')
		}
	}
	for _, rel := range d.Related {
		b.WriteString("  ")
		if loc := spanLocation(rel.Span); loc != "" {
			b.WriteString(p.location(loc))
			b.WriteString(": ")
		}
		b.WriteString(p.note("note"))
		b.WriteString(": ")
		b.WriteString(displayText(rel.Message))
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

// writeSnippet prints the subject's first source line under a line-number
// gutter, and below it a marker of '^' under the subject's columns.
func writeSnippet(b *strings.Builder, d *lang.Diagnostic, src *sourceLines, p palette) {
	s := d.Subject
	if !s.IsValid() {
		return
	}
	line, ok := src.line(s.File, s.Start.Line)
	if !ok {
		return
	}
	end := spanEnd(s)
	endCol := end.Column
	if end.Line != s.Start.Line {
		endCol = -1 // to the end of the first line
	}
	text, pad, carets := markLine(line, s.Start.Column, endCol)

	num := strconv.Itoa(s.Start.Line)
	b.WriteString(p.gutter("  " + num + " |"))
	if text != "" {
		b.WriteByte(' ')
		b.WriteString(text)
	}
	b.WriteByte('\n')
	b.WriteString(p.gutter("  " + strings.Repeat(" ", len(num)) + " |"))
	b.WriteByte(' ')
	b.WriteString(pad)
	b.WriteString(p.severity(d.Severity, strings.Repeat("^", carets)))
	b.WriteByte('\n')
}

// markLine lays out one source line for display. It returns the line with
// every unprintable code point replaced (so each code point still takes one
// column), the padding that reaches column from (a space per code point, a
// tab where the line has one, so the marker lines up), and how many carets
// mark the columns [from, to). A to of -1 or past the line's end marks to
// the end of the line; an empty or reversed range marks one caret; a from
// outside the line is clamped to it.
func markLine(line []byte, from, to int) (text, pad string, carets int) {
	var shown, lead strings.Builder
	n := 0
	for i := 0; i < len(line); {
		r, size := utf8.DecodeRune(line[i:])
		i += size
		n++
		if n < from {
			if r == '\t' {
				lead.WriteByte('\t')
			} else {
				lead.WriteByte(' ')
			}
		}
		shown.WriteRune(printableRune(r, size))
	}
	last := n + 1 // the column just after the line's last code point
	if from < 1 {
		from = 1
	}
	if from > last {
		from = last
	}
	if to < 0 || to > last {
		to = last
	}
	carets = to - from
	if carets < 1 {
		carets = 1
	}
	// lead holds one byte for each code point before the requested start,
	// which is exactly from-1 of them after clamping.
	return shown.String(), lead.String(), carets
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
	starts []int // byte offset of each line's first byte
}

func newSourceLines(get func(file string) []byte) *sourceLines {
	return &sourceLines{get: get, files: map[string]*lineIndex{}}
}

// line returns the text of 1-based line n of file without its line ending,
// and false when the source or the line is not available.
func (s *sourceLines) line(file string, n int) ([]byte, bool) {
	if s == nil || s.get == nil || n < 1 {
		return nil, false
	}
	idx, ok := s.files[file]
	if !ok {
		if text := s.get(file); text != nil {
			idx = &lineIndex{text: text, starts: []int{0}}
			for i, c := range text {
				if c == '\n' {
					idx.starts = append(idx.starts, i+1)
				}
			}
		}
		s.files[file] = idx
	}
	if idx == nil || n > len(idx.starts) {
		return nil, false
	}
	start := idx.starts[n-1]
	end := len(idx.text)
	if n < len(idx.starts) {
		end = idx.starts[n] - 1
	}
	return bytes.TrimSuffix(idx.text[start:end], []byte("\r")), true
}
