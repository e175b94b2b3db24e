package network

import (
	"math/rand/v2"
	"testing"

	"hess/lang"
	"hess/synth"
	"hess/thermo"
)

// TestLookupByDeclaredText checks that the compiler's lookup, which tries
// the text that declared a species before splitting the reference, finds
// for every species reference a reaction writes what LookupSpecies finds
// by the canonical key: on the test networks, the examples (hostile and
// odd spellings among them) and a generated network.
func TestLookupByDeclaredText(t *testing.T) {
	roots := globRoots(t, "../testdata/check/*.hess", "../examples/*.hess", "../examples/*/*.hess")
	if len(roots) < 10 {
		t.Fatalf("only %d networks found", len(roots))
	}
	check := func(name string, n *Network) {
		c := &compiler{net: n, declared: map[string]int32{}}
		for _, f := range n.Files {
			for _, st := range f.AST.Statements {
				if st.Species == nil {
					continue
				}
				for _, ref := range st.Species.Refs {
					if ref != nil {
						if sp := n.LookupSpecies(ref.Text); sp != nil {
							if _, seen := c.declared[ref.Text]; !seen {
								c.declared[ref.Text] = int32(sp.index)
							}
						}
					}
				}
			}
		}
		for _, f := range n.Files {
			for _, st := range f.AST.Statements {
				if st.Reaction == nil {
					continue
				}
				for _, side := range [][]*lang.Term{st.Reaction.Left, st.Reaction.Right} {
					for _, term := range side {
						if term == nil || term.Species == nil {
							continue
						}
						text := term.Species.Text
						if got, want := c.lookup(text), n.LookupSpecies(text); got != want {
							t.Errorf("%s: %s: lookup found %v, LookupSpecies %v", name, text, got, want)
						}
					}
				}
			}
		}
	}
	for _, root := range roots {
		check(root, Load(root, Disk{}, Options{}))
	}
	root, src, _ := shapeSource(t, synth.Mechanism, 300, 600)
	check("generated", Load(root, src, Options{}))
}

// TestCoverageMatchesPieces checks coverage, which reads a piecewise
// model's bounds, against each of its pieces' own ranges, at temperatures
// inside, at and just past every bound.
func TestCoverageMatchesPieces(t *testing.T) {
	r := rand.New(rand.NewPCG(7, 8))
	for range 200 {
		var pieces []thermo.Model
		lo := 100 + 400*r.Float64()
		for range 1 + r.IntN(4) {
			hi := lo + 50 + 1000*r.Float64()
			pieces = append(pieces, thermo.NASA7Range{Tmin: lo, Tmax: hi, A: [7]float64{3.5}})
			lo = hi + []float64{0, 0, 1e-9, 5, -20}[r.IntN(5)] // meet, gap or overlap
		}
		pw, err := thermo.NewPiecewise(pieces...)
		if err != nil {
			t.Fatal(err)
		}
		spans := coverage(pw)
		var temps []float64
		for _, b := range pw.Bounds() {
			for _, d := range []float64{-1, -thermo.JoinTolerance, -1e-12, 0, 1e-12, thermo.JoinTolerance, 1} {
				temps = append(temps, b[0]+d, b[1]+d)
			}
		}
		for range 20 {
			temps = append(temps, 50+3000*r.Float64())
		}
		for _, T := range temps {
			want := false
			for _, p := range pw.Pieces() {
				lo, hi := p.Range()
				want = want || T >= lo-thermo.JoinTolerance && T <= hi+thermo.JoinTolerance
			}
			if got := coveredBy(spans, T); got != want {
				t.Fatalf("coverage(%v) at %v: %v, the pieces say %v", pw.Bounds(), T, got, want)
			}
		}
	}
}
