// Package synth writes invented reaction networks of a chosen size for tests
// and benchmarks, in two shapes. Spread (the default): species with two-range
// NASA 7-term data named by Hill formula, balanced one- to three-body steps,
// some with their own ΔrG° and a forward rate, spread over a root file and
// the files it includes. Mechanism: one large file laid out as a kinetics
// mechanism is, with full five-term heat-capacity polynomials, join
// temperatures that vary between species, isomers declared with an explicit
// formula, mostly bimolecular steps and few reactions with own data. The
// output depends only on the configuration, seed included; synth never
// reads files and never checks what it writes.
package synth

import (
	"fmt"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"strings"
)

// Config sizes a generated network.
type Config struct {
	Shape     Shape  // layout of the network; the zero value is Spread
	Seed      uint64 // seed of the pseudo-random choices
	Species   int    // number of species, each with NASA 7-term data
	Reactions int    // number of reactions
	OwnData   int    // how many reactions carry their own ΔrG° and a rate
	Files     int    // files the network is spread over (root included); 1 or less: one file; Mechanism always writes one
}

// Shape is the layout of a generated network.
type Shape int

const (
	// Spread is species named by Hill formula with three-term heat
	// capacities, one- to three-body steps, over several files.
	Spread Shape = iota
	// Mechanism is one file in the layout of a kinetics mechanism: full
	// polynomials, varying join temperatures, isomers, bimolecular steps.
	Mechanism
)

var shapeNames = [...]string{Spread: "spread", Mechanism: "mechanism"}

// String returns the shape's name as ParseShape reads it.
func (s Shape) String() string {
	if int(s) >= 0 && int(s) < len(shapeNames) {
		return shapeNames[s]
	}
	return fmt.Sprintf("Shape(%d)", int(s))
}

// ParseShape reads a shape's name: "spread" or "mechanism".
func ParseShape(name string) (Shape, error) {
	for i, n := range shapeNames {
		if n == name {
			return Shape(i), nil
		}
	}
	return 0, fmt.Errorf("synth: unknown shape %q (spread or mechanism)", name)
}

// Network is a generated network: file contents by name, and the root file
// that includes the others.
type Network struct {
	Root  string            // name of the root file
	Names []string          // file names, root first
	Files map[string][]byte // file contents by name
}

// Bytes is the total size of all files.
func (n *Network) Bytes() int {
	t := 0
	for _, b := range n.Files {
		t += len(b)
	}
	return t
}

// WriteDir writes every file into dir, which must exist.
func (n *Network) WriteDir(dir string) error {
	for _, name := range n.Names {
		if err := os.WriteFile(filepath.Join(dir, name), n.Files[name], 0o644); err != nil {
			return fmt.Errorf("writing generated network: %w", err)
		}
	}
	return nil
}

// elements of the generated species, in the order a formula names them.
var elements = [4]string{"C", "H", "N", "O"}

// comp counts the atoms of each element in a species.
type comp [4]int

func (c comp) total() int { return c[0] + c[1] + c[2] + c[3] }

// name is the species name: its formula, elements in Hill order.
func (c comp) name() string {
	var b strings.Builder
	for i, e := range elements {
		switch {
		case c[i] == 1:
			b.WriteString(e)
		case c[i] > 1:
			fmt.Fprintf(&b, "%s%d", e, c[i])
		}
	}
	return b.String()
}

// species holds one generated species and its two NASA 7-term ranges.
type species struct {
	c        comp
	name     string
	low, hi  [7]float64
	g298     float64 // G° at 298.15 K in J/mol, for the reactions' own data
	refState bool
	mid      float64 // join temperature of the two ranges in K (Mechanism)
	isomer   bool    // named apart from its formula, which is declared (Mechanism)
}

const (
	gasR    = 8.314462618 // J/(mol K)
	tRef    = 298.15
	tLow    = 200.0
	tMid    = 1000.0
	tHigh   = 6000.0
	kJ      = 1000.0
	maxBody = 3
)

// Generate writes a network for the configuration.
func Generate(cfg Config) (*Network, error) {
	if cfg.Species < 8 {
		return nil, fmt.Errorf("synth: %d species, need at least 8", cfg.Species)
	}
	if cfg.Reactions < 1 || cfg.OwnData < 0 || cfg.OwnData > cfg.Reactions {
		return nil, fmt.Errorf("synth: %d reactions with %d carrying own data", cfg.Reactions, cfg.OwnData)
	}
	switch cfg.Shape {
	case Spread:
	case Mechanism:
		return generateMechanism(cfg), nil
	default:
		return nil, fmt.Errorf("synth: unknown shape %v", cfg.Shape)
	}
	rng := rand.New(rand.NewPCG(cfg.Seed, 0x6865737373796e74))
	sp := makeSpecies(cfg.Species, rng)
	index := make(map[comp][]int, len(sp))
	for i, s := range sp {
		index[s.c] = append(index[s.c], i)
	}
	files := max(cfg.Files, 1)
	spFiles := (files + 1) / 2
	if files == 1 {
		spFiles = 0
	}
	rxFiles := files - 1 - spFiles
	if files > 1 && rxFiles < 1 {
		spFiles, rxFiles = files-2, 1
	}
	n := &Network{Root: "network.hess", Files: map[string][]byte{}}
	var root strings.Builder
	root.WriteString("# Generated demo network (invented data, not for design)\n")
	root.WriteString("settings {\n  pressure 1 bar\n  temperatures 300 K to 1200 K by 100 K\n}\n\n")
	var parts []string
	for i := 0; i < spFiles; i++ {
		parts = append(parts, fmt.Sprintf("species-%d.hess", i+1))
	}
	for i := 0; i < rxFiles; i++ {
		parts = append(parts, fmt.Sprintf("reactions-%d.hess", i+1))
	}
	for _, p := range parts {
		fmt.Fprintf(&root, "include %q\n", p)
	}
	bodies := make([]strings.Builder, len(parts))
	out := func(kind, i, of, count int) *strings.Builder {
		if of == 0 {
			return &root
		}
		k := i * of / count
		if kind == 1 {
			k += spFiles
		}
		return &bodies[k]
	}
	root.WriteString("\n")
	for i := range sp {
		writeSpecies(out(0, i, spFiles, len(sp)), &sp[i])
	}
	every := 0
	if cfg.OwnData > 0 {
		every = cfg.Reactions / cfg.OwnData
	}
	own := 0
	for i := 0; i < cfg.Reactions; i++ {
		left, right := makeReaction(sp, index, rng)
		b := out(1, i, rxFiles, cfg.Reactions)
		fmt.Fprintf(b, "reaction r%d: %s <-> %s", i+1, side(sp, left), side(sp, right))
		if every > 0 && i%every == 0 && own < cfg.OwnData {
			own++
			writeOwnData(b, sp, left, right, rng)
		}
		b.WriteString("\n")
	}
	n.Names = append(n.Names, n.Root)
	n.Files[n.Root] = []byte(root.String())
	for i, p := range parts {
		n.Names = append(n.Names, p)
		n.Files[p] = []byte(bodies[i].String())
	}
	return n, nil
}

// makeSpecies lists the first n compositions by atom count (so every part
// of a listed composition is listed too) and gives each invented data.
func makeSpecies(n int, rng *rand.Rand) []species {
	cs := listComps(n)
	sp := make([]species, len(cs))
	for i, c := range cs {
		sp[i] = newSpecies(c, rng)
	}
	return sp
}

// newSpecies invents plausible data: Cp° growing with the atom count, ΔfH°
// zero for the elements' reference states (H2, N2, O2) and random otherwise.
func newSpecies(c comp, rng *rand.Rand) species {
	s := species{c: c, name: c.name()}
	atoms := float64(c.total())
	s.refState = c.total() == 2 && (c[1] == 2 || c[2] == 2 || c[3] == 2)
	hf := 0.0
	if !s.refState {
		hf = (rng.Float64()*500 - 300) * kJ
	}
	s298 := 110 + 35*atoms + 20*rng.Float64()
	a1 := 2.5 + 0.9*(atoms-1)
	a2 := 1.2e-3 * (atoms - 1) * (0.6 + 0.4*rng.Float64())
	a3 := -2.0e-7*(atoms-1) + 0 // + 0: no negative zero in the output
	s.low = [7]float64{a1, a2, a3}
	s.low[5] = hf/gasR - (a1*tRef + a2*tRef*tRef/2 + a3*tRef*tRef*tRef/3)
	s.low[6] = s298/gasR - (a1*math.Log(tRef) + a2*tRef + a3*tRef*tRef/2)
	b2 := a2 / 4
	b1 := a1 + a2*tMid + a3*tMid*tMid - b2*tMid
	hMid := a1*tMid + a2*tMid*tMid/2 + a3*tMid*tMid*tMid/3 + s.low[5]
	sMid := a1*math.Log(tMid) + a2*tMid + a3*tMid*tMid/2 + s.low[6]
	s.hi = [7]float64{b1, b2}
	s.hi[5] = hMid - (b1*tMid + b2*tMid*tMid/2)
	s.hi[6] = sMid - (b1*math.Log(tMid) + b2*tMid)
	s.g298 = hf - tRef*s298
	return s
}

func writeSpecies(b *strings.Builder, s *species) {
	fmt.Fprintf(b, "species %s(g) {\n", s.name)
	for _, r := range []struct {
		lo, hi float64
		a      *[7]float64
	}{{tLow, tMid, &s.low}, {tMid, tHigh, &s.hi}} {
		a := r.a
		fmt.Fprintf(b, "  nasa7 %g K to %g K {\n    %.8e %.8e %.8e %.8e\n    %.8e %.8e %.8e\n  }\n",
			r.lo, r.hi, a[0], a[1], a[2], a[3], a[4], a[5], a[6])
	}
	b.WriteString("}\n")
}

// term is a coefficient and a species index.
type term struct{ n, sp int }

// makeReaction draws a balanced step: a composition S, split into one to
// three reactants and one to three products with no species on both sides.
func makeReaction(sp []species, index map[comp][]int, rng *rand.Rand) (left, right []term) {
	for {
		s := sp[rng.IntN(len(sp))].c
		r, p := 1+rng.IntN(maxBody), 1+rng.IntN(maxBody)
		if r+p < 3 || s.total() < max(r, p) {
			continue
		}
		left, ok := split(s, r, index, rng)
		if !ok {
			continue
		}
		right, ok := split(s, p, index, rng)
		if !ok || shares(left, right) {
			continue
		}
		return left, right
	}
}

func shares(a, b []term) bool {
	for _, x := range a {
		for _, y := range b {
			if x.sp == y.sp {
				return true
			}
		}
	}
	return false
}

func side(sp []species, ts []term) string {
	var b strings.Builder
	for i, t := range ts {
		if i > 0 {
			b.WriteString(" + ")
		}
		if t.n > 1 {
			fmt.Fprintf(&b, "%d ", t.n)
		}
		b.WriteString(sp[t.sp].name)
		b.WriteString("(g)")
	}
	return b.String()
}

// writeOwnData adds a ΔrG° consistent with the species data (rounded to
// 1 J/mol) and a forward Arrhenius rate whose unit fits the step's order.
func writeOwnData(b *strings.Builder, sp []species, left, right []term, rng *rand.Rand) {
	dg := 0.0
	order := 0
	for _, t := range left {
		dg -= float64(t.n) * sp[t.sp].g298
		order += t.n
	}
	for _, t := range right {
		dg += float64(t.n) * sp[t.sp].g298
	}
	unit := "1/s"
	switch order {
	case 2:
		unit = "cm3/mol/s"
	case 3:
		unit = "cm6/mol2/s"
	}
	if order > 3 {
		unit = fmt.Sprintf("cm%d/mol%d/s", 3*(order-1), order-1)
	}
	a := math.Pow(10, 8+6*rng.Float64())
	fmt.Fprintf(b, " {\n  dg %.3f kJ/mol\n  rate A %.3e %s n %.2f Ea %.1f kJ/mol\n}", dg/kJ, a, unit, 2*rng.Float64()-1, 200*rng.Float64())
}
