package equilibrium

import (
	"fmt"
	"math"
	"sort"

	"hess/gibbs"
	"hess/lang"
	"hess/network"
	"hess/thermo"
)

// Options say where and how a feed is brought to equilibrium.
type Options struct {
	// T is the temperature, K; 0 takes the mixture's. Ignored when
	// Adiabatic is set.
	T float64
	// P is the pressure, Pa; 0 takes the mixture's.
	P float64
	// Basis is what the amounts may change along.
	Basis Basis
	// Adiabatic holds H and P: T becomes the temperature at which the
	// products have the feed's enthalpy at its own temperature.
	Adiabatic bool
	// Start is a previous composition of the same feed (for example at a
	// neighbouring temperature of a sweep) to start from.
	Start *Composition
}

// Composition is a feed brought to equilibrium at T and P.
type Composition struct {
	Mixture   *network.Mixture
	T, P      float64 // K, Pa
	FeedT     float64 // the feed's own temperature, K
	Basis     Basis
	Adiabatic bool
	// Converged is true when the minimisation met its tolerances.
	Converged  bool
	Iterations int
	// ElementResidual is the largest |Σ_j a_ij (n_j − n₀_j)| over the
	// element and charge rows, relative to the feed's total amount.
	ElementResidual float64
	// Stationarity is the largest gap between a present species' chemical
	// potential and the conservation potentials (dimensionless, μ/RT).
	Stationarity float64
	// FeedMoles is the feed's total amount, mol.
	FeedMoles float64
	// Heat is the heat to take the feed from its own temperature to the
	// products at T, J (Σ n_j H°_j(T) − Σ n₀_j H°_j(T_feed), ideal
	// phases); NaN when some species lacks enthalpy data (HeatNote says).
	Heat     float64
	HeatNote string
	// AdjustedMu reports that some μ° were fitted to reactions' own ΔrG°.
	AdjustedMu bool
	// Extrapolated are the species whose data, which state no range, were
	// carried beyond their default span (298.15 K ± 100 K) to T.
	Extrapolated []*network.Species
	Phases       []PhaseAmount
	// Species are in the order of the calculation (feed first); sort them
	// for display.
	Species   []SpeciesAmount
	Reactions []ReactionBalance

	sys   *system
	res   gibbs.Result
	cache *rxCache
}

// PhaseAmount is one phase of the result.
type PhaseAmount struct {
	Name    string // "g", "aq", a solution tag, or a pure species' name
	Kind    gibbs.PhaseKind
	Present bool
	Amount  float64 // mol
}

// SpeciesAmount is one species of the result.
type SpeciesAmount struct {
	Species      *network.Species
	Phase        string
	Amount       float64 // mol (≥ 0)
	MoleFraction float64 // in its phase (a pure phase: 1 present, 0 absent)
	Activity     float64 // on the network's conventions; 0 when absent
	Molality     float64 // mol/kg for solutes; NaN otherwise
}

// ReactionBalance is one reaction's log10(Q/K) at the solution: ≈ 0 where
// all its species are present; NaN where one is absent (Q is 0 or
// undefined) or ΔrG° is unknown at T.
type ReactionBalance struct {
	Reaction    *network.Reaction
	Log10QoverK float64
	InBasis     bool // the reaction is one of the reactions basis
}

// Feed returns the mixture's feed, or diagnostics when the mixture is no
// feed.
func feedOf(mx *network.Mixture) ([]feedItem, float64, lang.Diagnostics) {
	errAt := func(format string, args ...any) lang.Diagnostics {
		return lang.Diagnostics{{Code: "mixture-amount", Severity: lang.Error, Subject: mx.NameSpan, Message: fmt.Sprintf(format, args...)}}
	}
	if !mx.Usable() {
		return nil, 0, errAt("mixture %s has mistakes and cannot be fed", mx.Name)
	}
	amounts := mx.FeedAmounts()
	if amounts == nil {
		return nil, 0, errAt("mixture %s is no feed: give every member an amount (such as CH4(g) 1 mol), or give only gases as mole fractions", mx.Name)
	}
	var out []feedItem
	total := 0.0
	for i, mm := range mx.Members {
		out = append(out, feedItem{species: mm.Species, amount: amounts[i], span: mm.Span})
		total += amounts[i]
	}
	return out, total, nil
}

// Equilibrate brings a mixture, read as a feed, to equilibrium. A mixture
// that is no feed, or whose members cannot take part, gives diagnostics and
// no composition. An error is a failure of the solver itself.
func Equilibrate(net *network.Network, mx *network.Mixture, o Options) (*Composition, lang.Diagnostics, error) {
	if o.Adiabatic {
		return adiabatic(net, mx, o)
	}
	feed, total, diags := feedOf(mx)
	if diags != nil {
		return nil, diags, nil
	}
	T, P, diags := conditions(mx, o)
	if diags != nil {
		return nil, diags, nil
	}
	c, diags, err := solveAt(net, cacheFor(net, o.Start), mx, feed, total, T, P, o.Basis, o.Start)
	if c != nil {
		c.heat(feed)
	}
	return c, diags, err
}

// conditions are the temperature and pressure of a calculation.
func conditions(mx *network.Mixture, o Options) (T, P float64, diags lang.Diagnostics) {
	T, P = o.T, o.P
	if T == 0 && mx.Temperature != nil {
		T = mx.Temperature.V
	}
	if P == 0 {
		P = mx.TotalPressure()
	}
	if !(T > 0) || math.IsInf(T, 0) {
		diags = append(diags, lang.Diagnostic{Code: "mixture-incomplete", Severity: lang.Error, Subject: mx.NameSpan,
			Message: fmt.Sprintf("mixture %s gives no temperature to bring it to equilibrium at", mx.Name)})
	}
	if !(P > 0) || math.IsInf(P, 0) {
		diags = append(diags, lang.Diagnostic{Code: "mixture-incomplete", Severity: lang.Error, Subject: mx.NameSpan,
			Message: fmt.Sprintf("mixture %s gives no pressure to bring it to equilibrium at", mx.Name)})
	}
	return T, P, diags
}

// solveAt solves the feed at T and P.
func solveAt(net *network.Network, rc *rxCache, mx *network.Mixture, feed []feedItem, total, T, P float64, basis Basis, start *Composition) (*Composition, lang.Diagnostics, error) {
	sys, diags, err := buildSystem(net, rc, feed, mx.NameSpan, T, P, basis)
	if diags != nil || err != nil {
		if err != nil {
			err = fmt.Errorf("mixture %s at %s K: %w", mx.Name, kelvin(T), err)
		}
		return nil, diags, err
	}
	opts := gibbs.Options{}
	if start != nil && sameSpecies(start.sys, sys) {
		opts.Start = &start.res
	}
	res, err := gibbs.Solve(sys.problem, opts)
	if err == nil && !res.Converged {
		// A pure phase that must vanish while a one-species gas phase
		// grows (a carbonate just above its decomposition temperature)
		// converges slowly: retry from cold with a larger budget, bounded
		// by the system's size. A start that wandered off is abandoned by
		// the solver for the feed's own phases; restarting from where it
		// ended often gets through.
		budget := retryIterations(len(sys.species))
		if r2, err2 := gibbs.Solve(sys.problem, gibbs.Options{MaxIterations: budget}); err2 == nil && r2.Converged {
			res = r2
		} else if r3, err3 := gibbs.Solve(sys.problem, gibbs.Options{MaxIterations: budget, Start: &res}); err3 == nil && r3.Converged {
			res = r3
		}
	}
	if err != nil {
		return nil, nil, fmt.Errorf("mixture %s at %s K: %w", mx.Name, kelvin(T), err)
	}
	c := &Composition{Mixture: mx, T: T, P: P, Basis: basis, Converged: res.Converged, Iterations: res.Iterations,
		Stationarity: res.Stationarity, FeedMoles: total, AdjustedMu: sys.adjusted, Extrapolated: sys.extrapolated, sys: sys, res: res, cache: rc}
	if mx.Temperature != nil {
		c.FeedT = mx.Temperature.V
	}
	c.assemble()
	return c, nil, nil
}

// retryIterations is the iteration budget of the second try: 40 000 for
// small systems, falling with size so that a retry costs at most about as
// much as 500 iterations on 2 000 species.
func retryIterations(species int) int {
	return max(2000, min(40000, 1_000_000/max(species, 1)))
}

func sameSpecies(a, b *system) bool {
	if a == nil || b == nil || len(a.species) != len(b.species) {
		return false
	}
	for j := range a.species {
		if a.species[j] != b.species[j] {
			return false
		}
	}
	return true
}

// assemble fills the phases, species, reactions and the element balance
// from the solver's result.
func (c *Composition) assemble() {
	sys, res, rc := c.sys, c.res, c.cache
	for k, name := range sys.phaseName {
		c.Phases = append(c.Phases, PhaseAmount{Name: name, Kind: sys.phaseKind[k], Present: res.PhasePresent[k], Amount: res.PhaseAmount[k]})
	}
	waterKg := 0.0
	if sys.solvent >= 0 {
		waterKg = res.N[sys.solvent] * network.WaterMolarMass
	}
	for j, sp := range sys.species {
		k := sys.problem.Species[j].Phase
		s := SpeciesAmount{Species: sp, Phase: sys.phaseName[k], Amount: res.N[j], Molality: math.NaN()}
		if pa := res.PhaseAmount[k]; pa > 0 && res.N[j] > 0 {
			s.MoleFraction = res.N[j] / pa
		}
		if la := res.LnActivity[j]; !math.IsNaN(la) {
			s.Activity = math.Exp(la)
		}
		if sp.Activity() == thermo.ActivitySolute && waterKg > 0 {
			s.Molality = res.N[j] / waterKg
		}
		c.Species = append(c.Species, s)
	}
	inBasis := map[*network.Reaction]bool{}
	for _, rx := range sys.reactions {
		inBasis[rx] = true
	}
	for _, rx := range rc.net.Reactions {
		it := rc.get(rx)
		if !it.ok {
			continue
		}
		rb := ReactionBalance{Reaction: rx, Log10QoverK: math.NaN(), InBasis: inBasis[rx]}
		g := it.deltaG(c.T)
		ok := !math.IsNaN(g)
		lnQ := 0.0
		for _, t := range it.terms {
			j, in := sys.index[t.species]
			if !in || !(res.N[j] > 0) {
				ok = false
				break
			}
			lnQ += t.nu * res.LnActivity[j]
		}
		if !ok {
			if sys.reactionsBasis() && !inBasis[rx] {
				continue
			}
			c.Reactions = append(c.Reactions, rb)
			continue
		}
		rb.Log10QoverK = (lnQ + g/(thermo.R*c.T)) / math.Ln10
		c.Reactions = append(c.Reactions, rb)
	}
	worst := 0.0
	for _, row := range sys.elemRows {
		d := 0.0
		for j, a := range row {
			d += a * (res.N[j] - sys.problem.N0[j])
		}
		worst = math.Max(worst, math.Abs(d))
	}
	c.ElementResidual = worst / math.Max(c.FeedMoles, 1e-300)
}

func (sys *system) reactionsBasis() bool { return sys.reactions != nil }

var nan = math.NaN()

// Sorted returns the species by amount, largest first (ties by name).
func (c *Composition) Sorted() []SpeciesAmount {
	out := append([]SpeciesAmount(nil), c.Species...)
	sort.SliceStable(out, func(a, b int) bool {
		if out[a].Amount != out[b].Amount {
			return out[a].Amount > out[b].Amount
		}
		return out[a].Species.Key < out[b].Species.Key
	})
	return out
}

// HeatPerMolFeed is Heat divided by the feed's total amount, J/mol.
func (c *Composition) HeatPerMolFeed() float64 { return c.Heat / c.FeedMoles }
