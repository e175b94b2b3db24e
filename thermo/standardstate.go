package thermo

import (
	"fmt"
	"math"
)

// StandardPressureEntropyShift returns how much an ideal gas's S° changes, in
// J/(mol·K), when its standard-state pressure changes from pFrom to pTo (Pa):
// R·ln(pFrom/pTo). From 1 atm to 1 bar it is +R·ln 1.01325.
func StandardPressureEntropyShift(pFrom, pTo float64) float64 {
	return R * math.Log(pFrom/pTo)
}

// ShiftStandardPressure returns an ideal gas's model with its data moved from the
// standard-state pressure pFrom to pTo (Pa): S° rises by
// StandardPressureEntropyShift and G° falls by T times it; Cp° and H° do not
// depend on pressure.
func ShiftStandardPressure(m Model, pFrom, pTo float64) (Model, error) {
	if m == nil {
		return nil, fmt.Errorf("shift standard pressure: no model")
	}
	if !(pFrom > 0) || !(pTo > 0) || !finite(pFrom) || !finite(pTo) {
		return nil, fmt.Errorf("shift standard pressure from %v Pa to %v Pa: pressures must be positive and finite", pFrom, pTo)
	}
	return pressureShifted{Model: m, dS: StandardPressureEntropyShift(pFrom, pTo)}, nil
}

type pressureShifted struct {
	Model
	dS float64
}

func (p pressureShifted) S(T float64) float64 { return p.Model.S(T) + p.dS }
func (p pressureShifted) G(T float64) float64 { return p.Model.G(T) - T*p.dS }
