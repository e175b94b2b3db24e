package network

import "slices"

// termFact is what a reaction's compile reads of each of its species, kept
// in one array by declaration index (termFacts) rather than in the
// species themselves: a reaction's species lie anywhere among tens of
// thousands of species of nearly 500 bytes each, so reading each from its
// species costs a cache and a TLB miss once the species outgrow the
// caches, while the facts take 12 bytes a species and 8 an element of its
// formula (about a megabyte for 40 000 species), and a reaction's compile
// then reads nothing of its species but these.
type termFact struct {
	charge     int32
	hasFormula bool
	// compact reports that the formula's counts are small integers, held
	// in termFacts.counts[at:at+n]; otherwise the compile reads the
	// species (stoichFacts by factsWith).
	compact bool
	n       uint16
	at      uint32
}

// elementFact is one element's count in a formula, the element numbered
// by termFacts.
type elementFact struct {
	elem  uint16
	count int32 // |count| ≤ smallIntLimit
}

// termFacts holds a termFact per declared species, by declaration index,
// and their formulas' counts one after another in declaration order.
type termFacts struct {
	facts  []termFact
	counts []elementFact
}

// maxFactElements bounds the element numbers an elementFact holds;
// maxFactCounts the counts termFacts holds in all.
const (
	maxFactElements = 1 << 16
	maxFactCounts   = 1 << 31
)

// newTermFacts reads the facts of every species of the network, once their
// formulas are read.
func newTermFacts(species []*Species) *termFacts {
	tf := &termFacts{facts: make([]termFact, len(species)), counts: make([]elementFact, 0, 3*len(species))}
	elements := map[string]uint16{}
	for i, sp := range species {
		f := &tf.facts[i]
		f.hasFormula = sp.HasFormula
		counts, ok := sp.elementInts()
		if !ok || int(int32(sp.Charge)) != sp.Charge || len(counts) > maxFactElements || len(tf.counts)+len(counts) > maxFactCounts {
			continue
		}
		f.charge, f.at, f.n, f.compact = int32(sp.Charge), uint32(len(tf.counts)), uint16(len(counts)), true
		for _, ec := range counts {
			e, seen := elements[ec.key]
			if !seen {
				if len(elements) >= maxFactElements {
					f.compact = false
					break
				}
				e = uint16(len(elements))
				elements[ec.key] = e
			}
			tf.counts = append(tf.counts, elementFact{e, int32(ec.n)})
		}
		if !f.compact {
			tf.counts = tf.counts[:f.at]
		}
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
		for _, ec := range tf.counts[f.at : f.at+uint32(f.n)] {
			es = addCount(es, ec.elem, c*int64(ec.count))
		}
		ss = addCount(ss, int(at), -c)
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

// elementCount is an element's count by element number.
type elementCount = count[uint16]
