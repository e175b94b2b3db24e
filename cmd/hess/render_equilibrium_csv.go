package main

import (
	"encoding/csv"
	"fmt"
	"io"
	"strconv"
)

// renderEquilibriumCSV writes every result as rows of one table: a row per
// phase, species and reaction, each with its result's conditions, heat and
// residual; empty cells where a value does not apply.
func renderEquilibriumCSV(w io.Writer, doc *equilibriumDoc) error {
	cw := csv.NewWriter(w)
	header := []string{"mixture", "T [K]", "P [bar]", "basis", "adiabatic", "converged", "item", "name", "phase",
		"present", "amount [mol]", "mole fraction", "activity", "molality [mol/kg]", "log10(Q/K)",
		"heat [kJ]", "heat per mol feed [kJ/mol]", "element residual"}
	if err := cw.Write(header); err != nil {
		return fmt.Errorf("writing CSV: %w", err)
	}
	for _, c := range doc.Results {
		head := func(item, name, phase string) []string {
			return []string{c.Mixture.Name, csvNumber(c.T), csvNumber(c.P / 1e5), c.Basis.String(),
				strconv.FormatBool(c.Adiabatic), strconv.FormatBool(c.Converged), item, name, phase}
		}
		tail := func(rec []string) []string {
			return append(rec, csvNumber(c.Heat/1000), csvNumber(c.HeatPerMolFeed()/1000), csvNumber(c.ElementResidual))
		}
		var rows [][]string
		for _, p := range c.Phases {
			rows = append(rows, tail(append(head("phase", p.Name, p.Name), strconv.FormatBool(p.Present), csvNumber(p.Amount), "", "", "", "")))
		}
		for _, s := range c.Sorted() {
			rows = append(rows, tail(append(head("species", s.Species.Key, s.Phase), "", csvNumber(s.Amount),
				csvNumber(s.MoleFraction), csvNumber(s.Activity), csvNumber(s.Molality), "")))
		}
		for _, r := range c.Reactions {
			rows = append(rows, tail(append(head("reaction", r.Reaction.Name, ""), "", "", "", "", "", csvNumber(r.Log10QoverK))))
		}
		for _, rec := range rows {
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
