package network

import (
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"

	"hess/lang"
)

// Codes of LANGUAGE.md's check table that later work implements; they are
// not registered yet, so `hess explain` and SARIF do not list them.
var pendingCodes = map[string]bool{}

// Codes registered here that LANGUAGE.md's table does not list yet.
var proposedCodes = map[string]bool{"unknown-phase": true, "polynomial-mismatch": true, "determined-species": true,
	"mixture-amount": true, "mixture-incomplete": true, "mixture-fractions": true, "not-in-mixture": true}

func TestRegistry(t *testing.T) {
	seen := map[string]bool{}
	for _, c := range Checks() {
		if seen[c.Name] {
			t.Errorf("check %s registered twice", c.Name)
		}
		seen[c.Name] = true
		if !regexp.MustCompile(`^[a-z]+(-[a-z]+)*$`).MatchString(c.Name) {
			t.Errorf("check name %q is not lower-case words joined by -", c.Name)
		}
		if c.Title() == "" || c.Explanation() == "" {
			t.Errorf("check %s lacks a title or an explanation", c.Name)
		}
		if strings.HasSuffix(c.Title(), ".") || strings.ToLower(c.Title()[:1]) != c.Title()[:1] {
			t.Errorf("check %s: title %q should be lower case without a trailing period", c.Name, c.Title())
		}
		switch c.Severity {
		case lang.Error, lang.Warning, lang.Info:
		default:
			t.Errorf("check %s has no valid default severity", c.Name)
		}
		if LookupCheck(c.Name) != c {
			t.Errorf("LookupCheck(%q) does not find it", c.Name)
		}
	}
}

// TestRegistryMatchesLanguage compares the registry with the check table of
// the language contract, where the design folder is beside the repository.
func TestRegistryMatchesLanguage(t *testing.T) {
	path := filepath.Join("..", "..", "shared", "design", "LANGUAGE.md")
	doc, err := os.ReadFile(path)
	if err != nil {
		if os.Getenv("HESS_REQUIRE_EXTERNAL") == "1" {
			t.Fatalf("LANGUAGE.md not found at %s: %v", path, err)
		}
		t.Skipf("LANGUAGE.md not found at %s (the design folder lies beside the repository)", path)
	}
	_, table, _ := strings.Cut(string(doc), "## Checks")
	documented := map[string]bool{}
	for _, line := range strings.Split(table, "\n") {
		if !strings.HasPrefix(line, "| `") {
			continue
		}
		first := strings.Split(line, "|")[1]
		for _, m := range regexp.MustCompile("`([a-z-]+)`").FindAllStringSubmatch(first, -1) {
			documented[m[1]] = true
		}
	}
	if len(documented) < 20 {
		t.Fatalf("found only %d codes in LANGUAGE.md's check table", len(documented))
	}
	for code := range documented {
		if LookupCheck(code) == nil && !pendingCodes[code] {
			t.Errorf("LANGUAGE.md lists %s, which is neither registered nor pending", code)
		}
		if LookupCheck(code) != nil && pendingCodes[code] {
			t.Errorf("%s is registered: remove it from pendingCodes", code)
		}
	}
	for _, c := range Checks() {
		if !documented[c.Name] && !proposedCodes[c.Name] {
			t.Errorf("check %s is not in LANGUAGE.md's table", c.Name)
		}
	}
}
