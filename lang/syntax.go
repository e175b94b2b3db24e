package lang

import (
	"errors"
	"fmt"
	"strings"

	"github.com/alecthomas/participle/v2"
	"github.com/alecthomas/participle/v2/lexer"
)

// syntaxError is why a statement does not parse: the token found where
// the grammar wanted one of expected, named in words ("a number", `"to"`).
// The hand-written readers return it where they find the fault; an error
// of participle's becomes one in toSyntaxError. It meets participle.Error,
// so it passes unchanged through participle when participle calls a
// reader.
type syntaxError struct {
	found    Token
	expected []string // empty where the grammar does not say
	// worded is a message participle words itself, with no token found;
	// it is reported at found.Offset as it stands (nowhere where that is
	// negative).
	worded string
	// glued is set where found is one token that holds two terms joined
	// by "+" without spaces ("CO(g)+O2(g)"): left and right are the two.
	glued *[2]string
}

// gluedTerms reports the error for a species token that holds two terms
// joined by "+" with no spaces, as in CO(g)+O2(g); nil for any other token.
// A "+" right after a closing parenthesis cannot be a charge, which stands
// before the state tag (Na+(aq)).
func gluedTerms(t Token) error {
	i := strings.Index(t.Value, ")+")
	if i < 0 || i+2 >= len(t.Value) {
		return nil
	}
	return &syntaxError{found: t, glued: &[2]string{t.Value[:i+1], t.Value[i+2:]}}
}

// expecting is the error for a missing part x of the grammar: the next
// token is not one that can start it.
func expecting(lex tokenStream, x expr) error {
	return &syntaxError{found: *lex.Peek(), expected: x.words()}
}

func (e *syntaxError) Error() string { return participle.FormatError(e) }

// Position is where the error is, as participle asks for it: its byte
// offset only, since a token does not know its line; the parser reports the
// error with the line and column its Source resolves.
func (e *syntaxError) Position() lexer.Position {
	return lexer.Position{Offset: int(e.found.Offset)}
}

func (e *syntaxError) Message() string {
	if e.worded != "" {
		return e.worded
	}
	return e.message(nil)
}

// message says what was expected and what was found. toks are the
// statement's tokens, which name what may stand inside a block where the
// error expects only its end.
func (e *syntaxError) message(toks []Token) string {
	if e.glued != nil {
		return fmt.Sprintf("%s is two terms: terms need spaces around \"+\" (write %s + %s)", describe(e.found), e.glued[0], e.glued[1])
	}
	exp := strings.Join(e.expected, " or ")
	if exp == `"}"` || exp == "" {
		if items := blockItems(toks, e.found); items != "" {
			exp = items + ` or "}"`
		}
	}
	if exp == "" && !isEnd(e.found) {
		exp = "end of statement"
	}
	if exp == "" {
		return "unexpected " + describe(e.found)
	}
	return "expected " + exp + ", found " + describe(e.found)
}

// toSyntaxError is the one place where an error of participle's, from the
// statements it reads, becomes a syntaxError. It returns nil for an error
// that is neither.
func toSyntaxError(err error) *syntaxError {
	var se *syntaxError
	var ute *participle.UnexpectedTokenError
	var perr participle.Error
	switch {
	case errors.As(err, &se):
		return se
	case errors.As(err, &ute):
		return &syntaxError{found: fromLexer(ute.Unexpected), expected: participleExpected(ute)}
	case errors.As(err, &perr):
		found := Token{Offset: int32(perr.Position().Offset)}
		if perr.Position().Line == 0 {
			found.Offset = -1
		}
		return &syntaxError{found: found, worded: strings.ToLower(perr.Message())}
	}
	return nil
}

// participleExpected names, in words, the first part of what participle
// expected. Participle keeps the grammar node it expected to itself and
// gives it out only as EBNF in its message, so this reads that fragment:
// its first element, each alternative of it named as the grammar names it.
func participleExpected(ute *participle.UnexpectedTokenError) []string {
	msg := ute.Message()
	i := strings.Index(msg, "(expected ")
	if i < 0 {
		return nil
	}
	exp := strings.TrimSuffix(msg[i+len("(expected "):], ")")
	var alts []string
	for _, alt := range strings.Split(firstOfSequence(exp), " | ") {
		alt = strings.Trim(alt, "()?*+ ")
		if w := productionWords(alt); w != "" {
			alt = w
		} else if strings.HasPrefix(alt, "<") {
			alt = "a " + strings.Trim(alt, "<>")
		}
		if alt != "" && !contains(alts, alt) {
			alts = append(alts, alt)
		}
	}
	return alts
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

// syntaxDiag is the diagnostic for a statement that does not parse. toks
// are the statement's tokens.
func syntaxDiag(src *Source, toks []Token, err error) Diagnostic {
	stmt := src.Span(toks[0]).Join(src.Span(toks[len(toks)-1]))
	d := Diagnostic{Code: CodeSyntax, Severity: Error, Context: stmt}
	se := toSyntaxError(err)
	switch {
	case se == nil:
		d.Subject = stmt
		d.Message = err.Error()
	case se.worded != "":
		if se.found.Offset >= 0 {
			pos := src.Pos(int(se.found.Offset))
			d.Subject = Span{File: src.name, Start: pos, End: pos}
		}
		d.Message = se.worded
	default:
		d.Subject = src.Span(se.found)
		d.Message = se.message(toks)
		if se.glued == nil {
			d.Message += plusSpacingHint(toks, se.found)
		}
		if startsLine(toks, se.found) {
			d.Message += keywordHint(se.found)
		}
		if brace, kind, ok := unclosedBlock(toks, se.found); ok && isEnd(se.found) {
			span := src.Span(brace)
			d.Message += fmt.Sprintf(`; the %s block opened at line %d, column %d has no closing "}"`, kind, span.Start.Line, span.Start.Column)
			d.Related = append(d.Related, Related{Span: span, Message: "the " + kind + " block opens here"})
		}
	}
	return d
}

// plusSpacingHint says that terms need spaces around "+" where the token
// found, or the one before it, has a "+" stuck to a term: "CO(g) +O2(g)"
// or "CO(g)+ O2(g)".
func plusSpacingHint(toks []Token, at Token) string {
	const hint = `; terms need spaces around "+"`
	if at.Type != Punct && len(at.Value) > 1 && strings.HasPrefix(at.Value, "+") {
		return hint
	}
	for i, t := range toks {
		if t.Offset == at.Offset {
			if i > 0 && toks[i-1].Type != Punct && len(toks[i-1].Value) > 1 && strings.HasSuffix(toks[i-1].Value, ")+") {
				return hint
			}
			break
		}
	}
	return ""
}

// unclosedBlock finds the innermost block still open at token at: its
// opening brace and its kind (the statement's keyword, "polynomial" inside
// a species block).
func unclosedBlock(toks []Token, at Token) (Token, string, bool) {
	type open struct {
		brace Token
		kind  string
	}
	var stack []open
	for _, t := range toks {
		if t.Offset >= at.Offset {
			break
		}
		if t.Type != Punct {
			continue
		}
		switch t.Value {
		case "{":
			kind := toks[0].Value
			if len(stack) > 0 {
				kind = "polynomial"
			}
			stack = append(stack, open{t, kind})
		case "}":
			if len(stack) > 0 {
				stack = stack[:len(stack)-1]
			}
		}
	}
	if len(stack) == 0 {
		return Token{}, "", false
	}
	top := stack[len(stack)-1]
	return top.brace, top.kind, true
}

// blockItems names what may stand at token at inside the innermost block
// that is open there, or "" when at is not directly inside a block or the
// block takes nothing more.
func blockItems(toks []Token, at Token) string {
	var open []string // the kind of each open block
	prev := Token{}
	for _, t := range toks {
		if t.Offset >= at.Offset {
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
		return productionWords(blockItem[kind])
	}
}

// blockItem is the production that stands inside each kind of block.
var blockItem = map[string]string{
	"settings": "Setting",
	"species":  "SpeciesProperty",
	"reaction": "ReactionProperty",
	"mixture":  "MixItem",
}

func describe(t Token) string {
	switch {
	case isEnd(t):
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
