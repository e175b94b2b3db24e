package thermo

import (
	"fmt"
	"math"
)

// Term is one species in a reaction: its signed stoichiometric coefficient ν
// (negative for reactants), its model, whether it is a gas (it counts in Δn), its
// activity convention and the standard uncertainties of its data.
type Term struct {
	Nu       float64
	Model    Model
	IsGas    bool
	Activity Activity
	Sigma    SpeciesSigma
}

func (t Term) activity() Activity {
	if t.Activity != ActivityUnstated {
		return t.Activity
	}
	if t.IsGas {
		return ActivityGas
	}
	return ActivityPureLiquid
}

func (t Term) gas() bool { return t.IsGas || t.Activity == ActivityGas }

// Reaction is a weighted sum of species: Σ ν·X = 0.
type Reaction struct {
	Terms []Term
}

// sum returns Σ ν·f(model) at T.
func (r Reaction) sum(f func(Model) float64) float64 {
	s := 0.0
	for _, t := range r.Terms {
		if t.Nu == 0 {
			continue
		}
		if t.Model == nil {
			return math.NaN()
		}
		s += t.Nu * f(t.Model)
	}
	return s
}

// DeltaCp returns ΔrCp°(T) in J/(mol·K).
func (r Reaction) DeltaCp(T float64) float64 {
	return r.sum(func(m Model) float64 { return m.Cp(T) })
}

// DeltaH returns ΔrH°(T) in J/mol.
func (r Reaction) DeltaH(T float64) float64 {
	return r.sum(func(m Model) float64 { return m.H(T) })
}

// DeltaS returns ΔrS°(T) in J/(mol·K).
func (r Reaction) DeltaS(T float64) float64 {
	return r.sum(func(m Model) float64 { return m.S(T) })
}

// DeltaG returns ΔrG°(T) = Σ ν·G°(T) in J/mol. It is defined for a reaction with
// gf-only species at 298.15 K even though ΔrH° and ΔrS° are not.
func (r Reaction) DeltaG(T float64) float64 {
	return r.sum(func(m Model) float64 { return m.G(T) })
}

// LnK returns ln K(T) = −ΔrG°/(R·T).
func (r Reaction) LnK(T float64) float64 { return -r.DeltaG(T) / (R * T) }

// K returns the dimensionless thermodynamic equilibrium constant exp(−ΔrG°/(R·T)),
// relative to the standard states the species data refer to.
func (r Reaction) K(T float64) float64 { return math.Exp(r.LnK(T)) }

// Log10K returns log10 K(T).
func (r Reaction) Log10K(T float64) float64 { return r.LnK(T) / math.Ln10 }

// DeltaNGas returns Δn, the change in moles of gas Σ ν over the gas terms.
func (r Reaction) DeltaNGas() float64 {
	n := 0.0
	for _, t := range r.Terms {
		if t.gas() {
			n += t.Nu
		}
	}
	return n
}

// Kc returns the concentration-basis constant in (mol/L)^Δn,
// K·(p°/(R·T·c°))^Δn with c° = 1 mol/L. p0 is the standard-state pressure in Pa
// the gas data refer to; 0 means 1 bar.
func (r Reaction) Kc(T, p0 float64) float64 {
	if p0 == 0 {
		p0 = Bar
	}
	dn := r.DeltaNGas()
	if dn == 0 {
		return r.K(T)
	}
	return math.Exp(r.LnK(T) + dn*math.Log(p0/(R*T*CStd)))
}

// KcSI returns the concentration-basis constant in SI, (mol/m³)^Δn,
// K·(p°/(R·T))^Δn, the unit in which SI forward and reverse rate constants of an
// elementary gas step are related (kf/kr = KcSI). p0 is in Pa; 0 means 1 bar.
func (r Reaction) KcSI(T, p0 float64) float64 {
	if p0 == 0 {
		p0 = Bar
	}
	return math.Exp(r.LnK(T) + r.DeltaNGas()*math.Log(p0/(R*T)))
}

// Range returns the temperatures where every species' data are valid, the
// intersection of their ranges. Tmin > Tmax means the ranges do not overlap.
func (r Reaction) Range() (Tmin, Tmax float64) {
	Tmin, Tmax = 0, math.Inf(1)
	for _, t := range r.Terms {
		if t.Nu == 0 || t.Model == nil {
			continue
		}
		lo, hi := t.Model.Range()
		Tmin, Tmax = math.Max(Tmin, lo), math.Min(Tmax, hi)
	}
	return Tmin, Tmax
}

// Validate reports a term with no model or a coefficient that is not finite.
func (r Reaction) Validate() error {
	for i, t := range r.Terms {
		if !finite(t.Nu) {
			return fmt.Errorf("term %d: coefficient %v is not finite", i+1, t.Nu)
		}
		if t.Model == nil && t.Nu != 0 {
			return fmt.Errorf("term %d: no thermodynamic model", i+1)
		}
	}
	return nil
}
