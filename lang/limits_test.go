package lang

import (
	"strings"
	"testing"
)

// A statement past MaxStatementTokens is reported and the rest of it
// skipped; the statement after it is read as usual.
func TestStatementTokenLimit(t *testing.T) {
	src := "species " + strings.Repeat("A(g), ", MaxStatementTokens) + "B(g)\nspecies C(g)\n"
	f, diags := Parse("big.hess", []byte(src))
	found := false
	for _, d := range diags {
		found = found || (d.Code == CodeSyntax && strings.Contains(d.Message, "the limit on one statement"))
	}
	if !found {
		t.Errorf("no limit diagnostic among %d", len(diags))
	}
	last := f.Statements[len(f.Statements)-1]
	if last.Species == nil || last.Broken || last.Position().Line != 2 {
		t.Errorf("the statement after the long one: %+v", last)
	}
}
