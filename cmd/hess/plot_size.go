package main

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"gonum.org/v1/plot/vg"
)

// Plot size and resolution: the defaults and the bounds --size and --dpi
// accept. The bounds keep a PNG within maxPlotPixels (about 48 MB of
// pixels while it is drawn).
const (
	defaultPlotWidth  = 16 * vg.Centimeter
	defaultPlotHeight = 11 * vg.Centimeter
	defaultPlotDPI    = 96
	minPlotSide       = 4 * vg.Centimeter
	maxPlotSide       = 100 * vg.Centimeter
	minPlotDPI        = 30
	maxPlotDPI        = 1200
	maxPlotPixels     = 12_000_000
)

// plotUnits are the length units --size takes.
var plotUnits = []struct {
	name string
	len  vg.Length
}{
	{"cm", vg.Centimeter}, {"mm", vg.Millimeter}, {"in", vg.Inch}, {"pt", vg.Points(1)},
}

// plotSize is the size of a plot on the page and its PNG resolution.
type plotSize struct {
	w, h vg.Length
	dpi  int
}

// parseLength reads a number with a unit ("16cm", "6.5 in"); the unit may
// be left off when def is not zero.
func parseLength(s string, def vg.Length) (vg.Length, vg.Length, error) {
	s = strings.TrimSpace(s)
	for _, u := range plotUnits {
		if num, ok := strings.CutSuffix(s, u.name); ok {
			v, err := strconv.ParseFloat(strings.TrimSpace(num), 64)
			if err != nil || !(v > 0) || math.IsInf(v, 0) {
				return 0, 0, fmt.Errorf("%q is not a positive length", s)
			}
			return vg.Length(v) * u.len, u.len, nil
		}
	}
	v, err := strconv.ParseFloat(s, 64)
	if err != nil || def == 0 || !(v > 0) || math.IsInf(v, 0) {
		return 0, 0, fmt.Errorf("%q is not a length with a unit (cm, mm, in or pt)", s)
	}
	return vg.Length(v) * def, def, nil
}

// parsePlotSize reads --size: WIDTHxHEIGHT with a unit on each or on the
// last ("16cmx10cm", "16x10cm", "6.5in×4in"); "x", "X" and "×" separate.
func parsePlotSize(s string) (vg.Length, vg.Length, error) {
	norm := strings.NewReplacer("×", "x", "X", "x").Replace(s)
	ws, hs, ok := strings.Cut(norm, "x")
	if !ok {
		return 0, 0, fmt.Errorf("size %q: give WIDTHxHEIGHT with a unit, such as 16cmx10cm", s)
	}
	h, unit, err := parseLength(hs, 0)
	if err != nil {
		return 0, 0, fmt.Errorf("size %q: height %w", s, err)
	}
	w, _, err := parseLength(ws, unit)
	if err != nil {
		return 0, 0, fmt.Errorf("size %q: width %w", s, err)
	}
	for _, side := range []vg.Length{w, h} {
		if side < minPlotSide-1e-9 || side > maxPlotSide+1e-9 {
			return 0, 0, fmt.Errorf("size %q: each side must be from %g cm to %g cm", s, minPlotSide/vg.Centimeter, maxPlotSide/vg.Centimeter)
		}
	}
	return w, h, nil
}

// checkPNGPixels refuses a PNG larger than maxPlotPixels.
func (ps plotSize) checkPNGPixels() error {
	px := float64(ps.w/vg.Inch) * float64(ps.dpi) * float64(ps.h/vg.Inch) * float64(ps.dpi)
	if px > maxPlotPixels {
		return fmt.Errorf("a PNG of %s at %d dpi would have %.0f million pixels; the most is %d million (use a smaller --size or --dpi, or SVG)",
			sizeText(ps.w, ps.h), ps.dpi, px/1e6, maxPlotPixels/1_000_000)
	}
	return nil
}

func sizeText(w, h vg.Length) string {
	return strconv.FormatFloat(float64(w/vg.Centimeter), 'g', 4, 64) + "cm×" +
		strconv.FormatFloat(float64(h/vg.Centimeter), 'g', 4, 64) + "cm"
}
