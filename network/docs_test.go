package network

import (
	"flag"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"hess/lang"
)

var update = flag.Bool("update", false, "rewrite golden files and the generated parts of docs/")

// languageReference is the repository's language reference, relative to
// this package's folder.
var languageReference = filepath.Join("..", "docs", "language.md")

// The generated check table stands between these markers in the language
// reference; everything outside them is written by hand.
const (
	checksBegin = "<!-- checks:begin -->"
	checksEnd   = "<!-- checks:end -->"
)

// checkTableMarkdown renders the registry as the language reference shows
// it: a table of code, default severity and title, in registry order, then
// each check's explanation as `hess explain` prints it.
func checkTableMarkdown(cs []*Check) string {
	var b strings.Builder
	b.WriteString("<!-- Generated from the check registry (network/checks.go) by TestDocsCheckTable;\n")
	b.WriteString("     edit the checks' Doc, then run: go test ./network -run TestDocsCheckTable -update -->\n\n")
	b.WriteString("| code | default severity | reported when |\n| --- | --- | --- |\n")
	for _, c := range cs {
		fmt.Fprintf(&b, "| `%s` | %s | %s |\n", c.Name, c.Severity, markdownCell(c.Title()))
	}
	b.WriteString("\n### What each check means\n")
	for _, c := range cs {
		para := fmt.Sprintf("%s (%s by default). %s", capitalize(c.Title()), c.Severity, c.Explanation())
		fmt.Fprintf(&b, "\n#### `%s`\n\n%s\n", c.Name, wrap(markdownText(para), 96))
	}
	return b.String()
}

// markdownCell escapes the characters that would end a table cell or start
// markup.
func markdownCell(s string) string {
	return strings.ReplaceAll(markdownText(s), "|", `\|`)
}

// markdownText escapes the characters of plain text that Markdown would
// read as emphasis or code.
func markdownText(s string) string {
	return strings.NewReplacer("*", `\*`, "_", `\_`, "`", "\\`").Replace(s)
}

// wrap breaks text into lines of at most width bytes at spaces (a longer
// word stands on its own line). A word that Markdown would read as the
// start of a list, heading or quote never begins a line.
func wrap(text string, width int) string {
	var b strings.Builder
	n := 0
	for _, w := range strings.Fields(text) {
		switch {
		case n == 0:
		case n+1+len(w) > width && !blockMarker(w):
			b.WriteByte('\n')
			n = 0
		default:
			b.WriteByte(' ')
			n++
		}
		b.WriteString(w)
		n += len(w)
	}
	return b.String()
}

// blockMarker reports whether w, first on a line, would start a Markdown
// block: a list item, a heading, a quote or a numbered item.
func blockMarker(w string) bool {
	switch w {
	case "-", "+", "*", ">", "=":
		return true
	}
	if strings.HasPrefix(w, "#") {
		return true
	}
	digits := strings.TrimLeft(w, "0123456789")
	return len(digits) < len(w) && (digits == "." || digits == ")")
}

func capitalize(s string) string {
	if s == "" {
		return s
	}
	return strings.ToUpper(s[:1]) + s[1:]
}

// generatedChecks returns the text between the check markers of doc, and
// where it starts and ends.
func generatedChecks(doc string) (text string, start, end int, err error) {
	b := strings.Index(doc, checksBegin)
	e := strings.Index(doc, checksEnd)
	switch {
	case b < 0 || e < 0:
		return "", 0, 0, fmt.Errorf("markers %s and %s not found", checksBegin, checksEnd)
	case e < b:
		return "", 0, 0, fmt.Errorf("%s comes before %s", checksEnd, checksBegin)
	case strings.Count(doc, checksBegin) != 1 || strings.Count(doc, checksEnd) != 1:
		return "", 0, 0, fmt.Errorf("markers %s and %s must each appear once", checksBegin, checksEnd)
	}
	start = b + len(checksBegin)
	return doc[start:e], start, e, nil
}

// TestDocsCheckTable keeps the check table of docs/language.md equal to the
// registry; -update rewrites it.
func TestDocsCheckTable(t *testing.T) {
	raw, err := os.ReadFile(languageReference)
	if err != nil {
		t.Fatalf("the language reference must be in the repository: %v", err)
	}
	doc := string(raw)
	got, start, end, err := generatedChecks(doc)
	if err != nil {
		t.Fatalf("%s: %v", languageReference, err)
	}
	want := "\n" + checkTableMarkdown(checks)
	if got == want {
		return
	}
	if *update {
		if err := os.WriteFile(languageReference, []byte(doc[:start]+want+doc[end:]), 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	t.Errorf("%s: the check table differs from the registry; run go test ./network -run TestDocsCheckTable -update\n%s",
		languageReference, firstDifference(got, want))
}

// firstDifference names the first line where got and want differ.
func firstDifference(got, want string) string {
	g, w := strings.Split(got, "\n"), strings.Split(want, "\n")
	for i := 0; i < len(g) || i < len(w); i++ {
		var gl, wl string
		if i < len(g) {
			gl = g[i]
		}
		if i < len(w) {
			wl = w[i]
		}
		if gl != wl {
			return fmt.Sprintf("line %d of the table:\n  file:     %q\n  registry: %q", i+1, gl, wl)
		}
	}
	return ""
}

func TestCheckTableMarkdown(t *testing.T) {
	c := &Check{Name: "demo-check", Severity: lang.Error, Doc: "a | b with *stars* and `ticks`\n\nFirst line\nsecond line."}
	out := checkTableMarkdown([]*Check{c})
	for _, want := range []string{
		"| `demo-check` | error | a \\| b with \\*stars\\* and \\`ticks\\` |\n",
		"#### `demo-check`\n\nA | b with \\*stars\\* and \\`ticks\\` (error by default). First line second line.\n",
	} {
		if !strings.Contains(out, want) {
			t.Errorf("rendered table lacks %q:\n%s", want, out)
		}
	}
	for _, c := range []struct{ in, want string }{
		{"aa bb cc dddddd e", "aa bb\ncc\ndddddd\ne"},
		{"aa bb - cc", "aa bb -\ncc"},   // "-" would start a list item
		{"aa bb 1. cc", "aa bb 1.\ncc"}, // and so would "1."
		{"aa bb #4 cc", "aa bb #4\ncc"}, // "#" a heading
		{"aa bb > cc", "aa bb >\ncc"},   // ">" a quote
	} {
		if got := wrap(c.in, 5); got != c.want {
			t.Errorf("wrap(%q) = %q, want %q", c.in, got, c.want)
		}
	}
	for _, doc := range []string{"no markers", checksEnd + checksBegin, checksBegin + checksBegin + checksEnd} {
		if _, _, _, err := generatedChecks(doc); err == nil {
			t.Errorf("generatedChecks(%q) gave no error", doc)
		}
	}
}

// TestDocsKeywords requires the grammar of the language reference to name
// every reserved word of the language.
func TestDocsKeywords(t *testing.T) {
	raw, err := os.ReadFile(languageReference)
	if err != nil {
		t.Fatalf("the language reference must be in the repository: %v", err)
	}
	_, grammar, ok := strings.Cut(string(raw), "```ebnf\n")
	if !ok {
		t.Fatalf("%s has no ebnf block", languageReference)
	}
	grammar, _, _ = strings.Cut(grammar, "```")
	for _, kw := range lang.Keywords() {
		if !strings.Contains(grammar, `"`+kw+`"`) {
			t.Errorf("the grammar in %s does not use the keyword %q", languageReference, kw)
		}
	}
}
