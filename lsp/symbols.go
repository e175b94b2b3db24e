package lsp

import (
	"context"

	"github.com/sourcegraph/jsonrpc2"

	"hess/network"
)

// documentSymbol answers textDocument/documentSymbol with the document's
// outline: settings, includes, elements, phases, species, reactions and
// mixtures, as last compiled. A document not compiled yet has an empty
// outline.
func (s *server) documentSymbol(ctx context.Context, req *jsonrpc2.Request) (any, error) {
	var p DocumentSymbolParams
	if err := params(req, &p); err != nil {
		return nil, err
	}
	out := []DocumentSymbol{}
	path, err := uriToPath(p.TextDocument.URI)
	if err != nil {
		return out, nil
	}
	snap := s.worker.current()
	net, _, ix, ok := snap.file(path)
	if !ok {
		return out, nil
	}
	enc := s.encoding()
	rng := func(from, to int) Range {
		return Range{Start: ix.position(from, enc), End: ix.position(to, enc)}
	}
	for _, d := range net.Outline(path) {
		name := d.Name
		if name == "" {
			name = "(unnamed)" // the protocol forbids empty names
		}
		out = append(out, DocumentSymbol{
			Name:           name,
			Detail:         d.Detail,
			Kind:           symbolKind(d.Kind),
			Range:          rng(d.Span.Start.Offset, d.Span.End.Offset),
			SelectionRange: rng(d.NameSpan.Start.Offset, d.NameSpan.End.Offset),
		})
	}
	return out, nil
}

func symbolKind(k network.SymbolKind) int {
	switch k {
	case network.SymbolSpecies:
		return symbolKindObject
	case network.SymbolReaction:
		return symbolKindFunction
	case network.SymbolMixture:
		return symbolKindStruct
	case network.SymbolPhase:
		return symbolKindEnum
	case network.SymbolElement:
		return symbolKindConstant
	case network.SymbolSettings:
		return symbolKindNamespace
	}
	return symbolKindFile
}
