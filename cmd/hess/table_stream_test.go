package main

import (
	"bytes"
	"encoding/json"
	"errors"
	"io"
	"path/filepath"
	"runtime"
	"testing"
	"time"

	"hess/network"
	"hess/synth"
	"hess/thermo"
)

// countingWriter keeps what is written and counts the writes.
type countingWriter struct {
	bytes.Buffer
	writes int
}

func (w *countingWriter) Write(p []byte) (int, error) {
	w.writes++
	return w.Buffer.Write(p)
}

func (w *countingWriter) WriteString(s string) (int, error) {
	w.writes++
	return w.Buffer.WriteString(s)
}

// streamedNetwork writes a generated network of several batches of
// reactions to a temporary folder and returns its root file.
func streamedNetwork(t *testing.T) string {
	t.Helper()
	g, err := synth.Generate(synth.Config{Shape: synth.Mechanism, Seed: 3, Species: 200, Reactions: 3*tableBatch + 7, OwnData: 20, Files: 1})
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	if err := g.WriteDir(dir); err != nil {
		t.Fatal(err)
	}
	return filepath.Join(dir, g.Root)
}

// TestTableStreams checks that a table of more reactions than one batch is
// written in pieces as it is computed, not at the end, and that it comes
// out the same on one processor as on several.
func TestTableStreams(t *testing.T) {
	root := streamedNetwork(t)
	for _, format := range []string{"text", "csv", "json", "markdown"} {
		t.Run(format, func(t *testing.T) {
			var outs [][]byte
			for _, procs := range []int{1, 4} {
				prev := runtime.GOMAXPROCS(procs)
				w := &countingWriter{}
				code := run([]string{"table", "--format", format, root}, w, io.Discard)
				runtime.GOMAXPROCS(prev)
				if code != exitOK {
					t.Fatalf("exit %d", code)
				}
				if w.writes < 2 {
					t.Errorf("%d processors: %d bytes written in %d piece(s)", procs, w.Len(), w.writes)
				}
				outs = append(outs, w.Bytes())
			}
			if !bytes.Equal(outs[0], outs[1]) {
				t.Error("the table on four processors differs from the table on one")
			}
		})
	}
}

// TestTableJSONStreamedAsEncoded checks that the JSON table written piece
// by piece is byte for byte what encoding/json writes for the whole
// document, with reactions and without.
func TestTableJSONStreamedAsEncoded(t *testing.T) {
	root := streamedNetwork(t)
	net := network.Load(root, network.Disk{}, network.Options{})
	temps := net.Settings.Temperatures
	for _, names := range [][]string{nil, {net.Reactions[0].Name}} {
		doc, err := newTableDoc(net, root, temps, names)
		if err != nil {
			t.Fatal(err)
		}
		for _, empty := range []bool{false, true} {
			if empty {
				doc.reactions = nil
			}
			whole := jsonTables{
				Network:             doc.Network,
				StandardPressureBar: jsonNumber(doc.Pressure / thermo.Bar),
				Reactions:           []jsonReactionTable{},
			}
			for _, e := range doc.tables() {
				jt := jsonTable(e.Table)
				jt.ReverseRate = jsonReverse(e.Reverse)
				whole.Reactions = append(whole.Reactions, jt)
			}
			var want bytes.Buffer
			enc := json.NewEncoder(&want)
			enc.SetEscapeHTML(false)
			enc.SetIndent("", "  ")
			if err := enc.Encode(whole); err != nil {
				t.Fatal(err)
			}
			var got bytes.Buffer
			if err := renderTableJSON(&got, doc); err != nil {
				t.Fatal(err)
			}
			if !bytes.Equal(got.Bytes(), want.Bytes()) {
				t.Errorf("%d reactions: streamed JSON differs from the encoded document", len(doc.reactions))
			}
		}
	}
}

// TestTableEachStopsAtError checks that each, which computes the next
// batch while the caller takes one, returns the caller's first error at
// once and leaves nothing computing behind.
func TestTableEachStopsAtError(t *testing.T) {
	root := streamedNetwork(t)
	net := network.Load(root, network.Disk{}, network.Options{})
	doc, err := newTableDoc(net, root, net.Settings.Temperatures, nil)
	if err != nil {
		t.Fatal(err)
	}
	if len(doc.reactions) <= tableBatch {
		t.Fatalf("%d reactions: the test needs more than one batch", len(doc.reactions))
	}
	before := runtime.NumGoroutine()
	stop := errors.New("stop")
	seen := 0
	err = doc.each(func(e tableEntry) error {
		seen++
		if e.Reaction != doc.reactions[seen-1] {
			t.Fatalf("entry %d is %s, want %s", seen, e.Reaction.Name, doc.reactions[seen-1].Name)
		}
		if seen == 3 {
			return stop
		}
		return nil
	})
	if !errors.Is(err, stop) || seen != 3 {
		t.Fatalf("each returned %v after %d entries, want the caller's error after 3", err, seen)
	}
	// The goroutines of the batch computed ahead end before each returns;
	// give the scheduler a moment to retire them.
	for range 100 {
		if runtime.NumGoroutine() <= before {
			break
		}
		time.Sleep(time.Millisecond)
	}
	if n := runtime.NumGoroutine(); n > before {
		t.Errorf("%d goroutines after each returned, %d before", n, before)
	}
	// All of them, in order, when the caller takes every one.
	seen = 0
	if err := doc.each(func(e tableEntry) error {
		if e.Reaction != doc.reactions[seen] {
			t.Fatalf("entry %d is %s, want %s", seen, e.Reaction.Name, doc.reactions[seen].Name)
		}
		seen++
		return nil
	}); err != nil || seen != len(doc.reactions) {
		t.Fatalf("each: %v after %d of %d entries", err, seen, len(doc.reactions))
	}
}
