package aqueous

import (
	"fmt"
	"math"
)

// Solute is one dissolved species as the models see it.
type Solute struct {
	Charge     int     // charge number z
	Size       float64 // ion-size parameter å in Å; 0 if none
	Setschenow float64 // Setschenow coefficient ks (log10, kg/mol) of a neutral solute
	Molality   float64 // mol/kg of water
}

// IonicStrength returns I = ½ Σ m_i z_i² in mol/kg. Molalities that are not
// positive finite numbers count as 0.
func IonicStrength(solutes []Solute) float64 {
	sum := 0.0
	for _, s := range solutes {
		if m := molality(s.Molality); m > 0 && s.Charge != 0 {
			sum += m * z2(s.Charge)
		}
	}
	return sum / 2
}

// LogGamma returns log10 γ of solute s under model m at ionic strength I: the
// model's ion term for a charged solute, its neutral (Setschenow) term for a
// neutral one.
func LogGamma(m Model, s Solute, I float64, p Params) float64 {
	if s.Charge == 0 {
		return m.LogGammaNeutral(s.Setschenow, I)
	}
	return m.LogGamma(s.Charge, s.Size, I, p)
}

// LogGammaAt is LogGamma at temperature T (K); it fails with a *RangeError
// where ParamsAt does. Solvers should call ParamsAt once and LogGamma per
// species instead.
func LogGammaAt(m Model, s Solute, I, T float64) (float64, error) {
	p, err := ParamsAt(T)
	if err != nil {
		return 0, err
	}
	return LogGamma(m, s, I, p), nil
}

// MeanLogGamma returns the mean ionic log10 γ± of the salt made of cation and
// anion (charges of opposite sign; molalities ignored) at ionic strength I:
//
//	log10 γ± = (ν₊ log10 γ₊ + ν₋ log10 γ₋) / (ν₊ + ν₋)
//
// with ν₊ = |z₋|/g, ν₋ = |z₊|/g, g their greatest common divisor. It fails
// unless one charge is positive and the other negative.
func MeanLogGamma(m Model, cation, anion Solute, I float64, p Params) (float64, error) {
	zp, zn := cation.Charge, anion.Charge
	if zp <= 0 || zn >= 0 {
		return 0, fmt.Errorf("mean activity coefficient needs a cation and an anion, got charges %d and %d", zp, zn)
	}
	g := gcd(zp, -zn)
	nup, nun := float64(-zn/g), float64(zp/g)
	lp := m.LogGamma(zp, cation.Size, I, p)
	ln := m.LogGamma(zn, anion.Size, I, p)
	return (nup*lp + nun*ln) / (nup + nun), nil
}

func gcd(a, b int) int {
	for b != 0 {
		a, b = b, a%b
	}
	return a
}

func molality(m float64) float64 {
	if m > 0 && !math.IsInf(m, 1) {
		return m
	}
	return 0
}

// Exceeds reports whether ionic strength I (mol/kg) is beyond model m's
// range of validity.
func Exceeds(m Model, I float64) bool { return I > m.ValidUpTo() }

// CheckIonicStrength returns nil when I is within model m's range of
// validity, else a *RangeError naming I and the model, for the caller to turn
// into a warning, e.g. "ionic strength 0.62 mol/kg is beyond the range of the
// davies activity model (up to 0.5 mol/kg)".
func CheckIonicStrength(m Model, I float64) error {
	if !Exceeds(m, I) {
		return nil
	}
	return &RangeError{Quantity: "ionic strength", Value: I, Max: m.ValidUpTo(),
		Unit: "mol/kg", Of: "the " + m.Name() + " activity model"}
}
