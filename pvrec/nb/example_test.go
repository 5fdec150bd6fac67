package nb_test

import (
	"fmt"

	"github.com/pvrec/pvrec/pvrec/nb"
	"github.com/pvrec/pvrec/pvrec/plots"
)

// Build the HTML of a small results table; in a notebook, nb.Table displays it directly.
func ExampleTableHTML() {
	h, err := nb.TableHTML("", []string{"T (K)"}, [][]string{{"300"}})
	fmt.Println(h, err)
	// Output: <table style="border-collapse:collapse;font-family:sans-serif;font-size:0.9em"><tr><th style="border-bottom:1px solid #888;padding:2px 8px">T (K)</th></tr><tr><td style="padding:2px 8px;text-align:right">300</td></tr></table> <nil>
}

// A table built from typed columns with units; in a notebook, nb.Columns displays it with a
// CSV download of the same numbers.
func ExampleColumnsCSV() {
	csv, err := nb.ColumnsCSV(
		nb.Column{Name: "Δn", Unit: "cm⁻³", Format: "%.0e", Values: []float64{1e14, 1e15}},
		nb.Column{Name: "τeff", Unit: "µs", Scale: nb.Microsecond, Format: "%.0f", Values: []float64{1.2e-3, 0.95e-3}},
	)
	fmt.Print(csv, err)
	// Output:
	// Δn (cm⁻³),τeff (µs)
	// 1e+14,1200
	// 1e+15,950
	// <nil>
}

// An exploration with one log slider. In a notebook open in a browser, moving the slider
// redraws the figure in place; outside GoNB (as here) and in a headless run, Run draws the
// initial values once and returns.
func ExampleExplore() {
	e := nb.Explore{
		Controls: []nb.Control{
			nb.LogSlider{Name: "Dit", Unit: "cm⁻² eV⁻¹", Min: 1e10, Max: 1e13, Value: 1e11, Steps: 30},
		},
		Draw: func(v nb.Values) (nb.View, error) {
			fmt.Println("drawing at", v)
			s, err := plots.Func("Seff", []float64{1e14, 1e16}, func(dn float64) (float64, error) {
				return 1e-10 * v.Get("Dit"), nil // an invented proportionality, for the example
			})
			if err != nil {
				return nb.View{}, err
			}
			p, err := plots.Lines(plots.Axes{XLabel: "Δn (cm^-3)", YLabel: "Seff (cm/s)", LogX: true}, s)
			return nb.View{Plot: p}, err
		},
	}
	fmt.Println(e.Run())
	// Output:
	// drawing at Dit = 1e+11 cm⁻² eV⁻¹
	// <nil>
}
