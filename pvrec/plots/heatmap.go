package plots

import (
	"fmt"
	"image/color"
	"math"
	"slices"
	"strconv"
	"sync"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/palette/moreland"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/text"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// Grid is a map of values over a rectangular grid of nodes, e.g. Seff over Qf × Dit.
type Grid struct {
	X, Y []float64   // node coordinates, strictly increasing, at least 2 each, in the units of the axis labels
	Z    [][]float64 // Z[j][i] is the value at (X[i], Y[j]), finite, in the unit of Axes.RightLabel
}

// MaxNodes is the largest number of nodes of a Grid that HeatMap draws (our choice: a 500 ×
// 500 map; each node is a filled rectangle in vector formats).
const MaxNodes = 250_000

// GridFunc evaluates f at every node of xs × ys and returns the map as a Grid: the double
// loop a notebook would otherwise paste, f typically a closure over a pvrec model. It
// returns an error naming x and y at the first failing evaluation, and an error for fewer
// than 2 values on either axis, more than MaxNodes nodes, or a nil f.
func GridFunc(xs, ys []float64, f func(x, y float64) (float64, error)) (Grid, error) {
	switch {
	case len(xs) < 2 || len(ys) < 2:
		return Grid{}, fmt.Errorf("plots: GridFunc: a map needs at least 2 × 2 nodes, got %d × %d", len(xs), len(ys))
	case len(xs) > MaxNodes/len(ys):
		return Grid{}, fmt.Errorf("plots: GridFunc: %d × %d nodes are more than MaxNodes (%d)", len(xs), len(ys), MaxNodes)
	case f == nil:
		return Grid{}, fmt.Errorf("plots: GridFunc: nil function")
	}
	g := Grid{X: slices.Clone(xs), Y: slices.Clone(ys), Z: make([][]float64, len(ys))}
	for j, y := range ys {
		g.Z[j] = make([]float64, len(xs))
		for i, x := range xs {
			z, err := f(x, y)
			if err != nil {
				return Grid{}, fmt.Errorf("plots: GridFunc at x=%g, y=%g: %w", x, y, err)
			}
			g.Z[j][i] = z
		}
	}
	return g, nil
}

// HeatMap returns a map of g in the house style: each node a cell coloured by its value,
// the cells meeting halfway between nodes (geometrically halfway on a logarithmic axis) and
// filling the frame; a colour bar on the right labelled ax.RightLabel, logarithmic if
// ax.LogRight; and, for each of the levels, a contour line across the map (black on a white
// edge, readable on every colour) marked on the colour bar and labelled with its value on a
// white ground, written as the colour bar writes values (decades as 10^n on a logarithmic
// scale), on the line near the middle of the map, clear of the frame and of the other
// labels (a level whose lines leave no such room goes unlabelled). The colours are a
// luminance-linear map (Kindlmann, Reinhard and Creem, "Face-based luminance matching for
// perceptual colormap generation", IEEE Visualization 2002, as gonum/plot's palette/moreland
// has it, from dark violet to near-white), which orders the values alike in colour, in
// greyscale and for colour-blind readers.
//
// It returns an error for a grid with fewer than 2 nodes on an axis or more than MaxNodes,
// coordinates that are not finite and strictly increasing, a Z whose shape is not len(Y) ×
// len(X), a value that is not finite, non-positive coordinates or values on a logarithmic
// axis or scale, spans a float64 cannot hold, a level that is not finite (or not positive
// on a logarithmic scale), a label that is markup and does not parse, or a Legend position
// other than the zero value (a map has no legend).
func HeatMap(ax Axes, g Grid, levels ...float64) (*plot.Plot, error) {
	if err := checkAxes(ax); err != nil {
		return nil, err
	}
	if ax.Legend != TopLeft {
		return nil, fmt.Errorf("plots: HeatMap: a map has no legend (Legend %d)", ax.Legend)
	}
	nx, ny := len(g.X), len(g.Y)
	switch {
	case nx < 2 || ny < 2:
		return nil, fmt.Errorf("plots: HeatMap: a map needs at least 2 × 2 nodes, got %d × %d", nx, ny)
	case nx > MaxNodes/ny:
		return nil, fmt.Errorf("plots: HeatMap: %d × %d nodes are more than MaxNodes (%d)", nx, ny, MaxNodes)
	case len(g.Z) != ny:
		return nil, fmt.Errorf("plots: HeatMap: Z has %d rows for %d Y values", len(g.Z), ny)
	}
	xe, err := edges("x", g.X, ax.LogX)
	if err != nil {
		return nil, err
	}
	ye, err := edges("y", g.Y, ax.LogY)
	if err != nil {
		return nil, err
	}
	zs := newSpan()
	for j, row := range g.Z {
		if len(row) != nx {
			return nil, fmt.Errorf("plots: HeatMap: Z row %d has %d values for %d X values", j, len(row), nx)
		}
		for i, z := range row {
			if math.IsNaN(z) || math.IsInf(z, 0) || ax.LogRight && z <= 0 {
				return nil, fmt.Errorf("plots: HeatMap: Z[%d][%d] = %g must be finite%s", j, i, z, positive(ax.LogRight))
			}
		}
		zs.add(row...)
	}
	zlo, zhi := zs.lo, zs.hi
	if !ax.LogRight && math.IsInf(zhi-zlo, 0) {
		return nil, fmt.Errorf("plots: HeatMap: values from %g to %g span more than a float64 holds; rescale them", zlo, zhi)
	}
	if zlo == zhi { // one colour: pad the scale as a constant axis
		zlo, zhi, _ = zs.axis("z", ax.LogRight)
	}
	levels = slices.Clone(levels)
	for k, l := range levels {
		if math.IsNaN(l) || math.IsInf(l, 0) || ax.LogRight && l <= 0 {
			return nil, fmt.Errorf("plots: HeatMap: level %d = %g must be finite%s", k, l, positive(ax.LogRight))
		}
	}
	slices.Sort(levels)
	levels = slices.Compact(levels)

	p := newPlot(ax)
	p.X.Min, p.X.Max = xe[0], xe[nx]
	p.Y.Min, p.Y.Max = ye[0], ye[ny]
	scale := plot.Axis{Min: zlo, Max: zhi, Scale: plot.LinearScale{}}
	scale.Tick.Marker = linTicks{}
	if ax.LogRight {
		scale.Scale, scale.Tick.Marker = plot.LogScale{}, logTicks{}
	}
	colour := func(t float64) color.Color {
		pal := mapColours()
		return pal[min(len(pal)-1, max(0, int(t*float64(len(pal)))))]
	}
	p.Add(&heatCells{g: g, xe: xe, ye: ye, scale: scale, colour: colour})
	if len(levels) > 0 {
		p.Add(&contours{g: g, levels: levels, logX: ax.LogX, logY: ax.LogY, logZ: ax.LogRight})
	}
	p.Add(&rightScale{axis: scale, label: ax.RightLabel, colour: colour, levels: levels})
	return p, nil
}

func positive(log bool) string {
	if log {
		return " and > 0 on a logarithmic scale"
	}
	return ""
}

// edges returns the cell edges of nodes v (name names the axis in errors): halfway between
// nodes (geometrically on a log axis), the outer edges as far beyond the end nodes as the
// inner ones.
func edges(name string, v []float64, log bool) ([]float64, error) {
	for k, x := range v {
		switch {
		case math.IsNaN(x) || math.IsInf(x, 0) || log && x <= 0:
			return nil, fmt.Errorf("plots: HeatMap: %s node %d = %g must be finite%s", name, k, x, positive(log))
		case k > 0 && !(x > v[k-1]):
			return nil, fmt.Errorf("plots: HeatMap: %s nodes must increase (node %d: %g after %g)", name, k, x, v[k-1])
		}
	}
	n := len(v)
	e := make([]float64, n+1)
	if log {
		for k := 1; k < n; k++ {
			e[k] = v[k-1] * math.Sqrt(v[k]/v[k-1])
		}
		e[0] = math.Max(v[0]/math.Sqrt(v[1]/v[0]), math.SmallestNonzeroFloat64)
		e[n] = math.Min(v[n-1]*math.Sqrt(v[n-1]/v[n-2]), math.MaxFloat64)
	} else {
		for k := 1; k < n; k++ {
			e[k] = v[k-1] + (v[k]-v[k-1])/2
		}
		e[0] = v[0] - (v[1]-v[0])/2
		e[n] = v[n-1] + (v[n-1]-v[n-2])/2
	}
	for _, x := range e {
		if math.IsNaN(x) || math.IsInf(x, 0) || !log && math.IsInf(e[n]-e[0], 0) {
			return nil, fmt.Errorf("plots: HeatMap: %s nodes from %g to %g span more than a float64 holds; rescale them", name, v[0], v[n-1])
		}
	}
	return e, nil
}

// mapColours is the colour map of HeatMap: 256 steps of Kindlmann's map from 10 % to 97 % of
// its luminance range (pure black and white would hide the contour lines and the frame).
var mapColours = sync.OnceValue(func() []color.Color {
	cm := moreland.Kindlmann()
	cm.SetMin(0)
	cm.SetMax(1)
	pal := make([]color.Color, 256)
	for i := range pal {
		c, err := cm.At(0.1 + 0.87*float64(i)/float64(len(pal)-1))
		if err != nil { // cannot happen inside [0, 1]
			c = color.Gray{Y: 128}
		}
		pal[i] = c
	}
	return pal
})

// heatCells draws the cells of a map.
type heatCells struct {
	g      Grid
	xe, ye []float64 // cell edges
	scale  plot.Axis // the colour scale
	colour func(t float64) color.Color
}

// Plot draws the cells, each overlapping its neighbours above and to the right by a
// fraction of a point, so that no hairline of background shows between them.
func (h *heatCells) Plot(c draw.Canvas, plt *plot.Plot) {
	trX, trY := plt.Transforms(&c)
	ov := vg.Points(0.3)
	nx, ny := len(h.g.X), len(h.g.Y)
	for j := range ny {
		y0, y1 := trY(h.ye[j]), trY(h.ye[j+1])
		if j < ny-1 {
			y1 += ov
		}
		for i := range nx {
			x0, x1 := trX(h.xe[i]), trX(h.xe[i+1])
			if i < nx-1 {
				x1 += ov
			}
			c.SetColor(h.colour(h.scale.Norm(h.g.Z[j][i])))
			c.Fill(vg.Rectangle{Min: vg.Point{X: x0, Y: y0}, Max: vg.Point{X: x1, Y: y1}}.Path())
		}
	}
}

// contours draws the contour lines of a map at levels, found by gonum/plot's plotter.Contour
// in the coordinates the axes show (the logarithms on logarithmic axes and scale), so that
// the lines interpolate as the map is drawn.
type contours struct {
	g                Grid
	levels           []float64
	logX, logY, logZ bool
}

// Plot draws the contour lines on a white edge.
func (k *contours) Plot(c draw.Canvas, plt *plot.Plot) {
	q := *plt
	lin := func(a plot.Axis, log bool) plot.Axis {
		if !log {
			return a
		}
		return plot.Axis{Min: math.Log10(a.Min), Max: math.Log10(a.Max), Scale: plot.LinearScale{}}
	}
	q.X, q.Y = lin(plt.X, k.logX), lin(plt.Y, k.logY)
	g := gridXYZ{k.g, k.logX, k.logY, k.logZ}
	levels := slices.Clone(k.levels)
	if k.logZ {
		for i := range levels {
			levels[i] = math.Log10(levels[i])
		}
	}
	for _, sty := range []draw.LineStyle{{Color: color.White, Width: vg.Points(1.8)}, {Color: color.Black, Width: vg.Points(0.7)}} {
		ct := plotter.NewContour(g, levels, nil)
		ct.LineStyles = []draw.LineStyle{sty}
		ct.Plot(c, &q)
	}
	k.labels(c, &q, plt.Y.Tick.Label, g, levels)
}

// labels writes each level's value on one of its contour lines, in the tick labels' style
// on a white ground that breaks the line: at the crossing of a grid edge (where the lines
// run, as plotter.Contour interpolates them linearly along the edges) nearest the middle of
// the map whose label keeps clear of the frame and of the labels already placed. A level
// whose lines have no such place is left unlabelled (its mark on the colour bar remains).
func (k *contours) labels(c draw.Canvas, q *plot.Plot, sty text.Style, g gridXYZ, levels []float64) {
	trX, trY := q.Transforms(&c)
	sty.XAlign, sty.YAlign = draw.XCenter, draw.YCenter
	pad := vg.Points(1.5)
	mid := vg.Point{X: (c.Min.X + c.Max.X) / 2, Y: (c.Min.Y + c.Max.Y) / 2}
	var placed []vg.Rectangle
	nx, ny := g.Dims()
	for li, l := range levels {
		label := levelLabel(k.levels[li], k.logZ)
		w, h := sty.Width(label)+2*pad, sty.Height(label)+pad
		var best vg.Rectangle
		bestD := vg.Length(math.Inf(1))
		try := func(x, y float64) {
			pt := vg.Point{X: trX(x), Y: trY(y)}
			r := vg.Rectangle{Min: vg.Point{X: pt.X - w/2, Y: pt.Y - h/2}, Max: vg.Point{X: pt.X + w/2, Y: pt.Y + h/2}}
			if r.Min.X < c.Min.X+pad || r.Max.X > c.Max.X-pad || r.Min.Y < c.Min.Y+pad || r.Max.Y > c.Max.Y-pad {
				return
			}
			for _, o := range placed {
				if r.Min.X < o.Max.X && o.Min.X < r.Max.X && r.Min.Y < o.Max.Y && o.Min.Y < r.Max.Y {
					return
				}
			}
			if d := abs(pt.X-mid.X) + abs(pt.Y-mid.Y)/2; d < bestD {
				best, bestD = r, d
			}
		}
		cross := func(x0, y0, z0, x1, y1, z1 float64) {
			if (z0 < l) != (z1 < l) {
				t := (l - z0) / (z1 - z0)
				try(x0+t*(x1-x0), y0+t*(y1-y0))
			}
		}
		for j := range ny {
			for i := range nx {
				if i+1 < nx {
					cross(g.X(i), g.Y(j), g.Z(i, j), g.X(i+1), g.Y(j), g.Z(i+1, j))
				}
				if j+1 < ny {
					cross(g.X(i), g.Y(j), g.Z(i, j), g.X(i), g.Y(j+1), g.Z(i, j+1))
				}
			}
		}
		if math.IsInf(float64(bestD), 1) {
			continue
		}
		placed = append(placed, best)
		c.SetColor(color.White)
		c.Fill(best.Path())
		c.FillText(sty, vg.Point{X: (best.Min.X + best.Max.X) / 2, Y: (best.Min.Y + best.Max.Y) / 2}, label)
	}
}

// levelLabel is the label of contour level v: a power of ten as 10^n on a logarithmic
// scale, as the colour bar labels its decades; otherwise as the linear ticks label a value.
func levelLabel(v float64, log bool) string {
	if n := math.Round(math.Log10(v)); log && math.Pow(10, n) == v {
		return "$10^{" + strconv.Itoa(int(n)) + "}$"
	}
	return numberLabels([]float64{v})[0]
}

// gridXYZ is a Grid as plotter.GridXYZ, in logarithms where log.
type gridXYZ struct {
	g                Grid
	logX, logY, logZ bool
}

func (g gridXYZ) Dims() (int, int)   { return len(g.g.X), len(g.g.Y) }
func (g gridXYZ) Z(c, r int) float64 { return lg(g.g.Z[r][c], g.logZ) }
func (g gridXYZ) X(c int) float64    { return lg(g.g.X[c], g.logX) }
func (g gridXYZ) Y(r int) float64    { return lg(g.g.Y[r], g.logY) }

func lg(v float64, log bool) float64 {
	if log {
		return math.Log10(v)
	}
	return v
}
