package main

import (
	"fmt"
	"io"
	"strings"
	"unicode/utf8"

	"hess/network"
	"hess/suggest"
)

func runExplain(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("explain", "explain [CODE]",
		"Print the paragraph behind one diagnostic code; with no code, list every code\nwith its default severity and title.", stderr)
	codes, status, ok := parseFlags(fs, args, stdout)
	if !ok {
		return status
	}
	switch len(codes) {
	case 0:
		var b strings.Builder
		for _, c := range network.Checks() {
			fmt.Fprintf(&b, "%-24s %-8s %s\n", c.Name, c.Severity, c.Title())
		}
		return writeOut("explain", stdout, stderr, b.String())
	case 1:
		c := network.LookupCheck(codes[0])
		if c == nil {
			var names []string
			for _, c := range network.Checks() {
				names = append(names, c.Name)
			}
			hint := suggest.Phrase(codes[0], names)
			if hint != "" {
				hint = "; " + hint
			}
			fmt.Fprintf(stderr, "hess explain: no check named %q%s ('hess explain' lists them)\n", codes[0], hint)
			return exitTrouble
		}
		return writeOut("explain", stdout, stderr, fmt.Sprintf("%s (%s by default): %s\n\n%s\n", c.Name, c.Severity, c.Title(), wrap(c.Explanation(), 78)))
	}
	fmt.Fprintln(stderr, "hess explain: takes at most one code")
	return exitTrouble
}

// writeOut writes a command's whole output to stdout; a failing write (a
// closed pipe, a full disk) is reported on stderr with exit status 2, as
// every command does.
func writeOut(cmd string, stdout, stderr io.Writer, text string) int {
	if _, err := io.WriteString(stdout, text); err != nil {
		fmt.Fprintf(stderr, "hess %s: writing the output: %v\n", cmd, err)
		return exitTrouble
	}
	return exitOK
}

// wrap breaks text into lines of at most width characters at spaces.
func wrap(text string, width int) string {
	var out []byte
	line := 0
	word := []byte{}
	flush := func() {
		if len(word) == 0 {
			return
		}
		if line > 0 && line+1+utf8.RuneCount(word) > width {
			out = append(out, '\n')
			line = 0
		} else if line > 0 {
			out = append(out, ' ')
			line++
		}
		out = append(out, word...)
		line += utf8.RuneCount(word)
		word = word[:0]
	}
	for i := 0; i < len(text); i++ {
		if text[i] == ' ' || text[i] == '\n' {
			flush()
			continue
		}
		word = append(word, text[i])
	}
	flush()
	return string(out)
}
