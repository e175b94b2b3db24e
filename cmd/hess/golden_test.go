package main

import (
	"flag"
	"path/filepath"
	"testing"
)

var update = flag.Bool("update", false, "rewrite golden files")

// checkGolden compares got with the golden file testdata/name, or rewrites
// that file when the -update flag is set.
func checkGolden(t *testing.T, name string, got []byte) {
	t.Helper()
	compareGolden(t, filepath.Join("testdata", filepath.FromSlash(name)), got)
}
