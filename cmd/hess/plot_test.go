package main

import (
	"bytes"
	"fmt"
	"image"
	"image/color"
	"image/png"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestPlotSVGGolden draws the reformer example's van 't Hoff plot as SVG and
// compares it with testdata/plot/reformer.svg.golden (the SVG is the same
// bytes on every run). Run with -update after looking at it.
func TestPlotSVGGolden(t *testing.T) {
	golden := inRoot(t)
	out := filepath.Join(t.TempDir(), "reformer.svg")
	var stdout, stderr bytes.Buffer
	if code := run([]string{"plot", "-o", out, "examples/hydrogen-plant/reformer.hess"}, &stdout, &stderr); code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr.String())
	}
	got, err := os.ReadFile(out)
	if err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"<svg", "1000 K / T", "log10 K", "reform (K = 1 at 892.2 K)", "shift (K = 1 at 1096.8 K)", "dry-reform", "1000 K",
		"reformer.hess: van &#39;t Hoff plot"} {
		if !bytes.Contains(got, []byte(want)) {
			t.Errorf("SVG lacks %q", want)
		}
	}
	again := filepath.Join(t.TempDir(), "again.svg")
	if code := run([]string{"plot", "-o", again, "examples/hydrogen-plant/reformer.hess"}, &stdout, &stderr); code != exitOK {
		t.Fatalf("second run: exit %d", code)
	}
	if b, _ := os.ReadFile(again); !bytes.Equal(b, got) {
		t.Fatal("two runs drew different SVG")
	}
	compareGolden(t, filepath.Join(golden, "plot", "reformer.svg.golden"), got)
}

// TestPlotPNG draws the reformer plot as PNG and checks the picture: its
// size, and that each reaction's line colour appears in it.
func TestPlotPNG(t *testing.T) {
	inRoot(t)
	out := filepath.Join(t.TempDir(), "reformer.png")
	var stdout, stderr bytes.Buffer
	if code := run([]string{"plot", "-o", out, "examples/hydrogen-plant/reformer.hess"}, &stdout, &stderr); code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr.String())
	}
	f, err := os.Open(out)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	img, err := png.Decode(f)
	if err != nil {
		t.Fatalf("not a PNG: %v", err)
	}
	if b := img.Bounds(); b.Dx() < 400 || b.Dy() < 300 {
		t.Errorf("picture is %v", b)
	}
	for i := range 4 { // four reactions in the example
		c := okabeIto[i]
		if n := countColor(img, c); n < 200 {
			t.Errorf("line colour %d (%v) covers %d pixels; the line is missing", i, c, n)
		}
	}
}

func countColor(img image.Image, c color.Color) int {
	r0, g0, b0, _ := c.RGBA()
	n := 0
	b := img.Bounds()
	for y := b.Min.Y; y < b.Max.Y; y++ {
		for x := b.Min.X; x < b.Max.X; x++ {
			r, g, bl, _ := img.At(x, y).RGBA()
			if near(r, r0) && near(g, g0) && near(bl, b0) {
				n++
			}
		}
	}
	return n
}

func near(a, b uint32) bool {
	d := int(a>>8) - int(b>>8)
	return d > -24 && d < 24
}

func TestPlotNothingToDraw(t *testing.T) {
	inRoot(t)
	var stdout, stderr bytes.Buffer
	out := filepath.Join(t.TempDir(), "flame.svg")
	if code := run([]string{"plot", "-o", out, "examples/small-flame.hess"}, &stdout, &stderr); code != exitTrouble {
		t.Errorf("exit %d, want %d", code, exitTrouble)
	}
	if !strings.Contains(stderr.String(), "no reaction has data") {
		t.Errorf("stderr: %s", stderr.String())
	}
	if _, err := os.Stat(out); err == nil {
		t.Error("a plot file was written")
	}
}

// A plot of more reactions than its colours and markers tell apart is
// refused before anything is drawn, and says how to choose; as many as
// they tell apart are drawn.
func TestPlotLineLimit(t *testing.T) {
	dir := t.TempDir()
	for _, n := range []int{maxPlotLines, maxPlotLines + 1} {
		var b strings.Builder
		b.WriteString("settings { temperatures 300 K, 400 K }\n")
		b.WriteString("species A(g) { formula CO hf 0 kJ/mol s 100 J/mol/K }\n")
		b.WriteString("species B(g) { formula CO hf -10 kJ/mol s 90 J/mol/K }\n")
		b.WriteString("reaction r1: A(g) <-> B(g)\n")
		for i := 2; i <= n; i++ {
			fmt.Fprintf(&b, "reaction r%d: A(g) <-> B(g) = r%d\n", i, i-1)
		}
		net := filepath.Join(dir, fmt.Sprintf("n%d.hess", n))
		if err := os.WriteFile(net, []byte(b.String()), 0o644); err != nil {
			t.Fatal(err)
		}
		out := filepath.Join(dir, fmt.Sprintf("n%d.svg", n))
		var stdout, stderr bytes.Buffer
		code := run([]string{"plot", "-o", out, net}, &stdout, &stderr)
		_, statErr := os.Stat(out)
		if n == maxPlotLines {
			if code != exitOK || statErr != nil {
				t.Errorf("%d reactions: exit %d, plot written: %v; stderr: %.500s", n, code, statErr == nil, stderr.String())
			}
			continue
		}
		want := "57 reactions are more lines than one plot tells apart (at most 56: 8 colours × 7 markers); choose those to draw with --reaction"
		if code != exitTrouble || !strings.Contains(stderr.String(), want) || statErr == nil {
			t.Errorf("%d reactions: exit %d, plot written: %v; stderr lacks %q: %.500s", n, code, statErr == nil, want, stderr.String())
		}
		code = run([]string{"plot", "--reaction", "r57", "--reaction", "r1", "-o", out, net}, &stdout, &stderr)
		if code != exitOK {
			t.Errorf("two named of %d: exit %d", n, code)
		}
	}
}
