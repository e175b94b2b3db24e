package network

import (
	"context"
	"fmt"
	"math/big"
	"math/rand/v2"
	"os"
	"path/filepath"
	"reflect"
	"slices"
	"strconv"
	"strings"
	"testing"

	"hess/lang"
	"hess/synth"
)

// TestIncrementalLoadMatchesFresh compiles a long sequence of random edits
// the way the language server does (each load through the parse caches of
// the loads before it, some of them cancelled half way) and requires every
// load to equal a fresh Load of the same text: the same diagnostics, and
// the same compiled network down to every value and span. The edits change
// numbers, settings (pressure, temperatures), names; remove, duplicate and
// swap statements; and break the syntax; over a generated four-file
// network and over the shipped examples.
func TestIncrementalLoadMatchesFresh(t *testing.T) {
	steps := 60
	if testing.Short() {
		steps = 20
	}
	root, src, _ := synthSource(t, 60, 200)
	t.Run("generated", func(t *testing.T) { editSequence(t, root, src, steps, 1) })
	root, src, _ = shapeSource(t, synth.Mechanism, 60, 120)
	t.Run("mechanism", func(t *testing.T) { editSequence(t, root, src, steps, 99) })
	ex := memSource{}
	var roots []string
	err := filepath.WalkDir("../examples", func(p string, d os.DirEntry, err error) error {
		if err != nil || d.IsDir() || !strings.HasSuffix(p, ".hess") {
			return err
		}
		b, err := os.ReadFile(p)
		rel, _ := filepath.Rel("../examples", p)
		ex[filepath.Join("/ex", rel)] = b
		roots = append(roots, filepath.Join("/ex", rel))
		return err
	})
	if err != nil || len(roots) == 0 {
		t.Fatalf("examples: %v (%d files)", err, len(roots))
	}
	slices.Sort(roots)
	for i, r := range roots {
		t.Run(filepath.Base(r), func(t *testing.T) { editSequence(t, r, ex, steps, uint64(i+2)) })
	}
}

// editSequence applies steps random edits to the files of the network at
// root, comparing after each an incremental load with a fresh one.
func editSequence(t *testing.T, root string, orig memSource, steps int, seed uint64) {
	src := memSource{}
	for k, v := range orig {
		src[k] = v
	}
	// The files the network reads, as first written.
	var names []string
	for _, f := range Load(root, src, Options{}).Files {
		names = append(names, f.Path)
	}
	rng := rand.New(rand.NewPCG(seed, 17))
	caches := NewParseCaches()
	reused, reusedSpecies := 0, 0
	defer func() {
		// The sequence must have exercised the reuse it checks.
		n := Load(root, orig, Options{})
		if !t.Failed() && reused == 0 && len(n.Reactions) > 0 {
			t.Errorf("no load reused a compiled reaction")
		}
		if !t.Failed() && reusedSpecies == 0 && len(n.Species) > 0 {
			t.Errorf("no load reused a species statement's data")
		}
	}()
	for step := 0; step <= steps; step++ {
		if step > 0 {
			name := names[rng.IntN(len(names))]
			var what string
			src[name], what = randomEdit(rng, src[name])
			t.Logf("step %d: %s in %s", step, what, filepath.Base(name))
		}
		if rng.IntN(4) == 0 {
			// A load cancelled part way, as a newer edit does in the
			// language server, leaves the caches fit for the next one.
			ctx, cancel := context.WithCancel(context.Background())
			stop := rng.IntN(3)
			ctxSrc := cancelAfter{src: src, n: stop, cancel: cancel}
			// A network of no more than stop files loads before the cancel.
			if n, err := LoadContext(ctx, root, &ctxSrc, Options{Caches: caches}); (err == nil) != (n != nil) {
				t.Fatalf("step %d: a load cancelled after %d files returned a network %v and %v", step, stop, n != nil, err)
			}
			cancel()
		}
		got := Load(root, src, Options{Caches: caches})
		m := caches.memo(PathID(root))
		reused += m.reused
		reusedSpecies += m.reusedSpecies
		want := Load(root, src, Options{})
		if g, w := dumpNetwork(got), dumpNetwork(want); g != w {
			gl, wl := strings.Split(g, "\n"), strings.Split(w, "\n")
			for i := 0; i < min(len(gl), len(wl)); i++ {
				if gl[i] != wl[i] {
					t.Fatalf("step %d: the incremental load differs from a fresh one at line %d:\n got  %s\n want %s", step, i, gl[i], wl[i])
				}
			}
			t.Fatalf("step %d: the incremental load has %d lines of dump, a fresh one %d", step, len(gl), len(wl))
		}
	}
}

// cancelAfter is a source that cancels its load when asked for more than n
// files.
type cancelAfter struct {
	src    memSource
	n      int
	cancel func()
}

func (c *cancelAfter) ReadFile(path string) ([]byte, error) {
	if c.n == 0 {
		c.cancel()
	}
	c.n--
	return c.src.ReadFile(path)
}

// randomEdit makes one edit of a kind a user makes, and says which.
func randomEdit(rng *rand.Rand, text []byte) ([]byte, string) {
	lines := strings.Split(string(text), "\n")
	i := rng.IntN(len(lines))
	switch k := rng.IntN(12); k {
	case 10: // a species' formula changed, or a formula given
		for _, j := range rng.Perm(len(lines)) {
			l := lines[j]
			if f, ok := strings.CutPrefix(strings.TrimSpace(l), "formula "); ok {
				// Of the same length half the time, so that the
				// statements after it stay in place.
				b := []byte(f)
				switch at := rng.IntN(len(b)); {
				case rng.IntN(2) == 0:
					f = []string{f + "H", "CH4", "Qz2", f + "O2"}[rng.IntN(4)]
				case b[at] >= '0' && b[at] <= '9':
					b[at] = byte('2' + rng.IntN(8))
					f = string(b)
				default:
					b[at] = "CHNO"[rng.IntN(4)]
					f = string(b)
				}
				lines[j] = "  formula " + f
				return join(lines), "a formula changed"
			}
		}
		for _, j := range rng.Perm(len(lines)) {
			if strings.HasPrefix(lines[j], "species ") && strings.HasSuffix(lines[j], "{") {
				lines = slices.Insert(lines, j+1, "  formula C2H6")
				return join(lines), "a formula given"
			}
		}
		return text, "nothing"
	case 11: // an element declared, which formulas may name
		// At the end half the time, so that the statements before it
		// stay in place.
		if rng.IntN(2) == 0 {
			i = len(lines)
		}
		lines = slices.Insert(lines, i, "element Qz {\n  mass 12.5 g/mol\n}")
		return join(lines), "an element declared"
	case 0: // a digit changed
		var at []int
		for j, r := range lines[i] {
			if r >= '0' && r <= '9' {
				at = append(at, j)
			}
		}
		if len(at) == 0 {
			return text, "nothing"
		}
		j := at[rng.IntN(len(at))]
		lines[i] = lines[i][:j] + strconv.Itoa(rng.IntN(10)) + lines[i][j+1:]
		return join(lines), "a digit"
	case 1: // a line removed
		lines = slices.Delete(lines, i, i+1)
		return join(lines), "a line removed"
	case 2: // a line duplicated (duplicate species, reactions, settings)
		lines = slices.Insert(lines, i, lines[i])
		return join(lines), "a line duplicated"
	case 3: // two lines swapped
		j := rng.IntN(len(lines))
		lines[i], lines[j] = lines[j], lines[i]
		return join(lines), "lines swapped"
	case 4: // the syntax broken
		l := lines[i]
		j := rng.IntN(len(l) + 1)
		lines[i] = l[:j] + []string{"{", "}", "(", ")", " ->", "\"", ":"}[rng.IntN(7)] + l[j:]
		return join(lines), "syntax broken"
	case 5: // a name changed where it is written
		for _, w := range []string{"H2O", "CO2", "O2", "H2", "CH4", "N2", "CO", "r1", "r2", "CaCO3"} {
			if strings.Contains(lines[i], w) {
				lines[i] = strings.Replace(lines[i], w, w+"x", 1)
				return join(lines), "a name changed"
			}
		}
		return text, "nothing"
	case 6: // the standard pressure or the temperatures changed
		s := string(text)
		for _, r := range [][2]string{{"pressure 1 bar", "pressure 1 atm"}, {"pressure 1 atm", "pressure 1 bar"},
			{"temperatures 300 K", "temperatures 350 K"}, {"298.15 K", "400 K"}} {
			if strings.Contains(s, r[0]) {
				return []byte(strings.Replace(s, r[0], r[1], 1)), "settings changed"
			}
		}
		lines = slices.Insert(lines, 0, "settings {\n  pressure 1 atm\n}")
		return join(lines), "settings added"
	case 7: // a statement added
		add := []string{"species Zq(g)", "species H2O(g) {\n  hf -241.8 kJ/mol\n}", "element Qz {\n  mass 12.5 g/mol\n}", "phase melt {\n  convention pure\n}", "species CaO(melt)",
			"reaction extra: H2(g) + O2(g) <-> H2O(g)", "reaction r1: CO(g) <-> CO(g)", "mixture m1 {\n  temperature 300 K\n  pressure 1 bar\n  H2(g) 1 mol\n}",
			"include \"missing.hess\"", "settings {\n  temperatures 500 K\n}"}
		lines = slices.Insert(lines, i, add[rng.IntN(len(add))])
		return join(lines), "a statement added"
	case 8: // a character deleted
		if l := lines[i]; l != "" {
			j := rng.IntN(len(l))
			lines[i] = l[:j] + l[j+1:]
		}
		return join(lines), "a character deleted"
	default: // text inserted at the start of a line (the lines after move)
		lines[i] = "  " + lines[i]
		return join(lines), "indented"
	}
}

func join(lines []string) []byte { return []byte(strings.Join(lines, "\n")) }

// dumpNetwork writes every field of a compiled network, exported or not,
// following pointers; a pointer to a species, reaction, mixture or file
// elsewhere than in its own list is written as its name, so that two
// networks compare by value.
func dumpNetwork(n *Network) string {
	d := &dumper{seen: map[uintptr]bool{}}
	v := reflect.ValueOf(n).Elem()
	t := v.Type()
	for i := 0; i < t.NumField(); i++ {
		f := t.Field(i)
		switch f.Name {
		case "files", "speciesByKey", "reactionByName":
			continue // indexes of the lists written
		case "Files":
			for _, file := range n.Files {
				fmt.Fprintf(&d.b, "file %s %s %d bytes %d statements\n", file.Path, file.ID, len(file.Source), len(file.AST.Statements))
			}
			continue
		case "Species", "Reactions", "Mixtures":
			fv := v.Field(i)
			for j := 0; j < fv.Len(); j++ {
				fmt.Fprintf(&d.b, "%s[%d] ", f.Name, j)
				d.value(fv.Index(j).Elem(), 0)
				d.b.WriteString("\n")
			}
			continue
		}
		fmt.Fprintf(&d.b, "%s: ", f.Name)
		d.value(v.Field(i), 0)
		d.b.WriteString("\n")
	}
	return d.b.String()
}

type dumper struct {
	b    strings.Builder
	seen map[uintptr]bool
}

var (
	speciesPtr  = reflect.TypeFor[*Species]()
	reactionPtr = reflect.TypeFor[*Reaction]()
	mixturePtr  = reflect.TypeFor[*Mixture]()
	filePtr     = reflect.TypeFor[*File]()
	astPtr      = reflect.TypeFor[*lang.File]()
	ratPtr      = reflect.TypeFor[*big.Rat]()
)

func (d *dumper) value(v reflect.Value, depth int) {
	if depth > 40 {
		d.b.WriteString("…")
		return
	}
	switch v.Kind() {
	case reflect.Pointer:
		if v.IsNil() {
			d.b.WriteString("nil")
			return
		}
		switch v.Type() {
		case speciesPtr:
			fmt.Fprintf(&d.b, "&species(%s)", v.Elem().FieldByName("Key").String())
			return
		case reactionPtr:
			fmt.Fprintf(&d.b, "&reaction(%s)", v.Elem().FieldByName("Name").String())
			return
		case mixturePtr:
			fmt.Fprintf(&d.b, "&mixture(%s)", v.Elem().FieldByName("Name").String())
			return
		case filePtr, astPtr:
			d.b.WriteString("&file")
			return
		case ratPtr:
			if v.CanInterface() {
				d.b.WriteString(v.Interface().(*big.Rat).RatString())
				return
			}
		}
		if v.Type().Elem().PkgPath() == "hess/lang" {
			// A syntax-tree node the model keeps (a reaction's statement,
			// a range's polynomial) counts by where it is, not by how the
			// parse that made it grouped its tokens: a statement taken
			// from the cache and a fresh parse of it must compare equal.
			p := reflect.NewAt(v.Type().Elem(), v.UnsafePointer()) // readable even through an unexported field
			if s, ok := p.Interface().(interface{ Span() lang.Span }); ok {
				fmt.Fprintf(&d.b, "&node(%v)", s.Span())
				return
			}
		}
		if d.seen[v.Pointer()] {
			d.b.WriteString("&seen")
			return
		}
		d.seen[v.Pointer()] = true
		d.b.WriteString("&")
		d.value(v.Elem(), depth+1)
	case reflect.Struct:
		d.b.WriteString("{")
		for i := 0; i < v.NumField(); i++ {
			if i > 0 {
				d.b.WriteString(" ")
			}
			d.b.WriteString(v.Type().Field(i).Name + ":")
			d.value(v.Field(i), depth+1)
		}
		d.b.WriteString("}")
	case reflect.Slice, reflect.Array:
		if v.Kind() == reflect.Slice && v.IsNil() {
			d.b.WriteString("nil")
			return
		}
		d.b.WriteString("[")
		for i := 0; i < v.Len(); i++ {
			if i > 0 {
				d.b.WriteString(" ")
			}
			d.value(v.Index(i), depth+1)
		}
		d.b.WriteString("]")
	case reflect.Map:
		if v.IsNil() {
			d.b.WriteString("nil")
			return
		}
		type kv struct{ k, v string }
		var items []kv
		for it := v.MapRange(); it.Next(); {
			kd := &dumper{seen: d.seen}
			kd.value(it.Key(), depth+1)
			vd := &dumper{seen: d.seen}
			vd.value(it.Value(), depth+1)
			items = append(items, kv{kd.b.String(), vd.b.String()})
		}
		slices.SortFunc(items, func(a, b kv) int { return strings.Compare(a.k+a.v, b.k+b.v) })
		d.b.WriteString("map[")
		for _, it := range items {
			d.b.WriteString(it.k + "=" + it.v + " ")
		}
		d.b.WriteString("]")
	case reflect.Interface:
		if v.IsNil() {
			d.b.WriteString("nil")
			return
		}
		d.b.WriteString(v.Elem().Type().String() + "(")
		d.value(v.Elem(), depth+1)
		d.b.WriteString(")")
	case reflect.Func:
		fmt.Fprintf(&d.b, "func(%v)", !v.IsNil())
	case reflect.Chan, reflect.UnsafePointer:
		fmt.Fprintf(&d.b, "%s(%v)", v.Kind(), !v.IsNil())
	case reflect.Float32, reflect.Float64:
		d.b.WriteString(strconv.FormatFloat(v.Float(), 'g', -1, 64))
	case reflect.Complex64, reflect.Complex128:
		fmt.Fprint(&d.b, v.Complex())
	case reflect.Bool:
		fmt.Fprint(&d.b, v.Bool())
	case reflect.String:
		d.b.WriteString(strconv.Quote(v.String()))
	case reflect.Int, reflect.Int8, reflect.Int16, reflect.Int32, reflect.Int64:
		fmt.Fprint(&d.b, v.Int())
	default:
		fmt.Fprint(&d.b, v.Uint())
	}
}

// TestIncrementalLoadTargeted walks edits chosen to change what a reused
// statement depends on while the statement itself stays in place: an
// element declared after the species whose formula names it, a duplicate
// declaration in the root that takes a species from an included file's
// statement, a species' formula changed under reactions that use it.
func TestIncrementalLoadTargeted(t *testing.T) {
	const lib = "species Zz(g) {\n  formula Qz2\n  hf 10 kJ/mol\n  s 200 J/mol/K\n}\nspecies Qz(g) {\n  formula Qz\n}\nspecies CH4(g), H2(g)\nreaction split: Zz(g) <-> 2 Qz(g)\nreaction other: Zz(g) <-> Qz(g)\n"
	steps := []map[string]string{
		{"/t/root.hess": "include \"lib.hess\"\n", "/t/lib.hess": lib},
		{"/t/root.hess": "include \"lib.hess\"\n# a note\n", "/t/lib.hess": lib},
		{"/t/root.hess": "include \"lib.hess\"\n", "/t/lib.hess": lib + "element Qz {\n  mass 12.5 g/mol\n}\n"},
		{"/t/root.hess": "include \"lib.hess\"\n", "/t/lib.hess": lib},
		{"/t/root.hess": "element Qz {\n  mass 20 g/mol\n}\ninclude \"lib.hess\"\n", "/t/lib.hess": lib},
		{"/t/root.hess": "element Qz {\n  mass 20 g/mol\n}\nspecies Zz(g) {\n  formula C\n}\ninclude \"lib.hess\"\n", "/t/lib.hess": lib},
		{"/t/root.hess": "element Qz {\n  mass 20 g/mol\n}\nspecies CH4(g)\ninclude \"lib.hess\"\n", "/t/lib.hess": lib},
		{"/t/root.hess": "element Qz {\n  mass 20 g/mol\n}\ninclude \"lib.hess\"\n", "/t/lib.hess": lib},
		{"/t/root.hess": "element Qz {\n  mass 20 g/mol\n}\ninclude \"lib.hess\"\n", "/t/lib.hess": strings.Replace(lib, "formula Qz\n", "formula Qy\n", 1)},
		{"/t/root.hess": "element Qz {\n  mass 20 g/mol\n}\ninclude \"lib.hess\"\n", "/t/lib.hess": strings.Replace(lib, "formula Qz2\n", "formula Qz3\n", 1)},
		{"/t/root.hess": "settings {\n  pressure 1 atm\n}\nelement Qz 20\ninclude \"lib.hess\"\n", "/t/lib.hess": strings.Replace(lib, "formula Qz2\n", "formula Qz3\n", 1)},
	}
	caches := NewParseCaches()
	reused, reusedSpecies := 0, 0
	for i, files := range steps {
		src := memSource{}
		for k, v := range files {
			src[k] = []byte(v)
		}
		got, want := Load("/t/root.hess", src, Options{Caches: caches}), Load("/t/root.hess", src, Options{})
		m := caches.memo(PathID("/t/root.hess"))
		reused += m.reused
		reusedSpecies += m.reusedSpecies
		if g, w := dumpNetwork(got), dumpNetwork(want); g != w {
			t.Fatalf("step %d: the incremental load differs from a fresh one:\n%s\nfresh:\n%s", i, g, w)
		}
	}
	if reused == 0 || reusedSpecies == 0 {
		t.Errorf("%d reactions and %d species statements reused: the sequence does not exercise the reuse", reused, reusedSpecies)
	}
}

// TestIncrementalChecksTargeted changes what the species-local checks
// depend on besides the species' own statement (the tolerance, the
// network's standard pressure and temperatures, a file's standard
// pressure, a phase's convention, whether a reaction uses the species)
// while the species statements stay in place, and requires each load to
// equal a fresh one, with findings reused in between.
func TestIncrementalChecksTargeted(t *testing.T) {
	lib, err := os.ReadFile("testdata/reuse/lib.hess")
	if err != nil {
		t.Fatal(err)
	}
	const phase = "phase melt {\n  convention ideal-gas\n}\n"
	const include = "include \"lib.hess\"\n"
	const react = "reaction ab: Aa(g) + O2(g) <-> Bb(melt)\n"
	const temps = "settings {\n  temperatures 298.15 K, 500 K\n}\n"
	roots := []string{
		include,
		include + "# a note\n",
		temps + include,
		temps + include + react,
		temps + include,
		temps + include + react,
		include + react,
		"settings {\n  tolerance 0.001 kJ/mol\n}\n" + include + react,
		"settings {\n  tolerance 0.001 kJ/mol\n}\n" + include,
		"settings {\n  tolerance 0.001 kJ/mol\n}\n# a note\n" + include,
		"settings {\n  tolerance 0.001 kJ/mol\n  pressure 1 atm\n}\n" + include,
		"settings {\n  tolerance 0.001 kJ/mol\n  pressure 1 atm\n}\n" + phase + include,
		"settings {\n  tolerance 0.001 kJ/mol\n  pressure 1 atm\n}\n" + strings.Replace(phase, "ideal-gas", "pure", 1) + include,
		"settings {\n  tolerance 0.001 kJ/mol\n}\n" + phase + include,
		"settings {\n  tolerance 0.001 kJ/mol\n}\n" + strings.Replace(phase, "ideal-gas", "pure", 1) + include,
	}
	caches := NewParseCaches()
	reused := 0
	for i, root := range roots {
		atm := string(lib) + "settings {\n  standard-pressure 1 atm\n}\n"
		for _, libText := range []string{atm, string(lib), atm} {
			src := memSource{"/t/root.hess": []byte(root), "/t/lib.hess": []byte(libText)}
			reused += loadBothWays(t, caches, src, fmt.Sprintf("root %d", i))
		}
	}
	if reused == 0 {
		t.Error("no species-local finding was reused: the sequence does not exercise the reuse")
	}
}

// TestIncrementalReactionChecksTargeted changes what missing-thermo finds
// for a reaction whose statement stays in place (and whose build is
// reused): the data of one of its species, and the own data of the
// reaction it is a combination of.
func TestIncrementalReactionChecksTargeted(t *testing.T) {
	lib, err := os.ReadFile("testdata/reuse/lib.hess")
	if err != nil {
		t.Fatal(err)
	}
	noS := string(lib) + "species Cc(g) {\n  formula C\n  hf 10 kJ/mol\n}\n"
	withS := string(lib) + "species Cc(g) {\n  formula C\n  hf 10 kJ/mol\n  s 100 J/mol/K\n}\n"
	const combo = "include \"lib.hess\"\nreaction c2: Cc(g) <-> Aa(g) = c1\n"
	plain := combo + "reaction c1: Cc(g) <-> Aa(g)\n"
	own := combo + "reaction c1: Cc(g) <-> Aa(g) {\n  dg 5 kJ/mol\n}\n"
	steps := [][2]string{{plain, noS}, {plain + "# a note\n", noS}, {plain, withS}, {plain, noS}, {own, noS}, {plain, noS}, {own, noS}}
	caches := NewParseCaches()
	reused := 0
	for i, st := range steps {
		src := memSource{"/t/root.hess": []byte(st[0]), "/t/lib.hess": []byte(st[1])}
		reused += loadBothWays(t, caches, src, fmt.Sprintf("step %d", i))
	}
	if reused == 0 {
		t.Error("no finding was reused: the sequence does not exercise the reuse")
	}
}

// loadBothWays loads /t/root.hess of src through caches and afresh, fails
// the test (naming the step) when the two differ, and returns how many
// species-local findings the load through the caches reused.
func loadBothWays(t *testing.T, caches *ParseCaches, src memSource, step string) int {
	t.Helper()
	got := Load("/t/root.hess", src, Options{Caches: caches})
	reused := caches.memo(PathID("/t/root.hess")).checks.reused
	want := Load("/t/root.hess", src, Options{})
	if g, w := dumpNetwork(got), dumpNetwork(want); g != w {
		t.Fatalf("%s: the incremental load differs from a fresh one:\n%s\nfresh:\n%s", step, g, w)
	}
	return reused
}

// TestIncrementalMovedReactions edits above reactions so that every one of
// them moves (a new statement of the same text): the position-free builds
// are taken from the memo with their node replaced, those with own data
// or rates (whose values keep spans) are built afresh, and every load
// equals a fresh one.
func TestIncrementalMovedReactions(t *testing.T) {
	const species = "species A(g) {\n  formula C\n  hf 1 kJ/mol\n  s 100 J/mol/K\n}\nspecies B(g) {\n  formula C\n  hf 2 kJ/mol\n  s 110 J/mol/K\n}\nspecies C2(g) {\n  formula C2\n  hf 3 kJ/mol\n  s 120 J/mol/K\n}\n"
	var rx strings.Builder
	for i := range 20 {
		fmt.Fprintf(&rx, "reaction p%d: 2 A(g) <-> C2(g)\n", i)
	}
	rx.WriteString("reaction own: 2 B(g) <-> C2(g) {\n  dg 5 kJ/mol\n}\nreaction q: A(g) <-> B(g)\n")
	steps := []string{
		species + rx.String(),
		"# moved down by a line\n" + species + rx.String(),
		"# moved down\n# by two lines\n" + species + rx.String(),
		species + "\n\n" + rx.String(),
		species + rx.String(),
	}
	caches := NewParseCaches()
	for i, text := range steps {
		src := memSource{"/t/root.hess": []byte(text)}
		got := Load("/t/root.hess", src, Options{Caches: caches})
		reused := caches.memo(PathID("/t/root.hess")).reused
		want := Load("/t/root.hess", src, Options{})
		if g, w := dumpNetwork(got), dumpNetwork(want); g != w {
			t.Fatalf("step %d: the incremental load differs from a fresh one:\n%s\nfresh:\n%s", i, g, w)
		}
		// 21 plain reactions move with every edit; the one with own data
		// is built again.
		if i > 0 && reused != 21 {
			t.Errorf("step %d: %d reactions reused, want the 21 without own data", i, reused)
		}
		for _, r := range got.Reactions {
			if r.Span() != r.node.Span() || r.Span().Start.Offset != strings.Index(text, "reaction "+r.Name+":") {
				t.Errorf("step %d: %s spans %v, written at offset %d", i, r.Name, r.Span(), strings.Index(text, "reaction "+r.Name+":"))
			}
		}
	}
}
