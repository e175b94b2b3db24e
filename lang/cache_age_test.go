package lang

import (
	"fmt"
	"strings"
	"testing"
	"unsafe"
)

// TestCacheKeepsFewTexts edits a different statement before each parse
// through one cache, so that without a bound every parse's text would stay
// alive through the statements shared from it. It checks that the
// statements resolve through at most maxSourceAge+1 texts, that every
// token's value is a slice of its own statement's text (a moved statement
// keeps nothing of the old one), and that the tree equals a fresh parse.
func TestCacheKeepsFewTexts(t *testing.T) {
	const n = 60
	stmts := make([]string, n)
	for i := range stmts {
		stmts[i] = fmt.Sprintf("reaction r%d: A%d(g) <-> B%d(g) {\n  dg %d kJ/mol\n}\n", i, i, i, 10+i)
	}
	c := NewCache()
	for round := range 40 {
		k := (round * 7) % n
		stmts[k] = strings.Replace(stmts[k], "dg ", "dg 1", 1)
		text := strings.Join(stmts, "")
		f, diags := ParseCached("net.hess", []byte(text), c)
		if len(diags) > 0 {
			t.Fatalf("round %d: %v", round, diags)
		}
		sources := map[*Source]bool{}
		for _, st := range f.Statements {
			src := st.Source()
			sources[src] = true
			base := uintptr(unsafe.Pointer(unsafe.StringData(src.Text())))
			for _, tok := range st.Tokens() {
				if tok.Value == "" {
					continue
				}
				p := uintptr(unsafe.Pointer(unsafe.StringData(tok.Value)))
				if p < base || p-base+uintptr(len(tok.Value)) > uintptr(len(src.Text())) {
					t.Fatalf("round %d: token %q of a statement is not a slice of that statement's text", round, tok.Value)
				}
			}
		}
		if len(sources) > maxSourceAge+1 {
			t.Fatalf("round %d: the statements keep %d texts alive, more than %d", round, len(sources), maxSourceAge+1)
		}
		fresh, _ := Parse("net.hess", []byte(text))
		if got, want := treeText(f), treeText(fresh); got != want {
			t.Fatalf("round %d: the cached parse differs from a fresh one:\n%s\nfresh:\n%s", round, got, want)
		}
	}
}

// treeText writes every statement's span and tokens, for comparing trees.
func treeText(f *File) string {
	var b strings.Builder
	for _, st := range f.Statements {
		fmt.Fprintf(&b, "%v:", st.Span())
		for i, tok := range st.Tokens() {
			fmt.Fprintf(&b, " %q@%v", tok.Value, st.TokenSpan(i))
		}
		b.WriteString("\n")
	}
	return b.String()
}
