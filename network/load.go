package network

import (
	"errors"
	"fmt"
	"io/fs"
	"path/filepath"
	"strings"

	"hess/lang"
)

// Load reads the root file and every file it includes through src, and
// compiles them into a network: names resolved, formulas parsed, quantities
// converted to SI, and every registered check run. Problems are
// diagnostics on the network, never errors or panics; a root file that
// cannot be read is an include-missing diagnostic with an empty span.
func Load(root string, src Source) *Network {
	return LoadCached(root, src, nil)
}

type loader struct {
	net   *Network
	src   Source
	index map[string]int // file identity -> index in net.Files
	// caches, when set, keep parsed statements between loads.
	caches *ParseCaches
}

// chainLink is one include on the way from the root to a file.
type chainLink struct {
	path string
	at   lang.Span // the include statement that reached the next file
}

func identity(path string) string {
	if abs, err := filepath.Abs(path); err == nil {
		return abs
	}
	return filepath.Clean(path)
}

// load reads one file and, depth first, the files it includes. chain holds
// the files being loaded above it (for cycle reports); at is the include
// that asked for it.
func (l *loader) load(path string, chain []chainLink, at lang.Span) {
	id := identity(path)
	for i, c := range chain {
		if identity(c.path) == id {
			names := make([]string, 0, len(chain)-i+1)
			for _, c := range chain[i:] {
				names = append(names, c.path)
			}
			names = append(names, path)
			d := lang.Diagnostic{
				Code:    "include-cycle",
				Message: "includes form a cycle: " + strings.Join(names, " -> "),
				Subject: at,
			}
			for _, c := range chain[i : len(chain)-1] {
				d.Related = append(d.Related, lang.Related{Span: c.at, Message: "included from here"})
			}
			l.net.Diagnostics = append(l.net.Diagnostics, d)
			return
		}
	}
	if _, seen := l.index[id]; seen {
		return
	}
	text, err := l.src.ReadFile(path)
	if err != nil {
		msg := fmt.Sprintf("cannot read %s: %v", path, describeReadError(err))
		if len(chain) > 0 {
			names := make([]string, 0, len(chain)+1)
			for _, c := range chain {
				names = append(names, c.path)
			}
			msg += " (included by " + strings.Join(names, " -> ") + ")"
		}
		l.net.Diagnostics = append(l.net.Diagnostics, lang.Diagnostic{
			Code: "include-missing", Message: msg, Subject: at,
		})
		return
	}
	ast, diags := lang.ParseCached(path, text, l.caches.file(id))
	l.index[id] = len(l.net.Files)
	l.net.Files = append(l.net.Files, &File{Path: path, Source: text, AST: ast})
	l.net.Diagnostics = append(l.net.Diagnostics, diags...)
	for _, st := range ast.Statements {
		inc := st.Include
		if inc == nil || inc.Path == nil {
			continue
		}
		rel, err := lang.Unquote(inc.Path.Raw)
		if err != nil || rel == "" {
			continue // the lexer has reported the string
		}
		next := rel
		if !filepath.IsAbs(rel) {
			next = filepath.Join(filepath.Dir(path), rel)
		}
		span := inc.Span()
		l.load(next, append(chain, chainLink{path: path, at: span}), span)
	}
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
