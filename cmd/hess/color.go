package main

import "hess/lang"

// palette colours the parts of a text report with ANSI SGR sequences when
// on is true, and returns text unchanged otherwise.
//
// The scheme: locations bold, "error" bold red, "warning" bold yellow,
// "info" bold cyan, "note" bold blue, the check's name dim, a snippet's
// ellipses blue, the marker in its diagnostic's severity colour, and the
// summary bold.
type palette struct {
	on bool
}

const (
	sgrBold    = "1"
	sgrError   = "1;31"
	sgrWarning = "1;33"
	sgrInfo    = "1;36"
	sgrNote    = "1;34"
	sgrElision = "34"
	sgrCode    = "2"
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

// elision colours the ellipsis where a snippet cuts its line.
func (p palette) elision(s string) string { return p.paint(sgrElision, s) }

// code colours the bracketed check name that ends a diagnostic's line.
func (p palette) code(s string) string { return p.paint(sgrCode, s) }

// summary colours the closing summary line.
func (p palette) summary(s string) string { return p.paint(sgrBold, s) }
