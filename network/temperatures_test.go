package network

import (
	"math"
	"path/filepath"
	"strings"
	"testing"

	"hess/lang"
)

// TestRequestedTemperatures: the checks of requested temperatures run once,
// at the caller's temperatures when it names them, and the settings stay.
func TestRequestedTemperatures(t *testing.T) {
	const src = `
settings { temperatures 600 K }
include "webbook-shomate.hess"
reaction shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)
`
	temperatureCodes := func(n *Network) (out []lang.Diagnostic) {
		for _, d := range n.Diagnostics {
			if string(d.Code) == extrapolationCheck.Name || string(d.Code) == missingThermoCheck.Name {
				out = append(out, d)
			}
		}
		return out
	}
	if ds := temperatureCodes(loadThermo(t, src)); len(ds) != 0 {
		t.Errorf("at the settings' 600 K: %v", ds)
	}
	dir, err := filepath.Abs(filepath.Join("testdata", "thermo"))
	if err != nil {
		t.Fatal(err)
	}
	root := filepath.Join(dir, "net.hess")
	temps := []float64{298.15, 400, 700}
	n := Load(root, Overlay{Files: map[string][]byte{root: []byte(src)}, Base: Disk{}}, Options{Temperatures: temps})
	ds := temperatureCodes(n)
	if len(ds) != 1 || ds[0].Code != "extrapolation" || !strings.Contains(ds[0].Message, "298.15 K and 400 K are outside the data of H2O(g)") {
		t.Errorf("diagnostics at 298.15, 400 and 700 K: %v", ds)
	}
	if len(n.Settings.Temperatures) != 1 || len(n.Temperatures) != 3 {
		t.Errorf("settings' temperatures %v, checked at %v", n.Settings.Temperatures, n.Temperatures)
	}
}

func TestParseTemperatures(t *testing.T) {
	tests := []struct {
		text string
		want []float64
		err  string
	}{
		{"298.15 K", []float64{298.15}, ""},
		{"298.15 K, 700 K to 1000 K by 100 K", []float64{298.15, 700, 800, 900, 1000}, ""},
		{"25 degC", []float64{298.15}, ""},
		{"", nil, "no temperatures"},
		{"300", nil, "unit"},
		{"300 kJ/mol", nil, "temperature"},
		{"-5 K", nil, "absolute zero"},
		{"500 K to 400 K by 10 K", nil, "backwards"},
		{"300 K } species X(g) {", nil, "only temperatures"},
	}
	for _, tc := range tests {
		got, err := ParseTemperatures(tc.text)
		if tc.err != "" {
			if err == nil || !strings.Contains(err.Error(), tc.err) {
				t.Errorf("ParseTemperatures(%q) error %v, want one containing %q", tc.text, err, tc.err)
			}
			continue
		}
		if err != nil {
			t.Errorf("ParseTemperatures(%q): %v", tc.text, err)
			continue
		}
		if len(got) != len(tc.want) {
			t.Errorf("ParseTemperatures(%q) = %v, want %v", tc.text, got, tc.want)
			continue
		}
		for i := range got {
			if math.Abs(got[i]-tc.want[i]) > 1e-9 {
				t.Errorf("ParseTemperatures(%q) = %v, want %v", tc.text, got, tc.want)
			}
		}
	}
}
