package lsp

import (
	"runtime"
	"runtime/metrics"
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
// for it, and at most one at a time; it costs CPU beside the next compile
// when edits come back to back, a collection per cycle instead of one
// every few. So the server collects after a cycle only once its heap
// holds more than collectAbove: below that the runtime's own pacing costs
// less and the memory is small anyway.
//
// Measured with BenchmarkLSPEditStdio in cmd/hess, which sends the next
// edit as soon as the last one's diagnostics arrive: on the
// 50 000-reaction network in four files (heap 250–300 MiB after a cycle)
// the peak fell from 450–490 MiB to 325 MiB and the median edit rose from
// 140–162 ms to 177–182 ms; rules that collected only when the heap had
// grown by half since the last collection, or when the next cycle would
// pass the runtime's goal, let the runtime collect during compiles again
// (380–460 MiB).

// collectAbove is the heap, in bytes, above which the server collects
// after each cycle.
const collectAbove = 256 << 20

// collecting is set while a collection started by collectAfterCycle runs.
var collecting atomic.Bool

// collectAfterCycle starts a collection in the background when the heap
// holds more than collectAbove, unless one it started is still running.
func collectAfterCycle() {
	if heapObjects() <= collectAbove || !collecting.CompareAndSwap(false, true) {
		return
	}
	go func() {
		defer collecting.Store(false)
		runtime.GC()
	}()
}

// heapObjects is the memory of the heap's objects now, live or not yet
// collected, in bytes (0 when the runtime does not say).
func heapObjects() uint64 {
	s := []metrics.Sample{{Name: "/memory/classes/heap/objects:bytes"}}
	metrics.Read(s)
	if s[0].Value.Kind() != metrics.KindUint64 {
		return 0
	}
	return s[0].Value.Uint64()
}
