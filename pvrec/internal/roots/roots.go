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

// Bracket searches outward from x0, where f = f0, for an interval [lo, hi] on which the
// monotone function f changes sign (flo = f(lo) and fhi = f(hi) of opposite signs, or one of
// them zero), ready for Brent. increasing says whether f rises with x, which fixes the
// direction of the search; steps start at step (> 0) and are multiplied by grow (>= 1) after
// each evaluation, and the search stops at xmin or xmax (xmin <= x0 <= xmax). If f0 = 0 it
// returns lo = hi = x0. An error from f is returned unchanged; reaching a limit without a sign
// change gives ErrNoBracket, wrapped with the limit.
func Bracket(f func(float64) (float64, error), x0, f0, step, grow, xmin, xmax float64, increasing bool) (lo, hi, flo, fhi float64, err error) {
	if f0 == 0 {
		return x0, x0, f0, f0, nil
	}
	if math.IsNaN(f0) || !(step > 0) || !(grow >= 1) || !(xmin <= x0 && x0 <= xmax) {
		return 0, 0, 0, 0, fmt.Errorf("bracket from x0 = %g (f = %g) with step %g, growth %g in [%g, %g]: %w",
			x0, f0, step, grow, xmin, xmax, ErrNoBracket)
	}
	up := (f0 < 0) == increasing // the root lies above x0
	x, fx := x0, f0
	for {
		prev, fprev := x, fx
		if up {
			if x == xmax {
				return 0, 0, 0, 0, fmt.Errorf("no sign change up to x = %g: %w", xmax, ErrNoBracket)
			}
			x = math.Min(x+step, xmax)
		} else {
			if x == xmin {
				return 0, 0, 0, 0, fmt.Errorf("no sign change down to x = %g: %w", xmin, ErrNoBracket)
			}
			x = math.Max(x-step, xmin)
		}
		if fx, err = f(x); err != nil {
			return 0, 0, 0, 0, err
		}
		if math.IsNaN(fx) {
			return 0, 0, 0, 0, fmt.Errorf("f(%g) is NaN: %w", x, ErrNoConvergence)
		}
		if fx == 0 || (fx > 0) != (fprev > 0) {
			if up {
				return prev, x, fprev, fx, nil
			}
			return x, prev, fx, fprev, nil
		}
		step *= grow
	}
}
