package lang

import (
	"bytes"
	"fmt"
	"math/rand/v2"
	"reflect"
	"slices"
	"strings"
	"testing"
	"unsafe"
)

// checkReparse parses src through the cache and whole, and fails unless
// the trees, the diagnostics and the comments are the same.
func checkReparse(t testing.TB, c *Cache, src []byte) {
	t.Helper()
	got, gotDiags := ParseCached("f.hess", src, c)
	want, wantDiags := Parse("f.hess", src)
	if fmt.Sprint(gotDiags) != fmt.Sprint(wantDiags) {
		t.Fatalf("diagnostics differ\n got  %v\n want %v\ntext:\n%s", gotDiags, wantDiags, src)
	}
	if len(got.Statements) != len(want.Statements) {
		t.Fatalf("%d statements, want %d\ntext:\n%s", len(got.Statements), len(want.Statements), src)
	}
	for i := range got.Statements {
		if !sameTree(reflect.ValueOf(got.Statements[i]), reflect.ValueOf(want.Statements[i])) {
			t.Fatalf("statement %d at %v differs from a fresh parse\ntext:\n%s", i, want.Statements[i].Position(), src)
		}
		if got.Statements[i].Source().Text()[got.Statements[i].Span().Start.Offset:got.Statements[i].Span().End.Offset] != got.Statements[i].Text() {
			t.Fatalf("statement %d does not resolve through its own text", i)
		}
	}
	if msg := sourceDiff(got.Source, want.Source); msg != "" {
		t.Fatalf("the source's index differs from a fresh one: %s\ntext:\n%s", msg, src)
	}
	if !reflect.DeepEqual(got.Comments, want.Comments) {
		t.Fatalf("comments differ\n got  %v\n want %v\ntext:\n%s", got.Comments, want.Comments, src)
	}
	for _, cm := range got.Comments {
		if !sameString(cm.Text, got.Source.Text()[cm.Span.Start.Offset:]) {
			t.Fatalf("comment %q is not a slice of the latest text", cm.Text)
		}
	}
}

// sameString reports whether s starts at the first byte of t.
func sameString(s, t string) bool {
	return len(s) == 0 || (strings.HasPrefix(t, s) && unsafeData(s) == unsafeData(t))
}

// editPieces are what the random edits insert: statement keywords, braces
// and line ends that move statement boundaries, strings and comments that
// run to the end of the line, a keyword cut short, non-ASCII text, and
// now and then a byte the lexer reports.
var editPieces = []string{
	"\n", "\n", " ", "{", "}", "{\n", "}\n", ":", "2 ", "x", "H2O(g)", " + ", "<->", "->",
	"reaction ", "reaction r: A(g) <-> B(g)\n", "species ", "species Q(g) { hf 1 kJ/mol }\n", "mixture m {\n",
	"reac", "spec", "#", "# note\n", "\"", "\"text\"", "±", "é", "\r\n", "\t", "1.5e3", "kJ/mol", "include ",
}

// randomEdit deletes up to 12 bytes at a random place of src and inserts
// up to three pieces there; hostile adds a byte the lexer reports.
func randomEdit(r *rand.Rand, src []byte, hostile bool) []byte {
	at := r.IntN(len(src) + 1)
	del := min(r.IntN(13), len(src)-at)
	if r.IntN(3) == 0 {
		del = 0
	}
	var ins []byte
	for range r.IntN(4) {
		ins = append(ins, editPieces[r.IntN(len(editPieces))]...)
	}
	if hostile {
		ins = append(ins, "\xff\x01"[r.IntN(2)])
	}
	out := append([]byte(nil), src[:at]...)
	out = append(out, ins...)
	return append(out, src[at+del:]...)
}

// TestReparseMatchesParse makes random edits, one after the other, to
// texts with every kind of statement, comments, blocks, a byte order
// mark and CR LF line ends, and checks after each that parsing through
// the cache gives what parsing the whole text does; it also checks that
// most edits were re-parsed only where they touched the text.
func TestReparseMatchesParse(t *testing.T) {
	gen, _ := generateNetwork(12 << 10)
	bases := map[string][]byte{
		"generated":  gen,
		"bom-crlf":   append([]byte("\ufeff"), bytes.ReplaceAll(gen[:4<<10], []byte("\n"), []byte("\r\n"))...),
		"one-line":   []byte("species A(g) { hf 1 kJ/mol } species B(g) { hf 2 kJ/mol } reaction r: A(g) <-> B(g) reaction s: B(g) -> A(g) { rate A 1 1/s n 0 Ea 1 kJ/mol }\n"),
		"bad-runs":   []byte(strings.Repeat("species A(g) { hf 1 kJ/mol }\n\xff\x01 x\n", 60)),
		"near-limit": []byte(strings.Repeat("species A(g) { hf 1 kJ/mol }\n\xff\x01 x\n", 49)),
		"all-broken": []byte(strings.Repeat("reaction r: A(g) <->\nspecies B(g) { hf }\n", 200)),
		"broken":     []byte("species A(g) {\n  hf 1\nreaction r: A(g) <-> \nspecies é(g) { s 1 J/mol/K }\n# c\njunk words here\nmixture m {\n  A(g) 1\n}\nreaction q A(g)\n"),
	}
	for name, base := range bases {
		t.Run(name, func(t *testing.T) {
			r := rand.New(rand.NewPCG(1, uint64(len(base))))
			c := NewCache()
			src := base
			checkReparse(t, c, src)
			short := 0
			const edits = 400
			for i := range edits {
				// Now and then a byte the lexer reports as a bad run,
				// after which the file is parsed whole until the text
				// starts over.
				src = randomEdit(r, src, i%100 == 90)
				if len(src) > 3*len(base) || i%100 == 99 {
					src = base
				}
				checkReparse(t, c, src)
				if c.partial {
					short++
				}
			}
			// A tenth of the edits come after a bad run, and a few touch
			// the first statement; past 100 runs of invalid characters,
			// every parse is whole.
			if !strings.HasSuffix(name, "runs") && !strings.HasSuffix(name, "limit") && short < edits*3/4 {
				t.Errorf("only %d of %d edits were re-parsed where they touched the text", short, edits)
			}
			t.Logf("%d of %d edits re-parsed", short, edits)
		})
	}
}

// TestReparseLexesOnlyTheEdit checks that one-line edits in the middle of
// a large file lex a few hundred bytes and parse one statement, and that
// the statements before and after are the old ones, in place or moved.
func TestReparseLexesOnlyTheEdit(t *testing.T) {
	src, n := generateNetwork(256 << 10)
	c := NewCache()
	first, _ := ParseCached("f.hess", src, c)
	mid := bytes.Index(src[len(src)/2:], []byte("\nreaction r")) + len(src)/2 + 1
	colon := mid + bytes.IndexByte(src[mid:], ':') + 2
	for _, e := range []struct {
		name string
		text []byte
	}{
		{"same length", append(append(append([]byte(nil), src[:colon]...), 'Z'), src[colon+1:]...)},
		{"insert", append(append(append([]byte(nil), src[:colon]...), "2 "...), src[colon:]...)},
		{"undo", src},
	} {
		f, _ := ParseCached("f.hess", e.text, c)
		hits, parsed := c.Reused()
		if c.lexed > 1000 || parsed != 1 || hits != n-1 {
			t.Errorf("%s: lexed %d bytes, parsed %d statements, reused %d; want < 1000, 1 and %d", e.name, c.lexed, parsed, hits, n-1)
		}
		if f.Statements[0] != first.Statements[0] {
			t.Errorf("%s: the first statement was not shared", e.name)
		}
		checkReparse(t, NewCache(), e.text)
	}
}

// FuzzReparse parses a text, then an edit of it, through one cache, and
// checks the second parse against a parse of the whole edited text.
func FuzzReparse(f *testing.F) {
	gen, _ := generateNetwork(2 << 10)
	f.Add(string(gen), uint16(300), uint8(3), "2 ")
	f.Add(string(gen), uint16(0), uint8(0), "reaction ")
	f.Add("species A(g) { hf 1 kJ/mol }\nreaction r: A(g) <-> B(g)\n", uint16(13), uint8(1), "}\nspecies ")
	f.Add("reaction r: A(g) <-> B(g) { dg 1 kJ/mol }\n# c\nreaction s: B(g) <-> C(g)\n", uint16(40), uint8(2), "\"")
	f.Fuzz(func(t *testing.T, base string, at uint16, del uint8, ins string) {
		if len(base) > 1<<16 || len(ins) > 256 {
			return
		}
		c := NewCache()
		ParseCached("f.hess", []byte(base), c)
		i := min(int(at), len(base))
		j := min(i+int(del), len(base))
		checkReparse(t, c, []byte(base[:i]+ins+base[j:]))
	})
}

// unsafeData is the address of the first byte of s.
func unsafeData(s string) *byte { return unsafe.StringData(s) }

// TestLineageFollowsMovedStatements checks that a statement an edit moved
// keeps its Lineage, that one in place is the same statement, and that a
// statement parsed anew has a Lineage no other has.
func TestLineageFollowsMovedStatements(t *testing.T) {
	src, _ := generateNetwork(32 << 10)
	c := NewCache()
	before, _ := ParseCached("f.hess", src, c)
	mid := bytes.Index(src[len(src)/2:], []byte("\nreaction ")) + len(src)/2 + 1
	edited := append(append(append([]byte(nil), src[:mid]...), "reaction new: A(g) <-> B(g)\n"...), src[mid:]...)
	after, _ := ParseCached("f.hess", edited, c)
	if len(after.Statements) != len(before.Statements)+1 {
		t.Fatalf("%d statements, want %d", len(after.Statements), len(before.Statements)+1)
	}
	seen := map[uint64]bool{}
	for _, st := range before.Statements {
		if seen[st.Lineage()] || st.Lineage() == 0 {
			t.Fatalf("lineage %d given twice or zero", st.Lineage())
		}
		seen[st.Lineage()] = true
	}
	inserted := 0
	for i, st := range after.Statements {
		switch {
		case st.Text() == "reaction new: A(g) <-> B(g)":
			inserted = i
			if seen[st.Lineage()] {
				t.Errorf("the new statement has an old statement's lineage")
			}
		case inserted == 0:
			if st != before.Statements[i] {
				t.Errorf("statement %d before the edit is not the one of the last parse", i)
			}
		default:
			old := before.Statements[i-1]
			if st == old || st.Lineage() != old.Lineage() || st.Text() != old.Text() {
				t.Errorf("statement %d after the edit: moved %v, lineage %d, want a moved copy of lineage %d", i, st != old, st.Lineage(), old.Lineage())
			}
		}
	}
	if inserted == 0 {
		t.Fatal("the inserted statement is not there")
	}
}

// sourceDiff says how two sources' names, texts and indexes differ ("" when
// they do not).
func sourceDiff(a, b *Source) string {
	switch {
	case a.name != b.name || a.text != b.text:
		return "name or text"
	case !slices.Equal(a.lines, b.lines):
		return fmt.Sprintf("lines %v, want %v", a.lines, b.lines)
	case !slices.Equal(a.wide, b.wide):
		return fmt.Sprintf("wide %b, want %b", a.wide, b.wide)
	case !slices.Equal(a.marks, b.marks):
		return fmt.Sprintf("marks %v, want %v", a.marks, b.marks)
	}
	return ""
}

// TestEditedSourceMatchesNew makes random edits to texts with CR LF line
// ends, lines beyond ASCII, a byte order mark and long lines, and checks
// that each edited source indexes its text as a new one does.
func TestEditedSourceMatchesNew(t *testing.T) {
	gen, _ := generateNetwork(8 << 10)
	long := strings.Repeat("x", markEvery+10)
	bases := []string{
		string(gen),
		"\ufeff" + strings.ReplaceAll(string(gen[:2000]), "\n", "\r\n"),
		"a é b\nline two ±\n\nthree\n" + string(gen[:1000]),
		"first\n" + long + "\nafter é\n" + long + "é\nend",
		"",
		"\n\n\n",
	}
	pieces := []string{"\n", "é", "x", "\r\n", "±±", long, "ab\ncd", ""}
	for bi, base := range bases {
		r := rand.New(rand.NewPCG(7, uint64(bi)))
		s := NewSource("f", base)
		for range 300 {
			text := s.text
			at := r.IntN(len(text) + 1)
			del := min(r.IntN(20), len(text)-at)
			next := text[:at] + pieces[r.IntN(len(pieces))] + pieces[r.IntN(len(pieces))] + text[at+del:]
			p := commonPrefix(text, next)
			e := s.edited(next, textEdit{prefix: p, suffix: commonSuffix(text[p:], next[p:])})
			if msg := sourceDiff(e, NewSource("f", next)); msg != "" {
				t.Fatalf("base %d: %s\nbefore %q\nafter %q", bi, msg, text, next)
			}
			s = e
			if len(s.text) > 4*len(base)+3*len(long) {
				s = NewSource("f", base)
			}
		}
	}
}

// TestCommonPrefixSuffix checks commonPrefix and commonSuffix against a
// byte-by-byte count, around the block size they compare by.
func TestCommonPrefixSuffix(t *testing.T) {
	r := rand.New(rand.NewPCG(3, 4))
	for range 2000 {
		n := r.IntN(3 * compareBlock)
		a := make([]byte, n)
		for i := range a {
			a[i] = byte('a' + r.IntN(2))
		}
		b := slices.Clone(a)
		if n > 0 && r.IntN(4) > 0 {
			b[r.IntN(n)] ^= 1
		}
		b = b[:r.IntN(n+1)]
		p, s := 0, 0
		for p < min(len(a), len(b)) && a[p] == b[p] {
			p++
		}
		for s < min(len(a), len(b)) && a[len(a)-1-s] == b[len(b)-1-s] {
			s++
		}
		if got := commonPrefix(string(a), string(b)); got != p {
			t.Fatalf("commonPrefix(%q, %q) = %d, want %d", a, b, got, p)
		}
		if got := commonSuffix(string(a), string(b)); got != s {
			t.Fatalf("commonSuffix(%q, %q) = %d, want %d", a, b, got, s)
		}
	}
}

// TestReparseManyBrokenStatements edits a file of 40 000 statements that
// do not parse: those after the edit would all be lexed again, more than
// maxReparseWindow bytes, so the file is parsed whole (in parallel), and
// still as a whole parse gives.
func TestReparseManyBrokenStatements(t *testing.T) {
	src := []byte(strings.Repeat("reaction r: A(g) <->\nspecies B(g) { hf }\n", 20000))
	c := NewCache()
	checkReparse(t, c, src)
	at := bytes.Index(src, []byte("<->")) + 3
	edited := append(append(append([]byte(nil), src[:at]...), " C(g)"...), src[at:]...)
	checkReparse(t, c, edited)
	if c.partial {
		t.Errorf("re-parsed %d bytes where the whole file had to be", c.lexed)
	}
	// An edit at the end lexes only the last statements.
	edited = append(edited, "reaction s: A(g) <-> B(g)\n"...)
	checkReparse(t, c, edited)
	if !c.partial || c.lexed > 1000 {
		t.Errorf("lexed %d bytes (re-parse %v) for a statement added at the end", c.lexed, c.partial)
	}
}

// TestReparseLargeEditParsesWhole changes the first and the last
// statement of a 512 kB file in one edit: the edit spans more than
// maxReparseWindow, so the file is parsed whole (in parallel) rather than
// lexed on one goroutine.
func TestReparseLargeEditParsesWhole(t *testing.T) {
	src, _ := generateNetwork(512 << 10)
	c := NewCache()
	checkReparse(t, c, src)
	first := bytes.Index(src, []byte("species S")) + len("species S")
	last := bytes.LastIndex(src, []byte("reaction r")) + len("reaction r")
	edited := bytes.Clone(src)
	edited[first], edited[last] = 'Z', 'Z'
	checkReparse(t, c, edited)
	if c.partial {
		t.Errorf("an edit of %d bytes was re-parsed on one goroutine", last-first)
	}
	// A small edit after it is re-parsed again.
	edited[last] = 'Y'
	checkReparse(t, c, edited)
	if !c.partial {
		t.Error("a one-byte edit was parsed whole")
	}
}
