//go:build linux

package main

import (
	"bufio"
	"context"
	"encoding/json"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
)

// Includes that would block, read without end, leave the project or print
// what is not a network: each is refused with a diagnostic, quickly.
func TestHostileIncludes(t *testing.T) {
	if testing.Short() {
		t.Skip("runs the built binary")
	}
	const tail = "\nspecies H2(g)\n"
	for _, tc := range []struct {
		name, src string
		args      []string // before the file
		want      []string
	}{
		{"device /dev/zero", `include "/dev/zero"`, []string{"--include-path", "/"},
			[]string{"refusing /dev/zero: it is a character device", "[include-refused]"}},
		{"device /dev/urandom", `include "/dev/urandom"`, []string{"--include-path", "/"},
			[]string{"refusing /dev/urandom: it is a character device"}},
		{"standard input, a pipe", `include "/dev/stdin"`, []string{"--include-path", "/"},
			[]string{"refusing /dev/stdin: it is a named pipe"}},
		{"absolute path outside the folder", `include "/etc/hostname"`, nil,
			[]string{"/etc/hostname lies outside the folders includes may come from (.)", "--include-path"}},
		{"relative path outside the folder", `include "../outside.hess"`, nil,
			[]string{"../outside.hess lies outside the folders includes may come from (.)"}},
		{"the environment", `include "/proc/self/environ"`, nil,
			[]string{"/proc/self/environ resolves to /proc/", "outside the folders includes may come from"}},
		{"empty path", `include ""`, nil, []string{"1:1: error: an include must name a file; this one is empty [include-refused]"}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			dir := t.TempDir()
			writeFile(t, filepath.Join(dir, "net.hess"), tc.src+tail, 0o644)
			r := runBounded(t, dir, "", "", append(append([]string{"check"}, tc.args...), "net.hess")...)
			expectRun(t, r, exitFindings, tc.want...)
		})
	}

	t.Run("named pipe in the folder", func(t *testing.T) {
		dir := t.TempDir()
		if err := syscall.Mkfifo(filepath.Join(dir, "lib.hess"), 0o644); err != nil {
			t.Skipf("mkfifo: %v", err)
		}
		writeFile(t, filepath.Join(dir, "net.hess"), `include "lib.hess"`+tail, 0o644)
		expectRun(t, runBounded(t, dir, "", "", "check", "net.hess"), exitFindings, "refusing lib.hess: it is a named pipe")
		expectRun(t, runBounded(t, dir, "", "", "check", "lib.hess"), exitTrouble, "refusing lib.hess: it is a named pipe")
	})

	t.Run("file past the size limit", func(t *testing.T) {
		dir := t.TempDir()
		writeFile(t, filepath.Join(dir, "big.hess"), "", 0o644)
		if err := os.Truncate(filepath.Join(dir, "big.hess"), 65<<20); err != nil {
			t.Fatal(err)
		}
		writeFile(t, filepath.Join(dir, "net.hess"), `include "big.hess"`+tail, 0o644)
		expectRun(t, runBounded(t, dir, "", "", "check", "net.hess"), exitFindings, "refusing big.hess: it is larger than 64 MiB, the limit on one file")
		expectRun(t, runBounded(t, dir, "", "", "check", "big.hess"), exitTrouble, "refusing big.hess: it is larger than 64 MiB")
	})

	t.Run("link out of the folder", func(t *testing.T) {
		dir := t.TempDir()
		outside := t.TempDir()
		writeFile(t, filepath.Join(outside, "lib.hess"), "species O2(g)\n", 0o644)
		if err := os.Symlink(filepath.Join(outside, "lib.hess"), filepath.Join(dir, "lib.hess")); err != nil {
			t.Fatal(err)
		}
		writeFile(t, filepath.Join(dir, "net.hess"), `include "lib.hess"`+tail, 0o644)
		expectRun(t, runBounded(t, dir, "", "", "check", "net.hess"), exitFindings, "lib.hess resolves to "+filepath.Join(outside, "lib.hess")+", outside")
		// Named with --include-path, the library's folder is allowed.
		expectRun(t, runBounded(t, dir, "", "", "check", "--include-path", outside, "net.hess"), exitOK)
	})

	t.Run("the environment, allowed, is not quoted", func(t *testing.T) {
		dir := t.TempDir()
		writeFile(t, filepath.Join(dir, "net.hess"), `include "/proc/self/environ"`+tail, 0o644)
		t.Setenv("HESS_HOSTILE_SECRET", "do-not-print-this-value")
		r := runBounded(t, dir, "", "", "check", "--include-path", "/proc", "net.hess")
		expectRun(t, r, exitFindings, "/proc/self/environ does not read as a network file: it holds NUL bytes; only its first line is shown")
		if strings.Contains(r.stdout+r.stderr, "do-not-print-this-value") {
			t.Errorf("the environment was printed:\n%s", r.stdout)
		}
	})

	t.Run("2 000-file include chain", func(t *testing.T) {
		dir := t.TempDir()
		const n = 2000
		for i := range n {
			src := fmt.Sprintf("species C%dH4(g)\n", i+1)
			if i+1 < n {
				src = fmt.Sprintf("include \"f%d.hess\"\n", i+1) + src
			}
			writeFile(t, filepath.Join(dir, fmt.Sprintf("f%d.hess", i)), src, 0o644)
		}
		expectRun(t, runBounded(t, dir, "", "", "check", "f0.hess"), exitOK)
	})

	t.Run("include depth past the limit", func(t *testing.T) {
		dir := t.TempDir()
		const n = 4200
		for i := range n {
			writeFile(t, filepath.Join(dir, fmt.Sprintf("f%d.hess", i)), fmt.Sprintf("include \"f%d.hess\"\n", i+1), 0o644)
		}
		r := runBounded(t, dir, "", "", "check", "f0.hess")
		expectRun(t, r, exitFindings, "includes nest deeper than 4096 files, the limit on include depth", "… 4088 more …")
		if len(r.stdout) > 4096 {
			t.Errorf("report of %d bytes for one refusal", len(r.stdout))
		}
	})
}

// The language server, as built, over its own standard input and output:
// a document including /dev/stdin must not read the protocol pipe, and no
// hostile document stops it serving a normal one.
func TestHostileLanguageServer(t *testing.T) {
	if testing.Short() {
		t.Skip("runs the built binary")
	}
	dir := t.TempDir()
	if err := syscall.Mkfifo(filepath.Join(dir, "fifo.hess"), 0o644); err != nil {
		t.Skipf("mkfifo: %v", err)
	}
	ctx, cancel := context.WithTimeout(context.Background(), hostileDeadline)
	defer cancel()
	cmd := exec.CommandContext(ctx, hessBinary(t), "lsp")
	stdin, stdout := startWithPipes(t, cmd)
	defer cmd.Wait()
	defer stdin.Close()
	send := func(msg map[string]any) {
		msg["jsonrpc"] = "2.0"
		b, _ := json.Marshal(msg)
		fmt.Fprintf(stdin, "Content-Length: %d\r\n\r\n%s", len(b), b)
	}
	frames := make(chan map[string]any, 64)
	go func() {
		defer close(frames)
		r := bufio.NewReader(stdout)
		for {
			body, err := readFrame(r)
			if err != nil {
				return
			}
			var m map[string]any
			json.Unmarshal(body, &m)
			frames <- m
		}
	}()
	// diagnosticsOf waits for the publish of uri and returns its text.
	diagnosticsOf := func(uri string) string {
		t.Helper()
		for m := range frames {
			if m["method"] != "textDocument/publishDiagnostics" {
				continue
			}
			if p, _ := m["params"].(map[string]any); p["uri"] == uri {
				b, _ := json.Marshal(p["diagnostics"])
				return string(b)
			}
		}
		t.Fatalf("the server stopped before publishing %s", uri)
		return ""
	}
	send(map[string]any{"id": 1, "method": "initialize", "params": map[string]any{
		"processId": nil, "capabilities": map[string]any{},
		"workspaceFolders": []map[string]any{{"uri": "file://" + dir, "name": "w"}, {"uri": "file:///dev", "name": "dev"}},
	}})
	send(map[string]any{"method": "initialized", "params": map[string]any{}})
	for i, tc := range []struct{ include, want string }{
		{"/dev/stdin", "refusing /dev/stdin: it is a named pipe"},
		{"/dev/zero", "refusing /dev/zero: it is a character device"},
		{"fifo.hess", "it is a named pipe"},
		{"/proc/self/environ", "outside the folders includes may come from"},
		{"", "must name a file"},
	} {
		uri := fmt.Sprintf("file://%s/hostile%d.hess", dir, i)
		send(map[string]any{"method": "textDocument/didOpen", "params": map[string]any{"textDocument": map[string]any{
			"uri": uri, "languageId": "hess", "version": 1, "text": fmt.Sprintf("include %q\nspecies H2(g)\n", tc.include)}}})
		if got := diagnosticsOf(uri); !strings.Contains(got, tc.want) {
			t.Errorf("include %q: %s", tc.include, got)
		}
	}
	uri := "file://" + dir + "/normal.hess"
	send(map[string]any{"method": "textDocument/didOpen", "params": map[string]any{"textDocument": map[string]any{
		"uri": uri, "languageId": "hess", "version": 1, "text": "species H2(g), H(g)\nreaction split: H2(g) <-> H(g)\n"}}})
	if got := diagnosticsOf(uri); !strings.Contains(got, "element-imbalance") {
		t.Errorf("normal document: %s", got)
	}
	send(map[string]any{"id": 2, "method": "shutdown"})
	send(map[string]any{"method": "exit"})
	stdin.Close()
	for range frames {
	}
	if err := cmd.Wait(); err != nil || ctx.Err() != nil {
		t.Errorf("hess lsp: %v (%v)", err, ctx.Err())
	}
	if cpu := cmd.ProcessState.UserTime() + cmd.ProcessState.SystemTime(); cpu > hostileCPU {
		t.Errorf("hess lsp took %v of CPU", cpu)
	}
}
