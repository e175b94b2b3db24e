package network

import (
	"bytes"
	"errors"
	"fmt"
	"io/fs"
	"path/filepath"
	"strings"
	"testing"
)

// memSource serves files from memory, by cleaned path.
type memSource map[string][]byte

func (m memSource) ReadFile(path string) ([]byte, error) {
	if b, ok := m[filepath.Clean(path)]; ok {
		return b, nil
	}
	return nil, &fs.PathError{Op: "open", Path: path, Err: fs.ErrNotExist}
}

func loadText(t testing.TB, text string) *Network {
	t.Helper()
	return Load("net.hess", memSource{"net.hess": []byte(text)}, Options{})
}

// TestNoPanic compiles hostile inputs end to end: each must come back with
// diagnostics, never a panic.
func TestNoPanic(t *testing.T) {
	deep := "species " + strings.Repeat("(", 10000) + "H" + strings.Repeat(")", 10000) + "(g)\n"
	cases := map[string]string{
		"empty":            "",
		"only comments":    "# a\n# b\n",
		"malformed utf8":   "species H2\xff\xfe(g)\nreaction r: H2(g) <-> H2\xc3(g)\n\"\xff\"",
		"nul bytes":        "species H2(g)\x00, O2(g)\nreaction\x00 r: H2(g) <-> H2(g)\n",
		"deep parentheses": deep,
		"deep braces":      "species H2(g) " + strings.Repeat("{", 10000) + strings.Repeat("}", 10000),
		"huge numbers":     "species H2(g) { hf 1e999 kJ/mol s -1e999 J/mol/K cp 1e-999 J/mol/K }\nreaction r: 1e999 H2(g) <-> 99999999999999999999999999999 H2(g)\n",
		"huge counts":      "species C99999999999999999999999H4(g)\nreaction r: C99999999999999999999999H4(g) <-> C99999999999999999999999H4(g)\n",
		"temperatures":     "settings { temperatures 1 K to 1e300 K by 1e-300 K }\n",
		"unterminated":     "include \"never closed\nspecies A(",
		"stray tokens":     "} } { + -> <-> ± , : = 1/0 \"\"",
		"self include":     "include \"net.hess\"\n",
	}
	for name, text := range cases {
		t.Run(name, func(t *testing.T) {
			n := loadText(t, text)
			if name != "empty" && name != "only comments" && name != "huge counts" && len(n.Diagnostics) == 0 {
				t.Errorf("expected diagnostics for %s", name)
			}
		})
	}
}

// TestLargeFile compiles a generated network of about 50 MB.
func TestLargeFile(t *testing.T) {
	if testing.Short() {
		t.Skip("large input skipped in -short mode")
	}
	if raceEnabled {
		t.Skip("the 50 MB compile takes minutes under the race detector; run it without -race")
	}
	var b bytes.Buffer
	b.WriteString("species H2(g), O2(g), H2O(g)\n")
	count := 0
	for b.Len() < 50<<20 {
		fmt.Fprintf(&b, "reaction r%d: 2 H2(g) + O2(g) <-> 2 H2O(g) # a comment to pad the line out\n", count)
		count++
	}
	n := Load("big.hess", memSource{"big.hess": b.Bytes()}, Options{})
	if len(n.Reactions) != count {
		t.Fatalf("got %d reactions, want %d", len(n.Reactions), count)
	}
	// Every reaction after the first repeats it.
	dups := 0
	for _, d := range n.Diagnostics {
		if d.Code == "duplicate-reaction" {
			dups++
		} else {
			t.Fatalf("unexpected %s: %s", d.Code, d.Message)
		}
	}
	if dups != count-1 {
		t.Errorf("got %d duplicate-reaction warnings, want %d", dups, count-1)
	}
}

func TestMissingRoot(t *testing.T) {
	n := Load("absent.hess", memSource{}, Options{})
	if len(n.Files) != 0 || len(n.Diagnostics) != 1 || n.Diagnostics[0].Code != "include-missing" {
		t.Fatalf("got %d files, diagnostics %v", len(n.Files), n.Diagnostics)
	}
	// The message names the file and the reason the source gave
	// (fs.ErrNotExist, "file does not exist", said as "no such file").
	if got := n.Diagnostics[0].Message; got != "cannot read absent.hess: no such file" {
		t.Errorf("message %q, want %q", got, "cannot read absent.hess: no such file")
	}
	// A source that fails another way says so instead.
	other := Load("locked.hess", failingSource{errors.New("permission denied")}, Options{})
	if len(other.Diagnostics) != 1 || !strings.Contains(other.Diagnostics[0].Message, "permission denied") ||
		strings.Contains(other.Diagnostics[0].Message, "no such file") {
		t.Errorf("unreadable root: %v", other.Diagnostics)
	}
}

// failingSource fails every read with its error.
type failingSource struct{ err error }

func (f failingSource) ReadFile(string) ([]byte, error) { return nil, f.err }
