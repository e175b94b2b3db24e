package lsp

import (
	"bytes"
	"encoding/json"
	"io"
	"log"
	"strings"
	"testing"

	"github.com/sourcegraph/jsonrpc2"
)

// Every request id comes back exactly as the client wrote it, including
// those the JSON-RPC connection cannot hold as a number: negative ids (once
// answered as 18446744073709551615), fractions, exponents and integers past
// int64.
func TestStreamEchoesIDsAsSent(t *testing.T) {
	for _, id := range []string{`-1`, `0`, `7`, `9223372036854775807`, `9223372036854775808`, `99999999999999999999999`,
		`2.5`, `-0`, `1e3`, `-12.75E-2`, `"-1"`, `"\u0000id:5"`} {
		var out bytes.Buffer
		s := newStream(strings.NewReader(frame(`{"jsonrpc":"2.0","id":`+id+`,"method":"shutdown"}`)), &out, nil, log.New(io.Discard, "", 0))
		var req jsonrpc2.Request
		if err := s.ReadObject(&req); err != nil {
			t.Errorf("id %s: reading: %v", id, err)
			continue
		}
		if err := s.WriteObject(&jsonrpc2.Response{ID: req.ID, Result: &json.RawMessage{'1'}}); err != nil {
			t.Fatal(err)
		}
		body := out.String()[strings.Index(out.String(), "{"):]
		var got struct {
			ID json.RawMessage `json:"id"`
		}
		if err := json.Unmarshal([]byte(body), &got); err != nil || string(got.ID) != id {
			t.Errorf("request id %s answered with id %s (%v)", id, got.ID, err)
		}
	}
}

// Through the whole server: a negative id is answered with that id.
func TestServerEchoesNegativeID(t *testing.T) {
	rc := startRaw(t)
	rc.send(t, frame(`{"jsonrpc":"2.0","id":-1,"method":"initialize","params":{"capabilities":{}}}`))
	if m := rc.next(t); m["id"] != -1.0 || m["result"] == nil {
		t.Errorf("initialize with id -1: %v", m)
	}
	rc.send(t, frame(`{"jsonrpc":"2.0","id":-2.5,"method":"shutdown"}`))
	if m := rc.next(t); m["id"] != -2.5 || m["error"] != nil {
		t.Errorf("shutdown with id -2.5: %v", m)
	}
}
