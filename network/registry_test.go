package network

import (
	"os"
	"regexp"
	"strings"
	"testing"

	"hess/lang"
)

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

// TestRegistryMatchesLanguage compares the registry with the language
// reference in the repository (docs/language.md): its check table lists
// every registered check and nothing else, and the checks it proposes
// (its "Proposed checks" section) are not registered yet.
func TestRegistryMatchesLanguage(t *testing.T) {
	raw, err := os.ReadFile(languageReference)
	if err != nil {
		t.Fatalf("the language reference must be in the repository: %v", err)
	}
	doc := string(raw)
	table, _, _, err := generatedChecks(doc)
	if err != nil {
		t.Fatalf("%s: %v", languageReference, err)
	}
	documented := tableCodes(table)
	if len(documented) < 20 {
		t.Fatalf("found only %d codes in the check table of %s", len(documented), languageReference)
	}
	for code := range documented {
		if LookupCheck(code) == nil {
			t.Errorf("%s lists %s, which is not registered", languageReference, code)
		}
	}
	for _, c := range Checks() {
		if !documented[c.Name] {
			t.Errorf("check %s is not in the check table of %s", c.Name, languageReference)
		}
	}
	for code := range proposedCodes(doc) {
		if LookupCheck(code) != nil {
			t.Errorf("%s is registered: remove it from the proposed checks of %s", code, languageReference)
		}
	}
}

// tableCodes returns the codes in the first column of a Markdown table.
func tableCodes(table string) map[string]bool {
	codes := map[string]bool{}
	for _, line := range strings.Split(table, "\n") {
		if !strings.HasPrefix(line, "| `") {
			continue
		}
		first := strings.Split(line, "|")[1]
		for _, m := range codePattern.FindAllStringSubmatch(first, -1) {
			codes[m[1]] = true
		}
	}
	return codes
}

var codePattern = regexp.MustCompile("`([a-z]+(?:-[a-z]+)*)`")

// proposedCodes returns the codes the reference proposes but the registry
// does not hold yet: those in the table of its "Proposed checks" section.
func proposedCodes(doc string) map[string]bool {
	_, section, ok := strings.Cut(doc, "\n## Proposed checks\n")
	if !ok {
		return nil
	}
	if next := strings.Index(section, "\n## "); next >= 0 {
		section = section[:next]
	}
	return tableCodes(section)
}

func TestProposedCodes(t *testing.T) {
	doc := "## Checks\n| `syntax` | error |\n\n## Proposed checks\n\n| code | reported when |\n| --- | --- |\n" +
		"| `future-check` | one day |\n\n## Units\n| `later` | x |\n"
	got := proposedCodes(doc)
	if len(got) != 1 || !got["future-check"] {
		t.Errorf("proposedCodes = %v, want only future-check", got)
	}
	if got := proposedCodes("## Checks\n| `syntax` | error |\n"); len(got) != 0 {
		t.Errorf("proposedCodes without the section = %v", got)
	}
}
