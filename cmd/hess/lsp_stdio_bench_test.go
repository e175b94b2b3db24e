package main

import (
	"bufio"
	"bytes"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
	"testing"
	"time"

	"hess/synth"
)

// BenchmarkLSPEditStdio drives the built binary's language server (hess
// lsp) over its standard input and output as an editor does: it opens
// every file of a generated network, then makes one-line edits to it, one
// per iteration, and times each from the didChange written to the
// publishDiagnostics of that document at the new version read back. The
// edits go round four steps so that the text always changes: a digit of
// a polynomial coefficient in a species statement (same length), "2 "
// inserted before a reaction's first term (the lines after it move), the
// digit restored, the "2 " removed; on the spread network the species
// edit is in an included species file and the reaction edit in the
// reactions file.
//
// It reports numbers only (it asserts nothing about time): the median,
// least and greatest edit-to-diagnostics time in ms, the server's CPU time
// (user + sys) per edit, and its peak resident set (VmHWM) in MiB. Run
// with -benchtime 12x or more, so that the median is of at least ten
// edits:
//
//	go test ./cmd/hess -run '^$' -bench LSPEditStdio -benchtime 12x
func BenchmarkLSPEditStdio(b *testing.B) {
	cases := []struct {
		name string
		cfg  synth.Config
	}{
		{"mechanism/sp=1000/rx=5000", synth.Config{Shape: synth.Mechanism, Seed: 1, Species: 1000, Reactions: 5000, OwnData: 500}},
		{"mechanism/sp=10000/rx=5000", synth.Config{Shape: synth.Mechanism, Seed: 1, Species: 10000, Reactions: 5000, OwnData: 500}},
		{"spread/sp=10000/rx=50000/files=4", synth.Config{Shape: synth.Spread, Seed: 1, Species: 10000, Reactions: 50000, OwnData: 5000, Files: 4}},
	}
	for _, c := range cases {
		b.Run(c.name, func(b *testing.B) {
			g, err := synth.Generate(c.cfg)
			if err != nil {
				b.Fatal(err)
			}
			benchEdits(b, g)
		})
	}
}

// lspEdit is one edit of the round: where, what it replaces and with what.
type lspEdit struct {
	file              string
	line, col, endCol int
	text              string
}

// roundOfEdits picks the four edits of a round in a generated network: a
// coefficient digit of the middle species and a coefficient on the middle
// plain reaction line, each made and undone.
func roundOfEdits(b *testing.B, g *synth.Network) []lspEdit {
	var spFile, rxFile string
	var spLine, rxLine, digit int
	var old byte
	for _, name := range g.Names {
		lines := strings.Split(string(g.Files[name]), "\n")
		var sps, rxs []int
		for i, l := range lines {
			switch {
			case strings.HasPrefix(l, "species ") && i+2 < len(lines):
				sps = append(sps, i)
			case strings.HasPrefix(l, "reaction ") && !strings.HasSuffix(l, "{"):
				rxs = append(rxs, i)
			}
		}
		if spFile == "" && len(sps) > 0 {
			spFile = name
			i := sps[len(sps)/2]
			for spLine = i + 1; !strings.HasPrefix(lines[spLine], "  nasa7"); spLine++ {
			}
			spLine++ // the first line of coefficients
			digit = strings.IndexAny(lines[spLine], "eE") - 1
			old = lines[spLine][digit]
		}
		if rxFile == "" && len(rxs) > 0 {
			rxFile, rxLine = name, rxs[len(rxs)/2]
		}
	}
	if spFile == "" || rxFile == "" {
		b.Fatal("no species or no plain reaction in the generated network")
	}
	next := string('0' + (old-'0'+1)%10)
	rxLines := strings.Split(string(g.Files[rxFile]), "\n")
	at := strings.Index(rxLines[rxLine], ": ") + 2
	return []lspEdit{
		{spFile, spLine, digit, digit + 1, next},
		{rxFile, rxLine, at, at, "2 "},
		{spFile, spLine, digit, digit + 1, string(old)},
		{rxFile, rxLine, at, at + 2, ""},
	}
}

func benchEdits(b *testing.B, g *synth.Network) {
	dir := b.TempDir()
	if err := g.WriteDir(dir); err != nil {
		b.Fatal(err)
	}
	edits := roundOfEdits(b, g)
	cmd := exec.Command(hessBinary(b), "lsp")
	cmd.Env = os.Environ()
	stdin, stdout := startWithPipes(b, cmd)
	defer func() {
		stdin.Close()
		cmd.Wait()
	}()
	c := &stdioClient{b: b, in: stdin, frames: make(chan stdioFrame, 16), seen: map[string]int{}}
	go c.read(stdout)
	uri := func(name string) string { return "file://" + filepath.Join(dir, name) }
	c.send(map[string]any{"id": 1, "method": "initialize", "params": map[string]any{
		"processId": nil, "capabilities": map[string]any{},
		"workspaceFolders": []map[string]any{{"uri": "file://" + dir, "name": "w"}},
	}})
	c.send(map[string]any{"method": "initialized", "params": map[string]any{}})
	version := map[string]int{}
	for _, name := range g.Names {
		version[name] = 1
		c.send(map[string]any{"method": "textDocument/didOpen", "params": map[string]any{"textDocument": map[string]any{
			"uri": uri(name), "languageId": "hess", "version": 1, "text": string(g.Files[name])}}})
	}
	for _, name := range g.Names {
		c.await(uri(name), 1)
	}
	cpu0 := procCPU(b, cmd.Process.Pid)
	times := make([]float64, 0, b.N)
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		e := edits[i%len(edits)]
		version[e.file]++
		v := version[e.file]
		start := time.Now()
		c.send(map[string]any{"method": "textDocument/didChange", "params": map[string]any{
			"textDocument": map[string]any{"uri": uri(e.file), "version": v},
			"contentChanges": []map[string]any{{
				"range": map[string]any{
					"start": map[string]any{"line": e.line, "character": e.col},
					"end":   map[string]any{"line": e.line, "character": e.endCol},
				},
				"text": e.text,
			}},
		}})
		got := c.await(uri(e.file), v)
		times = append(times, float64(got.Sub(start))/1e6)
	}
	b.StopTimer()
	cpu := procCPU(b, cmd.Process.Pid) - cpu0
	hwm := procHWM(b, cmd.Process.Pid)
	c.send(map[string]any{"id": 2, "method": "shutdown"})
	c.send(map[string]any{"method": "exit"})
	slices.Sort(times)
	b.ReportMetric(times[len(times)/2], "ms-median")
	b.ReportMetric(times[0], "ms-min")
	b.ReportMetric(times[len(times)-1], "ms-max")
	b.ReportMetric(cpu.Seconds()*1e3/float64(b.N), "cpu-ms/edit")
	b.ReportMetric(float64(hwm)/1024, "MiB-VmHWM")
	b.ReportMetric(0, "ns/op")
}

// stdioClient writes framed messages to the server and reads its
// publishDiagnostics back.
type stdioClient struct {
	b      *testing.B
	in     io.Writer
	frames chan stdioFrame
	seen   map[string]int // the latest version published of each URI
}

// stdioFrame is a publishDiagnostics as read, with when its body arrived.
type stdioFrame struct {
	uri     string
	version int
	at      time.Time
}

func (c *stdioClient) send(msg map[string]any) {
	msg["jsonrpc"] = "2.0"
	body, err := json.Marshal(msg)
	if err != nil {
		c.b.Fatal(err)
	}
	if _, err := fmt.Fprintf(c.in, "Content-Length: %d\r\n\r\n%s", len(body), body); err != nil {
		c.b.Fatalf("writing to hess lsp: %v", err)
	}
}

func (c *stdioClient) read(out io.Reader) {
	defer close(c.frames)
	r := bufio.NewReaderSize(out, 1<<20)
	for {
		body, err := readFrame(r)
		if err != nil {
			return
		}
		at := time.Now()
		if !bytes.Contains(body[:min(len(body), 200)], []byte(`"textDocument/publishDiagnostics"`)) {
			continue
		}
		var m struct {
			Params struct {
				URI     string `json:"uri"`
				Version *int   `json:"version"`
			} `json:"params"`
		}
		if err := json.Unmarshal(body, &m); err != nil || m.Params.Version == nil {
			continue
		}
		c.frames <- stdioFrame{uri: m.Params.URI, version: *m.Params.Version, at: at}
	}
}

// await waits for the publish of uri at version v and returns when it
// arrived (the zero time when it came before await was called).
func (c *stdioClient) await(uri string, v int) time.Time {
	if c.seen[uri] >= v {
		return time.Time{}
	}
	timeout := time.After(5 * time.Minute)
	for {
		select {
		case f, ok := <-c.frames:
			if !ok {
				c.b.Fatalf("hess lsp stopped before publishing %s at version %d", uri, v)
			}
			c.seen[f.uri] = max(c.seen[f.uri], f.version)
			if f.uri == uri && f.version == v {
				return f.at
			}
		case <-timeout:
			c.b.Fatalf("no publish of %s at version %d in 5 minutes", uri, v)
		}
	}
}

// procCPU is the user + system CPU time of a running process so far.
func procCPU(b *testing.B, pid int) time.Duration {
	stat, err := os.ReadFile(fmt.Sprintf("/proc/%d/stat", pid))
	if err != nil {
		b.Skipf("no /proc: %v", err)
	}
	// Fields after the command name, which is in parentheses.
	f := strings.Fields(string(stat[bytes.LastIndexByte(stat, ')')+2:]))
	utime, _ := strconv.ParseInt(f[11], 10, 64)
	stime, _ := strconv.ParseInt(f[12], 10, 64)
	const ticks = 100 // USER_HZ on Linux
	return time.Duration(utime+stime) * time.Second / ticks
}

// procHWM is the peak resident set of a running process in KiB.
func procHWM(b *testing.B, pid int) int {
	status, err := os.ReadFile(fmt.Sprintf("/proc/%d/status", pid))
	if err != nil {
		b.Skipf("no /proc: %v", err)
	}
	for _, l := range strings.Split(string(status), "\n") {
		if v, ok := strings.CutPrefix(l, "VmHWM:"); ok {
			kb, _ := strconv.Atoi(strings.TrimSuffix(strings.TrimSpace(v), " kB"))
			return kb
		}
	}
	return 0
}

// startWithPipes starts cmd with pipes to its standard input and from its
// standard output, as an editor starts the language server.
func startWithPipes(tb testing.TB, cmd *exec.Cmd) (io.WriteCloser, io.ReadCloser) {
	tb.Helper()
	stdin, err := cmd.StdinPipe()
	if err != nil {
		tb.Fatal(err)
	}
	stdout, err := cmd.StdoutPipe()
	if err != nil {
		tb.Fatal(err)
	}
	if err := cmd.Start(); err != nil {
		tb.Fatal(err)
	}
	return stdin, stdout
}

// readFrame reads one message of the language server's framing: header
// lines up to an empty one, then Content-Length bytes of body.
func readFrame(r *bufio.Reader) ([]byte, error) {
	n := -1
	for {
		line, err := r.ReadString('\n')
		if err != nil {
			return nil, err
		}
		line = strings.TrimSpace(line)
		if line == "" {
			break
		}
		if v, ok := strings.CutPrefix(line, "Content-Length: "); ok {
			n, _ = strconv.Atoi(v)
		}
	}
	if n < 0 {
		return nil, errors.New("a frame without Content-Length")
	}
	body := make([]byte, n)
	if _, err := io.ReadFull(r, body); err != nil {
		return nil, err
	}
	return body, nil
}
