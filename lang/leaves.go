package lang

import (
	"github.com/alecthomas/participle/v2"
	"github.com/alecthomas/participle/v2/lexer"
)

// The leaf nodes of the grammar, and the small nodes built only of leaves,
// parse themselves: participle calls their Parse method instead of
// interpreting their struct tags by reflection, which is most of the
// parser's work on a large network. Each reads exactly what its tag in the
// grammar documentation says, with lookahead one.

// take consumes the next token and returns it with its one-token slice.
func take(lex *lexer.PeekingLexer) (lexer.Token, []lexer.Token) {
	start := lex.RawCursor()
	t := *lex.Next()
	return t, lex.Range(start, lex.RawCursor())
}

func unexpected(lex *lexer.PeekingLexer, expect string) error {
	return &participle.UnexpectedTokenError{Unexpected: *lex.Peek(), Expect: expect}
}

func isNameToken(t *lexer.Token) bool { return t.Type == Word || t.Type == Keyword }

func isRefToken(t *lexer.Token) bool { return t.Type == Ref || t.Type == Word || t.Type == Keyword }

// Parse reads a number token.
func (n *Num) Parse(lex *lexer.PeekingLexer) error {
	if lex.Peek().Type != Number {
		return participle.NextMatch
	}
	t, toks := take(lex)
	*n = Num{Node: Node{Pos: t.Pos, Tokens: toks}, Text: t.Value}
	return nil
}

// Parse reads a unit word.
func (u *Unit) Parse(lex *lexer.PeekingLexer) error {
	if lex.Peek().Type != Word {
		return participle.NextMatch
	}
	t, toks := take(lex)
	*u = Unit{Node: Node{Pos: t.Pos, Tokens: toks}, Text: t.Value}
	return nil
}

// Parse reads a name.
func (id *Ident) Parse(lex *lexer.PeekingLexer) error {
	if !isNameToken(lex.Peek()) {
		return participle.NextMatch
	}
	t, toks := take(lex)
	*id = Ident{Node: Node{Pos: t.Pos, Tokens: toks}, Name: t.Value}
	return nil
}

// Parse reads a string literal.
func (s *Str) Parse(lex *lexer.PeekingLexer) error {
	if lex.Peek().Type != String {
		return participle.NextMatch
	}
	t, toks := take(lex)
	*s = Str{Node: Node{Pos: t.Pos, Tokens: toks}, Raw: t.Value}
	return nil
}

// Parse reads a species reference.
func (r *SpeciesRef) Parse(lex *lexer.PeekingLexer) error {
	if !isRefToken(lex.Peek()) {
		return participle.NextMatch
	}
	t, toks := take(lex)
	*r = SpeciesRef{Node: Node{Pos: t.Pos, Tokens: toks}, Text: t.Value}
	return nil
}

// Parse reads a reaction arrow.
func (a *Arrow) Parse(lex *lexer.PeekingLexer) error {
	t := lex.Peek()
	if t.Type != Punct {
		return participle.NextMatch
	}
	switch t.Value {
	case "<->", "⇌", "->", "→":
	default:
		return participle.NextMatch
	}
	tok, toks := take(lex)
	*a = Arrow{Node: Node{Pos: tok.Pos, Tokens: toks}, Text: tok.Value}
	return nil
}

func isPlusMinus(t *lexer.Token) bool {
	return t.Type == Punct && (t.Value == "±" || t.Value == "+-")
}

// Parse reads Num [ ("±" | "+-") Num ] [ Unit ].
func (q *Quantity) Parse(lex *lexer.PeekingLexer) error {
	if lex.Peek().Type != Number {
		return participle.NextMatch
	}
	start := lex.RawCursor()
	first := *lex.Peek()
	out := Quantity{Value: &Num{}}
	_ = out.Value.Parse(lex)
	if isPlusMinus(lex.Peek()) {
		lex.Next()
		out.Sigma = &Num{}
		if out.Sigma.Parse(lex) != nil {
			return unexpected(lex, "Num")
		}
	}
	if lex.Peek().Type == Word {
		out.Unit = &Unit{}
		_ = out.Unit.Parse(lex)
	}
	out.Node = Node{Pos: first.Pos, Tokens: lex.Range(start, lex.RawCursor())}
	*q = out
	return nil
}

// Parse reads [ Num ] SpeciesRef.
func (tm *Term) Parse(lex *lexer.PeekingLexer) error {
	start := lex.RawCursor()
	first := *lex.Peek()
	var out Term
	if first.Type == Number {
		out.Coef = &Num{}
		_ = out.Coef.Parse(lex)
	}
	out.Species = &SpeciesRef{}
	if out.Species.Parse(lex) != nil {
		if out.Coef == nil {
			return participle.NextMatch
		}
		return unexpected(lex, "SpeciesRef")
	}
	out.Node = Node{Pos: first.Pos, Tokens: lex.Range(start, lex.RawCursor())}
	*tm = out
	return nil
}
