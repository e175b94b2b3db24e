package network

import (
	"math"

	"hess/lang"
	"hess/thermo"
)

// DataPressure is the standard pressure a file states for its own data.
type DataPressure struct {
	P    float64 // Pa
	Span lang.Span
}

// DataPressure is the standard pressure that the data of the given file
// refer to: the one it states (standard-pressure), else the network's p°
// (settings pressure). stated reports that the file states one.
func (n *Network) DataPressure(file string) (p float64, stated bool) {
	if dp, ok := n.Settings.DataPressures[file]; ok {
		return dp.P, true
	}
	return n.StandardPressure(), false
}

// pressureLogRatio is ln(p°/p_data) for the data of a file: how far the
// network's standard pressure lies from the one the file's data refer to
// (0 where they are the same).
func (n *Network) pressureLogRatio(file string) float64 {
	p, _ := n.DataPressure(file)
	return math.Log(n.StandardPressure() / p)
}

// ownDataShift converts a reaction's own data (dg, ds, logk) from its
// file's standard pressure to the network's: ΔrG° moves by Δn·R·T·ln r and
// ΔrS° by −Δn·R·ln r, with r = p°/p_data and Δn the moles of gas the
// reaction makes; ΔrH° does not move. It returns Δn·ln r, 0 where nothing
// moves.
func (n *Network) ownDataShift(rx *Reaction) float64 {
	lr := n.pressureLogRatio(rx.file())
	if lr == 0 {
		return 0
	}
	return deltaGasMoles(rx.NetTerms()) * lr
}

// shiftPoint applies ownDataShift's Δn·ln r to a point at T.
func shiftPoint(p point, T, dnLogRatio float64) point {
	if dnLogRatio == 0 || !p.ok() {
		return p
	}
	p.dg += thermo.R * T * dnLogRatio
	p.ds -= thermo.R * dnLogRatio
	return p
}

// pressureShiftedModel moves a gas species' model from its file's standard
// pressure to the network's: S° rises by R·ln(p_data/p°).
func (n *Network) pressureShiftedModel(sp *Species, m thermo.Model) thermo.Model {
	if m == nil || sp.Activity() != thermo.ActivityGas {
		return m
	}
	p, _ := n.DataPressure(sp.Span.File)
	if p == n.StandardPressure() {
		return m
	}
	if isGibbsOnly(m) {
		g, ok := m.(thermo.GibbsOnly)
		if !ok {
			return m
		}
		// G° at 298.15 K moves by R·T·ln(p°/p_data).
		g.Gf += thermo.R * thermo.T298 * math.Log(n.StandardPressure()/p)
		return g
	}
	shifted, err := thermo.ShiftStandardPressure(m, p, n.StandardPressure())
	if err != nil {
		return m
	}
	return shifted
}
