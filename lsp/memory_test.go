package lsp

import (
	"runtime"
	"testing"
	"time"
)

// TestCollectAfterCycle checks that a finished cycle starts a collection
// in the background once the heap holds more than collectAbove, and not
// before.
func TestCollectAfterCycle(t *testing.T) {
	if testing.Short() {
		t.Skip("allocates collectAbove")
	}
	runtime.GC()
	if heapObjects() > collectAbove {
		t.Skip("the heap is already above collectAbove")
	}
	var before runtime.MemStats
	runtime.ReadMemStats(&before)
	collectAfterCycle()
	if collecting.Load() {
		t.Fatal("a collection started below collectAbove")
	}
	ballast := make([][]byte, 0, collectAbove>>20+1)
	for range collectAbove>>20 + 1 {
		ballast = append(ballast, make([]byte, 1<<20))
	}
	if heapObjects() <= collectAbove {
		t.Skip("the runtime collected the ballast's growth already")
	}
	collectAfterCycle()
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
		t.Error("no collection ran above collectAbove")
	}
	runtime.KeepAlive(ballast)
}
