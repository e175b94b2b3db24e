package thermo

import (
	"errors"
	"fmt"
	"math"
)

// ShomateRange is one temperature range of a Shomate fit in the NIST form, with
// t = T/1000:
//
//	Cp = A + B·t + C·t² + D·t³ + E/t²                         J/(mol·K)
//	H  = A·t + B·t²/2 + C·t³/3 + D·t⁴/4 − E/t + F              kJ/mol
//	S  = A·ln t + B·t + C·t²/2 + D·t³/3 − E/(2t²) + G          J/(mol·K)
//
// H is referenced to the elements at 298.15 K; the eighth parameter (NIST's H)
// is ΔfH°298 in kJ/mol, so H°(T) − H°298 is the formula above minus it.
type ShomateRange struct {
	Tmin, Tmax float64    // K
	Coef       [8]float64 // A, B, C, D, E, F, G, H in the NIST units
}

// NewShomate builds a multi-range Shomate model, checking each range's bounds and
// coefficients.
func NewShomate(ranges ...ShomateRange) (*Piecewise, error) {
	if len(ranges) == 0 {
		return nil, errors.New("shomate: no ranges")
	}
	pieces := make([]Model, len(ranges))
	for i, r := range ranges {
		if err := checkRange(r.Tmin, r.Tmax); err != nil {
			return nil, fmt.Errorf("shomate range %d: %w", i+1, err)
		}
		for j, c := range r.Coef {
			if !finite(c) {
				return nil, fmt.Errorf("shomate range %d: parameter %c is %v", i+1, 'A'+j, c)
			}
		}
		pieces[i] = r
	}
	return NewPiecewise(pieces...)
}

// Cp returns the heat capacity in J/(mol·K).
func (r ShomateRange) Cp(T float64) float64 {
	if !(T > 0) {
		return math.NaN()
	}
	c := &r.Coef
	t := T / 1000
	return c[0] + t*(c[1]+t*(c[2]+t*c[3])) + c[4]/(t*t)
}

// H returns the formation-referenced enthalpy in J/mol.
func (r ShomateRange) H(T float64) float64 {
	if !(T > 0) {
		return math.NaN()
	}
	c := &r.Coef
	t := T / 1000
	return 1000 * (t*(c[0]+t*(c[1]/2+t*(c[2]/3+t*c[3]/4))) - c[4]/t + c[5])
}

// S returns the absolute entropy in J/(mol·K).
func (r ShomateRange) S(T float64) float64 {
	if !(T > 0) {
		return math.NaN()
	}
	c := &r.Coef
	t := T / 1000
	return c[0]*math.Log(t) + t*(c[1]+t*(c[2]/2+t*c[3]/3)) - c[4]/(2*t*t) + c[6]
}

// G returns H − T·S in J/mol.
func (r ShomateRange) G(T float64) float64 { return r.H(T) - T*r.S(T) }

// Range returns the range's bounds in K.
func (r ShomateRange) Range() (Tmin, Tmax float64) { return r.Tmin, r.Tmax }

// HMinusH298 returns H°(T) − H°298 in J/mol as NIST tabulates it, using the
// range's own ΔfH°298 parameter.
func (r ShomateRange) HMinusH298(T float64) float64 { return r.H(T) - 1000*r.Coef[7] }
