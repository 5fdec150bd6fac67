package plots

import (
	"fmt"
	"image/color"
	"math"
	"slices"
	"strconv"

	"gonum.org/v1/gonum/stat"
	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// MaxBins is the largest number of bins of a Histogram (our choice: more bins than a figure
// has room for at 1 pt each).
const MaxBins = 1000

// HistogramOptions are the options of a Histogram; the zero value draws counts in bins of the
// Freedman–Diaconis width with no markers.
type HistogramOptions struct {
	Label       string     // legend entry of the bars, e.g. "Monte Carlo, 10 000 draws"; empty for none
	Bins        int        // number of bins of equal width (of equal width in decades on a log axis), 1 to MaxBins; 0 chooses the width by the Freedman–Diaconis rule
	Density     bool       // bar heights as probability density (per unit of x, or per decade of x on a logarithmic axis) instead of counts
	Mean        bool       // a vertical line at the arithmetic mean of the samples
	Percentiles []float64  // vertical dashed lines at these percentiles, in % (0 to 100), e.g. 50 for the median
	Interval    [2]float64 // percentiles bounding a highlighted interval, in % (0 ≤ low < high ≤ 100), e.g. {2.5, 97.5}; {0, 0} for none
}

// Histogram returns a histogram of samples in the house style: the distribution of a result
// over the draws of an uncertainty analysis, for instance. The samples are in the unit that
// ax.XLabel names; ax.YLabel names the bar height, which is a count, or with opt.Density a
// probability density in 1/(unit of x) (per decade on a logarithmic x axis, so that the
// bars' areas over the decades sum to 1).
//
// Bins are of equal width in x, or in log10 x if ax.LogX. With opt.Bins 0 their width is
// 2 IQR n^(−1/3), the rule of D. Freedman and P. Diaconis, "On the histogram as a density
// estimator: L2 theory", Z. Wahrscheinlichkeitstheorie verw. Gebiete 57, 453 (1981), with IQR
// the interquartile range of the n samples (of their logarithms on a logarithmic axis), or, if
// that is 0 (more than half the samples equal), 3.49 s n^(−1/3) with s their standard
// deviation, the rule of D. W. Scott, "On optimal and data-based histograms", Biometrika 66,
// 605 (1979); at most MaxBins bins. Samples that are all equal make one bin around them.
// Percentiles and the interval are gonum's stat.Quantile with stat.LinInterp (linear
// interpolation of the empirical distribution, definition 4 of R. J. Hyndman and Y. Fan,
// "Sample quantiles in statistical packages", Am. Stat. 50, 361 (1996)). With an interval,
// bars (and the parts of bars) inside it are drawn in the full colour, those outside in a
// light tint, and the legend names the interval, e.g. "2.5–97.5 % interval".
//
// The x axis holds every bin with the house margin; the y axis starts at 0. It returns an
// error for no samples, a sample that is not finite (or not > 0 on a logarithmic axis),
// samples spanning more than a float64 holds, Bins outside 0…MaxBins, a percentile outside
// 0…100, an interval with low ≥ high or outside 0…100, a density that overflows (samples a
// few subnormal numbers apart), a label that is markup and does not parse, or axes options a histogram cannot honour (LogY, RightLabel, LogRight).
func Histogram(ax Axes, samples []float64, opt HistogramOptions) (*plot.Plot, error) {
	h, err := newHistogram(ax, samples, opt)
	if err != nil {
		return nil, err
	}
	return h.plot(ax, opt), nil
}

// histogram is a Histogram's bins and markers, in the values the axes show.
type histogram struct {
	edges   []float64 // bin edges in x (not logarithms), increasing
	heights []float64 // bar heights: counts or densities
	mean    float64
	pcts    []float64 // values at opt.Percentiles
	lo, hi  float64   // the interval's ends, if any
	has     bool      // whether there is an interval
}

func newHistogram(ax Axes, samples []float64, opt HistogramOptions) (*histogram, error) {
	if ax.LogY || ax.RightLabel != "" || ax.LogRight {
		return nil, fmt.Errorf("plots: Histogram: a histogram has a linear count axis and no right-hand scale (LogY %v, RightLabel %q, LogRight %v)",
			ax.LogY, ax.RightLabel, ax.LogRight)
	}
	if err := checkAxes(ax); err != nil {
		return nil, err
	}
	if err := checkLabel("Histogram: label", opt.Label); err != nil {
		return nil, err
	}
	n := len(samples)
	switch {
	case n == 0:
		return nil, fmt.Errorf("plots: Histogram: no samples")
	case opt.Bins < 0 || opt.Bins > MaxBins:
		return nil, fmt.Errorf("plots: Histogram: Bins must be 0 (automatic) to %d, got %d", MaxBins, opt.Bins)
	}
	for k, v := range samples {
		if math.IsNaN(v) || math.IsInf(v, 0) || ax.LogX && v <= 0 {
			return nil, fmt.Errorf("plots: Histogram: sample %d = %g must be finite%s", k, v, positive(ax.LogX))
		}
	}
	for k, p := range opt.Percentiles {
		if !(p >= 0 && p <= 100) {
			return nil, fmt.Errorf("plots: Histogram: percentile %d = %g must be in 0…100 %%", k, p)
		}
	}
	iv := opt.Interval
	has := iv != [2]float64{}
	if has && !(iv[0] >= 0 && iv[0] < iv[1] && iv[1] <= 100) {
		return nil, fmt.Errorf("plots: Histogram: Interval %g to %g %% must have 0 ≤ low < high ≤ 100", iv[0], iv[1])
	}
	x := slices.Clone(samples)
	slices.Sort(x)
	if !ax.LogX && math.IsInf(x[n-1]-x[0], 0) {
		return nil, fmt.Errorf("plots: Histogram: samples from %g to %g span more than a float64 holds; rescale them", x[0], x[n-1])
	}
	t := x // the values binned: x, or log10 x on a log axis
	if ax.LogX {
		t = make([]float64, n)
		for i, v := range x {
			t[i] = math.Log10(v)
		}
	}
	dividers := binEdges(t, opt.Bins, ax.LogX)
	// stat.Histogram counts x in [d_j, d_j+1): its last divider lies just above the largest
	// value (+Inf above MaxFloat64), while the last bar ends at it.
	count := slices.Clone(dividers)
	count[len(count)-1] = math.Nextafter(math.Max(count[len(count)-1], t[n-1]), math.Inf(1))
	counts := stat.Histogram(nil, count, t, nil)
	h := &histogram{edges: dividers, heights: counts, has: has}
	if ax.LogX {
		h.edges = make([]float64, len(dividers))
		for i, d := range dividers {
			h.edges[i] = math.Pow(10, d)
		}
	}
	if opt.Density {
		for i := range counts {
			w := dividers[i+1] - dividers[i] // in x, or in decades
			h.heights[i] = counts[i] / (float64(n) * w)
			if math.IsInf(h.heights[i], 0) {
				return nil, fmt.Errorf("plots: Histogram: samples from %g to %g are too close for a density in %d bins (it overflows); rescale them", x[0], x[n-1], len(counts))
			}
		}
	}
	// The mean of values near ±MaxFloat64 overflows in the sum: scale them down first.
	sc := math.Max(math.Abs(x[0]), math.Abs(x[n-1]))
	if sc == 0 {
		sc = 1
	}
	for _, v := range x {
		h.mean += v / sc
	}
	h.mean = h.mean / float64(n) * sc
	for _, p := range opt.Percentiles {
		h.pcts = append(h.pcts, stat.Quantile(p/100, stat.LinInterp, x, nil))
	}
	if has {
		h.lo, h.hi = stat.Quantile(iv[0]/100, stat.LinInterp, x, nil), stat.Quantile(iv[1]/100, stat.LinInterp, x, nil)
	}
	return h, nil
}

// binEdges returns the bin edges of the sorted values t, from the smallest to the largest:
// bins of equal width, bins of them (0 for the Freedman–Diaconis width, Scott's if the
// interquartile range is 0), or one bin if they would be narrower than the values'
// resolution. Equal values make one
// bin of width 1 around them (0.2 on a logarithmic axis, a fifth of a decade; 20 % of the
// value where 1 is below its resolution).
func binEdges(t []float64, bins int, log bool) []float64 {
	n := len(t)
	lo, hi := t[0], t[n-1]
	if lo == hi {
		w := 1.0
		if log {
			w = 0.2
		}
		if lo-w/2 == lo || hi+w/2 == hi || math.IsInf(hi+w/2, 0) {
			w = 0.2 * math.Abs(lo)
		}
		return []float64{math.Max(lo-w/2, -math.MaxFloat64), math.Min(hi+w/2, math.MaxFloat64)}
	}
	k := bins
	if k == 0 {
		k = 1
		w := 2 * (stat.Quantile(0.75, stat.LinInterp, t, nil) - stat.Quantile(0.25, stat.LinInterp, t, nil)) * math.Cbrt(1/float64(n))
		if !(w > 0) && n > 1 {
			w = 3.49 * stat.StdDev(t, nil) * math.Cbrt(1/float64(n))
		}
		if w > 0 {
			k = int(math.Min(math.Ceil((hi-lo)/w), MaxBins))
		}
		k = max(1, k)
	}
	e := make([]float64, k+1)
	for i := range e {
		e[i] = lo + (hi-lo)*float64(i)/float64(k)
	}
	e[k] = hi
	for i := 1; i <= k; i++ {
		if !(e[i] > e[i-1]) {
			return []float64{lo, hi}
		}
	}
	return e
}

// plot builds the figure of h.
func (h *histogram) plot(ax Axes, opt HistogramOptions) *plot.Plot {
	p := newPlot(ax)
	xs := newSpan()
	xs.add(h.edges[0], h.edges[len(h.edges)-1])
	p.X.Min, p.X.Max, _ = xs.axis("x", ax.LogX) // cannot fail: the samples were checked
	top := slices.Max(h.heights)
	if !(top > 0) {
		top = 1
	}
	// Room above the bars for the legend in a top corner: each entry takes about 8 % of the
	// height of a data area at a preset's size (our choice, from the Column and Notebook
	// layouts).
	room := 0.0
	if ax.Legend == TopLeft || ax.Legend == TopRight {
		room = 0.08 * float64(legendEntries(opt))
	}
	p.Y.Min, p.Y.Max = 0, top*(1+margin+room)
	p.Add(newGrid())
	c := palette[0]
	bars := &histBars{h: h, full: c, light: c}
	if h.has {
		bars.light = tint(c, 0.4)
	}
	p.Add(bars)
	var lg legendBox
	lg.add(opt.Label, swatch{bars.light})
	if h.has {
		lg.add(fmt.Sprintf("%s–%s %% interval", fmtPct(opt.Interval[0]), fmtPct(opt.Interval[1])), swatch{c})
	}
	if opt.Mean {
		sty := draw.LineStyle{Color: palette[1], Width: vg.Points(lineWidth)}
		p.Add(&vLine{x: h.mean, sty: sty})
		lg.add("mean", lineThumb{sty})
	}
	for k, v := range h.pcts {
		sty := draw.LineStyle{Color: inkColor, Width: vg.Points(errWidth), Dashes: dashes[1+k%(len(dashes)-1)]}
		p.Add(&vLine{x: v, sty: sty})
		label := "P" + fmtPct(opt.Percentiles[k])
		if opt.Percentiles[k] == 50 {
			label = "median"
		}
		lg.add(label, lineThumb{sty})
	}
	lg.addTo(p)
	return p
}

// legendEntries is the number of legend entries of a histogram with options opt.
func legendEntries(opt HistogramOptions) int {
	n := len(opt.Percentiles)
	if opt.Label != "" {
		n++
	}
	if opt.Mean {
		n++
	}
	if opt.Interval != [2]float64{} {
		n++
	}
	return n
}

// fmtPct formats a percentage as few digits as it has, e.g. 2.5, 97.5, 50.
func fmtPct(p float64) string { return strconv.FormatFloat(p, 'g', -1, 64) }

// histBars draws the bars of a histogram from 0, each in light, the part inside the
// interval (if any) in full, with thin white lines between neighbouring bars so that they
// stay apart.
type histBars struct {
	h           *histogram
	full, light color.Color
}

// Plot draws the bars.
func (b *histBars) Plot(c draw.Canvas, plt *plot.Plot) {
	trX, trY := plt.Transforms(&c)
	h := b.h
	y0 := trY(0)
	for i, v := range h.heights {
		if v == 0 {
			continue
		}
		x0, x1, y1 := trX(h.edges[i]), trX(h.edges[i+1]), trY(v)
		c.SetColor(b.light)
		c.Fill(vg.Rectangle{Min: vg.Point{X: x0, Y: y0}, Max: vg.Point{X: x1, Y: y1}}.Path())
		if h.has {
			lo, hi := math.Max(h.edges[i], h.lo), math.Min(h.edges[i+1], h.hi)
			if lo < hi {
				c.SetColor(b.full)
				c.Fill(vg.Rectangle{Min: vg.Point{X: trX(lo), Y: y0}, Max: vg.Point{X: trX(hi), Y: y1}}.Path())
			}
		}
	}
	// Separators between bars narrower than 3 pt would grey the fill: none then.
	gap := draw.LineStyle{Color: color.White, Width: vg.Points(0.5)}
	for i := 1; i < len(h.heights); i++ {
		x := trX(h.edges[i])
		if top := max(h.heights[i-1], h.heights[i]); top > 0 && trX(h.edges[i+1])-x >= vg.Points(3) && x-trX(h.edges[i-1]) >= vg.Points(3) {
			c.StrokeLine2(gap, x, y0, x, trY(top))
		}
	}
}

// vLine is a vertical line across the data area at x (a marker of a value).
type vLine struct {
	x   float64
	sty draw.LineStyle
}

// Plot draws the line if x is on the axis.
func (l *vLine) Plot(c draw.Canvas, plt *plot.Plot) {
	if l.x < plt.X.Min || l.x > plt.X.Max {
		return
	}
	trX, _ := plt.Transforms(&c)
	x := trX(l.x)
	c.StrokeLine2(l.sty, x, c.Min.Y, x, c.Max.Y)
}

// lineThumb is the legend thumbnail of a line: a horizontal stroke.
type lineThumb struct{ sty draw.LineStyle }

// Thumbnail draws the thumbnail in c.
func (t lineThumb) Thumbnail(c *draw.Canvas) {
	y := (c.Min.Y + c.Max.Y) / 2
	c.StrokeLine2(t.sty, c.Min.X, y, c.Max.X, y)
}
