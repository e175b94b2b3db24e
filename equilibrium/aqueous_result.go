package equilibrium

import (
	"math"

	"hess/aqueous"
	"hess/gibbs"
	"hess/network"
)

// aqueousResult reads the solver's result in the network's terms: each
// solute's amount, molality, γ and activity (and the pH from H+(aq)), the
// ionic strength and water's activity, each pure phase's amount and
// saturation index, and the gases formed or exchanged.
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
