package main

import (
	"fmt"
	"image/color"
	"io"
	"math"
	"path"
	"path/filepath"
	"strconv"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"

	"hess/equilibrium"
	"hess/network"
)

// plotSamples is how many temperatures each line is drawn through, evenly
// spaced in 1000/T.
const plotSamples = 240

func runPlot(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("plot", "plot [--reaction NAME]... [--temperatures LIST] [--size WxH] [--dpi N] -o OUT.svg|OUT.png [--include-path DIR]... FILE\n"+
		"       hess plot --equilibrium --mixture NAME [--temperatures LIST] [--pressure P] [--elements] [--log] [--size WxH] [--dpi N] -o OUT.svg|OUT.png FILE",
		"Draw a van 't Hoff plot: log10 K against 1000 K/T, one line per reaction\n"+
			"(every reaction, or those named), over the span of the settings'\n"+
			"temperatures or those of --temperatures, with ticks at round temperatures.\n"+
			"Each reaction has its own colour (the Okabe-Ito palette, safe for colour-\n"+
			"blind readers) and marker shape; stretches computed from data outside their\n"+
			"range are dashed; a dot shows each temperature where K = 1. The legend\n"+
			"stands beside the plot. The format follows the output's extension: .svg or\n"+
			".png. The file is written atomically.\n\n"+
			"With --equilibrium, draw the equilibrium composition of the feed --mixture\n"+
			"(see hess equilibrium) against T: each species' mole fraction in its phase\n"+
			"(log10 of it with --log), at 60 temperatures over the same span.\n\n"+
			cautionText, stderr)
	temps := fs.String("temperatures", "", "span of temperatures to draw, e.g. \"600 K to 1200 K by 100 K\"")
	var names nameList
	fs.Var(&names, "reaction", "draw this reaction (repeatable; default: every reaction)")
	includes := includePathFlag(fs)
	out := fs.String("o", "", "write the plot to `FILE` (.svg or .png)")
	sizeText := fs.String("size", "16cmx11cm", "the plot's `WxH` on the page, in cm, mm, in or pt (\"16cmx10cm\", \"6.5x4in\")")
	dpi := fs.Int("dpi", defaultPlotDPI, "PNG resolution in dots per inch (30 to 1200); the PNG is WxH times this")
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
	size := plotSize{dpi: *dpi}
	var err error
	if size.w, size.h, err = parsePlotSize(*sizeText); err != nil {
		fmt.Fprintf(stderr, "hess plot: --%v\n", err)
		return exitTrouble
	}
	if size.dpi < minPlotDPI || size.dpi > maxPlotDPI {
		fmt.Fprintf(stderr, "hess plot: --dpi %d: give %d to %d dots per inch\n", size.dpi, minPlotDPI, maxPlotDPI)
		return exitTrouble
	}
	if format == "png" {
		if err := size.checkPNGPixels(); err != nil {
			fmt.Fprintf(stderr, "hess plot: %v\n", err)
			return exitTrouble
		}
	}
	if *eqPlot {
		return runEquilibriumPlot(equilibriumPlotRequest{root: files[0], mixture: *mixture, temps: *temps, pressure: *pressure,
			elements: *elements, log: *logScale, out: *out, format: format, size: size, includes: *includes}, stderr)
	}
	doc, status := tabulate("plot", files[0], *temps, names, *includes, stderr)
	if doc == nil {
		return status
	}
	if n := len(doc.reactions); n > maxPlotLines {
		fmt.Fprintf(stderr, "hess plot: %d reactions are more lines than one plot tells apart (at most %d: %d colours × %d markers); choose those to draw with --reaction\n",
			n, maxPlotLines, len(okabeIto), len(reactionGlyphs))
		return exitTrouble
	}
	data, err := renderPlot(doc, format, size)
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
// given format ("svg" or "png") at the given size.
func renderPlot(doc *tableDoc, format string, size plotSize) ([]byte, error) {
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
	setPlotFonts(p)
	p.X.Label.Text = xAxisLabel
	p.Y.Label.Text = "log10 K"
	p.Y.Tick.Marker = niceTicks{}
	p.Add(plotter.NewGrid())

	zero := plotter.NewFunction(func(float64) float64 { return 0 })
	zero.Color = color.Gray{Y: 120}
	zero.Dashes = []vg.Length{vg.Points(2), vg.Points(2)}
	zero.Width = vg.Points(0.5)
	p.Add(zero)

	leg := plot.NewLegend()
	leg.TextStyle.Font = plotFont(legendFontSize)
	leg.Top, leg.Left = true, true
	leg.Padding = vg.Points(2)
	var marks plotter.XYs
	drawn, extrapolated := 0, false
	sampled := equilibrium.NewTabulator(doc.net, temps)
	for i, t := range doc.tables() {
		rx := t.Reaction
		// The reaction's table, densely sampled.
		dense := sampled.Rows(rx)
		st := reactionStyle(i)
		segs := segments(dense)
		if len(segs) == 0 {
			continue // no data anywhere in the span
		}
		var glyphs plotter.XYs
		for _, seg := range segs {
			l, err := plotter.NewLine(seg.xys)
			if err != nil {
				return nil, fmt.Errorf("line of %s: %w", rx.Name, err)
			}
			l.LineStyle = st.line
			if seg.extrapolated {
				l.Dashes = extrapolatedDashes
				extrapolated = true
			}
			p.Add(l)
			glyphs = append(glyphs, markerPoints(seg.xys, xLo, xHi, i)...)
		}
		if len(glyphs) > 0 {
			sc, err := plotter.NewScatter(glyphs)
			if err != nil {
				return nil, fmt.Errorf("markers of %s: %w", rx.Name, err)
			}
			sc.GlyphStyle = st.glyph
			p.Add(sc)
		}
		drawn++
		var at []float64
		for _, c := range t.Crossovers {
			if c.T >= lo && c.T <= hi {
				marks = append(marks, plotter.XY{X: 1000 / c.T, Y: 0})
				at = append(at, c.T)
			}
		}
		leg.Add(legendLabel(rx.Name, at), st)
	}
	if drawn == 0 {
		return nil, fmt.Errorf("no reaction has data in %s to %s", kelvinText(lo), kelvinText(hi))
	}
	if extrapolated {
		leg.Add("dashed: extrapolated (data outside their range)", extrapolatedThumb{})
	}
	if len(marks) > 0 {
		sc, err := plotter.NewScatter(marks)
		if err != nil {
			return nil, fmt.Errorf("crossover markers: %w", err)
		}
		sc.GlyphStyle = crossoverGlyph
		p.Add(sc)
		leg.Add("K = 1", sc)
	}
	p.X.Min, p.X.Max = xLo, xHi
	// The axis is about the picture less the legend and the y axis.
	lw, _ := legendWidth(&leg, size.w)
	axisW := size.w - lw - plotMargin - vg.Points(48)
	p.X.Tick.Marker = newTemperatureTicks(p.X.Tick.Label, axisW)
	title := fmt.Sprintf("%s: van 't Hoff plot (p° = %s)", path.Base(doc.Network), pressureText(doc.Pressure))
	return drawPlot(p, &leg, title, format, size)
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
