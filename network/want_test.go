package network

import (
	"fmt"
	"os"
	"path/filepath"
	"regexp"
	"sort"
	"strings"
	"testing"

	"hess/lang"
)

// The files under ../testdata/check carry their expected diagnostics as
// comments on the line where each must start:
//
//	reaction burn: CO(g) + O2(g) <-> CO2(g)  # want element-imbalance "O: left 3"
//
// A want names a code and a substring of the message; several may stand in
// one comment. The test fails on every missing and every unexpected
// diagnostic (info diagnostics included).

var wantPair = regexp.MustCompile(`([a-z][a-z-]*)\s+"((?:[^"\\]|\\.)*)"`)

type want struct {
	file string
	line int
	code string
	text string
}

func (w want) String() string { return fmt.Sprintf("%s:%d: %s %q", w.file, w.line, w.code, w.text) }

func collectWants(t *testing.T, n *Network) []want {
	t.Helper()
	var out []want
	for _, f := range n.Files {
		for _, c := range f.AST.Comments {
			text := strings.TrimSpace(strings.TrimPrefix(c.Text, "#"))
			rest, ok := strings.CutPrefix(text, "want ")
			if !ok {
				continue
			}
			pairs := wantPair.FindAllStringSubmatch(rest, -1)
			if len(pairs) == 0 {
				t.Errorf("%s:%d: malformed want comment %q", f.Path, c.Span.Start.Line, c.Text)
			}
			for _, p := range pairs {
				out = append(out, want{file: f.Path, line: c.Span.Start.Line, code: p[1], text: strings.ReplaceAll(p[2], `\"`, `"`)})
			}
		}
	}
	return out
}

func TestCheckExpectations(t *testing.T) {
	roots, err := filepath.Glob(filepath.Join("..", "testdata", "check", "*.hess"))
	if err != nil || len(roots) == 0 {
		t.Fatalf("no testdata networks found: %v", err)
	}
	covered := map[string]bool{}
	for _, root := range roots {
		t.Run(filepath.Base(root), func(t *testing.T) {
			n := Load(root, Disk{}, Options{})
			wants := collectWants(t, n)
			matched := make([]bool, len(wants))
			for _, d := range append(n.Diagnostics, n.ApproachNotes()...) {
				found := false
				for i, w := range wants {
					if !matched[i] && w.code == string(d.Code) && sameFile(w.file, d.Subject.File) &&
						w.line == d.Subject.Start.Line && strings.Contains(d.Message, w.text) {
						matched[i], found = true, true
						covered[string(d.Code)] = true
						break
					}
				}
				if !found {
					t.Errorf("unexpected %s:%d:%d: %s[%s]: %s", d.Subject.File, d.Subject.Start.Line, d.Subject.Start.Column, d.Severity, d.Code, d.Message)
				}
			}
			for i, w := range wants {
				if !matched[i] {
					t.Errorf("missing %v", w)
				}
			}
		})
	}
	// Every check that this package can report has a testdata file that
	// makes it fire.
	for _, c := range Checks() {
		if !covered[c.Name] {
			t.Errorf("no testdata network makes %s fire", c.Name)
		}
	}
}

func sameFile(a, b string) bool { return filepath.Clean(a) == filepath.Clean(b) }

// TestExamplesCheckClean compiles every shipped example: none may report
// anything.
func TestExamplesCheckClean(t *testing.T) {
	roots := exampleRoots(t)
	for _, root := range roots {
		n := Load(root, Disk{}, Options{})
		for _, d := range n.Diagnostics {
			t.Errorf("%s:%d:%d: %s[%s]: %s", d.Subject.File, d.Subject.Start.Line, d.Subject.Start.Column, d.Severity, d.Code, d.Message)
		}
		if len(n.Reactions) == 0 {
			t.Errorf("%s: no reactions", root)
		}
	}
}

// exampleRoots lists the examples' root files: every .hess file in
// ../examples, and in each of its folders the file that no other file there
// includes.
func exampleRoots(t *testing.T) []string {
	t.Helper()
	var roots []string
	entries, err := os.ReadDir(filepath.Join("..", "examples"))
	if err != nil {
		t.Fatal(err)
	}
	for _, e := range entries {
		path := filepath.Join("..", "examples", e.Name())
		if !e.IsDir() {
			if strings.HasSuffix(e.Name(), ".hess") {
				roots = append(roots, path)
			}
			continue
		}
		files, _ := filepath.Glob(filepath.Join(path, "*.hess"))
		included := map[string]bool{}
		for _, f := range files {
			src, err := os.ReadFile(f)
			if err != nil {
				t.Fatal(err)
			}
			ast, _ := lang.Parse(f, src)
			for _, st := range ast.Statements {
				if st.Include != nil {
					rel, _ := lang.Unquote(st.Include.Path.Raw)
					included[filepath.Join(path, rel)] = true
				}
			}
		}
		for _, f := range files {
			if !included[f] {
				roots = append(roots, f)
			}
		}
	}
	sort.Strings(roots)
	if len(roots) < 3 {
		t.Fatalf("expected at least three example networks, found %v", roots)
	}
	return roots
}
