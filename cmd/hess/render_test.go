package main

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"strings"
	"testing"
	"unicode/utf8"

	"hess/lang"
	"hess/network"
)

// testRoot is the SRCROOT folder of the SARIF tests, and testRootURI its
// URI.
const (
	testRoot    = "/work/project"
	testRootURI = "file:///work/project/"
)

// Sources of the sample report. plant.hess has a non-ASCII line, a line
// starting with a tab, a reaction spread over two lines and two identical
// lines; gases.hess has invalid UTF-8 and a NUL byte before a marker.
var sampleSources = map[string]string{
	"plant.hess": "# Burner section (demo scenario, ΔfH° in kJ/mol)\n" +
		"include \"gases.hess\"\n" +
		"species CO(g) \"ΔfH° −110.5 kJ/mol\" { hf -110.5 kJ/mol  s 197.7 J/K }\n" +
		"reaction burn: CO(g) + O2(g) <-> CO2(g)\n" +
		"\treaction idle:\tCO(g) <-> CO(g)\n" +
		"reaction shift: CO(g) + H2O(g)\n" +
		"    <-> CO2(g) + H2(g)   # ΔrH° ≈ −41 kJ/mol\n" +
		"species Ar(g)\n" +
		"species Ar(g)\n",
	"gases.hess": "# shared gases\r\n" +
		"species O2(g) { hf 0 kJ/mol  s 205.2 J/mol/K }\r\n" +
		"species N2(g) \"bad \xff byte\x00 here\" { hf 0 kJ/mol\r\n",
	"sub dir/ΔfH data.hess": "species Xe(g)\n",
}

// sp builds a span from line:col to endLine:endCol.
func sp(file string, line, col, endLine, endCol int) lang.Span {
	return lang.Span{
		File:  file,
		Start: lang.Pos{Line: line, Column: col},
		End:   lang.Pos{Line: endLine, Column: endCol},
	}
}

func sampleReport() *report {
	ds := lang.Diagnostics{
		{
			Code: "element-imbalance", Severity: lang.Error,
			Message: "O: left 3, right 2",
			Detail:  "the left side has 1 O more than the right\nwrite 1/2 O2(g) to balance it",
			Subject: sp("plant.hess", 4, 16, 4, 40),
			Related: []lang.Related{{Span: sp("gases.hess", 2, 9, 2, 14), Message: "O2(g) declared here"}},
		},
		{
			Code: "unit-mismatch", Severity: lang.Error,
			Message: "s needs an entropy unit such as J/mol/K, got J/K",
			Subject: sp("plant.hess", 3, 64, 3, 67),
		},
		{
			Code: "duplicate-reaction", Severity: lang.Warning,
			Message: "idle has CO(g) on both sides",
			Subject: sp("plant.hess", 5, 17, 5, 32),
		},
		{
			Code: "missing-thermo", Severity: lang.Warning,
			Message: "K at 298.15 K needs data for H2O(g)",
			Subject: sp("plant.hess", 6, 17, 7, 23),
		},
		{
			Code: "unused-species", Severity: lang.Warning,
			Message: "Ar(g) appears in no reaction",
			Subject: sp("plant.hess", 8, 9, 8, 14),
		},
		{
			Code: "duplicate-species", Severity: lang.Error,
			Message: "Ar(g) is declared twice",
			Subject: sp("plant.hess", 9, 9, 9, 14),
			Related: []lang.Related{{Span: sp("plant.hess", 8, 9, 8, 14), Message: "first declared here"}},
		},
		{
			Code: "unused-species", Severity: lang.Warning,
			Message: "Ar(g) appears in no reaction",
			Subject: sp("plant.hess", 9, 9, 9, 14),
		},
		{
			Code: "syntax", Severity: lang.Error,
			Message: `expected "}" to close the species block`,
			Subject: sp("gases.hess", 3, 47, 3, 47),
			Related: []lang.Related{{Span: sp("gases.hess", 3, 34, 3, 35), Message: "block opened here"}},
		},
		{
			Code: "species-only", Severity: lang.Info,
			Message: "the file declares species but no reactions",
			Subject: lang.Span{File: "gases.hess"},
		},
		{
			Code: "unused-species", Severity: lang.Warning,
			Message: "Xe(g) appears in no reaction",
			Subject: sp("sub dir/ΔfH data.hess", 1, 9, 1, 14),
		},
	}
	ds.Sort()
	return &report{
		Files:       []string{"plant.hess", "gases.hess", "sub dir/ΔfH data.hess"},
		Diagnostics: ds,
		Source:      sourceOf(sampleSources),
	}
}

func sourceOf(files map[string]string) func(string) []byte {
	return func(name string) []byte {
		text, ok := files[name]
		if !ok {
			return nil
		}
		return []byte(text)
	}
}

// sampleChecks is a registry for the SARIF rules: the sample's codes but
// one, plus an info and an off check for every level mapping.
func sampleChecks() []*network.Check {
	return []*network.Check{
		{Name: "syntax", Severity: lang.Error, Doc: "file does not parse\nThe file could not be read as\nstatements; the message names what was expected."},
		{Name: "unit-mismatch", Severity: lang.Error, Doc: "quantity has the wrong dimension\nA property was given a unit of another dimension."},
		{Name: "duplicate-species", Severity: lang.Error, Doc: "species declared twice\nTwo declarations share a name and state tag."},
		{Name: "element-imbalance", Severity: lang.Error, Doc: "elements do not balance\nAn element's count differs between the two sides."},
		{Name: "missing-thermo", Severity: lang.Warning, Doc: "K cannot be computed\nA species in the reaction lacks data at a requested temperature."},
		{Name: "duplicate-reaction", Severity: lang.Warning, Doc: "reaction repeated\nTwo reactions have the same equation, or one is the other reversed."},
		{Name: "unused-species", Severity: lang.Warning, Doc: "species in no reaction\nA declared species appears in no reaction."},
		{Name: "not-in-mixture", Severity: lang.Info, Doc: "reaction has no quotient\nSome species of the reaction are missing from the mixture."},
		{Name: "range-discontinuity", Severity: lang.Off, Doc: "jump at a range join\nCp, H or S jumps where two ranges meet."},
	}
}

func TestRenderTextGolden(t *testing.T) {
	for _, tc := range []struct {
		golden string
		color  bool
	}{
		{"render/text.golden", false},
		{"render/text_color.golden", true},
	} {
		t.Run(tc.golden, func(t *testing.T) {
			var buf bytes.Buffer
			if err := renderText(&buf, sampleReport(), tc.color); err != nil {
				t.Fatalf("renderText: %v", err)
			}
			if !tc.color && strings.Contains(buf.String(), "\x1b") {
				t.Errorf("colour off but output has escape sequences")
			}
			if tc.color && !strings.Contains(buf.String(), "\x1b[1;31merror\x1b[0m: O: left 3, right 2 \x1b[2m[element-imbalance]\x1b[0m") {
				t.Errorf("colour on but the error label is not red")
			}
			checkGolden(t, tc.golden, buf.Bytes())
		})
	}
}

func TestRenderJSONGolden(t *testing.T) {
	var buf bytes.Buffer
	if err := renderJSON(&buf, sampleReport()); err != nil {
		t.Fatalf("renderJSON: %v", err)
	}
	checkGolden(t, "render/report.json", buf.Bytes())
}

func TestRenderSARIFGolden(t *testing.T) {
	var buf bytes.Buffer
	if err := writeSARIF(&buf, sampleReport(), sampleChecks(), "0.3.0", testRoot); err != nil {
		t.Fatalf("writeSARIF: %v", err)
	}
	checkGolden(t, "render/report.sarif", buf.Bytes())
}

// TestMarkLine checks the snippet layout for the awkward cases one by one.
func TestMarkLine(t *testing.T) {
	long := strings.Repeat("a", 100) + "SPAN" + strings.Repeat("b", 100)
	huge := strings.Repeat("x", 500)
	for _, tc := range []struct {
		name          string
		line          string
		from, to      int
		text          string
		pad           string
		marks         int
		before, after bool
	}{
		{"ascii", "abc def", 5, 8, "abc def", "    ", 3, false, false},
		{"non-ASCII before the range", "# ΔfH° x", 8, 9, "# ΔfH° x", "       ", 1, false, false},
		{"tab before the range", "\ta\tbc", 4, 6, "\ta\tbc", "\t \t", 2, false, false},
		{"tab inside the range", "a\tb", 1, 4, "a\tb", "", 3, false, false},
		{"to the end of the line", "abcdef", 3, -1, "abcdef", "  ", 4, false, false},
		{"end past the line", "abc", 2, 99, "abc", " ", 2, false, false},
		{"empty range", "abc", 2, 2, "abc", " ", 1, false, false},
		{"reversed range", "abc", 3, 1, "abc", "  ", 1, false, false},
		{"at the end of the line", "abc", 4, 4, "abc", "   ", 1, false, false},
		{"start past the line", "abc", 40, 41, "abc", "   ", 1, false, false},
		{"start before column 1", "abc", 0, 2, "abc", "", 1, false, false},
		{"empty line", "", 1, 1, "", "", 1, false, false},
		{"invalid UTF-8", "a\xff\xfeb", 4, 5, "a\uFFFD\uFFFDb", "   ", 1, false, false},
		{"NUL and escape", "a\x00\x1b[31mb", 3, 4, "a\uFFFD\uFFFD[31mb", "  ", 1, false, false},
		{"bidi override", "a\u202eb", 3, 4, "a\uFFFDb", "  ", 1, false, false},
		{"window on a long line", long, 101, 105,
			strings.Repeat("a", 60) + "SPAN" + strings.Repeat("b", 60), strings.Repeat(" ", 60), 4, true, true},
		{"window at the start", long, 1, 2, long[:61], "", 1, false, true},
		{"window at the end", long, 205, -1, strings.Repeat("b", 60), strings.Repeat(" ", 60), 1, true, false},
		{"window with non-ASCII", strings.Repeat("é", 100) + "SPAN", 101, 105,
			strings.Repeat("é", 60) + "SPAN", strings.Repeat(" ", 60), 4, true, false},
		{"long subject marked in part", huge, 1, -1, huge[:180], "", 120, false, true},
	} {
		t.Run(tc.name, func(t *testing.T) {
			w := markLine([]byte(tc.line), isASCII([]byte(tc.line)), tc.from, tc.to)
			want := window{text: tc.text, pad: tc.pad, marks: tc.marks, before: tc.before, after: tc.after}
			if w != want {
				t.Errorf("markLine(%q, %d, %d) = %+v; want %+v", tc.line, tc.from, tc.to, w, want)
			}
			if !isASCII([]byte(tc.line)) {
				return
			}
			// The general path gives the same layout as the ASCII one.
			if slow := markLine([]byte(tc.line), false, tc.from, tc.to); slow != w {
				t.Errorf("markLine without the ASCII shortcut = %+v; want %+v", slow, w)
			}
		})
	}
}

// A line of any length gives a snippet of bounded size: one 70 KB line with
// thousands of findings makes a report proportional to the findings.
func TestRenderTextLongLineBounded(t *testing.T) {
	const n = 5000
	line := strings.Repeat("species H2(g) ", n)
	r := &report{Files: []string{"long.hess"}, Source: func(string) []byte { return []byte(line + "\n") }}
	for i := 0; i < n; i++ {
		col := 14*i + 9
		r.Diagnostics = append(r.Diagnostics, lang.Diagnostic{Severity: lang.Error, Code: "duplicate-species",
			Message: "H2(g) is declared twice", Subject: sp("long.hess", 1, col, 1, col+5)})
	}
	var buf bytes.Buffer
	if err := renderText(&buf, r, false); err != nil {
		t.Fatal(err)
	}
	if per := buf.Len() / n; per > 400 {
		t.Errorf("report takes %d bytes per finding on a %d-byte line, want at most 400", per, len(line))
	}
	if !strings.Contains(buf.String(), "long.hess:1:69995: error: H2(g) is declared twice [duplicate-species]\n    …") {
		t.Errorf("last finding not laid out as expected:\n%s", buf.String()[buf.Len()-600:])
	}
}

// A message quoting a huge name is cut.
func TestRenderTextLongMessageCut(t *testing.T) {
	name := strings.Repeat("Xy", 1<<20)
	r := &report{Diagnostics: lang.Diagnostics{{Severity: lang.Warning, Code: "unused-species", Message: "species " + name + " appears in no reaction"}}}
	var buf bytes.Buffer
	if err := renderText(&buf, r, false); err != nil {
		t.Fatal(err)
	}
	if buf.Len() > maxMessageBytes+200 {
		t.Errorf("report of one message is %d bytes", buf.Len())
	}
}

func TestRenderTextWithoutSource(t *testing.T) {
	r := sampleReport()
	r.Source = nil
	var buf bytes.Buffer
	if err := renderText(&buf, r, false); err != nil {
		t.Fatalf("renderText: %v", err)
	}
	out := buf.String()
	if strings.Contains(out, "    ") || strings.Contains(out, "^") {
		t.Errorf("snippet printed without a source:\n%s", out)
	}
	if !strings.Contains(out, "plant.hess:4:16: error: O: left 3, right 2 [element-imbalance]\n") {
		t.Errorf("header missing:\n%s", out)
	}
}

func TestRenderTextLocations(t *testing.T) {
	r := &report{
		Files: []string{"a.hess"},
		Diagnostics: lang.Diagnostics{
			{Severity: lang.Error, Message: "no location at all"},
			{Severity: lang.Warning, Code: "w", Message: "line only", Subject: lang.Span{File: "a.hess", Start: lang.Pos{Line: 2}}},
			{Severity: lang.Error, Code: "e", Message: "tab\tand \x1b[2J escape", Subject: sp("a\x07.hess", 1, 1, 1, 2),
				Related: []lang.Related{{Message: "somewhere"}}},
		},
	}
	var buf bytes.Buffer
	if err := renderText(&buf, r, false); err != nil {
		t.Fatalf("renderText: %v", err)
	}
	want := "error: no location at all\n" +
		"a.hess:2: warning: line only [w]\n" +
		"a\uFFFD.hess:1:1: error: tab and \uFFFD[2J escape [e]\n" +
		"note: somewhere\n" +
		"2 errors, 1 warning in 1 file\n"
	if got := buf.String(); got != want {
		t.Errorf("got\n%q\nwant\n%q", got, want)
	}
}

func TestSummaryLine(t *testing.T) {
	diags := func(sevs ...lang.Severity) lang.Diagnostics {
		var ds lang.Diagnostics
		for _, s := range sevs {
			ds = append(ds, lang.Diagnostic{Severity: s, Code: "x", Message: "m"})
		}
		return ds
	}
	for _, tc := range []struct {
		files int
		ds    lang.Diagnostics
		want  string
	}{
		{1, nil, "no problems in 1 file"},
		{0, nil, "no problems in 0 files"},
		{3, diags(lang.Error, lang.Error, lang.Warning), "2 errors, 1 warning in 3 files"},
		{1, diags(lang.Error), "1 error in 1 file"},
		{2, diags(lang.Warning, lang.Warning), "2 warnings in 2 files"},
		{1, diags(lang.Info), "1 info in 1 file"},
		{1, diags(lang.Error, lang.Info, lang.Info, lang.Warning, lang.Warning), "1 error, 2 warnings, 2 infos in 1 file"},
	} {
		r := &report{Files: make([]string, tc.files), Diagnostics: tc.ds}
		if got := summaryLine(r); got != tc.want {
			t.Errorf("summaryLine(%d files, %d diagnostics) = %q, want %q", tc.files, len(tc.ds), got, tc.want)
		}
	}
}

func TestRenderJSONValues(t *testing.T) {
	var buf bytes.Buffer
	if err := renderJSON(&buf, sampleReport()); err != nil {
		t.Fatalf("renderJSON: %v", err)
	}
	var got jsonReport
	dec := json.NewDecoder(&buf)
	dec.DisallowUnknownFields()
	if err := dec.Decode(&got); err != nil {
		t.Fatalf("decoding: %v", err)
	}
	if want := []string{"plant.hess", "gases.hess", "sub dir/ΔfH data.hess"}; fmt.Sprint(got.Files) != fmt.Sprint(want) {
		t.Errorf("files = %q, want %q", got.Files, want)
	}
	if len(got.Diagnostics) != 10 {
		t.Fatalf("%d diagnostics, want 10", len(got.Diagnostics))
	}
	if got.Summary != (jsonSummary{Errors: 4, Warnings: 5, Infos: 1}) {
		t.Errorf("summary = %+v", got.Summary)
	}
	var imbalance, multi *jsonDiagnostic
	for i := range got.Diagnostics {
		switch got.Diagnostics[i].Code {
		case "element-imbalance":
			imbalance = &got.Diagnostics[i]
		case "missing-thermo":
			multi = &got.Diagnostics[i]
		}
	}
	if imbalance == nil || multi == nil {
		t.Fatalf("diagnostics missing from %+v", got.Diagnostics)
	}
	wantImb := jsonDiagnostic{
		File: "plant.hess", Line: 4, Column: 16, EndLine: 4, EndColumn: 40,
		Severity: "error", Code: "element-imbalance", Message: "O: left 3, right 2",
		Detail:  "the left side has 1 O more than the right\nwrite 1/2 O2(g) to balance it",
		Related: []jsonRelated{{File: "gases.hess", Line: 2, Column: 9, Message: "O2(g) declared here"}},
	}
	if fmt.Sprintf("%+v", *imbalance) != fmt.Sprintf("%+v", wantImb) {
		t.Errorf("element-imbalance = %+v\nwant %+v", *imbalance, wantImb)
	}
	if multi.Line != 6 || multi.Column != 17 || multi.EndLine != 7 || multi.EndColumn != 23 || multi.Severity != "warning" {
		t.Errorf("multi-line span = %+v", *multi)
	}

	// The raw document: related is always an array and detail only
	// appears when set.
	var raw struct {
		Diagnostics []map[string]json.RawMessage `json:"diagnostics"`
	}
	buf.Reset()
	if err := renderJSON(&buf, sampleReport()); err != nil {
		t.Fatalf("renderJSON: %v", err)
	}
	if err := json.Unmarshal(buf.Bytes(), &raw); err != nil {
		t.Fatalf("decoding: %v", err)
	}
	for _, d := range raw.Diagnostics {
		if rel := string(d["related"]); rel == "" || rel == "null" {
			t.Errorf("related = %q in %s, want an array", rel, d["code"])
		}
		if _, has := d["detail"]; has && string(d["code"]) != `"element-imbalance"` {
			t.Errorf("detail present on %s", d["code"])
		}
	}
}

func TestRenderJSONEmpty(t *testing.T) {
	var buf bytes.Buffer
	if err := renderJSON(&buf, &report{}); err != nil {
		t.Fatalf("renderJSON: %v", err)
	}
	want := "{\n  \"files\": [],\n  \"diagnostics\": [],\n  \"summary\": {\n    \"errors\": 0,\n    \"warnings\": 0,\n    \"infos\": 0\n  }\n}\n"
	if buf.String() != want {
		t.Errorf("got\n%s\nwant\n%s", buf.String(), want)
	}
}

// sarifDoc renders the sample as SARIF and decodes it into generic maps.
func sarifDoc(t *testing.T, r *report) map[string]any {
	t.Helper()
	var buf bytes.Buffer
	if err := writeSARIF(&buf, r, sampleChecks(), "0.3.0", testRoot); err != nil {
		t.Fatalf("writeSARIF: %v", err)
	}
	var doc map[string]any
	if err := json.Unmarshal(buf.Bytes(), &doc); err != nil {
		t.Fatalf("decoding SARIF: %v", err)
	}
	return doc
}

// field walks a path of object keys and array indexes through a decoded
// JSON value, failing the test when a step is missing.
func field(t *testing.T, v any, path ...any) any {
	t.Helper()
	cur := v
	for i, step := range path {
		switch k := step.(type) {
		case string:
			m, ok := cur.(map[string]any)
			if !ok {
				t.Fatalf("%v: not an object at %v", path, path[:i])
			}
			next, ok := m[k]
			if !ok {
				t.Fatalf("%v: no key %q", path, k)
			}
			cur = next
		case int:
			a, ok := cur.([]any)
			if !ok || k >= len(a) {
				t.Fatalf("%v: no element %d", path, k)
			}
			cur = a[k]
		}
	}
	return cur
}

func TestSARIFFields(t *testing.T) {
	doc := sarifDoc(t, sampleReport())
	if got := field(t, doc, "version"); got != "2.1.0" {
		t.Errorf("version = %v", got)
	}
	if got := field(t, doc, "$schema"); got != sarifSchema {
		t.Errorf("$schema = %v", got)
	}
	runs := field(t, doc, "runs").([]any)
	if len(runs) != 1 {
		t.Fatalf("%d runs, want 1", len(runs))
	}
	run := runs[0]
	if got := field(t, run, "columnKind"); got != "unicodeCodePoints" {
		t.Errorf("columnKind = %v", got)
	}
	if got := field(t, run, "originalUriBaseIds", "SRCROOT", "uri"); got != testRootURI {
		t.Errorf("SRCROOT = %v", got)
	}
	if got := field(t, run, "tool", "driver", "name"); got != "hess" {
		t.Errorf("driver name = %v", got)
	}
	if got := field(t, run, "tool", "driver", "version"); got != "0.3.0" {
		t.Errorf("driver version = %v", got)
	}

	checks := sampleChecks()
	rules := field(t, run, "tool", "driver", "rules").([]any)
	if len(rules) != len(checks) {
		t.Fatalf("%d rules, want %d", len(rules), len(checks))
	}
	wantLevel := map[lang.Severity]string{lang.Error: "error", lang.Warning: "warning", lang.Info: "note", lang.Off: "none"}
	for i, c := range checks {
		if got := field(t, rules[i], "id"); got != c.Name {
			t.Errorf("rule %d id = %v, want %s", i, got, c.Name)
		}
		if got := field(t, rules[i], "shortDescription", "text"); got != c.Title() {
			t.Errorf("rule %s shortDescription = %v", c.Name, got)
		}
		if got := field(t, rules[i], "fullDescription", "text"); got != c.Explanation() {
			t.Errorf("rule %s fullDescription = %v", c.Name, got)
		}
		if got := field(t, rules[i], "defaultConfiguration", "level"); got != wantLevel[c.Severity] {
			t.Errorf("rule %s level = %v, want %s", c.Name, got, wantLevel[c.Severity])
		}
	}

	r := sampleReport()
	results := field(t, run, "results").([]any)
	if len(results) != len(r.Diagnostics) {
		t.Fatalf("%d results, want %d", len(results), len(r.Diagnostics))
	}
	for i, d := range r.Diagnostics {
		res := results[i]
		if got := field(t, res, "ruleId"); got != string(d.Code) {
			t.Errorf("result %d ruleId = %v, want %s", i, got, d.Code)
		}
		idx, hasIndex := res.(map[string]any)["ruleIndex"]
		known := -1
		for j, c := range checks {
			if c.Name == string(d.Code) {
				known = j
			}
		}
		switch {
		case known < 0 && hasIndex:
			t.Errorf("result %d (%s) has ruleIndex %v for an unknown rule", i, d.Code, idx)
		case known >= 0 && idx != float64(known):
			t.Errorf("result %d (%s) ruleIndex = %v, want %d", i, d.Code, idx, known)
		}
		if got := field(t, res, "level"); got != wantLevel[d.Severity] {
			t.Errorf("result %d level = %v, want %s", i, got, wantLevel[d.Severity])
		}
		if got := field(t, res, "message", "text").(string); !strings.HasPrefix(got, d.Message) {
			t.Errorf("result %d message = %q", i, got)
		}
		locs := field(t, res, "locations").([]any)
		if len(locs) != 1 {
			t.Errorf("result %d has %d locations, want 1", i, len(locs))
		}
		if got := field(t, locs[0], "physicalLocation", "artifactLocation", "uriBaseId"); got != "SRCROOT" {
			t.Errorf("result %d uriBaseId = %v", i, got)
		}
		uri := field(t, locs[0], "physicalLocation", "artifactLocation", "uri")
		if want := escapeURIPath(d.Subject.File); uri != want {
			t.Errorf("result %d uri = %v, want %s", i, uri, want)
		}
		if fp := field(t, res, "partialFingerprints", "primaryLocationLineHash").(string); !strings.Contains(fp, ":") {
			t.Errorf("result %d fingerprint %q lacks its occurrence counter", i, fp)
		}
		if !d.Subject.IsValid() {
			if _, has := locs[0].(map[string]any)["physicalLocation"].(map[string]any)["region"]; has {
				t.Errorf("result %d has a region without a position", i)
			}
			continue
		}
		end := spanEnd(d.Subject)
		for key, want := range map[string]int{
			"startLine": d.Subject.Start.Line, "startColumn": d.Subject.Start.Column,
			"endLine": end.Line, "endColumn": end.Column,
		} {
			if got := field(t, locs[0], "physicalLocation", "region", key); got != float64(want) {
				t.Errorf("result %d region %s = %v, want %d", i, key, got, want)
			}
		}
		for j, rel := range d.Related {
			rl := field(t, res, "relatedLocations", j)
			if got := field(t, rl, "id"); got != float64(j+1) {
				t.Errorf("result %d related %d id = %v", i, j, got)
			}
			if got := field(t, rl, "message", "text"); got != rel.Message {
				t.Errorf("result %d related %d message = %v", i, j, got)
			}
			if got := field(t, rl, "physicalLocation", "artifactLocation", "uri"); got != escapeURIPath(rel.Span.File) {
				t.Errorf("result %d related %d uri = %v", i, j, got)
			}
			if got := field(t, rl, "physicalLocation", "region", "startLine"); got != float64(rel.Span.Start.Line) {
				t.Errorf("result %d related %d startLine = %v", i, j, got)
			}
		}
	}

	artifacts := field(t, run, "artifacts").([]any)
	if len(artifacts) != len(r.Files) {
		t.Errorf("%d artifacts, want %d", len(artifacts), len(r.Files))
	}
	if got := field(t, artifacts, 2, "location", "uri"); got != "sub%20dir/%CE%94fH%20data.hess" {
		t.Errorf("artifact uri = %v", got)
	}
}

func TestSARIFEmptyArrays(t *testing.T) {
	var buf bytes.Buffer
	if err := writeSARIF(&buf, &report{Files: []string{"a.hess"}}, nil, "", testRoot); err != nil {
		t.Fatalf("writeSARIF: %v", err)
	}
	for _, want := range []string{`"results": []`, `"rules": []`} {
		if !strings.Contains(buf.String(), want) {
			t.Errorf("clean log lacks %s:\n%s", want, buf.String())
		}
	}
}

// fingerprints renders r as SARIF and returns each result's line hash.
func fingerprints(t *testing.T, r *report) []string {
	t.Helper()
	results := field(t, sarifDoc(t, r), "runs", 0, "results").([]any)
	var out []string
	for i := range results {
		out = append(out, field(t, results[i], "partialFingerprints", "primaryLocationLineHash").(string))
	}
	return out
}

func TestFingerprintSurvivesInsertedLines(t *testing.T) {
	before := fingerprints(t, sampleReport())

	// Insert three lines at the top of plant.hess and shift its positions.
	const inserted = 3
	sources := map[string]string{}
	for k, v := range sampleSources {
		sources[k] = v
	}
	sources["plant.hess"] = "# a\n\n# c\n" + sources["plant.hess"]
	r := sampleReport()
	r.Source = sourceOf(sources)
	shift := func(s *lang.Span) {
		if s.File == "plant.hess" && s.IsValid() {
			s.Start.Line += inserted
			s.End.Line += inserted
		}
	}
	for i := range r.Diagnostics {
		shift(&r.Diagnostics[i].Subject)
		for j := range r.Diagnostics[i].Related {
			shift(&r.Diagnostics[i].Related[j].Span)
		}
	}
	after := fingerprints(t, r)
	if fmt.Sprint(before) != fmt.Sprint(after) {
		t.Errorf("fingerprints changed when lines were inserted above:\nbefore %q\nafter  %q", before, after)
	}

	// Identical lines with the same code are told apart by the counter;
	// distinct ones differ in the hash.
	seen := map[string]bool{}
	for _, fp := range before {
		if seen[fp] {
			t.Errorf("fingerprint %s repeated", fp)
		}
		seen[fp] = true
	}
	var ar []string
	for i, d := range sampleReport().Diagnostics {
		if d.Code == "unused-species" && d.Subject.File == "plant.hess" {
			ar = append(ar, before[i])
		}
	}
	if len(ar) != 2 {
		t.Fatalf("found %d unused Ar(g) results, want 2", len(ar))
	}
	h1, n1, _ := strings.Cut(ar[0], ":")
	h2, n2, _ := strings.Cut(ar[1], ":")
	if h1 != h2 || n1 != "1" || n2 != "2" {
		t.Errorf("identical lines got %q and %q, want the same hash with :1 and :2", ar[0], ar[1])
	}
}

func TestFingerprintFollowsLineText(t *testing.T) {
	r := sampleReport()
	before := fingerprints(t, r)
	sources := map[string]string{}
	for k, v := range sampleSources {
		sources[k] = v
	}
	sources["plant.hess"] = strings.Replace(sources["plant.hess"], "reaction burn: CO(g) + O2(g)", "reaction  burn:  CO(g)  +  O2(g)", 1)
	r.Source = sourceOf(sources)
	spaced := fingerprints(t, r)
	sources["plant.hess"] = strings.Replace(sources["plant.hess"], "O2(g)", "O3(g)", 1)
	changed := fingerprints(t, r)
	for i, d := range r.Diagnostics {
		if d.Code != "element-imbalance" {
			continue
		}
		if spaced[i] != before[i] {
			t.Errorf("changing only white space changed the fingerprint: %s → %s", before[i], spaced[i])
		}
		if changed[i] == before[i] {
			t.Errorf("changing the line's text kept the fingerprint %s", before[i])
		}
	}
}

func TestArtifactLocation(t *testing.T) {
	for _, tc := range []struct {
		file, uri, base string
	}{
		{"plant.hess", "plant.hess", "SRCROOT"},
		{"lib/gases.hess", "lib/gases.hess", "SRCROOT"},
		{"../shared/a b.hess", "../shared/a%20b.hess", "SRCROOT"},
		{"c:d.hess", "c%3Ad.hess", "SRCROOT"},
		{"50%#?.hess", "50%25%23%3F.hess", "SRCROOT"},
		{"/srv/nets/ΔfH.hess", "../../srv/nets/%CE%94fH.hess", "SRCROOT"},
		{"/work/project/lib/a.hess", "lib/a.hess", "SRCROOT"},
		{"/work/shared/gases.hess", "../shared/gases.hess", "SRCROOT"},
	} {
		got := artifactLocationIn(testRoot, tc.file)
		if got.URI != tc.uri || got.URIBaseID != tc.base {
			t.Errorf("artifactLocation(%q) = %q, %q; want %q, %q", tc.file, got.URI, got.URIBaseID, tc.uri, tc.base)
		}
	}
	if got := folderURI("/work/my project"); got != "file:///work/my%20project/" {
		t.Errorf("folderURI = %q", got)
	}
	if got := folderURI("/"); got != "file:///" {
		t.Errorf("folderURI(/) = %q", got)
	}
}

func TestRenderSARIFUsesWorkingFolder(t *testing.T) {
	dir := t.TempDir()
	t.Chdir(dir)
	var buf bytes.Buffer
	if err := renderSARIF(&buf, &report{}, nil, "dev"); err != nil {
		t.Fatalf("renderSARIF: %v", err)
	}
	var doc map[string]any
	if err := json.Unmarshal(buf.Bytes(), &doc); err != nil {
		t.Fatalf("decoding: %v", err)
	}
	got := field(t, doc, "runs", 0, "originalUriBaseIds", "SRCROOT", "uri")
	if want := folderURI(dir); got != want {
		t.Errorf("SRCROOT = %v, want %s", got, want)
	}
}

type failingWriter struct{}

var errDiskFull = errors.New("disk full")

func (failingWriter) Write([]byte) (int, error) { return 0, errDiskFull }

func TestRenderWriteErrors(t *testing.T) {
	r := sampleReport()
	for name, err := range map[string]error{
		"text":  renderText(failingWriter{}, r, false),
		"json":  renderJSON(failingWriter{}, r),
		"sarif": writeSARIF(failingWriter{}, r, sampleChecks(), "", testRoot),
	} {
		if !errors.Is(err, errDiskFull) {
			t.Errorf("%s: error %v does not wrap the write failure", name, err)
		}
	}
}

// FuzzRenderText renders one diagnostic with arbitrary source and span;
// every renderer must succeed without panicking, and the text snippet, when
// shown, must carry a marker.
func FuzzRenderText(f *testing.F) {
	f.Add([]byte("reaction a: A <-> B\n"), 1, 13, 1, 20)
	f.Add([]byte("\t\xff\x00x\r\n"), 1, 3, 2, 1)
	f.Add([]byte(""), 1, 1, 1, 1)
	f.Add([]byte("ab\ncd"), 2, -5, 1, 99)
	f.Add([]byte(strings.Repeat("species H2(g) ", 40)), 1, 300, 1, 305)
	f.Add([]byte(strings.Repeat("é\t", 300)), 1, 200, 1, 599)
	f.Fuzz(func(t *testing.T, src []byte, line, col, endLine, endCol int) {
		r := &report{
			Files: []string{"f.hess"},
			Diagnostics: lang.Diagnostics{{
				Code: "syntax", Severity: lang.Error, Message: "m",
				Subject: sp("f.hess", line, col, endLine, endCol),
			}},
			Source: func(string) []byte { return src },
		}
		var buf bytes.Buffer
		if err := renderText(&buf, r, true); err != nil {
			t.Fatalf("renderText: %v", err)
		}
		lines := strings.Split(buf.String(), "\n")
		if len(lines) > 3 && !strings.Contains(lines[2], "^") {
			t.Errorf("snippet without a marker:\n%s", buf.String())
		}
		for _, l := range lines {
			// A window of context, marks and slack, the indent, two
			// ellipses and the colour codes.
			if n := utf8.RuneCountInString(l); n > 2*(snippetContext+snippetSlack)+snippetMarkMax+40 {
				t.Errorf("a line of %d code points: the snippet is not windowed", n)
			}
		}
		if err := renderJSON(&bytes.Buffer{}, r); err != nil {
			t.Fatalf("renderJSON: %v", err)
		}
		if err := writeSARIF(&bytes.Buffer{}, r, sampleChecks(), "", testRoot); err != nil {
			t.Fatalf("writeSARIF: %v", err)
		}
	})
}
