// Command hess compiles and checks chemical reaction networks written in the
// hess language, and reports every problem as a precise diagnostic.
package main

import (
	"bytes"
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"regexp"
	"runtime"
	"runtime/debug"
	"strings"

	"hess/suggest"
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
	tuneGC(os.Args[1:])
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

// memoryLimit is the soft limit on the heap that every command keeps to
// unless GOMEMLIMIT says otherwise: the runtime collects harder as the heap
// nears it.
const memoryLimit = 1 << 30

// tuneGC sets how memory is collected for the command args name, unless
// GOGC or GOMEMLIMIT say otherwise.
//
// A command that compiles a network once and exits (check, table, plot,
// ...) keeps nearly all it allocates live until the end: a collection
// would mark the whole syntax tree and model to free little, and its write
// barriers slow the compile while it runs. Such commands run with the
// collector off below the soft limit (GOGC off, 1 GiB): the heap is then
// what the compile allocated, a few per cent above what it keeps, and the
// runtime collects only if a network grows near the limit.
//
// The long-running commands (watch, lsp) compile again and again, and
// each compile's network is garbage once the next one is published: they
// collect at Go's default pace (GOGC 100) under the same soft limit, so
// their memory stays near twice one network. So does fmt, whose every
// file is garbage once printed.
func tuneGC(args []string) {
	if os.Getenv("GOGC") == "" {
		percent := -1
		if len(args) > 0 && collectsAsItGoes(args[0]) {
			percent = 100
		}
		debug.SetGCPercent(percent)
	}
	if os.Getenv("GOMEMLIMIT") == "" {
		debug.SetMemoryLimit(memoryLimit)
	}
}

// collectsAsItGoes reports whether the command cmd leaves garbage behind
// as it goes rather than compiling one network and exiting: watch and lsp
// compile again on every change, fmt reads file after file.
func collectsAsItGoes(cmd string) bool { return cmd == "watch" || cmd == "lsp" || cmd == "fmt" }

// betweenNetworks frees the last network before a command that checks
// several compiles the next: with the collector off (tuneGC) each would
// otherwise add its garbage to the heap. What the command keeps of a
// network (its sources and diagnostics) is small, so the collection marks
// little. Under GOGC, the runtime decides.
func betweenNetworks() {
	if os.Getenv("GOGC") == "" {
		runtime.GC()
	}
}

// streamingGC is tuneGC for what a command does with a network once it is
// compiled (a table streamed, feeds solved, a plot drawn): what that
// allocates is garbage once used, so it collects at Go's default pace
// (GOGC 100), which keeps the heap near the network's own size instead of
// letting garbage grow until the soft limit. GOGC, when set, still decides.
func streamingGC() {
	if os.Getenv("GOGC") == "" {
		debug.SetGCPercent(100)
	}
}

func run(args []string, stdout, stderr io.Writer) int {
	if len(args) == 0 {
		usage(stderr)
		return exitTrouble
	}
	switch args[0] {
	case "help", "-h", "-help", "--help":
		if len(args) == 1 {
			return printUsage(stdout, stderr)
		}
		if len(args) > 2 {
			fmt.Fprintln(stderr, "hess help: takes at most one command")
			return exitTrouble
		}
		if args[1] == "help" {
			return printUsage(stdout, stderr)
		}
		if c, ok := lookupCommand(args[1], stderr); ok {
			return c.run([]string{"--help"}, stdout, stderr)
		}
		return exitTrouble
	case "--version", "-version":
		return runVersion(args[1:], stdout, stderr)
	}
	if c, ok := lookupCommand(args[0], stderr); ok {
		return c.run(args[1:], stdout, stderr)
	}
	return exitTrouble
}

// lookupCommand finds a subcommand by name; for an unknown name it says so
// on stderr, with the nearest command's name when one is close.
func lookupCommand(name string, stderr io.Writer) (command, bool) {
	var names []string
	for _, c := range commands() {
		if c.name == name {
			return c, true
		}
		names = append(names, c.name)
	}
	msg := fmt.Sprintf("hess: unknown command %q", name)
	if hint := suggest.Phrase(name, names); hint != "" {
		msg += "; " + hint
	}
	fmt.Fprintf(stderr, "%s\nRun 'hess help' for the list of commands.\n", msg)
	return command{}, false
}

// printUsage prints the general usage on stdout; a failed write (a full
// device, a closed pipe) is said on stderr and is exit status 2, as for
// every command.
func printUsage(stdout, stderr io.Writer) int {
	var b bytes.Buffer
	usage(&b)
	return writeHelp(stdout, stderr, "hess", b.Bytes())
}

// writeHelp writes help text to stdout, and says on stderr when it cannot.
func writeHelp(stdout, stderr io.Writer, who string, text []byte) int {
	if _, err := stdout.Write(text); err != nil {
		fmt.Fprintf(stderr, "%s: cannot write the help: %v\n", who, unwrapPathError(err))
		return exitTrouble
	}
	return exitOK
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
	fmt.Fprintln(w, "Run 'hess help COMMAND' (or 'hess COMMAND --help') for a command's flags,")
	fmt.Fprintln(w, "and 'hess --version' for the version.")
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
			printFlags(out, fs, synopsis)
		}
	}
	return fs
}

// printFlags lists a flag set's flags as the synopses write them: a
// one-letter flag with one dash (-w), every other with two (--format), its
// value's name, its description, and a default that is not the zero value.
// The flag package accepts both spellings; only its own listing, which
// prints one dash throughout, is replaced.
func printFlags(w io.Writer, fs *flag.FlagSet, synopsis string) {
	fs.VisitAll(func(f *flag.Flag) {
		arg, desc := flag.UnquoteUsage(f)
		head := "  " + dashed(f.Name)
		if arg != "" {
			head += " " + flagValueName(synopsis, dashed(f.Name))
		}
		line := head
		if len(head) <= 20 {
			line += strings.Repeat(" ", 22-len(head)) + desc
		} else {
			line += "\n" + strings.Repeat(" ", 22) + desc
		}
		if d := f.DefValue; d != "" && d != "false" && d != "0" && d != "[]" {
			line += fmt.Sprintf(" (default %s)", d)
		}
		fmt.Fprintln(w, line)
	})
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
	out := fs.Output()
	defer func() { fs.Usage = usage; fs.SetOutput(out) }()
	for {
		// The flag package words its errors with one dash and prints them
		// itself; say them here instead, as the help spells the flags.
		fs.SetOutput(io.Discard)
		err := fs.Parse(args)
		fs.SetOutput(out)
		if err != nil {
			if errors.Is(err, flag.ErrHelp) {
				var b bytes.Buffer
				fs.SetOutput(&b)
				usage()
				return nil, writeHelp(stdout, out, "hess "+fs.Name(), b.Bytes()), false
			}
			fmt.Fprintf(out, "hess %s: %s\n\n", fs.Name(), flagErrorText(fs, err))
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

// flagSpelling matches a flag name as the flag package writes it in its
// errors: one dash, after "flag ", "for " or ": ".
var flagSpelling = regexp.MustCompile(`(^|flag |for |: )-([A-Za-z][\w-]*)`)

// flagErrorText rewords an error of the flag package: each flag spelt as
// the help spells it (--format, -o), a boolean's value explained, and an
// unknown flag's nearest known name suggested.
func flagErrorText(fs *flag.FlagSet, err error) string {
	msg := err.Error()
	const undefined = "flag provided but not defined: -"
	if name, ok := strings.CutPrefix(msg, undefined); ok {
		var names []string
		fs.VisitAll(func(f *flag.Flag) { names = append(names, f.Name) })
		msg = "unknown flag " + dashed(name)
		if c, ok := suggest.Closest(name, names); ok {
			msg += "; did you mean " + dashed(c) + "?"
		}
		return msg
	}
	msg = strings.Replace(msg, ": parse error", ": takes true or false", 1)
	return flagSpelling.ReplaceAllStringFunc(msg, func(m string) string {
		sub := flagSpelling.FindStringSubmatch(m)
		return sub[1] + dashed(sub[2])
	})
}

// dashed is a flag's name as the help writes it: -o, --format.
func dashed(name string) string {
	if len([]rune(name)) == 1 {
		return "-" + name
	}
	return "--" + name
}

// flagValueName is the name the synopsis gives a flag's value ("LIST" in
// "[--temperatures LIST]"), or VALUE when it gives none.
func flagValueName(synopsis, flagName string) string {
	fields := strings.Fields(synopsis)
	for i, f := range fields {
		if strings.TrimLeft(f, "[") == flagName && i+1 < len(fields) {
			v := strings.TrimRight(fields[i+1], "].")
			if v != "" && !strings.HasPrefix(v, "-") && !strings.HasPrefix(v, "[") {
				return v
			}
		}
	}
	return "VALUE"
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
