package equilibrium

import (
	"math"
	"testing"
)

// fuzzNet is a small network for FuzzEquilibrate: steam reforming, shift,
// carbon and a carbonate, constant-Cp data (NIST-JANAF and NBS82 at
// 298.15 K), valid 10–10 000 K.
const fuzzNet = `
species CH4(g) { hf -74.873 kJ/mol s 186.251 J/mol/K cp 35.639 J/mol/K }
species H2O(g) { hf -241.826 kJ/mol s 188.834 J/mol/K cp 33.590 J/mol/K }
species CO(g) { hf -110.527 kJ/mol s 197.653 J/mol/K cp 29.142 J/mol/K }
species CO2(g) { hf -393.522 kJ/mol s 213.795 J/mol/K cp 37.129 J/mol/K }
species H2(g) { hf 0 kJ/mol s 130.680 J/mol/K cp 28.836 J/mol/K }
species C(cr) { hf 0 kJ/mol s 5.740 J/mol/K cp 8.517 J/mol/K }
species CaCO3(cr) { hf -1206.92 kJ/mol s 92.9 J/mol/K cp 81.88 J/mol/K }
species CaO(cr) { hf -635.09 kJ/mol s 39.75 J/mol/K cp 42.80 J/mol/K }
reaction reform: CH4(g) + H2O(g) <-> CO(g) + 3 H2(g)
reaction shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)
reaction boudouard: 2 CO(g) <-> C(cr) + CO2(g)
reaction cracking: CH4(g) -> C(cr) + 2 H2(g)
reaction calcination: CaCO3(cr) <-> CaO(cr) + CO2(g)
mixture feed { temperature 900 K pressure 1 bar CH4(g) 1 mol H2O(g) 1 mol CO2(g) 1 mol C(cr) 1 mol CaCO3(cr) 1 mol }
`

// FuzzEquilibrate brings random feeds of the small network to equilibrium
// at random temperatures and pressures in both bases: never a panic, never
// a negative or non-finite amount, and a result that says it converged
// keeps its balances and puts every reaction whose species are present at
// equilibrium.
func FuzzEquilibrate(f *testing.F) {
	f.Add(1.0, 3.0, 0.0, 0.0, 0.0, 1123.0, 25.0, false)
	f.Add(1.0, 1.0, 0.0, 0.0, 0.0, 850.0, 1.0, true)
	f.Add(0.0, 0.0, 0.0, 0.0, 1.0, 1200.0, 1.0, false)
	f.Add(0.0, 0.0, 1.0, 1.0, 1.0, 600.0, 0.001, true)
	f.Add(1e-20, 1.0, 0.0, 1e9, 0.0, 3000.0, 1000.0, false)
	f.Add(0.0, 0.0, 0.0, 0.0, 0.0, 900.0, 1.0, false)
	n := loadText(f, fuzzNet)
	if n.Diagnostics.HasErrors() {
		f.Fatalf("fuzz network: %v", n.Diagnostics)
	}
	mx := n.LookupMixture("feed")
	f.Fuzz(func(t *testing.T, ch4, h2o, co2, c, caco3, T, P float64, elements bool) {
		amounts := []float64{ch4, h2o, co2, c, caco3}
		for i, v := range amounts {
			v = math.Abs(v)
			if !(v <= 1e12) {
				v = 1
			}
			mx.Members[i].Amount.V = v
		}
		if !(T >= 50 && T <= 6000) || !(P >= 1e-6 && P <= 1e6) {
			return
		}
		basis := BasisReactions
		if elements {
			basis = BasisElements
		}
		res, diags, err := Equilibrate(n, mx, Options{T: T, P: P * 1e5, Basis: basis})
		if err != nil {
			t.Fatalf("solver error: %v", err)
		}
		if res == nil {
			if len(diags) == 0 {
				t.Fatal("no result and no diagnostic")
			}
			return
		}
		for _, s := range res.Species {
			if !(s.Amount >= 0) || math.IsInf(s.Amount, 0) {
				t.Fatalf("%s: amount %g", s.Species.Key, s.Amount)
			}
		}
		if !res.Converged {
			return // reported as such by every renderer
		}
		if res.ElementResidual > 1e-9 {
			t.Fatalf("converged with element residual %g", res.ElementResidual)
		}
		for _, r := range res.Reactions {
			if !math.IsNaN(r.Log10QoverK) && math.Abs(r.Log10QoverK) > 1e-6 && majorPresent(res, r) {
				t.Fatalf("converged with %s at log10(Q/K) = %g", r.Reaction.Name, r.Log10QoverK)
			}
		}
	})
}

// majorPresent reports whether every species of a reaction is above the
// rounding of the balances (1e-12 of the feed): below it the balance, not
// the potential, fixes an amount.
func majorPresent(c *Composition, r ReactionBalance) bool {
	for _, t := range r.Reaction.NetTerms() {
		for _, s := range c.Species {
			if s.Species == t.Species && s.Amount <= 1e-12*c.FeedMoles {
				return false
			}
		}
	}
	return true
}

// TestSolverInputsFromFuzz: feeds that once made gonum's simplex panic
// inside the forced-zero search (a large carbonate charge with a little
// steam, carbon or methane) are solved without an error, and the first one,
// which once wandered off, converges through the retry from where the
// first start ended.
func TestSolverInputsFromFuzz(t *testing.T) {
	n := loadText(t, fuzzNet)
	mx := n.LookupMixture("feed")
	for i, tc := range []struct {
		T, P  float64
		basis Basis
		feed  [5]float64
		conv  bool
	}{
		{1695.6, 6.7, BasisElements, [5]float64{0.6473222960062746, 0, 0, 0, 43.61920234756224}, true},
		{2365.4306328542539, 71.98966494318114, BasisElements, [5]float64{0, 0.017450491916089713, 0, 0.0029376422232457807, 50.44294575482296}, false},
		{2126.1899335526059, 0.0085283497040448096, BasisReactions, [5]float64{1.4718236413410232e-06, 8.191604448602734e-06, 0, 0, 0.1794813904418293}, false},
		{888.12957446285372, 0.0103587545393779, BasisElements, [5]float64{0, 0, 4.3636912283867976e-05, 0, 0.29973583993308855}, false},
	} {
		for k := range mx.Members {
			mx.Members[k].Amount.V = tc.feed[k]
		}
		c, diags, err := Equilibrate(n, mx, Options{T: tc.T, P: tc.P * 1e5, Basis: tc.basis})
		if err != nil || len(diags) > 0 {
			t.Errorf("case %d: %v %v", i, err, diags)
			continue
		}
		if tc.conv && !c.Converged {
			t.Errorf("case %d: not converged", i)
		}
	}
}
