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
func take(lex tokenStream) (lexer.Token, []lexer.Token) {
	start := lex.RawCursor()
	t := *lex.Next()
	return t, lex.Range(start, lex.RawCursor())
}

func unexpected(lex tokenStream, expect string) error {
	return &participle.UnexpectedTokenError{Unexpected: *lex.Peek(), Expect: expect}
}

func isNameToken(t *lexer.Token) bool { return t.Type == Word || t.Type == Keyword }

func isRefToken(t *lexer.Token) bool { return t.Type == Ref || t.Type == Word || t.Type == Keyword }

// Parse reads a number token.
func (n *Num) Parse(lex *lexer.PeekingLexer) error { return n.read(lex) }

func (n *Num) read(lex tokenStream) error {
	if lex.Peek().Type != Number {
		return participle.NextMatch
	}
	t, toks := take(lex)
	*n = Num{Node: Node{Pos: t.Pos, Tokens: toks}, Text: t.Value}
	return nil
}

// Parse reads a unit word.
func (u *Unit) Parse(lex *lexer.PeekingLexer) error { return u.read(lex) }

func (u *Unit) read(lex tokenStream) error {
	if lex.Peek().Type != Word {
		return participle.NextMatch
	}
	t, toks := take(lex)
	*u = Unit{Node: Node{Pos: t.Pos, Tokens: toks}, Text: t.Value}
	return nil
}

// Parse reads a name.
func (id *Ident) Parse(lex *lexer.PeekingLexer) error { return id.read(lex) }

func (id *Ident) read(lex tokenStream) error {
	if !isNameToken(lex.Peek()) {
		return participle.NextMatch
	}
	t, toks := take(lex)
	*id = Ident{Node: Node{Pos: t.Pos, Tokens: toks}, Name: t.Value}
	return nil
}

// Parse reads a string literal.
func (s *Str) Parse(lex *lexer.PeekingLexer) error { return s.read(lex) }

func (s *Str) read(lex tokenStream) error {
	if lex.Peek().Type != String {
		return participle.NextMatch
	}
	t, toks := take(lex)
	*s = Str{Node: Node{Pos: t.Pos, Tokens: toks}, Raw: t.Value}
	return nil
}

// Parse reads a species reference.
func (r *SpeciesRef) Parse(lex *lexer.PeekingLexer) error { return r.read(lex) }

func (r *SpeciesRef) read(lex tokenStream) error {
	if !isRefToken(lex.Peek()) {
		return participle.NextMatch
	}
	t, toks := take(lex)
	*r = SpeciesRef{Node: Node{Pos: t.Pos, Tokens: toks}, Text: t.Value}
	return nil
}

// Parse reads a reaction arrow.
func (a *Arrow) Parse(lex *lexer.PeekingLexer) error { return a.read(lex) }

func (a *Arrow) read(lex tokenStream) error {
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
func (q *Quantity) Parse(lex *lexer.PeekingLexer) error { return q.read(lex) }

func (q *Quantity) read(lex tokenStream) error {
	if lex.Peek().Type != Number {
		return participle.NextMatch
	}
	start := lex.RawCursor()
	first := *lex.Peek()
	out := Quantity{Value: &Num{}}
	_ = out.Value.read(lex)
	if isPlusMinus(lex.Peek()) {
		lex.Next()
		out.Sigma = &Num{}
		if out.Sigma.read(lex) != nil {
			return unexpected(lex, "Num")
		}
	}
	if lex.Peek().Type == Word {
		out.Unit = &Unit{}
		_ = out.Unit.read(lex)
	}
	out.Node = Node{Pos: first.Pos, Tokens: lex.Range(start, lex.RawCursor())}
	*q = out
	return nil
}

// Parse reads [ Num ] SpeciesRef.
func (tm *Term) Parse(lex *lexer.PeekingLexer) error { return tm.read(lex) }

func (tm *Term) read(lex tokenStream) error {
	start := lex.RawCursor()
	first := *lex.Peek()
	var out Term
	if first.Type == Number {
		out.Coef = &Num{}
		_ = out.Coef.read(lex)
	}
	out.Species = &SpeciesRef{}
	if out.Species.read(lex) != nil {
		if out.Coef == nil {
			return participle.NextMatch
		}
		return unexpected(lex, "SpeciesRef")
	}
	out.Node = Node{Pos: first.Pos, Tokens: lex.Range(start, lex.RawCursor())}
	*tm = out
	return nil
}

// unexpectedRest is the error for a required element that is missing,
// expecting rest, the part of the production from that element on (as the
// grammar's EBNF writes it).
func unexpectedRest(lex tokenStream, rest string) error {
	return &participle.UnexpectedTokenError{Unexpected: *lex.Peek(), Expect: rest}
}

// expectLiteral consumes the token with text s or fails expecting rest.
func expectLiteral(lex tokenStream, s, rest string) error {
	if lex.Peek().Value != s || lex.Peek().EOF() {
		return unexpectedRest(lex, rest)
	}
	lex.Next()
	return nil
}

// requireQuantity parses a quantity that must be there, or fails
// expecting rest.
func requireQuantity(lex tokenStream, rest string) (*Quantity, error) {
	q := &Quantity{}
	if err := q.read(lex); err != nil {
		if err == participle.NextMatch {
			return nil, unexpectedRest(lex, rest)
		}
		return nil, err
	}
	return q, nil
}

// Parse reads ("shomate" | "nasa7") Quantity "to" Quantity "{" Num* "}".
func (p *Polynomial) Parse(lex *lexer.PeekingLexer) error { return p.read(lex) }

func (p *Polynomial) read(lex tokenStream) error {
	if v := lex.Peek().Value; v != "shomate" && v != "nasa7" {
		return participle.NextMatch
	}
	start := lex.RawCursor()
	first := *lex.Next()
	out := Polynomial{Kind: first.Value}
	var err error
	if out.From, err = requireQuantity(lex, `Quantity "to" Quantity "{" Num* "}"`); err != nil {
		return err
	}
	if err := expectLiteral(lex, "to", `"to" Quantity "{" Num* "}"`); err != nil {
		return err
	}
	if out.To, err = requireQuantity(lex, `Quantity "{" Num* "}"`); err != nil {
		return err
	}
	if err := expectLiteral(lex, "{", `"{" Num* "}"`); err != nil {
		return err
	}
	for lex.Peek().Type == Number {
		n := &Num{}
		_ = n.read(lex)
		out.Coeffs = append(out.Coeffs, n)
	}
	if err := expectLiteral(lex, "}", `"}"`); err != nil {
		return err
	}
	out.Node = Node{Pos: first.Pos, Tokens: lex.Range(start, lex.RawCursor())}
	*p = out
	return nil
}

// Parse reads one species property, chosen by its keyword: FormulaProp,
// SpeciesValue, Polynomial or TextProp.
func (sp *SpeciesProperty) Parse(lex *lexer.PeekingLexer) error { return sp.read(lex) }

func (sp *SpeciesProperty) read(lex tokenStream) error {
	start := lex.RawCursor()
	first := *lex.Peek()
	var out SpeciesProperty
	var err error
	switch first.Value {
	case "formula":
		lex.Next()
		ref := &SpeciesRef{}
		if ref.read(lex) != nil {
			return unexpectedRest(lex, "SpeciesRef")
		}
		out.Formula = &FormulaProp{Node: Node{Pos: first.Pos, Tokens: lex.Range(start, lex.RawCursor())}, Formula: ref}
	case "hf", "gf", "s", "cp":
		lex.Next()
		v := &SpeciesValue{Key: first.Value}
		if v.Value, err = requireQuantity(lex, "Quantity"); err != nil {
			return err
		}
		v.Node = Node{Pos: first.Pos, Tokens: lex.Range(start, lex.RawCursor())}
		out.Value = v
	case "shomate", "nasa7":
		out.Poly = &Polynomial{}
		if err := out.Poly.read(lex); err != nil {
			return err
		}
	case "source", "note":
		lex.Next()
		s := &Str{}
		if s.read(lex) != nil {
			return unexpectedRest(lex, "Str")
		}
		out.Text = &TextProp{Node: Node{Pos: first.Pos, Tokens: lex.Range(start, lex.RawCursor())}, Key: first.Value, Text: s}
	default:
		return participle.NextMatch
	}
	out.Node = Node{Pos: first.Pos, Tokens: lex.Range(start, lex.RawCursor())}
	*sp = out
	return nil
}

// optionalNum reads Num after the literal lit when lit comes next; a
// missing Num is an error.
func optionalNum(lex tokenStream, lit string) (*Num, error) {
	if lex.Peek().Value != lit || lex.Peek().EOF() {
		return nil, nil
	}
	lex.Next()
	n := &Num{}
	if n.read(lex) != nil {
		return nil, unexpectedRest(lex, "Num")
	}
	return n, nil
}

// Parse reads one reaction property, chosen by its keyword: ReactionValue,
// LogK, Rate or TextProp.
func (rp *ReactionProperty) Parse(lex *lexer.PeekingLexer) error { return rp.read(lex) }

func (rp *ReactionProperty) read(lex tokenStream) error {
	start := lex.RawCursor()
	first := *lex.Peek()
	node := func() Node { return Node{Pos: first.Pos, Tokens: lex.Range(start, lex.RawCursor())} }
	var out ReactionProperty
	var err error
	switch first.Value {
	case "dg", "dh", "ds":
		lex.Next()
		v := &ReactionValue{Key: first.Value}
		if v.Value, err = requireQuantity(lex, "Quantity"); err != nil {
			return err
		}
		v.Node = node()
		out.Value = v
	case "logk":
		lex.Next()
		lk := &LogK{Value: &Num{}}
		if lk.Value.read(lex) != nil {
			return unexpectedRest(lex, `Num (("±" | "+-") Num)? ("at" Quantity)?`)
		}
		if isPlusMinus(lex.Peek()) {
			lex.Next()
			lk.Sigma = &Num{}
			if lk.Sigma.read(lex) != nil {
				return unexpectedRest(lex, "Num")
			}
		}
		if v := lex.Peek(); v.Value == "at" && !v.EOF() {
			lex.Next()
			if lk.At, err = requireQuantity(lex, "Quantity"); err != nil {
				return err
			}
		}
		lk.Node = node()
		out.LogK = lk
	case "rate", "reverse":
		lex.Next()
		r := &Rate{Kind: first.Value}
		if err := expectLiteral(lex, "A", `"A" Quantity ("n" Num)? "Ea" Quantity`); err != nil {
			return err
		}
		if r.A, err = requireQuantity(lex, `Quantity ("n" Num)? "Ea" Quantity`); err != nil {
			return err
		}
		if r.N, err = optionalNum(lex, "n"); err != nil {
			return err
		}
		if err := expectLiteral(lex, "Ea", `"Ea" Quantity`); err != nil {
			return err
		}
		if r.Ea, err = requireQuantity(lex, "Quantity"); err != nil {
			return err
		}
		r.Node = node()
		out.Rate = r
	case "source", "note":
		lex.Next()
		s := &Str{}
		if s.read(lex) != nil {
			return unexpectedRest(lex, "Str")
		}
		out.Text = &TextProp{Node: node(), Key: first.Value, Text: s}
	default:
		return participle.NextMatch
	}
	out.Node = node()
	*rp = out
	return nil
}
