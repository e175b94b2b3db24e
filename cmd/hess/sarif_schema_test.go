package main

import (
	"bytes"
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"github.com/santhosh-tekuri/jsonschema/v6"

	"hess/lang"
	"hess/network"
)

// sarifSchemaFile is the SARIF 2.1.0 JSON schema (OASIS, final
// "2.1.0-rtm.5" text), copied unchanged from the npm package
// @microsoft/jest-sarif 1.0.0-beta.0 (lib/schemas/sarif-2.1.0-rtm.5.json,
// MIT licence, Microsoft Corporation).
const sarifSchemaFile = "testdata/sarif/sarif-schema-2.1.0.json"

// compileSARIFSchema compiles the vendored schema, asserting formats (uri,
// uri-reference, date-time) as a validator does.
func compileSARIFSchema(t *testing.T) *jsonschema.Schema {
	t.Helper()
	f, err := os.Open(sarifSchemaFile)
	if err != nil {
		t.Fatalf("opening the SARIF schema: %v", err)
	}
	defer f.Close()
	doc, err := jsonschema.UnmarshalJSON(f)
	if err != nil {
		t.Fatalf("reading the SARIF schema: %v", err)
	}
	c := jsonschema.NewCompiler()
	c.AssertFormat()
	const url = "file:///sarif-schema-2.1.0.json"
	if err := c.AddResource(url, doc); err != nil {
		t.Fatalf("adding the SARIF schema: %v", err)
	}
	sch, err := c.Compile(url)
	if err != nil {
		t.Fatalf("compiling the SARIF schema: %v", err)
	}
	return sch
}

// validateSARIF checks a log against the schema and against the rules a
// code-scanning service applies on upload.
func validateSARIF(t *testing.T, sch *jsonschema.Schema, log []byte) {
	t.Helper()
	inst, err := jsonschema.UnmarshalJSON(bytes.NewReader(log))
	if err != nil {
		t.Fatalf("SARIF log is not JSON: %v\n%s", err, log)
	}
	if err := sch.Validate(inst); err != nil {
		t.Errorf("SARIF log does not follow the 2.1.0 schema: %v", err)
	}
	checkCodeScanningRules(t, log)
}

// checkCodeScanningRules applies the rules that code-scanning services add
// to the schema: every result's ruleId names a rule (and ruleIndex points
// at it), has message text and a physical location with an artifact URI
// whose base is declared and a region starting on line 1 or later, and a
// partial fingerprint; every rule has an id, help text and descriptions
// within 1 024 characters, and no helpUri (there is no page); base URIs are
// absolute and end with a slash.
func checkCodeScanningRules(t *testing.T, raw []byte) {
	t.Helper()
	type message struct {
		Text *string `json:"text"`
	}
	type artifactLocation struct {
		URI       string `json:"uri"`
		URIBaseID string `json:"uriBaseId"`
		Index     *int   `json:"index"`
	}
	type location struct {
		Physical *struct {
			Artifact artifactLocation `json:"artifactLocation"`
			Region   *struct {
				StartLine int `json:"startLine"`
			} `json:"region"`
		} `json:"physicalLocation"`
	}
	var doc struct {
		Runs []struct {
			Tool struct {
				Driver struct {
					Name  string `json:"name"`
					Rules []struct {
						ID    string          `json:"id"`
						Short *message        `json:"shortDescription"`
						Full  *message        `json:"fullDescription"`
						Help  *message        `json:"help"`
						URI   json.RawMessage `json:"helpUri"`
					} `json:"rules"`
				} `json:"driver"`
			} `json:"tool"`
			Bases     map[string]artifactLocation `json:"originalUriBaseIds"`
			Artifacts []struct {
				Location artifactLocation `json:"location"`
			} `json:"artifacts"`
			Results []struct {
				RuleID       string            `json:"ruleId"`
				RuleIndex    *int              `json:"ruleIndex"`
				Message      message           `json:"message"`
				Locations    []location        `json:"locations"`
				Fingerprints map[string]string `json:"partialFingerprints"`
			} `json:"results"`
		} `json:"runs"`
	}
	if err := json.Unmarshal(raw, &doc); err != nil {
		t.Fatalf("decoding SARIF: %v", err)
	}
	if len(doc.Runs) != 1 {
		t.Fatalf("SARIF log has %d runs, want 1", len(doc.Runs))
	}
	run := doc.Runs[0]
	if run.Tool.Driver.Name == "" {
		t.Errorf("driver has no name")
	}
	for id, base := range run.Bases {
		if !strings.HasPrefix(base.URI, "file:///") || !strings.HasSuffix(base.URI, "/") {
			t.Errorf("base %s = %q: not an absolute folder URI", id, base.URI)
		}
	}
	rules := map[string]int{}
	for i, r := range run.Tool.Driver.Rules {
		if r.ID == "" {
			t.Errorf("rule %d has no id", i)
		}
		rules[r.ID] = i
		if r.Help == nil || r.Help.Text == nil || *r.Help.Text == "" {
			t.Errorf("rule %s has no help text", r.ID)
		}
		if r.URI != nil {
			t.Errorf("rule %s has a helpUri %s, but there is no page", r.ID, r.URI)
		}
		for _, m := range []*message{r.Short, r.Full} {
			if m != nil && m.Text != nil && len(*m.Text) > 1024 {
				t.Errorf("rule %s: description of %d characters, over 1024", r.ID, len(*m.Text))
			}
		}
	}
	checkArtifact := func(where string, a artifactLocation) {
		if a.URI == "" {
			t.Errorf("%s: artifact location has no uri", where)
		}
		if a.URIBaseID != "" {
			if _, ok := run.Bases[a.URIBaseID]; !ok {
				t.Errorf("%s: uriBaseId %q is not in originalUriBaseIds", where, a.URIBaseID)
			}
		} else if !strings.HasPrefix(a.URI, "file:///") {
			t.Errorf("%s: relative uri %q without a base", where, a.URI)
		}
		if a.Index != nil && (*a.Index < 0 || *a.Index >= len(run.Artifacts)) {
			t.Errorf("%s: artifact index %d out of range", where, *a.Index)
		} else if a.Index != nil && run.Artifacts[*a.Index].Location.URI != a.URI {
			t.Errorf("%s: artifact %d is %q, not %q", where, *a.Index, run.Artifacts[*a.Index].Location.URI, a.URI)
		}
	}
	for i, res := range run.Results {
		at, ok := rules[res.RuleID]
		if !ok {
			t.Errorf("result %d: ruleId %q is not among the rules", i, res.RuleID)
		} else if res.RuleIndex != nil && *res.RuleIndex != at {
			t.Errorf("result %d: ruleIndex %d, but rule %q is at %d", i, *res.RuleIndex, res.RuleID, at)
		}
		if res.Message.Text == nil || *res.Message.Text == "" {
			t.Errorf("result %d: no message text", i)
		}
		if len(res.Locations) == 0 {
			t.Errorf("result %d (%s): no location", i, res.RuleID)
		}
		for _, loc := range res.Locations {
			if loc.Physical == nil {
				t.Errorf("result %d: location without physicalLocation", i)
				continue
			}
			checkArtifact(res.RuleID, loc.Physical.Artifact)
			if loc.Physical.Region == nil || loc.Physical.Region.StartLine < 1 {
				t.Errorf("result %d (%s): region must start on line 1 or later", i, res.RuleID)
			}
		}
		if res.Fingerprints[lineHashKey] == "" {
			t.Errorf("result %d (%s): no %s", i, res.RuleID, lineHashKey)
		}
	}
}

func TestSARIFSchemaSample(t *testing.T) {
	sch := compileSARIFSchema(t)
	var buf bytes.Buffer
	r := sampleReport()
	// The sample has a diagnostic without a position, which a code-scanning
	// service would refuse; the command line never makes one (every
	// diagnostic of a compile has a span), so leave it to the schema.
	var located lang.Diagnostics
	for _, d := range r.Diagnostics {
		if d.Subject.File != "" && d.Subject.IsValid() {
			located = append(located, d)
		}
	}
	r.Diagnostics = located
	if err := writeSARIF(&buf, r, sampleChecks(), "0.3.0", testRoot); err != nil {
		t.Fatalf("writeSARIF: %v", err)
	}
	validateSARIF(t, sch, buf.Bytes())
}

// TestSARIFSchemaEveryCheck validates the log of every testdata network,
// with the real registry of checks, as the binary writes it.
func TestSARIFSchemaEveryCheck(t *testing.T) {
	sch := compileSARIFSchema(t)
	files, err := filepath.Glob(filepath.Join("..", "..", "testdata", "check", "*.hess"))
	if err != nil || len(files) == 0 {
		t.Fatalf("no testdata networks: %v", err)
	}
	for _, f := range files {
		rep, trouble := compileAll([]string{f}, nil, network.Options{}, &bytes.Buffer{})
		if trouble {
			t.Fatalf("%s: cannot read", f)
		}
		var buf bytes.Buffer
		if err := renderSARIF(&buf, rep, network.Checks(), "dev"); err != nil {
			t.Fatalf("%s: %v", f, err)
		}
		t.Run(filepath.Base(f), func(t *testing.T) { validateSARIF(t, sch, buf.Bytes()) })
	}
}

// TestSARIFUnreadableRoot: a root that cannot be read still gives a valid
// log, with a notification naming it and an unsuccessful invocation, and
// exit status 2.
func TestSARIFUnreadableRoot(t *testing.T) {
	sch := compileSARIFSchema(t)
	r := runHess(t, "check", "--format", "sarif", "no/such/network.hess", "testdata/check/clean.hess")
	if r.code != exitTrouble {
		t.Errorf("exit %d, want %d", r.code, exitTrouble)
	}
	validateSARIF(t, sch, []byte(r.stdout))
	var doc map[string]any
	if err := json.Unmarshal([]byte(r.stdout), &doc); err != nil {
		t.Fatalf("decoding: %v\n%s", err, r.stdout)
	}
	inv := field(t, doc, "runs", 0, "invocations", 0)
	if field(t, inv, "executionSuccessful") != false {
		t.Errorf("executionSuccessful is not false")
	}
	n := field(t, inv, "toolExecutionNotifications", 0)
	if msg := field(t, n, "message", "text").(string); !strings.Contains(msg, "no/such/network.hess") {
		t.Errorf("notification %q does not name the file", msg)
	}
	if uri := field(t, n, "locations", 0, "physicalLocation", "artifactLocation", "uri"); uri != "no/such/network.hess" {
		t.Errorf("notification location %v", uri)
	}
	// The readable root is still checked.
	if arts := field(t, doc, "runs", 0, "artifacts").([]any); len(arts) == 0 {
		t.Errorf("the readable root was not compiled")
	}
}

// TestSARIFOutsideWorkingFolder: a file outside the working folder is a
// relative URI under SRCROOT, not an absolute file URI.
func TestSARIFOutsideWorkingFolder(t *testing.T) {
	dir := t.TempDir()
	lib := filepath.Join(dir, "lib")
	work := filepath.Join(dir, "work")
	for _, d := range []string{lib, work} {
		if err := os.Mkdir(d, 0o755); err != nil {
			t.Fatal(err)
		}
	}
	root := filepath.Join(lib, "net.hess")
	if err := os.WriteFile(root, []byte("species Zz(g)\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	sch := compileSARIFSchema(t)
	t.Chdir(work)
	rep, trouble := compileAll([]string{root}, nil, network.Options{}, &bytes.Buffer{})
	if trouble {
		t.Fatal("cannot read the network")
	}
	var buf bytes.Buffer
	if err := renderSARIF(&buf, rep, network.Checks(), "dev"); err != nil {
		t.Fatal(err)
	}
	validateSARIF(t, sch, buf.Bytes())
	var doc map[string]any
	if err := json.Unmarshal(buf.Bytes(), &doc); err != nil {
		t.Fatal(err)
	}
	loc := field(t, doc, "runs", 0, "results", 0, "locations", 0, "physicalLocation", "artifactLocation")
	if field(t, loc, "uri") != "../lib/net.hess" || field(t, loc, "uriBaseId") != "SRCROOT" {
		t.Errorf("artifact location %v, want ../lib/net.hess under SRCROOT", loc)
	}
}

func TestClipSentences(t *testing.T) {
	for _, tc := range []struct {
		text string
		max  int
		want string
	}{
		{"Short.", 10, "Short."},
		{"One two. Three four. Five.", 21, "One two. Three four."},
		{"One two three four", 12, "One two…"},
		{"ΔΔΔΔ ΔΔΔΔ", 12, "ΔΔΔΔ…"},
	} {
		got := clipSentences(tc.text, tc.max)
		if got != tc.want || len(got) > tc.max {
			t.Errorf("clipSentences(%q, %d) = %q, want %q", tc.text, tc.max, got, tc.want)
		}
	}
}
