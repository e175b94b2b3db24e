package lang

import (
	"unsafe"

	"github.com/alecthomas/participle/v2/lexer"
)

// moved copies a statement as if it had been parsed at offset at of src:
// every node and token moves by the same number of bytes, into a group of
// the statement's tokens and the one after them. Every string of the tree
// that is a slice of the old text becomes the same slice of src's, so the
// copy keeps no part of the old text alive.
//
// The copy is written out type by type (an insertion in an open file
// moves every statement after it, so this runs thousands of times per
// edit); TestMovedCoversEveryField fails when a field is added to the
// syntax tree that it does not copy. Each node is allocated on its own:
// one array of nodes per kind and statement, sized by a first count, made
// a third as many allocations, but neither the move nor a collection of
// the moved trees got faster (on the generated mechanism of
// BenchmarkMoveStatements).
func moved(st *Statement, src *Source, at int) *Statement {
	return newMover(st, src, at).statement(st)
}

// newMover is the mover of st to offset at of src, with st's tokens (and
// the one after them) already copied into the new group.
func newMover(st *Statement, src *Source, at int) *mover {
	old, first := st.g, int(st.start)
	last := min(int(st.end)+1, len(old.toks))
	m := &mover{old: old, first: first, dOff: at - int(old.toks[first].Offset), src: src}
	m.g = &tokenGroup{src: src, toks: make([]Token, last-first)}
	for i, t := range old.toks[first:last] {
		t.Offset += int32(m.dOff)
		t.Value = m.rebase(t.Value)
		m.g.toks[i] = t
	}
	return m
}

type mover struct {
	old, g *tokenGroup // the statement's group before and after the move
	first  int         // index in old of the statement's first token
	dOff   int
	src    *Source
}

// rebase is s, when it is a slice of the old text, as the same slice of
// the new text (where the statement's text is the same, dOff further on),
// so that the moved statement keeps no part of the old text alive; other
// strings are kept.
func (m *mover) rebase(s string) string {
	old := m.old.src.text
	if len(s) == 0 || len(old) == 0 {
		return s
	}
	p, base := uintptr(unsafe.Pointer(unsafe.StringData(s))), uintptr(unsafe.Pointer(unsafe.StringData(old)))
	if p < base || p-base+uintptr(len(s)) > uintptr(len(old)) {
		return s
	}
	at := int(p-base) + m.dOff
	if at < 0 || at+len(s) > len(m.src.text) || m.src.text[at:at+len(s)] != s {
		return s
	}
	return m.src.text[at : at+len(s)]
}

func (m *mover) pos(p lexer.Position) lexer.Position {
	if p.Line == 0 {
		return p
	}
	return m.src.position(p.Offset + m.dOff)
}

// node is n moved: its run of the moved group.
func (m *mover) node(n Node) Node {
	if n.g != m.old {
		return Node{}
	}
	start, end := int(n.start)-m.first, int(n.end)-m.first
	if start < 0 || end > len(m.g.toks) || start > end {
		return Node{}
	}
	return Node{g: m.g, start: int32(start), end: int32(end)}
}

func (m *mover) parsed(n ParsedNode) ParsedNode {
	return ParsedNode{Pos: m.pos(n.Pos), EndPos: m.pos(n.EndPos), Node: m.node(n.Node)}
}

// list is a list of n nodes for the copy of ps: nil for nil, and, as
// for the reflective copy it replaced, empty but not nil for empty.
func list[T any](ps []T) []T {
	if ps == nil {
		return nil
	}
	return make([]T, len(ps))
}

// The copies, one function per node type: each returns nil for nil.

func (m *mover) statement(st *Statement) *Statement {
	return &Statement{
		Node:     m.node(st.Node),
		Include:  m.include(st.Include),
		Settings: m.settings(st.Settings),
		Element:  m.element(st.Element),
		Phase:    m.phase(st.Phase),
		Species:  m.species(st.Species),
		Reaction: m.reaction(st.Reaction),
		Mixture:  m.mixture(st.Mixture),
		Broken:   st.Broken,
		lineage:  st.lineage,
	}
}

func (m *mover) include(n *Include) *Include {
	if n == nil {
		return nil
	}
	return &Include{ParsedNode: m.parsed(n.ParsedNode), Path: m.str(n.Path)}
}

func (m *mover) str(n *Str) *Str {
	if n == nil {
		return nil
	}
	return &Str{Node: m.node(n.Node), Raw: m.rebase(n.Raw)}
}

func (m *mover) ident(n *Ident) *Ident {
	if n == nil {
		return nil
	}
	return &Ident{Node: m.node(n.Node), Name: m.rebase(n.Name)}
}

func (m *mover) num(n *Num) *Num {
	if n == nil {
		return nil
	}
	return &Num{Node: m.node(n.Node), Text: m.rebase(n.Text)}
}

func (m *mover) nums(ns []*Num) []*Num {
	l := list(ns)
	for i, n := range ns {
		l[i] = m.num(n)
	}
	return l
}

func (m *mover) quantity(n *Quantity) *Quantity {
	if n == nil {
		return nil
	}
	return &Quantity{Node: m.node(n.Node), Value: m.num(n.Value), Sigma: m.num(n.Sigma), Unit: m.unit(n.Unit)}
}

func (m *mover) unit(n *Unit) *Unit {
	if n == nil {
		return nil
	}
	return &Unit{Node: m.node(n.Node), Text: m.rebase(n.Text)}
}

func (m *mover) settings(n *Settings) *Settings {
	if n == nil {
		return nil
	}
	c := &Settings{ParsedNode: m.parsed(n.ParsedNode)}
	c.Items = list(n.Items)
	for i, s := range n.Items {
		c.Items[i] = m.setting(s)
	}
	return c
}

func (m *mover) setting(n *Setting) *Setting {
	if n == nil {
		return nil
	}
	c := &Setting{
		ParsedNode:       m.parsed(n.ParsedNode),
		Pressure:         m.quantity(n.Pressure),
		StandardPressure: m.quantity(n.StandardPressure),
		Tolerance:        m.quantity(n.Tolerance),
		Lint:             m.lint(n.Lint),
		Activity:         m.ident(n.Activity),
	}
	c.Temperatures = list(n.Temperatures)
	for i, t := range n.Temperatures {
		c.Temperatures[i] = m.tempSet(t)
	}
	return c
}

func (m *mover) tempSet(n *TempSet) *TempSet {
	if n == nil {
		return nil
	}
	return &TempSet{ParsedNode: m.parsed(n.ParsedNode), From: m.quantity(n.From), To: m.quantity(n.To), By: m.quantity(n.By)}
}

func (m *mover) lint(n *Lint) *Lint {
	if n == nil {
		return nil
	}
	return &Lint{ParsedNode: m.parsed(n.ParsedNode), Check: m.ident(n.Check), Level: m.ident(n.Level)}
}

func (m *mover) element(n *Element) *Element {
	if n == nil {
		return nil
	}
	return &Element{ParsedNode: m.parsed(n.ParsedNode), Symbol: m.ident(n.Symbol), Mass: m.quantity(n.Mass)}
}

func (m *mover) phase(n *Phase) *Phase {
	if n == nil {
		return nil
	}
	return &Phase{ParsedNode: m.parsed(n.ParsedNode), Name: m.ident(n.Name), Convention: m.ident(n.Convention)}
}

func (m *mover) ref(n *SpeciesRef) *SpeciesRef {
	if n == nil {
		return nil
	}
	return &SpeciesRef{Node: m.node(n.Node), Text: m.rebase(n.Text)}
}

func (m *mover) species(n *Species) *Species {
	if n == nil {
		return nil
	}
	c := &Species{Node: m.node(n.Node), Label: m.str(n.Label), HasBody: n.HasBody}
	c.Refs = list(n.Refs)
	for i, r := range n.Refs {
		c.Refs[i] = m.ref(r)
	}
	c.Props = list(n.Props)
	for i, p := range n.Props {
		c.Props[i] = m.speciesProperty(p)
	}
	return c
}

func (m *mover) speciesProperty(n *SpeciesProperty) *SpeciesProperty {
	if n == nil {
		return nil
	}
	return &SpeciesProperty{
		Node:    m.node(n.Node),
		Formula: m.formulaProp(n.Formula),
		Value:   m.speciesValue(n.Value),
		Poly:    m.polynomial(n.Poly),
		Text:    m.textProp(n.Text),
	}
}

func (m *mover) formulaProp(n *FormulaProp) *FormulaProp {
	if n == nil {
		return nil
	}
	return &FormulaProp{Node: m.node(n.Node), Formula: m.ref(n.Formula)}
}

func (m *mover) speciesValue(n *SpeciesValue) *SpeciesValue {
	if n == nil {
		return nil
	}
	return &SpeciesValue{Node: m.node(n.Node), Key: m.rebase(n.Key), Value: m.quantity(n.Value)}
}

func (m *mover) polynomial(n *Polynomial) *Polynomial {
	if n == nil {
		return nil
	}
	return &Polynomial{
		Node:   m.node(n.Node),
		Kind:   m.rebase(n.Kind),
		From:   m.quantity(n.From),
		To:     m.quantity(n.To),
		Coeffs: m.nums(n.Coeffs),
	}
}

func (m *mover) textProp(n *TextProp) *TextProp {
	if n == nil {
		return nil
	}
	return &TextProp{Node: m.node(n.Node), Key: m.rebase(n.Key), Text: m.str(n.Text)}
}

func (m *mover) reaction(n *Reaction) *Reaction {
	if n == nil {
		return nil
	}
	c := &Reaction{
		Node:    m.node(n.Node),
		Name:    m.ident(n.Name),
		Left:    m.terms(n.Left),
		Arrow:   m.arrow(n.Arrow),
		Right:   m.terms(n.Right),
		Combo:   m.combination(n.Combo),
		HasBody: n.HasBody,
	}
	c.Props = list(n.Props)
	for i, p := range n.Props {
		c.Props[i] = m.reactionProperty(p)
	}
	return c
}

func (m *mover) arrow(n *Arrow) *Arrow {
	if n == nil {
		return nil
	}
	return &Arrow{Node: m.node(n.Node), Text: m.rebase(n.Text)}
}

func (m *mover) terms(ts []*Term) []*Term {
	l := list(ts)
	for i, t := range ts {
		l[i] = m.term(t)
	}
	return l
}

func (m *mover) term(n *Term) *Term {
	if n == nil {
		return nil
	}
	return &Term{Node: m.node(n.Node), Coef: m.num(n.Coef), Species: m.ref(n.Species)}
}

func (m *mover) combination(n *Combination) *Combination {
	if n == nil {
		return nil
	}
	c := &Combination{ParsedNode: m.parsed(n.ParsedNode)}
	c.Terms = list(n.Terms)
	for i, t := range n.Terms {
		c.Terms[i] = m.comboTerm(t)
	}
	return c
}

func (m *mover) comboTerm(n *ComboTerm) *ComboTerm {
	if n == nil {
		return nil
	}
	return &ComboTerm{ParsedNode: m.parsed(n.ParsedNode), Sign: m.rebase(n.Sign), Coef: m.num(n.Coef), Name: m.ident(n.Name)}
}

func (m *mover) reactionProperty(n *ReactionProperty) *ReactionProperty {
	if n == nil {
		return nil
	}
	return &ReactionProperty{
		Node:  m.node(n.Node),
		Value: m.reactionValue(n.Value),
		LogK:  m.logK(n.LogK),
		Rate:  m.rate(n.Rate),
		Text:  m.textProp(n.Text),
	}
}

func (m *mover) reactionValue(n *ReactionValue) *ReactionValue {
	if n == nil {
		return nil
	}
	return &ReactionValue{Node: m.node(n.Node), Key: m.rebase(n.Key), Value: m.quantity(n.Value)}
}

func (m *mover) logK(n *LogK) *LogK {
	if n == nil {
		return nil
	}
	return &LogK{Node: m.node(n.Node), Value: m.num(n.Value), Sigma: m.num(n.Sigma), At: m.quantity(n.At)}
}

func (m *mover) rate(n *Rate) *Rate {
	if n == nil {
		return nil
	}
	return &Rate{Node: m.node(n.Node), Kind: m.rebase(n.Kind), A: m.quantity(n.A), N: m.num(n.N), Ea: m.quantity(n.Ea)}
}

func (m *mover) mixture(n *Mixture) *Mixture {
	if n == nil {
		return nil
	}
	c := &Mixture{ParsedNode: m.parsed(n.ParsedNode), Name: m.ident(n.Name)}
	c.Items = list(n.Items)
	for i, it := range n.Items {
		c.Items[i] = m.mixItem(it)
	}
	return c
}

func (m *mover) mixItem(n *MixItem) *MixItem {
	if n == nil {
		return nil
	}
	return &MixItem{
		ParsedNode:  m.parsed(n.ParsedNode),
		Temperature: m.quantity(n.Temperature),
		Pressure:    m.quantity(n.Pressure),
		Member:      m.mixMember(n.Member),
	}
}

func (m *mover) mixMember(n *MixMember) *MixMember {
	if n == nil {
		return nil
	}
	return &MixMember{ParsedNode: m.parsed(n.ParsedNode), Species: m.ref(n.Species), Amount: m.quantity(n.Amount), Fixed: n.Fixed}
}
