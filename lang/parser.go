package lang

import (
	"errors"
	"fmt"
	"io"
	"strings"

	"github.com/alecthomas/participle/v2"
	"github.com/alecthomas/participle/v2/lexer"
)

// definition adapts the lexer to participle. The parser is only ever fed
// token slices that Lex produced; reading from an io.Reader is not offered.
type definition struct{}

func (definition) Symbols() map[string]lexer.TokenType { return symbols() }

func (definition) Lex(filename string, r io.Reader) (lexer.Lexer, error) {
	return nil, errors.New("lang: lex through Lex, not a reader")
}

var statementParser = participle.MustBuild[Statement](
	participle.Lexer(definition{}),
	// Lookahead 0: every alternative starts with its own token, so a
	// branch that has read one token is the one meant, and its error is
	// the one to report.
	participle.UseLookahead(0),
)

// Grammar returns the grammar in EBNF, for review and golden tests.
func Grammar() string { return statementParser.String() }

// sliceLexer feeds a prepared token slice to participle, followed by an EOF
// token.
type sliceLexer struct {
	toks []lexer.Token
	eof  lexer.Token
	i    int
}

func (s *sliceLexer) Next() (lexer.Token, error) {
	if s.i >= len(s.toks) {
		return s.eof, nil
	}
	t := s.toks[s.i]
	s.i++
	return t, nil
}

// Parse parses one source file. It reports every statement that does not
// parse and carries on at the next statement keyword, so later statements
// are still read. The returned File is never nil.
//
// A statement starts at a statement keyword that stands at brace depth 0 or
// first on its line, so a block missing its `}` ends where the next
// statement begins on a new line.
func Parse(file string, src []byte) (*File, Diagnostics) {
	l := newLexState(file, src)
	f := &File{Name: file}
	var diags Diagnostics
	flush := func(n int) {
		st, d := parseStatement(l.toks[:n])
		if st != nil {
			f.Statements = append(f.Statements, st)
		}
		diags = append(diags, d...)
		l.toks = l.toks[:copy(l.toks, l.toks[n:])]
	}
	// The lexer fills l.toks as the splitter needs tokens; each finished
	// statement is parsed and dropped from the buffer, so memory beyond the
	// syntax tree stays bounded by the longest statement.
	depth, prevLine := 0, 0
	for i := 0; ; {
		if i == len(l.toks) {
			if !l.more() {
				break
			}
			continue
		}
		t := l.toks[i]
		if i > 0 && t.Type == Keyword && statementKeywords[t.Value] && (depth <= 0 || t.Pos.Line != prevLine) {
			flush(i)
			i, depth = 0, 0
		}
		if t.Type == Punct {
			switch t.Value {
			case "{":
				depth++
			case "}":
				depth--
			}
		}
		prevLine = t.Pos.Line
		i++
	}
	if len(l.toks) > 0 {
		flush(len(l.toks))
	}
	f.Comments = l.comments
	return f, append(l.diags, diags...)
}

// statementEOF is the EOF token just after the last of toks.
func statementEOF(toks []lexer.Token) lexer.Token {
	last := toks[len(toks)-1]
	end := TokenSpan(last).End
	return lexer.Token{Type: lexer.EOF, Pos: lexer.Position{
		Filename: last.Pos.Filename, Offset: end.Offset, Line: end.Line, Column: end.Column,
	}}
}

// parseStatement parses the tokens of one statement (without EOF). The
// tokens may be overwritten after it returns: the statement keeps copies.
func parseStatement(toks []lexer.Token) (*Statement, Diagnostics) {
	first := toks[0]
	eof := statementEOF(toks)
	if first.Type != Keyword || !statementKeywords[first.Value] {
		span := TokenSpan(first)
		return nil, Diagnostics{{
			Code:     "syntax",
			Severity: Error,
			Message:  fmt.Sprintf("expected a statement (include, settings, element, phase, species, reaction, mixture), found %s", describe(first)),
			Subject:  span,
			Context:  span.Join(TokenSpan(toks[len(toks)-1])),
		}}
	}
	peek, err := lexer.Upgrade(&sliceLexer{toks: toks, eof: eof})
	if err != nil {
		return nil, Diagnostics{syntaxDiag(toks, eof, err)}
	}
	// The peeking lexer holds its own copy of the tokens, which the syntax
	// tree's nodes share.
	own := peek.Range(0, lexer.RawCursor(len(toks)))
	st, err := statementParser.ParseFromLexer(peek)
	if err == nil {
		return st, nil
	}
	if st == nil {
		st = &Statement{}
	}
	st.Broken = true
	st.Node = Node{Pos: first.Pos, Tokens: own}
	return st, Diagnostics{syntaxDiag(own, eof, err)}
}

// syntaxDiag turns a participle error into a diagnostic that names what was
// expected and what was found. toks are the statement's tokens, eof the
// token after them.
func syntaxDiag(toks []lexer.Token, eof lexer.Token, err error) Diagnostic {
	stmt := TokenSpan(toks[0]).Join(TokenSpan(toks[len(toks)-1]))
	d := Diagnostic{Code: "syntax", Severity: Error, Context: stmt}
	var ute *participle.UnexpectedTokenError
	var perr participle.Error
	switch {
	case errors.As(err, &ute):
		found := ute.Unexpected
		d.Subject = TokenSpan(found)
		exp := expected(ute)
		if exp == `"}"` || exp == "" {
			if items := blockItems(toks, found); items != "" {
				exp = items + ` or "}"`
			}
		}
		if exp == "" && !found.EOF() {
			exp = "end of statement"
		}
		if exp == "" {
			d.Message = "unexpected " + describe(found)
		} else {
			d.Message = "expected " + exp + ", found " + describe(found)
		}
	case errors.As(err, &perr):
		p := perr.Position()
		pos := Pos{Line: p.Line, Column: p.Column, Offset: p.Offset}
		d.Subject = Span{File: p.Filename, Start: pos, End: pos}
		d.Message = strings.ToLower(perr.Message())
	default:
		d.Subject = stmt
		d.Message = err.Error()
	}
	return d
}

// blockItems names what may stand at token at inside the innermost block
// that is open there, or "" when at is not directly inside a block or the
// block takes nothing more.
func blockItems(toks []lexer.Token, at lexer.Token) string {
	var open []string // the kind of each open block
	prev := lexer.Token{}
	for _, t := range toks {
		if t.Pos.Offset >= at.Pos.Offset {
			break
		}
		if t.Type == Punct && t.Value == "{" {
			kind := toks[0].Value
			if len(open) > 0 {
				kind = "polynomial"
			}
			open = append(open, kind)
		}
		if t.Type == Punct && t.Value == "}" && len(open) > 0 {
			open = open[:len(open)-1]
		}
		prev = t
	}
	if len(open) == 0 {
		return ""
	}
	switch kind := open[len(open)-1]; kind {
	case "element", "phase":
		// These blocks take one optional property, right after the brace.
		if prev.Value != "{" {
			return ""
		}
		if kind == "element" {
			return `"mass"`
		}
		return `"convention"`
	case "polynomial":
		return "a coefficient"
	default:
		return blockWords[kind]
	}
}

var blockWords = map[string]string{
	"settings": productionWords["Setting"],
	"species":  productionWords["SpeciesProperty"],
	"reaction": productionWords["ReactionProperty"],
	"mixture":  productionWords["MixItem"],
}

// expected rewrites participle's expectation (a grammar fragment) in words:
// the first element of the expected sequence, named for a reader.
func expected(ute *participle.UnexpectedTokenError) string {
	msg := ute.Message()
	i := strings.Index(msg, "(expected ")
	if i < 0 {
		return ""
	}
	exp := strings.TrimSuffix(msg[i+len("(expected "):], ")")
	var alts []string
	for _, alt := range strings.Split(firstOfSequence(exp), " | ") {
		alt = strings.Trim(alt, "()?*+ ")
		if w, ok := productionWords[alt]; ok {
			alt = w
		} else if strings.HasPrefix(alt, "<") {
			alt = "a " + strings.Trim(alt, "<>")
		}
		if alt != "" && !contains(alts, alt) {
			alts = append(alts, alt)
		}
	}
	return strings.Join(alts, " or ")
}

// firstOfSequence returns the first top-level element of an EBNF sequence.
func firstOfSequence(s string) string {
	depth := 0
	for i, r := range s {
		switch r {
		case '(':
			depth++
		case ')':
			depth--
		case ' ':
			if depth == 0 && !strings.HasPrefix(s[i:], " | ") && (i < 2 || s[i-2:i] != " |") {
				return s[:i]
			}
		}
	}
	return s
}

func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

var productionWords = map[string]string{
	"Arrow":            "an arrow (<-> or ->)",
	"Term":             "a species",
	"SpeciesRef":       "a species",
	"Ident":            "a name",
	"Quantity":         "a number",
	"Num":              "a number",
	"Unit":             "a unit",
	"Str":              "a string",
	"Setting":          "a setting (pressure, temperatures, tolerance, lint)",
	"SpeciesProperty":  "a species property (formula, hf, gf, s, cp, shomate, nasa7, source, note)",
	"ReactionProperty": "a reaction property (dg, dh, ds, logk, rate, reverse, source)",
	"MixItem":          "a mixture item (temperature, pressure, or a species)",
	"MixMember":        "a species",
	"Combination":      "a reaction name",
	"ComboTerm":        "a reaction name",
	"TempSet":          "a temperature",
	"Lint":             "a check name",
	"Statement":        "a statement",
	"FormulaProp":      "a formula",
}

func describe(t lexer.Token) string {
	switch {
	case t.EOF():
		return "end of statement"
	case t.Type == Keyword:
		return fmt.Sprintf("keyword %q", t.Value)
	case t.Type == Number:
		return fmt.Sprintf("number %s", t.Value)
	case t.Type == String:
		return fmt.Sprintf("string %s", t.Value)
	}
	return fmt.Sprintf("%q", t.Value)
}
