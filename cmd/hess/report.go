package main

import "hess/lang"

// report is what `hess check` renders: the files it compiled and every
// diagnostic found in them. File names are as displayed to the user
// (relative to the working folder where possible).
type report struct {
	// Files lists every file of every compiled network, in load order.
	Files []string
	// Diagnostics are sorted; Subject.File and Related[i].Span.File are
	// display names from Files.
	Diagnostics lang.Diagnostics
	// Source returns the text of a file for snippets; it may be nil, and
	// may return nil for a file it does not have.
	Source func(file string) []byte
	// Trouble lists the inputs that could not be read at all (a missing
	// root file); the SARIF log records them as notifications.
	Trouble []inputTrouble
}

// inputTrouble is one input that could not be read: its display name and
// what went wrong, in words for the user.
type inputTrouble struct {
	File    string
	Message string
}
