package main

import (
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"unicode/utf8"

	"hess/equilibrium"
)

// approachColumn is one column of the text, CSV and Markdown approach
// tables: its header (units in brackets) and how a reaction's value is
// written at the mixture's temperature T.
type approachColumn struct {
	header string
	cell   func(r equilibrium.ReactionApproach, T float64) string
}

// approachColumns are the columns every approach format carries, the same
// numbers as the JSON fields of CLI.md.
func approachColumns() []approachColumn {
	return []approachColumn{
		{"reaction", func(r equilibrium.ReactionApproach, _ float64) string { return r.Reaction.Name }},
		{"Q", func(r equilibrium.ReactionApproach, _ float64) string { return sci(math.Exp(r.LnQ)) }},
		{"K", func(r equilibrium.ReactionApproach, _ float64) string { return sci(math.Exp(r.LnK)) }},
		{"log10(Q/K)", func(r equilibrium.ReactionApproach, _ float64) string { return fixed(r.Log10QOverK(), 4) }},
		{"dG [kJ/mol]", func(r equilibrium.ReactionApproach, _ float64) string { return fixed(r.DG/1000, 3) }},
		{"direction", func(r equilibrium.ReactionApproach, _ float64) string { return directionText(r.Direction) }},
		{"T_eq [K]", func(r equilibrium.ReactionApproach, _ float64) string { return fixed(r.EquilibriumT, 2) }},
		{"approach [K]", func(r equilibrium.ReactionApproach, T float64) string { return fixed(r.ApproachK(T), 2) }},
	}
}

func directionText(d equilibrium.Direction) string {
	if s := d.String(); s != "" {
		return s
	}
	return missingCell
}

// mixtureHeading names a mixture with its temperature and total pressure.
func mixtureHeading(a *equilibrium.MixtureApproach) string {
	s := fmt.Sprintf("mixture %s at %s", a.Mixture.Name, kelvinText(a.T))
	if finite(a.P) {
		s += ", " + pressureText(a.P)
	}
	return s
}

// approachSummary is the line that ends a mixture: "3 reactions run
// forward, 1 reverse, 1 at equilibrium", then how many have no K and how
// many have no quotient there.
func approachSummary(a *equilibrium.MixtureApproach) string {
	fwd, rev, eq, unknown := a.Counts()
	verb := "reactions run"
	if fwd == 1 {
		verb = "reaction runs"
	}
	s := fmt.Sprintf("%d %s forward, %d reverse, %d at equilibrium", fwd, verb, rev, eq)
	if unknown > 0 {
		s += fmt.Sprintf("; %d without K at %s", unknown, kelvinText(a.T))
	}
	if n := len(a.Absent); n > 0 {
		s += fmt.Sprintf("; %d not in this mixture", n)
	}
	return s
}

// approachConvention says which way the approach column counts.
const approachConvention = "approach: |T - T_eq|, positive while a reaction is short of equilibrium (Q < K), negative past it (Q > K)"

// approachNotes explain what the rows leave out: reactions with no
// quotient, reactions with no K, extrapolated data.
func approachNotes(a *equilibrium.MixtureApproach) []string {
	var notes []string
	for _, ab := range a.Absent {
		notes = append(notes, fmt.Sprintf("%s: no quotient here (%s)", ab.Reaction.Name, ab.Reason()))
	}
	var extrapolated []string
	for _, r := range a.Reactions {
		if reason := r.Reason(a.T); reason != "" {
			notes = append(notes, fmt.Sprintf("%s: %s", r.Reaction.Name, reason))
		}
		if len(r.EquilibriumTs) > 1 {
			ts := make([]string, len(r.EquilibriumTs))
			for i, t := range r.EquilibriumTs {
				ts[i] = kelvinText(t)
			}
			notes = append(notes, fmt.Sprintf("%s: K = Q at %s inside %s to %s (T_eq is the nearest)", r.Reaction.Name,
				strings.Join(ts, ", "), kelvinText(r.Tmin), kelvinText(r.Tmax)))
		}
		if r.Extrapolated {
			extrapolated = append(extrapolated, r.Reaction.Name)
		}
	}
	if len(extrapolated) > 0 {
		notes = append(notes, "extrapolated: "+strings.Join(extrapolated, ", ")+" use some data outside their temperature range")
	}
	if len(a.Reactions) > 0 {
		notes = append(notes, approachConvention)
	}
	return notes
}

// renderApproachText writes each mixture for a person: a heading, the
// reactions in aligned columns, notes, and the summary line.
func renderApproachText(w io.Writer, doc *approachDoc) error {
	var b strings.Builder
	fmt.Fprintf(&b, "%s: standard pressure p° = %s\n", doc.Network, pressureText(doc.Pressure))
	if len(doc.Approaches) == 0 {
		b.WriteString("\nno mixtures\n")
	}
	cols := approachColumns()
	for _, a := range doc.Approaches {
		fmt.Fprintf(&b, "\n%s\n", mixtureHeading(a))
		if a.Solution != nil {
			writeSolutionText(&b, a.Solution)
		}
		cells := [][]string{make([]string, len(cols))}
		for i, c := range cols {
			cells[0][i] = c.header
		}
		for _, r := range a.Reactions {
			line := make([]string, len(cols))
			for i, c := range cols {
				line[i] = c.cell(r, a.T)
			}
			cells = append(cells, line)
		}
		widths := make([]int, len(cols))
		for _, line := range cells {
			for i, s := range line {
				widths[i] = max(widths[i], utf8.RuneCountInString(s))
			}
		}
		if len(a.Reactions) > 0 {
			for _, line := range cells {
				b.WriteString(" ")
				for i, s := range line {
					pad := strings.Repeat(" ", widths[i]-utf8.RuneCountInString(s))
					if i == 0 {
						b.WriteString(" " + s + pad) // names left-aligned
						continue
					}
					b.WriteString(" " + pad + s)
				}
				b.WriteString("\n")
			}
		}
		for _, n := range approachNotes(a) {
			fmt.Fprintf(&b, "  %s\n", n)
		}
		fmt.Fprintf(&b, "  %s\n", approachSummary(a))
	}
	if _, err := io.WriteString(w, b.String()); err != nil {
		return fmt.Errorf("writing approach table: %w", err)
	}
	return nil
}

// kelvinOrEmpty writes a temperature for CSV: empty when unknown.
func kelvinOrEmpty(v float64) string {
	if !finite(v) {
		return ""
	}
	return strconv.FormatFloat(round10(v), 'g', -1, 64)
}
