// Package roots holds the bracketed scalar root finder shared by pvrec's numerical
// inversions (equilibrium Fermi level, resistivity, surface potential, Sproul's eigenvalue,
// implied voltage). It is hand-written because gonum v0.17 offers minimisers (optimize) but no
// bracketed scalar root finder.
package roots

import (
	"errors"
	"fmt"
	"math"
)

// ErrNoBracket is returned when f(a) and f(b) do not have opposite signs (or one is NaN).
var ErrNoBracket = errors.New("roots: root not bracketed")

// ErrNoConvergence is returned when the iteration limit is reached or f returns NaN.
var ErrNoConvergence = errors.New("roots: no convergence")

// Brent returns a root of f in the bracket [a, b], where fa = f(a) and fb = f(b) have
// opposite signs (or one is zero), to within xtol (absolute, >= 0) plus 4 ulp of the root,
// by the method of R. P. Brent, "Algorithms for Minimization without Derivatives"
// (Prentice-Hall, 1973), chapter 4: inverse quadratic interpolation and secant steps,
// safeguarded by bisection, so that the bracket always shrinks to the tolerance. An error from
// f is returned unchanged; a bracket without a sign change gives ErrNoBracket; NaN from f or
// more than maxIter iterations give ErrNoConvergence (all wrapped with the values involved).
func Brent(f func(float64) (float64, error), a, b, fa, fb, xtol float64, maxIter int) (float64, error) {
	if fa == 0 {
		return a, nil
	}
	if fb == 0 {
		return b, nil
	}
	if math.IsNaN(fa) || math.IsNaN(fb) || (fa > 0) == (fb > 0) {
		return 0, fmt.Errorf("f(%g) = %g, f(%g) = %g: %w", a, fa, b, fb, ErrNoBracket)
	}
	c, fc := a, fa
	d := b - a
	e := d
	for iter := 0; iter < maxIter; iter++ {
		if (fb > 0) == (fc > 0) {
			c, fc = a, fa
			d = b - a
			e = d
		}
		if math.Abs(fc) < math.Abs(fb) {
			a, b, c = b, c, b
			fa, fb, fc = fb, fc, fb
		}
		tol := 4*0x1p-53*math.Abs(b) + 0.5*xtol
		if tol == 0 {
			tol = math.SmallestNonzeroFloat64
		}
		m := 0.5 * (c - b)
		if math.Abs(m) <= tol || fb == 0 {
			return b, nil
		}
		if math.Abs(e) >= tol && math.Abs(fa) > math.Abs(fb) {
			var p, q float64
			s := fb / fa
			if a == c { // secant
				p = 2 * m * s
				q = 1 - s
			} else { // inverse quadratic interpolation
				qq := fa / fc
				r := fb / fc
				p = s * (2*m*qq*(qq-r) - (b-a)*(r-1))
				q = (qq - 1) * (r - 1) * (s - 1)
			}
			if p > 0 {
				q = -q
			}
			p = math.Abs(p)
			if 2*p < math.Min(3*m*q-math.Abs(tol*q), math.Abs(e*q)) {
				e = d
				d = p / q
			} else {
				d = m
				e = m
			}
		} else {
			d = m
			e = m
		}
		a, fa = b, fb
		if math.Abs(d) > tol {
			b += d
		} else if m > 0 {
			b += tol
		} else {
			b -= tol
		}
		var err error
		fb, err = f(b)
		if err != nil {
			return 0, err
		}
		if math.IsNaN(fb) {
			return 0, fmt.Errorf("f(%g) is NaN: %w", b, ErrNoConvergence)
		}
	}
	return 0, fmt.Errorf("no root to tolerance in %d iterations (bracket [%g, %g]): %w", maxIter, b, c, ErrNoConvergence)
}
