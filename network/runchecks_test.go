package network

import "testing"

// TestRunChecksDeterministic checks that loading the same network twice,
// with the checks run side by side, gives the same diagnostics in the same
// order.
func TestRunChecksDeterministic(t *testing.T) {
	root, src, _ := synthSource(t, 200, 1000)
	a := Load(root, src, Options{})
	b := Load(root, src, Options{})
	if len(a.Diagnostics) == 0 {
		t.Fatal("no diagnostics on the generated network")
	}
	if len(a.Diagnostics) != len(b.Diagnostics) {
		t.Fatalf("%d diagnostics, then %d", len(a.Diagnostics), len(b.Diagnostics))
	}
	for i := range a.Diagnostics {
		if a.Diagnostics[i].Code != b.Diagnostics[i].Code || a.Diagnostics[i].Message != b.Diagnostics[i].Message || a.Diagnostics[i].Subject != b.Diagnostics[i].Subject {
			t.Fatalf("diagnostic %d differs: %v / %v", i, a.Diagnostics[i], b.Diagnostics[i])
		}
	}
}
