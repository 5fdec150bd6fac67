package plots

import (
	"fmt"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
)

// Bar is one bar of a bar chart: its label and its value, in the unit that the value axis's
// label names (Axes.XLabel), e.g. a J0 in fA/cm^2.
type Bar struct {
	Label string  // category label, drawn beside the bar, e.g. "front: emitter"
	Value float64 // length of the bar, finite (negative values extend to the left)
}

// Bars returns a horizontal bar chart in the house style, one bar per entry, listed from top
// to bottom in the order given, with the labels on the vertical axis: the form for a budget
// of named parts (a J0 budget, a loss ranking). ax.Title and ax.XLabel (the value axis, with
// its unit) are used; the value axis is linear, holds 0 and leaves 5 % room beyond the bars. The bars are sized
// for the default figure (DefaultWidth × DefaultHeight). It returns an error for no bars, a
// non-finite value, an empty label, or axes options that a bar chart cannot honour (LogX,
// LogY, a YLabel).
func Bars(ax Axes, bars ...Bar) (*plot.Plot, error) {
	p, _, err := barChart(ax, bars)
	return p, err
}

// barChart is Bars, also returning the chart it adds (for the tests).
func barChart(ax Axes, bars []Bar) (*plot.Plot, *plotter.BarChart, error) {
	if len(bars) == 0 {
		return nil, nil, fmt.Errorf("plots: Bars: no bars to draw")
	}
	if ax.LogX || ax.LogY || ax.YLabel != "" {
		return nil, nil, fmt.Errorf("plots: Bars: a bar chart has a linear value axis and its labels on the category axis (LogX %v, LogY %v, YLabel %q)", ax.LogX, ax.LogY, ax.YLabel)
	}
	n := len(bars)
	vals := make(plotter.Values, n)
	labels := make([]string, n)
	for i, b := range bars {
		if math.IsNaN(b.Value) || math.IsInf(b.Value, 0) {
			return nil, nil, fmt.Errorf("plots: Bars: bar %d (%q) has a non-finite value %g", i, b.Label, b.Value)
		}
		if b.Label == "" {
			return nil, nil, fmt.Errorf("plots: Bars: bar %d has no label", i)
		}
		// The chart draws position 0 at the bottom: the first bar goes on top.
		vals[n-1-i], labels[n-1-i] = b.Value, b.Label
	}
	p := plot.New()
	p.Title.Text = ax.Title
	p.X.Label.Text = ax.XLabel
	p.Add(plotter.NewGrid())
	// Bars take 60 % of the slot each has in the data area of the default figure (its height
	// less about 2.5 cm of title and axis).
	width := 0.6 * (DefaultHeight - 2.5*vg.Centimeter) / vg.Length(n)
	chart, err := plotter.NewBarChart(vals, width)
	if err != nil {
		return nil, nil, fmt.Errorf("plots: Bars: %v", err)
	}
	chart.Horizontal = true
	chart.Color = palette[0]
	chart.LineStyle.Width = 0
	p.Add(chart)
	p.NominalY(labels...)
	// The value axis holds 0 and the bars, with 5 % room beyond their ends.
	lo, hi := math.Min(0, p.X.Min), math.Max(0, p.X.Max)
	pad := 0.05 * (hi - lo)
	if pad == 0 {
		pad = 1 // all bars of length 0
	}
	if hi > 0 || lo == 0 {
		hi += pad
	}
	if lo < 0 {
		lo -= pad
	}
	p.X.Min, p.X.Max = lo, hi
	return p, chart, nil
}
