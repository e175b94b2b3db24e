package lsp

import (
	"reflect"
	"sync"

	"hess/lang"
	"hess/network"
)

// snapshot is what the last compile cycle knows, for answering requests:
// the network each file belongs to.
type snapshot struct {
	nets  map[string]*network.Network // by clean path of every file
	feeds map[*network.Network]*feedResults

	mu    sync.Mutex
	lines map[string]*lines // line indexes of compiled sources, by path
}

// file returns the network that owns path, the file as compiled and its
// line index; ok is false when no compiled network reads path.
func (s *snapshot) file(path string) (net *network.Network, f *network.File, ix *lines, ok bool) {
	if s == nil {
		return nil, nil, nil, false
	}
	net = s.nets[path]
	if net == nil {
		return nil, nil, nil, false
	}
	f = net.File(path)
	if f == nil {
		return nil, nil, nil, false
	}
	return net, f, s.linesOf(path, f.Source), true
}

// linesOf returns the cached line index of a compiled source.
func (s *snapshot) linesOf(path string, src []byte) *lines {
	s.mu.Lock()
	defer s.mu.Unlock()
	if ix, ok := s.lines[path]; ok && sameBytes(ix.text, src) {
		return ix
	}
	ix := newLines(src)
	s.lines[path] = ix
	return ix
}

// sameBytes reports whether a and b are the same bytes in memory (the
// same slice).
func sameBytes(a, b []byte) bool {
	return len(a) == len(b) && (len(a) == 0 || &a[0] == &b[0])
}

// spanRange converts a compiler span into a protocol location, reading the
// span's file from net. A span without a position is the start of its file.
func (s *snapshot) spanRange(net *network.Network, sp lang.Span, enc encoding) (string, Range) {
	path := cleanPath(sp.File)
	if sp.File == "" {
		path = cleanPath(net.Root)
	}
	f := net.File(path)
	if f == nil || !sp.IsValid() {
		return path, Range{}
	}
	ix := s.linesOf(path, f.Source)
	return path, Range{Start: ix.position(sp.Start.Offset, enc), End: ix.position(sp.End.Offset, enc)}
}

// collect converts the diagnostics of every root network into protocol
// diagnostics grouped by file path. A file read by several networks gets
// the union of their findings, each once.
func collect(roots []*compiled, snap *snapshot, uriOf func(string) string, enc encoding) map[string][]Diagnostic {
	out := map[string][]Diagnostic{}
	type key struct {
		path string
		r    Range
		code string
		msg  string
	}
	seen := map[key]bool{}
	for _, c := range roots {
		for _, d := range c.net.Diagnostics {
			path, r := snap.spanRange(c.net, d.Subject, enc)
			msg := untitledText(d.Message, string(d.Code))
			if d.Detail != "" {
				msg += "\n" + d.Detail
			}
			k := key{path, r, string(d.Code), msg}
			if seen[k] {
				continue
			}
			seen[k] = true
			pd := Diagnostic{Range: r, Severity: severity(d.Severity), Code: string(d.Code), Source: "hess", Message: msg}
			for _, rel := range d.Related {
				rp, rr := snap.spanRange(c.net, rel.Span, enc)
				pd.RelatedInformation = append(pd.RelatedInformation, DiagnosticRelatedInformation{
					Location: Location{URI: uriOf(rp), Range: rr},
					Message:  rel.Message,
				})
			}
			out[path] = append(out[path], pd)
		}
	}
	return out
}

func severity(s lang.Severity) int {
	switch s {
	case lang.Error:
		return severityError
	case lang.Warning:
		return severityWarning
	}
	return severityInformation
}

func equalDiagnostics(a, b []Diagnostic) bool {
	if len(a) != len(b) {
		return false
	}
	return len(a) == 0 || reflect.DeepEqual(a, b)
}
