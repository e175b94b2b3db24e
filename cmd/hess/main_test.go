package main

import (
	"math"
	"runtime/debug"
	"testing"
)

// TestTuneGC: without GOGC and GOMEMLIMIT in the environment the collector
// runs at 400 % with a 1 GiB soft limit; either variable, when set, is left
// to the runtime.
func TestTuneGC(t *testing.T) {
	percent := debug.SetGCPercent(100)
	limit := debug.SetMemoryLimit(math.MaxInt64)
	defer func() {
		debug.SetGCPercent(percent)
		debug.SetMemoryLimit(limit)
	}()

	t.Setenv("GOGC", "")
	t.Setenv("GOMEMLIMIT", "")
	tuneGC()
	if p := debug.SetGCPercent(100); p != 400 {
		t.Errorf("GC percent %d, want 400", p)
	}
	if l := debug.SetMemoryLimit(math.MaxInt64); l != 1<<30 {
		t.Errorf("memory limit %d, want 1 GiB", l)
	}

	t.Setenv("GOGC", "50")
	t.Setenv("GOMEMLIMIT", "2GiB")
	tuneGC()
	if p := debug.SetGCPercent(100); p != 100 {
		t.Errorf("GC percent %d with GOGC set, want it left at 100", p)
	}
	if l := debug.SetMemoryLimit(math.MaxInt64); l != math.MaxInt64 {
		t.Errorf("memory limit %d with GOMEMLIMIT set, want it left alone", l)
	}
}
