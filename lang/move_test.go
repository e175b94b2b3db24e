package lang

import (
	"bufio"
	"bytes"
	"fmt"
	"io/fs"
	"os"
	"path/filepath"
	"reflect"
	"strconv"
	"strings"
	"testing"
	"unsafe"

	"github.com/alecthomas/participle/v2/lexer"

	"hess/synth"
)

// reflectMoved is the reference for moved: the copier that walks the
// syntax tree by reflection, as the statement cache first moved
// statements. It knows no node type by name, so it copies every field the
// tree has or will have; moved must give exactly what it gives. It shares
// moved's copy of the tokens and its moves of one node, position and
// string (mover), which the comparison checks on their own (checkNode,
// checkString).
func reflectMoved(st *Statement, src *Source, at int) *Statement {
	m := reflectMover{newMover(st, src, at)}
	out := reflect.New(reflect.TypeFor[Statement]())
	m.copyStruct(out.Elem(), reflect.ValueOf(st).Elem())
	return out.Interface().(*Statement)
}

type reflectMover struct{ *mover }

func (m *reflectMover) copyStruct(dst, src reflect.Value) {
	for i := 0; i < src.NumField(); i++ {
		f, d := src.Field(i), dst.Field(i)
		switch {
		case f.Type() == nodeType:
			n := (*Node)(f.Addr().UnsafePointer())
			*(*Node)(d.Addr().UnsafePointer()) = m.node(*n)
		case f.Type() == parsedNodeType:
			n := (*ParsedNode)(f.Addr().UnsafePointer())
			*(*ParsedNode)(d.Addr().UnsafePointer()) = ParsedNode{Pos: m.pos(n.Pos), EndPos: m.pos(n.EndPos), Node: m.node(n.Node)}
		case f.Kind() == reflect.Pointer:
			if !f.IsNil() {
				p := reflect.New(f.Type().Elem())
				m.copyStruct(p.Elem(), f.Elem())
				d.Set(p)
			}
		case f.Kind() == reflect.Slice && f.Type().Elem().Kind() == reflect.Pointer:
			if !f.IsNil() {
				s := reflect.MakeSlice(f.Type(), f.Len(), f.Len())
				for j := 0; j < f.Len(); j++ {
					if e := f.Index(j); !e.IsNil() {
						p := reflect.New(e.Type().Elem())
						m.copyStruct(p.Elem(), e.Elem())
						s.Index(j).Set(p)
					}
				}
				d.Set(s)
			}
		case f.Kind() == reflect.String:
			d.SetString(m.rebase(f.String()))
		case !src.Type().Field(i).IsExported():
			exposed(d).Set(exposed(f)) // a statement's lineage
		default:
			d.Set(f)
		}
	}
}

// inText reports whether s is a slice of text.
func inText(s, text string) bool {
	if len(s) == 0 || len(text) == 0 {
		return false
	}
	p, base := uintptr(unsafe.Pointer(unsafe.StringData(s))), uintptr(unsafe.Pointer(unsafe.StringData(text)))
	return p >= base && p-base+uintptr(len(s)) <= uintptr(len(text))
}

// moveCheck compares a statement moved by moved (got) with the same
// statement moved by reflectMoved (want), both moved from orig.
type moveCheck struct {
	t                *testing.T
	oldText, newText string
	src              *Source
	gotG, wantG      *tokenGroup // the groups of the two copies
	seen             map[unsafe.Pointer]string
	fails            int
}

func (c *moveCheck) errorf(path, format string, args ...any) {
	c.t.Helper()
	c.fails++
	if c.fails <= 10 {
		c.t.Errorf("%s: %s", path, fmt.Sprintf(format, args...))
	}
}

// checkMoved compares the two copies of orig deeply: the same field values,
// nil where the reference has nil, lists of the same length and capacity,
// every pointer new and used once, every node a run of its copy's group
// with the reference's bounds, every position and string the reference's,
// and every string that was a slice of the old text one of the new text.
func checkMoved(t *testing.T, name string, orig, got, want *Statement, oldText, newText string, src *Source) bool {
	t.Helper()
	c := &moveCheck{t: t, oldText: oldText, newText: newText, src: src, gotG: got.g, wantG: want.g, seen: map[unsafe.Pointer]string{}}
	if got.g == nil || want.g == nil || got.g == orig.g {
		c.errorf(name, "the copy's group is %p, the reference's %p, the original's %p", got.g, want.g, orig.g)
		return false
	}
	if got.g.src != src {
		c.errorf(name, "the copy's group resolves through another Source")
	}
	if len(got.g.toks) != len(want.g.toks) {
		c.errorf(name, "%d tokens in the copy's group, %d in the reference's", len(got.g.toks), len(want.g.toks))
	} else {
		for i := range got.g.toks {
			g, w, o := got.g.toks[i], want.g.toks[i], orig.g.toks[int(orig.start)+i]
			p := fmt.Sprintf("%s.token[%d]", name, i)
			if g.Offset != w.Offset || g.Type != w.Type || g.FirstOnLine != w.FirstOnLine {
				c.errorf(p, "%+v, the reference has %+v", g, w)
			}
			c.checkString(p+".Value", g.Value, w.Value, o.Value)
		}
	}
	c.compare(name, reflect.ValueOf(got), reflect.ValueOf(want), reflect.ValueOf(orig))
	return c.fails == 0
}

func (c *moveCheck) checkString(path, got, want, orig string) {
	c.t.Helper()
	if got != want {
		c.errorf(path, "%q, the reference has %q", got, want)
		return
	}
	if unsafe.StringData(got) != unsafe.StringData(want) {
		c.errorf(path, "%q is not the same slice as the reference's", got)
	}
	if inText(orig, c.oldText) && !inText(got, c.newText) && inText(want, c.newText) {
		c.errorf(path, "%q was a slice of the old text but is not one of the new", got)
	}
	if inText(got, c.oldText) && !inText(want, c.oldText) {
		c.errorf(path, "%q keeps the old text alive", got)
	}
}

func (c *moveCheck) checkNode(path string, got, want, orig Node) {
	c.t.Helper()
	if (got.g == nil) != (want.g == nil) {
		c.errorf(path, "node on group %p, the reference's on %p (original %+v)", got.g, want.g, orig)
		return
	}
	if got.g == nil {
		if got != (Node{}) {
			c.errorf(path, "an empty node %+v is not the zero node", got)
		}
		return
	}
	if got.g != c.gotG || want.g != c.wantG {
		c.errorf(path, "node is not on its statement's group")
	}
	if got.start != want.start || got.end != want.end {
		c.errorf(path, "node is tokens [%d:%d], the reference's [%d:%d]", got.start, got.end, want.start, want.end)
	}
	if got.Source() != c.src {
		c.errorf(path, "node resolves through another Source")
	}
	if got.Span() != want.Span() {
		c.errorf(path, "node spans %v, the reference's %v", got.Span(), want.Span())
	}
}

func (c *moveCheck) compare(path string, got, want, orig reflect.Value) {
	c.t.Helper()
	if c.fails > 10 {
		return
	}
	switch got.Kind() {
	case reflect.Pointer:
		if got.IsNil() != want.IsNil() {
			c.errorf(path, "nil is %v, the reference's %v", got.IsNil(), want.IsNil())
			return
		}
		if got.IsNil() {
			return
		}
		p := got.UnsafePointer()
		if p == orig.UnsafePointer() {
			c.errorf(path, "shared with the original")
		}
		if prev, ok := c.seen[p]; ok {
			c.errorf(path, "the same node as %s", prev)
		}
		c.seen[p] = path
		c.compare(path, got.Elem(), want.Elem(), orig.Elem())
	case reflect.Slice:
		if got.IsNil() != want.IsNil() || got.Len() != want.Len() || got.Cap() != want.Cap() {
			c.errorf(path, "list nil %v, len %d, cap %d; the reference's nil %v, len %d, cap %d",
				got.IsNil(), got.Len(), got.Cap(), want.IsNil(), want.Len(), want.Cap())
			return
		}
		if got.Len() > 0 && got.Pointer() == orig.Pointer() {
			c.errorf(path, "list shared with the original")
		}
		for i := range got.Len() {
			c.compare(fmt.Sprintf("%s[%d]", path, i), got.Index(i), want.Index(i), orig.Index(i))
		}
	case reflect.Struct:
		switch got.Type() {
		case nodeType:
			c.checkNode(path, got.Interface().(Node), want.Interface().(Node), orig.Interface().(Node))
			return
		case parsedNodeType:
			g, w := got.Interface().(ParsedNode), want.Interface().(ParsedNode)
			if g.Pos != w.Pos || g.EndPos != w.EndPos {
				c.errorf(path, "positions %v–%v, the reference's %v–%v", g.Pos, g.EndPos, w.Pos, w.EndPos)
			}
			c.checkString(path+".Pos.Filename", g.Pos.Filename, w.Pos.Filename, orig.Interface().(ParsedNode).Pos.Filename)
			c.checkNode(path, g.Node, w.Node, orig.Interface().(ParsedNode).Node)
			return
		}
		for i := range got.NumField() {
			c.compare(path+"."+got.Type().Field(i).Name, got.Field(i), want.Field(i), orig.Field(i))
		}
	case reflect.String:
		c.checkString(path, got.String(), want.String(), orig.String())
	default:
		if !got.CanInterface() { // a statement's lineage
			got, want = exposed(got), exposed(want)
		}
		if !reflect.DeepEqual(got.Interface(), want.Interface()) {
			c.errorf(path, "%v, the reference has %v", got.Interface(), want.Interface())
		}
	}
}

// moveInput is one text whose statements the tests move.
type moveInput struct {
	name string
	src  []byte
}

// moveInputs are the texts the mover is checked on: every file under the
// testdata of lang and network (fuzz corpus entries decoded), the shipped
// examples, generated networks of both shapes, and hand-written statements
// with syntax errors, CRLF line ends, a byte order mark and names outside
// ASCII.
func moveInputs(t testing.TB) []moveInput {
	t.Helper()
	var ins []moveInput
	for _, dir := range []string{"testdata", "../network/testdata", "../examples"} {
		err := filepath.WalkDir(dir, func(path string, d fs.DirEntry, err error) error {
			if err != nil || d.IsDir() {
				return err
			}
			b, err := os.ReadFile(path)
			if err != nil {
				return err
			}
			if bytes.HasPrefix(b, []byte("go test fuzz v1\n")) {
				for _, v := range corpusValues(b) {
					ins = append(ins, moveInput{path, v})
				}
				return nil
			}
			ins = append(ins, moveInput{path, b})
			return nil
		})
		if err != nil {
			t.Fatal(err)
		}
	}
	for _, c := range []synth.Config{
		{Shape: synth.Spread, Seed: 3, Species: 120, Reactions: 300, OwnData: 60, Files: 3},
		{Shape: synth.Mechanism, Seed: 3, Species: 200, Reactions: 300, OwnData: 40},
	} {
		g, err := synth.Generate(c)
		if err != nil {
			t.Fatal(err)
		}
		for _, name := range g.Names {
			ins = append(ins, moveInput{fmt.Sprintf("%v/%s", c.Shape, name), g.Files[name]})
		}
	}
	gen, _ := generateNetwork(16 << 10)
	ins = append(ins, moveInput{"generateNetwork", gen})
	for i, s := range handMoveInputs {
		ins = append(ins, moveInput{fmt.Sprintf("hand-%d", i), []byte(s)})
	}
	// Every text again with CRLF line ends, and with a byte order mark.
	n := len(ins)
	for _, in := range ins[:n] {
		ins = append(ins,
			moveInput{in.name + "+crlf", bytes.ReplaceAll(in.src, []byte("\n"), []byte("\r\n"))},
			moveInput{in.name + "+bom", append([]byte("\ufeff"), in.src...)})
	}
	return ins
}

// corpusValues are the []byte values of a Go fuzz corpus file.
func corpusValues(b []byte) [][]byte {
	var vs [][]byte
	sc := bufio.NewScanner(bytes.NewReader(b))
	sc.Buffer(nil, 1<<20)
	for sc.Scan() {
		line := sc.Text()
		if s, ok := strings.CutPrefix(line, "[]byte("); ok {
			if v, err := strconv.Unquote(strings.TrimSuffix(s, ")")); err == nil {
				vs = append(vs, []byte(v))
			}
		}
	}
	return vs
}

var handMoveInputs = []string{
	`include "lib/gases.hess"
include "
settings {
  pressure 1 bar
  standard-pressure 1 atm
  temperatures 298.15 K, 500 K to 1500 K by 100 K, 2000
  tolerance 0.5 kJ/mol
  lint unbalanced error
  activity davies
}
settings { pressure }
element Xq { mass 12.5 g/mol }
element Yq { }
phase aq { convention molality }
phase melt {}
species Δ-Ölsäure(l) "Ölsäure ± data" {
  formula C18H34O2
  hf -802.1 ± 2.5 kJ/mol
  gf -
  s 550 J/mol/K
  cp 600
  size 4.5e-10 m
  shomate 298 K to 1200 K { 30.1 6.83 6.79 -2.53 0.082 -250.9 223.4 -241.8 }
  nasa7 200 K to 1000 K { 1 2 3 4 5 6 7 }
  source "invented for a test"
  note "ünïcödé note"
}
species A(g), B(g), C(aq), D+(aq), E-(aq)
species F(g) {
reaction r1: A(g) + 2 B(g) <-> C(aq) = r0 - 1/2 r2 + 3 r3 {
  dg -10 ± 1 kJ/mol
  dh 5 kJ/mol
  ds 0.1 kJ/mol/K
  logk 3.5 ± 0.1 at 350 K
  rate A 1e13 cm3/mol/s n -0.5 Ea 80 kJ/mol
  reverse A 1e12 n 0 Ea 20 kJ/mol
  source "a"
  note "b"
}
reaction r2: A(g) → B(g)
reaction r3: A(g) ⇌ 2 B(g) {
reaction r4 A(g) -> 
reaction : <->
reaction r5: = r1 +
mixture feed {
  temperature 900 K
  pressure 20 bar
  CH4(g) 0.2
  H2O(g) 0.6 mol
  H2(g) 2 bar fixed
  CO2(g)
}
mixture broken { temperature }
species
}}} {{{ ± ± 
`,
	"species Ω(g) { hf 1 kJ/mol }\r\nreaction ρ: Ω(g) <-> 2 Ψ(g)\r\n",
	"\ufeffspecies A(g) { hf 1 kJ/mol }\nreaction r: A(g) <-> B(g) { dg 1 kJ/mol",
	"reaction r: 1/2 A(g) + 0.5e-3 B(g) -> C(g) { rate A 1 n 2 Ea 3 }\nreaction s: A(g) <->\n",
}

// moveShifts are the edits in front of a text whose statements the tests
// move: an insertion (a longer text) and a deletion.
var moveShifts = []struct {
	name     string
	old, new string // prefixes of the old and the new text
}{
	{"inserted", "", "# an inserted line, ünïcode\n  "},
	{"deleted", "species Zz(g)\r\n# Δ\n", ""},
	{"same place", "", ""},
}

// moveAll moves every statement of each input with moved and with
// reflectMoved and compares them; it returns how many statements it moved.
func moveAll(t *testing.T, in moveInput) int {
	n := 0
	for _, sh := range moveShifts {
		oldText := sh.old + string(in.src)
		newText := sh.new + string(in.src)
		f, _ := Parse(in.name, []byte(oldText))
		src := NewSource(in.name, newText)
		oldText = f.Source.Text()
		dOff := len(sh.new) - len(sh.old)
		for i, st := range f.Statements {
			first, ok := st.at()
			if !ok {
				continue
			}
			at := int(first.Offset) + dOff
			if at < 0 {
				continue // the statement was deleted
			}
			got, want := moved(st, src, at), reflectMoved(st, src, at)
			if !checkMoved(t, fmt.Sprintf("%s %s statement %d (%v)", in.name, sh.name, i, st.Position()), st, got, want, oldText, newText, src) {
				return n
			}
			n++
		}
	}
	return n
}

// TestMovedMatchesReflectiveCopy moves every statement of many texts and
// requires the hand-written copy to equal the reflective reference.
func TestMovedMatchesReflectiveCopy(t *testing.T) {
	ins := moveInputs(t)
	total, broken := 0, 0
	for _, in := range ins {
		total += moveAll(t, in)
		f, _ := Parse(in.name, in.src)
		for _, st := range f.Statements {
			if st.Broken {
				broken++
			}
		}
		if t.Failed() {
			return
		}
	}
	if total < 5000 || broken < 50 {
		t.Fatalf("moved %d statements of %d texts holding %d broken ones: too few to mean anything", total, len(ins), broken)
	}
	t.Logf("moved %d statements (each text's three times) of %d texts holding %d broken ones", total, len(ins), broken)
}

// TestMovedCoversEveryField moves statements in which every field of every
// node type reachable from Statement is set (filled by reflection, so a
// field or type added to the tree is set too), each to a value of its own,
// and requires the copy to equal the reflective reference: a field the
// hand-written mover does not copy, or copies from the wrong place, fails.
func TestMovedCoversEveryField(t *testing.T) {
	var b strings.Builder
	for i := 0; b.Len() < 8000; i++ {
		fmt.Fprintf(&b, "w%03d ü%d\n", i%1000, i%7)
	}
	oldText := b.String()
	for _, v := range []fillVariant{
		{},
		{emptyLists: true},
		{nilInLists: true},
		{foreignStrings: true, foreignNodes: true},
		{zeroPositions: true},
	} {
		t.Run(fmt.Sprintf("%+v", v), func(t *testing.T) {
			for _, shift := range []int{0, 7, -5} {
				old := oldText
				var newText string
				if shift >= 0 {
					newText = strings.Repeat("é", shift)[:shift] + old
				} else {
					newText = old[-shift:]
				}
				oldSrc := NewSource("old.hess", old)
				g := &tokenGroup{src: oldSrc}
				for off := 0; off+3 <= len(old); off += 4 {
					g.toks = append(g.toks, Token{Value: old[off : off+3], Offset: int32(off), Type: Word, FirstOnLine: off%3 == 0})
				}
				fl := &filler{t: t, v: v, g: g, text: old, first: 10, last: len(g.toks) - 10, other: &tokenGroup{src: oldSrc, toks: g.toks}}
				st := &Statement{}
				fl.fill(reflect.ValueOf(st).Elem(), "Statement", 0)
				st.Node = Node{g: g, start: int32(fl.first), end: int32(fl.last)}
				src := NewSource("new.hess", newText)
				at := int(g.toks[fl.first].Offset) + shift
				got, want := moved(st, src, at), reflectMoved(st, src, at)
				if !checkMoved(t, fmt.Sprintf("shift %d", shift), st, got, want, old, newText, src) {
					return
				}
				if fl.strings < 10 || fl.nodes < 20 {
					t.Fatalf("filled %d strings and %d nodes: the filler did not reach the tree", fl.strings, fl.nodes)
				}
			}
		})
	}
}

// fillVariant chooses how filler sets a tree's fields.
type fillVariant struct {
	emptyLists     bool // lists empty but not nil
	nilInLists     bool // every other list element nil
	foreignStrings bool // every other string not a slice of the text
	foreignNodes   bool // every third node on another group
	zeroPositions  bool // every other position unknown (line 0)
}

// filler sets every field of a tree by reflection, each to a value of its
// own: nodes on g (runs of its tokens first to last), strings slices of
// text, positions within it.
type filler struct {
	t              *testing.T
	v              fillVariant
	g, other       *tokenGroup
	text           string
	first, last    int
	n              int // values handed out so far
	strings, nodes int
}

func (fl *filler) node() Node {
	fl.n++
	fl.nodes++
	span := fl.last - fl.first
	start := fl.first + (fl.n*7)%span
	end := min(start+fl.n%4, fl.last)
	if fl.v.foreignNodes && fl.n%3 == 0 {
		return Node{g: fl.other, start: int32(start), end: int32(end)}
	}
	return Node{g: fl.g, start: int32(start), end: int32(end)}
}

func (fl *filler) pos() lexer.Position {
	fl.n++
	if fl.v.zeroPositions && fl.n%2 == 0 {
		return lexer.Position{Filename: "old.hess", Offset: fl.n, Column: 3}
	}
	off := 40 + (fl.n*13)%(len(fl.text)-80)
	p := fl.g.src.position(off)
	p.Filename = fl.g.src.Name()
	return p
}

func (fl *filler) str() string {
	fl.n++
	fl.strings++
	if fl.v.foreignStrings && fl.n%2 == 0 {
		return fmt.Sprintf("foreign %d", fl.n)
	}
	off := 40 + (fl.n*11)%(len(fl.text)-80)
	return fl.text[off : off+1+fl.n%9]
}

func (fl *filler) fill(v reflect.Value, path string, depth int) {
	if depth > 20 {
		fl.t.Fatalf("%s: the syntax tree nests deeper than 20: a cycle of types?", path)
	}
	switch v.Type() {
	case nodeType:
		v.Set(reflect.ValueOf(fl.node()))
		return
	case parsedNodeType:
		v.Set(reflect.ValueOf(ParsedNode{Pos: fl.pos(), EndPos: fl.pos(), Node: fl.node()}))
		return
	}
	switch v.Kind() {
	case reflect.Struct:
		for i := range v.NumField() {
			f := v.Type().Field(i)
			if f.Name == "lineage" && f.Type.Kind() == reflect.Uint64 {
				fl.n++
				exposed(v.Field(i)).SetUint(uint64(fl.n))
				continue
			}
			if !f.IsExported() && f.Type != nodeType && f.Type != parsedNodeType {
				fl.t.Fatalf("%s.%s is unexported: teach the filler and the mover about it", path, f.Name)
			}
			fl.fill(v.Field(i), path+"."+f.Name, depth+1)
		}
	case reflect.Pointer:
		p := reflect.New(v.Type().Elem())
		fl.fill(p.Elem(), path, depth+1)
		v.Set(p)
	case reflect.Slice:
		if v.Type().Elem().Kind() != reflect.Pointer {
			fl.t.Fatalf("%s is a list of %v, not of nodes: teach the filler and the mover about it", path, v.Type().Elem())
		}
		if fl.v.emptyLists {
			v.Set(reflect.MakeSlice(v.Type(), 0, 0))
			return
		}
		s := reflect.MakeSlice(v.Type(), 3, 3)
		for i := range 3 {
			if fl.v.nilInLists && i%2 == 1 {
				continue
			}
			fl.fill(s.Index(i), fmt.Sprintf("%s[%d]", path, i), depth+1)
		}
		v.Set(s)
	case reflect.String:
		v.SetString(fl.str())
	case reflect.Bool:
		fl.n++
		v.SetBool(fl.n%2 == 0 || !fl.v.emptyLists)
	default:
		fl.t.Fatalf("%s is a %v: teach the filler and the mover about it", path, v.Kind())
	}
}

// FuzzMoved moves every statement of a parsed input by a few bytes with
// moved and with the reflective reference, and requires the same copies.
func FuzzMoved(f *testing.F) {
	for _, s := range handMoveInputs {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, src []byte) {
		moveAll(t, moveInput{"f.hess", src})
	})
}

// BenchmarkMoveStatements moves every statement of a generated mechanism
// of 10 000 species by a few bytes, as an insertion near the top of the
// file makes the statement cache do: "moved" is the hand-written mover,
// "reflective" the reference it replaced.
func BenchmarkMoveStatements(b *testing.B) {
	g, err := synth.Generate(synth.Config{Shape: synth.Mechanism, Seed: 1, Species: 10000, Reactions: 5000, OwnData: 500})
	if err != nil {
		b.Fatal(err)
	}
	text := g.Files[g.Root]
	f, diags := Parse(g.Root, text)
	if len(diags) != 0 {
		b.Fatal(diags[0])
	}
	const shift = "# a new line\n"
	src := NewSource(g.Root, shift+string(text))
	for _, c := range []struct {
		name string
		move func(*Statement, *Source, int) *Statement
	}{
		{"moved", moved},
		{"reflective", reflectMoved},
	} {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			start, _ := processCPU()
			for b.Loop() {
				for _, st := range f.Statements {
					first, _ := st.at()
					if c.move(st, src, int(first.Offset)+len(shift)) == nil {
						b.Fatal("nil statement")
					}
				}
			}
			reportCPU(b, start)
			b.ReportMetric(float64(len(f.Statements)), "statements")
		})
	}
}

// exposed is the unexported field v (addressable) as a value reflection
// may read and set.
func exposed(v reflect.Value) reflect.Value {
	return reflect.NewAt(v.Type(), unsafe.Pointer(v.UnsafeAddr())).Elem()
}
