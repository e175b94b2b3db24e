package equilibrium

import (
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/mat"

	"hess/gibbs"
	"hess/lang"
	"hess/network"
	"hess/thermo"
)

// Basis is what the amounts of an equilibrium calculation may change along.
type Basis int

// Bases of an equilibrium calculation.
const (
	// BasisReactions: n = n₀ + N·ξ over the network's reactions whose
	// ΔrG°(T) is known, two-way and one-way alike: only what the network
	// says can happen may happen.
	BasisReactions Basis = iota
	// BasisElements: every species with data at T, constrained only by
	// element and charge conservation (full Gibbs minimisation).
	BasisElements
)

func (b Basis) String() string {
	if b == BasisElements {
		return "elements"
	}
	return "reactions"
}

// system is one equilibrium problem built from a network at T and P: the
// species taken part, their phases, μ°/RT, the conservation matrix and the
// element rows that measure the balance.
type system struct {
	species   []*network.Species
	index     map[*network.Species]int
	phaseName []string // per gibbs phase
	phaseKind []gibbs.PhaseKind
	reactions []*network.Reaction // of the basis (reactions basis only)
	problem   gibbs.Problem
	elemRows  [][]float64 // element and charge rows over species
	solvent   int         // index of the aqueous solvent, -1 without
	// adjusted reports that some μ°/RT were fitted to reactions' own ΔrG°
	// (the reactions basis with reaction data).
	adjusted bool
	// extrapolated are the species whose data were carried beyond their
	// range to T (see network.Species.EvaluableAt).
	extrapolated []*network.Species
}

// evaluable reports whether a species' data answer at T, inside their
// range or, for data without a stated range, beyond it.
func evaluable(sp *network.Species, T float64) bool {
	ok, _ := sp.EvaluableAt(T)
	return ok
}

// feedItem is one species of a feed with its amount, mol.
type feedItem struct {
	species *network.Species
	amount  float64
	span    lang.Span
}

// waterKey is the solvent of aqueous solutes.
const waterKey = "H2O(l)"

// usableSpecies reports whether a species can take part in an equilibrium
// calculation: a known phase and a formula (for the element balance).
func usableSpecies(sp *network.Species) bool {
	return sp != nil && sp.HasFormula && sp.Activity() != thermo.ActivityUnstated
}

// buildSystem assembles the problem at T (K) and P (Pa). Diagnostics name
// feed members that cannot take part; the system is nil with them. An
// error is a failure to build the reactions basis.
func buildSystem(net *network.Network, rc *rxCache, feed []feedItem, at lang.Span, T, P float64, basis Basis) (*system, lang.Diagnostics, error) {
	if diags := feedDiagnostics(feed, T); len(diags) > 0 {
		return nil, diags, nil
	}
	sys := &system{index: map[*network.Species]int{}, solvent: -1}
	for _, f := range feed {
		sys.add(f.species)
	}
	dg := sys.addBasis(net, rc, T, basis)
	sys, hasSolute, diags := sys.addSolvent(net, feed, at, basis)
	if len(diags) > 0 {
		return nil, diags, nil
	}
	sys.phases(hasSolute)
	if err := sys.conservation(rc, basis); err != nil {
		return nil, nil, err
	}
	sys.mu0(rc, T, dg)
	n0 := make([]float64, len(sys.species))
	for _, f := range feed {
		n0[sys.index[f.species]] += f.amount
	}
	sys.problem.N0 = n0
	sys.problem.PRatio = P / net.StandardPressure()
	sys.problem.SolventMolarMass = network.WaterMolarMass
	for _, sp := range sys.species {
		if _, extra := sp.EvaluableAt(T); extra {
			sys.extrapolated = append(sys.extrapolated, sp)
		}
	}
	return sys, nil, nil
}

// errorAt is an error diagnostic at span with a formatted message.
func errorAt(code lang.Code, span lang.Span, format string, args ...any) lang.Diagnostic {
	return lang.Diagnostic{Code: code, Severity: lang.Error, Subject: span, Message: fmt.Sprintf(format, args...)}
}

// feedDiagnostics names the feed members that cannot take part in an
// equilibrium at T: no formula or phase, or no data there.
func feedDiagnostics(feed []feedItem, T float64) lang.Diagnostics {
	var diags lang.Diagnostics
	for _, f := range feed {
		sp := f.species
		switch {
		case !usableSpecies(sp):
			diags = append(diags, errorAt("mixture-amount", f.span, "%s has no formula or no known phase, so it cannot take part in an equilibrium", sp.Key))
		case !evaluable(sp, T):
			diags = append(diags, errorAt("missing-thermo", f.span, "%s has no data at %s K%s, so the feed cannot be brought to equilibrium there", sp.Key, kelvin(T), spanText(sp)))
		}
	}
	return diags
}

// add takes a species into the system once, in order of first arrival.
func (sys *system) add(sp *network.Species) {
	if _, ok := sys.index[sp]; !ok {
		sys.index[sp] = len(sys.species)
		sys.species = append(sys.species, sp)
	}
}

// addBasis takes in the species the basis reaches at T: with the elements
// basis every usable species with data there; with the reactions basis the
// species of every reaction whose terms are usable and whose ΔrG° is
// finite at T, with the reaction itself. It returns ΔrG°/RT of the basis
// reactions (none with the elements basis).
func (sys *system) addBasis(net *network.Network, rc *rxCache, T float64, basis Basis) []float64 {
	var dg []float64
	switch basis {
	case BasisElements:
		for _, sp := range net.Species {
			if usableSpecies(sp) && evaluable(sp, T) {
				sys.add(sp)
			}
		}
	case BasisReactions:
		for _, rx := range net.Reactions {
			it := rc.get(rx)
			ok := it.ok
			for _, t := range it.terms {
				if !usableSpecies(t.species) {
					ok = false
				}
			}
			if !ok {
				continue
			}
			g := it.deltaG(T)
			if math.IsNaN(g) || math.IsInf(g, 0) {
				continue
			}
			for _, t := range it.terms {
				sys.add(t.species)
			}
			sys.reactions = append(sys.reactions, rx)
			dg = append(dg, g/(thermo.R*T))
		}
	}
	return dg
}

// addSolvent takes in water when the system holds aqueous solutes, which
// need it as their solvent. Without usable water the elements basis leaves
// the solutes that are not fed out (the system returned is then a new one),
// and diagnostics name the fed solutes, or at at when only the reactions
// brought solutes in. It reports whether the system still holds solutes.
func (sys *system) addSolvent(net *network.Network, feed []feedItem, at lang.Span, basis Basis) (*system, bool, lang.Diagnostics) {
	water := net.LookupSpecies(waterKey)
	hasSolute := false
	for _, sp := range sys.species {
		if sp.Activity() == thermo.ActivitySolute {
			hasSolute = true
		}
	}
	if !hasSolute {
		return sys, false, nil
	}
	if water != nil && usableSpecies(water) {
		sys.add(water)
		return sys, true, nil
	}
	if basis == BasisElements {
		// Leave the solutes out: without water they have no phase.
		sys = dropSolutes(sys, feed)
		hasSolute = false
	}
	var diags lang.Diagnostics
	for _, f := range feed {
		if f.species.Activity() == thermo.ActivitySolute {
			diags = append(diags, errorAt("missing-thermo", f.span, "%s is a solute, and the network has no %s with data to dissolve it in", f.species.Key, waterKey))
		}
	}
	if hasSolute && len(diags) == 0 {
		diags = append(diags, errorAt("missing-thermo", at, "the reactions bring aqueous solutes in, and the network has no %s to dissolve them in", waterKey))
	}
	return sys, hasSolute, diags
}

// dropSolutes removes the aqueous solutes that are not fed.
func dropSolutes(sys *system, feed []feedItem) *system {
	fed := map[*network.Species]bool{}
	for _, f := range feed {
		fed[f.species] = true
	}
	out := &system{index: map[*network.Species]int{}, solvent: -1}
	for _, sp := range sys.species {
		if sp.Activity() == thermo.ActivitySolute && !fed[sp] {
			continue
		}
		out.index[sp] = len(out.species)
		out.species = append(out.species, sp)
	}
	return out
}

// phases assigns each species its gibbs phase: one ideal-gas phase for
// every gas, one phase per pure species, one per solution tag, and the
// aqueous phase of the solutes with water as solvent.
func (sys *system) phases(aqueous bool) {
	byName := map[string]int{}
	phase := func(name string, kind gibbs.PhaseKind) int {
		if k, ok := byName[name]; ok {
			return k
		}
		byName[name] = len(sys.phaseName)
		sys.phaseName = append(sys.phaseName, name)
		sys.phaseKind = append(sys.phaseKind, kind)
		sys.problem.Phases = append(sys.problem.Phases, gibbs.Phase{Name: name, Kind: kind})
		return byName[name]
	}
	sys.problem.Species = make([]gibbs.Species, len(sys.species))
	for j, sp := range sys.species {
		g := gibbs.Species{Name: sp.Key}
		switch a := sp.Activity(); {
		case a == thermo.ActivityGas:
			g.Phase = phase("g", gibbs.IdealGas)
		case a == thermo.ActivitySolute:
			g.Phase = phase("aq", gibbs.Aqueous)
		case a == thermo.ActivitySolution:
			g.Phase = phase(sp.Phase.Tag, gibbs.Solution)
		case aqueous && sp.Key == waterKey:
			g.Phase = phase("aq", gibbs.Aqueous)
			g.Solvent = true
			sys.solvent = j
		default:
			g.Phase = phase(sp.Key, gibbs.Pure)
		}
		sys.problem.Species[j] = g
	}
}

// conservation builds the element (and charge) rows, and the problem's
// conservation matrix: those rows, or a basis of the left null space of the
// reactions' stoichiometric matrix.
func (sys *system) conservation(rc *rxCache, basis Basis) error {
	s := len(sys.species)
	var symbols []string
	seen := map[string]bool{}
	charged := false
	for _, sp := range sys.species {
		for _, e := range sp.Formula.Elements {
			if !seen[e.Symbol] {
				seen[e.Symbol] = true
				symbols = append(symbols, e.Symbol)
			}
		}
		if sp.Charge != 0 {
			charged = true
		}
	}
	sort.Strings(symbols)
	for _, sym := range symbols {
		row := make([]float64, s)
		for j, sp := range sys.species {
			row[j], _ = sp.Formula.Count(sym).Float64()
		}
		sys.elemRows = append(sys.elemRows, row)
	}
	if charged {
		row := make([]float64, s)
		for j, sp := range sys.species {
			row[j] = float64(sp.Charge)
		}
		sys.elemRows = append(sys.elemRows, row)
	}
	if basis == BasisElements {
		B := mat.NewDense(max(len(sys.elemRows), 1), s, nil)
		for i, row := range sys.elemRows {
			B.SetRow(i, row)
		}
		sys.problem.B = B
		return nil
	}
	if B := rc.reactionsBasis(sys.species, sys.reactions); B != nil {
		sys.problem.B = B
		return nil
	}
	N := mat.NewDense(s, max(len(sys.reactions), 1), nil)
	for r, rx := range sys.reactions {
		for _, t := range rc.get(rx).terms {
			j := sys.index[t.species]
			N.Set(j, r, N.At(j, r)+t.nu)
		}
	}
	if len(sys.reactions) == 0 {
		N = nil
	}
	var B *mat.Dense
	var err error
	if N == nil {
		B = mat.NewDense(s, s, nil)
		for j := 0; j < s; j++ {
			B.Set(j, j, 1)
		}
	} else if B, err = gibbs.ReactionsConservation(N); err != nil {
		return fmt.Errorf("reactions basis: %w", err)
	}
	rc.keepBasis(sys.species, sys.reactions, B)
	sys.problem.B = B
	return nil
}

// mu0 sets each species' μ°/RT at T. Species with data at T take
// (H° − T S°)/RT of their own model (gases at the network's standard
// pressure, solutes at 1 mol/kg). In the reactions basis only Nᵀμ° (each
// reaction's ΔrG°/RT) decides the answer; where a reaction's ΔrG° comes
// from its own data rather than its species' (or a species has no data at
// T), μ° is moved the least, in the least-squares sense, to satisfy
// Nᵀμ° = ΔrG°/RT: species with data are weighted 1, species without 10⁻⁸,
// so that they take up the difference. Any two solutions differ by a
// vector the conservation rows annul, which changes no amount.
func (sys *system) mu0(rc *rxCache, T float64, dg []float64) {
	s := len(sys.species)
	mu := make([]float64, s)
	known := make([]bool, s)
	for j, sp := range sys.species {
		if evaluable(sp, T) {
			mu[j] = sp.Model().G(T) / (thermo.R * T)
			known[j] = true
		}
	}
	if len(sys.reactions) > 0 {
		r := len(sys.reactions)
		res := make([]float64, r)
		need := false
		for k, rx := range sys.reactions {
			sum := 0.0
			for _, t := range rc.get(rx).terms {
				j := sys.index[t.species]
				if !known[j] {
					need = true
				}
				sum += t.nu * mu[j]
			}
			res[k] = dg[k] - sum
			if math.Abs(res[k]) > 1e-12*(1+math.Abs(dg[k])) {
				need = true
			}
		}
		if need {
			sys.adjusted = true
			// Weighted minimum-norm δ with Nᵀδ = res: δ = D z, z the
			// minimum-norm solution of (Nᵀ D) z = res.
			A := mat.NewDense(r, s, nil)
			d := make([]float64, s)
			for j := range d {
				d[j] = 1
				if !known[j] {
					d[j] = 1e4
				}
			}
			for k, rx := range sys.reactions {
				for _, t := range rc.get(rx).terms {
					j := sys.index[t.species]
					A.Set(k, j, A.At(k, j)+t.nu*d[j])
				}
			}
			if z, ok := minNorm(A, res); ok {
				for j := range mu {
					mu[j] += d[j] * z[j]
				}
			}
		}
	}
	for j := range mu {
		sys.problem.Species[j].Mu0 = mu[j]
	}
}

// minNorm solves A z = b (rows ≤ columns or rank deficient) for the z of
// least norm by the singular value decomposition.
func minNorm(A *mat.Dense, b []float64) ([]float64, bool) {
	var svd mat.SVD
	if !svd.Factorize(A, mat.SVDThin) {
		return nil, false
	}
	var u, v mat.Dense
	svd.UTo(&u)
	svd.VTo(&v)
	sv := svd.Values(nil)
	if len(sv) == 0 {
		return nil, false
	}
	tol := 1e-12 * sv[0]
	_, c := A.Dims()
	z := make([]float64, c)
	rows, _ := u.Dims()
	for k, sigma := range sv {
		if sigma <= tol {
			continue
		}
		dot := 0.0
		for i := 0; i < rows; i++ {
			dot += u.At(i, k) * b[i]
		}
		coef := dot / sigma
		for j := 0; j < c; j++ {
			z[j] += coef * v.At(j, k)
		}
	}
	return z, true
}

// kelvin prints a temperature for a message.
func kelvin(T float64) string { return fmt.Sprintf("%.6g", T) }

// spanText is " (its data cover A–B K)" for a species with data.
func spanText(sp *network.Species) string {
	lo, hi, ok := sp.DataSpan()
	if !ok {
		return " (it has no temperature model)"
	}
	return fmt.Sprintf(" (its data cover %s–%s K)", kelvin(lo), kelvin(hi))
}
