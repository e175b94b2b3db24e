package main

import (
	"fmt"
	"io"
	"strings"
)

// renderEquilibriumMarkdown writes each result as a section: summary, then
// tables of phases, species (by amount) and reactions.
func renderEquilibriumMarkdown(w io.Writer, doc *equilibriumDoc) error {
	var b strings.Builder
	fmt.Fprintf(&b, "# Equilibrium of %s\n\nStandard pressure p° = %s.\n", mdEscape(doc.Network), pressureText(doc.Pressure))
	for _, c := range doc.Results {
		fmt.Fprintf(&b, "\n## %s\n\n", mdEscape(resultHeading(c)))
		for _, l := range resultSummary(c) {
			fmt.Fprintf(&b, "- %s\n", mdEscape(l))
		}
		b.WriteString("\n| phase | present | amount [mol] |\n|---|---|---:|\n")
		for _, p := range c.Phases {
			fmt.Fprintf(&b, "| %s | %s | %s |\n", mdEscape(p.Name), presentText(p.Present), amountText(p.Amount))
		}
		b.WriteString("\n| species | phase | amount [mol] | mole fraction | activity | molality [mol/kg] |\n|---|---|---:|---:|---:|---:|\n")
		for _, s := range c.Sorted() {
			fmt.Fprintf(&b, "| %s | %s | %s | %s | %s | %s |\n", mdEscape(s.Species.Key), mdEscape(s.Phase),
				amountText(s.Amount), amountText(s.MoleFraction), amountText(s.Activity), molalityText(s.Molality))
		}
		if len(c.Reactions) > 0 {
			b.WriteString("\n| reaction | log10(Q/K) |\n|---|---:|\n")
			for _, r := range c.Reactions {
				fmt.Fprintf(&b, "| %s | %s |\n", mdEscape(r.Reaction.Name), mdEscape(reactionText(r)))
			}
		}
	}
	for _, r := range doc.Aqueous {
		writeAqueousMarkdown(&b, r, doc.Pressure)
	}
	fmt.Fprintf(&b, "\n%s\n", equilibriumCaution)
	_, err := io.WriteString(w, b.String())
	return err
}
