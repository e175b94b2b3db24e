package network

import (
	"os"
	"path/filepath"
)

// Source reads the files of a network. The command line reads the disk; the
// language server reads open editor buffers first, so unsaved edits in an
// included file count.
type Source interface {
	ReadFile(path string) ([]byte, error)
}

// Disk reads files from the file system.
type Disk struct{}

// ReadFile reads the named file.
func (Disk) ReadFile(path string) ([]byte, error) { return os.ReadFile(path) }

// Overlay serves the files it holds (by cleaned absolute path) and reads
// everything else from Base.
type Overlay struct {
	Files map[string][]byte
	Base  Source
}

// ReadFile returns the overlay's copy of path, or reads it from Base.
func (o Overlay) ReadFile(path string) ([]byte, error) {
	if abs, err := filepath.Abs(path); err == nil {
		if b, ok := o.Files[abs]; ok {
			return b, nil
		}
	}
	if o.Base == nil {
		return Disk{}.ReadFile(path)
	}
	return o.Base.ReadFile(path)
}
