package plots

import (
	"image/color"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Sizes of the colour bar, pt.
const (
	barGap   = 6  // between the data area and the colour bar
	barWidth = 9  // width of the colour bar
	barSteps = 96 // colour steps drawn along the bar
)

// rightScale is the scale on the right of the data area: the second y axis of a twin-axis
// plot, or the colour bar of a heat map (if colour is set). gonum/plot draws axes only on
// the left and at the bottom; this plotter draws the right one from the plot's y-axis
// styles, and asks for its room through a glyph box at the right edge, which makes
// gonum/plot narrow the data area.
type rightScale struct {
	axis   plot.Axis // Min, Max, Scale and Tick.Marker of the scale
	label  string
	colour func(t float64) color.Color // colour at t ∈ [0, 1] along the bar; nil for an axis
	levels []float64                   // values marked across the colour bar
}

// width is the room the scale takes right of the data area.
func (r *rightScale) width(plt *plot.Plot) vg.Length {
	w := r.offset()
	if plt.Y.Tick.Length > 0 {
		w += plt.Y.Tick.Length
	}
	ticks := r.axis.Tick.Marker.Ticks(r.axis.Min, r.axis.Max)
	var lw vg.Length
	for _, t := range ticks {
		if !t.IsMinor() {
			lw = max(lw, plt.Y.Tick.Label.Width(t.Label))
		}
	}
	if lw > 0 {
		w += plt.Y.Tick.Label.Width(" ") + lw
	}
	if r.label != "" {
		w += plt.Y.Label.Padding + plt.Y.Label.TextStyle.Height(r.label) + plt.Y.Label.TextStyle.FontExtents().Descent
	}
	return w
}

// offset is the distance from the data area to the scale's line.
func (r *rightScale) offset() vg.Length {
	if r.colour == nil {
		return 0
	}
	return vg.Points(barGap + barWidth)
}

// GlyphBoxes returns a box as wide as the scale at the right edge of the data area, so that
// gonum/plot leaves room for it (a box of zero height does not count vertically).
func (r *rightScale) GlyphBoxes(plt *plot.Plot) []plot.GlyphBox {
	return []plot.GlyphBox{{X: 1, Y: 0.5, Rectangle: vg.Rectangle{Max: vg.Point{X: r.width(plt)}}}}
}

// Plot draws the scale right of the data area c.
func (r *rightScale) Plot(c draw.Canvas, plt *plot.Plot) {
	norm := func(v float64) vg.Length { return c.Min.Y + vg.Length(r.axis.Norm(v))*(c.Max.Y-c.Min.Y) }
	x := c.Max.X
	line := plt.Y.LineStyle
	if r.colour != nil {
		x0 := x + vg.Points(barGap)
		x = x0 + vg.Points(barWidth)
		dy := (c.Max.Y - c.Min.Y) / barSteps
		for i := range barSteps {
			y0 := c.Min.Y + vg.Length(i)*dy
			c.SetColor(r.colour((float64(i) + 0.5) / barSteps))
			// Overlap the next step a little, so that no hairline of background shows.
			y1 := min(y0+dy+vg.Points(0.3), c.Max.Y)
			c.Fill(vg.Rectangle{Min: vg.Point{X: x0, Y: y0}, Max: vg.Point{X: x, Y: y1}}.Path())
		}
		for _, v := range r.levels {
			if y := norm(v); y >= c.Min.Y && y <= c.Max.Y {
				c.StrokeLine2(draw.LineStyle{Color: color.Black, Width: vg.Points(0.8)}, x0, y, x, y)
			}
		}
		c.StrokeLines(line, []vg.Point{{X: x0, Y: c.Min.Y}, {X: x, Y: c.Min.Y}, {X: x, Y: c.Max.Y},
			{X: x0, Y: c.Max.Y}, {X: x0, Y: c.Min.Y}})
	} else {
		c.StrokeLine2(line, x, c.Min.Y, x, c.Max.Y)
	}
	ticks := r.axis.Tick.Marker.Ticks(r.axis.Min, r.axis.Max)
	tl := plt.Y.Tick.Length
	for _, t := range ticks {
		y := norm(t.Value)
		if y < c.Min.Y-1e-6 || y > c.Max.Y+1e-6 {
			continue
		}
		l := tl
		if t.IsMinor() {
			l /= 2
		}
		c.StrokeLine2(plt.Y.Tick.LineStyle, x, y, x+l, y)
	}
	x += tl
	lsty := plt.Y.Tick.Label
	lsty.XAlign = draw.XLeft
	x += lsty.Width(" ")
	var lw vg.Length
	descent := lsty.FontExtents().Descent
	for _, t := range ticks {
		y := norm(t.Value)
		if t.IsMinor() || y < c.Min.Y-1e-6 || y > c.Max.Y+1e-6 {
			continue
		}
		c.FillText(lsty, vg.Point{X: x, Y: y + descent}, t.Label)
		lw = max(lw, lsty.Width(t.Label))
	}
	if r.label == "" {
		return
	}
	sty := plt.Y.Label.TextStyle
	sty.Rotation += math.Pi / 2
	x += lw + plt.Y.Label.Padding + sty.Height(r.label)
	c.FillText(sty, vg.Point{X: x, Y: (c.Min.Y + c.Max.Y) / 2}, r.label)
}
