package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"io"
	"math"

	"hess/equilibrium"
	"hess/thermo"
)

// jsonApproach is the document `approach --format json` prints (CLI.md).
type jsonApproach struct {
	Network  string              `json:"network"`
	Mixtures []jsonMixtureResult `json:"mixtures"`
}

type jsonMixtureResult struct {
	Name        string                 `json:"name"`
	T           jsonNumber             `json:"T_K"`
	PressureBar jsonNumber             `json:"pressure_bar"`
	Reactions   []jsonReactionApproach `json:"reactions"`
	// Solution is the aqueous part (absent when the mixture lists no solute).
	Solution *jsonSolution `json:"solution,omitempty"`
}

// jsonSolution is a mixture's solutes under the network's activity model.
type jsonSolution struct {
	ActivityModel string       `json:"activityModel"`
	IonicStrength jsonNumber   `json:"ionicStrength_mol_kg"`
	Beyond        bool         `json:"beyondModelRange"`
	Water         *string      `json:"water"`
	WaterActivity jsonNumber   `json:"waterActivity"`
	Solutes       []jsonSolute `json:"solutes"`
	Note          *string      `json:"note,omitempty"`
}

type jsonSolute struct {
	Species             string     `json:"species"`
	Molality            jsonNumber `json:"molality"`
	ActivityCoefficient jsonNumber `json:"activityCoefficient"`
	Activity            jsonNumber `json:"activity"`
}

// jsonReactionApproach is one reaction in a mixture; unknown values and an
// unknown direction are null.
type jsonReactionApproach struct {
	Name         string     `json:"name"`
	Q            jsonNumber `json:"Q"`
	K            jsonNumber `json:"K"`
	Log10QOverK  jsonNumber `json:"log10QoverK"`
	DG           jsonNumber `json:"dG_kJ_mol"`
	Direction    *string    `json:"direction"`
	EquilibriumT jsonNumber `json:"equilibriumT_K"`
	Approach     jsonNumber `json:"approach_K"`
	// EquilibriumTs are all temperatures inside the data's range where
	// K = Q; Extrapolated that K uses data outside their range; Reason why
	// a reaction has no quotient or no K (null otherwise).
	EquilibriumTs []jsonNumber `json:"equilibriumTs_K"`
	Extrapolated  bool         `json:"extrapolated"`
	Reason        *string      `json:"reason"`
}

// renderApproachJSON writes the mixtures as one indented JSON document.
func renderApproachJSON(w io.Writer, doc *approachDoc) error {
	out := jsonApproach{Network: doc.Network, Mixtures: make([]jsonMixtureResult, 0, len(doc.Approaches))}
	for _, a := range doc.Approaches {
		out.Mixtures = append(out.Mixtures, jsonMixture(a))
	}
	var buf bytes.Buffer
	enc := json.NewEncoder(&buf)
	enc.SetEscapeHTML(false)
	enc.SetIndent("", "  ")
	if err := enc.Encode(out); err != nil {
		return fmt.Errorf("encoding JSON approach: %w", err)
	}
	if _, err := w.Write(buf.Bytes()); err != nil {
		return fmt.Errorf("writing JSON approach: %w", err)
	}
	return nil
}

func jsonMixture(a *equilibrium.MixtureApproach) jsonMixtureResult {
	jm := jsonMixtureResult{Name: a.Mixture.Name, T: jsonNumber(a.T), PressureBar: jsonNumber(a.P / thermo.Bar),
		Reactions: make([]jsonReactionApproach, 0, len(a.Reactions)+len(a.Absent))}
	for _, r := range a.Reactions {
		jr := jsonReactionApproach{
			Name: r.Reaction.Name, Q: jsonNumber(math.Exp(r.LnQ)), K: jsonNumber(math.Exp(r.LnK)),
			Log10QOverK: jsonNumber(r.Log10QOverK()), DG: jsonNumber(r.DG / 1000),
			EquilibriumT: jsonNumber(r.EquilibriumT), Approach: jsonNumber(r.ApproachK(a.T)),
			EquilibriumTs: make([]jsonNumber, 0, len(r.EquilibriumTs)), Extrapolated: r.Extrapolated,
		}
		for _, t := range r.EquilibriumTs {
			jr.EquilibriumTs = append(jr.EquilibriumTs, jsonNumber(t))
		}
		if s := r.Direction.String(); s != "" {
			jr.Direction = &s
		}
		if s := r.Reason(a.T); s != "" {
			jr.Reason = &s
		}
		jm.Reactions = append(jm.Reactions, jr)
	}
	for _, ab := range a.Absent {
		reason := "no quotient: " + ab.Reason()
		nan := jsonNumber(math.NaN())
		jm.Reactions = append(jm.Reactions, jsonReactionApproach{Name: ab.Reaction.Name, Q: nan, K: nan, Log10QOverK: nan, DG: nan,
			EquilibriumT: nan, Approach: nan, EquilibriumTs: []jsonNumber{}, Reason: &reason})
	}
	if s := a.Solution; s != nil {
		js := &jsonSolution{ActivityModel: s.Model, IonicStrength: jsonNumber(s.I), Beyond: s.Beyond,
			WaterActivity: jsonNumber(s.WaterActivity), Solutes: make([]jsonSolute, 0, len(s.Solutes))}
		if s.Water != nil {
			js.Water = &s.Water.Key
		} else {
			js.WaterActivity = jsonNumber(math.NaN())
		}
		if s.Err != nil {
			note := s.Err.Error() + ": activity coefficients taken as 1"
			js.Note = &note
		}
		for _, a := range s.Solutes {
			js.Solutes = append(js.Solutes, jsonSolute{Species: a.Species.Key, Molality: jsonNumber(a.Molality),
				ActivityCoefficient: jsonNumber(a.Gamma), Activity: jsonNumber(a.Activity)})
		}
		jm.Solution = js
	}
	return jm
}
