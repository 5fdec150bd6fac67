package plots_test

import (
	"fmt"

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
