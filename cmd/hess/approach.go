package main

import (
	"bytes"
	"fmt"
	"io"

	"hess/equilibrium"
	"hess/network"
)

func runApproach(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("approach", "approach [--mixture NAME] [--format text|csv|json|markdown] FILE",
		"For each mixture of the network (or the one named) and each reaction whose\n"+
			"species it lists: the reaction quotient Q on the network's activity\n"+
			"conventions (gas p/p°, solute m/(1 mol/kg), solution mole fraction, pure\n"+
			"phase 1), K at the mixture's temperature, ΔrG = ΔrG° + RT ln Q, which way\n"+
			"the reaction would run (equilibrium when |ΔrG| is within the settings'\n"+
			"tolerance), and the approach to equilibrium: the temperature at which K\n"+
			"would equal Q, and the mixture's temperature minus it. Diagnostics go to\n"+
			"stderr; a network with errors gives no numbers (exit status 1).\n\n"+
			cautionText, stderr)
	format := &choice{value: "text", allowed: []string{"text", "csv", "json", "markdown"}}
	fs.Var(format, "format", "output format: text, csv, json or markdown")
	mixture := fs.String("mixture", "", "evaluate only the mixture of this `NAME`")
	files, status, ok := parseFlags(fs, args, stdout)
	if !ok {
		return status
	}
	if len(files) != 1 {
		fmt.Fprintln(stderr, "hess approach: give exactly one root file")
		fs.Usage()
		return exitTrouble
	}
	doc, status := approachDocument(files[0], *mixture, stderr)
	if doc == nil {
		return status
	}
	data, err := renderApproachFormat(doc, format.value)
	if err != nil {
		fmt.Fprintf(stderr, "hess approach: %v\n", err)
		return exitTrouble
	}
	if _, err := stdout.Write(data); err != nil {
		fmt.Fprintf(stderr, "hess approach: %v\n", err)
		return exitTrouble
	}
	return exitOK
}

// approachDoc is what the approach renderers print: one network's mixtures,
// each evaluated reaction by reaction.
type approachDoc struct {
	Network    string  // display name of the root file
	Pressure   float64 // standard pressure p°, Pa
	Approaches []*equilibrium.MixtureApproach
}

// approachDocument compiles root, reports its diagnostics on stderr and
// evaluates the named mixture (every mixture when name is empty). It
// returns nil and the exit status when there is nothing to print.
func approachDocument(root, name string, stderr io.Writer) (*approachDoc, int) {
	net, status := compileRoot("approach", root, stderr)
	if net == nil {
		return nil, status
	}
	if len(net.Diagnostics) > 0 {
		if err := renderText(stderr, networkReport(net, net.Diagnostics), useColor("auto", stderr)); err != nil {
			return nil, exitTrouble
		}
	}
	if net.Diagnostics.HasErrors() {
		fmt.Fprintf(stderr, "hess approach: %s has errors; no output written\n", displayName(root))
		return nil, exitFindings
	}
	var mixtures []*network.Mixture
	for _, m := range net.Mixtures {
		if !m.GivesAmounts() { // feeds are for hess equilibrium
			mixtures = append(mixtures, m)
		}
	}
	if name != "" {
		m := net.LookupMixture(name)
		if m == nil {
			fmt.Fprintf(stderr, "hess approach: %s has no mixture named %q\n", displayName(root), name)
			return nil, exitTrouble
		}
		mixtures = []*network.Mixture{m}
	}
	doc := &approachDoc{Network: displayName(root), Pressure: net.Settings.Pressure}
	for _, m := range mixtures {
		a := equilibrium.Approach(net, m)
		if a == nil {
			// A mixture is refused only for what error diagnostics report,
			// so its diagnostics were turned off by lint settings.
			fmt.Fprintf(stderr, "hess approach: mixture %s has mistakes (their diagnostics are turned off by lint settings) and cannot be evaluated\n", m.Name)
			return nil, exitFindings
		}
		doc.Approaches = append(doc.Approaches, a)
	}
	return doc, exitOK
}

// renderApproachFormat renders the document in one of the formats "text",
// "csv", "json" or "markdown".
func renderApproachFormat(doc *approachDoc, format string) ([]byte, error) {
	var buf bytes.Buffer
	var err error
	switch format {
	case "text":
		err = renderApproachText(&buf, doc)
	case "csv":
		err = renderApproachCSV(&buf, doc)
	case "json":
		err = renderApproachJSON(&buf, doc)
	case "markdown":
		err = renderApproachMarkdown(&buf, doc)
	default:
		err = fmt.Errorf("unknown approach format %q", format)
	}
	if err != nil {
		return nil, err
	}
	return buf.Bytes(), nil
}
