package main

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// A write through a symbolic link lands in the link's target; the link
// stays a link.
func TestWriteFileAtomicThroughLink(t *testing.T) {
	dir := t.TempDir()
	target := filepath.Join(dir, "real.hess")
	link := filepath.Join(dir, "link.hess")
	if err := os.WriteFile(target, []byte("old"), 0o640); err != nil {
		t.Fatal(err)
	}
	if err := os.Symlink("real.hess", link); err != nil {
		t.Fatal(err)
	}
	if err := writeFileAtomic(link, []byte("new")); err != nil {
		t.Fatal(err)
	}
	if info, err := os.Lstat(link); err != nil || info.Mode()&os.ModeSymlink == 0 {
		t.Errorf("the link was replaced: %v %v", info.Mode(), err)
	}
	if b, _ := os.ReadFile(target); string(b) != "new" {
		t.Errorf("target holds %q, want %q", b, "new")
	}
	if info, _ := os.Stat(target); info.Mode().Perm() != 0o640 {
		t.Errorf("target's mode is %v, want 0640", info.Mode().Perm())
	}
}

// A dangling link is written through, as a plain write would.
func TestWriteFileAtomicDanglingLink(t *testing.T) {
	dir := t.TempDir()
	link := filepath.Join(dir, "out.csv")
	if err := os.Symlink("made.csv", link); err != nil {
		t.Fatal(err)
	}
	if err := writeFileAtomic(link, []byte("x")); err != nil {
		t.Fatal(err)
	}
	if b, err := os.ReadFile(filepath.Join(dir, "made.csv")); err != nil || string(b) != "x" {
		t.Errorf("made.csv: %q, %v", b, err)
	}
}

// Read-only files, folders and unwritable places are refused, the old file
// stays, and the error names the user's path, never a temporary file.
func TestWriteFileAtomicRefuses(t *testing.T) {
	dir := t.TempDir()
	ro := filepath.Join(dir, "ro.csv")
	if err := os.WriteFile(ro, []byte("keep"), 0o444); err != nil {
		t.Fatal(err)
	}
	loop := filepath.Join(dir, "loop")
	if err := os.Symlink("loop", loop); err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct{ path, want string }{
		{ro, "read-only"},
		{dir, "folder"},
		{filepath.Join(dir, "no", "such", "x.csv"), "no such file"},
		{loop, "too many levels"},
	} {
		err := writeFileAtomic(tc.path, []byte("new"))
		if err == nil || !strings.Contains(err.Error(), tc.want) || !strings.Contains(err.Error(), tc.path) || strings.Contains(err.Error(), ".tmp") {
			t.Errorf("writeFileAtomic(%s) = %v; want an error naming the path with %q and no temporary name", tc.path, err, tc.want)
		}
	}
	if b, _ := os.ReadFile(ro); string(b) != "keep" {
		t.Errorf("read-only file changed to %q", b)
	}
	entries, _ := os.ReadDir(dir)
	for _, e := range entries {
		if strings.Contains(e.Name(), ".tmp") {
			t.Errorf("temporary file %s left behind", e.Name())
		}
	}
}

// table -o and plot -o refuse to overwrite a source file of the network,
// whatever name reaches it.
func TestOutputOverSourceRefused(t *testing.T) {
	dir := t.TempDir()
	src, err := os.ReadFile("../../examples/hydrogen-plant/reformer.hess")
	if err != nil {
		t.Skip("example missing:", err)
	}
	gases, _ := os.ReadFile("../../examples/hydrogen-plant/gases.hess")
	root := filepath.Join(dir, "reformer.hess")
	lib := filepath.Join(dir, "gases.hess")
	os.WriteFile(root, src, 0o644)
	os.WriteFile(lib, gases, 0o644)
	os.Symlink("gases.hess", filepath.Join(dir, "alias.svg"))
	for _, args := range [][]string{
		{"table", "-o", root, root},
		{"table", "--format", "csv", "-o", lib, root},
		{"plot", "-o", filepath.Join(dir, "alias.svg"), root},
	} {
		var stdout, stderr strings.Builder
		code := run(args, &stdout, &stderr)
		if code != exitTrouble || !strings.Contains(stderr.String(), "a source file of the network") {
			t.Errorf("%v: exit %d, stderr %q; want exit %d refusing the source file", args, code, stderr.String(), exitTrouble)
		}
	}
	if b, _ := os.ReadFile(root); string(b) != string(src) {
		t.Error("the root file changed")
	}
	if b, _ := os.ReadFile(lib); string(b) != string(gases) {
		t.Error("the included file changed")
	}
}
