package plots

import (
	"math"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// gonum/plot v0.17 places the glyph box of an axis label at the axis's arithmetic midpoint,
// Norm((Min+Max)/2), which on a logarithmic axis lies near the top or right end: the box
// then pokes out of the data area and gonum/plot shrinks the data area by up to half the
// label's length (about 15 % of a log–log figure). So a figure renders its panels with
// phantom axis labels, which take the label's height but no width and draw nothing, and
// axisLabels draws the labels where gonum/plot would have. A plot drawn by gonum/plot
// directly (p.Save) keeps its ordinary labels, and axisLabels does nothing.

// phantom marks each line of a phantom label.
const phantom = "\x00"

// phantomOf returns the phantom of label s ("" for none).
func phantomOf(s string) string {
	if s == "" || strings.HasPrefix(s, phantom) {
		return s
	}
	return phantom + strings.ReplaceAll(s, "\n", "\n"+phantom)
}

// realOf returns the label a phantom stands for, and whether s is a phantom.
func realOf(s string) (string, bool) {
	if !strings.HasPrefix(s, phantom) {
		return s, false
	}
	return strings.ReplaceAll(s, phantom, ""), true
}

// axisLabels draws the phantom axis labels of the plot it is drawn in.
type axisLabels struct{}

// Plot draws the labels around the data area c, as gonum/plot's axes lay them out.
func (axisLabels) Plot(c draw.Canvas, plt *plot.Plot) {
	if s, ok := realOf(plt.X.Label.Text); ok && s != "" {
		a := plt.X
		marks := a.Tick.Marker.Ticks(a.Min, a.Max)
		size := a.Label.TextStyle.Height(a.Label.Text) + a.Label.Padding + a.Width/2 + a.Padding
		if len(marks) > 0 {
			if a.Tick.Width > 0 && a.Tick.Length > 0 {
				size += a.Tick.Length
			}
			var h vg.Length
			for _, t := range marks {
				if !t.IsMinor() {
					r := a.Tick.Label.Rectangle(t.Label)
					h = max(h, r.Max.Y-r.Min.Y)
				}
			}
			size += h
		}
		y := c.Min.Y - size + a.Label.TextStyle.FontExtents().Descent
		c.FillText(a.Label.TextStyle, vg.Point{X: (c.Min.X + c.Max.X) / 2, Y: y}, s)
	}
	if s, ok := realOf(plt.Y.Label.Text); ok && s != "" {
		a := plt.Y
		sty := a.Label.TextStyle
		descent := sty.FontExtents().Descent
		height := sty.Height(a.Label.Text)
		size := descent + height + a.Label.Padding + a.Width/2 + a.Padding
		marks := a.Tick.Marker.Ticks(a.Min, a.Max)
		if len(marks) > 0 {
			var w vg.Length
			for _, t := range marks {
				if !t.IsMinor() {
					r := a.Tick.Label.Rectangle(t.Label)
					w = max(w, r.Max.X-r.Min.X)
				}
			}
			if w > 0 {
				size += w + sty.Width(" ")
			}
			if a.Tick.Width > 0 && a.Tick.Length > 0 {
				size += a.Tick.Length
			}
		}
		sty.Rotation += math.Pi / 2
		x := c.Min.X - size + height - descent
		c.FillText(sty, vg.Point{X: x, Y: (c.Min.Y + c.Max.Y) / 2}, s)
	}
}
