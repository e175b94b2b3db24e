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

// tableColumns are the columns every table format carries (CLI.md), with
// the unit of Kc for a reaction with Δn moles of gas.
func tableColumns(kcHeader string) []tableColumn {
	return []tableColumn{
		{"T [K]", func(r network.TableRow) string { return shortNumber(r.T) }},
		{"dH [kJ/mol]", func(r network.TableRow) string { return fixed(r.DH/1000, 3) }},
		{"dS [J/mol/K]", func(r network.TableRow) string { return fixed(r.DS, 3) }},
		{"dG [kJ/mol]", func(r network.TableRow) string { return fixed(r.DG/1000, 3) }},
		{"K", func(r network.TableRow) string { return sci(r.K) }},
		{"log10 K", func(r network.TableRow) string { return fixed(r.Log10K, 4) }},
		{kcHeader, func(r network.TableRow) string { return sci(r.Kc) }},
		{"σ(log10 K)", func(r network.TableRow) string { return fixed(r.SigmaLog10K, 4) }},
		{"extrapolated", func(r network.TableRow) string {
			if !r.Valid {
				return "n/a"
			}
			if r.Extrapolated {
				return "yes"
			}
			return "no"
		}},
	}
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
	if len(t.Crossovers) == 0 {
		if t.Tmin < t.Tmax {
			lines = append(lines, fmt.Sprintf("ΔrG° keeps its sign from %s to %s", kelvinText(t.Tmin), kelvinText(t.Tmax)))
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
