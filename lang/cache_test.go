package lang

import (
	"bytes"
	"fmt"
	"reflect"
	"slices"
	"testing"
)

// checkCachedParse parses src with the cache and without, and fails unless
// both give the same tree and diagnostics.
func checkCachedParse(t *testing.T, c *Cache, src []byte) *File {
	t.Helper()
	got, gotDiags := ParseCached("f.hess", src, c)
	want, wantDiags := Parse("f.hess", src)
	if fmt.Sprint(gotDiags) != fmt.Sprint(wantDiags) {
		t.Fatalf("diagnostics differ\n got  %v\n want %v", gotDiags, wantDiags)
	}
	if len(got.Statements) != len(want.Statements) {
		t.Fatalf("%d statements, want %d", len(got.Statements), len(want.Statements))
	}
	for i := range got.Statements {
		if !sameTree(reflect.ValueOf(got.Statements[i]), reflect.ValueOf(want.Statements[i])) {
			t.Fatalf("statement %d at %v differs from a fresh parse", i, want.Statements[i].Position())
		}
	}
	return got
}

// sameTree reports whether two syntax trees hold the same nodes with the
// same tokens at the same places: every node's tokens are equal and
// resolve to the same spans, though a statement taken from the cache
// resolves them through the Source of the parse that read it.
func sameTree(a, b reflect.Value) bool {
	switch a.Kind() {
	case reflect.Pointer:
		if a.IsNil() || b.IsNil() {
			return a.IsNil() == b.IsNil()
		}
		return sameTree(a.Elem(), b.Elem())
	case reflect.Slice:
		if a.Len() != b.Len() {
			return false
		}
		for i := range a.Len() {
			if !sameTree(a.Index(i), b.Index(i)) {
				return false
			}
		}
		return true
	case reflect.Struct:
		if a.Type() == nodeType {
			na, nb := a.Interface().(Node), b.Interface().(Node)
			if !slices.Equal(na.Tokens(), nb.Tokens()) || na.Span() != nb.Span() {
				return false
			}
			for i := range na.Tokens() {
				if na.TokenSpan(i) != nb.TokenSpan(i) {
					return false
				}
			}
			return true
		}
		for i := range a.NumField() {
			if !a.Type().Field(i).IsExported() {
				continue // a statement's lineage: a fresh parse's is new
			}
			if !sameTree(a.Field(i), b.Field(i)) {
				return false
			}
		}
		return true
	}
	return reflect.DeepEqual(a.Interface(), b.Interface())
}

func TestCacheReparsesOnlyChangedStatements(t *testing.T) {
	src, n := generateNetwork(32 << 10)
	c := NewCache()
	checkCachedParse(t, c, src)
	if hits, parsed := c.Reused(); hits != 0 || parsed != n {
		t.Fatalf("first parse: %d reused, %d parsed; want 0 and %d", hits, parsed, n)
	}
	edits := []struct {
		name     string
		old, new string
		parsed   int
	}{
		{"same length", "CO2(g) + 4 H2(g)\n", "CO2(g) + 5 H2(g)\n", 1},
		{"longer line", "reaction r10:", "reaction r10000:", 1},
		{"new line", "species T9(g) {\n", "species T9(g) {\n  # a comment line\n", 1},
		{"broken statement", "reaction r11:", "reaction r11", 1},
		{"repaired", "reaction r11", "reaction r11:", 1},
	}
	for _, e := range edits {
		t.Run(e.name, func(t *testing.T) {
			if !bytes.Contains(src, []byte(e.old)) {
				t.Fatalf("%q not in the source", e.old)
			}
			src = bytes.Replace(src, []byte(e.old), []byte(e.new), 1)
			checkCachedParse(t, c, src)
			if _, parsed := c.Reused(); parsed != e.parsed {
				t.Errorf("%d statements parsed again, want %d", parsed, e.parsed)
			}
		})
	}
}

func TestCacheSharesUnmovedStatements(t *testing.T) {
	src := []byte("species A(g) { hf 1 kJ/mol }\nspecies B(g) { hf 2 kJ/mol }\n")
	c := NewCache()
	first := checkCachedParse(t, c, src)
	second := checkCachedParse(t, c, append([]byte("species C(g)\n"), src...))
	if first.Statements[0] == second.Statements[1] {
		t.Error("a moved statement is shared with the earlier parse")
	}
	third := checkCachedParse(t, c, append([]byte("species D(g)\n"), src...))
	if second.Statements[1] != third.Statements[1] {
		t.Error("a statement at the same place was parsed again")
	}
}
