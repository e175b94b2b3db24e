package network

import (
	"bytes"
	"fmt"
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
