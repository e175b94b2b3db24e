package lsp

import (
	"context"
	"fmt"

	"github.com/sourcegraph/jsonrpc2"
)

// The document sync notifications. Each stores what the client sent and
// schedules the worker; none compiles.

func (s *server) didOpen(ctx context.Context, req *jsonrpc2.Request) (any, error) {
	var p DidOpenTextDocumentParams
	if err := params(req, &p); err != nil {
		return nil, err
	}
	path, err := uriToPath(p.TextDocument.URI)
	if err != nil {
		return nil, fmt.Errorf("opening a document: %w", err)
	}
	s.docs.open(p.TextDocument.URI, path, p.TextDocument.Version, []byte(p.TextDocument.Text))
	s.worker.schedule(path, true)
	return nil, nil
}

func (s *server) didChange(ctx context.Context, req *jsonrpc2.Request) (any, error) {
	var p DidChangeTextDocumentParams
	if err := params(req, &p); err != nil {
		return nil, err
	}
	if err := s.docs.edit(p.TextDocument.URI, p.TextDocument.Version, p.ContentChanges, s.encoding()); err != nil {
		return nil, fmt.Errorf("ignoring a change: %w", err)
	}
	path, _ := s.docs.pathOf(p.TextDocument.URI)
	s.worker.schedule(path, false)
	return nil, nil
}

func (s *server) didSave(ctx context.Context, req *jsonrpc2.Request) (any, error) {
	var p DidSaveTextDocumentParams
	if err := params(req, &p); err != nil {
		return nil, err
	}
	if !s.docs.saved(p.TextDocument.URI, p.Text) {
		return nil, fmt.Errorf("save of %s, which is not open", p.TextDocument.URI)
	}
	path, _ := s.docs.pathOf(p.TextDocument.URI)
	s.worker.schedule(path, true)
	return nil, nil
}

func (s *server) didClose(ctx context.Context, req *jsonrpc2.Request) (any, error) {
	var p DidCloseTextDocumentParams
	if err := params(req, &p); err != nil {
		return nil, err
	}
	path, ok := s.docs.close(p.TextDocument.URI)
	if !ok {
		return nil, fmt.Errorf("close of %s, which is not open", p.TextDocument.URI)
	}
	s.worker.schedule(path, true)
	return nil, nil
}
