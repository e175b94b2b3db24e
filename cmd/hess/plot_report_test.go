package main

import (
	"bytes"
	"encoding/binary"
	"fmt"
	"image/png"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgsvg"
)

// plotFile draws the reformer example with extra arguments and returns the
// file's bytes. The test must be in the repository's root (inRoot).
func plotFile(t *testing.T, name string, args ...string) []byte {
	t.Helper()
	out := filepath.Join(t.TempDir(), name)
	var stdout, stderr bytes.Buffer
	args = append(append([]string{"plot", "-o", out}, args...), "examples/hydrogen-plant/reformer.hess")
	if code := run(args, &stdout, &stderr); code != exitOK {
		t.Fatalf("%v: exit %d: %s", args, code, stderr.String())
	}
	b, err := os.ReadFile(out)
	if err != nil {
		t.Fatal(err)
	}
	return b
}

// Ticks of the 1000 K/T axis stand at round temperatures, exactly at
// 1000/T, labelled with the temperature, never crowded, and cover narrow
// spans too.
func TestTemperatureTicks(t *testing.T) {
	for _, tc := range []struct {
		lo, hi float64
		gap    float64
		labels []string // must be among the labels
		every  float64  // every labelled T is a multiple of this
	}{
		{298.15, 1200, 1.0 / 8, []string{"300 K", "400 K", "500 K", "1000 K"}, 50},
		{250, 2500, 0.12, []string{"250 K", "300 K", "400 K", "1000 K", "2000 K"}, 50},
		{700, 710, 1.0 / 8, []string{"700 K", "705 K", "710 K"}, 1},
		{1000, 1001, 1.0 / 8, []string{"1000 K", "1001 K"}, 0.1},
	} {
		min, max := 1000/tc.hi, 1000/tc.lo
		ticks := temperatureTicks{gap: tc.gap}.Ticks(min, max)
		var labels []string
		var labelled []plot.Tick
		for _, tk := range ticks {
			if tk.Value < min-1e-12 || tk.Value > max+1e-12 {
				t.Errorf("%g–%g K: tick at %g outside the axis", tc.lo, tc.hi, tk.Value)
			}
			if tk.Label == "" {
				continue
			}
			T, err := strconv.ParseFloat(strings.TrimSuffix(tk.Label, " K"), 64)
			if err != nil {
				t.Fatalf("label %q", tk.Label)
			}
			if math.Abs(tk.Value-1000/T) > 1e-9*tk.Value {
				t.Errorf("%s at %g, want 1000/T = %g", tk.Label, tk.Value, 1000/T)
			}
			if r := T / tc.every; math.Abs(r-math.Round(r)) > 1e-6 {
				t.Errorf("%g–%g K: %s is not a multiple of %g K", tc.lo, tc.hi, tk.Label, tc.every)
			}
			for _, o := range labelled {
				if math.Abs(o.Value-tk.Value) < tc.gap*(max-min)*(1-1e-9) {
					t.Errorf("%g–%g K: labels %s and %s closer than the gap", tc.lo, tc.hi, o.Label, tk.Label)
				}
			}
			labelled = append(labelled, tk)
			labels = append(labels, tk.Label)
		}
		for _, want := range tc.labels {
			if !strings.Contains(" "+strings.Join(labels, ", ")+",", " "+want+",") {
				t.Errorf("%g–%g K: labels %v lack %s", tc.lo, tc.hi, labels, want)
			}
		}
	}
}

// --size sets the picture's size and --dpi the PNG's resolution, recorded
// in the file; sizes out of bounds are refused.
func TestPlotSize(t *testing.T) {
	inRoot(t)
	b := plotFile(t, "r.png", "--size", "12cmx8cm", "--dpi", "150")
	img, err := png.Decode(bytes.NewReader(b))
	if err != nil {
		t.Fatal(err)
	}
	// 12 cm at 150 dpi: 12/2.54·150 = 708.7 px; 8 cm: 472.4 px.
	if got := img.Bounds().Size(); got.X != 709 || got.Y != 472 {
		t.Errorf("12cm×8cm at 150 dpi is %v px, want 709×472", got)
	}
	i := bytes.Index(b, []byte("pHYs"))
	if i < 0 {
		t.Fatal("no pHYs chunk")
	}
	// 150 dpi = 150/0.0254 = 5905.5 pixels per metre.
	if ppm := binary.BigEndian.Uint32(b[i+4:]); ppm != 5906 || b[i+12] != 1 {
		t.Errorf("pHYs %d per unit %d, want 5906 per metre", ppm, b[i+12])
	}
	for _, tc := range []struct{ arg, px string }{
		{"6.5x4in", "624×384"}, {"160mm×110mm", "605×416"}, {"300ptX200pt", "400×267"},
	} {
		b := plotFile(t, "s.png", "--size", tc.arg)
		img, err := png.Decode(bytes.NewReader(b))
		if err != nil {
			t.Fatal(err)
		}
		if got := img.Bounds().Size(); strconv.Itoa(got.X)+"×"+strconv.Itoa(got.Y) != tc.px {
			t.Errorf("--size %s at 96 dpi: %v, want %s", tc.arg, got, tc.px)
		}
	}
	svg := plotFile(t, "s.svg", "--size", "20cmx10cm")
	// 20 cm = 566.93 pt.
	if !bytes.Contains(svg, []byte(`width="566.93pt" height="283.46pt"`)) {
		t.Errorf("SVG of 20cm×10cm: %s", svg[:min(300, len(svg))])
	}
	for _, args := range [][]string{
		{"--size", "16cm"}, {"--size", "1cmx1cm"}, {"--size", "200cmx10cm"}, {"--size", "16x11"},
		{"--size", "-16cmx11cm"}, {"--dpi", "5"}, {"--dpi", "5000"},
		{"--size", "100cmx100cm", "--dpi", "600"}, // 559 million pixels
	} {
		var stdout, stderr bytes.Buffer
		out := filepath.Join(t.TempDir(), "x.png")
		if code := run(append(append([]string{"plot", "-o", out}, args...), "examples/hydrogen-plant/reformer.hess"), &stdout, &stderr); code != exitTrouble {
			t.Errorf("%v: exit %d, want 2", args, code)
		}
		if _, err := os.Stat(out); err == nil {
			t.Errorf("%v: a file was written", args)
		}
	}
}

// Each reaction takes an Okabe–Ito colour and its own marker shape; the
// SVG names a generic family after the font; the title names the file.
func TestPlotPaletteAndText(t *testing.T) {
	inRoot(t)
	svg := string(plotFile(t, "r.svg"))
	for i, want := range []string{"#0072B2", "#E69F00", "#009E73", "#CC79A7"} {
		if !strings.Contains(svg, "stroke:"+want) {
			t.Errorf("reaction %d: no line in %s", i, want)
		}
	}
	for _, unsafe := range []string{"#FF0000", "#00FF00", "#F15A60", "#7AC36A"} {
		if strings.Contains(strings.ToUpper(svg), unsafe) {
			t.Errorf("SVG uses %s", unsafe)
		}
	}
	seen := map[string]bool{}
	for i := range 7 {
		g := reactionStyle(i).glyph.Shape
		key := fmt.Sprintf("%T", g)
		if seen[key] || key == "draw.CircleGlyph" {
			t.Errorf("reaction %d: marker %s repeats or is the K = 1 mark", i, key)
		}
		seen[key] = true
	}
	families := regexp.MustCompile(`font-family:([^;"]*)`).FindAllStringSubmatch(svg, -1)
	if len(families) == 0 {
		t.Fatal("no text in the SVG")
	}
	for _, f := range families {
		if !strings.HasSuffix(f[1], ",sans-serif") {
			t.Errorf("font-family %q has no generic fallback", f[1])
		}
	}
	if !strings.Contains(svg, ">reformer.hess: van &#39;t Hoff plot (p° = 1 bar)<") || strings.Contains(svg, "examples/hydrogen-plant/reformer.hess") {
		t.Error("the title does not name the file by its base name")
	}
}

// The legend stands beside the data (or under them when it is too wide),
// never over them, and has an entry for dashed stretches when there are
// some.
func TestPlotLegend(t *testing.T) {
	inRoot(t)
	svg := string(plotFile(t, "r.svg"))
	if strings.Contains(svg, "dashed: extrapolated") {
		t.Error("a legend entry for extrapolation where nothing is extrapolated")
	}
	svg = string(plotFile(t, "r.svg", "--temperatures", "250 K to 1200 K by 50 K"))
	if !strings.Contains(svg, "dashed: extrapolated (data outside their range)") {
		t.Error("no legend entry for the dashed stretches")
	}
	for _, w := range []vg.Length{16 * vg.Centimeter, 8 * vg.Centimeter} {
		leg := plot.NewLegend()
		leg.TextStyle.Font = plotFont(legendFontSize)
		leg.Add(legendLabel("reform", []float64{892.23}), reactionStyle(0))
		leg.Add("dashed: extrapolated (data outside their range)", extrapolatedThumb{})
		c := draw.New(vgsvg.New(w, 11*vg.Centimeter))
		ts := plot.New().Title.TextStyle
		l := layoutPlot(c, &leg, "t", ts)
		beside := l.legend.Min.X >= l.data.Max.X
		below := l.legend.Max.Y <= l.data.Min.Y
		if !beside && !below {
			t.Errorf("width %v: legend %v overlaps the plot %v", w, l.legend.Rectangle, l.data.Rectangle)
		}
		if _, wantBeside := legendWidth(&leg, w); beside != wantBeside {
			t.Errorf("width %v: beside %v, want %v", w, beside, wantBeside)
		}
	}
	long := legendLabel(strings.Repeat("x", 100), []float64{400, 500, 600, 700, 800})
	if n := len([]rune(long)); n > 80 || !strings.Contains(long, "2 more") {
		t.Errorf("legend label not bounded: %q", long)
	}
}
