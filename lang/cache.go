package lang

import (
	"reflect"
	"sort"
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

// statementKey is the cache key of the statement made of toks.
func statementKey(src []byte, toks []lexer.Token) (cacheKey, bool) {
	first, last := toks[0].Pos, toks[len(toks)-1]
	end := last.Pos.Offset + len(last.Value)
	if first.Offset < 0 || end > len(src) || first.Offset > end {
		return cacheKey{}, false
	}
	return cacheKey{text: string(src[first.Offset:end]), column: first.Column}, true
}

// lookup returns the cached statement with the key, moved to at.
func (c *Cache) lookup(k cacheKey, at lexer.Position) *Statement {
	c.mu.Lock()
	st := c.last[k]
	if st == nil {
		st = c.next[k]
	}
	c.mu.Unlock()
	if st == nil {
		return nil
	}
	if p := st.Position(); p.Offset != at.Offset || p.Line != at.Line || p.Filename != at.Filename {
		st = moved(st, at)
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

// moved copies a statement as if it had been parsed at position at: every
// node and token keeps its column and moves by the same number of lines
// and bytes.
func moved(st *Statement, at lexer.Position) *Statement {
	p := st.Position()
	m := mover{dOff: at.Offset - p.Offset, dLine: at.Line - p.Line, file: at.Filename, old: st.Tokens}
	m.toks = make([]lexer.Token, len(st.Tokens))
	for i, t := range st.Tokens {
		m.toks[i] = t
		m.toks[i].Pos = m.pos(t.Pos)
	}
	out := reflect.New(reflect.TypeFor[Statement]())
	m.copyStruct(out.Elem(), reflect.ValueOf(st).Elem())
	return out.Interface().(*Statement)
}

type mover struct {
	dOff, dLine int
	file        string
	old, toks   []lexer.Token // the statement's tokens before and after the move
}

func (m *mover) pos(p lexer.Position) lexer.Position {
	p.Offset += m.dOff
	p.Line += m.dLine
	p.Filename = m.file
	return p
}

var (
	nodeType       = reflect.TypeFor[Node]()
	parsedNodeType = reflect.TypeFor[ParsedNode]()
)

// copyStruct copies the syntax-tree struct src into dst, moving positions.
func (m *mover) copyStruct(dst, src reflect.Value) {
	for i := 0; i < src.NumField(); i++ {
		f, d := src.Field(i), dst.Field(i)
		switch {
		case f.Type() == nodeType:
			n := f.Interface().(Node)
			d.Set(reflect.ValueOf(Node{Tokens: m.tokens(n.Tokens)}))
		case f.Type() == parsedNodeType:
			n := f.Interface().(ParsedNode)
			d.Set(reflect.ValueOf(ParsedNode{Pos: m.pos(n.Pos), Node: Node{Tokens: m.tokens(n.Tokens)}}))
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
func (m *mover) tokens(ts []lexer.Token) []lexer.Token {
	if cap(ts) == 0 {
		return ts
	}
	off := ts[:1][0].Pos.Offset
	i := sort.Search(len(m.old), func(i int) bool { return m.old[i].Pos.Offset >= off })
	n := max(len(ts), 1) // an empty run keeps the token where it starts
	if i+n > len(m.old) || m.old[i].Pos.Offset != off {
		out := make([]lexer.Token, n)
		for j, t := range ts[:n] {
			out[j] = t
			out[j].Pos = m.pos(t.Pos)
		}
		return out[:len(ts)]
	}
	return m.toks[i : i+len(ts) : i+n]
}
