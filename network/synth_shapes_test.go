package network

import (
	"testing"

	"hess/lang"
	"hess/synth"
)

// TestSynthShapesCheck compiles a small network of each generated shape
// with every check: neither may have an error, and the mechanism, whose
// equations are all distinct, must check clean.
func TestSynthShapesCheck(t *testing.T) {
	for _, shape := range []synth.Shape{synth.Spread, synth.Mechanism} {
		t.Run(shape.String(), func(t *testing.T) {
			root, src, _ := shapeSource(t, shape, 400, 2000)
			n := Load(root, src)
			if len(n.Species) != 400 || len(n.Reactions) != 2000 {
				t.Fatalf("%d species and %d reactions, want 400 and 2000", len(n.Species), len(n.Reactions))
			}
			for _, d := range n.Diagnostics {
				if d.Severity == lang.Error || shape == synth.Mechanism {
					t.Errorf("%s: %s", d.Code, d.Message)
				}
			}
		})
	}
}
