package network

import (
	"bytes"
	"sync"
	"unsafe"

	"hess/lang"
)

// ParseCaches keeps each file's parse between loads, so that loading a
// network again after an edit re-reads only what changed: a file whose
// path and text are exactly those of its last parse takes that parse
// whole (syntax tree and diagnostics, nothing lexed), and a file whose
// text changed re-parses only the statements whose text changed (see
// lang.Cache). It also keeps each root's compiled reactions, which a load
// reuses for the statements that did not change while the declared
// species did not (reuse.go). It is safe for concurrent use; each file's cache serves one
// load at a time. The text a Source returns must not change afterwards
// (Disk and Overlay return text that does not).
type ParseCaches struct {
	mu    sync.Mutex
	files map[string]*fileParse   // by file identity
	memos map[string]*compileMemo // compiled reactions, by root identity (reuse.go)
}

// fileParse is one file's cache: its statements, and its last parse with
// the path and text it was of.
type fileParse struct {
	stmts *lang.Cache

	mu    sync.Mutex
	path  string
	text  []byte
	ast   *lang.File
	diags lang.Diagnostics
	whole int // parses taken whole, for tests
}

// NewParseCaches returns empty caches.
func NewParseCaches() *ParseCaches { return &ParseCaches{files: map[string]*fileParse{}} }

// file returns the cache of the file with the given identity; nil caches
// give nil.
func (p *ParseCaches) file(id string) *fileParse {
	if p == nil {
		return nil
	}
	p.mu.Lock()
	defer p.mu.Unlock()
	c := p.files[id]
	if c == nil {
		c = &fileParse{stmts: lang.NewCache()}
		p.files[id] = c
	}
	return c
}

// parse parses a file's text as lang.ParseCached does, taking the last
// parse whole when path and text are the same; a nil cache parses
// everything. The tree and diagnostics may be shared with earlier loads
// and must not be modified.
func (c *fileParse) parse(path string, text []byte) (*lang.File, lang.Diagnostics) {
	if c == nil {
		return lang.ParseText(path, inPlace(text))
	}
	c.mu.Lock()
	defer c.mu.Unlock()
	if c.ast != nil && c.path == path && bytes.Equal(c.text, text) {
		c.whole++
		return c.ast, c.diags
	}
	ast, diags := lang.ParseCachedText(path, inPlace(text), c.stmts)
	c.path, c.text, c.ast, c.diags = path, text, ast, diags
	return ast, diags
}

// Retain drops the caches of the files for whose path keep is false, so
// that files no longer read stop holding their parsed statements. Paths
// are compared as Load identifies files (absolute and clean).
func (p *ParseCaches) Retain(keep func(path string) bool) {
	if p == nil {
		return
	}
	p.mu.Lock()
	defer p.mu.Unlock()
	for id := range p.files {
		if !keep(id) {
			delete(p.files, id)
		}
	}
	for id := range p.memos {
		if !keep(id) {
			delete(p.memos, id)
		}
	}
}

// Len reports how many files' caches are held.
func (p *ParseCaches) Len() int {
	if p == nil {
		return 0
	}
	p.mu.Lock()
	defer p.mu.Unlock()
	return len(p.files)
}

// inPlace is text as a string without copying it: a Source's bytes never
// change once read (see Source), so the syntax tree may keep them as the
// network does, rather than a second copy of every file.
func inPlace(text []byte) string {
	if len(text) == 0 {
		return ""
	}
	return unsafe.String(&text[0], len(text))
}
