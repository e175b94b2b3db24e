package lsp

import (
	"bytes"
	"context"
	"errors"
	"io"
	"io/fs"
	"log"
	"testing"

	"github.com/sourcegraph/jsonrpc2"
)

// FuzzStream feeds arbitrary bytes to the framing reader: it must never
// panic, must end at the end of input, and must hand on only messages that
// decode as JSON-RPC requests.
func FuzzStream(f *testing.F) {
	f.Add([]byte(frame(`{"jsonrpc":"2.0","id":1,"method":"initialize","params":{}}`)))
	f.Add([]byte("Content-Length: 3\r\n\r\n{}}Content-Length: 2\r\n\r\n[]"))
	f.Add([]byte("content-length:9\n\n\"invalid\"\r\n\r\n"))
	f.Fuzz(func(t *testing.T, data []byte) {
		var out bytes.Buffer
		s := newStream(bytes.NewReader(data), &out, nil, log.New(io.Discard, "", 0))
		for n := 0; ; n++ {
			if n > len(data) {
				t.Fatalf("read more messages than the input has bytes")
			}
			var req jsonrpc2.Request
			err := s.ReadObject(&req)
			if errors.Is(err, io.EOF) {
				return
			}
			if err != nil {
				t.Fatalf("ReadObject: %v, want only io.EOF to end the stream", err)
			}
			if req.Method == "" {
				t.Fatalf("handed on a request without a method")
			}
		}
	})
}

// noFiles is a file source with nothing in it, so that fuzzed includes
// read no real files.
type noFiles struct{}

func (noFiles) ReadFile(path string) ([]byte, error) {
	return nil, &fs.PathError{Op: "open", Path: path, Err: fs.ErrNotExist}
}

// FuzzSession runs whole sessions: after a valid initialize, each
// NUL-separated part of the input is sent as one correctly framed message.
// The server must survive every one of them and end when the input does.
func FuzzSession(f *testing.F) {
	f.Add([]byte(`{"jsonrpc":"2.0","method":"textDocument/didOpen","params":{"textDocument":{"uri":"file:///w/p.hess","version":1,"text":"species H2(g)\nreaction r: H2(g) <-> 2 H2(g)\n"}}}` + "\x00" +
		`{"jsonrpc":"2.0","id":2,"method":"textDocument/hover","params":{"textDocument":{"uri":"file:///w/p.hess"},"position":{"line":1,"character":13}}}`))
	f.Fuzz(func(t *testing.T, data []byte) {
		var in bytes.Buffer
		in.WriteString(frame(`{"jsonrpc":"2.0","id":1,"method":"initialize","params":{"capabilities":{}}}`))
		for _, body := range bytes.Split(data, []byte{0}) {
			in.WriteString(frame(string(body)))
		}
		srv := newServer(Options{Files: noFiles{}})
		srv.serve(context.Background(), &in, io.Discard)
		if srv.panics > 0 {
			t.Fatalf("the server caught %d panics", srv.panics)
		}
	})
}
