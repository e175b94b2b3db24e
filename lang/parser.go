package lang

import (
	"errors"
	"fmt"
	"io"
	"reflect"
	"runtime"
	"strings"
	"sync"
	"sync/atomic"

	"github.com/alecthomas/participle/v2"
	"github.com/alecthomas/participle/v2/lexer"

	"hess/suggest"
)

// definition adapts the lexer to participle. The parser is only ever fed
// token slices that Lex produced; reading from an io.Reader is not offered.
type definition struct{}

func (definition) Symbols() map[string]lexer.TokenType { return symbols() }

func (definition) Lex(filename string, r io.Reader) (lexer.Lexer, error) {
	return nil, errors.New("lang: lex through Lex, not a reader")
}

var parserOptions = []participle.Option{
	participle.Lexer(definition{}),
	// Lookahead 0: every alternative starts with its own token, so a
	// branch that has read one token is the one meant, and its error is
	// the one to report.
	participle.UseLookahead(0),
}

// kindParser parses one kind of statement into st, leaving the cursor at
// the token after it.
type kindParser func(c *tokenCursor, st *Statement) error

// statementKind is one kind of statement: its keyword, the name of its
// production, its parser, and its grammar in EBNF.
type statementKind struct {
	keyword, name string
	parse         kindParser
	grammar       func() string
}

// participleKind is a statement that participle reads by the struct tags
// of G.
func participleKind[G any](keyword string, set func(*Statement, *G)) statementKind {
	p := participle.MustBuild[G](parserOptions...)
	parse := func(c *tokenCursor, st *Statement) error {
		v, err := parseWith(c, p)
		if v != nil {
			set(st, v)
		}
		return err
	}
	return statementKind{keyword: keyword, name: reflect.TypeFor[G]().Name(), parse: parse, grammar: p.String}
}

// handKind is a statement read by hand by parse, whose production is p.
// Its grammar lists after p those of the parts it hands to participle.
func handKind(p *production, parse kindParser, parts ...fmt.Stringer) statementKind {
	keyword, _ := p.at(0).(lit)
	grammar := func() string {
		s := p.String()
		for _, q := range parts {
			s += "\n" + q.String()
		}
		return s
	}
	return statementKind{keyword: string(keyword), name: p.name, parse: parse, grammar: grammar}
}

// statementKinds are the statements, in the order Grammar lists them. The
// species and reaction statements are read by hand (statements.go).
var statementKinds = []statementKind{
	participleKind("include", func(st *Statement, v *Include) { st.Include = v }),
	participleKind("settings", func(st *Statement, v *Settings) { st.Settings = v }),
	participleKind("element", func(st *Statement, v *Element) { st.Element = v }),
	participleKind("phase", func(st *Statement, v *Phase) { st.Phase = v }),
	handKind(speciesRule, parseSpeciesStatement),
	handKind(reactionRule, parseReactionStatement, comboParser),
	participleKind("mixture", func(st *Statement, v *Mixture) { st.Mixture = v }),
}

// statementParsers parse each kind of statement by its keyword.
var statementParsers = func() map[string]kindParser {
	m := map[string]kindParser{}
	for _, k := range statementKinds {
		m[k.keyword] = k.parse
	}
	return m
}()

// statementRule is a statement: one of statementKinds, chosen by its
// keyword.
var statementRule = func() *production {
	kinds := make(alt, len(statementKinds))
	for i, k := range statementKinds {
		kinds[i] = ref(k.name)
	}
	return rule("Statement", "a statement", kinds)
}()

// notAStatement is the message for a statement that does not start with a
// statement keyword.
var notAStatement = func() string {
	kws := make([]string, len(statementKinds))
	for i, k := range statementKinds {
		kws[i] = k.keyword
	}
	return "expected " + statementRule.named + " (" + strings.Join(kws, ", ") + "), found "
}()

// endOfStatement is the type of the token the parser sees after each
// statement's last token. No grammar rule matches it, so no statement can
// run into the next one.
const endOfStatement TokenType = -64

// isEnd reports whether t ends the statement being parsed.
func isEnd(t Token) bool { return t.Type == EOF || t.Type == endOfStatement }

// chunk is one statement's place in a group's token stream: tokens
// [start, end), followed by an endOfStatement token at end.
type chunk struct{ start, end int }

// groupLexer cuts the lexer's tokens into groups of statements, each
// statement's tokens followed by an endOfStatement token, and an EOF token
// once the group is full or at the end of the input. It cuts statements
// at statement keywords that stand at brace depth 0 or first on their
// line. The lexer writes each token straight into the group's array
// (l.toks), which the syntax tree keeps: tokens [0, queue) are the
// group's so far, the few after them are lexed ahead and move to the next
// group's array when this one is full.
type groupLexer struct {
	l        *lexState
	queue    int // index in l.toks of the next token to hand out
	chunks   []chunk
	open     bool  // a statement has started and not yet ended
	last     Token // the last token of the open statement
	depth    int   // brace depth in the open statement
	junk     bool  // the open statement does not start with a statement keyword
	full     bool  // the group is full
	finished bool  // the input is exhausted, or stop accepted a statement
	// stop, when set, ends the input before the first statement whose
	// first token it accepts (a re-parse lexes only part of a file);
	// stopped is then that token's offset, else -1.
	stop    func(Token) bool
	stopped int
}

// A group is full after groupStatements statements, or once its
// statements reach groupTokens tokens: small enough that a group's tokens
// are still in the cache when a worker parses them, large enough that
// handing groups to workers costs little.
const (
	groupStatements = 64
	groupTokens     = 1024
)

// peek returns the next token of the input without taking it.
func (b *groupLexer) peek() (Token, bool) {
	for b.queue == len(b.l.toks) {
		if !b.l.more() {
			return Token{}, false
		}
	}
	return b.l.toks[b.queue], true
}

// insert places t before the tokens lexed ahead and hands it out.
func (b *groupLexer) insert(t Token) Token {
	toks := append(b.l.toks, Token{})
	copy(toks[b.queue+1:], toks[b.queue:])
	toks[b.queue] = t
	b.l.toks = toks
	b.queue++
	return t
}

// drop removes the next token, one that is not kept.
func (b *groupLexer) drop() {
	b.l.toks = append(b.l.toks[:b.queue], b.l.toks[b.queue+1:]...)
}

// next hands out the group's next token, in place at l.toks[queue-1],
// and returns it.
func (b *groupLexer) next() Token {
	if b.full || b.finished {
		return b.insert(Token{Type: EOF, Offset: b.last.Offset})
	}
	t, ok := b.peek()
	if !ok {
		b.finished = true
		if b.open {
			return b.end()
		}
		return b.insert(Token{Type: EOF, Offset: int32(b.l.off)})
	}
	if b.open && b.startsStatement(t) {
		return b.end()
	}
	if !b.open && b.stop != nil && b.stop(t) {
		b.finished, b.stopped = true, int(t.Offset)
		return b.insert(Token{Type: EOF, Offset: t.Offset})
	}
	if b.open && b.junk && b.queue-b.chunks[len(b.chunks)-1].start >= junkTokens {
		b.skipStatement(false)
		return b.end()
	}
	if b.open && b.queue-b.chunks[len(b.chunks)-1].start >= MaxStatementTokens {
		b.skipStatement(true)
		return b.end()
	}
	if !b.open {
		b.open, b.depth = true, 0
		b.junk = t.Type != Keyword || !statementKeywords[t.Value]
		b.chunks = append(b.chunks, chunk{start: b.queue})
	}
	if t.Type == Punct {
		switch t.Value {
		case "{":
			b.depth++
		case "}":
			b.depth--
		}
	}
	b.queue++
	b.last = t
	return t
}

// startsStatement reports whether t begins a new statement: a statement
// keyword at brace depth 0 or first on its line.
func (b *groupLexer) startsStatement(t Token) bool {
	return t.Type == Keyword && statementKeywords[t.Value] && (b.depth <= 0 || t.FirstOnLine)
}

// MaxStatementTokens is the most tokens one statement may hold: 24 MiB of
// tokens. The longest statements a network needs (a mixture listing every
// species of a large network, a combination of thousands of reactions) hold
// far fewer; TestRobustLongLine's 2 MB one-line reaction holds 700 000.
// The limit keeps one runaway statement (a file of words without a
// keyword) from holding the tokens of the whole file at once.
const MaxStatementTokens = 1 << 20

// junkTokens is how many tokens of text that does not start with a
// statement keyword are kept: the parser reports only its first.
const junkTokens = 64

// skipStatement skips the rest of the open statement, up to the next
// statement or the end of the input, without keeping its tokens; report
// says it passed MaxStatementTokens.
func (b *groupLexer) skipStatement(report bool) {
	first := b.last
	skipped := 0
	for {
		t, ok := b.peek()
		if !ok || b.startsStatement(t) {
			break
		}
		if t.Type == Punct {
			switch t.Value {
			case "{":
				b.depth++
			case "}":
				b.depth--
			}
		}
		b.drop()
		b.last = t
		skipped++
	}
	if !report {
		return
	}
	src := b.l.src
	span := src.Span(first).Join(src.Span(b.last))
	b.l.diags = append(b.l.diags, Diagnostic{
		Code: CodeSyntax, Severity: Error, Subject: src.Span(first), Context: span,
		Message: fmt.Sprintf("a statement of more than %d tokens, the limit on one statement; its last %d tokens, to the next statement, are skipped", MaxStatementTokens, skipped),
	})
}

// end closes the open statement and hands out its endOfStatement token,
// placed just after the statement's last token.
func (b *groupLexer) end() Token {
	b.open = false
	b.chunks[len(b.chunks)-1].end = b.queue
	t := b.insert(Token{Type: endOfStatement, Offset: int32(b.last.End())})
	if len(b.chunks) >= groupStatements || b.queue >= groupTokens {
		b.full = true
	}
	return t
}

// Parse parses one source file. It reports every statement that does not
// parse and carries on at the next statement keyword, so later statements
// are still read. The returned File is never nil.
//
// A statement starts at a statement keyword that stands at brace depth 0 or
// first on its line, so a block missing its `}` ends where the next
// statement begins on a new line.
func Parse(file string, src []byte) (*File, Diagnostics) {
	f, diags, _ := parse(file, src, nil)
	return f, diags
}

// parse is Parse with an optional statement cache. With a cache it also
// returns what the cache keeps of the parse for re-parsing an edit of the
// text (see Cache.reparse).
func parse(file string, src []byte, cache *Cache) (*File, Diagnostics, *lastParse) {
	if len(src) > MaxSourceBytes {
		return &File{Name: file}, Diagnostics{tooLarge(file)}, nil
	}
	source := NewSource(file, string(src))
	if cache != nil {
		source.gen = cache.generation()
	}
	return parseSource(source, cache)
}

// parseSource is parse of the text of source, at most MaxSourceBytes
// long.
func parseSource(source *Source, cache *Cache) (*File, Diagnostics, *lastParse) {
	f := &File{Name: source.Name(), Source: source}
	l := newLexState(source)
	// The input is lexed on this goroutine, a small group of statements at
	// a time, while workers parse the groups already lexed. Groups are
	// small so that each one's tokens stay in the cache from lexing to
	// parsing, and at most lexAhead groups wait, so memory beyond the
	// syntax tree stays bounded.
	groups := make(chan *lexedGroup, lexAhead)
	var wg sync.WaitGroup
	for range max(1, runtime.GOMAXPROCS(0)) {
		wg.Add(1)
		go func() {
			defer wg.Done()
			// A worker's small nodes come from one slab for all the
			// groups it parses, so that only its last chunks are part
			// full.
			slab := &nodeSlab{}
			for g := range groups {
				g.results = parseGroup(g.g, g.chunks, cache, slab)
			}
		}()
	}
	var order []*lexedGroup
	lexGroups(&groupLexer{l: l}, func(g *lexedGroup) {
		order = append(order, g)
		groups <- g
	})
	close(groups)
	wg.Wait()
	var diags Diagnostics
	var last *lastParse
	if cache != nil {
		last = &lastParse{src: source, comments: l.comments, badRuns: l.badRuns, runs: l.runs}
	}
	for _, g := range order {
		for i, r := range g.results {
			if r.st != nil {
				f.Statements = append(f.Statements, r.st)
			}
			diags = append(diags, r.diags...)
			if last != nil {
				last.chunks = append(last.chunks, g.record(i, r))
			}
		}
	}
	if last != nil {
		last.head = attributeLex(last.chunks, l.diags)
	}
	f.Comments = l.comments
	return f, append(l.diags, diags...), last
}

// lexGroups lexes with b into groups of statements, handing each to emit
// once lexed, until the input ends or b.stop accepts a statement.
func lexGroups(b *groupLexer, emit func(*lexedGroup)) {
	l := b.l
	b.stopped = -1
	last := 0 // tokens in the group before
	for !b.finished {
		b.chunks, b.full = make([]chunk, 0, groupStatements), false
		// The syntax tree keeps the group's tokens. Groups of one file are
		// much alike in size, so room for the last one's and a little more
		// seldom needs to grow and wastes little. Tokens lexed ahead for
		// this group move to the front of its array.
		ahead := l.toks[b.queue:]
		toks := make([]Token, len(ahead), max(last, groupTokens/4)+len(ahead)+64)
		copy(toks, ahead)
		l.toks, b.queue = toks, 0
		for b.next().Type != EOF {
		}
		last = b.queue
		if len(b.chunks) == 0 {
			continue
		}
		emit(&lexedGroup{g: &tokenGroup{src: l.src, toks: l.toks[:b.queue:b.queue]}, chunks: b.chunks})
	}
}

// lexAhead is how many lexed groups may wait for a worker.
const lexAhead = 16

// lexedGroup is one group of statements, lexed, and once a worker has
// parsed it, its results.
type lexedGroup struct {
	g       *tokenGroup // each statement's tokens, then endOfStatement; EOF last
	chunks  []chunk
	results []result
}

// result is what parsing one statement gave.
type result struct {
	st    *Statement
	diags Diagnostics
}

// parseGroup parses the statements of one group in order, taking their
// small nodes from slab. With a cache, a statement whose text it holds is
// taken from it.
func parseGroup(g *tokenGroup, chunks []chunk, cache *Cache, slab *nodeSlab) []result {
	results := make([]result, len(chunks))
	cur := &tokenCursor{} // one for all the group's statements
	// The lineages of the statements parsed here are numbers of their own.
	lineage := lineages.Add(uint64(len(chunks))) - uint64(len(chunks))
	parsed := func(r result) result {
		lineage++
		if r.st != nil {
			r.st.lineage = lineage
		}
		return r
	}
	for i, c := range chunks {
		if cache != nil && c.end > c.start {
			if key, keyed := statementKey(g.src, g.toks[c.start:c.end]); keyed {
				if st := cache.lookup(key, g.src, int(g.toks[c.start].Offset)); st != nil {
					results[i] = result{st: st}
					continue
				}
				r := parsed(parseStatement(g, c, slab, cur))
				cache.store(key, r.st, len(r.diags) == 0)
				results[i] = r
				continue
			}
		}
		results[i] = parsed(parseStatement(g, c, slab, cur))
	}
	return results
}

// lineages counts the statements parsed so far: each one's Lineage is its
// number.
var lineages atomic.Uint64

// parseStatement parses the statement c of a group with cursor cur,
// taking its small nodes from slab.
func parseStatement(g *tokenGroup, c chunk, slab *nodeSlab, cur *tokenCursor) result {
	src := g.src
	toks := g.toks[c.start:c.end:c.end]
	first := toks[0]
	if first.Type != Keyword || !statementKeywords[first.Value] {
		span := src.Span(first)
		return result{diags: Diagnostics{{
			Code:     CodeSyntax,
			Severity: Error,
			Message:  notAStatement + describe(first) + keywordHint(first),
			Subject:  span,
			Context:  span.Join(src.Span(toks[len(toks)-1])),
		}}}
	}
	st := slabOr(slab, slabStmts)
	st.Node = Node{g: g, start: int32(c.start), end: int32(c.end)}
	*cur = tokenCursor{g: g, base: c.start, toks: g.toks[c.start : c.end+1 : c.end+1], slab: slab}
	err := statementParsers[first.Value](cur, st)
	if err == nil && !isEnd(*cur.Peek()) {
		err = &syntaxError{found: *cur.Peek()}
	}
	if err != nil {
		st.Broken = true
		return result{st: st, diags: Diagnostics{syntaxDiag(src, toks, err)}}
	}
	return result{st: st}
}

// startsLine reports whether at is the first of toks on its line, where a
// misspelt statement keyword would stand.
func startsLine(toks []Token, at Token) bool {
	for i, t := range toks {
		if t.Offset == at.Offset {
			return i == 0 || t.FirstOnLine
		}
	}
	return false
}

// statementKeywordList is statementKeywords in the order messages list
// them.
var statementKeywordList = []string{"include", "settings", "element", "phase", "species", "reaction", "mixture"}

// keywordHint is "; did you mean …?" when a word that starts a statement is
// a near miss of a statement keyword (speces, Reaction), else "".
func keywordHint(t Token) string {
	if t.Type == Keyword || t.Type == Number || t.Type == String || isEnd(t) {
		return ""
	}
	if hint := suggest.Phrase(t.Value, statementKeywordList); hint != "" {
		return "; " + hint
	}
	return ""
}
