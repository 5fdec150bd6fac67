package plots

import (
	"errors"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/recorder"
)

func demoGrid(t testing.TB) Grid {
	t.Helper()
	g, err := GridFunc([]float64{0, 1e12, 2e12, 3e12}, []float64{1e9, 1e10, 1e11},
		func(qf, dit float64) (float64, error) { return dit / 1e8 / (1 + qf*qf/1e24), nil })
	if err != nil {
		t.Fatal(err)
	}
	return g
}

// TestHeatMap checks the frame (the cells' outer edges, halfway beyond the end nodes,
// geometrically on a log axis), the colour scale, the contour lines and the errors.
func TestHeatMap(t *testing.T) {
	g := demoGrid(t)
	p, err := HeatMap(Axes{XLabel: "Qf (cm^-2)", YLabel: "Dit (cm^-2 eV^-1)", LogY: true, RightLabel: "Seff (cm/s)", LogRight: true}, g, 10, 100, 10)
	if err != nil {
		t.Fatal(err)
	}
	if p.X.Min != -0.5e12 || p.X.Max != 3.5e12 || math.Abs(p.Y.Min-math.Pow(10, 8.5)) > 1e-3 || math.Abs(p.Y.Max-math.Pow(10, 11.5)) > 1e2 {
		t.Errorf("frame [%g, %g] × [%g, %g]", p.X.Min, p.X.Max, p.Y.Min, p.Y.Max)
	}
	e, err := edges("x", []float64{1, 4, 16}, true)
	if err != nil || math.Abs(e[0]-0.5) > 1e-15 || math.Abs(e[1]-2) > 1e-15 || math.Abs(e[2]-8) > 1e-14 || math.Abs(e[3]-32) > 1e-13 {
		t.Errorf("log edges of 1, 4, 16: %v, %v", e, err)
	}
	// One filled cell per node, a colour-bar strip, and contour lines (white edge, black
	// line) at the two distinct levels.
	var c recorder.Canvas
	Figure{Panels: []*plot.Plot{p}}.draw(draw.NewCanvas(&c, DefaultWidth, DefaultHeight), drawText)
	fills, strokes := 0, 0
	for _, a := range c.Actions {
		switch a.(type) {
		case *recorder.Fill:
			fills++
		case *recorder.Stroke:
			strokes++
		}
	}
	if fills < len(g.X)*len(g.Y)+barSteps || strokes == 0 {
		t.Errorf("%d fills, %d strokes", fills, strokes)
	}
	pal := mapColours()
	if lum(pal[0]) >= lum(pal[len(pal)/2]) || lum(pal[len(pal)/2]) >= lum(pal[len(pal)-1]) {
		t.Errorf("the colour map is not ordered by luminance")
	}
	// A constant map is drawn in one colour over a padded scale.
	if _, err := HeatMap(Axes{}, Grid{X: []float64{0, 1}, Y: []float64{0, 1}, Z: [][]float64{{5, 5}, {5, 5}}}); err != nil {
		t.Errorf("constant map: %v", err)
	}
	ok := Grid{X: []float64{1, 2}, Y: []float64{1, 2}, Z: [][]float64{{1, 2}, {3, 4}}}
	for _, c := range []struct {
		name   string
		ax     Axes
		g      Grid
		levels []float64
		want   string
	}{
		{"small", Axes{}, Grid{X: []float64{1}, Y: []float64{1, 2}, Z: [][]float64{{1}, {2}}}, nil, "at least 2 × 2"},
		{"rows", Axes{}, Grid{X: ok.X, Y: ok.Y, Z: ok.Z[:1]}, nil, "1 rows for 2 Y values"},
		{"row length", Axes{}, Grid{X: ok.X, Y: ok.Y, Z: [][]float64{{1, 2}, {3}}}, nil, "row 1 has 1 values"},
		{"NaN", Axes{}, Grid{X: ok.X, Y: ok.Y, Z: [][]float64{{1, 2}, {3, math.NaN()}}}, nil, "Z[1][1] = NaN"},
		{"log scale", Axes{LogRight: true}, Grid{X: ok.X, Y: ok.Y, Z: [][]float64{{1, 2}, {3, 0}}}, nil, "> 0 on a logarithmic"},
		{"order", Axes{}, Grid{X: []float64{2, 1}, Y: ok.Y, Z: ok.Z}, nil, "must increase"},
		{"log x", Axes{LogX: true}, Grid{X: []float64{0, 1}, Y: ok.Y, Z: ok.Z}, nil, "x node 0 = 0"},
		{"x span", Axes{}, Grid{X: []float64{-1e308, 1e308}, Y: ok.Y, Z: ok.Z}, nil, "span more than"},
		{"z span", Axes{}, Grid{X: ok.X, Y: ok.Y, Z: [][]float64{{-1e308, 1}, {1, 1e308}}}, nil, "span more than"},
		{"level", Axes{}, ok, []float64{math.Inf(1)}, "level 0"},
		{"log level", Axes{LogRight: true}, ok, []float64{-1}, "level 0"},
		{"legend", Axes{Legend: TopRight}, ok, nil, "no legend"},
		{"markup", Axes{RightLabel: `$\foo$`}, ok, nil, "right label"},
	} {
		if _, err := HeatMap(c.ax, c.g, c.levels...); err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s: error %v, want %q", c.name, err, c.want)
		}
	}
	big := make([]float64, 501)
	for i := range big {
		big[i] = float64(i)
	}
	if _, err := HeatMap(Axes{}, Grid{X: big, Y: big}); err == nil || !strings.Contains(err.Error(), "MaxNodes") {
		t.Errorf("501 × 501 map: %v", err)
	}
	if _, err := GridFunc(big, big, func(x, y float64) (float64, error) { return 0, nil }); err == nil {
		t.Errorf("GridFunc of 501 × 501 nodes: no error")
	}
	if _, err := GridFunc([]float64{1}, big, nil); err == nil {
		t.Errorf("GridFunc of one column: no error")
	}
	if _, err := GridFunc(ok.X, ok.Y, nil); err == nil {
		t.Errorf("GridFunc with nil function: no error")
	}
	_, err = GridFunc(ok.X, ok.Y, func(x, y float64) (float64, error) {
		if y == 2 {
			return 0, errTest
		}
		return x, nil
	})
	if !errors.Is(err, errTest) || !strings.Contains(err.Error(), "x=1, y=2") {
		t.Errorf("GridFunc error %v", err)
	}
}

// TestContourLabels checks that each level with a line is labelled once, inside the data
// area and clear of its frame, that labels do not overlap, that a level without a line
// has no label, and the labels' form (powers of ten on a logarithmic scale, as the colour
// bar's decades).
func TestContourLabels(t *testing.T) {
	// z = x + y over [0, 10]²: the lines of 3.7, 6.3 and 8.1 are diagonals; 25 has none.
	xs := []float64{0, 2, 4, 6, 8, 10}
	g, err := GridFunc(xs, xs, func(x, y float64) (float64, error) { return x + y, nil })
	if err != nil {
		t.Fatal(err)
	}
	p, err := HeatMap(Axes{RightLabel: "z"}, g, 3.7, 6.3, 8.1, 25)
	if err != nil {
		t.Fatal(err)
	}
	var rc recorder.Canvas
	dc := draw.NewCanvas(&rc, 12*vg.Centimeter, 9*vg.Centimeter)
	p.Draw(dc)
	da := p.DataCanvas(dc).Rectangle
	found := map[string][]vg.Point{}
	for _, a := range rc.Actions {
		if fs, ok := a.(*recorder.FillString); ok {
			found[fs.String] = append(found[fs.String], fs.Point)
		}
	}
	var at []vg.Point
	for _, l := range []string{"3.7", "6.3", "8.1"} {
		if len(found[l]) != 1 {
			t.Errorf("level %s labelled %d times", l, len(found[l]))
			continue
		}
		pt := found[l][0]
		if pt.X < da.Min.X+vg.Points(2) || pt.X > da.Max.X-vg.Points(10) || pt.Y < da.Min.Y+vg.Points(2) || pt.Y > da.Max.Y-vg.Points(8) {
			t.Errorf("label %s at %v, not inside the data area %v", l, pt, da)
		}
		at = append(at, pt)
	}
	for i := range at {
		for j := range i {
			if abs(at[i].X-at[j].X) < vg.Points(12) && abs(at[i].Y-at[j].Y) < vg.Points(8) {
				t.Errorf("labels %d and %d overlap: %v, %v", j, i, at[j], at[i])
			}
		}
	}
	if len(found["25"]) != 0 {
		t.Errorf("level 25 has no line but a label")
	}
	for _, c := range []struct {
		v    float64
		log  bool
		want string
	}{{100, true, "$10^{2}$"}, {1, true, "$10^{0}$"}, {1e-3, true, "$10^{-3}$"}, {50, true, "$50$"}, {100, false, "$100$"}, {2.5e6, false, `$2.5\times10^{6}$`}} {
		if got := levelLabel(c.v, c.log); got != c.want {
			t.Errorf("levelLabel(%g, %v) = %q, want %q", c.v, c.log, got, c.want)
		}
	}
}

// lum is the relative luminance of c (ITU-R BT.709 weights on linear-ish values; enough to
// order colours).
func lum(c interface{ RGBA() (r, g, b, a uint32) }) float64 {
	r, g, b, _ := c.RGBA()
	return 0.2126*float64(r) + 0.7152*float64(g) + 0.0722*float64(b)
}
