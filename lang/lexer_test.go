package lang

import (
	"fmt"
	"strings"
	"testing"

	"github.com/alecthomas/participle/v2/lexer"
)

// tok is a token's type and value, as a test expects it.
type tok struct {
	typ TokenType
	val string
}

func (t tok) String() string { return typeName(t.typ) + " " + fmt.Sprintf("%q", t.val) }

func typeName(t TokenType) string {
	for name, typ := range symbols() {
		if typ == lexer.TokenType(t) {
			return name
		}
	}
	return fmt.Sprintf("type(%d)", t)
}

// lexTokens lexes src and returns its tokens without the final EOF.
func lexTokens(t *testing.T, src string) ([]tok, []Comment, Diagnostics) {
	t.Helper()
	toks, comments, diags := Lex("t.hess", []byte(src))
	if len(toks) == 0 || toks[len(toks)-1].Type != EOF {
		t.Fatalf("Lex(%q): token list does not end with EOF", src)
	}
	out := make([]tok, 0, len(toks)-1)
	for _, k := range toks[:len(toks)-1] {
		out = append(out, tok{k.Type, k.Value})
	}
	return out, comments, diags
}

func TestLexTokens(t *testing.T) {
	ref := func(v string) tok { return tok{Ref, v} }
	word := func(v string) tok { return tok{Word, v} }
	num := func(v string) tok { return tok{Number, v} }
	punct := func(v string) tok { return tok{Punct, v} }
	kw := func(v string) tok { return tok{Keyword, v} }
	str := func(v string) tok { return tok{String, v} }

	tests := []struct {
		name string
		src  string
		want []tok
	}{
		// species references
		{"gas", "CO2(g)", []tok{ref("CO2(g)")}},
		{"group and state", "Ca(OH)2(s)", []tok{ref("Ca(OH)2(s)")}},
		{"group without state", "Ca(OH)2", []tok{word("Ca(OH)2")}},
		{"caret charge", "SO4^2-(aq)", []tok{ref("SO4^2-(aq)")}},
		{"caret plus", "Fe^3+(aq)", []tok{ref("Fe^3+(aq)")}},
		{"single plus", "Ag+(aq)", []tok{ref("Ag+(aq)")}},
		{"sign run", "SO4--(aq)", []tok{ref("SO4--(aq)")}},
		{"electron", "e-", []tok{word("e-")}},
		{"declared name", "iC3H7(g)", []tok{ref("iC3H7(g)")}},
		{"declared phase", "NaCl(melt)", []tok{ref("NaCl(melt)")}},
		{"adduct", "CuSO4*5H2O(s)", []tok{ref("CuSO4*5H2O(s)")}},
		{"upper-case tag is a group", "Ca(OH)", []tok{word("Ca(OH)")}},
		{"charged, no state", "OH-", []tok{word("OH-")}},
		{"two terms", "Ag+(aq) + Cl-(aq)", []tok{ref("Ag+(aq)"), punct("+"), ref("Cl-(aq)")}},
		{"charge before one-way arrow", "OH- -> H2O(l)", []tok{word("OH-"), punct("->"), ref("H2O(l)")}},
		{"plus touching is one word", "A(g)+B(g)", []tok{ref("A(g)+B(g)")}},

		// numbers
		{"negative decimal", "-74.87", []tok{num("-74.87")}},
		{"scientific", "3.5e15", []tok{num("3.5e15")}},
		{"signed exponent", "6.02E+23 1e-3", []tok{num("6.02E+23"), num("1e-3")}},
		{"fraction", "1/2", []tok{num("1/2")}},
		{"huge", "1e999", []tok{num("1e999")}},
		{"leading point", ".5 -.25", []tok{num(".5"), num("-.25")}},
		{"plus sign", "+3", []tok{num("+3")}},
		{"signed fraction is no number", "-1/2", []tok{word("-1/2")}},
		{"fraction without denominator", "1/", []tok{word("1/")}},
		{"exponent without digits", "2e", []tok{num("2"), word("e")}},

		// a number running into letters is two tokens
		{"number and unit", "298.15K", []tok{num("298.15"), word("K")}},
		{"coefficient and species", "2H2O(g)", []tok{num("2"), ref("H2O(g)")}},
		{"fraction and species", "1/2O2(g)", []tok{num("1/2"), ref("O2(g)")}},
		{"electrons", "2e-", []tok{num("2"), word("e-")}},
		{"number and degree", "25°C", []tok{num("25"), word("°C")}},
		{"number and keyword", "2s", []tok{num("2"), kw("s")}},
		{"digits then symbol", "1++", []tok{word("1++")}},

		// units
		{"energy", "kJ/mol", []tok{word("kJ/mol")}},
		{"parenthesised", "J/(mol*K)", []tok{word("J/(mol*K)")}},
		{"parenthesised single", "J/(mol)", []tok{word("J/(mol)")}},
		{"powers", "J*mol^-1*K^-1", []tok{word("J*mol^-1*K^-1")}},
		{"rate prefactor", "cm3/mol/s", []tok{word("cm3/mol/s")}},
		{"per second", "1/s", []tok{word("1/s")}},
		{"celsius", "°C degC", []tok{word("°C"), word("degC")}},
		{"quantity", "-393.51 ± 0.13 kJ/mol", []tok{num("-393.51"), punct("±"), num("0.13"), word("kJ/mol")}},
		{"ascii uncertainty", "1 +- 0.1 K", []tok{num("1"), punct("+-"), num("0.1"), word("K")}},
		{"uncertainty touching", "1±0.1", []tok{num("1"), punct("±"), num("0.1")}},
		{"ascii uncertainty touching", "-74.9+-0.4 1+- 2 +-.5", []tok{num("-74.9"), punct("+-"), num("0.4"), num("1"), punct("+-"), num("2"), punct("+-"), num(".5")}},
		{"plus-minus not before a number", "+-x X+- +-", []tok{word("+-x"), word("X+-"), punct("+-")}},

		// arrows and punctuation
		{"arrows", "<-> ⇌ -> →", []tok{punct("<->"), punct("⇌"), punct("->"), punct("→")}},
		{"delimiters", "{}:,=", []tok{punct("{"), punct("}"), punct(":"), punct(","), punct("=")}},
		{"name and colon", "reaction r1:", []tok{kw("reaction"), word("r1"), punct(":")}},
		{"list", "A(g),B(g)", []tok{ref("A(g)"), punct(","), ref("B(g)")}},
		{"combination signs", "= a + 2 b - c", []tok{punct("="), word("a"), punct("+"), num("2"), word("b"), punct("-"), word("c")}},
		{"identifiers", "unused-species shift_2 _x", []tok{word("unused-species"), word("shift_2"), word("_x")}},

		// keywords
		{"statement keywords", "include settings element phase species reaction mixture",
			[]tok{kw("include"), kw("settings"), kw("element"), kw("phase"), kw("species"), kw("reaction"), kw("mixture")}},
		{"property keywords", "hf gf s cp A n Ea", []tok{kw("hf"), kw("gf"), kw("s"), kw("cp"), kw("A"), kw("n"), kw("Ea")}},
		{"keywords are case-sensitive", "Species HF", []tok{word("Species"), word("HF")}},

		// strings
		{"string", `"gases.hess"`, []tok{str(`"gases.hess"`)}},
		{"escapes", `"a \"b\" \\ c"`, []tok{str(`"a \"b\" \\ c"`)}},
		{"string ends word", `x"y"`, []tok{word("x"), str(`"y"`)}},
		{"empty string", `""`, []tok{str(`""`)}},
		{"non-ASCII string", `"ΔfH° ⇌"`, []tok{str(`"ΔfH° ⇌"`)}},

		// comments and white space
		{"comment only", "# demo", nil},
		{"comment ends word", "CO2(g)# note", []tok{ref("CO2(g)")}},
		{"hash in string", `"a # b"`, []tok{str(`"a # b"`)}},
		{"tabs and CRLF", "a\tb\r\nc", []tok{word("a"), word("b"), word("c")}},
		{"empty", "", nil},
		{"byte order mark", "\ufeffspecies X", []tok{kw("species"), word("X")}},
		{"byte order mark later is text", "a \ufeffb", []tok{word("a"), word("\ufeffb")}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			got, _, diags := lexTokens(t, tc.src)
			if len(diags) != 0 {
				t.Errorf("Lex(%q): unexpected diagnostics %v", tc.src, diags)
			}
			if fmt.Sprint(got) != fmt.Sprint(tc.want) {
				t.Errorf("Lex(%q)\n got  %v\n want %v", tc.src, got, tc.want)
			}
		})
	}
}

func TestLexComments(t *testing.T) {
	src := "# first\r\nspecies X(g) # trailing ⇌\n#\n  #x#y"
	_, comments, diags := lexTokens(t, src)
	if len(diags) != 0 {
		t.Fatalf("unexpected diagnostics %v", diags)
	}
	want := []Comment{
		{Span{"t.hess", Pos{1, 1, 0}, Pos{1, 8, 7}}, "# first"},
		{Span{"t.hess", Pos{2, 14, 22}, Pos{2, 26, 36}}, "# trailing ⇌"},
		{Span{"t.hess", Pos{3, 1, 37}, Pos{3, 2, 38}}, "#"},
		{Span{"t.hess", Pos{4, 3, 41}, Pos{4, 7, 45}}, "#x#y"},
	}
	if fmt.Sprint(comments) != fmt.Sprint(want) {
		t.Errorf("comments\n got  %v\n want %v", comments, want)
	}
	for _, c := range comments {
		if got := src[c.Span.Start.Offset:c.Span.End.Offset]; got != c.Text {
			t.Errorf("comment %q: span covers %q", c.Text, got)
		}
	}
}

func TestLexPositions(t *testing.T) {
	// Line 2 has non-ASCII characters before its tokens: columns count code
	// points, offsets count bytes.
	src := "species CO2(g)\n\"ΔfH° ⇌\" µ → Fe^3+(aq)\r\n\t2H2O(g)"
	toks, _, diags := Lex("t.hess", []byte(src))
	if len(diags) != 0 {
		t.Fatalf("unexpected diagnostics %v", diags)
	}
	type at struct {
		val                  string
		line, column, offset int
	}
	want := []at{
		{"species", 1, 1, 0},
		{"CO2(g)", 1, 9, 8},
		{`"ΔfH° ⇌"`, 2, 1, 15},
		{"µ", 2, 10, 28},
		{"→", 2, 12, 31},
		{"Fe^3+(aq)", 2, 14, 35},
		{"2", 3, 2, 47},
		{"H2O(g)", 3, 3, 48},
		{"", 3, 9, 54}, // EOF
	}
	if len(toks) != len(want) {
		t.Fatalf("got %d tokens, want %d: %v", len(toks), len(want), toks)
	}
	source := NewSource("t.hess", src)
	for i, w := range want {
		k := toks[i]
		p := source.Span(k)
		if k.Value != w.val || p.Start.Line != w.line || p.Start.Column != w.column || p.Start.Offset != w.offset {
			t.Errorf("token %d: got %q at %d:%d@%d, want %q at %d:%d@%d", i,
				k.Value, p.Start.Line, p.Start.Column, p.Start.Offset, w.val, w.line, w.column, w.offset)
		}
		if p.File != "t.hess" {
			t.Errorf("token %d: file %q", i, p.File)
		}
		if src[k.Offset:k.End()] != k.Value {
			t.Errorf("token %d: value %q is not the source text at its offset", i, k.Value)
		}
	}
	// A token's span ends after the token, in code points and bytes.
	s := source.Span(toks[2])
	if s.End != (Pos{Line: 2, Column: 9, Offset: 27}) {
		t.Errorf("the string's span ends at %+v", s.End)
	}
}

func TestLexByteOrderMark(t *testing.T) {
	src := "\ufeffspecies A(g)"
	toks, _, diags := Lex("t.hess", []byte(src))
	if len(diags) != 0 {
		t.Fatalf("diagnostics %v", diags)
	}
	source := NewSource("t.hess", src)
	if p := source.Pos(int(toks[0].Offset)); p.Line != 1 || p.Column != 1 || p.Offset != 3 {
		t.Errorf("first token at %d:%d@%d, want 1:1@3", p.Line, p.Column, p.Offset)
	}
	if p := source.Pos(int(toks[1].Offset)); p.Column != 9 || p.Offset != 11 {
		t.Errorf("second token at column %d offset %d, want 9 and 11", p.Column, p.Offset)
	}
}

func TestLexDiagnostics(t *testing.T) {
	tests := []struct {
		name string
		src  string
		msg  string // substring of the only diagnostic
		at   Pos    // its start
		toks int    // tokens besides EOF
	}{
		{"invalid UTF-8", "a \xff b", "invalid UTF-8 byte 0xff", Pos{1, 3, 2}, 2},
		{"invalid UTF-8 in a word", "ab\xc3(g)", "invalid UTF-8 byte 0xc3", Pos{1, 3, 2}, 2},
		{"NUL", "x\x00y", "invalid control character U+0000", Pos{1, 2, 1}, 2},
		{"control", "é\x01", "invalid control character U+0001", Pos{1, 2, 2}, 1},
		{"DEL", "\x7f", "invalid control character U+007F", Pos{1, 1, 0}, 0},
		{"unterminated string", "include \"gases.hess\nspecies", "string is not closed on its line", Pos{1, 9, 8}, 3},
		{"unterminated string at CRLF", "\"abc\r\nx", "string is not closed on its line", Pos{1, 1, 0}, 2},
		{"unterminated at end of file", `"abc\`, "string is not closed on its line", Pos{1, 1, 0}, 1},
		{"bad escape", `"a\nb"`, `only \" and \\ are allowed`, Pos{1, 1, 0}, 1},
		{"invalid UTF-8 in a string", "\"a\xffb\"", "string has invalid UTF-8 byte 0xff", Pos{1, 3, 2}, 1},
		{"control in a string", "x \"a\x00\"", "string has invalid control character U+0000", Pos{1, 5, 4}, 2},
		{"NUL in a comment", "# ok\n#  é\x00", "comment has invalid control character U+0000", Pos{2, 5, 10}, 0},
		{"invalid UTF-8 in a comment", "#\xfe", "comment has invalid UTF-8 byte 0xfe", Pos{1, 2, 1}, 0},
		{"run of invalid bytes", "a\xff\xfe\x80b", "3 invalid UTF-8 bytes starting with 0xff", Pos{1, 2, 1}, 2},
		{"control run stops at a line end", "\v\v\nx", "2 invalid control characters starting with U+000B", Pos{1, 1, 0}, 1},
		{"run of control characters", "a \x00\x00\x01", "3 invalid control characters starting with U+0000", Pos{1, 3, 2}, 1},
		{"truncated rune", "Fe\xe2\x87", "2 invalid UTF-8 bytes starting with 0xe2", Pos{1, 3, 2}, 1},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			got, _, diags := lexTokens(t, tc.src)
			if len(diags) != 1 {
				t.Fatalf("Lex(%q): got %d diagnostics %v, want 1", tc.src, len(diags), diags)
			}
			d := diags[0]
			if d.Code != "syntax" || d.Severity != Error {
				t.Errorf("diagnostic is %s %s, want syntax error", d.Code, d.Severity)
			}
			if !strings.Contains(d.Message, tc.msg) {
				t.Errorf("message %q does not contain %q", d.Message, tc.msg)
			}
			if d.Subject.Start != tc.at || d.Subject.File != "t.hess" {
				t.Errorf("diagnostic at %+v in %q, want %+v", d.Subject.Start, d.Subject.File, tc.at)
			}
			if d.Subject.End.Offset <= d.Subject.Start.Offset {
				t.Errorf("diagnostic span %+v is empty", d.Subject)
			}
			if len(got) != tc.toks {
				t.Errorf("got %d tokens %v, want %d", len(got), got, tc.toks)
			}
		})
	}
}

func TestLexDiagnosticCap(t *testing.T) {
	// Alternating bad bytes and letters: one diagnostic per run, capped.
	src := strings.Repeat("\x00a\xffb", 1000)
	toks, _, diags := Lex("t.hess", []byte(src))
	if len(diags) != maxLexDiagnostics {
		t.Fatalf("got %d diagnostics, want %d", len(diags), maxLexDiagnostics)
	}
	if last := diags[len(diags)-1]; !strings.Contains(last.Message, "too many invalid characters") {
		t.Errorf("last diagnostic %q", last.Message)
	}
	if len(toks) != 2001 {
		t.Errorf("got %d tokens, want 2001", len(toks))
	}
	// Other lexer errors do not use up the cap or hide its notice.
	src = strings.Repeat("\"\\x\" ", 150) + strings.Repeat("\x00a", 200)
	_, _, diags = Lex("t.hess", []byte(src))
	if len(diags) != 150+maxLexDiagnostics || !strings.Contains(diags[len(diags)-1].Message, "too many") {
		t.Errorf("got %d diagnostics, last %q", len(diags), diags[len(diags)-1].Message)
	}
}

func TestKeywords(t *testing.T) {
	list := Keywords()
	if len(list) != len(keywords) {
		t.Fatalf("Keywords() has %d words, want %d", len(list), len(keywords))
	}
	for i, k := range list {
		if !IsKeyword(k) {
			t.Errorf("IsKeyword(%q) = false", k)
		}
		if i > 0 && list[i-1] >= k {
			t.Errorf("Keywords() not sorted at %q", k)
		}
	}
	for k := range statementKeywords {
		if !IsKeyword(k) {
			t.Errorf("statement keyword %q is not a keyword", k)
		}
	}
	if IsKeyword("CO2") || IsKeyword("") {
		t.Error("IsKeyword accepts a non-keyword")
	}
}

// TestIsKeywordAgreesWithTheList checks the lexer's lookup of keywords by
// first byte against the list of reserved words.
func TestIsKeywordAgreesWithTheList(t *testing.T) {
	for _, k := range Keywords() {
		for _, w := range []string{k, k + "x", k[:len(k)-1], strings.ToUpper(k), "é" + k} {
			if IsKeyword(w) != keywords[w] {
				t.Errorf("IsKeyword(%q) = %v", w, IsKeyword(w))
			}
		}
	}
	if IsKeyword("") {
		t.Error("the empty word is a keyword")
	}
}
