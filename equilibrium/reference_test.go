package equilibrium

import (
	"fmt"
	"math"
	"math/rand/v2"
	"path/filepath"
	"testing"

	"hess/gibbs"
	"hess/gibbs/gibbstest"
	"hess/network"
)

// loadPlantWith compiles the shipped hydrogen-plant example with extra
// statements appended to its root file.
func loadPlantWith(t testing.TB, extra string) *network.Network {
	t.Helper()
	return loadExample(t, filepath.Join("hydrogen-plant", "reformer.hess"), extra)
}

// plantFeed is a steam–methane feed of 1 mol in all.
func plantFeed(name string, sc float64) string {
	return fmt.Sprintf("mixture %s { temperature 900 K pressure 1 bar CH4(g) %.17g mol H2O(g) %.17g mol }\n", name, 1/(1+sc), sc/(1+sc))
}

// TestPlantAgainstScipy compares hess equilibrium on the shipped
// hydrogen-plant network (its species data and reactions, graphite
// included) with an independent minimisation in Debian's python3-scipy
// (gibbstest: SLSQP polished by fsolve on the KKT equations) of the same
// problem, over 600–1200 K, 1–30 bar and steam-to-carbon 1–4, in both
// bases: amounts within 1e-7 mol for a feed of 1 mol. The cases include
// carbon forming and not forming.
func TestPlantAgainstScipy(t *testing.T) {
	gibbstest.Require(t)
	type tc struct{ T, P, sc float64 }
	cases := []tc{
		{850, 1, 1},      // carbon forms
		{700, 1, 1},      // carbon forms (cracking and Boudouard near their balance)
		{1123.15, 25, 3}, // the reformer outlet: no carbon
		{1123.15, 25, 1.5},
		{600, 30, 4}, // cold, steam-rich: methane and steam remain
		{1200, 1, 1},
	}
	rng := rand.New(rand.NewPCG(7, 11))
	for i := 0; i < 10; i++ {
		cases = append(cases, tc{600 + 600*rng.Float64(), 1 + 29*rng.Float64(), 1 + 3*rng.Float64()})
	}
	var extra string
	for i, c := range cases {
		extra += plantFeed(fmt.Sprintf("case%d", i), c.sc)
	}
	n := loadPlantWith(t, extra)
	type run struct {
		c     tc
		basis Basis
		got   *Composition
	}
	var runs []run
	var problems []gibbs.Problem
	for i, c := range cases {
		for _, basis := range []Basis{BasisReactions, BasisElements} {
			got := solveFeed(t, n, fmt.Sprintf("case%d", i), Options{T: c.T, P: c.P * 1e5, Basis: basis})
			runs = append(runs, run{c, basis, got})
			problems = append(problems, got.sys.problem)
		}
	}
	refs, err := gibbstest.ReferenceAll(problems)
	if err != nil {
		t.Fatal(err)
	}
	carbon, none := false, false
	for i, r := range runs {
		for j, s := range r.got.Species {
			if d := math.Abs(s.Amount - refs[i].N[j]); d > 1e-7 {
				t.Errorf("%s T=%.2f P=%.2f S/C=%.2f %s: hess %.12g scipy %.12g", r.basis, r.c.T, r.c.P, r.c.sc, s.Species.Key, s.Amount, refs[i].N[j])
			}
		}
		if amount(t, r.got, "C(cr)") > 1e-6 {
			carbon = true
		} else {
			none = true
		}
	}
	if !carbon || !none {
		t.Errorf("the cases must include carbon forming (%v) and not (%v)", carbon, none)
	}
}

// TestBasesAgreeOnExamples: on the shipped hydrogen plant, whose reactions
// span every element-conserving change of its species, the reactions basis
// and the elements basis give the same amounts.
func TestBasesAgreeOnExamples(t *testing.T) {
	n := loadPlantWith(t, "")
	for _, mx := range n.Mixtures {
		for _, T := range []float64{700, 900, 1123.15} {
			a := solveFeed(t, n, mx.Name, Options{T: T})
			b := solveFeed(t, n, mx.Name, Options{T: T, Basis: BasisElements})
			for j, s := range a.Species {
				other := amount(t, b, s.Species.Key)
				if d := math.Abs(s.Amount - other); d > 1e-9*a.FeedMoles {
					t.Errorf("%s %g K %s: reactions %.12g, elements %.12g", mx.Name, T, s.Species.Key, s.Amount, other)
				}
				_ = j
			}
		}
	}
}

// TestReactionsBasisConstrains: a network that knows only steam reforming
// (no shift, no carbon reactions) cannot make CO2 however favourable: under
// the default basis CO2 stays at its feed amount (0) and only reform
// balances, while the elements basis, free to make CO2 through the
// element balance, gives a different composition with CO2 and a lower
// Gibbs energy. Both conserve the elements.
func TestReactionsBasisConstrains(t *testing.T) {
	n := mustLoad(t, `
species CH4(g) { hf -74.873 kJ/mol s 186.251 J/mol/K }
species H2O(g) { hf -241.826 kJ/mol s 188.834 J/mol/K }
species CO(g) { hf -110.527 kJ/mol s 197.653 J/mol/K }
species CO2(g) { hf -393.522 kJ/mol s 213.795 J/mol/K }
species H2(g) { hf 0 kJ/mol s 130.680 J/mol/K }
reaction reform: CH4(g) + H2O(g) <-> CO(g) + 3 H2(g)
mixture feed { temperature 900 K pressure 5 bar CH4(g) 1 mol H2O(g) 3 mol }
`)
	r := solveFeed(t, n, "feed", Options{})
	e := solveFeed(t, n, "feed", Options{Basis: BasisElements})
	for _, s := range r.Species {
		if s.Species.Key == "CO2(g)" {
			t.Errorf("reactions basis: CO2 takes part (%g mol), but no reaction of the network makes it", s.Amount)
		}
	}
	// The reform reaction's extent: CO equals a third of the H2.
	within(t, "CO = H2/3", amount(t, r, "CO(g)"), amount(t, r, "H2(g)")/3, 1e-12)
	allReactionsAtEquilibrium(t, r)
	if got := amount(t, e, "CO2(g)"); got < 0.01 {
		t.Errorf("elements basis: CO2 = %g, want a clear amount", got)
	}
	if !(e.res.G < r.res.G-1e-6) {
		t.Errorf("the free minimisation must reach a lower G/RT: elements %g, reactions %g", e.res.G, r.res.G)
	}
	for _, c := range []*Composition{r, e} {
		if c.ElementResidual > 1e-12 {
			t.Errorf("%s: element residual %g", c.Basis, c.ElementResidual)
		}
	}
}

// TestPlantCarbonReactionsMatchJANAF: the example's graphite (a Shomate fit
// to NIST-JANAF C-002) with its gases gives the Boudouard and cracking
// constants that NIST-JANAF's log10 Kf give: log10 K(boudouard) =
// log Kf(CO2) − 2 log Kf(CO), log10 K(cracking) = −log Kf(CH4) (JANAF
// 1998 values from the reference data; ±0.003 for their rounding and the
// fits).
func TestPlantCarbonReactionsMatchJANAF(t *testing.T) {
	n := loadPlantWith(t, "")
	kf := map[float64][3]float64{ // CO2, CO, CH4
		600: {34.404, 14.320, 1.993}, 700: {29.505, 12.948, 0.943}, 800: {25.829, 11.916, 0.138},
		900: {22.969, 11.109, -0.500}, 1000: {20.679, 10.461, -1.018}, 1100: {18.805, 9.928, -1.447},
		1200: {17.242, 9.481, -1.807},
	}
	bk := n.ReactionK(n.LookupReaction("boudouard"))
	ck := n.ReactionK(n.LookupReaction("cracking"))
	for T, v := range kf {
		within(t, fmt.Sprintf("boudouard log10 K at %g K", T), bk.Row(T).Log10K, v[0]-2*v[1], 0.004)
		within(t, fmt.Sprintf("cracking log10 K at %g K", T), ck.Row(T).Log10K, -v[2], 0.004)
	}
}
