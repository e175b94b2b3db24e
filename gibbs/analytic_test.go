package gibbs

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// The checks in this file compare with closed forms derived from the
// equilibrium conditions themselves (textbook algebra, no tabulated data).

func relClose(t *testing.T, what string, got, want, tol float64) {
	t.Helper()
	if d := math.Abs(got - want); d > tol*math.Abs(want) && d > 1e-300 {
		t.Errorf("%s = %.15g, want %.15g (relative error %.2g)", what, got, want, d/math.Abs(want))
	}
}

// amountClose compares an amount to a relative 1e-9 or, for amounts that
// are a difference of order-one numbers, to 1e-12 mol of the 1-mol feed.
func amountClose(t *testing.T, what string, got, want float64) {
	t.Helper()
	if d := math.Abs(got - want); d > 1e-9*math.Abs(want)+1e-12 {
		t.Errorf("%s = %.15g, want %.15g", what, got, want)
	}
}

func mustSolve(t *testing.T, p Problem, o Options) Result {
	t.Helper()
	r, err := Solve(p, o)
	if err != nil {
		t.Fatalf("Solve: %v", err)
	}
	if !r.Converged {
		t.Fatalf("not converged after %d iterations: residual %g, stationarity %g, N %v", r.Iterations, r.ElementResidual, r.Stationarity, r.N)
	}
	for j, v := range r.N {
		if v < 0 && !p.Species[j].Fixed {
			t.Fatalf("negative amount %g of %s", v, p.Species[j].Name)
		}
	}
	return r
}

func dense(rows [][]float64) *mat.Dense {
	m := mat.NewDense(len(rows), len(rows[0]), nil)
	for i, r := range rows {
		for j, v := range r {
			m.Set(i, j, v)
		}
	}
	return m
}

func gas() []Phase { return []Phase{{Name: "g", Kind: IdealGas}} }

func TestWaterGasShift(t *testing.T) {
	// CO + H2O ⇌ CO2 + H2 from 1 mol each: x = √K/(1+√K) of the CO becomes CO2.
	for _, K := range []float64{1e-6, 0.03, 0.5, 1, 4, 37, 1e5} {
		p := Problem{
			Phases: gas(),
			Species: []Species{
				{Name: "CO", Mu0: 0.2}, {Name: "H2O", Mu0: -0.4},
				{Name: "CO2", Mu0: 0.2 - 0.4 - math.Log(K) - 1.1}, {Name: "H2", Mu0: 1.1},
			},
			B: dense([][]float64{
				{1, 0, 1, 0}, // C
				{0, 2, 0, 2}, // H
				{1, 1, 2, 0}, // O
			}),
			N0:     []float64{1, 1, 0, 0},
			PRatio: 3,
		}
		r := mustSolve(t, p, Options{})
		x := math.Sqrt(K) / (1 + math.Sqrt(K))
		relClose(t, "CO2", r.N[2], x, 1e-9)
		relClose(t, "H2", r.N[3], x, 1e-9)
		relClose(t, "CO", r.N[0], 1-x, 1e-9)
		relClose(t, "H2O", r.N[1], 1-x, 1e-9)
	}
}

func TestDissociation(t *testing.T) {
	// A(g) ⇌ 2 B(g), 1 mol A: α = sqrt(K/(K + 4 P/p°)).
	for _, K := range []float64{1e-4, 0.2, 10} {
		for _, P := range []float64{0.01, 1, 30, 1000} {
			p := Problem{
				Phases:  gas(),
				Species: []Species{{Name: "A", Mu0: 0}, {Name: "B", Mu0: -math.Log(K) / 2}},
				B:       dense([][]float64{{2, 1}}),
				N0:      []float64{1, 0},
				PRatio:  P,
			}
			r := mustSolve(t, p, Options{})
			a := math.Sqrt(K / (K + 4*P))
			relClose(t, "A", r.N[0], 1-a, 1e-9)
			relClose(t, "B", r.N[1], 2*a, 1e-9)
		}
	}
}

// calcite builds CaCO3(s) ⇌ CaO(s) + CO2(g) with K = p_CO2/p° and an inert
// gas; species CaCO3, CaO, CO2, N2; rows Ca, C, O, N.
func calcite(K, P, n2 float64) Problem {
	return Problem{
		Phases: []Phase{{Name: "g", Kind: IdealGas}, {Name: "CaCO3(s)", Kind: Pure}, {Name: "CaO(s)", Kind: Pure}},
		Species: []Species{
			{Name: "CaCO3", Phase: 1, Mu0: -5},
			{Name: "CaO", Phase: 2, Mu0: -3},
			{Name: "CO2", Phase: 0, Mu0: -2 - math.Log(K)},
			{Name: "N2", Phase: 0, Mu0: 0.7},
		},
		B: dense([][]float64{
			{1, 1, 0, 0},
			{1, 0, 1, 0},
			{3, 1, 2, 0},
			{0, 0, 0, 2},
		}),
		N0:     []float64{1, 0, 0, n2},
		PRatio: P,
	}
}

func TestSolidDecomposition(t *testing.T) {
	// 1 mol CaCO3 and 1 mol N2 at P: with y = K/(P/p°), while both solids
	// coexist n_CO2 = y/(1-y) (≤ 1 mol, y ≤ 1/2); above, all CaCO3 is gone.
	const P = 2
	for _, y := range []float64{1e-30, 1e-6, 0.1, 0.3, 0.49, 0.4999999, 0.5, 0.5000001, 0.6, 0.9, 5} {
		r := mustSolve(t, calcite(y*P, P, 1), Options{})
		if y < 0.5 {
			c := y / (1 - y)
			relClose(t, "CO2", r.N[2], c, 1e-9)
			amountClose(t, "CaO", r.N[1], c)
			amountClose(t, "CaCO3", r.N[0], 1-c)
			if c > 1e-12 && (!r.PhasePresent[1] || !r.PhasePresent[2]) {
				t.Errorf("y=%g: both solids must be present: %v", y, r.PhasePresent)
			}
		} else {
			if r.N[0] != 0 {
				t.Errorf("y=%g: CaCO3 = %g, want exactly 0", y, r.N[0])
			}
			relClose(t, "CaO", r.N[1], 1, 1e-10)
			relClose(t, "CO2", r.N[2], 1, 1e-10)
		}
		relClose(t, "N2", r.N[3], 1, 1e-10)
	}
}

func TestGasPhaseVanishes(t *testing.T) {
	// Without an inert gas, below the decomposition pressure no gas phase
	// can exist: CaCO3 stays whole and CaO is exactly 0; above it, all decomposes.
	for _, tc := range []struct {
		K, P            float64
		caco3, cao, co2 float64
	}{
		{0.5, 1, 1, 0, 0},
		{1e-20, 10, 1, 0, 0},
		{2, 1, 0, 1, 1},
	} {
		p := calcite(tc.K, tc.P, 0)
		r := mustSolve(t, p, Options{})
		if r.N[0] != tc.caco3 || r.N[1] != tc.cao || math.Abs(r.N[2]-tc.co2) > 1e-12 {
			t.Errorf("K=%g P=%g: CaCO3 %g CaO %g CO2 %g, want %g %g %g", tc.K, tc.P, r.N[0], r.N[1], r.N[2], tc.caco3, tc.cao, tc.co2)
		}
		if r.N[3] != 0 || !r.Zero[3] {
			t.Errorf("N2 absent from the feed must be exactly 0 and marked: %g %v", r.N[3], r.Zero[3])
		}
		if (tc.co2 > 0) != r.PhasePresent[0] {
			t.Errorf("K=%g: gas present %v", tc.K, r.PhasePresent[0])
		}
	}
}

func TestTraceSpecies(t *testing.T) {
	// N2 + O2 ⇌ 2 NO with K = 1e-50 from 1 mol each: 2ξ/(1−ξ) = √K, so
	// n_NO = 2ξ ≈ 1e-25 mol, computed to full relative precision.
	for _, K := range []float64{1e-50, 1e-60, 1e-20} {
		p := Problem{
			Phases:  gas(),
			Species: []Species{{Name: "N2", Mu0: 0}, {Name: "O2", Mu0: 0}, {Name: "NO", Mu0: -math.Log(K) / 2}},
			B:       dense([][]float64{{2, 0, 1}, {0, 2, 1}}),
			N0:      []float64{1, 1, 0},
			PRatio:  1,
		}
		r := mustSolve(t, p, Options{})
		xi := math.Sqrt(K) / (2 + math.Sqrt(K))
		relClose(t, "NO", r.N[2], 2*xi, 1e-9)
	}
}

func TestForcedZero(t *testing.T) {
	// H2O splitting with a nitrogen species in the list but no N in the feed:
	// NH3 and N2 must be exactly 0, and the solve unaffected.
	p := Problem{
		Phases: gas(),
		Species: []Species{
			{Name: "H2O", Mu0: -20}, {Name: "H2", Mu0: 0}, {Name: "O2", Mu0: 0},
			{Name: "NH3", Mu0: -50}, {Name: "N2", Mu0: 0},
		},
		B:      dense([][]float64{{2, 2, 0, 3, 0}, {1, 0, 2, 0, 0}, {0, 0, 0, 1, 2}}),
		N0:     []float64{1, 0, 0, 0, 0},
		PRatio: 1,
	}
	r := mustSolve(t, p, Options{})
	if r.N[3] != 0 || r.N[4] != 0 || !r.Zero[3] || !r.Zero[4] {
		t.Errorf("N species: %g %g zero %v", r.N[3], r.N[4], r.Zero)
	}
	// 2 H2O ⇌ 2 H2 + O2 with K = e^-40, P = 1: n_H2 = 2 n_O2 = 2z, 4z³/((1-2z)²(1+z)) = K.
	z := math.Cbrt(math.Exp(-40) / 4)
	for i := 0; i < 50; i++ {
		f := 4*z*z*z - math.Exp(-40)*(1-2*z)*(1-2*z)*(1+z)
		df := 12*z*z - math.Exp(-40)*(-4*(1-2*z)*(1+z)+(1-2*z)*(1-2*z))
		z -= f / df
	}
	relClose(t, "O2", r.N[2], z, 1e-9)
	relClose(t, "H2", r.N[1], 2*z, 1e-9)
}

const mw = 0.01801528 // kg/mol, H2O (from IUPAC atomic weights, common practice)

// salt: MX(s) ⇌ M+(aq) + X−(aq), Ksp = m+·m−, in 1 kg of water.
func salt(Ksp, nSalt float64) Problem {
	return Problem{
		Phases: []Phase{{Name: "aq", Kind: Aqueous}, {Name: "MX(s)", Kind: Pure}},
		Species: []Species{
			{Name: "H2O", Phase: 0, Solvent: true, Mu0: -90},
			{Name: "M+", Phase: 0, Mu0: 3},
			{Name: "X-", Phase: 0, Mu0: -1},
			{Name: "MX", Phase: 1, Mu0: 2 + math.Log(Ksp)},
		},
		B: dense([][]float64{
			{2, 0, 0, 0},  // H
			{1, 0, 0, 0},  // O
			{0, 1, 0, 1},  // M
			{0, 0, 1, 1},  // X
			{0, 1, -1, 0}, // charge
		}),
		N0:               []float64{1 / mw, 0, 0, nSalt},
		PRatio:           1,
		SolventMolarMass: mw,
	}
}

func TestDissolution(t *testing.T) {
	// Saturated: m = √Ksp; undersaturated (all dissolves): m = n_salt; water
	// activity ln a_w = −M_w Σ m_j.
	for _, tc := range []struct{ Ksp, n float64 }{{0.01, 1}, {1e-12, 1}, {4, 1}, {0.25, 0.5}} {
		r := mustSolve(t, salt(tc.Ksp, tc.n), Options{})
		m := math.Min(math.Sqrt(tc.Ksp), tc.n)
		relClose(t, "M+", r.N[1], m, 1e-9)
		relClose(t, "X-", r.N[2], m, 1e-9)
		if m < tc.n {
			relClose(t, "MX", r.N[3], tc.n-m, 1e-9)
		} else if r.N[3] != 0 {
			t.Errorf("Ksp=%g: MX = %g, want exactly 0", tc.Ksp, r.N[3])
		}
		relClose(t, "ln a_w", r.LnActivity[0], -mw*2*m, 1e-9)
		relClose(t, "ln m", r.LnActivity[1], math.Log(m), 1e-9)
	}
}

func TestAqueousFreeEnergyConsistent(t *testing.T) {
	// F = Σ_solutes n_j(μ°_j + ln(n_j/(n_w M_w)) − 1) + n_w μ°_w: its
	// gradient (central differences) is the solver's potentials, and Euler's
	// theorem G = Σ n_j μ_j holds.
	mu0 := []float64{-90, 3, -1}
	n := []float64{50, 0.3, 0.2}
	F := func(n []float64) float64 {
		f := n[0] * mu0[0]
		for j := 1; j < 3; j++ {
			f += n[j] * (mu0[j] + math.Log(n[j]/(n[0]*mw)) - 1)
		}
		return f
	}
	want := []float64{
		mu0[0] - mw*(n[1]+n[2])/(n[0]*mw),
		mu0[1] + math.Log(n[1]/(n[0]*mw)),
		mu0[2] + math.Log(n[2]/(n[0]*mw)),
	}
	for j := range n {
		h := 1e-6 * n[j]
		up := append([]float64(nil), n...)
		dn := append([]float64(nil), n...)
		up[j] += h
		dn[j] -= h
		relClose(t, "dF/dn", (F(up)-F(dn))/(2*h), want[j], 1e-7)
	}
	euler := 0.0
	for j := range n {
		euler += n[j] * want[j]
	}
	relClose(t, "Euler", F(n), euler, 1e-12)
}

func TestLnGammaFixedPoint(t *testing.T) {
	// A ⇌ B in one solution phase with Margules activity coefficients
	// ln γ_A = W x_B², ln γ_B = W x_A²: at equilibrium
	// ln(x_B/x_A) + W(x_A² − x_B²) = μ°_A − μ°_B (solved here by bisection).
	const W, d = 1.5, 0.3
	p := Problem{
		Phases:  []Phase{{Name: "l", Kind: Solution}},
		Species: []Species{{Name: "A", Mu0: d}, {Name: "B", Mu0: 0}},
		B:       dense([][]float64{{1, 1}}),
		N0:      []float64{2, 0},
		PRatio:  1,
		LnGamma: func(n, out []float64) {
			xa := n[0] / (n[0] + n[1])
			out[0] = W * (1 - xa) * (1 - xa)
			out[1] = W * xa * xa
		},
	}
	r := mustSolve(t, p, Options{})
	lo, hi := 1e-12, 1-1e-12
	for i := 0; i < 200; i++ {
		x := (lo + hi) / 2
		if math.Log(x/(1-x))+W*((1-x)*(1-x)-x*x)-d > 0 {
			hi = x
		} else {
			lo = x
		}
	}
	relClose(t, "B", r.N[1], 2*(lo+hi)/2, 1e-9)
}

func TestFixedActivity(t *testing.T) {
	// CaO(s) open to CO2 at p/p°: CaCO3 forms wholly when p/p° > K (the
	// decomposition pressure), else none; the CO2 taken in is signed.
	const K = 0.05
	for _, tc := range []struct {
		p           float64
		caco3, cao  float64
		exchangeCO2 float64
	}{{0.5, 1, 0, 1}, {0.01, 0, 1, 0}} {
		prob := Problem{
			Phases: []Phase{{Name: "CaCO3(s)", Kind: Pure}, {Name: "CaO(s)", Kind: Pure}},
			Species: []Species{
				{Name: "CaCO3", Phase: 0, Mu0: -5},
				{Name: "CaO", Phase: 1, Mu0: -3},
				{Name: "CO2", Fixed: true, Mu0: -2 - math.Log(K) + math.Log(tc.p)},
			},
			B:      dense([][]float64{{1, 1, 0}, {1, 0, 1}, {3, 1, 2}}),
			N0:     []float64{0, 1, 0},
			PRatio: 1,
		}
		r := mustSolve(t, prob, Options{})
		if math.Abs(r.N[0]-tc.caco3) > 1e-12 || math.Abs(r.N[1]-tc.cao) > 1e-12 || math.Abs(r.N[2]-tc.exchangeCO2) > 1e-12 {
			t.Errorf("p=%g: CaCO3 %g CaO %g CO2 taken %g", tc.p, r.N[0], r.N[1], r.N[2])
		}
	}
}

func TestGasDissolves(t *testing.T) {
	// CO2(g) ⇌ CO2(aq) with K_H = m/(p/p°) over 1 kg of water with an inert
	// gas: n_aq = K_H·y·P·(kg water), y = n_g/(n_g + n_N2). With 1 mol CO2 and
	// 1 mol N2: n_aq = K_H P (1 − n_aq)/(2 − n_aq), a quadratic.
	const KH = 0.034 // invented magnitude, of the order of CO2 near 25 °C
	for _, P := range []float64{1, 10, 100} {
		p := Problem{
			Phases: []Phase{{Name: "g", Kind: IdealGas}, {Name: "aq", Kind: Aqueous}},
			Species: []Species{
				{Name: "CO2(g)", Phase: 0, Mu0: -50},
				{Name: "N2", Phase: 0, Mu0: -5},
				{Name: "H2O", Phase: 1, Solvent: true, Mu0: -95},
				{Name: "CO2(aq)", Phase: 1, Mu0: -50 - math.Log(KH)},
			},
			B: dense([][]float64{
				{1, 0, 0, 1}, // C
				{2, 0, 1, 2}, // O
				{0, 2, 0, 0}, // N
				{0, 0, 2, 0}, // H
			}),
			N0:               []float64{1, 1, 1 / mw, 0},
			PRatio:           P,
			SolventMolarMass: mw,
		}
		r := mustSolve(t, p, Options{})
		// a x² − b x + c = 0 from x(2 − x) = k(1 − x), k = K_H P.
		k := KH * P
		x := ((2 + k) - math.Sqrt((2+k)*(2+k)-4*k)) / 2
		relClose(t, "CO2(aq)", r.N[3], x, 1e-9)
		relClose(t, "CO2(g)", r.N[0], 1-x, 1e-9)
	}
}
