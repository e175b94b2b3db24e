package network

import (
	"math/big"
	"sort"
)

// elementCounts sums each element over a side of a reaction.
func elementCounts(terms []Term) map[string]*big.Rat {
	out := map[string]*big.Rat{}
	for _, t := range terms {
		for _, ec := range t.Species.Formula.Elements {
			acc, ok := out[ec.Symbol]
			if !ok {
				acc = new(big.Rat)
				out[ec.Symbol] = acc
			}
			acc.Add(acc, new(big.Rat).Mul(t.Coef, ec.Count))
		}
	}
	return out
}

func netCharge(terms []Term) *big.Rat {
	out := new(big.Rat)
	for _, t := range terms {
		out.Add(out, new(big.Rat).Mul(t.Coef, big.NewRat(int64(t.Species.Charge), 1)))
	}
	return out
}

func unionKeys(a, b map[string]*big.Rat) []string {
	keys := make([]string, 0, len(a)+len(b))
	for k := range a {
		keys = append(keys, k)
	}
	for k := range b {
		if _, ok := a[k]; !ok {
			keys = append(keys, k)
		}
	}
	sort.Strings(keys)
	return keys
}

func ratOrZero(r *big.Rat) *big.Rat {
	if r == nil {
		return new(big.Rat)
	}
	return r
}

// ElementBalance is one element's count on each side of a reaction.
type ElementBalance struct {
	Symbol      string
	Left, Right *big.Rat
}

// Balance returns each element's count on both sides of the reaction (in
// symbol order) and the net charge of each side. It reports false when the
// reaction names a species that is undeclared or has no formula.
func (rx *Reaction) Balance() (elements []ElementBalance, left, right *big.Rat, ok bool) {
	if !rx.Resolved {
		return nil, nil, nil, false
	}
	l, r := elementCounts(rx.Left), elementCounts(rx.Right)
	for _, sym := range unionKeys(l, r) {
		elements = append(elements, ElementBalance{Symbol: sym, Left: ratOrZero(l[sym]), Right: ratOrZero(r[sym])})
	}
	return elements, netCharge(rx.Left), netCharge(rx.Right), true
}
