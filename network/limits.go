package network

import "fmt"

// Limits on what one load reads. Every structure that grows with the input
// has a bound, and passing one is a diagnostic naming it; see
// DEVELOPERS.md ("Hostile input") for why each value was chosen.
const (
	// MaxFileBytes is the most one file may hold. The largest networks we
	// compile (a 50 MB generated file in TestLargeFile) fit; a larger one
	// can be split into includes.
	MaxFileBytes = 64 << 20
	// maxTotalBytes is the most all the files of one network may hold
	// together: four files at the limit.
	maxTotalBytes = 4 * MaxFileBytes
	// maxIncludeFiles is the most files one network may read.
	maxIncludeFiles = 10000
	// maxIncludeDepth is the longest chain of includes, root first.
	maxIncludeDepth = 4096
	// maxChainShown is how many files of a chain of includes a message
	// names before eliding the middle.
	maxChainShown = 8
	// maxQuotedBytes is how much of the first line of an included file
	// that does not read as a network is kept for quoting.
	maxQuotedBytes = 60
)

// sizeText writes a byte count in binary units.
func sizeText(n int64) string {
	switch {
	case n >= 1<<30 && n%(1<<30) == 0:
		return fmt.Sprintf("%d GiB", n>>30)
	case n >= 1<<20 && n%(1<<20) == 0:
		return fmt.Sprintf("%d MiB", n>>20)
	case n >= 1<<10 && n%(1<<10) == 0:
		return fmt.Sprintf("%d KiB", n>>10)
	}
	return fmt.Sprintf("%d bytes", n)
}
