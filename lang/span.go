package lang

import (
	"unicode/utf8"

	"github.com/alecthomas/participle/v2/lexer"
)

// TokenSpan is the exact source range of one token.
func TokenSpan(t lexer.Token) Span { return tokenSpan(&t) }

func tokenSpan(t *lexer.Token) Span {
	start := Pos{Line: t.Pos.Line, Column: t.Pos.Column, Offset: t.Pos.Offset}
	return Span{File: t.Pos.Filename, Start: start, End: tokenEnd(t)}
}

// tokenEnd is the position just after a token.
func tokenEnd(t *lexer.Token) Pos {
	return Pos{Line: t.Pos.Line, Column: t.Pos.Column + utf8.RuneCountInString(t.Value), Offset: t.Pos.Offset + len(t.Value)}
}

// Span is the exact source range of the node, from the start of its first
// token to the end of its last. A node with no tokens has an empty span
// where it starts, if it knows (see Node).
func (n *Node) Span() Span {
	if n == nil {
		return Span{}
	}
	if len(n.Tokens) == 0 {
		if cap(n.Tokens) == 0 {
			return Span{}
		}
		at := &n.Tokens[:1][0]
		p := Pos{Line: at.Pos.Line, Column: at.Pos.Column, Offset: at.Pos.Offset}
		return Span{File: at.Pos.Filename, Start: p, End: p}
	}
	first := &n.Tokens[0]
	return Span{
		File:  first.Pos.Filename,
		Start: Pos{Line: first.Pos.Line, Column: first.Pos.Column, Offset: first.Pos.Offset},
		End:   tokenEnd(&n.Tokens[len(n.Tokens)-1]),
	}
}

// Position is where the node starts: its first token's position, or the
// zero Position when it knows none.
func (n *Node) Position() lexer.Position {
	if n == nil || cap(n.Tokens) == 0 {
		return lexer.Position{}
	}
	return n.Tokens[:1][0].Pos
}

// EndSpan is an empty span just after the node's last token, where a
// missing part (a unit, say) would go.
func (n *Node) EndSpan() Span {
	s := n.Span()
	s.Start = s.End
	return s
}

// startsAt is a Node with no tokens yet that starts at the token at of
// lex: what a node read by hand holds until it is complete.
func startsAt(lex tokenStream, at lexer.RawCursor) Node {
	return Node{Tokens: lex.Range(at, at+1)[:0]}
}
