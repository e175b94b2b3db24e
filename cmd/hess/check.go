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
	fs := newFlags("check", "check [--format text|json|sarif] [--strict] [--color auto|always|never] [--include-path DIR]... FILE|DIR...",
		"Compile each root file with everything it includes, run every check, and\n"+
			"report the diagnostics. A folder stands for every network file (*.hess)\n"+
			"below it; of the files named, those another one includes are checked only\n"+
			"through the networks that include them, never on their own. Exit status:\n"+
			"0 when there are no errors (and, with --strict, no warnings), 1 when\n"+
			"there are, 2 on usage or input trouble.\n"+
			"The file \"-\" is standard input, named <stdin> in diagnostics; its includes\n"+
			"are relative to the working folder.", stderr)
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
	rep, trouble := compileAll(files, os.Stdin, network.Options{IncludePaths: *includes}, stderr)
	if trouble && format.value != "sarif" {
		return exitTrouble
	}
	var err error
	switch format.value {
	case "json":
		err = renderJSON(stdout, rep)
	case "sarif":
		err = renderSARIF(stdout, rep, network.Checks(), toolVersion())
	default:
		err = renderText(stdout, rep, useColor(color.value, stdout))
	}
	if err != nil {
		fmt.Fprintf(stderr, "hess check: %v\n", err)
		return exitTrouble
	}
	if trouble {
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

// stdinName is the display name of standard input, read for the file
// argument "-". Its includes resolve against the working folder.
const stdinName = "<stdin>"

// compileAll loads the networks of the file arguments and merges the
// results into one report with display file names. A folder stands for
// every network file below it (expandArgs); of all the files so named, the
// roots are those no other one includes (pickRoots), and only their
// networks are reported, so a library file is checked through the networks
// that include it. The argument "-" is standard input (read from stdin). A
// file that cannot be read is said on stderr and recorded in the report's
// Trouble, and compileAll reports trouble; the other files are still
// compiled.
func compileAll(args []string, stdin io.Reader, opts network.Options, stderr io.Writer) (*report, bool) {
	rep := &report{}
	fail := func(root, msg string) {
		fmt.Fprintf(stderr, "hess: %s\n", msg)
		rep.Trouble = append(rep.Trouble, inputTrouble{File: root, Message: msg})
	}
	files, trouble := expandArgs(args)
	for _, tr := range trouble {
		fail(tr.File, tr.Message)
	}
	opts.IncludePaths = append(append([]string(nil), opts.IncludePaths...), folderArgs(args)...)
	var cands []loadedRoot
	for i, root := range files {
		if i > 0 {
			betweenNetworks()
		}
		var src network.Source = network.Disk{}
		if root == "-" {
			var ok bool
			root, src, ok = stdinSource(stdin)
			if !ok {
				fail("", "cannot read standard input")
				continue
			}
		} else if _, err := os.Stat(root); err != nil {
			fail(displayName(root), fmt.Sprintf("cannot read %s: %v", displayName(root), unwrapPathError(err)))
			continue
		}
		net := network.Load(root, src, opts)
		if len(net.Files) == 0 {
			fail(displayName(root), unreadableRoot(displayName(root), net))
			continue
		}
		cands = append(cands, newLoadedRoot(root, net))
	}
	sources := map[string][]byte{}
	seenFile := map[string]bool{}
	seenDiag := map[string]bool{}
	for _, c := range pickRoots(cands) {
		for _, f := range c.files {
			name := displayName(f.Path)
			if !seenFile[name] {
				seenFile[name] = true
				rep.Files = append(rep.Files, name)
				sources[name] = f.Source
			}
		}
		for _, d := range c.diags {
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
	return rep, len(rep.Trouble) > 0
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

// stdinSource reads standard input whole (up to maxStdin bytes) and serves
// it as the file "<stdin>" in the working folder, so that its includes
// resolve against that folder and its diagnostics name "<stdin>".
func stdinSource(stdin io.Reader) (string, network.Source, bool) {
	if stdin == nil {
		return "", nil, false
	}
	b, err := io.ReadAll(io.LimitReader(stdin, maxStdin+1))
	if err != nil || len(b) > maxStdin {
		return "", nil, false
	}
	wd, err := os.Getwd()
	if err != nil {
		return "", nil, false
	}
	path := filepath.Join(wd, stdinName)
	return path, network.Overlay{Files: map[string][]byte{path: b}, Base: network.Disk{}}, true
}

// maxStdin bounds what "-" reads from standard input.
const maxStdin = 1 << 30

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

// folderArgs are the folders among the arguments: a network below a folder
// named for checking may include any file below that folder too, as a
// repository's networks include its shared libraries.
func folderArgs(args []string) []string {
	var dirs []string
	for _, arg := range args {
		if arg == "-" {
			continue
		}
		if info, err := os.Stat(arg); err == nil && info.IsDir() {
			dirs = append(dirs, arg)
		}
	}
	return dirs
}
