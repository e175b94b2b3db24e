package network

import (
	"fmt"
	"testing"

	"hess/lang"
	"hess/synth"
)

// TestSynthShapesCheck compiles small networks of each generated shape
// with every check: none may have an error, and the mechanism, whose
// equations are all distinct and whose species all take part, must check
// clean, also with half as many reactions as species.
func TestSynthShapesCheck(t *testing.T) {
	for _, c := range []struct {
		shape              synth.Shape
		species, reactions int
	}{{synth.Spread, 400, 2000}, {synth.Mechanism, 400, 2000}, {synth.Mechanism, 1000, 500}} {
		shape := c.shape
		t.Run(fmt.Sprintf("%v/%d/%d", shape, c.species, c.reactions), func(t *testing.T) {
			root, src, _ := shapeSource(t, shape, c.species, c.reactions)
			n := Load(root, src, Options{})
			if len(n.Species) != c.species || len(n.Reactions) != c.reactions {
				t.Fatalf("%d species and %d reactions, want %d and %d", len(n.Species), len(n.Reactions), c.species, c.reactions)
			}
			for _, d := range n.Diagnostics {
				if d.Severity == lang.Error || shape == synth.Mechanism {
					t.Errorf("%s: %s", d.Code, d.Message)
				}
			}
		})
	}
}
