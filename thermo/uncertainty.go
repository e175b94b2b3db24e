package thermo

import "math"

// SpeciesSigma holds the standard uncertainties of one species' 298.15 K data;
// zero means none was given.
type SpeciesSigma struct {
	H float64 // σ(ΔfH°) in J/mol
	S float64 // σ(S°) in J/(mol·K)
	G float64 // σ(ΔfG°) in J/mol, used only for a gf-only species
}

// VarianceG returns the variance of the species' G°(T) in (J/mol)², treating its
// inputs as independent: σH² + T²·σS², or σG² when the species is gf-only.
func (s SpeciesSigma) VarianceG(T float64, gibbsOnly bool) float64 {
	if gibbsOnly {
		return s.G * s.G
	}
	return s.H*s.H + T*T*s.S*s.S
}

// Weighted is one input of a linear combination: a weight times a value with a
// standard uncertainty.
type Weighted struct {
	Weight, Value, Sigma float64
}

// LinearSum returns Σ wᵢ·xᵢ and its first-order standard uncertainty
// sqrt(Σ wᵢ²·σᵢ²) for independent inputs, as for the residual of a cycle of
// reactions.
func LinearSum(terms []Weighted) (sum, sigma float64) {
	v := 0.0
	for _, t := range terms {
		sum += t.Weight * t.Value
		v += t.Weight * t.Weight * t.Sigma * t.Sigma
	}
	return sum, math.Sqrt(v)
}

// SigmaDeltaG returns the first-order standard uncertainty of ΔrG°(T) in J/mol
// from the terms' species uncertainties, sqrt(Σ ν²·(σH² + T²·σS²)) with σG in
// place of the bracket for gf-only species.
func (r Reaction) SigmaDeltaG(T float64) float64 {
	v := 0.0
	for _, t := range r.Terms {
		if t.Nu == 0 {
			continue
		}
		g := t.Model != nil && isGibbsOnly(t.Model)
		v += t.Nu * t.Nu * t.Sigma.VarianceG(T, g)
	}
	return math.Sqrt(v)
}

// SigmaDeltaH returns the standard uncertainty of ΔrH° in J/mol, sqrt(Σ ν²·σH²).
func (r Reaction) SigmaDeltaH() float64 {
	v := 0.0
	for _, t := range r.Terms {
		v += t.Nu * t.Nu * t.Sigma.H * t.Sigma.H
	}
	return math.Sqrt(v)
}

// SigmaDeltaS returns the standard uncertainty of ΔrS° in J/(mol·K),
// sqrt(Σ ν²·σS²).
func (r Reaction) SigmaDeltaS() float64 {
	v := 0.0
	for _, t := range r.Terms {
		v += t.Nu * t.Nu * t.Sigma.S * t.Sigma.S
	}
	return math.Sqrt(v)
}

// SigmaLog10K converts σ(ΔrG°) in J/mol at T into σ(log10 K) = σ(ΔrG°)/(R·T·ln 10).
func SigmaLog10K(T, sigmaG float64) float64 { return sigmaG / (R * T * math.Ln10) }

// SigmaLog10K returns the first-order standard uncertainty of log10 K(T).
func (r Reaction) SigmaLog10K(T float64) float64 { return SigmaLog10K(T, r.SigmaDeltaG(T)) }
