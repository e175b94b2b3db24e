package network

import (
	"bytes"
	"context"
	"errors"
	"fmt"
	"io/fs"
	"path/filepath"
	"strings"
	"unicode/utf8"

	"hess/lang"
)

// Options are a caller's choices for one load.
type Options struct {
	// Temperatures, when not nil, are the temperatures the caller will
	// evaluate the network at (hess table --temperatures): the checks of
	// requested temperatures (extrapolation, missing-thermo) run at these
	// instead of the settings'. Network.Temperatures holds the ones used.
	Temperatures []float64
	// IncludePaths are folders, besides the root file's own folder tree,
	// that includes may read from (shared libraries).
	IncludePaths []string
	// Caches, when set, keep parsed statements between loads.
	Caches *ParseCaches
}

// Load reads the root file and every file it includes through src, and
// compiles them into a network: names resolved, formulas parsed, quantities
// converted to SI, and every registered check run once, at the temperatures
// opts asks for. Problems are diagnostics on the network, never errors or
// panics; a root file that cannot be read is an include-missing (or
// include-refused) diagnostic with an empty span.
//
// Includes are read only from regular files inside the root file's folder
// tree or a folder of opts.IncludePaths (symbolic links followed), and
// within the limits of limits.go.
func Load(root string, src Source, opts Options) *Network {
	n, _ := LoadContext(context.Background(), root, src, opts)
	return n
}

// LoadContext is Load that gives up when ctx is done: it looks at ctx
// between files, between the compiler's passes and before each check, and
// then returns a nil network and ctx's error. A load that is not cancelled
// returns exactly what Load returns.
func LoadContext(ctx context.Context, root string, src Source, opts Options) (*Network, error) {
	n := &Network{Root: root, files: map[string]*File{}}
	l := &loader{ctx: ctx, net: n, src: src, caches: opts.Caches, onStack: map[string]int{}}
	rootID := PathID(root)
	l.allowed = append(l.allowed, realPath(filepath.Dir(rootID)))
	shown := []string{filepath.Dir(root)}
	for _, p := range opts.IncludePaths {
		l.allowed = append(l.allowed, realPath(PathID(p)))
		shown = append(shown, p)
	}
	l.shown = strings.Join(shown, ", ")
	l.load(root, rootID, lang.Span{})
	if err := ctx.Err(); err != nil {
		return nil, err
	}
	memo := opts.Caches.memo(rootID)
	if err := compileContext(ctx, n, memo); err != nil {
		return nil, err
	}
	n.Temperatures = n.Settings.Temperatures
	if opts.Temperatures != nil {
		n.Temperatures = opts.Temperatures
	}
	if err := runChecks(ctx, n, memo); err != nil {
		return nil, err
	}
	finalize(n)
	return n, nil
}

type loader struct {
	ctx     context.Context // the load stops reading files once it is done
	net     *Network
	src     Source
	caches  *ParseCaches
	allowed []string       // real paths of the folders includes may come from
	shown   string         // those folders as the user named them, for messages
	stack   []chainLink    // the files being loaded, root first
	onStack map[string]int // file identity -> index in stack
	bytes   int64          // read so far
	limited bool           // a limit on files or bytes was reported
}

// chainLink is one file on the way from the root to the file being loaded.
type chainLink struct {
	path, id string
	at       lang.Span // the include statement that reached the next file
}

// load reads one file and, depth first, the files it includes. at is the
// include that asked for it (none for the root).
func (l *loader) load(path, id string, at lang.Span) {
	if l.ctx.Err() != nil {
		return
	}
	if i, ok := l.onStack[id]; ok {
		l.cycle(i, path, at)
		return
	}
	if _, seen := l.net.files[id]; seen {
		return
	}
	included := len(l.stack) > 0
	if included && !l.admit(path, id, at) {
		return
	}
	text, err := l.src.ReadFile(path)
	if err == nil && len(text) > MaxFileBytes {
		err = tooLarge(path)
	}
	if err == nil && l.bytes+int64(len(text)) > maxTotalBytes {
		err = &RefusedError{Path: path, Reason: fmt.Sprintf("the network's files would hold more than %s, the limit on one network", sizeText(maxTotalBytes))}
	}
	if err != nil {
		l.readError(path, at, err)
		return
	}
	l.bytes += int64(len(text))
	ast, diags := l.caches.file(id).parse(path, text)
	f := &File{Path: path, ID: id, Source: text, AST: ast}
	if included {
		if why := notNetwork(text, ast, diags); why != "" {
			f, diags = quoteFirstLine(f, why)
		}
	}
	l.net.files[id] = f
	l.net.Files = append(l.net.Files, f)
	l.net.Diagnostics = append(l.net.Diagnostics, diags...)

	l.onStack[id] = len(l.stack)
	l.stack = append(l.stack, chainLink{path: path, id: id})
	for _, st := range f.AST.Statements {
		inc := st.Include
		if inc == nil || inc.Path == nil {
			continue
		}
		rel, err := lang.Unquote(inc.Path.Raw)
		if err != nil {
			continue // the lexer has reported the string
		}
		span := inc.Span()
		if rel == "" {
			l.refuse(span, "an include must name a file; this one is empty")
			continue
		}
		nextPath := filepath.Clean(rel)
		if !filepath.IsAbs(rel) {
			nextPath = filepath.Join(filepath.Dir(path), rel)
		}
		nextID := includeID(id, rel)
		l.stack[len(l.stack)-1].at = span
		l.load(nextPath, nextID, span)
	}
	l.stack = l.stack[:len(l.stack)-1]
	delete(l.onStack, id)
}

// admit checks an included file against the limits and the folders
// includes may come from, reporting a refusal.
func (l *loader) admit(path, id string, at lang.Span) bool {
	switch {
	case len(l.stack) >= maxIncludeDepth:
		l.refuse(at, "%s: includes nest deeper than %d files, the limit on include depth (included by %s)",
			path, maxIncludeDepth, l.chainText(len(l.stack)))
		return false
	case len(l.net.Files) >= maxIncludeFiles:
		if !l.limited {
			l.limited = true
			l.refuse(at, "%s: the network would read more than %d files, the limit on one network", path, maxIncludeFiles)
		}
		return false
	}
	real := realPath(id)
	for _, dir := range l.allowed {
		if within(real, dir) {
			return true
		}
	}
	msg := fmt.Sprintf("%s lies outside the folders includes may come from (%s); name its folder with --include-path to allow it",
		path, l.shown)
	if real != id {
		msg = fmt.Sprintf("%s resolves to %s, outside the folders includes may come from (%s); name its folder with --include-path to allow it",
			path, real, l.shown)
	}
	l.refuse(at, "%s", msg)
	return false
}

// refuse reports an include-refused diagnostic at the include statement.
func (l *loader) refuse(at lang.Span, format string, args ...any) {
	l.net.Diagnostics = append(l.net.Diagnostics, lang.Diagnostic{
		Code: includeRefusedCheck.Code(), Message: fmt.Sprintf(format, args...), Subject: at,
	})
}

// readError reports a file that could not be read or was refused.
func (l *loader) readError(path string, at lang.Span, err error) {
	code := includeMissingCheck.Code()
	var msg string
	if r, ok := isRefused(err); ok {
		code = includeRefusedCheck.Code()
		msg = fmt.Sprintf("refusing %s: %s", path, r.Reason)
	} else {
		msg = fmt.Sprintf("cannot read %s: %v", path, describeReadError(err))
	}
	if len(l.stack) > 0 {
		msg += " (included by " + l.chainText(len(l.stack)) + ")"
	}
	l.net.Diagnostics = append(l.net.Diagnostics, lang.Diagnostic{Code: code, Message: msg, Subject: at})
}

// cycle reports an include that reaches stack[i] again.
func (l *loader) cycle(i int, path string, at lang.Span) {
	names := make([]string, 0, len(l.stack)-i+1)
	for _, c := range l.stack[i:] {
		names = append(names, c.path)
	}
	names = append(names, path)
	d := lang.Diagnostic{
		Code:    includeCycleCheck.Code(),
		Message: "includes form a cycle: " + elideChain(names),
		Subject: at,
	}
	related := l.stack[i : len(l.stack)-1]
	if len(related) > maxChainShown {
		related = related[len(related)-maxChainShown:]
	}
	for _, c := range related {
		d.Related = append(d.Related, lang.Related{Span: c.at, Message: "included from here"})
	}
	l.net.Diagnostics = append(l.net.Diagnostics, d)
}

// chainText names the first n files of the stack, root first.
func (l *loader) chainText(n int) string {
	names := make([]string, 0, min(n, maxChainShown+1))
	if n <= maxChainShown {
		for _, c := range l.stack[:n] {
			names = append(names, c.path)
		}
		return elideChain(names)
	}
	for _, c := range l.stack[:maxChainShown/2] {
		names = append(names, c.path)
	}
	names = append(names, fmt.Sprintf("… %d more …", n-maxChainShown))
	for _, c := range l.stack[n-maxChainShown/2 : n] {
		names = append(names, c.path)
	}
	return strings.Join(names, " -> ")
}

// elideChain joins a chain of file names, eliding the middle of a long one
// so that a message stays short however deep the includes go.
func elideChain(names []string) string {
	if len(names) > maxChainShown {
		h := maxChainShown / 2
		tail := names[len(names)-h:]
		names = append(append(names[:h:h], fmt.Sprintf("… %d more …", len(names)-2*h)), tail...)
	}
	return strings.Join(names, " -> ")
}

// realPath resolves the symbolic links of an absolute path. A path that
// does not exist (an editor buffer not yet saved) resolves its folder; what
// cannot be resolved at all stays as it is.
func realPath(p string) string {
	if r, err := filepath.EvalSymlinks(p); err == nil {
		return r
	}
	if dir, err := filepath.EvalSymlinks(filepath.Dir(p)); err == nil {
		return filepath.Join(dir, filepath.Base(p))
	}
	return p
}

// within reports whether path is dir or lies inside it.
func within(path, dir string) bool {
	if path == dir {
		return true
	}
	if !strings.HasSuffix(dir, string(filepath.Separator)) {
		dir += string(filepath.Separator)
	}
	return strings.HasPrefix(path, dir)
}

// notNetwork says why an included file does not read as a network at all
// (binary content, or not one statement read), or "" when it does.
func notNetwork(text []byte, ast *lang.File, diags lang.Diagnostics) string {
	switch {
	case bytes.IndexByte(text, 0) >= 0:
		return "it holds NUL bytes"
	case !utf8.Valid(text):
		return "it is not UTF-8 text"
	}
	if len(diags) == 0 {
		return ""
	}
	for _, st := range ast.Statements {
		if !st.Broken {
			return ""
		}
	}
	return "not one statement in it could be read"
}

// quoteFirstLine replaces an included file that does not read as a network
// by its first line, cut short, and one syntax diagnostic there: such a
// file may be anything (a key, the environment) and is never quoted
// further.
func quoteFirstLine(f *File, why string) (*File, lang.Diagnostics) {
	line := f.Source
	if i := bytes.IndexAny(line, "\n\r\x00"); i >= 0 {
		line = line[:i]
	}
	cut := false
	if len(line) > maxQuotedBytes {
		line, cut = line[:maxQuotedBytes], true
	}
	for len(line) > 0 && !utf8.Valid(line) {
		line, cut = line[:len(line)-1], true
	}
	line = bytes.Map(func(r rune) rune {
		if r < ' ' || r == 0x7f {
			return -1
		}
		return r
	}, line)
	if cut {
		line = append(line, "…"...)
	}
	start := lang.Pos{Line: 1, Column: 1}
	end := lang.Pos{Line: 1, Column: 1 + utf8.RuneCount(line), Offset: len(line)}
	d := lang.Diagnostic{
		Code:    syntaxCheck.Code(),
		Message: fmt.Sprintf("%s does not read as a network file: %s; only its first line is shown", f.Path, why),
		Subject: lang.Span{File: f.Path, Start: start, End: end},
	}
	return &File{Path: f.Path, ID: f.ID, Source: line, AST: &lang.File{Name: f.Path}}, lang.Diagnostics{d}
}

func describeReadError(err error) string {
	switch {
	case errors.Is(err, fs.ErrNotExist):
		return "no such file"
	case errors.Is(err, fs.ErrPermission):
		return "permission denied"
	}
	var pe *fs.PathError
	if errors.As(err, &pe) {
		return pe.Err.Error()
	}
	return err.Error()
}

// DirectIncludes parses one file's text (through caches, so that a load
// after it reuses the statements) and returns the identities of the files
// its include statements name, as the loader would reach them.
func DirectIncludes(path string, text []byte, caches *ParseCaches) []string {
	id := PathID(path)
	ast, _ := caches.file(id).parse(path, text)
	var out []string
	for _, st := range ast.Statements {
		if inc := st.Include; inc != nil && inc.Path != nil {
			if rel, err := lang.Unquote(inc.Path.Raw); err == nil && rel != "" {
				out = append(out, includeID(id, rel))
			}
		}
	}
	return out
}

// includeID is the identity of the file that rel names in the file whose
// identity is id.
func includeID(id, rel string) string {
	if filepath.IsAbs(rel) {
		return filepath.Clean(rel)
	}
	return filepath.Join(filepath.Dir(id), rel)
}
