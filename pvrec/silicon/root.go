package silicon

import (
	"errors"
	"math"
)

// errNoBracket is returned by the root finders when f(a) and f(b) have the same sign.
var errNoBracket = errors.New("silicon: internal error: root not bracketed")

// brentRoot returns a root of f in the bracket [a, b], where fa = f(a) and fb = f(b) have
// opposite signs (or one is zero), to within tol (absolute, in x) or 4 ulp, using the method
// of R. P. Brent, "Algorithms for Minimization without Derivatives" (Prentice-Hall, 1973),
// chapter 4: inverse quadratic interpolation and secant steps, falling back on bisection, so
// it always converges, in at most about 2·log2((b−a)/tol) evaluations. Hand-written because
// gonum v0.17 offers minimisers (optimize) but no bracketed scalar root finder.
func brentRoot(f func(float64) (float64, error), a, b, fa, fb, tol float64) (float64, error) {
	if fa == 0 {
		return a, nil
	}
	if fb == 0 {
		return b, nil
	}
	if (fa > 0) == (fb > 0) {
		return 0, errNoBracket
	}
	c, fc := a, fa
	d := b - a
	e := d
	for iter := 0; iter < 400; iter++ {
		if (fb > 0) == (fc > 0) {
			c, fc = a, fa
			d = b - a
			e = d
		}
		if math.Abs(fc) < math.Abs(fb) {
			a, b, c = b, c, b
			fa, fb, fc = fb, fc, fb
		}
		tol1 := 4*0x1p-52*math.Abs(b) + 0.5*tol
		xm := 0.5 * (c - b)
		if math.Abs(xm) <= tol1 || fb == 0 {
			return b, nil
		}
		if math.Abs(e) >= tol1 && math.Abs(fa) > math.Abs(fb) {
			var p, q float64
			s := fb / fa
			if a == c { // secant
				p = 2 * xm * s
				q = 1 - s
			} else { // inverse quadratic interpolation
				qq := fa / fc
				r := fb / fc
				p = s * (2*xm*qq*(qq-r) - (b-a)*(r-1))
				q = (qq - 1) * (r - 1) * (s - 1)
			}
			if p > 0 {
				q = -q
			}
			p = math.Abs(p)
			if 2*p < math.Min(3*xm*q-math.Abs(tol1*q), math.Abs(e*q)) {
				e = d
				d = p / q
			} else {
				d = xm
				e = d
			}
		} else {
			d = xm
			e = d
		}
		a, fa = b, fb
		if math.Abs(d) > tol1 {
			b += d
		} else {
			b += math.Copysign(tol1, xm)
		}
		var err error
		if fb, err = f(b); err != nil {
			return 0, err
		}
	}
	return b, nil
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
