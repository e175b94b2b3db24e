package lsp

import (
	"slices"
	"strings"
	"sync"
	"testing"
	"time"
)

const shiftPlant = `include "gases.hess"
reaction shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)
`

// TestOpenIncludeBuffersCount: an unsaved edit in an open included file
// changes the diagnostics of the file that includes it, and the included
// file is checked as part of that network (not on its own).
func TestOpenIncludeBuffersCount(t *testing.T) {
	dir := t.TempDir()
	writeFile(t, dir, "gases.hess", gasesLib)
	writeFile(t, dir, "plant.hess", shiftPlant)
	plant, gases := fileURI(dir, "plant.hess"), fileURI(dir, "gases.hess")
	c := startServer(t, Options{})
	c.initialize()

	c.open(plant, shiftPlant, 1)
	if p := c.waitDiagnostics(plant, atVersion(1)); len(p.Diagnostics) != 0 {
		t.Fatalf("plant.hess: %+v", p.Diagnostics)
	}
	c.open(gases, gasesLib, 1)
	g := c.waitDiagnostics(gases, atVersion(1))
	if len(g.Diagnostics) != 1 || !strings.Contains(g.Diagnostics[0].Message, "CH4(g)") {
		t.Errorf("gases.hess as part of plant's network should warn about CH4(g) alone: %+v", g.Diagnostics)
	}

	// Rename CO2(g) in the buffer only (the disk keeps it).
	line := uint32(strings.Count(gasesLib[:strings.Index(gasesLib, "species CO2(g)")], "\n"))
	c.change(gases, 2, TextDocumentContentChangeEvent{Range: &Range{Start: pos(line, 8), End: pos(line, 14)}, Text: "CO3(g)"})
	p := c.waitDiagnostics(plant, func(p PublishDiagnosticsParams) bool { return len(p.Diagnostics) > 0 })
	if !slices.Contains(codes(p), "undefined-species") || p.Diagnostics[0].Range != rng(1, 35, 1, 41) {
		t.Errorf("plant.hess after the unsaved edit: %+v", p.Diagnostics)
	}

	// Closing the root clears its diagnostics; the included file, still
	// open, is then checked on its own.
	c.notify("textDocument/didClose", DidCloseTextDocumentParams{TextDocument: TextDocumentIdentifier{URI: plant}})
	if p := c.waitDiagnostics(plant, anyPublish); len(p.Diagnostics) != 0 || p.Version != nil {
		t.Errorf("plant.hess after close: %+v", p)
	}
	g = c.waitDiagnostics(gases, func(p PublishDiagnosticsParams) bool { return len(p.Diagnostics) == 5 })
	for _, d := range g.Diagnostics {
		if d.Code != "unused-species" {
			t.Errorf("gases.hess alone: %+v", d)
		}
	}
	if n := c.srv.worker.parsed.Len(); n != 1 {
		t.Errorf("parsed statements kept for %d files while gases.hess alone is read, want 1", n)
	}
	c.notify("textDocument/didClose", DidCloseTextDocumentParams{TextDocument: TextDocumentIdentifier{URI: gases}})
	if g := c.waitDiagnostics(gases, anyPublish); len(g.Diagnostics) != 0 {
		t.Errorf("gases.hess after close: %+v", g)
	}
	if n := c.srv.worker.parsed.Len(); n != 0 {
		t.Errorf("parsed statements kept for %d files with nothing open", n)
	}
}

// TestMissingIncludeThenOpened: an include that cannot be read is an
// error at the include; opening a buffer for that file (not yet on disk)
// satisfies it.
func TestMissingIncludeThenOpened(t *testing.T) {
	dir := t.TempDir()
	plant, gases := fileURI(dir, "plant.hess"), fileURI(dir, "gases.hess")
	c := startServer(t, Options{})
	c.initialize()
	c.open(plant, shiftPlant, 1)
	p := c.waitDiagnostics(plant, atVersion(1))
	if !slices.Contains(codes(p), "include-missing") {
		t.Fatalf("plant.hess without gases.hess: %+v", p.Diagnostics)
	}
	c.open(gases, gasesLib, 1)
	if p := c.waitDiagnostics(plant, anyPublish); len(p.Diagnostics) != 0 {
		t.Errorf("plant.hess once gases.hess is open: %+v", p.Diagnostics)
	}
}

func TestUTF8Negotiated(t *testing.T) {
	dir := t.TempDir()
	writeFile(t, dir, "gases.hess", gasesLib)
	plant := fileURI(dir, "plant.hess")
	c := startServer(t, Options{})
	if res := c.initialize("utf-16", "utf-8"); res.Capabilities.PositionEncoding != "utf-8" {
		t.Fatalf("positionEncoding %q, want utf-8 when offered", res.Capabilities.PositionEncoding)
	}
	c.open(plant, plantBroken, 1)
	p := c.waitDiagnostics(plant, atVersion(1))
	if d := p.Diagnostics[0]; d.Code != "missing-unit" || d.Range != rng(3, 52, 3, 53) {
		t.Errorf("first diagnostic %+v, want missing-unit at byte columns 3:52-3:53", d)
	}
	// Incremental edits are read in bytes too: insert after ⇌ (3 bytes).
	c.change(plant, 2, insert(pos(3, 53), " kJ/mol"), insert(pos(6, 35), "2 "))
	if p := c.waitDiagnostics(plant, atVersion(2)); len(p.Diagnostics) != 0 {
		t.Errorf("after the fix in UTF-8 units: %+v", p.Diagnostics)
	}
}

// TestNewerChangeCancelsCompile: a change compiles at once; changes that
// arrive while it runs cancel it, so that nothing is published for the
// text it read, and the next compile, of the latest text, is published.
func TestNewerChangeCancelsCompile(t *testing.T) {
	dir := t.TempDir()
	writeFile(t, dir, "gases.hess", gasesLib)
	plant := fileURI(dir, "plant.hess")
	hold := make(chan struct{})
	holding := make(chan struct{}, 10)
	var mu sync.Mutex
	calls := 0
	c := startServer(t, Options{}, func(s *server) {
		s.worker.beforeCompile = func(string) {
			mu.Lock()
			calls++
			n := calls
			mu.Unlock()
			if n == 2 { // the compile of version 2
				holding <- struct{}{}
				<-hold
			}
		}
	})
	c.initialize()
	c.open(plant, shiftPlant, 1)
	c.waitDiagnostics(plant, atVersion(1))
	c.change(plant, 2, insert(pos(2, 0), "# edit 2\n"))
	select {
	case <-holding:
	case <-time.After(waitLimit):
		t.Fatal("the change did not start a compile at once")
	}
	c.change(plant, 3, insert(pos(2, 0), "# edit 3\n"))
	c.change(plant, 4, insert(pos(2, 0), "reaction split: H2(g) <-> 2 H2O(g)\n"))
	// A request is answered after the changes: they have been stored and
	// the compile of version 2 cancelled before it is let go.
	var syms []DocumentSymbol
	c.mustCall("textDocument/documentSymbol", DocumentSymbolParams{TextDocument: TextDocumentIdentifier{URI: plant}}, &syms)
	close(hold)
	p := c.waitDiagnostics(plant, anyPublish)
	if p.Version == nil || *p.Version != 4 {
		t.Fatalf("first publish after the changes: version %v, want 4 (2 was cancelled, 3 never compiled)", p.Version)
	}
	if got := codes(p); !contains(got, "element-imbalance") {
		t.Errorf("diagnostics of version 4: %v", got)
	}
	if n := c.srv.worker.compiles.Load(); n != 3 {
		t.Errorf("%d compiles started, want 3 (version 1, version 2 cancelled, version 4)", n)
	}
}

// TestRequestsDoNotWaitForCompiles: while a compile is held up, requests
// are answered from the last compiled state.
func TestRequestsDoNotWaitForCompiles(t *testing.T) {
	dir := t.TempDir()
	writeFile(t, dir, "gases.hess", gasesLib)
	plant := fileURI(dir, "plant.hess")
	hold := make(chan struct{})
	holding := make(chan struct{}, 10)
	first := true
	c := startServer(t, Options{}, func(s *server) {
		s.worker.beforeCompile = func(string) {
			if first {
				first = false
				return
			}
			holding <- struct{}{}
			<-hold
		}
	})
	c.initialize()
	c.open(plant, shiftPlant, 1)
	c.waitDiagnostics(plant, atVersion(1))
	c.change(plant, 2, insert(pos(2, 0), "reaction extra: CO2(g) + H2(g) <-> CO(g) + H2O(g)\n"))
	select {
	case <-holding:
	case <-time.After(waitLimit):
		t.Fatal("the change did not start a compile")
	}
	var h Hover
	c.mustCall("textDocument/hover", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: plant}, Position: pos(1, 10)}, &h)
	if !strings.Contains(h.Contents.Value, "reaction shift") {
		t.Errorf("hover during a compile: %+v", h)
	}
	var syms []DocumentSymbol
	c.mustCall("textDocument/documentSymbol", DocumentSymbolParams{TextDocument: TextDocumentIdentifier{URI: plant}}, &syms)
	if len(syms) != 2 {
		t.Errorf("symbols during a compile come from version 1: %+v", syms)
	}
	close(hold)
	c.waitDiagnostics(plant, atVersion(2))
	c.mustCall("textDocument/documentSymbol", DocumentSymbolParams{TextDocument: TextDocumentIdentifier{URI: plant}}, &syms)
	if len(syms) != 3 {
		t.Errorf("symbols after the compile: %+v", syms)
	}
}

func TestFormattingRefusesBrokenText(t *testing.T) {
	dir := t.TempDir()
	plant := fileURI(dir, "plant.hess")
	c := startServer(t, Options{})
	c.initialize()
	c.open(plant, "reaction broken: -> {\n", 1)
	var edits []TextEdit
	err := c.call("textDocument/formatting", DocumentFormattingParams{TextDocument: TextDocumentIdentifier{URI: plant}, Options: FormattingOptions{TabSize: 2, InsertSpaces: true}}, &edits)
	if !isCode(err, codeRequestFailed) || !strings.Contains(err.Error(), "syntax errors") {
		t.Errorf("formatting broken text: %v, want RequestFailed about syntax errors", err)
	}
	c.open(fileURI(dir, "ok.hess"), "species H2(g)\n", 1)
	c.mustCall("textDocument/formatting", DocumentFormattingParams{TextDocument: TextDocumentIdentifier{URI: fileURI(dir, "ok.hess")}, Options: FormattingOptions{TabSize: 2, InsertSpaces: true}}, &edits)
	if edits == nil || len(edits) != 0 {
		t.Errorf("formatting canonical text: %+v, want an empty list", edits)
	}
}

func TestHoverElsewhereIsNull(t *testing.T) {
	dir := t.TempDir()
	writeFile(t, dir, "gases.hess", gasesLib)
	plant := fileURI(dir, "plant.hess")
	c := startServer(t, Options{})
	c.initialize()
	var h *Hover
	// Not compiled yet: nothing to say.
	c.mustCall("textDocument/hover", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: plant}, Position: pos(1, 10)}, &h)
	if h != nil {
		t.Errorf("hover on an unopened document: %+v", h)
	}
	c.open(plant, shiftPlant, 1)
	c.waitDiagnostics(plant, atVersion(1))
	for _, p := range []Position{pos(1, 0), pos(1, 15), pos(1, 22), pos(40, 2)} {
		h = nil
		c.mustCall("textDocument/hover", TextDocumentPositionParams{TextDocument: TextDocumentIdentifier{URI: plant}, Position: p}, &h)
		if h != nil {
			t.Errorf("hover at %+v (no name there): %+v", p, h)
		}
	}
}
