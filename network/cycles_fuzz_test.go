package network

import (
	"math/big"
	"os"
	"path/filepath"
	"testing"
)

// FuzzCycles compiles arbitrary networks seeded with the cycle testdata:
// the consistency checks must never panic, and every cycle of the basis
// must cancel species by species.
func FuzzCycles(f *testing.F) {
	files, _ := filepath.Glob(filepath.Join("..", "testdata", "cycles", "*.hess"))
	for _, name := range files {
		if src, err := os.ReadFile(name); err == nil {
			f.Add(string(src))
		}
	}
	f.Add(bandNetwork(20))
	f.Add("species A(g), B(g)\nreaction r: A(g) <-> A(g) { dg 1 kJ/mol }\nreaction s: A(g) <-> B(g) { rate A 1 1/s Ea 1 kJ/mol reverse A 2 1/s Ea 1 kJ/mol }\n")
	f.Fuzz(func(t *testing.T, src string) {
		n := Load("net.hess", memSource{"net.hess": []byte(src)}, Options{})
		m := n.Stoichiometry()
		for _, c := range m.CycleBasis(nil) {
			if len(c.Terms) == 0 || c.Terms[0].Weight.Sign() <= 0 {
				t.Fatalf("cycle %q: empty or first weight not positive", c)
			}
			sum := map[int]*big.Rat{}
			for _, term := range c.Terms {
				for _, e := range m.Columns[term.Column] {
					if sum[e.Row] == nil {
						sum[e.Row] = new(big.Rat)
					}
					sum[e.Row].Add(sum[e.Row], new(big.Rat).Mul(e.Coef, new(big.Rat).SetInt(term.Weight)))
				}
			}
			for row, v := range sum {
				if v.Sign() != 0 {
					t.Fatalf("cycle %q: %s does not cancel", c, m.Species[row].Key)
				}
			}
		}
	})
}
