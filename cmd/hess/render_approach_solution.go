package main

import (
	"fmt"
	"strings"
	"unicode/utf8"

	"hess/equilibrium"
)

// solutionSummary is the line that introduces a mixture's solutes: the
// activity model, the ionic strength and water's activity.
func solutionSummary(s *equilibrium.SolutionActivities) string {
	out := fmt.Sprintf("solution: %s activity model, I = %s mol/kg", s.Model, shortSig(s.I))
	if s.Water != nil {
		out += fmt.Sprintf(", a(%s) = %s", s.Water.Key, fixed(s.WaterActivity, 5))
	}
	switch {
	case s.Err != nil:
		out += fmt.Sprintf(" (%v: γ taken as 1)", s.Err)
	case s.Beyond:
		out += " (beyond the model's range of validity)"
	}
	return out
}

// solutionColumns are the header and rows of a mixture's solute table.
func solutionColumns(s *equilibrium.SolutionActivities) [][]string {
	cells := [][]string{{"solute", "m [mol/kg]", "gamma", "log10 gamma", "activity"}}
	for _, a := range s.Solutes {
		cells = append(cells, []string{a.Species.Key, sci(a.Molality), fixed(a.Gamma, 4), fixed(a.Log10Gamma(), 4), sci(a.Activity)})
	}
	return cells
}

// writeSolutionText writes the solute table, indented, names left-aligned.
func writeSolutionText(b *strings.Builder, s *equilibrium.SolutionActivities) {
	fmt.Fprintf(b, "  %s\n", solutionSummary(s))
	cells := solutionColumns(s)
	widths := make([]int, len(cells[0]))
	for _, line := range cells {
		for i, c := range line {
			widths[i] = max(widths[i], utf8.RuneCountInString(c))
		}
	}
	for _, line := range cells {
		b.WriteString("  ")
		for i, c := range line {
			pad := strings.Repeat(" ", widths[i]-utf8.RuneCountInString(c))
			if i == 0 {
				b.WriteString("  " + c + pad)
				continue
			}
			b.WriteString("  " + pad + c)
		}
		b.WriteString("\n")
	}
}

// writeSolutionMarkdown writes the solute table as a pipe table.
func writeSolutionMarkdown(b *strings.Builder, s *equilibrium.SolutionActivities) {
	fmt.Fprintf(b, "%s.\n\n", mdEscape(solutionSummary(s)))
	for i, line := range solutionColumns(s) {
		b.WriteString("|")
		for _, c := range line {
			fmt.Fprintf(b, " %s |", mdEscape(c))
		}
		b.WriteString("\n")
		if i == 0 {
			b.WriteString("|---|" + strings.Repeat("---:|", len(line)-1) + "\n")
		}
	}
	b.WriteString("\n")
}

// shortSig writes a positive number with four significant digits.
func shortSig(v float64) string {
	if !finite(v) {
		return missingCell
	}
	return fmt.Sprintf("%.4g", v)
}
