// Command synthgen writes a generated demo network into a directory, for
// measuring the hess binary on networks of mechanism size.
package main

import (
	"flag"
	"fmt"
	"os"

	"hess/synth"
)

func main() {
	var c synth.Config
	flag.Uint64Var(&c.Seed, "seed", 1, "seed of the pseudo-random choices")
	flag.IntVar(&c.Species, "species", 10000, "number of species")
	flag.IntVar(&c.Reactions, "reactions", 50000, "number of reactions")
	flag.IntVar(&c.OwnData, "own", 5000, "reactions with their own data and rate")
	flag.IntVar(&c.Files, "files", 4, "number of files, root included")
	shape := flag.String("shape", "spread", "layout: spread (formula names, several files) or mechanism (one file, full polynomials, isomers)")
	dir := flag.String("out", ".", "directory to write into (must exist)")
	flag.Parse()
	var err error
	c.Shape, err = synth.ParseShape(*shape)
	var n *synth.Network
	if err == nil {
		n, err = synth.Generate(c)
	}
	if err == nil {
		err = n.WriteDir(*dir)
	}
	if err != nil {
		fmt.Fprintln(os.Stderr, "synthgen:", err)
		os.Exit(1)
	}
	fmt.Printf("%s: %d files, %d bytes\n", n.Root, len(n.Names), n.Bytes())
}
