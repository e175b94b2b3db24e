package network

import (
	"fmt"
	"math"
	"math/big"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
)

// cycleSums returns, for every cycle found for quantity q, its weighted
// sum and propagated uncertainty in J/mol, keyed by the cycle as written.
func cycleSums(t *testing.T, n *Network, q quantity) (order []string, sums map[string][2]float64) {
	t.Helper()
	a := analyseCycles(n)
	sums = map[string][2]float64{}
	for _, g := range a.groups {
		for qi, gq := range g.quantities {
			if gq != q {
				continue
			}
			for ci, c := range g.cycles {
				r := a.sumOf(g, qi, g.vecs[ci])
				order = append(order, c.String())
				sums[c.String()] = [2]float64{r.sum, r.sigma}
			}
		}
	}
	return order, sums
}

func diagnosticsOf(n *Network, code string) []string {
	var out []string
	for _, d := range n.Diagnostics {
		if string(d.Code) == code {
			out = append(out, d.Message)
		}
	}
	return out
}

// TestCycleBasisKnownCycles checks the cycles found in small networks
// whose cycles were worked out by hand, and their sums. The data are
// NIST-JANAF (4th ed., 1998) values and exact sums of them (see each
// file); the expected sums are hand arithmetic on the numbers in the file.
func TestCycleBasisKnownCycles(t *testing.T) {
	g298 := quantity{T: 298.15}
	// R·T·ln 10 at 298.15 K with R = 8.31446261815324 J/mol/K (SI 2019).
	rtln10 := 5708.009502535258
	tests := []struct {
		file   string
		q      quantity
		cycles []string
		sums   []float64 // J/mol, in the order of cycles
	}{
		{"half-coefficients.hess", g298,
			[]string{"2 water-half - water-two", "water-half - co-burn + shift"},
			// 2·(−228.582) − (−460.164); −228.582 − (−257.226) + (−RT ln10 · 5.018)
			[]float64{3000, -228582 + 257226 - rtln10*5.018}},
		{"three-cycles.hess", g298,
			[]string{"reform + shift - overall", "reform - shift - dry-reform", "shift - co-burn + h2-burn"},
			// 142.187 − 28.644 − 113.543; 142.187 + 28.644 − 172.831; −28.644 + 257.226 − 228.582
			[]float64{0, -2000, 0}},
		{"three-cycles-reordered.hess", g298,
			[]string{"co-burn - h2-burn - shift", "dry-reform - reform + shift", "overall - reform - shift"},
			// −257.226 + 228.582 + 28.644; 172.831 − 142.187 − 28.644; 113.543 − 142.187 + 28.644
			[]float64{0, 2000, 0}},
		{"janaf-enthalpies.hess", enthalpyQuantity,
			[]string{
				"c-burn + 2 h2-burn - ch4-form - ch4-burn",
				"c-burn - co-form - co-burn",
				"ch4-form - co-form + steam-form + reform",
				"co-burn - steam-form - shift",
				"h2-burn - steam-form - condense",
			},
			// −393.522 − 2·285.830 + 74.873 + 890.309; −393.522 + 110.527 + 282.995;
			// −74.873 + 110.527 − 241.826 + 206.172; −282.995 + 241.826 + 41.169;
			// −285.830 + 241.826 + 44.004
			[]float64{0, 0, 0, 0, 0}},
	}
	for _, tc := range tests {
		t.Run(tc.file, func(t *testing.T) {
			n := Load(filepath.Join("..", "testdata", "cycles", tc.file), Disk{}, Options{})
			order, sums := cycleSums(t, n, tc.q)
			if strings.Join(order, "; ") != strings.Join(tc.cycles, "; ") {
				t.Fatalf("cycles:\n got %q\nwant %q", order, tc.cycles)
			}
			for i, c := range tc.cycles {
				if got := sums[c][0]; math.Abs(got-tc.sums[i]) > 1e-6 {
					t.Errorf("%s: sum %.6f J/mol, want %.6f", c, got, tc.sums[i])
				}
			}
		})
	}
}

// TestCycleBasisWeightsArePrimitive checks on a network whose only cycle
// needs fractional weights in one scaling and integers in another that the
// weights come out as the smallest integers, the first positive.
func TestCycleBasisWeightsArePrimitive(t *testing.T) {
	src := `species H2(g), O2(g), H2O(g)
reaction quarter: 1/2 H2(g) + 1/4 O2(g) <-> 1/2 H2O(g) { dg -114.291 kJ/mol }
reaction six: 6 H2(g) + 3 O2(g) <-> 6 H2O(g) { dg -1371.492 kJ/mol }
`
	n := loadText(t, src)
	order, _ := cycleSums(t, n, quantity{T: 298.15})
	if want := []string{"12 quarter - six"}; strings.Join(order, ";") != strings.Join(want, ";") {
		t.Fatalf("cycles %q, want %q", order, want)
	}
}

// TestHessLawMethane checks Hess's law on published data: the formation
// enthalpy of methane (NIST WebBook, Manion 2002: −74.6 ± 0.3 kJ/mol)
// against the combustion enthalpies of graphite and hydrogen (CODATA key
// values: ΔfH° of CO2(g) −393.51 ± 0.13, of H2O(l) −285.830 ± 0.040) and of
// methane (Rossini 1931, −212.80 ± 0.07 kcal/mol, from memory). The cycle
// closes within its uncertainty; moving the formation enthalpy by 5 kJ/mol
// makes it fail, and with a single cycle every reaction on it is equally
// suspect.
func TestHessLawMethane(t *testing.T) {
	path := filepath.Join("..", "testdata", "cycles", "methane-hess.hess")
	n := Load(path, Disk{}, Options{})
	const cycle = "ch4-formation + ch4-combustion - c-combustion - 2 h2-combustion"
	order, sums := cycleSums(t, n, enthalpyQuantity)
	if len(order) != 1 || order[0] != cycle {
		t.Fatalf("cycles %q, want [%q]", order, cycle)
	}
	// −74.6 − 212.80·4.184 + 393.51 + 2·285.830 = 0.2148 kJ/mol;
	// σ = sqrt(0.3² + (0.07·4.184)² + 0.13² + (2·0.040)²) = 0.4462 kJ/mol.
	if s := sums[cycle]; math.Abs(s[0]-214.8) > 1e-6 || math.Abs(s[1]-446.18235554535324) > 1e-6 {
		t.Errorf("residual %.4f ± %.4f J/mol, want 214.8 ± 446.18", s[0], s[1])
	}
	if got := diagnosticsOf(n, "cycle-inconsistent"); len(got) != 0 {
		t.Errorf("published data should close: %q", got)
	}

	src, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	bad := strings.Replace(string(src), "dh -74.6 ± 0.3 kJ/mol", "dh -79.6 ± 0.3 kJ/mol", 1)
	n = loadText(t, bad)
	var found bool
	for _, d := range n.Diagnostics {
		if d.Code != "cycle-inconsistent" {
			continue
		}
		found = true
		if want := "cycle " + cycle + " does not close: ΣΔrH° = -4.79 ± 0.45 kJ/mol"; !strings.Contains(d.Message, want) {
			t.Errorf("message %q lacks %q", d.Message, want)
		}
		want := "the data cannot single out one reaction: ch4-formation, ch4-combustion, c-combustion and h2-combustion are equally suspect"
		if !strings.Contains(d.Detail, want) {
			t.Errorf("detail %q lacks %q", d.Detail, want)
		}
		if len(d.Related) != 4 {
			t.Errorf("%d related locations, want one per reaction of the cycle", len(d.Related))
		}
	}
	if !found {
		t.Fatal("a 5 kJ/mol error in ΔfH°(CH4) is not reported")
	}
}

// TestHintNamesPerturbedReaction moves each datum of a network of
// overlapping cycles (NIST-JANAF ΔfH° and exact sums of them) by 5 kJ/mol
// in turn: every failing cycle must name the moved reaction as the likely
// culprit, since it alone explains every residual.
func TestHintNamesPerturbedReaction(t *testing.T) {
	path := filepath.Join("..", "testdata", "cycles", "janaf-enthalpies.hess")
	src, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	if got := diagnosticsOf(Load(path, Disk{}, Options{}), "cycle-inconsistent"); len(got) != 0 {
		t.Fatalf("the JANAF data should close: %q", got)
	}
	line := regexp.MustCompile(`(?m)^reaction ([a-z0-9-]+):.*\{ dh (-?[0-9.]+) kJ/mol \}$`)
	matches := line.FindAllStringSubmatchIndex(string(src), -1)
	if len(matches) != 10 {
		t.Fatalf("found %d reactions, want 10", len(matches))
	}
	for _, m := range matches {
		name := string(src[m[2]:m[3]])
		v, _ := strconv.ParseFloat(string(src[m[4]:m[5]]), 64)
		moved := string(src[:m[4]]) + strconv.FormatFloat(v+5, 'f', 3, 64) + string(src[m[5]:])
		t.Run(name, func(t *testing.T) {
			n := loadText(t, moved)
			count := 0
			for _, d := range n.Diagnostics {
				if d.Code != "cycle-inconsistent" {
					continue
				}
				count++
				if want := fmt.Sprintf("likely culprit: %s (", name); !strings.HasPrefix(d.Detail, want) {
					t.Errorf("%s\n  detail %q, want it to start with %q", d.Message, d.Detail, want)
				}
				if want := "the other data give it " + strconv.FormatFloat(v, 'f', 2, 64) + " ± 0.00 kJ/mol"; !strings.Contains(d.Detail, want) {
					t.Errorf("detail %q lacks %q", d.Detail, want)
				}
			}
			if count == 0 {
				t.Error("no cycle-inconsistent diagnostic")
			}
		})
	}
}

// TestDeterminedSpeciesFit checks the fitted ΔfG° of water vapour in
// half-coefficients.hess, where four reactions with equal weight bear on
// it: with h = ΔfG°(H2O) and d = ΔfG°(CO2) − ΔfG°(CO), least squares over
// y1 = h, y2 = 2h, y3 = d, y4 = d − h gives
// h = (2/11)·(y1 + 2·y2 − y4 + (y3 + y4)/2) (worked out by hand).
func TestDeterminedSpeciesFit(t *testing.T) {
	n := Load(filepath.Join("..", "testdata", "cycles", "half-coefficients.hess"), Disk{}, Options{})
	y1, y2, y3 := -228582.0, -460164.0, -257226.0
	y4 := -5708.009502535258 * 5.018
	h := 2.0 / 11 * (y1 + 2*y2 - y4 + (y3+y4)/2)
	got := diagnosticsOf(n, "determined-species")
	want := fmt.Sprintf("ΔfG° of H2O(g) at 298.15 K is %s ± 0.00 kJ/mol, determined by water-half, water-two, co-burn and shift", kjText(h))
	if len(got) != 1 || got[0] != want+" (it has no data of its own)" {
		t.Errorf("got %q, want %q", got, want)
	}
}

// TestWegscheider checks a triangle of rate pairs without species data:
// the product of kf/kr around it is 0.5 exactly, so the cycle's ΣΔrG° is
// R·T·ln 2 at every temperature.
func TestWegscheider(t *testing.T) {
	src := `settings {
  temperatures 300 K, 1000 K
}
species a(g) { formula C4H8 }
species b(g) { formula C4H8 }
species c(g) { formula C4H8 }
reaction ab: a(g) <-> b(g) { rate A 1e13 1/s Ea 150 kJ/mol reverse A 1e13 1/s Ea 160 kJ/mol }
reaction bc: b(g) <-> c(g) { rate A 1e13 1/s Ea 140 kJ/mol reverse A 2e13 1/s Ea 145 kJ/mol }
reaction ca: c(g) <-> a(g) { rate A 1e13 1/s Ea 170 kJ/mol reverse A 1e13 1/s Ea 155 kJ/mol }
`
	n := loadText(t, src)
	for _, T := range []float64{300, 1000} {
		order, sums := cycleSums(t, n, quantity{T: T})
		if len(order) != 1 || order[0] != "ab + bc + ca" {
			t.Fatalf("cycles %q", order)
		}
		if want := 8.31446261815324 * T * math.Ln2; math.Abs(sums[order[0]][0]-want) > 1e-6 {
			t.Errorf("%g K: ΣΔrG° %.6f J/mol, want R·T·ln 2 = %.6f", T, sums[order[0]][0], want)
		}
	}
	got := diagnosticsOf(n, "cycle-inconsistent")
	if len(got) != 1 || !strings.Contains(got[0], "breaks the Wegscheider condition: the product of (kf/kr)^weight is 0.5 at 1000 K") ||
		!strings.Contains(got[0], "also misses zero at 1 more temperature") {
		t.Errorf("got %q", got)
	}
	// Consistent rates are not reported.
	fixed := strings.Replace(src, "reverse A 2e13 1/s Ea 145", "reverse A 1e13 1/s Ea 145", 1)
	if got := diagnosticsOf(loadText(t, fixed), "cycle-inconsistent"); len(got) != 0 {
		t.Errorf("consistent rates reported: %q", got)
	}
}

// bandNetwork writes n reactions, two per window of four neighbouring
// isomers: a chain in which every reaction depends on its neighbours.
func bandNetwork(n int) string {
	var b strings.Builder
	for i := 0; i < n/2+3; i++ {
		fmt.Fprintf(&b, "species s%d(g) { formula C4H10 }\n", i)
	}
	seed := uint64(7)
	next := func(k int) int {
		seed = seed*6364136223846793005 + 1442695040888963407
		return int((seed >> 33) % uint64(k))
	}
	for j := 0; j < n; j++ {
		w := j / 2
		a, c, d, e := w, w+1+next(3), w+2, w+3
		if c == d {
			d = w + 1
		}
		fmt.Fprintf(&b, "reaction r%d: s%d(g) + s%d(g) <-> s%d(g) + s%d(g)\n", j, a, c, d, e)
	}
	return b.String()
}

// TestCycleBasisStaysLocal checks that in a chain of reactions the basis
// is made of short cycles among neighbours, not of the long fundamental
// cycles that elimination in source order gives there (on this network 80
// reactions at most, 2463 in all). Every cycle must cancel species by
// species.
func TestCycleBasisStaysLocal(t *testing.T) {
	n := loadText(t, bandNetwork(200))
	m := n.Stoichiometry()
	cycles := m.CycleBasis(nil)
	if len(cycles) != 98 {
		t.Fatalf("%d cycles, want 98 (200 reactions of rank 102)", len(cycles))
	}
	total, longest := 0, 0
	for _, c := range cycles {
		total += len(c.Terms)
		longest = max(longest, len(c.Terms))
		sum := map[int]*big.Rat{}
		for _, term := range c.Terms {
			for _, e := range m.Columns[term.Column] {
				if sum[e.Row] == nil {
					sum[e.Row] = new(big.Rat)
				}
				sum[e.Row].Add(sum[e.Row], new(big.Rat).Mul(e.Coef, new(big.Rat).SetInt(term.Weight)))
			}
		}
		for row, v := range sum {
			if v.Sign() != 0 {
				t.Errorf("%s: %s does not cancel (%s)", c, m.Species[row].Key, v.RatString())
			}
		}
	}
	if longest > 16 || total > 500 {
		t.Errorf("cycles of up to %d reactions, %d in all; want at most 16 and 500", longest, total)
	}
}

// TestCycleWithVantHoffData: dh with one logk, and a fit of several logk,
// give ΔrG° at other temperatures, so a cycle through them is checked
// there. r1's ΔrG°(350 K) = ΔrH° − T·(ΔrH° − ΔrG°(298.15 K))/298.15 K.
func TestCycleWithVantHoffData(t *testing.T) {
	g0 := -8.31446261815324 * 298.15 * math.Ln10 * 1.0
	g1 := -10000 - 350*(-10000-g0)/298.15
	closing := -(g1 + 5000) / (8.31446261815324 * 350 * math.Ln10)
	src := func(logk3 float64) string {
		return fmt.Sprintf(`species xa(g) { formula C4H10 }
species xb(g) { formula C4H10 }
species xc(g) { formula C4H10 }
reaction r1: xa(g) <-> xb(g) { dh -10 kJ/mol logk 1.0 }
reaction r2: xb(g) <-> xc(g) { dh 5 kJ/mol ds 0 J/mol/K }
reaction r3: xa(g) <-> xc(g) { logk %.6f at 350 K logk %.6f at 360 K }
`, logk3, logk3)
	}
	if got := diagnosticsOf(loadText(t, src(closing)), "cycle-inconsistent"); len(got) != 0 {
		t.Errorf("a closing cycle reported: %q", got)
	}
	got := diagnosticsOf(loadText(t, src(closing-1)), "cycle-inconsistent")
	if len(got) != 1 || !strings.Contains(got[0], "cycle r1 + r2 - r3 does not close") {
		t.Errorf("a cycle off by log10 K = 1 at 350 K: %q", got)
	}
}
