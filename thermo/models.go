package thermo

import (
	"fmt"
	"math"
)

// Model is the standard-state thermodynamics of one species as a function of
// temperature T in K. Enthalpy is referenced to the elements in their standard
// states at 298.15 K, so H(298.15) = ΔfH°; entropy is absolute. A value the model
// cannot give is NaN, and every method returns NaN for T ≤ 0.
type Model interface {
	Cp(T float64) float64 // J/(mol·K)
	H(T float64) float64  // J/mol
	S(T float64) float64  // J/(mol·K)
	G(T float64) float64  // J/mol, H − T·S
	Range() (Tmin, Tmax float64)
}

// DefaultSpan is how far from 298.15 K, in K, data that state no range of
// their own are taken to hold: a species' hf and s (with or without a
// constant cp) and a reaction's dh, ds, dg or single logk. Such data leave
// out how Cp° varies, and the neglected term in ΔrG°(T) is
// ΔrCp·[(T − T0) − T·ln(T/T0)] ≈ −ΔrCp·(T − T0)²/(2·T0). At 100 K from
// 298.15 K and |ΔrCp| = 35 J/(mol·K), a common size for a reaction that
// changes its moles of gas, that is 0.53 kJ/mol above and 0.67 kJ/mol below,
// about the default tolerance of 0.5 kJ/mol; beyond this span values are
// still computed but marked extrapolated.
const DefaultSpan = 100.0

// Temperature range of the range-less models (hf/s and hf/s/cp), in K:
// 298.15 K ± DefaultSpan.
const (
	ConstTmin = T298 - DefaultSpan
	ConstTmax = T298 + DefaultSpan
)

// T298Tolerance is how close, in K, a temperature must be to 298.15 K to count as
// the reference temperature.
const T298Tolerance = 1e-6

// AtT298 reports whether T is the reference temperature 298.15 K.
func AtT298(T float64) bool { return math.Abs(T-T298) <= T298Tolerance }

// GibbsOnly is a species known only by ΔfG° at 298.15 K. Its Range is the single
// point [298.15, 298.15]; G is ΔfG° there and NaN at any other temperature, and
// Cp, H and S are NaN everywhere.
type GibbsOnly struct {
	Gf float64 // J/mol
}

// NewGibbsOnly returns the model of a species with ΔfG° (J/mol) alone.
func NewGibbsOnly(gf float64) (GibbsOnly, error) {
	if !finite(gf) {
		return GibbsOnly{}, fmt.Errorf("gf %v J/mol is not a finite number", gf)
	}
	return GibbsOnly{Gf: gf}, nil
}

// Cp is unknown for a gf-only species: NaN.
func (GibbsOnly) Cp(float64) float64 { return math.NaN() }

// H is unknown for a gf-only species: NaN.
func (GibbsOnly) H(float64) float64 { return math.NaN() }

// S is unknown for a gf-only species: NaN.
func (GibbsOnly) S(float64) float64 { return math.NaN() }

// G is ΔfG° at 298.15 K and NaN at any other temperature.
func (m GibbsOnly) G(T float64) float64 {
	if !AtT298(T) {
		return math.NaN()
	}
	return m.Gf
}

// Range is the single point 298.15 K.
func (GibbsOnly) Range() (Tmin, Tmax float64) { return T298, T298 }

// isGibbsOnly reports whether a model carries only G at a single temperature,
// which is how a gf-only species shows through the Model interface.
func isGibbsOnly(m Model) bool {
	lo, hi := m.Range()
	return lo == hi
}

// Constant is a species with ΔfH° and S° at 298.15 K and a constant heat
// capacity (zero for the hf/s model): H = Hf + Cp·(T − 298.15),
// S = S298 + Cp·ln(T/298.15). It is valid from ConstTmin to ConstTmax.
type Constant struct {
	Hf    float64 // J/mol
	S298  float64 // J/(mol·K)
	Cp298 float64 // J/(mol·K)
}

// NewConstant returns the model with constant ΔH° and S° (ΔCp = 0) from ΔfH° in
// J/mol and S° in J/(mol·K).
func NewConstant(hf, s float64) (Constant, error) { return NewConstantCp(hf, s, 0) }

// NewConstantCp returns the constant-heat-capacity model from ΔfH° (J/mol), S° and
// Cp° (J/(mol·K)) at 298.15 K.
func NewConstantCp(hf, s, cp float64) (Constant, error) {
	for _, v := range []struct {
		name string
		v    float64
	}{{"hf", hf}, {"s", s}, {"cp", cp}} {
		if !finite(v.v) {
			return Constant{}, fmt.Errorf("%s %v is not a finite number", v.name, v.v)
		}
	}
	return Constant{Hf: hf, S298: s, Cp298: cp}, nil
}

// Cp returns the constant heat capacity.
func (m Constant) Cp(T float64) float64 {
	if !(T > 0) {
		return math.NaN()
	}
	return m.Cp298
}

// H returns Hf + Cp·(T − 298.15).
func (m Constant) H(T float64) float64 {
	if !(T > 0) {
		return math.NaN()
	}
	return m.Hf + m.Cp298*(T-T298)
}

// S returns S298 + Cp·ln(T/298.15).
func (m Constant) S(T float64) float64 {
	if !(T > 0) {
		return math.NaN()
	}
	return m.S298 + m.Cp298*math.Log(T/T298)
}

// G returns H − T·S.
func (m Constant) G(T float64) float64 { return m.H(T) - T*m.S(T) }

// Range is ConstTmin to ConstTmax.
func (Constant) Range() (Tmin, Tmax float64) { return ConstTmin, ConstTmax }

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
