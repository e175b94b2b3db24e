package lang

import (
	"github.com/alecthomas/participle/v2/lexer"
)

// Source is the file the node was read from, nil for a node that was not
// parsed.
func (n *Node) Source() *Source {
	if n == nil {
		return nil
	}
	return n.src
}

// TokenSpan is the exact source range of the node's i-th token.
func (n *Node) TokenSpan(i int) Span { return n.src.Span(n.Tokens[i]) }

// Span is the exact source range of the node, from the start of its first
// token to the end of its last. A node with no tokens has an empty span
// where it starts, if it knows (see Node).
func (n *Node) Span() Span {
	if n == nil || cap(n.Tokens) == 0 || n.src == nil {
		return Span{}
	}
	if len(n.Tokens) == 0 {
		p := n.src.Pos(int(n.Tokens[:1][0].Offset))
		return Span{File: n.src.name, Start: p, End: p}
	}
	first := n.src.Span(n.Tokens[0])
	if len(n.Tokens) > 1 {
		first.End = n.src.Span(n.Tokens[len(n.Tokens)-1]).End
	}
	return first
}

// Position is where the node starts: its first token's position, or the
// zero Position when it knows none.
func (n *Node) Position() lexer.Position {
	if n == nil || cap(n.Tokens) == 0 || n.src == nil {
		return lexer.Position{}
	}
	return n.src.position(int(n.Tokens[:1][0].Offset))
}

// EndSpan is an empty span just after the node's last token, where a
// missing part (a unit, say) would go.
func (n *Node) EndSpan() Span {
	s := n.Span()
	s.Start = s.End
	return s
}
