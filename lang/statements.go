package lang

import (
	"github.com/alecthomas/participle/v2"
)

// The species and reaction statements, by far the most numerous in a large
// network, are read by hand rather than by participle's reflection, each
// by its production below. When a reader fails it leaves what it read so
// far in the node.

var (
	speciesRule = rule("Species", "",
		seq{lit("species"), ref("SpeciesRef"), many{moreRefsPart}, opt{ref("Str")}, opt{block("SpeciesProperty")}})
	reactionRule = rule("Reaction", "",
		seq{lit("reaction"), ref("Ident"), lit(":"), ref("Term"), many{moreTermsPart}, ref("Arrow"),
			ref("Term"), many{moreTermsPart}, opt{comboPart}, opt{block("ReactionProperty")}})

	moreRefsPart  = seq{lit(","), ref("SpeciesRef")}
	moreTermsPart = seq{lit("+"), ref("Term")}
	comboPart     = seq{lit("="), ref("Combination")}
)

// The braces around a block.
const openBrace, closeBrace = lit("{"), lit("}")

// block is a block of items: "{" item* "}".
func block(item string) seq { return seq{openBrace, many{ref(item)}, closeBrace} }

// blockOpens reports whether t opens a block.
func blockOpens(t *Token) bool { return t.Type == Punct && isLit(t, openBrace) }

// comboParser reads the combination after a reaction's "=".
var comboParser = participle.MustBuild[Combination](parserOptions...)

// parseSpeciesStatement reads a Species.
func parseSpeciesStatement(lex *tokenCursor, st *Statement) error {
	start := lex.RawCursor()
	lex.Next() // "species"
	out := slabOr(lex.slab, slabSpecies)
	out.Node = startsAt(lex, start)
	st.Species = out
	var buf [4]*SpeciesRef
	refs := buf[:0]
	for {
		ref := lex.slab.ref()
		if ref.read(lex) != nil {
			out.Refs = slabListOr(lex.slab, slabRefPtrs, refs)
			if len(refs) == 0 {
				return expecting(lex, speciesRule.at(1))
			}
			return expecting(lex, moreRefsPart[1])
		}
		refs = append(refs, ref)
		if t := lex.Peek(); t.Type != Punct || !isLit(t, moreRefsPart[0]) {
			break
		}
		lex.Next()
	}
	out.Refs = slabListOr(lex.slab, slabRefPtrs, refs)
	if strRule.begins(lex.Peek()) {
		out.Label = &Str{}
		_ = out.Label.read(lex)
	}
	if blockOpens(lex.Peek()) {
		out.HasBody = true
		props, err := parseBlock(lex, slabSProps, slabSPPtrs)
		out.Props = props
		if err != nil {
			return err
		}
	}
	out.Node = lex.node(start, lex.RawCursor())
	return nil
}

// parseTerms reads Term ("+" Term)* into *terms, failing expecting part
// x of the reaction when no term starts the list.
func parseTerms(lex *tokenCursor, terms *[]*Term, x expr) error {
	var buf [8]*Term
	read := buf[:0]
	defer func() { *terms = lex.slab.termList(read) }()
	for {
		tm := lex.slab.term()
		if err := tm.read(lex); err != nil {
			if err != participle.NextMatch {
				return err
			}
			if len(read) == 0 {
				return expecting(lex, x)
			}
			return expecting(lex, moreTermsPart[1])
		}
		read = append(read, tm)
		if t := lex.Peek(); t.Type != Punct || !isLit(t, moreTermsPart[0]) {
			return nil
		}
		lex.Next()
	}
}

// parseReactionStatement reads a Reaction.
func parseReactionStatement(lex *tokenCursor, st *Statement) error {
	start := lex.RawCursor()
	lex.Next() // "reaction"
	out := slabOr(lex.slab, slabReactions)
	out.Node = startsAt(lex, start)
	st.Reaction = out
	name := lex.slab.ident()
	if name.read(lex) != nil {
		return expecting(lex, reactionRule.at(1))
	}
	out.Name = name
	if err := expectLit(lex, reactionRule.at(2)); err != nil {
		return err
	}
	if err := parseTerms(lex, &out.Left, reactionRule.at(3)); err != nil {
		return err
	}
	arrow := lex.slab.arrow()
	if arrow.read(lex) != nil {
		return expecting(lex, reactionRule.at(5))
	}
	out.Arrow = arrow
	if err := parseTerms(lex, &out.Right, reactionRule.at(6)); err != nil {
		return err
	}
	if t := lex.Peek(); t.Type == Punct && isLit(t, comboPart[0]) {
		lex.Next()
		c, err := parseWith(lex, comboParser)
		if c != nil {
			out.Combo = c
		}
		if err != nil {
			return err
		}
	}
	if blockOpens(lex.Peek()) {
		out.HasBody = true
		props, err := parseBlock(lex, slabRProps, slabRPPtrs)
		out.Props = props
		if err != nil {
			return err
		}
	}
	out.Node = lex.node(start, lex.RawCursor())
	return nil
}

// parseBlock reads "{" P* "}" with lex at the "{": the properties of a
// species or reaction block, taken from the slab's arrays nodes and
// lists. It returns the properties read so far with any error.
func parseBlock[P any, PP interface {
	*P
	read(tokenStream) error
}](lex *tokenCursor, nodes func(*nodeSlab) *[]P, lists func(*nodeSlab) *[]PP) ([]PP, error) {
	lex.Next()
	var buf [8]PP
	props := buf[:0]
	var p PP
	for {
		if p == nil {
			p = slabOr(lex.slab, nodes)
		}
		err := p.read(lex)
		if err == participle.NextMatch {
			break
		}
		if err != nil {
			return slabListOr(lex.slab, lists, props), err
		}
		props = append(props, p)
		p = nil
	}
	return slabListOr(lex.slab, lists, props), expectLit(lex, closeBrace)
}
