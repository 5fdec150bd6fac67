package plots_test

import (
	"fmt"

	"gonum.org/v1/plot"

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
