package main

import (
	"encoding/csv"
	"fmt"
	"io"
	"math"
	"strconv"
)

// renderApproachCSV writes every mixture's reactions as one CSV table: the
// mixture with its temperature and pressure, then the reaction's numbers,
// empty cells where a value is unknown.
func renderApproachCSV(w io.Writer, doc *approachDoc) error {
	cw := csv.NewWriter(w)
	header := []string{"mixture", "T [K]", "P [bar]", "reaction", "Q", "K", "log10(Q/K)", "dG [kJ/mol]",
		"direction", "T_eq [K]", "approach [K]", "extrapolated", "reason"}
	if err := cw.Write(header); err != nil {
		return fmt.Errorf("writing CSV: %w", err)
	}
	for _, a := range doc.Approaches {
		for _, r := range a.Reactions {
			rec := []string{a.Mixture.Name, csvNumber(a.T), csvNumber(a.P / 1e5), r.Reaction.Name,
				csvNumber(math.Exp(r.LnQ)), csvNumber(math.Exp(r.LnK)), csvNumber(r.Log10QOverK()), csvNumber(r.DG / 1000),
				r.Direction.String(), kelvinOrEmpty(r.EquilibriumT), kelvinOrEmpty(r.ApproachK(a.T)),
				strconv.FormatBool(r.Extrapolated), r.Reason(a.T)}
			if err := cw.Write(rec); err != nil {
				return fmt.Errorf("writing CSV: %w", err)
			}
		}
		for _, ab := range a.Absent {
			rec := []string{a.Mixture.Name, csvNumber(a.T), csvNumber(a.P / 1e5), ab.Reaction.Name,
				"", "", "", "", "", "", "", "", "no quotient: " + ab.Reason()}
			if err := cw.Write(rec); err != nil {
				return fmt.Errorf("writing CSV: %w", err)
			}
		}
	}
	cw.Flush()
	if err := cw.Error(); err != nil {
		return fmt.Errorf("writing CSV: %w", err)
	}
	return nil
}
