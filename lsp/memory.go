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
// edit as soon as the last one's diagnostics arrive (2 cores, quiet,
// three or five rounds of 24 edits): on the 50 000-reaction network in
// four files, whose heap after a cycle holds 250–300 MiB, the peak is
// 303–310 MiB with a collection after each cycle above 192 MiB, 362–376
// MiB above 256 MiB, and was 450–490 MiB with none, the median edit 147–
// 165 ms, 130–155 ms and 140–162 ms; on the 10 000-species file the
// median is 30–41 ms above 192 MiB and 32–46 ms above 256 MiB. Rules that
// collected only when the heap had grown by half since the last
// collection, or when the next cycle would pass the runtime's goal, let
// the runtime collect during compiles again (380–460 MiB).

// collectAbove is the heap, in bytes, above which the server collects
// after each cycle: well above the whole memory of a server on a network
// of a few thousand species and reactions (under 70 MiB at 1 000 species
// and 5 000 reactions), which the runtime's pacing serves best.
const collectAbove = 192 << 20

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
