package network

import (
	"bytes"
	"fmt"
	"testing"
)

// TestLoadCachedMatchesLoad loads a generated network through parse
// caches, edits one reaction line (unbalancing it), and checks that each
// load reports exactly what a fresh Load does.
func TestLoadCachedMatchesLoad(t *testing.T) {
	root, src, _ := synthSource(t, 100, 300)
	caches := NewParseCaches()
	same := func() {
		t.Helper()
		got, want := Load(root, src, Options{Caches: caches}), Load(root, src, Options{})
		if fmt.Sprint(got.Diagnostics) != fmt.Sprint(want.Diagnostics) {
			t.Fatalf("cached load reports\n %v\nfresh load\n %v", got.Diagnostics, want.Diagnostics)
		}
		if len(got.Reactions) != len(want.Reactions) || len(got.Species) != len(want.Species) {
			t.Fatalf("cached load has %d reactions and %d species, fresh %d and %d",
				len(got.Reactions), len(got.Species), len(want.Reactions), len(want.Species))
		}
	}
	same()
	name := "/syn/reactions-1.hess"
	src[name] = bytes.Replace(src[name], []byte("reaction r2: "), []byte("reaction r2: 2 "), 1)
	same()
	n := Load(root, src, Options{Caches: caches})
	found := false
	for _, d := range n.Diagnostics {
		found = found || d.Code == "element-imbalance"
	}
	if !found {
		t.Error("the edited reaction does not show as unbalanced")
	}
	if whole := caches.file(PathID(name)).whole; whole != 1 {
		t.Errorf("third load of an unchanged file took its last parse whole %d times, want 1", whole)
	}
	hits, parsed := caches.file(PathID(name)).stmts.Reused()
	if parsed != 1 || hits == 0 {
		t.Errorf("the load of the edited file parsed %d statements and reused %d, want 1 parsed", parsed, hits)
	}
}

// TestParseCachesRetain drops the caches of files not kept.
func TestParseCachesRetain(t *testing.T) {
	root, src, _ := synthSource(t, 50, 100)
	caches := NewParseCaches()
	n := Load(root, src, Options{Caches: caches})
	if caches.Len() != len(n.Files) {
		t.Fatalf("%d caches for %d files", caches.Len(), len(n.Files))
	}
	keep := PathID(root)
	caches.Retain(func(path string) bool { return path == keep })
	if caches.Len() != 1 {
		t.Errorf("%d caches after keeping the root's alone", caches.Len())
	}
	var none *ParseCaches
	none.Retain(func(string) bool { return false })
	if none.Len() != 0 {
		t.Error("nil caches hold something")
	}
}
