package main

import (
	"bufio"
	"bytes"
	"context"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"sync"
	"syscall"
	"testing"
	"time"
)

// watchWait bounds every wait for the watcher; it guards against a hang
// and measures nothing.
const watchWait = 20 * time.Second

const watchGases = `species CO(g) "carbon monoxide" {
  hf -110.527 kJ/mol
  s 197.653 J/mol/K
}
species H2O(g) "steam" {
  hf -241.826 kJ/mol
  s 188.834 J/mol/K
}
species CO2(g) "carbon dioxide" {
  hf -393.522 kJ/mol
  s 213.795 J/mol/K
}
species H2(g) "hydrogen" {
  hf 0 kJ/mol
  s 130.680 J/mol/K
}
`

const watchPlant = `# Shift converter of a small hydrogen plant (demo scenario)
include "lib/gases.hess"
reaction shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)
`

// saveByRename writes a file the way many editors save: a new file in the
// same folder, renamed over the old one.
func saveByRename(t *testing.T, path, text string) {
	t.Helper()
	tmp := filepath.Join(filepath.Dir(path), "."+filepath.Base(path)+".swp")
	if err := os.WriteFile(tmp, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
	if err := os.Rename(tmp, path); err != nil {
		t.Fatal(err)
	}
}

// watchRun is a watch running in the background of a test.
type watchRun struct {
	results chan watchResult
	status  chan int
	stderr  *lockedBuffer
	cancel  context.CancelFunc
}

type lockedBuffer struct {
	mu  sync.Mutex
	buf bytes.Buffer
}

func (b *lockedBuffer) Write(p []byte) (int, error) {
	b.mu.Lock()
	defer b.mu.Unlock()
	return b.buf.Write(p)
}

func (b *lockedBuffer) String() string {
	b.mu.Lock()
	defer b.mu.Unlock()
	return b.buf.String()
}

func startWatch(t *testing.T, opts watchOptions) *watchRun {
	t.Helper()
	ctx, cancel := context.WithCancel(context.Background())
	r := &watchRun{results: make(chan watchResult, 100), status: make(chan int, 1), stderr: &lockedBuffer{}, cancel: cancel}
	opts.rebuilt = func(res watchResult) { r.results <- res }
	opts.now = func() time.Time { return time.Date(2025, 3, 14, 9, 26, 53, 0, time.UTC) }
	if opts.debounce == 0 {
		opts.debounce = 20 * time.Millisecond
	}
	go func() { r.status <- watch(ctx, opts, r.stderr) }()
	t.Cleanup(func() {
		cancel()
		select {
		case <-r.status:
		case <-time.After(watchWait):
			t.Error("watch did not stop")
		}
	})
	return r
}

// next returns the next compile whose outcome satisfies ok, skipping
// others (an editor's save may arrive as more than one burst).
func (r *watchRun) next(t *testing.T, what string, ok func(watchResult) bool) watchResult {
	t.Helper()
	deadline := time.After(watchWait)
	var seen []string
	for {
		select {
		case res := <-r.results:
			if ok(res) {
				return res
			}
			seen = append(seen, res.output)
		case <-deadline:
			t.Fatalf("no compile with %s; saw:\n%s", what, strings.Join(seen, "\n---\n"))
		}
	}
}

func readString(t *testing.T, path string) string {
	t.Helper()
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	return string(b)
}

// TestWatch follows a drafting session in a temporary folder: saves by
// rename, a broken save, a deleted and re-created include, and edits to
// the included file.
func TestWatch(t *testing.T) {
	dir := t.TempDir()
	if err := os.Mkdir(filepath.Join(dir, "lib"), 0o755); err != nil {
		t.Fatal(err)
	}
	gases := filepath.Join(dir, "lib", "gases.hess")
	plant := filepath.Join(dir, "plant.hess")
	table := filepath.Join(dir, "out", "table.csv")
	if err := os.Mkdir(filepath.Dir(table), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(gases, []byte(watchGases), 0o644); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(plant, []byte(watchPlant), 0o644); err != nil {
		t.Fatal(err)
	}
	r := startWatch(t, watchOptions{roots: []string{plant}, table: table, format: "csv"})

	clean := func(res watchResult) bool { return res.errors == 0 && res.table }
	res := r.next(t, "a first good compile", clean)
	if !strings.HasPrefix(res.output, "[09:26:53] checking ") || !strings.Contains(res.output, "no problems in 2 files") {
		t.Errorf("first report:\n%s", res.output)
	}
	if want := []string{dir, filepath.Join(dir, "lib")}; strings.Join(res.watched, "|") != strings.Join(want, "|") {
		t.Errorf("watching %v, want the folders of both files %v", res.watched, want)
	}
	first := readString(t, table)
	if !strings.Contains(first, "shift") {
		t.Fatalf("table:\n%s", first)
	}

	// 1. An edit saved by writing a new file and renaming it over the old.
	saveByRename(t, plant, watchPlant+"reaction back: CO2(g) + H2(g) <-> CO(g) + H2O(g)\n")
	res = r.next(t, "the renamed-over save", func(res watchResult) bool { return res.table && strings.Contains(readString(t, table), "back") })
	if !strings.Contains(res.output, "plant.hess created") && !strings.Contains(res.output, "plant.hess changed") {
		t.Errorf("report does not say what changed:\n%s", res.output)
	}
	good := readString(t, table)

	// 2. A broken save is reported; the table stays as it was.
	saveByRename(t, plant, watchPlant+"reaction back: CO2(g) + H2(g) <-> \n")
	res = r.next(t, "the broken save", func(res watchResult) bool { return res.errors > 0 })
	if !strings.Contains(res.output, "[syntax]") || !strings.Contains(res.output, "table.csv not rewritten") || res.table {
		t.Errorf("broken save report:\n%s", res.output)
	}
	if readString(t, table) != good {
		t.Errorf("the table changed after a broken save")
	}

	// 3. The include is deleted: reported, and watching goes on.
	saveByRename(t, plant, watchPlant)
	r.next(t, "the repaired save", clean)
	if err := os.Remove(gases); err != nil {
		t.Fatal(err)
	}
	res = r.next(t, "the deleted include", func(res watchResult) bool { return res.errors > 0 })
	if !strings.Contains(res.output, "lib/gases.hess removed") || !strings.Contains(res.output, "[include-missing]") {
		t.Errorf("deleted include report:\n%s", res.output)
	}

	// 4. The include comes back (with other data): rebuilt.
	if err := os.WriteFile(gases, []byte(strings.Replace(watchGases, "-393.522", "-393.0", 1)), 0o644); err != nil {
		t.Fatal(err)
	}
	r.next(t, "the re-created include", clean)
	recreated := readString(t, table)
	if recreated == good {
		t.Errorf("the table did not change with the included file's data")
	}

	// 5. An edit in place to the included file triggers a rebuild.
	if err := os.WriteFile(gases, []byte(strings.Replace(watchGases, "-393.522", "-394.0", 1)), 0o644); err != nil {
		t.Fatal(err)
	}
	res = r.next(t, "the edited include", func(res watchResult) bool { return res.table && readString(t, table) != recreated })
	if !strings.Contains(res.output, "lib/gases.hess changed") {
		t.Errorf("report after editing the include:\n%s", res.output)
	}

	// 6. The whole include folder goes away and comes back.
	if err := os.RemoveAll(filepath.Join(dir, "lib")); err != nil {
		t.Fatal(err)
	}
	r.next(t, "the deleted folder", func(res watchResult) bool { return res.errors > 0 })
	if err := os.Mkdir(filepath.Join(dir, "lib"), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(gases, []byte(watchGases), 0o644); err != nil {
		t.Fatal(err)
	}
	r.next(t, "the re-created folder", clean)

	// Changes to files the network does not read are ignored.
	if err := os.WriteFile(filepath.Join(dir, "notes.txt"), []byte("x"), 0o644); err != nil {
		t.Fatal(err)
	}
	saveByRename(t, plant, watchPlant+"# a last edit\n")
	res = r.next(t, "the last edit", func(watchResult) bool { return true })
	if strings.Contains(res.output, "notes.txt") {
		t.Errorf("an unrelated file triggered a compile:\n%s", res.output)
	}

	r.cancel()
	select {
	case st := <-r.status:
		if st != exitOK {
			t.Errorf("status %d after stop, want 0", st)
		}
		r.status <- st
	case <-time.After(watchWait):
		t.Fatal("watch did not stop")
	}
}

// TestWatchMissingRoot: a root that is not there yet is reported, and the
// first compile happens when it appears.
func TestWatchMissingRoot(t *testing.T) {
	dir := t.TempDir()
	plant := filepath.Join(dir, "plant.hess")
	r := startWatch(t, watchOptions{roots: []string{plant}})
	res := r.next(t, "the first report", func(watchResult) bool { return true })
	if res.errors != -1 || !strings.Contains(res.output, "cannot read") || !strings.Contains(res.output, "waiting for it") {
		t.Errorf("report for a missing root:\n%s", res.output)
	}
	saveByRename(t, plant, "species H2(g)\n")
	res = r.next(t, "the created root", func(res watchResult) bool { return res.errors == 0 })
	if !strings.Contains(res.output, "[unused-species]") {
		t.Errorf("report once the root exists:\n%s", res.output)
	}
}

func TestWatchUsage(t *testing.T) {
	for _, c := range []struct {
		args []string
		code int
		out  string
	}{
		{nil, exitTrouble, "no files given"},
		{[]string{"--table", "t.csv", "a.hess", "b.hess"}, exitTrouble, "exactly one root file"},
		{[]string{"--format", "xml", "a.hess"}, exitTrouble, "must be one of"},
		{[]string{"--help"}, exitOK, "usage: hess watch"},
	} {
		var stdout, stderr bytes.Buffer
		if code := runWatch(c.args, &stdout, &stderr); code != c.code || !strings.Contains(stdout.String()+stderr.String(), c.out) {
			t.Errorf("watch %v: exit %d, output %q; want %d and %q", c.args, code, stdout.String()+stderr.String(), c.code, c.out)
		}
	}
}

// TestWatchInterrupt runs the command as a user does and stops it with
// Ctrl-C (SIGINT): exit status 0.
func TestWatchInterrupt(t *testing.T) {
	dir := t.TempDir()
	plant := filepath.Join(dir, "plant.hess")
	if err := os.WriteFile(plant, []byte("species H2(g), O2(g), H2O(g)\nreaction burn: 2 H2(g) + O2(g) -> 2 H2O(g)\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	cmd := exec.Command(hessBinary(t), "watch", "--color", "never", plant)
	reports, err := cmd.StderrPipe()
	if err != nil {
		t.Fatal(err)
	}
	var stdout bytes.Buffer
	cmd.Stdout = &stdout
	if err := cmd.Start(); err != nil {
		t.Fatal(err)
	}
	lines := make(chan string, 100)
	go func() {
		sc := bufio.NewScanner(reports)
		for sc.Scan() {
			lines <- sc.Text()
		}
		close(lines)
	}()
	deadline := time.After(watchWait)
	for seen := false; !seen; {
		select {
		case l, ok := <-lines:
			if !ok {
				t.Fatal("watch ended early")
			}
			seen = strings.Contains(l, "no problems in 1 file")
		case <-deadline:
			cmd.Process.Kill()
			t.Fatal("no first report")
		}
	}
	if err := cmd.Process.Signal(syscall.SIGINT); err != nil {
		t.Fatal(err)
	}
	// Read the reports to their end before waiting, as os/exec asks.
	for open := true; open; {
		select {
		case _, open = <-lines:
		case <-time.After(watchWait):
			cmd.Process.Kill()
			t.Fatal("watch did not stop on Ctrl-C")
		}
	}
	done := make(chan error, 1)
	go func() { done <- cmd.Wait() }()
	select {
	case err := <-done:
		if err != nil {
			t.Errorf("after Ctrl-C: %v, want exit status 0", err)
		}
		if stdout.Len() > 0 {
			t.Errorf("watch wrote to stdout (reports belong on stderr): %q", stdout.String())
		}
	case <-time.After(watchWait):
		cmd.Process.Kill()
		t.Fatal("watch did not stop on Ctrl-C")
	}
}
