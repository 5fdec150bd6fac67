package roots_test

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/roots"
)

// Solve x = cos x on [0, 1].
func ExampleBrent() {
	f := func(x float64) (float64, error) { return x - math.Cos(x), nil }
	x, err := roots.Brent(f, 0, 1, -1, 1-math.Cos(1), 1e-15, 100)
	fmt.Printf("%.12f %v\n", x, err)
	// Output: 0.739085133215 <nil>
}
