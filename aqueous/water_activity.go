package aqueous

import "math"

// MolarMassWater is the molar mass of H2O in kg/mol (IUPAC conventional atomic
// weights: 18.015 g/mol).
const MolarMassWater = 0.018015

// WaterMethod says how a water activity was obtained.
type WaterMethod int

const (
	// WaterGibbsDuhem: from the model's own activity coefficients through the
	// Gibbs–Duhem equation (the model implements Osmotic).
	WaterGibbsDuhem WaterMethod = iota + 1
	// WaterApproximate: a_w = 1 − 0.017 Σm (common practice), for models
	// without an osmotic relation.
	WaterApproximate
)

func (w WaterMethod) String() string {
	switch w {
	case WaterGibbsDuhem:
		return "Gibbs–Duhem from the activity model"
	case WaterApproximate:
		return "1 − 0.017·Σm (common practice)"
	}
	return "unknown"
}

// Water is the activity of water in a solution.
type Water struct {
	Activity   float64     // a_w
	LnActivity float64     // ln a_w, exact where a_w rounds to 1 (−Inf when a_w is 0)
	Osmotic    float64     // osmotic coefficient φ (1 when there are no solutes; 0 for WaterApproximate)
	Method     WaterMethod // how Activity was obtained
}

// WaterActivity returns the activity of water in the solution of solutes under
// model m with parameters p; the ionic strength is computed from the solutes.
//
// For a model implementing Osmotic, the Gibbs–Duhem equation per kilogram of
// water, (1/M_w) d ln a_w + Σ m_i d ln(m_i γ_i) = 0, is integrated along the
// dilution path at fixed composition (every m_i ∝ I), where each log10 γ_i is
// a function of I alone:
//
//	ln a_w = −M_w (Σ m_i + ln 10 · Σ m_i K_i(I)),  φ = −ln a_w / (M_w Σ m_i)
//
// with K_i(I) = log10 γ_i(I) − (1/I) ∫₀^I log10 γ_i(x) dx (see Osmotic). For
// the ideal model this is ln a_w = −M_w Σm (φ = 1). Other models fall back to
// a_w = 1 − 0.017 Σm (common practice; never below 0).
//
// Beyond a model's range the result may be unphysical: the Debye–Hückel forms
// without a linear term drive φ negative at high I, so a_w exceeds 1 (and can
// overflow to +Inf while LnActivity stays finite). CheckIonicStrength reports
// that range.
func WaterActivity(m Model, solutes []Solute, p Params) Water {
	total := 0.0
	for _, s := range solutes {
		total += molality(s.Molality)
	}
	om, ok := m.(Osmotic)
	if !ok {
		aw := math.Max(0, 1-0.017*total)
		return Water{Activity: aw, LnActivity: math.Log(aw), Method: WaterApproximate}
	}
	if total == 0 {
		return Water{Activity: 1, LnActivity: 0, Osmotic: 1, Method: WaterGibbsDuhem}
	}
	I := IonicStrength(solutes)
	excess := 0.0
	for _, s := range solutes {
		mi := molality(s.Molality)
		if mi == 0 {
			continue
		}
		if s.Charge == 0 {
			excess += mi * om.NeutralOsmoticTerm(s.Setschenow, I)
		} else {
			excess += mi * om.OsmoticTerm(s.Charge, s.Size, I, p)
		}
	}
	sum := total + math.Ln10*excess
	ln := -MolarMassWater * sum
	return Water{Activity: math.Exp(ln), LnActivity: ln, Osmotic: sum / total, Method: WaterGibbsDuhem}
}
