package main

import (
	"fmt"
	"io/fs"
	"os"
	"path/filepath"
	"sort"
	"strings"

	"hess/lang"
	"hess/network"
)

// networkExt is the extension of the network files a folder argument
// stands for.
const networkExt = ".hess"

// expandArgs replaces each folder among the file arguments by every network
// file below it, in lexical order (folders whose names begin with a dot,
// such as .git, are skipped, and symbolic links to folders are not
// followed). Files and "-" are kept as given. A path that does not exist or
// a folder that cannot be read is returned as trouble: its message and the
// argument. So is a folder with no network file below it.
func expandArgs(args []string) (files []string, trouble []inputTrouble) {
	seen := map[string]bool{}
	add := func(path string) {
		id := path
		if path != "-" {
			id = fileIdentity(path)
		}
		if !seen[id] {
			seen[id] = true
			files = append(files, path)
		}
	}
	for _, arg := range args {
		if arg == "-" {
			add(arg)
			continue
		}
		info, err := os.Stat(arg)
		if err != nil || !info.IsDir() {
			add(arg) // the caller reports what cannot be read
			continue
		}
		// A folder named through a symbolic link is followed (a trailing
		// separator makes the walk read the link's target); links below it
		// are not.
		root := arg
		if li, err := os.Lstat(arg); err == nil && li.Mode()&fs.ModeSymlink != 0 {
			root = arg + string(filepath.Separator)
		}
		var found []string
		err = filepath.WalkDir(root, func(path string, d fs.DirEntry, err error) error {
			if err != nil {
				return err
			}
			if d.IsDir() {
				if path != root && strings.HasPrefix(d.Name(), ".") {
					return filepath.SkipDir
				}
				return nil
			}
			if d.Type().IsRegular() && strings.HasSuffix(d.Name(), networkExt) {
				found = append(found, path)
			}
			return nil
		})
		if err != nil {
			trouble = append(trouble, inputTrouble{File: displayName(arg),
				Message: fmt.Sprintf("cannot read %s: %v", displayName(arg), unwrapPathError(err))})
			continue
		}
		if len(found) == 0 {
			trouble = append(trouble, inputTrouble{File: displayName(arg),
				Message: fmt.Sprintf("%s holds no network files (*%s)", displayName(arg), networkExt)})
			continue
		}
		sort.Strings(found)
		for _, f := range found {
			add(f)
		}
	}
	return files, trouble
}

// fileIdentity names a file once however it is reached: its absolute
// path, through any symbolic links.
func fileIdentity(path string) string {
	if real, err := filepath.EvalSymlinks(path); err == nil {
		path = real
	}
	if abs, err := filepath.Abs(path); err == nil {
		return abs
	}
	return filepath.Clean(path)
}

// loadedRoot is one candidate root file and what its network gives the
// report: the files it read (path and text) and its diagnostics. The
// compiled model is not kept, so that holding every candidate until the
// roots are known costs about the sources and the findings.
type loadedRoot struct {
	path  string
	files []network.File // Path and Source only
	diags lang.Diagnostics
}

// newLoadedRoot keeps what the report needs of a compiled network.
func newLoadedRoot(path string, net *network.Network) loadedRoot {
	files := make([]network.File, len(net.Files))
	for i, f := range net.Files {
		files[i] = network.File{Path: f.Path, Source: f.Source}
	}
	return loadedRoot{path: path, files: files, diags: net.Diagnostics}
}

// pickRoots keeps the candidates that no other candidate's network
// includes: a shared library of species is checked through the networks
// that include it, never on its own (where all its species would be
// unused). Files that only include one another in a cycle are all
// included; of those, the first not reached from a root so far becomes a
// root too, so that every candidate is checked once. Order is kept.
func pickRoots(cands []loadedRoot) []loadedRoot {
	if len(cands) < 2 {
		return cands
	}
	id := fileIdentity
	reach := make([]map[string]bool, len(cands))
	included := map[string]bool{}
	for i, c := range cands {
		own := id(c.path)
		reach[i] = map[string]bool{own: true}
		for _, f := range c.files {
			fid := id(f.Path)
			reach[i][fid] = true
			if fid != own {
				included[fid] = true
			}
		}
	}
	covered := map[string]bool{}
	isRoot := make([]bool, len(cands))
	take := func(i int) {
		isRoot[i] = true
		for f := range reach[i] {
			covered[f] = true
		}
	}
	for i, c := range cands {
		if !included[id(c.path)] {
			take(i)
		}
	}
	for i, c := range cands {
		if !covered[id(c.path)] {
			take(i)
		}
	}
	var roots []loadedRoot
	for i, c := range cands {
		if isRoot[i] {
			roots = append(roots, c)
		}
	}
	return roots
}
