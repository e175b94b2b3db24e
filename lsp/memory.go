package lsp

import (
	"runtime"
	"sync/atomic"
)

// Returning a replaced network's memory. Each cycle builds the new
// networks while the old ones are still live (requests read them, and the
// compile memo copies from them), so a collection that the runtime starts
// in the middle of a compile finds two networks live and sets its next
// goal from both: on a 50 000-reaction network the server's peak reached
// three times its settled live heap. Right after a cycle publishes, the
// old networks have just become garbage and only one network is live: a
// collection started then marks the least and sets the lowest goal, under
// which the next compile fits, so the runtime need not start one during
// it. It runs in the background, so the next edit's compile does not wait
// for it, and at most one at a time. It costs CPU beside the next
// compile when edits come back to back. (Measured with
// BenchmarkLSPEditStdio in cmd/hess, which sends the next edit as soon as
// the last one's diagnostics arrive: on the 50 000-reaction network in
// four files the peak fell from 450–490 MiB to 325 MiB, and the median
// edit rose from 140–162 ms to 177–182 ms; a rule that collected only
// once the heap had grown by half since its last collection let the
// runtime collect during compiles again, 380–440 MiB and 188–196 ms.)

// collecting is set while a collection started by collectAfterCycle runs.
var collecting atomic.Bool

// collectAfterCycle starts a collection in the background unless one it
// started is still running.
func collectAfterCycle() {
	if !collecting.CompareAndSwap(false, true) {
		return
	}
	go func() {
		defer collecting.Store(false)
		runtime.GC()
	}()
}
