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

// TestApproachBrineBeyondDavies drives the built binary on a brine beyond
// Davies' range: the activity-range warning names I and the model on
// stderr, and the numbers still come (a warning, exit 0), marked beyond
// the range; the scrubber's sump shows I and γ.
func TestApproachBrineBeyondDavies(t *testing.T) {
	r := runHess(t, "approach", "--mixture", "pond-brine", "testdata/check/activity-range.hess")
	if r.code != 0 || !strings.Contains(r.stderr, "ionic strength 3 mol/kg is beyond the range of the davies activity model (up to 0.5 mol/kg)") ||
		!strings.Contains(r.stdout, "I = 3 mol/kg") || !strings.Contains(r.stdout, "(beyond the model's range of validity)") {
		t.Errorf("brine: exit %d\n%s\n%s", r.code, r.stdout, r.stderr)
	}
	r = runHess(t, "approach", "--mixture", "sump", "examples/flue-gas-scrubber.hess")
	if !strings.Contains(r.stdout, "solution: davies activity model, I = 0.0157 mol/kg") || !strings.Contains(r.stdout, "Ca^2+(aq)") {
		t.Errorf("sump: exit %d\n%s\n%s", r.code, r.stdout, r.stderr)
	}
}
