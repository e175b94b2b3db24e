package gibbs

import (
	"math"
	"testing"

	"hess/thermo"
)

// Species data for the C–H–O tests. Gases: NIST Chemistry WebBook Shomate
// fits (Chase 1998, NIST-JANAF 4th ed.), the same parameter sets as
// network/testdata/thermo/webbook-shomate.hess; p° = 1 bar. Graphite: a
// constant-Cp model with S°298 = 5.74 J/(mol·K) (CODATA 1989) and
// Cp = 8.517 J/(mol·K) (NIST-JANAF at 298.15 K), both from memory — crude
// above room temperature, but these tests compare solvers on the same
// numbers, not the numbers with measurement.
var chonShomate = map[string][]thermo.ShomateRange{
	"CO2": {
		{Tmin: 298, Tmax: 1200, Coef: [8]float64{24.99735, 55.18696, -33.69137, 7.948387, -0.136638, -403.6075, 228.2431, -393.5224}},
		{Tmin: 1200, Tmax: 6000, Coef: [8]float64{58.16639, 2.720074, -0.492289, 0.038844, -6.447293, -425.9186, 263.6125, -393.5224}},
	},
	"H2O": {
		{Tmin: 500, Tmax: 1700, Coef: [8]float64{30.09200, 6.832514, 6.793435, -2.534480, 0.082139, -250.8810, 223.3967, -241.8264}},
	},
	"H2": {
		{Tmin: 298, Tmax: 1000, Coef: [8]float64{33.066178, -11.363417, 11.432816, -2.772874, -0.158558, -9.980797, 172.707974, 0}},
		{Tmin: 1000, Tmax: 2500, Coef: [8]float64{18.563083, 12.257357, -2.859786, 0.268238, 1.977990, -1.147438, 156.288133, 0}},
	},
	"CO": {
		{Tmin: 298, Tmax: 1300, Coef: [8]float64{25.56759, 6.096130, 4.054656, -2.671301, 0.131021, -118.0089, 227.3665, -110.5271}},
	},
	"CH4": {
		{Tmin: 298, Tmax: 1300, Coef: [8]float64{-0.703029, 108.4773, -42.52157, 5.862788, 0.678565, -76.84376, 158.7163, -74.87310}},
	},
	"O2": {
		{Tmin: 100, Tmax: 700, Coef: [8]float64{31.32234, -20.23531, 57.86644, -36.50624, -0.007374, -8.903471, 246.7945, 0}},
		{Tmin: 700, Tmax: 2000, Coef: [8]float64{30.03235, 8.772972, -3.988133, 0.788313, -0.741599, -11.32468, 236.1663, 0}},
	},
	"N2": {
		{Tmin: 100, Tmax: 500, Coef: [8]float64{28.98641, 1.853978, -9.647459, 16.63537, 0.000117, -8.671914, 226.4168, 0}},
		{Tmin: 500, Tmax: 2000, Coef: [8]float64{19.50583, 19.88705, -8.598535, 1.369784, 0.527601, -4.935202, 212.3900, 0}},
	},
}

// mu0RT returns μ°(T)/RT of a species of chonShomate, or of "C(gr)".
func mu0RT(t testing.TB, name string, T float64) float64 {
	t.Helper()
	if name == "C(gr)" {
		m, err := thermo.NewConstantCp(0, 5.74, 8.517)
		if err != nil {
			t.Fatal(err)
		}
		return m.G(T) / (thermo.R * T)
	}
	for _, r := range chonShomate[name] {
		if T >= r.Tmin && T <= r.Tmax {
			return r.G(T) / (thermo.R * T)
		}
	}
	t.Fatalf("no data for %s at %g K", name, T)
	return math.NaN()
}

// chon is the C–H–O system CH4, H2O, CO, CO2, H2, O2 (gas) and C(gr);
// rows C, H, O. Its element-conserving changes are spanned by
// chonReactions.
var chonNames = []string{"CH4", "H2O", "CO", "CO2", "H2", "O2", "C(gr)"}

func chonProblem(t testing.TB, T, P, steamToCarbon float64) Problem {
	sp := make([]Species, len(chonNames))
	for j, n := range chonNames {
		sp[j] = Species{Name: n, Mu0: mu0RT(t, n, T)}
	}
	sp[6].Phase = 1
	return Problem{
		Phases:  []Phase{{Name: "g", Kind: IdealGas}, {Name: "C(gr)", Kind: Pure}},
		Species: sp,
		B: dense([][]float64{
			{1, 0, 1, 1, 0, 0, 1}, // C
			{4, 2, 0, 0, 2, 0, 0}, // H
			{0, 1, 1, 2, 0, 2, 0}, // O
		}),
		N0:     []float64{1 / (1 + steamToCarbon), steamToCarbon / (1 + steamToCarbon), 0, 0, 0, 0, 0},
		PRatio: P,
	}
}

// chonReactions (species × reactions): steam reforming, water-gas shift,
// methane cracking, hydrogen oxidation: they span the element-conserving
// changes of the seven species (7 − 3 = 4).
func chonReactions() [][]float64 {
	return [][]float64{
		// SMR WGS crack H2ox
		{-1, 0, -1, 0}, // CH4
		{-1, -1, 0, 2}, // H2O
		{1, -1, 0, 0},  // CO
		{0, 1, 0, 0},   // CO2
		{3, 1, 2, -2},  // H2
		{0, 0, 0, -1},  // O2
		{0, 0, 1, 0},   // C(gr)
	}
}
