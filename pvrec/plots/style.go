package plots

import (
	"image/color"
	"math"

	stdfont "golang.org/x/image/font"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/font"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// The house style, at the design size (scale 1, the print presets): type sizes in pt and
// line weights that read at a journal's column width (common practice: 7–9 pt text at print
// size, lines of about 1 pt). The Notebook and Slide presets scale the whole drawing.
const (
	tickSize   = 8    // tick labels, pt
	labelSize  = 9    // axis labels, pt
	legendSize = 8    // legend entries, pt
	titleSize  = 9.5  // title, pt
	letterSize = 10   // panel letters (a), (b), pt (bold)
	lineWidth  = 1.2  // curves, pt
	markerSize = 2.2  // marker radius, pt
	errWidth   = 0.8  // error bars, pt
	capWidth   = 3.5  // error-bar caps, pt
	axisWidth  = 0.6  // axis lines and ticks, pt
	tickLength = 3.5  // major ticks, pt (minor ticks are half as long)
	gridWidth  = 0.35 // grid lines, pt
	bandTint   = 0.28 // weight of a series colour in its uncertainty band (the rest is white)
	margin     = 0.04 // room left beyond the data on each side of an axis, fraction of its span
)

var (
	gridColor = color.Gray{Y: 215}
	inkColor  = color.Gray{Y: 25}
)

// palette is the house colour cycle: the Okabe–Ito colours for colour-blind readers
// (M. Okabe and K. Ito, "Color Universal Design (CUD): how to make figures and
// presentations that are friendly to colorblind people", 2002), without their yellow
// (#F0E442), too light on white.
var palette = []color.RGBA{
	{0, 114, 178, 255},   // blue #0072B2
	{213, 94, 0, 255},    // vermillion #D55E00
	{0, 158, 115, 255},   // bluish green #009E73
	{204, 121, 167, 255}, // reddish purple #CC79A7
	{230, 159, 0, 255},   // orange #E69F00
	{86, 180, 233, 255},  // sky blue #56B4E9
	{0, 0, 0, 255},       // black
}

// dashes cycle with the colours, so that curves stay apart in greyscale (pt; nil is solid).
// referenceDash is the pattern of a Series with Dashed set, outside the cycle.
var (
	dashes = [][]vg.Length{
		nil,                    // solid
		{6, 2.5},               // dashed
		{6, 2, 1.2, 2},         // dash-dot
		{1.2, 1.6},             // dotted
		{6, 2, 1.2, 2, 1.2, 2}, // dash-dot-dot
		{11, 2.5},              // long dash
		{8, 2, 3, 2},           // long-short
	}
	referenceDash = []vg.Length{2.5, 2}
)

// markers cycle with the colours: filled circle, square, triangle, diamond, inverted
// triangle, then open circle and square.
var markers = []marker{
	{shape: circle}, {shape: square}, {shape: triangle}, {shape: diamond}, {shape: invTriangle},
	{shape: circle, open: true}, {shape: square, open: true},
}

// styleOf returns the colour, dash pattern and marker of series i.
func styleOf(i int) (color.RGBA, []vg.Length, marker) {
	return palette[i%len(palette)], dashes[i%len(dashes)], markers[i%len(markers)]
}

// tint mixes c with white, keeping the weight w of c: an opaque light shade, which prints
// the same in every format (EPS has no transparency).
func tint(c color.RGBA, w float64) color.RGBA {
	mix := func(v uint8) uint8 { return uint8(math.Round(float64(v)*w + 255*(1-w))) }
	return color.RGBA{mix(c.R), mix(c.G), mix(c.B), 255}
}

type shape uint8

const (
	circle shape = iota
	square
	triangle
	diamond
	invTriangle
)

// marker is a glyph of the house style (draw.GlyphDrawer), filled or open.
type marker struct {
	shape shape
	open  bool
}

// DrawGlyph draws the marker at pt; sty.Radius is the radius of the circle of equal area.
func (m marker) DrawGlyph(c *draw.Canvas, sty draw.GlyphStyle, pt vg.Point) {
	r := sty.Radius
	var p vg.Path
	poly := func(k int, rot float64, rr vg.Length) {
		for i := 0; i < k; i++ {
			a := rot + 2*math.Pi*float64(i)/float64(k)
			q := vg.Point{X: pt.X + rr*vg.Length(math.Cos(a)), Y: pt.Y + rr*vg.Length(math.Sin(a))}
			if i == 0 {
				p.Move(q)
			} else {
				p.Line(q)
			}
		}
		p.Close()
	}
	switch m.shape {
	case square:
		poly(4, math.Pi/4, r*vg.Length(math.Sqrt(math.Pi/2))) // area πr²
	case triangle:
		poly(3, math.Pi/2, r*1.56) // area πr² needs 1.555 r
	case invTriangle:
		poly(3, -math.Pi/2, r*1.56)
	case diamond:
		poly(4, math.Pi/2, r*1.35)
	default:
		p.Move(vg.Point{X: pt.X + r, Y: pt.Y})
		p.Arc(pt, r, 0, 2*math.Pi)
		p.Close()
	}
	c.SetColor(sty.Color)
	if m.open {
		c.SetLineStyle(draw.LineStyle{Color: sty.Color, Width: vg.Points(0.9)})
		c.Stroke(p)
		return
	}
	c.Fill(p)
}

// houseFont returns the font of the house style at size pt: Liberation Sans, or Liberation
// Serif if serif.
func houseFont(size vg.Length, serif bool) font.Font {
	v := font.Variant("Sans")
	if serif {
		v = "Serif"
	}
	return font.Font{Typeface: "Liberation", Variant: v, Size: size}
}

// textStyle returns a text style of the house at size pt.
func textStyle(size vg.Length, xa text.XAlignment, ya text.YAlignment) text.Style {
	return text.Style{Color: color.Black, Font: houseFont(size, false), XAlign: xa, YAlign: ya, Handler: typesetter{}}
}

// newPlot returns an empty plot in the house style with ax's title and labels.
func newPlot(ax Axes) *plot.Plot {
	p := plot.New()
	p.TextHandler = typesetter{}
	p.Title.Text = ax.Title
	p.Title.TextStyle = textStyle(titleSize, draw.XCenter, draw.YTop)
	p.Title.Padding = vg.Points(4)
	p.X.Label.Text = ax.XLabel
	p.Y.Label.Text = ax.YLabel
	for _, a := range []*plot.Axis{&p.X, &p.Y} {
		a.Label.TextStyle = textStyle(labelSize, draw.XCenter, draw.YBottom)
		a.Label.Padding = vg.Points(2)
		a.LineStyle = draw.LineStyle{Color: inkColor, Width: vg.Points(axisWidth)}
		a.Tick.LineStyle = a.LineStyle
		a.Tick.Length = vg.Points(tickLength)
		a.Padding = 0 // the data range has its own margin; the axes meet at the corner
	}
	p.X.Tick.Label = textStyle(tickSize, draw.XCenter, draw.YTop)
	p.Y.Tick.Label = textStyle(tickSize, draw.XRight, draw.YCenter)
	p.X.Tick.Marker, p.Y.Tick.Marker = linTicks{}, linTicks{}
	if ax.LogX {
		p.X.Scale, p.X.Tick.Marker = plot.LogScale{}, logTicks{}
	}
	if ax.LogY {
		p.Y.Scale, p.Y.Tick.Marker = plot.LogScale{}, logTicks{}
	}
	p.Legend.TextStyle = textStyle(legendSize, draw.XLeft, draw.YBottom)
	p.Legend.ThumbnailWidth = vg.Points(16)
	p.Legend.Top = ax.Legend == TopLeft || ax.Legend == TopRight
	p.Legend.Left = ax.Legend == TopLeft || ax.Legend == BottomLeft
	p.Add(axisLabels{})
	return p
}

// newGrid returns the light grid of the house style, at the major ticks.
func newGrid() plot.Plotter {
	sty := draw.LineStyle{Color: gridColor, Width: vg.Points(gridWidth)}
	return &gridLines{sty: sty}
}

// gridLines draws the grid at the labelled ticks (plotter.Grid, with our style).
type gridLines struct {
	sty      draw.LineStyle
	vertical bool // vertical lines only (bar charts)
}

// Plot draws the grid.
func (g *gridLines) Plot(c draw.Canvas, plt *plot.Plot) {
	trX, trY := plt.Transforms(&c)
	for _, t := range plt.X.Tick.Marker.Ticks(plt.X.Min, plt.X.Max) {
		if x := trX(t.Value); !t.IsMinor() && x >= c.Min.X && x <= c.Max.X {
			c.StrokeLine2(g.sty, x, c.Min.Y, x, c.Max.Y)
		}
	}
	if g.vertical {
		return
	}
	for _, t := range plt.Y.Tick.Marker.Ticks(plt.Y.Min, plt.Y.Max) {
		if y := trY(t.Value); !t.IsMinor() && y >= c.Min.Y && y <= c.Max.Y {
			c.StrokeLine2(g.sty, c.Min.X, y, c.Max.X, y)
		}
	}
}

// restyled returns a shallow copy of p whose house text styles are set in the serif face if
// serif, and drawn in mode, with phantom axis labels (axislabels.go): the copy a Figure
// renders, leaving p as it was. Text styles that are not the house's (a plot made with
// plot.New) are left as they are.
func restyled(p *plot.Plot, serif bool, mode drawMode) *plot.Plot {
	q := *p
	if _, ok := q.X.Label.TextStyle.Handler.(typesetter); ok {
		q.X.Label.Text = phantomOf(q.X.Label.Text)
	}
	if _, ok := q.Y.Label.TextStyle.Handler.(typesetter); ok {
		q.Y.Label.Text = phantomOf(q.Y.Label.Text)
	}
	for _, s := range []*text.Style{&q.Title.TextStyle, &q.X.Label.TextStyle, &q.Y.Label.TextStyle,
		&q.X.Tick.Label, &q.Y.Tick.Label, &q.Legend.TextStyle} {
		restyle(s, serif, mode)
	}
	return &q
}

// restyle sets a house text style's face and drawing mode.
func restyle(s *text.Style, serif bool, mode drawMode) {
	if _, ok := s.Handler.(typesetter); !ok {
		return
	}
	s.Handler = typesetter{mode: mode}
	if serif {
		s.Font.Variant = "Serif"
	}
}

// letterStyle is the style of panel letters.
func letterStyle(serif bool, mode drawMode) text.Style {
	s := textStyle(letterSize, draw.XLeft, draw.YTop)
	s.Font.Weight = stdfont.WeightBold
	restyle(&s, serif, mode)
	return s
}
