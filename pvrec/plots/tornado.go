package plots

import (
	"cmp"
	"fmt"
	"image/color"
	"math"
	"slices"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
)

// TornadoBar is one input of a tornado chart: the result with that input at its low and at
// its high value and every other input at its base value, in the unit of Axes.XLabel.
type TornadoBar struct {
	Label     string  // the input, e.g. "τ_{bulk} ± 50 %"
	Low, High float64 // the result with the input at its low and at its high value, finite
}

// Tornado returns a tornado chart in the house style: for each input a horizontal bar from
// base (the result with every input at its base value, marked by a vertical line) to the
// result at the input's low value, in the first colour of the house cycle, and one to the
// result at its high value, in the second, with a legend "input low", "input high" (at
// ax.Legend). Inputs are sorted by their swing |High − Low|, the largest on top (equal swings
// keep the order given); their labels are on the vertical axis. ax.Title and ax.XLabel (the
// result, with its unit) are used; the value axis is linear, or logarithmic if ax.LogX, and
// holds base and every bar with the house margin. Where low and high move the result the
// same way, both bars lie on one side of base, the shorter drawn over the longer.
//
// It returns an error for no bars, an empty label, a base or value that is not finite (or not
// > 0 on a logarithmic axis), values spanning more than a float64 holds, a label that is
// markup and does not parse, or axes options a tornado chart cannot honour (LogY, a YLabel, a
// RightLabel or LogRight).
func Tornado(ax Axes, base float64, bars []TornadoBar) (*plot.Plot, error) {
	if ax.LogY || ax.YLabel != "" || ax.RightLabel != "" || ax.LogRight {
		return nil, fmt.Errorf("plots: Tornado: a tornado chart has its inputs on the vertical axis and no right-hand scale (LogY %v, YLabel %q, RightLabel %q, LogRight %v)",
			ax.LogY, ax.YLabel, ax.RightLabel, ax.LogRight)
	}
	if err := checkAxes(ax); err != nil {
		return nil, err
	}
	if len(bars) == 0 {
		return nil, fmt.Errorf("plots: Tornado: no bars to draw")
	}
	bad := func(v float64) bool { return math.IsNaN(v) || math.IsInf(v, 0) || ax.LogX && v <= 0 }
	if bad(base) {
		return nil, fmt.Errorf("plots: Tornado: base = %g must be finite%s", base, positive(ax.LogX))
	}
	xs := newSpan()
	xs.add(base)
	for i, b := range bars {
		if b.Label == "" {
			return nil, fmt.Errorf("plots: Tornado: bar %d has no label", i)
		}
		if err := checkLabel(fmt.Sprintf("Tornado: bar %d label", i), b.Label); err != nil {
			return nil, err
		}
		if bad(b.Low) || bad(b.High) {
			return nil, fmt.Errorf("plots: Tornado: bar %d (%q): Low = %g and High = %g must be finite%s", i, b.Label, b.Low, b.High, positive(ax.LogX))
		}
		xs.add(b.Low, b.High)
	}
	sorted := slices.Clone(bars)
	// The swing in the axis's terms: |log High − log Low| on a log axis, whose difference
	// cannot overflow; on a linear axis the span check below covers High − Low.
	swing := func(b TornadoBar) float64 {
		if ax.LogX {
			return math.Abs(math.Log(b.High) - math.Log(b.Low))
		}
		return math.Abs(b.High/2 - b.Low/2)
	}
	slices.SortStableFunc(sorted, func(a, b TornadoBar) int { return cmp.Compare(swing(b), swing(a)) })
	p := newPlot(ax)
	var err error
	if p.X.Min, p.X.Max, err = xs.axis("x", ax.LogX); err != nil {
		return nil, err
	}
	n := len(sorted)
	p.Y.Min, p.Y.Max = -0.5, float64(n)-0.5
	p.Add(&gridLines{sty: draw.LineStyle{Color: gridColor, Width: vg.Points(gridWidth)}, vertical: true})
	t := &tornadoBars{base: base, bars: make([]TornadoBar, n), low: palette[0], high: palette[1]}
	labels := make([]string, n)
	for i, b := range sorted { // position 0 is at the bottom: the largest swing goes on top
		t.bars[n-1-i], labels[n-1-i] = b, b.Label
	}
	p.Add(t)
	p.Add(&vLine{x: base, sty: draw.LineStyle{Color: inkColor, Width: vg.Points(errWidth)}})
	p.NominalY(labels...)
	var lg legendBox
	lg.add("input low", swatch{t.low})
	lg.add("input high", swatch{t.high})
	lg.addTo(p)
	return p, nil
}

// tornadoBars draws the bars of a tornado chart at the category positions 0, 1, … (bottom
// to top), 60 % of the slot thick.
type tornadoBars struct {
	base      float64
	bars      []TornadoBar
	low, high color.Color
}

// Plot draws the bars, for each input the longer of its two first.
func (t *tornadoBars) Plot(c draw.Canvas, plt *plot.Plot) {
	trX, trY := plt.Transforms(&c)
	th := 0.6 * vg.Length(math.Abs(float64(trY(1)-trY(0))))
	x0 := trX(t.base)
	for i, b := range t.bars {
		y := trY(float64(i))
		parts := []struct {
			x   vg.Length
			col color.Color
		}{{trX(b.Low), t.low}, {trX(b.High), t.high}}
		if abs(parts[0].x-x0) < abs(parts[1].x-x0) {
			parts[0], parts[1] = parts[1], parts[0]
		}
		for _, q := range parts {
			c.SetColor(q.col)
			c.Fill(vg.Rectangle{Min: vg.Point{X: min(x0, q.x), Y: y - th/2}, Max: vg.Point{X: max(x0, q.x), Y: y + th/2}}.Path())
		}
	}
}

func abs(v vg.Length) vg.Length { return max(v, -v) }
