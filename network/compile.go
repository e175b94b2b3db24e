package network

import (
	"fmt"
	"math/big"
	"sort"
	"strings"
	"unicode/utf8"

	"hess/lang"
	"hess/suggest"
)

// compiler turns the parsed files of a network into its model. The
// parallel passes give each worker a compiler of its own that reports
// into its own list and keeps its own cache of species lookups.
type compiler struct {
	net  *Network
	out  *lang.Diagnostics   // where report writes; nil for net.Diagnostics
	refs map[string]*Species // species by reference as written, when caching
	near *nearIndexes        // near-miss names, shared by the workers
}

// worker returns a compiler for one worker of a parallel pass, reporting
// into out.
func (c *compiler) worker(out *lang.Diagnostics) *compiler {
	return &compiler{net: c.net, out: out, refs: map[string]*Species{}, near: c.near}
}

func (c *compiler) report(code string, span lang.Span, format string, args ...any) *lang.Diagnostic {
	out := c.out
	if out == nil {
		out = &c.net.Diagnostics
	}
	*out = append(*out, lang.Diagnostic{
		Code: code, Message: fmt.Sprintf(format, args...), Subject: span,
	})
	return &(*out)[len(*out)-1]
}

// Built-in state tags and their conventions.
var builtinPhases = map[string]Convention{
	"g": IdealGas, "l": Pure, "s": Pure, "cr": Pure, "aq": Solute,
}

func compile(n *Network) {
	c := &compiler{net: n, near: &nearIndexes{}}
	n.Elements = BuiltinElements()
	n.Phases = map[string]*Phase{}
	for tag, conv := range builtinPhases {
		n.Phases[tag] = &Phase{Tag: tag, Convention: conv, Builtin: true}
	}
	// Room for every species and reaction statement, so that the maps do
	// not grow on large networks.
	nSpecies, nReactions := 0, 0
	c.each(func(st *lang.Statement) {
		switch {
		case st.Species != nil:
			nSpecies += len(st.Species.Refs)
		case st.Reaction != nil:
			nReactions++
		}
	})
	n.speciesByKey = make(map[string]*Species, nSpecies)
	n.reactionByName = make(map[string]*Reaction, nReactions)
	n.Settings = Settings{Pressure: 1e5, Temperatures: []float64{298.15}, Tolerance: 500}

	// Elements and phases first: formulas and state tags depend on them.
	c.each(func(st *lang.Statement) {
		switch {
		case st.Element != nil:
			c.element(st.Element)
		case st.Phase != nil:
			c.phase(st.Phase)
		}
	})
	var settingsSeen *lang.Settings
	var species []declaredSpecies
	c.each(func(st *lang.Statement) {
		switch {
		case st.Settings != nil:
			s := st.Settings
			switch {
			case s.Pos.Filename != n.Root:
				c.report("misplaced-settings", keywordSpan(&s.Node), "settings belong in the root file %s, not in an included file", n.Root)
			case settingsSeen != nil:
				d := c.report("misplaced-settings", keywordSpan(&s.Node), "a network has one settings block; this is a second one")
				d.Related = []lang.Related{{Span: keywordSpan(&settingsSeen.Node), Message: "first settings block"}}
			default:
				settingsSeen = s
				if !st.Broken {
					c.settings(s)
				}
			}
		case st.Species != nil:
			if d := c.declareAll(st.Species, st.Broken); d.declared != nil {
				species = append(species, d)
			}
		}
	})
	c.speciesData(species)
	reactions := make([]*lang.Statement, 0, nReactions)
	c.each(func(st *lang.Statement) {
		if st.Reaction != nil {
			reactions = append(reactions, st)
		}
	})
	for _, b := range c.buildReactions(reactions) {
		c.addReaction(b)
	}
	c.each(func(st *lang.Statement) {
		if st.Reaction != nil && !st.Broken {
			c.combination(st.Reaction)
		}
		if st.Mixture != nil && !st.Broken {
			c.mixture(st.Mixture)
		}
	})
	buildModels(n)
}

// each calls fn for every statement of every file, in load order.
func (c *compiler) each(fn func(*lang.Statement)) {
	for _, f := range c.net.Files {
		for _, st := range f.AST.Statements {
			fn(st)
		}
	}
}

// keywordSpan is the span of a statement's first token.
func keywordSpan(n *lang.Node) lang.Span {
	if len(n.Tokens) == 0 {
		return n.Span()
	}
	return lang.TokenSpan(n.Tokens[0])
}

// validName reports whether s is an identifier: a letter or _, then
// letters, digits, _ and -.
func validName(s string) bool {
	for i, r := range s {
		letter := ('a' <= r && r <= 'z') || ('A' <= r && r <= 'Z') || r == '_'
		if !letter && (i == 0 || !(('0' <= r && r <= '9') || r == '-')) {
			return false
		}
	}
	return s != ""
}

func (c *compiler) name(id *lang.Ident, what string) bool {
	if id == nil {
		return false
	}
	if !validName(id.Name) {
		c.report("syntax", id.Span(), "%s name %q must start with a letter or _ and hold only letters, digits, _ and -", what, id.Name)
		return false
	}
	return true
}

func (c *compiler) element(e *lang.Element) {
	if e.Symbol == nil {
		return
	}
	sym := e.Symbol.Name
	if !isElementSymbol(sym) {
		c.report("syntax", e.Symbol.Span(), "element symbol %q must be an upper-case letter followed by up to two lower-case letters", sym)
		return
	}
	if _, ok := c.net.Elements.Lookup(sym); ok {
		c.report("syntax", e.Symbol.Span(), "element %s is already defined", sym)
		return
	}
	if e.Mass == nil {
		c.report("syntax", e.Symbol.Span(), "element %s needs a mass, such as `mass 2.014 g/mol`", sym)
		return
	}
	v, ok := c.quantity(e.Mass, molarMassKind, "mass", false)
	if !ok {
		return
	}
	if v.V <= 0 {
		c.report("implausible-value", e.Mass.Span(), "element %s has mass %s; a molar mass must be positive", sym, e.Mass.Value.Text)
		return
	}
	c.net.Elements = c.net.Elements.With(sym, v.V*1000) // g/mol
}

func isElementSymbol(s string) bool {
	if n := utf8.RuneCountInString(s); n < 1 || n > 3 {
		return false
	}
	if s[0] < 'A' || s[0] > 'Z' {
		return false
	}
	for i := 1; i < len(s); i++ {
		if s[i] < 'a' || s[i] > 'z' {
			return false
		}
	}
	return true
}

var conventionNames = map[string]Convention{
	"ideal-gas": IdealGas, "pure": Pure, "solute": Solute, "solution": SolutionMember,
}

func (c *compiler) phase(p *lang.Phase) {
	if !c.name(p.Name, "phase") {
		return
	}
	tag := p.Name.Name
	if strings.ToLower(tag) != tag {
		c.report("syntax", p.Name.Span(), "phase name %q must be lower case, as state tags are", tag)
		return
	}
	if old, ok := c.net.Phases[tag]; ok {
		if old.Builtin {
			c.report("syntax", p.Name.Span(), "phase %s is built in and cannot be redeclared", tag)
		} else {
			d := c.report("syntax", p.Name.Span(), "phase %s is declared twice", tag)
			d.Related = []lang.Related{{Span: old.Span, Message: "first declared here"}}
		}
		return
	}
	if p.Convention == nil {
		c.report("syntax", p.Name.Span(), "phase %s needs a convention: ideal-gas, pure, solute or solution", tag)
		return
	}
	conv, ok := conventionNames[p.Convention.Name]
	if !ok {
		c.report("syntax", p.Convention.Span(), "unknown convention %q: use ideal-gas, pure, solute or solution", p.Convention.Name)
		return
	}
	c.net.Phases[tag] = &Phase{Tag: tag, Convention: conv, Span: p.Name.Span()}
}

// maxTemperatures bounds the size of a temperature list.
const maxTemperatures = 10000

func (c *compiler) settings(s *lang.Settings) {
	set := &c.net.Settings
	set.Span = s.Span()
	seen := map[string]lang.Span{}
	once := func(key string, span lang.Span) bool {
		if first, dup := seen[key]; dup {
			d := c.report("syntax", span, "%s is set twice", key)
			d.Related = []lang.Related{{Span: first, Message: "first set here"}}
			return false
		}
		seen[key] = span
		return true
	}
	for _, it := range s.Items {
		key := keywordSpan(&it.Node)
		switch {
		case it.Pressure != nil:
			if !once("pressure", key) {
				continue
			}
			if v, ok := c.quantity(it.Pressure, pressureKind, "pressure", false); ok {
				if v.V <= 0 {
					c.report("implausible-value", it.Pressure.Span(), "standard pressure must be positive, found %s", quantityText(it.Pressure))
					continue
				}
				set.Pressure = v.V
			}
		case it.Temperatures != nil:
			if !once("temperatures", key) {
				continue
			}
			if ts, ok := c.temperatures(it.Temperatures); ok {
				set.Temperatures = ts
			}
		case it.Tolerance != nil:
			if !once("tolerance", key) {
				continue
			}
			if v, ok := c.quantity(it.Tolerance, energyKind, "tolerance", true); ok {
				if v.V < 0 {
					c.report("implausible-value", it.Tolerance.Span(), "tolerance cannot be negative, found %s", quantityText(it.Tolerance))
					continue
				}
				set.Tolerance = v.V
			}
		case it.Lint != nil:
			c.lint(it.Lint)
		}
	}
}

func (c *compiler) temperatures(items []*lang.TempSet) ([]float64, bool) {
	var out []float64
	ok := true
	for _, it := range items {
		from, ok1 := c.quantity(it.From, temperatureKind, "temperature", false)
		if it.To == nil {
			if ok1 {
				if from.V <= 0 {
					c.report("implausible-value", it.From.Span(), "temperature %s is not above absolute zero", quantityText(it.From))
					ok = false
					continue
				}
				out = append(out, from.V)
			}
			ok = ok && ok1
			continue
		}
		to, ok2 := c.quantity(it.To, temperatureKind, "temperature", false)
		step, ok3 := c.quantity(it.By, temperatureKind, "temperature step", true)
		if !ok1 || !ok2 || !ok3 {
			ok = false
			continue
		}
		switch {
		case from.V <= 0 || to.V <= 0:
			c.report("implausible-value", it.Span(), "temperature range %s to %s reaches absolute zero or below", quantityText(it.From), quantityText(it.To))
			ok = false
			continue
		case step.V <= 0:
			c.report("syntax", it.By.Span(), "a temperature step must be positive, found %s", quantityText(it.By))
			ok = false
			continue
		case to.V < from.V:
			c.report("syntax", it.Span(), "temperature range runs backwards: %s to %s", quantityText(it.From), quantityText(it.To))
			ok = false
			continue
		}
		count := (to.V-from.V)/step.V + 1
		if count+float64(len(out)) > maxTemperatures {
			c.report("syntax", it.Span(), "temperature range gives %.0f temperatures, more than %d", count, maxTemperatures)
			ok = false
			continue
		}
		for i := 0; ; i++ {
			t := from.V + float64(i)*step.V
			if t > to.V+1e-9*step.V {
				break
			}
			out = append(out, t)
		}
	}
	return out, ok && len(out) > 0
}

func (c *compiler) lint(l *lang.Lint) {
	if l.Check == nil || l.Level == nil {
		return
	}
	if LookupCheck(l.Check.Name) == nil {
		var names []string
		for _, ch := range checks {
			names = append(names, ch.Name)
		}
		hint := suggest.Phrase(l.Check.Name, names)
		if hint != "" {
			hint = "; " + hint
		}
		c.report("syntax", l.Check.Span(), "lint names no known check %q%s (`hess explain` lists them)", l.Check.Name, hint)
		return
	}
	sev, ok := lang.ParseSeverity(l.Level.Name)
	if !ok || sev == lang.Info {
		c.report("syntax", l.Level.Span(), "lint level must be off, warning or error, found %q", l.Level.Name)
		return
	}
	if c.net.Settings.Lint == nil {
		c.net.Settings.Lint = map[string]lang.Severity{}
	}
	c.net.Settings.Lint[l.Check.Name] = sev
}

// declare registers one species reference of a species statement.
func (c *compiler) declare(ref *lang.SpeciesRef, decl *lang.Species, broken bool) *Species {
	parts, err := lang.SplitRef(ref.Text)
	if err != nil {
		c.report("bad-formula", ref.Span(), "%s: %v", ref.Text, err)
		return nil
	}
	sp := &Species{Key: parts.Canonical(), Parts: parts, Span: ref.Span(), Charge: parts.Charge}
	if old, dup := c.net.speciesByKey[sp.Key]; dup {
		d := c.report("duplicate-species", ref.Span(), "species %s is declared twice", sp.Key)
		d.Related = []lang.Related{{Span: old.Span, Message: "first declared here"}}
		return nil
	}
	c.net.speciesByKey[sp.Key] = sp
	sp.index = len(c.net.Species)
	c.net.Species = append(c.net.Species, sp)
	if parts.State != "" {
		if ph, ok := c.net.Phases[parts.State]; ok {
			sp.Phase = ph
		} else {
			c.report("unknown-phase", ref.Span(), "state tag (%s) is neither built in (g, l, s, cr, aq) nor a declared phase%s", parts.State, c.phaseHint(parts.State))
		}
	}
	return sp
}

// declaredSpecies is a species statement whose species are declared and
// whose data remain to be read.
type declaredSpecies struct {
	st       *lang.Species
	declared []*Species
}

// declareAll declares the species of a statement. Its result has no
// species when there are no data to read.
func (c *compiler) declareAll(s *lang.Species, broken bool) declaredSpecies {
	var declared []*Species
	for _, ref := range s.Refs {
		if ref == nil {
			continue
		}
		if sp := c.declare(ref, s, broken); sp != nil {
			declared = append(declared, sp)
		}
	}
	if broken {
		return declaredSpecies{}
	}
	if len(s.Refs) > 1 && s.HasBody {
		c.report("syntax", keywordSpan(&s.Node), "a species list declares species without data; give each species with data its own statement")
		return declaredSpecies{}
	}
	return declaredSpecies{st: s, declared: declared}
}

// speciesData reads the data and formulas of declared species, in
// parallel: each statement touches only its own species.
func (c *compiler) speciesData(list []declaredSpecies) {
	diags := make([]lang.Diagnostics, len(list))
	parallel(len(list), 256, func() func(i int) {
		w := &compiler{net: c.net}
		return func(i int) {
			w.out = &diags[i]
			w.speciesStatement(list[i])
		}
	})
	for _, ds := range diags {
		c.net.Diagnostics = append(c.net.Diagnostics, ds...)
	}
}

// speciesStatement reads one statement's data and formulas.
func (c *compiler) speciesStatement(d declaredSpecies) {
	s := d.st
	var formulaText string
	var formulaSpan lang.Span
	if len(d.declared) == 1 {
		sp := d.declared[0]
		if s.Label != nil {
			sp.Label, _ = lang.Unquote(s.Label.Raw)
		}
		formulaText, formulaSpan = c.properties(sp, s.Props)
	}
	for _, sp := range d.declared {
		c.formula(sp, formulaText, formulaSpan)
	}
}

// givenOnce records where each property of a block was first given.
// Blocks are short, so a list serves.
type givenOnce []struct {
	name string
	at   lang.Span
}

// add records name given at at, unless it was given before; then it
// returns where, and dup is true.
func (g *givenOnce) add(name string, at lang.Span) (first lang.Span, dup bool) {
	for _, e := range *g {
		if e.name == name {
			return e.at, true
		}
	}
	*g = append(*g, struct {
		name string
		at   lang.Span
	}{name, at})
	return lang.Span{}, false
}

// properties reads a species block. It returns the explicit formula, if any.
func (c *compiler) properties(sp *Species, props []*lang.SpeciesProperty) (string, lang.Span) {
	var seen givenOnce
	var formula string
	var formulaSpan lang.Span
	for _, pr := range props {
		key := keywordSpan(&pr.Node)
		name := pr.Tokens[0].Value
		if name != "shomate" && name != "nasa7" {
			if first, dup := seen.add(name, key); dup {
				d := c.report("syntax", key, "%s is given twice for %s", name, sp.Key)
				d.Related = []lang.Related{{Span: first, Message: "first given here"}}
				continue
			}
		}
		switch {
		case pr.Formula != nil:
			formula, formulaSpan = pr.Formula.Formula.Text, pr.Formula.Formula.Span()
		case pr.Value != nil:
			kind := energyKind
			if pr.Value.Key == "s" || pr.Value.Key == "cp" {
				kind = entropyKind
			}
			v, ok := c.quantity(pr.Value.Value, kind, pr.Value.Key, false)
			if !ok {
				continue
			}
			switch pr.Value.Key {
			case "hf":
				sp.Hf = v
			case "gf":
				sp.Gf = v
			case "s":
				sp.S = v
			case "cp":
				sp.Cp = v
			}
		case pr.Poly != nil:
			c.polynomial(sp, pr.Poly)
		case pr.Text != nil:
			text, _ := lang.Unquote(pr.Text.Text.Raw)
			if pr.Text.Key == "source" {
				sp.Source = text
			} else {
				sp.Note = text
			}
		}
	}
	return formula, formulaSpan
}

var polyCoefficients = map[string]int{"shomate": 8, "nasa7": 7}

func (c *compiler) polynomial(sp *Species, p *lang.Polynomial) {
	want := polyCoefficients[p.Kind]
	if len(p.Coeffs) != want {
		names := "A to H"
		if p.Kind == "nasa7" {
			names = "a1 to a7"
		}
		c.report("syntax", keywordSpan(&p.Node), "%s takes %d coefficients (%s), found %d", p.Kind, want, names, len(p.Coeffs))
		return
	}
	from, ok1 := c.quantity(p.From, temperatureKind, "range start", false)
	to, ok2 := c.quantity(p.To, temperatureKind, "range end", false)
	coeffs := make([]float64, 0, want)
	ok3 := true
	for _, num := range p.Coeffs {
		v, ok := c.number(num)
		ok3 = ok3 && ok
		coeffs = append(coeffs, v)
	}
	if !ok1 || !ok2 || !ok3 {
		return
	}
	if from.V <= 0 || to.V <= from.V {
		c.report("implausible-value", p.From.Span().Join(p.To.Span()), "%s range %s to %s must run upwards from above absolute zero", p.Kind, quantityText(p.From), quantityText(p.To))
		return
	}
	sp.Ranges = append(sp.Ranges, &PolyRange{Kind: p.Kind, Tmin: from.V, Tmax: to.V, Coeffs: coeffs, Span: p.Span(),
		Header: keywordSpan(&p.Node).Join(p.To.Span())})
}

// formula parses the species' formula: the explicit one if given, else
// the base of its reference.
func (c *compiler) formula(sp *Species, explicit string, explicitSpan lang.Span) {
	if sp.Parts.Electron && explicit == "" {
		sp.HasFormula = true
		return
	}
	text, span, offset := sp.Parts.Base, sp.Span, 0
	if explicit != "" {
		parts, err := lang.SplitRef(explicit)
		if err != nil || parts.State != "" || parts.HasCharge {
			c.report("bad-formula", explicitSpan, "formula %s: give the elements only; the charge and state tag belong to the species name", explicit)
			return
		}
		text, span = explicit, explicitSpan
	}
	f, ferr := ParseFormula(text, c.net.Elements)
	if ferr != nil {
		sub := subSpan(span, text, offset+ferr.Offset, offset+ferr.End)
		msg := ferr.Message
		if explicit == "" && (ferr.Code == "unknown-element" || strings.ToLower(text[:1]) == text[:1]) {
			msg += "; a species whose name is not a formula declares one with `formula`"
		}
		c.report(ferr.Code, sub, "%s", msg)
		return
	}
	sp.Formula = f
	sp.HasFormula = true
	sp.ints.counts, sp.ints.ok = formulaInts(f)
	sp.ints.known = true
}

// subSpan narrows a one-line span that starts with text to the bytes
// [from, to) of text.
func subSpan(span lang.Span, text string, from, to int) lang.Span {
	if from < 0 || to > len(text) || from > to {
		return span
	}
	out := span
	out.Start.Offset += from
	out.Start.Column += utf8.RuneCountInString(text[:from])
	out.End = out.Start
	out.End.Offset += to - from
	out.End.Column += utf8.RuneCountInString(text[from:to])
	if to == from {
		out.End.Column++
		out.End.Offset++
		if from >= len(text) {
			out.End = out.Start
		}
	}
	return out
}

// builtReaction is a reaction statement compiled on its own, before the
// serial pass that names it in the network.
type builtReaction struct {
	rx       *Reaction // nil when the statement has no name
	complete bool      // the statement has a valid name and two sides
	diags    lang.Diagnostics
	// propDiags come from the reaction's properties; they are reported
	// only when the reaction is kept.
	propDiags lang.Diagnostics
}

// buildReactions compiles every reaction statement on its own, in
// parallel: species are all declared by now, so lookups only read the
// network.
func (c *compiler) buildReactions(sts []*lang.Statement) []builtReaction {
	out := make([]builtReaction, len(sts))
	parallel(len(sts), 512, func() func(i int) {
		w := c.worker(nil)
		return func(i int) { w.buildReaction(sts[i], &out[i]) }
	})
	return out
}

// buildReaction compiles one reaction statement into b.
func (c *compiler) buildReaction(st *lang.Statement, b *builtReaction) {
	r := st.Reaction
	if r.Name == nil {
		return
	}
	c.out = &b.diags
	validName := c.name(r.Name, "reaction")
	rx := &Reaction{Name: r.Name.Name, NameSpan: r.Name.Span(), Span: r.Span()}
	b.rx = rx
	b.complete = !st.Broken && validName && r.Arrow != nil && len(r.Left) > 0 && len(r.Right) > 0
	if !b.complete {
		return
	}
	rx.TwoWay = r.Arrow.TwoWay()
	rx.Equation = r.Left[0].Span().Join(r.Right[len(r.Right)-1].Span())
	coefs := make([]int64, 0, len(r.Left)+len(r.Right))
	left, ok := c.side(r.Left, true, &coefs)
	right, ok := c.side(r.Right, ok, &coefs)
	rx.Left, rx.Right, rx.Resolved = left, right, ok
	if ok {
		rx.stoich = factsWith(rx, coefs)
	}
	c.out = &b.propDiags
	c.reactionProperties(rx, r.Props)
}

// addReaction names a built reaction in the network, in source order, so
// that the first of two reactions with one name is the one kept.
func (c *compiler) addReaction(b builtReaction) {
	rx := b.rx
	if rx == nil {
		return
	}
	c.net.Diagnostics = append(c.net.Diagnostics, b.diags...)
	if b.complete {
		for _, side := range [][]Term{rx.Left, rx.Right} {
			for _, t := range side {
				if t.Species != nil {
					t.Species.Used = true
				}
			}
		}
	}
	if old, dup := c.net.reactionByName[rx.Name]; dup {
		d := c.report("duplicate-reaction-name", rx.NameSpan, "reaction name %s is used twice", rx.Name)
		d.Related = []lang.Related{{Span: old.NameSpan, Message: "first used here"}}
		return
	}
	c.net.reactionByName[rx.Name] = rx
	if !b.complete {
		return
	}
	c.net.Reactions = append(c.net.Reactions, rx)
	c.net.Diagnostics = append(c.net.Diagnostics, b.propDiags...)
}

// lookup finds a declared species by reference, through the compiler's
// cache when it keeps one.
func (c *compiler) lookup(ref string) *Species {
	if c.refs == nil {
		return c.net.LookupSpecies(ref)
	}
	if sp, ok := c.refs[ref]; ok {
		return sp
	}
	sp := c.net.LookupSpecies(ref)
	if sp != nil {
		// A copy of the key: ref lies somewhere in the source, and the
		// comparisons of later lookups would read it from there.
		c.refs[strings.Clone(ref)] = sp
	}
	return sp
}

// side resolves one side of a reaction: coefficients read and species
// looked up. resolved stays true while every species is declared and has
// a formula. The coefficients are appended to coefs while all are small
// integers; coefs becomes nil at the first that is not.
func (c *compiler) side(terms []*lang.Term, resolved bool, coefs *[]int64) ([]Term, bool) {
	out := make([]Term, 0, len(terms))
	ones := make([]big.Rat, len(terms)) // the default coefficients, one allocation
	for i, t := range terms {
		term := Term{Coef: ones[i].SetInt64(1), Span: t.Span()}
		if t.Coef != nil {
			q, err := parseRat(t.Coef.Text)
			switch {
			case err != nil:
				c.report("syntax", t.Coef.Span(), "%v", err)
				resolved = false
			case q.Sign() <= 0:
				c.report("syntax", t.Coef.Span(), "a coefficient must be positive, found %s; move the species to the other side", t.Coef.Text)
				resolved = false
			default:
				term.Coef = q
			}
		}
		if *coefs != nil {
			if n, ok := smallInt(term.Coef); ok {
				*coefs = append(*coefs, n)
			} else {
				*coefs = nil
			}
		}
		sp := c.lookup(t.Species.Text)
		if sp == nil {
			c.undefinedSpecies(t.Species)
			resolved = false
		} else {
			term.Species = sp
			if !sp.HasFormula {
				resolved = false
			}
		}
		out = append(out, term)
	}
	return out, resolved
}

func (c *compiler) undefinedSpecies(ref *lang.SpeciesRef) {
	parts, err := lang.SplitRef(ref.Text)
	if err != nil {
		c.report("bad-formula", ref.Span(), "%s: %v", ref.Text, err)
		return
	}
	msg := fmt.Sprintf("species %s is not declared", parts.Canonical())
	var near []string
	for _, sp := range c.net.Species {
		if sp.Parts.Base == parts.Base && sp.Charge == parts.Charge {
			near = append(near, sp.Key)
		}
	}
	if len(near) > 0 {
		sort.Strings(near)
		msg += "; declared: " + strings.Join(near, ", ")
	} else if c.near != nil {
		if key := c.near.species.closestSpecies(c.net.Species, ref.Text, parts.Base); key != "" {
			msg += "; " + suggest.DidYouMean(key)
		}
	}
	c.report("undefined-species", ref.Span(), "%s", msg)
}

func (c *compiler) reactionProperties(rx *Reaction, props []*lang.ReactionProperty) {
	var seen givenOnce
	for _, pr := range props {
		key := keywordSpan(&pr.Node)
		name := pr.Tokens[0].Value
		if name != "logk" {
			if first, dup := seen.add(name, key); dup {
				d := c.report("syntax", key, "%s is given twice for reaction %s", name, rx.Name)
				d.Related = []lang.Related{{Span: first, Message: "first given here"}}
				continue
			}
		}
		switch {
		case pr.Value != nil:
			kind := energyKind
			if pr.Value.Key == "ds" {
				kind = entropyKind
			}
			v, ok := c.quantity(pr.Value.Value, kind, pr.Value.Key, false)
			if !ok {
				continue
			}
			switch pr.Value.Key {
			case "dg":
				rx.Dg = v
			case "dh":
				rx.Dh = v
			case "ds":
				rx.Ds = v
			}
		case pr.LogK != nil:
			c.logK(rx, pr.LogK)
		case pr.Rate != nil:
			if rate := c.rate(pr.Rate); rate != nil {
				if pr.Rate.Kind == "rate" {
					rx.Rate = rate
				} else {
					rx.Reverse = rate
				}
			}
		case pr.Text != nil:
			rx.Source, _ = lang.Unquote(pr.Text.Text.Raw)
		}
	}
}

func (c *compiler) logK(rx *Reaction, l *lang.LogK) {
	v, ok := c.number(l.Value)
	if !ok {
		return
	}
	lk := LogK{Value: Value{V: v, Span: l.Value.Span()}, T: 298.15, Span: l.Span()}
	if l.Sigma != nil {
		s, ok := c.number(l.Sigma)
		if !ok {
			return
		}
		lk.Value.Sigma = s
	}
	if l.At != nil {
		t, ok := c.quantity(l.At, temperatureKind, "logk temperature", false)
		if !ok {
			return
		}
		if t.V <= 0 {
			c.report("implausible-value", l.At.Span(), "temperature %s is not above absolute zero", quantityText(l.At))
			return
		}
		lk.T = t.V
	}
	for _, old := range rx.LogK {
		if old.T == lk.T {
			d := c.report("syntax", l.Span(), "logk at %g K is given twice for reaction %s", lk.T, rx.Name)
			d.Related = []lang.Related{{Span: old.Span, Message: "first given here"}}
			return
		}
	}
	rx.LogK = append(rx.LogK, lk)
}

func (c *compiler) rate(r *lang.Rate) *Rate {
	ea, ok := c.quantity(r.Ea, energyKind, "Ea", false)
	if !ok {
		return nil
	}
	a, ok := c.prefactor(r.A)
	if !ok {
		return nil
	}
	rate := &Rate{A: *a, AUnit: r.A.Unit.Text, Ea: *ea, Span: r.Span()}
	if r.N != nil {
		n, ok := c.number(r.N)
		if !ok {
			return nil
		}
		rate.N = n
	}
	return rate
}

func (c *compiler) combination(r *lang.Reaction) {
	if r.Combo == nil {
		return
	}
	rx := c.net.reactionByName[r.Name.Name]
	if rx == nil || rx.Span != r.Span() {
		return
	}
	for i, t := range r.Combo.Terms {
		if i > 0 && t.Sign == "" {
			c.report("syntax", t.Span(), "terms of a combination are joined by + or -")
			rx.Combo = nil
			return
		}
		w := big.NewRat(1, 1)
		if t.Coef != nil {
			v, err := parseRat(t.Coef.Text)
			if err != nil {
				c.report("syntax", t.Coef.Span(), "%v", err)
				rx.Combo = nil
				return
			}
			w = v
		}
		if t.Sign == "-" {
			w.Neg(w)
		}
		ct := ComboTerm{Weight: w, Name: t.Name.Name, Span: t.Span()}
		ct.Reaction = c.net.reactionByName[ct.Name]
		if ct.Reaction == nil {
			msg := fmt.Sprintf("reaction %s is not defined", ct.Name)
			if c.near != nil {
				if near := c.near.reactions.closestReaction(c.net.Reactions, ct.Name); near != "" {
					msg += "; " + suggest.DidYouMean(near)
				}
			}
			c.report("undefined-reaction", t.Name.Span(), "%s", msg)
		} else if ct.Reaction == rx {
			c.report("undefined-reaction", t.Name.Span(), "reaction %s cannot be a combination of itself", ct.Name)
			ct.Reaction = nil
		}
		rx.Combo = append(rx.Combo, ct)
	}
}

// quantityText prints a quantity as written, for messages.
func quantityText(q *lang.Quantity) string {
	if q == nil || q.Value == nil {
		return ""
	}
	s := q.Value.Text
	if q.Unit != nil {
		s += " " + q.Unit.Text
	}
	return s
}
