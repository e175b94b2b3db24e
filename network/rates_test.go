package network

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"hess/thermo"
)

// Water-gas shift species: NIST Chemistry WebBook Shomate parameters
// (reference Chase 1998), as listed in the project's reference data.
const wgsSpecies = `settings {
  temperatures 600 K to 1200 K by 100 K
}
species CO(g) {
  shomate 298 K to 1300 K { 25.56759 6.096130 4.054656 -2.671301 0.131021 -118.0089 227.3665 -110.5271 }
}
species H2O(g) {
  shomate 500 K to 1700 K { 30.09200 6.832514 6.793435 -2.534480 0.082139 -250.8810 223.3967 -241.8264 }
}
species CO2(g) {
  shomate 298 K to 1200 K { 24.99735 55.18696 -33.69137 7.948387 -0.136638 -403.6075 228.2431 -393.5224 }
  shomate 1200 K to 6000 K { 58.16639 2.720074 -0.492289 0.038844 -6.447293 -425.9186 263.6125 -393.5224 }
}
species H2(g) {
  shomate 298 K to 1000 K { 33.066178 -11.363417 11.432816 -2.772874 -0.158558 -9.980797 172.707974 0 }
  shomate 1000 K to 2500 K { 18.563083 12.257357 -2.859786 0.268238 1.977990 -1.147438 156.288133 0 }
}
`

// log10 K of CO + H2O <-> CO2 + H2 at 600 … 1200 K, derived from the
// NIST-JANAF log Kf tables (p° = 1 bar; ±0.002 from their rounding).
var wgsTemps = []float64{600, 700, 800, 900, 1000, 1100, 1200}
var wgsLog10K = []float64{1.453, 0.975, 0.626, 0.364, 0.158, -0.004, -0.136}

// The forward rate is a demonstration value: k = 1e12 cm3/mol/s·exp(−120 kJ/mol / RT).
const wgsForward = "rate A 1e12 cm3/mol/s Ea 120 kJ/mol"

func wgsKf(T float64) float64 { return 1e12 * 1e-6 * math.Exp(-120e3/(thermo.R*T)) }

// TestDetailedBalanceAgainstPublishedK derives a reverse rate from the
// published K(T) of the water-gas shift (Δn = 0, so Kc = K) and the forward
// rate: detailed-balance stays quiet on it, and fires when its prefactor is
// doubled.
func TestDetailedBalanceAgainstPublishedK(t *testing.T) {
	kr := make([]float64, len(wgsTemps))
	for i, T := range wgsTemps {
		kr[i] = wgsKf(T) / math.Pow(10, wgsLog10K[i])
	}
	fit, err := thermo.FitArrhenius(wgsTemps, kr)
	if err != nil {
		t.Fatal(err)
	}
	network := func(aScale float64) string {
		return wgsSpecies + fmt.Sprintf(`reaction wgs: CO(g) + H2O(g) <-> CO2(g) + H2(g) {
  %s
  reverse A %.6e cm3/mol/s n %.6f Ea %.6f kJ/mol
}
`, wgsForward, fit.A*1e6*aScale, fit.N, fit.Ea/1000)
	}
	n := loadText(t, network(1))
	if got := diagnosticsOf(n, "detailed-balance"); len(got) != 0 {
		t.Errorf("a reverse rate derived from K(T) is reported: %q", got)
	}
	n = loadText(t, network(2))
	got := diagnosticsOf(n, "detailed-balance")
	if len(got) != 1 || !strings.Contains(got[0], "off at 6 more temperatures") {
		t.Fatalf("a reverse rate off by a factor 2: got %q", got)
	}
	var factor float64
	if _, err := fmt.Sscanf(got[0], "kf/kr of wgs is %g times Kc", &factor); err != nil || math.Abs(factor-0.5) > 0.005 {
		t.Errorf("factor %g (%v) in %q, want 0.5", factor, err, got[0])
	}
}

// TestReverseRateFit fits the reverse rate of the water-gas shift from its
// forward rate and the species' data, and checks it against kf/K from the
// published K(T) over the range.
func TestReverseRateFit(t *testing.T) {
	n := loadText(t, wgsSpecies+"reaction wgs: CO(g) + H2O(g) <-> CO2(g) + H2(g) { "+wgsForward+" }\n")
	rx := n.LookupReaction("wgs")
	rr, err := n.FitReverseRate(rx, wgsTemps)
	if err != nil {
		t.Fatal(err)
	}
	if rr.AUnit != "cm3/mol/s" || rr.Order != 2 || math.Abs(rr.A/(rr.Fit.A*1e6)-1) > 1e-12 {
		t.Errorf("A = %g %s (order %d), SI %g", rr.A, rr.AUnit, rr.Order, rr.Fit.A)
	}
	if rr.Tmin != 600 || rr.Tmax != 1200 || rr.Fit.Points != 7 {
		t.Errorf("range %g to %g K, %d points", rr.Tmin, rr.Tmax, rr.Fit.Points)
	}
	if !(rr.Fit.MaxRelErr < 0.02) {
		t.Errorf("maxRelError %g: a modified Arrhenius form should fit kf/K over 600 to 1200 K to 2%%", rr.Fit.MaxRelErr)
	}
	rows := n.reactionRows(rx, wgsTemps)
	for i, T := range wgsTemps {
		k := rr.Fit.Rate(T)
		model := wgsKf(T) / rows[i].K
		if e := math.Abs(k/model - 1); e > rr.Fit.MaxRelErr+1e-9 {
			t.Errorf("%g K: fit %g against kf/K %g: error %g beyond maxRelError %g", T, k, model, e, rr.Fit.MaxRelErr)
		}
		// The published log10 K is rounded to ±0.002 (0.5 % in K).
		published := wgsKf(T) / math.Pow(10, wgsLog10K[i])
		if e := math.Abs(k/published - 1); e > rr.Fit.MaxRelErr+0.005 {
			t.Errorf("%g K: fit %g against kf/K(published) %g: error %g", T, k, published, e)
		}
	}
	if _, err := n.FitReverseRate(rx, []float64{1000}); err == nil {
		t.Error("a fit at one temperature should fail")
	}
}

// TestRateLnKConvertsConcentrations checks the conversion of kf/kr (SI,
// mol/m³) to the thermodynamic K of a gas step with Δn = −1 against
// K = Kc·(R·T/p°)^Δn, the relation stated in CLI.md.
func TestRateLnKConvertsConcentrations(t *testing.T) {
	n := loadText(t, `species H(g), O2(g), HO2(g)
reaction add: H(g) + O2(g) <-> HO2(g) {
  rate A 2e12 cm3/mol/s Ea 0 kJ/mol
  reverse A 4e14 1/s Ea 200 kJ/mol
}
`)
	rx := n.LookupReaction("add")
	T := 1000.0
	lnK, _, ok := rateLnK(n, rx, T)
	if !ok {
		t.Fatal("no K from the rates")
	}
	kc := (2e12 * 1e-6) / (4e14 * math.Exp(-200e3/(thermo.R*T))) // m³/mol
	want := math.Log(kc * thermo.Bar / (thermo.R * T))
	if math.Abs(lnK-want) > 1e-9 {
		t.Errorf("ln K = %.9f, want %.9f", lnK, want)
	}
}
