// Package lsp is the hess language server: the Language Server Protocol
// 3.17 over a byte stream, a store of open documents, and handlers that
// answer from the networks the compiler builds of them.
package lsp

import (
	"context"
	"io"
	"log"
	"runtime/debug"
	"sync"

	"github.com/sourcegraph/jsonrpc2"

	"hess/network"
)

// Options configure a server.
type Options struct {
	// Version is reported to the client in serverInfo.
	Version string
	// Log receives the server's log (never the protocol stream); nil
	// discards it.
	Log io.Writer
	// Files reads the files of a network that are not open in the editor;
	// nil reads the disk.
	Files network.Source
	// IncludePaths are folders includes may read from besides the root
	// document's folder tree and the workspace folders (hess lsp
	// --include-path).
	IncludePaths []string
}

// lifecycle is where the server is between initialize and exit.
type lifecycle int

const (
	awaitingInitialize lifecycle = iota
	running
	shutDown
)

// server is one language server session.
type server struct {
	opts   Options
	log    *log.Logger
	docs   *store
	worker *worker

	mu    sync.Mutex
	state lifecycle
	enc   encoding
	mdOK  bool // the client renders markdown in hovers
	// folders are the workspace folders the client named at initialize
	// (its root URI when it named none).
	folders []string
	status  int // exit status, once exit has arrived
	exited  bool

	exitOnce sync.Once
	exitCh   chan struct{} // closed when exit arrives

	// panics counts handler and compile failures that were caught; tests
	// require it to stay zero.
	panics int

	inflight sync.WaitGroup // requests answered off the read loop
	closing  bool           // serve is ending: start no more of them
}

// Serve runs a language server session on in and out until the client
// sends exit or the input ends, and returns the exit status: 0 after
// shutdown and exit, 1 otherwise. If in is an io.Closer it is closed at
// the end.
func Serve(ctx context.Context, in io.Reader, out io.Writer, opts Options) int {
	s := newServer(opts)
	return s.serve(ctx, in, out)
}

func newServer(opts Options) *server {
	if opts.Files == nil {
		opts.Files = network.Disk{}
	}
	logw := opts.Log
	if logw == nil {
		logw = io.Discard
	}
	s := &server{opts: opts, log: log.New(logw, "hess lsp: ", log.LstdFlags|log.Lmsgprefix), docs: newStore(), status: 1, exitCh: make(chan struct{})}
	s.worker = newWorker(s)
	return s
}

func (s *server) serve(ctx context.Context, in io.Reader, out io.Writer) int {
	ctx, cancel := context.WithCancel(ctx)
	defer cancel()
	closer, _ := in.(io.Closer)
	st := newStream(in, out, closer, s.log)
	conn := jsonrpc2.NewConn(ctx, st, s, jsonrpc2.SetLogger(s.log))

	var wg sync.WaitGroup
	wg.Add(1)
	go func() {
		defer wg.Done()
		s.worker.run(ctx, conn)
	}()

	select {
	case <-conn.DisconnectNotify():
	case <-s.exitCh:
	case <-ctx.Done():
	}
	conn.Close()
	cancel()
	s.worker.stop()
	wg.Wait()
	s.mu.Lock()
	s.closing = true
	s.mu.Unlock()
	s.inflight.Wait()

	s.mu.Lock()
	defer s.mu.Unlock()
	if !s.exited {
		s.log.Printf("connection ended without exit")
		return 1
	}
	return s.status
}

// handlerFunc answers one request or takes one notification.
type handlerFunc func(ctx context.Context, req *jsonrpc2.Request) (any, error)

// methods maps each supported method to its handler. Handlers run on the
// connection's read loop, one at a time in the order messages arrive, so
// each must return quickly: document changes are stored and queued for the
// worker, and requests answer from the last compiled state.
func (s *server) methods() map[string]handlerFunc {
	return map[string]handlerFunc{
		"initialize":                  s.initialize,
		"initialized":                 ignore,
		"shutdown":                    s.shutdown,
		"exit":                        s.exit,
		"textDocument/didOpen":        s.didOpen,
		"textDocument/didChange":      s.didChange,
		"textDocument/didSave":        s.didSave,
		"textDocument/didClose":       s.didClose,
		"textDocument/hover":          s.hover,
		"textDocument/definition":     s.definition,
		"textDocument/documentSymbol": s.documentSymbol,
		"textDocument/completion":     s.completion,
		"textDocument/formatting":     s.formatting,

		"workspace/didChangeWorkspaceFolders": s.didChangeWorkspaceFolders,
	}
}

func ignore(context.Context, *jsonrpc2.Request) (any, error) { return nil, nil }

// deferred is a result computed off the read loop: the reply is sent when
// run returns.
type deferred struct {
	run func() (any, error)
}

// Handle takes one message from the connection's read loop and answers it
// if it is a request.
func (s *server) Handle(ctx context.Context, conn *jsonrpc2.Conn, req *jsonrpc2.Request) {
	result, err := s.dispatch(ctx, req)
	if d, ok := result.(deferred); ok {
		s.mu.Lock()
		closing := s.closing
		if !closing {
			s.inflight.Add(1)
		}
		s.mu.Unlock()
		if closing {
			return // the connection is gone
		}
		go func() {
			defer s.inflight.Done()
			result, err := s.guard(req, d.run)
			s.reply(ctx, conn, req, result, err)
		}()
		return
	}
	s.reply(ctx, conn, req, result, err)
}

func (s *server) reply(ctx context.Context, conn *jsonrpc2.Conn, req *jsonrpc2.Request, result any, err error) {
	if req.Notif {
		if err != nil {
			s.log.Printf("%s: %v", req.Method, err)
		}
		return
	}
	var sendErr error
	if err != nil {
		rpcErr, ok := err.(*jsonrpc2.Error)
		if !ok {
			rpcErr = &jsonrpc2.Error{Code: codeRequestFailed, Message: err.Error()}
		}
		sendErr = conn.ReplyWithError(ctx, req.ID, rpcErr)
	} else {
		sendErr = conn.Reply(ctx, req.ID, result)
	}
	if sendErr != nil && sendErr != jsonrpc2.ErrClosed {
		s.log.Printf("answering %s: %v", req.Method, sendErr)
	}
}

// guard runs fn, turning a panic into an internal error (and a log entry)
// so that one bad message cannot end the session.
func (s *server) guard(req *jsonrpc2.Request, fn func() (any, error)) (result any, err error) {
	defer func() {
		if p := recover(); p != nil {
			s.mu.Lock()
			s.panics++
			s.mu.Unlock()
			s.log.Printf("internal error handling %s: %v\n%s", req.Method, p, debug.Stack())
			result, err = nil, &jsonrpc2.Error{Code: jsonrpc2.CodeInternalError, Message: "internal error handling " + req.Method}
		}
	}()
	return fn()
}

// dispatch picks the handler by method and lifecycle state. Requests
// before initialize get ServerNotInitialized, requests after shutdown
// InvalidRequest, unknown requests MethodNotFound; unknown notifications
// are ignored.
func (s *server) dispatch(ctx context.Context, req *jsonrpc2.Request) (any, error) {
	h, known := s.methods()[req.Method]
	s.mu.Lock()
	state := s.state
	s.mu.Unlock()
	switch {
	case req.Method == "exit":
	case state == awaitingInitialize && req.Method != "initialize":
		if req.Notif {
			return nil, nil
		}
		return nil, &jsonrpc2.Error{Code: codeServerNotInitialized, Message: "the server is not initialized: send initialize first"}
	case state == shutDown:
		if req.Notif {
			return nil, nil
		}
		return nil, &jsonrpc2.Error{Code: jsonrpc2.CodeInvalidRequest, Message: "the server has shut down: only exit is accepted"}
	case !known:
		if req.Notif {
			return nil, nil
		}
		return nil, &jsonrpc2.Error{Code: jsonrpc2.CodeMethodNotFound, Message: "method not supported: " + req.Method}
	}
	return s.guard(req, func() (any, error) { return h(ctx, req) })
}

// params decodes a message's parameters into v (decodeParams).
func params(req *jsonrpc2.Request, v any) error { return decodeParams(req.Method, req.Params, v) }

func (s *server) initialize(ctx context.Context, req *jsonrpc2.Request) (any, error) {
	var p InitializeParams
	if err := params(req, &p); err != nil {
		return nil, err
	}
	s.mu.Lock()
	defer s.mu.Unlock()
	if s.state != awaitingInitialize {
		return nil, &jsonrpc2.Error{Code: jsonrpc2.CodeInvalidRequest, Message: "initialize was already received"}
	}
	if p.Capabilities.General != nil {
		s.enc = negotiate(p.Capabilities.General.PositionEncodings)
	}
	if td := p.Capabilities.TextDocument; td != nil && td.Hover != nil {
		for _, f := range td.Hover.ContentFormat {
			if f == "markdown" {
				s.mdOK = true
			}
		}
	}
	s.folders = workspaceFolders(p, s.log)
	s.state = running
	return InitializeResult{
		Capabilities: ServerCapabilities{
			PositionEncoding: s.enc.name(),
			TextDocumentSync: TextDocumentSyncOptions{
				OpenClose: true,
				Change:    syncIncremental,
				Save:      SaveOptions{IncludeText: false},
			},
			HoverProvider:              true,
			DefinitionProvider:         true,
			DocumentSymbolProvider:     true,
			CompletionProvider:         CompletionOptions{TriggerCharacters: []string{"("}},
			DocumentFormattingProvider: true,
			Workspace: &WorkspaceCapabilities{WorkspaceFolders: WorkspaceFoldersServerCapabilities{
				Supported: true, ChangeNotifications: true,
			}},
		},
		ServerInfo: ServerInfo{Name: "hess", Version: s.opts.Version},
	}, nil
}

func (s *server) shutdown(ctx context.Context, req *jsonrpc2.Request) (any, error) {
	s.mu.Lock()
	s.state = shutDown
	s.mu.Unlock()
	s.worker.stop()
	return nil, nil
}

func (s *server) exit(ctx context.Context, req *jsonrpc2.Request) (any, error) {
	s.mu.Lock()
	s.exited = true
	if s.state == shutDown {
		s.status = 0
	}
	s.mu.Unlock()
	s.exitOnce.Do(func() { close(s.exitCh) })
	return nil, nil
}

// encoding returns the negotiated position encoding.
func (s *server) encoding() encoding {
	s.mu.Lock()
	defer s.mu.Unlock()
	return s.enc
}

// workspaceFolders are the paths of the client's workspace folders, or of
// its root URI when it names none. URIs that are not file: URIs are logged
// and skipped.
func workspaceFolders(p InitializeParams, log *log.Logger) []string {
	uris := make([]string, 0, len(p.WorkspaceFolders))
	for _, f := range p.WorkspaceFolders {
		uris = append(uris, f.URI)
	}
	if len(uris) == 0 && p.RootURI != nil && *p.RootURI != "" {
		uris = append(uris, *p.RootURI)
	}
	var out []string
	for _, u := range uris {
		path, err := uriToPath(u)
		if err != nil {
			log.Printf("workspace folder %q skipped: %v", u, err)
			continue
		}
		out = append(out, path)
	}
	return out
}

// includePaths are the folders, besides a root document's own folder
// tree, that its includes may read from.
func (s *server) includePaths() []string {
	s.mu.Lock()
	defer s.mu.Unlock()
	return append(append([]string(nil), s.opts.IncludePaths...), s.folders...)
}

// didChangeWorkspaceFolders updates the folders includes may come from and
// compiles every open document again: what a network may read has changed.
func (s *server) didChangeWorkspaceFolders(ctx context.Context, req *jsonrpc2.Request) (any, error) {
	var p DidChangeWorkspaceFoldersParams
	if err := params(req, &p); err != nil {
		return nil, err
	}
	removed := map[string]bool{}
	for _, f := range workspaceFolders(InitializeParams{WorkspaceFolders: p.Event.Removed}, s.log) {
		removed[f] = true
	}
	added := workspaceFolders(InitializeParams{WorkspaceFolders: p.Event.Added}, s.log)
	s.mu.Lock()
	kept := s.folders[:0:0]
	for _, f := range s.folders {
		if !removed[f] {
			kept = append(kept, f)
		}
	}
	s.folders = append(kept, added...)
	s.mu.Unlock()
	s.docs.invalidate()
	docs, _ := s.docs.snapshot()
	for _, d := range docs {
		s.worker.schedule(d.path, true)
	}
	return nil, nil
}
