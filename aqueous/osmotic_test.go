package aqueous

import (
	"math"
	"testing"

	"hess/thermo"
)

// brine is a mixed solution with ions of three charges and a neutral solute.
func brine(scale float64) []Solute {
	return []Solute{
		{Charge: 1, Size: 4, Molality: 0.30 * scale},                           // Na+
		{Charge: 2, Size: 6, Molality: 0.05 * scale},                           // Ca2+
		{Charge: -1, Size: 3, Molality: 0.36 * scale},                          // Cl−
		{Charge: -2, Size: 4, Molality: 0.02 * scale},                          // SO4 2−
		{Charge: 3, Size: 9, Molality: 0.00 * scale},                           // absent
		{Setschenow: DefaultSetschenowCO2, Molality: 0.01 * scale},             // CO2
		{Charge: 0, Setschenow: 0, Molality: 0.002 * scale, Size: math.Inf(1)}, // a neutral without ks
	}
}

// TestGibbsDuhemPointwise checks the water activity against the Gibbs–Duhem
// equation itself, differentiated numerically along the dilution path m_i = λ
// m_i°: (1/M_w) d ln a_w/dλ + Σ m_i d ln(m_i γ_i)/dλ = 0, with
// d ln m_i/dλ = 1/λ. The activity coefficients come from LogGamma, the water
// activity from WaterActivity, so the check ties the two together.
func TestGibbsDuhemPointwise(t *testing.T) {
	p, err := ParamsAt(thermo.T298)
	if err != nil {
		t.Fatal(err)
	}
	lnGamma := func(m Model, s Solute, I float64) float64 { return math.Ln10 * LogGamma(m, s, I, p) }
	for _, m := range Models() {
		for _, lam := range []float64{0.01, 0.1, 0.5, 1, 2} {
			h := 1e-5 * lam
			wp := WaterActivity(m, brine(lam+h), p)
			wm := WaterActivity(m, brine(lam-h), p)
			dlnaw := (wp.LnActivity - wm.LnActivity) / (2 * h)
			Ip, Im := IonicStrength(brine(lam+h)), IonicStrength(brine(lam-h))
			sum := dlnaw / MolarMassWater
			for i, s := range brine(lam) {
				if s.Molality == 0 {
					continue
				}
				sp, sm := brine(lam + h)[i], brine(lam - h)[i]
				dlng := (lnGamma(m, sp, Ip) - lnGamma(m, sm, Im)) / (2 * h)
				sum += s.Molality * (1/lam + dlng)
			}
			// Terms are of order Σm/λ ≈ 0.7/λ; central differences leave ~1e−9.
			if math.Abs(sum)*lam > 1e-6 {
				t.Errorf("%s at λ = %g: Gibbs–Duhem residual %.3g", m.Name(), lam, sum)
			}
		}
	}
}

// TestGibbsDuhemIntegral integrates Σ m_i d ln γ_i along the dilution path
// numerically (Simpson's rule in s = √λ, where the integrand is smooth) and
// compares ln a_w = −M_w (Σm + ∫ Σ m_i d ln γ_i) with WaterActivity.
func TestGibbsDuhemIntegral(t *testing.T) {
	p, _ := ParamsAt(zeroCelsius + 60)
	full := brine(1)
	I := IonicStrength(full)
	total := 0.0
	for _, s := range full {
		total += molality(s.Molality)
	}
	for _, m := range Models() {
		// ∫₀¹ Σ m_i λ d ln γ_i/dλ dλ = ∫₀¹ Σ m_i s² d ln γ_i/ds ds with λ = s².
		f := func(s float64) float64 {
			const h = 1e-6
			v := 0.0
			for _, sol := range full {
				if molality(sol.Molality) == 0 {
					continue
				}
				up := math.Ln10 * LogGamma(m, sol, I*(s+h)*(s+h), p)
				lo := math.Ln10 * LogGamma(m, sol, I*math.Max(s-h, 0)*math.Max(s-h, 0), p)
				v += sol.Molality * s * s * (up - lo) / (s + h - math.Max(s-h, 0))
			}
			return v
		}
		const n = 2000
		integral := f(0) + f(1)
		for k := 1; k < n; k++ {
			w := 2.0
			if k%2 == 1 {
				w = 4
			}
			integral += w * f(float64(k)/n)
		}
		integral /= 3 * n
		want := -MolarMassWater * (total + integral)
		got := WaterActivity(m, full, p).LnActivity
		if math.Abs(got-want) > 1e-9 {
			t.Errorf("%s: ln a_w = %.12f, numerical Gibbs–Duhem %.12f", m.Name(), got, want)
		}
	}
}

// TestOsmoticLimits: φ → 1 at infinite dilution; the Debye–Hückel limiting
// law for a 1:1 salt gives φ − 1 = −(ln 10 · A/3) √m (Robinson & Stokes ch. 9,
// the limiting law of the osmotic coefficient); the ideal model has φ = 1 and
// ln a_w = −M_w Σm.
func TestOsmoticLimits(t *testing.T) {
	p, _ := ParamsAt(thermo.T298)
	for _, mol := range []float64{1e-8, 1e-6, 1e-4} {
		salt := []Solute{{Charge: 1, Molality: mol}, {Charge: -1, Molality: mol}}
		w := WaterActivity(DebyeHuckel{}, salt, p)
		want := 1 - math.Ln10*p.A/3*math.Sqrt(mol)
		if math.Abs(w.Osmotic-want) > 1e-12 {
			t.Errorf("limiting law at %g: φ = %.15f, want %.15f", mol, w.Osmotic, want)
		}
		ideal := WaterActivity(Ideal{}, salt, p)
		if ideal.Osmotic != 1 || math.Abs(ideal.LnActivity/(-MolarMassWater*2*mol)-1) > 1e-12 {
			t.Errorf("ideal at %g: φ = %v, a_w = %v", mol, ideal.Osmotic, ideal.Activity)
		}
	}
	if w := WaterActivity(BDot{}, nil, p); w.Activity != 1 || w.Osmotic != 1 || w.Method != WaterGibbsDuhem {
		t.Errorf("pure water: %+v", w)
	}
}

// TestMeanKernel compares the closed form, the series and the large-u branch
// of g(u) = ∫₀¹ t²/(1+ut) dt with Simpson's rule.
func TestMeanKernel(t *testing.T) {
	for _, u := range []float64{0, 1e-9, 0.01, 0.0499, 0.05, 0.0501, 0.3, 1, 7, 1e3, 1e7, 1e9} {
		const n = 20000
		f := func(x float64) float64 { return x * x / (1 + u*x) }
		s := f(0) + f(1)
		for k := 1; k < n; k++ {
			w := 2.0
			if k%2 == 1 {
				w = 4
			}
			s += w * f(float64(k)/n)
		}
		s /= 3 * n
		if got := meanKernel(u); math.Abs(got-s) > 1e-9*s {
			t.Errorf("g(%g) = %.15g, Simpson %.15g", u, got, s)
		}
	}
}
