package main

import (
	"flag"
	"fmt"
	"os"
	"strings"
)

// includePaths is the repeatable --include-path flag: folders, besides the
// root file's own folder tree, that includes may read from.
type includePaths []string

func (p *includePaths) String() string { return strings.Join(*p, string(os.PathListSeparator)) }

func (p *includePaths) Set(dir string) error {
	if dir == "" {
		return fmt.Errorf("a folder cannot be empty")
	}
	info, err := os.Stat(dir)
	if err != nil {
		return fmt.Errorf("%s: %v", dir, unwrapPathError(err))
	}
	if !info.IsDir() {
		return fmt.Errorf("%s is not a folder", dir)
	}
	*p = append(*p, dir)
	return nil
}

// includePathFlag registers --include-path on fs.
func includePathFlag(fs *flag.FlagSet) *includePaths {
	p := &includePaths{}
	fs.Var(p, "include-path", "also read includes from the folder `DIR` and below (repeatable)")
	return p
}
