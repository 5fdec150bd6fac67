// Package roots holds the bracketed scalar root finder shared by pvrec's numerical
// inversions (equilibrium Fermi level, resistivity, surface potential, Sproul's eigenvalue,
// implied voltage). It is hand-written because gonum v0.17 offers minimisers (optimize) but no
// bracketed scalar root finder.
package roots

import (
	"errors"
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// ErrNoBracket is returned when f(a) and f(b) do not have opposite signs (or one is NaN), or
// when Bracket finds no sign change within its limits.
var ErrNoBracket = errors.New("roots: root not bracketed")

// Solve is Brent for callers that treat a lost bracket like any other failure to converge:
// it returns the root of f in [a, b] as Brent does, and reports ErrNoBracket, NaN and the
// iteration limit alike as an error matching check.ErrNoConvergence; an error from f is
// passed on unchanged.
func Solve(f func(float64) (float64, error), a, b, fa, fb, xtol float64, maxIter int) (float64, error) {
	x, err := Brent(f, a, b, fa, fb, xtol, maxIter)
	if errors.Is(err, ErrNoBracket) && !errors.Is(err, check.ErrNoConvergence) {
		return 0, check.NoConvergence("%v", err)
	}
	return x, err
}

// maxBracketEvals bounds the evaluations of Bracket, so that a step too small for the range
// (grow = 1) cannot make it run for hours.
const maxBracketEvals = 10000

// Brent returns a root of f in the bracket [a, b], where fa = f(a) and fb = f(b) have
// opposite signs (or one is zero), to within xtol (absolute, >= 0) plus 4 ulp of the root,
// by the method of R. P. Brent, "Algorithms for Minimization without Derivatives"
// (Prentice-Hall, 1973), chapter 4: inverse quadratic interpolation and secant steps,
// safeguarded by bisection, so that the bracket always shrinks to the tolerance. An error from
// f is returned unchanged; a bracket without a sign change gives ErrNoBracket; NaN from f or
// more than maxIter iterations give an error matching check.ErrNoConvergence (all with the
// values involved in the message).
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
			return 0, check.NoConvergence("roots: Brent: f(%g) is NaN", b)
		}
	}
	return 0, check.NoConvergence("roots: Brent: no root to tolerance in %d iterations (bracket [%g, %g])", maxIter, b, c)
}

// Bracket searches outward from x0, where f = f0, for an interval [lo, hi] on which the
// monotone function f changes sign (flo = f(lo) and fhi = f(hi) of opposite signs, or one of
// them zero), ready for Brent. increasing says whether f rises with x, which fixes the
// direction of the search; steps start at step (> 0) and are multiplied by grow (>= 1) after
// each evaluation, and the search stops at xmin or xmax (xmin <= x0 <= xmax). If f0 = 0 it
// returns lo = hi = x0. An error from f is returned unchanged; reaching a limit without a sign
// change, a fixed step (grow = 1) below the resolution of x, or 10000 steps without a sign
// change give ErrNoBracket, wrapped with the limit; NaN from f gives an error matching
// check.ErrNoConvergence.
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
	for evals := 0; ; evals++ {
		if evals == maxBracketEvals {
			return 0, 0, 0, 0, fmt.Errorf("no sign change in %d steps from x0 = %g (reached x = %g): %w", maxBracketEvals, x0, x, ErrNoBracket)
		}
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
		if x == prev { // the step is below the resolution of x
			if grow == 1 {
				return 0, 0, 0, 0, fmt.Errorf("step %g below the resolution of x = %g: %w", step, x, ErrNoBracket)
			}
			step *= grow
			continue
		}
		if fx, err = f(x); err != nil {
			return 0, 0, 0, 0, err
		}
		if math.IsNaN(fx) {
			return 0, 0, 0, 0, check.NoConvergence("roots: Bracket: f(%g) is NaN", x)
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
