package lsp

import (
	"github.com/sourcegraph/jsonrpc2"

	"hess/network"
)

// target is what a position request points at, read from the last compiled
// state of its document.
type target struct {
	snap   *snapshot
	net    *network.Network
	file   *network.File
	lines  *lines
	path   string
	offset int // byte offset in the compiled source
}

// locate finds the compiled file of a document and the byte offset of a
// position in it. It reports false when the document has not been
// compiled (yet) or its URI is not a file.
func (s *server) locate(uri string, pos Position) (target, bool) {
	path, err := uriToPath(uri)
	if err != nil {
		return target{}, false
	}
	snap := s.worker.current()
	net, f, ix, ok := snap.file(path)
	if !ok {
		return target{}, false
	}
	return target{snap: snap, net: net, file: f, lines: ix, path: path, offset: ix.offset(pos, s.encoding())}, true
}

// symbol is the name at the target, if any.
func (t target) symbol() (network.Symbol, bool) {
	return t.net.SymbolAt(t.path, t.offset)
}

// symbolAt reads a position request and finds the name under its
// position; ok is false (and the answer null) where there is none.
func (s *server) symbolAt(req *jsonrpc2.Request) (t target, sym network.Symbol, ok bool, err error) {
	var p TextDocumentPositionParams
	if err := params(req, &p); err != nil {
		return target{}, network.Symbol{}, false, err
	}
	if t, ok = s.locate(p.TextDocument.URI, p.Position); !ok {
		return target{}, network.Symbol{}, false, nil
	}
	sym, ok = t.symbol()
	return t, sym, ok, nil
}
