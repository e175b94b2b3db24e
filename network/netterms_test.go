package network

import (
	"math/big"
	"math/rand/v2"
	"testing"

	"hess/thermo"
)

// TestNetTermsMatchExact compares NetTerms and Δn, whose whole-number
// coefficients are summed in integers, with sums in exact rationals on
// random equations: whole and fractional coefficients, species on both
// sides, net coefficients that cancel and ones beyond the shared range.
func TestNetTermsMatchExact(t *testing.T) {
	gas := &Phase{Tag: "g", Convention: IdealGas}
	solid := &Phase{Tag: "s", Convention: Pure}
	var species []*Species
	for i := range 6 {
		ph := gas
		if i%3 == 2 {
			ph = solid
		}
		species = append(species, &Species{Key: string(rune('A' + i)), Phase: ph})
	}
	coefs := []*big.Rat{big.NewRat(1, 1), big.NewRat(2, 1), big.NewRat(3, 1), big.NewRat(1, 2), big.NewRat(150, 1), big.NewRat(7, 3)}
	rng := rand.New(rand.NewPCG(1, 2))
	for trial := range 2000 {
		var rx Reaction
		for side := range 2 {
			for range 1 + rng.IntN(4) {
				c := coefs[rng.IntN(len(coefs))]
				if trial%2 == 0 {
					c = coefs[rng.IntN(3)] // whole numbers only: the integer path
				}
				term := Term{Coef: c, Species: species[rng.IntN(len(species))]}
				if side == 0 {
					rx.Left = append(rx.Left, term)
				} else {
					rx.Right = append(rx.Right, term)
				}
			}
		}
		// The reference: exact sums in order of first appearance.
		var order []*Species
		sum := map[*Species]*big.Rat{}
		for side, terms := range [2][]Term{rx.Left, rx.Right} {
			for _, tm := range terms {
				c := new(big.Rat).Set(tm.Coef)
				if side == 0 {
					c.Neg(c)
				}
				if sum[tm.Species] == nil {
					sum[tm.Species] = new(big.Rat)
					order = append(order, tm.Species)
				}
				sum[tm.Species].Add(sum[tm.Species], c)
			}
		}
		var want []NetTerm
		dn := new(big.Rat)
		for _, sp := range order {
			if sum[sp].Sign() != 0 {
				want = append(want, NetTerm{Species: sp, Nu: sum[sp]})
				if sp.Activity() == thermo.ActivityGas {
					dn.Add(dn, sum[sp])
				}
			}
		}
		got := rx.NetTerms()
		if len(got) != len(want) {
			t.Fatalf("trial %d: %d net terms, want %d", trial, len(got), len(want))
		}
		for i := range got {
			if got[i].Species != want[i].Species || got[i].Nu.Cmp(want[i].Nu) != 0 {
				t.Fatalf("trial %d: term %d is %s %s, want %s %s", trial, i, got[i].Nu.RatString(), got[i].Species.Key, want[i].Nu.RatString(), want[i].Species.Key)
			}
			if f, _ := want[i].Nu.Float64(); got[i].NuFloat() != f {
				t.Fatalf("trial %d: term %d as float %v, want %v", trial, i, got[i].NuFloat(), f)
			}
		}
		if f, _ := dn.Float64(); deltaGasMoles(got) != f {
			t.Fatalf("trial %d: Δn %v, want %v", trial, deltaGasMoles(got), f)
		}
	}
	for i, r := range sharedCoefs {
		if r.Cmp(big.NewRat(int64(i-maxSharedCoef), 1)) != 0 {
			t.Fatalf("shared coefficient %d was changed to %s", i-maxSharedCoef, r.RatString())
		}
	}
}

// TestSmallCoef checks which coefficients are read without big arithmetic.
func TestSmallCoef(t *testing.T) {
	for _, tc := range []struct {
		text string
		n    int64
		ok   bool
	}{
		{"1", 1, true}, {"2", 2, true}, {"99", 99, true}, {"07", 7, true},
		{"0", 0, false}, {"00", 0, false}, {"100", 0, false}, {"1.5", 0, false},
		{"1/2", 0, false}, {"", 0, false}, {"-1", 0, false}, {"1e", 0, false},
	} {
		if n, ok := smallCoef(tc.text); n != tc.n && tc.ok || ok != tc.ok {
			t.Errorf("smallCoef(%q) = %d, %v; want %d, %v", tc.text, n, ok, tc.n, tc.ok)
		}
	}
}
