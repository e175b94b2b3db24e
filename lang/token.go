package lang

import (
	"sort"
	"unicode/utf8"

	"github.com/alecthomas/participle/v2/lexer"
)

// Token is one token of a source file: its text and where it starts.
// Every token is on one line; its Value is the exact source text, so its
// end follows from its start and Value. A token holds no file name, line
// or column: the Source of the node that holds it resolves its offset to
// a line and column when asked (see Source.Pos), as go/token does.
type Token struct {
	Value  string
	Offset int32 // bytes from the start of the file
	Type   TokenType
	// FirstOnLine reports that no token stands before this one on its
	// line: a statement keyword there starts a new statement.
	FirstOnLine bool
}

// TokenType is the kind of a token. The values are participle's: lexer.EOF
// for the end of the input, the negative constants below for the rest.
type TokenType int8

// EOF is the type of the token after the last.
const EOF TokenType = TokenType(lexer.EOF)

// Token types produced by the lexer.
const (
	// Word is any other run of non-space characters: identifiers, formulas
	// without a state tag, units.
	Word TokenType = -(iota + 2)
	// Ref is a word that ends in a lower-case state tag, such as CO2(g).
	Ref
	// Keyword is a reserved word of the language (statement and property keys).
	Keyword
	// Number is a decimal or scientific number with optional sign, or a
	// fraction p/q.
	Number
	// String is a double-quoted string, quotes included.
	String
	// Punct is one of { } : , = ± +- + - <-> -> ⇌ →.
	Punct
)

// EOF reports whether t is the end of the input.
func (t Token) EOF() bool { return t.Type == EOF }

// End is the offset just after the token.
func (t Token) End() int { return int(t.Offset) + len(t.Value) }

func symbols() map[string]lexer.TokenType {
	return map[string]lexer.TokenType{
		"EOF":     lexer.EOF,
		"Word":    lexer.TokenType(Word),
		"Ref":     lexer.TokenType(Ref),
		"Keyword": lexer.TokenType(Keyword),
		"Number":  lexer.TokenType(Number),
		"String":  lexer.TokenType(String),
		"Punct":   lexer.TokenType(Punct),
	}
}

// statementKeywords start a top-level statement; the parser resumes at them
// after a syntax error.
var statementKeywords = map[string]bool{
	"include": true, "settings": true, "element": true, "phase": true,
	"species": true, "reaction": true, "mixture": true,
}

// keywords are reserved: a keyword is never read as a unit.
var keywords = map[string]bool{
	"include": true, "settings": true, "element": true, "phase": true,
	"species": true, "reaction": true, "mixture": true,
	// settings
	"pressure": true, "temperatures": true, "tolerance": true, "lint": true,
	"standard-pressure": true, "activity": true, "to": true, "by": true,
	// element and phase
	"mass": true, "convention": true,
	// species
	"formula": true, "hf": true, "gf": true, "s": true, "cp": true,
	"size": true, "setschenow": true, "shomate": true, "nasa7": true, "source": true, "note": true,
	// reaction
	"dg": true, "dh": true, "ds": true, "logk": true, "at": true,
	"rate": true, "reverse": true, "A": true, "n": true, "Ea": true,
	// mixture
	"temperature": true, "fixed": true,
}

// IsKeyword reports whether w is a reserved word of the language.
func IsKeyword(w string) bool {
	if w == "" || w[0] >= utf8.RuneSelf {
		return false
	}
	for _, k := range keywordsByFirst[w[0]] {
		if k == w {
			return true
		}
	}
	return false
}

// keywordsByFirst lists the keywords by their first byte, which the lexer
// looks each word up in: faster than hashing every word.
var keywordsByFirst = func() (t [utf8.RuneSelf][]string) {
	for k := range keywords {
		t[k[0]] = append(t[k[0]], k)
	}
	return t
}()

// Keywords lists the reserved words, for completion.
func Keywords() []string {
	out := make([]string, 0, len(keywords))
	for k := range keywords {
		out = append(out, k)
	}
	sort.Strings(out)
	return out
}
