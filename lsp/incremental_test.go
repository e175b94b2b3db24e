package lsp

import (
	"encoding/json"
	"math/rand/v2"
	"os"
	"slices"
	"strconv"
	"strings"
	"testing"

	"hess/synth"
)

// TestEditsPublishWhatAFreshServerDoes sends bursts of random edits (each
// burst compiled at once and cancelled by the next change) and requires
// the diagnostics published for the last version of each burst to equal
// those a fresh server publishes for the same text: the parse caches and
// compile memo a session keeps, and its cancelled compiles, change
// nothing a client sees.
func TestEditsPublishWhatAFreshServerDoes(t *testing.T) {
	g, err := synth.Generate(synth.Config{Shape: synth.Mechanism, Seed: 3, Species: 40, Reactions: 60, OwnData: 6})
	if err != nil {
		t.Fatal(err)
	}
	kiln, err := os.ReadFile("../examples/lime-kiln.hess")
	if err != nil {
		t.Fatal(err)
	}
	rounds := 30
	if testing.Short() {
		rounds = 10
	}
	mech := string(g.Files[g.Root])
	// The same with the reactions first: edits to the species then leave
	// the reactions in place, to be reused or not.
	at := strings.Index(mech, "\nreaction ") + 1
	docs := map[string]string{"mechanism": mech, "reactions-first": mech[at:] + mech[:at], "lime-kiln": string(kiln)}
	for name, text := range docs {
		t.Run(name, func(t *testing.T) {
			dir := t.TempDir()
			uri := fileURI(dir, "doc.hess")
			c := startServer(t, Options{})
			c.initialize()
			c.open(uri, text, 1)
			c.waitDiagnostics(uri, atVersion(1))
			rng := rand.New(rand.NewPCG(uint64(len(name)), 5))
			v := int32(1)
			for round := 0; round < rounds; round++ {
				for burst := 1 + rng.IntN(3); burst > 0; burst-- {
					text = editLines(rng, text)
					v++
					c.change(uri, v, TextDocumentContentChangeEvent{Text: text})
				}
				got := c.waitDiagnostics(uri, atVersion(v))
				fresh := startServer(t, Options{})
				fresh.initialize()
				fresh.open(uri, text, v)
				want := fresh.waitDiagnostics(uri, atVersion(v))
				g, _ := json.Marshal(got.Diagnostics)
				w, _ := json.Marshal(want.Diagnostics)
				if string(g) != string(w) {
					t.Fatalf("round %d: the session publishes\n%s\na fresh server\n%s\nfor\n%s", round, g, w, text)
				}
			}
		})
	}
}

// editLines makes one random edit of the kinds a user makes.
func editLines(rng *rand.Rand, text string) string {
	lines := strings.Split(text, "\n")
	i := rng.IntN(len(lines))
	switch rng.IntN(5) {
	case 0: // a digit changed
		for j, r := range lines[i] {
			if r >= '0' && r <= '9' {
				lines[i] = lines[i][:j] + strconv.Itoa(rng.IntN(10)) + lines[i][j+1:]
				break
			}
		}
	case 1: // a coefficient put before a reaction's first term
		if at := strings.Index(lines[i], ": "); strings.HasPrefix(lines[i], "reaction ") && at > 0 {
			lines[i] = lines[i][:at+2] + "2 " + lines[i][at+2:]
		}
	case 2:
		lines = slices.Delete(lines, i, i+1)
	case 3:
		lines = slices.Insert(lines, i, lines[i])
	default: // a character deleted
		if l := lines[i]; l != "" {
			j := rng.IntN(len(l))
			lines[i] = l[:j] + l[j+1:]
		}
	}
	return strings.Join(lines, "\n")
}
