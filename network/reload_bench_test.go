package network

import (
	"bytes"
	"fmt"
	"maps"
	"slices"
	"testing"

	"hess/synth"
)

// BenchmarkReloadSynthetic is what the language server does on each edit:
// a load through parse caches kept from the load before, after a one-line
// edit that toggles a reaction's coefficient (the lines after it move).
func BenchmarkReloadSynthetic(b *testing.B) {
	for _, shape := range []synth.Shape{synth.Spread, synth.Mechanism} {
		for _, size := range scaleSizes {
			b.Run(fmt.Sprintf("%v/sp=%d/rx=%d", shape, size.species, size.reactions), func(b *testing.B) {
				root, src, _ := shapeSource(b, shape, size.species, size.reactions)
				var file string
				var at int
				for name, text := range src {
					if i := bytes.LastIndex(text, []byte("\nreaction ")); i >= 0 && (file == "" || name > file) {
						file, at = name, i+1+bytes.Index(text[i+1:], []byte(": "))+2
					}
				}
				orig := src[file]
				edited := append(append(append([]byte(nil), orig[:at]...), "2 "...), orig[at:]...)
				caches := NewParseCaches()
				Load(root, src, Options{Caches: caches})
				b.ReportAllocs()
				i := 0
				for b.Loop() {
					if i%2 == 0 {
						src[file] = edited
					} else {
						src[file] = orig
					}
					i++
					if n := Load(root, src, Options{Caches: caches}); len(n.Reactions) != size.reactions {
						b.Fatalf("%d reactions", len(n.Reactions))
					}
				}
				src[file] = orig
			})
		}
	}
}

// BenchmarkEditRoundSynthetic is the round of edits the language server's
// stdio benchmark (cmd/hess BenchmarkLSPEditStdio) makes, in process: a
// digit of a species' polynomial coefficient changed (same length) and a
// "2 " inserted before a reaction's first term (the lines after it move),
// each undone, every load through the caches of the one before. It is
// the benchmark to profile the server's compile with.
func BenchmarkEditRoundSynthetic(b *testing.B) {
	cases := []struct {
		shape              synth.Shape
		species, reactions int
	}{{synth.Mechanism, 10000, 5000}, {synth.Spread, 10000, 50000}}
	for _, c := range cases {
		b.Run(fmt.Sprintf("%v/sp=%d/rx=%d", c.shape, c.species, c.reactions), func(b *testing.B) {
			root, src, _ := shapeSource(b, c.shape, c.species, c.reactions)
			edits := editRound(b, src)
			caches := NewParseCaches()
			Load(root, src, Options{Caches: caches})
			b.ReportAllocs()
			i := 0
			for b.Loop() {
				e := edits[i%len(edits)]
				i++
				e.apply(b, src, 0)
				if n := Load(root, src, Options{Caches: caches}); len(n.Reactions) != c.reactions {
					b.Fatalf("%d reactions", len(n.Reactions))
				}
			}
		})
	}
}

// roundEdit is one edit of a round: in a file, the bytes at an offset
// replaced by others.
type roundEdit struct {
	file     string
	at       int
	old, new string
}

// apply makes the edit in src; edits before it in the round have moved
// its offset by shift bytes.
func (e roundEdit) apply(tb testing.TB, src memSource, shift int) {
	text := src[e.file]
	at := e.at + shift
	if string(text[at:at+len(e.old)]) != e.old {
		tb.Fatalf("%s at %d: %q, not %q", e.file, at, text[at:at+len(e.old)], e.old)
	}
	src[e.file] = append(append(append([]byte(nil), text[:at]...), e.new...), text[at+len(e.old):]...)
}

// editRound is the four edits of a round, each made on the text the one
// before left: a digit of the middle species' first polynomial
// coefficient line changed, "2 " inserted before the first term of the
// middle plain reaction line, the digit restored, the "2 " removed.
func editRound(tb testing.TB, src memSource) []roundEdit {
	tb.Helper()
	var sp, rx *roundEdit
	for _, name := range slices.Sorted(maps.Keys(src)) {
		text := src[name]
		lines := bytes.SplitAfter(text, []byte("\n"))
		var sps, rxs []int
		off := 0
		offs := make([]int, len(lines))
		for i, l := range lines {
			offs[i] = off
			off += len(l)
			switch {
			case bytes.HasPrefix(l, []byte("species ")) && i+2 < len(lines):
				sps = append(sps, i)
			case bytes.HasPrefix(l, []byte("reaction ")) && !bytes.HasSuffix(bytes.TrimSpace(l), []byte("{")):
				rxs = append(rxs, i)
			}
		}
		if sp == nil && len(sps) > 0 {
			i := sps[len(sps)/2]
			for i++; i < len(lines) && !bytes.HasPrefix(lines[i], []byte("  nasa7")); i++ {
			}
			if i+1 < len(lines) {
				l := lines[i+1]
				if d := bytes.IndexAny(l, "eE") - 1; d >= 0 && l[d] >= '0' && l[d] <= '9' {
					sp = &roundEdit{file: name, at: offs[i+1] + d, old: string(l[d]), new: string('0' + (l[d]-'0'+1)%10)}
				}
			}
		}
		if rx == nil && len(rxs) > 0 {
			i := rxs[len(rxs)/2]
			rx = &roundEdit{file: name, at: offs[i] + bytes.Index(lines[i], []byte(": ")) + 2, new: "2 "}
		}
	}
	if sp == nil || rx == nil {
		tb.Fatal("no species polynomial or no plain reaction in the generated network")
	}
	if sp.file == rx.file && rx.at < sp.at {
		tb.Fatal("the reaction edit comes before the species edit")
	}
	return []roundEdit{*sp, *rx, {sp.file, sp.at, sp.new, sp.old}, {rx.file, rx.at, rx.new, ""}}
}
