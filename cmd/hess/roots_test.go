package main

import (
	"encoding/json"
	"os"
	"path/filepath"
	"sort"
	"strings"
	"testing"
)

// checkJSON is the part of check's JSON report these tests read.
type checkJSON struct {
	Files       []string `json:"files"`
	Diagnostics []struct {
		File    string `json:"file"`
		Code    string `json:"code"`
		Message string `json:"message"`
	} `json:"diagnostics"`
}

func decodeCheck(t *testing.T, out string) checkJSON {
	t.Helper()
	var doc checkJSON
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatalf("%v:\n%s", err, out)
	}
	return doc
}

// hess check examples/ checks each example once, and the shared gas data
// of the hydrogen plant only through the reformer that includes it.
func TestCheckExamplesFolder(t *testing.T) {
	want, err := filepath.Glob(filepath.Join("..", "..", "examples", "*", "*.hess"))
	if err != nil {
		t.Fatal(err)
	}
	top, _ := filepath.Glob(filepath.Join("..", "..", "examples", "*.hess"))
	want = append(want, top...)
	for i, w := range want {
		rel, _ := filepath.Rel(filepath.Join("..", ".."), w)
		want[i] = filepath.ToSlash(rel)
	}
	sort.Strings(want)
	for _, args := range [][]string{
		{"check", "--format", "json", "examples/"},
		{"check", "--format", "json", "examples"},
		// A shell's glob names the library beside the files including it.
		append([]string{"check", "--format", "json"}, want...),
	} {
		r := runHess(t, args...)
		if r.code != exitOK {
			t.Fatalf("%v: exit %d\n%s%s", args, r.code, r.stdout, r.stderr)
		}
		doc := decodeCheck(t, r.stdout)
		for _, d := range doc.Diagnostics {
			t.Errorf("%v: %s: %s [%s]", args, d.File, d.Message, d.Code)
		}
		got := append([]string(nil), doc.Files...)
		sort.Strings(got)
		if strings.Join(got, " ") != strings.Join(want, " ") {
			t.Errorf("%v: files %v, want each of %v once", args, doc.Files, want)
		}
	}
}

func writeTree(t *testing.T, files map[string]string) string {
	t.Helper()
	dir := t.TempDir()
	for name, text := range files {
		path := filepath.Join(dir, filepath.FromSlash(name))
		if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(path, []byte(text), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	return dir
}

// Roots are the files no other file includes; a library is reported only
// through them, files in an include cycle are still checked, and folders
// mix with files.
func TestCheckFolderRoots(t *testing.T) {
	dir := writeTree(t, map[string]string{
		// Shared data: each plant uses one of its species, so on its own
		// it would report the other as unused.
		"lib/gases.hess":  "species H2(g), O2(g), N2(g), NH3(g)\n",
		"plants/a.hess":   "include \"../lib/gases.hess\"\nreaction burn: 2 H2(g) + O2(g) <-> 2 H2O(g)\nspecies H2O(g)\nspecies N2(g), NH3(g)\nreaction nh3: N2(g) + 3 H2(g) <-> 2 NH3(g)\n",
		"plants/b.hess":   "include \"../lib/gases.hess\"\nspecies H2O(l)\nreaction wet: 2 H2(g) + O2(g) <-> 2 H2O(l)\nreaction nh3b: N2(g) + 3 H2(g) <-> 2 NH3(g)\n",
		"loop/one.hess":   "include \"two.hess\"\nspecies CO(g)\n",
		"loop/two.hess":   "include \"one.hess\"\n",
		".hidden/x.hess":  "this is not read\n",
		"notes/readme.md": "not a network\n",
	})
	// The library's folder is named through a symbolic link.
	if err := os.Symlink(filepath.Join(dir, "lib"), filepath.Join(dir, "shared")); err != nil {
		t.Fatal(err)
	}
	r := runHess(t, "check", "--format", "json", filepath.Join(dir, "plants"), filepath.Join(dir, "shared"), filepath.Join(dir, "loop", "one.hess"), filepath.Join(dir, "loop"))
	doc := decodeCheck(t, r.stdout)
	if len(doc.Files) != 5 {
		t.Errorf("files %v, want the 5 network files once each", doc.Files)
	}
	seen := map[string]int{}
	for _, d := range doc.Diagnostics {
		if strings.Contains(d.File, "hidden") {
			t.Errorf("a hidden folder was read: %s", d.File)
		}
		if d.Code == "unused-species" && strings.Contains(d.File, "gases") {
			t.Errorf("the library was checked on its own: %s: %s", d.File, d.Message)
		}
		seen[d.Code]++
	}
	if seen["include-cycle"] == 0 {
		t.Errorf("the include cycle was not checked: %+v", doc.Diagnostics)
	}
	if r.code != exitFindings {
		t.Errorf("exit %d, want %d (the cycle is an error)\n%s", r.code, exitFindings, r.stderr)
	}
}

// fmt --check and fmt -w take folders: every network file below.
func TestFmtFolder(t *testing.T) {
	dir := writeTree(t, map[string]string{
		"a.hess":         "species   H2(g)\n",
		"deep/er/b.hess": "species O2(g)   {  hf 0 kJ/mol }\n",
		"c.hess":         "species N2(g)\n",
		".git/d.hess":    "species   Ar(g)\n",
	})
	r := runHess(t, "fmt", "--check", dir)
	if r.code != exitFindings {
		t.Fatalf("exit %d, want 1\n%s%s", r.code, r.stdout, r.stderr)
	}
	lines := strings.Fields(r.stdout)
	if len(lines) != 2 || !strings.HasSuffix(lines[0], "a.hess") || !strings.HasSuffix(lines[1], "b.hess") {
		t.Errorf("fmt --check listed %q, want a.hess and deep/er/b.hess", lines)
	}
	if r := runHess(t, "fmt", "-w", dir); r.code != exitOK {
		t.Fatalf("fmt -w: exit %d\n%s", r.code, r.stderr)
	}
	if r := runHess(t, "fmt", "--check", dir); r.code != exitOK || r.stdout != "" {
		t.Errorf("after fmt -w: exit %d, %q", r.code, r.stdout)
	}
	if b, _ := os.ReadFile(filepath.Join(dir, ".git", "d.hess")); string(b) != "species   Ar(g)\n" {
		t.Errorf("fmt -w rewrote a file in a hidden folder: %q", b)
	}
}
