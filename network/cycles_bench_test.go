package network

import (
	"fmt"
	"regexp"
	"strings"
	"testing"
)

func benchText() string {
	text, _ := syntheticNetwork(20000, 2000, 3)
	return text
}

// syntheticNetwork writes a network of isomers (all C4H10, so every
// exchange balances) with nRx reactions, nOwn of which carry a dg that is
// consistent with a hidden potential per species, except nBad of them
// (spread over the network), which are moved by 5 kJ/mol. Half of the
// reactions with data tie one isomer each to a reference isomer, as
// formation data tie compounds to the elements; the other half are
// exchanges among those isomers, each closing a cycle. The reactions
// without data are random exchanges among all isomers.
func syntheticNetwork(nRx, nOwn, nBad int) (text string, moved []string) {
	nSpecies := max(nRx/4, 8)
	linked := min(nOwn/2+1, nSpecies)
	seed := uint64(1)
	next := func(n int) int {
		seed = seed*6364136223846793005 + 1442695040888963407
		return int((seed >> 33) % uint64(n))
	}
	mu := make([]float64, nSpecies)
	for i := range mu {
		mu[i] = float64(next(200000)) - 100000 // J/mol, demo values
	}
	var b strings.Builder
	b.WriteString("settings {\n  temperatures 298.15 K\n}\n")
	for i := 0; i < nSpecies; i++ {
		fmt.Fprintf(&b, "species s%d(g) { formula C4H10 }\n", i)
	}
	every := nRx / nOwn
	own, links, cross := 0, 0, 0
	badEvery := max(nOwn/2/max(nBad, 1), 1)
	for i := 0; i < nRx; i++ {
		if i%every != 0 || own >= nOwn {
			a, c := next(nSpecies), next(nSpecies)
			d, e := next(nSpecies), next(nSpecies)
			fmt.Fprintf(&b, "reaction r%d: s%d(g) + s%d(g) <-> s%d(g) + s%d(g)\n", i, a, c, d, e)
			continue
		}
		var dg float64
		if own%2 == 0 && links < linked-1 {
			links++
			fmt.Fprintf(&b, "reaction r%d: s0(g) <-> s%d(g)", i, links)
			dg = mu[links] - mu[0]
		} else {
			a, c := 1+next(linked-1), 1+next(linked-1)
			d, e := 1+next(linked-1), 1+next(linked-1)
			fmt.Fprintf(&b, "reaction r%d: s%d(g) + s%d(g) <-> s%d(g) + s%d(g)", i, a, c, d, e)
			dg = mu[d] + mu[e] - mu[a] - mu[c]
			if len(moved) < nBad && cross%badEvery == 0 {
				dg += 5000
				moved = append(moved, fmt.Sprintf("r%d", i))
			}
			cross++
		}
		fmt.Fprintf(&b, " { dg %.3f kJ/mol }\n", dg/1000)
		own++
	}
	return b.String(), moved
}

// TestSyntheticNetwork checks the generator and the check on a small
// instance: the moved reactions are named as likely culprits.
func TestSyntheticNetwork(t *testing.T) {
	text, moved := syntheticNetwork(2000, 200, 2)
	n := loadText(t, text)
	culprit := regexp.MustCompile(`^likely culprit: (` + strings.Join(moved, "|") + `) \(`)
	got := 0
	for _, d := range n.Diagnostics {
		if d.Code != "cycle-inconsistent" {
			continue
		}
		got++
		if !culprit.MatchString(d.Detail) {
			t.Errorf("%s\n  %s", d.Message, d.Detail)
		}
	}
	if got == 0 {
		t.Error("no cycle-inconsistent diagnostic")
	}
}

// BenchmarkCycleCheck runs the cycle check on a network of 20 000
// reactions, 2 000 of which carry their own ΔrG° (three of them wrong).
func BenchmarkCycleCheck(b *testing.B) {
	n := Load("synthetic.hess", memSource{"synthetic.hess": []byte(benchText())}, Options{})
	base := n.Diagnostics
	b.ReportAllocs()
	b.ResetTimer()
	for b.Loop() {
		n.Diagnostics = base[:len(base):len(base)]
		cycleInconsistentCheck.Run(&Pass{Net: n, check: cycleInconsistentCheck})
	}
}

// BenchmarkCycleBasis finds the cycle basis of the 2 000 reactions with
// own data in the same network.
func BenchmarkCycleBasis(b *testing.B) {
	n := Load("synthetic.hess", memSource{"synthetic.hess": []byte(benchText())}, Options{})
	var own []*Reaction
	for _, rx := range n.Reactions {
		if hasOwnData(rx) {
			own = append(own, rx)
		}
	}
	b.ReportAllocs()
	b.ResetTimer()
	for b.Loop() {
		m := NewStoichMatrix(own)
		if len(m.CycleBasis(nil)) == 0 {
			b.Fatal("no cycles")
		}
	}
}
