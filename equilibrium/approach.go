package equilibrium

import (
	"math"

	"hess/network"
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
	Mixture   *network.Mixture
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
	Reaction *network.Reaction
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
	Missing []*network.Species
	// Extrapolated reports that some data are used outside their range.
	Extrapolated bool
}

// Log10QOverK is log10(Q/K), NaN when K is unknown.
func (r ReactionApproach) Log10QOverK() float64 { return (r.LnQ - r.LnK) / math.Ln10 }

// ApproachK is the approach to equilibrium at the mixture's temperature T,
// in kelvin, signed as plant practice reports it: positive when the
// reaction as written is short of equilibrium (Q < K, so it would still run
// forward), negative when it is past it (Q > K), for endothermic and
// exothermic reactions alike. Its size is |T − EquilibriumT|: for an
// endothermic reaction short of equilibrium T lies above EquilibriumT, for
// an exothermic one below. NaN when K or EquilibriumT is unknown.
func (r ReactionApproach) ApproachK(T float64) float64 {
	d := math.Abs(T - r.EquilibriumT)
	if math.IsNaN(r.LnK) || math.IsNaN(r.LnQ) {
		return math.NaN()
	}
	if r.LnQ > r.LnK {
		return -d
	}
	return d
}

// AbsentReaction is a reaction with no quotient in a mixture.
type AbsentReaction struct {
	Reaction *network.Reaction
	Lacking  []*network.Species
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

// Approach evaluates every reaction of the network in the mixture: its
// quotient Q, K at the mixture's temperature, ΔrG = ΔrG° + RT ln Q, the
// direction it would run, and the temperature at which K would equal Q. It
// returns nil for a mixture that is not Usable, so that a mistake in the
// composition never yields a number.
func Approach(n *network.Network, m *network.Mixture) *MixtureApproach {
	if !m.Usable() {
		return nil
	}
	out := &MixtureApproach{Mixture: m, T: m.Temperature.V, P: m.TotalPressure()}
	for _, rx := range n.Reactions {
		lnQ, lacking := m.LnQuotient(rx, n.StandardPressure())
		if len(lacking) > 0 || !rx.Resolved {
			out.Absent = append(out.Absent, AbsentReaction{Reaction: rx, Lacking: lacking})
			continue
		}
		out.Reactions = append(out.Reactions, approachOne(n, rx, out.T, lnQ))
	}
	return out
}

func approachOne(n *network.Network, rx *network.Reaction, T, lnQ float64) ReactionApproach {
	k := n.ReactionK(rx)
	row := k.Row(T)
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
	r.EquilibriumT = equilibriumTemperature(k, T, lnQ)
	return r
}

// equilibriumTemperature finds where ln K(T) = ln Q, that is where
// ΔrG°(T) + RT ln Q = 0, by a bracketing root search over the data's span;
// of several roots it takes the one nearest T. It is NaN when K never
// reaches Q there.
func equilibriumTemperature(k *network.ReactionK, T, lnQ float64) float64 {
	lo, hi := k.Span()
	if !(lo < hi) || math.IsInf(hi, 0) || math.IsInf(lo, 0) {
		return math.NaN()
	}
	dg := k.DeltaG
	if r, ok := k.Species(); ok {
		dg = r.DeltaG
	}
	roots := thermo.Crossovers(func(t float64) float64 {
		return dg(t) + thermo.R*t*lnQ
	}, lo, hi)
	best := math.NaN()
	for _, r := range roots {
		if math.IsNaN(best) || math.Abs(r.T-T) < math.Abs(best-T) {
			best = r.T
		}
	}
	return best
}
