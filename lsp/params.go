package lsp

import (
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"reflect"
	"strings"

	"github.com/sourcegraph/jsonrpc2"
)

// requiredParams lists, for each method the server handles, the members of
// its parameters that the protocol (LSP 3.17) marks required, as dotted
// paths. A request that lacks one, or gives it as null, is answered with
// InvalidParams rather than read with a zero value (a hover without a
// position would otherwise answer for line 1, column 1, or nothing).
var requiredParams = map[string][]string{
	"initialize":                  {"capabilities"},
	"textDocument/didOpen":        {"textDocument.uri", "textDocument.version", "textDocument.text"},
	"textDocument/didChange":      {"textDocument.uri", "textDocument.version", "contentChanges"},
	"textDocument/didSave":        {"textDocument.uri"},
	"textDocument/didClose":       {"textDocument.uri"},
	"textDocument/hover":          {"textDocument.uri", "position.line", "position.character"},
	"textDocument/definition":     {"textDocument.uri", "position.line", "position.character"},
	"textDocument/documentSymbol": {"textDocument.uri"},
	"textDocument/completion":     {"textDocument.uri", "position.line", "position.character"},
	"textDocument/formatting":     {"textDocument.uri", "options"},
}

// decodeParams checks that raw carries every member the method requires
// and decodes it into v. Its errors are InvalidParams with a message in
// the protocol's terms: the member's path and the JSON kind expected,
// never a Go type.
func decodeParams(method string, raw *json.RawMessage, v any) error {
	invalid := func(format string, args ...any) error {
		return &jsonrpc2.Error{Code: jsonrpc2.CodeInvalidParams, Message: method + ": " + fmt.Sprintf(format, args...)}
	}
	if raw == nil || bytes.Equal(bytes.TrimSpace(*raw), []byte("null")) {
		return invalid("parameters are missing")
	}
	var tree any
	if err := json.Unmarshal(*raw, &tree); err != nil {
		return invalid("parameters are not valid JSON")
	}
	if _, ok := tree.(map[string]any); !ok {
		return invalid("parameters must be an object")
	}
	for _, path := range requiredParams[method] {
		if problem := lacks(tree, path); problem != "" {
			return invalid("%s", problem)
		}
	}
	if err := json.Unmarshal(*raw, v); err != nil {
		return invalid("%s", jsonErrorText(err))
	}
	return nil
}

// jsonErrorText words a JSON decoding error in the protocol's terms: the
// member at fault and the kind of value it takes, never a Go type.
func jsonErrorText(err error) string {
	var te *json.UnmarshalTypeError
	if errors.As(err, &te) {
		field := te.Field
		if field == "" {
			field = "the value"
		}
		return fmt.Sprintf("%s must be %s, found %s", field, jsonKind(te.Type), te.Value)
	}
	if errors.Is(err, io.ErrUnexpectedEOF) || strings.Contains(err.Error(), "unexpected end of JSON input") {
		return "the JSON ends early"
	}
	var se *json.SyntaxError
	if errors.As(err, &se) {
		return fmt.Sprintf("not valid JSON at byte %d", se.Offset)
	}
	return "the message cannot be read"
}

// lacks says which member on the dotted path tree lacks (or holds as
// null), or which one is not the object the path goes through, or "" when
// all are there.
func lacks(tree any, path string) string {
	parts := strings.Split(path, ".")
	cur := tree
	for i, p := range parts {
		obj, ok := cur.(map[string]any)
		if !ok {
			return strings.Join(parts[:i], ".") + " must be an object"
		}
		next, ok := obj[p]
		if !ok || next == nil {
			return strings.Join(parts[:i+1], ".") + " is required"
		}
		cur = next
	}
	return ""
}

// jsonKind names, in JSON's words, the kind of value a Go type decodes
// from.
func jsonKind(t reflect.Type) string {
	if t == nil {
		return "a value"
	}
	switch t.Kind() {
	case reflect.Bool:
		return "a boolean"
	case reflect.Int, reflect.Int8, reflect.Int16, reflect.Int32, reflect.Int64,
		reflect.Uint, reflect.Uint8, reflect.Uint16, reflect.Uint32, reflect.Uint64:
		if t.Kind() >= reflect.Uint && t.Kind() <= reflect.Uint64 {
			return "a non-negative integer"
		}
		return "an integer"
	case reflect.Float32, reflect.Float64:
		return "a number"
	case reflect.String:
		return "a string"
	case reflect.Slice, reflect.Array:
		return "an array"
	case reflect.Map, reflect.Struct:
		return "an object"
	case reflect.Pointer:
		return jsonKind(t.Elem())
	}
	return "a value of another kind"
}
