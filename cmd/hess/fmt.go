package main

import (
	"bytes"
	"fmt"
	"io"
	"os"

	"hess/lang"
)

func runFmt(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("fmt", "fmt [-w] [--check] FILE|DIR...",
		"Print each file in the canonical layout. Every comment is kept, and\n"+
			"formatting a formatted file changes nothing. A folder stands for every\n"+
			"network file (*.hess) below it. A file with syntax errors is left alone\n"+
			"and its errors reported (exit status 1). The file \"-\" is standard input,\n"+
			"printed formatted to standard output (for editors that format through a\n"+
			"filter).", stderr)
	write := fs.Bool("w", false, "rewrite the files in place (atomically) instead of printing them")
	check := fs.Bool("check", false, "print nothing but the names of files that would change; exit 1 if any")
	files, status, ok := parseFlags(fs, args, stdout)
	if !ok {
		return status
	}
	if len(files) == 0 {
		fmt.Fprintln(stderr, "hess fmt: no files given")
		fs.Usage()
		return exitTrouble
	}
	files, trouble := expandArgs(files)
	for _, tr := range trouble {
		fmt.Fprintf(stderr, "hess fmt: %s\n", tr.Message)
	}
	if len(trouble) > 0 {
		return exitTrouble
	}
	result := exitOK
	for _, path := range files {
		name := displayName(path)
		var src []byte
		var err error
		if path == "-" {
			if *write {
				fmt.Fprintln(stderr, "hess fmt: -w cannot rewrite standard input")
				return exitTrouble
			}
			name = stdinName
			src, err = io.ReadAll(io.LimitReader(os.Stdin, maxStdin+1))
			if err == nil && len(src) > maxStdin {
				err = fmt.Errorf("more than %d bytes", maxStdin)
			}
		} else {
			src, err = os.ReadFile(path)
		}
		if err != nil {
			fmt.Fprintf(stderr, "hess fmt: cannot read %s: %v\n", name, unwrapPathError(err))
			return exitTrouble
		}
		out, diags := lang.FormatSource(name, src)
		if out == nil {
			rep := &report{Files: []string{name}, Source: func(string) []byte { return src }}
			for _, d := range diags {
				if path != "-" {
					d = displayDiagnostic(d)
				}
				rep.Diagnostics = append(rep.Diagnostics, d)
			}
			rep.Diagnostics.Sort()
			if err := renderText(stderr, rep, useColor("auto", stderr)); err != nil {
				return exitTrouble
			}
			result = exitFindings
			continue
		}
		changed := !bytes.Equal(out, src)
		switch {
		case *check:
			if changed {
				fmt.Fprintln(stdout, name)
				result = exitFindings
			}
		case *write:
			if changed {
				if err := writeFileAtomic(path, out); err != nil {
					fmt.Fprintf(stderr, "hess fmt: %v\n", err)
					return exitTrouble
				}
			}
		default:
			if _, err := stdout.Write(out); err != nil {
				fmt.Fprintf(stderr, "hess fmt: %v\n", err)
				return exitTrouble
			}
		}
	}
	return result
}
