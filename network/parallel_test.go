package network

import (
	"fmt"
	"path"
	"runtime"
	"testing"

	"hess/synth"
)

// faults are statements that give diagnostics from every parallel pass:
// species data, reaction sides, reaction properties, and the serial pass
// that registers reaction names.
const faults = `species Ar(g) { hf 0 kJ/mol  s 154.8 J/mol/K  cp 20.8 J/mol/K }
species Ar2(g) { hf 5 kJ/mol  s 200 J/furlong  cp 30 J/mol/K }
species Xq(g)
reaction fault1: Ar2(g) -> 3 Ar(g)
reaction fault2: Ar2(g) -> 2 Ar(g) + Zz(g)
reaction fault1: Ar(g) -> Ar(g)
reaction fault3: 2 Ar(g) -> Ar2(g) { dg 5 kJ/furlong  dh 1 kJ/mol  dh 2 kJ/mol }
reaction fault4: 0 Ar(g) -> Ar2(g)
reaction fault5: Ar2(g) <-> 2 Ar(g)
`

// TestParallelMatchesSerial compiles a network large enough for every
// parallel pass of the parser and the compiler to use several workers,
// with faults added, once on one processor and once on four: the
// diagnostics and the model must be the same, in the same order.
func TestParallelMatchesSerial(t *testing.T) {
	g, err := synth.Generate(synth.Config{Seed: 3, Species: 600, Reactions: 3000, OwnData: 300, Files: 2})
	if err != nil {
		t.Fatal(err)
	}
	src := memSource{}
	for name, b := range g.Files {
		src[path.Join("/syn", name)] = b
	}
	root := path.Join("/syn", g.Root)
	src[root] = append(append([]byte(nil), src[root]...), "\ninclude \"faults.hess\"\n"...)
	src["/syn/faults.hess"] = []byte(faults)

	defer runtime.GOMAXPROCS(runtime.GOMAXPROCS(0))
	var runs [2]string
	for i, procs := range []int{1, 4} {
		runtime.GOMAXPROCS(procs)
		runs[i] = describeNetwork(Load(root, src, Options{}))
	}
	if runs[0] != runs[1] {
		t.Errorf("one processor and four give different networks:\n--- one\n%.2000s\n--- four\n%.2000s", runs[0], runs[1])
	}
	for _, code := range []string{"element-imbalance", "undefined-species", "duplicate-reaction-name", "unit-mismatch", "syntax", "duplicate-reaction"} {
		if !containsCode(Load(root, src, Options{}), code) {
			t.Errorf("no %s among the diagnostics: the faults do not reach every pass", code)
		}
	}
}

func containsCode(n *Network, code string) bool {
	for _, d := range n.Diagnostics {
		if string(d.Code) == code {
			return true
		}
	}
	return false
}

// describeNetwork writes out what the compiler built, in order.
func describeNetwork(n *Network) string {
	out := ""
	for _, d := range n.Diagnostics {
		out += fmt.Sprintf("%s %s %v %s\n", d.Code, d.Subject, d.Severity, d.Message)
	}
	for _, sp := range n.Species {
		out += fmt.Sprintf("species %s %s formula=%v ranges=%d used=%v\n", sp.Key, sp.Span, sp.HasFormula, len(sp.Ranges), sp.Used)
	}
	for _, rx := range n.Reactions {
		out += fmt.Sprintf("reaction %s %s resolved=%v facts=%+v dg=%v rate=%v\n", rx.Name, rx.Span(), rx.Resolved, rx.stoich, rx.Dg != nil, rx.Rate != nil)
	}
	return out
}
