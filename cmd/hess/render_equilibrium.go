package main

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"hess/equilibrium"
)

// equilibriumCaution ends the text and Markdown results.
const equilibriumCaution = "Caution: estimates from the data given; check them against local codes and licensed engineering practice before relying on them."

// amountText writes an amount, a mole fraction or an activity: six
// decimals, trace values (below 1e-4) in scientific notation, 0 as 0.
func amountText(v float64) string {
	switch {
	case !finite(v):
		return missingCell
	case v == 0:
		return "0"
	case math.Abs(v) < 1e-4:
		return strconv.FormatFloat(v, 'e', 4, 64)
	case math.Abs(v) >= 1e7:
		return strconv.FormatFloat(v, 'e', 6, 64)
	}
	return strconv.FormatFloat(v, 'f', 6, 64)
}

// resultHeading names a result: mixture, temperature and pressure.
func resultHeading(c *equilibrium.Composition) string {
	s := fmt.Sprintf("%s at %s, %s", c.Mixture.Name, kelvinText(c.T), pressureText(c.P))
	if c.Adiabatic {
		s += " (adiabatic)"
	}
	return s
}

// resultSummary is the lines under a result's heading.
func resultSummary(c *equilibrium.Composition) []string {
	conv := fmt.Sprintf("converged in %d iterations", c.Iterations)
	if !c.Converged {
		conv = fmt.Sprintf("NOT CONVERGED after %d iterations: these numbers are no equilibrium", c.Iterations)
	}
	lines := []string{
		fmt.Sprintf("basis: %s; %s; element residual %s, stationarity %s", c.Basis, conv, smallText(c.ElementResidual), smallText(c.Stationarity)),
		fmt.Sprintf("feed: %s mol at %s", amountText(c.FeedMoles), kelvinText(c.FeedT)),
	}
	if finite(c.Heat) {
		lines = append(lines, fmt.Sprintf("heat to bring the feed to the products at %s: %s kJ (%s kJ per mol of feed)",
			kelvinText(c.T), fixed(c.Heat/1000, 3), fixed(c.HeatPerMolFeed()/1000, 3)))
	} else {
		lines = append(lines, "heat: unknown: "+c.HeatNote)
	}
	if c.AdjustedMu {
		lines = append(lines, "some standard chemical potentials were fitted to the reactions' own ΔrG° (see docs/commands.md)")
	}
	if len(c.Extrapolated) > 0 {
		lines = append(lines, "extrapolated: the data of "+extrapolatedNames(c)+" state no range and hold by default within 100 K of 298.15 K; at "+kelvinText(c.T)+" they are carried on as constant ΔfH°, S° and Cp°")
	}
	return lines
}

// presentText is "present" or "absent".
func presentText(p bool) string {
	if p {
		return "present"
	}
	return "absent"
}

// reactionText is log10(Q/K) or why it is missing.
func reactionText(r equilibrium.ReactionBalance) string {
	if finite(r.Log10QoverK) {
		return smallText(r.Log10QoverK)
	}
	return "n/a (a species is absent or ΔrG° unknown)"
}

// molalityText is a solute's molality, blank otherwise.
func molalityText(v float64) string {
	if !finite(v) {
		return ""
	}
	return amountText(v)
}

// smallText writes a residual: three significant digits, and "< 1e-12"
// for values at the rounding of double precision, which differ from one
// machine to another.
func smallText(v float64) string {
	if finite(v) && math.Abs(v) < 1e-12 {
		return "< 1e-12"
	}
	if !finite(v) {
		return missingCell
	}
	return strconv.FormatFloat(v, 'e', 2, 64)
}

// extrapolatedNames lists the species a result carried beyond their data's
// range, as "A, B and C".
func extrapolatedNames(c *equilibrium.Composition) string {
	names := make([]string, len(c.Extrapolated))
	for i, sp := range c.Extrapolated {
		names[i] = sp.Key
	}
	if len(names) == 1 {
		return names[0]
	}
	return strings.Join(names[:len(names)-1], ", ") + " and " + names[len(names)-1]
}
