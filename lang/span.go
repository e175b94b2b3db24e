package lang

import (
	"unicode/utf8"

	"github.com/alecthomas/participle/v2/lexer"
)

// TokenSpan is the exact source range of one token.
func TokenSpan(t lexer.Token) Span {
	start := Pos{Line: t.Pos.Line, Column: t.Pos.Column, Offset: t.Pos.Offset}
	end := start
	end.Offset += len(t.Value)
	end.Column += utf8.RuneCountInString(t.Value)
	return Span{File: t.Pos.Filename, Start: start, End: end}
}

// Span is the exact source range of the node, from the start of its first
// token to the end of its last. A node with no tokens has an empty span at
// its position.
func (n *Node) Span() Span {
	if n == nil {
		return Span{}
	}
	if len(n.Tokens) == 0 {
		p := Pos{Line: n.Pos.Line, Column: n.Pos.Column, Offset: n.Pos.Offset}
		return Span{File: n.Pos.Filename, Start: p, End: p}
	}
	first := TokenSpan(n.Tokens[0])
	last := TokenSpan(n.Tokens[len(n.Tokens)-1])
	return Span{File: first.File, Start: first.Start, End: last.End}
}

// EndSpan is an empty span just after the node's last token, where a
// missing part (a unit, say) would go.
func (n *Node) EndSpan() Span {
	s := n.Span()
	s.Start = s.End
	return s
}
