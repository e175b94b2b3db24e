package equilibrium

import (
	"errors"
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/mat"

	"hess/aqueous"
	"hess/gibbs"
	"hess/network"
	"hess/thermo"
)

// WaterMolarMass is M_w of H2O in kg/mol (CIAAW 2021 conventional atomic
// weights: 2 × 1.008 + 15.999 g/mol, derived; 18.015 g/mol).
const WaterMolarMass = 0.018015

// AqueousSystem is an aqueous equilibrium problem in a network's terms: a
// mass of water with what is fed into it, gases held at fixed partial
// pressures (an open system), at one temperature and pressure.
type AqueousSystem struct {
	T float64 // K
	// P is the total pressure in Pa, for a gas phase that may form (not for
	// the fixed gases, which have their own); 0 means the network's p°.
	P float64
	// WaterKg is the mass of water, kg (> 0).
	WaterKg float64
	// Feed is the amount of each other species fed, mol (≥ 0): solutes,
	// minerals, gases. Water is WaterKg; an entry for water adds to it.
	Feed map[*network.Species]float64
	// Fixed holds gases at partial pressures, Pa.
	Fixed map[*network.Species]float64
	// Candidates are the species the equilibrium may hold besides those
	// fed; nil means every species of the network made only of the
	// elements fed: aq solutes, pure solids and liquids, gases.
	Candidates []*network.Species
}

// AqueousResult is an aqueous equilibrium: the solution's speciation, its
// pH, ionic strength and activity coefficients, each mineral's saturation
// and what the fixed gases exchanged.
type AqueousResult struct {
	T, P    float64 // K, Pa
	Model   string  // the activity model
	WaterKg float64 // water at equilibrium, kg
	// PH is −log10 a(H+) (NaN without H+(aq) among the species).
	PH float64
	// I is the ionic strength, mol/kg; Beyond that it exceeds the
	// activity model's range of validity.
	I             float64
	Beyond        bool
	WaterActivity float64
	Solutes       []AqueousSpecies
	Minerals      []MineralSaturation
	Gases         []GasAmount // a gas phase that formed, and the fixed gases
	// Skipped are candidates left out for lack of data at T.
	Skipped []*network.Species
	// Converged reports whether the solver met its tolerances;
	// Iterations and ElementResidual are the solver's.
	Converged       bool
	Iterations      int
	ElementResidual float64
}

// AqueousSpecies is one solute at equilibrium.
type AqueousSpecies struct {
	Species  *network.Species
	Amount   float64 // mol
	Molality float64 // mol/kg of water
	Gamma    float64 // activity coefficient (molality scale)
	// LogActivity is log10 a = log10(γ m/(1 mol/kg)); -Inf when absent.
	LogActivity float64
}

// MineralSaturation is a pure phase's amount and saturation index
// SI = log10(Q/K) of its dissolution, 0 where it is present at equilibrium
// and below 0 where it is absent (undersaturated).
type MineralSaturation struct {
	Species *network.Species
	Amount  float64 // mol present at equilibrium
	Present bool
	SI      float64
}

// GasAmount is a gas at equilibrium: in a gas phase (Amount, mol) or held
// fixed (Taken: the signed amount drawn from the reservoir, mol).
type GasAmount struct {
	Species  *network.Species
	Fixed    bool
	Pressure float64 // partial pressure, Pa
	Amount   float64
	Taken    float64
}

// Solute returns the result for one solute, or false.
func (r *AqueousResult) Solute(sp *network.Species) (AqueousSpecies, bool) {
	for _, s := range r.Solutes {
		if s.Species == sp {
			return s, true
		}
	}
	return AqueousSpecies{}, false
}

// Mineral returns the saturation of one pure phase, or false.
func (r *AqueousResult) Mineral(sp *network.Species) (MineralSaturation, bool) {
	for _, m := range r.Minerals {
		if m.Species == sp {
			return m, true
		}
	}
	return MineralSaturation{}, false
}

// ErrAqueous wraps every error about an aqueous system that cannot be set up.
var ErrAqueous = errors.New("aqueous equilibrium")

// maxAqueousSpecies bounds the species of one problem.
const maxAqueousSpecies = 4096

// species roles in the problem
type aqRole int

const (
	roleWater aqRole = iota
	roleSolute
	rolePure
	roleGas
	roleFixed
)

type aqSpecies struct {
	sp   *network.Species
	role aqRole
	mu0  float64 // μ°/RT
}

// SolveAqueous finds the equilibrium of an aqueous system by minimising its
// Gibbs energy (package gibbs) over water, the solutes, the pure phases and
// a gas phase, with element and charge balances, the fixed gases held at
// their partial pressures, and the network's activity model for the
// solutes' γ (iterated to a fixed point) and water's activity. Each
// species' μ°(T) comes from its data (Species.StandardGibbs); a species
// without data gets it from a two-way reaction whose ΔrG°(T) is known and
// whose other species have it (repeatedly, so chains of reactions with
// logk serve). Candidates that still lack it are skipped and listed.
func SolveAqueous(n *network.Network, sys AqueousSystem) (*AqueousResult, error) {
	if !(sys.T > 0) || math.IsInf(sys.T, 0) {
		return nil, fmt.Errorf("%w: temperature %g K", ErrAqueous, sys.T)
	}
	if !(sys.WaterKg > 0) || math.IsInf(sys.WaterKg, 0) {
		return nil, fmt.Errorf("%w: no water: the solution needs H2O(l) as its solvent", ErrAqueous)
	}
	p0 := n.StandardPressure()
	P := sys.P
	if P == 0 {
		P = p0
	}
	if !(P > 0) || math.IsInf(P, 0) {
		return nil, fmt.Errorf("%w: pressure %g Pa", ErrAqueous, P)
	}
	model := n.ActivityModel()
	var params aqueous.Params
	if _, ideal := model.(aqueous.Ideal); !ideal {
		p, err := aqueous.ParamsAt(sys.T)
		if err != nil {
			return nil, fmt.Errorf("%w: the %s activity model: %v", ErrAqueous, model.Name(), err)
		}
		params = p
	}
	water := findWater(n)
	if water == nil {
		return nil, fmt.Errorf("%w: the network declares no H2O(l)", ErrAqueous)
	}
	set, err := aqueousSpecies(n, sys, water)
	if err != nil {
		return nil, err
	}
	skipped := assignMu0(n, set, sys.T)
	var kept []aqSpecies
	for _, s := range set {
		if !math.IsNaN(s.mu0) {
			kept = append(kept, s)
		}
	}
	if len(kept) == 0 || kept[0].role != roleWater {
		return nil, fmt.Errorf("%w: H2O(l) has no data at %s", ErrAqueous, kelvinString(sys.T))
	}
	for i := range kept {
		if kept[i].role == roleFixed {
			kept[i].mu0 += math.Log(sys.Fixed[kept[i].sp] / p0)
		}
	}
	for _, sp := range skipped {
		if _, fixed := sys.Fixed[sp]; fixed || sys.Feed[sp] > 0 {
			return nil, fmt.Errorf("%w: %s is fed or held fixed but has no data at %s (neither its own nor through a reaction)",
				ErrAqueous, sp.Key, kelvinString(sys.T))
		}
	}
	prob, err := buildProblem(kept, sys, P/p0)
	if err != nil {
		return nil, err
	}
	hook := gammaHook(kept, model, params)
	if hook != nil {
		prob.LnGamma = func(nn, out []float64) { hook(nn, out, nil) }
	}
	res, err := gibbs.Solve(prob, gibbs.Options{})
	if err != nil {
		return nil, fmt.Errorf("%w: %v", ErrAqueous, err)
	}
	return aqueousResult(kept, prob, res, sys, P, p0, model, params, skipped), nil
}

// AqueousFromMixture reads a mixture as an aqueous system: 1 kg of the
// water it lists, each solute's molality as mol in that kilogram, each
// pure phase it lists present (1 mol, an excess for most demos), its fixed
// gases at their partial pressures and its temperature and pressure.
func AqueousFromMixture(n *network.Network, m *network.Mixture) (AqueousSystem, error) {
	if !m.Usable() {
		return AqueousSystem{}, fmt.Errorf("%w: mixture %s has mistakes", ErrAqueous, m.Name)
	}
	sys := AqueousSystem{T: m.Temperature.V, Feed: map[*network.Species]float64{}, Fixed: map[*network.Species]float64{}}
	if m.Pressure != nil {
		sys.P = m.Pressure.V
	}
	for i := range m.Members {
		mm := &m.Members[i]
		switch {
		case mm.Species.IsWater():
			sys.WaterKg = 1
		case mm.Fixed && mm.Kind == network.AmountPartialPressure:
			sys.Fixed[mm.Species] = mm.Amount.V
		case mm.Kind == network.AmountMolality:
			sys.Feed[mm.Species] += mm.Amount.V // mol in 1 kg
		case mm.Kind == network.AmountPresent:
			sys.Feed[mm.Species] += 1
		default:
			return AqueousSystem{}, fmt.Errorf("%w: mixture %s: %s is neither water, a solute, a pure phase nor a fixed gas", ErrAqueous, m.Name, mm.Species.Key)
		}
	}
	if sys.WaterKg == 0 {
		return AqueousSystem{}, fmt.Errorf("%w: mixture %s lists no H2O(l)", ErrAqueous, m.Name)
	}
	return sys, nil
}

func findWater(n *network.Network) *network.Species {
	for _, sp := range n.Species {
		if sp.IsWater() {
			return sp
		}
	}
	return nil
}

// aqueousSpecies lists the problem's species, water first: the fed and
// fixed species, and the candidates made only of the elements present.
func aqueousSpecies(n *network.Network, sys AqueousSystem, water *network.Species) ([]aqSpecies, error) {
	role := func(sp *network.Species) (aqRole, bool) {
		if _, fixed := sys.Fixed[sp]; fixed {
			return roleFixed, true
		}
		switch sp.Activity() {
		case thermo.ActivitySolute:
			if sp.Phase.Tag != "aq" {
				return 0, false
			}
			return roleSolute, true
		case thermo.ActivityPureSolid, thermo.ActivityPureLiquid:
			if sp == water {
				return roleWater, true
			}
			return rolePure, true
		case thermo.ActivityGas:
			return roleGas, true
		}
		return 0, false
	}
	out := []aqSpecies{{sp: water, role: roleWater}}
	seen := map[*network.Species]bool{water: true}
	elements := map[string]bool{"H": true, "O": true}
	add := func(sp *network.Species, must bool) error {
		if seen[sp] {
			return nil
		}
		r, ok := role(sp)
		if !ok || !sp.HasFormula || sp.Parts.Electron {
			if must {
				return fmt.Errorf("%w: %s cannot take part in an aqueous equilibrium (its phase is not aq, a pure phase or a gas)", ErrAqueous, sp.Key)
			}
			return nil
		}
		if len(out) >= maxAqueousSpecies {
			return fmt.Errorf("%w: more than %d species", ErrAqueous, maxAqueousSpecies)
		}
		seen[sp] = true
		out = append(out, aqSpecies{sp: sp, role: r})
		return nil
	}
	var fed []*network.Species
	for sp, amt := range sys.Feed {
		if math.IsNaN(amt) || amt < 0 || math.IsInf(amt, 0) {
			return nil, fmt.Errorf("%w: feed of %s is %g mol", ErrAqueous, sp.Key, amt)
		}
		if sp != water {
			fed = append(fed, sp)
		}
	}
	for sp, p := range sys.Fixed {
		if sp.Activity() != thermo.ActivityGas {
			return nil, fmt.Errorf("%w: %s is held fixed but is not a gas", ErrAqueous, sp.Key)
		}
		if !(p > 0) || math.IsInf(p, 0) {
			return nil, fmt.Errorf("%w: fixed partial pressure of %s is %g Pa", ErrAqueous, sp.Key, p)
		}
		fed = append(fed, sp)
	}
	sort.Slice(fed, func(i, j int) bool { return fed[i].Key < fed[j].Key })
	for _, sp := range fed {
		if err := add(sp, true); err != nil {
			return nil, err
		}
		for _, ec := range sp.Formula.Elements {
			elements[ec.Symbol] = true
		}
	}
	candidates := sys.Candidates
	if candidates == nil {
		candidates = n.Species
	}
	for _, sp := range candidates {
		if !sp.HasFormula || sp.Parts.Electron {
			continue
		}
		inside := true
		for _, ec := range sp.Formula.Elements {
			if !elements[ec.Symbol] {
				inside = false
				break
			}
		}
		if inside {
			if err := add(sp, false); err != nil {
				return nil, err
			}
		}
	}
	return out, nil
}

// assignMu0 sets μ°/RT of every species from its data, then from the
// reactions whose ΔrG° is known at T and whose other species have μ°; the
// rest get NaN and are returned.
func assignMu0(n *network.Network, set []aqSpecies, T float64) []*network.Species {
	// Two scales give Σ ν μ° = ΔrG° for every balanced reaction: G° = H° −
	// T·S° at any T, and ΔfG° at 298.15 K. Each species' data place it on
	// one or both; the scale that places more of them is used.
	scales := []func(*network.Species) (float64, bool){
		func(sp *network.Species) (float64, bool) { return sp.StandardGibbs(T) },
	}
	if thermo.AtT298(T) {
		scales = append(scales, func(sp *network.Species) (float64, bool) { return sp.FormationGibbs() })
	}
	var best []*network.Species
	var bestMu []float64
	for _, g := range scales {
		mu := make([]float64, len(set))
		skipped := derivedMu0(n, set, T, g, mu)
		if bestMu == nil || len(skipped) < len(best) {
			best, bestMu = skipped, mu
		}
	}
	for i := range set {
		set[i].mu0 = bestMu[i]
	}
	return best
}

// derivedMu0 fills mu with μ°/RT of every species on the scale g gives,
// then from the reactions whose ΔrG° is known at T and whose other species
// have μ°; the rest get NaN and are returned.
func derivedMu0(n *network.Network, set []aqSpecies, T float64, g func(*network.Species) (float64, bool), mu []float64) []*network.Species {
	RT := thermo.R * T
	index := map[*network.Species]int{}
	for i := range set {
		index[set[i].sp] = i
		mu[i] = math.NaN()
		if v, ok := g(set[i].sp); ok {
			mu[i] = v / RT
		}
	}
	// Derived: each pass assigns the species that one reaction leaves as its
	// only unknown. Reactions whose species are all known are left alone.
	derived := map[*network.Species]float64{}
	known := func(sp *network.Species) (float64, bool) {
		if i, ok := index[sp]; ok && !math.IsNaN(mu[i]) {
			return mu[i] * RT, true
		}
		if v, ok := derived[sp]; ok {
			return v, true
		}
		return g(sp)
	}
	for pass := 0; pass <= len(n.Reactions); pass++ {
		progress := false
		for _, rx := range n.Reactions {
			if !rx.Resolved || !rx.TwoWay {
				continue
			}
			var unknown *network.Species
			var nuUnknown float64
			sum, count := 0.0, 0
			for _, t := range rx.NetTerms() {
				nu, _ := t.Nu.Float64()
				if v, ok := known(t.Species); ok {
					sum += nu * v
					continue
				}
				count++
				unknown, nuUnknown = t.Species, nu
			}
			if count != 1 {
				continue
			}
			row := n.ReactionK(rx).Row(T)
			if !row.Valid || math.IsNaN(row.DG) {
				continue
			}
			derived[unknown] = (row.DG - sum) / nuUnknown
			if i, ok := index[unknown]; ok {
				mu[i] = derived[unknown] / RT
			}
			progress = true
		}
		if !progress {
			break
		}
	}
	var skipped []*network.Species
	for i, s := range set {
		if math.IsNaN(mu[i]) {
			skipped = append(skipped, s.sp)
		}
	}
	return skipped
}

// buildProblem sets up the Gibbs minimisation: phases (aqueous, each pure
// phase, one gas phase), element and charge rows, the feed.
func buildProblem(set []aqSpecies, sys AqueousSystem, pRatio float64) (gibbs.Problem, error) {
	elemIndex := map[string]int{}
	var rows []string
	for _, s := range set {
		for _, ec := range s.sp.Formula.Elements {
			if _, ok := elemIndex[ec.Symbol]; !ok {
				elemIndex[ec.Symbol] = len(rows)
				rows = append(rows, ec.Symbol)
			}
		}
	}
	charged := false
	for _, s := range set {
		if s.sp.Charge != 0 {
			charged = true
		}
	}
	if charged {
		rows = append(rows, "charge")
	}
	B := mat.NewDense(len(rows), len(set), nil)
	prob := gibbs.Problem{PRatio: pRatio, SolventMolarMass: WaterMolarMass, N0: make([]float64, len(set))}
	prob.Phases = []gibbs.Phase{{Name: "aq", Kind: gibbs.Aqueous}}
	gasPhase := -1
	for j, s := range set {
		for _, ec := range s.sp.Formula.Elements {
			v, _ := ec.Count.Float64()
			B.Set(elemIndex[ec.Symbol], j, v)
		}
		if charged {
			B.Set(len(rows)-1, j, float64(s.sp.Charge))
		}
		g := gibbs.Species{Name: s.sp.Key, Mu0: s.mu0}
		switch s.role {
		case roleWater:
			g.Phase, g.Solvent = 0, true
		case roleSolute:
			g.Phase = 0
		case rolePure:
			g.Phase = len(prob.Phases)
			prob.Phases = append(prob.Phases, gibbs.Phase{Name: s.sp.Key, Kind: gibbs.Pure})
		case roleGas:
			if gasPhase < 0 {
				gasPhase = len(prob.Phases)
				prob.Phases = append(prob.Phases, gibbs.Phase{Name: "gas", Kind: gibbs.IdealGas})
			}
			g.Phase = gasPhase
		case roleFixed:
			g.Fixed = true
		}
		prob.Species = append(prob.Species, g)
		if s.role != roleFixed {
			prob.N0[j] = sys.Feed[s.sp]
		}
	}
	prob.N0[0] += sys.WaterKg / WaterMolarMass
	prob.B = B
	if charged {
		q := 0.0
		for j, s := range set {
			q += float64(s.sp.Charge) * prob.N0[j]
		}
		if math.Abs(q) > 1e-12*sumFeed(prob.N0) {
			return prob, fmt.Errorf("%w: the feed carries a net charge of %g mol: a solution is neutral", ErrAqueous, q)
		}
	}
	return prob, nil
}

func sumFeed(n0 []float64) float64 {
	s := 0.0
	for _, v := range n0 {
		s += v
	}
	return s
}

// gammaHook returns the activity-coefficient evaluation for the solver, or
// nil under the ideal model. It writes ln γ of every solute and, for water,
// ln of its activity over the ideal-dilute one; when I is non-nil it also
// stores the ionic strength there.
func gammaHook(set []aqSpecies, model aqueous.Model, p aqueous.Params) func(n, out []float64, I *float64) {
	if _, ideal := model.(aqueous.Ideal); ideal {
		return nil
	}
	var idx []int
	for j, s := range set {
		if s.role == roleSolute {
			idx = append(idx, j)
		}
	}
	solutes := make([]aqueous.Solute, len(idx))
	return func(n, out []float64, Iout *float64) {
		kg := n[0] * WaterMolarMass
		if !(kg > 0) {
			return
		}
		sum := 0.0
		for k, j := range idx {
			solutes[k] = set[j].sp.SoluteOf(n[j] / kg)
			sum += solutes[k].Molality
		}
		I := aqueous.IonicStrength(solutes)
		if Iout != nil {
			*Iout = I
		}
		for k, j := range idx {
			out[j] = math.Ln10 * aqueous.LogGamma(model, solutes[k], I, p)
		}
		w := aqueous.WaterActivity(model, solutes, p)
		if w.Activity > 0 {
			out[0] = math.Log(w.Activity) + WaterMolarMass*sum
		}
	}
}

func aqueousResult(set []aqSpecies, prob gibbs.Problem, res gibbs.Result, sys AqueousSystem,
	P, p0 float64, model aqueous.Model, params aqueous.Params, skipped []*network.Species) *AqueousResult {
	out := &AqueousResult{T: sys.T, P: P, Model: model.Name(), PH: math.NaN(), Skipped: skipped,
		Converged: res.Converged, Iterations: res.Iterations, ElementResidual: res.ElementResidual}
	kg := res.N[0] * WaterMolarMass
	out.WaterKg = kg
	lnGamma := make([]float64, len(set))
	if hook := gammaHook(set, model, params); hook != nil {
		hook(res.N, lnGamma, &out.I)
	} else {
		var solutes []aqueous.Solute
		for j, s := range set {
			if s.role == roleSolute && kg > 0 {
				solutes = append(solutes, s.sp.SoluteOf(res.N[j]/kg))
			}
		}
		out.I = aqueous.IonicStrength(solutes)
	}
	out.Beyond = aqueous.Exceeds(model, out.I)
	out.WaterActivity = math.Exp(res.LnActivity[0])
	m, _ := prob.B.Dims()
	for j, s := range set {
		switch s.role {
		case roleSolute:
			mol := 0.0
			if kg > 0 {
				mol = res.N[j] / kg
			}
			a := AqueousSpecies{Species: s.sp, Amount: res.N[j], Molality: mol, Gamma: math.Exp(lnGamma[j]),
				LogActivity: res.LnActivity[j] / math.Ln10}
			out.Solutes = append(out.Solutes, a)
			if s.sp.Key == "H+(aq)" && !math.IsInf(a.LogActivity, 0) {
				out.PH = -a.LogActivity
			}
		case rolePure:
			// SI = log10(Q/K) of the dissolution = (Σ_i B_ik λ_i − μ°_k)/ln 10.
			dot := 0.0
			for i := 0; i < m; i++ {
				dot += prob.B.At(i, j) * res.Potentials[i]
			}
			si := (dot - s.mu0) / math.Ln10
			present := res.N[j] > 0
			out.Minerals = append(out.Minerals, MineralSaturation{Species: s.sp, Amount: res.N[j], Present: present, SI: si})
		case roleGas:
			if res.N[j] > 0 {
				out.Gases = append(out.Gases, GasAmount{Species: s.sp, Amount: res.N[j],
					Pressure: math.Exp(res.LnActivity[j]) * p0})
			}
		case roleFixed:
			out.Gases = append(out.Gases, GasAmount{Species: s.sp, Fixed: true, Pressure: sys.Fixed[s.sp], Taken: res.N[j]})
		}
	}
	return out
}

func kelvinString(T float64) string { return fmt.Sprintf("%.2f K", T) }
