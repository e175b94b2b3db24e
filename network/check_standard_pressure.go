package network

import (
	"fmt"
	"sort"
	"strings"

	"hess/lang"
	"hess/thermo"
)

var unstatedPressureCheck = &Check{
	Name:     "unstated-pressure",
	Severity: lang.Warning,
	Doc: `files state different standard pressures, or some state none
Gas data refer to a standard pressure: S° of a gas, and so G° and K, differ
by R·ln(1.01325) = 0.109 J/mol/K per mole of gas between 1 atm and 1 bar.
A file states the pressure its own data refer to with settings {
standard-pressure 1 atm }, which a species library may carry; hess then
converts its gas entropies and its reactions' dg, ds and logk to the
network's pressure setting. Data in a file that states none are taken at
the network's pressure. Where some files state a standard pressure and a
file with gas data states none, that file's data are taken at the network's
pressure without its saying so: the message names the file and the
pressures; add standard-pressure to it.`,
	Run: func(p *Pass) {
		n := p.Net
		if len(n.Settings.DataPressures) == 0 {
			return
		}
		var stated []string
		for file, dp := range n.Settings.DataPressures {
			stated = append(stated, fmt.Sprintf("%s states %s bar", file, barText(dp.P)))
		}
		sort.Strings(stated)
		first := map[string]lang.Span{}
		var files []string
		note := func(file string, span lang.Span) {
			if _, ok := n.Settings.DataPressures[file]; ok {
				return
			}
			if file == n.Root && n.Settings.PressureSet {
				return // the root's pressure setting says it
			}
			if _, seen := first[file]; !seen {
				first[file] = span
				files = append(files, file)
			}
		}
		for _, sp := range n.Species {
			if sp.Activity() == thermo.ActivityGas && sp.hasThermoData() {
				note(sp.Span.File, sp.Span)
			}
		}
		for _, rx := range n.Reactions {
			if rx.Resolved && (rx.Dg != nil || rx.Ds != nil || len(rx.LogK) > 0) && deltaGasMoles(rx.NetTerms()) != 0 {
				note(rx.file(), rx.NameSpan())
			}
		}
		for _, file := range files {
			p.Reportf(first[file], "the gas data of %s state no standard pressure and are taken at the network's p° = %s bar, while %s",
				file, barText(n.StandardPressure()), strings.Join(stated, ", "))
		}
	},
}
