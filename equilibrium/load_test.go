package equilibrium

import (
	"io/fs"
	"path/filepath"
	"testing"

	"hess/lang"
	"hess/network"
)

// memSource serves only the files it holds, by cleaned path.
type memSource map[string][]byte

func (m memSource) ReadFile(path string) ([]byte, error) {
	if b, ok := m[filepath.Clean(path)]; ok {
		return b, nil
	}
	return nil, &fs.PathError{Op: "open", Path: path, Err: fs.ErrNotExist}
}

// loadThermo compiles src as a network whose root lies in network's
// testdata/thermo, so that it can include the species libraries there
// (published Shomate and NASA 7-term sets). It fails the test on any error
// diagnostic.
func loadThermo(t testing.TB, src string) *network.Network {
	t.Helper()
	dir, err := filepath.Abs(filepath.Join("..", "network", "testdata", "thermo"))
	if err != nil {
		t.Fatal(err)
	}
	root := filepath.Join(dir, "net.hess")
	n := network.Load(root, network.Overlay{Files: map[string][]byte{root: []byte(src)}, Base: network.Disk{}}, network.Options{})
	for _, d := range n.Diagnostics {
		if d.Severity == lang.Error {
			t.Fatalf("%s:%d: %s: %s", d.Subject.File, d.Subject.Start.Line, d.Code, d.Message)
		}
	}
	return n
}

// loadText compiles text as the only file of a network.
func loadText(t testing.TB, text string) *network.Network {
	t.Helper()
	return network.Load("net.hess", memSource{"net.hess": []byte(text)}, network.Options{})
}
