package main

import (
	"context"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

// aleScript opens the broken reformer, waits for ALE's list of problems
// and writes it to ale.json; then fixes an unformatted file with the
// README's fixer (hess fmt - on standard input) and writes the result to
// fixed.txt.
const aleScript = `
edit reformer.hess
let s:n = 0
while s:n < 200 && empty(get(get(g:ale_buffer_info, bufnr(''), {}), 'loclist', []))
  sleep 100m
  let s:n += 1
endwhile
call writefile([json_encode(get(get(g:ale_buffer_info, bufnr(''), {}), 'loclist', []))], 'ale.json')
edit messy.hess
ALEFix
let s:n = 0
while s:n < 100 && getline(1) !=# 'species Ar(g) {'
  sleep 100m
  let s:n += 1
endwhile
call writefile(getline(1, '$'), 'fixed.txt')
qa!
`

// readmeBlock returns the first fenced block of the given language after
// the marker in the README.
func readmeBlock(t *testing.T, marker, lang string) string {
	t.Helper()
	readme, err := os.ReadFile(filepath.Join("..", "..", "README.md"))
	if err != nil {
		t.Fatal(err)
	}
	s := string(readme)
	i := strings.Index(s, marker)
	if i < 0 {
		t.Fatalf("the README has no %q", marker)
	}
	fence := "```" + lang + "\n"
	start := strings.Index(s[i:], fence)
	if start < 0 {
		t.Fatalf("no %s block after %q in the README", lang, marker)
	}
	block := s[i+start+len(fence):]
	return block[:strings.Index(block, "```")]
}

// TestVimALEReadmeRecipe runs the README's Vim set-up with ALE (Debian's
// vim-nox and vim-ale): the diagnostic of the broken example arrives with
// its code and columns, and the fixer formats through standard input.
func TestVimALEReadmeRecipe(t *testing.T) {
	vim := requireTool(t, "vim", "apt-get install -y vim-nox vim-ale")
	if v, err := exec.Command(vim, "--version").Output(); err != nil || !strings.Contains(string(v), "+job") {
		// A minimal build (vim-tiny) has no jobs, which ALE needs.
		if os.Getenv("HESS_REQUIRE_EXTERNAL") == "1" {
			t.Fatalf("vim has no +job (apt-get install -y vim-nox), and HESS_REQUIRE_EXTERNAL=1 requires it")
		}
		t.Skip("vim has no +job (apt-get install -y vim-nox): skipping the editor test")
	}
	const aleDir = "/usr/share/vim-ale"
	if _, err := os.Stat(filepath.Join(aleDir, "plugin", "ale.vim")); err != nil {
		if os.Getenv("HESS_REQUIRE_EXTERNAL") == "1" {
			t.Fatalf("ALE is not installed (apt-get install -y vim-ale), and HESS_REQUIRE_EXTERNAL=1 requires it")
		}
		t.Skip("ALE is not installed (apt-get install -y vim-ale): skipping the editor test")
	}
	bin := hessBinary(t)
	dir := t.TempDir()
	_, bad, line := brokenReformer(t, dir)
	binDir := filepath.Join(dir, "bin")
	if err := os.Mkdir(binDir, 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.Symlink(bin, filepath.Join(binDir, "hess")); err != nil {
		t.Fatal(err)
	}
	vimrc := "set nocompatible\nset runtimepath^=" + aleDir + "\nfiletype plugin on\n" +
		readmeBlock(t, "**Vim** with [ALE]", "vim") + "runtime plugin/ale.vim\n"
	for name, text := range map[string]string{
		"vimrc": vimrc, "test.vim": aleScript, "messy.hess": "species   Ar(g)  {hf 0 kJ/mol}\n",
	} {
		if err := os.WriteFile(filepath.Join(dir, name), []byte(text), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	ctx, cancel := context.WithTimeout(context.Background(), 60*time.Second)
	defer cancel()
	cmd := exec.CommandContext(ctx, vim, "-N", "-u", "vimrc", "-i", "NONE", "--not-a-term", "-c", "source test.vim")
	cmd.Dir = dir
	cmd.Env = append(os.Environ(), "HOME="+dir, "PATH="+binDir+string(os.PathListSeparator)+os.Getenv("PATH"))
	out, err := cmd.CombinedOutput()
	if err != nil {
		t.Fatalf("vim: %v", err)
	}
	var loclist []struct {
		Lnum   int    `json:"lnum"`
		Col    int    `json:"col"`
		EndCol int    `json:"end_col"`
		Type   string `json:"type"`
		Code   string `json:"code"`
		Text   string `json:"text"`
	}
	readJSON(t, filepath.Join(dir, "ale.json"), &loclist, nil)
	var found bool
	for _, d := range loclist {
		if d.Code != "element-imbalance" {
			continue
		}
		found = true
		// Vim counts 1-based byte columns; ALE's end column is inclusive.
		startCol := strings.Index(bad, "CH4(g)") + 1
		if d.Lnum != line+1 || d.Col != startCol || d.Type != "E" || d.Text != "H: left 6, right 4" {
			t.Errorf("ALE shows %+v, want an error at %d:%d saying H: left 6, right 4", d, line+1, startCol)
		}
	}
	if !found {
		t.Errorf("ALE has no element-imbalance: %+v (vim output %q)", loclist, out)
	}
	fixed, err := os.ReadFile(filepath.Join(dir, "fixed.txt"))
	if err != nil {
		t.Fatal(err)
	}
	if string(fixed) != "species Ar(g) {\n  hf 0 kJ/mol\n}\n" {
		t.Errorf("ALEFix with hess fmt - gave %q", fixed)
	}
}
