package main

import (
	"fmt"
	"io"
	"math"
	"math/big"
	"strconv"
	"strings"

	"hess/equilibrium"
	"hess/network"
	"hess/thermo"
)

// tableColumn is one column of the text, CSV and Markdown tables: its
// header (units in brackets) and how a row's value is written.
type tableColumn struct {
	header string
	cell   func(r network.TableRow) string
}

// tableColumns are the columns the text and Markdown tables carry, with
// the unit of Kc for a reaction with Δn moles of gas; withSpecies adds
// log10 K from the species' data and the row's difference from it, for a
// reaction whose rows come from elsewhere while its species give K too.
func tableColumns(kcHeader string, withSpecies bool) []tableColumn {
	cols := []tableColumn{
		{"T [K]", func(r network.TableRow) string { return shortNumber(r.T) }},
		{"dH [kJ/mol]", func(r network.TableRow) string { return fixed(r.DH/1000, 3) }},
		{"dS [J/mol/K]", func(r network.TableRow) string { return fixed(r.DS, 3) }},
		{"dG [kJ/mol]", func(r network.TableRow) string { return fixed(r.DG/1000, 3) }},
		{"K", func(r network.TableRow) string { return sci(r.K) }},
		{"log10 K", func(r network.TableRow) string { return fixed(r.Log10K, 4) }},
		{kcHeader, func(r network.TableRow) string { return sci(r.Kc) }},
		{"σ(log10 K)", sigmaCell},
		{"extrapolated", func(r network.TableRow) string {
			if !r.Valid {
				return "n/a"
			}
			if r.Extrapolated {
				return "yes"
			}
			return "no"
		}},
		{"source", sourceCell},
	}
	if withSpecies {
		cols = append(cols,
			tableColumn{"log10 K (species)", func(r network.TableRow) string { return fixedOrBlank(r.SpeciesLog10K, 4) }},
			tableColumn{"difference", func(r network.TableRow) string { return fixedOrBlank(speciesDifference(r), 4) }})
	}
	return cols
}

// sigmaCell is σ(log10 K): n/a where the row has no value, blank where no
// input stated an uncertainty.
func sigmaCell(r network.TableRow) string {
	if !r.Valid {
		return missingCell
	}
	return fixedOrBlank(r.SigmaLog10K, 4)
}

// sourceCell names where a row's numbers come from: species, reaction,
// combination or fit (n/a where no data give it).
func sourceCell(r network.TableRow) string {
	if !r.Valid {
		return missingCell
	}
	return r.Basis.String()
}

// fixedOrBlank is fixed, or blank for an unknown value.
func fixedOrBlank(v float64, decimals int) string {
	if !finite(v) {
		return ""
	}
	return fixed(v, decimals)
}

// speciesDifference is the row's log10 K less that of the species' data
// (NaN where the row comes from the species or they give none).
func speciesDifference(r network.TableRow) float64 {
	if !r.Valid {
		return math.NaN()
	}
	return r.Log10K - r.SpeciesLog10K
}

// hasSpeciesAlternative reports whether some row of the table comes from
// another source while the species' data also give its log10 K.
func hasSpeciesAlternative(t *equilibrium.Table) bool {
	for _, r := range t.Rows {
		if r.Valid && finite(r.SpeciesLog10K) {
			return true
		}
	}
	return false
}

// kcHeader is the Kc column's header with its unit, (mol/L)^Δn.
func kcHeader(dn float64) string {
	if dn == 0 {
		return "Kc"
	}
	return "Kc [" + kcUnit(dn) + "]"
}

// kcUnit writes (mol/L)^Δn: "mol/L", "(mol/L)^2", "(mol/L)^-1/2".
func kcUnit(dn float64) string {
	if dn == 1 {
		return "mol/L"
	}
	return "(mol/L)^" + rational(dn)
}

// rational writes a coefficient as an integer or a small fraction p/q.
func rational(v float64) string {
	if v == math.Trunc(v) {
		return strconv.FormatFloat(v, 'f', 0, 64)
	}
	for q := int64(2); q <= 12; q++ {
		p := math.Round(v * float64(q))
		if math.Abs(p/float64(q)-v) < 1e-9 {
			return big.NewRat(int64(p), q).RatString()
		}
	}
	return strconv.FormatFloat(v, 'g', 6, 64)
}

const missingCell = "n/a"

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// shortNumber writes a temperature with at most four decimals.
func shortNumber(v float64) string {
	if !finite(v) {
		return missingCell
	}
	if a := math.Abs(v); a >= 1e15 || (a < 1e-4 && a > 0) {
		return strconv.FormatFloat(v, 'g', 6, 64)
	}
	return strconv.FormatFloat(math.Round(v*1e4)/1e4, 'f', -1, 64)
}

func fixed(v float64, decimals int) string {
	if !finite(v) {
		return missingCell
	}
	s := strconv.FormatFloat(v, 'f', decimals, 64)
	if strings.Trim(s, "-0.") == "" {
		s = strings.TrimPrefix(s, "-") // no "-0.000"
	}
	return s
}

func sci(v float64) string {
	if !finite(v) {
		return missingCell
	}
	return strconv.FormatFloat(v, 'e', 4, 64)
}

// pressureText writes p° in bar: "1 bar", "1.01325 bar".
func pressureText(p float64) string {
	return strconv.FormatFloat(p/thermo.Bar, 'g', 8, 64) + " bar"
}

// summaryLines describe a reaction above its rows: its constant's kind and
// quotient, Δn, and where ΔrG° changes sign.
func summaryLines(t *equilibrium.Table) []string {
	lines := []string{fmt.Sprintf("%s = %s, Δn(gas) = %s", t.Kind, t.Quotient, rational(t.DeltaGasMoles))}
	valid := false
	for _, r := range t.Rows {
		valid = valid || r.Valid
	}
	if len(t.Rows) > 0 && !valid {
		lines = append(lines, "ΔrG° cannot be computed at these temperatures from the data given")
	}
	if len(t.Untagged) > 0 {
		names := make([]string, len(t.Untagged))
		for i, sp := range t.Untagged {
			names[i] = sp.Key
		}
		lines = append(lines, fmt.Sprintf("no state tag on %s: activity taken as a mole fraction (solution convention)", strings.Join(names, ", ")))
	}
	if f := t.Fit; f != nil {
		lines = append(lines, fitLine(f))
	}
	if len(t.Crossovers) == 0 {
		if t.Tmin < t.Tmax {
			lines = append(lines, fmt.Sprintf("ΔrG° keeps its sign from %s to %s (the range of the %s data)",
				kelvinText(t.Tmin), kelvinText(t.Tmax), t.RangeSource))
		}
		return lines
	}
	for _, c := range t.Crossovers {
		side := "below"
		if c.FavoredAbove {
			side = "above"
		}
		lines = append(lines, fmt.Sprintf("ΔrG° = 0 at %s (K = 1; favoured %s)", kelvinText(c.T), side))
	}
	return lines
}

// fitLine describes a van 't Hoff fit of logk values: its form,
// coefficients, points, range and residual.
func fitLine(f *network.LogKFit) string {
	form := fmt.Sprintf("log10 K = %s %s %s/T", strconv.FormatFloat(f.A, 'g', 6, 64), signText(f.B), strconv.FormatFloat(math.Abs(f.B), 'g', 6, 64))
	if f.Terms == 3 {
		form += fmt.Sprintf(" %s %s·log10 T", signText(f.C), strconv.FormatFloat(math.Abs(f.C), 'g', 6, 64))
	}
	res := "exact (no degree of freedom left)"
	if finite(f.RMS) {
		res = fmt.Sprintf("residual standard error %s, largest residual %s", strconv.FormatFloat(f.RMS, 'f', 4, 64), strconv.FormatFloat(f.MaxAbs, 'f', 4, 64))
	}
	return fmt.Sprintf("fit of %d logk values from %s to %s: %s; %s", f.Points, kelvinText(f.Tmin), kelvinText(f.Tmax), form, res)
}

func signText(v float64) string {
	if v < 0 {
		return "-"
	}
	return "+"
}

func kelvinText(T float64) string {
	if a := math.Abs(T); a >= 1e15 || (a < 1e-2 && a > 0) {
		return strconv.FormatFloat(T, 'g', 6, 64) + " K"
	}
	return strconv.FormatFloat(math.Round(T*100)/100, 'f', -1, 64) + " K"
}

// anyExtrapolated reports whether some row of the table is extrapolated.
func anyExtrapolated(t *equilibrium.Table) bool {
	for _, r := range t.Rows {
		if r.Valid && r.Extrapolated {
			return true
		}
	}
	return false
}

// flushLarge writes out what b holds once it is large and empties it, so
// that the tables of a large network are not all held in memory at once.
func flushLarge(w io.Writer, b *strings.Builder) error {
	if b.Len() < 1<<16 {
		return nil
	}
	_, err := io.WriteString(w, b.String())
	b.Reset()
	return err
}
