package lang

import (
	"fmt"
	"testing"
)

func TestSeverity(t *testing.T) {
	for _, tc := range []struct {
		sev  Severity
		name string
	}{{Off, "off"}, {Info, "info"}, {Warning, "warning"}, {Error, "error"}} {
		if got := tc.sev.String(); got != tc.name {
			t.Errorf("%d.String() = %q, want %q", tc.sev, got, tc.name)
		}
		got, ok := ParseSeverity(tc.name)
		if !ok || got != tc.sev {
			t.Errorf("ParseSeverity(%q) = %v, %v", tc.name, got, ok)
		}
	}
	var zero Severity
	if zero != SeverityInvalid || zero.String() != "invalid" {
		t.Errorf("zero severity is %q", zero)
	}
	for _, bad := range []string{"", "invalid", "Error", "warn"} {
		if got, ok := ParseSeverity(bad); ok || got != SeverityInvalid {
			t.Errorf("ParseSeverity(%q) = %v, %v", bad, got, ok)
		}
	}
	if !(Off < Info && Info < Warning && Warning < Error) {
		t.Error("severities are not ordered from least to most serious")
	}
}

func TestSpan(t *testing.T) {
	a := Span{File: "a.hess", Start: Pos{1, 5, 4}, End: Pos{1, 9, 8}}
	b := Span{File: "a.hess", Start: Pos{2, 1, 10}, End: Pos{2, 3, 12}}
	if got := a.Join(b); got.Start != a.Start || got.End != b.End {
		t.Errorf("Join = %+v", got)
	}
	if got := b.Join(a); got.Start != a.Start || got.End != b.End {
		t.Errorf("Join reversed = %+v", got)
	}
	if got := a.Join(Span{}); got != a {
		t.Errorf("Join with invalid = %+v", got)
	}
	if got := (Span{}).Join(b); got != b {
		t.Errorf("invalid Join b = %+v", got)
	}
	if a.String() != "a.hess:1:5" {
		t.Errorf("String() = %q", a.String())
	}
	if (Span{}).IsValid() || (Pos{}).IsValid() || !a.IsValid() {
		t.Error("IsValid is wrong")
	}
}

func TestDiagnostics(t *testing.T) {
	at := func(file string, line, col int) Span {
		return Span{File: file, Start: Pos{line, col, 0}, End: Pos{line, col + 1, 1}}
	}
	ds := Diagnostics{
		{Code: "unused-species", Severity: Warning, Message: "w", Subject: at("b.hess", 1, 1)},
		{Code: "syntax", Severity: Error, Message: "e2", Subject: at("a.hess", 3, 2)},
		{Code: "element-imbalance", Severity: Error, Message: "e1", Subject: at("a.hess", 3, 2)},
		{Code: "syntax", Severity: Error, Message: "e0", Subject: at("a.hess", 1, 9)},
		{Code: "not-in-mixture", Severity: Info, Message: "i", Subject: at("a.hess", 2, 1)},
	}
	if !ds.HasErrors() || ds.Count(Error) != 3 || ds.Count(Warning) != 1 || ds.Count(Info) != 1 || ds.Count(Off) != 0 {
		t.Errorf("counts: errors %v %d, warnings %d", ds.HasErrors(), ds.Count(Error), ds.Count(Warning))
	}
	ds.Sort()
	var order []string
	for _, d := range ds {
		order = append(order, d.Message)
	}
	if fmt.Sprint(order) != "[e0 i e1 e2 w]" {
		t.Errorf("sorted order %v", order)
	}
	err := ds.Err()
	if err == nil {
		t.Fatal("Err() is nil with errors present")
	}
	if want := "a.hess:1:9: error: e0 [syntax] (and 2 more errors)"; err.Error() != want {
		t.Errorf("Err() = %q, want %q", err, want)
	}
	one := Diagnostics{{Code: "syntax", Severity: Error, Message: "only", Subject: at("a.hess", 1, 1)}}
	if got := one.Err().Error(); got != "a.hess:1:1: error: only [syntax]" {
		t.Errorf("Err() = %q", got)
	}
	// No typed nil: a list without errors gives a nil error interface.
	warnings := Diagnostics{{Code: "unused-species", Severity: Warning}}
	if warnings.HasErrors() || warnings.Err() != nil {
		t.Error("warnings count as errors")
	}
	var none Diagnostics
	if err := none.Err(); err != nil {
		t.Errorf("empty list gives error %v", err)
	}
	// A diagnostic whose severity was never set is not an error.
	unset := Diagnostics{{Code: "syntax"}}
	if unset.HasErrors() {
		t.Error("an unset severity passes for an error")
	}
}
