package lang

import (
	"github.com/alecthomas/participle/v2/lexer"
)

// Tokens are the tokens the node spans, a run of its statement's; nil for
// a node with none. The slice shares the syntax tree's array: it must not
// be modified.
func (n *Node) Tokens() []Token {
	if n == nil || n.g == nil {
		return nil
	}
	return n.g.toks[n.start:n.end:n.end]
}

// Source is the file the node was read from, nil for a node that was not
// parsed.
func (n *Node) Source() *Source {
	if n == nil || n.g == nil {
		return nil
	}
	return n.g.src
}

// Text is the node's source text, from the start of its first token to
// the end of its last ("" for a node without tokens).
func (n *Node) Text() string {
	text, _ := n.Source().textOf(n.Tokens())
	return text
}

// TokenSpan is the exact source range of the node's i-th token.
func (n *Node) TokenSpan(i int) Span { return n.g.src.Span(n.Tokens()[i]) }

// at is the token where the node starts, if it knows.
func (n *Node) at() (Token, bool) {
	if n == nil || n.g == nil || int(n.start) >= len(n.g.toks) {
		return Token{}, false
	}
	return n.g.toks[n.start], true
}

// Span is the exact source range of the node, from the start of its first
// token to the end of its last. A node with no tokens has an empty span
// where it starts, if it knows (see Node).
func (n *Node) Span() Span {
	first, ok := n.at()
	if !ok {
		return Span{}
	}
	src := n.g.src
	if n.end == n.start {
		p := src.Pos(int(first.Offset))
		return Span{File: src.Name(), Start: p, End: p}
	}
	return src.span(first, n.g.toks[n.end-1])
}

// Position is where the node starts: its first token's position, or the
// zero Position when it knows none.
func (n *Node) Position() lexer.Position {
	first, ok := n.at()
	if !ok {
		return lexer.Position{}
	}
	return n.g.src.position(int(first.Offset))
}

// EndSpan is an empty span just after the node's last token, where a
// missing part (a unit, say) would go.
func (n *Node) EndSpan() Span {
	s := n.Span()
	s.Start = s.End
	return s
}
