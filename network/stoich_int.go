package network

import (
	"math/big"
	"slices"
	"strconv"
	"strings"
)

// smallIntLimit bounds the integers the fast paths below accept, so that
// sums and products of a few of them cannot overflow an int64.
const smallIntLimit = 1 << 24

// smallInt is r as an int64 when r is an integer of at most smallIntLimit
// in magnitude.
func smallInt(r *big.Rat) (int64, bool) {
	if r == nil || !r.IsInt() || !r.Num().IsInt64() {
		return 0, false
	}
	v := r.Num().Int64()
	if v > smallIntLimit || v < -smallIntLimit {
		return 0, false
	}
	return v, true
}

// symbolCount is an element's or a species' count in integer arithmetic.
type symbolCount struct {
	key string
	n   int64
}

func addSymbolCount(cs []symbolCount, key string, n int64) []symbolCount {
	for i := range cs {
		if cs[i].key == key {
			cs[i].n += n
			return cs
		}
	}
	return append(cs, symbolCount{key, n})
}

// balancesInIntegers reports whether a reaction whose coefficients and
// formula counts are all small integers balances in every element and in
// charge. ok is false when some number is not such an integer, and the
// exact rational check must decide.
func balancesInIntegers(rx *Reaction) (elements, charge, ok bool) {
	var buf [16]symbolCount
	cs := buf[:0]
	var q int64
	for side, terms := range [2][]Term{rx.Left, rx.Right} {
		sign := int64(1 - 2*side)
		for _, t := range terms {
			c, isInt := smallInt(t.Coef)
			if !isInt || t.Species == nil {
				return false, false, false
			}
			c *= sign
			q += c * int64(t.Species.Charge)
			for _, ec := range t.Species.Formula.Elements {
				k, isInt := smallInt(ec.Count)
				if !isInt {
					return false, false, false
				}
				cs = addSymbolCount(cs, ec.Symbol, c*k)
			}
		}
	}
	elements = true
	for _, e := range cs {
		if e.n != 0 {
			elements = false
		}
	}
	return elements, q == 0, true
}

// netKeysInt is netKeys for a reaction whose coefficients are all small
// integers, with the same result; ok is false for any other reaction.
func netKeysInt(rx *Reaction) (fwd, rev string, ok bool) {
	var buf [12]symbolCount
	cs := buf[:0]
	for side, terms := range [2][]Term{rx.Left, rx.Right} {
		sign := int64(2*side - 1)
		for _, t := range terms {
			c, isInt := smallInt(t.Coef)
			if !isInt || t.Species == nil {
				return "", "", false
			}
			cs = addSymbolCount(cs, t.Species.Key, sign*c)
		}
	}
	cs = slices.DeleteFunc(cs, func(c symbolCount) bool { return c.n == 0 })
	if len(cs) == 0 {
		return "", "", true
	}
	slices.SortFunc(cs, func(a, b symbolCount) int { return strings.Compare(a.key, b.key) })
	var f, r []byte
	for _, c := range cs {
		f = append(f, c.key...)
		f = append(f, '=')
		f = strconv.AppendInt(f, c.n, 10)
		f = append(f, ';')
		r = append(r, c.key...)
		r = append(r, '=')
		r = strconv.AppendInt(r, -c.n, 10)
		r = append(r, ';')
	}
	return string(f), string(r), true
}

// unchargedSpecies reports whether every species of the reaction is
// neutral, so that it balances in charge whatever its coefficients.
func unchargedSpecies(rx *Reaction) bool {
	for _, side := range [2][]Term{rx.Left, rx.Right} {
		for _, t := range side {
			if t.Species == nil || t.Species.Charge != 0 {
				return false
			}
		}
	}
	return true
}
