package equilibrium

import (
	"math"

	"hess/network"
	"hess/thermo"
)

// A Table is one reaction's equilibrium constant over temperature: what
// `hess table` prints for it.
type Table struct {
	Reaction      *network.Reaction
	Kind          string // "Kp", "Kc", "Ksp" or "K" (CLI.md)
	Quotient      string // e.g. "p(CO2) p(H2) / (p(CO) p(H2O))"
	DeltaGasMoles float64
	// StandardPressure is p° in Pa, the pressure the gas data and K refer to.
	StandardPressure float64
	// Crossovers are the temperatures inside the data's range where ΔrG°
	// changes sign.
	Crossovers []thermo.Crossover
	// Tmin and Tmax bound the temperatures the data cover (Tmin > Tmax when
	// the data hold at no span of temperatures, such as gf alone).
	Tmin, Tmax float64
	// RangeSource is the source whose data make Tmin to Tmax (the first
	// source of the provenance rule that has a range).
	RangeSource network.Basis
	// Fit is the van 't Hoff fit of the reaction's logk values, nil unless
	// it has logk at two or more temperatures.
	Fit *network.LogKFit
	// Untagged are the reaction's species without a state tag: their
	// activity is taken as a mole fraction (the solution convention), which
	// a table names.
	Untagged []*network.Species
	Rows     []network.TableRow
}

// ReactionTable computes a reaction's K(T) table at the given temperatures
// (K): each row as network.ReactionK's Row gives it, the span of
// temperatures the data cover and the crossovers inside it. A nil reaction
// has a nil table.
func ReactionTable(n *network.Network, rx *network.Reaction, temps []float64) *Table {
	if rx == nil {
		return nil
	}
	k := n.ReactionK(rx)
	terms := k.Terms()
	t := &Table{
		Reaction:         rx,
		Kind:             kindOf(terms),
		Quotient:         quotientText(terms),
		DeltaGasMoles:    k.DeltaGasMoles(),
		StandardPressure: k.StandardPressure(),
	}
	t.Tmin, t.Tmax = k.Span()
	t.RangeSource = k.SpanSource()
	t.Fit = k.Fit()
	for _, nt := range terms {
		if nt.Species.Phase == nil {
			t.Untagged = append(t.Untagged, nt.Species)
		}
	}
	t.Crossovers = crossovers(k)
	t.Rows = make([]network.TableRow, 0, len(temps))
	for _, T := range temps {
		t.Rows = append(t.Rows, k.Row(T))
	}
	return t
}

// crossovers finds every sign change of ΔrG° inside the data's span.
func crossovers(k *network.ReactionK) []thermo.Crossover {
	lo, hi := k.Span()
	if !(lo < hi) || math.IsInf(hi, 0) {
		return nil
	}
	if r, ok := k.Species(); ok && k.SpanSource() == network.BasisSpecies {
		return thermo.ScanCrossovers(r.SummedDeltaG(), r.DeltaG, lo, hi)
	}
	return thermo.Crossovers(k.DeltaG, lo, hi)
}
