package network

import (
	"strings"

	"hess/lang"
)

// A Check is one named rule of the network: its name is the diagnostic code
// it reports, Doc explains it (the first line is a short title, the rest is
// the paragraph `hess explain` prints), Severity is its default, and Run
// inspects a compiled network. Checks whose findings arise while loading and
// resolving (syntax, includes, names, formulas) have a nil Run: they are
// registered so that explain, SARIF and lint settings know them.
type Check struct {
	Name     string
	Doc      string
	Severity lang.Severity
	Run      func(p *Pass)
	// ApproachOnly marks a note that matters only when a mixture is
	// evaluated: Load leaves the check out, so check, table, plot and the
	// language server stay quiet about it, and hess approach asks for it
	// through Network.ApproachNotes.
	ApproachOnly bool
}

// Code is the code of the check's diagnostics: its name.
func (c *Check) Code() lang.Code { return lang.Code(c.Name) }

// Title is the first line of the check's documentation.
func (c *Check) Title() string {
	title, _, _ := strings.Cut(c.Doc, "\n")
	return strings.TrimSpace(title)
}

// Explanation is the documentation after the title, as one paragraph.
func (c *Check) Explanation() string {
	_, rest, _ := strings.Cut(c.Doc, "\n")
	return strings.Join(strings.Fields(rest), " ")
}
