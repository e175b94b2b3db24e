package equilibrium

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/mat"

	"hess/aqueous"
	"hess/gibbs"
)

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

// sumFeed is the total of the feed, mol.
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
