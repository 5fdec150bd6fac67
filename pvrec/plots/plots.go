package plots

import (
	"fmt"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Series is one curve of a figure: paired X and Y values in the units named by the axes'
// labels, and a legend label (empty for no legend entry). Optional fields add error bars, an
// uncertainty band, or put the curve on the right-hand y axis.
type Series struct {
	Label  string    // legend entry, e.g. "Schenk1998" (plain or markup, see the package doc)
	X, Y   []float64 // data, same length, at least one point; Y may be nil for a band alone
	Dashed bool      // draw the line dashed (for references and limits), outside the dash cycle
	Points bool      // draw markers at the data points instead of a line (for measurements)
	YErr   []float64 // error bars: Y[k] ± YErr[k] (YErr[k] ≥ 0, in Y's unit); nil for none
	Lo, Hi []float64 // an uncertainty band from Lo[k] to Hi[k] (Lo[k] ≤ Hi[k]) under the curve; nil for none
	Right  bool      // plot against the right-hand y axis (Axes.RightLabel, Axes.LogRight)
}

// Axes describes the frame of a figure: a title, axis labels with their units, e.g.
// "Δn (cm^-3)" or `$\Delta n$ (cm$^{-3}$)`, and whether each axis is logarithmic.
type Axes struct {
	Title      string         // figure title, empty for none
	XLabel     string         // horizontal axis label with its unit, e.g. "Δn (cm^-3)"
	YLabel     string         // vertical axis label with its unit, e.g. "τ (s)"
	LogX, LogY bool           // logarithmic axes (every value on them must be > 0)
	Legend     LegendPosition // corner of the data area where the legend goes; the zero value is TopLeft
	RightLabel string         // label of the right-hand scale: the second y axis of Lines, the colour bar of HeatMap
	LogRight   bool           // logarithmic right-hand scale (every value on it must be > 0)
}

// LegendPosition is the corner of the data area where the legend is drawn; pick the one the
// curves leave free.
type LegendPosition uint8

// Legend corners.
const (
	TopLeft LegendPosition = iota
	TopRight
	BottomLeft
	BottomRight
)

// Default figure size used by SVG, SVGInline and Save: 16 cm × 10 cm, the Notebook preset.
const (
	DefaultWidth  = 16 * vg.Centimeter // default figure width
	DefaultHeight = 10 * vg.Centimeter // default figure height
)

// MaxSize is the largest width or height Encode and Figure accept: 1 m, a poster (our
// choice). A PNG of 1 m × 1 m at gonum's 96 dpi holds 14 million pixels; raster images are
// further bounded by MaxPixels.
const MaxSize = 100 * vg.Centimeter

// Lines returns a figure with one curve per series in the house style: a line (dashed if
// Dashed, the dash pattern otherwise cycling with the colour), or markers if Points (their
// shape cycling with the colour), with error bars if YErr is set and a band in a light tint
// of the colour if Lo and Hi are set. Series with Right are drawn against a second y axis on
// the right, labelled ax.RightLabel and logarithmic if ax.LogRight.
//
// Every axis holds all the data, error bars and bands, with a margin of 4 % of its span (of
// its decades on a logarithmic axis) on each side, and room for markers, so that nothing is
// clipped. It returns an error naming the series and point for mismatched lengths, empty
// series, NaN or infinite values, negative error bars, a band with Lo above Hi, or
// non-positive values (or error bars reaching to 0 or below) on a logarithmic axis; an error
// if the values on a linear axis span more than a float64 can hold (max − min overflows); an
// error for a label that is markup and does not parse; and an error if every series is on
// the right, or RightLabel or LogRight is set with no series on the right. An axis whose
// values are all equal v is drawn over [v − 1, v + 1] as gonum/plot does, or, where that
// range is empty (|v| above 2^53) or not positive on a logarithmic axis, over ±10 % of v
// (logarithmic: a decade either side).
func Lines(ax Axes, series ...Series) (*plot.Plot, error) {
	if len(series) == 0 {
		return nil, fmt.Errorf("plots: no series to draw")
	}
	if err := checkAxes(ax); err != nil {
		return nil, err
	}
	nRight := 0
	for i, s := range series {
		if err := checkSeries(i, s, ax); err != nil {
			return nil, err
		}
		if s.Right {
			nRight++
		}
	}
	switch {
	case nRight == len(series):
		return nil, fmt.Errorf("plots: every series is on the right axis; put at least one on the left")
	case nRight == 0 && (ax.RightLabel != "" || ax.LogRight):
		return nil, fmt.Errorf("plots: RightLabel or LogRight set, but no series has Right")
	}
	xs, ys, rs := newSpan(), newSpan(), newSpan()
	for _, s := range series {
		xs.add(s.X...)
		y := &ys
		if s.Right {
			y = &rs
		}
		y.add(s.Y...)
		y.add(s.Lo...)
		y.add(s.Hi...)
		for k, e := range s.YErr {
			y.add(s.Y[k]-e, s.Y[k]+e)
		}
	}
	p := newPlot(ax)
	var err error
	if p.X.Min, p.X.Max, err = xs.axis("x", ax.LogX); err != nil {
		return nil, err
	}
	if p.Y.Min, p.Y.Max, err = ys.axis("y", ax.LogY); err != nil {
		return nil, err
	}
	var right *rightScale
	if nRight > 0 {
		right = &rightScale{label: ax.RightLabel, axis: p.Y}
		right.axis.Scale, right.axis.Tick.Marker = plot.LinearScale{}, linTicks{}
		if ax.LogRight {
			right.axis.Scale, right.axis.Tick.Marker = plot.LogScale{}, logTicks{}
		}
		if right.axis.Min, right.axis.Max, err = rs.axis("right y", ax.LogRight); err != nil {
			return nil, err
		}
	}
	p.Add(newGrid())
	thumbs := make([][]plot.Thumbnailer, len(series))
	add := func(i int, pl plot.Plotter, th plot.Thumbnailer) {
		if series[i].Right {
			pl = onRight{Plotter: pl, axis: right.axis}
		}
		p.Add(pl)
		thumbs[i] = append(thumbs[i], th)
	}
	// Bands under everything, then lines, error bars and markers.
	for i, s := range series {
		if s.Lo == nil {
			continue
		}
		c, _, _ := styleOf(i)
		ring := make(plotter.XYs, 0, 2*len(s.X))
		for k := range s.X {
			ring = append(ring, plotter.XY{X: s.X[k], Y: s.Hi[k]})
		}
		for k := len(s.X) - 1; k >= 0; k-- {
			ring = append(ring, plotter.XY{X: s.X[k], Y: s.Lo[k]})
		}
		band, err := plotter.NewPolygon(ring)
		if err != nil {
			return nil, fmt.Errorf("plots: series %d (%q): band: %v", i, s.Label, err)
		}
		band.Color, band.LineStyle.Width = tint(c, bandTint), 0
		add(i, band, band)
	}
	for i, s := range series {
		if s.Y == nil || s.Points {
			continue
		}
		c, dash, _ := styleOf(i)
		l, err := plotter.NewLine(xys(s.X, s.Y))
		if err != nil {
			return nil, fmt.Errorf("plots: series %d (%q): %v", i, s.Label, err)
		}
		l.Color, l.Width, l.Dashes = c, vg.Points(lineWidth), dash
		if s.Dashed {
			l.Dashes = referenceDash
		}
		add(i, l, l)
	}
	for i, s := range series {
		if s.YErr == nil {
			continue
		}
		c, _, _ := styleOf(i)
		eb, err := plotter.NewYErrorBars(errorBars{xys(s.X, s.Y), s.YErr})
		if err != nil {
			return nil, fmt.Errorf("plots: series %d (%q): error bars: %v", i, s.Label, err)
		}
		eb.LineStyle = draw.LineStyle{Color: c, Width: vg.Points(errWidth)}
		eb.CapWidth = vg.Points(capWidth)
		add(i, eb, errThumb{eb.LineStyle})
	}
	for i, s := range series {
		if !s.Points {
			continue
		}
		c, _, m := styleOf(i)
		sc, err := plotter.NewScatter(xys(s.X, s.Y))
		if err != nil {
			return nil, fmt.Errorf("plots: series %d (%q): %v", i, s.Label, err)
		}
		sc.GlyphStyle = draw.GlyphStyle{Color: c, Shape: m, Radius: vg.Points(markerSize)}
		add(i, sc, sc)
	}
	if right != nil {
		p.Add(right)
	}
	var lg legendBox
	for i, s := range series {
		lg.add(s.Label, thumbs[i]...)
	}
	lg.addTo(p)
	return p, nil
}

// xys pairs x and y.
func xys(x, y []float64) plotter.XYs {
	v := make(plotter.XYs, len(x))
	for k := range x {
		v[k].X, v[k].Y = x[k], y[k]
	}
	return v
}

// errorBars are points with symmetric errors (plotter.YErrorer).
type errorBars struct {
	plotter.XYs
	err []float64
}

// YError returns the error of point i below and above it.
func (e errorBars) YError(i int) (float64, float64) { return e.err[i], e.err[i] }

// onRight draws a plotter against the right-hand axis.
type onRight struct {
	plot.Plotter
	axis plot.Axis
}

// Plot draws the plotter with the right-hand axis as its y axis.
func (r onRight) Plot(c draw.Canvas, plt *plot.Plot) {
	q := *plt
	q.Y = r.axis
	r.Plotter.Plot(c, &q)
}

// GlyphBoxes returns the plotter's glyph boxes, placed against the right-hand axis.
func (r onRight) GlyphBoxes(plt *plot.Plot) []plot.GlyphBox {
	gb, ok := r.Plotter.(plot.GlyphBoxer)
	if !ok {
		return nil
	}
	q := *plt
	q.Y = r.axis
	return gb.GlyphBoxes(&q)
}

// span is the range of a set of values.
type span struct{ lo, hi float64 }

func newSpan() span { return span{math.Inf(1), math.Inf(-1)} }

// add widens the span to hold vs.
func (s *span) add(vs ...float64) {
	for _, v := range vs {
		s.lo, s.hi = math.Min(s.lo, v), math.Max(s.hi, v)
	}
}

// axis returns the range of an axis (named name, logarithmic if log) that holds the span
// with a margin on each side. When its values are all equal it pads them by ±1 as gonum/plot
// would, unless that fails: below the resolution of large values (gonum/plot's "illegal
// range" panic) or to 0 or less on a log axis (a panic); then it pads by 10 % (a decade on a
// log axis). It returns an error if max − min overflows on a linear axis (gonum/plot then
// hangs in its tick search).
func (s span) axis(name string, log bool) (lo, hi float64, err error) {
	lo, hi = s.lo, s.hi
	switch {
	case !log && math.IsInf(hi-lo, 0):
		return 0, 0, fmt.Errorf("plots: %s values from %g to %g span more than a float64 holds; rescale them", name, lo, hi)
	case lo < hi && log:
		m := margin * (math.Log10(hi) - math.Log10(lo))
		lo, hi = math.Max(lo/math.Pow(10, m), math.SmallestNonzeroFloat64), math.Min(hi*math.Pow(10, m), math.MaxFloat64)
	case lo < hi:
		if m := margin * (hi - lo); !math.IsInf((hi+m)-(lo-m), 0) {
			lo, hi = lo-m, hi+m
		}
	case lo-1 < hi+1 && (!log || lo-1 > 0):
		lo, hi = lo-1, hi+1
	case log:
		lo, hi = math.Max(lo/10, math.SmallestNonzeroFloat64), math.Min(hi*10, math.MaxFloat64)
	default:
		d := 0.1 * math.Abs(lo)
		lo, hi = math.Max(lo-d, -math.MaxFloat64), math.Min(hi+d, math.MaxFloat64)
	}
	return lo, hi, nil
}

// checkAxes checks the options and labels of ax.
func checkAxes(ax Axes) error {
	if ax.Legend > BottomRight {
		return fmt.Errorf("plots: unknown legend position %d", ax.Legend)
	}
	for _, l := range []struct{ what, s string }{{"title", ax.Title}, {"x label", ax.XLabel},
		{"y label", ax.YLabel}, {"right label", ax.RightLabel}} {
		if err := checkLabel(l.what, l.s); err != nil {
			return err
		}
	}
	return nil
}

func checkSeries(i int, s Series, ax Axes) error {
	if len(s.X) == 0 {
		return fmt.Errorf("plots: series %d (%q) is empty", i, s.Label)
	}
	if err := checkLabel(fmt.Sprintf("series %d label", i), s.Label); err != nil {
		return err
	}
	if (s.Lo == nil) != (s.Hi == nil) {
		return fmt.Errorf("plots: series %d (%q): a band needs both Lo and Hi", i, s.Label)
	}
	if s.Y == nil && s.Lo == nil {
		return fmt.Errorf("plots: series %d (%q) has %d X values but 0 Y values", i, s.Label, len(s.X))
	}
	for _, v := range []struct {
		name string
		vs   []float64
	}{{"Y", s.Y}, {"YErr", s.YErr}, {"Lo", s.Lo}, {"Hi", s.Hi}} {
		if v.vs != nil && len(v.vs) != len(s.X) {
			return fmt.Errorf("plots: series %d (%q) has %d X values but %d %s values", i, s.Label, len(s.X), len(v.vs), v.name)
		}
	}
	if s.YErr != nil && s.Y == nil {
		return fmt.Errorf("plots: series %d (%q): error bars need Y values", i, s.Label)
	}
	if s.Points && s.Y == nil {
		return fmt.Errorf("plots: series %d (%q): markers need Y values", i, s.Label)
	}
	logY := ax.LogY
	if s.Right {
		logY = ax.LogRight
	}
	at := func(vs []float64, k int) float64 {
		if vs == nil {
			return 1
		}
		return vs[k]
	}
	for k := range s.X {
		x, y, e, lo, hi := s.X[k], at(s.Y, k), 0.0, at(s.Lo, k), at(s.Hi, k)
		if s.YErr != nil {
			e = s.YErr[k]
		}
		if math.IsNaN(x) || math.IsInf(x, 0) || math.IsNaN(y) || math.IsInf(y, 0) {
			return fmt.Errorf("plots: series %d (%q) point %d is not finite (x=%g, y=%g)", i, s.Label, k, x, y)
		}
		if math.IsNaN(e) || math.IsInf(e, 0) || e < 0 {
			return fmt.Errorf("plots: series %d (%q) point %d: error bar %g must be finite and ≥ 0", i, s.Label, k, e)
		}
		if math.IsNaN(lo) || math.IsInf(lo, 0) || math.IsNaN(hi) || math.IsInf(hi, 0) || lo > hi {
			return fmt.Errorf("plots: series %d (%q) point %d: band from %g to %g must be finite with Lo ≤ Hi", i, s.Label, k, lo, hi)
		}
		if math.IsInf(y+e, 0) || math.IsInf(y-e, 0) {
			return fmt.Errorf("plots: series %d (%q) point %d: y ± error bar overflows (y=%g, error %g)", i, s.Label, k, y, e)
		}
		if ax.LogX && x <= 0 {
			return fmt.Errorf("plots: series %d (%q) point %d: x=%g must be > 0 on a log axis", i, s.Label, k, x)
		}
		if logY && (y <= 0 || lo <= 0) {
			return fmt.Errorf("plots: series %d (%q) point %d: y=%g must be > 0 on a log axis", i, s.Label, k, math.Min(y, lo))
		}
		if logY && y-e <= 0 {
			return fmt.Errorf("plots: series %d (%q) point %d: the error bar reaches y − error = %g, not > 0 as a log axis needs", i, s.Label, k, y-e)
		}
	}
	return nil
}

// Func evaluates f at every x and returns the curve as a Series with the given label. It is
// the one loop a notebook would otherwise paste: f is typically a closure over a pvrec model.
// It returns an error naming the label and x at the first failing evaluation, or for an
// empty xs or a nil f.
func Func(label string, xs []float64, f func(x float64) (float64, error)) (Series, error) {
	if len(xs) == 0 {
		return Series{}, fmt.Errorf("plots: curve %q has no x values", label)
	}
	if f == nil {
		return Series{}, fmt.Errorf("plots: curve %q has a nil function", label)
	}
	s := Series{Label: label, X: append([]float64(nil), xs...), Y: make([]float64, len(xs))}
	for i, x := range xs {
		y, err := f(x)
		if err != nil {
			return Series{}, fmt.Errorf("plots: curve %q at x=%g: %w", label, x, err)
		}
		s.Y[i] = y
	}
	return s, nil
}
