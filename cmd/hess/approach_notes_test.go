package main

import (
	"bytes"
	"path/filepath"
	"strings"
	"testing"
)

// A reaction a mixture gives no quotient for is a note for approach only:
// check and table say nothing of it.
func TestNotInMixtureOnlyInApproach(t *testing.T) {
	path := filepath.Join("..", "..", "testdata", "check", "not-in-mixture.hess")
	for _, args := range [][]string{
		{"check", path},
		{"check", "--format", "json", path},
		{"table", path},
	} {
		var stdout, stderr bytes.Buffer
		if code := run(args, &stdout, &stderr); code != exitOK {
			t.Fatalf("%v: exit %d: %s", args, code, stderr.String())
		}
		if out := stdout.String() + stderr.String(); strings.Contains(out, "[not-in-mixture]") || strings.Contains(out, `"not-in-mixture"`) {
			t.Errorf("%v reports not-in-mixture:\n%s", args, out)
		}
	}
	var stdout, stderr bytes.Buffer
	if code := run([]string{"approach", path}, &stdout, &stderr); code != exitOK {
		t.Fatalf("approach: exit %d: %s", code, stderr.String())
	}
	if !strings.Contains(stderr.String(), "mixture flue gives no quotient for calcine") {
		t.Errorf("approach does not report not-in-mixture:\n%s", stderr.String())
	}
}
