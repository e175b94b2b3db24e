package main

import (
	"bytes"
	"fmt"
	"io"
	"strconv"
	"strings"

	"hess/equilibrium"
	"hess/lang"
	"hess/network"
	"hess/thermo"
)

const equilibriumHelp = "Bring each feed of the network (every mixture that gives its members as\n" +
	"amounts, such as CH4(g) 1 mol, or only gases as mole fractions, a feed of\n" +
	"1 mol), or the mixtures named, to chemical equilibrium by minimising the\n" +
	"Gibbs energy at the mixture's temperature and pressure, or at each of\n" +
	"--temperatures (a sweep) and at --pressure.\n\n" +
	"By default the amounts change only along the network's reactions whose\n" +
	"ΔrG°(T) is known, two-way (<->) and one-way (->) alike: n = n0 + N·ξ, so only\n" +
	"what the network says can happen may happen. With --elements every species\n" +
	"with data at T may form, constrained only by element and charge balance.\n" +
	"Phases: one ideal gas, pure condensed phases (present or absent), ideal\n" +
	"solutions, and dilute ideal aqueous solutes in H2O(l).\n\n" +
	"A feed with water as solvent (H2O(l) 1 kg, solutes and minerals in mol) in a\n" +
	"network with aq species, or open to a gas held fixed (CO2(g) 0.0004 bar\n" +
	"fixed), is solved as a solution: the network's activity model, pH, ionic\n" +
	"strength, molality and activity coefficient per solute, each mineral's\n" +
	"saturation index and what each fixed gas exchanged (element basis; no\n" +
	"--adiabatic).\n\n" +
	"--adiabatic holds the enthalpy instead of the temperature: the result is at\n" +
	"the temperature where the products have the feed's enthalpy at its own\n" +
	"temperature (adiabatic reaction or flame temperature). Each result gives the\n" +
	"heat to take the feed from its own temperature to the products at T.\n" +
	"Diagnostics go to stderr; a network with errors or a bad feed gives no\n" +
	"numbers (exit status 1), and so does a calculation that did not converge\n" +
	"(its results are printed, marked).\n\n" + cautionText

func runEquilibrium(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("equilibrium", "equilibrium [--mixture NAME]... [--temperatures LIST] [--pressure P] [--adiabatic] [--elements] [--format text|csv|json|markdown] [-o FILE] [--include-path DIR]... FILE",
		equilibriumHelp, stderr)
	format := &choice{value: "text", allowed: []string{"text", "csv", "json", "markdown"}}
	fs.Var(format, "format", "output format: text, csv, json or markdown")
	var names nameList
	fs.Var(&names, "mixture", "bring this mixture `NAME` to equilibrium (repeatable; default: every feed)")
	temps := fs.String("temperatures", "", "temperatures instead of each mixture's, e.g. \"700 K to 1200 K by 25 K\"")
	pressure := fs.String("pressure", "", "pressure instead of each mixture's, e.g. \"25 bar\"")
	adiabatic := fs.Bool("adiabatic", false, "hold the enthalpy: find the adiabatic temperature")
	elements := fs.Bool("elements", false, "let every species with data form (element and charge balance only)")
	out := fs.String("o", "", "write the results to `FILE` (atomically) instead of stdout")
	includes := includePathFlag(fs)
	files, status, ok := parseFlags(fs, args, stdout)
	if !ok {
		return status
	}
	if len(files) != 1 {
		fmt.Fprintln(stderr, "hess equilibrium: give exactly one root file")
		fs.Usage()
		return exitTrouble
	}
	req := equilibriumRequest{root: files[0], names: names, adiabatic: *adiabatic, includes: *includes}
	if *elements {
		req.basis = equilibrium.BasisElements
	}
	if *temps != "" {
		if *adiabatic {
			fmt.Fprintln(stderr, "hess equilibrium: --adiabatic finds the temperature; it takes no --temperatures")
			return exitTrouble
		}
		ts, err := network.ParseTemperatures(*temps)
		if err != nil {
			fmt.Fprintf(stderr, "hess equilibrium: --temperatures: %v\n", err)
			return exitTrouble
		}
		req.temps = ts
	}
	if *pressure != "" {
		p, err := parsePressure(*pressure)
		if err != nil {
			fmt.Fprintf(stderr, "hess equilibrium: --pressure: %v\n", err)
			return exitTrouble
		}
		req.pressure = p
	}
	doc, status := equilibriumDocument(req, stderr)
	if doc == nil {
		return status
	}
	data, err := renderEquilibriumFormat(doc, format.value)
	if err != nil {
		fmt.Fprintf(stderr, "hess equilibrium: %v\n", err)
		return exitTrouble
	}
	if *out != "" {
		err = writeOutput(*out, doc.net, data)
	} else {
		_, err = stdout.Write(data)
	}
	if err != nil {
		fmt.Fprintf(stderr, "hess equilibrium: %v\n", err)
		return exitTrouble
	}
	return status
}

// parsePressure reads a pressure such as "25 bar" or "101325 Pa", in Pa.
func parsePressure(text string) (float64, error) {
	fields := strings.Fields(text)
	if len(fields) != 2 {
		return 0, fmt.Errorf("%q: give a number and a pressure unit, such as 25 bar", text)
	}
	v, err := strconv.ParseFloat(fields[0], 64)
	if err != nil {
		return 0, fmt.Errorf("%q: %s is not a number", text, fields[0])
	}
	u, err := thermo.ParseUnit(fields[1])
	if err != nil {
		return 0, err
	}
	if u.Dim != thermo.DimPressure {
		return 0, fmt.Errorf("%q: %s is not a pressure unit", text, fields[1])
	}
	p := u.ToSI(v)
	if !(p > 0) || p > 1e12 {
		return 0, fmt.Errorf("%q: the pressure must be above 0 and at most 10^12 Pa", text)
	}
	return p, nil
}

// maxEquilibriumResults bounds the solves of one run (mixtures ×
// temperatures).
const maxEquilibriumResults = 20000

// equilibriumRequest is what to compute.
type equilibriumRequest struct {
	root      string
	includes  []string // more folders includes may come from
	names     []string
	temps     []float64 // nil: each mixture's
	pressure  float64   // 0: each mixture's
	basis     equilibrium.Basis
	adiabatic bool
}

// equilibriumDoc is what the renderers print.
type equilibriumDoc struct {
	Network  string
	Pressure float64 // p°, Pa
	Results  []*equilibrium.Composition
	// Aqueous are the results of aqueous feeds (equilibrium.IsAqueousFeed),
	// written after the others.
	Aqueous []*aqueousRun

	net *network.Network
}

// equilibriumDocument compiles the network, reports its diagnostics and
// computes every result. It returns nil and the exit status when there is
// nothing to print; a document with a non-converged result comes with
// exit status 1.
func equilibriumDocument(req equilibriumRequest, stderr io.Writer) (*equilibriumDoc, int) {
	net, status := compileRoot("equilibrium", req.root, network.Options{Temperatures: req.temps, IncludePaths: req.includes}, stderr)
	if net == nil {
		return nil, status
	}
	diags := net.Diagnostics
	report := func(ds lang.Diagnostics) bool {
		if len(ds) == 0 {
			return true
		}
		return renderText(stderr, networkReport(net, ds), useColor("auto", stderr)) == nil
	}
	if diags.HasErrors() {
		report(diags)
		fmt.Fprintf(stderr, "hess equilibrium: %s has errors; no output written\n", displayName(req.root))
		return nil, exitFindings
	}
	mixtures, status := equilibriumMixtures(net, req, stderr)
	if mixtures == nil {
		return nil, status
	}
	doc := &equilibriumDoc{Network: displayName(req.root), Pressure: net.StandardPressure(), net: net}
	bad, warnings, err := equilibrateMixtures(doc, mixtures, req)
	if err != nil {
		fmt.Fprintf(stderr, "hess equilibrium: %v\n", err)
		return nil, exitTrouble
	}
	if len(bad) > 0 {
		bad = append(diags, uniqueDiagnostics(bad)...)
		bad.Sort()
		report(bad)
		fmt.Fprintf(stderr, "hess equilibrium: %s has feeds that cannot be brought to equilibrium; no output written\n", displayName(req.root))
		return nil, exitFindings
	}
	if len(warnings) > 0 {
		diags = append(append(lang.Diagnostics{}, diags...), warnings...)
		diags.Sort()
	}
	if !report(diags) {
		return nil, exitTrouble
	}
	return doc, convergenceStatus(doc, stderr)
}

// equilibriumMixtures picks the mixtures to bring to equilibrium: those the
// request names, or else every feed of the network, bounded by
// maxEquilibriumResults results in all. It returns nil and the exit status,
// with a message on stderr, when there is nothing to compute.
func equilibriumMixtures(net *network.Network, req equilibriumRequest, stderr io.Writer) ([]*network.Mixture, int) {
	var mixtures []*network.Mixture
	for _, name := range req.names {
		m := net.LookupMixture(name)
		if m == nil {
			fmt.Fprintf(stderr, "hess equilibrium: %s has no mixture named %q\n", displayName(req.root), name)
			return nil, exitTrouble
		}
		mixtures = append(mixtures, m)
	}
	if len(req.names) == 0 {
		for _, m := range net.Mixtures {
			if m.IsFeed() || equilibrium.IsAqueousFeed(net, m) {
				mixtures = append(mixtures, m)
			}
		}
		if len(mixtures) == 0 {
			fmt.Fprintf(stderr, "hess equilibrium: %s has no feed: a mixture that gives its members as amounts, such as CH4(g) 1 mol\n", displayName(req.root))
			return nil, exitTrouble
		}
	}
	if n := len(mixtures) * max(len(req.temps), 1); n > maxEquilibriumResults {
		fmt.Fprintf(stderr, "hess equilibrium: %d mixtures × %d temperatures make %d results (at most %d): name fewer mixtures or temperatures\n",
			len(mixtures), max(len(req.temps), 1), n, maxEquilibriumResults)
		return nil, exitTrouble
	}
	return mixtures, exitOK
}

// equilibrateMixtures computes each mixture at each requested temperature
// (once when none is given or the search is adiabatic) into doc, each result
// of a gas feed warm-started from the one before. A mixture whose
// diagnostics hold an error stops at that temperature; its errors come back
// in bad, and the diagnostics of aqueous results that went through come back
// in warnings. An error is a failure of the solver itself.
func equilibrateMixtures(doc *equilibriumDoc, mixtures []*network.Mixture, req equilibriumRequest) (bad, warnings lang.Diagnostics, err error) {
	net := doc.net
	for _, m := range mixtures {
		temps := req.temps
		if temps == nil || req.adiabatic {
			temps = []float64{0}
		}
		if equilibrium.IsAqueousFeed(net, m) || m.HasFixed() {
			for _, T := range temps {
				run, ds := equilibrateAqueous(net, m, req, T)
				if ds.HasErrors() {
					bad = append(bad, ds...)
					break
				}
				warnings = append(warnings, ds...)
				doc.Aqueous = append(doc.Aqueous, run)
			}
			continue
		}
		var prev *equilibrium.Composition
		for _, T := range temps {
			c, ds, err := equilibrium.Equilibrate(net, m, equilibrium.Options{T: T, P: req.pressure, Basis: req.basis, Adiabatic: req.adiabatic, Start: prev})
			if err != nil {
				return nil, nil, err
			}
			if len(ds) > 0 {
				bad = append(bad, ds...)
				break
			}
			prev = c
			doc.Results = append(doc.Results, c)
		}
	}
	return bad, warnings, nil
}

// convergenceStatus says on stderr which results of doc did not converge
// and returns the exit status: exitFindings when any did, else exitOK.
func convergenceStatus(doc *equilibriumDoc, stderr io.Writer) int {
	status := exitOK
	for _, c := range doc.Results {
		if !c.Converged {
			fmt.Fprintf(stderr, "hess equilibrium: mixture %s at %s did not converge (element residual %.3g, stationarity %.3g); its numbers are not an equilibrium\n",
				c.Mixture.Name, kelvinText(c.T), c.ElementResidual, c.Stationarity)
			status = exitFindings
		}
	}
	for _, r := range doc.Aqueous {
		if !r.Converged {
			fmt.Fprintf(stderr, "hess equilibrium: mixture %s at %s did not converge (element residual %.3g); its numbers are not an equilibrium\n",
				r.Mixture.Name, kelvinText(r.T), r.ElementResidual)
			status = exitFindings
		}
	}
	return status
}

// uniqueDiagnostics drops repeats (the same feed refused at several
// temperatures of a sweep reports once per message).
func uniqueDiagnostics(ds lang.Diagnostics) lang.Diagnostics {
	seen := map[string]bool{}
	var out lang.Diagnostics
	for _, d := range ds {
		key := fmt.Sprintf("%s|%d|%s", d.Subject.File, d.Subject.Start.Offset, d.Message)
		if !seen[key] {
			seen[key] = true
			out = append(out, d)
		}
	}
	return out
}

// renderEquilibriumFormat renders the document in one of the formats.
func renderEquilibriumFormat(doc *equilibriumDoc, format string) ([]byte, error) {
	var buf bytes.Buffer
	var err error
	switch format {
	case "text":
		err = renderEquilibriumText(&buf, doc)
	case "csv":
		err = renderEquilibriumCSV(&buf, doc)
	case "json":
		err = renderEquilibriumJSON(&buf, doc)
	case "markdown":
		err = renderEquilibriumMarkdown(&buf, doc)
	default:
		err = fmt.Errorf("unknown equilibrium format %q", format)
	}
	if err != nil {
		return nil, err
	}
	return buf.Bytes(), nil
}
