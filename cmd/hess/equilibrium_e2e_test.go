package main

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
)

// TestEquilibriumBadFeeds runs every bad feed of testdata/equilibrium
// through the built binary: each must give the diagnostic its first line
// expects (# expect CODE "part of the message"), exit status 1 and no
// numbers on stdout. A comment "# run with ARGS" gives extra arguments.
func TestEquilibriumBadFeeds(t *testing.T) {
	files, err := filepath.Glob(filepath.Join("..", "..", "testdata", "equilibrium", "bad-*.hess"))
	if err != nil || len(files) == 0 {
		t.Fatalf("no bad feeds: %v", err)
	}
	expect := regexp.MustCompile(`^# expect ([a-z-]+) "([^"]*)"`)
	runWith := regexp.MustCompile(`(?m)^# run with (--[a-z]+) "?([^"\n]*)"?$`)
	for _, f := range files {
		src, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		m := expect.FindSubmatch(src)
		if m == nil {
			t.Fatalf("%s: no # expect line", f)
		}
		rel := filepath.ToSlash(strings.TrimPrefix(f, filepath.Join("..", "..")+string(filepath.Separator)))
		args := []string{"equilibrium"}
		if r := runWith.FindSubmatch(src); r != nil {
			args = append(args, string(r[1]), string(r[2]))
		}
		args = append(args, rel)
		r := runHess(t, args...)
		if r.code != exitFindings || r.stdout != "" {
			t.Errorf("%s: exit %d, stdout %q (want 1 and nothing)", rel, r.code, r.stdout)
		}
		if !strings.Contains(r.stderr, "["+string(m[1])+"]") || !strings.Contains(r.stderr, string(m[2])) {
			t.Errorf("%s: want %s %q in\n%s", rel, m[1], m[2], r.stderr)
		}
	}
}

// TestEquilibriumEndToEnd drives the built binary on the shipped hydrogen
// plant: text and JSON against golden files, CSV and Markdown by their
// shape, a sweep, the elements basis and usage errors.
func TestEquilibriumEndToEnd(t *testing.T) {
	const plant = "examples/hydrogen-plant/reformer.hess"
	for _, format := range []string{"text", "json"} {
		r := runHess(t, "equilibrium", "--format", format, "--mixture", "feed-sc3", "--mixture", "feed-sc1-5", plant)
		if r.code != 0 || r.stderr != "" {
			t.Fatalf("%s: exit %d\n%s", format, r.code, r.stderr)
		}
		compareGolden(t, filepath.Join("testdata", "equilibrium", "plant."+format+".golden"), roundingFree(r.stdout))
	}
	r := runHess(t, "equilibrium", "--format", "json", "--mixture", "feed-sc3", plant)
	var doc struct {
		Network string `json:"network"`
		Results []struct {
			Mixture   string   `json:"mixture"`
			T         float64  `json:"T_K"`
			P         float64  `json:"pressure_bar"`
			Basis     string   `json:"basis"`
			Adiabatic bool     `json:"adiabatic"`
			Converged bool     `json:"converged"`
			Heat      *float64 `json:"heat_kJ"`
			HeatMol   *float64 `json:"heat_kJ_per_mol_feed"`
			Phases    []struct {
				Phase   string  `json:"phase"`
				Present bool    `json:"present"`
				Amount  float64 `json:"amount_mol"`
			} `json:"phases"`
			Species []struct {
				Name         string  `json:"name"`
				Phase        string  `json:"phase"`
				Amount       float64 `json:"amount_mol"`
				MoleFraction float64 `json:"moleFraction"`
				Activity     float64 `json:"activity"`
			} `json:"species"`
			Reactions []struct {
				Name string   `json:"name"`
				QK   *float64 `json:"log10QoverK"`
			} `json:"reactions"`
			Residual     *float64 `json:"elementResidual"`
			Extrapolated []string `json:"extrapolated"`
		} `json:"results"`
	}
	dec := json.NewDecoder(bytes.NewReader([]byte(r.stdout)))
	dec.DisallowUnknownFields()
	if err := dec.Decode(&doc); err != nil {
		t.Fatalf("JSON does not keep to the contract: %v", err)
	}
	if len(doc.Results) != 1 || doc.Results[0].T != 1123.15 || doc.Results[0].P != 25 || doc.Results[0].Basis != "reactions" ||
		!doc.Results[0].Converged || doc.Results[0].Heat == nil || doc.Results[0].Residual == nil || len(doc.Results[0].Species) == 0 {
		t.Errorf("JSON: %+v", doc)
	}

	r = runHess(t, "equilibrium", "--format", "csv", "--mixture", "feed-sc3", plant)
	lines := strings.Split(strings.TrimSpace(r.stdout), "\n")
	if r.code != 0 || !strings.HasPrefix(lines[0], "mixture,T [K],P [bar],basis,") || len(lines) < 8 ||
		!strings.Contains(r.stdout, "feed-sc3,1123.15,25,reactions,false,true,species,H2(g),g,") {
		t.Errorf("CSV: exit %d\n%s", r.code, r.stdout)
	}
	r = runHess(t, "equilibrium", "--format", "markdown", "--mixture", "feed-sc3", plant)
	if r.code != 0 || !strings.Contains(r.stdout, "## feed-sc3 at 1123.15 K, 25 bar") || !strings.Contains(r.stdout, "| species | phase |") ||
		!strings.Contains(r.stdout, "Caution:") {
		t.Errorf("Markdown: exit %d\n%s", r.code, r.stdout)
	}
	r = runHess(t, "equilibrium", "--mixture", "feed-sc3", "--temperatures", "700 K to 1200 K by 25 K", "--pressure", "25 bar", "--format", "csv", plant)
	if r.code != 0 || strings.Count(r.stdout, ",phase,g,g,") != 21 {
		t.Errorf("sweep: exit %d, %d results\n%s", r.code, strings.Count(r.stdout, ",phase,g,g,"), r.stderr)
	}
	r = runHess(t, "equilibrium", "--elements", "--mixture", "feed-sc3", plant)
	if r.code != 0 || !strings.Contains(r.stdout, "basis: elements") {
		t.Errorf("elements: exit %d\n%s%s", r.code, r.stdout, r.stderr)
	}
	for _, bad := range [][]string{
		{"equilibrium", "--mixture", "nowhere", plant},
		{"equilibrium", "--pressure", "25 K", plant},
		{"equilibrium", "--adiabatic", "--temperatures", "900 K", plant},
		{"equilibrium"},
	} {
		if r := runHess(t, bad...); r.code != exitTrouble || r.stdout != "" {
			t.Errorf("%v: exit %d\n%s", bad, r.code, r.stdout)
		}
	}
	if r := runHess(t, "equilibrium", "--help"); r.code != 0 || !strings.Contains(r.stdout, "two-way (<->) and one-way (->) alike") ||
		!strings.Contains(r.stdout, "licensed engineering practice") {
		t.Errorf("help: exit %d\n%s", r.code, r.stdout)
	}
}

// roundingFree replaces the residuals of a JSON document that sit at the
// rounding of double precision (below 1e-12), which differ from one machine
// to another, by 0.
func roundingFree(s string) []byte {
	tiny := regexp.MustCompile(`("(?:log10QoverK|elementResidual)": )-?[0-9.]+e-(?:1[3-9]|[2-9][0-9]|[1-9][0-9]{2})`)
	return []byte(tiny.ReplaceAllString(s, "${1}0"))
}

// TestEquilibriumPlot draws a feed's composition against T through the
// built binary, linear and log, and refuses --equilibrium without a
// mixture.
func TestEquilibriumPlot(t *testing.T) {
	dir := t.TempDir()
	for _, extra := range [][]string{nil, {"--log"}} {
		out := filepath.Join(dir, "eq.svg")
		args := append([]string{"plot", "--equilibrium", "--mixture", "feed-sc3", "--temperatures", "700 K to 1200 K by 100 K", "-o", out}, extra...)
		r := runHess(t, append(args, "examples/hydrogen-plant/reformer.hess")...)
		if r.code != 0 {
			t.Fatalf("%v: exit %d\n%s", extra, r.code, r.stderr)
		}
		svg, err := os.ReadFile(out)
		if err != nil || !bytes.Contains(svg, []byte("<svg")) || !bytes.Contains(svg, []byte("H2(g)")) {
			t.Errorf("%v: no plot with an H2(g) line: %v", extra, err)
		}
	}
	if r := runHess(t, "plot", "--equilibrium", "-o", filepath.Join(dir, "x.svg"), "examples/hydrogen-plant/reformer.hess"); r.code != exitTrouble {
		t.Errorf("--equilibrium without --mixture: exit %d", r.code)
	}
}
