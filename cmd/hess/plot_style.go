package main

import (
	"bytes"
	"encoding/binary"
	"fmt"
	"hash/crc32"
	"image/color"
	"math"
	"sort"
	"strconv"
	"strings"
	"unicode/utf8"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgsvg"
)

// okabeIto is the colour-blind-safe palette of Okabe and Ito ("Color
// Universal Design", 2008; the values as given by B. Wong, Nature Methods
// 8 (2011) 441), in the order lines take them: the first four keep the
// vermillion away from the bluish green, and the yellow, faint on white,
// comes last. Its colours stay apart for readers with any common colour
// vision deficiency.
var okabeIto = []color.RGBA{
	{0x00, 0x72, 0xB2, 0xFF}, // blue
	{0xE6, 0x9F, 0x00, 0xFF}, // orange
	{0x00, 0x9E, 0x73, 0xFF}, // bluish green
	{0xCC, 0x79, 0xA7, 0xFF}, // reddish purple
	{0x56, 0xB4, 0xE9, 0xFF}, // sky blue
	{0xD5, 0x5E, 0x00, 0xFF}, // vermillion
	{0x00, 0x00, 0x00, 0xFF}, // black
	{0xF0, 0xE4, 0x42, 0xFF}, // yellow
}

// reactionGlyphs are the marker shapes that tell lines apart where colour
// does not (a grey-scale print): one per reaction, cycling with a period
// (7) prime to the palette's (8), so that 56 reactions differ in one or the
// other. A filled circle is kept for the K = 1 marks.
var reactionGlyphs = []draw.GlyphDrawer{
	draw.BoxGlyph{}, draw.TriangleGlyph{}, draw.PyramidGlyph{}, draw.CrossGlyph{},
	draw.PlusGlyph{}, draw.SquareGlyph{}, draw.RingGlyph{},
}

// extrapolatedDashes is the dash pattern of stretches drawn from data
// outside their temperature range.
var extrapolatedDashes = []vg.Length{vg.Points(5), vg.Points(3)}

// crossoverGlyph marks each temperature where K = 1.
var crossoverGlyph = draw.GlyphStyle{Color: color.Black, Radius: vg.Points(3), Shape: draw.CircleGlyph{}}

// Font sizes, in points.
const (
	titleFontSize  = 12
	axisFontSize   = 11
	tickFontSize   = 9.5
	legendFontSize = 9.5
)

// xAxisLabel names the abscissa: the values run linearly in 1000 K/T, and
// the ticks stand at round temperatures.
const xAxisLabel = "1000 K / T   (ticks at T)"

// plotFont is Liberation Sans at size points. Its widths are those of
// Arial and Helvetica, which the SVG names as fallbacks (svgFontFallback),
// so text measured for it fits where a viewer substitutes one of those.
func plotFont(size float64) font.Font {
	return font.Font{Typeface: "Liberation", Variant: "Sans", Size: vg.Points(size)}
}

// setPlotFonts sets every text of the plot in plotFont.
func setPlotFonts(p *plot.Plot) {
	p.Title.TextStyle.Font = plotFont(titleFontSize)
	for _, ax := range []*plot.Axis{&p.X, &p.Y} {
		ax.Label.TextStyle.Font = plotFont(axisFontSize)
		ax.Tick.Label.Font = plotFont(tickFontSize)
	}
}

// lineStyle is one reaction's look: colour, line and marker shape. As a
// legend thumbnail it draws a stretch of its line with its marker.
type lineStyle struct {
	line  draw.LineStyle
	glyph draw.GlyphStyle
}

// maxPlotLines is how many reactions one plot draws: each pair of the 8
// colours and 7 markers once (8 and 7 share no factor, so reactionStyle
// repeats a pair only after 56). More lines could not be told apart, and
// their drawing grows past what one picture should take (5 000 lines took
// 0.9 GB).
var maxPlotLines = len(okabeIto) * len(reactionGlyphs)

// reactionStyle is the look of the i-th reaction drawn.
func reactionStyle(i int) lineStyle {
	c := okabeIto[i%len(okabeIto)]
	return lineStyle{
		line:  draw.LineStyle{Color: c, Width: vg.Points(1.5)},
		glyph: draw.GlyphStyle{Color: c, Radius: vg.Points(2.5), Shape: reactionGlyphs[i%len(reactionGlyphs)]},
	}
}

// Thumbnail draws the style in a legend entry.
func (s lineStyle) Thumbnail(c *draw.Canvas) {
	y := c.Center().Y
	c.StrokeLine2(s.line, c.Min.X, y, c.Max.X, y)
	c.DrawGlyph(s.glyph, vg.Point{X: c.Center().X, Y: y})
}

// extrapolatedThumb is the legend's key to dashed stretches.
type extrapolatedThumb struct{}

// Thumbnail draws a dashed grey line.
func (extrapolatedThumb) Thumbnail(c *draw.Canvas) {
	y := c.Center().Y
	c.StrokeLine2(draw.LineStyle{Color: color.Gray{Y: 90}, Width: vg.Points(1.5), Dashes: extrapolatedDashes}, c.Min.X, y, c.Max.X, y)
}

// markersPerLine is how many markers a line spanning the whole plot
// carries.
const markersPerLine = 6

// markerPoints picks the samples of a stretch where reaction i's markers
// go: evenly spaced across the plot, each reaction's shifted a little so
// that markers of lines that run together do not hide one another.
func markerPoints(xys plotter.XYs, xLo, xHi float64, i int) plotter.XYs {
	if len(xys) == 0 || !(xHi > xLo) {
		return nil
	}
	lo, hi := math.Min(xys[0].X, xys[len(xys)-1].X), math.Max(xys[0].X, xys[len(xys)-1].X)
	step := (xHi - xLo) / markersPerLine
	shift := (0.2 + 0.6*float64(i%5)/4) * step
	var out plotter.XYs
	for k := 0; k < markersPerLine; k++ {
		x := xLo + shift + float64(k)*step
		if x < lo || x > hi {
			continue
		}
		j := sort.Search(len(xys), func(j int) bool { return (xys[j].X >= x) == (xys[0].X <= xys[len(xys)-1].X) })
		if j == len(xys) {
			j--
		}
		out = append(out, xys[j])
	}
	return out
}

// Bounds on a legend label.
const (
	legendNameRunes  = 32 // a longer reaction name is cut with "…"
	legendCrossovers = 3  // K = 1 temperatures named; more are counted
)

// legendLabel is a reaction's legend entry: its name and where K = 1.
func legendLabel(name string, at []float64) string {
	if utf8.RuneCountInString(name) > legendNameRunes {
		name = string([]rune(name)[:legendNameRunes-1]) + "…"
	}
	if len(at) == 0 {
		return name
	}
	var parts []string
	for i, T := range at {
		if i == legendCrossovers {
			parts = append(parts, fmt.Sprintf("%d more", len(at)-i))
			break
		}
		parts = append(parts, strconv.FormatFloat(math.Round(T*10)/10, 'f', -1, 64)+" K")
	}
	return name + " (K = 1 at " + strings.Join(parts, ", ") + ")"
}

// temperatureTicks put the ticks of the 1000 K/T axis at round
// temperatures (…, 400 K, 500 K, …), labelled with the temperature. Since
// equal steps of T crowd together towards high T on this axis, only ticks
// at least gap apart (a fraction of the axis, room for a label) are
// labelled, the roundest first; the others stay as unlabelled ticks.
type temperatureTicks struct {
	gap float64
}

// newTemperatureTicks spaces the labels for an axis of about axisWidth
// whose labels are set in tick.
func newTemperatureTicks(tick text.Style, axisWidth vg.Length) temperatureTicks {
	gap := defaultLabelGap
	if axisWidth > 0 {
		gap = float64((tick.Width("0000 K") + vg.Points(8)) / axisWidth)
	}
	return temperatureTicks{gap: math.Min(math.Max(gap, 0.04), 0.5)}
}

// defaultLabelGap is the least distance between labelled ticks, as a
// fraction of the axis, when its width is not known.
const defaultLabelGap = 1.0 / 8

// Ticks returns the ticks between min and max (values of 1000 K/T). It
// goes through the round steps from coarse to fine (…, 1000, 500, 200, 100,
// 50, … K), labelling each multiple that keeps its distance from the labels
// already placed, so the roundest temperatures are labelled first and the
// sparse cold end gets finer labels than the crowded hot end; a label's
// step is at least a tenth of its temperature (or a quarter of a narrow
// span), so labels stay round. Multiples
// that cannot be labelled stay as unlabelled ticks where they are a quarter
// of that distance apart.
func (tt temperatureTicks) Ticks(min, max float64) []plot.Tick {
	if !(min > 0) || !(max > min) || math.IsInf(max, 0) {
		return plot.DefaultTicks{}.Ticks(min, max)
	}
	frac := tt.gap
	if !(frac > 0) {
		frac = defaultLabelGap
	}
	gap := frac * (max - min)
	tLo, tHi := 1000/max, 1000/min
	var ticks []plot.Tick
	far := func(x, d float64) bool {
		for _, t := range ticks {
			if math.Abs(t.Value-x) < d && (d < gap || t.Label != "") {
				return false
			}
		}
		return true
	}
	steps := temperatureSteps(tLo, tHi)
	for _, labelling := range []bool{true, false} {
		for _, step := range steps {
			first := math.Ceil(tLo/step - 1e-9)
			last := math.Floor(tHi/step + 1e-9)
			for k := first; k <= last; k++ {
				T := k * step
				x := 1000 / T
				// A label's step is at least a tenth of its temperature
				// (660 K is not labelled where 600 K and 700 K crowd
				// out), unless the whole span is narrower.
				roundEnough := step >= math.Min(T/10, (tHi-tLo)/4)*(1-1e-9)
				switch {
				case labelling && roundEnough && far(x, gap):
					ticks = append(ticks, plot.Tick{Value: x, Label: temperatureLabel(T, step)})
				case !labelling && far(x, gap/4):
					ticks = append(ticks, plot.Tick{Value: x})
				}
			}
		}
	}
	sort.Slice(ticks, func(i, j int) bool { return ticks[i].Value < ticks[j].Value })
	return ticks
}

// maxTicksPerStep bounds the multiples of one step that Ticks considers.
const maxTicksPerStep = 200

// temperatureSteps are the round steps (1, 5 and 2 times a power of ten)
// from the first power of ten above hi down to the finest that puts at most
// maxTicksPerStep multiples in [lo, hi].
func temperatureSteps(lo, hi float64) []float64 {
	top := math.Pow(10, math.Ceil(math.Log10(hi)))
	var out []float64
	for mag := top; ; mag /= 10 {
		for _, f := range []float64{1, 0.5, 0.2} {
			step := f * mag
			if (hi-lo)/step > maxTicksPerStep {
				return out
			}
			out = append(out, step)
		}
	}
}

// temperatureLabel writes a tick's temperature with the decimals its step
// needs.
func temperatureLabel(T, step float64) string {
	decimals := max(0, int(math.Ceil(-math.Log10(step)-1e-9)))
	return strconv.FormatFloat(T, 'f', decimals, 64) + " K"
}

// plotLayout is where the parts of the picture go: the title across the
// top, the plot with its axes on the left, the legend on the right, beside
// the data and never over them.
type plotLayout struct {
	title  vg.Point
	data   draw.Canvas
	legend draw.Canvas
}

// Layout margins.
var (
	plotMargin = vg.Millimeter * 3
	legendGap  = vg.Millimeter * 4
)

// layoutPlot divides the canvas. The legend stands to the right of the
// plot when its widest entry takes at most maxLegendShare of the picture's
// width, and under the plot otherwise (legendLabel bounds its entries).
func layoutPlot(c draw.Canvas, leg *plot.Legend, title string, ts text.Style) plotLayout {
	var l plotLayout
	titleH := ts.Height(title) + plotMargin
	l.title = vg.Point{X: (c.Min.X + c.Max.X) / 2, Y: c.Max.Y - plotMargin/2}
	box := leg.Rectangle(c).Size()
	if lw, beside := legendWidth(leg, c.Size().X); beside {
		l.data = draw.Crop(c, 0, -lw, 0, -titleH)
		l.legend = draw.Crop(c, c.Size().X-lw+legendGap, -plotMargin, 0, -titleH-plotMargin)
		return l
	}
	lh := box.Y + legendGap
	if maxH := 0.4 * c.Size().Y; lh > maxH {
		lh = maxH
	}
	l.data = draw.Crop(c, 0, 0, lh, -titleH)
	l.legend = draw.Crop(c, plotMargin, -plotMargin, plotMargin/2, -(c.Size().Y - lh + legendGap/2))
	return l
}

// legendWidth is the width the legend takes beside the plot in a picture
// of width w, and whether it stands there (false: it goes under the plot).
func legendWidth(leg *plot.Legend, w vg.Length) (vg.Length, bool) {
	lw := leg.Rectangle(draw.Canvas{}).Size().X + legendGap + plotMargin
	if lw <= maxLegendShare*w {
		return lw, true
	}
	return 0, false
}

// maxLegendShare is the most of the picture's width a legend beside the
// plot may take.
const maxLegendShare = 0.4

// drawPlot draws the plot, its title and its legend on a canvas of the
// given size and format and returns the file's bytes.
func drawPlot(p *plot.Plot, leg *plot.Legend, title, format string, size plotSize) ([]byte, error) {
	var c vg.CanvasWriterTo
	if format == "svg" {
		c = vgsvg.New(size.w, size.h)
	} else {
		c = vgimg.PngCanvas{Canvas: vgimg.NewWith(vgimg.UseWH(size.w, size.h), vgimg.UseDPI(size.dpi))}
	}
	dc := draw.New(c)
	dc.SetColor(color.White)
	dc.Fill(dc.Rectangle.Path())
	ts := p.Title.TextStyle
	ts.YAlign = draw.YTop
	// A title wider than the picture is set smaller, down to 8 points.
	for ts.Width(title) > dc.Size().X-2*plotMargin && ts.Font.Size > vg.Points(8) {
		ts.Font.Size -= vg.Points(0.5)
	}
	l := layoutPlot(dc, leg, title, ts)
	dc.FillText(ts, l.title, title)
	p.Draw(l.data)
	leg.Draw(l.legend)
	var buf bytes.Buffer
	if _, err := c.WriteTo(&buf); err != nil {
		return nil, fmt.Errorf("render %s: %w", format, err)
	}
	if format == "svg" {
		return svgFontFallback(buf.Bytes()), nil
	}
	return pngWithDPI(buf.Bytes(), size.dpi), nil
}

// svgFontFallback lets every text of an SVG fall back to fonts of the same
// widths (Arial, Helvetica) and then to the generic sans-serif family, so
// that a viewer without Liberation Sans still shows all the text.
func svgFontFallback(svg []byte) []byte {
	return bytes.ReplaceAll(svg, []byte("font-family:Liberation Sans;"),
		[]byte("font-family:'Liberation Sans',Arial,Helvetica,sans-serif;"))
}

// pngWithDPI records the resolution in a PNG's pHYs chunk (pixels per
// metre), right after the header chunk, so that documents place the
// picture at its size on the page.
func pngWithDPI(png []byte, dpi int) []byte {
	const ihdrEnd = 8 + 4 + 4 + 13 + 4 // signature and the IHDR chunk
	if len(png) < ihdrEnd || string(png[12:16]) != "IHDR" {
		return png
	}
	ppm := uint32(math.Round(float64(dpi) / 0.0254))
	chunk := make([]byte, 0, 21)
	chunk = binary.BigEndian.AppendUint32(chunk, 9)
	chunk = append(chunk, "pHYs"...)
	chunk = binary.BigEndian.AppendUint32(chunk, ppm)
	chunk = binary.BigEndian.AppendUint32(chunk, ppm)
	chunk = append(chunk, 1) // the unit is the metre
	chunk = binary.BigEndian.AppendUint32(chunk, crc32.ChecksumIEEE(chunk[4:]))
	out := make([]byte, 0, len(png)+len(chunk))
	out = append(out, png[:ihdrEnd]...)
	out = append(out, chunk...)
	return append(out, png[ihdrEnd:]...)
}
