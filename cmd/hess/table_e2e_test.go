package main

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestTableEndToEnd drives the built binary as a user would: a table to
// stdout, a table file, and a plot file.
func TestTableEndToEnd(t *testing.T) {
	r := runHess(t, "table", "--reaction", "shift", "--temperatures", "1000 K", "examples/hydrogen-plant/reformer.hess")
	if r.code != 0 || !strings.Contains(r.stdout, "shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)") ||
		!strings.Contains(r.stdout, "Kp = p(CO2) p(H2) / (p(CO) p(H2O))") || r.stderr != "" {
		t.Errorf("table: exit %d\n%s\n%s", r.code, r.stdout, r.stderr)
	}
	// log10 K(1000 K) of the shift is 0.158 (NIST-JANAF, REFERENCE-DATA.md §3).
	if !strings.Contains(r.stdout, " 0.158") {
		t.Errorf("table lacks log10 K = 0.158:\n%s", r.stdout)
	}

	dir := t.TempDir()
	out := filepath.Join(dir, "scrubber.json")
	r = runHess(t, "table", "--format", "json", "-o", out, "examples/flue-gas-scrubber.hess")
	if r.code != 0 || r.stdout != "" {
		t.Fatalf("table -o: exit %d\n%s\n%s", r.code, r.stdout, r.stderr)
	}
	data, err := os.ReadFile(out)
	if err != nil {
		t.Fatal(err)
	}
	var doc struct {
		Reactions []struct {
			Name, Kind string
			Rows       []struct {
				T      float64 `json:"T_K"`
				Log10K float64 `json:"log10K"`
			}
		}
	}
	if err := json.Unmarshal(data, &doc); err != nil {
		t.Fatalf("table file is not JSON: %v", err)
	}
	found := false
	for _, rx := range doc.Reactions {
		if rx.Name == "water" {
			found = true
			// pKw at 25 °C is 13.995 (CRC 5-20); the example's NBS data give it.
			if rx.Kind != "Kc" || len(rx.Rows) == 0 || rx.Rows[0].Log10K > -13.99 || rx.Rows[0].Log10K < -14.00 {
				t.Errorf("water: %+v", rx)
			}
		}
	}
	if !found {
		t.Error("no water reaction in the scrubber table")
	}

	png := filepath.Join(dir, "reformer.png")
	r = runHess(t, "plot", "-o", png, "examples/hydrogen-plant/reformer.hess")
	if r.code != 0 {
		t.Fatalf("plot: exit %d\n%s", r.code, r.stderr)
	}
	head, err := os.ReadFile(png)
	if err != nil || !bytes.HasPrefix(head, []byte("\x89PNG\r\n\x1a\n")) {
		t.Errorf("plot file is not a PNG: %v", err)
	}

	r = runHess(t, "table", "testdata/check/range-gap.hess")
	if r.code != 1 || r.stdout != "" || !strings.Contains(r.stderr, "[range-gap]") {
		t.Errorf("network with errors: exit %d\n%s\n%s", r.code, r.stdout, r.stderr)
	}
}
