package lang

import (
	"github.com/alecthomas/participle/v2"
	"github.com/alecthomas/participle/v2/lexer"
)

// The species and reaction statements, by far the most numerous in a large
// network, are read by hand rather than by participle's reflection. Each
// reads what its struct tags in ast.go say, reports the same expectations
// at the same tokens, and leaves what it read so far in the node when it
// fails, as participle does.

// comboParser reads the combination after a reaction's "=".
var comboParser = participle.MustBuild[Combination](parserOptions...)

// parseSpeciesStatement reads
// "species" SpeciesRef ("," SpeciesRef)* Str? ("{" SpeciesProperty* "}")?.
func parseSpeciesStatement(lex *tokenCursor, st *Statement) error {
	start := lex.RawCursor()
	first := *lex.Next() // "species"
	out := &Species{Node: Node{Pos: first.Pos}}
	st.Species = out
	const refsRest = `SpeciesRef ("," SpeciesRef)* Str? ("{" SpeciesProperty* "}")?`
	for {
		ref := &SpeciesRef{}
		if ref.read(lex) != nil {
			if len(out.Refs) == 0 {
				return unexpectedRest(lex, refsRest)
			}
			return unexpectedRest(lex, "SpeciesRef")
		}
		out.Refs = append(out.Refs, ref)
		if t := lex.Peek(); t.Type != Punct || t.Value != "," {
			break
		}
		lex.Next()
	}
	if lex.Peek().Type == String {
		out.Label = &Str{}
		_ = out.Label.read(lex)
	}
	if t := lex.Peek(); t.Type == Punct && t.Value == "{" {
		out.HasBody = true
		props, err := parseBlock[SpeciesProperty](lex)
		out.Props = props
		if err != nil {
			return err
		}
	}
	out.Tokens = lex.Range(start, lex.RawCursor())
	return nil
}

// parseTerms reads Term ("+" Term)* into *terms, failing expecting rest
// when no term starts the list.
func parseTerms(lex *tokenCursor, terms *[]*Term, rest string) error {
	for {
		tm := &Term{}
		if err := tm.read(lex); err != nil {
			if err != participle.NextMatch {
				return err
			}
			if len(*terms) == 0 {
				return unexpectedRest(lex, rest)
			}
			return unexpectedRest(lex, "Term")
		}
		*terms = append(*terms, tm)
		if t := lex.Peek(); t.Type != Punct || t.Value != "+" {
			return nil
		}
		lex.Next()
	}
}

// parseReactionStatement reads
// "reaction" Ident ":" Term ("+" Term)* Arrow Term ("+" Term)*
// ("=" Combination)? ("{" ReactionProperty* "}")?.
func parseReactionStatement(lex *tokenCursor, st *Statement) error {
	start := lex.RawCursor()
	first := *lex.Next() // "reaction"
	out := &Reaction{Node: Node{Pos: first.Pos}}
	st.Reaction = out
	name := &Ident{}
	if name.read(lex) != nil {
		return unexpectedRest(lex, `Ident ":" Term ("+" Term)* Arrow Term ("+" Term)* ("=" Combination)? ("{" ReactionProperty* "}")?`)
	}
	out.Name = name
	if err := expectLiteral(lex, ":", `":" Term ("+" Term)* Arrow Term ("+" Term)* ("=" Combination)? ("{" ReactionProperty* "}")?`); err != nil {
		return err
	}
	if err := parseTerms(lex, &out.Left, `Term ("+" Term)* Arrow Term ("+" Term)* ("=" Combination)? ("{" ReactionProperty* "}")?`); err != nil {
		return err
	}
	arrow := &Arrow{}
	if arrow.read(lex) != nil {
		return unexpectedRest(lex, `Arrow Term ("+" Term)* ("=" Combination)? ("{" ReactionProperty* "}")?`)
	}
	out.Arrow = arrow
	if err := parseTerms(lex, &out.Right, `Term ("+" Term)* ("=" Combination)? ("{" ReactionProperty* "}")?`); err != nil {
		return err
	}
	if t := lex.Peek(); t.Type == Punct && t.Value == "=" {
		lex.Next()
		err := lex.withPeeking(func(peek *lexer.PeekingLexer) error {
			c, err := comboParser.ParseFromLexer(peek, participle.AllowTrailing(true))
			if c != nil {
				out.Combo = c
			}
			return err
		})
		if err != nil {
			return err
		}
	}
	if t := lex.Peek(); t.Type == Punct && t.Value == "{" {
		out.HasBody = true
		props, err := parseBlock[ReactionProperty](lex)
		out.Props = props
		if err != nil {
			return err
		}
	}
	out.Tokens = lex.Range(start, lex.RawCursor())
	return nil
}

// parseBlock reads "{" P* "}" with lex at the "{": the properties of a
// species or reaction block. It returns the properties read so far with
// any error.
func parseBlock[P any, PP interface {
	*P
	read(tokenStream) error
}](lex *tokenCursor) ([]PP, error) {
	lex.Next()
	var props []PP
	for {
		p := PP(new(P))
		err := p.read(lex)
		if err == participle.NextMatch {
			break
		}
		if err != nil {
			return props, err
		}
		props = append(props, p)
	}
	return props, expectLiteral(lex, "}", `"}"`)
}
