//go:build linux

package main

import (
	"bytes"
	"context"
	"errors"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

// Limits every hostile input must end within: the CPU time and the peak
// resident memory of the process. CPU time rather than the wall clock, so
// that a loaded two-core CI machine does not fail a fast run; a run still
// going at hostileDeadline is a hang and is killed.
const (
	hostileCPU      = 2 * time.Second
	hostileRSSBytes = 200 << 20
	hostileDeadline = 20 * time.Second
)

// bounded is one run of the built binary with its resource use.
type bounded struct {
	stdout, stderr string
	code           int
	cpu            time.Duration
	rss            int64 // peak resident set, bytes
}

// runBounded runs the built binary in dir with stdin and, when stdoutPath
// is set, standard output going to that file; it fails the test on a hang,
// on more than hostileCPU of CPU time or hostileRSSBytes of peak memory.
func runBounded(t *testing.T, dir, stdin, stdoutPath string, args ...string) bounded {
	t.Helper()
	ctx, cancel := context.WithTimeout(context.Background(), hostileDeadline)
	defer cancel()
	cmd := exec.CommandContext(ctx, hessBinary(t), args...)
	cmd.Dir = dir
	cmd.Stdin = strings.NewReader(stdin)
	cmd.Env = append(os.Environ(), "NO_COLOR=1")
	var stdout, stderr bytes.Buffer
	cmd.Stdout, cmd.Stderr = &stdout, &stderr
	if stdoutPath != "" {
		f, err := os.OpenFile(stdoutPath, os.O_WRONLY, 0)
		if err != nil {
			t.Skipf("cannot open %s: %v", stdoutPath, err)
		}
		defer f.Close()
		cmd.Stdout = f
	}
	if err := cmd.Start(); err != nil {
		t.Fatalf("hess %s: %v", clipArgs(args), err)
	}
	// The peak resident set is read from the process state while it runs:
	// VmHWM is a high-water mark, so the last reading before the exit holds
	// nearly all of it. (The rusage of a child started by vfork counts the
	// parent's memory, so it cannot be used.)
	done := make(chan struct{})
	peak := make(chan int64, 1)
	go func() {
		var hwm int64
		status := fmt.Sprintf("/proc/%d/status", cmd.Process.Pid)
		tick := time.NewTicker(2 * time.Millisecond)
		defer tick.Stop()
		for {
			if v := vmHWM(status); v > hwm {
				hwm = v
			}
			select {
			case <-done:
				peak <- hwm
				return
			case <-tick.C:
			}
		}
	}()
	err := cmd.Wait()
	close(done)
	rss := <-peak
	if ctx.Err() != nil {
		t.Fatalf("hess %s: still running after %v (a hang)", strings.Join(args, " "), hostileDeadline)
	}
	var ee *exec.ExitError
	if err != nil && !errors.As(err, &ee) {
		t.Fatalf("hess %s: %v", strings.Join(args, " "), err)
	}
	r := bounded{stdout: stdout.String(), stderr: stderr.String(), code: cmd.ProcessState.ExitCode(),
		cpu: cmd.ProcessState.UserTime() + cmd.ProcessState.SystemTime()}
	r.rss = rss
	t.Logf("hess %s: exit %d, %v CPU, %.1f MB peak", clipArgs(args), r.code, r.cpu, float64(r.rss)/(1<<20))
	if r.cpu > hostileCPU {
		t.Errorf("hess %s took %v of CPU, more than %v", clipArgs(args), r.cpu, hostileCPU)
	}
	if r.rss > hostileRSSBytes {
		t.Errorf("hess %s peaked at %d MB, more than %d MB", clipArgs(args), r.rss>>20, hostileRSSBytes>>20)
	}
	return r
}

// vmHWM reads the peak resident set (bytes) from a /proc/PID/status file,
// or 0 when the process has gone.
func vmHWM(status string) int64 {
	b, err := os.ReadFile(status)
	if err != nil {
		return 0
	}
	for _, line := range strings.Split(string(b), "\n") {
		if rest, ok := strings.CutPrefix(line, "VmHWM:"); ok {
			var kb int64
			fmt.Sscanf(strings.TrimSpace(rest), "%d", &kb)
			return kb << 10
		}
	}
	return 0
}

func clipArgs(args []string) string {
	s := strings.Join(args, " ")
	if len(s) > 80 {
		s = s[:80] + "…"
	}
	return s
}

// expectRun checks a run's exit status and that its output has each of want.
func expectRun(t *testing.T, r bounded, code int, want ...string) {
	t.Helper()
	if r.code != code {
		t.Errorf("exit %d, want %d\nstdout: %.2000s\nstderr: %.2000s", r.code, code, r.stdout, r.stderr)
	}
	out := r.stdout + r.stderr
	for _, w := range want {
		if !strings.Contains(out, w) {
			t.Errorf("output lacks %q:\nstdout: %.2000s\nstderr: %.2000s", w, r.stdout, r.stderr)
		}
	}
}

func writeFile(t *testing.T, path, text string, perm os.FileMode) {
	t.Helper()
	if err := os.WriteFile(path, []byte(text), perm); err != nil {
		t.Fatal(err)
	}
}

// Hostile networks: each ends quickly, in bounded memory, with its
// diagnostic and exit status 1.
func TestHostileNetworks(t *testing.T) {
	if testing.Short() {
		t.Skip("runs the built binary")
	}
	long := strings.Repeat("species H2(g) ", 5000)
	for _, tc := range []struct {
		name, src string
		want      []string
		maxOut    int // largest acceptable report, bytes; 0 for no limit
	}{
		{"temperature list that never reaches its end", "settings { temperatures 1e308 K to 1e308 K by 1 K }\n",
			[]string{"1:25: error: temperature 1e308 K is above 1000000 K"}, 0},
		{"temperature step below float resolution", "settings { temperatures 300 K to 300 K by 1e-20 K }\n",
			[]string{"temperature step 1e-20 K: too small to tell temperatures apart"}, 0},
		{"temperature list past the cap", "settings { temperatures 300 K to 3000 K by 1e-6 K }\n",
			[]string{"would hold 2700000001 temperatures, more than 10000"}, 0},
		{"hexadecimal number", "species H2(g) { hf 0x1p3 kJ/mol }\n",
			[]string{"1:20: error: hexadecimal numbers are not part of the language"}, 0},
		{"temperature beyond the float range once converted", "settings { temperatures 1e308 K }\n",
			[]string{"temperature 1e308 K is above"}, 0},
		{"subnormal temperature", "settings { temperatures 1e-320 K }\n",
			[]string{"number 1e-320 is too small to compute with"}, 0},
		{"70 KB line with 5 000 findings", long + "\n",
			[]string{"1:69995: error: species H2(g) is declared twice [duplicate-species]", "\n    …"}, 5000 * 400},
		{"4 million words and no statement keyword", strings.Repeat("a ", 4<<20) + "\n",
			[]string{"1:1: error: expected a statement"}, 64 << 10},
		{"16 MB one-line name", "species " + strings.Repeat("Ab", 8<<20) + "(g)\n",
			[]string{"error:"}, 64 << 10},
	} {
		t.Run(tc.name, func(t *testing.T) {
			dir := t.TempDir()
			writeFile(t, filepath.Join(dir, "net.hess"), tc.src, 0o644)
			r := runBounded(t, dir, "", "", "check", "net.hess")
			expectRun(t, r, exitFindings, tc.want...)
			if tc.maxOut > 0 && len(r.stdout) > tc.maxOut {
				t.Errorf("report of %d bytes, want at most %d", len(r.stdout), tc.maxOut)
			}
		})
	}
}

// Writes land where the user meant and nowhere else.
func TestHostileWrites(t *testing.T) {
	if testing.Short() {
		t.Skip("runs the built binary")
	}
	messy := "species  H2(g)   { hf 0 kJ/mol }\n"
	t.Run("fmt -w through a link", func(t *testing.T) {
		dir := t.TempDir()
		writeFile(t, filepath.Join(dir, "real.hess"), messy, 0o600)
		os.Symlink("real.hess", filepath.Join(dir, "link.hess"))
		expectRun(t, runBounded(t, dir, "", "", "fmt", "-w", "link.hess"), exitOK)
		if info, err := os.Lstat(filepath.Join(dir, "link.hess")); err != nil || info.Mode()&os.ModeSymlink == 0 {
			t.Errorf("link.hess is no longer a link")
		}
		b, _ := os.ReadFile(filepath.Join(dir, "real.hess"))
		if string(b) == messy {
			t.Errorf("the link's target was not formatted")
		}
		if info, _ := os.Stat(filepath.Join(dir, "real.hess")); info.Mode().Perm() != 0o600 {
			t.Errorf("mode became %v", info.Mode().Perm())
		}
	})
	t.Run("fmt -w on a read-only file", func(t *testing.T) {
		dir := t.TempDir()
		writeFile(t, filepath.Join(dir, "ro.hess"), messy, 0o444)
		expectRun(t, runBounded(t, dir, "", "", "fmt", "-w", "ro.hess"), exitTrouble, "hess fmt: cannot write ro.hess: it is read-only")
		if b, _ := os.ReadFile(filepath.Join(dir, "ro.hess")); string(b) != messy {
			t.Errorf("read-only file replaced")
		}
	})
	t.Run("table -o over the network's own source", func(t *testing.T) {
		dir := t.TempDir()
		src := "species H2(g) { hf 0 kJ/mol  s 130.68 J/(mol*K)  cp 28.84 J/(mol*K) }\n" +
			"species H(g) { hf 217.998 kJ/mol  s 114.717 J/(mol*K)  cp 20.786 J/(mol*K) }\n" +
			"reaction split: H2(g) <-> 2 H(g)\n"
		writeFile(t, filepath.Join(dir, "net.hess"), src, 0o644)
		expectRun(t, runBounded(t, dir, "", "", "table", "-o", "net.hess", "net.hess"), exitTrouble, "a source file of the network")
		if b, _ := os.ReadFile(filepath.Join(dir, "net.hess")); string(b) != src {
			t.Errorf("the network's source was overwritten")
		}
		r := runBounded(t, dir, "", "", "table", "-o", "missing/t.csv", "net.hess")
		expectRun(t, r, exitTrouble, "cannot write missing/t.csv: no such file or directory")
		if strings.Contains(r.stderr, ".tmp") {
			t.Errorf("error shows a temporary name: %s", r.stderr)
		}
	})
}

// Commands whose output cannot be written exit 2 with a message.
func TestHostileFullDevice(t *testing.T) {
	if testing.Short() {
		t.Skip("runs the built binary")
	}
	for _, args := range [][]string{{"explain"}, {"explain", "syntax"}, {"version"},
		{"help"}, {"--help"}, {"help", "check"}, {"help", "help"}, {"check", "--help"}, {"plot", "-h"}} {
		r := runBounded(t, t.TempDir(), "", "/dev/full", args...)
		expectRun(t, r, exitTrouble, "no space left on device")
	}
}

// A folder with no network file below it is input trouble, not a clean run.
func TestHostileFolderRoot(t *testing.T) {
	if testing.Short() {
		t.Skip("runs the built binary")
	}
	dir := t.TempDir()
	os.Mkdir(filepath.Join(dir, "sub"), 0o755)
	expectRun(t, runBounded(t, dir, "", "", "check", "sub"), exitTrouble, "sub holds no network files (*.hess)")
	expectRun(t, runBounded(t, dir, "", "", "fmt", "--check", "sub"), exitTrouble, "sub holds no network files (*.hess)")
}

// The language server answers a negative request id with that id.
func TestHostileNegativeRequestID(t *testing.T) {
	if testing.Short() {
		t.Skip("runs the built binary")
	}
	frame := func(body string) string { return fmt.Sprintf("Content-Length: %d\r\n\r\n%s", len(body), body) }
	in := frame(`{"jsonrpc":"2.0","id":-1,"method":"initialize","params":{"capabilities":{}}}`) +
		frame(`{"jsonrpc":"2.0","id":-9223372036854775809,"method":"shutdown"}`) +
		frame(`{"jsonrpc":"2.0","method":"exit"}`)
	r := runBounded(t, t.TempDir(), in, "", "lsp")
	expectRun(t, r, exitOK, `"id":-1,`, `"id":-9223372036854775809,`)
	if strings.Contains(r.stdout, "18446744073709551615") {
		t.Errorf("id -1 answered as an unsigned number:\n%s", r.stdout)
	}
}

// The largest PNG --size and --dpi allow stays within the time and memory
// bounds; a larger one is refused before anything is drawn.
func TestHostilePlotSize(t *testing.T) {
	if testing.Short() {
		t.Skip("runs the built binary")
	}
	dir := t.TempDir()
	net, err := filepath.Abs(filepath.Join("..", "..", "examples", "hydrogen-plant", "reformer.hess"))
	if err != nil {
		t.Fatal(err)
	}
	// 34 cm at 254 dpi: 3400 px a side, 11.6 million pixels.
	expectRun(t, runBounded(t, dir, "", "", "plot", "--size", "34cmx34cm", "--dpi", "254", "-o", "big.png", net), exitOK)
	expectRun(t, runBounded(t, dir, "", "", "plot", "--size", "100cmx100cm", "--dpi", "1200", "-o", "huge.png", net),
		exitTrouble, "would have 2232 million pixels")
}

// chainNetwork is n coupled reactions, each the one before it: A(g) to
// B(g) with the given entropy of B (J/mol/K), the first from the species.
func chainNetwork(n int, sB string) string {
	var b strings.Builder
	b.WriteString("settings { temperatures 300 K, 350 K }\n")
	b.WriteString("species A(g) { formula CO hf 0 kJ/mol s 100 J/mol/K }\n")
	fmt.Fprintf(&b, "species B(g) { formula CO hf -10 kJ/mol s %s J/mol/K }\n", sB)
	b.WriteString("reaction c0: A(g) <-> B(g)\n")
	for i := 1; i <= n; i++ {
		fmt.Fprintf(&b, "reaction c%d: A(g) <-> B(g) = c%d\n", i, i-1)
	}
	return b.String()
}

// A chain of 5 000 coupled reactions, each the one before it: tables and
// a plot of its far end cost in proportion to its length (they grew with
// its square, 58 s for the table), and a plot of every reaction is
// refused as more lines than can be told apart.
func TestHostileCoupledChain(t *testing.T) {
	if testing.Short() {
		t.Skip("runs the built binary")
	}
	dir := t.TempDir()
	// ΔrS° = 0: ΔrG° keeps its sign; ΔrS° = -40 J/mol/K: K = 1 at 250 K,
	// inside the data's span, so every table searches a crossover.
	writeFile(t, filepath.Join(dir, "flat.hess"), chainNetwork(5000, "100"), 0o644)
	writeFile(t, filepath.Join(dir, "cross.hess"), chainNetwork(5000, "60"), 0o644)
	for _, net := range []string{"flat.hess", "cross.hess"} {
		t.Run(net, func(t *testing.T) {
			expectRun(t, runBounded(t, dir, "", "", "table", net), exitOK, "c5000: A(g) <-> B(g)")
			expectRun(t, runBounded(t, dir, "", "", "plot", "--reaction", "c5000", "--reaction", "c2500", "-o", "far.svg", net), exitOK)
			expectRun(t, runBounded(t, dir, "", "", "plot", "-o", "all.svg", net), exitTrouble,
				"5001 reactions are more lines than one plot tells apart (at most 56")
		})
	}
}

// Hostile feeds: each ends quickly, in bounded memory, with numbers or a
// clear refusal, never a crash.
func TestHostileFeeds(t *testing.T) {
	if testing.Short() {
		t.Skip("runs the built binary")
	}
	const gases = `species CO(g) { hf -110.527 kJ/mol s 197.653 J/mol/K }
species H2O(g) { hf -241.826 kJ/mol s 188.834 J/mol/K }
species CO2(g) { hf -393.522 kJ/mol s 213.795 J/mol/K }
species H2(g) { hf 0 kJ/mol s 130.680 J/mol/K }
reaction shift: CO(g) + H2O(g) <-> CO2(g) + H2(g)
`
	for _, tc := range []struct {
		name, src string
		args      []string
		code      int
		want      []string
	}{
		{"amounts near the float limit", gases + "mixture feed { temperature 800 K pressure 1 bar CO(g) 1e300 mol H2O(g) 1e-300 mol }\n",
			nil, exitOK, []string{"feed at 800 K"}},
		{"extreme temperature and pressure", gases + "mixture feed { temperature 800 K pressure 1 bar CO(g) 1 mol H2O(g) 1 mol }\n",
			[]string{"--temperatures", "9000 K", "--pressure", "1e9 Pa"}, exitOK, []string{"feed at 9000 K"}},
		{"sweep past the result cap", gases + "mixture feed { temperature 800 K pressure 1 bar CO(g) 1 mol H2O(g) 1 mol }\n" +
			"mixture feed2 { temperature 800 K pressure 1 bar CO(g) 1 mol H2O(g) 1 mol }\nmixture feed3 { temperature 800 K pressure 1 bar CO(g) 1 mol }\n",
			[]string{"--temperatures", "300 K to 1299.9 K by 0.1 K"}, exitTrouble, []string{"at most 20000"}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			dir := t.TempDir()
			writeFile(t, filepath.Join(dir, "net.hess"), tc.src, 0o644)
			args := append(append([]string{"equilibrium"}, tc.args...), "net.hess")
			r := runBounded(t, dir, "", "", args...)
			if r.code != tc.code {
				t.Errorf("exit %d, want %d\n%s%s", r.code, tc.code, r.stdout, r.stderr)
			}
			for _, w := range tc.want {
				if !strings.Contains(r.stdout+r.stderr, w) {
					t.Errorf("want %q in\n%s%s", w, r.stdout, r.stderr)
				}
			}
		})
	}
}
