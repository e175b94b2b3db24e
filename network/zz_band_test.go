package network

import (
	"fmt"
	"strings"
	"testing"
	"time"
)

func TestBandStress(t *testing.T) {
	var b strings.Builder
	n := 1003
	for i := 0; i < n; i++ {
		fmt.Fprintf(&b, "species s%d(g) { formula C4H10 }\n", i)
	}
	seed := uint64(7)
	next := func(k int) int { seed = seed*6364136223846793005 + 1442695040888963407; return int((seed >> 33) % uint64(k)) }
	for j := 0; j < 2000; j++ {
		w := j / 2
		a, c, d, e := w, w+1+next(3), w+2, w+3
		if c == d {
			d = w + 1
		}
		fmt.Fprintf(&b, "reaction r%d: s%d(g) + s%d(g) <-> s%d(g) + s%d(g) { dg %d kJ/mol }\n", j, a, c, d, e, next(100))
	}
	start := time.Now()
	net := loadText(t, b.String())
	fmt.Println("load+checks", time.Since(start), len(net.Diagnostics))
	a := analyseCycles(net)
	maxLen := 0
	for _, g := range a.groups {
		for _, c := range g.cycles {
			maxLen = max(maxLen, len(c.Terms))
		}
		fmt.Println("cycles", len(g.cycles), "max len", maxLen)
	}
}
