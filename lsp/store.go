package lsp

import (
	"fmt"
	"sort"
	"sync"
)

// document is one open editor buffer.
type document struct {
	uri     string
	path    string // clean absolute path
	version int32
	text    []byte
	ix      *lines // text's line index, kept from edit to edit; nil until an edit builds it
}

// store holds the open documents. Every method is safe for concurrent use;
// documents are copied in and out, never shared.
type store struct {
	mu     sync.Mutex
	docs   map[string]*document // by path
	byURI  map[string]string    // URI -> path
	change uint64               // counts every open, close and save
}

func newStore() *store {
	return &store{docs: map[string]*document{}, byURI: map[string]string{}}
}

// open adds or replaces a document.
func (s *store) open(uri, path string, version int32, text []byte) {
	s.mu.Lock()
	defer s.mu.Unlock()
	if old, ok := s.docs[path]; ok && old.uri != uri {
		delete(s.byURI, old.uri)
	}
	s.docs[path] = &document{uri: uri, path: path, version: version, text: text}
	s.byURI[uri] = path
	s.change++
}

// close removes a document; it reports whether it was open.
func (s *store) close(uri string) (string, bool) {
	s.mu.Lock()
	defer s.mu.Unlock()
	path, ok := s.byURI[uri]
	if !ok {
		return "", false
	}
	delete(s.byURI, uri)
	delete(s.docs, path)
	s.change++
	return path, true
}

// saved notes that a document was written to disk, with its text when the
// client sent it.
func (s *store) saved(uri string, text *string) bool {
	s.mu.Lock()
	defer s.mu.Unlock()
	path, ok := s.byURI[uri]
	if !ok {
		return false
	}
	if text != nil {
		s.docs[path].text, s.docs[path].ix = []byte(*text), nil
	}
	s.change++
	return true
}

// edit applies changes to a document at a newer version. A version that is
// not newer than the one held is refused, and so is a change whose range
// cannot be read; the document is then left as it was.
func (s *store) edit(uri string, version int32, changes []TextDocumentContentChangeEvent, enc encoding) error {
	s.mu.Lock()
	defer s.mu.Unlock()
	path, ok := s.byURI[uri]
	if !ok {
		return fmt.Errorf("change to %s, which is not open", uri)
	}
	doc := s.docs[path]
	if version <= doc.version {
		return fmt.Errorf("change to %s at version %d, but version %d is already held", uri, version, doc.version)
	}
	text, ix := doc.text, doc.ix
	for i, c := range changes {
		if c.Range == nil {
			text, ix = []byte(c.Text), nil
			continue
		}
		if ix == nil || !sameBytes(ix.text, text) {
			ix = newLines(text)
		}
		from, to := ix.offset(c.Range.Start, enc), ix.offset(c.Range.End, enc)
		if from > to {
			return fmt.Errorf("change %d to %s at version %d: range ends before it starts", i+1, uri, version)
		}
		next := make([]byte, 0, len(text)-(to-from)+len(c.Text))
		next = append(next, text[:from]...)
		next = append(next, c.Text...)
		next = append(next, text[to:]...)
		text, ix = next, ix.edited(next, from, to, len(c.Text))
	}
	doc.text, doc.version, doc.ix = text, version, ix
	return nil
}

// get returns a copy of the document at path.
func (s *store) get(path string) (document, bool) {
	s.mu.Lock()
	defer s.mu.Unlock()
	d, ok := s.docs[path]
	if !ok {
		return document{}, false
	}
	return *d, true
}

// pathOf returns the path of an open document's URI.
func (s *store) pathOf(uri string) (string, bool) {
	s.mu.Lock()
	defer s.mu.Unlock()
	p, ok := s.byURI[uri]
	return p, ok
}

// snapshot returns every open document (sorted by path) and the count of
// opens, closes and saves so far.
func (s *store) snapshot() ([]document, uint64) {
	s.mu.Lock()
	defer s.mu.Unlock()
	out := make([]document, 0, len(s.docs))
	for _, d := range s.docs {
		out = append(out, *d)
	}
	sort.Slice(out, func(i, j int) bool { return out[i].path < out[j].path })
	return out, s.change
}

// invalidate counts as a change of what networks read from disk (the
// workspace folders changed), so no compiled network is reused.
func (s *store) invalidate() {
	s.mu.Lock()
	defer s.mu.Unlock()
	s.change++
}
