package lsp

import (
	"bytes"
	"context"
	"errors"
	"fmt"

	"github.com/sourcegraph/jsonrpc2"

	"hess/lang"
)

// formatting answers textDocument/formatting with the canonical layout of
// `hess fmt`, as one edit that replaces the lines that differ (no edit
// when the document is already formatted). A document with syntax errors
// is not formatted: the request fails and says so. The document is read
// as it is now and formatted off the read loop.
func (s *server) formatting(ctx context.Context, req *jsonrpc2.Request) (any, error) {
	var p DocumentFormattingParams
	if err := params(req, &p); err != nil {
		return nil, err
	}
	path, err := uriToPath(p.TextDocument.URI)
	if err != nil {
		return nil, err
	}
	doc, ok := s.docs.get(path)
	if !ok {
		return nil, fmt.Errorf("formatting %s: the document is not open", p.TextDocument.URI)
	}
	enc := s.encoding()
	return deferred{run: func() (any, error) {
		out, _ := lang.FormatSource(path, doc.text)
		if out == nil {
			return nil, errors.New("the document has syntax errors; fix them (see the diagnostics) before formatting")
		}
		return formatEdits(doc.text, out, enc), nil
	}}, nil
}

// formatEdits is the one edit that turns old into formatted: the lines
// between their common leading and trailing lines are replaced.
func formatEdits(old, formatted []byte, enc encoding) []TextEdit {
	if bytes.Equal(old, formatted) {
		return []TextEdit{}
	}
	// Common prefix and suffix, cut back to whole lines.
	pre := 0
	for pre < len(old) && pre < len(formatted) && old[pre] == formatted[pre] {
		pre++
	}
	for pre > 0 && old[pre-1] != '\n' {
		pre--
	}
	suf := 0
	for suf < len(old)-pre && suf < len(formatted)-pre && old[len(old)-1-suf] == formatted[len(formatted)-1-suf] {
		suf++
	}
	for suf > 0 && old[len(old)-suf-1] != '\n' {
		suf--
	}
	ix := newLines(old)
	return []TextEdit{{
		Range:   Range{Start: ix.position(pre, enc), End: ix.position(len(old)-suf, enc)},
		NewText: string(formatted[pre : len(formatted)-suf]),
	}}
}
