package main

import (
	"bytes"
	"fmt"
	"image/color"
	"io"
	"math"
	"path/filepath"
	"strconv"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/plotutil"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"

	"hess/equilibrium"
	"hess/network"
)

// plotSamples is how many temperatures each line is drawn through, evenly
// spaced in 1000/T.
const plotSamples = 240

// Size of the plot.
const (
	plotWidth  = 16 * vg.Centimeter
	plotHeight = 11 * vg.Centimeter
)

func runPlot(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("plot", "plot [--reaction NAME]... [--temperatures LIST] -o OUT.svg|OUT.png FILE\n"+
		"       hess plot --equilibrium --mixture NAME [--temperatures LIST] [--pressure P] [--elements] [--log] -o OUT.svg|OUT.png FILE",
		"Draw a van 't Hoff plot: log10 K against 1000/T, one line per reaction (every\n"+
			"reaction, or those named), over the span of the settings' temperatures or\n"+
			"those of --temperatures. Parts computed from data outside their range are\n"+
			"dashed; a marker shows each temperature where K = 1. The format follows the\n"+
			"output's extension: .svg or .png. The file is written atomically.\n\n"+
			"With --equilibrium, draw the equilibrium composition of the feed --mixture\n"+
			"(see hess equilibrium) against T: each species' mole fraction in its phase\n"+
			"(log10 of it with --log), at 60 temperatures over the same span.\n\n"+
			cautionText, stderr)
	temps := fs.String("temperatures", "", "span of temperatures to draw, e.g. \"600 K to 1200 K by 100 K\"")
	var names nameList
	fs.Var(&names, "reaction", "draw this reaction (repeatable; default: every reaction)")
	out := fs.String("o", "", "write the plot to `FILE` (.svg or .png)")
	eqPlot := fs.Bool("equilibrium", false, "draw a feed's equilibrium composition against T")
	mixture := fs.String("mixture", "", "with --equilibrium: the feed mixture `NAME`")
	logScale := fs.Bool("log", false, "with --equilibrium: draw log10 of the mole fractions")
	pressure := fs.String("pressure", "", "with --equilibrium: pressure instead of the mixture's, e.g. \"25 bar\"")
	elements := fs.Bool("elements", false, "with --equilibrium: let every species with data form")
	files, status, ok := parseFlags(fs, args, stdout)
	if !ok {
		return status
	}
	if len(files) != 1 {
		fmt.Fprintln(stderr, "hess plot: give exactly one root file")
		fs.Usage()
		return exitTrouble
	}
	format := strings.TrimPrefix(strings.ToLower(filepath.Ext(*out)), ".")
	if *out == "" || (format != "svg" && format != "png") {
		fmt.Fprintln(stderr, "hess plot: -o must name an .svg or .png file")
		fs.Usage()
		return exitTrouble
	}
	if *eqPlot {
		return runEquilibriumPlot(equilibriumPlotRequest{root: files[0], mixture: *mixture, temps: *temps, pressure: *pressure,
			elements: *elements, log: *logScale, out: *out, format: format}, stderr)
	}
	doc, status := tabulate("plot", files[0], *temps, names, stderr)
	if doc == nil {
		return status
	}
	data, err := renderPlot(doc, format)
	if err != nil {
		fmt.Fprintf(stderr, "hess plot: %v\n", err)
		return exitTrouble
	}
	if err := writeOutput(*out, doc.net, data); err != nil {
		fmt.Fprintf(stderr, "hess plot: %v\n", err)
		return exitTrouble
	}
	return exitOK
}

// plotSpan is the span of temperatures the plot covers: the lowest to the
// highest requested temperature, widened by a fifth each way when there is
// only one.
func plotSpan(temps []float64) (lo, hi float64) {
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, T := range temps {
		if T > 0 {
			lo, hi = math.Min(lo, T), math.Max(hi, T)
		}
	}
	if lo == hi {
		lo, hi = lo/1.2, hi*1.2
	}
	return lo, hi
}

// renderPlot draws the van 't Hoff plot of the document's reactions in the
// given format ("svg" or "png").
func renderPlot(doc *tableDoc, format string) ([]byte, error) {
	lo, hi := plotSpan(doc.Temps)
	if !(lo < hi) || math.IsInf(lo, 0) {
		return nil, fmt.Errorf("no temperatures to plot")
	}
	// Samples evenly spaced in x = 1000/T, from the hottest to the coldest.
	temps := make([]float64, plotSamples)
	xLo, xHi := 1000/hi, 1000/lo
	for i := range temps {
		x := xLo + (xHi-xLo)*float64(i)/float64(plotSamples-1)
		temps[i] = 1000 / x
	}
	temps[0], temps[plotSamples-1] = hi, lo

	p := plot.New()
	p.Title.Text = fmt.Sprintf("van 't Hoff plot of %s (p° = %s)", doc.Network, pressureText(doc.Pressure))
	p.X.Label.Text = "1000/T [1/K]   (T in K below each value)"
	p.Y.Label.Text = "log10 K"
	p.X.Tick.Marker = kelvinTicks{}
	p.Y.Tick.Marker = niceTicks{}
	p.Add(plotter.NewGrid())

	zero := plotter.NewFunction(func(float64) float64 { return 0 })
	zero.Color = color.Gray{Y: 120}
	zero.Dashes = []vg.Length{vg.Points(2), vg.Points(2)}
	zero.Width = vg.Points(0.5)
	p.Add(zero)

	var marks, all plotter.XYs
	drawn := 0
	for i, t := range doc.Tables {
		rx := t.Reaction
		// The reaction's table, densely sampled.
		dense := tableAt(doc, t, temps)
		col := plotutil.Color(i)
		segs := segments(dense)
		if len(segs) == 0 {
			continue // no data anywhere in the span
		}
		for _, seg := range segs {
			all = append(all, seg.xys...)
			l, err := plotter.NewLine(seg.xys)
			if err != nil {
				return nil, fmt.Errorf("line of %s: %w", rx.Name, err)
			}
			l.Color = col
			l.Width = vg.Points(1.5)
			if seg.extrapolated {
				l.Dashes = []vg.Length{vg.Points(5), vg.Points(3)}
			}
			p.Add(l)
		}
		drawn++
		label := rx.Name
		var at []string
		for _, c := range t.Crossovers {
			if c.T >= lo && c.T <= hi {
				marks = append(marks, plotter.XY{X: 1000 / c.T, Y: 0})
				at = append(at, strconv.FormatFloat(math.Round(c.T*10)/10, 'f', -1, 64)+" K")
			}
		}
		if len(at) > 0 {
			label += " (K = 1 at " + strings.Join(at, ", ") + ")"
		}
		p.Legend.Add(label, &plotter.Line{LineStyle: draw.LineStyle{Color: col, Width: vg.Points(1.5)}})
	}
	if drawn == 0 {
		return nil, fmt.Errorf("no reaction has data in %s to %s", kelvinText(lo), kelvinText(hi))
	}
	if len(marks) > 0 {
		sc, err := plotter.NewScatter(marks)
		if err != nil {
			return nil, fmt.Errorf("crossover markers: %w", err)
		}
		sc.Shape = draw.CircleGlyph{}
		sc.Color = color.Black
		sc.Radius = vg.Points(3)
		p.Add(sc)
		p.Legend.Add("K = 1", sc)
	}
	p.X.Min, p.X.Max = xLo, xHi
	p.Legend.Top, p.Legend.Left = emptiestCorner(all, xLo, xHi)
	p.Legend.XOffs, p.Legend.YOffs = vg.Points(6), vg.Points(6)
	if !p.Legend.Left {
		p.Legend.XOffs = -p.Legend.XOffs
	}
	if p.Legend.Top {
		p.Legend.YOffs = -p.Legend.YOffs
	}

	return plotBytes(p, format)
}

// plotBytes renders a plot at the plots' size in format ("svg" or "png").
func plotBytes(p *plot.Plot, format string) ([]byte, error) {
	w, err := p.WriterTo(plotWidth, plotHeight, format)
	if err != nil {
		return nil, fmt.Errorf("render %s: %w", format, err)
	}
	var buf bytes.Buffer
	if _, err := w.WriteTo(&buf); err != nil {
		return nil, fmt.Errorf("render %s: %w", format, err)
	}
	return buf.Bytes(), nil
}

// emptiestCorner chooses where the legend goes: the corner of the plot
// (top or bottom, left or right) whose quarter holds the fewest points of
// the lines, the bottom left on a tie.
func emptiestCorner(pts plotter.XYs, xLo, xHi float64) (top, left bool) {
	yLo, yHi := 0.0, 0.0 // the K = 1 line is always drawn
	for _, pt := range pts {
		yLo, yHi = math.Min(yLo, pt.Y), math.Max(yHi, pt.Y)
	}
	best := -1
	for _, c := range []struct{ top, left bool }{{false, true}, {false, false}, {true, true}, {true, false}} {
		n := 0
		for _, pt := range pts {
			fx := (pt.X - xLo) / (xHi - xLo)
			fy := 0.5
			if yHi > yLo {
				fy = (pt.Y - yLo) / (yHi - yLo)
			}
			inX := (c.left && fx < 0.5) || (!c.left && fx >= 0.5)
			inY := (c.top && fy >= 0.6) || (!c.top && fy < 0.4)
			if inX && inY {
				n++
			}
		}
		if best < 0 || n < best {
			best, top, left = n, c.top, c.left
		}
	}
	return top, left
}

// tableAt recomputes a reaction's table at the plot's sample temperatures.
func tableAt(doc *tableDoc, t *equilibrium.Table, temps []float64) []network.TableRow {
	return equilibrium.ReactionTable(doc.net, t.Reaction, temps).Rows
}

// segment is a run of samples drawn as one line: all inside the data's
// ranges, or all extrapolated.
type segment struct {
	xys          plotter.XYs
	extrapolated bool
}

// segments splits the rows into runs of valid samples with the same
// extrapolation; unknown values break a line. Neighbouring runs share their
// boundary sample so that the line stays joined.
func segments(rows []network.TableRow) []segment {
	var out []segment
	open := false // the last segment of out is being extended
	for _, r := range rows {
		if !r.Valid || !finite(r.Log10K) {
			open = false
			continue
		}
		pt := plotter.XY{X: 1000 / r.T, Y: r.Log10K}
		if !open || out[len(out)-1].extrapolated != r.Extrapolated {
			seg := segment{extrapolated: r.Extrapolated}
			if open {
				prev := out[len(out)-1].xys
				seg.xys = append(seg.xys, prev[len(prev)-1])
			}
			out = append(out, seg)
			open = true
		}
		last := &out[len(out)-1]
		last.xys = append(last.xys, pt)
	}
	// A line needs two points; a lone sample is left out.
	kept := out[:0]
	for _, s := range out {
		if len(s.xys) >= 2 {
			kept = append(kept, s)
		}
	}
	return kept
}

// kelvinTicks are the default ticks of 1000/T with the temperature written
// under each labelled one.
type kelvinTicks struct{}

// Ticks returns the ticks between min and max.
func (kelvinTicks) Ticks(min, max float64) []plot.Tick {
	ticks := plot.DefaultTicks{}.Ticks(min, max)
	for i, t := range ticks {
		if t.Label == "" || t.Value <= 0 {
			continue
		}
		ticks[i].Label = t.Label + "\n" + strconv.FormatFloat(math.Round(1000/t.Value), 'f', 0, 64) + " K"
	}
	return ticks
}

// niceTicks labels about six values 1, 2 or 5 times a power of ten apart,
// with a minor tick between each two.
type niceTicks struct{}

// Ticks returns the ticks between lo and hi.
func (niceTicks) Ticks(lo, hi float64) []plot.Tick {
	if !(hi > lo) {
		return plot.DefaultTicks{}.Ticks(lo, hi)
	}
	raw := (hi - lo) / 6
	mag := math.Pow(10, math.Floor(math.Log10(raw)))
	step := mag
	for _, f := range []float64{1, 2, 5, 10} {
		if f*mag >= raw {
			step = f * mag
			break
		}
	}
	decimals := max(0, -int(math.Floor(math.Log10(step))))
	var ticks []plot.Tick
	for v := math.Ceil(lo/step) * step; v <= hi+step*1e-9; v += step {
		label := strconv.FormatFloat(v, 'f', decimals, 64)
		if strings.Trim(label, "-0.") == "" {
			label = strconv.FormatFloat(0, 'f', decimals, 64)
		}
		ticks = append(ticks, plot.Tick{Value: v, Label: label})
		if m := v + step/2; m <= hi {
			ticks = append(ticks, plot.Tick{Value: m})
		}
	}
	return ticks
}
