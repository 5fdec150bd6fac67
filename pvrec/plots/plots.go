package plots

import (
	"bytes"
	"fmt"
	"image/color"
	"math"
	"os"
	"path/filepath"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgsvg"
)

// Series is one curve of a figure: paired X and Y values in the units named by the axes'
// labels, and a legend label (empty for no legend entry).
type Series struct {
	Label  string    // legend entry, e.g. "Schenk1998"
	X, Y   []float64 // data, same length, at least one point
	Dashed bool      // draw the line dashed (for references and limits)
	Points bool      // draw markers at the data points instead of a line (for measurements)
}

// Axes describes the frame of a figure: a title, axis labels with their units, e.g.
// "Δn (cm⁻³)", and whether each axis is logarithmic.
type Axes struct {
	Title      string         // figure title, empty for none
	XLabel     string         // horizontal axis label with its unit, e.g. "Δn (cm^-3)"
	YLabel     string         // vertical axis label with its unit, e.g. "τ (s)"
	LogX, LogY bool           // logarithmic axes (every value on them must be > 0)
	Legend     LegendPosition // corner of the legend; the zero value is TopLeft
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

// Default figure size used by SVG and Save: 16 cm × 10 cm, readable inline in a notebook
// and in a two-column paper at full width.
const (
	DefaultWidth  = 16 * vg.Centimeter // default figure width
	DefaultHeight = 10 * vg.Centimeter // default figure height
)

// MaxSize is the largest width or height Encode accepts: 1 m, a poster (our choice). A PNG of
// 1 m × 1 m at gonum's 96 dpi holds 14 million pixels; larger sizes would only exhaust memory.
const MaxSize = 100 * vg.Centimeter

// palette is the house colour cycle (colour-blind-safe Okabe–Ito hues).
var palette = []color.RGBA{
	{0, 114, 178, 255},   // blue
	{213, 94, 0, 255},    // vermillion
	{0, 158, 115, 255},   // bluish green
	{204, 121, 167, 255}, // reddish purple
	{230, 159, 0, 255},   // orange
	{86, 180, 233, 255},  // sky blue
	{0, 0, 0, 255},       // black
}

// Lines returns a figure with one line (or marker set) per series in the house style. It
// returns an error naming the series and point for mismatched lengths, empty series, NaN or
// infinite values, or non-positive values on a logarithmic axis, and an error if the values on
// a linear axis span more than a float64 can hold (max − min overflows). An axis whose values
// are all equal v is drawn over [v − 1, v + 1] as gonum/plot does, or, where that range is
// empty (|v| above 2^53) or not positive on a logarithmic axis, over ±10 % of v
// (logarithmic: a decade either side).
func Lines(ax Axes, series ...Series) (*plot.Plot, error) {
	if len(series) == 0 {
		return nil, fmt.Errorf("plots: no series to draw")
	}
	if ax.Legend > BottomRight {
		return nil, fmt.Errorf("plots: unknown legend position %d", ax.Legend)
	}
	for i, s := range series {
		if err := checkSeries(i, s, ax); err != nil {
			return nil, err
		}
	}
	p := plot.New()
	p.Title.Text = ax.Title
	p.X.Label.Text = ax.XLabel
	p.Y.Label.Text = ax.YLabel
	p.Add(plotter.NewGrid())
	if ax.LogX {
		p.X.Scale = plot.LogScale{}
		p.X.Tick.Marker = plot.LogTicks{Prec: -1}
	}
	if ax.LogY {
		p.Y.Scale = plot.LogScale{}
		p.Y.Tick.Marker = plot.LogTicks{Prec: -1}
	}
	p.Legend.Top = ax.Legend == TopLeft || ax.Legend == TopRight
	p.Legend.Left = ax.Legend == TopLeft || ax.Legend == BottomLeft
	p.Legend.XOffs = vg.Points(6)
	if !p.Legend.Left {
		p.Legend.XOffs = -vg.Points(6)
	}
	p.Legend.YOffs = -vg.Points(4)
	if !p.Legend.Top {
		p.Legend.YOffs = vg.Points(4)
	}
	p.Legend.Padding = vg.Points(1)
	if err := setRange(&p.X, "x", ax.LogX, series, func(s Series) []float64 { return s.X }); err != nil {
		return nil, err
	}
	if err := setRange(&p.Y, "y", ax.LogY, series, func(s Series) []float64 { return s.Y }); err != nil {
		return nil, err
	}
	for i, s := range series {
		xy := make(plotter.XYs, len(s.X))
		for k := range s.X {
			xy[k].X, xy[k].Y = s.X[k], s.Y[k]
		}
		c := palette[i%len(palette)]
		if s.Points {
			sc, err := plotter.NewScatter(xy)
			if err != nil {
				return nil, fmt.Errorf("plots: series %d (%q): %v", i, s.Label, err)
			}
			sc.GlyphStyle.Color = c
			sc.GlyphStyle.Shape = draw.CircleGlyph{}
			sc.GlyphStyle.Radius = vg.Points(2)
			p.Add(sc)
			if s.Label != "" {
				p.Legend.Add(s.Label, sc)
			}
			continue
		}
		l, err := plotter.NewLine(xy)
		if err != nil {
			return nil, fmt.Errorf("plots: series %d (%q): %v", i, s.Label, err)
		}
		l.Color = c
		l.Width = vg.Points(1.5)
		if s.Dashed {
			l.Dashes = []vg.Length{vg.Points(5), vg.Points(3)}
		}
		p.Add(l)
		if s.Label != "" {
			p.Legend.Add(s.Label, l)
		}
	}
	return p, nil
}

// setRange sets the range of axis a (named name, logarithmic if log) to that of the values
// of every series. When they are all equal it pads them by ±1 as gonum/plot would, unless that
// fails: below the resolution of large values (gonum/plot's "illegal range" panic) or to 0 or
// less on a log axis (a panic); then it pads by 10 % (a decade on a log axis). It returns an
// error if max − min overflows on a linear axis (gonum/plot then hangs in its tick search).
// The data added later leave the range as set, since it holds them.
func setRange(a *plot.Axis, name string, log bool, series []Series, vals func(Series) []float64) error {
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, s := range series {
		for _, v := range vals(s) {
			lo, hi = math.Min(lo, v), math.Max(hi, v)
		}
	}
	switch {
	case !log && math.IsInf(hi-lo, 0):
		return fmt.Errorf("plots: %s values from %g to %g span more than a float64 holds; rescale them", name, lo, hi)
	case lo < hi:
	case lo-1 < hi+1 && (!log || lo-1 > 0):
		lo, hi = lo-1, hi+1
	case log:
		lo, hi = math.Max(lo/10, math.SmallestNonzeroFloat64), math.Min(hi*10, math.MaxFloat64)
	default:
		d := 0.1 * math.Abs(lo)
		lo, hi = math.Max(lo-d, -math.MaxFloat64), math.Min(hi+d, math.MaxFloat64)
	}
	a.Min, a.Max = lo, hi
	return nil
}

func checkSeries(i int, s Series, ax Axes) error {
	if len(s.X) == 0 {
		return fmt.Errorf("plots: series %d (%q) is empty", i, s.Label)
	}
	if len(s.X) != len(s.Y) {
		return fmt.Errorf("plots: series %d (%q) has %d X values but %d Y values", i, s.Label, len(s.X), len(s.Y))
	}
	for k := range s.X {
		x, y := s.X[k], s.Y[k]
		if math.IsNaN(x) || math.IsInf(x, 0) || math.IsNaN(y) || math.IsInf(y, 0) {
			return fmt.Errorf("plots: series %d (%q) point %d is not finite (x=%g, y=%g)", i, s.Label, k, x, y)
		}
		if ax.LogX && x <= 0 {
			return fmt.Errorf("plots: series %d (%q) point %d: x=%g must be > 0 on a log axis", i, s.Label, k, x)
		}
		if ax.LogY && y <= 0 {
			return fmt.Errorf("plots: series %d (%q) point %d: y=%g must be > 0 on a log axis", i, s.Label, k, y)
		}
	}
	return nil
}

// Encode renders p in the given format ("svg", "pdf", "png", "eps", "jpg") at width w and
// height h (each > 0 and at most MaxSize) and returns the bytes. A plot that gonum/plot cannot
// draw (such as a zero plot.Plot, not made by plot.New or Lines) is an error, not a panic.
func Encode(p *plot.Plot, w, h vg.Length, format string) (b []byte, err error) {
	defer recoverDraw(&err)
	if p == nil {
		return nil, fmt.Errorf("plots: nil plot")
	}
	if !(w > 0 && h > 0 && w <= MaxSize && h <= MaxSize) {
		return nil, fmt.Errorf("plots: figure size must be positive and at most %v cm per side, got %v × %v cm",
			float64(MaxSize/vg.Centimeter), float64(w/vg.Centimeter), float64(h/vg.Centimeter))
	}
	wt, err := p.WriterTo(w, h, format)
	if err != nil {
		return nil, fmt.Errorf("plots: %v", err)
	}
	var buf bytes.Buffer
	if _, err := wt.WriteTo(&buf); err != nil {
		return nil, fmt.Errorf("plots: rendering %s: %v", format, err)
	}
	return buf.Bytes(), nil
}

// SVG renders p as a self-contained SVG document at the default size, with its fonts
// embedded (about 0.5 MB), so that text is measured and drawn alike in every viewer: this is
// the form for files that travel (Save uses it). Like Encode it returns an error for a plot
// gonum/plot cannot draw. Labels should use characters the Liberation
// fonts have; write units as "cm^-3", not with superscript minus signs, which they lack.
func SVG(p *plot.Plot) ([]byte, error) {
	return renderSVG(p, true)
}

// SVGInline renders p as a light SVG document (a few tens of kB) without embedded fonts, for
// display in a notebook. Text is set in Liberation Serif with the metric-compatible Times New
// Roman and Times as fall-backs, so the layout computed by gonum/plot holds wherever one of them
// is installed.
func SVGInline(p *plot.Plot) ([]byte, error) {
	b, err := renderSVG(p, false)
	if err != nil {
		return nil, err
	}
	return bytes.ReplaceAll(b, []byte("font-family:Liberation Serif;"),
		[]byte("font-family:'Liberation Serif','Times New Roman',Times,serif;")), nil
}

// recoverDraw turns a panic of gonum/plot while drawing into the error *err.
func recoverDraw(err *error) {
	if r := recover(); r != nil {
		*err = fmt.Errorf("plots: gonum/plot cannot draw this plot (make it with Lines or plot.New): %v", r)
	}
}

func renderSVG(p *plot.Plot, embed bool) (b []byte, err error) {
	defer recoverDraw(&err)
	if p == nil {
		return nil, fmt.Errorf("plots: nil plot")
	}
	c := vgsvg.NewWith(vgsvg.UseWH(DefaultWidth, DefaultHeight), vgsvg.EmbedFonts(embed))
	p.Draw(draw.New(c))
	var buf bytes.Buffer
	if _, err := c.WriteTo(&buf); err != nil {
		return nil, fmt.Errorf("plots: rendering svg: %v", err)
	}
	return buf.Bytes(), nil
}

// Save writes p to path at the default size; the extension (.svg, .pdf, .png) picks the format.
func Save(p *plot.Plot, path string) error {
	ext := strings.TrimPrefix(strings.ToLower(filepath.Ext(path)), ".")
	switch ext {
	case "svg", "pdf", "png":
	default:
		return fmt.Errorf("plots: unsupported file extension %q in %s (want .svg, .pdf or .png)", ext, path)
	}
	var b []byte
	var err error
	if ext == "svg" {
		b, err = SVG(p)
	} else {
		b, err = Encode(p, DefaultWidth, DefaultHeight, ext)
	}
	if err != nil {
		return err
	}
	if err := os.WriteFile(path, b, 0o644); err != nil {
		return fmt.Errorf("plots: %v", err)
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
