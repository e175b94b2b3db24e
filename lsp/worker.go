package lsp

import (
	"context"
	"fmt"
	"runtime/debug"
	"sort"
	"strings"
	"sync"
	"sync/atomic"

	"github.com/sourcegraph/jsonrpc2"

	"hess/network"
)

// worker compiles the open documents off the read loop and publishes their
// diagnostics. Handlers only schedule it: every change, open, save and
// close wakes it at once and cancels the cycle in progress, which then
// publishes nothing. Each cycle compiles the latest text of every open
// document, so a burst of changes that arrives faster than a compile
// costs one finished compile, of the last text.
type worker struct {
	s    *server
	wake chan struct{} // capacity 1: a pending wake-up

	mu       sync.Mutex
	force    map[string]bool    // paths to publish even when unchanged
	cancel   context.CancelFunc // cancels the cycle in progress
	stopped  bool
	done     chan struct{}
	stopOnce sync.Once

	// Touched only by the worker goroutine.
	cache      map[string]*compiled // by root path
	parsed     *network.ParseCaches // parsed statements of the files the networks read
	cacheEpoch uint64               // the store's open/close/save count the cache is for
	owners     map[string]string    // file path -> root path, from the last cycle
	published  map[string]published // by path

	cur      atomic.Pointer[snapshot]
	compiles atomic.Int64 // networks compiled (not reused) so far
	solving  atomic.Bool  // a goroutine solves feeds for hovers

	// beforeCompile, when set (by tests), runs before each compile.
	beforeCompile func(root string)
}

// compiled is one root's network and the inputs it was compiled from.
type compiled struct {
	net   *network.Network
	key   string
	feeds *feedResults // equilibrium of its feeds, for hovers
}

// published is what a document's client last received.
type published struct {
	uri     string
	version int32 // -1 when it was not open
	diags   []Diagnostic
}

func newWorker(s *server) *worker {
	return &worker{
		s:         s,
		wake:      make(chan struct{}, 1),
		force:     map[string]bool{},
		done:      make(chan struct{}),
		cache:     map[string]*compiled{},
		parsed:    network.NewParseCaches(),
		owners:    map[string]string{},
		published: map[string]published{},
	}
}

// schedule asks for a compile at once: the cycle in progress, which may
// have read the text before this change, is cancelled, and the next one
// starts over with the latest text. force makes the next finished cycle
// publish the document's diagnostics even when unchanged.
func (w *worker) schedule(path string, force bool) {
	w.mu.Lock()
	defer w.mu.Unlock()
	if w.stopped {
		return
	}
	if force {
		w.force[path] = true
	}
	w.kick()
	if w.cancel != nil {
		w.cancel()
	}
}

func (w *worker) kick() {
	select {
	case w.wake <- struct{}{}:
	default:
	}
}

// stop ends the worker: the cycle in progress is cancelled and no cycle
// starts after it.
func (w *worker) stop() {
	w.stopOnce.Do(func() {
		w.mu.Lock()
		w.stopped = true
		if w.cancel != nil {
			w.cancel()
		}
		w.mu.Unlock()
		close(w.done)
	})
}

// run compiles and publishes until stopped.
func (w *worker) run(ctx context.Context, conn *jsonrpc2.Conn) {
	for {
		select {
		case <-ctx.Done():
			return
		case <-w.done:
			return
		case <-w.wake:
		}
		w.mu.Lock()
		if w.stopped {
			w.mu.Unlock()
			return
		}
		cycleCtx, cancel := context.WithCancel(ctx)
		w.cancel = cancel
		w.mu.Unlock()
		w.cycle(ctx, cycleCtx, conn)
		cancel()
	}
}

// current is the state of the last cycle, for requests (nil before the
// first).
func (w *worker) current() *snapshot { return w.cur.Load() }

// cycle compiles every open document's network and publishes the
// diagnostics that changed. Once cycleCtx is done (a newer change came)
// the cycle stops compiling and publishes nothing; what it was asked to
// publish is left for the next cycle. ctx is the session's.
func (w *worker) cycle(ctx, cycleCtx context.Context, conn *jsonrpc2.Conn) {
	docs, epoch := w.s.docs.snapshot()
	w.mu.Lock()
	force := w.force
	w.force = map[string]bool{}
	w.mu.Unlock()
	cancelled := func() bool {
		if cycleCtx.Err() == nil {
			return false
		}
		w.mu.Lock()
		for p := range force {
			w.force[p] = true
		}
		w.mu.Unlock()
		return true
	}

	open := make(map[string]document, len(docs))
	overlay := network.Overlay{Files: make(map[string][]byte, len(docs)), Base: w.s.opts.Files}
	for _, d := range docs {
		open[d.path] = d
		overlay.Files[d.path] = d.text
	}
	if epoch != w.cacheEpoch {
		// A document opened, closed or saved: what is read from disk may
		// differ, so nothing compiled before can be trusted.
		w.cache = map[string]*compiled{}
		w.cacheEpoch = epoch
	}

	roots := w.chooseRoots(cycleCtx, docs, open, overlay)
	if cancelled() {
		return
	}
	owners := map[string]string{}
	for _, r := range roots {
		for _, f := range r.net.Files {
			if p := cleanPath(f.Path); owners[p] == "" {
				owners[p] = cleanPath(r.net.Root)
			}
		}
	}
	w.owners = owners
	// Files that no network reads any more need not keep their parsed
	// statements.
	w.parsed.Retain(func(path string) bool { return owners[cleanPath(path)] != "" })

	snap := &snapshot{nets: map[string]*network.Network{}, lines: map[string]*lines{}, feeds: map[*network.Network]*feedResults{}}
	// The open documents' line indexes, kept from edit to edit, serve
	// for the text the networks read (linesOf checks that it is the same).
	for _, d := range docs {
		if d.ix != nil {
			snap.lines[d.path] = d.ix
		}
	}
	for _, r := range roots {
		snap.feeds[r.net] = r.feeds
	}
	for p, root := range owners {
		for _, r := range roots {
			if cleanPath(r.net.Root) == root {
				snap.nets[p] = r.net
			}
		}
	}
	uriOf := func(path string) string {
		if d, ok := open[path]; ok {
			return d.uri
		}
		return pathToURI(path)
	}
	diags := collect(roots, snap, uriOf, w.s.encoding())
	if cancelled() {
		return
	}
	w.cur.Store(snap)
	w.publish(ctx, conn, diags, open, uriOf, force)
	w.solveFeeds(roots)
	collectAfterCycle()
}

// chooseRoots compiles the networks whose diagnostics are published: each
// open document is compiled as a root unless another open document's
// network includes it. A document that was included last time is first
// assumed to be included still; if its includer no longer reads it, it is
// compiled as a root of its own in a second round.
func (w *worker) chooseRoots(ctx context.Context, docs []document, open map[string]document, src network.Source) []*compiled {
	rc := &rootChoice{ctx: ctx, w: w, open: open, src: src, nets: map[string]*compiled{}, tried: map[string]bool{},
		chosen: map[string]bool{}, covered: map[string]bool{}}
	rc.compileFirstRound(docs)
	rc.pick()
	for rc.compileMissing(docs) {
		rc.pick()
	}
	return withoutIncluded(rc.roots)
}

// rootChoice is one choice of roots in progress: the networks compiled so
// far, and those chosen for publishing with the files they cover.
type rootChoice struct {
	ctx   context.Context // the cycle's: once done, nothing more compiles
	w     *worker
	open  map[string]document
	src   network.Source
	nets  map[string]*compiled // compiled networks by root path
	tried map[string]bool      // paths compiled as roots, whether or not they loaded

	roots   []*compiled     // chosen, in the order chosen
	chosen  map[string]bool // root paths chosen
	covered map[string]bool // files of the chosen networks
}

// compileRoot compiles path as a root, keeping the network when it loads.
func (rc *rootChoice) compileRoot(path string) {
	rc.tried[path] = true
	if c := rc.w.compile(rc.ctx, path, rc.open, rc.src); c != nil {
		rc.nets[path] = c
	}
}

// compileFirstRound compiles first the documents that no other open
// document includes; a document that a network compiled in this round
// already reads is not compiled again as a root, unless it reaches that
// network's root in turn: a chain of n open documents costs one compile,
// not n. A document whose owner last time is still open is left to it.
func (rc *rootChoice) compileFirstRound(docs []document) {
	graph := rc.w.openIncludes(docs, rc.open)
	ordered := append([]document(nil), docs...)
	sort.SliceStable(ordered, func(i, j int) bool {
		return !graph.included[ordered[i].path] && graph.included[ordered[j].path]
	})
	coveredBy := map[string]string{}
	reachers := map[string]map[string]bool{} // root -> open documents that include it
	for _, d := range ordered {
		if owner := rc.w.owners[d.path]; owner != "" && owner != d.path {
			if _, ok := rc.open[owner]; ok {
				continue
			}
		}
		if r, ok := coveredBy[d.path]; ok {
			if reachers[r] == nil {
				reachers[r] = graph.reaching(r)
			}
			if !reachers[r][d.path] {
				continue
			}
		}
		rc.compileRoot(d.path)
		if c := rc.nets[d.path]; c != nil {
			for _, f := range c.net.Files {
				if _, ok := coveredBy[f.ID]; !ok {
					coveredBy[f.ID] = d.path
				}
			}
		}
	}
}

// pick chooses, among the networks compiled and not yet chosen, each one
// whose root no chosen network covers, larger networks first, so that a
// network is chosen before the networks of the files it includes.
func (rc *rootChoice) pick() {
	var cands []string
	for p := range rc.nets {
		if !rc.chosen[p] {
			cands = append(cands, p)
		}
	}
	sort.Slice(cands, func(i, j int) bool {
		a, b := len(rc.nets[cands[i]].net.Files), len(rc.nets[cands[j]].net.Files)
		if a != b {
			return a > b
		}
		return cands[i] < cands[j]
	})
	for _, p := range cands {
		if rc.covered[p] {
			continue
		}
		rc.chosen[p] = true
		rc.roots = append(rc.roots, rc.nets[p])
		for _, f := range rc.nets[p].net.Files {
			rc.covered[cleanPath(f.Path)] = true
		}
	}
}

// compileMissing compiles as roots the open documents that no chosen
// network covers and that were not tried yet; false when there are none.
func (rc *rootChoice) compileMissing(docs []document) bool {
	var missing []string
	for _, d := range docs {
		if !rc.covered[d.path] && !rc.tried[d.path] {
			missing = append(missing, d.path)
		}
	}
	for _, p := range missing {
		rc.compileRoot(p)
	}
	return len(missing) > 0
}

// withoutIncluded drops a root chosen early that a root chosen later
// includes: the later one's diagnostics cover it (unless the two include
// each other).
func withoutIncluded(roots []*compiled) []*compiled {
	reads := func(c *compiled, path string) bool { return c.net.File(path) != nil }
	var out []*compiled
	for _, x := range roots {
		demoted := false
		for _, y := range roots {
			if x != y && reads(y, x.net.Root) && !reads(x, y.net.Root) {
				demoted = true
				break
			}
		}
		if !demoted {
			out = append(out, x)
		}
	}
	return out
}

// compile loads the network rooted at path, or reuses the last one when
// none of its open files changed. A compile that fails inside the compiler
// is logged and yields nil, and so does one cancelled through ctx.
func (w *worker) compile(ctx context.Context, path string, open map[string]document, src network.Source) (c *compiled) {
	if ctx.Err() != nil {
		return nil
	}
	if old := w.cache[path]; old != nil && old.key == inputKey(old.net, open) {
		return old
	}
	defer func() {
		if p := recover(); p != nil {
			w.s.mu.Lock()
			w.s.panics++
			w.s.mu.Unlock()
			w.s.log.Printf("internal error compiling %s: %v\n%s", path, p, debug.Stack())
			c = nil
		}
	}()
	w.compiles.Add(1)
	if w.beforeCompile != nil {
		w.beforeCompile(path)
	}
	net, err := network.LoadContext(ctx, path, src, network.Options{Caches: w.parsed, IncludePaths: w.s.includePaths()})
	if err != nil {
		return nil
	}
	c = &compiled{net: net, key: inputKey(net, open), feeds: &feedResults{byName: map[string]feedResult{}}}
	w.cache[path] = c
	return c
}

// inputKey names the open-document versions a network was read from.
func inputKey(net *network.Network, open map[string]document) string {
	var b strings.Builder
	for _, f := range net.Files {
		p := cleanPath(f.Path)
		if d, ok := open[p]; ok {
			fmt.Fprintf(&b, "%s@%d;", p, d.version)
		} else {
			fmt.Fprintf(&b, "%s@disk;", p)
		}
	}
	return b.String()
}

// publish sends each document's diagnostics when they changed, when an
// open document reached a new version, or when forced (open, save); a
// document that no network reads any more gets an empty list once.
func (w *worker) publish(ctx context.Context, conn *jsonrpc2.Conn, diags map[string][]Diagnostic, open map[string]document, uriOf func(string) string, force map[string]bool) {
	paths := map[string]bool{}
	for p := range diags {
		paths[p] = true
	}
	for p := range open {
		paths[p] = true
	}
	for p := range w.published {
		paths[p] = true
	}
	sorted := make([]string, 0, len(paths))
	for p := range paths {
		sorted = append(sorted, p)
	}
	sort.Strings(sorted)
	for _, p := range sorted {
		list := diags[p]
		if list == nil {
			list = []Diagnostic{}
		}
		version := int32(-1)
		d, isOpen := open[p]
		if isOpen {
			version = d.version
		}
		prev, had := w.published[p]
		uri := uriOf(p)
		if had && !isOpen {
			uri = prev.uri // the name the client knew it by
		}
		var send bool
		switch {
		case force[p]:
			send = true
		case !had:
			send = isOpen || len(list) > 0
		default:
			send = !equalDiagnostics(prev.diags, list) || (isOpen && prev.version != version)
		}
		if send {
			params := PublishDiagnosticsParams{URI: uri, Diagnostics: list}
			if isOpen {
				v := version
				params.Version = &v
			}
			if err := conn.Notify(ctx, "textDocument/publishDiagnostics", params); err != nil {
				if err != jsonrpc2.ErrClosed {
					w.s.log.Printf("publishing diagnostics of %s: %v", p, err)
				}
				return
			}
		}
		if !isOpen && len(list) == 0 {
			delete(w.published, p)
			continue
		}
		w.published[p] = published{uri: uri, version: version, diags: list}
	}
}

// cleanPath is the identity of a path as the loader reached it.
func cleanPath(p string) string { return network.PathID(p) }

// includeGraph is how the open documents include one another directly.
type includeGraph struct {
	reverse  map[string][]string // path -> open documents that include it
	included map[string]bool     // open documents another open document includes
}

// openIncludes reads the include statements of the open documents (parsing
// them into the caches the compile then reuses).
func (w *worker) openIncludes(docs []document, open map[string]document) includeGraph {
	g := includeGraph{reverse: map[string][]string{}, included: map[string]bool{}}
	for _, d := range docs {
		for _, inc := range network.DirectIncludes(d.path, d.text, w.parsed) {
			if _, ok := open[inc]; ok && inc != d.path {
				g.reverse[inc] = append(g.reverse[inc], d.path)
				g.included[inc] = true
			}
		}
	}
	return g
}

// reaching returns the open documents that include to, directly or through
// other open documents.
func (g includeGraph) reaching(to string) map[string]bool {
	seen := map[string]bool{}
	stack := []string{to}
	for len(stack) > 0 {
		p := stack[len(stack)-1]
		stack = stack[:len(stack)-1]
		for _, q := range g.reverse[p] {
			if !seen[q] {
				seen[q] = true
				stack = append(stack, q)
			}
		}
	}
	return seen
}
