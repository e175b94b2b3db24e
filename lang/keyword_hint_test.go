package lang

import (
	"strings"
	"testing"
)

// TestKeywordHint: a misspelt statement keyword, where a statement could
// start, names the keyword it is close to; other words do not.
func TestKeywordHint(t *testing.T) {
	for _, tc := range []struct {
		src, want string
	}{
		{"reacton r: A(g) <-> B(g)\n", `found "reacton"; did you mean "reaction"?`},
		{"speces A(g)\n", `did you mean "species"?`},
		{"Mixture m { A(g) 1 bar }\n", `did you mean "mixture"?`},
		{"species A(g)\nspeces B(g)\n", `found "speces"; did you mean "species"?`},
		{"species A(g)\nelemnt Q { mass 1 g/mol }\n", `did you mean "element"?`},
	} {
		_, diags := Parse("t.hess", []byte(tc.src))
		if len(diags) == 0 || !strings.Contains(diags[0].Message, tc.want) {
			t.Errorf("%q: diagnostics %v, want one with %q", tc.src, diags, tc.want)
		}
	}
	for _, src := range []string{"frobnicate A(g)\n", "species A(g) B(g)\n"} {
		_, diags := Parse("t.hess", []byte(src))
		for _, d := range diags {
			if strings.Contains(d.Message, "did you mean") {
				t.Errorf("%q: unexpected suggestion in %q", src, d.Message)
			}
		}
	}
}
