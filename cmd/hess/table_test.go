package main

import (
	"bytes"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// inRoot runs the test from the module root, so that file names display as
// a user at the root would see them, and returns the absolute path of
// cmd/hess/testdata.
func inRoot(t *testing.T) string {
	t.Helper()
	golden, err := filepath.Abs("testdata")
	if err != nil {
		t.Fatal(err)
	}
	root, err := filepath.Abs(filepath.Join("..", ".."))
	if err != nil {
		t.Fatal(err)
	}
	t.Chdir(root)
	return golden
}

// TestTableGolden renders every example's table in every format and compares
// with testdata/table/NAME.FORMAT.golden. Run with -update after review.
func TestTableGolden(t *testing.T) {
	exampleGoldens(t, "table", map[string]string{
		"reformer": "examples/hydrogen-plant/reformer.hess",
		"scrubber": "examples/flue-gas-scrubber.hess",
		"flame":    "examples/small-flame.hess",
	})
}

// exampleGoldens runs `hess COMMAND --format F FILE` on each example in
// every format and compares stdout with testdata/COMMAND/NAME.F.golden.
// A clean example must write nothing to stderr.
func exampleGoldens(t *testing.T, command string, examples map[string]string) {
	t.Helper()
	golden := inRoot(t)
	for name, path := range examples {
		for _, format := range []string{"text", "csv", "json", "markdown"} {
			t.Run(name+"."+format, func(t *testing.T) {
				var stdout, stderr bytes.Buffer
				if code := run([]string{command, "--format", format, path}, &stdout, &stderr); code != exitOK {
					t.Fatalf("exit %d: %s", code, stderr.String())
				}
				if stderr.Len() != 0 {
					t.Errorf("stderr for a clean example: %s", stderr.String())
				}
				compareGolden(t, filepath.Join(golden, command, name+"."+format+".golden"), stdout.Bytes())
			})
		}
	}
}

// TestTableJSONFields decodes the JSON table and checks the fields CLI.md
// names, including null for what cannot be computed.
func TestTableJSONFields(t *testing.T) {
	inRoot(t)
	var stdout, stderr bytes.Buffer
	code := run([]string{"table", "--format", "json", "--reaction", "shift", "--reaction", "reform",
		"--temperatures", "298.15 K, 1000 K", "examples/hydrogen-plant/reformer.hess"}, &stdout, &stderr)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr.String())
	}
	var doc struct {
		Network             string  `json:"network"`
		StandardPressureBar float64 `json:"standardPressure_bar"`
		Reactions           []struct {
			Name, Equation, Kind, Quotient string
			DeltaGasMoles                  float64 `json:"deltaGasMoles"`
			Crossovers                     []struct {
				T            float64 `json:"T_K"`
				FavoredAbove *bool   `json:"favoredAbove"`
			}
			Rows []map[string]any
		}
	}
	if err := json.Unmarshal(stdout.Bytes(), &doc); err != nil {
		t.Fatalf("%v\n%s", err, stdout.String())
	}
	if doc.Network != "examples/hydrogen-plant/reformer.hess" || doc.StandardPressureBar != 1 || len(doc.Reactions) != 2 {
		t.Fatalf("document %+v", doc)
	}
	shift, reform := doc.Reactions[0], doc.Reactions[1]
	if shift.Name != "shift" || shift.Kind != "Kp" || shift.Quotient != "p(CO2) p(H2) / (p(CO) p(H2O))" ||
		shift.Equation != "CO(g) + H2O(g) <-> CO2(g) + H2(g)" || shift.DeltaGasMoles != 0 {
		t.Errorf("shift: %+v", shift)
	}
	if reform.DeltaGasMoles != 2 || len(reform.Crossovers) != 1 || reform.Crossovers[0].FavoredAbove == nil || !*reform.Crossovers[0].FavoredAbove {
		t.Errorf("reform: %+v", reform)
	}
	keys := []string{"T_K", "dH_kJ_mol", "dS_J_molK", "dG_kJ_mol", "K", "log10K", "Kc", "sigmaLog10K", "extrapolated",
		"source", "speciesLog10K", "differenceLog10K"}
	for _, row := range shift.Rows {
		for _, k := range keys {
			if _, ok := row[k]; !ok {
				t.Errorf("row %v lacks %s", row, k)
			}
		}
		if len(row) != len(keys) {
			t.Errorf("row has %d fields, want %d: %v", len(row), len(keys), row)
		}
	}
	// shift at 1000 K: log10 K = 0.158 (NIST-JANAF, REFERENCE-DATA.md §3).
	if lk := shift.Rows[1]["log10K"].(float64); math.Abs(lk-0.158) > 0.003 {
		t.Errorf("shift log10 K(1000 K) = %v", lk)
	}
	// reform: Kc = K·(p°/(R·T·c°))².
	k, kc := reform.Rows[1]["K"].(float64), reform.Rows[1]["Kc"].(float64)
	if want := k / math.Pow(8.31446261815324*1000*1000/1e5, 2); math.Abs(kc/want-1) > 1e-8 {
		t.Errorf("reform Kc %g, want %g", kc, want)
	}

	// A reaction whose species have no data: nulls.
	stdout.Reset()
	stderr.Reset()
	if code := run([]string{"table", "--format", "json", "--reaction", "init", "examples/small-flame.hess"}, &stdout, &stderr); code != exitOK {
		t.Fatalf("flame: exit %d: %s", code, stderr.String())
	}
	if !strings.Contains(stdout.String(), `"log10K": null`) || !strings.Contains(stdout.String(), `"K": null`) {
		t.Errorf("flame: no nulls for missing values:\n%s", stdout.String())
	}
}

func TestTableHelpAndUsage(t *testing.T) {
	inRoot(t)
	tests := []struct {
		name   string
		args   []string
		code   int
		stdout string
		stderr string
	}{
		{"help has the caution", []string{"table", "--help"}, exitOK, "check them against local codes and licensed engineering practice", ""},
		{"plot help has the caution", []string{"plot", "--help"}, exitOK, "licensed engineering practice", ""},
		{"no file", []string{"table"}, exitTrouble, "", "give exactly one root file"},
		{"two files", []string{"table", "a.hess", "b.hess"}, exitTrouble, "", "give exactly one root file"},
		{"missing file", []string{"table", "absent.hess"}, exitTrouble, "", "cannot read absent.hess"},
		{"bad format", []string{"table", "--format", "xml", "examples/small-flame.hess"}, exitTrouble, "", "must be one of"},
		{"unknown reaction", []string{"table", "--reaction", "nope", "examples/small-flame.hess"}, exitTrouble, "", `no reaction named "nope"`},
		{"bad temperatures", []string{"table", "--temperatures", "300", "examples/small-flame.hess"}, exitTrouble, "", "--temperatures"},
		{"network errors", []string{"table", "testdata/check/range-gap.hess"}, exitFindings, "", "[range-gap]"},
		{"plot without -o", []string{"plot", "examples/small-flame.hess"}, exitTrouble, "", "-o must name an .svg or .png file"},
		{"plot with a PDF", []string{"plot", "-o", "x.pdf", "examples/small-flame.hess"}, exitTrouble, "", "-o must name an .svg or .png file"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			var stdout, stderr bytes.Buffer
			code := run(tc.args, &stdout, &stderr)
			if code != tc.code {
				t.Errorf("exit %d, want %d; stderr: %s", code, tc.code, stderr.String())
			}
			if !strings.Contains(stdout.String(), tc.stdout) {
				t.Errorf("stdout lacks %q:\n%s", tc.stdout, stdout.String())
			}
			if !strings.Contains(stderr.String(), tc.stderr) {
				t.Errorf("stderr lacks %q:\n%s", tc.stderr, stderr.String())
			}
			if tc.code != exitOK && stdout.Len() != 0 && tc.stdout == "" {
				t.Errorf("stdout not empty on failure: %s", stdout.String())
			}
		})
	}
}

// TestTableTemperaturesFlag: --temperatures replaces the settings'
// temperatures, and the temperature checks follow it.
func TestTableTemperaturesFlag(t *testing.T) {
	inRoot(t)
	var stdout, stderr bytes.Buffer
	code := run([]string{"table", "--format", "csv", "--temperatures", "1000 K to 1600 K by 300 K", "--reaction", "shift", "testdata/check/extrapolation.hess"}, &stdout, &stderr)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr.String())
	}
	if !strings.Contains(stderr.String(), "1600 K is outside the data of CO(g)") {
		t.Errorf("stderr lacks the extrapolation at the flag's temperatures:\n%s", stderr.String())
	}
	if strings.Contains(stderr.String(), "298.15 K is outside") {
		t.Errorf("stderr still reports the settings' temperatures:\n%s", stderr.String())
	}
	// Every row is extrapolated: H2(g) has hf and s alone, which hold
	// 298.15 K ± 100 K.
	lines := strings.Split(strings.TrimSpace(stdout.String()), "\n")
	if len(lines) != 4 || !strings.HasPrefix(lines[1], "shift,1000,") || !strings.HasSuffix(lines[3], ",true,species,,") || !strings.HasSuffix(lines[1], ",true,species,,") {
		t.Errorf("CSV rows:\n%s", stdout.String())
	}
}

// TestTableOutputAtomic: -o replaces the file only when a whole table was
// written; on network errors or a failed write the old file stays as it
// was.
func TestTableOutputAtomic(t *testing.T) {
	inRoot(t)
	dir := t.TempDir()
	old := []byte("previous table\n")

	// Errors in the network: nothing is written.
	out := filepath.Join(dir, "table.txt")
	if err := os.WriteFile(out, old, 0o644); err != nil {
		t.Fatal(err)
	}
	var stdout, stderr bytes.Buffer
	if code := run([]string{"table", "-o", out, "testdata/check/range-overlap.hess"}, &stdout, &stderr); code != exitFindings {
		t.Errorf("network with errors: exit %d, want %d", code, exitFindings)
	}
	if got, _ := os.ReadFile(out); !bytes.Equal(got, old) {
		t.Errorf("network with errors changed the file to %q", got)
	}

	// The write fails: the temporary file's name is too long for the file
	// system, although the target's is not.
	long := filepath.Join(dir, strings.Repeat("t", 250))
	if err := os.WriteFile(long, old, 0o644); err != nil {
		t.Skipf("file system does not take a 250-byte name: %v", err)
	}
	stderr.Reset()
	if code := run([]string{"table", "-o", long, "examples/hydrogen-plant/reformer.hess"}, &stdout, &stderr); code != exitTrouble {
		t.Errorf("failed write: exit %d, want %d", code, exitTrouble)
	}
	if got, _ := os.ReadFile(long); !bytes.Equal(got, old) {
		t.Errorf("failed write changed the file to %q", got)
	}
	if !strings.Contains(stderr.String(), "write ") {
		t.Errorf("failed write not reported: %s", stderr.String())
	}

	// The target is a folder: the rename fails and the folder keeps its file.
	folder := filepath.Join(dir, "folder")
	if err := os.MkdirAll(filepath.Join(folder, "inside"), 0o755); err != nil {
		t.Fatal(err)
	}
	stderr.Reset()
	if code := run([]string{"table", "-o", folder, "examples/hydrogen-plant/reformer.hess"}, &stdout, &stderr); code != exitTrouble {
		t.Errorf("folder target: exit %d, want %d", code, exitTrouble)
	}
	if _, err := os.Stat(filepath.Join(folder, "inside")); err != nil {
		t.Errorf("folder target lost its content: %v", err)
	}
	if left, _ := filepath.Glob(filepath.Join(dir, ".*tmp*")); len(left) != 0 {
		t.Errorf("temporary files left behind: %v", left)
	}

	// A good run replaces the file whole.
	stderr.Reset()
	if code := run([]string{"table", "-o", out, "--format", "csv", "examples/hydrogen-plant/reformer.hess"}, &stdout, &stderr); code != exitOK {
		t.Fatalf("good run: exit %d: %s", code, stderr.String())
	}
	got, _ := os.ReadFile(out)
	if !bytes.HasPrefix(got, []byte("reaction,T [K],")) || stdout.Len() != 0 {
		t.Errorf("good run wrote %q (stdout %q)", got, stdout.String())
	}
}

func TestRational(t *testing.T) {
	tests := map[float64]string{0: "0", 2: "2", -1: "-1", 0.5: "1/2", -1.5: "-3/2", 1.0 / 3: "1/3", -0.25: "-1/4"}
	for v, want := range tests {
		if got := rational(v); got != want {
			t.Errorf("rational(%v) = %q, want %q", v, got, want)
		}
	}
	units := map[float64]string{0: "Kc", 1: "Kc [mol/L]", 2: "Kc [(mol/L)^2]", -0.5: "Kc [(mol/L)^-1/2]"}
	for dn, want := range units {
		if got := kcHeader(dn); got != want {
			t.Errorf("kcHeader(%v) = %q, want %q", dn, got, want)
		}
	}
}

func TestJSONNumber(t *testing.T) {
	tests := []struct {
		v    float64
		want string
	}{
		{math.NaN(), "null"}, {math.Inf(1), "null"}, {math.Inf(-1), "null"},
		{1.0e5, "100000"}, {0.1 + 0.2, "0.3"}, {-41.1766764512, "-41.17667645"}, {1.2315e-25, "1.2315e-25"},
	}
	for _, tc := range tests {
		b, err := jsonNumber(tc.v).MarshalJSON()
		if err != nil || string(b) != tc.want {
			t.Errorf("jsonNumber(%v) = %s, %v; want %s", tc.v, b, err, tc.want)
		}
	}
}

// TestTableSourceEveryFormat: every table format names each row's source
// and, where the row comes from the reaction's own data, the species'
// log10 K beside it with the difference; a species without a state tag has
// its convention named.
func TestTableSourceEveryFormat(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "calcite.hess")
	src := `species CaCO3(cr) { hf -1207.6 kJ/mol s 91.7 J/mol/K }
species Ca++(aq) { hf -543.0 kJ/mol s -56.2 J/mol/K }
species CO3--(aq) { hf -675.23 kJ/mol s -50.0 J/mol/K }
species loose { formula CaCO3 hf -1207.6 kJ/mol s 91.7 J/mol/K }
reaction calcite: CaCO3(cr) <-> Ca++(aq) + CO3--(aq) { logk -8.48 }
reaction lump: loose <-> Ca++(aq) + CO3--(aq)
`
	if err := os.WriteFile(path, []byte(src), 0o644); err != nil {
		t.Fatal(err)
	}
	out := func(format string) string {
		var stdout, stderr bytes.Buffer
		if code := run([]string{"table", "--format", format, path}, &stdout, &stderr); code != exitOK {
			t.Fatalf("%s: exit %d: %s", format, code, stderr.String())
		}
		return stdout.String()
	}
	text := strings.Join(strings.Fields(out("text")), " ")
	for _, want := range []string{"source log10 K (species) difference", "no reaction -8.4747 -0.0053",
		"no state tag on loose: activity taken as a mole fraction (solution convention)", "no species"} {
		if !strings.Contains(text, want) {
			t.Errorf("text lacks %q:\n%s", want, out("text"))
		}
	}
	if md := out("markdown"); !strings.Contains(md, "| source | log10 K (species) | difference |") || !strings.Contains(md, "| reaction | -8.4747 | -0.0053 |") {
		t.Errorf("markdown:\n%s", md)
	}
	if csv := out("csv"); !strings.Contains(csv, ",false,reaction,-8.474737994,-0.005262006219") || !strings.Contains(csv, ",false,species,,") {
		t.Errorf("csv:\n%s", csv)
	}
	var doc struct {
		Reactions []struct {
			Untagged []string         `json:"untagged"`
			Rows     []map[string]any `json:"rows"`
		} `json:"reactions"`
	}
	if err := json.Unmarshal([]byte(out("json")), &doc); err != nil {
		t.Fatal(err)
	}
	row := doc.Reactions[0].Rows[0]
	if row["source"] != "reaction" || row["sigmaLog10K"] != nil || math.Abs(row["differenceLog10K"].(float64)+0.005262006) > 1e-6 {
		t.Errorf("JSON row %v", row)
	}
	if got := doc.Reactions[1].Untagged; len(got) != 1 || got[0] != "loose" {
		t.Errorf("untagged %v", got)
	}
}
