package network

import (
	"path/filepath"

	"hess/lang"
)

// SymbolKind says what a name in the source stands for.
type SymbolKind int

// Kinds of names in a source file.
const (
	SymbolNone SymbolKind = iota
	SymbolSpecies
	SymbolReaction
	SymbolMixture
	SymbolPhase
	SymbolElement
	SymbolSettings
	SymbolInclude
)

// Symbol is one name in a source file and what it stands for.
type Symbol struct {
	Kind SymbolKind
	// Name is the name as written; for an include, the path as written
	// without quotes.
	Name string
	// Span is the name in the source.
	Span lang.Span
	// Declaration reports that this name is where its thing is declared.
	Declaration bool
	// Species is the declared species a species name stands for (nil when
	// it is not declared).
	Species *Species
	// Reaction is the reaction a reaction name stands for (nil when no
	// reaction of that name is declared).
	Reaction *Reaction
	// Target is the path an include reads, joined to the including
	// file's folder as the loader reads it.
	Target string
}

// Definition is where the thing a symbol names is declared, and whether
// it is declared at all. An include's definition is the start of the file
// it reads (Span.File is the target, Span.Start its first line).
func (s Symbol) Definition() (lang.Span, bool) {
	switch {
	case s.Kind == SymbolSpecies && s.Species != nil:
		return s.Species.Span, true
	case s.Kind == SymbolReaction && s.Reaction != nil:
		return s.Reaction.NameSpan(), true
	case s.Kind == SymbolInclude && s.Target != "":
		start := lang.Pos{Line: 1, Column: 1}
		return lang.Span{File: s.Target, Start: start, End: start}, true
	case s.Declaration:
		return s.Span, true
	}
	return lang.Span{}, false
}

// File returns the network's file at path (compared by PathID), or nil
// when the network does not read it.
func (n *Network) File(path string) *File { return n.files[PathID(path)] }

// SymbolAt finds the name that covers the byte offset in the file at path:
// the offset may be anywhere inside the name or just after its last
// character. It reports false when no name is there.
func (n *Network) SymbolAt(path string, offset int) (Symbol, bool) {
	f := n.File(path)
	if f == nil || f.AST == nil {
		return Symbol{}, false
	}
	var found Symbol
	ok := false
	n.eachSymbol(f, func(s Symbol) bool {
		if s.Span.Start.Offset <= offset && offset <= s.Span.End.Offset {
			found, ok = s, true
			return false
		}
		return true
	}, func(sp lang.Span) bool {
		return sp.Start.Offset <= offset && offset <= sp.End.Offset
	})
	return found, ok
}

// eachSymbol calls fn for every name in f, in source order, until fn
// returns false. Statements for which within returns false are skipped.
func (n *Network) eachSymbol(f *File, fn func(Symbol) bool, within func(lang.Span) bool) {
	species := func(ref *lang.SpeciesRef, decl bool) bool {
		if ref == nil {
			return true
		}
		s := Symbol{Kind: SymbolSpecies, Name: ref.Text, Span: ref.Span(), Species: n.LookupSpecies(ref.Text)}
		s.Declaration = decl && s.Species != nil && s.Species.Span == s.Span
		return fn(s)
	}
	reaction := func(id *lang.Ident, decl bool) bool {
		if id == nil {
			return true
		}
		s := Symbol{Kind: SymbolReaction, Name: id.Name, Span: id.Span(), Reaction: n.LookupReaction(id.Name)}
		s.Declaration = decl && s.Reaction != nil && s.Reaction.NameSpan() == s.Span
		return fn(s)
	}
	simple := func(kind SymbolKind, id *lang.Ident) bool {
		if id == nil {
			return true
		}
		return fn(Symbol{Kind: kind, Name: id.Name, Span: id.Span(), Declaration: true})
	}
	for _, st := range f.AST.Statements {
		if !within(st.Span()) {
			continue
		}
		switch {
		case st.Include != nil && st.Include.Path != nil:
			rel, err := lang.Unquote(st.Include.Path.Raw)
			if err != nil || rel == "" {
				continue
			}
			if !fn(Symbol{Kind: SymbolInclude, Name: rel, Span: st.Include.Path.Span(), Target: includeTarget(f.Path, rel)}) {
				return
			}
		case st.Element != nil:
			if !simple(SymbolElement, st.Element.Symbol) {
				return
			}
		case st.Phase != nil:
			if !simple(SymbolPhase, st.Phase.Name) {
				return
			}
		case st.Species != nil:
			for _, ref := range st.Species.Refs {
				if !species(ref, true) {
					return
				}
			}
		case st.Reaction != nil:
			r := st.Reaction
			if !reaction(r.Name, true) {
				return
			}
			for _, side := range [][]*lang.Term{r.Left, r.Right} {
				for _, t := range side {
					if t != nil && !species(t.Species, false) {
						return
					}
				}
			}
			if r.Combo != nil {
				for _, ct := range r.Combo.Terms {
					if ct != nil && !reaction(ct.Name, false) {
						return
					}
				}
			}
		case st.Mixture != nil:
			m := st.Mixture
			if !simple(SymbolMixture, m.Name) {
				return
			}
			for _, it := range m.Items {
				if it != nil && it.Member != nil && !species(it.Member.Species, false) {
					return
				}
			}
		}
	}
}

// includeTarget is the path an include of rel in the file at from reads,
// as the loader joins it.
func includeTarget(from, rel string) string {
	if filepath.IsAbs(rel) {
		return rel
	}
	return filepath.Join(filepath.Dir(from), rel)
}

// Includes lists the path of every include statement in the network's
// files, as the loader reads it, whether or not that file could be read.
// A tool that follows the network's files (a watcher) needs the missing
// ones too, so that it notices when they appear.
func (n *Network) Includes() []string {
	var out []string
	seen := map[string]bool{}
	for _, f := range n.Files {
		n.eachSymbol(f, func(s Symbol) bool {
			if s.Kind == SymbolInclude && !seen[s.Target] {
				seen[s.Target] = true
				out = append(out, s.Target)
			}
			return true
		}, func(lang.Span) bool { return true })
	}
	return out
}

// Declaration is one thing a file declares, for an outline of the file.
type Declaration struct {
	Kind SymbolKind
	Name string
	// Detail is a short description: a species' label or formula, a
	// reaction's equation, an include's path.
	Detail string
	// Span is the whole declaration; NameSpan is its name within it.
	Span, NameSpan lang.Span
}

// Outline lists what the file at path declares, in source order: settings,
// includes, elements, phases, species (one entry per name of a species
// list), reactions and mixtures.
func (n *Network) Outline(path string) []Declaration {
	f := n.File(path)
	if f == nil || f.AST == nil {
		return nil
	}
	var out []Declaration
	for _, st := range f.AST.Statements {
		span := st.Span()
		switch {
		case st.Settings != nil:
			out = append(out, Declaration{Kind: SymbolSettings, Name: "settings", Span: span, NameSpan: keywordSpan(&st.Settings.Node)})
		case st.Include != nil && st.Include.Path != nil:
			rel, _ := lang.Unquote(st.Include.Path.Raw)
			out = append(out, Declaration{Kind: SymbolInclude, Name: rel, Detail: "include", Span: span, NameSpan: st.Include.Path.Span()})
		case st.Element != nil && st.Element.Symbol != nil:
			out = append(out, Declaration{Kind: SymbolElement, Name: st.Element.Symbol.Name, Detail: "element", Span: span, NameSpan: st.Element.Symbol.Span()})
		case st.Phase != nil && st.Phase.Name != nil:
			d := Declaration{Kind: SymbolPhase, Name: st.Phase.Name.Name, Detail: "phase", Span: span, NameSpan: st.Phase.Name.Span()}
			if st.Phase.Convention != nil {
				d.Detail = st.Phase.Convention.Name
			}
			out = append(out, d)
		case st.Species != nil:
			refs := st.Species.Refs
			for _, ref := range refs {
				if ref == nil {
					continue
				}
				d := Declaration{Kind: SymbolSpecies, Name: ref.Text, Span: span, NameSpan: ref.Span()}
				if len(refs) > 1 {
					d.Span = d.NameSpan
				}
				if sp := n.LookupSpecies(ref.Text); sp != nil && sp.Span == d.NameSpan {
					d.Detail = sp.Label
					if d.Detail == "" && sp.HasFormula {
						d.Detail = sp.Formula.String()
					}
				}
				out = append(out, d)
			}
		case st.Reaction != nil && st.Reaction.Name != nil:
			r := st.Reaction
			d := Declaration{Kind: SymbolReaction, Name: r.Name.Name, Span: span, NameSpan: r.Name.Span()}
			if !st.Broken && r.Arrow != nil && len(r.Left) > 0 && len(r.Right) > 0 {
				d.Detail = lang.SideText(r.Left) + " " + lang.ArrowText(r.Arrow) + " " + lang.SideText(r.Right)
			}
			out = append(out, d)
		case st.Mixture != nil && st.Mixture.Name != nil:
			out = append(out, Declaration{Kind: SymbolMixture, Name: st.Mixture.Name.Name, Detail: "mixture", Span: span, NameSpan: st.Mixture.Name.Span()})
		}
	}
	return out
}
