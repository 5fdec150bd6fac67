package sweep_test

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/sweep"
)

// Evaluate a function over a grid concurrently; the results come back in input order.
func ExampleRun() {
	x := []float64{1, 2, 4, 8}
	out, errs := sweep.Run(len(x), 0, func(i int) (float64, error) { return math.Sqrt(x[i]), nil })
	if errs != nil {
		fmt.Println(errs)
	}
	fmt.Printf("%.3f\n", out)
	// Output:
	// [1.000 1.414 2.000 2.828]
}
