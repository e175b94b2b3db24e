package lsp

import (
	"strings"
	"testing"
)

func TestStoreEdits(t *testing.T) {
	s := newStore()
	const uri = "file:///tmp/x.hess"
	s.open(uri, "/tmp/x.hess", 1, []byte("species A(g) \"𝑂\"\nreaction r: A(g) ⇌ B(g)\n"))
	text := func() string {
		d, _ := s.get("/tmp/x.hess")
		return string(d.text)
	}
	// Two changes in one notification apply in order, each to the result
	// of the one before.
	err := s.edit(uri, 2, []TextDocumentContentChangeEvent{
		{Range: &Range{Start: pos(1, 17), End: pos(1, 18)}, Text: "<->"},  // replaces ⇌
		{Range: &Range{Start: pos(0, 16), End: pos(0, 16)}, Text: " gas"}, // after 𝑂: two units
	}, encUTF16)
	if err != nil {
		t.Fatal(err)
	}
	if want := "species A(g) \"𝑂 gas\"\nreaction r: A(g) <-> B(g)\n"; text() != want {
		t.Errorf("after edits: %q, want %q", text(), want)
	}
	// The same edit in UTF-8 units.
	if err := s.edit(uri, 3, []TextDocumentContentChangeEvent{{Range: &Range{Start: pos(0, 18), End: pos(0, 22)}, Text: ""}}, encUTF8); err != nil {
		t.Fatal(err)
	}
	if want := "species A(g) \"𝑂\"\nreaction r: A(g) <-> B(g)\n"; text() != want {
		t.Errorf("after a UTF-8 edit: %q, want %q", text(), want)
	}
	// A change without a range replaces the whole text.
	if err := s.edit(uri, 4, []TextDocumentContentChangeEvent{{Text: "species B(g)\n"}}, encUTF16); err != nil {
		t.Fatal(err)
	}
	if text() != "species B(g)\n" {
		t.Errorf("after a full change: %q", text())
	}
	// Stale versions, backwards ranges and unknown documents are refused
	// and change nothing.
	for _, c := range []struct {
		uri     string
		version int32
		change  TextDocumentContentChangeEvent
		msg     string
	}{
		{uri, 4, TextDocumentContentChangeEvent{Text: "x"}, "already held"},
		{uri, 3, TextDocumentContentChangeEvent{Text: "x"}, "already held"},
		{uri, 5, TextDocumentContentChangeEvent{Range: &Range{Start: pos(0, 5), End: pos(0, 2)}}, "ends before it starts"},
		{"file:///tmp/other.hess", 9, TextDocumentContentChangeEvent{Text: "x"}, "not open"},
	} {
		err := s.edit(c.uri, c.version, []TextDocumentContentChangeEvent{c.change}, encUTF16)
		if err == nil || !strings.Contains(err.Error(), c.msg) {
			t.Errorf("edit %+v: %v, want an error about %q", c, err, c.msg)
		}
	}
	if d, _ := s.get("/tmp/x.hess"); string(d.text) != "species B(g)\n" || d.version != 4 {
		t.Errorf("refused edits changed the document: %q v%d", d.text, d.version)
	}
	// Ranges past the end clamp to the end.
	if err := s.edit(uri, 6, []TextDocumentContentChangeEvent{{Range: &Range{Start: pos(7, 0), End: pos(9, 9)}, Text: "# end\n"}}, encUTF16); err != nil {
		t.Fatal(err)
	}
	if text() != "species B(g)\n# end\n" {
		t.Errorf("edit past the end: %q", text())
	}
}

func TestFormatEdits(t *testing.T) {
	cases := []struct{ old, formatted string }{
		{"a\nb  c\nd\n", "a\nb c\nd\n"},
		{"x\n", "y\n"},
		{"same\n", "same\n"},
		{"a\nb\n", "a\nb\nc\n"},
		{"a\nb\nc\n", "a\nc\n"},
		{"é ⇌\nq\n", "é <->\nq\n"},
		{"", "x\n"},
		{"aaa\n", "aa\n"},
	}
	for _, c := range cases {
		edits := formatEdits([]byte(c.old), []byte(c.formatted), encUTF16)
		if c.old == c.formatted && len(edits) != 0 {
			t.Errorf("%q: edits %+v for a formatted text", c.old, edits)
		}
		if got := applyEdits(t, c.old, edits); got != c.formatted {
			t.Errorf("%q with %+v gives %q, want %q", c.old, edits, got, c.formatted)
		}
	}
}

// TestStoreEditAfterSave checks that a text sent with a save replaces the
// line index kept from the edits before it: an edit after the save finds
// its range in the saved text.
func TestStoreEditAfterSave(t *testing.T) {
	s := newStore()
	const uri = "file:///tmp/x.hess"
	s.open(uri, "/tmp/x.hess", 1, []byte("species A(g)\nspecies B(g)\n"))
	if err := s.edit(uri, 2, []TextDocumentContentChangeEvent{{Range: &Range{Start: pos(1, 8), End: pos(1, 9)}, Text: "C"}}, encUTF16); err != nil {
		t.Fatal(err)
	}
	saved := "# header line\n\nspecies A(g)\nspecies C(g)\n"
	s.saved(uri, &saved)
	if err := s.edit(uri, 3, []TextDocumentContentChangeEvent{{Range: &Range{Start: pos(3, 8), End: pos(3, 9)}, Text: "D"}}, encUTF16); err != nil {
		t.Fatal(err)
	}
	if d, _ := s.get("/tmp/x.hess"); string(d.text) != "# header line\n\nspecies A(g)\nspecies D(g)\n" {
		t.Errorf("after a save and an edit: %q", d.text)
	}
}
