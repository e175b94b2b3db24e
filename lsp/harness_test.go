package lsp

import (
	"bytes"
	"context"
	"encoding/json"
	"net"
	"path/filepath"
	"sync"
	"testing"
	"time"

	"github.com/sourcegraph/jsonrpc2"
)

// waitLimit bounds every wait for the server; it only guards against a
// hang and says nothing about speed.
const waitLimit = 20 * time.Second

// syncBuffer is a log sink safe for concurrent writes.
type syncBuffer struct {
	mu  sync.Mutex
	buf bytes.Buffer
}

func (b *syncBuffer) Write(p []byte) (int, error) {
	b.mu.Lock()
	defer b.mu.Unlock()
	return b.buf.Write(p)
}

func (b *syncBuffer) String() string {
	b.mu.Lock()
	defer b.mu.Unlock()
	return b.buf.String()
}

// client is a test language client: a real JSON-RPC connection (with the
// library's own framing) to a server over an in-memory pipe.
type client struct {
	t      testing.TB
	conn   *jsonrpc2.Conn
	srv    *server
	log    *syncBuffer
	status chan int

	mu      sync.Mutex
	cond    *sync.Cond
	publish []PublishDiagnosticsParams
	read    map[string]int // by URI: publishes consumed by waitDiagnostics
}

// startServer runs a server on one end of a pipe and connects a client to
// the other; setup may adjust the server before it starts. The server is
// stopped when the test ends.
func startServer(t testing.TB, opts Options, setup ...func(*server)) *client {
	t.Helper()
	logs := &syncBuffer{}
	if opts.Log == nil {
		opts.Log = logs
	}
	srvEnd, cliEnd := net.Pipe()
	srv := newServer(opts)
	for _, f := range setup {
		f(srv)
	}
	c := &client{t: t, srv: srv, log: logs, status: make(chan int, 1), read: map[string]int{}}
	c.cond = sync.NewCond(&c.mu)
	ctx, cancel := context.WithCancel(context.Background())
	go func() { c.status <- srv.serve(ctx, srvEnd, srvEnd) }()
	c.conn = jsonrpc2.NewConn(ctx, jsonrpc2.NewBufferedStream(cliEnd, jsonrpc2.VSCodeObjectCodec{}), jsonrpc2.HandlerWithError(c.handle))
	t.Cleanup(func() {
		cancel()
		c.conn.Close()
		select {
		case <-c.status:
		case <-time.After(waitLimit):
			t.Errorf("server did not stop")
		}
		srv.mu.Lock()
		panics := srv.panics
		srv.mu.Unlock()
		if panics > 0 {
			t.Errorf("server caught %d panics; log:\n%s", panics, logs.String())
		}
	})
	return c
}

func (c *client) handle(_ context.Context, _ *jsonrpc2.Conn, req *jsonrpc2.Request) (any, error) {
	if req.Method == "textDocument/publishDiagnostics" && req.Params != nil {
		var p PublishDiagnosticsParams
		if err := json.Unmarshal(*req.Params, &p); err != nil {
			c.t.Errorf("publishDiagnostics: %v", err)
			return nil, nil
		}
		if p.Diagnostics == nil {
			c.t.Errorf("publishDiagnostics for %s has null diagnostics, want a list", p.URI)
		}
		c.mu.Lock()
		c.publish = append(c.publish, p)
		c.cond.Broadcast()
		c.mu.Unlock()
	}
	return nil, nil
}

// call sends a request and decodes its result into result.
func (c *client) call(method string, params, result any) error {
	c.t.Helper()
	ctx, cancel := context.WithTimeout(context.Background(), waitLimit)
	defer cancel()
	return c.conn.Call(ctx, method, params, result)
}

// mustCall is call that fails the test on an error.
func (c *client) mustCall(method string, params, result any) {
	c.t.Helper()
	if err := c.call(method, params, result); err != nil {
		c.t.Fatalf("%s: %v\nserver log:\n%s", method, err, c.log.String())
	}
}

func (c *client) notify(method string, params any) {
	c.t.Helper()
	if err := c.conn.Notify(context.Background(), method, params); err != nil {
		c.t.Fatalf("%s: %v", method, err)
	}
}

// initialize runs the handshake, offering the given position encodings.
func (c *client) initialize(encodings ...string) InitializeResult {
	c.t.Helper()
	var res InitializeResult
	p := map[string]any{
		"processId": nil, "rootUri": nil,
		"capabilities": map[string]any{
			"general":      map[string]any{"positionEncodings": encodings},
			"textDocument": map[string]any{"hover": map[string]any{"contentFormat": []string{"plaintext"}}},
		},
	}
	c.mustCall("initialize", p, &res)
	c.notify("initialized", map[string]any{})
	return res
}

// waitDiagnostics returns the next publish for uri that satisfies ok,
// skipping (and consuming) the publishes for uri before it.
func (c *client) waitDiagnostics(uri string, ok func(PublishDiagnosticsParams) bool) PublishDiagnosticsParams {
	c.t.Helper()
	deadline := time.Now().Add(waitLimit)
	timer := time.AfterFunc(waitLimit, func() {
		c.mu.Lock()
		c.cond.Broadcast()
		c.mu.Unlock()
	})
	defer timer.Stop()
	c.mu.Lock()
	defer c.mu.Unlock()
	for {
		for c.read[uri] < len(c.publish) {
			p := c.publish[c.read[uri]]
			c.read[uri]++
			if p.URI == uri && ok(p) {
				return p
			}
		}
		if time.Now().After(deadline) {
			c.t.Fatalf("no matching diagnostics for %s; got %+v\nserver log:\n%s", uri, c.publish, c.log.String())
		}
		c.cond.Wait()
	}
}

// atVersion matches a publish for a document version.
func atVersion(v int32) func(PublishDiagnosticsParams) bool {
	return func(p PublishDiagnosticsParams) bool { return p.Version != nil && *p.Version == v }
}

// anyPublish matches every publish.
func anyPublish(PublishDiagnosticsParams) bool { return true }

// fileURI is the URI of a file in dir.
func fileURI(dir, name string) string { return pathToURI(filepath.Join(dir, name)) }

func (c *client) open(uri, text string, version int32) {
	c.t.Helper()
	c.notify("textDocument/didOpen", DidOpenTextDocumentParams{TextDocument: TextDocumentItem{URI: uri, LanguageID: "hess", Version: version, Text: text}})
}

func (c *client) change(uri string, version int32, changes ...TextDocumentContentChangeEvent) {
	c.t.Helper()
	c.notify("textDocument/didChange", DidChangeTextDocumentParams{
		TextDocument:   VersionedTextDocumentIdentifier{URI: uri, Version: version},
		ContentChanges: changes,
	})
}

func pos(line, char uint32) Position { return Position{Line: line, Character: char} }

func rng(l1, c1, l2, c2 uint32) Range { return Range{Start: pos(l1, c1), End: pos(l2, c2)} }

// insert is an incremental change that inserts text at p.
func insert(p Position, text string) TextDocumentContentChangeEvent {
	return TextDocumentContentChangeEvent{Range: &Range{Start: p, End: p}, Text: text}
}

// codes lists the diagnostic codes of a publish.
func codes(p PublishDiagnosticsParams) []string {
	var out []string
	for _, d := range p.Diagnostics {
		out = append(out, d.Code)
	}
	return out
}
