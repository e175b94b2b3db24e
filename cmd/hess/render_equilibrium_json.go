package main

import (
	"io"

	"hess/thermo"
)

// jsonEquilibrium is the document `equilibrium --format json` prints. The
// field names are a contract (docs/commands.md).
type jsonEquilibrium struct {
	Network string               `json:"network"`
	Results []jsonEquilibriumRun `json:"results"`
}

type jsonEquilibriumRun struct {
	Mixture         string           `json:"mixture"`
	T               jsonNumber       `json:"T_K"`
	Pressure        jsonNumber       `json:"pressure_bar"`
	Basis           string           `json:"basis"`
	Adiabatic       bool             `json:"adiabatic"`
	Converged       bool             `json:"converged"`
	Heat            jsonNumber       `json:"heat_kJ"`
	HeatPerMol      jsonNumber       `json:"heat_kJ_per_mol_feed"`
	Phases          []jsonPhase      `json:"phases"`
	Species         []jsonEqSpecies  `json:"species"`
	Reactions       []jsonEqReaction `json:"reactions"`
	ElementResidual jsonNumber       `json:"elementResidual"`
	// Extrapolated names the species whose data, stating no range, were
	// carried beyond their default span to T; empty when none.
	Extrapolated []string `json:"extrapolated"`
}

type jsonPhase struct {
	Phase   string     `json:"phase"`
	Present bool       `json:"present"`
	Amount  jsonNumber `json:"amount_mol"`
}

// jsonEqSpecies is one species; molality_mol_kg is given for solutes only.
type jsonEqSpecies struct {
	Name         string      `json:"name"`
	Phase        string      `json:"phase"`
	Amount       jsonNumber  `json:"amount_mol"`
	MoleFraction jsonNumber  `json:"moleFraction"`
	Activity     jsonNumber  `json:"activity"`
	Molality     *jsonNumber `json:"molality_mol_kg,omitempty"`
}

type jsonEqReaction struct {
	Name        string     `json:"name"`
	Log10QoverK jsonNumber `json:"log10QoverK"`
}

func renderEquilibriumJSON(w io.Writer, doc *equilibriumDoc) error {
	out := jsonEquilibrium{Network: doc.Network, Results: []jsonEquilibriumRun{}}
	for _, c := range doc.Results {
		r := jsonEquilibriumRun{
			Mixture: c.Mixture.Name, T: jsonNumber(c.T), Pressure: jsonNumber(c.P / thermo.Bar),
			Basis: c.Basis.String(), Adiabatic: c.Adiabatic, Converged: c.Converged,
			Heat: jsonNumber(c.Heat / 1000), HeatPerMol: jsonNumber(c.HeatPerMolFeed() / 1000),
			Phases: []jsonPhase{}, Species: []jsonEqSpecies{}, Reactions: []jsonEqReaction{},
			ElementResidual: jsonNumber(c.ElementResidual), Extrapolated: []string{},
		}
		for _, sp := range c.Extrapolated {
			r.Extrapolated = append(r.Extrapolated, sp.Key)
		}
		for _, p := range c.Phases {
			r.Phases = append(r.Phases, jsonPhase{Phase: p.Name, Present: p.Present, Amount: jsonNumber(p.Amount)})
		}
		for _, s := range c.Sorted() {
			js := jsonEqSpecies{Name: s.Species.Key, Phase: s.Phase, Amount: jsonNumber(s.Amount),
				MoleFraction: jsonNumber(s.MoleFraction), Activity: jsonNumber(s.Activity)}
			if finite(s.Molality) {
				m := jsonNumber(s.Molality)
				js.Molality = &m
			}
			r.Species = append(r.Species, js)
		}
		for _, x := range c.Reactions {
			r.Reactions = append(r.Reactions, jsonEqReaction{Name: x.Reaction.Name, Log10QoverK: jsonNumber(x.Log10QoverK)})
		}
		out.Results = append(out.Results, r)
	}
	return writeIndentedJSON(w, out, "JSON equilibrium")
}
