package network

import (
	"math/big"

	"hess/chem"
	"hess/lang"
	"hess/thermo"
)

// Network is one compiled network: a root file, every file it includes, the
// species, reactions and mixtures they declare, and every diagnostic found.
type Network struct {
	Root      string
	Files     []*File
	Settings  Settings
	Elements  *chem.ElementTable
	Phases    map[string]*Phase
	Species   []*Species
	Reactions []*Reaction
	Mixtures  []*Mixture

	// Temperatures are the temperatures the network was checked at: the
	// caller's (Options.Temperatures) or else the settings'.
	Temperatures []float64

	Diagnostics lang.Diagnostics

	files          map[string]*File // by File.ID
	speciesByKey   map[string]*Species
	reactionByName map[string]*Reaction
}

// File is one source file of the network.
type File struct {
	Path   string // as reached: the root as given, includes joined to their includer's folder
	ID     string // identity: PathID(Path), computed once by the loader
	Source []byte
	AST    *lang.File
}

// LookupSpecies finds a declared species by its reference as written
// (charges in any accepted spelling).
func (n *Network) LookupSpecies(ref string) *Species {
	parts, err := lang.SplitRef(ref)
	if err != nil {
		return nil
	}
	return n.speciesByKey[parts.Canonical()]
}

// LookupReaction finds a reaction by name.
func (n *Network) LookupReaction(name string) *Reaction { return n.reactionByName[name] }

// LookupMixture finds a mixture by name.
func (n *Network) LookupMixture(name string) *Mixture {
	for _, m := range n.Mixtures {
		if m.Name == name {
			return m
		}
	}
	return nil
}

// StandardPressure is p° in Pa, the pressure the network's gas data and
// equilibrium constants refer to: its pressure setting, else 1 bar.
func (n *Network) StandardPressure() float64 {
	if p := n.Settings.Pressure; p > 0 {
		return p
	}
	return thermo.Bar
}

// Settings are the network's settings in SI units, defaults filled in.
type Settings struct {
	Pressure    float64 // standard-state pressure p°, Pa
	PressureSet bool    // the root's settings give pressure
	// DataPressures are the standard pressures files state for their own
	// data (standard-pressure), by file path.
	DataPressures map[string]DataPressure
	Temperatures  []float64 // requested temperatures, K
	Tolerance     float64   // J/mol
	Lint          map[string]lang.Severity
	// Activity is the activity model of aqueous solutes by name ("ideal",
	// "davies", "debye-huckel", "b-dot"); "" is ideal, the default.
	Activity     string
	ActivitySpan lang.Span // the activity setting, if written
	Span         lang.Span // the settings block, if any
}

// Convention is how a phase's species enter an equilibrium expression.
type Convention int

// Activity conventions.
const (
	ConventionUnknown Convention = iota
	IdealGas                     // activity p/p°
	Pure                         // activity 1
	Solute                       // activity γ·m/(1 mol/kg)
	SolutionMember               // activity = mole fraction
)

// String names the convention as written in a phase declaration.
func (c Convention) String() string {
	switch c {
	case IdealGas:
		return "ideal-gas"
	case Pure:
		return "pure"
	case Solute:
		return "solute"
	case SolutionMember:
		return "solution"
	}
	return "unknown"
}

// Phase is a state tag and its activity convention.
type Phase struct {
	Tag        string
	Convention Convention
	Builtin    bool
	Span       lang.Span
}

// Value is a number from the source in SI units, with its standard
// uncertainty (0 when none was given) and where it was written.
type Value struct {
	V, Sigma float64
	Span     lang.Span
	// Stated reports that the uncertainty was written (± or +-), so that a
	// σ of zero is a statement and not the absence of one.
	Stated bool
}

// PolyRange is one Shomate or NASA 7-term range of a species.
type PolyRange struct {
	Kind       string // "shomate" or "nasa7"
	Tmin, Tmax float64
	Coeffs     []float64

	node *lang.Polynomial // where it was written; see Span and Header
	m    thermo.Model     // the range as a model, built once by the compiler; see model
}

// Span is where the range was written, from its keyword to its closing
// brace. A network holds tens of thousands of ranges, which checks
// report on seldom, so the span is worked out when asked for.
func (r *PolyRange) Span() lang.Span {
	if r.node == nil {
		return lang.Span{}
	}
	return r.node.Span()
}

// Header is the range's keyword and bounds, "shomate 298 K to 1200 K":
// where a report on the range points.
func (r *PolyRange) Header() lang.Span {
	if r.node == nil {
		return lang.Span{}
	}
	return keywordSpan(&r.node.Node).Join(r.node.To.Span())
}

// Species is one declared species.
type Species struct {
	// The fields the checks read for every term of every reaction come
	// first, so that they share two cache lines: a large network reads
	// them hundreds of thousands of times, in no useful order. (A
	// reaction's compile reads none of them: see termFacts.)

	Key        string // canonical reference, e.g. SO4^2-(aq)
	HasFormula bool   // the formula parsed
	Used       bool   // appears in some reaction
	// BrokenData reports that a thermodynamic value of the species (hf,
	// gf, s, cp or a polynomial range) was written but did not compile.
	// Its error is reported where it was written; checks that would miss
	// that value (missing-thermo) stay quiet rather than report the
	// consequence.
	BrokenData    bool
	built         bool
	Charge        int
	Phase         *Phase // nil when untagged or the tag is unknown
	index         int    // declaration order in the network
	Hf, Gf, S, Cp *Value
	Ranges        []*PolyRange
	// derivedS is S° worked out from hf and gf (see DerivedS); p0 the
	// network's standard pressure, which that derivation uses.
	derivedS *Value
	model    thermo.Model // built once the species is compiled; see Model

	cover [][2]float64 // coverage(model), built with it
	ints  speciesInts  // the formula in small integers
	p0    float64

	Parts   lang.RefParts
	Span    lang.Span // the reference in its declaration
	Label   string
	Formula chem.Formula

	// Size is the ion-size parameter å in m (SI); Setschenow a neutral
	// solute's salting coefficient k_s (log10 form) in kg/mol.
	Size, Setschenow *Value
	Source, Note     string
}

// Term is one species with its exact coefficient on one side of a reaction.
// Coef may be shared with other terms (small whole numbers are): never
// change it in place. Where a term was written is in the reaction's
// syntax tree (Reaction.Equation spans them all): a network holds
// hundreds of thousands of terms, which checks walk again and again, so
// a term keeps only these three words.
type Term struct {
	Coef    *big.Rat
	Species *Species // nil when undefined
	// at is the species' declaration index plus one, as the compiler
	// found it, so that a check can read what it worked out per species
	// from an array without reading the species; 0 when not known.
	// termIndex checks it against the network before use.
	at int32
}

// termIndex is the declaration index of t's species among list (a
// network's species), read from the term when it holds a valid one, else
// from the species; -1 when the species is not one of list's.
func termIndex(list []*Species, t Term) int {
	if i := int(t.at) - 1; i >= 0 && i < len(list) && list[i] == t.Species {
		return i
	}
	if t.Species != nil && declaredIn(list, t.Species) {
		return t.Species.index
	}
	return -1
}

// ComboTerm is one weighted reaction of a coupled reaction's combination.
type ComboTerm struct {
	Weight   *big.Rat
	Name     string
	Reaction *Reaction // nil when undefined
	Span     lang.Span
}

// LogK is a measured log10 K at a temperature.
type LogK struct {
	Value Value   // dimensionless
	T     float64 // K
	Span  lang.Span
}

// Rate is a modified Arrhenius rate k = A T^n exp(−Ea/RT) in SI units.
type Rate struct {
	A     Value
	AUnit string
	N     float64
	Ea    Value
	Span  lang.Span
}

// Reaction is one reaction of the network.
type Reaction struct {
	// The fields checks read of every reaction come first (see Species).

	Name  string
	Left  []Term
	Right []Term
	// Resolved reports that every species of the equation is declared.
	Resolved bool
	TwoWay   bool
	// BrokenData reports that some of the reaction's own data (dg, dh, ds,
	// logk) was written but did not compile; see Species.BrokenData.
	BrokenData bool
	stoich     stoichFacts // worked out by the compiler once resolved
	Combo      []ComboTerm
	Dg, Dh, Ds *Value
	LogK       []LogK
	Rate       *Rate
	Reverse    *Rate

	Source string

	// node is the statement the reaction was compiled from; its spans
	// (NameSpan, Span, Equation) are worked out from it when asked for:
	// a network holds hundreds of thousands of reactions, which reports
	// name seldom. equation reports that the statement has both sides.
	node     *lang.Reaction
	equation bool
}

// NameSpan is where the reaction's name was written.
func (rx *Reaction) NameSpan() lang.Span {
	if rx.node == nil || rx.node.Name == nil {
		return lang.Span{}
	}
	return rx.node.Name.Span()
}

// file is the path of the file the reaction was written in (Span().File,
// without working out the span).
func (rx *Reaction) file() string {
	if rx.node == nil {
		return ""
	}
	if src := rx.node.Source(); src != nil {
		return src.Name()
	}
	return rx.Span().File
}

// Span is the whole reaction statement.
func (rx *Reaction) Span() lang.Span {
	if rx.node == nil {
		return lang.Span{}
	}
	return rx.node.Span()
}

// Equation spans the equation from its first term to its last; it is
// empty (not valid) for a reaction without both sides.
func (rx *Reaction) Equation() lang.Span {
	if rx.node == nil || !rx.equation {
		return lang.Span{}
	}
	r := rx.node
	return r.Left[0].Span().Join(r.Right[len(r.Right)-1].Span())
}

// Mixture is a named composition at a temperature and pressure.
type Mixture struct {
	Name        string
	Span        lang.Span
	NameSpan    lang.Span
	Temperature *Value
	Pressure    *Value
	Members     []MixMember
	// Valid is false when some item of the mixture could not be read.
	Valid bool

	wroteT, wroteP bool      // a temperature or pressure item was written
	solution       *Solution // the aqueous part, built once compiled
}

// MixMember is one species of a mixture with its amount: a mole fraction,
// or in SI a partial pressure (Pa) or a molality (mol/kg), as Kind says.
type MixMember struct {
	Species *Species
	Amount  *Value // nil for a pure phase marked present
	Unit    string // as written
	Kind    AmountKind
	// Fixed holds a gas at its partial pressure: the mixture is open to a
	// reservoir of it (an equilibrium keeps its activity).
	Fixed bool
	Span  lang.Span
}
