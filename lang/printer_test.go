package lang

import (
	"bytes"
	"fmt"
	"io/fs"
	"os"
	"path/filepath"
	"sort"
	"strings"
	"testing"
)

// commentTexts returns the sorted texts of a file's comments.
func commentTexts(f *File) []string {
	out := make([]string, len(f.Comments))
	for i, c := range f.Comments {
		out[i] = c.Text
	}
	sort.Strings(out)
	return out
}

// checkFormatted checks the formatter's promises for one source file: the
// output parses without errors, formatting it again changes nothing, and
// every comment is kept exactly as often as it was written. It returns the
// output.
func checkFormatted(t *testing.T, name string, src []byte) []byte {
	t.Helper()
	f, diags := Parse(name, src)
	if diags.HasErrors() {
		t.Fatalf("%s does not parse:\n%s", name, diagList(diags))
	}
	out := Format(f)
	g, diags := Parse(name, out)
	if len(diags) != 0 {
		t.Fatalf("formatted %s does not parse:\n%s\n%s", name, diagList(diags), out)
	}
	if again := Format(g); !bytes.Equal(again, out) {
		t.Errorf("formatting %s is not idempotent\n--- once ---\n%s\n--- twice ---\n%s", name, out, again)
	}
	if got, want := commentTexts(g), commentTexts(f); fmt.Sprintf("%q", got) != fmt.Sprintf("%q", want) {
		t.Errorf("%s: comments changed\n got  %q\n want %q", name, got, want)
	}
	if len(g.Statements) != len(f.Statements) {
		t.Errorf("%s: %d statements after formatting, %d before", name, len(g.Statements), len(f.Statements))
	}
	return out
}

func TestFormatGolden(t *testing.T) {
	inputs, err := filepath.Glob(filepath.Join("testdata", "format", "*.hess"))
	if err != nil || len(inputs) == 0 {
		t.Fatalf("no format inputs: %v", err)
	}
	for _, in := range inputs {
		name := strings.TrimSuffix(filepath.Base(in), ".hess")
		t.Run(name, func(t *testing.T) {
			src, err := os.ReadFile(in)
			if err != nil {
				t.Fatal(err)
			}
			out := checkFormatted(t, in, src)
			golden := strings.TrimSuffix(in, ".hess") + ".golden"
			checkGolden(t, golden, out)
			// The golden file itself is canonical.
			if want, err := os.ReadFile(golden); err == nil {
				if again, diags := FormatSource(golden, want); !bytes.Equal(again, want) {
					t.Errorf("formatting %s changes it (diagnostics: %v)", golden, diags)
				}
			}
			if bytes.Contains(out, []byte("\r")) || bytes.Contains(out, []byte("\t")) {
				t.Errorf("output keeps CR or tab characters")
			}
			if len(out) > 0 && !bytes.HasSuffix(out, []byte("\n")) {
				t.Errorf("output does not end with a newline")
			}
			if bytes.Contains(out, []byte("\n\n\n")) || bytes.HasPrefix(out, []byte("\n")) {
				t.Errorf("output has a run of blank lines or starts with one")
			}
		})
	}
}

func TestFormatCanonicalUnchanged(t *testing.T) {
	src, err := os.ReadFile(filepath.Join("testdata", "format", "canonical.hess"))
	if err != nil {
		t.Fatal(err)
	}
	out, diags := FormatSource("canonical.hess", src)
	if diags.HasErrors() || !bytes.Equal(out, src) {
		t.Errorf("canonical input changed:\n%s", out)
	}
}

func TestFormatCases(t *testing.T) {
	tests := []struct {
		name string
		src  string
		want string
	}{
		{"arrows", "reaction a: A(g) ⇌ B(g)\nreaction b: A(g) → B(g)\n",
			"reaction a: A(g) <-> B(g)\nreaction b: A(g) -> B(g)\n"},
		{"uncertainty", "species X(g) { hf 1 +- 0.5 kJ/mol gf 2±0.1 kJ/mol }\n",
			"species X(g) {\n  hf 1 ± 0.5 kJ/mol\n  gf 2 ± 0.1 kJ/mol\n}\n"},
		{"charges", "species Fe++(aq), SO4--(aq), Na^1+(aq), Cl^1-(aq), PO4^3-(aq), e-\n",
			"species Fe^2+(aq), SO4^2-(aq), Na+(aq), Cl-(aq), PO4^3-(aq), e-\n"},
		{"charge in reactions and mixtures", "reaction r: Fe+++(aq) + e- -> Fe++(aq)\nmixture m { Fe++(aq) 1 mol/kg }\n",
			"reaction r: Fe^3+(aq) + e- -> Fe^2+(aq)\nmixture m {\n  Fe^2+(aq) 1 mol/kg\n}\n"},
		{"glued coefficient", "reaction r: 2H2(g) + O2(g) -> 2H2O(g)\n",
			"reaction r: 2 H2(g) + O2(g) -> 2 H2O(g)\n"},
		{"combination", "reaction r: A -> B = a  +  x - 2  b\n", "reaction r: A -> B = a + x - 2 b\n"},
		{"leading minus", "reaction r: A -> B = - a + b\n", "reaction r: A -> B = - a + b\n"},
		{"numbers and units as written", "species X(g) { hf -7.4870E+01 kJ/mol cp 35.70 J/(mol*K) }\n",
			"species X(g) {\n  hf -7.4870E+01 kJ/mol\n  cp 35.70 J/(mol*K)\n}\n"},
		{"blank-line runs", "\n\n\nspecies A(g)\n\n\n\nspecies B(g)\nspecies C(g)\n\n\n",
			"species A(g)\n\nspecies B(g)\nspecies C(g)\n"},
		{"blank lines inside blocks", "species A(g) {\n\n  hf 1 kJ/mol\n\n\n  s 2 J/mol/K\n\n}\n",
			"species A(g) {\n  hf 1 kJ/mol\n\n  s 2 J/mol/K\n}\n"},
		{"empty blocks", "settings {\n}\nelement D { }\nphase p {}\nmixture m {\n\n}\nspecies X(g) {}\nreaction r: A -> B {}\n",
			"settings {}\nelement D {}\nphase p {}\nmixture m {}\nspecies X(g) {}\nreaction r: A -> B {}\n"},
		{"one line per statement", "species A(g) species B(g) reaction r: A(g) -> B(g)",
			"species A(g)\nspecies B(g)\nreaction r: A(g) -> B(g)\n"},
		{"multi-line reaction joins", "reaction r:\n  A(g)\n  + B(g)\n  <->\n  C(g)\n",
			"reaction r: A(g) + B(g) <-> C(g)\n"},
		{"settings list", "settings { temperatures 300K,400 K to 600K by 100K , 900 K }",
			"settings {\n  temperatures 300 K, 400 K to 600 K by 100 K, 900 K\n}\n"},
		{"logk and rates", "reaction r: A -> B { logk 3 +- 0.2 at 500 K rate A 1e13 1/s Ea 100 kJ/mol reverse A 2 1/s n 1.5 Ea 3 kJ/mol }",
			"reaction r: A -> B {\n  logk 3 ± 0.2 at 500 K\n  rate A 1e13 1/s Ea 100 kJ/mol\n  reverse A 2 1/s n 1.5 Ea 3 kJ/mol\n}\n"},
		{"polynomial lines", "species X(g) { nasa7 1 K to 2 K { 1 2 3 4 5 6 7 } shomate 2 K to 3 K { } }",
			"species X(g) {\n  nasa7 1 K to 2 K {\n    1 2 3 4\n    5 6 7\n  }\n  shomate 2 K to 3 K {}\n}\n"},
		{"strings as written", `species X(g) "a \"label\"" { source "x\\y" note "ΔfH°" }`,
			"species X(g) \"a \\\"label\\\"\" {\n  source \"x\\\\y\"\n  note \"ΔfH°\"\n}\n"},
		{"trailing comment stays", "species A(g)   # a\nspecies B(g)#b\n",
			"species A(g)  # a\nspecies B(g)  #b\n"},
		{"comment follows the item it trails", "mixture m { temperature 300 K pressure 1 bar # p\n}\n",
			"mixture m {\n  temperature 300 K\n  pressure 1 bar  # p\n}\n"},
		{"comment inside a line moves before it", "reaction r: A(g) + # x\n B(g) -> C(g)\n",
			"# x\nreaction r: A(g) + B(g) -> C(g)\n"},
		{"comment in an empty block", "species X(g) { # c\n}\n", "species X(g) {  # c\n}\n"},
		{"comment keeps spacing inside", "#   spaced   out  \n", "#   spaced   out  \n"},
		{"comment at end without newline", "species A(g)\n# end", "species A(g)\n# end\n"},
		{"CRLF", "species A(g) {\r\n  hf 1 kJ/mol  # c\r\n}\r\n\r\n\r\nspecies B(g)\r\n",
			"species A(g) {\n  hf 1 kJ/mol  # c\n}\n\nspecies B(g)\n"},
		{"tabs", "species A(g) {\n\thf\t1\tkJ/mol\n}\n", "species A(g) {\n  hf 1 kJ/mol\n}\n"},
		{"byte order mark dropped", "\ufeff# c\nspecies A(g)\n", "# c\nspecies A(g)\n"},
		{"empty file", "", ""},
		{"only white space", " \n\t\r\n", ""},
		{"only comments", "\n# a\n\n\n# b\n", "# a\n\n# b\n"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			out := checkFormatted(t, "t.hess", []byte(tc.src))
			if string(out) != tc.want {
				t.Errorf("Format(%q)\n got  %q\n want %q", tc.src, out, tc.want)
			}
		})
	}
}

func TestFormatSourceSyntaxError(t *testing.T) {
	out, diags := FormatSource("t.hess", []byte("species X(g) {\nreaction r A -> B\n"))
	if out != nil {
		t.Errorf("FormatSource returned output %q for a file with syntax errors", out)
	}
	if diags.Count(Error) != 2 {
		t.Errorf("got diagnostics:\n%s", diagList(diags))
	}
	out, diags = FormatSource("t.hess", []byte("species X(g) \"\x01\""))
	if out != nil || !diags.HasErrors() {
		t.Errorf("FormatSource accepted a lexer error: %q %v", out, diags)
	}
}

func TestFormatBrokenDoesNotPanic(t *testing.T) {
	if Format(nil) != nil || len(Format(&File{Statements: []*Statement{{}}})) != 0 {
		t.Error("Format of a nil or empty tree printed something")
	}
	srcs := []string{
		"species X(g) {\nreaction r A -> B\nmixture m { temperature }\n",
		"element D { mass }\nphase p { convention }\nsettings { temperatures 1 K to }\n",
		"hello\nspecies\nreaction\ninclude\n# c\n",
		"species X(g) { shomate 1 K to 2 K { 1 2 } hf }",
	}
	for _, src := range srcs {
		f, _ := Parse("t.hess", []byte(src))
		out := Format(f)
		for _, c := range f.Comments {
			if !bytes.Contains(out, []byte(c.Text)) {
				t.Errorf("Format of a broken file dropped comment %q", c.Text)
			}
		}
	}
}

// TestFormatCorpus formats every example and test data file of the module
// twice and checks that the second pass changes nothing and that comments
// are kept. Files with syntax errors are skipped.
func TestFormatCorpus(t *testing.T) {
	root := moduleRoot(t)
	n := 0
	for _, dir := range []string{"examples", "testdata"} {
		base := filepath.Join(root, dir)
		if _, err := os.Stat(base); err != nil {
			continue
		}
		err := filepath.WalkDir(base, func(path string, d fs.DirEntry, err error) error {
			if err != nil {
				return err
			}
			if d.IsDir() || !strings.HasSuffix(path, ".hess") {
				return nil
			}
			src, err := os.ReadFile(path)
			if err != nil {
				return err
			}
			if _, diags := Parse(path, src); diags.HasErrors() {
				return nil
			}
			n++
			rel, _ := filepath.Rel(root, path)
			t.Run(rel, func(t *testing.T) { checkFormatted(t, path, src) })
			return nil
		})
		if err != nil {
			t.Fatalf("walk %s: %v", base, err)
		}
	}
	t.Logf("formatted %d corpus files", n)
}
