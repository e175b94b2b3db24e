package main

import (
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"

	"hess/network"
)

// maxLinkHops bounds how many symbolic links a written path may pass
// through, as the kernel does (40 on Linux).
const maxLinkHops = 40

// writeFileAtomic replaces the file at path with data so that a reader
// never sees a half-written file: it writes a temporary file beside the
// target and renames it over the target. It behaves as a plain write would
// in everything else:
//
//   - a symbolic link is followed and its target written; the link stays;
//   - an existing file keeps its permission bits;
//   - a file the user may not write, a file no one may write (mode 0444,
//     even for the superuser) and anything but a regular file are refused
//     and left untouched.
//
// Errors name path as the user gave it, never the temporary file. On
// failure the old file is left as it was.
func writeFileAtomic(path string, data []byte) (err error) {
	return writeFileAtomicStream(path, func(w io.Writer) error {
		_, err := w.Write(data)
		return err
	})
}

// writeFileAtomicStream is writeFileAtomic of what write writes, as it
// writes it: the target is replaced only once write has succeeded.
func writeFileAtomicStream(path string, write func(io.Writer) error) (err error) {
	fail := func(err error) error { return fmt.Errorf("cannot write %s: %w", path, err) }
	target, err := linkTarget(path)
	if err != nil {
		return fail(err)
	}
	perm := os.FileMode(0o644)
	info, err := os.Stat(target)
	switch {
	case err == nil:
		if info.IsDir() {
			return fail(errors.New("it is a folder"))
		}
		if !info.Mode().IsRegular() {
			return fail(errors.New("not a regular file"))
		}
		perm = info.Mode().Perm()
		if perm&0o222 == 0 {
			// Nobody may write it: the owner meant it to stay as it is,
			// even where the system would let this user replace it.
			return fail(fmt.Errorf("it is read-only (mode %04o)", perm))
		}
		// Opening for writing asks the system the question a plain write
		// would: a read-only file or folder refuses.
		f, err := os.OpenFile(target, os.O_WRONLY, 0)
		if err != nil {
			return fail(unwrapPathError(err))
		}
		f.Close()
	case !errors.Is(err, fs.ErrNotExist):
		return fail(unwrapPathError(err))
	}
	dir := filepath.Dir(target)
	tmp, err := os.CreateTemp(dir, "."+filepath.Base(target)+".tmp*")
	if err != nil {
		return fail(unwrapPathError(err))
	}
	defer func() {
		if err != nil {
			tmp.Close()
			os.Remove(tmp.Name())
		}
	}()
	if err := write(tmp); err != nil {
		return fail(unwrapPathError(err))
	}
	if err := tmp.Sync(); err != nil {
		return fail(unwrapPathError(err))
	}
	if err := tmp.Chmod(perm); err != nil {
		return fail(unwrapPathError(err))
	}
	if err := tmp.Close(); err != nil {
		return fail(unwrapPathError(err))
	}
	if err := os.Rename(tmp.Name(), target); err != nil {
		return fail(unwrapPathError(err))
	}
	return nil
}

// linkTarget follows path through symbolic links to the file they name,
// which need not exist yet (a dangling link is written through, as a plain
// write does).
func linkTarget(path string) (string, error) {
	for hops := 0; ; hops++ {
		info, err := os.Lstat(path)
		if err != nil || info.Mode()&fs.ModeSymlink == 0 {
			return path, nil
		}
		if hops == maxLinkHops {
			return "", errors.New("too many levels of symbolic links")
		}
		dest, err := os.Readlink(path)
		if err != nil {
			return "", unwrapPathError(err)
		}
		if !filepath.IsAbs(dest) {
			dest = filepath.Join(filepath.Dir(path), dest)
		}
		path = dest
	}
}

// writeOutput writes a file computed from a network (a table, a plot) with
// writeFileAtomic, and refuses to when path is one of the network's own
// source files.
func writeOutput(path string, net *network.Network, data []byte) error {
	return writeOutputStream(path, net, func(w io.Writer) error {
		_, err := w.Write(data)
		return err
	})
}

// writeOutputStream is writeOutput of what write writes, as it writes it.
func writeOutputStream(path string, net *network.Network, write func(io.Writer) error) error {
	var sources []string
	if net != nil {
		for _, f := range net.Files {
			sources = append(sources, f.Path)
		}
	}
	if src := sameFileAs(path, sources); src != "" {
		return fmt.Errorf("cannot write %s: it is %s, a source file of the network", path, displayName(src))
	}
	return writeFileAtomicStream(path, write)
}

// sameFileAs returns the first of files that is the same file as out
// (after links), or "" when none is. A table or plot written over a file of
// the network it was computed from would destroy the source.
func sameFileAs(out string, files []string) string {
	oi, err := os.Stat(out)
	if err != nil {
		return ""
	}
	for _, f := range files {
		if fi, err := os.Stat(f); err == nil && os.SameFile(oi, fi) {
			return f
		}
	}
	return ""
}
