package lang

import (
	"fmt"
	"strings"

	"github.com/alecthomas/participle/v2/lexer"
)

// The grammar of the statements and nodes read by hand (statements.go,
// properties.go, leaves.go) is written once, as production values. Grammar prints them,
// and the readers take from them the literals they match and the words
// an error names as expected, so the printed grammar, what the readers
// accept and what their errors say cannot drift apart. The statements
// participle reads keep their grammar in their struct tags (ast.go).

// expr is one part of a production.
type expr interface {
	ebnf() string // the part in EBNF, as Grammar prints it
	words() []string
}

// lit is a literal token, such as "to".
type lit string

// tokenClass is a kind of token, such as <word>.
type tokenClass TokenType

// ref names another production.
type ref string

// seq is a sequence of parts.
type seq []expr

// alt is a choice between parts.
type alt []expr

// group is a part written in parentheses.
type group struct{ x expr }

// opt is an optional part: x?.
type opt struct{ x expr }

// many is a part repeated zero or more times: x*.
type many struct{ x expr }

// oneOf is a choice between literals, in parentheses.
func oneOf(lits ...string) group {
	a := make(alt, len(lits))
	for i, s := range lits {
		a[i] = lit(s)
	}
	return group{a}
}

func (l lit) ebnf() string        { return fmt.Sprintf("%q", string(l)) }
func (c tokenClass) ebnf() string { return "<" + c.name() + ">" }
func (r ref) ebnf() string        { return string(r) }
func (g group) ebnf() string      { return "(" + g.x.ebnf() + ")" }
func (o opt) ebnf() string        { return atom(o.x) + "?" }
func (m many) ebnf() string       { return atom(m.x) + "*" }
func (s seq) ebnf() string        { return join(s, " ") }
func (a alt) ebnf() string        { return join(a, " | ") }

// atom writes x in parentheses when it has more than one part.
func atom(x expr) string {
	switch x.(type) {
	case seq, alt:
		return "(" + x.ebnf() + ")"
	}
	return x.ebnf()
}

func join(xs []expr, sep string) string {
	parts := make([]string, len(xs))
	for i, x := range xs {
		parts[i] = x.ebnf()
	}
	return strings.Join(parts, sep)
}

// The words of a part name what may start it, for "expected …" messages.

func (l lit) words() []string        { return []string{l.ebnf()} }
func (c tokenClass) words() []string { return []string{"a " + c.name()} }
func (g group) words() []string      { return g.x.words() }
func (o opt) words() []string        { return o.x.words() }
func (m many) words() []string       { return m.x.words() }
func (s seq) words() []string        { return s[0].words() }

// words of a production are how errors name it, or its name where it has
// none.
func (r ref) words() []string {
	if w := productionWords(string(r)); w != "" {
		return []string{w}
	}
	return []string{string(r)}
}

func (a alt) words() []string {
	var out []string
	for _, x := range a {
		for _, w := range x.words() {
			if !contains(out, w) {
				out = append(out, w)
			}
		}
	}
	return out
}

// name is the token type's name in lower case, as participle prints it.
func (c tokenClass) name() string {
	for name, t := range symbols() {
		if t == lexer.TokenType(TokenType(c)) {
			return strings.ToLower(name)
		}
	}
	return fmt.Sprint(int(c))
}

// bit is the token type's bit in a production's mask of first tokens.
func (c tokenClass) bit() uint32 {
	if n := -int(c); n >= 0 && n < 32 {
		return 1 << n
	}
	return 0
}

func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

// production is one rule of the grammar read by hand.
type production struct {
	name string
	// named is how an error names the production where it is expected.
	named string
	body  expr
	// starts holds the literals that can begin the production, and
	// types the kinds of token (one bit each).
	starts map[string]bool
	types  uint32
}

// rule declares a production.
func rule(name, named string, body expr) *production {
	p := &production{name: name, named: named, body: body, starts: map[string]bool{}}
	for _, x := range first(body) {
		switch x := x.(type) {
		case lit:
			p.starts[string(x)] = true
		case tokenClass:
			p.types |= x.bit()
		}
	}
	return p
}

// first are the literals, token classes and references that can begin x.
func first(x expr) []expr {
	switch x := x.(type) {
	case lit, tokenClass, ref:
		return []expr{x}
	case group:
		return first(x.x)
	case opt:
		return first(x.x)
	case many:
		return first(x.x)
	case seq:
		var out []expr
		for _, y := range x {
			out = append(out, first(y)...)
			if !optional(y) {
				break
			}
		}
		return out
	case alt:
		var out []expr
		for _, y := range x {
			out = append(out, first(y)...)
		}
		return out
	}
	return nil
}

// optional reports whether x may match no tokens.
func optional(x expr) bool {
	switch x := x.(type) {
	case opt, many:
		return true
	case group:
		return optional(x.x)
	}
	return false
}

func (p *production) String() string { return p.name + " = " + p.body.ebnf() + " ." }

// at is the i-th part of the production's sequence.
func (p *production) at(i int) expr {
	if s, ok := p.body.(seq); ok && i < len(s) {
		return s[i]
	}
	return p.body
}

// begins reports whether t can start p: a token of one of its first
// kinds, or one of its first literals.
func (p *production) begins(t *Token) bool {
	return p.types&tokenClass(t.Type).bit() != 0 || (p.starts[t.Value] && !isEnd(*t))
}

// isLit reports whether t is the literal part x.
func isLit(t *Token, x expr) bool {
	l, ok := x.(lit)
	return ok && t.Value == string(l) && !isEnd(*t)
}

// isOneOf reports whether t is one of the literals of x, a choice of
// literals made by oneOf.
func isOneOf(t *Token, x group) bool {
	if isEnd(*t) {
		return false
	}
	a, _ := x.x.(alt)
	for _, y := range a {
		if l, ok := y.(lit); ok && t.Value == string(l) {
			return true
		}
	}
	return false
}

// leafProductions are the nodes that parse themselves (leaves.go), in the
// order Grammar prints them.
var leafProductions = []*production{
	quantityRule, termRule,
	speciesPropertyRule, formulaRule, speciesValueRule, polynomialRule, textRule,
	reactionPropertyRule, reactionValueRule, logKRule, rateRule,
	arrowRule, speciesRefRule, identRule, numRule, unitRule, strRule,
}

// handProductions indexes every production read by hand by name.
var handProductions = func() map[string]*production {
	m := map[string]*production{}
	for _, p := range append([]*production{statementRule, speciesRule, reactionRule}, leafProductions...) {
		m[p.name] = p
	}
	return m
}()

// participleWords name the productions participle reads where an error
// expects them.
var participleWords = map[string]string{
	"Setting":     "a setting (pressure, temperatures, tolerance, lint)",
	"TempSet":     "a temperature",
	"Lint":        "a check name",
	"MixItem":     "a mixture item (temperature, pressure, or a species)",
	"MixMember":   "a species",
	"Combination": "a reaction name",
	"ComboTerm":   "a reaction name",
}

// productionWords names the production called name for an error, or
// returns "" when it has no name.
func productionWords(name string) string {
	if p, ok := handProductions[name]; ok {
		return p.named
	}
	return participleWords[name]
}

// Grammar returns the grammar in EBNF, for review and golden tests: the
// statements in order, then the nodes that parse themselves.
func Grammar() string {
	lines := []string{statementRule.String()}
	for _, k := range statementKinds {
		lines = append(lines, k.grammar())
	}
	for _, p := range leafProductions {
		lines = append(lines, p.String())
	}
	return strings.Join(lines, "\n")
}
