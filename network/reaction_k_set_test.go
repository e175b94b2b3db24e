package network

import (
	"fmt"
	"strings"
	"testing"
)

// kSetNetwork has coupled reactions of every shape a KSet shares or must
// not share: a chain, a part used twice (a diamond), parts with their own
// data, a cycle of combinations, an undefined part and a combination that
// is not its equation's sum.
const kSetNetwork = `settings { temperatures 300 K, 400 K }
species A(g) { formula CO hf 0 kJ/mol s 100 J/mol/K }
species B(g) { formula CO hf -10 kJ/mol s 70 J/mol/K }
species C(g) { formula CO hf 5 kJ/mol s 120 J/mol/K }
reaction ab: A(g) <-> B(g)
reaction bc: B(g) <-> C(g) { dh 12 kJ/mol logk -1.5 }
reaction ac: A(g) <-> C(g) = ab + bc
reaction ac2: A(g) <-> C(g) = ac
reaction aa: 2 A(g) <-> 2 C(g) = ac + ac2
reaction abab: 2 A(g) <-> 2 B(g) = ab + ab
reaction chain: 4 A(g) <-> 4 B(g) = abab + abab
reaction x: A(g) <-> B(g) = y
reaction y: A(g) <-> B(g) = x
reaction z: A(g) <-> B(g) = x
reaction u: A(g) <-> B(g) = nowhere
reaction wrong: A(g) <-> C(g) = ab
`

// A KSet's calculations give every row exactly as a calculation built
// alone does, at its grid temperatures and between them, whatever order
// the reactions come in.
func TestKSetAgreesWithReactionK(t *testing.T) {
	n := loadText(t, kSetNetwork)
	grid := []float64{300, 350, 400, 800}
	off := []float64{298.15, 333.3, 900}
	names := []string{"ab", "bc", "ac", "ac2", "aa", "abab", "chain", "x", "y", "z", "u", "wrong"}
	rows := func(k *ReactionK) string {
		var b strings.Builder
		for _, T := range append(append([]float64(nil), grid...), off...) {
			fmt.Fprintf(&b, "%+v\n", k.Row(T))
		}
		return b.String()
	}
	for _, reversed := range []bool{false, true} {
		s := n.NewKSet(grid)
		for i := range names {
			name := names[i]
			if reversed {
				name = names[len(names)-1-i]
			}
			rx := n.LookupReaction(name)
			if rx == nil {
				t.Fatalf("no reaction %s", name)
			}
			if got, want := rows(s.K(rx)), rows(n.ReactionK(rx)); got != want {
				t.Errorf("%s (reversed %v): set gives\n%s\nalone\n%s", name, reversed, got, want)
			}
		}
	}
}

// A coupled reaction sums its species where its parts take their values
// from species and add up to its equation, or where its parts cannot be
// summed (they lead back, or one is undefined) and the species answer;
// not where a part has own data or the sum is not the equation.
func TestSumsSpecies(t *testing.T) {
	n := loadText(t, kSetNetwork)
	for name, want := range map[string]bool{
		"ab": true, "abab": true, "chain": true, "x": true, "y": true, "z": true, "u": true,
		"bc": false, "ac": false, "ac2": false, "aa": false, "wrong": false,
	} {
		if got := n.ReactionK(n.LookupReaction(name)).SumsSpecies(); got != want {
			t.Errorf("%s: SumsSpecies %v, want %v", name, got, want)
		}
	}
}
