package network

import (
	"fmt"
	"path/filepath"
	"strings"
	"testing"
)

// An included file that does not read as a network is quoted by its first
// line only, cut short: such a file may be anything.
func TestIncludeNotANetwork(t *testing.T) {
	secret := "SECRET=" + strings.Repeat("x", 200)
	for _, tc := range []struct{ name, lib, why string }{
		{"binary", "KEY=value\x00" + secret, "it holds NUL bytes"},
		{"not UTF-8", "KEY=\xff\xfe\n" + secret, "it is not UTF-8 text"},
		{"no statement", "-----BEGIN KEY-----\n" + secret + "\n-----END KEY-----\n", "not one statement in it could be read"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			n := Load("net.hess", memSource{"net.hess": []byte("include \"lib.hess\"\n"), "lib.hess": []byte(tc.lib)}, Options{})
			f := n.File("lib.hess")
			if f == nil {
				t.Fatal("lib.hess not among the files")
			}
			if strings.Contains(string(f.Source), "SECRET") || len(f.Source) > maxQuotedBytes+len("…") || strings.ContainsAny(string(f.Source), "\n\x00") {
				t.Errorf("kept source %q", f.Source)
			}
			var msgs []string
			for _, d := range n.Diagnostics {
				if d.Subject.File == "lib.hess" {
					msgs = append(msgs, d.Message)
				}
			}
			if len(msgs) != 1 || !strings.Contains(msgs[0], tc.why) {
				t.Errorf("diagnostics of lib.hess: %q", msgs)
			}
		})
	}
	// A library with one good statement among broken ones is a network.
	n := Load("net.hess", memSource{"net.hess": []byte("include \"lib.hess\"\n"), "lib.hess": []byte("species H2(g)\nspecies {\n")}, Options{})
	if f := n.File("lib.hess"); f == nil || !strings.Contains(string(f.Source), "species {") {
		t.Errorf("a partly broken library was cut short")
	}
}

// Each file's identity is computed once and looked up by any spelling of
// its path.
func TestFileIdentity(t *testing.T) {
	n := Load("a/net.hess", memSource{"a/net.hess": []byte("include \"../b/lib.hess\"\n"), "b/lib.hess": []byte("species H2(g)\n")},
		Options{IncludePaths: []string{"b"}})
	if len(n.Files) != 2 {
		t.Fatalf("files %v, diagnostics %v", n.Files, n.Diagnostics)
	}
	lib := n.Files[1]
	if lib.ID != PathID("b/lib.hess") || lib.Path != filepath.Join("a", "..", "b", "lib.hess") && lib.Path != "b/lib.hess" {
		t.Errorf("path %q, id %q", lib.Path, lib.ID)
	}
	for _, p := range []string{"b/lib.hess", "./b/lib.hess", "a/../b/lib.hess", PathID("b/lib.hess")} {
		if n.File(p) != lib {
			t.Errorf("File(%q) did not find the library", p)
		}
	}
}

// Messages about deep chains of includes stay short.
func TestLongIncludeChainMessages(t *testing.T) {
	const depth = maxIncludeDepth + 10
	src := memSource{}
	for i := range depth {
		src[fmt.Sprintf("f%d.hess", i)] = []byte(fmt.Sprintf("include \"f%d.hess\"\n", i+1))
	}
	src[fmt.Sprintf("f%d.hess", 50)] = []byte("include \"f0.hess\"\n") // a cycle 51 files long
	n := Load("f0.hess", src, Options{})
	if len(n.Diagnostics) != 1 || n.Diagnostics[0].Code != "include-cycle" || !strings.Contains(n.Diagnostics[0].Message, "… 44 more …") ||
		len(n.Diagnostics[0].Message) > 200 || len(n.Diagnostics[0].Related) != maxChainShown {
		t.Errorf("cycle: %+v", n.Diagnostics)
	}
	delete(src, "f50.hess")
	src["f50.hess"] = []byte("include \"f51.hess\"\n")
	n = Load("f0.hess", src, Options{})
	if len(n.Diagnostics) != 1 || !strings.Contains(n.Diagnostics[0].Message, "the limit on include depth") || len(n.Diagnostics[0].Message) > 400 {
		t.Errorf("depth: %+v", n.Diagnostics)
	}
}
