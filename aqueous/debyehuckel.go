package aqueous

import (
	"math"

	"hess/thermo"
)

// Epsilon0 is the vacuum electric permittivity in F/m (CODATA 2018; no longer
// exact since the 2019 SI redefinition).
const Epsilon0 = 8.8541878128e-12

// Params are the temperature-dependent parameters every activity model reads,
// computed once per temperature by ParamsAt.
type Params struct {
	T            float64 // K
	Permittivity float64 // relative permittivity of water (Permittivity)
	Density      float64 // density of water in kg/m³ (Density)
	A            float64 // Debye–Hückel A for log10 γ, (kg/mol)^½
	B            float64 // Debye–Hückel B, (kg/mol)^½ per Å
	BDot         float64 // Helgeson's Ḃ, kg/mol (BDotAt)
}

// ParamsTMin and ParamsTMax bound ParamsAt: the intersection of the ranges of
// Permittivity, Density and BDotAt (0–100 °C).
const (
	ParamsTMin = PermittivityTMin
	ParamsTMax = PermittivityTMax
)

// ParamsAt returns the model parameters at T (K). Outside 0–100 °C it returns
// the zero Params and a *RangeError naming the correlation out of range.
func ParamsAt(T float64) (Params, error) {
	eps, err := Permittivity(T)
	if err != nil {
		return Params{}, err
	}
	rho, err := Density(T)
	if err != nil {
		return Params{}, err
	}
	bdot, err := BDotAt(T)
	if err != nil {
		return Params{}, err
	}
	return Params{T: T, Permittivity: eps, Density: rho,
		A: debyeHuckelA(T, eps, rho), B: debyeHuckelB(T, eps, rho), BDot: bdot}, nil
}

// DebyeHuckelA returns the Debye–Hückel A for log10 γ on the molality scale,
// in (kg/mol)^½, at T (K) from water's permittivity and density:
//
//	A = e³ √(2 N_A ρ_w) / (8π ln 10 (ε0 ε_r k T)^{3/2})
//
// with the CODATA constants of thermo and Epsilon0; with ρ_w in g/cm³ this is
// the textbook A = 1.82483e6 √ρ_w / (ε_r T)^{3/2}.
func DebyeHuckelA(T float64) (float64, error) {
	p, err := ParamsAt(T)
	return p.A, err
}

// DebyeHuckelB returns the Debye–Hückel B on the molality scale, in
// (kg/mol)^½ per Å, at T (K):
//
//	B = √(2 N_A e² ρ_w / (ε0 ε_r k T)) · 1e−10 m/Å
//
// (textbook: B = 50.2916 √ρ_w / (ε_r T)^{1/2}, ρ_w in g/cm³).
func DebyeHuckelB(T float64) (float64, error) {
	p, err := ParamsAt(T)
	return p.B, err
}

func debyeHuckelA(T, eps, rho float64) float64 {
	e := thermo.ElementaryCharge
	return e * e * e * math.Sqrt(2*thermo.NA*rho) /
		(8 * math.Pi * math.Ln10 * math.Pow(Epsilon0*eps*thermo.KB*T, 1.5))
}

func debyeHuckelB(T, eps, rho float64) float64 {
	e := thermo.ElementaryCharge
	return math.Sqrt(2*thermo.NA*e*e*rho/(Epsilon0*eps*thermo.KB*T)) * 1e-10
}
