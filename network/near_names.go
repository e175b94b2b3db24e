package network

import (
	"sort"
	"strings"
	"sync"
	"unicode/utf8"

	"hess/suggest"
)

// nearNames finds the declared name (of a species or a reaction) a
// misspelt reference most likely meant. Comparing a reference with every
// name would cost the number of names for each undefined reference;
// instead the index keeps, for each name (and each species' bare name),
// the spellings one deletion away (after folding case and the look-alikes
// 0/O, 1/l), so that a lookup tries only the few names within two edits. It
// is built once per compile, on the first undefined reference, and read by
// every worker.
type nearNames struct {
	once     sync.Once
	keys     []string         // names, in declaration order
	bases    []string         // species' bare names beside keys (or the keys)
	variants map[string][]int // folded spelling or one deletion of it → keys
}

// nearIndexes are the indexes of one compile, shared by its workers.
type nearIndexes struct {
	species   nearNames
	reactions nearNames
}

// maxNearCandidates bounds the names one lookup compares, so that a file
// of many similar names and many undeclared references stays cheap; the
// candidates are taken in a fixed order, so the suggestion does not depend
// on scheduling.
const maxNearCandidates = 256

// maxIndexedName bounds the names indexed (and looked up): longer ones
// get no suggestion, which keeps the index proportional to the input.
const maxIndexedName = 48

// build indexes keys, and beside each its bare name (bases may be nil).
func (n *nearNames) build(keys, bases []string) {
	n.variants = map[string][]int{}
	n.keys, n.bases = keys, bases
	if n.bases == nil {
		n.bases = keys
	}
	for i, k := range keys {
		n.add(k, i)
		if b := n.bases[i]; b != "" && b != k {
			n.add(b, i)
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

// closestSpecies is the declared species key nearest to the reference as
// written, or whose bare name is nearest to the reference's bare name
// (CaC03 for CaCO3(cr)), or "" when none is near enough to be a likely
// slip.
func (n *nearNames) closestSpecies(species []*Species, ref, base string) string {
	n.once.Do(func() {
		keys := make([]string, len(species))
		bases := make([]string, len(species))
		for i, sp := range species {
			keys[i], bases[i] = sp.Key, sp.Parts.Base
		}
		n.build(keys, bases)
	})
	return n.closest(ref, base, plausibleSpeciesSlip)
}

// closestReaction is the reaction name nearest to name, or "".
func (n *nearNames) closestReaction(reactions []*Reaction, name string) string {
	n.once.Do(func() {
		keys := make([]string, len(reactions))
		for i, rx := range reactions {
			keys[i] = rx.Name
		}
		n.build(keys, nil)
	})
	return n.closest(name, name, func(string, string) bool { return true })
}

// closest looks ref up among the keys and base among the bare names,
// keeping only suggestions that plausible accepts.
func (n *nearNames) closest(ref, base string, plausible func(got, want string) bool) string {
	seen := map[int]bool{}
	var cands []string
	var bare []string
	for _, name := range []string{ref, base} {
		for _, v := range deletions(name) {
			for _, i := range n.variants[v] {
				if len(cands) == maxNearCandidates {
					break
				}
				if !seen[i] {
					seen[i] = true
					cands = append(cands, n.keys[i])
					bare = append(bare, n.bases[i])
				}
			}
		}
	}
	for _, try := range []struct {
		name  string
		among []string
	}{{ref, cands}, {base, bare}} {
		c, ok := suggest.Closest(try.name, try.among)
		if !ok || !plausible(try.name, c) {
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

// phaseWords are state tags written out in words, and the tag meant.
var phaseWords = map[string]string{
	"gas": "g", "vapour": "g", "vapor": "g", "liquid": "l", "liq": "l",
	"solid": "s", "sol": "s", "c": "cr", "cryst": "cr", "crystal": "cr", "crystalline": "cr",
	"aqueous": "aq", "aqu": "aq", "a": "aq",
}

// phaseHint is "; did you mean (x)?" for a state tag that names a built-in
// tag in words or is a near miss of a declared phase's tag, else "".
func (c *compiler) phaseHint(tag string) string {
	if t, ok := phaseWords[strings.ToLower(tag)]; ok {
		return "; did you mean (" + t + ")?"
	}
	if len([]rune(tag)) < 2 {
		return "" // one letter is a near miss of every built-in tag
	}
	tags := make([]string, 0, len(c.net.Phases))
	for t := range c.net.Phases {
		tags = append(tags, t)
	}
	sort.Strings(tags)
	if t, ok := suggest.Closest(tag, tags); ok {
		return "; did you mean (" + t + ")?"
	}
	return ""
}
