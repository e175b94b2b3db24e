package lang

import (
	"fmt"
	"path/filepath"
	"strings"
	"testing"
)

// TestSyntaxErrorMutations parses statements with every property kind
// after deleting or replacing each word, or inserting a stray one, and
// compares the diagnostics with a golden file, so that a change to how a
// node parses cannot change a message unnoticed.
func TestSyntaxErrorMutations(t *testing.T) {
	bases := []string{
		"species X(g) { nasa7 200 K to 1000 K { 1 2 3 4 5 6 7 } }",
		"species X(g) \"x\" { hf 1 ± 0.5 kJ/mol shomate 298 K to 1200 K { 30.1 6.83 } source \"a\" }",
		"species X(g) { formula C2H6 s 3 J/mol/K note \"n\" cp 4 }",
		"reaction r1: A(g) + 2 B(g) <-> C(g) { dg -3.5 ± 0.2 kJ/mol logk 1.5 ± 0.1 at 500 K }",
		"reaction r2: A(g) -> C(g) { rate A 1e13 cm3/mol/s n 0.5 Ea 40 kJ/mol source \"x\" }",
	}
	checkGolden(t, filepath.Join("testdata", "syntax-mutations.golden"), mutate(bases))
}

// TestSyntaxErrorMutationsOtherStatements does the same for the statements
// participle reads, and for a reaction's combination, so that the errors
// participle reports keep their wording too.
func TestSyntaxErrorMutationsOtherStatements(t *testing.T) {
	bases := []string{
		"include \"other.hess\"",
		"settings { pressure 1 bar temperatures 300 K, 400 K to 800 K by 100 K tolerance 0.5 kJ/mol lint balance error }",
		"element D { mass 2.014 g/mol }",
		"phase aq { convention molality }",
		"mixture feed { temperature 500 K pressure 2 bar CH4(g) 1 mol H2O(g) 2 mol N2(g) }",
		"reaction r3: A(g) -> C(g) = r1 + 2 r2 - 0.5 r4 { dh 1 kJ/mol }",
	}
	checkGolden(t, filepath.Join("testdata", "syntax-mutations-other.golden"), mutate(bases))
}

// mutate parses each base statement after deleting or replacing each word,
// or inserting a stray one, and writes each source with its diagnostics.
func mutate(bases []string) []byte {
	repl := []string{"", "x", "}", "1"}
	var b strings.Builder
	for _, base := range bases {
		words := strings.Fields(base)
		for i := range words {
			for _, r := range repl {
				for _, ins := range []bool{false, true} {
					if ins && r == "" {
						continue
					}
					w := append([]string(nil), words...)
					if ins {
						w = append(w[:i], append([]string{r}, w[i:]...)...)
					} else {
						w[i] = r
					}
					src := strings.Join(w, " ")
					_, diags := Parse("f.hess", []byte(src))
					fmt.Fprintf(&b, "%s\n", src)
					for _, d := range diags {
						fmt.Fprintf(&b, "  %d: %s\n", d.Subject.Start.Column, d.Message)
					}
				}
			}
		}
	}
	return []byte(b.String())
}
