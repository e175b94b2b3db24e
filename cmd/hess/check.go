package main

import (
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strings"

	"hess/lang"
	"hess/network"
)

func runCheck(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("check", "check [--format text|json|sarif] [--strict] [--color auto|always|never] [--include-path DIR]... FILE...",
		"Compile each root file with everything it includes, run every check, and\n"+
			"report the diagnostics. Exit status: 0 when there are no errors (and, with\n"+
			"--strict, no warnings), 1 when there are, 2 on usage or input trouble.", stderr)
	format := &choice{value: "text", allowed: []string{"text", "json", "sarif"}}
	color := &choice{value: "auto", allowed: []string{"auto", "always", "never"}}
	fs.Var(format, "format", "report format: text, json or sarif")
	fs.Var(color, "color", "colour text output: auto, always or never")
	strict := fs.Bool("strict", false, "treat warnings as errors for the exit status")
	includes := includePathFlag(fs)
	files, status, ok := parseFlags(fs, args, stdout)
	if !ok {
		return status
	}
	if len(files) == 0 {
		fmt.Fprintln(stderr, "hess check: no files given")
		fs.Usage()
		return exitTrouble
	}
	rep, trouble := compileAll(files, network.Options{IncludePaths: *includes}, stderr)
	if trouble {
		return exitTrouble
	}
	var err error
	switch format.value {
	case "json":
		err = renderJSON(stdout, rep)
	case "sarif":
		err = renderSARIF(stdout, rep, network.Checks(), version)
	default:
		err = renderText(stdout, rep, useColor(color.value, stdout))
	}
	if err != nil {
		fmt.Fprintf(stderr, "hess check: %v\n", err)
		return exitTrouble
	}
	return findingsStatus(rep.Diagnostics, *strict)
}

// findingsStatus is the exit status for a set of diagnostics.
func findingsStatus(ds lang.Diagnostics, strict bool) int {
	if ds.HasErrors() || (strict && ds.Count(lang.Warning) > 0) {
		return exitFindings
	}
	return exitOK
}

// compileAll loads each root file and merges the results into one report
// with display file names. It reports trouble (and says why on stderr) when
// a root file cannot be read.
func compileAll(roots []string, opts network.Options, stderr io.Writer) (*report, bool) {
	rep := &report{}
	sources := map[string][]byte{}
	seenFile := map[string]bool{}
	seenDiag := map[string]bool{}
	for _, root := range roots {
		if _, err := os.Stat(root); err != nil {
			fmt.Fprintf(stderr, "hess: cannot read %s: %v\n", root, unwrapPathError(err))
			return nil, true
		}
		net := network.Load(root, network.Disk{}, opts)
		if len(net.Files) == 0 {
			fmt.Fprintf(stderr, "hess: %s\n", unreadableRoot(root, net))
			return nil, true
		}
		for _, f := range net.Files {
			name := displayName(f.Path)
			if !seenFile[name] {
				seenFile[name] = true
				rep.Files = append(rep.Files, name)
				sources[name] = f.Source
			}
		}
		for _, d := range net.Diagnostics {
			d = displayDiagnostic(d)
			key := fmt.Sprintf("%s|%d|%d|%s|%s", d.Subject.File, d.Subject.Start.Offset, d.Subject.End.Offset, d.Code, d.Message)
			if seenDiag[key] {
				continue
			}
			seenDiag[key] = true
			rep.Diagnostics = append(rep.Diagnostics, d)
		}
	}
	rep.Diagnostics.Sort()
	rep.Source = func(file string) []byte { return sources[file] }
	return rep, false
}

// unreadableRoot says why a root file gave no network: the loader's
// message (it is a folder, a named pipe, permission denied, …) when it has
// one.
func unreadableRoot(root string, net *network.Network) string {
	for _, d := range net.Diagnostics {
		if !d.Subject.IsValid() && (strings.HasPrefix(d.Message, "cannot read ") || strings.HasPrefix(d.Message, "refusing ")) {
			return d.Message
		}
	}
	return "cannot read " + root
}

func unwrapPathError(err error) error {
	if pe, ok := err.(*os.PathError); ok {
		return pe.Err
	}
	return err
}

// displayName shows a path relative to the working folder when it lies
// inside it, with forward slashes.
func displayName(path string) string {
	abs, err := filepath.Abs(path)
	if err != nil {
		return filepath.ToSlash(path)
	}
	wd, err := os.Getwd()
	if err != nil {
		return filepath.ToSlash(path)
	}
	rel, err := filepath.Rel(wd, abs)
	if err != nil || rel == ".." || strings.HasPrefix(rel, ".."+string(filepath.Separator)) {
		return filepath.ToSlash(abs)
	}
	return filepath.ToSlash(rel)
}

func displayDiagnostic(d lang.Diagnostic) lang.Diagnostic {
	if d.Subject.File != "" {
		d.Subject.File = displayName(d.Subject.File)
	}
	if d.Context.File != "" {
		d.Context.File = displayName(d.Context.File)
	}
	if len(d.Related) > 0 {
		rel := make([]lang.Related, len(d.Related))
		for i, r := range d.Related {
			if r.Span.File != "" {
				r.Span.File = displayName(r.Span.File)
			}
			rel[i] = r
		}
		d.Related = rel
	}
	return d
}

// useColor decides whether text output to w is coloured.
func useColor(mode string, w io.Writer) bool {
	switch mode {
	case "always":
		return true
	case "never":
		return false
	}
	if os.Getenv("NO_COLOR") != "" {
		return false
	}
	f, ok := w.(*os.File)
	if !ok {
		return false
	}
	info, err := f.Stat()
	return err == nil && info.Mode()&os.ModeCharDevice != 0
}
