package lang

import (
	"reflect"
	"sort"

	"github.com/alecthomas/participle/v2/lexer"
)

// tokenStream is what the hand-written readers need of a token stream. It
// is met by participle's PeekingLexer, when participle calls a node's
// Parse method, and by tokenCursor, when the parser reads a species or
// reaction statement itself.
type tokenStream interface {
	Peek() *lexer.Token
	Next() *lexer.Token
	RawCursor() lexer.RawCursor
	Range(start, end lexer.RawCursor) []lexer.Token
}

// tokenCursor reads one statement's tokens, which end with a token that no
// rule matches (endOfStatement or EOF); it never moves past that token.
// Slices it returns share the statement's token array, which the syntax
// tree keeps.
type tokenCursor struct {
	toks []lexer.Token
	i    int
	slab *nodeSlab // where the statement's small nodes come from; nil: the heap
}

func (c *tokenCursor) Peek() *lexer.Token { return &c.toks[c.i] }

func (c *tokenCursor) Next() *lexer.Token {
	t := &c.toks[c.i]
	if c.i < len(c.toks)-1 {
		c.i++
	}
	return t
}

func (c *tokenCursor) RawCursor() lexer.RawCursor { return lexer.RawCursor(c.i) }

func (c *tokenCursor) Range(start, end lexer.RawCursor) []lexer.Token {
	return c.toks[start:end:end]
}

// withPeeking hands the rest of the cursor's tokens to participle as a
// PeekingLexer, for the parts of the grammar that participle reads, and
// then moves the cursor past what parse consumed.
func (c *tokenCursor) withPeeking(parse func(*lexer.PeekingLexer) error) error {
	peek, _ := lexer.Upgrade(&replay{toks: c.toks[c.i:]}) // replay.Next never fails
	err := parse(peek)
	c.i += int(peek.RawCursor())
	c.i = min(c.i, len(c.toks)-1)
	return err
}

// anchorParsed gives every node participle read in v that has no tokens
// (it failed part-way) an empty run of toks where it started, so that its
// Span is where it was before. toks are the tokens participle was given.
func anchorParsed(v reflect.Value, toks []lexer.Token) {
	switch v.Kind() {
	case reflect.Pointer:
		if !v.IsNil() {
			anchorParsed(v.Elem(), toks)
		}
	case reflect.Slice:
		if v.Type().Elem().Kind() == reflect.Pointer {
			for i := range v.Len() {
				anchorParsed(v.Index(i), toks)
			}
		}
	case reflect.Struct:
		if v.Type() == parsedNodeType {
			n := v.Addr().Interface().(*ParsedNode)
			if len(n.Tokens) == 0 && n.Pos.Line > 0 {
				i := sort.Search(len(toks), func(i int) bool { return toks[i].Pos.Offset >= n.Pos.Offset })
				if i < len(toks) && toks[i].Pos.Offset == n.Pos.Offset {
					n.Tokens = toks[i:i:min(i+1, len(toks))]
				}
			}
			return
		}
		for i := range v.NumField() {
			if v.Type().Field(i).IsExported() {
				anchorParsed(v.Field(i), toks)
			}
		}
	}
}

// replay is a lexer.Lexer over tokens already read, then EOF.
type replay struct {
	toks []lexer.Token
	i    int
}

func (r *replay) Next() (lexer.Token, error) {
	if r.i == len(r.toks) {
		var pos lexer.Position
		if len(r.toks) > 0 {
			pos = r.toks[len(r.toks)-1].Pos
		}
		return lexer.Token{Type: lexer.EOF, Pos: pos}, nil
	}
	r.i++
	return r.toks[r.i-1], nil
}
