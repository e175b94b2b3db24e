// Command hess compiles and checks chemical reaction networks written in the
// hess language, and reports every problem as a precise diagnostic.
package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"runtime/debug"
	"strings"
)

// Exit statuses (CLI.md).
const (
	exitOK       = 0
	exitFindings = 1
	exitTrouble  = 2
)

// command is one subcommand.
type command struct {
	name    string
	summary string
	run     func(args []string, stdout, stderr io.Writer) int
}

func commands() []command {
	return []command{
		{"check", "compile networks and report diagnostics", runCheck},
		{"table", "print K(T) tables of a network's reactions", runTable},
		{"approach", "show how far each mixture is from equilibrium", runApproach},
		{"equilibrium", "bring each feed to chemical equilibrium", runEquilibrium},
		{"plot", "draw a van 't Hoff plot of a network's reactions", runPlot},
		{"fmt", "print files in the canonical layout", runFmt},
		{"watch", "check again (and rebuild a table) whenever the files change", runWatch},
		{"lsp", "run the language server on stdin and stdout", runLSP},
		{"explain", "explain a diagnostic code, or list them all", runExplain},
		{"version", "print the version", runVersion},
	}
}

func main() {
	tuneGC()
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

// tuneGC sets how often memory is collected, unless GOGC or GOMEMLIMIT
// say otherwise. Nearly all a compile allocates stays live until the end,
// so collecting less often (GOGC 400) saves time and little memory; the
// soft limit of 1 GiB makes the collector work harder before the heap
// outgrows it, as a table of a large network would with garbage.
func tuneGC() {
	if os.Getenv("GOGC") == "" {
		debug.SetGCPercent(400)
	}
	if os.Getenv("GOMEMLIMIT") == "" {
		debug.SetMemoryLimit(1 << 30)
	}
}

func run(args []string, stdout, stderr io.Writer) int {
	if len(args) == 0 {
		usage(stderr)
		return exitTrouble
	}
	switch args[0] {
	case "help", "-h", "-help", "--help":
		usage(stdout)
		return exitOK
	}
	for _, c := range commands() {
		if c.name == args[0] {
			return c.run(args[1:], stdout, stderr)
		}
	}
	fmt.Fprintf(stderr, "hess: unknown command %q\n", args[0])
	usage(stderr)
	return exitTrouble
}

func usage(w io.Writer) {
	fmt.Fprintln(w, "hess compiles and checks chemical reaction networks.")
	fmt.Fprintln(w)
	fmt.Fprintln(w, "usage: hess COMMAND [flags] [FILE...]")
	fmt.Fprintln(w)
	for _, c := range commands() {
		fmt.Fprintf(w, "  %-8s %s\n", c.name, c.summary)
	}
	fmt.Fprintln(w)
	fmt.Fprintln(w, "Run 'hess COMMAND --help' for a command's flags.")
}

// newFlags makes a flag set for a subcommand whose --help prints the given
// synopsis and description.
func newFlags(name, synopsis, description string, stderr io.Writer) *flag.FlagSet {
	fs := flag.NewFlagSet(name, flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() {
		out := fs.Output()
		fmt.Fprintf(out, "usage: hess %s\n\n%s\n", synopsis, description)
		var hasFlags bool
		fs.VisitAll(func(*flag.Flag) { hasFlags = true })
		if hasFlags {
			fmt.Fprintln(out, "\nflags:")
			fs.PrintDefaults()
		}
	}
	return fs
}

// parseFlags parses flags that may stand before or after the file
// arguments. It returns the files, or a status to exit with (help: 0,
// usage error: 2).
func parseFlags(fs *flag.FlagSet, args []string, stdout io.Writer) ([]string, int, bool) {
	var files []string
	// The flag package prints the usage itself on -help and on errors;
	// print it here instead, once, on the right stream.
	usage := fs.Usage
	fs.Usage = func() {}
	defer func() { fs.Usage = usage }()
	for {
		if err := fs.Parse(args); err != nil {
			if errors.Is(err, flag.ErrHelp) {
				fs.SetOutput(stdout)
				usage()
				return nil, exitOK, false
			}
			usage()
			return nil, exitTrouble, false
		}
		rest := fs.Args()
		if len(rest) == 0 {
			return files, 0, true
		}
		if rest[0] == "--" {
			return append(files, rest[1:]...), 0, true
		}
		files = append(files, rest[0])
		args = rest[1:]
	}
}

// choice is a flag that accepts one of a fixed set of words.
type choice struct {
	value   string
	allowed []string
}

func (c *choice) String() string { return c.value }

func (c *choice) Set(s string) error {
	for _, a := range c.allowed {
		if s == a {
			c.value = s
			return nil
		}
	}
	return fmt.Errorf("must be one of %s", strings.Join(c.allowed, ", "))
}
