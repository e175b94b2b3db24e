package lsp

import (
	"bufio"
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"log"
	"strconv"
	"strings"
	"sync"
)

// Limits on what one message may hold.
const (
	maxHeaderLine = 64 << 10 // longer header lines are dropped as garbage
	maxBody       = 64 << 20 // larger bodies are skipped unread
)

// stream frames JSON-RPC messages with Content-Length headers (the LSP base
// protocol) for a jsonrpc2.Conn. Unlike a plain codec it survives bad
// input: a garbage header line, a wrong length or a body that is not a
// JSON-RPC message is logged and skipped, the reader resynchronises at the
// next Content-Length header, and the client gets a parse error or invalid
// request response where JSON-RPC asks for one. Only the end of input (or a
// failing reader) ends the stream.
type stream struct {
	r      *bufio.Reader
	w      io.Writer
	closer io.Closer // may be nil
	log    *log.Logger

	wmu sync.Mutex // one message at a time on w

	idmu sync.Mutex
	ids  map[string]json.RawMessage // stand-in string id → numeric id as sent
}

func newStream(r io.Reader, w io.Writer, closer io.Closer, logger *log.Logger) *stream {
	return &stream{r: bufio.NewReaderSize(r, maxHeaderLine), w: w, closer: closer, log: logger}
}

// WriteObject writes one framed message.
func (s *stream) WriteObject(obj any) error {
	body, err := json.Marshal(obj)
	if err != nil {
		return fmt.Errorf("encoding message: %w", err)
	}
	return s.writeBody(s.restoreID(body))
}

// idStandIn starts the string that stands in for a numeric request id the
// JSON-RPC connection cannot hold. The NUL keeps it apart from any id a
// client writes as a string.
const idStandIn = "\x00id:"

// holdID makes a request's id survive the connection exactly as sent.
// jsonrpc2 keeps a numeric id as an int64 cast to uint64, so a negative id
// (-1) would be answered as 18446744073709551615, and a fraction, an
// exponent or a number past int64 would be refused. Such an id is replaced
// by a string stand-in, and restoreID puts the original text back in the
// response. Every other body is returned as it is.
func (s *stream) holdID(body []byte) []byte {
	var msg map[string]json.RawMessage
	if json.Unmarshal(body, &msg) != nil {
		return body
	}
	id, ok := msg["id"]
	if !ok || len(id) == 0 || !(id[0] == '-' || ('0' <= id[0] && id[0] <= '9')) || keptNumericID(id) {
		return body
	}
	standIn := idStandIn + string(id)
	msg["id"], _ = json.Marshal(standIn)
	out, err := json.Marshal(msg)
	if err != nil {
		return body
	}
	s.idmu.Lock()
	if s.ids == nil {
		s.ids = map[string]json.RawMessage{}
	}
	if len(s.ids) < maxHeldIDs {
		s.ids[standIn] = append(json.RawMessage(nil), id...)
	}
	s.idmu.Unlock()
	return out
}

// maxHeldIDs bounds the ids waiting for their responses; a client that
// sends more unanswered odd ids than this gets the stand-in back.
const maxHeldIDs = 1 << 16

// keptNumericID reports whether jsonrpc2 holds the numeric id exactly: a
// plain non-negative integer within int64.
func keptNumericID(id json.RawMessage) bool {
	if len(id) > 1 && id[0] == '0' {
		return false
	}
	_, err := strconv.ParseInt(string(id), 10, 64)
	return err == nil && id[0] != '-'
}

// restoreID puts a held numeric id back into a response body.
func (s *stream) restoreID(body []byte) []byte {
	s.idmu.Lock()
	defer s.idmu.Unlock()
	if len(s.ids) == 0 || !bytes.Contains(body, []byte(`"\u0000id:`)) {
		return body
	}
	var msg map[string]json.RawMessage
	if json.Unmarshal(body, &msg) != nil {
		return body
	}
	var standIn string
	if json.Unmarshal(msg["id"], &standIn) != nil {
		return body
	}
	id, ok := s.ids[standIn]
	if !ok {
		return body
	}
	delete(s.ids, standIn)
	msg["id"] = id
	out, err := json.Marshal(msg)
	if err != nil {
		return body
	}
	return out
}

func (s *stream) writeBody(body []byte) error {
	var b bytes.Buffer
	b.Grow(len(body) + 32)
	fmt.Fprintf(&b, "Content-Length: %d\r\n\r\n", len(body))
	b.Write(body)
	s.wmu.Lock()
	defer s.wmu.Unlock()
	if _, err := s.w.Write(b.Bytes()); err != nil {
		return fmt.Errorf("writing message: %w", err)
	}
	return nil
}

// ReadObject reads the next well-formed message into v, skipping (and
// logging) every malformed one before it.
func (s *stream) ReadObject(v any) error {
	for {
		body, err := s.readFrame()
		if err != nil {
			return err
		}
		body = s.holdID(body)
		if err := json.Unmarshal(body, v); err != nil {
			s.reject(body, err)
			continue
		}
		return nil
	}
}

// Close closes the underlying connection.
func (s *stream) Close() error {
	if s.closer == nil {
		return nil
	}
	if err := s.closer.Close(); err != nil {
		return fmt.Errorf("closing connection: %w", err)
	}
	return nil
}

// reject logs a body that is not a JSON-RPC message and answers it as
// JSON-RPC 2.0 asks: a parse error for text that is not JSON, an invalid
// request error for a request whose id can be read. Anything else (an
// invalid notification, a broken response) gets no answer.
func (s *stream) reject(body []byte, err error) {
	s.log.Printf("skipping malformed message (%d bytes): %s: %s", len(body), jsonErrorText(err), clip(body))
	if !json.Valid(body) {
		s.replyError(json.RawMessage("null"), -32700, "parse error: the message is not valid JSON")
		return
	}
	var probe struct {
		ID json.RawMessage `json:"id"`
	}
	if json.Unmarshal(body, &probe) != nil || len(probe.ID) == 0 {
		return
	}
	switch probe.ID[0] {
	case '"', '-', '0', '1', '2', '3', '4', '5', '6', '7', '8', '9':
		s.replyError(probe.ID, -32600, "invalid request: "+jsonErrorText(err))
	}
}

func (s *stream) replyError(id json.RawMessage, code int, message string) {
	resp := struct {
		JSONRPC string          `json:"jsonrpc"`
		ID      json.RawMessage `json:"id"`
		Error   struct {
			Code    int    `json:"code"`
			Message string `json:"message"`
		} `json:"error"`
	}{JSONRPC: "2.0", ID: id}
	resp.Error.Code, resp.Error.Message = code, message
	body, err := json.Marshal(resp)
	if err != nil {
		s.log.Printf("encoding error response: %v", err)
		return
	}
	if err := s.writeBody(body); err != nil {
		s.log.Printf("answering a malformed message: %v", err)
	}
}

// clip shortens text for a log line.
func clip(b []byte) string {
	const max = 80
	if len(b) <= max {
		return strconv.Quote(string(b))
	}
	return strconv.Quote(string(b[:max])) + "…"
}

// readFrame returns the body of the next message whose header carries a
// usable Content-Length. It returns io.EOF when the input ends.
func (s *stream) readFrame() ([]byte, error) {
	for {
		length, err := s.readHeader()
		if err != nil {
			return nil, err
		}
		if length > maxBody {
			s.log.Printf("skipping a message of %d bytes (the limit is %d)", length, maxBody)
			if _, err := io.CopyN(io.Discard, s.r, int64(length)); err != nil {
				return nil, endOfInput(err)
			}
			continue
		}
		var body bytes.Buffer
		if _, err := io.CopyN(&body, s.r, int64(length)); err != nil {
			s.log.Printf("input ended inside a message body (%d of %d bytes read)", body.Len(), length)
			return nil, endOfInput(err)
		}
		return body.Bytes(), nil
	}
}

// readHeader reads header lines up to the blank line that ends a header
// holding a valid Content-Length, and returns that length. Lines that are
// not headers are logged and dropped; a Content-Length that shows up in the
// middle of such a line (after a body that was shorter than announced)
// starts a header there.
func (s *stream) readHeader() (int, error) {
	length := -1
	inHeader := false
	for {
		line, overlong, err := s.readLine()
		if err != nil {
			if inHeader {
				s.log.Printf("input ended inside a message header")
			}
			return 0, endOfInput(err)
		}
		if overlong {
			s.log.Printf("skipping a header line longer than %d bytes: %s…", maxHeaderLine, clip([]byte(line)))
			length, inHeader = -1, false
			continue
		}
		if line == "" {
			if length >= 0 {
				return length, nil
			}
			if inHeader {
				s.log.Printf("skipping a message header without a valid Content-Length")
			}
			inHeader = false
			continue
		}
		if i := indexFold(line, "content-length:"); i > 0 {
			s.log.Printf("skipping garbage before a header: %s", clip([]byte(line[:i])))
			line = line[i:]
		}
		name, value, ok := strings.Cut(line, ":")
		switch {
		case ok && strings.EqualFold(strings.TrimSpace(name), "Content-Length"):
			n, err := strconv.Atoi(strings.TrimSpace(value))
			if err != nil || n < 0 {
				s.log.Printf("bad Content-Length %s", clip([]byte(value)))
				length = -1
			} else {
				length = n
			}
			inHeader = true
		case ok && isHeaderName(name):
			inHeader = true // Content-Type and the like
		default:
			s.log.Printf("skipping garbage: %s", clip([]byte(line)))
			length, inHeader = -1, false
		}
	}
}

// readLine reads one line without its line ending (\r\n, or a bare \n).
// A line longer than maxHeaderLine is read to its end, and reported as
// overlong with its first bytes only.
func (s *stream) readLine() (line string, overlong bool, err error) {
	var head []byte
	for {
		chunk, err := s.r.ReadSlice('\n')
		switch {
		case errors.Is(err, bufio.ErrBufferFull):
			if !overlong {
				head = append([]byte(nil), chunk[:64]...)
			}
			overlong = true
			continue
		case err != nil:
			return "", false, err
		}
		if overlong {
			return string(head), true, nil
		}
		chunk = bytes.TrimSuffix(chunk[:len(chunk)-1], []byte("\r"))
		return string(chunk), false, nil
	}
}

// isHeaderName reports whether s is an HTTP-style header field name.
func isHeaderName(s string) bool {
	if s == "" {
		return false
	}
	for i := 0; i < len(s); i++ {
		c := s[i]
		if !('a' <= c && c <= 'z' || 'A' <= c && c <= 'Z' || '0' <= c && c <= '9' || c == '-' || c == '_') {
			return false
		}
	}
	return true
}

// indexFold is strings.Index ignoring ASCII case of substr (given in lower
// case).
func indexFold(s, substr string) int {
	n := len(substr)
	for i := 0; i+n <= len(s); i++ {
		if strings.EqualFold(s[i:i+n], substr) {
			return i
		}
	}
	return -1
}

// endOfInput turns a short read into io.EOF: the stream is over either way.
func endOfInput(err error) error {
	if errors.Is(err, io.ErrUnexpectedEOF) {
		return io.EOF
	}
	return err
}
