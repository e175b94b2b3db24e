package lsp

import (
	"bufio"
	"context"
	"fmt"
	"io"
	"log"
	"net"
	"strings"
	"testing"
	"time"

	"github.com/sourcegraph/jsonrpc2"
)

// frame wraps a body in a correct header.
func frame(body string) string {
	return fmt.Sprintf("Content-Length: %d\r\n\r\n%s", len(body), body)
}

func TestStreamReadsWhatFollowsBadInput(t *testing.T) {
	good := `{"jsonrpc":"2.0","id":7,"method":"m"}`
	cases := []struct {
		name    string
		input   string
		replies []string // error responses the stream writes, in order
		logged  string
	}{
		{"clean", frame(good), nil, ""},
		{"garbage line", "hello there\r\n" + frame(good), nil, "skipping garbage"},
		{"bare newlines", strings.ReplaceAll(frame(good), "\r\n", "\n"), nil, ""},
		{"other headers", "Content-Type: application/vscode-jsonrpc; charset=utf-8\r\n" + frame(good), nil, ""},
		{"lower-case header", strings.Replace(frame(good), "Content-Length", "content-length", 1), nil, ""},
		{"bad length", "Content-Length: twelve\r\n\r\n" + frame(good), nil, "bad Content-Length"},
		{"negative length", "Content-Length: -4\r\n\r\n" + frame(good), nil, "bad Content-Length"},
		{"no length", "Content-Type: x\r\n\r\n" + frame(good), nil, "without a valid Content-Length"},
		{"invalid JSON", frame(`{"jsonrpc":"2.0","id":1,`) + frame(good), []string{`{"jsonrpc":"2.0","id":null,"error":{"code":-32700,"message":"parse error: the message is not valid JSON"}}`}, "skipping malformed message"},
		{"empty body", frame("") + frame(good), []string{`"code":-32700`}, "skipping malformed message"},
		{"not a request", frame(`{"jsonrpc":"2.0","id":3,"method":5}`) + frame(good), []string{`"id":3,"error":{"code":-32600`}, "skipping malformed message"},
		{"neither request nor response", frame(`{"jsonrpc":"2.0"}`) + frame(good), nil, "skipping malformed message"},
		{"JSON array", frame(`[1,2]`) + frame(good), nil, "skipping malformed message"},
		{"short length", fmt.Sprintf("Content-Length: %d\r\n\r\n%s", len(good)-5, good) + frame(good), []string{`"code":-32700`}, "skipping garbage before a header"},
		{"long length eats the next message", fmt.Sprintf("Content-Length: %d\r\n\r\n%s", len(good)+10, good) + frame(`{"jsonrpc":"2.0","method":"lost"}`) + frame(good), []string{`"code":-32700`}, "skipping"},
		{"overlong header line", strings.Repeat("x", maxHeaderLine+10) + "\r\n" + frame(good), nil, "longer than"},
		{"huge length", "Content-Length: 99999999999\r\n\r\n" + strings.Repeat(" ", 100) + "\r\n" + frame(good), nil, ""},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			var out, logs strings.Builder
			s := newStream(strings.NewReader(c.input), &out, nil, log.New(&logs, "", 0))
			// Decoding into a request stands in for the connection's own
			// message type: both refuse what is not a JSON-RPC request.
			var msg jsonrpc2.Request
			err := s.ReadObject(&msg)
			if c.name == "huge length" {
				// The input ends inside the skipped body: end of stream,
				// and nothing read.
				if err != io.EOF {
					t.Fatalf("ReadObject: %v, want io.EOF", err)
				}
				return
			}
			if err != nil {
				t.Fatalf("ReadObject: %v\nlog:\n%s", err, logs.String())
			}
			if msg.Method != "m" || msg.ID.Num != 7 {
				t.Errorf("read %+v, want %s", msg, good)
			}
			if err := s.ReadObject(&msg); err != io.EOF {
				t.Errorf("after the last message: %v, want io.EOF", err)
			}
			for _, r := range c.replies {
				if !strings.Contains(out.String(), r) {
					t.Errorf("stream wrote %q, want it to contain %q", out.String(), r)
				}
			}
			if len(c.replies) == 0 && out.Len() > 0 {
				t.Errorf("stream wrote %q, want nothing", out.String())
			}
			if c.logged != "" && !strings.Contains(logs.String(), c.logged) {
				t.Errorf("log %q lacks %q", logs.String(), c.logged)
			}
		})
	}
}

func TestStreamWritesFramedMessages(t *testing.T) {
	var out strings.Builder
	s := newStream(strings.NewReader(""), &out, nil, log.New(io.Discard, "", 0))
	if err := s.WriteObject(map[string]string{"k": "é"}); err != nil {
		t.Fatal(err)
	}
	if want := "Content-Length: 10\r\n\r\n{\"k\":\"é\"}"; out.String() != want {
		t.Errorf("wrote %q, want %q", out.String(), want)
	}
}

// rawClient talks to a server byte by byte, reading its messages with the
// JSON-RPC library's own framing.
type rawClient struct {
	conn     net.Conn
	messages chan map[string]any
	status   chan int
	log      *syncBuffer
}

func startRaw(t *testing.T) *rawClient {
	t.Helper()
	srvEnd, cliEnd := net.Pipe()
	rc := &rawClient{conn: cliEnd, messages: make(chan map[string]any, 100), status: make(chan int, 1), log: &syncBuffer{}}
	srv := newServer(Options{Log: rc.log})
	go func() { rc.status <- srv.serve(context.Background(), srvEnd, srvEnd) }()
	go func() {
		r := bufio.NewReader(cliEnd)
		for {
			var m map[string]any
			if err := (jsonrpc2.VSCodeObjectCodec{}).ReadObject(r, &m); err != nil {
				close(rc.messages)
				return
			}
			rc.messages <- m
		}
	}()
	t.Cleanup(func() {
		cliEnd.Close()
		select {
		case <-rc.status:
		case <-time.After(waitLimit):
			t.Error("server did not stop")
		}
		if srv.panics > 0 {
			t.Errorf("server caught %d panics:\n%s", srv.panics, rc.log.String())
		}
	})
	return rc
}

func (rc *rawClient) send(t *testing.T, raw string) {
	t.Helper()
	if _, err := io.WriteString(rc.conn, raw); err != nil {
		t.Fatalf("writing to the server: %v", err)
	}
}

// next returns the next message from the server that is not a
// notification.
func (rc *rawClient) next(t *testing.T) map[string]any {
	t.Helper()
	for {
		select {
		case m, ok := <-rc.messages:
			if !ok {
				t.Fatalf("server closed the connection; log:\n%s", rc.log.String())
			}
			if _, isNotification := m["method"]; isNotification {
				continue
			}
			return m
		case <-time.After(waitLimit):
			t.Fatalf("no answer from the server; log:\n%s", rc.log.String())
		}
	}
}

func errorCode(m map[string]any) float64 {
	e, _ := m["error"].(map[string]any)
	code, _ := e["code"].(float64)
	return code
}

// TestServerSurvivesGarbage sends a client's worst: garbage headers, wrong
// lengths, invalid JSON, unknown methods, requests out of order. The
// server answers each as JSON-RPC asks and goes on serving.
func TestServerSurvivesGarbage(t *testing.T) {
	rc := startRaw(t)
	rc.send(t, frame(`{"jsonrpc":"2.0","id":1,"method":"textDocument/hover","params":{}}`))
	if m := rc.next(t); m["id"] != 1.0 || errorCode(m) != codeServerNotInitialized {
		t.Errorf("request before initialize: %v, want ServerNotInitialized", m)
	}
	rc.send(t, "GET / HTTP/1.1\r\nHost: nowhere\r\n\r\n")
	rc.send(t, "Content-Length: lots\r\n\r\n")
	rc.send(t, frame(`{"jsonrpc":"2.0","id":2,"method":"initialize","params":{"capabilities":{}}}`))
	if m := rc.next(t); m["id"] != 2.0 || m["result"] == nil {
		t.Errorf("initialize after garbage: %v", m)
	}
	rc.send(t, frame(`{"jsonrpc":"2.0","id":3,"method":"initialize",`))
	if m := rc.next(t); m["id"] != nil || errorCode(m) != jsonrpc2.CodeParseError {
		t.Errorf("invalid JSON: %v, want a parse error with id null", m)
	}
	rc.send(t, frame(`{"jsonrpc":"2.0","id":4,"method":["x"]}`))
	if m := rc.next(t); m["id"] != 4.0 || errorCode(m) != jsonrpc2.CodeInvalidRequest {
		t.Errorf("method not a string: %v, want InvalidRequest", m)
	}
	rc.send(t, frame(`{"jsonrpc":"2.0","id":5,"method":"textDocument/rename","params":{}}`))
	if m := rc.next(t); m["id"] != 5.0 || errorCode(m) != jsonrpc2.CodeMethodNotFound {
		t.Errorf("unknown request: %v, want MethodNotFound", m)
	}
	rc.send(t, frame(`{"jsonrpc":"2.0","method":"workspace/somethingNew","params":{}}`))
	rc.send(t, frame(`{"jsonrpc":"2.0","method":"$/cancelRequest","params":{"id":5}}`))
	rc.send(t, frame(`{"jsonrpc":"2.0","id":6,"method":"textDocument/hover","params":"not an object"}`))
	if m := rc.next(t); m["id"] != 6.0 || errorCode(m) != jsonrpc2.CodeInvalidParams {
		t.Errorf("bad params: %v, want InvalidParams", m)
	}
	rc.send(t, frame(`{"jsonrpc":"2.0","method":"textDocument/didOpen","params":{"textDocument":{"uri":"git:/x.hess","languageId":"hess","version":1,"text":"x"}}}`))
	rc.send(t, frame(`{"jsonrpc":"2.0","method":"textDocument/didChange","params":{"textDocument":{"uri":"file:///nowhere/x.hess","version":2},"contentChanges":[{"text":"y"}]}}`))
	// A length shorter than the body: the cut body is not JSON, and the
	// rest of it is garbage before the next header.
	body := `{"jsonrpc":"2.0","id":7,"method":"textDocument/hover","params":{}}`
	rc.send(t, fmt.Sprintf("Content-Length: %d\r\n\r\n%s", len(body)-4, body))
	if m := rc.next(t); m["id"] != nil || errorCode(m) != jsonrpc2.CodeParseError {
		t.Errorf("short length: %v, want a parse error", m)
	}
	// A length longer than the body: it eats the start of the next
	// message, which is lost; the one after it is read.
	body = `{"jsonrpc":"2.0","id":8,"method":"textDocument/hover","params":{}}`
	rc.send(t, fmt.Sprintf("Content-Length: %d\r\n\r\n%s", len(body)+20, body))
	rc.send(t, frame(`{"jsonrpc":"2.0","method":"$/lost"}`))
	if m := rc.next(t); m["id"] != nil || errorCode(m) != jsonrpc2.CodeParseError {
		t.Errorf("long length: %v, want a parse error", m)
	}
	rc.send(t, frame(`{"jsonrpc":"2.0","id":9,"method":"shutdown"}`))
	if m := rc.next(t); m["id"] != 9.0 || m["error"] != nil {
		t.Errorf("shutdown after wrong lengths: %v", m)
	}
	rc.send(t, frame(`{"jsonrpc":"2.0","method":"exit"}`))
	select {
	case st := <-rc.status:
		if st != 0 {
			t.Errorf("exit status %d, want 0", st)
		}
		rc.status <- st
	case <-time.After(waitLimit):
		t.Fatal("server did not exit")
	}
	for _, want := range []string{"skipping garbage", "bad Content-Length", "skipping malformed message", "only file: and untitled: URIs", "not open"} {
		if !strings.Contains(rc.log.String(), want) {
			t.Errorf("log lacks %q:\n%s", want, rc.log.String())
		}
	}
}

func TestExitWithoutShutdown(t *testing.T) {
	rc := startRaw(t)
	rc.send(t, frame(`{"jsonrpc":"2.0","id":1,"method":"initialize","params":{"capabilities":{}}}`))
	rc.next(t)
	rc.send(t, frame(`{"jsonrpc":"2.0","method":"exit"}`))
	select {
	case st := <-rc.status:
		if st != 1 {
			t.Errorf("exit status %d without shutdown, want 1", st)
		}
		rc.status <- st
	case <-time.After(waitLimit):
		t.Fatal("server did not exit")
	}
}

func TestEndOfInputEndsTheSession(t *testing.T) {
	in := strings.NewReader(frame(`{"jsonrpc":"2.0","id":1,"method":"initialize","params":{"capabilities":{}}}`) + "Content-Length: 5\r\n")
	var out syncBuffer
	st := Serve(context.Background(), in, &out, Options{})
	if st != 1 {
		t.Errorf("status %d when the input ends without exit, want 1", st)
	}
	if !strings.Contains(out.String(), `"id":1,"result"`) {
		t.Errorf("initialize was not answered: %q", out.String())
	}
}
