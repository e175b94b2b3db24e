package main

import (
	"context"
	"fmt"
	"io"
	"os"

	"hess/lsp"
)

func runLSP(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("lsp", "lsp [--include-path DIR]...",
		"Run the language server on standard input and output (Language Server\n"+
			"Protocol 3.17). Editors start it and talk to it; it logs to standard\n"+
			"error. Exit status: 0 after the editor's shutdown and exit, 1 when the\n"+
			"connection ends without them.", stderr)
	includes := includePathFlag(fs)
	files, status, ok := parseFlags(fs, args, stdout)
	if !ok {
		return status
	}
	if len(files) > 0 {
		fmt.Fprintln(stderr, "hess lsp: takes no arguments")
		return exitTrouble
	}
	return lsp.Serve(context.Background(), os.Stdin, stdout, lsp.Options{Version: toolVersion(), Log: stderr, IncludePaths: *includes})
}
