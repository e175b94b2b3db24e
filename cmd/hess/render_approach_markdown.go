package main

import (
	"fmt"
	"io"
	"strings"
)

// renderApproachMarkdown writes the mixtures as a Markdown document: a
// heading per mixture, a pipe table of its reactions, notes and the
// summary line.
func renderApproachMarkdown(w io.Writer, doc *approachDoc) error {
	var b strings.Builder
	fmt.Fprintf(&b, "# Approach to equilibrium in %s\n\nStandard pressure p° = %s.\n", mdEscape(doc.Network), pressureText(doc.Pressure))
	cols := approachColumns()
	for _, a := range doc.Approaches {
		fmt.Fprintf(&b, "\n## %s\n\n", mdEscape(mixtureHeading(a)))
		if a.Solution != nil {
			writeSolutionMarkdown(&b, a.Solution)
		}
		if len(a.Reactions) > 0 {
			b.WriteString("|")
			for _, c := range cols {
				fmt.Fprintf(&b, " %s |", mdEscape(c.header))
			}
			b.WriteString("\n|")
			for i := range cols {
				if i == 0 || i == 5 {
					b.WriteString("---|")
					continue
				}
				b.WriteString("---:|")
			}
			b.WriteString("\n")
			for _, r := range a.Reactions {
				b.WriteString("|")
				for _, c := range cols {
					fmt.Fprintf(&b, " %s |", mdEscape(c.cell(r, a.T)))
				}
				b.WriteString("\n")
			}
			b.WriteString("\n")
		}
		notes := approachNotes(a)
		for _, n := range notes {
			fmt.Fprintf(&b, "- %s\n", mdEscape(n))
		}
		if len(notes) > 0 {
			b.WriteString("\n")
		}
		fmt.Fprintf(&b, "%s.\n", mdEscape(approachSummary(a)))
	}
	if _, err := io.WriteString(w, b.String()); err != nil {
		return fmt.Errorf("writing Markdown approach: %w", err)
	}
	return nil
}
