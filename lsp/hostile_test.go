package lsp

import (
	"context"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"hess/network"
)

// A chain of open documents, each including the next, is compiled once as
// one network rooted at its head, whatever the order the documents come
// in: not once per document (which is quadratic in the chain's length).
func TestOpenIncludeChainCompilesOnce(t *testing.T) {
	const n = 1000
	dir := t.TempDir()
	docs := make([]document, n)
	for i := range docs {
		text := fmt.Sprintf("species C%dH4(g)\n", i+1)
		if i+1 < n {
			text = fmt.Sprintf("include \"d%d.hess\"\n", i+1) + text
		}
		p := filepath.Join(dir, fmt.Sprintf("d%d.hess", i))
		docs[i] = document{uri: pathToURI(p), path: p, version: 1, text: []byte(text)}
	}
	// The deepest first: a naive order compiles every suffix of the chain.
	for i, j := 0, n-1; i < j; i, j = i+1, j-1 {
		docs[i], docs[j] = docs[j], docs[i]
	}
	s := newServer(Options{})
	w := s.worker
	open := map[string]document{}
	overlay := network.Overlay{Files: map[string][]byte{}, Base: network.Disk{}}
	for _, d := range docs {
		open[d.path] = d
		overlay.Files[d.path] = d.text
	}
	start := time.Now()
	roots := w.chooseRoots(context.Background(), docs, open, overlay)
	t.Logf("%d open documents in a chain: %d compiles, %v", n, w.compiles.Load(), time.Since(start))
	if got := w.compiles.Load(); got != 1 {
		t.Errorf("%d compiles, want 1", got)
	}
	if len(roots) != 1 || roots[0].net.Root != filepath.Join(dir, "d0.hess") || len(roots[0].net.Files) != n {
		t.Fatalf("roots %v", roots)
	}
}

// The language server survives every hostile document: each gets its
// refusal, and a normal document opened after them gets its diagnostics.
func TestHostileDocuments(t *testing.T) {
	dir := t.TempDir()
	c := startServer(t, Options{})
	var res InitializeResult
	c.mustCall("initialize", map[string]any{
		"processId": nil, "rootUri": nil, "capabilities": map[string]any{},
		"workspaceFolders": []map[string]any{{"uri": pathToURI(dir), "name": "w"}, {"uri": "file:///dev", "name": "dev"}},
	}, &res)
	c.notify("initialized", map[string]any{})
	for i, tc := range []struct{ src, code, msg string }{
		{`include "/dev/stdin"`, "include-refused", "refusing /dev/stdin: it is a"},
		{`include "/dev/zero"`, "include-refused", "it is a character device"},
		{`include "/dev/urandom"`, "include-refused", "it is a character device"},
		{`include "/proc/self/environ"`, "include-refused", "outside the folders includes may come from"},
		{`include "../../../etc/hostname"`, "include-refused", "outside the folders includes may come from"},
		{`include ""`, "include-refused", "must name a file"},
		{`include "` + strings.Repeat("a/", 3000) + `x.hess"`, "include-missing", "cannot read"},
	} {
		uri := fileURI(dir, fmt.Sprintf("hostile%d.hess", i))
		c.open(uri, tc.src+"\nspecies H2(g)\n", 1)
		p := c.waitDiagnostics(uri, atVersion(1))
		found := false
		for _, d := range p.Diagnostics {
			found = found || (d.Code == tc.code && strings.Contains(d.Message, tc.msg))
		}
		if !found {
			t.Errorf("%s: diagnostics %+v, want %s %q", tc.src, p.Diagnostics, tc.code, tc.msg)
		}
	}
	uri := fileURI(dir, "normal.hess")
	c.open(uri, "species H2(g), H(g)\nreaction split: H2(g) <-> H(g)\n", 1)
	p := c.waitDiagnostics(uri, atVersion(1))
	if got := codes(p); len(got) == 0 || !contains(got, "element-imbalance") {
		t.Errorf("normal document: %v", got)
	}
}

func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

// Two open documents that include each other are each compiled, as before
// the chain rule (neither's network is taken to stand for the other's), and
// one of them is published as the root.
func TestOpenDocumentsIncludingEachOther(t *testing.T) {
	dir := t.TempDir()
	a, b := filepath.Join(dir, "a.hess"), filepath.Join(dir, "b.hess")
	docs := []document{
		{uri: pathToURI(a), path: a, version: 1, text: []byte("include \"b.hess\"\nspecies H2(g)\n")},
		{uri: pathToURI(b), path: b, version: 1, text: []byte("include \"a.hess\"\nspecies O2(g)\n")},
	}
	s := newServer(Options{})
	open := map[string]document{a: docs[0], b: docs[1]}
	overlay := network.Overlay{Files: map[string][]byte{a: docs[0].text, b: docs[1].text}, Base: network.Disk{}}
	roots := s.worker.chooseRoots(context.Background(), docs, open, overlay)
	if got := s.worker.compiles.Load(); got != 2 || len(roots) != 1 {
		t.Errorf("%d compiles, %d roots; want 2 and 1", got, len(roots))
	}
}

// A folder added to the workspace lets includes read from it at once.
func TestWorkspaceFolderAdded(t *testing.T) {
	dir, shared := t.TempDir(), t.TempDir()
	if err := os.WriteFile(filepath.Join(shared, "gases.hess"), []byte("species H2(g), H(g)\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	c := startServer(t, Options{})
	var res InitializeResult
	c.mustCall("initialize", map[string]any{"processId": nil, "rootUri": pathToURI(dir), "capabilities": map[string]any{}}, &res)
	if res.Capabilities.Workspace == nil || !res.Capabilities.Workspace.WorkspaceFolders.ChangeNotifications {
		t.Errorf("capabilities: %+v", res.Capabilities.Workspace)
	}
	c.notify("initialized", map[string]any{})
	uri := fileURI(dir, "net.hess")
	c.open(uri, "include \""+filepath.Join(shared, "gases.hess")+"\"\nreaction split: H2(g) <-> 2 H(g)\n", 1)
	if got := codes(c.waitDiagnostics(uri, atVersion(1))); !contains(got, "include-refused") {
		t.Fatalf("outside the workspace: %v", got)
	}
	c.notify("workspace/didChangeWorkspaceFolders", map[string]any{"event": map[string]any{
		"added": []map[string]any{{"uri": pathToURI(shared), "name": "shared"}}, "removed": []any{}}})
	c.waitDiagnostics(uri, func(p PublishDiagnosticsParams) bool { return len(codes(p)) == 0 })
}
