package chem

import (
	"fmt"
	"math/big"
	"strings"
	"testing"
)

// referenceCounts evaluates a formula by plain recursive descent over
// big.Rat, as an independent statement of the grammar in LANGUAGE.md:
//
//	Formula = Part { ( "*" | "·" ) [ Count ] Part } .
//	Part    = Item { Item } .
//	Item    = Symbol [ Count ] | "(" Part ")" [ Count ] | "[" Part "]" [ Count ] .
//	Count   = digits [ "." digits ] .   (not zero)
//
// It reports false for any input ParseFormula must reject.
func referenceCounts(s string, t *ElementTable) (map[string]*big.Rat, bool) {
	if t == nil {
		t = BuiltinElements()
	}
	r := refParser{s: s, t: t}
	total := map[string]*big.Rat{}
	mult := big.NewRat(1, 1)
	for {
		part, ok := r.part(0)
		if !ok {
			return nil, false
		}
		for sym, c := range part {
			addRat(total, sym, new(big.Rat).Mul(c, mult))
		}
		if r.pos == len(s) {
			return total, true
		}
		switch {
		case s[r.pos] == '*':
			r.pos++
		case strings.HasPrefix(s[r.pos:], "·"):
			r.pos += len("·")
		default:
			return nil, false
		}
		mult = big.NewRat(1, 1)
		if c, has, ok := r.count(); !ok {
			return nil, false
		} else if has {
			mult = c
		}
	}
}

type refParser struct {
	s   string
	t   *ElementTable
	pos int
}

func addRat(m map[string]*big.Rat, sym string, c *big.Rat) {
	if old, ok := m[sym]; ok {
		old.Add(old, c)
		return
	}
	m[sym] = c
}

// part reads one or more items; depth counts the enclosing groups.
func (r *refParser) part(depth int) (map[string]*big.Rat, bool) {
	out := map[string]*big.Rat{}
	items := 0
	for r.pos < len(r.s) {
		c := r.s[r.pos]
		var item map[string]*big.Rat
		switch {
		case 'A' <= c && c <= 'Z':
			start := r.pos
			r.pos++
			for r.pos < len(r.s) && 'a' <= r.s[r.pos] && r.s[r.pos] <= 'z' {
				r.pos++
			}
			if _, ok := r.t.Lookup(r.s[start:r.pos]); !ok {
				return nil, false
			}
			item = map[string]*big.Rat{r.s[start:r.pos]: big.NewRat(1, 1)}
		case c == '(' || c == '[':
			if depth == maxGroupDepth {
				return nil, false
			}
			r.pos++
			inner, ok := r.part(depth + 1)
			want := byte(')')
			if c == '[' {
				want = ']'
			}
			if !ok || r.pos >= len(r.s) || r.s[r.pos] != want {
				return nil, false
			}
			r.pos++
			item = inner
		default:
			if items == 0 {
				return nil, false
			}
			return out, true
		}
		n, has, ok := r.count()
		if !ok {
			return nil, false
		}
		for sym, v := range item {
			if has {
				v = new(big.Rat).Mul(v, n)
			}
			addRat(out, sym, v)
		}
		items++
	}
	return out, items > 0
}

func (r *refParser) count() (*big.Rat, bool, bool) {
	start := r.pos
	for r.pos < len(r.s) && '0' <= r.s[r.pos] && r.s[r.pos] <= '9' {
		r.pos++
	}
	if r.pos == start {
		if r.pos < len(r.s) && r.s[r.pos] == '.' {
			return nil, false, false
		}
		return nil, false, true
	}
	if r.pos < len(r.s) && r.s[r.pos] == '.' {
		r.pos++
		frac := r.pos
		for r.pos < len(r.s) && '0' <= r.s[r.pos] && r.s[r.pos] <= '9' {
			r.pos++
		}
		if r.pos == frac {
			return nil, false, false
		}
	}
	v, ok := new(big.Rat).SetString(r.s[start:r.pos])
	if !ok || v.Sign() == 0 {
		return nil, false, false
	}
	return v, true, true
}

// sameCounts describes how f's counts differ from want ("" when equal).
func sameCounts(f Formula, want map[string]*big.Rat) string {
	if len(f.Elements) != len(want) {
		return fmt.Sprintf("%d elements %s, want %d", len(f.Elements), f, len(want))
	}
	for sym, c := range want {
		if got := f.Count(sym); got.Cmp(c) != 0 {
			return fmt.Sprintf("count of %s = %s, want %s", sym, got.RatString(), c.RatString())
		}
	}
	return ""
}

// hillOrdered reports whether f's elements are unique, positive and in Hill
// order.
func hillOrdered(f Formula) bool {
	hasCarbon := f.Count("C").Sign() != 0
	key := func(sym string) string {
		switch {
		case hasCarbon && sym == "C":
			return "\x00"
		case hasCarbon && sym == "H":
			return "\x01"
		}
		return sym
	}
	for i, e := range f.Elements {
		if e.Count == nil || e.Count.Sign() <= 0 {
			return false
		}
		if i > 0 && key(f.Elements[i-1].Symbol) >= key(e.Symbol) {
			return false
		}
	}
	return true
}

func FuzzParseFormula(f *testing.F) {
	// Seeds are in testdata/fuzz/FuzzParseFormula.
	table := BuiltinElements().With("D", 2.01410).With("Lig", 123.5)
	f.Fuzz(func(t *testing.T, s string) {
		got, err := ParseFormula(s, table)
		want, ok := referenceCounts(s, table)
		if err != nil {
			if err.Code != "unknown-element" && err.Code != "bad-formula" {
				t.Errorf("%q: code %q", s, err.Code)
			}
			if err.Offset < 0 || err.End < err.Offset || err.End > len(s) {
				t.Errorf("%q: error range [%d,%d) outside the input", s, err.Offset, err.End)
			}
			if err.Message == "" || strings.HasSuffix(err.Message, ".") {
				t.Errorf("%q: message %q", s, err.Message)
			}
			if ok {
				t.Errorf("%q: error %v, but the reference grammar accepts it", s, err)
			}
			return
		}
		if !ok {
			t.Fatalf("%q parsed to %s, but the reference grammar rejects it", s, got)
		}
		if msg := sameCounts(got, want); msg != "" {
			t.Fatalf("%q: %s", s, msg)
		}
		if !hillOrdered(got) {
			t.Errorf("%q: elements %v not in Hill order", s, got.Elements)
		}
		hill := got.String()
		again, err := ParseFormula(hill, table)
		if err != nil {
			t.Fatalf("%q: String() %q does not parse: %v", s, hill, err)
		}
		if msg := sameCounts(again, want); msg != "" {
			t.Fatalf("%q: String() %q re-parses differently: %s", s, hill, msg)
		}
		if again.String() != hill {
			t.Errorf("%q: String() %q re-parses to %q", s, hill, again.String())
		}
		got.MolarMass(table)
	})
}
