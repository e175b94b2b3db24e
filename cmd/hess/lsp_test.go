package main

import (
	"bytes"
	"fmt"
	"strings"
	"testing"
)

func lspFrame(body string) string {
	return fmt.Sprintf("Content-Length: %d\r\n\r\n%s", len(body), body)
}

// TestLSPCommand runs `hess lsp` as an editor does, over its standard
// input and output.
func TestLSPCommand(t *testing.T) {
	cases := []struct {
		name  string
		input string
		code  int
	}{
		{"shutdown and exit", lspFrame(`{"jsonrpc":"2.0","id":1,"method":"initialize","params":{"capabilities":{}}}`) +
			lspFrame(`{"jsonrpc":"2.0","id":2,"method":"shutdown"}`) + lspFrame(`{"jsonrpc":"2.0","method":"exit"}`), 0},
		{"exit without shutdown", lspFrame(`{"jsonrpc":"2.0","id":1,"method":"initialize","params":{"capabilities":{}}}`) +
			lspFrame(`{"jsonrpc":"2.0","method":"exit"}`), 1},
		{"input ends", lspFrame(`{"jsonrpc":"2.0","id":1,"method":"initialize","params":{"capabilities":{}}}`) + "garbage\r\n", 1},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			r := runHessInput(t, c.input, "lsp")
			if r.code != c.code {
				t.Errorf("exit %d, want %d; stderr:\n%s", r.code, c.code, r.stderr)
			}
			// Standard output carries protocol messages only.
			out := r.stdout
			if !strings.HasPrefix(out, "Content-Length: ") || !strings.Contains(out, `"id":1,"result":{"capabilities"`) {
				t.Errorf("stdout:\n%s", out)
			}
			for rest := out; rest != ""; {
				var n int
				if _, err := fmt.Sscanf(rest, "Content-Length: %d\r\n\r\n", &n); err != nil {
					t.Fatalf("stdout is not a sequence of framed messages at %q", rest)
				}
				head := strings.Index(rest, "\r\n\r\n") + 4
				rest = rest[head+n:]
			}
		})
	}
}

func TestLSPCommandUsage(t *testing.T) {
	var stdout, stderr bytes.Buffer
	if code := runLSP([]string{"extra.hess"}, &stdout, &stderr); code != exitTrouble || !strings.Contains(stderr.String(), "takes no arguments") {
		t.Errorf("lsp with an argument: exit %d, stderr %q", code, stderr.String())
	}
	stdout.Reset()
	if code := runLSP([]string{"--help"}, &stdout, &stderr); code != exitOK || !strings.Contains(stdout.String(), "usage: hess lsp") {
		t.Errorf("lsp --help: exit %d, stdout %q", code, stdout.String())
	}
}
