package main

import (
	"bytes"
	"encoding/json"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"sync"
	"testing"

	"hess/lang"
)

var (
	buildOnce sync.Once
	binPath   string
	buildErr  error
)

// hessBinary builds the command once per test run.
func hessBinary(t testing.TB) string {
	t.Helper()
	buildOnce.Do(func() {
		dir, err := os.MkdirTemp("", "hess-e2e")
		if err != nil {
			buildErr = err
			return
		}
		binPath = filepath.Join(dir, "hess")
		out, err := exec.Command("go", "build", "-o", binPath, ".").CombinedOutput()
		if err != nil {
			buildErr = err
			binPath = string(out)
		}
	})
	if buildErr != nil {
		t.Fatalf("go build: %v\n%s", buildErr, binPath)
	}
	return binPath
}

type result struct {
	stdout, stderr string
	code           int
}

// runHess runs the built binary in the module root.
func runHess(t *testing.T, args ...string) result {
	t.Helper()
	return runHessInput(t, "", args...)
}

// runHessInput is runHess with stdin as the binary's standard input.
func runHessInput(t *testing.T, stdin string, args ...string) result {
	t.Helper()
	cmd := exec.Command(hessBinary(t), args...)
	cmd.Stdin = strings.NewReader(stdin)
	cmd.Dir = filepath.Join("..", "..")
	cmd.Env = append(os.Environ(), "NO_COLOR=1")
	var stdout, stderr bytes.Buffer
	cmd.Stdout, cmd.Stderr = &stdout, &stderr
	err := cmd.Run()
	code := 0
	if ee, ok := err.(*exec.ExitError); ok {
		code = ee.ExitCode()
	} else if err != nil {
		t.Fatalf("run hess %v: %v", args, err)
	}
	return result{stdout.String(), stderr.String(), code}
}

func TestEndToEnd(t *testing.T) {
	cases := []struct {
		name   string
		args   []string
		code   int
		stdout []string // substrings
		stderr []string
	}{
		{"clean example", []string{"check", "examples/hydrogen-plant/reformer.hess"}, 0,
			[]string{"no problems in 2 files"}, nil},
		{"all examples", []string{"check", "examples/hydrogen-plant/reformer.hess", "examples/flue-gas-scrubber.hess", "examples/small-flame.hess"}, 0,
			[]string{"no problems in 4 files"}, nil},
		{"element imbalance", []string{"check", "testdata/check/element-imbalance.hess"}, 1,
			[]string{"testdata/check/element-imbalance.hess:4:16: error: O: left 3, right 2 [element-imbalance]", "^~~~", "2 errors in 1 file"}, nil},
		{"charge imbalance", []string{"check", "testdata/check/charge-imbalance.hess"}, 1,
			[]string{"error: net charge: left +2, right +3 [charge-imbalance]"}, nil},
		{"warnings pass", []string{"check", "testdata/check/unused-species.hess"}, 0,
			[]string{"[unused-species]"}, nil},
		{"strict fails on warnings", []string{"check", "--strict", "testdata/check/unused-species.hess"}, 1,
			[]string{"[unused-species]"}, nil},
		{"flags after files", []string{"check", "testdata/check/unused-species.hess", "--strict"}, 1, nil, nil},
		{"missing file", []string{"check", "no/such.hess"}, 2, nil, []string{"cannot read no/such.hess"}},
		{"no files", []string{"check"}, 2, nil, []string{"no files given"}},
		{"bad flag", []string{"check", "--wobble", "x.hess"}, 2, nil, []string{"wobble"}},
		{"bad format", []string{"check", "--format", "xml", "x.hess"}, 2, nil, []string{"must be one of"}},
		{"unknown command", []string{"frobnicate"}, 2, nil, []string{"unknown command"}},
		{"no command", nil, 2, nil, []string{"usage"}},
		{"help", []string{"check", "--help"}, 0, []string{"usage: hess check"}, nil},
		{"explain list", []string{"explain"}, 0, []string{"element-imbalance", "unused-species"}, nil},
		{"explain one", []string{"explain", "element-imbalance"}, 0, []string{"element-imbalance (error by default)", "1/2 O2 balances exactly"}, nil},
		{"explain unknown", []string{"explain", "nope"}, 2, nil, []string{"no check named"}},
		{"version", []string{"version"}, 0, []string{"hess ", "module hess"}, nil},
		{"fmt check clean", []string{"fmt", "--check", "examples/small-flame.hess"}, 0, nil, nil},
		{"fmt syntax error", []string{"fmt", "testdata/check/syntax.hess"}, 1, nil, []string{"[syntax]"}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			r := runHess(t, c.args...)
			if r.code != c.code {
				t.Errorf("exit %d, want %d\nstdout:\n%s\nstderr:\n%s", r.code, c.code, r.stdout, r.stderr)
			}
			for _, s := range c.stdout {
				if !strings.Contains(r.stdout, s) {
					t.Errorf("stdout lacks %q:\n%s", s, r.stdout)
				}
			}
			for _, s := range c.stderr {
				if !strings.Contains(r.stderr, s) {
					t.Errorf("stderr lacks %q:\n%s", s, r.stderr)
				}
			}
		})
	}
}

func TestEndToEndJSONAndSARIF(t *testing.T) {
	r := runHess(t, "check", "--format", "json", "testdata/check/element-imbalance.hess", "testdata/check/unused-species.hess")
	if r.code != 1 {
		t.Fatalf("exit %d: %s", r.code, r.stderr)
	}
	var doc struct {
		Files       []string `json:"files"`
		Diagnostics []struct {
			File   string `json:"file"`
			Line   int    `json:"line"`
			Column int    `json:"column"`
			Code   string `json:"code"`
		} `json:"diagnostics"`
		Summary struct{ Errors, Warnings int } `json:"summary"`
	}
	if err := json.Unmarshal([]byte(r.stdout), &doc); err != nil {
		t.Fatalf("json: %v\n%s", err, r.stdout)
	}
	if len(doc.Files) != 2 || doc.Summary.Errors != 2 || doc.Summary.Warnings != 1 {
		t.Errorf("files %v summary %+v", doc.Files, doc.Summary)
	}
	if d := doc.Diagnostics[0]; d.Line != 4 || d.Column != 16 || d.Code != "element-imbalance" {
		t.Errorf("first diagnostic %+v", d)
	}

	r = runHess(t, "check", "--format", "sarif", "testdata/check/charge-imbalance.hess")
	if r.code != 1 {
		t.Fatalf("exit %d: %s", r.code, r.stderr)
	}
	var log map[string]any
	if err := json.Unmarshal([]byte(r.stdout), &log); err != nil {
		t.Fatalf("sarif: %v", err)
	}
	if log["version"] != "2.1.0" {
		t.Errorf("version %v", log["version"])
	}
}

func TestEndToEndFmtWrite(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "messy.hess")
	messy := "species   H2(g),O2(g) , H2O(g)  # kept\nreaction burn :2 H2(g)  +   O2(g) ⇌ 2H2O(g)\n"
	if err := os.WriteFile(path, []byte(messy), 0o600); err != nil {
		t.Fatal(err)
	}
	if r := runHess(t, "fmt", "--check", path); r.code != 1 || !strings.Contains(r.stdout, "messy.hess") {
		t.Fatalf("--check: exit %d, stdout %q", r.code, r.stdout)
	}
	if r := runHess(t, "fmt", "-w", path); r.code != 0 {
		t.Fatalf("-w: exit %d: %s", r.code, r.stderr)
	}
	got, _ := os.ReadFile(path)
	want := "species H2(g), O2(g), H2O(g)  # kept\nreaction burn: 2 H2(g) + O2(g) <-> 2 H2O(g)\n"
	if string(got) != want {
		t.Errorf("formatted:\n%s\nwant:\n%s", got, want)
	}
	info, _ := os.Stat(path)
	if info.Mode().Perm() != 0o600 {
		t.Errorf("permissions changed to %v", info.Mode().Perm())
	}
	if r := runHess(t, "fmt", "--check", path); r.code != 0 {
		t.Errorf("second --check: exit %d", r.code)
	}
}

// TestReadmeTourParses keeps the README's language tour valid: it must
// parse without syntax errors and already be in the canonical layout.
func TestReadmeTourParses(t *testing.T) {
	readme, err := os.ReadFile(filepath.Join("..", "..", "README.md"))
	if err != nil {
		t.Fatal(err)
	}
	_, after, ok := strings.Cut(string(readme), "## A tour of the language")
	if !ok {
		t.Fatal("README has no language tour")
	}
	_, block, _ := strings.Cut(after, "```\n")
	block, _, _ = strings.Cut(block, "```")
	out, diags := lang.FormatSource("README.md", []byte(block))
	if diags.HasErrors() {
		t.Fatalf("tour does not parse: %v", diags.Err())
	}
	if string(out) != block {
		t.Errorf("tour is not in canonical layout; hess fmt gives:\n%s", out)
	}
}
