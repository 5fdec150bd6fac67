package plots

// Tests of the figures of an uncertainty analysis (issue 15): Histogram, Tornado, Strip.

import (
	"math"
	"slices"
	"strings"
	"testing"

	"gonum.org/v1/gonum/stat"
	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
)

// TestHistogramBins checks the bins: the Freedman–Diaconis width on evenly spaced values,
// Scott's where the interquartile range is 0, a chosen number, one bin for equal values,
// every sample counted once, and densities that integrate to 1 (per unit, or per decade).
func TestHistogramBins(t *testing.T) {
	// 0, 1, …, 999: the quartiles of definition 4 of Hyndman and Fan (1996), x_(np), are
	// 249 and 749, so IQR = 500 and the Freedman–Diaconis width 2 · 500 · 1000^(−1/3) = 100
	// (Freedman and Diaconis, Z. Wahrscheinlichkeitstheorie verw. Gebiete 57, 453 (1981)):
	// ceil(999 / 100) = 10 bins of 100 values each.
	even := make([]float64, 1000)
	for i := range even {
		even[i] = float64(i)
	}
	h, err := newHistogram(Axes{}, even, HistogramOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if len(h.heights) != 10 {
		t.Fatalf("%d bins, want 10", len(h.heights))
	}
	for i, c := range h.heights {
		if c != 100 {
			t.Errorf("bin %d holds %g values, want 100", i, c)
		}
	}
	if h.edges[0] != 0 || h.edges[10] != 999 {
		t.Errorf("edges from %g to %g, want 0 to 999", h.edges[0], h.edges[10])
	}
	// Eight zeros, 1 and 2: IQR 0, so Scott's width 3.49 s n^(−1/3) (Scott, Biometrika 66,
	// 605 (1979)); s = sqrt(4.1/9) = 0.675 by hand, the width 1.094, ceil(2 / 1.094) = 2 bins.
	h, err = newHistogram(Axes{}, []float64{0, 0, 0, 0, 0, 0, 0, 0, 1, 2}, HistogramOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if len(h.heights) != 2 || h.heights[0] != 8 || h.heights[1] != 2 {
		t.Errorf("Scott's bins: %v, want [8 2]", h.heights)
	}
	// A chosen number of bins; densities integrate to 1 (a property of a density).
	h, err = newHistogram(Axes{}, even, HistogramOptions{Bins: 7, Density: true})
	if err != nil {
		t.Fatal(err)
	}
	area := 0.0
	for i, d := range h.heights {
		area += d * (h.edges[i+1] - h.edges[i])
	}
	if len(h.heights) != 7 || math.Abs(area-1) > 1e-12 {
		t.Errorf("7 bins: %d, area %g", len(h.heights), area)
	}
	// On a log axis, bins of equal width in decades and a density per decade.
	logs := make([]float64, 500)
	for i := range logs {
		logs[i] = math.Pow(10, -14+3*float64(i)/499)
	}
	h, err = newHistogram(Axes{LogX: true}, logs, HistogramOptions{Density: true})
	if err != nil {
		t.Fatal(err)
	}
	area = 0
	for i, d := range h.heights {
		area += d * math.Log10(h.edges[i+1]/h.edges[i])
		if i > 0 {
			if r, r0 := h.edges[i+1]/h.edges[i], h.edges[i]/h.edges[i-1]; math.Abs(r/r0-1) > 1e-9 {
				t.Errorf("log bins %d and %d differ in width: ratios %g and %g", i-1, i, r0, r)
			}
		}
	}
	if math.Abs(area-1) > 1e-12 || math.Abs(h.edges[0]-1e-14) > 1e-26 || math.Abs(h.edges[len(h.edges)-1]-1e-11) > 1e-23 {
		t.Errorf("log bins: area %g per decade, edges %g to %g", area, h.edges[0], h.edges[len(h.edges)-1])
	}
	// Equal values: one bin holding them, around them (at ±MaxFloat64, ending at them).
	for _, c := range []struct {
		v   float64
		log bool
	}{{5, false}, {0, false}, {1e300, false}, {-math.MaxFloat64, false}, {math.MaxFloat64, false}, {3e-15, true}} {
		h, err := newHistogram(Axes{LogX: c.log}, []float64{c.v, c.v, c.v}, HistogramOptions{})
		if err != nil {
			t.Fatalf("constant %g: %v", c.v, err)
		}
		if len(h.heights) != 1 || h.heights[0] != 3 || !(h.edges[0] <= c.v && h.edges[1] >= c.v && h.edges[0] < h.edges[1]) {
			t.Errorf("constant %g: bins %v, edges %v", c.v, h.heights, h.edges)
		}
	}
	// Every sample is counted once, whatever the rule picks.
	for _, n := range []int{1, 2, 3, 17, 1001} {
		x := make([]float64, n)
		for i := range x {
			x[i] = math.Sin(float64(i)) * 7
		}
		h, err := newHistogram(Axes{}, x, HistogramOptions{})
		if err != nil {
			t.Fatal(err)
		}
		if s := floatsSum(h.heights); s != float64(n) || len(h.heights) > MaxBins {
			t.Errorf("%d samples: %g counted in %d bins", n, s, len(h.heights))
		}
	}
}

func floatsSum(v []float64) float64 {
	s := 0.0
	for _, x := range v {
		s += x
	}
	return s
}

// TestHistogramMarkers checks the mean, percentiles and interval against their definitions,
// the legend, and the errors.
func TestHistogramMarkers(t *testing.T) {
	x := make([]float64, 101) // 0, 1, …, 100, shuffled
	for i := range x {
		x[i] = float64((i * 37) % 101)
	}
	h, err := newHistogram(Axes{}, x, HistogramOptions{Mean: true, Percentiles: []float64{50, 0, 100}, Interval: [2]float64{2.5, 97.5}})
	if err != nil {
		t.Fatal(err)
	}
	// Definition 4 of Hyndman and Fan, Am. Stat. 50, 361 (1996): Q(p) = x_(k) + (np − k)
	// (x_(k+1) − x_(k)) with k = floor(np), 1-based; here x_(k) = k − 1. Q(0.5): np = 50.5,
	// 49.5; Q(0.025): np = 2.525, 1.525; Q(0.975): np = 98.475, 97.475; Q(0) and Q(1) the
	// extremes. The mean of 0…100 is 50.
	for _, c := range []struct{ got, want float64 }{{h.mean, 50}, {h.pcts[0], 49.5}, {h.pcts[1], 0}, {h.pcts[2], 100}, {h.lo, 1.525}, {h.hi, 97.475}} {
		if math.Abs(c.got-c.want) > 1e-12 {
			t.Errorf("got %g, want %g", c.got, c.want)
		}
	}
	// The mean of values near the largest float64 does not overflow.
	if h, err := newHistogram(Axes{}, []float64{1.5e308, 1.7e308}, HistogramOptions{Mean: true}); err != nil || math.Abs(h.mean-1.6e308) > 1e294 {
		t.Errorf("mean near MaxFloat64: %v, %v", h, err)
	}
	p, err := Histogram(Axes{XLabel: "Voc (V)", YLabel: "draws", Legend: TopRight}, x,
		HistogramOptions{Label: "draws", Mean: true, Percentiles: []float64{50, 10}, Interval: [2]float64{2.5, 97.5}})
	if err != nil {
		t.Fatal(err)
	}
	if p.Y.Min != 0 || p.X.Min >= 0 || p.X.Max <= 100 {
		t.Errorf("axes [%g, %g] × [%g, %g] do not hold the bins from 0", p.X.Min, p.X.Max, p.Y.Min, p.Y.Max)
	}
	svg, err := SVGInline(p)
	if err != nil {
		t.Fatal(err)
	}
	for _, w := range []string{">draws<", ">2.5–97.5 % interval<", ">mean<", ">median<", ">P10<", ">Voc (V)<"} {
		if !strings.Contains(string(svg), w) {
			t.Errorf("histogram SVG lacks %q", w)
		}
	}
	ok := []float64{1, 2, 3}
	for _, c := range []struct {
		name    string
		ax      Axes
		samples []float64
		opt     HistogramOptions
		want    string
	}{
		{"empty", Axes{}, nil, HistogramOptions{}, "no samples"},
		{"NaN", Axes{}, []float64{1, math.NaN()}, HistogramOptions{}, "sample 1 = NaN"},
		{"Inf", Axes{}, []float64{math.Inf(-1), 1}, HistogramOptions{}, "sample 0 = -Inf"},
		{"log", Axes{LogX: true}, []float64{1, 0}, HistogramOptions{}, "> 0 on a logarithmic"},
		{"span", Axes{}, []float64{-1e308, 1e308}, HistogramOptions{}, "span more than"},
		{"bins", Axes{}, ok, HistogramOptions{Bins: -1}, "Bins"},
		{"many bins", Axes{}, ok, HistogramOptions{Bins: MaxBins + 1}, "Bins"},
		{"percentile", Axes{}, ok, HistogramOptions{Percentiles: []float64{50, 101}}, "percentile 1 = 101"},
		{"percentile NaN", Axes{}, ok, HistogramOptions{Percentiles: []float64{math.NaN()}}, "percentile 0"},
		{"interval order", Axes{}, ok, HistogramOptions{Interval: [2]float64{90, 10}}, "Interval"},
		{"interval range", Axes{}, ok, HistogramOptions{Interval: [2]float64{-1, 10}}, "Interval"},
		{"log y", Axes{LogY: true}, ok, HistogramOptions{}, "linear count axis"},
		{"right", Axes{RightLabel: "x"}, ok, HistogramOptions{}, "right-hand"},
		{"markup", Axes{}, ok, HistogramOptions{Label: `$\foo$`}, "Histogram: label"},
		{"axis markup", Axes{XLabel: `$x^$`}, ok, HistogramOptions{}, "x label"},
	} {
		if _, err := Histogram(c.ax, c.samples, c.opt); err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s: error %v, want %q", c.name, err, c.want)
		}
	}
}

// TestTornado checks the order (largest swing on top, ties as given), the bars' ends, the
// value axis holding base and every bar, the legend and labels in the SVG (in order from
// top to bottom), and the errors.
func TestTornado(t *testing.T) {
	bars := []TornadoBar{{"small", 10, 11}, {"large", 4, 17}, {"same side", 12, 14}, {"tie", 9.5, 10.5}}
	p, err := Tornado(Axes{XLabel: "Voc (mV)"}, 10, bars)
	if err != nil {
		t.Fatal(err)
	}
	ticks := p.Y.Tick.Marker.Ticks(p.Y.Min, p.Y.Max)
	var order []string
	for i := len(ticks) - 1; i >= 0; i-- {
		order = append(order, ticks[i].Label)
	}
	if want := []string{"large", "same side", "small", "tie"}; !slices.Equal(order, want) {
		t.Errorf("order top to bottom %v, want %v", order, want)
	}
	if p.X.Min >= 4 || p.X.Max <= 17 {
		t.Errorf("value axis [%g, %g] does not hold the bars", p.X.Min, p.X.Max)
	}
	svg, err := Figure{Panels: []*plot.Plot{p}, Preset: Column}.Encode("svg")
	if err != nil {
		t.Fatal(err)
	}
	texts := svgTexts(t, svg)
	ys := map[string]float64{}
	for _, x := range texts {
		ys[x.s] = x.y
	}
	for _, w := range []string{"input low", "input high", "large", "small", "tie", "same side"} {
		if _, ok := ys[w]; !ok {
			t.Errorf("tornado SVG lacks %q", w)
		}
	}
	for i := 1; i < len(order); i++ {
		if ys[order[i]] >= ys[order[i-1]] {
			t.Errorf("label %q is not below %q in the SVG", order[i], order[i-1])
		}
	}
	if _, err := Tornado(Axes{LogX: true}, 1e-3, []TornadoBar{{"τ", 5e-4, 2e-3}}); err != nil {
		t.Errorf("log axis: %v", err)
	}
	for _, c := range []struct {
		name string
		ax   Axes
		base float64
		bars []TornadoBar
		want string
	}{
		{"no bars", Axes{}, 1, nil, "no bars"},
		{"label", Axes{}, 1, []TornadoBar{{"", 1, 2}}, "bar 0 has no label"},
		{"NaN base", Axes{}, math.NaN(), bars, "base = NaN"},
		{"Inf", Axes{}, 1, []TornadoBar{{"a", 1, math.Inf(1)}}, `bar 0 ("a")`},
		{"log", Axes{LogX: true}, 1, []TornadoBar{{"a", 0, 2}}, "> 0 on a logarithmic"},
		{"log base", Axes{LogX: true}, -1, []TornadoBar{{"a", 1, 2}}, "base = -1"},
		{"span", Axes{}, 0, []TornadoBar{{"a", -1e308, 1e308}}, "span more than"},
		{"y label", Axes{YLabel: "inputs"}, 1, bars, "YLabel"},
		{"log y", Axes{LogY: true}, 1, bars, "LogY"},
		{"markup", Axes{}, 1, []TornadoBar{{`$\foo$`, 1, 2}}, "bar 0 label"},
	} {
		if _, err := Tornado(c.ax, c.base, c.bars); err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s: error %v, want %q", c.name, err, c.want)
		}
	}
}

// TestStrip checks the rows (in order from the top, groups apart), the breaking of long
// member labels into lines that fit, the axis holding every value, the group headings and the
// default's key on rows of their own above each group, and the errors.
func TestStrip(t *testing.T) {
	long := "BGN model A + FD, μ model M1, Auger model X1"
	groups := []StripGroup{
		{Label: "BGN", Members: []StripMember{{Label: long, Value: 31.5, Default: true}, {Label: "BGN model B", Value: 29}}},
		{Label: "mobility", Members: []StripMember{{Label: "μ model M2", Value: 33}}},
	}
	p, err := Strip(Axes{XLabel: "J0 (fA/cm^2)"}, groups...)
	if err != nil {
		t.Fatal(err)
	}
	ticks := p.Y.Tick.Marker.Ticks(p.Y.Min, p.Y.Max)
	if len(ticks) != 3 || !(ticks[0].Value > ticks[1].Value && ticks[1].Value > ticks[2].Value) {
		t.Fatalf("rows %+v: want 3 from the top down", ticks)
	}
	if g0, g1 := ticks[0].Value-ticks[1].Value, ticks[1].Value-ticks[2].Value; g1 <= 1 {
		t.Errorf("groups not apart: pitches %g, %g", g0, g1)
	}
	lines := strings.Split(ticks[0].Label, "\n")
	if len(lines) < 2 || strings.Join(lines, " ") != long {
		t.Errorf("long label broken as %q", lines)
	}
	for _, l := range lines {
		if w, _, _ := (typesetter{}).Box(l, houseFont(tickSize, false)); w > vg.Points(stripLabelWidth) {
			t.Errorf("line %q is %v wide, more than %v pt", l, w, stripLabelWidth)
		}
	}
	if ticks[1].Label != "BGN model B" {
		t.Errorf("short label %q", ticks[1].Label)
	}
	if p.X.Min >= 29 || p.X.Max <= 33 {
		t.Errorf("value axis [%g, %g] does not hold the members", p.X.Min, p.X.Max)
	}
	for _, s := range []string{"a\nb, c, d, e, f, g, h, i, j, k, l, m, n, o, p, q, r, s, t, u", `$\mu$ model M1, $\tau$ one, two, three, four, five, six, seven`} {
		if got := wrapLabel(s, vg.Points(stripLabelWidth)); got != s {
			t.Errorf("wrapLabel(%q) = %q, want it as written", s, got)
		}
	}
	svg, err := Figure{Panels: []*plot.Plot{p}, Preset: Column}.Encode("svg")
	if err != nil {
		t.Fatal(err)
	}
	texts := svgTexts(t, svg)
	var prev *svgText
	for _, l := range []string{"BGN", "mobility", "default", "BGN model B", "J0 (fA/cm"} {
		found := false
		for _, x := range texts {
			found = found || x.s == l
		}
		if !found {
			t.Errorf("strip SVG lacks %q", l)
		}
	}
	// Each heading stands above its group's first row, below the previous group's last; the
	// key has the top row.
	y := map[string]float64{}
	for _, x := range texts {
		if _, ok := y[x.s]; !ok {
			y[x.s] = x.y
		}
	}
	// (y grows upwards in the drawing; "μ model M2" is set as "μ" and " model M2".)
	if !(y["BGN"] > y["BGN model A + FD, "] && y["BGN model B"] > y["mobility"] && y["mobility"] > y[" model M2"]) {
		t.Errorf("headings not on rows of their own: %v", y)
	}
	if !(y["default"] > y["BGN"]) {
		t.Errorf("key at y = %g, first heading at %g: want the key's row on top", y["default"], y["BGN"])
	}
	// The lines of the long label, one below the other at the tick label's size.
	for _, x := range texts {
		if x.s == "BGN model A + FD," || x.s == "Auger model X1" {
			if prev != nil && math.Abs(prev.y-x.y-2*tickSize) > 1e-6 {
				t.Errorf("label lines %q at %g and %q at %g are not two lines apart", prev.s, prev.y, x.s, x.y)
			}
			prev = &x
		}
	}
	if prev == nil {
		t.Errorf("the long label's lines are not in the SVG")
	}
	if _, err := Strip(Axes{LogX: true}, StripGroup{Members: []StripMember{{Label: "a", Value: 1e-3}, {Label: "b", Value: 1e-3}}}); err != nil {
		t.Errorf("one group, equal values, log axis: %v", err)
	}
	ok := []StripMember{{Label: "a", Value: 1}}
	for _, c := range []struct {
		name   string
		ax     Axes
		groups []StripGroup
		want   string
	}{
		{"no groups", Axes{}, nil, "no groups"},
		{"no members", Axes{}, []StripGroup{{Label: "g"}}, `group 0 ("g") has no members`},
		{"group label", Axes{}, []StripGroup{{Members: ok}, {Members: ok}}, "group 0 has no label"},
		{"member label", Axes{}, []StripGroup{{Members: []StripMember{{Value: 1}}}}, "member 0 has no label"},
		{"NaN", Axes{}, []StripGroup{{Members: []StripMember{{Label: "a", Value: math.NaN()}}}}, "value NaN"},
		{"log", Axes{LogX: true}, []StripGroup{{Members: []StripMember{{Label: "a", Value: -1}}}}, "> 0 on a logarithmic"},
		{"span", Axes{}, []StripGroup{{Members: []StripMember{{Label: "a", Value: -1e308}, {Label: "b", Value: 1e308}}}}, "span more than"},
		{"two defaults", Axes{}, []StripGroup{{Members: []StripMember{{Label: "a", Value: 1, Default: true}, {Label: "b", Value: 2, Default: true}}}}, "two defaults"},
		{"y label", Axes{YLabel: "members"}, []StripGroup{{Members: ok}}, "YLabel"},
		{"markup", Axes{}, []StripGroup{{Members: []StripMember{{Label: `$\foo$`, Value: 1}}}}, "member 0 label"},
	} {
		if _, err := Strip(c.ax, c.groups...); err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s: error %v, want %q", c.name, err, c.want)
		}
	}
}

// TestHistogramQuantileKind checks that the percentiles are gonum's LinInterp quantiles, the
// definition the doc comment names.
func TestHistogramQuantileKind(t *testing.T) {
	x := []float64{3, 1, 4, 1, 5, 9, 2, 6}
	h, err := newHistogram(Axes{}, x, HistogramOptions{Percentiles: []float64{30}})
	if err != nil {
		t.Fatal(err)
	}
	s := slices.Sorted(slices.Values(x))
	if want := stat.Quantile(0.3, stat.LinInterp, s, nil); h.pcts[0] != want {
		t.Errorf("P30 = %g, want %g", h.pcts[0], want)
	}
}

// FuzzHistogram bins arbitrary samples: an error or bins that count every sample once, with
// edges in order, never a panic.
func FuzzHistogram(f *testing.F) {
	f.Add([]byte{1, 2, 3, 4, 5, 6, 7, 8}, false, uint8(0))
	f.Add([]byte{0, 0, 0, 0, 0, 0, 0xf0, 0x7f, 0, 0, 0, 0, 0, 0, 0xf0, 0x7f}, true, uint8(3))
	f.Add([]byte{0xff, 0xff, 0xff, 0xff, 0xff, 0xff, 0xef, 0x7f, 1, 0, 0, 0, 0, 0, 0, 0}, false, uint8(0))
	f.Fuzz(func(t *testing.T, b []byte, log bool, bins uint8) {
		var x []float64
		for i := 0; i+8 <= len(b) && len(x) < 4096; i += 8 {
			x = append(x, math.Float64frombits(uint64(b[i])|uint64(b[i+1])<<8|uint64(b[i+2])<<16|uint64(b[i+3])<<24|
				uint64(b[i+4])<<32|uint64(b[i+5])<<40|uint64(b[i+6])<<48|uint64(b[i+7])<<56))
		}
		h, err := newHistogram(Axes{LogX: log}, x, HistogramOptions{Bins: int(bins), Density: bins%2 == 1, Mean: true, Percentiles: []float64{50}})
		if err != nil {
			return
		}
		total := 0.0
		for i, v := range h.heights {
			if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
				t.Fatalf("bin %d height %g", i, v)
			}
			if !(h.edges[i+1] > h.edges[i]) && !(log && h.edges[i+1] >= h.edges[i]) {
				t.Fatalf("edges %d, %d: %g, %g", i, i+1, h.edges[i], h.edges[i+1])
			}
		}
		if !(bins%2 == 1) {
			total = floatsSum(h.heights)
			if total != float64(len(x)) {
				t.Fatalf("%g of %d samples counted", total, len(x))
			}
		}
		if math.IsNaN(h.mean) || math.IsInf(h.mean, 0) {
			t.Fatalf("mean %g", h.mean)
		}
	})
}
