package network

import (
	"math/big"
	"testing"
)

// TestIntegerFastPathsAgree compares the integer fast paths with the exact
// rational code on generated reactions (all balanced) and on copies with
// one coefficient changed (unbalanced), and checks that fractional
// coefficients fall back.
func TestIntegerFastPathsAgree(t *testing.T) {
	root, src, _ := synthSource(t, 200, 400)
	n := Load(root, src)
	if len(n.Reactions) != 400 {
		t.Fatalf("%d reactions", len(n.Reactions))
	}
	exact := func(rx *Reaction) (elements, charge bool) {
		l, r := elementCounts(rx.Left), elementCounts(rx.Right)
		elements = true
		for _, sym := range unionKeys(l, r) {
			if ratOrZero(l[sym]).Cmp(ratOrZero(r[sym])) != 0 {
				elements = false
			}
		}
		return elements, netCharge(rx.Left).Cmp(netCharge(rx.Right)) == 0
	}
	unbalanced := 0
	for i, rx := range n.Reactions {
		variants := []*Reaction{rx}
		bumped := *rx
		bumped.Left = append([]Term(nil), rx.Left...)
		bumped.Left[0].Coef = new(big.Rat).Add(rx.Left[0].Coef, big.NewRat(int64(1+i%3), 1))
		variants = append(variants, &bumped)
		for _, v := range variants {
			el, ch, ok := balancesInIntegers(v)
			if !ok {
				t.Fatalf("%s: integer reaction not taken by the fast path", v.Name)
			}
			wantEl, wantCh := exact(v)
			if el != wantEl || ch != wantCh {
				t.Fatalf("%s: fast path says elements %v charge %v, exact %v %v", v.Name, el, ch, wantEl, wantCh)
			}
			if !el {
				unbalanced++
			}
			f, r, _ := netKeysInt(v)
			wf, wr := netKeysRat(v)
			if f != wf || r != wr {
				t.Fatalf("%s: keys %q %q, exact %q %q", v.Name, f, r, wf, wr)
			}
		}
	}
	if unbalanced != len(n.Reactions) {
		t.Errorf("%d unbalanced variants, want %d", unbalanced, len(n.Reactions))
	}
	half := *n.Reactions[0]
	half.Left = append([]Term(nil), half.Left...)
	half.Left[0].Coef = big.NewRat(1, 2)
	if _, _, ok := balancesInIntegers(&half); ok {
		t.Error("a fractional coefficient was taken by the integer fast path")
	}
	if _, _, ok := netKeysInt(&half); ok {
		t.Error("a fractional coefficient was taken by the integer key path")
	}
}

// netKeysRat is netKeys by its exact rational route: a third of a species
// added to both sides cancels out of the net equation but keeps the
// integer path from applying.
func netKeysRat(rx *Reaction) (fwd, rev string) {
	third := Term{Coef: big.NewRat(1, 3), Species: rx.Left[0].Species}
	probe := *rx
	probe.Left = append(append([]Term(nil), rx.Left...), third)
	probe.Right = append(append([]Term(nil), rx.Right...), third)
	return netKeys(&probe)
}

func TestUnchargedSpecies(t *testing.T) {
	n := loadText(t, "species A+(aq) { formula A }\nspecies A(aq), B(aq)\nreaction r1: A(aq) <-> B(aq)\nreaction r2: A+(aq) <-> B(aq)\n")
	if !unchargedSpecies(n.LookupReaction("r1")) {
		t.Error("r1 has only neutral species")
	}
	if unchargedSpecies(n.LookupReaction("r2")) {
		t.Error("r2 has a cation")
	}
}
