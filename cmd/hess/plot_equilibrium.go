package main

import (
	"fmt"
	"io"
	"math"
	"path"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/plotutil"
	"gonum.org/v1/plot/vg"

	"hess/equilibrium"
	"hess/network"
)

// equilibriumPlotSamples is how many temperatures an equilibrium plot is
// computed at, evenly spaced in T.
const equilibriumPlotSamples = 60

// logFloor is the lowest mole fraction a log plot draws.
const logFloor = 1e-30

type equilibriumPlotRequest struct {
	root, mixture, temps, pressure string
	elements, log                  bool
	out, format                    string
	size                           plotSize
	includes                       []string
}

func runEquilibriumPlot(r equilibriumPlotRequest, stderr io.Writer) int {
	if r.mixture == "" {
		fmt.Fprintln(stderr, "hess plot: --equilibrium needs --mixture NAME")
		return exitTrouble
	}
	req := equilibriumRequest{root: r.root, names: []string{r.mixture}, includes: r.includes}
	if r.elements {
		req.basis = equilibrium.BasisElements
	}
	if r.pressure != "" {
		p, err := parsePressure(r.pressure)
		if err != nil {
			fmt.Fprintf(stderr, "hess plot: --pressure: %v\n", err)
			return exitTrouble
		}
		req.pressure = p
	}
	// The span: --temperatures, else the network's settings.
	var span []float64
	if r.temps != "" {
		ts, err := network.ParseTemperatures(r.temps)
		if err != nil {
			fmt.Fprintf(stderr, "hess plot: --temperatures: %v\n", err)
			return exitTrouble
		}
		span = ts
	} else {
		net, status := compileRoot("plot", r.root, network.Options{IncludePaths: r.includes}, stderr)
		if net == nil {
			return status
		}
		span = net.Settings.Temperatures
	}
	lo, hi := plotSpan(span)
	if !(lo < hi) || math.IsInf(lo, 0) {
		fmt.Fprintln(stderr, "hess plot: no span of temperatures to plot")
		return exitTrouble
	}
	req.temps = make([]float64, equilibriumPlotSamples)
	for i := range req.temps {
		req.temps[i] = lo + (hi-lo)*float64(i)/float64(equilibriumPlotSamples-1)
	}
	doc, status := equilibriumDocument(req, stderr)
	if doc == nil {
		return status
	}
	data, err := renderEquilibriumPlot(doc, r.log, r.format, r.size)
	if err != nil {
		fmt.Fprintf(stderr, "hess plot: %v\n", err)
		return exitTrouble
	}
	if err := writeOutput(r.out, doc.net, data); err != nil {
		fmt.Fprintf(stderr, "hess plot: %v\n", err)
		return exitTrouble
	}
	return status
}

// renderEquilibriumPlot draws each species' mole fraction in its phase
// against T, one line per species that is present somewhere in the span;
// results that did not converge are left out.
func renderEquilibriumPlot(doc *equilibriumDoc, logScale bool, format string, size plotSize) ([]byte, error) {
	if len(doc.Results) == 0 && len(doc.Aqueous) > 0 {
		return nil, fmt.Errorf("no results to plot: aqueous feeds (%s) are not plotted; hess equilibrium shows them", doc.Aqueous[0].Mixture.Name)
	}
	if len(doc.Results) == 0 {
		return nil, fmt.Errorf("no results to plot")
	}
	p := plot.New()
	setPlotFonts(p)
	c0 := doc.Results[0]
	title := fmt.Sprintf("%s: equilibrium of %s at %s", path.Base(doc.Network), c0.Mixture.Name, pressureText(c0.P))
	leg := plot.NewLegend()
	leg.TextStyle.Font = plotFont(legendFontSize)
	leg.Padding = vg.Points(2)
	p.X.Label.Text = "T [K]"
	p.Y.Label.Text = "mole fraction in its phase"
	if logScale {
		p.Y.Label.Text = "log10 mole fraction in its phase"
	}
	p.Y.Tick.Marker = niceTicks{}
	p.Add(plotter.NewGrid())
	var order []string
	lines := map[string]plotter.XYs{}
	for _, c := range doc.Results {
		if !c.Converged {
			continue
		}
		for _, s := range c.Species {
			key := s.Species.Key
			if _, ok := lines[key]; !ok {
				order = append(order, key)
				lines[key] = nil
			}
			y := s.MoleFraction
			if logScale {
				y = math.Log10(math.Max(y, logFloor))
			}
			lines[key] = append(lines[key], plotter.XY{X: c.T, Y: y})
		}
	}
	drawn := 0
	for i, key := range order {
		pts := lines[key]
		some := false
		for _, pt := range pts {
			if (logScale && pt.Y > math.Log10(logFloor)) || (!logScale && pt.Y > 0) {
				some = true
			}
		}
		if !some || len(pts) == 0 {
			continue
		}
		l, err := plotter.NewLine(pts)
		if err != nil {
			return nil, fmt.Errorf("line of %s: %w", key, err)
		}
		st := reactionStyle(i)
		l.LineStyle = st.line
		l.LineStyle.Dashes = plotutil.Dashes(i / len(okabeIto))
		p.Add(l)
		leg.Add(key, l)
		drawn++
	}
	if drawn == 0 {
		return nil, fmt.Errorf("no converged result to plot")
	}
	return drawPlot(p, &leg, title, format, size)
}
