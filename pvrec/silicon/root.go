package silicon

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/roots"
)

// brentRoot returns a root of f in the bracket [a, b], where fa = f(a) and fb = f(b) have
// opposite signs (or one is zero), to within tol (absolute, in x) plus 4 ulp, by Brent's
// method (package internal/roots; R. P. Brent, "Algorithms for Minimization without
// Derivatives", Prentice-Hall, 1973). It fails with an error rather than returning an
// unconverged point.
func brentRoot(f func(float64) (float64, error), a, b, fa, fb, tol float64) (float64, error) {
	x, err := roots.Brent(f, a, b, fa, fb, tol, 400)
	if err != nil {
		return 0, fmt.Errorf("silicon: internal root finding: %w", err)
	}
	return x, nil
}

// newtonRoot returns the root of the increasing function f (with derivative df, both
// evaluated by fdf) in the bracket [lo, hi] with f(lo) <= 0 <= f(hi), starting from x0 where
// f = f0 and df = df0, by
// Newton steps safeguarded by bisection: a step leaving the current bracket is replaced by
// bisection, and the bracket shrinks with every evaluation, so it always converges. It stops
// when a step is below tol·max(1, |x|) or after 200 iterations.
func newtonRoot(fdf func(float64) (f, df float64), lo, hi, x0, f0, df0, tol float64) float64 {
	x, f, df := x0, f0, df0
	for iter := 0; iter < 200; iter++ {
		if iter > 0 {
			f, df = fdf(x)
		}
		if f == 0 {
			return x
		}
		if f < 0 {
			lo = x
		} else {
			hi = x
		}
		next := x - f/df
		if !(next >= lo && next <= hi) { // also catches NaN from df == 0
			next = lo + 0.5*(hi-lo)
		}
		if math.Abs(next-x) <= tol*math.Max(1, math.Abs(x)) {
			return next
		}
		x = next
	}
	return x
}
