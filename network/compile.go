package network

import (
	"context"
	"fmt"
	"strings"

	"hess/chem"
	"hess/lang"
	"hess/thermo"
)

// compiler turns the parsed files of a network into its model. The
// parallel passes give each worker a compiler of its own that reports
// into its own list and keeps its own cache of species lookups.
type compiler struct {
	net  *Network
	out  *lang.Diagnostics   // where report writes; nil for net.Diagnostics
	refs map[string]*Species // species by reference as written, when caching
	near *nearIndexes        // near-miss names, shared by the workers
	// units are units as written that parsed, when caching: a network
	// writes the same few units thousands of times. At most maxUnitCache.
	units map[string]thermo.Unit
	// declared are the species, by declaration index, by the text of the
	// reference that declared them: a reaction nearly always writes a
	// species as it was declared, and the same text always names the same
	// species, so lookup finds it there without splitting the reference
	// (nor reading the species). Written only while species are declared
	// (serially), read by the workers after.
	declared map[string]int32
	// facts are what a reaction's compile reads of its species, by
	// declaration index, once the species' data are read.
	facts *termFacts
	// used, when set, marks by declaration index the species of the
	// complete reactions a worker built (see buildReactions).
	used []bool
	// prepared are the species references still to be declared, split in
	// parallel beforehand (prepareRefs); declare takes them in order.
	prepared []preparedRef
}

// maxUnitCache bounds a worker's cache of parsed units: a file may write a
// different unit on every line.
const maxUnitCache = 64

// parseUnit is thermo.ParseUnit through the compiler's cache when it keeps
// one.
func (c *compiler) parseUnit(text string) (thermo.Unit, error) {
	if u, ok := c.units[text]; ok {
		return u, nil
	}
	u, err := thermo.ParseUnit(text)
	if err == nil && c.units != nil && len(c.units) < maxUnitCache {
		// A copy of the key: text lies in the source (see lookup).
		c.units[strings.Clone(text)] = u
	}
	return u, err
}

// worker returns a compiler for one worker of a parallel pass, reporting
// into out.
func (c *compiler) worker(out *lang.Diagnostics) *compiler {
	return &compiler{net: c.net, out: out, refs: map[string]*Species{}, near: c.near, units: map[string]thermo.Unit{}, declared: c.declared, facts: c.facts}
}

func (c *compiler) report(check *Check, span lang.Span, format string, args ...any) *lang.Diagnostic {
	out := c.out
	if out == nil {
		out = &c.net.Diagnostics
	}
	*out = append(*out, lang.Diagnostic{
		Code: check.Code(), Message: fmt.Sprintf(format, args...), Subject: span,
	})
	return &(*out)[len(*out)-1]
}

// Built-in state tags and their conventions.
var builtinPhases = map[string]Convention{
	"g": IdealGas, "l": Pure, "s": Pure, "cr": Pure, "aq": Solute,
}

// compileContext compiles the loaded files of n in passes, giving up with
// ctx's error between passes once ctx is done (n is then half built and
// must be dropped). With a memo, reactions compiled by the last compile of
// the same root are reused where nothing they depend on changed, and the
// memo is updated once the compile completes.
func compileContext(ctx context.Context, n *Network, memo *compileMemo) error {
	c := &compiler{net: n, near: &nearIndexes{}}
	n.Elements = chem.BuiltinElements()
	n.Phases = map[string]*Phase{}
	for tag, conv := range builtinPhases {
		n.Phases[tag] = &Phase{Tag: tag, Convention: conv, Builtin: true}
	}
	// Room for every species and reaction statement, so that the maps do
	// not grow on large networks.
	nSpecies, nReactions := 0, 0
	var refs []*lang.SpeciesRef
	var refBroken []bool
	c.each(func(st *lang.Statement) {
		switch {
		case st.Species != nil:
			nSpecies += len(st.Species.Refs)
			for _, ref := range st.Species.Refs {
				if ref != nil {
					refs = append(refs, ref)
					refBroken = append(refBroken, st.Broken)
				}
			}
		case st.Reaction != nil:
			nReactions++
		}
	})
	var prevRefs map[*lang.SpeciesRef]*Species
	if memo != nil {
		memo.mu.Lock()
		prevRefs = memo.refs
		memo.mu.Unlock()
	}
	c.prepared = prepareRefs(refs, refBroken, prevRefs)
	var nextRefs map[*lang.SpeciesRef]*Species
	if memo != nil {
		nextRefs = preparedSpecies(c.prepared)
	}
	n.speciesByKey = make(map[string]*Species, nSpecies)
	c.declared = make(map[string]int32, nSpecies)
	n.reactionByName = make(map[string]*Reaction, nReactions)
	if nReactions > 0 {
		n.Reactions = make([]*Reaction, 0, nReactions)
	}
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
			case s.Pos.Filename != n.Root && onlyDataPressure(s):
				if !st.Broken {
					c.libraryDataPressure(s)
				}
			case s.Pos.Filename != n.Root:
				c.report(misplacedSettingsCheck, keywordSpan(&s.Node), "settings belong in the root file %s, not in an included file", n.Root)
			case settingsSeen != nil:
				d := c.report(misplacedSettingsCheck, keywordSpan(&s.Node), "a network has one settings block; this is a second one")
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
	if err := ctx.Err(); err != nil {
		return err
	}
	var elements string
	var speciesEntries map[*lang.Species]*memoSpecies
	var from *speciesOrigins
	if memo != nil {
		elements = elementsEnv(n)
		speciesEntries, from = c.speciesDataReusing(species, memo, elements)
	} else {
		c.speciesData(species)
	}
	if err := ctx.Err(); err != nil {
		return err
	}
	c.facts = newTermFacts(n.Species)
	reactions := make([]*lang.Statement, 0, nReactions)
	c.each(func(st *lang.Statement) {
		if st.Reaction != nil {
			reactions = append(reactions, st)
		}
	})
	var built []builtReaction
	var used []bool
	var env string
	var entries map[uint64]*memoReaction
	if memo != nil {
		env = speciesEnv(n)
		built, entries = c.buildReactionsReusing(reactions, memo, env)
	} else {
		built, used = c.buildReactions(reactions)
	}
	if err := ctx.Err(); err != nil {
		return err
	}
	c.markUsed(used)
	for _, b := range built {
		c.addReaction(b, used != nil)
	}
	c.each(func(st *lang.Statement) {
		if st.Reaction != nil && !st.Broken {
			c.combination(st.Reaction)
		}
		if st.Mixture != nil && !st.Broken {
			c.mixture(st.Mixture)
		}
	})
	if err := ctx.Err(); err != nil {
		return err
	}
	var reuse *modelReuse
	if memo != nil {
		memo.mu.Lock()
		reuse = &modelReuse{from: from, pressure: memo.pressure}
		memo.mu.Unlock()
	}
	buildModels(n, reuse)
	buildSolutions(n)
	if memo != nil {
		memo.commit(env, entries, elements, speciesEntries, from, n.StandardPressure(), nextRefs)
	}
	return nil
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
	if len(n.Tokens()) == 0 {
		return n.Span()
	}
	return n.TokenSpan(0)
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
		c.report(syntaxCheck, id.Span(), "%s name %q must start with a letter or _ and hold only letters, digits, _ and -", what, id.Name)
		return false
	}
	return true
}
