//go:build unix

package lang

import (
	"syscall"
	"time"
)

// processCPU is the CPU time (user and system) the test process has used,
// so benchmarks can report it beside wall time on a shared machine.
func processCPU() (time.Duration, bool) {
	var ru syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
		return 0, false
	}
	return time.Duration(ru.Utime.Nano() + ru.Stime.Nano()), true
}
