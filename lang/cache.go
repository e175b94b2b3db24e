package lang

import (
	"reflect"
	"sync"

	"github.com/alecthomas/participle/v2/lexer"
)

// A Cache keeps the statements of a file's last parse, keyed by their
// source text, so that parsing the file again after an edit re-parses only
// the statements whose text changed. A statement found again at another
// place is a copy moved there; one found at the same place is shared with
// the earlier parse, so the trees a Cache hands out must not be modified.
// A Cache serves one file, one parse at a time; it keeps only what the
// latest parse used.
type Cache struct {
	mu     sync.Mutex
	last   map[cacheKey]*Statement
	next   map[cacheKey]*Statement
	hits   int // statements reused by the latest parse
	misses int // statements it parsed
}

type cacheKey struct {
	text   string // the statement's source, first token to last
	column int    // column of its first token, which the tree records
}

// NewCache returns an empty statement cache.
func NewCache() *Cache { return &Cache{} }

// Reused reports how many statements the latest parse took from the cache
// and how many it parsed.
func (c *Cache) Reused() (hits, parsed int) {
	c.mu.Lock()
	defer c.mu.Unlock()
	return c.hits, c.misses
}

// ParseCached is Parse, taking unchanged statements from the cache and
// storing the new ones; a nil cache parses everything.
func ParseCached(file string, src []byte, c *Cache) (*File, Diagnostics) {
	if c == nil {
		return Parse(file, src)
	}
	c.mu.Lock()
	c.next, c.hits, c.misses = make(map[cacheKey]*Statement, len(c.last)), 0, 0
	c.mu.Unlock()
	f, diags := parse(file, src, c)
	c.mu.Lock()
	c.last, c.next = c.next, nil
	c.mu.Unlock()
	return f, diags
}

// statementKey is the cache key of the statement made of toks, tokens
// of src.
func statementKey(src *Source, toks []Token) (cacheKey, bool) {
	first, end := int(toks[0].Offset), toks[len(toks)-1].End()
	if first < 0 || end > len(src.text) || first > end {
		return cacheKey{}, false
	}
	return cacheKey{text: src.text[first:end], column: src.Pos(first).Column}, true
}

// lookup returns the cached statement with the key, moved to offset at of
// src. A statement at the same offset and line of a file of the same name
// is shared: its tokens resolve to the same lines and columns through the
// Source it was parsed from, since the key holds its text and column.
func (c *Cache) lookup(k cacheKey, src *Source, at int) *Statement {
	c.mu.Lock()
	st := c.last[k]
	if st == nil {
		st = c.next[k]
	}
	c.mu.Unlock()
	if st == nil {
		return nil
	}
	if int(st.Tokens[0].Offset) != at || st.src.Name() != src.Name() || st.src.Pos(at).Line != src.Pos(at).Line {
		st = moved(st, src, at)
	}
	c.mu.Lock()
	c.next[k] = st
	c.hits++
	c.mu.Unlock()
	return st
}

// store counts a parsed statement and keeps it when it parsed cleanly.
func (c *Cache) store(k cacheKey, st *Statement, clean bool) {
	c.mu.Lock()
	c.misses++
	if clean && st != nil && !st.Broken {
		c.next[k] = st
	}
	c.mu.Unlock()
}

// moved copies a statement as if it had been parsed at offset at of src:
// every node and token moves by the same number of bytes.
func moved(st *Statement, src *Source, at int) *Statement {
	m := mover{dOff: at - int(st.Tokens[0].Offset), src: src, old: st.Tokens}
	m.toks = make([]Token, len(st.Tokens))
	for i, t := range st.Tokens {
		m.toks[i] = t
		m.toks[i].Offset += int32(m.dOff)
	}
	out := reflect.New(reflect.TypeFor[Statement]())
	m.copyStruct(out.Elem(), reflect.ValueOf(st).Elem())
	return out.Interface().(*Statement)
}

type mover struct {
	dOff      int
	src       *Source
	old, toks []Token // the statement's tokens before and after the move
}

func (m *mover) pos(p lexer.Position) lexer.Position {
	if p.Line == 0 {
		return p
	}
	return m.src.position(p.Offset + m.dOff)
}

// copyStruct copies the syntax-tree struct src into dst, moving positions.
func (m *mover) copyStruct(dst, src reflect.Value) {
	for i := 0; i < src.NumField(); i++ {
		f, d := src.Field(i), dst.Field(i)
		switch {
		case f.Type() == nodeType:
			n := f.Interface().(Node)
			d.Set(reflect.ValueOf(Node{Tokens: m.tokens(n.Tokens), src: m.src}))
		case f.Type() == parsedNodeType:
			n := f.Interface().(ParsedNode)
			d.Set(reflect.ValueOf(ParsedNode{Pos: m.pos(n.Pos), EndPos: m.pos(n.EndPos), Node: Node{Tokens: m.tokens(n.Tokens), src: m.src}}))
		case f.Kind() == reflect.Pointer:
			if !f.IsNil() {
				p := reflect.New(f.Type().Elem())
				m.copyStruct(p.Elem(), f.Elem())
				d.Set(p)
			}
		case f.Kind() == reflect.Slice && f.Type().Elem().Kind() == reflect.Pointer:
			if !f.IsNil() {
				s := reflect.MakeSlice(f.Type(), f.Len(), f.Len())
				for j := 0; j < f.Len(); j++ {
					if e := f.Index(j); !e.IsNil() {
						p := reflect.New(e.Type().Elem())
						m.copyStruct(p.Elem(), e.Elem())
						s.Index(j).Set(p)
					}
				}
				d.Set(s)
			}
		default:
			d.Set(f)
		}
	}
}

// tokens maps a node's tokens, a run of the statement's, onto the moved
// statement's tokens.
func (m *mover) tokens(ts []Token) []Token {
	if cap(ts) == 0 {
		return ts
	}
	off := int(ts[:1][0].Offset)
	i := searchOffset(m.old, off)
	n := max(len(ts), 1) // an empty run keeps the token where it starts
	if i+n > len(m.old) || int(m.old[i].Offset) != off {
		out := make([]Token, n)
		for j, t := range ts[:n] {
			out[j] = t
			out[j].Offset += int32(m.dOff)
		}
		return out[:len(ts)]
	}
	return m.toks[i : i+len(ts) : i+n]
}
