package network

import (
	"math"

	"hess/thermo"
)

// TableRow is a reaction's standard reaction properties and equilibrium
// constants at one temperature.
type TableRow struct {
	T, DH, DS, DG, K, Log10K, Kc float64    // SI: J/mol, J/mol/K; NaN where unknown
	SigmaLog10K                  float64    // first-order standard uncertainty of log10 K; NaN when no input states one
	Valid                        bool       // false when a species lacks data at T (missing-thermo)
	Extrapolated                 bool       // some data are used outside their temperature range
	Basis                        Basis      // where the numbers come from
	Missing                      []*Species // when not Valid: the species whose data do not reach T
	// SpeciesLog10K is log10 K from the species' data where the row comes
	// from another source (the reaction's own data, their fit, or a
	// combination) and the species' data also give it at T; NaN otherwise.
	// The row's Log10K minus it is the difference a table reports.
	SpeciesLog10K float64
}

// Basis says which data a table row is computed from.
type Basis int

// Sources of a table row. String gives the name the tables print in their
// source column.
const (
	BasisNone         Basis = iota // no data give the row
	BasisSpecies                   // the species' models: ΔrG° = Σ ν (H° − T S°)
	BasisFormation                 // the species' gf at 298.15 K: ΔrG° = Σ ν ΔfG° (species data too)
	BasisCombination               // the weighted sum of a coupled reaction's parts
	BasisReactionData              // the reaction's own dg, dh, ds or logk
	BasisFit                       // a van 't Hoff fit of the reaction's logk at several temperatures
)

// String is the source's name in tables: "species", "reaction",
// "combination", "fit", or "" for none.
func (b Basis) String() string {
	switch b {
	case BasisSpecies, BasisFormation:
		return "species"
	case BasisCombination:
		return "combination"
	case BasisReactionData:
		return "reaction"
	case BasisFit:
		return "fit"
	}
	return ""
}

// A ReactionK evaluates one reaction's standard reaction properties and
// equilibrium constant at any temperature, from the first source that gives
// ΔrG° there (see Row). It remembers its last temperature, so it is for one
// goroutine at a time; a coupled reaction's parts are evaluated once per
// temperature however often they are shared.
type ReactionK struct {
	net   *Network
	rx    *Reaction
	terms []NetTerm
	dn    float64
	p0    float64

	abs          thermo.Reaction // species models
	absOK        bool            // every species has a model with H° and S°
	coverage     [][][2]float64  // per term of abs, where its data hold
	form         thermo.Reaction // species gf at 298.15 K
	formOK       bool            // every species has gf
	anyGibbsOnly bool
	sigmaStated  bool // some species datum states an uncertainty

	own ownK // the reaction's own data

	// parts are the calculations of a coupled reaction's parts, in the
	// order of its combination; partsOK is false when a part is undefined
	// or leads back to a reaction being summed.
	parts   []*ReactionK
	weights []float64 // the parts' weights
	partsOK bool
	// cyclic is true when building the calculation met a reaction being
	// summed above it: then it depends on where it was reached from and
	// is never shared (see KSet).
	cyclic bool
	// flat is true when the reaction's ΔrG° comes from parts that all
	// take theirs from species and add up to its own equation: the sum of
	// its species' models then gives the same value (see SumsSpecies).
	flat bool

	// set is the KSet that shares this calculation, nil for one built
	// alone; grid holds its points at the set's grid temperatures.
	set  *KSet
	grid []gridPoint

	// The last point computed, so that a part shared by several coupled
	// reactions is evaluated once per temperature.
	lastT   float64
	last    point
	hasLast bool

	spanLo, spanHi float64
	spanSrc        Basis
	spanDone       bool
}

// ReactionK prepares the evaluation of rx, which must not be nil. An
// unresolved reaction gives rows that are not Valid.
func (n *Network) ReactionK(rx *Reaction) *ReactionK {
	return n.reactionK(rx, nil)
}

// reactionK builds the calculation of rx, sharing the parts of a coupled
// reaction through s when s is not nil.
func (n *Network) reactionK(rx *Reaction, s *KSet) *ReactionK {
	if len(rx.Combo) == 0 {
		return n.calcWithin(rx, nil, nil, nil) // no parts to expand
	}
	return n.calcWithin(rx, map[*Reaction]bool{}, map[*Reaction]*ReactionK{}, s)
}

// calcWithin builds the calculation of rx; path holds the coupled reactions
// being expanded above it, memo the calculations already built for this
// reaction, s (when not nil) the parts shared with other reactions.
func (n *Network) calcWithin(rx *Reaction, path map[*Reaction]bool, memo map[*Reaction]*ReactionK, s *KSet) *ReactionK {
	if c, ok := memo[rx]; ok {
		return c
	}
	part := len(path) > 0 // reached as a part of a coupled reaction
	if c := s.shared(rx); c != nil && part {
		return c
	}
	c := &ReactionK{net: n, rx: rx, terms: rx.NetTerms(), p0: n.StandardPressure(), own: newOwnK(rx, n.ownDataShift(rx))}
	if len(rx.Combo) > 0 {
		path[rx] = true
		c.partsOK = true
		for _, ct := range rx.Combo {
			if ct.Reaction == nil || ct.Weight == nil || path[ct.Reaction] {
				c.partsOK = false
				c.cyclic = c.cyclic || (ct.Reaction != nil && path[ct.Reaction])
				break
			}
			p := n.calcWithin(ct.Reaction, path, memo, s)
			c.cyclic = c.cyclic || p.cyclic
			c.parts = append(c.parts, p)
			c.weights = append(c.weights, ratFloat(ct.Weight))
		}
		delete(path, rx)
	}
	if memo != nil {
		memo[rx] = c
	}
	n.sumSpecies(c)
	c.flat = c.addsUpFromSpecies()
	if part && !c.cyclic {
		s.share(rx, c)
	}
	return c
}

// sumSpecies fills in the reaction's sums over its species: Δn, their
// models and their gf.
func (n *Network) sumSpecies(c *ReactionK) {
	rx := c.rx
	c.dn = deltaGasMoles(c.terms)
	c.absOK, c.formOK = rx.Resolved && len(c.terms) > 0, rx.Resolved && len(c.terms) > 0
	c.coverage = make([][][2]float64, 0, len(c.terms))
	c.abs.Terms = make([]thermo.Term, 0, len(c.terms))
	c.form.Terms = make([]thermo.Term, 0, len(c.terms))
	for _, t := range c.terms {
		nu := t.NuFloat()
		sp := t.Species
		a := sp.QuotientActivity()
		m := sp.Model()
		if m == nil || isGibbsOnly(m) {
			c.absOK = false
		}
		if m != nil && isGibbsOnly(m) {
			c.anyGibbsOnly = true
		}
		c.sigmaStated = c.sigmaStated || sp.sigmaStated()
		c.coverage = append(c.coverage, sp.coverage())
		c.abs.Terms = append(c.abs.Terms, thermo.Term{Nu: nu, Model: m, IsGas: a == thermo.ActivityGas, Activity: a, Sigma: sp.Sigma()})
		var g thermo.Model
		if sp.Gf != nil {
			if gm, err := thermo.NewGibbsOnly(sp.Gf.V); err == nil {
				g = n.pressureShiftedModel(sp, gm)
			}
		}
		if g == nil {
			c.formOK = false
		}
		c.form.Terms = append(c.form.Terms, thermo.Term{Nu: nu, Model: g, IsGas: a == thermo.ActivityGas, Activity: a, Sigma: sp.Sigma()})
	}
}

// point is a reaction's ΔrH°, ΔrS°, ΔrG° and σ(log10 K) at one temperature.
type point struct {
	dh, ds, dg, sigma float64
	extrapolated      bool
	basis             Basis
}

func (p point) ok() bool { return !math.IsNaN(p.dg) && !math.IsInf(p.dg, 0) }

var noPoint = point{dh: math.NaN(), ds: math.NaN(), dg: math.NaN(), sigma: math.NaN()}

// Row is the reaction at T: ΔrH°, ΔrS°, ΔrG°, K, log10 K with its
// uncertainty, and Kc = K·(p°/(R·T·1 mol/L))^Δn. The row comes from the
// first of these that gives ΔrG° at T: the species' models; at 298.15 K,
// the species' gf when some species is known by gf alone; for a coupled
// reaction, the weighted sum of its parts' rows; the reaction's own logk at
// T, its dh with ds (or either with dg), or its dg at 298.15 K. K is
// relative to the network's standard pressure and 1 mol/kg. A row that no
// data give is not Valid and lists the species lacking data at T.
func (c *ReactionK) Row(T float64) TableRow {
	p := c.at(T)
	r := TableRow{T: T, DH: p.dh, DS: p.ds, DG: p.dg, K: math.NaN(), Log10K: math.NaN(), Kc: math.NaN(),
		SigmaLog10K: math.NaN(), Extrapolated: p.extrapolated, Basis: p.basis, SpeciesLog10K: math.NaN()}
	if !p.ok() || !(T > 0) {
		r.DG, r.Basis, r.Extrapolated = math.NaN(), BasisNone, false
		r.Missing = c.lacking(T)
		return r
	}
	r.Valid = true
	lnK := -p.dg/(thermo.R*T) + 0 // + 0: no −0 where ΔrG° = 0
	r.K = math.Exp(lnK)
	r.Log10K = lnK / math.Ln10
	r.Kc = r.K
	if c.dn != 0 {
		r.Kc = math.Exp(lnK + c.dn*math.Log(c.p0/(thermo.R*T*thermo.CStd)))
	}
	r.SigmaLog10K = p.sigma
	if p.basis != BasisSpecies && p.basis != BasisFormation {
		if sp := c.fromSpeciesData(T); sp.ok() {
			r.SpeciesLog10K = -sp.dg / (thermo.R * T * math.Ln10)
		}
	}
	return r
}

// SpeciesRow is the reaction at T from its species' data alone (their
// models, or their gf at 298.15 K), whatever the reaction's own data say:
// what the data-conflict check compares own data with.
func (c *ReactionK) SpeciesRow(T float64) TableRow {
	p := c.fromSpeciesData(T)
	r := TableRow{T: T, DH: p.dh, DS: p.ds, DG: p.dg, K: math.NaN(), Log10K: math.NaN(), Kc: math.NaN(),
		SigmaLog10K: p.sigma, Extrapolated: p.extrapolated, Basis: p.basis, SpeciesLog10K: math.NaN()}
	if !p.ok() || !(T > 0) {
		r.Basis, r.Extrapolated = BasisNone, false
		return r
	}
	r.Valid = true
	r.Log10K = -p.dg / (thermo.R * T * math.Ln10)
	r.K = math.Pow(10, r.Log10K)
	return r
}

// at evaluates the reaction at T from the first source that gives ΔrG°.
func (c *ReactionK) at(T float64) point {
	if c.hasLast && c.lastT == T {
		return c.last
	}
	if c.set != nil {
		if p, ok := c.set.at(c, T); ok {
			return p
		}
	}
	p := c.eval(T)
	c.lastT, c.last, c.hasLast = T, p, true
	return p
}

// eval applies the provenance rule: a reaction's own data are the measured
// values for that reaction, so the sources are tried in the order own data
// (a logk at T, a fit of several logk, a constant ΔrH° and ΔrS°, dg at
// 298.15 K), a coupled reaction's parts, the species' data. The first
// source that holds at T within its range answers; where every source that
// gives a value must extrapolate, the first of them answers, marked
// extrapolated.
func (c *ReactionK) eval(T float64) point {
	if !(T > 0) {
		return noPoint
	}
	if len(c.terms) == 0 && c.rx.Resolved && len(c.rx.Left)+len(c.rx.Right) > 0 {
		// The sides cancel: nothing happens, ΔrG° = 0 and K = 1 at any T
		// (reported as empty-reaction).
		return point{basis: BasisSpecies, sigma: math.NaN()}
	}
	first := noPoint
	for _, src := range [...]func(float64) point{c.own.at, c.fromCombination, c.fromSpeciesData} {
		p := src(T)
		if !p.ok() {
			continue
		}
		if !p.extrapolated {
			return p
		}
		if !first.ok() {
			first = p
		}
	}
	return first
}

// fromSpeciesData is the reaction from its species' models, or at 298.15 K
// from their gf where some species is known by gf alone.
func (c *ReactionK) fromSpeciesData(T float64) point {
	if c.absOK {
		if p := c.fromSpecies(T); p.ok() {
			return p
		}
	}
	if c.formOK && c.anyGibbsOnly && thermo.AtT298(T) {
		if p := c.fromFormation(T); p.ok() {
			return p
		}
	}
	return noPoint
}

func (c *ReactionK) fromSpecies(T float64) point {
	p := point{dh: c.abs.DeltaH(T), ds: c.abs.DeltaS(T), dg: c.abs.DeltaG(T), sigma: stated(c.abs.SigmaLog10K(T), c.sigmaStated), basis: BasisSpecies}
	for _, cov := range c.coverage {
		if !coveredBy(cov, T) {
			p.extrapolated = true
		}
	}
	return p
}

// fromFormation sums gf at 298.15 K. ΔrH° is Σ ν hf when every species has
// hf, and ΔrS° follows from ΔrH° and ΔrG°.
func (c *ReactionK) fromFormation(T float64) point {
	p := point{dh: 0, ds: math.NaN(), dg: c.form.DeltaG(T), sigma: stated(c.form.SigmaLog10K(T), c.sigmaStated), basis: BasisFormation}
	for _, t := range c.terms {
		if t.Species.Hf == nil {
			p.dh = math.NaN()
			break
		}
		nu := t.NuFloat()
		p.dh += nu * t.Species.Hf.V
	}
	if !math.IsNaN(p.dh) {
		p.ds = (p.dh - p.dg) / T
	}
	return p
}

// fromCombination sums the parts of a coupled reaction, weighted: ΔrG°, ΔrH°
// and ΔrS° add, and so do the variances of log10 K.
func (c *ReactionK) fromCombination(T float64) point {
	if !c.partsOK {
		return noPoint
	}
	sum := point{basis: BasisCombination}
	variance, anyStated := 0.0, false
	for i, part := range c.parts {
		w := c.weights[i]
		p := part.at(T)
		if !p.ok() {
			return noPoint
		}
		sum.dh += w * p.dh
		sum.ds += w * p.ds
		sum.dg += w * p.dg
		if !math.IsNaN(p.sigma) {
			variance += w * w * p.sigma * p.sigma
			anyStated = true
		}
		sum.extrapolated = sum.extrapolated || p.extrapolated
	}
	sum.sigma = stated(math.Sqrt(variance), anyStated)
	return sum
}

func sq(x float64) float64 { return x * x }

// Span is the span of temperatures over which the reaction's ΔrG° is a
// continuous function of the data of its first source (see eval): the range
// of its own data (the logk temperatures of a fit, the anchor ±
// thermo.DefaultSpan of a constant ΔrH° and ΔrS°), the overlap of its
// parts' spans for a coupled reaction, or the overlap of its species'
// ranges. lo > hi means no span.
func (c *ReactionK) Span() (lo, hi float64) {
	if !c.spanDone {
		c.spanLo, c.spanHi, c.spanSrc = c.findSpan()
		c.spanDone = true
	}
	return c.spanLo, c.spanHi
}

func (c *ReactionK) findSpan() (lo, hi float64, src Basis) {
	if lo, hi := c.own.span(); lo < hi {
		if c.own.fit != nil {
			return lo, hi, BasisFit
		}
		return lo, hi, BasisReactionData
	}
	if c.partsOK {
		lo, hi = 0, math.Inf(1)
		for _, part := range c.parts {
			l, h := part.Span()
			lo, hi = math.Max(lo, l), math.Min(hi, h)
		}
		if lo < hi {
			return lo, hi, BasisCombination
		}
	}
	if c.absOK {
		lo, hi = c.abs.Range()
		return lo, hi, BasisSpecies
	}
	return math.Inf(1), math.Inf(-1), BasisNone
}

// SpanSource is the source whose data make the Span: BasisReactionData or
// BasisFit for own data, BasisCombination, BasisSpecies, or BasisNone.
func (c *ReactionK) SpanSource() Basis {
	c.Span()
	return c.spanSrc
}

// Fit is the van 't Hoff fit of the reaction's logk values, nil unless it
// has logk at two or more temperatures.
func (c *ReactionK) Fit() *LogKFit { return c.own.fit }

// DeltaG is ΔrG° at T in J/mol, as Row gives it; NaN where no data give it.
func (c *ReactionK) DeltaG(T float64) float64 {
	p := c.at(T)
	if !p.ok() {
		return math.NaN()
	}
	return p.dg
}

// Species returns the reaction as the sum of its species' models, and false
// unless every species has a model with H° and S°. Row takes ΔrG° from it
// where neither the reaction's own data nor its parts answer.
func (c *ReactionK) Species() (thermo.Reaction, bool) { return c.abs, c.absOK }

// Terms are the reaction's net terms (Reaction.NetTerms), shared: the
// caller must not change them.
func (c *ReactionK) Terms() []NetTerm { return c.terms }

// DeltaGasMoles is Δn, the net change in moles of gas.
func (c *ReactionK) DeltaGasMoles() float64 { return c.dn }

// StandardPressure is p° in Pa, the pressure the gas data and K refer to.
func (c *ReactionK) StandardPressure() float64 { return c.p0 }

// lacking lists the species whose data cannot give the reaction at T: no
// usable model, gf alone away from 298.15 K, or (at 298.15 K, beside a
// gf-only species) no gf.
func (c *ReactionK) lacking(T float64) []*Species {
	var out []*Species
	for _, t := range c.terms {
		m := t.Species.Model()
		if m == nil || (isGibbsOnly(m) && !thermo.AtT298(T)) {
			out = append(out, t.Species)
		}
	}
	if len(out) == 0 && thermo.AtT298(T) && c.anyGibbsOnly {
		for _, t := range c.terms {
			if t.Species.Gf == nil {
				out = append(out, t.Species)
			}
		}
	}
	return out
}
