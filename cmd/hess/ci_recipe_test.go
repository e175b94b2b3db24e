package main

import (
	"bytes"
	"encoding/json"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
)

// readmeCIStep returns the shell step of the README's CI section.
func readmeCIStep(t *testing.T) string {
	t.Helper()
	b, err := os.ReadFile(filepath.Join("..", "..", "README.md"))
	if err != nil {
		t.Fatal(err)
	}
	_, rest, ok := strings.Cut(string(b), "<!-- ci-step:begin -->")
	block, _, ok2 := strings.Cut(rest, "<!-- ci-step:end -->")
	_, code, ok3 := strings.Cut(block, "```sh\n")
	code, _, ok4 := strings.Cut(code, "```")
	if !ok || !ok2 || !ok3 || !ok4 {
		t.Fatal("README.md has no ci-step block")
	}
	return code
}

// copyTree copies the regular files below src into dst.
func copyTree(t *testing.T, src, dst string) {
	t.Helper()
	err := filepath.Walk(src, func(path string, info os.FileInfo, err error) error {
		if err != nil {
			return err
		}
		rel, _ := filepath.Rel(src, path)
		target := filepath.Join(dst, rel)
		if info.IsDir() {
			return os.MkdirAll(target, 0o755)
		}
		b, err := os.ReadFile(path)
		if err != nil {
			return err
		}
		return os.WriteFile(target, b, 0o644)
	})
	if err != nil {
		t.Fatal(err)
	}
}

// The README's CI step, run as written on a repository holding the
// examples: clean, it passes with an empty SARIF log; with an error or an
// unformatted file it fails, and the log still holds the findings.
func TestReadmeCIStep(t *testing.T) {
	sh, err := exec.LookPath("sh")
	if err != nil {
		t.Skip("no sh")
	}
	step := readmeCIStep(t)
	bin := filepath.Dir(hessBinary(t))
	runStep := func(dir string) (int, string, []any) {
		cmd := exec.Command(sh, "-c", step)
		cmd.Dir = dir
		cmd.Env = append(os.Environ(), "PATH="+bin+string(os.PathListSeparator)+os.Getenv("PATH"), "NO_COLOR=1")
		var out bytes.Buffer
		cmd.Stdout, cmd.Stderr = &out, &out
		err := cmd.Run()
		code := 0
		if ee, ok := err.(*exec.ExitError); ok {
			code = ee.ExitCode()
		} else if err != nil {
			t.Fatal(err)
		}
		var log struct {
			Runs []struct {
				Results []any `json:"results"`
			} `json:"runs"`
		}
		b, err := os.ReadFile(filepath.Join(dir, "hess.sarif"))
		if err != nil || json.Unmarshal(b, &log) != nil || len(log.Runs) != 1 {
			t.Fatalf("no SARIF log (%v):\n%s\n%s", err, b, out.String())
		}
		return code, out.String(), log.Runs[0].Results
	}
	repo := t.TempDir()
	copyTree(t, filepath.Join("..", "..", "examples"), filepath.Join(repo, "networks"))
	if code, out, results := runStep(repo); code != 0 || len(results) != 0 {
		t.Fatalf("clean examples: exit %d, %d results\n%s", code, len(results), out)
	}
	bad := "species CO(g), O2(g), CO2(g)\nreaction burn: CO(g) + O2(g) <-> CO2(g)\n"
	if err := os.WriteFile(filepath.Join(repo, "networks", "burn.hess"), []byte(bad), 0o644); err != nil {
		t.Fatal(err)
	}
	code, out, results := runStep(repo)
	if code != exitFindings || len(results) == 0 || !strings.Contains(out, "[element-imbalance]") {
		t.Errorf("an unbalanced reaction: exit %d, %d results\n%s", code, len(results), out)
	}
	os.Remove(filepath.Join(repo, "networks", "burn.hess"))
	if err := os.WriteFile(filepath.Join(repo, "networks", "loose.hess"), []byte("species   N2(g)\nreaction n: N2(g) <-> N2(g)\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	if code, out, _ := runStep(repo); code != exitFindings || !strings.Contains(out, "loose.hess") {
		t.Errorf("an unformatted file: exit %d\n%s", code, out)
	}
}
