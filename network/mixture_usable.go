package network

import (
	"fmt"
	"sort"

	"hess/lang"
	"hess/thermo"
)

// Usable reports whether the mixture can be evaluated: every item was read
// and the mixture checks find nothing wrong with it as a whole.
func (m *Mixture) Usable() bool {
	return m != nil && m.Valid && len(mixtureIncomplete(m)) == 0 && len(mixtureProblems(m)) == 0
}

// mixtureProblem is one finding about a mixture as a whole.
type mixtureProblem struct {
	check *Check
	span  lang.Span
	msg   string
}

// mixtureIncomplete lists what a mixture lacks: a temperature, a total
// pressure for its gas mole fractions, any member at all.
func mixtureIncomplete(m *Mixture) []mixtureProblem {
	var out []mixtureProblem
	add := func(format string, args ...any) {
		out = append(out, mixtureProblem{mixtureIncompleteCheck, m.NameSpan, fmt.Sprintf(format, args...)})
	}
	if !m.wroteT {
		add("mixture %s gives no temperature (such as temperature 850 degC)", m.Name)
	}
	if _, n := m.gasFractionSum(); n > 0 && !m.wroteP {
		add("mixture %s gives gas mole fractions but no total pressure (such as pressure 25 bar)", m.Name)
	}
	if moles, _ := m.hasMoles(); moles > 0 && !m.wroteP {
		add("mixture %s gives amounts but no pressure (such as pressure 25 bar): a feed is at a temperature and a pressure", m.Name)
	}
	if len(m.Members) == 0 && m.Valid {
		add("mixture %s lists no species", m.Name)
	}
	return out
}

// mixtureProblems lists the amounts of a mixture that cannot give
// activities: zero gas fractions, all-zero fractions, fractions beside
// partial pressures, partial pressures above the total, solution fractions
// above 1.
func mixtureProblems(m *Mixture) []mixtureProblem {
	var out []mixtureProblem
	sum, n := m.gasFractionSum()
	var partials float64
	var partialN int
	for _, mm := range m.Members {
		if mm.Kind == AmountPartialPressure {
			partials += mm.Amount.V
			partialN++
		}
	}
	switch {
	case n > 0 && sum == 0:
		out = append(out, mixtureProblem{mixtureFractionsCheck, m.NameSpan,
			fmt.Sprintf("the gas mole fractions of mixture %s sum to 0: there is nothing to normalise", m.Name)})
	case n > 0:
		for _, mm := range m.Members {
			if mm.Kind == AmountFraction && mm.Amount.V == 0 {
				out = append(out, mixtureProblem{mixtureAmountCheck, mm.Amount.Span,
					fmt.Sprintf("mole fraction of %s is 0, which makes Q zero or infinite: leave the species out, or give its detection limit", mm.Species.Key)})
			}
		}
	}
	if n > 0 && partialN > 0 {
		out = append(out, mixtureProblem{mixtureFractionsCheck, m.NameSpan,
			fmt.Sprintf("mixture %s gives %d gases as mole fractions and %d as partial pressures: give them all one way", m.Name, n, partialN)})
	}
	if partialN > 0 && m.Pressure != nil && partials > m.Pressure.V*(1+1e-9) {
		out = append(out, mixtureProblem{mixtureFractionsCheck, m.Pressure.Span,
			fmt.Sprintf("the partial pressures of mixture %s sum to %s bar, above its pressure %s bar", m.Name,
				barText(partials), barText(m.Pressure.V))})
	}
	if moles, others := m.hasMoles(); moles > 0 && others > 0 {
		out = append(out, mixtureProblem{mixtureFractionsCheck, m.NameSpan,
			fmt.Sprintf("mixture %s gives %d species as amounts (mol) and %d otherwise: a feed gives every member as an amount, such as 1 mol", m.Name, moles, others)})
	} else if moles > 0 {
		total, invalid := 0.0, false
		for _, mm := range m.Members {
			if mm.Kind == AmountMoles {
				total += mm.Amount.V
			} else {
				invalid = true
			}
		}
		if !(total > 0) && !invalid {
			out = append(out, mixtureProblem{mixtureAmountCheck, m.NameSpan,
				fmt.Sprintf("the amounts of mixture %s sum to 0 mol: a feed needs something to feed", m.Name)})
		}
	}
	solution := map[string]float64{}
	for _, mm := range m.Members {
		if mm.Kind == AmountSolution {
			solution[mm.Species.Phase.Tag] += mm.Amount.V
		}
	}
	tags := make([]string, 0, len(solution))
	for tag := range solution {
		tags = append(tags, tag)
	}
	sort.Strings(tags)
	for _, tag := range tags {
		if s := solution[tag]; s > 1+1e-9 {
			out = append(out, mixtureProblem{mixtureFractionsCheck, m.NameSpan,
				fmt.Sprintf("the mole fractions in solution phase %s of mixture %s sum to %.6g, above 1", tag, m.Name, s)})
		}
	}
	return out
}

func barText(pa float64) string { return fmt.Sprintf("%.6g", pa/thermo.Bar) }
