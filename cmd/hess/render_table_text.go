package main

import (
	"fmt"
	"io"
	"strings"
	"unicode/utf8"
)

// renderTableText writes the tables for a person: per reaction a heading
// with its equation, the kind and quotient of its constant, its crossovers,
// then the rows in aligned columns with units in the headers.
func renderTableText(w io.Writer, doc *tableDoc) error {
	var b strings.Builder
	fmt.Fprintf(&b, "%s: standard pressure p° = %s\n", doc.Network, pressureText(doc.Pressure))
	if len(doc.reactions) == 0 {
		b.WriteString("\nno reactions\n")
	}
	extrapolated := false
	err := doc.each(func(t tableEntry) error {
		extrapolated = extrapolated || anyExtrapolated(t.Table)
		fmt.Fprintf(&b, "\n%s: %s\n", t.Reaction.Name, t.Reaction.EquationText())
		for _, line := range summaryLines(t.Table) {
			fmt.Fprintf(&b, "  %s\n", line)
		}
		if rr := t.Reverse; rr != nil {
			fmt.Fprintf(&b, "  %s\n", reverseRateLine(rr))
		}
		cols := tableColumns(kcHeader(t.DeltaGasMoles), hasSpeciesAlternative(t.Table))
		cells := make([][]string, 0, len(t.Rows)+1)
		head := make([]string, len(cols))
		for i, c := range cols {
			head[i] = c.header
		}
		cells = append(cells, head)
		for _, r := range t.Rows {
			line := make([]string, len(cols))
			for i, c := range cols {
				line[i] = c.cell(r)
			}
			cells = append(cells, line)
		}
		widths := make([]int, len(cols))
		for _, line := range cells {
			for i, s := range line {
				widths[i] = max(widths[i], utf8.RuneCountInString(s))
			}
		}
		for _, line := range cells {
			b.WriteString(" ")
			for i, s := range line {
				b.WriteString(" ")
				b.WriteString(strings.Repeat(" ", widths[i]-utf8.RuneCountInString(s)))
				b.WriteString(s)
			}
			b.WriteString("\n")
		}
		if err := flushLarge(w, &b); err != nil {
			return fmt.Errorf("writing table: %w", err)
		}
		return nil
	})
	if err != nil {
		return err
	}
	if extrapolated {
		b.WriteString("\nextrapolated: some data are used outside their temperature range\n")
	}
	if _, err := io.WriteString(w, b.String()); err != nil {
		return fmt.Errorf("writing table: %w", err)
	}
	return nil
}
