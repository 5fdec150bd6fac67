package surface

import (
	"errors"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/internal/roots"
)

// brent finds a root of f in the bracket [a, b] (fa = f(a), fb = f(b) of opposite signs) to
// within xtol by Brent's method (package internal/roots). A missing bracket is reported as
// non-convergence of the surface solve (pvrec.ErrNoConvergence), as are NaN and more than
// maxIter iterations; an error from f is passed on.
func brent(f func(float64) (float64, error), a, b, fa, fb, xtol float64, maxIter int) (float64, error) {
	x, err := roots.Brent(f, a, b, fa, fb, xtol, maxIter)
	if errors.Is(err, roots.ErrNoBracket) || errors.Is(err, check.ErrNoConvergence) {
		return 0, check.NoConvergence("surface: %v", err)
	}
	return x, err
}
