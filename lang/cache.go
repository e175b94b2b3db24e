package lang

import "sync"

// A Cache keeps the statements of a file's last parse, keyed by their
// source text, so that parsing the file again after an edit re-parses only
// the statements whose text changed. A statement found again at another
// place is a copy moved there; one found at the same place is shared with
// the earlier parse, so the trees a Cache hands out must not be modified.
// A Cache serves one file, one parse at a time; it keeps only what the
// latest parse used.
type Cache struct {
	mu sync.Mutex
	// prev is what the latest parse gave, for re-parsing an edit of its
	// text (reparse.go).
	prev *lastParse
	// last holds the statements a parse may take by text, next those it
	// took or parsed so far; both are set only during a parse.
	last    map[cacheKey]*Statement
	next    map[cacheKey]*Statement
	hits    int  // statements reused by the latest parse
	misses  int  // statements it parsed
	gen     int  // parses made through the cache
	lexed   int  // bytes the latest parse lexed, for tests
	partial bool // the latest parse was a re-parse (reparse.go), for tests
}

// maxSourceAge is how many parses a statement shared in place may stay
// with the text of the parse that made it. A shared statement keeps that
// whole text alive (its tokens are slices of it), so after edits all over
// a file every parse's text would stay alive; one older than this is
// copied onto the latest text instead, which bounds the texts kept to
// maxSourceAge+1 and copies each unchanged statement once every
// maxSourceAge parses.
const maxSourceAge = 8

// outlived reports whether a statement resolving through s, shared into
// the parse of latest, is to be copied onto latest's text instead (see
// maxSourceAge).
func (s *Source) outlived(latest *Source) bool { return s.gen+maxSourceAge < latest.gen }

// generation is the number of the parse under way.
func (c *Cache) generation() int {
	c.mu.Lock()
	defer c.mu.Unlock()
	return c.gen
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
// storing the new ones; a nil cache parses everything. A text that is an
// edit of the one the cache last parsed is lexed and parsed only where
// the edit touched it (reparse.go).
func ParseCached(file string, src []byte, c *Cache) (*File, Diagnostics) {
	return ParseCachedText(file, string(src), c)
}

// ParseCachedText is ParseCached of a text given as a string, which the
// syntax tree keeps without copying it.
func ParseCachedText(file, text string, c *Cache) (*File, Diagnostics) {
	if c == nil {
		return ParseText(file, text)
	}
	c.mu.Lock()
	c.gen++
	c.hits, c.misses = 0, 0
	c.mu.Unlock()
	if len(text) > MaxSourceBytes {
		c.prev = nil
		return ParseText(file, text)
	}
	var source *Source
	var edit textEdit // where text differs from the last parse's
	if c.prev != nil && c.prev.src.Name() == file {
		old := c.prev.src.text
		edit.prefix = commonPrefix(old, text)
		edit.suffix = commonSuffix(old[edit.prefix:], text[edit.prefix:])
		source = c.prev.src.edited(text, edit)
	} else {
		source = NewSource(file, text)
	}
	source.gen = c.generation()
	if f, diags, ok := c.reparse(source, edit); ok {
		return f, diags
	}
	keys := map[cacheKey]*Statement{}
	if c.prev != nil {
		for _, ch := range c.prev.chunks {
			if k, ok := recordKey(ch); ok {
				keys[k] = ch.st
			}
		}
	}
	c.mu.Lock()
	c.last, c.next, c.hits, c.misses = keys, make(map[cacheKey]*Statement, len(keys)), 0, 0
	c.mu.Unlock()
	f, diags, last := parseSource(source, c)
	c.lexed, c.partial = len(text), false
	c.mu.Lock()
	c.prev, c.last, c.next = last, nil, nil
	c.mu.Unlock()
	return f, diags
}

// count counts a statement the latest parse reused (hit) or parsed.
func (c *Cache) count(hit bool) {
	c.mu.Lock()
	if hit {
		c.hits++
	} else {
		c.misses++
	}
	c.mu.Unlock()
}

// statementKey is the cache key of the statement made of toks, tokens
// of src.
func statementKey(src *Source, toks []Token) (cacheKey, bool) {
	text, ok := src.textOf(toks)
	if !ok {
		return cacheKey{}, false
	}
	return cacheKey{text: text, column: src.Pos(int(toks[0].Offset)).Column}, true
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
	if first, _ := st.at(); int(first.Offset) != at || st.Source().Name() != src.Name() || st.Source().Pos(at).Line != src.Pos(at).Line ||
		st.Source().outlived(src) {
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
