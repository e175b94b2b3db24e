package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strconv"

	"hess/equilibrium"
	"hess/network"
	"hess/thermo"
)

// jsonTables is the document `table --format json` prints (CLI.md);
// renderTableJSON writes it piece by piece.
type jsonTables struct {
	Network             string              `json:"network"`
	StandardPressureBar jsonNumber          `json:"standardPressure_bar"`
	Reactions           []jsonReactionTable `json:"reactions"`
}

type jsonReactionTable struct {
	Name          string           `json:"name"`
	Equation      string           `json:"equation"`
	Kind          string           `json:"kind"`
	Quotient      string           `json:"quotient"`
	DeltaGasMoles jsonNumber       `json:"deltaGasMoles"`
	Crossovers    []jsonCrossover  `json:"crossovers"`
	Range         jsonRange        `json:"range"`
	Fit           *jsonFit         `json:"fit,omitempty"`
	Untagged      []string         `json:"untagged,omitempty"`
	Rows          []jsonTableRow   `json:"rows"`
	ReverseRate   *jsonReverseRate `json:"reverseRate,omitempty"`
}

type jsonCrossover struct {
	T            jsonNumber `json:"T_K"`
	FavoredAbove bool       `json:"favoredAbove"`
}

// jsonRange is the span of temperatures the data of the reaction's first
// source cover (null bounds where they cover none) and that source.
type jsonRange struct {
	Tmin   jsonNumber `json:"Tmin_K"`
	Tmax   jsonNumber `json:"Tmax_K"`
	Source string     `json:"source"`
}

// jsonFit is a van 't Hoff fit of logk values: log10 K = A + B/T (+ C·log10 T).
type jsonFit struct {
	A           jsonNumber `json:"A"`
	B           jsonNumber `json:"B_K"`
	C           jsonNumber `json:"C"`
	Terms       int        `json:"terms"`
	Points      int        `json:"points"`
	RMSResidual jsonNumber `json:"rmsResidual"`
	MaxResidual jsonNumber `json:"maxResidual"`
	Tmin        jsonNumber `json:"Tmin_K"`
	Tmax        jsonNumber `json:"Tmax_K"`
}

// jsonTableRow is one row; unknown values are null. sigmaLog10K is the
// first-order standard uncertainty of log10K (null when no input states
// one); source is species, reaction, combination or fit (null without a
// value); speciesLog10K and differenceLog10K compare a row from another
// source with the species' data.
type jsonTableRow struct {
	T            jsonNumber `json:"T_K"`
	DH           jsonNumber `json:"dH_kJ_mol"`
	DS           jsonNumber `json:"dS_J_molK"`
	DG           jsonNumber `json:"dG_kJ_mol"`
	K            jsonNumber `json:"K"`
	Log10K       jsonNumber `json:"log10K"`
	Kc           jsonNumber `json:"Kc"`
	SigmaLog10K  jsonNumber `json:"sigmaLog10K"`
	Extrapolated bool       `json:"extrapolated"`
	Source       *string    `json:"source"`
	SpeciesLog10 jsonNumber `json:"speciesLog10K"`
	Difference   jsonNumber `json:"differenceLog10K"`
}

// jsonNumber is a number written with ten significant digits, or null when
// it is not finite.
type jsonNumber float64

// MarshalJSON writes the number, or null for NaN and infinities.
func (n jsonNumber) MarshalJSON() ([]byte, error) {
	v := float64(n)
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return []byte("null"), nil
	}
	return []byte(strconv.FormatFloat(round10(v), 'g', -1, 64)), nil
}

// renderTableJSON writes the tables as one indented JSON document, the
// jsonTables value, streamed: the head first, then each reaction as its
// table is computed, written as encoding/json would indent the whole.
func renderTableJSON(w io.Writer, doc *tableDoc) error {
	fail := func(err error) error { return fmt.Errorf("writing JSON table: %w", err) }
	var buf bytes.Buffer
	enc := json.NewEncoder(&buf)
	enc.SetEscapeHTML(false)
	buf.WriteString("{\n  \"network\": ")
	if err := enc.Encode(doc.Network); err != nil {
		return fmt.Errorf("encoding JSON table: %w", err)
	}
	buf.Truncate(buf.Len() - 1) // Encode's newline
	pressure, _ := jsonNumber(doc.Pressure / thermo.Bar).MarshalJSON()
	buf.WriteString(",\n  \"standardPressure_bar\": ")
	buf.Write(pressure)
	buf.WriteString(",\n  \"reactions\": [")
	// Each reaction is an element of the array at depth two.
	enc.SetIndent("    ", "  ")
	n := 0
	err := doc.each(func(t tableEntry) error {
		jt := jsonTable(t.Table)
		jt.ReverseRate = jsonReverse(t.Reverse)
		if n > 0 {
			buf.WriteString(",")
		}
		n++
		buf.WriteString("\n    ")
		if err := enc.Encode(jt); err != nil {
			return fmt.Errorf("encoding JSON table: %w", err)
		}
		buf.Truncate(buf.Len() - 1)
		if buf.Len() >= 1<<16 {
			if _, err := w.Write(buf.Bytes()); err != nil {
				return fail(err)
			}
			buf.Reset()
		}
		return nil
	})
	if err != nil {
		return err
	}
	if n > 0 {
		buf.WriteString("\n  ")
	}
	buf.WriteString("]\n}\n")
	if _, err := w.Write(buf.Bytes()); err != nil {
		return fail(err)
	}
	return nil
}

func jsonTable(t *equilibrium.Table) jsonReactionTable {
	jt := jsonReactionTable{
		Name:          t.Reaction.Name,
		Equation:      t.Reaction.EquationText(),
		Kind:          t.Kind,
		Quotient:      t.Quotient,
		DeltaGasMoles: jsonNumber(t.DeltaGasMoles),
		Crossovers:    make([]jsonCrossover, 0, len(t.Crossovers)),
		Rows:          make([]jsonTableRow, 0, len(t.Rows)),
		Range:         jsonRange{Tmin: jsonNumber(math.NaN()), Tmax: jsonNumber(math.NaN())},
	}
	if t.Tmin <= t.Tmax {
		jt.Range = jsonRange{Tmin: jsonNumber(t.Tmin), Tmax: jsonNumber(t.Tmax), Source: t.RangeSource.String()}
	}
	if f := t.Fit; f != nil {
		jt.Fit = &jsonFit{A: jsonNumber(f.A), B: jsonNumber(f.B), C: jsonNumber(f.C), Terms: f.Terms, Points: f.Points,
			RMSResidual: jsonNumber(f.RMS), MaxResidual: jsonNumber(f.MaxAbs), Tmin: jsonNumber(f.Tmin), Tmax: jsonNumber(f.Tmax)}
	}
	for _, sp := range t.Untagged {
		jt.Untagged = append(jt.Untagged, sp.Key)
	}
	for _, c := range t.Crossovers {
		jt.Crossovers = append(jt.Crossovers, jsonCrossover{T: jsonNumber(math.Round(c.T*1000) / 1000), FavoredAbove: c.FavoredAbove})
	}
	for _, r := range t.Rows {
		jt.Rows = append(jt.Rows, jsonTableRow{
			T: jsonNumber(r.T), DH: jsonNumber(r.DH / 1000), DS: jsonNumber(r.DS), DG: jsonNumber(r.DG / 1000),
			K: jsonNumber(r.K), Log10K: jsonNumber(r.Log10K), Kc: jsonNumber(r.Kc), SigmaLog10K: jsonNumber(r.SigmaLog10K),
			Extrapolated: r.Valid && r.Extrapolated, Source: jsonSource(r),
			SpeciesLog10: jsonNumber(r.SpeciesLog10K), Difference: jsonNumber(speciesDifference(r)),
		})
	}
	return jt
}

func jsonSource(r network.TableRow) *string {
	if !r.Valid {
		return nil
	}
	s := r.Basis.String()
	return &s
}
