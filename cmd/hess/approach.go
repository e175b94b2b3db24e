package main

import (
	"bytes"
	"fmt"
	"io"

	"hess/equilibrium"
	"hess/lang"
	"hess/network"
	"hess/suggest"
)

func runApproach(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("approach", "approach [--mixture NAME] [--format text|csv|json|markdown] [--include-path DIR]... FILE",
		"For each mixture of the network (or the one named) and each reaction whose\n"+
			"species it lists: the reaction quotient Q on the network's activity\n"+
			"conventions (gas p/p°, solute γ·m/(1 mol/kg) with γ from the network's\n"+
			"activity model, solution mole fraction, pure phase 1), K at the mixture's\n"+
			"temperature, ΔrG = ΔrG° + RT ln Q, which way the reaction would run\n"+
			"(equilibrium when |ΔrG| is within the settings' tolerance), and the\n"+
			"approach to equilibrium: the temperature at which K would equal Q, and\n"+
			"the mixture's temperature minus it. A mixture with solutes also shows\n"+
			"its ionic strength, each solute's γ and water's activity. Diagnostics go\n"+
			"to stderr; a network with errors gives no numbers (exit status 1).\n\n"+
			cautionText, stderr)
	format := &choice{value: "text", allowed: []string{"text", "csv", "json", "markdown"}}
	fs.Var(format, "format", "output format: text, csv, json or markdown")
	mixture := fs.String("mixture", "", "evaluate only the mixture of this `NAME`")
	includes := includePathFlag(fs)
	files, status, ok := parseFlags(fs, args, stdout)
	if !ok {
		return status
	}
	if len(files) != 1 {
		fmt.Fprintln(stderr, "hess approach: give exactly one root file")
		fs.Usage()
		return exitTrouble
	}
	doc, status := approachDocument(files[0], *mixture, network.Options{IncludePaths: *includes}, stderr)
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
func approachDocument(root, name string, opts network.Options, stderr io.Writer) (*approachDoc, int) {
	net, status := compileRoot("approach", root, opts, stderr)
	if net == nil {
		return nil, status
	}
	// Notes that matter only here (a reaction a mixture gives no quotient
	// for) join the network's own diagnostics.
	diags := append(append(lang.Diagnostics(nil), net.Diagnostics...), net.ApproachNotes()...)
	diags.Sort()
	if len(diags) > 0 {
		if err := renderText(stderr, networkReport(net, diags), useColor("auto", stderr)); err != nil {
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
			var known []string
			for _, m := range net.Mixtures {
				known = append(known, m.Name)
			}
			hint := suggest.Phrase(name, known)
			if hint != "" {
				hint = "; " + hint
			}
			fmt.Fprintf(stderr, "hess approach: %s has no mixture named %q%s\n", displayName(root), name, hint)
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
