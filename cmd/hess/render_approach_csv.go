package main

import (
	"encoding/csv"
	"fmt"
	"io"
	"math"
	"strconv"

	"hess/equilibrium"
)

// renderApproachCSV writes every mixture's reactions as one CSV table: the
// mixture with its temperature and pressure, then the reaction's numbers,
// empty cells where a value is unknown. A mixture with solutes adds its
// ionic strength to each row and, after its reactions, one row per solute
// (reaction cells empty) with its molality and activity coefficient.
func renderApproachCSV(w io.Writer, doc *approachDoc) error {
	cw := csv.NewWriter(w)
	header := []string{"mixture", "T [K]", "P [bar]", "reaction", "Q", "K", "log10(Q/K)", "dG [kJ/mol]",
		"direction", "T_eq [K]", "approach [K]", "extrapolated", "reason", "I [mol/kg]", "solute", "m [mol/kg]", "gamma"}
	if err := cw.Write(header); err != nil {
		return fmt.Errorf("writing CSV: %w", err)
	}
	for _, a := range doc.Approaches {
		for _, r := range a.Reactions {
			rec := []string{a.Mixture.Name, csvNumber(a.T), csvNumber(a.P / 1e5), r.Reaction.Name,
				csvNumber(math.Exp(r.LnQ)), csvNumber(math.Exp(r.LnK)), csvNumber(r.Log10QOverK()), csvNumber(r.DG / 1000),
				r.Direction.String(), kelvinOrEmpty(r.EquilibriumT), kelvinOrEmpty(r.ApproachK(a.T)),
				strconv.FormatBool(r.Extrapolated), r.Reason(a.T), ionicStrengthCell(a), "", "", ""}
			if err := cw.Write(rec); err != nil {
				return fmt.Errorf("writing CSV: %w", err)
			}
		}
		for _, ab := range a.Absent {
			rec := []string{a.Mixture.Name, csvNumber(a.T), csvNumber(a.P / 1e5), ab.Reaction.Name,
				"", "", "", "", "", "", "", "", "no quotient: " + ab.Reason(), ionicStrengthCell(a), "", "", ""}
			if err := cw.Write(rec); err != nil {
				return fmt.Errorf("writing CSV: %w", err)
			}
		}
		if s := a.Solution; s != nil {
			// One row per solute after the mixture's reactions, the
			// reaction's cells empty.
			for _, sa := range s.Solutes {
				rec := []string{a.Mixture.Name, csvNumber(a.T), csvNumber(a.P / 1e5), "", "", "", "", "", "", "", "", "", "",
					csvNumber(s.I), sa.Species.Key, csvNumber(sa.Molality), csvNumber(sa.Gamma)}
				if err := cw.Write(rec); err != nil {
					return fmt.Errorf("writing CSV: %w", err)
				}
			}
		}
	}
	cw.Flush()
	if err := cw.Error(); err != nil {
		return fmt.Errorf("writing CSV: %w", err)
	}
	return nil
}

// ionicStrengthCell is the mixture's ionic strength, empty without solutes.
func ionicStrengthCell(a *equilibrium.MixtureApproach) string {
	if a.Solution == nil {
		return ""
	}
	return csvNumber(a.Solution.I)
}
