package main

import (
	"io"
	"math"

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
	// The fields of an aqueous result (absent from the others): pH,
	// ionic strength, the activity model, water, each mineral's
	// saturation index and what each fixed gas exchanged.
	PH            *jsonNumber    `json:"pH,omitempty"`
	IonicStrength *jsonNumber    `json:"ionicStrength_mol_kg,omitempty"`
	ActivityModel string         `json:"activityModel,omitempty"`
	BeyondRange   *bool          `json:"beyondActivityRange,omitempty"`
	WaterKg       *jsonNumber    `json:"water_kg,omitempty"`
	WaterActivity *jsonNumber    `json:"waterActivity,omitempty"`
	Minerals      []jsonMineral  `json:"minerals,omitempty"`
	FixedGases    []jsonFixedGas `json:"fixedGases,omitempty"`
	Skipped       []string       `json:"skipped,omitempty"`
}

// jsonMineral is a pure phase of an aqueous result: present or not, and
// its saturation index log10(Q/K) (0 where present).
type jsonMineral struct {
	Name            string     `json:"name"`
	Present         bool       `json:"present"`
	Amount          jsonNumber `json:"amount_mol"`
	SaturationIndex jsonNumber `json:"saturationIndex"`
}

// jsonFixedGas is a gas held at a fixed partial pressure: the amount taken
// in from its reservoir (negative: given off).
type jsonFixedGas struct {
	Name     string     `json:"name"`
	Pressure jsonNumber `json:"pressure_bar"`
	TakenIn  jsonNumber `json:"takenIn_mol"`
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
	// Solutes of an aqueous result only.
	AqMolality          *jsonNumber `json:"molality,omitempty"`
	ActivityCoefficient *jsonNumber `json:"activityCoefficient,omitempty"`
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
	for _, a := range doc.Aqueous {
		out.Results = append(out.Results, jsonAqueousRun(a, doc.Pressure))
	}
	return writeIndentedJSON(w, out, "JSON equilibrium")
}

// jsonAqueousRun is an aqueous result in the JSON of every result, with
// the aqueous fields added.
func jsonAqueousRun(a *aqueousRun, p0 float64) jsonEquilibriumRun {
	num := func(v float64) *jsonNumber { n := jsonNumber(v); return &n }
	beyond := a.Beyond
	r := jsonEquilibriumRun{
		Mixture: a.Mixture.Name, T: jsonNumber(a.T), Pressure: jsonNumber(barOf(a.P)), Basis: "elements",
		Converged: a.Converged, Heat: jsonNumber(math.NaN()), HeatPerMol: jsonNumber(math.NaN()),
		Phases: []jsonPhase{}, Species: []jsonEqSpecies{}, Reactions: []jsonEqReaction{},
		ElementResidual: jsonNumber(a.ElementResidual), Extrapolated: []string{},
		PH: num(a.PH), IonicStrength: num(a.I), ActivityModel: a.Model, BeyondRange: &beyond,
		WaterKg: num(a.WaterKg), WaterActivity: num(a.WaterActivity),
		Minerals: []jsonMineral{}, FixedGases: []jsonFixedGas{},
	}
	phase := map[string]int{}
	for _, s := range aqueousRows(a, p0) {
		js := jsonEqSpecies{Name: s.Name, Phase: s.Phase, Amount: jsonNumber(s.Amount),
			MoleFraction: jsonNumber(s.MoleFraction), Activity: jsonNumber(s.Activity)}
		if finite(s.Molality) {
			js.Molality, js.AqMolality, js.ActivityCoefficient = num(s.Molality), num(s.Molality), num(s.ActivityCoefficient)
		}
		r.Species = append(r.Species, js)
		k, ok := phase[s.Phase]
		if !ok {
			k = len(r.Phases)
			phase[s.Phase] = k
			r.Phases = append(r.Phases, jsonPhase{Phase: s.Phase})
		}
		r.Phases[k].Amount += jsonNumber(s.Amount)
		r.Phases[k].Present = r.Phases[k].Amount > 0
	}
	for _, m := range a.Minerals {
		r.Minerals = append(r.Minerals, jsonMineral{Name: m.Species.Key, Present: m.Present, Amount: jsonNumber(m.Amount), SaturationIndex: jsonNumber(m.SI)})
	}
	for _, g := range a.Gases {
		if g.Fixed {
			r.FixedGases = append(r.FixedGases, jsonFixedGas{Name: g.Species.Key, Pressure: jsonNumber(barOf(g.Pressure)), TakenIn: jsonNumber(g.Taken)})
		}
	}
	for _, sp := range a.Skipped {
		r.Skipped = append(r.Skipped, sp.Key)
	}
	return r
}
