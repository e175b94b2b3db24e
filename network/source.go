package network

import (
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"syscall"
)

// Source reads the files of a network. The command line reads the disk; the
// language server reads open editor buffers first, so unsaved edits in an
// included file count. The bytes ReadFile returns must never change
// afterwards: the network keeps them, and its syntax tree reads them in
// place (its token values are slices of them).
type Source interface {
	ReadFile(path string) ([]byte, error)
}

// PathID is the identity of a file: its absolute, clean path. The loader
// computes it once per file (File.ID); every caller that asks whether two
// paths name the same file of a network (the language server, watch,
// Overlay) compares PathIDs.
func PathID(path string) string {
	if abs, err := filepath.Abs(path); err == nil {
		return abs
	}
	return filepath.Clean(path)
}

// Disk reads files from the file system: regular files only, at most
// MaxFileBytes, opened without blocking (a named pipe, a terminal or a
// device is refused, never read).
type Disk struct{}

// ReadFile reads the named regular file. A file that is not regular or is
// too large gives a *RefusedError.
func (Disk) ReadFile(path string) ([]byte, error) {
	// O_NONBLOCK: opening a named pipe with no writer, or a terminal,
	// returns at once instead of waiting; fstat then refuses it.
	f, err := os.OpenFile(path, os.O_RDONLY|syscall.O_NONBLOCK|syscall.O_CLOEXEC, 0)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	info, err := f.Stat()
	if err != nil {
		return nil, err
	}
	if info.IsDir() {
		return nil, &fs.PathError{Op: "read", Path: path, Err: syscall.EISDIR}
	}
	if !info.Mode().IsRegular() {
		return nil, &RefusedError{Path: path, Reason: "it is " + fileKind(info.Mode())}
	}
	if info.Size() > MaxFileBytes {
		return nil, tooLarge(path)
	}
	// Files of /proc and the like report size 0 and may hold more: read at
	// most one byte past the limit, whatever the size said.
	b, err := io.ReadAll(io.LimitReader(f, MaxFileBytes+1))
	if err != nil {
		return nil, &fs.PathError{Op: "read", Path: path, Err: err}
	}
	if len(b) > MaxFileBytes {
		return nil, tooLarge(path)
	}
	return b, nil
}

func tooLarge(path string) *RefusedError {
	return &RefusedError{Path: path, Reason: fmt.Sprintf("it is larger than %s, the limit on one file", sizeText(MaxFileBytes))}
}

// fileKind names what a file that is not a regular file is.
func fileKind(m fs.FileMode) string {
	switch {
	case m.IsDir():
		return "a folder"
	case m&fs.ModeNamedPipe != 0:
		return "a named pipe"
	case m&fs.ModeSocket != 0:
		return "a socket"
	case m&fs.ModeCharDevice != 0:
		return "a character device"
	case m&fs.ModeDevice != 0:
		return "a device"
	}
	return "not a regular file"
}

// RefusedError is a file the loader will not read: not a regular file, too
// large, outside the folders includes may come from, or past a limit.
type RefusedError struct {
	Path   string
	Reason string
}

func (e *RefusedError) Error() string { return fmt.Sprintf("refusing %s: %s", e.Path, e.Reason) }

// Overlay serves the files it holds (by PathID) and reads everything else
// from Base.
type Overlay struct {
	Files map[string][]byte
	Base  Source
}

// ReadFile returns the overlay's copy of path, or reads it from Base.
func (o Overlay) ReadFile(path string) ([]byte, error) {
	if b, ok := o.Files[PathID(path)]; ok {
		return b, nil
	}
	if o.Base == nil {
		return Disk{}.ReadFile(path)
	}
	return o.Base.ReadFile(path)
}

// isRefused reports whether err is the loader's refusal of a file.
func isRefused(err error) (*RefusedError, bool) {
	var r *RefusedError
	return r, errors.As(err, &r)
}
