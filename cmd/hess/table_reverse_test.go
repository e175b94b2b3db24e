package main

import (
	"bytes"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"hess/thermo"
)

// The water-gas shift with NIST Chemistry WebBook Shomate species
// (reference Chase 1998) and a demonstration forward rate
// k = 1e12 cm3/mol/s·exp(−120 kJ/mol / RT), and no reverse rate.
const reverseTableNetwork = `settings {
  temperatures 600 K to 1200 K by 100 K
}
species CO(g) {
  shomate 298 K to 1300 K { 25.56759 6.096130 4.054656 -2.671301 0.131021 -118.0089 227.3665 -110.5271 }
}
species H2O(g) {
  shomate 500 K to 1700 K { 30.09200 6.832514 6.793435 -2.534480 0.082139 -250.8810 223.3967 -241.8264 }
}
species CO2(g) {
  shomate 298 K to 1200 K { 24.99735 55.18696 -33.69137 7.948387 -0.136638 -403.6075 228.2431 -393.5224 }
  shomate 1200 K to 6000 K { 58.16639 2.720074 -0.492289 0.038844 -6.447293 -425.9186 263.6125 -393.5224 }
}
species H2(g) {
  shomate 298 K to 1000 K { 33.066178 -11.363417 11.432816 -2.772874 -0.158558 -9.980797 172.707974 0 }
  shomate 1000 K to 2500 K { 18.563083 12.257357 -2.859786 0.268238 1.977990 -1.147438 156.288133 0 }
}
reaction wgs: CO(g) + H2O(g) <-> CO2(g) + H2(g) {
  rate A 1e12 cm3/mol/s Ea 120 kJ/mol
}
`

// TestTableReverseRate checks the fitted reverse rate in the JSON, text and
// Markdown tables: in JSON it reproduces kf/K (K from the table's own rows; Δn = 0,
// so Kc = K) within its maxRelError at every row, and against the
// published log10 K of the water-gas shift (derived from NIST-JANAF log Kf,
// ±0.002) within maxRelError plus that rounding.
func TestTableReverseRate(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "shift.hess")
	if err := os.WriteFile(path, []byte(reverseTableNetwork), 0o644); err != nil {
		t.Fatal(err)
	}
	var out, errb bytes.Buffer
	if code := run([]string{"table", "--format", "json", path}, &out, &errb); code != exitOK {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	var doc struct {
		Reactions []struct {
			Rows []struct {
				T float64 `json:"T_K"`
				K float64 `json:"K"`
			} `json:"rows"`
			ReverseRate *struct {
				A           float64 `json:"A"`
				AUnit       string  `json:"A_unit"`
				N           float64 `json:"n"`
				Ea          float64 `json:"Ea_kJ_mol"`
				MaxRelError float64 `json:"maxRelError"`
			} `json:"reverseRate"`
		} `json:"reactions"`
	}
	if err := json.Unmarshal(out.Bytes(), &doc); err != nil {
		t.Fatalf("%v\n%s", err, out.String())
	}
	if len(doc.Reactions) != 1 || doc.Reactions[0].ReverseRate == nil {
		t.Fatalf("no reverseRate in\n%s", out.String())
	}
	rr := doc.Reactions[0].ReverseRate
	if rr.AUnit != "cm3/mol/s" || !(rr.MaxRelError >= 0 && rr.MaxRelError < 0.02) {
		t.Errorf("reverseRate %+v", *rr)
	}
	published := map[float64]float64{600: 1.453, 700: 0.975, 800: 0.626, 900: 0.364, 1000: 0.158, 1100: -0.004, 1200: -0.136}
	for _, row := range doc.Reactions[0].Rows {
		T := row.T
		kf := 1e12 * math.Exp(-120e3/(thermo.R*T))
		kr := rr.A * math.Pow(T, rr.N) * math.Exp(-rr.Ea*1000/(thermo.R*T))
		// The JSON numbers carry ten significant digits.
		if e := math.Abs(kr/(kf/row.K) - 1); e > rr.MaxRelError+1e-6 {
			t.Errorf("%g K: reverse rate %g, kf/K %g: error %g beyond maxRelError %g", T, kr, kf/row.K, e, rr.MaxRelError)
		}
		if e := math.Abs(kr/(kf/math.Pow(10, published[T])) - 1); e > rr.MaxRelError+0.005 {
			t.Errorf("%g K: reverse rate %g against the published K: error %g", T, kr, e)
		}
	}

	out.Reset()
	if code := run([]string{"table", path}, &out, &errb); code != exitOK {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	if want := "  reverse rate fitted to kf/Kc from 600 K to 1200 K: A = "; !strings.Contains(out.String(), want) {
		t.Errorf("text table lacks %q:\n%s", want, out.String())
	}

	out.Reset()
	if code := run([]string{"table", "--format", "markdown", path}, &out, &errb); code != exitOK {
		t.Fatalf("exit %d: %s", code, errb.String())
	}
	if want := "\n- reverse rate fitted to kf/Kc from 600 K to 1200 K: A = "; !strings.Contains(out.String(), want) {
		t.Errorf("Markdown table lacks %q:\n%s", want, out.String())
	}
}
