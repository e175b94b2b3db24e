package lang

import (
	"os"
	"path/filepath"
	"reflect"
	"slices"
	"testing"
)

// TestNodeTokensMatchSpans checks every node of parsed files, those read
// by hand and those participle reads alike: its tokens are a run of its
// statement's, its span runs from the first one's start to the last one's
// end, and its position and participle's Pos agree with its span.
func TestNodeTokensMatchSpans(t *testing.T) {
	inputs, _ := filepath.Glob(filepath.Join("testdata", "format", "*.hess"))
	srcs := map[string][]byte{}
	for _, in := range inputs {
		b, err := os.ReadFile(in)
		if err != nil {
			t.Fatal(err)
		}
		srcs[in] = b
	}
	srcs["settings and mixtures"] = []byte("\ufeffsettings {\n  pressure 1 bar\n  temperatures 300 K to 500 K by 100 K, 900 K\n  lint unused-species off\n}\n" +
		"element Xq { mass 12 g/mol }\nphase aq { convention molality }\ninclude \"ΔX.hess\"\n" +
		"mixture µ { temperature 298.15 K\n  CO2(g) 1 mol fixed\n  H2O(l) }\n" +
		"reaction r: A(g) -> B(g) = a - 2 b + c { dg -1 kJ/mol }\n")
	big, _ := generateNetwork(64 << 10)
	srcs["generated"] = big
	for name, src := range srcs {
		f, _ := Parse(name, src)
		nodes := 0
		var walk func(v reflect.Value, st *Statement)
		walk = func(v reflect.Value, st *Statement) {
			switch v.Kind() {
			case reflect.Pointer:
				if !v.IsNil() {
					walk(v.Elem(), st)
				}
			case reflect.Slice:
				if v.Type().Elem().Kind() == reflect.Pointer {
					for i := range v.Len() {
						walk(v.Index(i), st)
					}
				}
			case reflect.Struct:
				if v.Type() == parsedNodeType {
					pn := v.Addr().Interface().(*ParsedNode)
					if len(pn.Tokens()) > 0 && pn.Pos.Offset != pn.Span().Start.Offset {
						t.Errorf("%s: participle's Pos %v is not the node's start %v", name, pn.Pos, pn.Span().Start)
					}
				}
				if v.Type() == nodeType {
					nodes++
					n := v.Addr().Interface().(*Node)
					checkNode(t, name, src, st, n)
					return
				}
				for i := range v.NumField() {
					if v.Type().Field(i).IsExported() {
						walk(v.Field(i), st)
					}
				}
			}
		}
		for _, st := range f.Statements {
			walk(reflect.ValueOf(st), st)
		}
		if nodes == 0 && len(f.Statements) > 0 {
			t.Errorf("%s: no nodes", name)
		}
	}
}

func checkNode(t *testing.T, name string, src []byte, st *Statement, n *Node) {
	t.Helper()
	toks, all := n.Tokens(), st.Tokens()
	if len(toks) == 0 {
		return
	}
	i := searchOffset(all, int(toks[0].Offset))
	if i+len(toks) > len(all) || !slices.Equal(all[i:i+len(toks)], toks) {
		t.Fatalf("%s: node tokens %v are not a run of its statement's", name, toks)
	}
	s := n.Span()
	if s.File != name || s.Start.Offset != int(toks[0].Offset) || s.End.Offset != toks[len(toks)-1].End() {
		t.Fatalf("%s: node span %+v does not run from its first token to its last (%v)", name, s, toks)
	}
	if len(src) < 8<<10 { // counting from the start is quadratic
		line, col := posAt(src, s.Start.Offset)
		if s.Start.Line != line || s.Start.Column != col {
			t.Fatalf("%s: node starts at %d:%d, want %d:%d", name, s.Start.Line, s.Start.Column, line, col)
		}
	}
	if p := n.Position(); p.Offset != s.Start.Offset || p.Line != s.Start.Line || p.Column != s.Start.Column || p.Filename != name {
		t.Fatalf("%s: position %v is not the span's start %+v", name, p, s.Start)
	}
	for j := range toks {
		if ts := n.TokenSpan(j); string(src[ts.Start.Offset:ts.End.Offset]) != toks[j].Value {
			t.Fatalf("%s: token span %+v is not the token %q", name, ts, toks[j].Value)
		}
	}
}
