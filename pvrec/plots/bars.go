package plots

import (
	"fmt"
	"image/color"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Bar is one bar of a bar chart: its label and its value, in the unit that the value axis's
// label names (Axes.XLabel), e.g. a J0 in fA/cm^2.
type Bar struct {
	Label string  // category label, drawn beside the bar, e.g. "front: emitter"
	Value float64 // length of the bar, finite (negative values extend to the left)
}

// BarSet is one set of bars of a grouped or stacked chart: one value per category, drawn in
// one colour of the house cycle, with one legend entry, e.g. the contact part of each
// region's J0.
type BarSet struct {
	Label  string    // legend entry, e.g. "contacts"
	Values []float64 // one value per category, in the unit of Axes.XLabel, finite
}

// Bars returns a horizontal bar chart in the house style, one bar per entry, listed from top
// to bottom in the order given, with the labels on the vertical axis: the form for a budget
// of named parts (a J0 budget, a loss ranking). ax.Title and ax.XLabel (the value axis, with
// its unit) are used; the value axis is linear, holds 0 and leaves 5 % room beyond the bars.
// Each bar takes 60 % of its slot, at any figure size. It returns an error for no bars, a
// non-finite value, an empty label, a label that is markup and does not parse, or axes
// options that a bar chart cannot honour (LogX, LogY, a YLabel, a RightLabel or LogRight).
func Bars(ax Axes, bars ...Bar) (*plot.Plot, error) {
	p, _, err := barChart(ax, bars)
	return p, err
}

// barChart is Bars, also returning the bars it adds (for the tests).
func barChart(ax Axes, bars []Bar) (*plot.Plot, *barPlotter, error) {
	if len(bars) == 0 {
		return nil, nil, fmt.Errorf("plots: Bars: no bars to draw")
	}
	cats := make([]string, len(bars))
	set := BarSet{Values: make([]float64, len(bars))}
	for i, b := range bars {
		if math.IsNaN(b.Value) || math.IsInf(b.Value, 0) {
			return nil, nil, fmt.Errorf("plots: Bars: bar %d (%q) has a non-finite value %g", i, b.Label, b.Value)
		}
		if b.Label == "" {
			return nil, nil, fmt.Errorf("plots: Bars: bar %d has no label", i)
		}
		cats[i], set.Values[i] = b.Label, b.Value
	}
	return barPlot("Bars", ax, cats, []BarSet{set}, false)
}

// Grouped returns a horizontal bar chart of several sets: for each category, listed from
// top to bottom, one bar per set side by side (the first set on top), each set in its colour
// of the house cycle with a legend entry (at ax.Legend): the form for comparing parts across
// designs. The value axis is as in Bars. It returns the errors of Bars, and an error for no
// sets, an empty set label, or a set whose number of values differs from the number of
// categories.
func Grouped(ax Axes, categories []string, sets ...BarSet) (*plot.Plot, error) {
	p, _, err := barPlot("Grouped", ax, categories, sets, false)
	return p, err
}

// Stacked returns a horizontal bar chart with one bar per category, listed from top to
// bottom, made of the sets' values laid end to end from 0 in the order given, each set in its
// colour of the house cycle, with thin white gaps between the parts (so that they stay apart
// in greyscale) and a legend entry per set (at ax.Legend): the form for a J0 budget by region
// and mechanism. The value axis is as in Bars. It returns the errors of Grouped, and an error
// for a negative value (a stack of signed parts has no single reading).
func Stacked(ax Axes, categories []string, sets ...BarSet) (*plot.Plot, error) {
	p, _, err := barPlot("Stacked", ax, categories, sets, true)
	return p, err
}

// barPlot builds the bar charts; name names the builder in errors.
func barPlot(name string, ax Axes, cats []string, sets []BarSet, stacked bool) (*plot.Plot, *barPlotter, error) {
	if ax.LogX || ax.LogY || ax.YLabel != "" || ax.RightLabel != "" || ax.LogRight {
		return nil, nil, fmt.Errorf("plots: %s: a bar chart has a linear value axis and its labels on the category axis (LogX %v, LogY %v, YLabel %q, RightLabel %q, LogRight %v)",
			name, ax.LogX, ax.LogY, ax.YLabel, ax.RightLabel, ax.LogRight)
	}
	if err := checkAxes(ax); err != nil {
		return nil, nil, err
	}
	n := len(cats)
	switch {
	case n == 0:
		return nil, nil, fmt.Errorf("plots: %s: no categories", name)
	case len(sets) == 0:
		return nil, nil, fmt.Errorf("plots: %s: no bar sets", name)
	}
	for i, c := range cats {
		if c == "" {
			return nil, nil, fmt.Errorf("plots: %s: category %d has no label", name, i)
		}
		if err := checkLabel(fmt.Sprintf("%s: category %d", name, i), c); err != nil {
			return nil, nil, err
		}
	}
	b := &barPlotter{stacked: stacked}
	lo, hi := 0.0, 0.0
	sums := make([]float64, n)
	for k, s := range sets {
		if len(sets) > 1 && s.Label == "" {
			return nil, nil, fmt.Errorf("plots: %s: set %d has no label", name, k)
		}
		if err := checkLabel(fmt.Sprintf("%s: set %d label", name, k), s.Label); err != nil {
			return nil, nil, err
		}
		if len(s.Values) != n {
			return nil, nil, fmt.Errorf("plots: %s: set %d (%q) has %d values for %d categories", name, k, s.Label, len(s.Values), n)
		}
		vals := make([]float64, n)
		for i, v := range s.Values {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return nil, nil, fmt.Errorf("plots: %s: set %d (%q) value %d is not finite (%g)", name, k, s.Label, i, v)
			}
			if stacked && v < 0 {
				return nil, nil, fmt.Errorf("plots: %s: set %d (%q) value %d is negative (%g); stacked parts must be ≥ 0", name, k, s.Label, i, v)
			}
			// The chart draws position 0 at the bottom: the first category goes on top.
			vals[n-1-i] = v
			sums[i] += v
			lo, hi = math.Min(lo, v), math.Max(hi, v)
		}
		b.values = append(b.values, vals)
		b.colours = append(b.colours, palette[k%len(palette)])
	}
	if stacked {
		for _, s := range sums {
			hi = math.Max(hi, s)
		}
		if math.IsInf(hi, 0) {
			return nil, nil, fmt.Errorf("plots: %s: the stacked values overflow", name)
		}
	}
	// The value axis holds 0 and the bars, with 5 % room beyond their ends.
	pad := 0.05 * (hi - lo)
	switch {
	case math.IsInf(hi-lo, 0):
		return nil, nil, fmt.Errorf("plots: %s: values from %g to %g span more than a float64 holds; rescale them", name, lo, hi)
	case pad == 0:
		pad = 1 // all bars of length 0
	case math.IsInf(hi-lo+2*pad, 0):
		pad = 0
	}
	if hi > 0 || lo == 0 {
		hi += pad
	}
	if lo < 0 {
		lo -= pad
	}
	ax.LogX, ax.LogY = false, false
	p := newPlot(ax)
	p.X.Min, p.X.Max = lo, hi
	p.Y.Min, p.Y.Max = -0.5, float64(n)-0.5
	p.Add(&gridLines{sty: draw.LineStyle{Color: gridColor, Width: vg.Points(gridWidth)}, vertical: true})
	p.Add(b)
	labels := make([]string, n)
	for i, c := range cats {
		labels[n-1-i] = c
	}
	p.NominalY(labels...)
	if len(sets) > 1 {
		var lg legendBox
		for k, s := range sets {
			lg.add(s.Label, swatch{b.colours[k]})
		}
		lg.addTo(p)
	}
	return p, b, nil
}

// barPlotter draws horizontal bars at the category positions 0, 1, … (bottom to top),
// sized from the slot between positions when drawn, so that they fit every figure size.
type barPlotter struct {
	values  [][]float64 // values[k][i] is set k at category position i
	colours []color.Color
	stacked bool
}

// Plot draws the bars.
func (b *barPlotter) Plot(c draw.Canvas, plt *plot.Plot) {
	trX, trY := plt.Transforms(&c)
	slot := vg.Length(math.Abs(float64(trY(1) - trY(0))))
	k := len(b.values)
	gap := draw.LineStyle{Color: color.White, Width: vg.Points(0.6)}
	for i := range b.values[0] {
		yc := trY(float64(i))
		if b.stacked {
			th, base := 0.6*slot, 0.0
			for s := range b.values {
				v := b.values[s][i]
				x0, x1 := trX(base), trX(base+v)
				c.SetColor(b.colours[s])
				c.Fill(vg.Rectangle{Min: vg.Point{X: x0, Y: yc - th/2}, Max: vg.Point{X: x1, Y: yc + th/2}}.Path())
				if s > 0 && v > 0 {
					c.StrokeLine2(gap, x0, yc-th/2, x0, yc+th/2)
				}
				base += v
			}
			continue
		}
		th := 0.6 * slot
		if k > 1 {
			th = 0.8 * slot / vg.Length(k)
		}
		for s := range b.values {
			y := yc + th*(vg.Length(k)/2-vg.Length(s)-0.5)
			x0, x1 := trX(0), trX(b.values[s][i])
			c.SetColor(b.colours[s])
			c.Fill(vg.Rectangle{Min: vg.Point{X: min(x0, x1), Y: y - th/2}, Max: vg.Point{X: max(x0, x1), Y: y + th/2}}.Path())
		}
	}
}

// swatch is the legend thumbnail of a bar set: a filled square, a little smaller than the
// entry's height so that swatches stay apart.
type swatch struct{ c color.Color }

// Thumbnail draws the swatch in c.
func (s swatch) Thumbnail(c *draw.Canvas) {
	h := 0.8 * (c.Max.Y - c.Min.Y)
	x, y := (c.Min.X+c.Max.X)/2, (c.Min.Y+c.Max.Y)/2
	c.SetColor(s.c)
	c.Fill(vg.Rectangle{Min: vg.Point{X: x - h/2, Y: y - h/2}, Max: vg.Point{X: x + h/2, Y: y + h/2}}.Path())
}
