package equilibrium

import (
	"fmt"
	"math"
	"testing"

	"hess/lang"
	"hess/network"
	"hess/thermo"
)

// mustLoad compiles text and fails on any error diagnostic.
func mustLoad(t testing.TB, text string) *network.Network {
	t.Helper()
	n := loadText(t, text)
	for _, d := range n.Diagnostics {
		if d.Severity == lang.Error {
			t.Fatalf("%d:%d: %s: %s", d.Subject.Start.Line, d.Subject.Start.Column, d.Code, d.Message)
		}
	}
	return n
}

// solve brings the named mixture to equilibrium and fails on diagnostics,
// errors or a solve that did not converge.
func solveFeed(t testing.TB, n *network.Network, mixture string, o Options) *Composition {
	t.Helper()
	mx := n.LookupMixture(mixture)
	if mx == nil {
		t.Fatalf("no mixture %s", mixture)
	}
	c, diags, err := Equilibrate(n, mx, o)
	if err != nil {
		t.Fatal(err)
	}
	if len(diags) > 0 {
		t.Fatalf("diagnostics: %v", diags)
	}
	if !c.Converged {
		t.Fatalf("%s at %g K did not converge (residual %g, stationarity %g)", mixture, c.T, c.ElementResidual, c.Stationarity)
	}
	return c
}

// amount is the amount of a species in a composition, mol.
func amount(t testing.TB, c *Composition, key string) float64 {
	t.Helper()
	for _, s := range c.Species {
		if s.Species.Key == key {
			return s.Amount
		}
	}
	t.Fatalf("no species %s in the result", key)
	return math.NaN()
}

func within(t testing.TB, what string, got, want, tol float64) {
	t.Helper()
	if d := math.Abs(got - want); !(d <= tol*math.Max(1, math.Abs(want))) {
		t.Errorf("%s = %.15g, want %.15g (off by %.3g)", what, got, want, d)
	}
}

// allReactionsAtEquilibrium requires log10(Q/K) ≈ 0 for every reaction
// whose species are all present.
func allReactionsAtEquilibrium(t testing.TB, c *Composition) {
	t.Helper()
	for _, r := range c.Reactions {
		if !math.IsNaN(r.Log10QoverK) && math.Abs(r.Log10QoverK) > 1e-9 {
			t.Errorf("%s: log10(Q/K) = %g at %g K", r.Reaction.Name, r.Log10QoverK, c.T)
		}
	}
	if c.ElementResidual > 1e-12 {
		t.Errorf("element residual %g", c.ElementResidual)
	}
}

// Data for the closed-form tests: ΔfH° and S° at 298.15 K (NIST-JANAF
// 1998; CaCO3 and CaO NBS82, as in the reference data). With hf and s
// alone a species' model has Cp = 0, so ΔrG°(T) = ΔrH° − TΔrS° exactly:
// the tests check the solver's answer against the closed form on the same
// numbers.
const shiftNet = `
species CO(g) { hf -110.527 kJ/mol s 197.653 J/mol/K }
species H2O(g) { hf -241.826 kJ/mol s 188.834 J/mol/K }
species CO2(g) { hf -393.522 kJ/mol s 213.795 J/mol/K }
species H2(g) { hf 0 kJ/mol s 130.680 J/mol/K }
reaction shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)
mixture feed { temperature 800 K pressure 10 bar CO(g) 1 mol H2O(g) 1 mol }
`

// TestShiftClosedForm: water-gas shift from 1:1 CO/H2O. With extent x per
// mol of CO, K = x²/(1−x)², so x = √K/(1+√K) (Δn = 0: no dependence on P).
func TestShiftClosedForm(t *testing.T) {
	n := mustLoad(t, shiftNet)
	dH := (-393.522 + 0 - (-110.527) - (-241.826)) * 1000
	dS := 213.795 + 130.680 - 197.653 - 188.834
	for _, basis := range []Basis{BasisReactions, BasisElements} {
		for _, T := range []float64{500, 800, 1100, 1500, 2500} {
			c := solveFeed(t, n, "feed", Options{T: T, Basis: basis})
			K := math.Exp(-(dH - T*dS) / (thermo.R * T))
			x := math.Sqrt(K) / (1 + math.Sqrt(K))
			what := fmt.Sprintf("%s %g K", basis, T)
			within(t, what+" CO2", amount(t, c, "CO2(g)"), x, 1e-9)
			within(t, what+" H2", amount(t, c, "H2(g)"), x, 1e-9)
			within(t, what+" CO", amount(t, c, "CO(g)"), 1-x, 1e-9)
			within(t, what+" H2O", amount(t, c, "H2O(g)"), 1-x, 1e-9)
			allReactionsAtEquilibrium(t, c)
		}
	}
}

// TestDissociationClosedForm: A(g) ⇌ 2 B(g) from 1 mol of A at total
// pressure P: K = 4α²(P/p°)/(1−α²), α = √(K/(K + 4P/p°)). Data: N2O4 and
// NO2, NBS82 (from memory; the test checks the closed form on the numbers
// given, not the numbers).
func TestDissociationClosedForm(t *testing.T) {
	n := mustLoad(t, `
species N2O4(g) { hf 9.16 kJ/mol s 304.29 J/mol/K }
species NO2(g) { hf 33.18 kJ/mol s 240.06 J/mol/K }
reaction split: N2O4(g) <-> 2 NO2(g)
mixture feed { temperature 320 K pressure 1 bar N2O4(g) 1 mol }
`)
	dH := (2*33.18 - 9.16) * 1000
	dS := 2*240.06 - 304.29
	for _, T := range []float64{300, 350} {
		for _, P := range []float64{0.01, 1, 10, 100} {
			c := solveFeed(t, n, "feed", Options{T: T, P: P * thermo.Bar})
			K := math.Exp(-(dH - T*dS) / (thermo.R * T))
			a := math.Sqrt(K / (K + 4*P))
			what := fmt.Sprintf("%g K %g bar", T, P)
			within(t, what+" NO2", amount(t, c, "NO2(g)"), 2*a, 1e-9)
			within(t, what+" N2O4", amount(t, c, "N2O4(g)"), 1-a, 1e-9)
			allReactionsAtEquilibrium(t, c)
		}
	}
}

const kilnNet = `
species CaCO3(cr) "calcite" { hf -1206.92 kJ/mol s 92.9 J/mol/K }
species CaO(cr) "lime" { hf -635.09 kJ/mol s 39.75 J/mol/K }
species CO2(g) { hf -393.522 kJ/mol s 213.795 J/mol/K }
species N2(g) { hf 0 kJ/mol s 191.609 J/mol/K }
reaction calcination: CaCO3(cr) <-> CaO(cr) + CO2(g)
mixture charge { temperature 1000 K pressure 1 bar CaCO3(cr) 1 mol N2(g) 1 mol }
`

// TestDecompositionClosedForm: CaCO3(cr) ⇌ CaO(cr) + CO2(g) with 1 mol of
// N2 at 1 bar. While both solids are present p(CO2) = K·p°, so
// n(CO2) = n(N2)·K/(P/p° − K); once that would exceed the 1 mol of
// carbonate, the carbonate is gone (exactly 0) and n(CO2) = 1. Below the
// range the lime is a trace that must still be exact.
func TestDecompositionClosedForm(t *testing.T) {
	n := mustLoad(t, kilnNet)
	dH := (-635.09 - 393.522 + 1206.92) * 1000
	dS := 39.75 + 213.795 - 92.9
	K := func(T float64) float64 { return math.Exp(-(dH - T*dS) / (thermo.R * T)) }
	for _, basis := range []Basis{BasisReactions, BasisElements} {
		for _, T := range []float64{600, 800, 1000, 1080, 1200, 1500} {
			c := solveFeed(t, n, "charge", Options{T: T, Basis: basis})
			k := K(T)
			co2 := 1 * k / (1 - k)
			what := fmt.Sprintf("%s %g K (K = %.4g)", basis, T, k)
			if k < 1 && co2 < 1 {
				// Both solids: lime and CO2 equal, to full relative precision.
				rel(t, what+" CO2", amount(t, c, "CO2(g)"), co2, 1e-9)
				rel(t, what+" CaO", amount(t, c, "CaO(cr)"), co2, 1e-9)
				within(t, what+" CaCO3", amount(t, c, "CaCO3(cr)"), 1-co2, 1e-9)
			} else {
				if got := amount(t, c, "CaCO3(cr)"); got != 0 {
					t.Errorf("%s: CaCO3 = %g, want exactly 0 above the two-solid range", what, got)
				}
				within(t, what+" CaO", amount(t, c, "CaO(cr)"), 1, 1e-12)
				within(t, what+" CO2", amount(t, c, "CO2(g)"), 1, 1e-12)
			}
			within(t, what+" N2", amount(t, c, "N2(g)"), 1, 1e-12)
			allReactionsAtEquilibrium(t, c)
		}
	}
}

// rel compares relative to want itself (for trace amounts).
func rel(t testing.TB, what string, got, want, tol float64) {
	t.Helper()
	if d := math.Abs(got-want) / math.Abs(want); !(d <= tol) {
		t.Errorf("%s = %.15g, want %.15g (relative error %.3g)", what, got, want, d)
	}
}

// TestTraceHydrogen: 1 mol H2 with 1 mol O2 at 500 K and 1 bar leaves
// hydrogen at a mole fraction near 1e-23, which must come out to full
// relative precision: x(H2) = x(H2O)/√(K·x(O2)·P/p°) for 2 H2 + O2 ⇌ 2 H2O,
// with x(H2O) = 1/1.5 and x(O2) = 0.5/1.5 to within the trace itself.
// Data: NIST-JANAF 1998 at 298.15 K (Cp = 0, so ΔrG° = ΔrH° − TΔrS°).
func TestTraceHydrogen(t *testing.T) {
	n := mustLoad(t, `
species H2(g) { hf 0 kJ/mol s 130.680 J/mol/K }
species O2(g) { hf 0 kJ/mol s 205.147 J/mol/K }
species H2O(g) { hf -241.826 kJ/mol s 188.834 J/mol/K }
reaction burn: 2 H2(g) + O2(g) <-> 2 H2O(g)
mixture feed { temperature 500 K pressure 1 bar H2(g) 1 mol O2(g) 1 mol }
`)
	const T = 500.0
	dH := 2 * -241826.0
	dS := 2*188.834 - 2*130.680 - 205.147
	K := math.Exp(-(dH - T*dS) / (thermo.R * T))
	x := (1 / 1.5) / math.Sqrt(K*(0.5/1.5))
	for _, basis := range []Basis{BasisReactions, BasisElements} {
		c := solveFeed(t, n, "feed", Options{Basis: basis})
		rel(t, basis.String()+" trace H2", amount(t, c, "H2(g)"), 1.5*x, 1e-9)
		for _, s := range c.Species {
			if s.Species.Key == "H2(g)" {
				rel(t, basis.String()+" trace H2 mole fraction", s.MoleFraction, x, 1e-9)
			}
		}
	}
	if !(x < 1e-20) {
		t.Fatalf("the case must be a trace: x = %g", x)
	}
}

// TestDissolutionWithCharge: silver chloride in 1 kg of water at 25 °C
// (NBS82 ΔfG°, gf alone: data at 298.15 K only). Ideal dilute solutes with
// the charge balanced: m(Ag+) = m(Cl−) = √Ksp, Ksp = exp(−ΔrG°/RT) with
// ΔrG° = 55.668 kJ/mol (pKsp 9.753; CRC's measured Ksp 1.77e-10). Both
// bases; the solid stays, and the heat is unknown (ΔfG° carries no
// enthalpy).
func TestDissolutionWithCharge(t *testing.T) {
	n := mustLoad(t, `
species H2O(l) { gf -237.129 kJ/mol }
species Ag+(aq) { gf 77.107 kJ/mol }
species Cl-(aq) { gf -131.228 kJ/mol }
species AgCl(s) { gf -109.789 kJ/mol }
reaction dissolve: AgCl(s) <-> Ag+(aq) + Cl-(aq)
mixture slurry { temperature 298.15 K pressure 1 bar H2O(l) 1 kg AgCl(s) 0.001 mol }
`)
	Ksp := math.Exp(-55668 / (thermo.R * 298.15))
	for _, basis := range []Basis{BasisReactions, BasisElements} {
		c := solveFeed(t, n, "slurry", Options{Basis: basis})
		var ag, cl SpeciesAmount
		for _, s := range c.Species {
			switch s.Species.Key {
			case "Ag+(aq)":
				ag = s
			case "Cl-(aq)":
				cl = s
			}
		}
		rel(t, basis.String()+" m(Ag+)", ag.Molality, math.Sqrt(Ksp), 1e-9)
		rel(t, basis.String()+" m(Cl-)", cl.Molality, math.Sqrt(Ksp), 1e-9)
		within(t, basis.String()+" AgCl left", amount(t, c, "AgCl(s)"), 0.001-ag.Amount, 1e-12)
		within(t, basis.String()+" Ksp", ag.Activity*cl.Activity, Ksp, 1e-9*Ksp)
		if !math.IsNaN(c.Heat) || c.HeatNote == "" {
			t.Errorf("%s: heat %g (%q), want unknown", basis, c.Heat, c.HeatNote)
		}
	}
}

// TestSolutionPhase: two members of a declared solution phase converting
// into each other (A ⇌ B, activity = mole fraction) end at x_B/x_A = K, and
// the gas beside them keeps its own balance. Invented data for the closed
// form (demo numbers).
func TestSolutionPhase(t *testing.T) {
	n := mustLoad(t, `
phase melt { convention solution }
species Ao(melt) { formula C2H6O hf -10 kJ/mol s 100 J/mol/K }
species Bo(melt) { formula C2H6O hf -12 kJ/mol s 99 J/mol/K }
species Ar(g) { hf 0 kJ/mol s 154.8 J/mol/K }
reaction flip: Ao(melt) <-> Bo(melt)
mixture feed { temperature 700 K pressure 1 bar Ao(melt) 1 mol Ar(g) 1 mol }
`)
	K := math.Exp(-(-2000 - 700*(-1.0)) / (thermo.R * 700))
	for _, basis := range []Basis{BasisReactions, BasisElements} {
		c := solveFeed(t, n, "feed", Options{Basis: basis})
		within(t, basis.String()+" B", amount(t, c, "Bo(melt)"), K/(1+K), 1e-9)
		within(t, basis.String()+" A", amount(t, c, "Ao(melt)"), 1/(1+K), 1e-9)
		within(t, basis.String()+" Ar", amount(t, c, "Ar(g)"), 1, 1e-12)
	}
}

// TestReactionDataGivesMu: a species without data of its own takes part
// through a reaction that carries its own ΔrH° and ΔrS°: its μ° is fitted
// so that the reaction's ΔrG° holds (the least-squares rule), and the
// isomerisation A ⇌ B ends at n_B/n_A = K = exp(−(ΔrH° − TΔrS°)/RT). A
// second reaction to a third isomer with species data on both sides keeps
// its own K. Invented data for the closed form (demo numbers).
func TestReactionDataGivesMu(t *testing.T) {
	n := mustLoad(t, `
species Ao(g) { formula C2H6O hf -10 kJ/mol s 250 J/mol/K }
species Bo(g) { formula C2H6O }
species Co(g) { formula C2H6O hf -9 kJ/mol s 252 J/mol/K }
reaction ab: Ao(g) <-> Bo(g) { dh -3 kJ/mol ds -2 J/mol/K }
reaction ac: Ao(g) <-> Co(g)
mixture feed { temperature 600 K pressure 1 bar Ao(g) 1 mol }
`)
	const T = 600.0
	Kab := math.Exp(-(-3000 - T*(-2)) / (thermo.R * T))
	Kac := math.Exp(-(1000 - T*2) / (thermo.R * T))
	c := solveFeed(t, n, "feed", Options{})
	if !c.AdjustedMu {
		t.Error("μ° of Bo(g) must be fitted to the reaction's data")
	}
	a := 1 / (1 + Kab + Kac)
	within(t, "A", amount(t, c, "Ao(g)"), a, 1e-9)
	within(t, "B", amount(t, c, "Bo(g)"), a*Kab, 1e-9)
	within(t, "C", amount(t, c, "Co(g)"), a*Kac, 1e-9)
	allReactionsAtEquilibrium(t, c)
	// The elements basis knows no data for Bo(g) and leaves it out.
	e := solveFeed(t, n, "feed", Options{Basis: BasisElements})
	for _, s := range e.Species {
		if s.Species.Key == "Bo(g)" {
			t.Errorf("elements basis: Bo(g) has no data at %g K and must not take part", T)
		}
	}
	within(t, "elements basis C/A", amount(t, e, "Co(g)")/amount(t, e, "Ao(g)"), Kac, 1e-9)
}
