package main

import (
	"fmt"
	"io"
	"runtime/debug"
)

// version is the release version; a build may set it with
// -ldflags "-X main.version=…".
var version = "0.1.0-dev"

func modulePath() string {
	if info, ok := debug.ReadBuildInfo(); ok && info.Main.Path != "" {
		return info.Main.Path
	}
	return "hess"
}

func runVersion(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("version", "version", "Print the version and module path.", stderr)
	files, status, ok := parseFlags(fs, args, stdout)
	if !ok {
		return status
	}
	if len(files) > 0 {
		fmt.Fprintln(stderr, "hess version: takes no arguments")
		return exitTrouble
	}
	return writeOut("version", stdout, stderr, fmt.Sprintf("hess %s (module %s)\n", version, modulePath()))
}
