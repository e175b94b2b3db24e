package lang

import (
	"github.com/alecthomas/participle/v2"
	"github.com/alecthomas/participle/v2/lexer"
)

// The leaf nodes of the grammar, and the small nodes built only of leaves,
// are read by hand, with lookahead one, which saves most of the parser's
// work on a large network. Each reads what its production (the *Rule
// values below) says, takes the literals it matches from it, and names
// what the production expected when it fails. The leaves that statements
// read by participle contain also meet participle.Parseable.

var (
	numRule        = rule("Num", "a number", tokenClass(Number))
	unitRule       = rule("Unit", "a unit", tokenClass(Word))
	identRule      = rule("Ident", "a name", group{alt{tokenClass(Word), tokenClass(Keyword)}})
	strRule        = rule("Str", "a string", tokenClass(String))
	speciesRefRule = rule("SpeciesRef", "a species", group{alt{tokenClass(Ref), tokenClass(Word), tokenClass(Keyword)}})
	arrowRule      = rule("Arrow", "an arrow (<-> or ->)", oneOf("<->", "⇌", "->", "→"))
	termRule       = rule("Term", "a species", seq{opt{ref("Num")}, ref("SpeciesRef")})
	quantityRule   = rule("Quantity", "a number", seq{ref("Num"), opt{sigmaPart}, opt{ref("Unit")}})

	// sigmaPart is a standard uncertainty after a value.
	sigmaPart = seq{plusMinus, ref("Num")}
	plusMinus = oneOf("±", "+-")
)

// take consumes the next token and returns its value with its Node.
func take(lex tokenStream) (string, Node) {
	start := lex.RawCursor()
	t := lex.Next().Value
	return t, lex.node(start, start+1)
}

// Parse reads a number token.
func (n *Num) Parse(lex *lexer.PeekingLexer) error { return n.read(&peekStream{lex: lex}) }

func (n *Num) read(lex tokenStream) error {
	if !numRule.begins(lex.Peek()) {
		return participle.NextMatch
	}
	t, node := take(lex)
	*n = Num{Node: node, Text: t}
	return nil
}

func (u *Unit) read(lex tokenStream) error {
	if !unitRule.begins(lex.Peek()) {
		return participle.NextMatch
	}
	t, node := take(lex)
	*u = Unit{Node: node, Text: t}
	return nil
}

// Parse reads a name.
func (id *Ident) Parse(lex *lexer.PeekingLexer) error { return id.read(&peekStream{lex: lex}) }

func (id *Ident) read(lex tokenStream) error {
	if !identRule.begins(lex.Peek()) {
		return participle.NextMatch
	}
	t, node := take(lex)
	*id = Ident{Node: node, Name: t}
	return nil
}

// Parse reads a string literal.
func (s *Str) Parse(lex *lexer.PeekingLexer) error { return s.read(&peekStream{lex: lex}) }

func (s *Str) read(lex tokenStream) error {
	if !strRule.begins(lex.Peek()) {
		return participle.NextMatch
	}
	t, node := take(lex)
	*s = Str{Node: node, Raw: t}
	return nil
}

// Parse reads a species reference.
func (r *SpeciesRef) Parse(lex *lexer.PeekingLexer) error { return r.read(&peekStream{lex: lex}) }

func (r *SpeciesRef) read(lex tokenStream) error {
	if !speciesRefRule.begins(lex.Peek()) {
		return participle.NextMatch
	}
	t, node := take(lex)
	*r = SpeciesRef{Node: node, Text: t}
	return nil
}

func (a *Arrow) read(lex tokenStream) error {
	if t := lex.Peek(); t.Type != Punct || !arrowRule.begins(t) {
		return participle.NextMatch
	}
	t, node := take(lex)
	*a = Arrow{Node: node, Text: t}
	return nil
}

// isPlusMinus reports whether t starts a standard uncertainty.
func isPlusMinus(t *Token) bool { return t.Type == Punct && isOneOf(t, plusMinus) }

// Parse reads a Quantity.
func (q *Quantity) Parse(lex *lexer.PeekingLexer) error { return q.read(&peekStream{lex: lex}) }

func (q *Quantity) read(lex tokenStream) error {
	if !numRule.begins(lex.Peek()) { // a Quantity starts with its Num
		return participle.NextMatch
	}
	start := lex.RawCursor()
	slab := slabOf(lex)
	out := Quantity{Value: slab.num()}
	_ = out.Value.read(lex)
	if isPlusMinus(lex.Peek()) {
		lex.Next()
		out.Sigma = slab.num()
		if out.Sigma.read(lex) != nil {
			return expecting(lex, sigmaPart[1])
		}
	}
	if unitRule.begins(lex.Peek()) {
		out.Unit = slab.unit()
		_ = out.Unit.read(lex)
	}
	out.Node = lex.node(start, lex.RawCursor())
	*q = out
	return nil
}

func (tm *Term) read(lex tokenStream) error {
	start := lex.RawCursor()
	first := *lex.Peek()
	var out Term
	slab := slabOf(lex)
	if numRule.begins(&first) {
		out.Coef = slab.num()
		_ = out.Coef.read(lex)
	}
	out.Species = slab.ref()
	if tok := *lex.Peek(); out.Species.read(lex) != nil {
		if out.Coef == nil {
			return participle.NextMatch
		}
		return expecting(lex, termRule.at(1))
	} else if err := gluedTerms(tok); err != nil {
		return err
	}
	out.Node = lex.node(start, lex.RawCursor())
	*tm = out
	return nil
}
