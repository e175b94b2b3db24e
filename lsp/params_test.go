package lsp

import (
	"encoding/json"
	"errors"
	"regexp"
	"strings"
	"testing"

	"github.com/sourcegraph/jsonrpc2"
)

// goNames matches what Go's own error texts show of its types: "Go struct
// field", "Go value of type", package-qualified names and built-in types.
var goNames = regexp.MustCompile(`\bGo (struct|value)\b|\blsp\.|\bjson\.|\b(uint32|int32|float64|\[\]string|map\[)`)

// TestRequiredParams: a request that lacks a member the protocol requires
// is answered InvalidParams, naming the member, not read with a zero value.
func TestRequiredParams(t *testing.T) {
	c := startServer(t, Options{})
	c.initialize()
	const uri = "file:///work/plant.hess"
	c.open(uri, "species H2(g) { hf 0 kJ/mol  s 130.68 J/mol/K }\n", 1)
	c.waitDiagnostics(uri, atVersion(1))
	for _, tc := range []struct {
		method string
		params any
		want   string
	}{
		{"textDocument/hover", map[string]any{"textDocument": map[string]any{"uri": uri}}, "position is required"},
		{"textDocument/hover", map[string]any{"textDocument": map[string]any{"uri": uri}, "position": map[string]any{"line": 0}}, "position.character is required"},
		{"textDocument/hover", map[string]any{"position": map[string]any{"line": 0, "character": 9}}, "textDocument is required"},
		{"textDocument/definition", map[string]any{"textDocument": map[string]any{"uri": uri}, "position": nil}, "position is required"},
		{"textDocument/completion", map[string]any{"textDocument": map[string]any{}}, "textDocument.uri is required"},
		{"textDocument/documentSymbol", map[string]any{}, "textDocument is required"},
		{"textDocument/formatting", map[string]any{"textDocument": map[string]any{"uri": uri}}, "options is required"},
		{"textDocument/hover", nil, "parameters are missing"},
		{"textDocument/hover", []int{1}, "parameters must be an object"},
		{"textDocument/hover", map[string]any{"textDocument": map[string]any{"uri": uri}, "position": map[string]any{"line": "zero", "character": 9}}, "position.line must be a non-negative integer, found string"},
		{"textDocument/hover", map[string]any{"textDocument": map[string]any{"uri": uri}, "position": map[string]any{"line": -1, "character": 9}}, "position.line must be a non-negative integer"},
		{"textDocument/hover", map[string]any{"textDocument": "plant.hess", "position": map[string]any{"line": 0, "character": 9}}, "textDocument must be an object"},
	} {
		err := c.call(tc.method, tc.params, new(json.RawMessage))
		var rpcErr *jsonrpc2.Error
		if !errors.As(err, &rpcErr) || rpcErr.Code != jsonrpc2.CodeInvalidParams {
			t.Errorf("%s %v: %v, want InvalidParams", tc.method, tc.params, err)
			continue
		}
		if !strings.Contains(rpcErr.Message, tc.want) {
			t.Errorf("%s %v: %q, want %q", tc.method, tc.params, rpcErr.Message, tc.want)
		}
		if goNames.MatchString(rpcErr.Message) {
			t.Errorf("%s: error text shows Go names: %q", tc.method, rpcErr.Message)
		}
	}
	// A complete request still answers.
	var h json.RawMessage
	c.mustCall("textDocument/hover", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: uri}, Position: pos(0, 9)}, &h)
	if !strings.Contains(string(h), "H2(g)") {
		t.Errorf("hover: %s", h)
	}
}

func TestJSONErrorText(t *testing.T) {
	var v struct {
		Method string `json:"method"`
		Pos    struct {
			Line uint32 `json:"line"`
		} `json:"position"`
	}
	for _, tc := range []struct{ in, want string }{
		{`{"method":["x"]}`, "method must be a string, found array"},
		{`{"position":{"line":true}}`, "position.line must be a non-negative integer, found bool"},
		{`{"position":[]}`, "position must be an object, found array"},
		{`{"method":`, "the JSON ends early"},
		{`{"method" 1}`, "not valid JSON at byte"},
	} {
		err := json.Unmarshal([]byte(tc.in), &v)
		if err == nil {
			t.Fatalf("%s decoded", tc.in)
		}
		got := jsonErrorText(err)
		if !strings.Contains(got, tc.want) || goNames.MatchString(got) {
			t.Errorf("%s: %q, want %q and no Go names", tc.in, got, tc.want)
		}
	}
}

// TestUntitledIncludeMessage: an include in an unsaved buffer names the
// include as written and why it cannot be found, not the server's
// pseudo-folder for such buffers.
func TestUntitledIncludeMessage(t *testing.T) {
	const uri = "untitled:Untitled-1"
	c := startServer(t, Options{})
	c.initialize()
	c.open(uri, "include \"lib/gases.hess\"\nspecies H2(g) { hf 0 kJ/mol  s 130.68 J/mol/K }\n", 1)
	p := c.waitDiagnostics(uri, atVersion(1))
	var found bool
	for _, d := range p.Diagnostics {
		if strings.Contains(d.Message, untitledDir) {
			t.Errorf("message names the pseudo-folder: %q", d.Message)
		}
		if d.Code == "include-missing" {
			found = true
			for _, want := range []string{"cannot read lib/gases.hess", "included by Untitled-1", "save it first"} {
				if !strings.Contains(d.Message, want) {
					t.Errorf("include-missing %q lacks %q", d.Message, want)
				}
			}
		}
	}
	if !found {
		t.Errorf("no include-missing: %+v", p.Diagnostics)
	}
}
