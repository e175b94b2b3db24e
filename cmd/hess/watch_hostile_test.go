package main

import (
	"os"
	"path/filepath"
	"strings"
	"syscall"
	"testing"
)

// A watch started with a relative path keeps watching the folder of that
// name after the folder is deleted and made again (the working folder
// then names the deleted one).
func TestWatchRelativeFolderRecreated(t *testing.T) {
	proj := filepath.Join(t.TempDir(), "proj")
	if err := os.Mkdir(proj, 0o755); err != nil {
		t.Fatal(err)
	}
	writeFile(t, filepath.Join(proj, "net.hess"), "species H2(g), H(g)\nreaction split: H2(g) <-> 2 H(g)\n", 0o644)
	t.Chdir(proj)
	r := startWatch(t, watchOptions{roots: []string{"net.hess"}})
	r.next(t, "the first compile", func(res watchResult) bool { return res.errors == 0 })
	if err := os.RemoveAll(proj); err != nil {
		t.Fatal(err)
	}
	r.next(t, "the root missing", func(res watchResult) bool { return res.errors == -1 })
	if err := os.Mkdir(proj, 0o755); err != nil {
		t.Fatal(err)
	}
	writeFile(t, filepath.Join(proj, "net.hess"), "species H2(g), H(g)\nreaction split: H2(g) <-> H(g)\n", 0o644)
	res := r.next(t, "the new file's error", func(res watchResult) bool { return res.errors == 1 })
	if !strings.Contains(res.output, "element-imbalance") {
		t.Errorf("report:\n%s", res.output)
	}
}

// An include whose permissions change is compiled again at once: made
// unreadable, it is reported without waiting for a save.
func TestWatchIncludePermissions(t *testing.T) {
	dir := t.TempDir()
	lib := filepath.Join(dir, "lib.hess")
	writeFile(t, lib, "species H2(g), H(g)\n", 0o644)
	writeFile(t, filepath.Join(dir, "net.hess"), "include \"lib.hess\"\nreaction split: H2(g) <-> 2 H(g)\n", 0o644)
	r := startWatch(t, watchOptions{roots: []string{filepath.Join(dir, "net.hess")}})
	r.next(t, "the first compile", func(res watchResult) bool { return res.errors == 0 })
	if err := os.Chmod(lib, 0); err != nil {
		t.Fatal(err)
	}
	res := r.next(t, "the permissions change", func(res watchResult) bool { return strings.Contains(res.output, "lib.hess permissions changed") })
	if os.Geteuid() != 0 && !strings.Contains(res.output, "permission denied") {
		t.Errorf("report:\n%s", res.output)
	}
	// Made readable again, it compiles clean.
	os.Chmod(lib, 0o644)
	r.next(t, "readable again", func(res watchResult) bool { return res.errors == 0 })
}

// A root replaced by a named pipe is reported, never opened (opening it
// would block the watch for good).
func TestWatchRootBecomesPipe(t *testing.T) {
	dir := t.TempDir()
	root := filepath.Join(dir, "net.hess")
	writeFile(t, root, "species H2(g)\n", 0o644)
	r := startWatch(t, watchOptions{roots: []string{root}})
	r.next(t, "the first compile", func(res watchResult) bool { return res.errors == 0 })
	if err := os.Remove(root); err != nil {
		t.Fatal(err)
	}
	if err := syscall.Mkfifo(root, 0o644); err != nil {
		t.Skipf("mkfifo: %v", err)
	}
	r.next(t, "the pipe refused", func(res watchResult) bool { return strings.Contains(res.output, "it is a named pipe; waiting for it") })
	os.Remove(root)
	writeFile(t, root, "species H2(g)\n", 0o644)
	r.next(t, "a file again", func(res watchResult) bool { return res.errors == 0 })
}
