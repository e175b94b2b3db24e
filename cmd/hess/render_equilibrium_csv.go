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
		"heat [kJ]", "heat per mol feed [kJ/mol]", "element residual", aqueousCSVHeader[0], aqueousCSVHeader[1],
		aqueousCSVHeader[2], aqueousCSVHeader[3], aqueousCSVHeader[4], aqueousCSVHeader[5], aqueousCSVHeader[6]}
	if err := cw.Write(header); err != nil {
		return fmt.Errorf("writing CSV: %w", err)
	}
	for _, c := range doc.Results {
		head := func(item, name, phase string) []string {
			return []string{c.Mixture.Name, csvNumber(c.T), csvNumber(c.P / 1e5), c.Basis.String(),
				strconv.FormatBool(c.Adiabatic), strconv.FormatBool(c.Converged), item, name, phase}
		}
		tail := func(rec []string) []string {
			return append(rec, csvNumber(c.Heat/1000), csvNumber(c.HeatPerMolFeed()/1000), csvNumber(c.ElementResidual), "", "", "", "", "", "", "")
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
	for _, a := range doc.Aqueous {
		for _, rec := range aqueousCSVRows(a, doc.Pressure) {
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

// aqueousCSVHeader names the columns only aqueous results fill.
var aqueousCSVHeader = [7]string{"activity coefficient", "saturation index", "pH", "ionic strength [mol/kg]",
	"activity model", "partial pressure [bar]", "taken in [mol]"}

// aqueousCSVRows writes an aqueous result as rows of the one table: the
// solution (pH, I, model), each species with its molality and γ, each
// mineral with its saturation index, each fixed gas with what it
// exchanged (taken in; negative: given off).
func aqueousCSVRows(a *aqueousRun, p0 float64) [][]string {
	head := func(item, name, phase string) []string {
		return []string{a.Mixture.Name, csvNumber(a.T), csvNumber(barOf(a.P)), "elements", "false",
			strconv.FormatBool(a.Converged), item, name, phase}
	}
	// cells: present, amount, mole fraction, activity, molality, log10(Q/K),
	// heat, heat per mol, residual, then the aqueous columns.
	row := func(h []string, cells ...string) []string {
		rec := append(h, cells...)
		for len(rec) < 9+9+len(aqueousCSVHeader) {
			rec = append(rec, "")
		}
		return rec
	}
	res := csvNumber(a.ElementResidual)
	rows := [][]string{row(head("solution", "aq", "aq"), "", "", "", csvNumber(a.WaterActivity), "", "", "", "", res,
		"", "", csvNumber(a.PH), csvNumber(a.I), a.Model)}
	for _, s := range aqueousRows(a, p0) {
		rows = append(rows, row(head("species", s.Name, s.Phase), "", csvNumber(s.Amount), csvNumber(s.MoleFraction),
			csvNumber(s.Activity), csvNumber(s.Molality), "", "", "", res, csvNumber(s.ActivityCoefficient)))
	}
	for _, m := range a.Minerals {
		rows = append(rows, row(head("mineral", m.Species.Key, m.Species.Key), strconv.FormatBool(m.Present), csvNumber(m.Amount),
			"", "", "", "", "", "", res, "", csvNumber(m.SI)))
	}
	for _, g := range a.Gases {
		if g.Fixed {
			rows = append(rows, row(head("fixed gas", g.Species.Key, "g"), "", "", "", "", "", "", "", "", res,
				"", "", "", "", "", csvNumber(barOf(g.Pressure)), csvNumber(g.Taken)))
		}
	}
	return rows
}
