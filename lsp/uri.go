package lsp

import (
	"fmt"
	"net/url"
	"path/filepath"
	"runtime"
	"strings"
)

// uriToPath turns a file: URI into a clean absolute path. Other schemes are
// an error: the compiler reads files by path.
func uriToPath(uri string) (string, error) {
	u, err := url.Parse(uri)
	if err != nil {
		return "", fmt.Errorf("document URI %q: %w", uri, err)
	}
	if u.Scheme != "file" {
		return "", fmt.Errorf("document URI %q: only file: URIs are supported", uri)
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

// pathToURI turns an absolute path into a file: URI.
func pathToURI(path string) string {
	p := filepath.ToSlash(path)
	if !strings.HasPrefix(p, "/") {
		p = "/" + p // a Windows drive letter
	}
	return (&url.URL{Scheme: "file", Path: p}).String()
}
