package lang

import (
	"errors"
	"strings"
	"testing"

	"github.com/alecthomas/participle/v2"
)

// firstTokens are the literals and token kinds that can begin x, following
// references to the productions read by hand.
func firstTokens(t *testing.T, x expr, lits map[string]bool, types map[TokenType]bool) {
	t.Helper()
	for _, y := range first(x) {
		switch y := y.(type) {
		case lit:
			lits[string(y)] = true
		case tokenClass:
			types[TokenType(y)] = true
		case ref:
			p, ok := handProductions[string(y)]
			if !ok {
				t.Fatalf("%s is not read by hand", y)
			}
			firstTokens(t, p.body, lits, types)
		}
	}
}

// TestReadersStartAsTheGrammarSays feeds each hand-written reader one
// token of every kind and every keyword and punctuation, and requires that
// it takes the token exactly when the token can begin its production.
func TestReadersStartAsTheGrammarSays(t *testing.T) {
	readers := map[string]func(tokenStream) error{
		"Num":              func(l tokenStream) error { return new(Num).read(l) },
		"Unit":             func(l tokenStream) error { return new(Unit).read(l) },
		"Ident":            func(l tokenStream) error { return new(Ident).read(l) },
		"Str":              func(l tokenStream) error { return new(Str).read(l) },
		"SpeciesRef":       func(l tokenStream) error { return new(SpeciesRef).read(l) },
		"Arrow":            func(l tokenStream) error { return new(Arrow).read(l) },
		"Quantity":         func(l tokenStream) error { return new(Quantity).read(l) },
		"Term":             func(l tokenStream) error { return new(Term).read(l) },
		"Polynomial":       func(l tokenStream) error { return new(Polynomial).read(l) },
		"SpeciesProperty":  func(l tokenStream) error { return new(SpeciesProperty).read(l) },
		"ReactionProperty": func(l tokenStream) error { return new(ReactionProperty).read(l) },
	}
	samples := []Token{
		{Type: Word, Value: "x"}, {Type: Ref, Value: "A(g)"}, {Type: Number, Value: "1"},
		{Type: String, Value: `"s"`}, {Type: endOfStatement}, {Type: EOF},
	}
	for _, k := range Keywords() {
		samples = append(samples, Token{Type: Keyword, Value: k})
	}
	for _, p := range []string{"{", "}", ":", ",", "=", "±", "+-", "+", "-", "<->", "->", "⇌", "→"} {
		samples = append(samples, Token{Type: Punct, Value: p})
	}
	for name, read := range readers {
		lits, types := map[string]bool{}, map[TokenType]bool{}
		firstTokens(t, handProductions[name].body, lits, types)
		for _, tok := range samples {
			cur := &tokenCursor{toks: []Token{tok, {Type: endOfStatement}}}
			took := read(cur) != participle.NextMatch
			want := types[tok.Type] || (lits[tok.Value] && !isEnd(tok))
			if took != want {
				t.Errorf("%s on %s: took it %v, the grammar says %v", name, describe(tok), took, want)
			}
		}
	}
}

// TestGrammarNamesEveryProduction requires that every production the
// grammar prints is defined once, and that every reference has a
// definition.
func TestGrammarNamesEveryProduction(t *testing.T) {
	defined := map[string]bool{}
	for _, line := range strings.Split(Grammar(), "\n") {
		name, _, ok := strings.Cut(line, " = ")
		if !ok {
			t.Fatalf("not a production: %q", line)
		}
		if defined[name] {
			t.Errorf("%s is defined twice", name)
		}
		defined[name] = true
	}
	var refs func(x expr)
	refs = func(x expr) {
		switch x := x.(type) {
		case ref:
			if !defined[string(x)] {
				t.Errorf("%s is referred to but not defined", x)
			}
		case seq:
			for _, y := range x {
				refs(y)
			}
		case alt:
			for _, y := range x {
				refs(y)
			}
		case group:
			refs(x.x)
		case opt:
			refs(x.x)
		case many:
			refs(x.x)
		}
	}
	for _, p := range handProductions {
		refs(p.body)
	}
}

// TestSyntaxErrorPassesThroughParticiple checks that an error a reader
// reports inside a statement participle reads reaches the diagnostic as
// the reader worded it.
func TestSyntaxErrorPassesThroughParticiple(t *testing.T) {
	_, diags := Parse("f.hess", []byte("mixture m { CH4(g) 1 ± mol }"))
	if len(diags) != 1 {
		t.Fatalf("got %d diagnostics, want 1: %v", len(diags), diags)
	}
	if want := `expected a number, found "mol"`; diags[0].Message != want {
		t.Errorf("message %q, want %q", diags[0].Message, want)
	}
	var se *syntaxError
	if !errors.As(toSyntaxErrorOf(t, "mixture m { CH4(g) 1 ± mol }"), &se) || len(se.expected) != 1 {
		t.Errorf("the reader's error did not come through participle as a syntaxError")
	}
}

// toSyntaxErrorOf parses src, one statement, and returns its error.
func toSyntaxErrorOf(t *testing.T, src string) error {
	t.Helper()
	toks, _, _ := Lex("f.hess", []byte(src))
	cur := newCursor(&tokenGroup{src: NewSource("f.hess", src), toks: toks}, 0, len(toks), nil)
	err := statementParsers[toks[0].Value](cur, &Statement{})
	if err == nil {
		t.Fatalf("%q parses", src)
	}
	return err
}
