package lsp

import (
	"context"

	"github.com/sourcegraph/jsonrpc2"
)

// definition answers textDocument/definition: where the species, reaction
// or included file under the cursor is declared. It answers null where no
// declared name is under the cursor.
func (s *server) definition(ctx context.Context, req *jsonrpc2.Request) (any, error) {
	t, sym, ok, err := s.symbolAt(req)
	if !ok || err != nil {
		return nil, err
	}
	span, ok := sym.Definition()
	if !ok {
		return nil, nil
	}
	path, r := t.snap.spanRange(t.net, span, s.encoding())
	return Location{URI: s.uriOf(path), Range: r}, nil
}

// uriOf is the URI of a path: the client's own for an open document.
func (s *server) uriOf(path string) string {
	if d, ok := s.docs.get(path); ok {
		return d.uri
	}
	return pathToURI(path)
}
