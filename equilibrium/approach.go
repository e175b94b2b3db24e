package equilibrium

import (
	"math"
	"sort"
	"strconv"
	"strings"

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
	// Solution is the mixture's aqueous part under the network's activity
	// model (nil when it lists no solute).
	Solution *SolutionActivities
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
	// EquilibriumTs are all the temperatures inside the data's range at
	// which K(T) = Q, in increasing order.
	EquilibriumTs []float64
	// Tmin and Tmax bound the data's range, where EquilibriumTs are sought.
	Tmin, Tmax float64
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

// Reason says why the reaction has no quotient in the mixture.
func (a AbsentReaction) Reason() string {
	if !a.Reaction.Resolved {
		return "some species of the reaction are undeclared"
	}
	return "the mixture lacks " + SpeciesList(a.Lacking)
}

// Reason says why a reaction has no direction in the mixture ("" where it
// has one): its K cannot be computed at the mixture's temperature.
func (r ReactionApproach) Reason(T float64) string {
	if r.Direction != DirectionUnknown {
		return ""
	}
	return "K cannot be computed at " + strconv.FormatFloat(math.Round(T*100)/100, 'f', -1, 64) + " K (no data for " + SpeciesList(r.Missing) + ")"
}

// SpeciesList names species by key, separated by commas ("some species"
// for none), as messages and reports write them.
func SpeciesList(sps []*network.Species) string {
	if len(sps) == 0 {
		return "some species"
	}
	names := make([]string, len(sps))
	for i, sp := range sps {
		names[i] = sp.Key
	}
	return strings.Join(names, ", ")
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
	out := &MixtureApproach{Mixture: m, T: m.Temperature.V, P: m.TotalPressure(), Solution: solutionActivities(n, m)}
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
	r.Tmin, r.Tmax = k.Span()
	r.EquilibriumTs = equilibriumTemperatures(k, lnQ)
	r.EquilibriumT = math.NaN()
	for _, t := range r.EquilibriumTs {
		if math.IsNaN(r.EquilibriumT) || math.Abs(t-T) < math.Abs(r.EquilibriumT-T) {
			r.EquilibriumT = t
		}
	}
	return r
}

// equilibriumTemperatures finds every temperature where ln K(T) = ln Q,
// that is where ΔrG°(T) + RT ln Q = 0, by a bracketing root search over the
// span of the data of the reaction's first source (its own data, its
// parts, or its species: ReactionK.Span), in increasing order. None lies
// outside that span, where the data would be extrapolated.
func equilibriumTemperatures(k *network.ReactionK, lnQ float64) []float64 {
	lo, hi := k.Span()
	if !(lo < hi) || math.IsInf(hi, 0) || math.IsInf(lo, 0) {
		return nil
	}
	dg := k.DeltaG
	if r, ok := k.Species(); ok && k.SpanSource() == network.BasisSpecies {
		dg = r.DeltaG
	}
	roots := thermo.Crossovers(func(t float64) float64 {
		return dg(t) + thermo.R*t*lnQ
	}, lo, hi)
	out := make([]float64, 0, len(roots))
	for _, r := range roots {
		out = append(out, r.T)
	}
	sort.Float64s(out)
	return out
}
