package thermo

import (
	"fmt"
	"math"
)

// Arrhenius is a modified Arrhenius rate constant k = A·T^n·exp(−Ea/(R·T)) in SI:
// A in (m³/mol)^(order−1)/s per K^n, Ea in J/mol, T in K.
type Arrhenius struct {
	A, N, Ea float64
}

// NewArrhenius checks that A is positive and the three parameters finite.
func NewArrhenius(a, n, ea float64) (Arrhenius, error) {
	switch {
	case !finite(a) || !finite(n) || !finite(ea):
		return Arrhenius{}, fmt.Errorf("arrhenius A=%v n=%v Ea=%v: parameters must be finite", a, n, ea)
	case !(a > 0):
		return Arrhenius{}, fmt.Errorf("arrhenius prefactor A=%v is not positive", a)
	}
	return Arrhenius{A: a, N: n, Ea: ea}, nil
}

// Rate returns k(T); NaN for T ≤ 0.
func (a Arrhenius) Rate(T float64) float64 {
	if !(T > 0) {
		return math.NaN()
	}
	return math.Exp(a.LnRate(T))
}

// LnRate returns ln k(T) = ln A + n·ln T − Ea/(R·T); NaN for T ≤ 0.
func (a Arrhenius) LnRate(T float64) float64 {
	if !(T > 0) {
		return math.NaN()
	}
	return math.Log(a.A) + a.N*math.Log(T) - a.Ea/(R*T)
}

// DetailedBalanceRatio returns kf/(kr·Kc): 1 when forward and reverse rate
// constants (SI) agree with the SI concentration-basis equilibrium constant
// Reaction.KcSI at the same temperature.
func DetailedBalanceRatio(kf, kr, kcSI float64) float64 { return kf / (kr * kcSI) }
