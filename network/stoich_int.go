package network

import (
	"encoding/binary"
	"math/big"
	"slices"

	"hess/chem"
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

// count is a count in integer arithmetic of an element, a species or a
// declaration index (key): the few of one formula or one reaction, kept
// in a short list.
type count[K comparable] struct {
	key K
	n   int64
}

// addCount adds n to key's count in cs, appending key when it is not
// there yet.
func addCount[K comparable](cs []count[K], key K, n int64) []count[K] {
	for i := range cs {
		if cs[i].key == key {
			cs[i].n += n
			return cs
		}
	}
	return append(cs, count[K]{key, n})
}

// symbolCount is an element's count by symbol.
type symbolCount = count[string]

// intCoefficients returns the reaction's coefficients, left side then
// right, when all are small integers.
func intCoefficients(rx *Reaction) ([]int64, bool) {
	out := make([]int64, 0, len(rx.Left)+len(rx.Right))
	for _, terms := range [2][]Term{rx.Left, rx.Right} {
		for _, t := range terms {
			c, isInt := smallInt(t.Coef)
			if !isInt {
				return nil, false
			}
			out = append(out, c)
		}
	}
	return out, true
}

// intBalance reports whether a reaction whose coefficients (given, left
// side then right) and formula counts are all small integers balances in
// every element and in charge. ok is false when some formula count is not
// such an integer, and the exact rational check must decide.
func intBalance(rx *Reaction, coefs []int64) (elements, charge, ok bool) {
	var buf [16]symbolCount
	cs := buf[:0]
	var q int64
	i := 0
	for side, terms := range [2][]Term{rx.Left, rx.Right} {
		sign := int64(1 - 2*side)
		for _, t := range terms {
			c := sign * coefs[i]
			i++
			if t.Species == nil {
				return false, false, false
			}
			counts, isInt := t.Species.elementInts()
			if !isInt {
				return false, false, false
			}
			q += c * int64(t.Species.Charge)
			for _, ec := range counts {
				cs = addCount(cs, ec.key, c*ec.n)
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

// formulaInts is a formula's element counts as small integers; ok is false
// when some count is not one.
func formulaInts(f chem.Formula) (counts []symbolCount, ok bool) {
	return appendFormulaInts(make([]symbolCount, 0, len(f.Elements)), f)
}

// appendFormulaInts is formulaInts appending to dst.
func appendFormulaInts(dst []symbolCount, f chem.Formula) ([]symbolCount, bool) {
	for _, ec := range f.Elements {
		k, isInt := smallInt(ec.Count)
		if !isInt {
			return nil, false
		}
		dst = append(dst, symbolCount{ec.Symbol, k})
	}
	return dst, true
}

// elementInts returns the species' formula as small integers, as the
// compiler worked it out, or fresh when it did not.
func (sp *Species) elementInts() ([]symbolCount, bool) {
	if sp.ints.known {
		return sp.ints.counts, sp.ints.ok
	}
	return formulaInts(sp.Formula)
}

// speciesInts caches a species' formulaInts. A formula of a few elements
// (nearly all) keeps its counts in inline, inside the species, so that a
// reaction's balance reads them from the species' own cache lines.
type speciesInts struct {
	known, ok bool
	counts    []symbolCount
	inline    [3]symbolCount
}

// setFormula records f's counts, in inline when they fit.
func (si *speciesInts) setFormula(f chem.Formula) {
	dst := si.inline[:0:len(si.inline)]
	if len(f.Elements) > len(si.inline) {
		dst = make([]symbolCount, 0, len(f.Elements))
	}
	si.counts, si.ok = appendFormulaInts(dst, f)
	si.known = true
}

// copyFrom makes si a copy of src whose counts, when src keeps them
// inline, are si's own inline ones (a copy must not point into the
// species it was copied from, or a chain of copies would keep every one
// before it alive).
func (si *speciesInts) copyFrom(src *speciesInts) {
	*si = *src
	if n := len(src.counts); n > 0 && n <= len(src.inline) && &src.counts[0] == &src.inline[0] {
		si.counts = si.inline[:n:n]
	}
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

// stoichFacts are what the balance and duplicate checks need of a
// reaction's equation, worked out once when the reaction is compiled (in
// parallel) so that the checks only read them.
type stoichFacts struct {
	known bool // the facts have been worked out

	// intOK reports that every coefficient and formula count is a small
	// integer; elements and charge are then whether the reaction balances.
	intOK, elements, charge bool

	// key is the net equation (see intNetKey), reversed whether it is the
	// equation as written reversed; key is "" when everything cancels.
	key      string
	reversed bool
}

// factsOf works out a resolved reaction's stoichFacts.
func factsOf(rx *Reaction) stoichFacts {
	coefs, _ := intCoefficients(rx)
	return factsWith(rx, coefs)
}

// factsWith is factsOf with the coefficients given as small integers, left
// side then right, or nil when some coefficient is not one.
func factsWith(rx *Reaction, coefs []int64) stoichFacts {
	f := stoichFacts{known: true}
	if coefs != nil {
		f.elements, f.charge, f.intOK = intBalance(rx, coefs)
		f.key, f.reversed = intNetKey(rx, coefs)
	} else {
		f.key, f.reversed = netKeyRat(rx)
	}
	return f
}

// facts returns the reaction's stoichFacts, from the compiler when it
// worked them out, else fresh.
func (rx *Reaction) facts() stoichFacts {
	if rx.stoich.known {
		return rx.stoich
	}
	return factsOf(rx)
}

// speciesCount is a species' net coefficient.
type speciesCount = count[*Species]

// intNetKey returns a canonical encoding of the reaction's net equation
// (products positive, species written on both sides cancelled), given its
// coefficients as small integers, left side then right. The encoding is
// oriented so that its first species in declaration order counts
// positive; reversed reports that this orientation is the reaction written
// backwards. Two reactions have the same key exactly when their net
// equations are equal or one is the other reversed. The key is "" when
// the net equation is empty.
func intNetKey(rx *Reaction, coefs []int64) (string, bool) {
	var buf [12]speciesCount
	cs := buf[:0]
	i := 0
	for side, terms := range [2][]Term{rx.Left, rx.Right} {
		sign := int64(2*side - 1)
		for _, t := range terms {
			c := coefs[i]
			i++
			if t.Species == nil {
				return netKeyRat(rx)
			}
			cs = addCount(cs, t.Species, sign*c)
		}
	}
	cs = slices.DeleteFunc(cs, func(c speciesCount) bool { return c.n == 0 })
	return intKey(cs)
}

// intKey encodes nonzero integer net coefficients: a tag byte, then each
// species' declaration index and coefficient as varints, in index order.
func intKey(cs []speciesCount) (string, bool) {
	var buf [12]indexCount
	ics := buf[:0]
	for _, c := range cs {
		ics = append(ics, indexCount{key: c.key.index, n: c.n})
	}
	return indexKey(ics)
}

// indexCount is a species' net coefficient by declaration index.
type indexCount = count[int]

// indexKey is intKey of nonzero coefficients given by declaration index.
func indexKey(cs []indexCount) (string, bool) {
	if len(cs) == 0 {
		return "", false
	}
	slices.SortFunc(cs, func(a, b indexCount) int { return a.key - b.key })
	sign := int64(1)
	if cs[0].n < 0 {
		sign = -1
	}
	var buf [64]byte // room for most keys, so that only the string is allocated
	b := append(buf[:0], 'i')
	for _, c := range cs {
		b = binary.AppendUvarint(b, uint64(c.key))
		b = binary.AppendVarint(b, sign*c.n)
	}
	return string(b), sign < 0
}

// netKeyRat is intNetKey in exact rational arithmetic, for reactions with a
// coefficient that is not a small integer. A net equation whose
// coefficients all come out as small integers gets the integer key.
func netKeyRat(rx *Reaction) (string, bool) {
	type net struct {
		sp *Species
		nu *big.Rat
	}
	var nets []net
	for side, terms := range [2][]Term{rx.Left, rx.Right} {
		for _, t := range terms {
			if t.Species == nil || t.Coef == nil {
				continue
			}
			c := new(big.Rat).Set(t.Coef)
			if side == 0 {
				c.Neg(c)
			}
			i := slices.IndexFunc(nets, func(x net) bool { return x.sp == t.Species })
			if i < 0 {
				nets = append(nets, net{t.Species, c})
			} else {
				nets[i].nu.Add(nets[i].nu, c)
			}
		}
	}
	nets = slices.DeleteFunc(nets, func(x net) bool { return x.nu.Sign() == 0 })
	if len(nets) == 0 {
		return "", false
	}
	ints := make([]speciesCount, 0, len(nets))
	for _, x := range nets {
		if n, ok := smallInt(x.nu); ok {
			ints = append(ints, speciesCount{x.sp, n})
		}
	}
	if len(ints) == len(nets) {
		return intKey(ints)
	}
	slices.SortFunc(nets, func(a, b net) int { return a.sp.index - b.sp.index })
	reversed := nets[0].nu.Sign() < 0
	b := []byte{'r'}
	for _, x := range nets {
		nu := x.nu
		if reversed {
			nu = new(big.Rat).Neg(nu)
		}
		b = binary.AppendUvarint(b, uint64(x.sp.index))
		b = append(b, nu.RatString()...)
		b = append(b, ';')
	}
	return string(b), reversed
}
