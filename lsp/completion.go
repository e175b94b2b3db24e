package lsp

import (
	"context"
	"strings"
	"unicode/utf8"

	"github.com/sourcegraph/jsonrpc2"

	"hess/lang"
	"hess/network"
)

// completion answers textDocument/completion with the species, reaction
// names and keywords that start with the word before the cursor (ignoring
// case). On a reaction line, after the colon only species are offered and
// after `=` only reactions. Nothing is offered inside a comment or a
// string. Names come from the last compiled network; the word is read from
// the document as it is now.
func (s *server) completion(ctx context.Context, req *jsonrpc2.Request) (any, error) {
	var p TextDocumentPositionParams
	if err := params(req, &p); err != nil {
		return nil, err
	}
	out := CompletionList{Items: []CompletionItem{}}
	path, err := uriToPath(p.TextDocument.URI)
	if err != nil {
		return out, nil
	}
	doc, ok := s.docs.get(path)
	if !ok {
		return out, nil
	}
	enc := s.encoding()
	ix := newLines(doc.text)
	cursor := ix.offset(p.Position, enc)
	lineStart := ix.starts[ix.position(cursor, enc).Line]
	ctxt := completionContext(string(doc.text[lineStart:cursor]))
	if ctxt.none {
		return out, nil
	}
	edit := Range{Start: ix.position(cursor-len(ctxt.prefix), enc), End: ix.position(cursor, enc)}
	add := func(label string, kind int, detail, rank string) {
		if !strings.HasPrefix(strings.ToLower(label), strings.ToLower(ctxt.prefix)) {
			return
		}
		out.Items = append(out.Items, CompletionItem{
			Label: label, Kind: kind, Detail: detail, SortText: rank + label, FilterText: label,
			TextEdit: &TextEdit{Range: edit, NewText: label},
		})
	}
	net, _, _, compiled := s.worker.current().file(path)
	if compiled && ctxt.species {
		for _, sp := range net.Species {
			add(sp.Key, completionKindConstant, speciesDetail(sp), "1")
		}
	}
	if compiled && ctxt.reactions {
		for _, rx := range net.Reactions {
			add(rx.Name, completionKindFunction, equationText(net, rx), "2")
		}
	}
	if ctxt.keywords {
		rank := "3"
		if ctxt.lineStart {
			rank = "0"
		}
		for _, k := range lang.Keywords() {
			add(k, completionKindKeyword, "keyword", rank)
		}
	}
	return out, nil
}

// wordContext is what may be completed at the cursor.
type wordContext struct {
	prefix                       string // the word before the cursor
	none                         bool   // inside a comment or string
	lineStart                    bool   // the word is the first on its line
	species, reactions, keywords bool
}

// completionContext reads the line up to the cursor.
func completionContext(line string) wordContext {
	inString := false
	for i := 0; i < len(line); i++ {
		switch c := line[i]; {
		case inString && c == '\\':
			i++
		case c == '"':
			inString = !inString
		case !inString && c == '#':
			return wordContext{none: true}
		}
	}
	if inString {
		return wordContext{none: true}
	}
	start := len(line)
	for start > 0 {
		r, size := utf8.DecodeLastRuneInString(line[:start])
		if r == ' ' || r == '\t' || r == '{' || r == '}' || r == ':' || r == ',' || r == '=' || r == '±' {
			break
		}
		start -= size
	}
	c := wordContext{prefix: line[start:], species: true, reactions: true, keywords: true}
	before := strings.TrimSpace(line[:start])
	c.lineStart = before == "" || strings.HasSuffix(before, "{") || strings.HasSuffix(before, "}")
	if fields := strings.Fields(before); len(fields) > 0 && fields[0] == "reaction" {
		switch {
		case strings.Contains(before, "="):
			c.species, c.keywords = false, false
		case strings.Contains(before, ":"):
			c.reactions, c.keywords = false, false
		}
	}
	return c
}

func speciesDetail(sp *network.Species) string {
	if sp.Label != "" {
		return sp.Label
	}
	if sp.HasFormula {
		return sp.Formula.String()
	}
	return ""
}

// equationText is a reaction's equation as written.
func equationText(net *network.Network, rx *network.Reaction) string {
	eq := rx.Equation()
	f := net.File(eq.File)
	if f == nil || eq.End.Offset > len(f.Source) || eq.Start.Offset > eq.End.Offset {
		return ""
	}
	return string(f.Source[eq.Start.Offset:eq.End.Offset])
}
