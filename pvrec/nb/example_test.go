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
