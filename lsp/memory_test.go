package lsp

import (
	"runtime"
	"testing"
	"time"
)

// TestCollectAfterCycle checks that a finished cycle starts a collection
// in the background.
func TestCollectAfterCycle(t *testing.T) {
	var before runtime.MemStats
	runtime.ReadMemStats(&before)
	collectAfterCycle()
	if !collecting.Load() {
		t.Fatal("no collection started")
	}
	deadline := time.Now().Add(10 * time.Second)
	for collecting.Load() {
		if time.Now().After(deadline) {
			t.Fatal("the collection did not finish in 10 s")
		}
		time.Sleep(time.Millisecond)
	}
	var after runtime.MemStats
	runtime.ReadMemStats(&after)
	// Servers of other tests may have started collections too.
	if after.NumForcedGC == before.NumForcedGC {
		t.Error("no collection ran")
	}
}
