package lsp

import (
	"fmt"
	"net/url"
	"path/filepath"
	"runtime"
	"strings"
)

// uriToPath turns a file: URI into a clean absolute path, and an untitled:
// URI (a buffer not yet saved) into a path under untitledDir, where no
// file is ever read: the compiler reads files by path, open buffers
// first. Other schemes are an error.
func uriToPath(uri string) (string, error) {
	u, err := url.Parse(uri)
	if err != nil {
		return "", fmt.Errorf("document URI %q: %w", uri, err)
	}
	if u.Scheme == "untitled" {
		name := u.Opaque + u.Path
		if name == "" {
			return "", fmt.Errorf("document URI %q names no buffer", uri)
		}
		return filepath.Abs(filepath.Join(string(filepath.Separator), untitledDir, url.PathEscape(name)))
	}
	if u.Scheme != "file" {
		return "", fmt.Errorf("document URI %q: only file: and untitled: URIs are supported", uri)
	}
	p := u.Path
	if runtime.GOOS == "windows" {
		// file:///C:/dir/x.hess has the path /C:/dir/x.hess.
		if len(p) >= 3 && p[0] == '/' && p[2] == ':' {
			p = p[1:]
		}
		if u.Host != "" {
			p = `\\` + u.Host + p
		}
	} else if u.Host != "" && u.Host != "localhost" {
		return "", fmt.Errorf("document URI %q: files on other hosts are not supported", uri)
	}
	p = filepath.FromSlash(p)
	if !filepath.IsAbs(p) {
		return "", fmt.Errorf("document URI %q: the path is not absolute", uri)
	}
	return filepath.Clean(p), nil
}

// untitledDir is the folder, at the root of the file system, in which
// unsaved buffers are taken to lie. An include in such a buffer is looked
// for there, and is not found.
const untitledDir = "hess-untitled"

// pathToURI turns an absolute path into a file: URI.
func pathToURI(path string) string {
	p := filepath.ToSlash(path)
	if !strings.HasPrefix(p, "/") {
		p = "/" + p // a Windows drive letter
	}
	return (&url.URL{Scheme: "file", Path: p}).String()
}

// untitledRoot is the pseudo-folder of unsaved buffers with a trailing
// separator, as it appears at the start of their paths.
var untitledRoot = string(filepath.Separator) + untitledDir + string(filepath.Separator)

// untitledText rewrites a message that names paths under the pseudo-folder
// of unsaved buffers: each becomes the name the user knows (the buffer's
// name, or the include as written), and a file an unsaved buffer includes
// gets the reason it cannot be found.
func untitledText(msg, code string) string {
	if !strings.Contains(msg, untitledRoot) {
		return msg
	}
	var b strings.Builder
	rest := msg
	for {
		i := strings.Index(rest, untitledRoot)
		if i < 0 {
			b.WriteString(rest)
			break
		}
		b.WriteString(rest[:i])
		rest = rest[i+len(untitledRoot):]
		end := strings.IndexAny(rest, " :)\n")
		if end < 0 {
			end = len(rest)
		}
		name := rest[:end]
		if u, err := url.PathUnescape(name); err == nil {
			name = u
		}
		b.WriteString(filepath.ToSlash(name))
		rest = rest[end:]
	}
	out := b.String()
	if code == "include-missing" {
		out += "; an unsaved buffer has no folder to include from: save it first"
	}
	return out
}
