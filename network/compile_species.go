package network

import (
	"math"
	"strings"
	"unicode/utf8"

	"hess/chem"
	"hess/lang"
	"hess/thermo"
)

// preparedRef is a species reference split and made into a species
// before the serial pass that declares it (see prepareRefs).
type preparedRef struct {
	ref *lang.SpeciesRef
	sp  *Species // nil when the reference does not split
	err error
	// text is ref.Text, copied next to the other references' texts: the
	// key by which lookup finds the species (see compiler.declared), whose
	// comparisons then read a few hundred kilobytes rather than the whole
	// source.
	text string
}

// prepareRefs splits every species reference of the network and makes its
// species, in parallel, in the order the statements declare them: what
// declaring a species costs apart from naming it in the network, which
// must go in order. broken says, for each reference, that its statement
// did not parse. A reference that made a species in the last compile
// (prev, by reference: the parse caches hand out the same reference for a
// statement that did not change or move) makes one with that one's key,
// parts, span and charge, which depend on nothing but the reference.
func prepareRefs(refs []*lang.SpeciesRef, broken []bool, prev map[*lang.SpeciesRef]*Species) []preparedRef {
	size := 0
	for _, ref := range refs {
		size += len(ref.Text)
	}
	var b strings.Builder
	b.Grow(size)
	for _, ref := range refs {
		b.WriteString(ref.Text)
	}
	texts := b.String()
	out := make([]preparedRef, len(refs))
	parallel(len(refs), 512, func() func(i int) {
		return func(i int) {
			if old := prev[refs[i]]; old != nil {
				out[i] = preparedRef{ref: refs[i], sp: &Species{Key: old.Key, Parts: old.Parts, Span: old.Span, Charge: old.Charge, BrokenData: broken[i]}}
				return
			}
			out[i] = newSpecies(refs[i], broken[i])
		}
	})
	at := 0
	for i, ref := range refs {
		out[i].text = texts[at : at+len(ref.Text)]
		at += len(ref.Text)
	}
	return out
}

// newSpecies is the species a reference declares, not yet named in the
// network.
func newSpecies(ref *lang.SpeciesRef, broken bool) preparedRef {
	parts, err := lang.SplitRef(ref.Text)
	if err != nil {
		return preparedRef{ref: ref, err: err, text: ref.Text}
	}
	// A statement that did not parse has data that were never read.
	sp := &Species{Key: parts.Canonical(), Parts: parts, Span: ref.Span(), Charge: parts.Charge, BrokenData: broken}
	return preparedRef{ref: ref, sp: sp, text: ref.Text}
}

// declare registers one species reference of a species statement, taking
// the species prepareRefs made for it when it is next in c.prepared.
func (c *compiler) declare(ref *lang.SpeciesRef, decl *lang.Species, broken bool) *Species {
	var p preparedRef
	if len(c.prepared) > 0 && c.prepared[0].ref == ref {
		p, c.prepared = c.prepared[0], c.prepared[1:]
	} else {
		p = newSpecies(ref, broken)
	}
	if p.err != nil {
		c.report(badFormulaCheck, ref.Span(), "%s: %v", ref.Text, p.err)
		return nil
	}
	sp := p.sp
	parts := sp.Parts
	if old, dup := c.net.speciesByKey[sp.Key]; dup {
		d := c.report(duplicateSpeciesCheck, ref.Span(), "species %s is declared twice", sp.Key)
		d.Related = []lang.Related{{Span: old.Span, Message: "first declared here"}}
		return nil
	}
	c.net.speciesByKey[sp.Key] = sp
	sp.index = len(c.net.Species)
	if c.declared != nil && sp.index <= math.MaxInt32 {
		c.declared[p.text] = int32(sp.index)
	}
	c.net.Species = append(c.net.Species, sp)
	if parts.State != "" {
		if ph, ok := c.net.Phases[parts.State]; ok {
			sp.Phase = ph
		} else {
			c.report(unknownPhaseCheck, ref.Span(), "state tag (%s) is neither built in (g, l, s, cr, aq) nor a declared phase%s", parts.State, c.phaseHint(parts.State))
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
		c.report(syntaxCheck, keywordSpan(&s.Node), "a species list declares species without data; give each species with data its own statement")
		return declaredSpecies{}
	}
	return declaredSpecies{st: s, declared: declared}
}

// speciesData reads the data and formulas of declared species, in
// parallel: each statement touches only its own species.
func (c *compiler) speciesData(list []declaredSpecies) {
	diags := make([]lang.Diagnostics, len(list))
	parallel(len(list), 256, func() func(i int) {
		w := c.speciesWorker()
		return func(i int) {
			w.out = &diags[i]
			w.speciesStatement(list[i])
		}
	})
	for _, ds := range diags {
		c.net.Diagnostics = append(c.net.Diagnostics, ds...)
	}
}

// speciesWorker is a compiler for one worker reading species data: as
// c.worker's but without the lookup cache and near-miss index, which
// species data do not use.
func (c *compiler) speciesWorker() *compiler {
	return &compiler{net: c.net, units: map[string]thermo.Unit{}, declared: c.declared}
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
// Blocks are short, so a list serves; a property's span is worked out only
// for a report.
type givenOnce []struct {
	name string
	at   *lang.Node
}

// add records name given at at, unless it was given before; then it
// returns where, and dup is true.
func (g *givenOnce) add(name string, at *lang.Node) (first *lang.Node, dup bool) {
	for _, e := range *g {
		if e.name == name {
			return e.at, true
		}
	}
	*g = append(*g, struct {
		name string
		at   *lang.Node
	}{name, at})
	return nil, false
}

// properties reads a species block. It returns the explicit formula, if any.
func (c *compiler) properties(sp *Species, props []*lang.SpeciesProperty) (string, lang.Span) {
	var seen givenOnce
	var formula string
	var formulaSpan lang.Span
	for _, pr := range props {
		name := pr.Tokens()[0].Value
		if name != "shomate" && name != "nasa7" {
			if first, dup := seen.add(name, &pr.Node); dup {
				d := c.report(syntaxCheck, keywordSpan(&pr.Node), "%s is given twice for %s", name, sp.Key)
				d.Related = []lang.Related{{Span: keywordSpan(first), Message: "first given here"}}
				continue
			}
		}
		switch {
		case pr.Formula != nil:
			formula, formulaSpan = pr.Formula.Formula.Text, pr.Formula.Formula.Span()
		case pr.Value != nil:
			kind := energyKind
			switch pr.Value.Key {
			case "s", "cp":
				kind = entropyKind
			case "size":
				kind = lengthKind
			case "setschenow":
				kind = setschenowKind
			}
			v, ok := c.quantity(pr.Value.Value, kind, pr.Value.Key, false)
			if !ok {
				sp.BrokenData = true
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
			case "size":
				if !(v.V > 0) {
					c.report(implausibleValueCheck, pr.Value.Value.Span(), "ion-size parameter of %s must be above 0, found %s", sp.Key, quantityText(pr.Value.Value))
					continue
				}
				sp.Size = v
			case "setschenow":
				sp.Setschenow = v
			}
		case pr.Poly != nil:
			if !c.polynomial(sp, pr.Poly) {
				sp.BrokenData = true
			}
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

// polynomial adds a range to the species; false when it did not compile
// (its error is reported).
func (c *compiler) polynomial(sp *Species, p *lang.Polynomial) bool {
	want := polyCoefficients[p.Kind]
	if len(p.Coeffs) != want {
		names := "A to H"
		if p.Kind == "nasa7" {
			names = "a1 to a7"
		}
		c.report(syntaxCheck, keywordSpan(&p.Node), "%s takes %d coefficients (%s), found %d", p.Kind, want, names, len(p.Coeffs))
		return false
	}
	from, _, ok1 := c.quantitySI(p.From, temperatureKind, "range start", false)
	to, _, ok2 := c.quantitySI(p.To, temperatureKind, "range end", false)
	coeffs := make([]float64, 0, want)
	ok3 := true
	for _, num := range p.Coeffs {
		v, ok := c.number(num)
		ok3 = ok3 && ok
		coeffs = append(coeffs, v)
	}
	if !ok1 || !ok2 || !ok3 {
		return false
	}
	if from <= 0 || to <= from {
		c.report(implausibleValueCheck, p.From.Span().Join(p.To.Span()), "%s range %s to %s must run upwards from above absolute zero", p.Kind, quantityText(p.From), quantityText(p.To))
		return false
	}
	r := &PolyRange{Kind: p.Kind, Tmin: from, Tmax: to, Coeffs: coeffs, node: p}
	// Built once here, so that the model, the checks and every evaluation
	// share one (parallel checks read it, never build it).
	r.m = r.buildModel()
	sp.Ranges = append(sp.Ranges, r)
	return true
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
			c.report(badFormulaCheck, explicitSpan, "formula %s: give the elements only; the charge and state tag belong to the species name", explicit)
			return
		}
		text, span = explicit, explicitSpan
	}
	f, ferr := chem.ParseFormula(text, c.net.Elements)
	if ferr != nil {
		sub := subSpan(span, text, offset+ferr.Offset, offset+ferr.End)
		msg := ferr.Message
		if explicit == "" && (ferr.Code == "unknown-element" || strings.ToLower(text[:1]) == text[:1]) {
			msg += "; a species whose name is not a formula declares one with `formula`"
		}
		c.report(formulaCheck(ferr.Code), sub, "%s", msg)
		return
	}
	sp.Formula = f
	sp.HasFormula = true
	sp.ints.setFormula(f)
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

// formulaCheck is the check of a formula error's code (package chem names
// its codes as strings, since it imports nothing of ours).
func formulaCheck(code string) *Check {
	if code == unknownElementCheck.Name {
		return unknownElementCheck
	}
	return badFormulaCheck
}

// preparedSpecies is the species each reference of prepared made, by
// reference, for the next compile's prepareRefs.
func preparedSpecies(prepared []preparedRef) map[*lang.SpeciesRef]*Species {
	m := make(map[*lang.SpeciesRef]*Species, len(prepared))
	for _, p := range prepared {
		if p.sp != nil {
			m[p.ref] = p.sp
		}
	}
	return m
}
