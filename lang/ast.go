// Package lang reads and prints network files (.hess): the lexer, the
// grammar and its syntax tree with exact source spans, the parser that
// recovers after syntax errors, the canonical formatter, and the Diagnostic
// and Span types every other package reports with.
package lang

import "github.com/alecthomas/participle/v2/lexer"

// The syntax tree. Every node is a run of its statement group's tokens
// (Node.Tokens), from which its exact Span follows through the file's
// Source (see Node.Span).
// The struct tags are participle's grammar for the nodes it reads; the
// nodes read by hand have their grammar in production values (the *Rule
// variables of statements.go, properties.go and leaves.go).

// File is one parsed source file.
type File struct {
	Name string
	// Source is the file's text and line index, which every node's
	// tokens resolve their positions through.
	Source     *Source
	Statements []*Statement
	Comments   []Comment
}

// Statement is one top-level statement; exactly one field is set on a
// statement that parsed. A statement that failed to parse keeps what was
// read of it (Broken is true).
type Statement struct {
	Node
	Include  *Include
	Settings *Settings
	Element  *Element
	Phase    *Phase
	Species  *Species
	Reaction *Reaction
	Mixture  *Mixture

	// Broken reports that the statement did not parse completely.
	Broken bool

	lineage uint64 // see Lineage
}

// Lineage is a number a statement shares with every copy the parse cache
// makes of it at another place (moved by an edit before it), and with no
// other statement: statements of one file with the same Lineage have the
// same text. Compilers key what they derive from a statement's text by
// it.
func (st *Statement) Lineage() uint64 { return st.lineage }

// Node is the run of its statement group's tokens that a node spans (see
// Tokens), in 16 bytes: the group, which knows the Source its tokens'
// offsets resolve through, and the run's bounds in it. A node that has no
// tokens of its own (a statement that failed before its end, say) may
// keep where it starts as an empty run at the token there; its Span is
// then empty at that token.
type Node struct {
	g          *tokenGroup
	start, end int32 // the node's tokens are g.toks[start:end]
}

// tokenGroup is the token array of one group of statements, which their
// nodes share, and the Source the tokens were read from.
type tokenGroup struct {
	src  *Source
	toks []Token
}

// ParsedNode is the Node of a node that participle reads: participle
// records the positions where it started and where the token after it
// stands, from which the parser finds its tokens; a node that failed
// part-way has only its start (the parser turns it into an empty run of
// tokens there).
type ParsedNode struct {
	Pos    lexer.Position
	EndPos lexer.Position
	Node
}

// Include is `include "path"`: another file's statements pulled in.
type Include struct {
	ParsedNode
	Path *Str `parser:"'include' @@"`
}

// Str is a string literal; Raw keeps the quotes and escapes as written.
type Str struct {
	Node
	Raw string
}

// Ident is a name: a reaction, mixture, element, phase or check name.
type Ident struct {
	Node
	Name string
}

// Num is a bare number as written.
type Num struct {
	Node
	Text string
}

// Quantity is a number with an optional standard uncertainty and unit.
// Unit is nil where none was written (which is `missing-unit` wherever one
// is required).
type Quantity struct {
	Node
	Value *Num
	Sigma *Num
	Unit  *Unit
}

// Unit is a unit token such as kJ/mol.
type Unit struct {
	Node
	Text string
}

// Settings is the `settings { … }` block.
type Settings struct {
	ParsedNode
	Items []*Setting `parser:"'settings' '{' @@* '}'"`
}

// Setting is one key of a settings block.
type Setting struct {
	ParsedNode
	Pressure *Quantity `parser:"  'pressure' @@"`
	// StandardPressure is the standard pressure the file's own data refer
	// to; unlike the other keys it may stand in an included file.
	StandardPressure *Quantity  `parser:"| 'standard-pressure' @@"`
	Temperatures     []*TempSet `parser:"| 'temperatures' @@ ( ',' @@ )*"`
	Tolerance        *Quantity  `parser:"| 'tolerance' @@"`
	Lint             *Lint      `parser:"| 'lint' @@"`
	Activity         *Ident     `parser:"| 'activity' @@"`
}

// TempSet is one item of a temperature list: a single temperature, or a
// range From to To by By.
type TempSet struct {
	ParsedNode
	From *Quantity `parser:"@@"`
	To   *Quantity `parser:"( 'to' @@"`
	By   *Quantity `parser:"  'by' @@ )?"`
}

// Lint changes the severity of one check.
type Lint struct {
	ParsedNode
	Check *Ident `parser:"@@"`
	Level *Ident `parser:"@@"`
}

// Element declares an element beyond the built-in table.
type Element struct {
	ParsedNode
	Symbol *Ident    `parser:"'element' @@ '{'"`
	Mass   *Quantity `parser:"( 'mass' @@ )? '}'"`
}

// Phase declares a state tag and its activity convention.
type Phase struct {
	ParsedNode
	Name       *Ident `parser:"'phase' @@ '{'"`
	Convention *Ident `parser:"( 'convention' @@ )? '}'"`
}

// SpeciesRef is a species reference as written, e.g. Ca(OH)2(s).
type SpeciesRef struct {
	Node
	Text string
}

// Species declares one species with its data, or several without data.
type Species struct {
	Node
	Refs    []*SpeciesRef
	Label   *Str
	HasBody bool
	Props   []*SpeciesProperty
}

// SpeciesProperty is one property of a species block.
type SpeciesProperty struct {
	Node
	Formula *FormulaProp
	Value   *SpeciesValue
	Poly    *Polynomial
	Text    *TextProp
}

// FormulaProp is `formula C3H7`: the formula of a species whose name is
// not one.
type FormulaProp struct {
	Node
	Formula *SpeciesRef
}

// SpeciesValue is one of hf, gf, s, cp, size (an ion-size parameter) and
// setschenow (a neutral solute's salting coefficient) with its quantity.
type SpeciesValue struct {
	Node
	Key   string
	Value *Quantity
}

// Polynomial is a shomate or nasa7 range with its coefficients.
type Polynomial struct {
	Node
	Kind   string
	From   *Quantity
	To     *Quantity
	Coeffs []*Num
}

// TextProp is `source "…"` or `note "…"`.
type TextProp struct {
	Node
	Key  string
	Text *Str
}

// Reaction is one reaction statement.
type Reaction struct {
	Node
	Name    *Ident
	Left    []*Term
	Arrow   *Arrow
	Right   []*Term
	Combo   *Combination
	HasBody bool
	Props   []*ReactionProperty
}

// Arrow is <-> (or ⇌) for a two-way reaction, -> (or →) for a one-way step.
type Arrow struct {
	Node
	Text string
}

// TwoWay reports whether the arrow is an equilibrium arrow.
func (a *Arrow) TwoWay() bool { return a.Text == "<->" || a.Text == "⇌" }

// Term is a coefficient and a species on one side of a reaction.
type Term struct {
	Node
	Coef    *Num
	Species *SpeciesRef
}

// Combination is the weighted sum of reactions a coupled reaction claims
// to be. Every term after the first carries a sign.
type Combination struct {
	ParsedNode
	Terms []*ComboTerm `parser:"@@ ( (?= '+' | '-' ) @@ )*"`
}

// ComboTerm is one signed, weighted reaction name in a combination.
type ComboTerm struct {
	ParsedNode
	Sign string `parser:"@( '+' | '-' )?"`
	Coef *Num   `parser:"@@?"`
	Name *Ident `parser:"@@"`
}

// ReactionProperty is one property of a reaction block.
type ReactionProperty struct {
	Node
	Value *ReactionValue
	LogK  *LogK
	Rate  *Rate
	Text  *TextProp
}

// ReactionValue is one of dg, dh, ds with its quantity.
type ReactionValue struct {
	Node
	Key   string
	Value *Quantity
}

// LogK is `logk V [± U] [at T]`: a measured log10 K, at 298.15 K unless
// At is set.
type LogK struct {
	Node
	Value *Num
	Sigma *Num
	At    *Quantity
}

// Rate is a forward (`rate`) or reverse (`reverse`) modified Arrhenius
// rate.
type Rate struct {
	Node
	Kind string
	A    *Quantity
	N    *Num
	Ea   *Quantity
}

// Mixture is a named composition at a temperature and pressure.
type Mixture struct {
	ParsedNode
	Name  *Ident     `parser:"'mixture' @@ '{'"`
	Items []*MixItem `parser:"@@* '}'"`
}

// MixItem is one line of a mixture.
type MixItem struct {
	ParsedNode
	Temperature *Quantity  `parser:"  'temperature' @@"`
	Pressure    *Quantity  `parser:"| 'pressure' @@"`
	Member      *MixMember `parser:"| @@"`
}

// MixMember is a species with an optional amount.
type MixMember struct {
	ParsedNode
	Species *SpeciesRef `parser:"@@"`
	Amount  *Quantity   `parser:"@@?"`
	// Fixed holds a gas at its partial pressure: the mixture is open to a
	// reservoir of it.
	Fixed bool `parser:"@'fixed'?"`
}
