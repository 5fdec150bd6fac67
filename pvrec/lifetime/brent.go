package lifetime

import (
	"errors"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/internal/roots"
)

// brent finds a root of f in the bracket [a, b] by Brent's method (package internal/roots),
// reporting a lost bracket, NaN or the iteration limit as pvrec.ErrNoConvergence and passing
// an error from f on.
func brent(f func(float64) (float64, error), a, b, fa, fb, xtol float64, maxIter int) (float64, error) {
	x, err := roots.Brent(f, a, b, fa, fb, xtol, maxIter)
	if errors.Is(err, roots.ErrNoBracket) || errors.Is(err, roots.ErrNoConvergence) {
		return 0, check.NoConvergence("%v", err)
	}
	return x, err
}
