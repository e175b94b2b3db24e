package network

import (
	"math/big"
	"testing"

	"hess/lang"
	"hess/synth"
)

// TestTermFactsAgree checks that the stoichiometric facts a reaction's
// compile works out from the species' termFacts (balance in elements and
// charge, net-equation key) are those factsOf works out from the species
// themselves, on the test networks, the examples and generated networks of
// both shapes; and, on the generated ones, for copies of every reaction
// with a coefficient changed (unbalanced) and with its sides swapped.
func TestTermFactsAgree(t *testing.T) {
	roots := globRoots(t, "../testdata/check/*.hess", "../examples/*.hess", "../examples/*/*.hess")
	if len(roots) < 10 {
		t.Fatalf("only %d networks found", len(roots))
	}
	compared := 0
	agree := func(name string, n *Network) {
		for _, rx := range n.Reactions {
			if !rx.stoich.known {
				continue
			}
			compared++
			if got, want := rx.stoich, factsOf(rx); got != want {
				t.Errorf("%s: %s: compiled %+v, from the species %+v", name, rx.Name, got, want)
			}
		}
	}
	for _, root := range roots {
		agree(root, Load(root, Disk{}, Options{}))
	}
	for _, shape := range []synth.Shape{synth.Spread, synth.Mechanism} {
		root, src, _ := shapeSource(t, shape, 300, 900)
		n := Load(root, src, Options{})
		agree(shape.String(), n)
		tf := newTermFacts(n.Species)
		unbalanced := 0
		for i, rx := range n.Reactions {
			bumped := *rx
			bumped.Left = append([]Term(nil), rx.Left...)
			bumped.Left[0].Coef = new(big.Rat).Add(rx.Left[0].Coef, big.NewRat(int64(1+i%3), 1))
			swapped := *rx
			swapped.Left, swapped.Right = rx.Right, rx.Left
			for _, v := range []*Reaction{rx, &bumped, &swapped} {
				coefs, ok := intCoefficients(v)
				if !ok {
					t.Fatalf("%s: coefficients not small integers", v.Name)
				}
				var idx []int32
				for _, side := range [2][]Term{v.Left, v.Right} {
					for _, term := range side {
						idx = append(idx, int32(term.Species.index))
					}
				}
				got, want := tf.stoich(v, coefs, idx), factsWith(v, coefs)
				if got != want {
					t.Fatalf("%s: %+v from termFacts, %+v from the species", v.Name, got, want)
				}
				if !got.elements {
					unbalanced++
				}
			}
		}
		if unbalanced == 0 {
			t.Errorf("%v: no unbalanced variant compared", shape)
		}
	}
	if compared < 1000 {
		t.Errorf("only %d reactions compared", compared)
	}
}

// TestTermFactsFallBack checks formulas of four elements and of a count
// that is not a small integer (whose facts are not compact: its reactions'
// facts come from the species), an electron and an ion: the compiled facts
// agree with the species'.
func TestTermFactsFallBack(t *testing.T) {
	text := `species NaHCO3(s) { hf -950.8 kJ/mol }
species Na2CO3(s) { hf -1130.7 kJ/mol }
species O2(g) { hf 0 kJ/mol }
species CO2(g) { hf -393.5 kJ/mol }
species H2O(l) { hf -285.8 kJ/mol }
species Fe0.95O(s) { hf -266 kJ/mol }
species Fe(s) { hf 0 kJ/mol }
species e-(aq) { hf 0 kJ/mol }
species Fe^2+(aq) { hf -89.1 kJ/mol }
reaction soda: 2 NaHCO3(s) -> Na2CO3(s) + CO2(g) + H2O(l)
reaction wustite: 19 Fe(s) + 10 O2(g) -> 20 Fe0.95O(s)
reaction ox: Fe(s) -> Fe^2+(aq) + 2 e-(aq)
reaction bad: Fe(s) -> Fe^2+(aq) + e-(aq)
reaction long: NaHCO3(s) + NaHCO3(s) + Fe(s) + Fe(s) + CO2(g) -> Na2CO3(s) + CO2(g) + H2O(l) + Fe(s) + Fe(s) + CO2(g)
reaction half: Fe(s) + 1/2 O2(g) + 2 e-(aq) -> Fe^2+(aq) + H2O(l)
reaction spelled: Fe(s) -> Fe++(aq) + 2 e-(aq)
`
	n := Load("/t/net.hess", memSource{"/t/net.hess": []byte(text)}, Options{})
	tf := newTermFacts(n.Species)
	compact := map[string]bool{}
	for i, sp := range n.Species {
		compact[sp.Key] = tf.facts[i].compact
	}
	if !compact["NaHCO3(s)"] || compact["Fe0.95O(s)"] || !compact["CO2(g)"] || !compact["e-(aq)"] {
		t.Errorf("compact facts: %v", compact)
	}
	if len(n.Reactions) != 7 {
		t.Fatalf("%d reactions: %v", len(n.Reactions), n.Diagnostics)
	}
	for _, rx := range n.Reactions {
		if got, want := rx.stoich, factsOf(rx); !got.known || got != want {
			t.Errorf("%s: compiled %+v, from the species %+v", rx.Name, got, want)
		}
	}
	if f := n.LookupReaction("bad").stoich; !f.intOK || f.charge {
		t.Errorf("bad: %+v, want an integer charge imbalance", f)
	}
	if f := n.LookupReaction("long").stoich; !f.intOK || !f.elements || !f.charge {
		t.Errorf("long (eleven terms, species on both sides): %+v, want balanced", f)
	}
	if rx := n.LookupReaction("spelled"); rx.Left[0].Species == nil || rx.Right[0].Species != n.LookupSpecies("Fe^2+(aq)") || int(rx.Right[0].at)-1 != rx.Right[0].Species.index {
		t.Errorf("spelled: a charge written otherwise did not find its species and index: %+v", rx.Right[0])
	}
}

// TestTermIndex checks that every term the compiler makes holds its
// species' declaration index, and that termIndex falls back on the
// species where a term holds none or one that is not its species' (a term
// copied into another network).
func TestTermIndex(t *testing.T) {
	root, src, _ := shapeSource(t, synth.Mechanism, 300, 900)
	n := Load(root, src, Options{})
	terms := 0
	for _, rx := range n.Reactions {
		for _, side := range [2][]Term{rx.Left, rx.Right} {
			for _, term := range side {
				terms++
				if term.Species == nil {
					continue
				}
				if int(term.at)-1 != term.Species.index {
					t.Fatalf("%s: %s holds index %d, declared at %d", rx.Name, term.Species.Key, term.at-1, term.Species.index)
				}
				if got := termIndex(n.Species, term); got != term.Species.index {
					t.Fatalf("%s: termIndex %d, want %d", term.Species.Key, got, term.Species.index)
				}
				bare := Term{Coef: term.Coef, Species: term.Species}
				if got := termIndex(n.Species, bare); got != term.Species.index {
					t.Fatalf("%s without an index: termIndex %d, want %d", term.Species.Key, got, term.Species.index)
				}
				stale := term
				stale.at = int32((term.Species.index+1)%len(n.Species)) + 1
				if got := termIndex(n.Species, stale); got != term.Species.index {
					t.Fatalf("%s with another's index: termIndex %d, want %d", term.Species.Key, got, term.Species.index)
				}
				if got := termIndex(n.Species[:0], term); got != -1 {
					t.Fatalf("%s in another network: termIndex %d, want -1", term.Species.Key, got)
				}
			}
		}
	}
	if terms == 0 {
		t.Fatal("no terms")
	}
	if got := termIndex(n.Species, Term{}); got != -1 {
		t.Errorf("a term without a species: termIndex %d", got)
	}
}

// TestResolveTerms checks the pass that looks up every term's species
// before the reactions are built: each index it gives is that of the
// species lookup finds for the term, and -1 only where the term does not
// write the species as its declaration did (or names none), on the test
// networks, the examples and a generated network.
func TestResolveTerms(t *testing.T) {
	roots := globRoots(t, "../testdata/check/*.hess", "../examples/*.hess", "../examples/*/*.hess")
	nets := map[string]*Network{}
	for _, root := range roots {
		nets[root] = Load(root, Disk{}, Options{})
	}
	root, src, _ := shapeSource(t, synth.Mechanism, 300, 900)
	nets["generated"] = Load(root, src, Options{})
	found := 0
	for name, n := range nets {
		c := &compiler{net: n, declared: map[string]int32{}}
		var sts []*lang.Statement
		c.each(func(st *lang.Statement) {
			if st.Species != nil {
				for _, ref := range st.Species.Refs {
					if ref == nil {
						continue
					}
					if sp := n.LookupSpecies(ref.Text); sp != nil && sp.Span == ref.Span() {
						c.declared[ref.Text] = int32(sp.index)
					}
				}
			}
			if st.Reaction != nil {
				sts = append(sts, st)
			}
		})
		resolved, starts := c.resolveTerms(sts)
		for i, st := range sts {
			got := resolved[starts[i]:starts[i+1]]
			r := st.Reaction
			if st.Broken {
				if len(got) != 0 {
					t.Errorf("%s: a statement that did not parse has %d resolved terms", name, len(got))
				}
				continue
			}
			k := 0
			for _, side := range [2][]*lang.Term{r.Left, r.Right} {
				for _, term := range side {
					want := int32(-1)
					if term != nil && term.Species != nil {
						if j, ok := c.declared[term.Species.Text]; ok {
							want = j
						}
					}
					if got[k] != want {
						t.Errorf("%s: term %d of %s: resolved %d, want %d", name, k, st.Text(), got[k], want)
					}
					if got[k] >= 0 {
						found++
						if sp := n.LookupSpecies(term.Species.Text); sp == nil || sp.index != int(got[k]) {
							t.Errorf("%s: %s resolved to %d, LookupSpecies finds %v", name, term.Species.Text, got[k], sp)
						}
					}
					k++
				}
			}
		}
	}
	if found < 1000 {
		t.Errorf("only %d terms resolved", found)
	}
}
