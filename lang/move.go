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
// syntax tree that it does not copy. The nodes come from arrays sized by a
// first pass over the statement (moveCounts), a few allocations per
// statement instead of one per node.
func moved(st *Statement, src *Source, at int) *Statement {
	var m mover
	m.init(st, src, at)
	return m.statement(st)
}

// init makes m the mover of st to offset at of src: the statement's tokens
// moved into m.g, m.a holding as many nodes of each kind as st.
func (m *mover) init(st *Statement, src *Source, at int) {
	old, first := st.g, int(st.start)
	last := min(int(st.end)+1, len(old.toks))
	*m = mover{old: old, first: first, dOff: at - int(old.toks[first].Offset), src: src}
	m.g = &tokenGroup{src: src, toks: make([]Token, last-first)}
	for i, t := range old.toks[first:last] {
		t.Offset += int32(m.dOff)
		t.Value = m.rebase(t.Value)
		m.g.toks[i] = t
	}
	var c moveCounts
	c.statement(st)
	m.a.make(&c)
}

type mover struct {
	old, g *tokenGroup // the statement's group before and after the move
	first  int         // index in old of the statement's first token
	dOff   int
	src    *Source
	a      moveArena
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

// moveArena holds the nodes of one moved statement, one array per kind,
// each sized by moveCounts; arenaNext hands them out in turn.
type moveArena struct {
	includes     []Include
	settings     []Settings
	settingItems []Setting
	tempSets     []TempSet
	lints        []Lint
	elements     []Element
	phases       []Phase
	species      []Species
	sprops       []SpeciesProperty
	formulas     []FormulaProp
	svalues      []SpeciesValue
	polys        []Polynomial
	textProps    []TextProp
	reactions    []Reaction
	arrows       []Arrow
	terms        []Term
	combos       []Combination
	comboTerms   []ComboTerm
	rprops       []ReactionProperty
	rvalues      []ReactionValue
	logKs        []LogK
	rates        []Rate
	mixtures     []Mixture
	mixItems     []MixItem
	mixMembers   []MixMember
	strs         []Str
	idents       []Ident
	nums         []Num
	quantities   []Quantity
	units        []Unit
	refs         []SpeciesRef

	// The lists' elements, each list a run of one array.
	settingPtrs []*Setting
	tempSetPtrs []*TempSet
	refPtrs     []*SpeciesRef
	spropPtrs   []*SpeciesProperty
	numPtrs     []*Num
	termPtrs    []*Term
	comboPtrs   []*ComboTerm
	rpropPtrs   []*ReactionProperty
	mixItemPtrs []*MixItem
}

// moveCounts is how many nodes of each kind, and list elements of each
// list type, a statement holds.
type moveCounts struct {
	includes, settings, settingItems, tempSets, lints, elements, phases  int
	species, sprops, formulas, svalues, polys, textProps                 int
	reactions, arrows, terms, combos, comboTerms, rprops, rvalues, logKs int
	rates, mixtures, mixItems, mixMembers                                int
	strs, idents, nums, quantities, units, refs                          int

	settingPtrs, tempSetPtrs, refPtrs, spropPtrs, numPtrs int
	termPtrs, comboPtrs, rpropPtrs, mixItemPtrs           int
}

// arenaOf is an array of n nodes, nil for none.
func arenaOf[T any](n int) []T {
	if n == 0 {
		return nil
	}
	return make([]T, n)
}

func (a *moveArena) make(c *moveCounts) {
	*a = moveArena{
		includes:     arenaOf[Include](c.includes),
		settings:     arenaOf[Settings](c.settings),
		settingItems: arenaOf[Setting](c.settingItems),
		tempSets:     arenaOf[TempSet](c.tempSets),
		lints:        arenaOf[Lint](c.lints),
		elements:     arenaOf[Element](c.elements),
		phases:       arenaOf[Phase](c.phases),
		species:      arenaOf[Species](c.species),
		sprops:       arenaOf[SpeciesProperty](c.sprops),
		formulas:     arenaOf[FormulaProp](c.formulas),
		svalues:      arenaOf[SpeciesValue](c.svalues),
		polys:        arenaOf[Polynomial](c.polys),
		textProps:    arenaOf[TextProp](c.textProps),
		reactions:    arenaOf[Reaction](c.reactions),
		arrows:       arenaOf[Arrow](c.arrows),
		terms:        arenaOf[Term](c.terms),
		combos:       arenaOf[Combination](c.combos),
		comboTerms:   arenaOf[ComboTerm](c.comboTerms),
		rprops:       arenaOf[ReactionProperty](c.rprops),
		rvalues:      arenaOf[ReactionValue](c.rvalues),
		logKs:        arenaOf[LogK](c.logKs),
		rates:        arenaOf[Rate](c.rates),
		mixtures:     arenaOf[Mixture](c.mixtures),
		mixItems:     arenaOf[MixItem](c.mixItems),
		mixMembers:   arenaOf[MixMember](c.mixMembers),
		strs:         arenaOf[Str](c.strs),
		idents:       arenaOf[Ident](c.idents),
		nums:         arenaOf[Num](c.nums),
		quantities:   arenaOf[Quantity](c.quantities),
		units:        arenaOf[Unit](c.units),
		refs:         arenaOf[SpeciesRef](c.refs),

		settingPtrs: arenaOf[*Setting](c.settingPtrs),
		tempSetPtrs: arenaOf[*TempSet](c.tempSetPtrs),
		refPtrs:     arenaOf[*SpeciesRef](c.refPtrs),
		spropPtrs:   arenaOf[*SpeciesProperty](c.spropPtrs),
		numPtrs:     arenaOf[*Num](c.numPtrs),
		termPtrs:    arenaOf[*Term](c.termPtrs),
		comboPtrs:   arenaOf[*ComboTerm](c.comboPtrs),
		rpropPtrs:   arenaOf[*ReactionProperty](c.rpropPtrs),
		mixItemPtrs: arenaOf[*MixItem](c.mixItemPtrs),
	}
}

// arenaNext is the next node of *s, or a new one when the count fell short
// (it never does; see TestMovedArenaExact).
func arenaNext[T any](s *[]T) *T {
	if len(*s) == 0 {
		return new(T)
	}
	p := &(*s)[0]
	*s = (*s)[1:]
	return p
}

// arenaList is a list of n elements from *s, its capacity its length, so
// that an append to it cannot write into the next list. Like the copier
// it replaces, it keeps a nil list nil and an empty one empty but not nil.
func arenaList[T any](s *[]T, ps []T) []T {
	if ps == nil {
		return nil
	}
	n := len(ps)
	if n == 0 || len(*s) < n {
		return make([]T, n)
	}
	l := (*s)[:n:n]
	*s = (*s)[n:]
	return l
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
	}
}

func (m *mover) include(n *Include) *Include {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.includes)
	*c = Include{ParsedNode: m.parsed(n.ParsedNode), Path: m.str(n.Path)}
	return c
}

func (m *mover) str(n *Str) *Str {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.strs)
	*c = Str{Node: m.node(n.Node), Raw: m.rebase(n.Raw)}
	return c
}

func (m *mover) ident(n *Ident) *Ident {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.idents)
	*c = Ident{Node: m.node(n.Node), Name: m.rebase(n.Name)}
	return c
}

func (m *mover) num(n *Num) *Num {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.nums)
	*c = Num{Node: m.node(n.Node), Text: m.rebase(n.Text)}
	return c
}

func (m *mover) nums(ns []*Num) []*Num {
	l := arenaList(&m.a.numPtrs, ns)
	for i, n := range ns {
		l[i] = m.num(n)
	}
	return l
}

func (m *mover) quantity(n *Quantity) *Quantity {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.quantities)
	*c = Quantity{Node: m.node(n.Node), Value: m.num(n.Value), Sigma: m.num(n.Sigma), Unit: m.unit(n.Unit)}
	return c
}

func (m *mover) unit(n *Unit) *Unit {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.units)
	*c = Unit{Node: m.node(n.Node), Text: m.rebase(n.Text)}
	return c
}

func (m *mover) settings(n *Settings) *Settings {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.settings)
	*c = Settings{ParsedNode: m.parsed(n.ParsedNode)}
	c.Items = arenaList(&m.a.settingPtrs, n.Items)
	for i, s := range n.Items {
		c.Items[i] = m.setting(s)
	}
	return c
}

func (m *mover) setting(n *Setting) *Setting {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.settingItems)
	*c = Setting{
		ParsedNode:       m.parsed(n.ParsedNode),
		Pressure:         m.quantity(n.Pressure),
		StandardPressure: m.quantity(n.StandardPressure),
		Tolerance:        m.quantity(n.Tolerance),
		Lint:             m.lint(n.Lint),
		Activity:         m.ident(n.Activity),
	}
	c.Temperatures = arenaList(&m.a.tempSetPtrs, n.Temperatures)
	for i, t := range n.Temperatures {
		c.Temperatures[i] = m.tempSet(t)
	}
	return c
}

func (m *mover) tempSet(n *TempSet) *TempSet {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.tempSets)
	*c = TempSet{ParsedNode: m.parsed(n.ParsedNode), From: m.quantity(n.From), To: m.quantity(n.To), By: m.quantity(n.By)}
	return c
}

func (m *mover) lint(n *Lint) *Lint {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.lints)
	*c = Lint{ParsedNode: m.parsed(n.ParsedNode), Check: m.ident(n.Check), Level: m.ident(n.Level)}
	return c
}

func (m *mover) element(n *Element) *Element {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.elements)
	*c = Element{ParsedNode: m.parsed(n.ParsedNode), Symbol: m.ident(n.Symbol), Mass: m.quantity(n.Mass)}
	return c
}

func (m *mover) phase(n *Phase) *Phase {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.phases)
	*c = Phase{ParsedNode: m.parsed(n.ParsedNode), Name: m.ident(n.Name), Convention: m.ident(n.Convention)}
	return c
}

func (m *mover) ref(n *SpeciesRef) *SpeciesRef {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.refs)
	*c = SpeciesRef{Node: m.node(n.Node), Text: m.rebase(n.Text)}
	return c
}

func (m *mover) species(n *Species) *Species {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.species)
	*c = Species{Node: m.node(n.Node), Label: m.str(n.Label), HasBody: n.HasBody}
	c.Refs = arenaList(&m.a.refPtrs, n.Refs)
	for i, r := range n.Refs {
		c.Refs[i] = m.ref(r)
	}
	c.Props = arenaList(&m.a.spropPtrs, n.Props)
	for i, p := range n.Props {
		c.Props[i] = m.speciesProperty(p)
	}
	return c
}

func (m *mover) speciesProperty(n *SpeciesProperty) *SpeciesProperty {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.sprops)
	*c = SpeciesProperty{
		Node:    m.node(n.Node),
		Formula: m.formulaProp(n.Formula),
		Value:   m.speciesValue(n.Value),
		Poly:    m.polynomial(n.Poly),
		Text:    m.textProp(n.Text),
	}
	return c
}

func (m *mover) formulaProp(n *FormulaProp) *FormulaProp {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.formulas)
	*c = FormulaProp{Node: m.node(n.Node), Formula: m.ref(n.Formula)}
	return c
}

func (m *mover) speciesValue(n *SpeciesValue) *SpeciesValue {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.svalues)
	*c = SpeciesValue{Node: m.node(n.Node), Key: m.rebase(n.Key), Value: m.quantity(n.Value)}
	return c
}

func (m *mover) polynomial(n *Polynomial) *Polynomial {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.polys)
	*c = Polynomial{
		Node:   m.node(n.Node),
		Kind:   m.rebase(n.Kind),
		From:   m.quantity(n.From),
		To:     m.quantity(n.To),
		Coeffs: m.nums(n.Coeffs),
	}
	return c
}

func (m *mover) textProp(n *TextProp) *TextProp {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.textProps)
	*c = TextProp{Node: m.node(n.Node), Key: m.rebase(n.Key), Text: m.str(n.Text)}
	return c
}

func (m *mover) reaction(n *Reaction) *Reaction {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.reactions)
	*c = Reaction{
		Node:    m.node(n.Node),
		Name:    m.ident(n.Name),
		Left:    m.terms(n.Left),
		Arrow:   m.arrow(n.Arrow),
		Right:   m.terms(n.Right),
		Combo:   m.combination(n.Combo),
		HasBody: n.HasBody,
	}
	c.Props = arenaList(&m.a.rpropPtrs, n.Props)
	for i, p := range n.Props {
		c.Props[i] = m.reactionProperty(p)
	}
	return c
}

func (m *mover) arrow(n *Arrow) *Arrow {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.arrows)
	*c = Arrow{Node: m.node(n.Node), Text: m.rebase(n.Text)}
	return c
}

func (m *mover) terms(ts []*Term) []*Term {
	l := arenaList(&m.a.termPtrs, ts)
	for i, t := range ts {
		l[i] = m.term(t)
	}
	return l
}

func (m *mover) term(n *Term) *Term {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.terms)
	*c = Term{Node: m.node(n.Node), Coef: m.num(n.Coef), Species: m.ref(n.Species)}
	return c
}

func (m *mover) combination(n *Combination) *Combination {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.combos)
	*c = Combination{ParsedNode: m.parsed(n.ParsedNode)}
	c.Terms = arenaList(&m.a.comboPtrs, n.Terms)
	for i, t := range n.Terms {
		c.Terms[i] = m.comboTerm(t)
	}
	return c
}

func (m *mover) comboTerm(n *ComboTerm) *ComboTerm {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.comboTerms)
	*c = ComboTerm{ParsedNode: m.parsed(n.ParsedNode), Sign: m.rebase(n.Sign), Coef: m.num(n.Coef), Name: m.ident(n.Name)}
	return c
}

func (m *mover) reactionProperty(n *ReactionProperty) *ReactionProperty {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.rprops)
	*c = ReactionProperty{
		Node:  m.node(n.Node),
		Value: m.reactionValue(n.Value),
		LogK:  m.logK(n.LogK),
		Rate:  m.rate(n.Rate),
		Text:  m.textProp(n.Text),
	}
	return c
}

func (m *mover) reactionValue(n *ReactionValue) *ReactionValue {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.rvalues)
	*c = ReactionValue{Node: m.node(n.Node), Key: m.rebase(n.Key), Value: m.quantity(n.Value)}
	return c
}

func (m *mover) logK(n *LogK) *LogK {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.logKs)
	*c = LogK{Node: m.node(n.Node), Value: m.num(n.Value), Sigma: m.num(n.Sigma), At: m.quantity(n.At)}
	return c
}

func (m *mover) rate(n *Rate) *Rate {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.rates)
	*c = Rate{Node: m.node(n.Node), Kind: m.rebase(n.Kind), A: m.quantity(n.A), N: m.num(n.N), Ea: m.quantity(n.Ea)}
	return c
}

func (m *mover) mixture(n *Mixture) *Mixture {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.mixtures)
	*c = Mixture{ParsedNode: m.parsed(n.ParsedNode), Name: m.ident(n.Name)}
	c.Items = arenaList(&m.a.mixItemPtrs, n.Items)
	for i, it := range n.Items {
		c.Items[i] = m.mixItem(it)
	}
	return c
}

func (m *mover) mixItem(n *MixItem) *MixItem {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.mixItems)
	*c = MixItem{
		ParsedNode:  m.parsed(n.ParsedNode),
		Temperature: m.quantity(n.Temperature),
		Pressure:    m.quantity(n.Pressure),
		Member:      m.mixMember(n.Member),
	}
	return c
}

func (m *mover) mixMember(n *MixMember) *MixMember {
	if n == nil {
		return nil
	}
	c := arenaNext(&m.a.mixMembers)
	*c = MixMember{ParsedNode: m.parsed(n.ParsedNode), Species: m.ref(n.Species), Amount: m.quantity(n.Amount), Fixed: n.Fixed}
	return c
}

// The counts, in the copies' order: one function per node type.

func (c *moveCounts) statement(st *Statement) {
	c.include(st.Include)
	c.settingsBlock(st.Settings)
	c.element(st.Element)
	c.phase(st.Phase)
	c.speciesStatement(st.Species)
	c.reaction(st.Reaction)
	c.mixture(st.Mixture)
}

func (c *moveCounts) include(n *Include) {
	if n != nil {
		c.includes++
		c.str(n.Path)
	}
}

func (c *moveCounts) str(n *Str) {
	if n != nil {
		c.strs++
	}
}

func (c *moveCounts) ident(n *Ident) {
	if n != nil {
		c.idents++
	}
}

func (c *moveCounts) num(n *Num) {
	if n != nil {
		c.nums++
	}
}

func (c *moveCounts) quantity(n *Quantity) {
	if n != nil {
		c.quantities++
		c.num(n.Value)
		c.num(n.Sigma)
		if n.Unit != nil {
			c.units++
		}
	}
}

func (c *moveCounts) settingsBlock(n *Settings) {
	if n == nil {
		return
	}
	c.settings++
	c.settingPtrs += len(n.Items)
	for _, s := range n.Items {
		if s == nil {
			continue
		}
		c.settingItems++
		c.quantity(s.Pressure)
		c.quantity(s.StandardPressure)
		c.quantity(s.Tolerance)
		c.ident(s.Activity)
		if s.Lint != nil {
			c.lints++
			c.ident(s.Lint.Check)
			c.ident(s.Lint.Level)
		}
		c.tempSetPtrs += len(s.Temperatures)
		for _, t := range s.Temperatures {
			if t != nil {
				c.tempSets++
				c.quantity(t.From)
				c.quantity(t.To)
				c.quantity(t.By)
			}
		}
	}
}

func (c *moveCounts) element(n *Element) {
	if n != nil {
		c.elements++
		c.ident(n.Symbol)
		c.quantity(n.Mass)
	}
}

func (c *moveCounts) phase(n *Phase) {
	if n != nil {
		c.phases++
		c.ident(n.Name)
		c.ident(n.Convention)
	}
}

func (c *moveCounts) ref(n *SpeciesRef) {
	if n != nil {
		c.refs++
	}
}

func (c *moveCounts) textProp(n *TextProp) {
	if n != nil {
		c.textProps++
		c.str(n.Text)
	}
}

func (c *moveCounts) speciesStatement(n *Species) {
	if n == nil {
		return
	}
	c.species++
	c.str(n.Label)
	c.refPtrs += len(n.Refs)
	for _, r := range n.Refs {
		c.ref(r)
	}
	c.spropPtrs += len(n.Props)
	for _, p := range n.Props {
		if p == nil {
			continue
		}
		c.sprops++
		if p.Formula != nil {
			c.formulas++
			c.ref(p.Formula.Formula)
		}
		if p.Value != nil {
			c.svalues++
			c.quantity(p.Value.Value)
		}
		if p.Poly != nil {
			c.polys++
			c.quantity(p.Poly.From)
			c.quantity(p.Poly.To)
			c.numPtrs += len(p.Poly.Coeffs)
			for _, n := range p.Poly.Coeffs {
				c.num(n)
			}
		}
		c.textProp(p.Text)
	}
}

func (c *moveCounts) termList(ts []*Term) {
	c.termPtrs += len(ts)
	for _, t := range ts {
		if t != nil {
			c.terms++
			c.num(t.Coef)
			c.ref(t.Species)
		}
	}
}

func (c *moveCounts) reaction(n *Reaction) {
	if n == nil {
		return
	}
	c.reactions++
	c.ident(n.Name)
	c.termList(n.Left)
	if n.Arrow != nil {
		c.arrows++
	}
	c.termList(n.Right)
	if n.Combo != nil {
		c.combos++
		c.comboPtrs += len(n.Combo.Terms)
		for _, t := range n.Combo.Terms {
			if t != nil {
				c.comboTerms++
				c.num(t.Coef)
				c.ident(t.Name)
			}
		}
	}
	c.rpropPtrs += len(n.Props)
	for _, p := range n.Props {
		if p == nil {
			continue
		}
		c.rprops++
		if p.Value != nil {
			c.rvalues++
			c.quantity(p.Value.Value)
		}
		if p.LogK != nil {
			c.logKs++
			c.num(p.LogK.Value)
			c.num(p.LogK.Sigma)
			c.quantity(p.LogK.At)
		}
		if p.Rate != nil {
			c.rates++
			c.quantity(p.Rate.A)
			c.num(p.Rate.N)
			c.quantity(p.Rate.Ea)
		}
		c.textProp(p.Text)
	}
}

func (c *moveCounts) mixture(n *Mixture) {
	if n == nil {
		return
	}
	c.mixtures++
	c.ident(n.Name)
	c.mixItemPtrs += len(n.Items)
	for _, it := range n.Items {
		if it == nil {
			continue
		}
		c.mixItems++
		c.quantity(it.Temperature)
		c.quantity(it.Pressure)
		if it.Member != nil {
			c.mixMembers++
			c.ref(it.Member.Species)
			c.quantity(it.Member.Amount)
		}
	}
}
