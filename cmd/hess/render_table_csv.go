package main

import (
	"encoding/csv"
	"fmt"
	"io"
	"strconv"

	"hess/network"
)

// renderTableCSV writes every reaction's rows as one CSV table: the
// reaction's name, then the columns of the other formats with empty cells
// where a value is unknown, Kc in (mol/L)^dn and the dn column beside it.
func renderTableCSV(w io.Writer, doc *tableDoc) error {
	cw := csv.NewWriter(w)
	header := []string{"reaction", "T [K]", "dH [kJ/mol]", "dS [J/mol/K]", "dG [kJ/mol]", "K", "log10 K",
		"Kc [(mol/L)^dn]", "dn", "sigma(log10 K)", "extrapolated", "source", "species log10 K", "difference"}
	if err := cw.Write(header); err != nil {
		return fmt.Errorf("writing CSV: %w", err)
	}
	err := doc.each(func(t tableEntry) error {
		for _, r := range t.Rows {
			rec := []string{t.Reaction.Name, csvNumber(r.T), csvNumber(r.DH / 1000), csvNumber(r.DS), csvNumber(r.DG / 1000),
				csvNumber(r.K), csvNumber(r.Log10K), csvNumber(r.Kc), rational(t.DeltaGasMoles), csvNumber(r.SigmaLog10K),
				csvBool(r), csvSource(r), csvNumber(r.SpeciesLog10K), csvNumber(speciesDifference(r))}
			if err := cw.Write(rec); err != nil {
				return fmt.Errorf("writing CSV: %w", err)
			}
		}
		return nil
	})
	if err != nil {
		return err
	}
	cw.Flush()
	if err := cw.Error(); err != nil {
		return fmt.Errorf("writing CSV: %w", err)
	}
	return nil
}

// csvNumber writes a value with ten significant digits, or nothing when it
// is unknown.
func csvNumber(v float64) string {
	if !finite(v) {
		return ""
	}
	return strconv.FormatFloat(round10(v), 'g', -1, 64)
}

func csvSource(r network.TableRow) string {
	if !r.Valid {
		return ""
	}
	return r.Basis.String()
}

func csvBool(r network.TableRow) string {
	if !r.Valid {
		return ""
	}
	return strconv.FormatBool(r.Extrapolated)
}

// round10 rounds to ten significant digits, so that output does not carry
// the last bits of floating-point arithmetic.
func round10(v float64) float64 {
	r, err := strconv.ParseFloat(strconv.FormatFloat(v, 'g', 10, 64), 64)
	if err != nil {
		return v
	}
	return r
}
