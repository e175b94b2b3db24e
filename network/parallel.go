package network

import (
	"runtime"
	"sync"
	"sync/atomic"
)

// parallel calls do(i) for every i in [0, n), spread over the available
// processors in batches of batch consecutive indices. newWorker is called
// once per worker goroutine and returns its do, so a worker can keep state
// of its own (a cache, a buffer). With one processor, or no more than one
// batch, everything runs on the calling goroutine.
func parallel(n, batch int, newWorker func() func(i int)) {
	if n == 0 {
		return
	}
	workers := min(runtime.GOMAXPROCS(0), (n+batch-1)/batch)
	if workers < 2 {
		do := newWorker()
		for i := range n {
			do(i)
		}
		return
	}
	var next atomic.Int64
	var wg sync.WaitGroup
	for range workers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			do := newWorker()
			for {
				start := int(next.Add(int64(batch))) - batch
				if start >= n {
					return
				}
				for i := start; i < min(start+batch, n); i++ {
					do(i)
				}
			}
		}()
	}
	wg.Wait()
}
