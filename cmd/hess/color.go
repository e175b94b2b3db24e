package main

import "hess/lang"

// palette colours the parts of a text report with ANSI SGR sequences when
// on is true, and returns text unchanged otherwise.
//
// The scheme: locations bold, "error" bold red, "warning" bold yellow,
// "info" bold cyan, "note" bold blue, the line-number gutter blue, the
// marker in its diagnostic's severity colour, and the summary bold.
type palette struct {
	on bool
}

const (
	sgrBold    = "1"
	sgrError   = "1;31"
	sgrWarning = "1;33"
	sgrInfo    = "1;36"
	sgrNote    = "1;34"
	sgrGutter  = "34"
)

// paint wraps s in the SGR sequence code and a reset.
func (p palette) paint(code, s string) string {
	if !p.on || s == "" {
		return s
	}
	return "\x1b[" + code + "m" + s + "\x1b[0m"
}

// location colours a file:line:col prefix.
func (p palette) location(s string) string { return p.paint(sgrBold, s) }

// severity colours s in the colour of sev.
func (p palette) severity(sev lang.Severity, s string) string {
	switch sev {
	case lang.Error:
		return p.paint(sgrError, s)
	case lang.Warning:
		return p.paint(sgrWarning, s)
	case lang.Info:
		return p.paint(sgrInfo, s)
	}
	return p.paint(sgrBold, s)
}

// note colours the label of a related location.
func (p palette) note(s string) string { return p.paint(sgrNote, s) }

// gutter colours the line-number column of a snippet.
func (p palette) gutter(s string) string { return p.paint(sgrGutter, s) }

// summary colours the closing summary line.
func (p palette) summary(s string) string { return p.paint(sgrBold, s) }
