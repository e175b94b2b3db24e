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

	Diagnostics lang.Diagnostics

	speciesByKey   map[string]*Species
	reactionByName map[string]*Reaction
}

// File is one source file of the network.
type File struct {
	Path   string // as reached: the root as given, includes joined to their includer's folder
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
	Pressure     float64   // standard-state pressure p°, Pa
	Temperatures []float64 // requested temperatures, K
	Tolerance    float64   // J/mol
	Lint         map[string]lang.Severity
	Span         lang.Span // the settings block, if any
}

// Convention is how a phase's species enter an equilibrium expression.
type Convention int

// Activity conventions.
const (
	ConventionUnknown Convention = iota
	IdealGas                     // activity p/p°
	Pure                         // activity 1
	Solute                       // activity m/(1 mol/kg)
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
}

// PolyRange is one Shomate or NASA 7-term range of a species.
type PolyRange struct {
	Kind       string // "shomate" or "nasa7"
	Tmin, Tmax float64
	Coeffs     []float64
	Span       lang.Span
	Header     lang.Span // the keyword and the bounds, "shomate 298 K to 1200 K"
}

// Species is one declared species.
type Species struct {
	Key        string // canonical reference, e.g. SO4^2-(aq)
	Parts      lang.RefParts
	Span       lang.Span // the reference in its declaration
	Label      string
	Formula    chem.Formula
	HasFormula bool // the formula parsed
	Charge     int
	Phase      *Phase // nil when untagged or the tag is unknown

	Hf, Gf, S, Cp *Value
	Ranges        []*PolyRange
	Source, Note  string

	Used bool // appears in some reaction

	index int          // declaration order in the network
	ints  speciesInts  // the formula in small integers
	model thermo.Model // built once the species is compiled; see Model
	built bool
}

// Term is one species with its exact coefficient on one side of a reaction.
// Coef may be shared with other terms (small whole numbers are): never
// change it in place.
type Term struct {
	Coef    *big.Rat
	Species *Species // nil when undefined
	Span    lang.Span
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
	Name       string
	NameSpan   lang.Span
	Span       lang.Span // the whole statement
	Equation   lang.Span // from the first term to the last
	Left       []Term
	Right      []Term
	TwoWay     bool
	Combo      []ComboTerm
	Dg, Dh, Ds *Value
	LogK       []LogK
	Rate       *Rate
	Reverse    *Rate
	Source     string

	// Resolved reports that every species of the equation is declared.
	Resolved bool

	stoich stoichFacts // worked out by the compiler once resolved
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

	wroteT, wroteP bool // a temperature or pressure item was written
}

// MixMember is one species of a mixture with its amount: a mole fraction,
// or in SI a partial pressure (Pa) or a molality (mol/kg), as Kind says.
type MixMember struct {
	Species *Species
	Amount  *Value // nil for a pure phase marked present
	Unit    string // as written
	Kind    AmountKind
	Span    lang.Span
}
