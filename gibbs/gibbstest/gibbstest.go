// Package gibbstest runs an independent Gibbs-energy minimisation (Debian's
// python3-scipy through /usr/bin/python3) on a gibbs.Problem, for tests that
// compare the solver with an outside reference. The problem travels as JSON
// (Encode); the script is testdata/minimize.py, embedded.
//
// It is for tests only and never part of a program.
package gibbstest

import (
	"bytes"
	"context"
	_ "embed"
	"encoding/json"
	"errors"
	"fmt"
	"os"
	"os/exec"
	"testing"
	"time"

	"hess/gibbs"
)

//go:embed testdata/minimize.py
var script []byte

// Python is the interpreter the reference runs under (Debian's, not a
// user-installed one).
const Python = "/usr/bin/python3"

// Problem is the JSON form of a gibbs.Problem: phases as kind names
// ("gas", "pure", "solution", "aqueous"), B as rows, b = B·N0.
type Problem struct {
	Phases        []string    `json:"phases"`
	Species       []Species   `json:"species"`
	B             [][]float64 `json:"B"`
	Totals        []float64   `json:"b"`
	PressureRatio float64     `json:"pressureRatio"`
	SolventMolarM float64     `json:"solventMolarMass"`
}

// Species is one species of Problem.
type Species struct {
	Name    string  `json:"name"`
	Phase   int     `json:"phase"`
	Mu0     float64 `json:"mu0"`
	Solvent bool    `json:"solvent,omitempty"`
}

// Answer is what the reference returns.
type Answer struct {
	N        []float64 `json:"n"`
	Lambda   []float64 `json:"lambda"`
	Residual float64   `json:"residual"`
}

// Encode writes p as JSON. Fixed species and activity-coefficient models
// are not representable and give an error.
func Encode(p gibbs.Problem) ([]byte, error) {
	if p.LnGamma != nil {
		return nil, errors.New("gibbstest: activity-coefficient models are not representable")
	}
	m, s := p.B.Dims()
	q := Problem{PressureRatio: p.PRatio, SolventMolarM: p.SolventMolarMass}
	for _, ph := range p.Phases {
		q.Phases = append(q.Phases, ph.Kind.String())
	}
	for _, sp := range p.Species {
		if sp.Fixed {
			return nil, fmt.Errorf("gibbstest: fixed species %s is not representable", sp.Name)
		}
		q.Species = append(q.Species, Species{Name: sp.Name, Phase: sp.Phase, Mu0: sp.Mu0, Solvent: sp.Solvent})
	}
	for i := 0; i < m; i++ {
		row := make([]float64, s)
		t := 0.0
		for j := range row {
			row[j] = p.B.At(i, j)
			t += row[j] * p.N0[j]
		}
		q.B = append(q.B, row)
		q.Totals = append(q.Totals, t)
	}
	return json.Marshal(q)
}

// Available reports why the reference cannot run, or nil.
func Available() error {
	if _, err := os.Stat(Python); err != nil {
		return fmt.Errorf("%s not found: %w", Python, err)
	}
	out, err := exec.Command(Python, "-c", "import scipy.optimize, numpy").CombinedOutput()
	if err != nil {
		return fmt.Errorf("python3-scipy is missing (apt-get install python3-scipy): %v: %s", err, bytes.TrimSpace(out))
	}
	return nil
}

// Require skips t when the reference cannot run, and fails it instead when
// HESS_REQUIRE_EXTERNAL=1.
func Require(t testing.TB) {
	t.Helper()
	if err := Available(); err != nil {
		if os.Getenv("HESS_REQUIRE_EXTERNAL") == "1" {
			t.Fatalf("independent solver required: %v", err)
		}
		t.Skipf("independent solver unavailable: %v", err)
	}
}

// Reference minimises p with scipy and returns its answer.
func Reference(p gibbs.Problem) (Answer, error) {
	a, err := ReferenceAll([]gibbs.Problem{p})
	if err != nil {
		return Answer{}, err
	}
	return a[0], nil
}

// ReferenceAll minimises each problem in one run of the interpreter.
func ReferenceAll(ps []gibbs.Problem) ([]Answer, error) {
	in := []byte("[")
	for i, p := range ps {
		b, err := Encode(p)
		if err != nil {
			return nil, fmt.Errorf("problem %d: %w", i, err)
		}
		if i > 0 {
			in = append(in, ',')
		}
		in = append(in, b...)
	}
	in = append(in, ']')
	dir, err := os.MkdirTemp("", "gibbstest")
	if err != nil {
		return nil, err
	}
	defer os.RemoveAll(dir)
	path := dir + "/minimize.py"
	if err := os.WriteFile(path, script, 0o600); err != nil {
		return nil, err
	}
	ctx, cancel := context.WithTimeout(context.Background(), 5*time.Minute)
	defer cancel()
	cmd := exec.CommandContext(ctx, Python, path)
	cmd.Stdin = bytes.NewReader(in)
	var stdout, stderr bytes.Buffer
	cmd.Stdout, cmd.Stderr = &stdout, &stderr
	if err := cmd.Run(); err != nil {
		return nil, fmt.Errorf("reference minimisation: %v: %s", err, bytes.TrimSpace(stderr.Bytes()))
	}
	var a []Answer
	if err := json.Unmarshal(stdout.Bytes(), &a); err != nil {
		return nil, fmt.Errorf("reference output: %w", err)
	}
	if len(a) != len(ps) {
		return nil, fmt.Errorf("reference returned %d answers for %d problems", len(a), len(ps))
	}
	return a, nil
}
