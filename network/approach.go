package network

import (
	"math"

	"hess/thermo"
)

// Direction is which way a reaction would run in a mixture.
type Direction int

// Directions of a reaction in a mixture.
const (
	DirectionUnknown Direction = iota // K or Q cannot be computed
	Forward                           // ΔrG < 0: Q < K
	Reverse                           // ΔrG > 0: Q > K
	AtEquilibrium                     // |ΔrG| within the network's tolerance
)

// String is the word CLI.md uses: forward, reverse or equilibrium ("" when
// unknown).
func (d Direction) String() string {
	switch d {
	case Forward:
		return "forward"
	case Reverse:
		return "reverse"
	case AtEquilibrium:
		return "equilibrium"
	}
	return ""
}

// MixtureApproach is how far a mixture is from equilibrium, reaction by
// reaction.
type MixtureApproach struct {
	Mixture   *Mixture
	T         float64 // K
	P         float64 // total pressure, Pa; NaN when nothing gives one
	Reactions []ReactionApproach
	// Absent are the reactions with no quotient in the mixture, each with
	// the species the mixture lacks.
	Absent []AbsentReaction
}

// ReactionApproach is one reaction's quotient, constant and driving force
// in a mixture. Values that cannot be computed are NaN.
type ReactionApproach struct {
	Reaction *Reaction
	LnQ      float64 // ln Q on the activity conventions of the network
	LnK      float64 // ln K at the mixture's temperature
	DG0      float64 // ΔrG° at the mixture's temperature, J/mol
	DG       float64 // ΔrG = ΔrG° + RT ln Q, J/mol
	// Direction follows from ΔrG and the network's tolerance.
	Direction Direction
	// EquilibriumT is the temperature inside the data's range at which
	// K(T) = Q (the one nearest the mixture's temperature); NaN where K
	// never reaches Q there.
	EquilibriumT float64
	// Missing lists the species lacking data at the mixture's temperature
	// when K cannot be computed there.
	Missing []*Species
	// Extrapolated reports that some data are used outside their range.
	Extrapolated bool
}

// Log10QOverK is log10(Q/K), NaN when K is unknown.
func (r ReactionApproach) Log10QOverK() float64 { return (r.LnQ - r.LnK) / math.Ln10 }

// ApproachK is T − EquilibriumT at the mixture's temperature T.
func (r ReactionApproach) ApproachK(T float64) float64 { return T - r.EquilibriumT }

// AbsentReaction is a reaction with no quotient in a mixture.
type AbsentReaction struct {
	Reaction *Reaction
	Lacking  []*Species
}

// Counts tallies the reactions by direction.
func (a *MixtureApproach) Counts() (forward, reverse, equilibrium, unknown int) {
	for _, r := range a.Reactions {
		switch r.Direction {
		case Forward:
			forward++
		case Reverse:
			reverse++
		case AtEquilibrium:
			equilibrium++
		default:
			unknown++
		}
	}
	return forward, reverse, equilibrium, unknown
}

// Usable reports whether the mixture can be evaluated: every item was read
// and the mixture checks find nothing wrong with it as a whole.
func (m *Mixture) Usable() bool {
	return m != nil && m.Valid && len(mixtureIncomplete(m)) == 0 && len(mixtureProblems(m)) == 0
}

// LookupMixture finds a mixture by name.
func (n *Network) LookupMixture(name string) *Mixture {
	for _, m := range n.Mixtures {
		if m.Name == name {
			return m
		}
	}
	return nil
}

// Approach evaluates every reaction of the network in the mixture: its
// quotient Q, K at the mixture's temperature, ΔrG = ΔrG° + RT ln Q, the
// direction it would run, and the temperature at which K would equal Q. It
// returns nil for a mixture that is not Usable, so that a mistake in the
// composition never yields a number.
func (n *Network) Approach(m *Mixture) *MixtureApproach {
	if !m.Usable() {
		return nil
	}
	out := &MixtureApproach{Mixture: m, T: m.Temperature.V, P: m.TotalPressure()}
	for _, rx := range n.Reactions {
		lnQ, lacking := n.lnQuotient(m, rx)
		if len(lacking) > 0 || !rx.Resolved {
			out.Absent = append(out.Absent, AbsentReaction{Reaction: rx, Lacking: lacking})
			continue
		}
		out.Reactions = append(out.Reactions, n.approachOne(rx, out.T, lnQ))
	}
	return out
}

// lnQuotient is ln Q of the reaction in the mixture, Σ ν ln a, or the
// species of the reaction's quotient that the mixture does not list (pure
// phases included: listing one marks it present).
func (n *Network) lnQuotient(m *Mixture, rx *Reaction) (float64, []*Species) {
	p0 := n.Settings.Pressure
	if !(p0 > 0) {
		p0 = thermo.Bar
	}
	var lacking []*Species
	lnQ := 0.0
	for _, t := range netTerms(rx) {
		mm := m.Member(t.species)
		if mm == nil {
			lacking = append(lacking, t.species)
			continue
		}
		a := m.Activity(mm, p0)
		if !(a > 0) {
			lacking = append(lacking, t.species)
			continue
		}
		nu, _ := t.nu.Float64()
		lnQ += nu * math.Log(a)
	}
	return lnQ, lacking
}

func (n *Network) approachOne(rx *Reaction, T, lnQ float64) ReactionApproach {
	c := n.calc(rx)
	row := c.row(T)
	r := ReactionApproach{Reaction: rx, LnQ: lnQ, LnK: math.NaN(), DG0: math.NaN(), DG: math.NaN(), EquilibriumT: math.NaN()}
	if !row.Valid {
		r.Missing = row.Missing
		return r
	}
	r.DG0 = row.DG
	r.LnK = -row.DG / (thermo.R * T)
	r.DG = row.DG + thermo.R*T*lnQ
	r.Extrapolated = row.Extrapolated
	switch {
	case math.Abs(r.DG) <= n.Settings.Tolerance:
		r.Direction = AtEquilibrium
	case r.DG < 0:
		r.Direction = Forward
	default:
		r.Direction = Reverse
	}
	r.EquilibriumT = equilibriumTemperature(c, T, lnQ)
	return r
}

// equilibriumTemperature finds where ln K(T) = ln Q, that is where
// ΔrG°(T) + RT ln Q = 0, by a bracketing root search over the data's span;
// of several roots it takes the one nearest T. It is NaN when K never
// reaches Q there.
func equilibriumTemperature(c *rxCalc, T, lnQ float64) float64 {
	lo, hi := c.span()
	if !(lo < hi) || math.IsInf(hi, 0) || math.IsInf(lo, 0) {
		return math.NaN()
	}
	roots := thermo.Crossovers(func(t float64) float64 {
		var dg float64
		if c.absOK {
			dg = c.abs.DeltaG(t)
		} else {
			p := c.at(t)
			if !p.ok() {
				return math.NaN()
			}
			dg = p.dg
		}
		return dg + thermo.R*t*lnQ
	}, lo, hi)
	best := math.NaN()
	for _, r := range roots {
		if math.IsNaN(best) || math.Abs(r.T-T) < math.Abs(best-T) {
			best = r.T
		}
	}
	return best
}
