package main

import (
	"bytes"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"hess/network"
)

// TestCheckGolden renders every testdata network with the text and JSON
// renderers and compares with the golden files beside it
// (testdata/check/NAME.text.golden and NAME.json.golden at the module root).
// Run with -update to rewrite them, then review the diff.
func TestCheckGolden(t *testing.T) {
	root, err := filepath.Abs(filepath.Join("..", ".."))
	if err != nil {
		t.Fatal(err)
	}
	t.Chdir(root)
	files, err := filepath.Glob(filepath.Join("testdata", "check", "*.hess"))
	if err != nil || len(files) == 0 {
		t.Fatalf("no testdata networks: %v", err)
	}
	for _, f := range files {
		base := strings.TrimSuffix(f, ".hess")
		t.Run(filepath.Base(f), func(t *testing.T) {
			var stderr bytes.Buffer
			rep, trouble := compileAll([]string{filepath.ToSlash(f)}, nil, network.Options{}, &stderr)
			if trouble {
				t.Fatalf("compile: %s", stderr.String())
			}
			var text, js bytes.Buffer
			if err := renderText(&text, rep, false); err != nil {
				t.Fatal(err)
			}
			if err := renderJSON(&js, rep); err != nil {
				t.Fatal(err)
			}
			compareGolden(t, base+".text.golden", text.Bytes())
			compareGolden(t, base+".json.golden", js.Bytes())
		})
	}
}

// compareGolden compares got with the golden file at path (relative to the
// working folder), or rewrites it under -update.
func compareGolden(t *testing.T, path string, got []byte) {
	t.Helper()
	if *update {
		if err := os.MkdirAll(filepath.Dir(path), 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(path, got, 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("reading golden file (run with -update to create it): %v", err)
	}
	if !bytes.Equal(got, want) {
		t.Errorf("%s differs from the golden file (run with -update after review)\n--- got ---\n%s\n--- want ---\n%s", path, got, want)
	}
}
