package network

import (
	"sync"

	"hess/lang"
)

// ParseCaches keeps each file's parsed statements between loads (see
// lang.Cache), so that loading a network again after an edit re-parses
// only the statements that changed. It is safe for concurrent use; each
// file's cache serves one load at a time.
type ParseCaches struct {
	mu    sync.Mutex
	files map[string]*lang.Cache // by file identity
}

// NewParseCaches returns empty caches.
func NewParseCaches() *ParseCaches { return &ParseCaches{files: map[string]*lang.Cache{}} }

// file returns the cache of the file with the given identity; nil caches
// give nil.
func (p *ParseCaches) file(id string) *lang.Cache {
	if p == nil {
		return nil
	}
	p.mu.Lock()
	defer p.mu.Unlock()
	c := p.files[id]
	if c == nil {
		c = lang.NewCache()
		p.files[id] = c
	}
	return c
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
