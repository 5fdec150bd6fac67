package plots

import (
	"image/color"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// legendInset is the distance of the legend from the corner of the data area.
const legendInset = 4 // pt

// legendBox draws the legend inside the data area, in the corner that the plot's Legend
// names (Top, Left), on a white ground that keeps it readable over grid lines and curves.
// gonum/plot would draw its legend relative to the whole figure, away from the data area
// when tick labels or a right-hand axis take room; the plot's own Legend holds no entries,
// but its position, offsets and text style are used.
type legendBox struct {
	legend plot.Legend
	labels []string
}

// add adds an entry with a label (none for an empty label).
func (b *legendBox) add(label string, thumbs ...plot.Thumbnailer) {
	if label == "" || len(thumbs) == 0 {
		return
	}
	b.legend.Add(label, thumbs...)
	b.labels = append(b.labels, label)
}

// addTo adds the legend to p if it has entries.
func (b *legendBox) addTo(p *plot.Plot) {
	if len(b.labels) > 0 {
		p.Add(b)
	}
}

// Plot draws the legend in the data area c.
func (b *legendBox) Plot(c draw.Canvas, plt *plot.Plot) {
	l := b.legend
	pl := plt.Legend
	l.TextStyle, l.Top, l.Left = pl.TextStyle, pl.Top, pl.Left
	l.XOffs, l.YOffs, l.Padding = pl.XOffs, pl.YOffs, pl.Padding
	l.ThumbnailWidth, l.YPosition = pl.ThumbnailWidth, pl.YPosition
	in := vg.Points(legendInset)
	c.Min.X, c.Max.X, c.Min.Y, c.Max.Y = c.Min.X+in, c.Max.X-in, c.Min.Y+in, c.Max.Y-in

	// The ground: the extent of the entries as plot.Legend.Draw places them.
	sty := l.TextStyle
	var tw, eh vg.Length
	for _, s := range b.labels {
		r := sty.Rectangle(s)
		tw, eh = max(tw, r.Max.X-r.Min.X), max(eh, r.Max.Y)
	}
	n := vg.Length(len(b.labels))
	w := l.ThumbnailWidth + sty.Rectangle(" ").Max.X + tw
	h := n*eh + (n-1)*l.Padding + sty.FontExtents().Descent
	var g vg.Rectangle
	if l.Left {
		g.Min.X = c.Min.X + l.XOffs
	} else {
		g.Min.X = c.Max.X + l.XOffs - w
	}
	if l.Top {
		g.Min.Y = c.Max.Y + l.YOffs - h
	} else {
		g.Min.Y = c.Min.Y + l.YOffs - sty.FontExtents().Descent
	}
	g.Max = vg.Point{X: g.Min.X + w, Y: g.Min.Y + h}
	pad := vg.Points(1.5)
	g.Min, g.Max = g.Min.Sub(vg.Point{X: pad, Y: pad}), g.Max.Add(vg.Point{X: pad, Y: pad})
	// Opaque, as the bands are: vgeps has no transparency and vgtex writes the
	// premultiplied colour with an opacity, so a translucent white would print grey there.
	c.SetColor(color.White)
	c.Fill(g.Path())
	l.Draw(c)
}

// errThumb is the legend thumbnail of error bars: a bar with caps.
type errThumb struct{ sty draw.LineStyle }

// Thumbnail draws the thumbnail in c.
func (t errThumb) Thumbnail(c *draw.Canvas) {
	x := (c.Min.X + c.Max.X) / 2
	h := c.Max.Y - c.Min.Y
	lo, hi := c.Min.Y+0.1*h, c.Max.Y-0.1*h
	cw := vg.Points(capWidth) / 2
	c.StrokeLine2(t.sty, x, lo, x, hi)
	c.StrokeLine2(t.sty, x-cw, lo, x+cw, lo)
	c.StrokeLine2(t.sty, x-cw, hi, x+cw, hi)
}
