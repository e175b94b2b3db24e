package synth

import (
	"bytes"
	"regexp"
	"strings"
	"testing"
)

func TestGenerateIsDeterministic(t *testing.T) {
	cfg := Config{Seed: 7, Species: 100, Reactions: 300, OwnData: 30, Files: 4}
	a, err := Generate(cfg)
	if err != nil {
		t.Fatal(err)
	}
	b, _ := Generate(cfg)
	for _, name := range a.Names {
		if !bytes.Equal(a.Files[name], b.Files[name]) {
			t.Fatalf("%s differs between two runs with one seed", name)
		}
	}
	cfg.Seed = 8
	c, _ := Generate(cfg)
	if bytes.Equal(a.Files["reactions-1.hess"], c.Files["reactions-1.hess"]) {
		t.Error("another seed gave the same reactions")
	}
}

func TestGenerateCounts(t *testing.T) {
	g, err := Generate(Config{Seed: 1, Species: 120, Reactions: 500, OwnData: 50, Files: 5})
	if err != nil {
		t.Fatal(err)
	}
	var all strings.Builder
	for _, name := range g.Names {
		all.Write(g.Files[name])
	}
	text := all.String()
	count := func(re string) int { return len(regexp.MustCompile(re).FindAllString(text, -1)) }
	if n := count(`(?m)^species `); n != 120 {
		t.Errorf("%d species, want 120", n)
	}
	if n := count(`(?m)^  nasa7 `); n != 240 {
		t.Errorf("%d nasa7 ranges, want 240", n)
	}
	if n := count(`(?m)^reaction `); n != 500 {
		t.Errorf("%d reactions, want 500", n)
	}
	if n := count(`(?m)^  dg `); n != 50 {
		t.Errorf("%d reactions with dg, want 50", n)
	}
	if n := count(`(?m)^  rate A `); n != 50 {
		t.Errorf("%d rates, want 50", n)
	}
	if n := count(`(?m)^include "`); n != 4 || len(g.Names) != 5 {
		t.Errorf("%d includes in %d files, want 4 in 5", n, len(g.Names))
	}
	if strings.Contains(text, "-0.00000000e+00") {
		t.Error("negative zero in the output")
	}
}

// TestReactionsBalance parses the generated equations back and checks
// every element balances and no species is on both sides.
func TestReactionsBalance(t *testing.T) {
	g, err := Generate(Config{Seed: 3, Species: 300, Reactions: 2000, Files: 1})
	if err != nil {
		t.Fatal(err)
	}
	line := regexp.MustCompile(`(?m)^reaction r\d+: (.*) <-> (.*)$`)
	term := regexp.MustCompile(`^(?:(\d+) )?([A-Z][A-Za-z0-9]*)\(g\)$`)
	elem := regexp.MustCompile(`([CHNO])(\d*)`)
	side := func(s string) (map[string]int, map[string]bool) {
		counts, names := map[string]int{}, map[string]bool{}
		for _, part := range strings.Split(s, " + ") {
			m := term.FindStringSubmatch(part)
			if m == nil {
				t.Fatalf("term %q", part)
			}
			k := 1
			if m[1] != "" {
				k = int(m[1][0] - '0')
			}
			names[m[2]] = true
			for _, e := range elem.FindAllStringSubmatch(m[2], -1) {
				n := 1
				if e[2] != "" {
					n = 0
					for _, d := range e[2] {
						n = 10*n + int(d-'0')
					}
				}
				counts[e[1]] += k * n
			}
		}
		return counts, names
	}
	ms := line.FindAllStringSubmatch(string(g.Files[g.Root]), -1)
	if len(ms) != 2000 {
		t.Fatalf("%d reactions", len(ms))
	}
	for _, m := range ms {
		l, ln := side(m[1])
		r, rn := side(m[2])
		for e := range elements {
			if l[elements[e]] != r[elements[e]] {
				t.Fatalf("%q does not balance in %s", m[0], elements[e])
			}
		}
		for n := range ln {
			if rn[n] {
				t.Fatalf("%q has %s on both sides", m[0], n)
			}
		}
	}
}

func TestGenerateRejectsBadConfig(t *testing.T) {
	for _, c := range []Config{{Species: 2, Reactions: 10}, {Species: 10, Reactions: 0}, {Species: 10, Reactions: 5, OwnData: 6}} {
		if _, err := Generate(c); err == nil {
			t.Errorf("%+v: no error", c)
		}
	}
}
