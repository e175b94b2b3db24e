package lang

import (
	"reflect"

	"github.com/alecthomas/participle/v2"
	"github.com/alecthomas/participle/v2/lexer"
)

// tokenStream is what the hand-written readers need of a token stream. It
// is met by tokenCursor, when the parser reads a species or reaction
// statement itself, and by peekStream, when participle calls a node's
// Parse method.
type tokenStream interface {
	Peek() *Token
	Next() *Token
	RawCursor() int
	// node is the Node of the tokens [start, end).
	node(start, end int) Node
}

// tokenCursor reads one statement's tokens, which end with a token that no
// rule matches (endOfStatement or EOF); it never moves past that token.
// Nodes it makes share the statement's token array, which the syntax tree
// keeps.
type tokenCursor struct {
	g    *tokenGroup
	base int     // index in g.toks of toks[0]
	toks []Token // g.toks[base:], up to the statement's end token
	i    int
	slab *nodeSlab // where the statement's small nodes come from; nil: the heap
}

// newCursor reads the tokens g.toks[start:end], the last a token that no
// rule matches.
func newCursor(g *tokenGroup, start, end int, slab *nodeSlab) *tokenCursor {
	return &tokenCursor{g: g, base: start, toks: g.toks[start:end:end], slab: slab}
}

func (c *tokenCursor) Peek() *Token { return &c.toks[c.i] }

func (c *tokenCursor) Next() *Token {
	t := &c.toks[c.i]
	if c.i < len(c.toks)-1 {
		c.i++
	}
	return t
}

func (c *tokenCursor) RawCursor() int { return c.i }

func (c *tokenCursor) node(start, end int) Node {
	return Node{g: c.g, start: int32(c.base + start), end: int32(c.base + end)}
}

// startsAt is a Node with no tokens yet that starts at the token at of
// lex: what a node read by hand holds until it is complete.
func startsAt(lex *tokenCursor, at int) Node { return lex.node(at, at) }

// parseWith hands the rest of the cursor's tokens to participle's parser
// p, for the statements and parts of the grammar that participle reads,
// and then moves the cursor past what p consumed. Participle sees each
// token as a lexer.Token made on the fly; the nodes it returns get their
// runs of the group's tokens afterwards (see attach).
func parseWith[G any](c *tokenCursor, p *participle.Parser[G]) (*G, error) {
	from := c.i
	peek, _ := lexer.Upgrade(&replay{toks: c.toks[from:], src: c.g.src}) // replay.Next never fails
	v, err := p.ParseFromLexer(peek, participle.AllowTrailing(true))
	c.i += int(peek.RawCursor())
	c.i = min(c.i, len(c.toks)-1)
	if v != nil {
		attach(reflect.ValueOf(v), c, from)
	}
	return v, err
}

// toLexer is t as participle sees it.
func toLexer(t Token, src *Source) lexer.Token {
	return lexer.Token{Type: lexer.TokenType(t.Type), Value: t.Value, Pos: src.position(int(t.Offset))}
}

// fromLexer is the Token participle saw as t.
func fromLexer(t lexer.Token) Token {
	return Token{Value: t.Value, Offset: int32(t.Pos.Offset), Type: TokenType(t.Type)}
}

// replay is a lexer.Lexer over tokens already read, then EOF.
type replay struct {
	toks []Token
	src  *Source
	i    int
}

func (r *replay) Next() (lexer.Token, error) {
	if r.i == len(r.toks) {
		var end Token
		if len(r.toks) > 0 {
			end.Offset = int32(r.toks[len(r.toks)-1].End())
		}
		return lexer.Token{Type: lexer.EOF, Pos: r.src.position(int(end.Offset))}, nil
	}
	r.i++
	return toLexer(r.toks[r.i-1], r.src), nil
}

// peekStream is participle's PeekingLexer as a tokenStream, for the leaves
// participle reads through their Parse methods. The nodes it makes hold
// the bounds of their run in participle's stream and the group
// unattached, until attach gives them their run of the group's tokens.
type peekStream struct {
	lex  *lexer.PeekingLexer
	peek Token
}

func (p *peekStream) Peek() *Token {
	p.peek = fromLexer(*p.lex.Peek())
	return &p.peek
}

func (p *peekStream) Next() *Token {
	t := fromLexer(*p.lex.Next())
	return &t
}

func (p *peekStream) RawCursor() int { return int(p.lex.RawCursor()) }

func (p *peekStream) node(start, end int) Node {
	return Node{g: unattached, start: int32(start), end: int32(end)}
}

// unattached is the group of a node read through participle until attach
// gives it its own.
var unattached = &tokenGroup{}

var (
	nodeType       = reflect.TypeFor[Node]()
	parsedNodeType = reflect.TypeFor[ParsedNode]()
)

// attach gives every node that participle read in v, from the tokens of
// cursor c from index from on, its run of c's group and the group. A node
// participle read spans from its Pos to its EndPos; one that failed
// part-way (it has no EndPos) gets an empty run where it started, so that
// its Span is where it was before. A leaf read through its Parse method
// holds the bounds of its run in participle's stream.
func attach(v reflect.Value, c *tokenCursor, from int) {
	switch v.Kind() {
	case reflect.Pointer:
		if !v.IsNil() {
			attach(v.Elem(), c, from)
		}
	case reflect.Slice:
		if v.Type().Elem().Kind() == reflect.Pointer {
			for i := range v.Len() {
				attach(v.Index(i), c, from)
			}
		}
	case reflect.Struct:
		switch v.Type() {
		case parsedNodeType:
			n := v.Addr().Interface().(*ParsedNode)
			n.Node = Node{}
			if n.Pos.Line > 0 {
				toks := c.toks[from:]
				i := searchOffset(toks, n.Pos.Offset)
				j := i
				if n.EndPos.Line > 0 {
					j = max(i, searchOffset(toks, n.EndPos.Offset))
				}
				if i < len(toks) {
					n.Node = c.node(from+i, from+j)
				}
			}
			return
		case nodeType:
			n := v.Addr().Interface().(*Node)
			if n.g == unattached {
				*n = c.node(from+int(n.start), from+int(n.end))
			}
			return
		}
		for i := range v.NumField() {
			if v.Type().Field(i).IsExported() {
				attach(v.Field(i), c, from)
			}
		}
	}
}

// searchOffset is the index of the first of toks at or after offset off.
func searchOffset(toks []Token, off int) int {
	lo, hi := 0, len(toks)
	for lo < hi {
		m := int(uint(lo+hi) >> 1)
		if int(toks[m].Offset) < off {
			lo = m + 1
		} else {
			hi = m
		}
	}
	return lo
}
