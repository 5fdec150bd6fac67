package plots

import (
	"bytes"
	"errors"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
)

func TestLinesRejectsBadInput(t *testing.T) {
	good := Series{Label: "a", X: []float64{1, 10}, Y: []float64{1, 2}}
	tests := []struct {
		name string
		ax   Axes
		s    []Series
		want string
	}{
		{"no series", Axes{}, nil, "no series"},
		{"empty", Axes{}, []Series{{Label: "e"}}, "empty"},
		{"length mismatch", Axes{}, []Series{{Label: "m", X: []float64{1, 2}, Y: []float64{1}}}, "2 X values but 1 Y"},
		{"NaN", Axes{}, []Series{{Label: "n", X: []float64{1, math.NaN()}, Y: []float64{1, 2}}}, "point 1 is not finite"},
		{"log x zero", Axes{LogX: true}, []Series{good, {Label: "z", X: []float64{0, 1}, Y: []float64{1, 2}}}, "series 1 (\"z\") point 0: x=0"},
		{"log y negative", Axes{LogY: true}, []Series{{Label: "y", X: []float64{1, 2}, Y: []float64{1, -2}}}, "y=-2"},
	}
	for _, tc := range tests {
		_, err := Lines(tc.ax, tc.s...)
		if err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s: error %v, want it to contain %q", tc.name, err, tc.want)
		}
	}
}

func TestEncodeFormats(t *testing.T) {
	p, err := Lines(Axes{Title: "t", XLabel: "Δn (cm^-3)", YLabel: "τ (s)", LogX: true, LogY: true},
		Series{Label: "line", X: []float64{1e10, 1e15, 1e17}, Y: []float64{1e-3, 5e-4, 1e-5}},
		Series{Label: "dashed", X: []float64{1e10, 1e17}, Y: []float64{2e-3, 2e-3}, Dashed: true},
		Series{Label: "points", X: []float64{1e12, 1e16}, Y: []float64{1e-3, 1e-4}, Points: true})
	if err != nil {
		t.Fatal(err)
	}
	svg, err := SVG(p)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Contains(svg, []byte("<svg")) || !bytes.Contains(svg, []byte("@font-face")) {
		t.Errorf("SVG output lacks an <svg> element or its embedded fonts")
	}
	light, err := SVGInline(p)
	if err != nil {
		t.Fatal(err)
	}
	// The house face is Liberation Sans (issue 13), with Arial and Helvetica as fall-backs.
	if bytes.Contains(light, []byte("@font-face")) || !bytes.Contains(light, []byte("'Liberation Sans',Arial,Helvetica")) || len(light) > len(svg)/4 {
		t.Errorf("SVGInline: want no embedded fonts and a fall-back font list (%d bytes vs %d)", len(light), len(svg))
	}
	if _, err := SVGInline(nil); err == nil {
		t.Errorf("SVGInline accepted a nil plot")
	}
	dir := t.TempDir()
	for _, name := range []string{"f.svg", "f.pdf", "f.png"} {
		path := filepath.Join(dir, name)
		if err := Save(p, path); err != nil {
			t.Fatalf("Save(%s): %v", name, err)
		}
		if fi, err := os.Stat(path); err != nil || fi.Size() == 0 {
			t.Errorf("Save(%s) wrote nothing (%v)", name, err)
		}
	}
	if err := Save(p, filepath.Join(dir, "f.bmp")); err == nil {
		t.Errorf("Save accepted an unsupported extension")
	}
	if _, err := Encode(nil, DefaultWidth, DefaultHeight, "svg"); err == nil {
		t.Errorf("Encode accepted a nil plot")
	}
}

func TestFunc(t *testing.T) {
	s, err := Func("sq", []float64{1, 2, 3}, func(x float64) (float64, error) { return x * x, nil })
	if err != nil || s.Label != "sq" || s.Y[2] != 9 {
		t.Fatalf("Func: %+v, %v", s, err)
	}
	_, err = Func("bad", []float64{1, 2}, func(x float64) (float64, error) {
		if x == 2 {
			return 0, errTest
		}
		return x, nil
	})
	if err == nil || !strings.Contains(err.Error(), `curve "bad" at x=2`) {
		t.Errorf("Func error %v", err)
	}
	if _, err := Func("empty", nil, nil); err == nil {
		t.Errorf("Func accepted empty xs")
	}
}

var errTest = errors.New("test failure")

func TestLegendPositions(t *testing.T) {
	s := Series{Label: "a", X: []float64{1, 2}, Y: []float64{1, 2}}
	for _, pos := range []LegendPosition{TopLeft, TopRight, BottomLeft, BottomRight} {
		p, err := Lines(Axes{Legend: pos}, s)
		if err != nil {
			t.Fatalf("position %d: %v", pos, err)
		}
		if p.Legend.Top != (pos == TopLeft || pos == TopRight) || p.Legend.Left != (pos == TopLeft || pos == BottomLeft) {
			t.Errorf("position %d: Top=%v Left=%v", pos, p.Legend.Top, p.Legend.Left)
		}
	}
	if _, err := Lines(Axes{Legend: 9}, s); err == nil {
		t.Errorf("unknown legend position accepted")
	}
}

// TestBars checks the structure of a bar chart: one horizontal bar per entry, the first at the
// top (largest category position), labels on the category axis in that order, values kept,
// the labels in the rendered SVG; and the errors for bad input.
func TestBars(t *testing.T) {
	bars := []Bar{{"front: emitter", 34}, {"rear: contacts", 10.5}, {"base", 4.1}, {"ΔFF", -0.2}}
	p, chart, err := barChart(Axes{Title: "J0 budget", XLabel: "J0 (fA/cm^2)"}, bars)
	if err != nil {
		t.Fatal(err)
	}
	if len(chart.values) != 1 || len(chart.values[0]) != len(bars) || chart.stacked {
		t.Fatalf("want one set of %d bars, got %+v", len(bars), chart)
	}
	ticks := p.Y.Tick.Marker.Ticks(p.Y.Min, p.Y.Max)
	if len(ticks) != len(bars) {
		t.Fatalf("%d category ticks, want %d", len(ticks), len(bars))
	}
	for i, b := range bars {
		pos := len(bars) - 1 - i
		if ticks[pos].Label != b.Label || ticks[pos].Value != float64(pos) || chart.values[0][pos] != b.Value {
			t.Errorf("bar %d: tick %+v, value %g; want %q at %d with %g", i, ticks[pos], chart.values[0][pos], b.Label, pos, b.Value)
		}
	}
	if p.X.Min > -0.2 || p.X.Max < 34 {
		t.Errorf("value axis [%g, %g] does not hold the bars", p.X.Min, p.X.Max)
	}
	svg, err := SVGInline(p)
	if err != nil {
		t.Fatal(err)
	}
	// The unit's exponent is typeset as a superscript, a text of its own (issue 13).
	for _, w := range []string{"J0 budget", ">J0 (fA/cm<", ">2<", "front: emitter", "rear: contacts"} {
		if !strings.Contains(string(svg), w) {
			t.Errorf("SVG lacks %q", w)
		}
	}
	for _, tc := range []struct {
		name string
		ax   Axes
		bars []Bar
		want string
	}{
		{"no bars", Axes{}, nil, "no bars"},
		{"NaN", Axes{}, []Bar{{"a", 1}, {"b", math.NaN()}}, `bar 1 ("b") has a non-finite value`},
		{"no label", Axes{}, []Bar{{"", 1}}, "bar 0 has no label"},
		{"log axis", Axes{LogX: true}, []Bar{{"a", 1}}, "linear value axis"},
		{"y label", Axes{YLabel: "parts"}, []Bar{{"a", 1}}, `YLabel "parts"`},
	} {
		if _, err := Bars(tc.ax, tc.bars...); err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s: error %v, want %q", tc.name, err, tc.want)
		}
	}
}

// TestLinesHostile checks the inputs on which gonum/plot panics or hangs (issue 12): values
// spanning more than a float64 (max − min overflows; the tick search never ended) are an
// error, and axes whose values are all equal are drawn (a log axis at 1 panicked, a linear
// axis at 1e300 panicked with "illegal range").
func TestLinesHostile(t *testing.T) {
	for _, c := range []struct {
		name string
		ax   Axes
		s    Series
		ok   bool
	}{
		{"x span overflows", Axes{}, Series{X: []float64{-1e308, 1e308}, Y: []float64{1, 2}}, false},
		{"y span overflows", Axes{}, Series{X: []float64{1, 2}, Y: []float64{-math.MaxFloat64, math.MaxFloat64}}, false},
		{"one point, log", Axes{LogX: true, LogY: true}, Series{X: []float64{1}, Y: []float64{1}}, true},
		{"constant, log", Axes{LogX: true, LogY: true}, Series{X: []float64{1, 1}, Y: []float64{1, 1}}, true},
		{"constant 1e300", Axes{}, Series{X: []float64{1e300, 1e300}, Y: []float64{1, 2}}, true},
		{"constant max", Axes{}, Series{X: []float64{1, 2}, Y: []float64{math.MaxFloat64, math.MaxFloat64}}, true},
		{"constant 0", Axes{}, Series{X: []float64{0, 0}, Y: []float64{0, 0}}, true},
		{"constant tiny, log", Axes{LogY: true}, Series{X: []float64{1, 2}, Y: []float64{5e-324, 5e-324}}, true},
		{"wide but finite", Axes{}, Series{X: []float64{-8e307, 8e307}, Y: []float64{1, 2}}, true},
	} {
		func() {
			defer func() {
				if r := recover(); r != nil {
					t.Errorf("%s: panic %v", c.name, r)
				}
			}()
			p, err := Lines(c.ax, c.s)
			if !c.ok {
				if err == nil || !strings.Contains(err.Error(), "span more than a float64") {
					t.Errorf("%s: err %v", c.name, err)
				}
				return
			}
			if err != nil {
				t.Fatalf("%s: %v", c.name, err)
			}
			if b, err := SVGInline(p); err != nil || len(b) == 0 {
				t.Errorf("%s: SVG %d bytes, %v", c.name, len(b), err)
			}
		}()
	}
	// A zero plot.Plot (not made by plot.New) makes gonum/plot panic: an error instead.
	if _, err := SVGInline(&plot.Plot{}); err == nil {
		t.Errorf("SVGInline of a zero plot.Plot: no error")
	}
	if _, err := Encode(&plot.Plot{}, DefaultWidth, DefaultHeight, "png"); err == nil {
		t.Errorf("Encode of a zero plot.Plot: no error")
	}
	// Where gonum/plot's own padding by ±1 works, it is kept.
	if p, err := Lines(Axes{LogY: true}, Series{X: []float64{1, 2}, Y: []float64{5, 5}}); err != nil || p.Y.Min != 4 || p.Y.Max != 6 {
		t.Errorf("constant 5 on a log axis: range [%g, %g], %v; want [4, 6]", p.Y.Min, p.Y.Max, err)
	}
	if _, err := Func("nil", []float64{1}, nil); err == nil {
		t.Errorf("Func with a nil function: no error")
	}
	p, _ := Lines(Axes{}, Series{X: []float64{1, 2}, Y: []float64{1, 2}})
	for _, w := range []vg.Length{MaxSize + 1, vg.Length(math.Inf(1)), vg.Length(math.NaN()), 0} {
		if _, err := Encode(p, w, DefaultHeight, "png"); err == nil {
			t.Errorf("Encode at width %v: no error", w)
		}
	}
}

// TestLinesKinds checks error bars, bands and the right-hand axis: the errors for bad input,
// and that every axis holds the data, error bars and bands with a margin (issue 13: never
// clip a curve or marker).
func TestLinesKinds(t *testing.T) {
	x := []float64{1, 10, 100}
	y := []float64{2, 3, 4}
	for _, c := range []struct {
		name string
		ax   Axes
		s    []Series
		want string
	}{
		{"negative error", Axes{}, []Series{{X: x, Y: y, YErr: []float64{1, -1, 1}}}, "error bar -1"},
		{"NaN error", Axes{}, []Series{{X: x, Y: y, YErr: []float64{1, math.NaN(), 1}}}, "error bar NaN"},
		{"error length", Axes{}, []Series{{X: x, Y: y, YErr: []float64{1}}}, "1 YErr values"},
		{"error without Y", Axes{}, []Series{{X: x, Lo: y, Hi: y, YErr: y}}, "error bars need Y"},
		{"error to 0 on log", Axes{LogY: true}, []Series{{X: x, Y: y, YErr: []float64{1, 3, 1}}}, "error bar reaches"},
		{"Lo without Hi", Axes{}, []Series{{X: x, Y: y, Lo: y}}, "both Lo and Hi"},
		{"Lo above Hi", Axes{}, []Series{{X: x, Y: y, Lo: []float64{1, 5, 1}, Hi: y}}, "Lo ≤ Hi"},
		{"band length", Axes{}, []Series{{X: x, Lo: y[:2], Hi: y[:2]}}, "2 Lo values"},
		{"band at 0 on log", Axes{LogY: true}, []Series{{X: x, Y: y, Lo: []float64{0, 1, 1}, Hi: y}}, "y=0 must be > 0"},
		{"no Y", Axes{}, []Series{{X: x}}, "0 Y values"},
		{"points without Y", Axes{}, []Series{{X: x, Lo: y, Hi: y, Points: true}}, "markers need Y"},
		{"all right", Axes{}, []Series{{X: x, Y: y, Right: true}}, "every series is on the right"},
		{"right label alone", Axes{RightLabel: "V"}, []Series{{X: x, Y: y}}, "no series has Right"},
		{"right log", Axes{LogRight: true}, []Series{{X: x, Y: y}, {X: x, Y: []float64{1, 0, 1}, Right: true}}, "y=0 must be > 0"},
		{"markup", Axes{XLabel: `$\foo$`}, []Series{{X: x, Y: y}}, `x label`},
		{"legend markup", Axes{}, []Series{{Label: `$x^$`, X: x, Y: y}}, `series 0 label`},
	} {
		if _, err := Lines(c.ax, c.s...); err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s: error %v, want %q", c.name, err, c.want)
		}
	}
	p, err := Lines(Axes{LogX: true, RightLabel: "iVoc (V)"},
		Series{Label: "τ", X: x, Y: y, YErr: []float64{0.5, 1, 2}},
		Series{Label: "band", X: x, Lo: []float64{1, 2.5, 3}, Hi: []float64{2.5, 3.5, 7}},
		Series{Label: "iVoc", X: x, Y: []float64{0.6, 0.65, 0.7}, Right: true})
	if err != nil {
		t.Fatal(err)
	}
	// x: 1 … 100 on a log axis, 4 % of two decades beyond each end; y: 1.5 … 7 (the error
	// bar at 4 − 2 = 2 is inside the band's 1), 4 % of the span beyond.
	if lo, hi := math.Pow(10, -0.08), math.Pow(10, 2.08); math.Abs(p.X.Min-lo) > 1e-12 || math.Abs(p.X.Max-hi) > 1e-9 {
		t.Errorf("x range [%g, %g], want [%g, %g]", p.X.Min, p.X.Max, lo, hi)
	}
	if lo, hi := 1-0.04*6, 7+0.04*6; math.Abs(p.Y.Min-lo) > 1e-12 || math.Abs(p.Y.Max-hi) > 1e-12 {
		t.Errorf("y range [%g, %g], want [%g, %g]", p.Y.Min, p.Y.Max, lo, hi)
	}
	svg, err := SVGInline(p)
	if err != nil {
		t.Fatal(err)
	}
	for _, w := range []string{">iVoc (V)<", ">0.65<", ">band<", ">τ<"} {
		if !strings.Contains(string(svg), w) {
			t.Errorf("SVG lacks %q", w)
		}
	}
	// The cycle gives every series of a figure its own colour, dash pattern and marker.
	seen := map[string]bool{}
	for i := range palette {
		c, d, m := styleOf(i)
		key := fmt.Sprint(c, d, m)
		if seen[key] {
			t.Errorf("style %d repeats", i)
		}
		seen[key] = true
		if i > 0 {
			_, d0, m0 := styleOf(i - 1)
			if fmt.Sprint(d) == fmt.Sprint(d0) || m == m0 {
				t.Errorf("style %d has the dash or marker of style %d", i, i-1)
			}
		}
	}
}

// TestGroupedStacked checks the structure of grouped and stacked charts (sets in category
// order, the first category on top, stacked sums on the value axis) and their errors.
func TestGroupedStacked(t *testing.T) {
	cats := []string{"front", "rear", "base"}
	sets := []BarSet{{"passivated", []float64{20, 6, 4}}, {"contacts", []float64{14, 10, 0}}}
	p, b, err := barPlot("Stacked", Axes{XLabel: "J0 (fA/cm^2)", Legend: BottomRight}, cats, sets, true)
	if err != nil {
		t.Fatal(err)
	}
	if !b.stacked || len(b.values) != 2 || b.values[0][2] != 20 || b.values[1][0] != 0 {
		t.Errorf("stacked bars: %+v", b)
	}
	// The front stack reaches 34; the axis holds it with 5 % of the span beyond.
	if p.X.Min != 0 || math.Abs(p.X.Max-34*1.05) > 1e-12 {
		t.Errorf("stacked value axis [%g, %g], want [0, %g]", p.X.Min, p.X.Max, 34*1.05)
	}
	q, err := Grouped(Axes{XLabel: "ΔJ0 (fA/cm^2)"}, cats, BarSet{"A", []float64{-3, 6, 4}}, BarSet{"B", []float64{1, 2, 3}})
	if err != nil {
		t.Fatal(err)
	}
	if q.X.Min > -3 || q.X.Max < 6 {
		t.Errorf("grouped value axis [%g, %g] does not hold the bars", q.X.Min, q.X.Max)
	}
	svg, err := SVGInline(q)
	if err != nil {
		t.Fatal(err)
	}
	for _, w := range []string{">front<", ">base<", ">A<", ">B<"} {
		if !strings.Contains(string(svg), w) {
			t.Errorf("grouped SVG lacks %q", w)
		}
	}
	for _, c := range []struct {
		name    string
		stacked bool
		ax      Axes
		cats    []string
		sets    []BarSet
		want    string
	}{
		{"no categories", false, Axes{}, nil, sets, "no categories"},
		{"no sets", false, Axes{}, cats, nil, "no bar sets"},
		{"empty category", false, Axes{}, []string{"a", ""}, []BarSet{{"s", []float64{1, 2}}}, "category 1 has no label"},
		{"set label", false, Axes{}, cats, []BarSet{{"s", []float64{1, 2, 3}}, {"", []float64{1, 2, 3}}}, "set 1 has no label"},
		{"length", false, Axes{}, cats, []BarSet{{"s", []float64{1, 2}}}, "2 values for 3 categories"},
		{"NaN", false, Axes{}, cats, []BarSet{{"s", []float64{1, math.NaN(), 3}}}, "not finite"},
		{"negative stack", true, Axes{}, cats, []BarSet{{"s", []float64{1, -2, 3}}}, "negative"},
		{"overflow", true, Axes{}, cats, []BarSet{{"a", []float64{1e308, 1, 1}}, {"b", []float64{1e308, 1, 1}}}, "overflow"},
		{"log", false, Axes{LogX: true}, cats, sets, "linear value axis"},
		{"right label", false, Axes{RightLabel: "x"}, cats, sets, "linear value axis"},
		{"markup", false, Axes{}, []string{`$\foo$`, "b", "c"}, sets, "category 0"},
	} {
		f := Grouped
		if c.stacked {
			f = Stacked
		}
		if _, err := f(c.ax, c.cats, c.sets...); err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s: error %v, want %q", c.name, err, c.want)
		}
	}
}
