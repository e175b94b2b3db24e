package main

import (
	"fmt"
	"io"
	"strings"
	"text/tabwriter"
)

// renderEquilibriumText writes each result for people: heading, summary,
// phases, species by amount (trace amounts in scientific notation) and
// each reaction's log10(Q/K).
func renderEquilibriumText(w io.Writer, doc *equilibriumDoc) error {
	var b strings.Builder
	fmt.Fprintf(&b, "Equilibrium of %s (standard pressure p° = %s)\n", doc.Network, pressureText(doc.Pressure))
	for _, c := range doc.Results {
		fmt.Fprintf(&b, "\n%s\n", resultHeading(c))
		for _, l := range resultSummary(c) {
			fmt.Fprintf(&b, "  %s\n", l)
		}
		tw := tabwriter.NewWriter(&b, 0, 0, 2, ' ', tabwriter.AlignRight)
		fmt.Fprintf(tw, "  phase\tpresent\tamount [mol]\t\n")
		for _, p := range c.Phases {
			fmt.Fprintf(tw, "  %s\t%s\t%s\t\n", p.Name, presentText(p.Present), amountText(p.Amount))
		}
		tw.Flush()
		solutes := false
		for _, s := range c.Species {
			solutes = solutes || finite(s.Molality)
		}
		tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', tabwriter.AlignRight)
		head := "  species\tphase\tamount [mol]\tmole fraction\tactivity\t"
		if solutes {
			head += "molality [mol/kg]\t"
		}
		fmt.Fprintln(tw, head)
		for _, s := range c.Sorted() {
			row := fmt.Sprintf("  %s\t%s\t%s\t%s\t%s\t", s.Species.Key, s.Phase, amountText(s.Amount), amountText(s.MoleFraction), amountText(s.Activity))
			if solutes {
				row += molalityText(s.Molality) + "\t"
			}
			fmt.Fprintln(tw, row)
		}
		tw.Flush()
		if len(c.Reactions) > 0 {
			tw = tabwriter.NewWriter(&b, 0, 0, 2, ' ', 0)
			fmt.Fprintf(tw, "  reaction\tlog10(Q/K)\n")
			for _, r := range c.Reactions {
				fmt.Fprintf(tw, "  %s\t%s\n", r.Reaction.Name, reactionText(r))
			}
			tw.Flush()
		}
	}
	for _, r := range doc.Aqueous {
		writeAqueousText(&b, r, doc.Pressure)
	}
	fmt.Fprintf(&b, "\n%s\n", equilibriumCaution)
	lines := strings.Split(b.String(), "\n")
	for i, l := range lines {
		lines[i] = strings.TrimRight(l, " ")
	}
	_, err := io.WriteString(w, strings.Join(lines, "\n"))
	return err
}
