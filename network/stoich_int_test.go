package network

import (
	"math/big"
	"testing"

	"hess/chem"
)

// TestIntegerFastPathsAgree compares the integer fast paths with the exact
// rational code on generated reactions (all balanced) and on copies with
// one coefficient changed (unbalanced), and checks that fractional
// coefficients fall back.
func TestIntegerFastPathsAgree(t *testing.T) {
	root, src, _ := synthSource(t, 200, 400)
	n := Load(root, src, Options{})
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
			f := factsOf(v)
			el, ch, ok := f.elements, f.charge, f.intOK
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
			k, rev := f.key, f.reversed
			wk, wrev := netKeyByRats(v)
			if k != wk || rev != wrev || k == "" || k[0] != 'i' {
				t.Fatalf("%s: key %q reversed %v, exact %q %v", v.Name, k, rev, wk, wrev)
			}
			back := *v
			back.Left, back.Right = v.Right, v.Left
			if b := factsOf(&back); b.key != k || b.reversed == rev {
				t.Fatalf("%s reversed: key %q reversed %v, want %q %v", v.Name, b.key, b.reversed, k, !rev)
			}
		}
	}
	if unbalanced != len(n.Reactions) {
		t.Errorf("%d unbalanced variants, want %d", unbalanced, len(n.Reactions))
	}
	half := *n.Reactions[0]
	half.Left = append([]Term(nil), half.Left...)
	half.Left[0].Coef = big.NewRat(1, 2)
	if factsOf(&half).intOK {
		t.Error("a fractional coefficient was taken by the integer fast path")
	}
	if k := factsOf(&half).key; k == "" || k[0] != 'r' {
		t.Errorf("a fractional net coefficient has key %q, want the rational encoding", k)
	}
}

// netKeyByRats is the net key by its exact rational route: a third of a species
// added to both sides cancels out of the net equation but keeps the
// integer path from applying.
func netKeyByRats(rx *Reaction) (string, bool) {
	third := Term{Coef: big.NewRat(1, 3), Species: rx.Left[0].Species}
	probe := *rx
	probe.Left = append(append([]Term(nil), rx.Left...), third)
	probe.Right = append(append([]Term(nil), rx.Right...), third)
	f := factsOf(&probe)
	return f.key, f.reversed
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

// TestSpeciesIntsCopyOwnsItsCounts checks that a copy of a species'
// inline counts reads its own array, not the original's.
func TestSpeciesIntsCopyOwnsItsCounts(t *testing.T) {
	f, err := chem.ParseFormula("CH4", chem.BuiltinElements())
	if err != nil {
		t.Fatal(err)
	}
	var src, dst speciesInts
	src.setFormula(f)
	dst.copyFrom(&src)
	if len(dst.counts) != 2 || &dst.counts[0] != &dst.inline[0] {
		t.Fatalf("copy's counts %v do not lie in its own inline array", dst.counts)
	}
	if dst.counts[0] != src.counts[0] || dst.counts[1] != src.counts[1] || !dst.ok || !dst.known {
		t.Fatalf("copy %+v differs from %+v", dst, src)
	}
}
