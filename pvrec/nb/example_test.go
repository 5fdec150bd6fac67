package nb_test

import (
	"fmt"

	"github.com/pvrec/pvrec/pvrec/nb"
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
