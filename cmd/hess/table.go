package main

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"os"
	"runtime"
	"strings"
	"sync"
	"sync/atomic"

	"hess/equilibrium"
	"hess/lang"
	"hess/network"
	"hess/suggest"
)

// cautionText is printed in the help of the commands that compute
// equilibrium numbers.
const cautionText = "Caution: results are estimates from the data given, no better than those data.\n" +
	"Where high temperatures, high pressures, or toxic or flammable gases are\n" +
	"involved, check them against local codes and licensed engineering practice\n" +
	"before relying on them."

func runTable(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("table", "table [--format text|csv|json|markdown] [--temperatures LIST] [--reaction NAME]... [-o FILE] [--include-path DIR]... FILE",
		"Compute each reaction's standard reaction enthalpy, entropy and Gibbs energy,\n"+
			"its equilibrium constant K (relative to the network's standard pressure p°\n"+
			"and 1 mol/kg), log10 K, Kc in (mol/L)^Δn, the uncertainty of log10 K and the\n"+
			"temperatures where ΔrG° changes sign, at the settings' temperatures or those\n"+
			"of --temperatures. Diagnostics go to stderr; a network with errors gives no\n"+
			"table (exit status 1), and -o then leaves an existing file as it was.\n\n"+
			cautionText, stderr)
	format := &choice{value: "text", allowed: []string{"text", "csv", "json", "markdown"}}
	fs.Var(format, "format", "table format: text, csv, json or markdown")
	temps := fs.String("temperatures", "", "temperatures instead of the settings', e.g. \"298.15 K, 700 K to 1200 K by 100 K\"")
	var names nameList
	fs.Var(&names, "reaction", "tabulate this reaction (repeatable; default: every reaction)")
	includes := includePathFlag(fs)
	out := fs.String("o", "", "write the table to `FILE` (atomically) instead of stdout")
	files, status, ok := parseFlags(fs, args, stdout)
	if !ok {
		return status
	}
	if len(files) != 1 {
		fmt.Fprintln(stderr, "hess table: give exactly one root file")
		fs.Usage()
		return exitTrouble
	}
	doc, status := tabulate("table", files[0], *temps, names, *includes, stderr)
	if doc == nil {
		return status
	}
	render, err := tableRenderer(format.value)
	if err != nil {
		fmt.Fprintf(stderr, "hess table: %v\n", err)
		return exitTrouble
	}
	// The table is written as it is computed, a batch of reactions at a
	// time: to stdout directly, to -o through a temporary file that
	// replaces the target once complete.
	if *out != "" {
		err = writeOutputStream(*out, doc.net, func(w io.Writer) error { return render(w, doc) })
	} else {
		err = render(stdout, doc)
	}
	if err != nil {
		fmt.Fprintf(stderr, "hess table: %v\n", err)
		return exitTrouble
	}
	return exitOK
}

// tableRenderer is the renderer of one of the table formats: "text",
// "csv", "json" or "markdown".
func tableRenderer(format string) (func(io.Writer, *tableDoc) error, error) {
	switch format {
	case "text":
		return renderTableText, nil
	case "csv":
		return renderTableCSV, nil
	case "json":
		return renderTableJSON, nil
	case "markdown":
		return renderTableMarkdown, nil
	}
	return nil, fmt.Errorf("unknown table format %q", format)
}

// renderTableFormat renders the whole document into memory in one of the
// table formats.
func renderTableFormat(doc *tableDoc, format string) ([]byte, error) {
	render, err := tableRenderer(format)
	if err != nil {
		return nil, err
	}
	var buf bytes.Buffer
	if err := render(&buf, doc); err != nil {
		return nil, err
	}
	return buf.Bytes(), nil
}

// nameList is a repeatable string flag.
type nameList []string

func (l *nameList) String() string { return strings.Join(*l, ",") }

func (l *nameList) Set(s string) error {
	if s == "" {
		return fmt.Errorf("a reaction name cannot be empty")
	}
	*l = append(*l, s)
	return nil
}

// tableDoc is what the table renderers print: one network's reaction
// tables at one list of temperatures. The tables are not held: each
// computes them in order as the renderer asks for them.
type tableDoc struct {
	Network  string  // display name of the root file
	Pressure float64 // standard pressure p°, Pa
	Temps    []float64

	reactions []*network.Reaction // the reactions tabulated, in order
	// fitReverse asks for the fitted reverse rates of the two-way steps
	// that have only a forward rate (see reverseRate).
	fitReverse bool
	net        *network.Network // the compiled network, for plots that sample more temperatures
}

// tableEntry is one reaction's table and, where one was fitted, its
// reverse rate.
type tableEntry struct {
	*equilibrium.Table
	Reverse *network.ReverseRate
}

// tableBatch is how many reactions' tables are computed at once (on every
// processor) before they are handed on in order: what a streamed table
// holds in memory beyond the network.
const tableBatch = 128

// each computes the document's tables in order and hands each to fn as
// soon as its batch is ready; it stops at fn's first error and returns it.
// While fn takes one batch (a renderer formatting numbers), the next batch
// is computed, so rendering and computing overlap; at most two batches are
// held at once.
func (doc *tableDoc) each(fn func(tableEntry) error) error {
	workers := max(1, runtime.GOMAXPROCS(0))
	// One tabulator per worker, kept over the batches: each shares the
	// parts of coupled reactions among the reactions it computes. Only one
	// batch is computed at a time, so no tabulator is used by two
	// goroutines at once.
	tabs := make([]*equilibrium.Tabulator, workers)
	for w := range tabs {
		tabs[w] = equilibrium.NewTabulator(doc.net, doc.Temps)
	}
	// compute starts computing the batch of reactions from start and
	// returns where its tables will be once the channel is closed.
	compute := func(start int) (<-chan struct{}, []tableEntry) {
		rxs := doc.reactions[start:min(start+tableBatch, len(doc.reactions))]
		batch := make([]tableEntry, len(rxs))
		done := make(chan struct{})
		go func() {
			defer close(done)
			var next atomic.Int64
			var wg sync.WaitGroup
			for w := range min(workers, len(rxs)) {
				wg.Add(1)
				go func() {
					tab := tabs[w]
					defer wg.Done()
					for i := int(next.Add(1)) - 1; i < len(rxs); i = int(next.Add(1)) - 1 {
						e := tableEntry{Table: tab.Table(rxs[i])}
						if doc.fitReverse {
							e.Reverse = reverseRate(doc.net, rxs[i], doc.Temps)
						}
						batch[i] = e
					}
				}()
			}
			wg.Wait()
		}()
		return done, batch
	}
	if len(doc.reactions) == 0 {
		return nil
	}
	done, batch := compute(0)
	for start := 0; start < len(doc.reactions); start += tableBatch {
		<-done
		cur := batch
		if next := start + tableBatch; next < len(doc.reactions) {
			done, batch = compute(next)
		} else {
			done = nil
		}
		for i := range cur {
			if err := fn(cur[i]); err != nil {
				if done != nil {
					<-done // the next batch uses the tabulators: let it end
				}
				return err
			}
			cur[i] = tableEntry{}
		}
	}
	return nil
}

// tables computes all of the document's tables, for a renderer that needs
// them at once (a plot).
func (doc *tableDoc) tables() []tableEntry {
	out := make([]tableEntry, 0, len(doc.reactions))
	doc.each(func(e tableEntry) error { // fn never fails
		out = append(out, e)
		return nil
	})
	return out
}

// tabulate compiles root, reports its diagnostics on stderr and computes the
// tables of the named reactions (all when names is empty) at the
// temperatures of tempText (the settings' when empty). It returns nil and
// the exit status when there is nothing to print: a usage or input problem
// (2) or a network with errors (1).
func tabulate(cmd, root, tempText string, names, includes []string, stderr io.Writer) (*tableDoc, int) {
	var requested []float64
	if tempText != "" {
		ts, err := network.ParseTemperatures(tempText)
		if err != nil {
			fmt.Fprintf(stderr, "hess %s: --temperatures: %v\n", cmd, err)
			return nil, exitTrouble
		}
		requested = ts
	}
	net, status := compileRoot(cmd, root, network.Options{Temperatures: requested, IncludePaths: includes}, stderr)
	if net == nil {
		return nil, status
	}
	temps, diags := net.Temperatures, net.Diagnostics
	if len(diags) > 0 {
		if err := renderText(stderr, networkReport(net, diags), useColor("auto", stderr)); err != nil {
			return nil, exitTrouble
		}
	}
	if diags.HasErrors() {
		fmt.Fprintf(stderr, "hess %s: %s has errors; no output written\n", cmd, displayName(root))
		return nil, exitFindings
	}
	doc, err := newTableDoc(net, root, temps, names)
	if err != nil {
		fmt.Fprintf(stderr, "hess %s: %v\n", cmd, err)
		return nil, exitTrouble
	}
	return doc, exitOK
}

// newTableDoc is the document of the tables of a compiled network's named reactions
// (every reaction when names is empty) at temps. root is the network's root
// file as given; an unknown name is an error. The tables are computed as
// the document is rendered.
func newTableDoc(net *network.Network, root string, temps []float64, names []string) (*tableDoc, error) {
	var rxs []*network.Reaction
	if len(names) == 0 {
		rxs = net.Reactions
	}
	seen := map[string]bool{}
	for _, name := range names {
		rx := net.LookupReaction(name)
		if rx == nil {
			var known []string
			for _, r := range net.Reactions {
				known = append(known, r.Name)
			}
			msg := fmt.Sprintf("%s has no reaction named %q", displayName(root), name)
			if hint := suggest.Phrase(name, known); hint != "" {
				msg += "; " + hint
			}
			return nil, errors.New(msg)
		}
		if !seen[name] {
			seen[name] = true
			rxs = append(rxs, rx)
		}
	}
	return &tableDoc{Network: displayName(root), Pressure: net.Settings.Pressure, Temps: temps,
		reactions: rxs, fitReverse: true, net: net}, nil
}

// compileRoot loads one root file. It returns nil and exit status 2 (having
// said why on stderr) when the file cannot be read.
func compileRoot(cmd, root string, opts network.Options, stderr io.Writer) (*network.Network, int) {
	if _, err := os.Stat(root); err != nil {
		fmt.Fprintf(stderr, "hess %s: cannot read %s: %v\n", cmd, root, unwrapPathError(err))
		return nil, exitTrouble
	}
	net := network.Load(root, network.Disk{}, opts)
	streamingGC()
	if len(net.Files) == 0 {
		fmt.Fprintf(stderr, "hess %s: %s\n", cmd, unreadableRoot(root, net))
		return nil, exitTrouble
	}
	return net, exitOK
}

// networkReport is the report of one compiled network with the given
// diagnostics, for the text renderer.
func networkReport(net *network.Network, diags lang.Diagnostics) *report {
	rep := &report{}
	sources := map[string][]byte{}
	for _, f := range net.Files {
		name := displayName(f.Path)
		rep.Files = append(rep.Files, name)
		sources[name] = f.Source
	}
	for _, d := range diags {
		rep.Diagnostics = append(rep.Diagnostics, displayDiagnostic(d))
	}
	rep.Diagnostics.Sort()
	rep.Source = func(file string) []byte { return sources[file] }
	return rep
}
