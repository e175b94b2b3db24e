package main

import (
	"crypto/sha256"
	"encoding/hex"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strconv"
	"strings"

	"hess/lang"
	"hess/network"
)

const (
	sarifSchema  = "https://json.schemastore.org/sarif-2.1.0.json"
	sarifVersion = "2.1.0"
	// sarifRoot names the base that relative artifact URIs resolve against:
	// the working folder of the run.
	sarifRoot = "SRCROOT"
	// lineHashKey is the partial fingerprint code-scanning services match
	// results by between runs.
	lineHashKey = "primaryLocationLineHash"
)

type sarifLog struct {
	Schema  string     `json:"$schema"`
	Version string     `json:"version"`
	Runs    []sarifRun `json:"runs"`
}

type sarifRun struct {
	Tool               sarifTool                        `json:"tool"`
	OriginalURIBaseIDs map[string]sarifArtifactLocation `json:"originalUriBaseIds"`
	Invocations        []sarifInvocation                `json:"invocations,omitempty"`
	Artifacts          []sarifArtifact                  `json:"artifacts"`
	ColumnKind         string                           `json:"columnKind"`
	Results            []sarifResult                    `json:"results"`
}

// sarifInvocation records how the run went: whether it finished, and a
// notification for each input it could not read.
type sarifInvocation struct {
	ExecutionSuccessful        bool                `json:"executionSuccessful"`
	ToolExecutionNotifications []sarifNotification `json:"toolExecutionNotifications,omitempty"`
}

type sarifNotification struct {
	Level     string          `json:"level"`
	Message   sarifMessage    `json:"message"`
	Locations []sarifLocation `json:"locations,omitempty"`
}

type sarifTool struct {
	Driver sarifDriver `json:"driver"`
}

type sarifDriver struct {
	Name    string      `json:"name"`
	Version string      `json:"version,omitempty"`
	Rules   []sarifRule `json:"rules"`
}

type sarifRule struct {
	ID                   string             `json:"id"`
	ShortDescription     *sarifMessage      `json:"shortDescription,omitempty"`
	FullDescription      *sarifMessage      `json:"fullDescription,omitempty"`
	Help                 *sarifHelp         `json:"help,omitempty"`
	DefaultConfiguration sarifConfiguration `json:"defaultConfiguration"`
}

type sarifConfiguration struct {
	Level string `json:"level"`
}

type sarifMessage struct {
	Text string `json:"text"`
}

// sarifHelp is a rule's help in plain text and in Markdown. Rules carry no
// helpUri: there is no page to point at, and `hess explain CODE` prints the
// same paragraph.
type sarifHelp struct {
	Text     string `json:"text"`
	Markdown string `json:"markdown,omitempty"`
}

type sarifArtifact struct {
	Location sarifArtifactLocation `json:"location"`
}

type sarifArtifactLocation struct {
	URI       string `json:"uri"`
	URIBaseID string `json:"uriBaseId,omitempty"`
	Index     *int   `json:"index,omitempty"`
}

type sarifResult struct {
	RuleID              string            `json:"ruleId,omitempty"`
	RuleIndex           *int              `json:"ruleIndex,omitempty"`
	Level               string            `json:"level"`
	Message             sarifMessage      `json:"message"`
	Locations           []sarifLocation   `json:"locations,omitempty"`
	PartialFingerprints map[string]string `json:"partialFingerprints,omitempty"`
	RelatedLocations    []sarifLocation   `json:"relatedLocations,omitempty"`
}

type sarifLocation struct {
	ID               int                    `json:"id,omitempty"`
	PhysicalLocation *sarifPhysicalLocation `json:"physicalLocation,omitempty"`
	Message          *sarifMessage          `json:"message,omitempty"`
}

type sarifPhysicalLocation struct {
	ArtifactLocation sarifArtifactLocation `json:"artifactLocation"`
	Region           *sarifRegion          `json:"region,omitempty"`
}

// sarifRegion is a source range; EndColumn is exclusive and columns count
// Unicode code points (the run's columnKind).
type sarifRegion struct {
	StartLine   int `json:"startLine"`
	StartColumn int `json:"startColumn,omitempty"`
	EndLine     int `json:"endLine,omitempty"`
	EndColumn   int `json:"endColumn,omitempty"`
}

// renderSARIF writes the report as a SARIF 2.1.0 log with one run: every
// check in checks becomes a rule, in order, and every diagnostic a result.
// Relative file names resolve against the working folder, recorded as the
// SRCROOT base; so do files outside it, with "../" segments. A root file
// that could not be read (r.Trouble) becomes a tool execution notification
// of an unsuccessful invocation. A diagnostic whose code is not among the checks still
// becomes a result, with its ruleId but no ruleIndex; one without a file
// has no location.
func renderSARIF(w io.Writer, r *report, checks []*network.Check, toolVersion string) error {
	wd, err := os.Getwd()
	if err != nil {
		return fmt.Errorf("finding the working folder for SARIF: %w", err)
	}
	return writeSARIF(w, r, checks, toolVersion, wd)
}

// writeSARIF is renderSARIF with the SRCROOT folder given (an absolute
// path).
func writeSARIF(w io.Writer, r *report, checks []*network.Check, toolVersion, root string) error {
	if r == nil {
		r = &report{}
	}
	rules, ruleIndex := sarifRules(checks)
	arts := &sarifArtifacts{root: root, list: []sarifArtifact{}, index: map[string]int{}}
	for _, f := range r.Files {
		arts.add(f)
	}
	run := sarifRun{
		Tool: sarifTool{Driver: sarifDriver{
			Name:    "hess",
			Version: toolVersion,
			Rules:   rules,
		}},
		OriginalURIBaseIDs: map[string]sarifArtifactLocation{sarifRoot: {URI: folderURI(root)}},
		ColumnKind:         "unicodeCodePoints",
		Results:            sarifResults(r, ruleIndex, arts),
		Invocations:        []sarifInvocation{sarifInvocationOf(r.Trouble, root)},
	}
	run.Artifacts = arts.list
	doc := sarifLog{Schema: sarifSchema, Version: sarifVersion, Runs: []sarifRun{run}}
	return writeIndentedJSON(w, doc, "SARIF log")
}

// sarifRules makes a rule of every check, in order (a nil check and a
// repeated name are skipped), and returns each rule's index by name.
func sarifRules(checks []*network.Check) ([]sarifRule, map[string]int) {
	rules := []sarifRule{}
	ruleIndex := map[string]int{}
	for _, c := range checks {
		if c == nil {
			continue
		}
		if _, dup := ruleIndex[c.Name]; dup {
			continue
		}
		ruleIndex[c.Name] = len(rules)
		rule := sarifRule{
			ID:                   c.Name,
			DefaultConfiguration: sarifConfiguration{Level: sarifLevel(c.Severity)},
		}
		if t := c.Title(); t != "" {
			rule.ShortDescription = &sarifMessage{Text: t}
		}
		if e := c.Explanation(); e != "" {
			rule.FullDescription = &sarifMessage{Text: clipSentences(e, maxDescription)}
		}
		rule.Help = sarifRuleHelp(c)
		rules = append(rules, rule)
	}
	return rules, ruleIndex
}

// sarifArtifacts is the run's artifact list, each file once, in the order
// first met.
type sarifArtifacts struct {
	root  string // the SRCROOT folder
	list  []sarifArtifact
	index map[string]int
}

// add lists file if it is new and returns its index.
func (a *sarifArtifacts) add(file string) int {
	if i, ok := a.index[file]; ok {
		return i
	}
	i := len(a.list)
	a.index[file] = i
	a.list = append(a.list, sarifArtifact{Location: artifactLocationIn(a.root, file)})
	return i
}

// physical is the location of s with its artifact's index and region, or
// nil when s names no file.
func (a *sarifArtifacts) physical(s lang.Span) *sarifPhysicalLocation {
	if s.File == "" {
		return nil
	}
	loc := artifactLocationIn(a.root, s.File)
	i := a.add(s.File)
	loc.Index = &i
	return &sarifPhysicalLocation{ArtifactLocation: loc, Region: sarifRegionOf(s)}
}

// sarifResults makes a result of every diagnostic: its rule (with the
// index where the rule is known), level and message, its location with a
// line-hash fingerprint counted per file and hash, and its related spans.
func sarifResults(r *report, ruleIndex map[string]int, arts *sarifArtifacts) []sarifResult {
	results := make([]sarifResult, 0, len(r.Diagnostics))
	src := newSourceLines(r.Source)
	seen := map[string]int{} // file and line hash → occurrences so far
	for _, d := range r.Diagnostics {
		res := sarifResult{
			RuleID:  string(d.Code),
			Level:   sarifLevel(d.Severity),
			Message: sarifMessage{Text: sarifMessageText(d)},
		}
		if i, ok := ruleIndex[string(d.Code)]; ok {
			res.RuleIndex = &i
		}
		if pl := arts.physical(d.Subject); pl != nil {
			res.Locations = []sarifLocation{{PhysicalLocation: pl}}
			h := lineHash(d, src)
			key := d.Subject.File + "\x00" + h
			seen[key]++
			res.PartialFingerprints = map[string]string{lineHashKey: h + ":" + strconv.Itoa(seen[key])}
		}
		for i, rel := range d.Related {
			loc := sarifLocation{ID: i + 1, PhysicalLocation: arts.physical(rel.Span)}
			if rel.Message != "" {
				loc.Message = &sarifMessage{Text: rel.Message}
			}
			res.RelatedLocations = append(res.RelatedLocations, loc)
		}
		results = append(results, res)
	}
	return results
}

// sarifInvocationOf is the run's invocation: successful unless an input
// could not be read, each such input an error notification.
func sarifInvocationOf(trouble []inputTrouble, root string) sarifInvocation {
	inv := sarifInvocation{ExecutionSuccessful: len(trouble) == 0}
	for _, tr := range trouble {
		n := sarifNotification{Level: "error", Message: sarifMessage{Text: tr.Message}}
		if tr.File != "" {
			n.Locations = []sarifLocation{{PhysicalLocation: &sarifPhysicalLocation{ArtifactLocation: artifactLocationIn(root, tr.File)}}}
		}
		inv.ToolExecutionNotifications = append(inv.ToolExecutionNotifications, n)
	}
	return inv
}

// maxDescription is the longest rule description code-scanning services
// take; the whole paragraph is always in the rule's help.
const maxDescription = 1024

// clipSentences shortens text to at most max bytes, ending after the last
// whole sentence that fits (or at a word, with an ellipsis, when not even
// one sentence fits).
func clipSentences(text string, max int) string {
	if len(text) <= max {
		return text
	}
	cut := text[:max]
	if i := strings.LastIndex(cut, ". "); i > 0 {
		return cut[:i+1]
	}
	cut = text[:max-len("…")]
	if i := strings.LastIndexByte(cut, ' '); i > 0 {
		cut = cut[:i]
	}
	return strings.ToValidUTF8(cut, "") + "…"
}

// sarifRuleHelp is a check's help: its title and the paragraph `hess
// explain` prints, as text and as Markdown; nil for a check with no doc.
func sarifRuleHelp(c *network.Check) *sarifHelp {
	title, para := c.Title(), c.Explanation()
	if title == "" && para == "" {
		return nil
	}
	text := strings.TrimSpace(title + "\n\n" + para)
	md := "**" + markdownEscape(c.Name) + "**"
	if title != "" {
		md += ": " + markdownEscape(title)
	}
	if para != "" {
		md += "\n\n" + markdownEscape(para)
	}
	md += "\n\nRun `hess explain " + c.Name + "` for this text in a terminal."
	return &sarifHelp{Text: text, Markdown: md}
}

// markdownEscape backslash-escapes the characters that Markdown would read
// as emphasis, code, links or HTML.
func markdownEscape(s string) string {
	var b strings.Builder
	for _, r := range s {
		if strings.ContainsRune("\\`*_[]<>#|", r) {
			b.WriteByte('\\')
		}
		b.WriteRune(r)
	}
	return b.String()
}

// sarifLevel maps a severity to a SARIF level; off (and an invalid
// severity) is "none".
func sarifLevel(s lang.Severity) string {
	switch s {
	case lang.Error:
		return "error"
	case lang.Warning:
		return "warning"
	case lang.Info:
		return "note"
	}
	return "none"
}

// sarifMessageText is the result message: the diagnostic's message, then
// its detail on the following line when it has one. SARIF requires text,
// so an empty message falls back to the code.
func sarifMessageText(d lang.Diagnostic) string {
	text := d.Message
	if text == "" {
		text = string(d.Code)
	}
	if d.Detail != "" {
		text += "\n" + d.Detail
	}
	return text
}

// sarifRegionOf is the region of s, or nil when s has no position.
func sarifRegionOf(s lang.Span) *sarifRegion {
	if !s.IsValid() {
		return nil
	}
	reg := &sarifRegion{StartLine: s.Start.Line}
	if s.Start.Column < 1 {
		return reg
	}
	end := spanEnd(s)
	reg.StartColumn = s.Start.Column
	reg.EndLine = end.Line
	reg.EndColumn = end.Column
	return reg
}

// lineHash fingerprints a diagnostic by its code and the text of its
// subject's first line with runs of white space collapsed, and not by the
// line's number, so that it survives edits elsewhere in the file. Where the
// line is not available the message stands in for it.
func lineHash(d lang.Diagnostic, src *sourceLines) string {
	h := sha256.New()
	h.Write([]byte(d.Code))
	h.Write([]byte{0})
	if line, _, ok := src.line(d.Subject.File, d.Subject.Start.Line); ok {
		h.Write([]byte("line\x00"))
		h.Write([]byte(strings.Join(strings.Fields(string(line)), " ")))
	} else {
		h.Write([]byte("message\x00"))
		h.Write([]byte(d.Message))
	}
	return hex.EncodeToString(h.Sum(nil)[:8])
}

// artifactLocationIn is where SARIF finds a file: a relative name becomes
// a URI reference against SRCROOT (the folder root), and so does an
// absolute one outside root where a relative path reaches it (with ".."
// segments); only one on another volume keeps a file URI.
func artifactLocationIn(root, file string) sarifArtifactLocation {
	if filepath.IsAbs(file) {
		rel, err := filepath.Rel(root, file)
		if err != nil || filepath.IsAbs(rel) || filepath.VolumeName(rel) != "" {
			return sarifArtifactLocation{URI: fileURI(file)}
		}
		file = rel
	}
	return sarifArtifactLocation{URI: escapeURIPath(filepath.ToSlash(file)), URIBaseID: sarifRoot}
}

// folderURI is the file URI of an absolute folder, ending in a slash as a
// base URI must.
func folderURI(dir string) string {
	u := fileURI(dir)
	if !strings.HasSuffix(u, "/") {
		u += "/"
	}
	return u
}

// fileURI is the file URI of an absolute path.
func fileURI(abs string) string {
	vol := filepath.VolumeName(abs)
	rest := escapeURIPath(filepath.ToSlash(abs[len(vol):]))
	if vol != "" {
		return "file:///" + filepath.ToSlash(vol) + rest
	}
	if !strings.HasPrefix(rest, "/") {
		rest = "/" + rest
	}
	return "file://" + rest
}

// escapeURIPath percent-encodes every byte of a slash-separated path
// except the unreserved characters of RFC 3986 and the slashes, so that
// spaces, non-ASCII letters and a colon in the first segment cannot be
// misread.
func escapeURIPath(p string) string {
	const hexDigits = "0123456789ABCDEF"
	var b strings.Builder
	for i := 0; i < len(p); i++ {
		c := p[i]
		switch {
		case 'a' <= c && c <= 'z', 'A' <= c && c <= 'Z', '0' <= c && c <= '9',
			c == '-', c == '.', c == '_', c == '~', c == '/':
			b.WriteByte(c)
		default:
			b.WriteByte('%')
			b.WriteByte(hexDigits[c>>4])
			b.WriteByte(hexDigits[c&15])
		}
	}
	return b.String()
}
