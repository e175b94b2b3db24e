package lang

import (
	"sort"
)

// Re-parsing an edit. An editor's change touches a few statements of a
// file: the cache keeps its last parse (lastParse: each statement's place,
// tree and diagnostics, the comments), and a parse of an edited text lexes
// only from the statement the edit starts in to the first statement after
// it that starts where an old one did (shifted by the edit's length):
// from there on the lexer reads the same bytes in the same state as
// before, so the old statements are the statements, moved. Statements
// before the edit are the old ones in place. What comes out is exactly
// what parsing the whole text gives (TestReparseMatchesParse,
// FuzzReparse).
//
// Why the cut points are safe: a statement starts at a statement keyword
// that stands at brace depth 0 or first on its line, and the lexer's only
// state between tokens is whether a token already stood on the current
// line. A statement whose first token, and the byte after it, come before
// the first changed byte starts in the new text exactly where it did,
// with the same first token, because everything the lexer read to get
// there is unchanged; lexing from it with that token's FirstOnLine is
// lexing the whole text from there. After the edit, a statement the new
// lexing starts at offset X, where the text from X on is the old text
// from X-d on (d the change in length) and where an old statement
// started with the same FirstOnLine, is the old statement shifted: each
// statement's brace depth starts at 0, and the bytes and state from there
// are the same. Every diagnostic of the lexer belongs to the statement
// whose text holds it, and such statements are lexed again; the one state
// of the lexer that spans statements is its count of runs of invalid
// characters, which it reports only up to maxLexDiagnostics: a re-parse
// counts on from the runs before the edit, and a text where the lexer
// reached the limit is parsed whole next time.

// lastParse is what a Cache keeps of its latest parse for re-parsing an
// edited text.
type lastParse struct {
	src      *Source
	chunks   []chunkRecord // every statement of the file, in order, including those that did not parse
	comments []Comment
	head     Diagnostics // the lexer's, before the first statement
	badRuns  int         // runs of invalid characters the lexer met
	runs     []int32     // where they start
}

// chunkRecord is one statement of a parse: where its first token starts
// and ends, whether it stood first on its line, what parsing the
// statement gave (st nil for text that did not start with a statement
// keyword) and what the lexer reported in its text (up to the next
// statement).
type chunkRecord struct {
	start, firstEnd int32
	firstOnLine     bool
	st              *Statement
	diags, lex      Diagnostics
}

// clean reports whether the statement parsed and nothing was reported in
// its text: it can move with its text.
func (ch *chunkRecord) clean() bool { return ch.st != nil && len(ch.diags) == 0 && len(ch.lex) == 0 }

// attributeLex gives each of the lexer's diagnostics, in the order
// reported, to the statement whose text holds it, and returns those
// before the first statement.
func attributeLex(chunks []chunkRecord, diags Diagnostics) (head Diagnostics) {
	for _, d := range diags {
		at := d.Subject.Start.Offset
		j := sort.Search(len(chunks), func(i int) bool { return int(chunks[i].start) > at }) - 1
		if j < 0 {
			head = append(head, d)
			continue
		}
		chunks[j].lex = append(chunks[j].lex, d)
	}
	return head
}

// record is the chunkRecord of the group's i-th statement, which parsed
// to r.
func (g *lexedGroup) record(i int, r result) chunkRecord {
	first := g.g.toks[g.chunks[i].start]
	return chunkRecord{start: first.Offset, firstEnd: int32(first.End()), firstOnLine: first.FirstOnLine, st: r.st, diags: r.diags}
}

// maxReparseWindow is how many bytes from the start of the first
// statement an edit touches to the end of the edit a re-parse lexes on
// one goroutine; a larger edit parses the whole file, in parallel.
const maxReparseWindow = 256 << 10

// textEdit is where a text differs from an earlier one: the lengths of
// their common prefix and, after it, their common suffix.
type textEdit struct{ prefix, suffix int }

// reparse parses source, the text of the cache's last parse changed where
// edit says, lexing and parsing only the statements the edit touched (see the top of
// this file). It reports false, having changed nothing, when it cannot:
// no last parse of the same file, a last parse whose lexer reported as
// many runs of invalid characters as it reports, or an edit too large for
// maxReparseWindow.
func (c *Cache) reparse(source *Source, edit textEdit) (*File, Diagnostics, bool) {
	old := c.prev
	if old == nil || old.badRuns >= maxLexDiagnostics || old.src.Name() != source.Name() || len(old.chunks) == 0 {
		return nil, nil, false
	}
	ot, nt := old.src.text, source.text
	p, s := edit.prefix, edit.suffix
	d := len(nt) - len(ot)
	newEnd := len(nt) - s // the new text differs from the old in [p, newEnd)
	chunks := old.chunks
	// r is the last statement whose first token, and the byte after it,
	// are before the edit.
	r := sort.Search(len(chunks), func(i int) bool { return int(chunks[i].firstEnd) >= p }) - 1
	if r < 0 || newEnd-int(chunks[r].start) > maxReparseWindow {
		return nil, nil, false
	}

	out := &reparsed{c: c, old: old, src: source, d: d, f: &File{Name: source.Name(), Source: source}}
	// The runs of invalid characters before the edit, which the lexer
	// counts on from.
	for _, at := range old.runs {
		if at < chunks[r].start {
			out.runs = append(out.runs, at)
		}
	}
	out.chunks = make([]chunkRecord, 0, len(chunks)+8)
	out.f.Statements = make([]*Statement, 0, len(chunks)+8)
	// The statements before the edit, in place: everything before them
	// is the same text, so they resolve to the same positions.
	for _, ch := range chunks[:r] {
		out.keep(ch, 0, false)
	}
	// Their comments, re-sliced from the new text so that they keep no
	// old text alive.
	for _, cm := range old.comments[:commentsFrom(old.comments, int(chunks[r].start))] {
		at := cm.Span.Start.Offset
		out.comments = append(out.comments, Comment{Span: cm.Span, Text: nt[at : at+len(cm.Text)]})
	}

	// The edit: from statement r to the first statement after the edit
	// that starts where an old one did.
	sync := len(chunks)
	window := c.windowKeys(chunks[r:], len(ot)-s)
	stop := func(t Token) bool {
		at := int(t.Offset)
		if at < newEnd {
			return false
		}
		j := r + 1 + sort.Search(len(chunks)-r-1, func(i int) bool { return int(chunks[r+1+i].start) >= at-d })
		if j < len(chunks) && int(chunks[j].start) == at-d && chunks[j].firstOnLine == t.FirstOnLine {
			sync = j
			return true
		}
		return false
	}
	c.mu.Lock()
	c.last, c.next = window, map[cacheKey]*Statement{}
	c.mu.Unlock()
	defer func() {
		c.mu.Lock()
		c.last, c.next = nil, nil
		c.mu.Unlock()
	}()
	if stopped := out.lex(int(chunks[r].start), chunks[r].firstOnLine, stop); stopped >= 0 && sync == len(chunks) {
		return nil, nil, false // cannot happen: stop set sync
	}

	samePlaces := d == 0 && len(source.lines) == len(old.src.lines)
	// The statements after the edit, moved; those that did not parse
	// cleanly are read again, since their messages may name places.
	relexed := 0 // bytes of statements after the edit lexed again
	for j := sync; j < len(chunks); j++ {
		ch := chunks[j]
		next := len(ot) // where the next statement starts
		if j+1 < len(chunks) {
			next = int(chunks[j+1].start)
		}
		// A statement with diagnostics at the same place as before keeps
		// them: every position in it is the same.
		if out.keepable(ch, d) {
			// With the text's length and its number of lines unchanged, a
			// statement on a line that starts after the edit is at the
			// same line and column as before.
			check := !samePlaces || int(source.lines[source.line(int(ch.start)+d)]) < newEnd
			out.keep(ch, d, check)
			from, to := commentsFrom(old.comments, int(ch.start)), commentsFrom(old.comments, next)
			for _, cm := range old.comments[from:to] {
				out.comments = append(out.comments, out.movedComment(cm))
			}
			continue
		}
		// A run of statements that cannot be kept is lexed again in one
		// go, up to the next that can; a file with so many that this
		// would read more than maxReparseWindow is parsed whole.
		k := j + 1
		for k < len(chunks) && !out.keepable(chunks[k], d) {
			k++
		}
		want, end := -1, len(ot)
		if k < len(chunks) {
			end = int(chunks[k].start)
			want = end + d
		}
		if relexed += end - int(ch.start); relexed > maxReparseWindow {
			return nil, nil, false
		}
		stopped := out.lex(int(ch.start)+d, ch.firstOnLine, func(t Token) bool { return int(t.Offset) >= end+d })
		if stopped != want {
			return nil, nil, false // cannot happen: the same bytes lex the same
		}
		j = k - 1
	}
	lexDiags := old.head
	var diags Diagnostics
	for _, ch := range out.chunks {
		lexDiags = append(lexDiags, ch.lex...)
		diags = append(diags, ch.diags...)
	}
	c.lexed, c.partial = out.lexed, true
	c.prev = &lastParse{src: source, chunks: out.chunks, comments: out.comments, head: old.head, badRuns: len(out.runs), runs: out.runs}
	out.f.Comments = out.comments
	return out.f, append(lexDiags, diags...), true
}

// reparsed is a re-parse being put together.
type reparsed struct {
	c        *Cache
	old      *lastParse
	src      *Source
	d        int // the edit's change in length
	f        *File
	chunks   []chunkRecord
	comments []Comment
	runs     []int32 // where the runs of invalid characters start
	slab     nodeSlab
	lexed    int // bytes lexed
}

// keep takes the old statement ch, whose text is now delta bytes further
// on: in place when it resolves to the same position in the new text
// (which, unless check, the caller knows) and is not too old, else moved.
func (o *reparsed) keep(ch chunkRecord, delta int, check bool) {
	at := int(ch.start) + delta
	st := ch.st
	if st != nil {
		old := st.Source()
		if delta != 0 || old.outlived(o.src) || old.Name() != o.src.Name() ||
			(check && old.Pos(int(ch.start)) != o.src.Pos(at)) {
			st = moved(st, o.src, at)
		}
		o.f.Statements = append(o.f.Statements, st)
		o.c.count(true)
	}
	ch.start, ch.firstEnd, ch.st = int32(at), ch.firstEnd+int32(delta), st
	o.chunks = append(o.chunks, ch)
}

// keepable reports whether the old statement ch, d bytes further on in
// the new text, can be kept without lexing it again: it parsed cleanly, or
// it stands at the same place, where its diagnostics say the same.
func (o *reparsed) keepable(ch chunkRecord, d int) bool {
	return ch.clean() || (d == 0 && ch.st != nil && ch.st.Source().Pos(int(ch.start)) == o.src.Pos(int(ch.start)))
}

// movedComment is the old comment cm, d bytes further on in the new text.
func (o *reparsed) movedComment(cm Comment) Comment {
	at := cm.Span.Start.Offset + o.d
	text := o.src.text[at : at+len(cm.Text)]
	return Comment{Span: o.src.Span(Token{Value: text, Offset: int32(at)}), Text: text}
}

// lex lexes and parses the new text from offset from, where a statement
// starts whose first token has FirstOnLine nl, up to the first statement
// stop accepts, and returns where that starts (-1 at the end of the
// text).
func (o *reparsed) lex(from int, nl bool, stop func(Token) bool) int {
	l := newLexState(o.src)
	l.off, l.nl = from, nl
	l.badRuns, l.runs = len(o.runs), o.runs
	b := &groupLexer{l: l, stop: stop}
	first := len(o.chunks)
	lexGroups(b, func(g *lexedGroup) {
		for i, r := range parseGroup(g.g, g.chunks, o.c, &o.slab) {
			if r.st != nil {
				o.f.Statements = append(o.f.Statements, r.st)
			}
			o.chunks = append(o.chunks, g.record(i, r))
		}
	})
	o.lexed += l.off - from
	o.comments = append(o.comments, l.comments...)
	o.runs = l.runs
	attributeLex(o.chunks[first:], l.diags) // a segment starts with a statement: none before it
	return b.stopped
}

// windowKeys are the cache keys of the statements that parsed cleanly
// among chunks, from the first the edit touches to windowKeysAfter past
// oldEnd, where the edit ends in the old text, so that a statement the
// edit moved within its window is found again.
func (c *Cache) windowKeys(chunks []chunkRecord, oldEnd int) map[cacheKey]*Statement {
	keys := map[cacheKey]*Statement{}
	after := 0
	for _, ch := range chunks {
		if int(ch.start) > oldEnd {
			if after++; after > windowKeysAfter {
				break
			}
		}
		if k, ok := recordKey(ch); ok {
			keys[k] = ch.st
		}
	}
	return keys
}

// windowKeysAfter is how many statements after an edit windowKeys keys:
// the re-parse usually stops at the first of them.
const windowKeysAfter = 16

// recordKey is the cache key of a statement of a parse that parsed
// cleanly.
func recordKey(ch chunkRecord) (cacheKey, bool) {
	if !ch.clean() || ch.st.Broken || ch.st.g == nil {
		return cacheKey{}, false
	}
	return statementKey(ch.st.g.src, ch.st.g.toks[ch.st.start:ch.st.end])
}

// commentsFrom is the index of the first of comments (in file order) at
// or after offset at.
func commentsFrom(comments []Comment, at int) int {
	return sort.Search(len(comments), func(i int) bool { return comments[i].Span.Start.Offset >= at })
}

// commonPrefix is the length of the longest common prefix of a and b,
// compared a block at a time (string comparison is vectorised) and then
// byte by byte in the block that differs.
func commonPrefix(a, b string) int {
	n := min(len(a), len(b))
	i := 0
	for i+compareBlock <= n && a[i:i+compareBlock] == b[i:i+compareBlock] {
		i += compareBlock
	}
	for i < n && a[i] == b[i] {
		i++
	}
	return i
}

// commonSuffix is the length of the longest common suffix of a and b.
func commonSuffix(a, b string) int {
	n := min(len(a), len(b))
	i := 0
	for i+compareBlock <= n && a[len(a)-i-compareBlock:len(a)-i] == b[len(b)-i-compareBlock:len(b)-i] {
		i += compareBlock
	}
	for i < n && a[len(a)-1-i] == b[len(b)-1-i] {
		i++
	}
	return i
}

// compareBlock is how many bytes commonPrefix and commonSuffix compare at
// once.
const compareBlock = 256
