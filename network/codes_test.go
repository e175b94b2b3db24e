package network

import (
	"os"
	"path/filepath"
	"testing"

	"hess/lang"
)

// Every code package lang reports is registered as a check.
func TestLangCodesRegistered(t *testing.T) {
	for _, code := range lang.Codes() {
		if byCode(code) == nil {
			t.Errorf("lang reports %q, which no check registers", code)
		}
	}
}

// Every diagnostic of the testdata networks, the examples and the fuzz
// seeds carries a registered code. (FuzzCompile checks the same of every
// input it tries.)
func TestReportedCodesRegistered(t *testing.T) {
	roots := globRoots(t, "../testdata/check/*.hess", "../examples/*/*.hess", "testdata/*/*.hess")
	if len(roots) == 0 {
		t.Fatal("no networks found")
	}
	hostile := map[string][]byte{
		"empty-include.hess": []byte(`include ""`),
		"binary.hess":        []byte("include \"bin.hess\"\n"),
		"bin.hess":           {0, 1, 2, 0xff},
		"outside.hess":       []byte(`include "/etc/hostname"`),
	}
	for name := range hostile {
		if name != "bin.hess" {
			roots = append(roots, name)
		}
	}
	src := Overlay{Files: map[string][]byte{}, Base: Disk{}}
	for name, text := range hostile {
		src.Files[PathID(name)] = text
	}
	for _, root := range roots {
		if _, err := os.Stat(root); err != nil && src.Files[PathID(root)] == nil {
			continue
		}
		for _, d := range Load(root, src, Options{}).Diagnostics {
			if byCode(d.Code) == nil {
				t.Errorf("%s: unregistered code %q: %s", root, d.Code, d.Message)
			}
		}
	}
}

// globRoots lists the files the patterns match, in pattern order.
func globRoots(t *testing.T, patterns ...string) []string {
	t.Helper()
	var roots []string
	for _, pattern := range patterns {
		m, err := filepath.Glob(pattern)
		if err != nil {
			t.Fatal(err)
		}
		roots = append(roots, m...)
	}
	return roots
}
