package network

import (
	"sync"
	"unicode/utf8"

	"hess/suggest"
)

// nearNames finds the declared species a misspelt reference most likely
// meant. Comparing a reference with every species would cost the number of
// species for each undefined reference; instead the index keeps, for each
// species' key and bare name, the spellings one deletion away (after
// folding case and the look-alikes 0/O, 1/l), so that a lookup tries only
// the few species within two edits. It is built once per compile, on the
// first undefined reference, and read by every worker.
type nearNames struct {
	once     sync.Once
	keys     []string         // species keys, in declaration order
	variants map[string][]int // folded spelling or one deletion of it → keys
}

// maxIndexedName bounds the names indexed (and looked up): longer ones
// get no suggestion, which keeps the index proportional to the input.
const maxIndexedName = 48

func (n *nearNames) build(species []*Species) {
	n.variants = map[string][]int{}
	for _, sp := range species {
		i := len(n.keys)
		n.keys = append(n.keys, sp.Key)
		n.add(sp.Key, i)
		if sp.Parts.Base != "" && sp.Parts.Base != sp.Key {
			n.add(sp.Parts.Base, i)
		}
	}
}

func (n *nearNames) add(name string, i int) {
	for _, v := range deletions(name) {
		list := n.variants[v]
		if len(list) > 0 && list[len(list)-1] == i {
			continue
		}
		n.variants[v] = append(list, i)
	}
}

// deletions is the folded name and every spelling with one code point of
// it removed; nil for a name longer than maxIndexedName.
func deletions(name string) []string {
	rs := []rune(name)
	if len(rs) == 0 || len(rs) > maxIndexedName {
		return nil
	}
	f := suggest.Fold(rs)
	out := make([]string, 0, len(f)+1)
	out = append(out, string(f))
	for i := range f {
		out = append(out, string(f[:i])+string(f[i+1:]))
	}
	return out
}

// closest is the declared species key nearest to the reference as
// written, or whose bare name is nearest to the reference's bare name (CaC03
// for CaCO3(cr)), or "" when none is near enough to be a likely slip.
func (n *nearNames) closest(species []*Species, ref, base string) string {
	n.once.Do(func() { n.build(species) })
	seen := map[int]bool{}
	var cands []string
	var bare []string
	for _, name := range []string{ref, base} {
		for _, v := range deletions(name) {
			for _, i := range n.variants[v] {
				if !seen[i] {
					seen[i] = true
					cands = append(cands, n.keys[i])
					bare = append(bare, species[i].Parts.Base)
				}
			}
		}
	}
	for _, try := range []struct {
		name  string
		among []string
	}{{ref, cands}, {base, bare}} {
		c, ok := suggest.Closest(try.name, try.among)
		if !ok || !plausibleSpeciesSlip(try.name, c) {
			continue
		}
		for i, x := range try.among {
			if x == c {
				return cands[i]
			}
		}
	}
	return ""
}

// plausibleSpeciesSlip tells whether want is a likely meaning of got. In a
// formula one character more or less is usually another species (CO2 and
// O2, CaO and CaO2), so a short formula is only suggested for slips of case
// and of the look-alikes 0/O and 1/l (C02 for CO2, NaCL for NaCl); names of
// eight characters or more, such as names given with a formula property,
// take the usual allowance.
func plausibleSpeciesSlip(got, want string) bool {
	if string(suggest.Fold([]rune(got))) == string(suggest.Fold([]rune(want))) {
		return true
	}
	return utf8.RuneCountInString(got) >= 8
}
