package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strconv"

	"hess/equilibrium"
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
	Rows          []jsonTableRow   `json:"rows"`
	ReverseRate   *jsonReverseRate `json:"reverseRate,omitempty"`
}

type jsonCrossover struct {
	T            jsonNumber `json:"T_K"`
	FavoredAbove bool       `json:"favoredAbove"`
}

// jsonTableRow is one row; unknown values are null. sigmaLog10K is the
// first-order standard uncertainty of log10K (0 when no input carries one).
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
	}
	for _, c := range t.Crossovers {
		jt.Crossovers = append(jt.Crossovers, jsonCrossover{T: jsonNumber(math.Round(c.T*1000) / 1000), FavoredAbove: c.FavoredAbove})
	}
	for _, r := range t.Rows {
		jt.Rows = append(jt.Rows, jsonTableRow{
			T: jsonNumber(r.T), DH: jsonNumber(r.DH / 1000), DS: jsonNumber(r.DS), DG: jsonNumber(r.DG / 1000),
			K: jsonNumber(r.K), Log10K: jsonNumber(r.Log10K), Kc: jsonNumber(r.Kc), SigmaLog10K: jsonNumber(r.SigmaLog10K),
			Extrapolated: r.Valid && r.Extrapolated,
		})
	}
	return jt
}
