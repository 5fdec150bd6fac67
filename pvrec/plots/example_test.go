package plots_test

import (
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/vg"

	"github.com/pvrec/pvrec/pvrec/plots"
)

// A figure of lifetime versus injection on log–log axes, rendered to SVG.
func ExampleLines() {
	p, err := plots.Lines(plots.Axes{XLabel: "Δn (cm^-3)", YLabel: "τ (s)", LogX: true, LogY: true},
		plots.Series{Label: "demo", X: []float64{1e13, 1e15, 1e17}, Y: []float64{2e-3, 1e-3, 1e-5}})
	if err != nil {
		fmt.Println(err)
		return
	}
	svg, err := plots.SVG(p)
	fmt.Println(err == nil && len(svg) > 0)
	// Output: true
}

// A J0 budget as a horizontal bar chart, largest part first (invented values).
func ExampleBars() {
	p, err := plots.Bars(plots.Axes{Title: "J0 budget at Voc", XLabel: "J0 (fA/cm^2)"},
		plots.Bar{Label: "front: emitter", Value: 34},
		plots.Bar{Label: "rear: contacts", Value: 10},
		plots.Bar{Label: "base", Value: 4})
	if err != nil {
		fmt.Println(err)
		return
	}
	svg, err := plots.SVGInline(p)
	fmt.Println(err == nil && len(svg) > 0)
	// Output: true
}

// A J0 budget by region and mechanism as stacked bars, saved as a PDF for a journal column
// (invented values).
func ExampleStacked() {
	p, err := plots.Stacked(plots.Axes{XLabel: "J0 (fA/cm^2)", Legend: plots.BottomRight},
		[]string{"front", "rear", "base"},
		plots.BarSet{Label: "passivated", Values: []float64{20, 6, 4}},
		plots.BarSet{Label: "contacts", Values: []float64{14, 10, 0}})
	if err != nil {
		fmt.Println(err)
		return
	}
	pdf, err := plots.Figure{Panels: []*plot.Plot{p}, Preset: plots.Column}.Encode("pdf")
	fmt.Println(err == nil && len(pdf) > 0)
	// Output: true
}

// Two designs compared part by part as grouped bars (invented values).
func ExampleGrouped() {
	p, err := plots.Grouped(plots.Axes{XLabel: "J0 (fA/cm^2)", Legend: plots.BottomRight},
		[]string{"front", "rear"},
		plots.BarSet{Label: "design A", Values: []float64{34, 16}},
		plots.BarSet{Label: "design B", Values: []float64{25, 19}})
	if err != nil {
		fmt.Println(err)
		return
	}
	svg, err := plots.SVGInline(p)
	fmt.Println(err == nil && len(svg) > 0)
	// Output: true
}

// A map of a surface recombination velocity over fixed charge and interface-state density,
// with contour lines at 10 and 100 cm/s (an invented formula in place of a pvrec model).
func ExampleHeatMap() {
	qf := []float64{0, 0.5e12, 1e12, 2e12, 3e12}
	dit := []float64{1e9, 1e10, 1e11, 1e12}
	g, err := plots.GridFunc(qf, dit, func(q, d float64) (float64, error) {
		return d / 1e8 / (1 + q*q/1e24), nil
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	p, err := plots.HeatMap(plots.Axes{XLabel: "Qf (cm^-2)", YLabel: "Dit (cm^-2 eV^-1)", LogY: true,
		RightLabel: "Seff (cm/s)", LogRight: true}, g, 10, 100)
	if err != nil {
		fmt.Println(err)
		return
	}
	svg, err := plots.SVGInline(p)
	fmt.Println(err == nil && len(svg) > 0)
	// Output: true
}

// Markup labels with a unit written the plain way.
func ExampleUnit() {
	fmt.Println(`$\Delta n$ (` + plots.Unit("cm^-3") + `)`)
	fmt.Println(`$J_{0}$ (` + plots.Unit("fA/cm^2") + `)`)
	// Output:
	// $\Delta n$ (cm$^{-3}$)
	// $J_{0}$ (fA/cm$^{2}$)
}

// Measured points with error bars beside a model curve with its uncertainty band, and a
// limit drawn dashed (invented values).
func ExampleLines_measured() {
	dn := []float64{1e13, 1e14, 1e15, 1e16, 1e17}
	model := []float64{2.0e-3, 2.0e-3, 1.9e-3, 1.4e-3, 3.0e-4}
	lo, hi := make([]float64, len(model)), make([]float64, len(model))
	for i, v := range model {
		lo[i], hi[i] = 0.8*v, 1.25*v
	}
	p, err := plots.Lines(plots.Axes{XLabel: "Δn (cm^-3)", YLabel: `$\tau_{\rm eff}$ (s)`, LogX: true, LogY: true, Legend: plots.BottomLeft},
		plots.Series{Label: "model, ±25 %", X: dn, Y: model, Lo: lo, Hi: hi},
		plots.Series{Label: "measured", X: []float64{3e13, 3e15, 5e16}, Y: []float64{1.9e-3, 1.8e-3, 8e-4},
			YErr: []float64{2e-4, 2e-4, 1e-4}, Points: true},
		plots.Series{Label: "intrinsic limit", X: dn, Y: []float64{2e-2, 2e-2, 1.8e-2, 6e-3, 3.5e-4}, Dashed: true})
	if err != nil {
		fmt.Println(err)
		return
	}
	svg, err := plots.SVGInline(p)
	fmt.Println(err == nil && len(svg) > 0)
	// Output: true
}

// Two quantities against one injection axis: lifetime on the left, implied Voc on the right
// (invented values).
func ExampleLines_twinAxes() {
	dn := []float64{1e13, 1e14, 1e15, 1e16, 1e17}
	p, err := plots.Lines(plots.Axes{XLabel: "Δn (cm^-3)", YLabel: "τ (s)", RightLabel: "iVoc (V)", LogX: true, LogY: true},
		plots.Series{Label: "τ (left)", X: dn, Y: []float64{2e-3, 2e-3, 1.9e-3, 1.4e-3, 3e-4}},
		plots.Series{Label: "iVoc (right)", X: dn, Y: []float64{0.58, 0.64, 0.70, 0.75, 0.79}, Right: true})
	if err != nil {
		fmt.Println(err)
		return
	}
	svg, err := plots.SVGInline(p)
	fmt.Println(err == nil && len(svg) > 0)
	// Output: true
}

// A curve computed from a function of x, the one loop a notebook would otherwise paste.
func ExampleFunc() {
	s, err := plots.Func("1/x", []float64{1, 2, 4}, func(x float64) (float64, error) { return 1 / x, nil })
	fmt.Println(s.Y, err)
	// Output: [1 0.5 0.25] <nil>
}

// A two-panel figure at a journal's full width, lettered (a) and (b), exported for a LaTeX
// manuscript (whose fonts then set the labels), as PDF and as PNG at 600 dpi.
func ExampleFigure() {
	dn := []float64{1e13, 1e15, 1e17}
	a, err := plots.Lines(plots.Axes{XLabel: "Δn (cm^-3)", YLabel: "τ (s)", LogX: true, LogY: true},
		plots.Series{Label: "model", X: dn, Y: []float64{2e-3, 1e-3, 1e-5}})
	if err != nil {
		fmt.Println(err)
		return
	}
	b, err := plots.Bars(plots.Axes{XLabel: "J0 (fA/cm^2)"},
		plots.Bar{Label: "front", Value: 34}, plots.Bar{Label: "rear", Value: 10})
	if err != nil {
		fmt.Println(err)
		return
	}
	f := plots.Figure{Panels: []*plot.Plot{a, b}, Preset: plots.DoubleColumn}
	tex, err := f.Encode("tex")
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(strings.Contains(string(tex), `$\Delta$n (cm$^{-3}$)`))
	// In a script: f.Save("fig3.pdf"), f.Save("fig3.tex").
	for _, format := range []string{"pdf", "png"} {
		f.DPI = 600
		if _, err := f.Encode(format); err != nil {
			fmt.Println(err)
		}
	}
	// Output: true
}

// A figure rendered at a size of one's choosing, at the house type sizes.
func ExampleEncode() {
	p, err := plots.Lines(plots.Axes{XLabel: "V (V)", YLabel: "J (mA/cm^2)"},
		plots.Series{Label: "J–V", X: []float64{0, 0.6, 0.7}, Y: []float64{40, 38, 0}})
	if err != nil {
		fmt.Println(err)
		return
	}
	b, err := plots.Encode(p, 12*vg.Centimeter, 8*vg.Centimeter, "eps")
	fmt.Println(err == nil && strings.HasPrefix(string(b), "%!PS-Adobe"))
	// Output: true
}

// The distribution of an open-circuit voltage over the draws of an uncertainty analysis,
// with its mean, median and 95 % interval (invented values in place of a pvrec analysis).
func ExampleHistogram() {
	voc := make([]float64, 2000)
	for i := range voc {
		voc[i] = 0.712 + 0.004*math.Sin(float64(i)*1.7)*math.Cos(float64(i)*0.3)
	}
	p, err := plots.Histogram(plots.Axes{XLabel: "Voc (V)", YLabel: "draws", Legend: plots.TopRight}, voc,
		plots.HistogramOptions{Mean: true, Percentiles: []float64{50}, Interval: [2]float64{2.5, 97.5}})
	if err != nil {
		fmt.Println(err)
		return
	}
	svg, err := plots.SVGInline(p)
	fmt.Println(err == nil && len(svg) > 0)
	// Output: true
}

// The sensitivity of Voc to each input, one at a time from its low to its high value, the
// largest swing on top (invented values).
func ExampleTornado() {
	p, err := plots.Tornado(plots.Axes{XLabel: "Voc (mV)", Legend: plots.BottomLeft}, 712, []plots.TornadoBar{
		{Label: "Qf ± 30 %", Low: 710.5, High: 713.1},
		{Label: "τ_{bulk} ± 50 %", Low: 704, High: 716},
		{Label: "W 160–200 µm", Low: 713, High: 711},
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	svg, err := plots.SVGInline(p)
	fmt.Println(err == nil && len(svg) > 0)
	// Output: true
}

// The spread of a J0 over model sets, the default highlighted; the long model-set names
// break into lines (invented values).
func ExampleStrip() {
	p, err := plots.Strip(plots.Axes{XLabel: "J0 (fA/cm^2)"},
		plots.StripGroup{Label: "BGN varied", Members: []plots.StripMember{
			{Label: "BGN model A + FD, μ model M1, Auger model X1", Value: 31.5, Default: true},
			{Label: "BGN model C, μ model M1, Auger model X1", Value: 36.8},
		}},
		plots.StripGroup{Label: "Auger varied", Members: []plots.StripMember{
			{Label: "Auger model X1", Value: 31.5, Default: true},
			{Label: "Auger model X2", Value: 30.1},
		}})
	if err != nil {
		fmt.Println(err)
		return
	}
	pdf, err := plots.Figure{Panels: []*plot.Plot{p}, Preset: plots.Column}.Encode("pdf")
	fmt.Println(err == nil && len(pdf) > 0)
	// Output: true
}
