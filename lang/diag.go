package lang

import (
	"fmt"
	"sort"
)

// Pos is a position in a source file. Line and Column are 1-based; Column
// counts Unicode code points (runes) from the start of the line. Offset is the
// 0-based byte offset from the start of the file.
type Pos struct {
	Line   int
	Column int
	Offset int
}

// IsValid reports whether p names a real position.
func (p Pos) IsValid() bool { return p.Line > 0 }

// Span is a half-open source range [Start, End) in one file. End is the
// position just after the last character of the range.
type Span struct {
	File  string
	Start Pos
	End   Pos
}

// IsValid reports whether s names a real range.
func (s Span) IsValid() bool { return s.Start.IsValid() }

// String formats the span's start as file:line:col.
func (s Span) String() string {
	return fmt.Sprintf("%s:%d:%d", s.File, s.Start.Line, s.Start.Column)
}

// Join returns the smallest span covering s and t (both in the same file).
func (s Span) Join(t Span) Span {
	if !s.IsValid() {
		return t
	}
	if !t.IsValid() {
		return s
	}
	out := s
	if t.Start.Offset < out.Start.Offset {
		out.Start = t.Start
	}
	if t.End.Offset > out.End.Offset {
		out.End = t.End
	}
	return out
}

// Severity is how serious a diagnostic is. The zero value is invalid, so an
// unset severity cannot pass for an error.
type Severity int

// Severities, from least to most serious. Off disables a check.
const (
	SeverityInvalid Severity = iota
	Off
	Info
	Warning
	Error
)

// String names the severity as it appears in reports and settings.
func (s Severity) String() string {
	switch s {
	case Off:
		return "off"
	case Info:
		return "info"
	case Warning:
		return "warning"
	case Error:
		return "error"
	}
	return "invalid"
}

// ParseSeverity reads a severity name as written in a `lint` setting.
func ParseSeverity(s string) (Severity, bool) {
	switch s {
	case "off":
		return Off, true
	case "info":
		return Info, true
	case "warning":
		return Warning, true
	case "error":
		return Error, true
	}
	return SeverityInvalid, false
}

// Related is a secondary location that helps explain a diagnostic.
type Related struct {
	Span    Span
	Message string
}

// Code names the check that made a diagnostic. Package lang reports only
// the codes in Codes; every code is registered as a check by package
// network, whose tests fail on a diagnostic whose code is not.
type Code string

// The codes package lang reports.
const (
	// CodeSyntax: the text does not follow the grammar, or a token is
	// malformed.
	CodeSyntax Code = "syntax"
)

// Codes returns every code package lang reports, for the registry's test.
func Codes() []Code { return []Code{CodeSyntax} }

// Diagnostic is one finding: a code (the name of the check that made it), a
// severity, a one-line message, an optional longer detail, the subject range
// it is about, an optional wider context range, and related locations.
type Diagnostic struct {
	Code     Code
	Severity Severity
	Message  string
	Detail   string
	Subject  Span
	Context  Span
	Related  []Related
}

// Diagnostics is a list of findings.
type Diagnostics []Diagnostic

// HasErrors reports whether any diagnostic has error severity.
func (ds Diagnostics) HasErrors() bool {
	for _, d := range ds {
		if d.Severity == Error {
			return true
		}
	}
	return false
}

// Count returns the number of diagnostics of severity sev.
func (ds Diagnostics) Count(sev Severity) int {
	n := 0
	for _, d := range ds {
		if d.Severity == sev {
			n++
		}
	}
	return n
}

// Sort orders the diagnostics stably by file, line, column and code.
func (ds Diagnostics) Sort() {
	sort.SliceStable(ds, func(i, j int) bool {
		a, b := ds[i].Subject, ds[j].Subject
		if a.File != b.File {
			return a.File < b.File
		}
		if a.Start.Line != b.Start.Line {
			return a.Start.Line < b.Start.Line
		}
		if a.Start.Column != b.Start.Column {
			return a.Start.Column < b.Start.Column
		}
		return ds[i].Code < ds[j].Code
	})
}

// Err returns the diagnostics as an error when any has error severity, and
// nil otherwise (never a typed nil).
func (ds Diagnostics) Err() error {
	if !ds.HasErrors() {
		return nil
	}
	return diagError(ds)
}

type diagError Diagnostics

func (e diagError) Error() string {
	for _, d := range e {
		if d.Severity == Error {
			n := Diagnostics(e).Count(Error)
			msg := fmt.Sprintf("%s: %s: %s [%s]", d.Subject, d.Severity, d.Message, d.Code)
			if n > 1 {
				msg += fmt.Sprintf(" (and %d more errors)", n-1)
			}
			return msg
		}
	}
	return "no errors"
}
