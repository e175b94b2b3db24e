package main

import (
	"os"
	"path/filepath"
	"regexp"
	"runtime/debug"
	"strings"
	"testing"
)

func TestBuildVersion(t *testing.T) {
	settings := func(kv ...string) []debug.BuildSetting {
		var out []debug.BuildSetting
		for i := 0; i+1 < len(kv); i += 2 {
			out = append(out, debug.BuildSetting{Key: kv[i], Value: kv[i+1]})
		}
		return out
	}
	for _, tc := range []struct {
		name string
		info *debug.BuildInfo
		want string
	}{
		{"no information", nil, "devel"},
		{"module version", &debug.BuildInfo{Main: debug.Module{Version: "v1.4.0"}}, "v1.4.0"},
		{"module version wins", &debug.BuildInfo{Main: debug.Module{Version: "v1.4.0"},
			Settings: settings("vcs.revision", "0123456789abcdef0123")}, "v1.4.0"},
		{"revision", &debug.BuildInfo{Main: debug.Module{Version: "(devel)"},
			Settings: settings("vcs.revision", "0123456789abcdef0123", "vcs.modified", "false")}, "0123456789ab"},
		{"modified", &debug.BuildInfo{Main: debug.Module{Version: "(devel)"},
			Settings: settings("vcs.revision", "0123456789abcdef0123", "vcs.modified", "true")}, "0123456789ab+modified"},
		{"nothing recorded", &debug.BuildInfo{Main: debug.Module{Version: "(devel)"}}, "devel"},
	} {
		if got := buildVersion(tc.info); got != tc.want {
			t.Errorf("%s: buildVersion = %q, want %q", tc.name, got, tc.want)
		}
	}
}

// TestVersionFlags: --version and -version answer as `hess version` does,
// with a version from the build rather than a fixed string.
func TestVersionFlags(t *testing.T) {
	want := runHess(t, "version")
	if want.code != 0 {
		t.Fatalf("hess version: exit %d", want.code)
	}
	if strings.Contains(want.stdout, "0.1.0-dev") {
		t.Errorf("version is the old fixed string: %s", want.stdout)
	}
	if !regexp.MustCompile(`^hess (devel|v\S+|[0-9a-f]{12}(\+modified)?) \(module hess\)\n$`).MatchString(want.stdout) {
		t.Errorf("version line %q", want.stdout)
	}
	for _, flag := range []string{"--version", "-version"} {
		r := runHess(t, flag)
		if r.code != 0 || r.stdout != want.stdout {
			t.Errorf("hess %s: exit %d, %q; want 0, %q (stderr %q)", flag, r.code, r.stdout, want.stdout, r.stderr)
		}
	}
}

// TestHelpCommand: `hess help COMMAND` prints that command's help, with
// its flags spelt as the synopsis spells them.
func TestHelpCommand(t *testing.T) {
	for _, c := range commands() {
		r := runHess(t, "help", c.name)
		if r.code != 0 {
			t.Errorf("help %s: exit %d: %s", c.name, r.code, r.stderr)
			continue
		}
		if !strings.HasPrefix(r.stdout, "usage: hess "+c.name) {
			t.Errorf("help %s printed:\n%s", c.name, r.stdout)
		}
		for _, line := range strings.Split(r.stdout, "\n") {
			// A flag line starts with two spaces and a dash; a name of
			// more than one letter takes two dashes.
			if m := regexp.MustCompile(`^  (-+)(\w[\w-]*)`).FindStringSubmatch(line); m != nil {
				if want := map[bool]string{true: "-", false: "--"}[len(m[2]) == 1]; m[1] != want {
					t.Errorf("help %s: flag line %q, want %s%s", c.name, line, want, m[2])
				}
			}
		}
	}
	if r := runHess(t, "help", "help"); r.code != 0 || !strings.Contains(r.stdout, "usage: hess COMMAND") {
		t.Errorf("help help: exit %d, %q", r.code, r.stdout)
	}
	r := runHess(t, "help", "table")
	for _, want := range []string{"--format text|csv|json|markdown", "--reaction NAME", "-o FILE", "--temperatures LIST"} {
		if !strings.Contains(r.stdout, want) {
			t.Errorf("help table lacks %q:\n%s", want, r.stdout)
		}
	}
}

func TestNearMissCommands(t *testing.T) {
	for _, tc := range []struct {
		args []string
		want string
	}{
		{[]string{"tabel", "x.hess"}, `unknown command "tabel"; did you mean "table"?`},
		{[]string{"chekc"}, `did you mean "check"?`},
		{[]string{"help", "aproach"}, `did you mean "approach"?`},
		{[]string{"explain", "element-imbalnce"}, `did you mean "element-imbalance"?`},
	} {
		r := runHess(t, tc.args...)
		if r.code != exitTrouble || !strings.Contains(r.stderr, tc.want) {
			t.Errorf("hess %v: exit %d, stderr %q; want 2 and %q", tc.args, r.code, r.stderr, tc.want)
		}
	}
	r := runHess(t, "frobnicate")
	if strings.Contains(r.stderr, "did you mean") {
		t.Errorf("a name far from every command got a suggestion: %s", r.stderr)
	}
}

// TestStdin: "-" is standard input for fmt and check, named <stdin>, with
// includes relative to the working folder.
func TestStdin(t *testing.T) {
	r := runHessInput(t, "species   CO(g)  {hf -110.5 kJ/mol}\n", "fmt", "-")
	if r.code != 0 || r.stdout != "species CO(g) {\n  hf -110.5 kJ/mol\n}\n" {
		t.Errorf("fmt -: exit %d, %q, %s", r.code, r.stdout, r.stderr)
	}
	r = runHessInput(t, "species CO(g)\nreaction r: CO(g) <->\n", "fmt", "-")
	if r.code != 1 || !strings.Contains(r.stderr, "<stdin>:2:") {
		t.Errorf("fmt - with an error: exit %d, stderr %q", r.code, r.stderr)
	}
	r = runHessInput(t, "species X(g)\n", "fmt", "--check", "-")
	if r.code != 0 || r.stdout != "" {
		t.Errorf("fmt --check - (formatted): exit %d, %q", r.code, r.stdout)
	}
	r = runHessInput(t, "species  X(g)\n", "fmt", "--check", "-")
	if r.code != 1 || r.stdout != "<stdin>\n" {
		t.Errorf("fmt --check - (unformatted): exit %d, %q", r.code, r.stdout)
	}
	r = runHessInput(t, "x\n", "fmt", "-w", "-")
	if r.code != 2 {
		t.Errorf("fmt -w -: exit %d, want 2", r.code)
	}

	// check -: the examples folder is below the working folder of the
	// binary (the repository root), so an include of an example resolves.
	root, err := filepath.Abs(filepath.Join("..", ".."))
	if err != nil {
		t.Fatal(err)
	}
	if _, err := os.Stat(filepath.Join(root, "testdata", "check", "clean.hess")); err != nil {
		t.Skip("no testdata/check/clean.hess")
	}
	r = runHessInput(t, "include \"testdata/check/clean.hess\"\nreaction extra: Q9(g) <-> Q9(g)\n", "check", "-")
	if r.code != 1 || !strings.Contains(r.stdout, "<stdin>:2:") {
		t.Errorf("check -: exit %d\nstdout %s\nstderr %s", r.code, r.stdout, r.stderr)
	}
	if strings.Contains(r.stdout, "include-missing") {
		t.Errorf("check -: the include did not resolve against the working folder:\n%s", r.stdout)
	}
}

func TestNearMissNames(t *testing.T) {
	for _, tc := range []struct {
		args []string
		want string
	}{
		{[]string{"table", "--reaction", "so2-absorbs", "examples/flue-gas-scrubber.hess"}, `no reaction named "so2-absorbs"; did you mean "so2-absorb"?`},
		{[]string{"plot", "--reaction", "so2-absrob", "-o", "/dev/null.svg", "examples/flue-gas-scrubber.hess"}, `did you mean "so2-absorb"?`},
	} {
		r := runHess(t, tc.args...)
		if r.code == 0 || !strings.Contains(r.stderr, tc.want) {
			t.Errorf("hess %v: exit %d, stderr %q; want %q", tc.args, r.code, r.stderr, tc.want)
		}
	}
}

func TestNearMissMixture(t *testing.T) {
	r := runHess(t, "approach", "--mixture", "smup", "examples/flue-gas-scrubber.hess")
	if r.code != exitTrouble || !strings.Contains(r.stderr, `did you mean "sump"?`) {
		t.Errorf("approach --mixture smup: exit %d, stderr %q", r.code, r.stderr)
	}
}

// TestFlagErrors: flag errors spell the flags as the help does and
// suggest the nearest flag.
func TestFlagErrors(t *testing.T) {
	for _, tc := range []struct {
		args []string
		want string
	}{
		{[]string{"check", "--stric", "x.hess"}, "hess check: unknown flag --stric; did you mean --strict?"},
		{[]string{"check", "--format", "xml", "x.hess"}, `invalid value "xml" for flag --format: must be one of text, json, sarif`},
		{[]string{"check", "--strict=maybe", "x.hess"}, `invalid boolean value "maybe" for --strict: takes true or false`},
		{[]string{"table", "-o"}, "flag needs an argument: -o"},
	} {
		r := runHess(t, tc.args...)
		if r.code != exitTrouble || !strings.HasPrefix(r.stderr, "hess ") || !strings.Contains(r.stderr, tc.want) {
			t.Errorf("hess %v: exit %d, stderr %q; want 2 and %q", tc.args, r.code, r.stderr, tc.want)
		}
		if regexp.MustCompile(`(^| )-[a-z]{2,}`).MatchString(strings.SplitN(r.stderr, "\n", 2)[0]) {
			t.Errorf("hess %v: a long flag with one dash: %q", tc.args, r.stderr)
		}
	}
}
