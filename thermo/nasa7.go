package thermo

import (
	"errors"
	"fmt"
	"math"
)

// NASA7Range is one temperature range of a NASA 7-term polynomial:
//
//	Cp/R  = a1 + a2·T + a3·T² + a4·T³ + a5·T⁴
//	H/RT  = a1 + a2·T/2 + a3·T²/3 + a4·T³/4 + a5·T⁴/5 + a6/T
//	S/R   = a1·ln T + a2·T + a3·T²/2 + a4·T³/3 + a5·T⁴/4 + a7
//
// with T in K. H includes ΔfH°298 (it is referenced to the elements at 298.15 K).
type NASA7Range struct {
	Tmin, Tmax float64 // K
	A          [7]float64
}

// NewNASA7 builds a multi-range NASA 7-term model, checking each range's bounds and
// coefficients.
func NewNASA7(ranges ...NASA7Range) (*Piecewise, error) {
	if len(ranges) == 0 {
		return nil, errors.New("nasa7: no ranges")
	}
	pieces := make([]Model, len(ranges))
	for i, r := range ranges {
		if err := checkRange(r.Tmin, r.Tmax); err != nil {
			return nil, fmt.Errorf("nasa7 range %d: %w", i+1, err)
		}
		for j, a := range r.A {
			if !finite(a) {
				return nil, fmt.Errorf("nasa7 range %d: a%d is %v", i+1, j+1, a)
			}
		}
		pieces[i] = r
	}
	return NewPiecewise(pieces...)
}

// Cp returns the heat capacity in J/(mol·K).
func (r NASA7Range) Cp(T float64) float64 {
	if !(T > 0) {
		return math.NaN()
	}
	a := &r.A
	return R * (a[0] + T*(a[1]+T*(a[2]+T*(a[3]+T*a[4]))))
}

// H returns the formation-referenced enthalpy in J/mol.
func (r NASA7Range) H(T float64) float64 {
	if !(T > 0) {
		return math.NaN()
	}
	a := &r.A
	return R * (T*(a[0]+T*(a[1]/2+T*(a[2]/3+T*(a[3]/4+T*a[4]/5)))) + a[5])
}

// S returns the absolute entropy in J/(mol·K).
func (r NASA7Range) S(T float64) float64 {
	if !(T > 0) {
		return math.NaN()
	}
	a := &r.A
	return R * (a[0]*math.Log(T) + T*(a[1]+T*(a[2]/2+T*(a[3]/3+T*a[4]/4))) + a[6])
}

// G returns H − T·S in J/mol.
func (r NASA7Range) G(T float64) float64 { return r.H(T) - T*r.S(T) }

// Range returns the range's bounds in K.
func (r NASA7Range) Range() (Tmin, Tmax float64) { return r.Tmin, r.Tmax }
