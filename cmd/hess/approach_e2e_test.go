package main

import (
	"strings"
	"testing"
)

// TestApproachEndToEnd drives the built binary: the examples' mixtures in
// text, and a usage error for an unknown mixture.
func TestApproachEndToEnd(t *testing.T) {
	r := runHess(t, "approach", "--mixture", "sump", "examples/flue-gas-scrubber.hess")
	if r.code != 0 || r.stderr != "" || !strings.Contains(r.stdout, "mixture sump at 323.15 K, 1.01325 bar") ||
		!strings.Contains(r.stdout, "reactions run forward") {
		t.Errorf("approach: exit %d\n%s\n%s", r.code, r.stdout, r.stderr)
	}
	r = runHess(t, "approach", "--mixture", "nowhere", "examples/flue-gas-scrubber.hess")
	if r.code != exitTrouble || r.stdout != "" {
		t.Errorf("unknown mixture: exit %d\n%s", r.code, r.stdout)
	}
}
