package main

import (
	"fmt"
	"io"
	"strings"
)

// renderTableMarkdown writes the tables as a Markdown document: a heading
// per reaction, its equation and quotient in code spans, its crossovers
// and fitted reverse rate, and a pipe table with right-aligned columns.
func renderTableMarkdown(w io.Writer, doc *tableDoc) error {
	var b strings.Builder
	fmt.Fprintf(&b, "# Equilibrium constants of %s\n\nStandard pressure p° = %s.\n", mdEscape(doc.Network), pressureText(doc.Pressure))
	extrapolated := false
	err := doc.each(func(t tableEntry) error {
		extrapolated = extrapolated || anyExtrapolated(t.Table)
		fmt.Fprintf(&b, "\n## %s\n\n`%s`\n\n", mdEscape(t.Reaction.Name), t.Reaction.EquationText())
		fmt.Fprintf(&b, "- %s = `%s`, Δn(gas) = %s\n", t.Kind, t.Quotient, rational(t.DeltaGasMoles))
		for _, line := range summaryLines(t.Table)[1:] {
			fmt.Fprintf(&b, "- %s\n", line)
		}
		if rr := t.Reverse; rr != nil {
			fmt.Fprintf(&b, "- %s\n", mdEscape(reverseRateLine(rr)))
		}
		cols := tableColumns(kcHeader(t.DeltaGasMoles), hasSpeciesAlternative(t.Table))
		b.WriteString("\n|")
		for _, c := range cols {
			fmt.Fprintf(&b, " %s |", mdEscape(c.header))
		}
		b.WriteString("\n|")
		for range cols {
			b.WriteString("---:|")
		}
		b.WriteString("\n")
		for _, r := range t.Rows {
			b.WriteString("|")
			for _, c := range cols {
				fmt.Fprintf(&b, " %s |", mdEscape(c.cell(r)))
			}
			b.WriteString("\n")
		}
		if err := flushLarge(w, &b); err != nil {
			return fmt.Errorf("writing Markdown table: %w", err)
		}
		return nil
	})
	if err != nil {
		return err
	}
	if extrapolated {
		b.WriteString("\nRows marked extrapolated use some data outside their temperature range.\n")
	}
	if _, err := io.WriteString(w, b.String()); err != nil {
		return fmt.Errorf("writing Markdown table: %w", err)
	}
	return nil
}

// mdEscape keeps text from being read as a Markdown table border or
// emphasis.
func mdEscape(s string) string {
	return strings.NewReplacer("|", `\|`, "*", `\*`, "_", `\_`).Replace(s)
}
