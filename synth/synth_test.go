package synth

import (
	"bytes"
	"regexp"
	"slices"
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

func TestMechanismIsDeterministic(t *testing.T) {
	cfg := Config{Shape: Mechanism, Seed: 7, Species: 200, Reactions: 600, OwnData: 6}
	a, err := Generate(cfg)
	if err != nil {
		t.Fatal(err)
	}
	b, _ := Generate(cfg)
	if !bytes.Equal(a.Files[a.Root], b.Files[b.Root]) {
		t.Fatal("two runs with one seed differ")
	}
	cfg.Seed = 8
	c, _ := Generate(cfg)
	if bytes.Equal(a.Files[a.Root], c.Files[c.Root]) {
		t.Error("another seed gave the same network")
	}
}

func TestMechanismCounts(t *testing.T) {
	g, err := Generate(Config{Shape: Mechanism, Seed: 1, Species: 500, Reactions: 2000, OwnData: 20, Files: 4})
	if err != nil {
		t.Fatal(err)
	}
	if len(g.Names) != 1 || g.Root != g.Names[0] {
		t.Fatalf("files %v, want the root alone", g.Names)
	}
	text := string(g.Files[g.Root])
	count := func(re string) int { return len(regexp.MustCompile(re).FindAllString(text, -1)) }
	for _, c := range []struct {
		what, re string
		want     int
	}{
		{"species", `(?m)^species `, 500},
		{"nasa7 ranges", `(?m)^  nasa7 `, 1000},
		{"isomers declaring their formula", `(?m)^  formula `, 100},
		{"reactions", `(?m)^reaction `, 2000},
		{"reactions with dg", `(?m)^  dg `, 20},
		{"rates", `(?m)^  rate A `, 20},
		{"includes", `(?m)^include `, 0},
	} {
		if n := count(c.re); n != c.want {
			t.Errorf("%d %s, want %d", n, c.what, c.want)
		}
	}
	// Five coefficients to a line, all five heat-capacity terms written.
	if n := count(`(?m)^    (?:-?\d\.\d{9}E[+-]\d\d ){4}-?\d\.\d{9}E[+-]\d\d$`); n != 1000 {
		t.Errorf("%d lines of five coefficients, want 1000", n)
	}
	if strings.Contains(text, "-0.000000000E+00") {
		t.Error("negative zero in the output")
	}
	if n := count(`(?m)^  nasa7 200 K to 1000 K `); n == 0 || n == 500 {
		t.Errorf("%d of 500 species join at 1000 K; the join should vary", n)
	}
}

// TestMechanismReactionsBalance reads the generated equations back with
// each species' formula (the declared one for isomers) and checks that
// every element balances, that no species is on both sides, that no
// equation is written twice either way round and that every species of
// two or more atoms takes part.
func TestMechanismReactionsBalance(t *testing.T) {
	g, err := Generate(Config{Shape: Mechanism, Seed: 3, Species: 400, Reactions: 3000})
	if err != nil {
		t.Fatal(err)
	}
	text := string(g.Files[g.Root])
	formulas := map[string]string{}
	decl := regexp.MustCompile(`(?m)^species ([A-Za-z0-9]+)\(g\) \{\n(?:  formula ([A-Za-z0-9]+)\n)?`)
	for _, m := range decl.FindAllStringSubmatch(text, -1) {
		formulas[m[1]] = m[1]
		if m[2] != "" {
			formulas[m[1]] = m[2]
		}
	}
	if len(formulas) != 400 {
		t.Fatalf("%d species declared", len(formulas))
	}
	line := regexp.MustCompile(`(?m)^reaction R\d+: (.*) <-> (.*)$`)
	term := regexp.MustCompile(`^(?:(\d+) )?([A-Za-z0-9]+)\(g\)$`)
	elem := regexp.MustCompile(`([CHNO])(\d*)`)
	used := map[string]bool{}
	side := func(s string) (map[string]int, []string) {
		counts := map[string]int{}
		var names []string
		for _, part := range strings.Split(s, " + ") {
			m := term.FindStringSubmatch(part)
			if m == nil || formulas[m[2]] == "" {
				t.Fatalf("term %q", part)
			}
			k := 1
			if m[1] != "" {
				k = int(m[1][0] - '0')
			}
			names = append(names, part)
			used[m[2]] = true
			for _, e := range elem.FindAllStringSubmatch(formulas[m[2]], -1) {
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
		slices.Sort(names)
		return counts, names
	}
	ms := line.FindAllStringSubmatch(text, -1)
	if len(ms) != 3000 {
		t.Fatalf("%d reactions", len(ms))
	}
	equations := map[string]bool{}
	for _, m := range ms {
		l, ln := side(m[1])
		r, rn := side(m[2])
		for _, e := range elements {
			if l[e] != r[e] {
				t.Fatalf("%q does not balance in %s", m[0], e)
			}
		}
		for _, n := range ln {
			if slices.Contains(rn, n) {
				t.Fatalf("%q has %s on both sides", m[0], n)
			}
		}
		a, b := strings.Join(ln, "+"), strings.Join(rn, "+")
		if equations[a+"="+b] || equations[b+"="+a] {
			t.Fatalf("%q written twice", m[0])
		}
		equations[a+"="+b] = true
	}
	for name, f := range formulas {
		if !used[name] && len(f) > 1 {
			t.Errorf("%s takes part in no reaction", name)
		}
	}
}

func TestParseShape(t *testing.T) {
	for _, s := range []Shape{Spread, Mechanism} {
		if got, err := ParseShape(s.String()); err != nil || got != s {
			t.Errorf("ParseShape(%q) = %v, %v", s.String(), got, err)
		}
	}
	if _, err := ParseShape("tree"); err == nil {
		t.Error("an unknown shape gave no error")
	}
	if _, err := Generate(Config{Shape: Shape(9), Species: 10, Reactions: 5}); err == nil {
		t.Error("Generate took an unknown shape")
	}
}
