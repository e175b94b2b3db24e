package network

import "slices"

// termFact is what a reaction's compile reads of each of its species, kept
// in one array by declaration index (termFacts) rather than in the
// species themselves: a reaction's species lie anywhere among tens of
// thousands of species of nearly 500 bytes each, so reading each from its
// species costs a cache and a TLB miss once the species outgrow the
// caches, while the array is 24 bytes a species (a megabyte for 40 000),
// and a reaction's compile then reads nothing of its species but this.
type termFact struct {
	charge     int32
	hasFormula bool
	// compact reports that the formula's counts are small integers of at
	// most len(elem) elements, held here; otherwise the compile reads the
	// species (stoichFacts by factsWith).
	compact bool
	n       uint8 // elements held
	elem    [3]uint16
	count   [3]int32
}

// termFacts holds a termFact per declared species, by declaration index,
// with the element numbering its elem fields use.
type termFacts struct {
	facts []termFact
}

// maxFactElements bounds the element numbers a termFact holds.
const maxFactElements = 1 << 16

// newTermFacts reads the facts of every species of the network, once their
// formulas are read.
func newTermFacts(species []*Species) *termFacts {
	tf := &termFacts{facts: make([]termFact, len(species))}
	elements := map[string]uint16{}
	for i, sp := range species {
		f := &tf.facts[i]
		f.hasFormula = sp.HasFormula
		if int(int32(sp.Charge)) != sp.Charge {
			continue
		}
		f.charge = int32(sp.Charge)
		counts, ok := sp.elementInts()
		if !ok || len(counts) > len(f.elem) {
			continue
		}
		f.compact = true
		for j, ec := range counts {
			e, seen := elements[ec.key]
			if !seen {
				if len(elements) >= maxFactElements {
					f.compact = false
					break
				}
				e = uint16(len(elements))
				elements[ec.key] = e
			}
			f.elem[j], f.count[j] = e, int32(ec.n) // |ec.n| ≤ smallIntLimit
		}
		f.n = uint8(len(counts))
	}
	return tf
}

// stoich works out a resolved reaction's stoichFacts from the facts of
// its species, given by declaration index (left side then right) with its
// coefficients as small integers (nil when some is not one). It gives
// what factsWith gives, which it falls back on where a species' facts are
// not compact.
func (tf *termFacts) stoich(rx *Reaction, coefs []int64, idx []int32) stoichFacts {
	if tf == nil || coefs == nil || len(idx) != len(coefs) {
		return factsWith(rx, coefs)
	}
	var ebuf [16]elementCount
	es := ebuf[:0]
	var sbuf [12]indexCount
	ss := sbuf[:0]
	var q int64
	for i, at := range idx {
		if at < 0 || int(at) >= len(tf.facts) {
			return factsWith(rx, coefs)
		}
		f := &tf.facts[at]
		if !f.compact {
			return factsWith(rx, coefs)
		}
		c := coefs[i]
		if i >= len(rx.Left) {
			c = -c
		}
		// c is the coefficient as the balance counts it (reactants
		// positive); the key counts products positive.
		q += c * int64(f.charge)
		for j := range int(f.n) {
			es = addElementCount(es, f.elem[j], c*int64(f.count[j]))
		}
		ss = addIndexCount(ss, int(at), -c)
	}
	st := stoichFacts{known: true, intOK: true, elements: true, charge: q == 0}
	for _, e := range es {
		if e.n != 0 {
			st.elements = false
		}
	}
	ss = slices.DeleteFunc(ss, func(c indexCount) bool { return c.n == 0 })
	st.key, st.reversed = indexKey(ss)
	return st
}

type elementCount struct {
	elem uint16
	n    int64
}

func addElementCount(es []elementCount, e uint16, n int64) []elementCount {
	for i := range es {
		if es[i].elem == e {
			es[i].n += n
			return es
		}
	}
	return append(es, elementCount{e, n})
}

func addIndexCount(cs []indexCount, at int, n int64) []indexCount {
	for i := range cs {
		if cs[i].index == at {
			cs[i].n += n
			return cs
		}
	}
	return append(cs, indexCount{at, n})
}
