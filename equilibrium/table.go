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
	return tableFor(n.ReactionK(rx), rx, temps)
}

// A Tabulator computes the tables of many reactions of one network at the
// same temperatures, sharing the parts of coupled reactions between them
// (network.KSet): a chain of coupled reactions costs in proportion to its
// length. Not safe for concurrent use; each goroutine takes its own.
type Tabulator struct {
	ks    *network.KSet
	temps []float64
}

// NewTabulator returns a Tabulator for n's reactions at temps (K).
func NewTabulator(n *network.Network, temps []float64) *Tabulator {
	return &Tabulator{ks: n.NewKSet(temps), temps: temps}
}

// Table is rx's table, as ReactionTable gives it at the Tabulator's
// temperatures.
func (tb *Tabulator) Table(rx *network.Reaction) *Table {
	if rx == nil {
		return nil
	}
	return tableFor(tb.ks.K(rx), rx, tb.temps)
}

// Rows are rx's rows at the Tabulator's temperatures, as its Table has
// them, without the search for crossovers.
func (tb *Tabulator) Rows(rx *network.Reaction) []network.TableRow {
	if rx == nil {
		return nil
	}
	return rowsOf(tb.ks.K(rx), tb.temps)
}

// rowsOf evaluates k at temps.
func rowsOf(k *network.ReactionK, temps []float64) []network.TableRow {
	rows := make([]network.TableRow, 0, len(temps))
	for _, T := range temps {
		rows = append(rows, k.Row(T))
	}
	return rows
}

// tableFor is the table of rx, whose calculation is k.
func tableFor(k *network.ReactionK, rx *network.Reaction, temps []float64) *Table {
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
	t.Rows = rowsOf(k, temps)
	return t
}

// crossovers finds every sign change of ΔrG° inside the data's span.
func crossovers(k *network.ReactionK) []thermo.Crossover {
	lo, hi := k.Span()
	if !(lo < hi) || math.IsInf(hi, 0) {
		return nil
	}
	if r, ok := k.Species(); ok && k.SumsSpecies() {
		// The species' sum, also for a coupled reaction whose parts add up
		// to it: evaluating the parts one by one at every step would grow
		// with the square of a chain's length.
		return thermo.ScanCrossovers(r.SummedDeltaG(), r.DeltaG, lo, hi)
	}
	return thermo.Crossovers(k.DeltaG, lo, hi)
}
