package main

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"text/tabwriter"

	"hess/equilibrium"
	"hess/thermo"
)

// aqueousRow is one species of an aqueous result as every format writes
// it: the fields of a species of any result, and for solutes the molality
// and activity coefficient (NaN otherwise).
type aqueousRow struct {
	Name, Phase                    string
	Amount, MoleFraction, Activity float64
	Molality, ActivityCoefficient  float64
}

// aqueousRows lists water, the solutes (by amount, as the solver gives
// them), the pure phases and a gas phase that formed. Mole fractions are
// within each phase; a pure phase's activity is 1 present and 0 absent,
// as in other results; a gas's is its partial pressure over p°.
func aqueousRows(r *aqueousRun, p0 float64) []aqueousRow {
	nan := math.NaN()
	water := r.WaterKg / equilibrium.WaterMolarMass
	total := water
	for _, s := range r.Solutes {
		total += s.Amount
	}
	rows := []aqueousRow{{Name: "H2O(l)", Phase: "aq", Amount: water, MoleFraction: water / total,
		Activity: r.WaterActivity, Molality: nan, ActivityCoefficient: nan}}
	for _, s := range r.Solutes {
		rows = append(rows, aqueousRow{Name: s.Species.Key, Phase: "aq", Amount: s.Amount, MoleFraction: s.Amount / total,
			Activity: math.Pow(10, s.LogActivity), Molality: s.Molality, ActivityCoefficient: s.Gamma})
	}
	for _, m := range r.Minerals {
		one := 0.0
		if m.Present {
			one = 1
		}
		rows = append(rows, aqueousRow{Name: m.Species.Key, Phase: m.Species.Key, Amount: m.Amount, MoleFraction: one,
			Activity: one, Molality: nan, ActivityCoefficient: nan})
	}
	gas := 0.0
	for _, g := range r.Gases {
		if !g.Fixed {
			gas += g.Amount
		}
	}
	for _, g := range r.Gases {
		if !g.Fixed {
			rows = append(rows, aqueousRow{Name: g.Species.Key, Phase: "g", Amount: g.Amount, MoleFraction: g.Amount / gas,
				Activity: g.Pressure / p0, Molality: nan, ActivityCoefficient: nan})
		}
	}
	return rows
}

// aqueousHeading names an aqueous result: mixture, temperature, pressure.
func aqueousHeading(r *aqueousRun) string {
	return fmt.Sprintf("%s at %s, %s (aqueous)", r.Mixture.Name, kelvinText(r.T), pressureText(r.P))
}

// aqueousSummary is the lines under an aqueous result's heading.
func aqueousSummary(r *aqueousRun) []string {
	conv := fmt.Sprintf("converged in %d iterations", r.Iterations)
	if !r.Converged {
		conv = fmt.Sprintf("NOT CONVERGED after %d iterations: these numbers are no equilibrium", r.Iterations)
	}
	pH := "pH: n/a (no H+(aq) in the network)"
	if finite(r.PH) {
		pH = "pH " + fixed(r.PH, 3)
	}
	lines := []string{
		fmt.Sprintf("basis: elements; %s; element residual %s", conv, smallText(r.ElementResidual)),
		fmt.Sprintf("%s; ionic strength %s mol/kg; activity model %s; water %s kg, activity %s",
			pH, sigText(r.I), r.Model, fixed(r.WaterKg, 6), fixed(r.WaterActivity, 6)),
	}
	if r.Beyond {
		lines = append(lines, fmt.Sprintf("warning: the ionic strength is beyond the %s model's range of validity: its activities may be far off", r.Model))
	}
	if len(r.Skipped) > 0 {
		names := ""
		for i, sp := range r.Skipped {
			if i > 0 {
				names += ", "
			}
			names += sp.Key
		}
		lines = append(lines, "left out for lack of data at "+kelvinText(r.T)+": "+names)
	}
	return lines
}

// sigText writes a positive quantity to four significant digits.
func sigText(v float64) string {
	if !finite(v) {
		return missingCell
	}
	return strconv.FormatFloat(v, 'g', 4, 64)
}

// siText writes a saturation index to three decimals ("0.000" within
// rounding of 0, which the solver reaches to about 1e-10).
func siText(v float64) string {
	if !finite(v) {
		return missingCell
	}
	if math.Abs(v) < 5e-4 {
		v = 0
	}
	return fixed(v, 3)
}

// barOf is a pressure in bar.
func barOf(p float64) float64 { return p / thermo.Bar }

// writeAqueousText writes one aqueous result for people: heading, summary,
// species with molality and γ, each mineral's saturation index and what
// each fixed gas exchanged.
func writeAqueousText(b *strings.Builder, r *aqueousRun, p0 float64) {
	fmt.Fprintf(b, "\n%s\n", aqueousHeading(r))
	for _, l := range aqueousSummary(r) {
		fmt.Fprintf(b, "  %s\n", l)
	}
	tw := tabwriter.NewWriter(b, 0, 0, 2, ' ', tabwriter.AlignRight)
	fmt.Fprintln(tw, "  species\tphase\tamount [mol]\tmole fraction\tactivity\tmolality [mol/kg]\tactivity coefficient\t")
	for _, s := range aqueousRows(r, p0) {
		fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t%s\t%s\t%s\t\n", s.Name, s.Phase, amountText(s.Amount), amountText(s.MoleFraction),
			amountText(s.Activity), molalityText(s.Molality), gammaText(s.ActivityCoefficient))
	}
	tw.Flush()
	if len(r.Minerals) > 0 {
		tw = tabwriter.NewWriter(b, 0, 0, 2, ' ', tabwriter.AlignRight)
		fmt.Fprintln(tw, "  mineral\tpresent\tamount [mol]\tsaturation index log10(Q/K)\t")
		for _, m := range r.Minerals {
			fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t\n", m.Species.Key, presentText(m.Present), amountText(m.Amount), siText(m.SI))
		}
		tw.Flush()
	}
	if fixedGases(r) {
		tw = tabwriter.NewWriter(b, 0, 0, 2, ' ', tabwriter.AlignRight)
		fmt.Fprintln(tw, "  fixed gas\tpressure [bar]\ttaken in [mol]\t")
		for _, g := range r.Gases {
			if g.Fixed {
				fmt.Fprintf(tw, "  %s\t%s\t%s\t\n", g.Species.Key, sigText(barOf(g.Pressure)), amountText(g.Taken))
			}
		}
		tw.Flush()
		b.WriteString("  taken in: drawn from the gas's reservoir into the system; negative where the system gives it off\n")
	}
}

// fixedGases reports whether the result holds a gas at a fixed pressure.
func fixedGases(r *aqueousRun) bool {
	for _, g := range r.Gases {
		if g.Fixed {
			return true
		}
	}
	return false
}

// gammaText writes an activity coefficient (blank for non-solutes).
func gammaText(v float64) string {
	if !finite(v) {
		return ""
	}
	return fixed(v, 6)
}

// writeAqueousMarkdown writes one aqueous result as a Markdown section.
func writeAqueousMarkdown(b *strings.Builder, r *aqueousRun, p0 float64) {
	fmt.Fprintf(b, "\n## %s\n\n", mdEscape(aqueousHeading(r)))
	for _, l := range aqueousSummary(r) {
		fmt.Fprintf(b, "- %s\n", mdEscape(l))
	}
	b.WriteString("\n| species | phase | amount [mol] | mole fraction | activity | molality [mol/kg] | activity coefficient |\n|---|---|---:|---:|---:|---:|---:|\n")
	for _, s := range aqueousRows(r, p0) {
		fmt.Fprintf(b, "| %s | %s | %s | %s | %s | %s | %s |\n", mdEscape(s.Name), mdEscape(s.Phase), amountText(s.Amount),
			amountText(s.MoleFraction), amountText(s.Activity), molalityText(s.Molality), gammaText(s.ActivityCoefficient))
	}
	if len(r.Minerals) > 0 {
		b.WriteString("\n| mineral | present | amount [mol] | saturation index log10(Q/K) |\n|---|---|---:|---:|\n")
		for _, m := range r.Minerals {
			fmt.Fprintf(b, "| %s | %s | %s | %s |\n", mdEscape(m.Species.Key), presentText(m.Present), amountText(m.Amount), siText(m.SI))
		}
	}
	if fixedGases(r) {
		b.WriteString("\n| fixed gas | pressure [bar] | taken in [mol] |\n|---|---:|---:|\n")
		for _, g := range r.Gases {
			if g.Fixed {
				fmt.Fprintf(b, "| %s | %s | %s |\n", mdEscape(g.Species.Key), sigText(barOf(g.Pressure)), amountText(g.Taken))
			}
		}
		b.WriteString("\nTaken in: drawn from the gas's reservoir into the system; negative where the system gives it off.\n")
	}
}
