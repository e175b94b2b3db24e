package lang

import (
	"encoding/json"
	"fmt"
	"os"
	"strings"
	"testing"
)

func TestPolyDump(t *testing.T) {
	out := os.Getenv("POLYDUMP")
	if out == "" {
		t.Skip()
	}
	bases := []string{
		"species X(g) { nasa7 200 K to 1000 K { 1 2 3 4 5 6 7 } nasa7 1000 K to 6000 K { 1 2 3 4 5 6 7 } }",
		"species X(g) \"x\" {\n  hf 1 ± 0.5 kJ/mol\n  shomate 298 K to 1200 K {\n    30.1 6.83 6.79 -2.53\n    0.082 -250.9 223.4 -241.8\n  }\n  source \"a\"\n}",
		"species X(g) { formula C2H6 nasa7 200 to 1000 K { } s 3 J/mol/K note \"n\" cp 4 }",
	}
	repl := []string{"", "x", "}", "{", "1", "K", "to", "nasa7", "±", "\"s\"", "species"}
	var b strings.Builder
	for _, base := range bases {
		words := strings.Fields(base)
		for i := range words {
			for _, r := range repl {
				for _, ins := range []bool{false, true} {
					w := append([]string(nil), words...)
					if ins {
						w = append(w[:i], append([]string{r}, w[i:]...)...)
					} else {
						w[i] = r
					}
					src := strings.Join(w, " ")
					f, diags := Parse("f.hess", []byte(src))
					js, _ := json.Marshal(f.Statements)
					fmt.Fprintf(&b, "%q\n%v\n%s\n", src, diags, js)
				}
			}
		}
	}
	os.WriteFile(out, []byte(b.String()), 0o644)
}
