package main

import (
	"math"
	"runtime/debug"
	"testing"
)

// TestTuneGC: without GOGC and GOMEMLIMIT in the environment a one-shot
// command runs with the collector off below a 1 GiB soft limit and the
// long-running ones (watch, lsp) and fmt at 100 % under the same limit; either
// variable, when set, is left to the runtime.
func TestTuneGC(t *testing.T) {
	percent := debug.SetGCPercent(100)
	limit := debug.SetMemoryLimit(math.MaxInt64)
	defer func() {
		debug.SetGCPercent(percent)
		debug.SetMemoryLimit(limit)
	}()

	t.Setenv("GOGC", "")
	t.Setenv("GOMEMLIMIT", "")
	for _, tc := range []struct {
		args    []string
		percent int
	}{
		{[]string{"check", "x.hess"}, -1},
		{[]string{"table", "x.hess"}, -1},
		{nil, -1},
		{[]string{"watch", "x.hess"}, 100},
		{[]string{"lsp"}, 100},
		{[]string{"fmt", "x.hess", "y.hess"}, 100},
	} {
		debug.SetGCPercent(50)
		tuneGC(tc.args)
		if p := debug.SetGCPercent(100); p != tc.percent {
			t.Errorf("%v: GC percent %d, want %d", tc.args, p, tc.percent)
		}
		if l := debug.SetMemoryLimit(math.MaxInt64); l != 1<<30 {
			t.Errorf("%v: memory limit %d, want 1 GiB", tc.args, l)
		}
	}

	t.Setenv("GOGC", "50")
	t.Setenv("GOMEMLIMIT", "2GiB")
	tuneGC([]string{"check"})
	if p := debug.SetGCPercent(100); p != 100 {
		t.Errorf("GC percent %d with GOGC set, want it left at 100", p)
	}
	if l := debug.SetMemoryLimit(math.MaxInt64); l != math.MaxInt64 {
		t.Errorf("memory limit %d with GOMEMLIMIT set, want it left alone", l)
	}
}
