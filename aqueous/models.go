package aqueous

import (
	"math"
	"slices"
)

// Model is an activity-coefficient model for solutes in water. Its methods
// are pure functions of their arguments; p comes from ParamsAt, computed once
// per temperature, so a solver evaluating many species pays for the water
// correlations once.
type Model interface {
	// Name is the model's name as a network selects it ("davies").
	Name() string
	// LogGamma returns log10 γ of an ion of charge z with ion-size parameter
	// size (å, in Å; 0 if none) at ionic strength I (mol/kg). It is 0 for
	// z = 0: neutral solutes go through LogGammaNeutral. A size that is not a
	// finite positive number counts as 0, which for the models that read å
	// leaves the Debye–Hückel limiting law. I ≤ 0 (or NaN) gives 0.
	LogGamma(z int, size, I float64, p Params) float64
	// LogGammaNeutral returns log10 γ of a neutral solute with Setschenow
	// coefficient ks (kg/mol, log10 form) at ionic strength I.
	LogGammaNeutral(ks, I float64) float64
	// ValidUpTo is the ionic strength (mol/kg) up to which the model is
	// published as reliable.
	ValidUpTo() float64
}

// Osmotic is implemented by models whose water activity follows from their
// own activity coefficients by the Gibbs–Duhem equation (see WaterActivity).
// Each method returns, for one solute, the term
//
//	K(I) = log10 γ(I) − (1/I) ∫₀^I log10 γ(x) dx
//
// that the solute contributes, times its molality, to the osmotic sum; K is 0
// at I = 0.
type Osmotic interface {
	OsmoticTerm(z int, size, I float64, p Params) float64
	NeutralOsmoticTerm(ks, I float64) float64
}

// Model names.
const (
	NameIdeal       = "ideal"
	NameDavies      = "davies"
	NameDebyeHuckel = "debye-huckel"
	NameBDot        = "b-dot"
)

// Ranges of validity in ionic strength, mol/kg.
const (
	// IdealValidUpTo is our choice: below 1e-3 mol/kg the limiting law keeps a
	// monovalent ion's γ above 0.96, so taking γ = 1 errs by at most ~4 %.
	IdealValidUpTo = 1e-3
	// DaviesValidUpTo: Davies' equation is commonly taken as usable to about
	// 0.5 mol/kg (Davies 1962; Stumm & Morgan, Aquatic Chemistry; common practice).
	DaviesValidUpTo = 0.5
	// DebyeHuckelValidUpTo: the extended Debye–Hückel equation to about
	// 0.1 mol/kg (common practice).
	DebyeHuckelValidUpTo = 0.1
	// BDotValidUpTo: Helgeson (1969) fitted Ḃ to NaCl solutions; for
	// NaCl-dominated solutions the B-dot form is commonly used to about
	// 1 mol/kg (common practice).
	BDotValidUpTo = 1.0
)

// DefaultSetschenowCO2 is the Setschenow coefficient commonly used for
// dissolved CO2 and other neutral species, log10 form, kg/mol (common
// practice; CO2 in NaCl solutions is about 0.1).
const DefaultSetschenowCO2 = 0.1

// Ideal takes every activity coefficient as 1: activity equals molality.
type Ideal struct{}

// Davies is Davies' equation (C. W. Davies, Ion Association, Butterworths,
// London 1962):
//
//	log10 γ = −A z² (√I/(1 + √I) − 0.3 I).
//
// It reads no ion size.
type Davies struct{}

// DebyeHuckel is the extended Debye–Hückel equation (Debye & Hückel 1923)
// with an ion-size parameter å per species:
//
//	log10 γ = −A z² √I / (1 + B å √I).
type DebyeHuckel struct{}

// BDot is Helgeson's B-dot equation (H. C. Helgeson, Am. J. Sci. 267 (1969)
// 729):
//
//	log10 γ = −A z² √I / (1 + B å √I) + Ḃ I
//
// with Ḃ(T) from BDotAt. The Ḃ term applies to ions only.
type BDot struct{}

// Models returns one value of each model, in the order of Names.
func Models() []Model { return []Model{Ideal{}, Davies{}, DebyeHuckel{}, BDot{}} }

// Names lists the model names a network may select.
func Names() []string {
	return []string{NameIdeal, NameDavies, NameDebyeHuckel, NameBDot}
}

// ByName returns the model called name, or false.
func ByName(name string) (Model, bool) {
	i := slices.Index(Names(), name)
	if i < 0 {
		return nil, false
	}
	return Models()[i], true
}

func (Ideal) Name() string                                      { return NameIdeal }
func (Ideal) LogGamma(z int, size, I float64, p Params) float64 { return 0 }
func (Ideal) LogGammaNeutral(ks, I float64) float64             { return 0 }
func (Ideal) ValidUpTo() float64                                { return IdealValidUpTo }
func (Ideal) OsmoticTerm(z int, size, I float64, p Params) float64 {
	return 0
}
func (Ideal) NeutralOsmoticTerm(ks, I float64) float64 { return 0 }

func (Davies) Name() string       { return NameDavies }
func (Davies) ValidUpTo() float64 { return DaviesValidUpTo }
func (Davies) LogGamma(z int, size, I float64, p Params) float64 {
	if z == 0 || !(I > 0) {
		return 0
	}
	s := math.Sqrt(I)
	return -p.A * z2(z) * (s/(1+s) - 0.3*I)
}
func (Davies) OsmoticTerm(z int, size, I float64, p Params) float64 {
	if z == 0 || !(I > 0) {
		return 0
	}
	s := math.Sqrt(I)
	// mean of √x/(1+√x) over [0, I] is 2√I·g(√I); mean of 0.3x is 0.15 I.
	return -p.A * z2(z) * (s/(1+s) - 2*s*meanKernel(s) - 0.15*I)
}
func (Davies) LogGammaNeutral(ks, I float64) float64    { return setschenow(ks, I) }
func (Davies) NeutralOsmoticTerm(ks, I float64) float64 { return setschenow(ks, I) / 2 }

func (DebyeHuckel) Name() string       { return NameDebyeHuckel }
func (DebyeHuckel) ValidUpTo() float64 { return DebyeHuckelValidUpTo }
func (DebyeHuckel) LogGamma(z int, size, I float64, p Params) float64 {
	return extendedDH(z, size, I, p)
}
func (DebyeHuckel) OsmoticTerm(z int, size, I float64, p Params) float64 {
	return extendedDHOsmotic(z, size, I, p)
}
func (DebyeHuckel) LogGammaNeutral(ks, I float64) float64    { return setschenow(ks, I) }
func (DebyeHuckel) NeutralOsmoticTerm(ks, I float64) float64 { return setschenow(ks, I) / 2 }

func (BDot) Name() string       { return NameBDot }
func (BDot) ValidUpTo() float64 { return BDotValidUpTo }
func (BDot) LogGamma(z int, size, I float64, p Params) float64 {
	if z == 0 || !(I > 0) {
		return 0
	}
	return extendedDH(z, size, I, p) + p.BDot*I
}
func (BDot) OsmoticTerm(z int, size, I float64, p Params) float64 {
	if z == 0 || !(I > 0) {
		return 0
	}
	return extendedDHOsmotic(z, size, I, p) + p.BDot*I/2
}
func (BDot) LogGammaNeutral(ks, I float64) float64    { return setschenow(ks, I) }
func (BDot) NeutralOsmoticTerm(ks, I float64) float64 { return setschenow(ks, I) / 2 }

func z2(z int) float64 { f := float64(z); return f * f }

// setschenow is the Setschenow (salting-out) term ks·I; 0 for I ≤ 0 or NaN.
func setschenow(ks, I float64) float64 {
	if !(I > 0) || math.IsNaN(ks) {
		return 0
	}
	return ks * I
}

// ionSize returns size if it is a finite positive number, else 0.
func ionSize(size float64) float64 {
	if size > 0 && !math.IsInf(size, 1) {
		return size
	}
	return 0
}

func extendedDH(z int, size, I float64, p Params) float64 {
	if z == 0 || !(I > 0) {
		return 0
	}
	s := math.Sqrt(I)
	return -p.A * z2(z) * s / (1 + p.B*ionSize(size)*s)
}

func extendedDHOsmotic(z int, size, I float64, p Params) float64 {
	if z == 0 || !(I > 0) {
		return 0
	}
	s := math.Sqrt(I)
	u := p.B * ionSize(size) * s
	// h(x) = √x/(1 + b√x); its mean over [0, I] is 2√I·g(b√I).
	return -p.A * z2(z) * (s/(1+u) - 2*s*meanKernel(u))
}

// meanKernel returns g(u) = (u²/2 − u + ln(1+u))/u³ = ∫₀¹ t²/(1+u t) dt for
// u ≥ 0, so that the mean of √x/(1 + b√x) over [0, I] is 2√I·g(b√I). It is
// 1/3 at u = 0 and falls like 1/(2u).
func meanKernel(u float64) float64 {
	switch {
	case !(u > 0):
		return 1.0 / 3
	case u < 0.05:
		// Σ (−u)^k/(k+3); 14 terms reach 0.05^14 ≈ 6e−19.
		sum, term := 0.0, 1.0
		for k := 0; k < 14; k++ {
			sum += term / float64(k+3)
			term *= -u
		}
		return sum
	case math.IsInf(u, 1):
		return 0
	case u > 1e8:
		// the closed form divided through by u³, which would overflow
		return (0.5 - 1/u + math.Log1p(u)/u/u) / u
	}
	return (u*u/2 - u + math.Log1p(u)) / (u * u * u)
}

// UsesIonSize reports whether model m reads the ion-size parameter å, so a
// caller can diagnose ions that lack one (they fall back to the limiting law).
func UsesIonSize(m Model) bool {
	s, ok := m.(interface{ usesIonSize() bool })
	return ok && s.usesIonSize()
}

func (DebyeHuckel) usesIonSize() bool { return true }
func (BDot) usesIonSize() bool        { return true }
