package roots

import (
	"errors"
	"math"
	"testing"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

func TestBrentKnownRoots(t *testing.T) {
	tests := []struct {
		name string
		f    func(float64) float64
		a, b float64
		want float64
	}{
		{"linear", func(x float64) float64 { return 2*x - 1 }, -3, 4, 0.5},
		{"sqrt2", func(x float64) float64 { return x*x - 2 }, 0, 2, math.Sqrt2},
		{"cos", math.Cos, 1, 2, math.Pi / 2},
		{"steep exp", func(x float64) float64 { return math.Expm1(50 * x) }, -1, 0.5, 0},
		{"flat cubic", func(x float64) float64 { return (x - 1) * (x - 1) * (x - 1) }, 0, 3, 1},
	}
	for _, tc := range tests {
		f := func(x float64) (float64, error) { return tc.f(x), nil }
		got, err := Brent(f, tc.a, tc.b, tc.f(tc.a), tc.f(tc.b), 1e-14, 200)
		if err != nil {
			t.Errorf("%s: %v", tc.name, err)
			continue
		}
		// Closed-form roots; tolerance: xtol plus a few ulp (the cubic's root is only
		// determined to about cbrt(eps) in x, since f is below rounding there).
		tol := 1e-13
		if tc.name == "flat cubic" {
			tol = 1e-5
		}
		if math.Abs(got-tc.want) > tol {
			t.Errorf("%s: root %.17g, want %.17g", tc.name, got, tc.want)
		}
	}
}

func TestBrentErrors(t *testing.T) {
	sq := func(x float64) (float64, error) { return x*x + 1, nil }
	if _, err := Brent(sq, -1, 1, 2, 2, 0, 100); !errors.Is(err, ErrNoBracket) {
		t.Errorf("no sign change: %v", err)
	}
	if _, err := Brent(sq, -1, 1, math.NaN(), -1, 0, 100); !errors.Is(err, ErrNoBracket) {
		t.Errorf("NaN end: %v", err)
	}
	boom := errors.New("boom")
	bad := func(x float64) (float64, error) { return 0, boom }
	if _, err := Brent(bad, -1, 1, -1, 1, 0, 100); !errors.Is(err, boom) {
		t.Errorf("error from f not passed on: %v", err)
	}
	nan := func(x float64) (float64, error) { return math.NaN(), nil }
	if _, err := Brent(nan, -1, 1, -1, 1, 0, 100); !errors.Is(err, check.ErrNoConvergence) {
		t.Errorf("NaN from f: %v", err)
	}
	// A step function gives Brent nothing to interpolate: it bisects, far more than 3 times.
	step := func(x float64) (float64, error) { return math.Copysign(1, x-0.3), nil }
	if _, err := Brent(step, -1e3, 1e3, -1, 1, 0, 3); !errors.Is(err, check.ErrNoConvergence) {
		t.Errorf("iteration limit: %v", err)
	}
	slow := func(x float64) (float64, error) { return x - 0.3, nil }
	if x, err := Brent(slow, 0.3, 1, 0, 0.7, 0, 10); err != nil || x != 0.3 {
		t.Errorf("root at an end: %g, %v", x, err)
	}
}

// FuzzBrent: for any bracket of a monotone function, Brent returns a point inside it where
// the sign change is resolved to the tolerance.
func FuzzBrent(f *testing.F) {
	f.Add(0.0, 1.0, 0.3)
	f.Add(-1e10, 1e10, 5.0)
	f.Add(-1.0, 1.0, -0.999999)
	f.Fuzz(func(t *testing.T, a, b, r float64) {
		if !(a < b) || math.IsInf(a, 0) || math.IsInf(b, 0) || !(r > a && r < b) || b-a > 1e300 {
			return
		}
		g := func(x float64) (float64, error) { return math.Tanh(x - r), nil }
		fa, _ := g(a)
		fb, _ := g(b)
		x, err := Brent(g, a, b, fa, fb, 0, 2000)
		if err != nil {
			if errors.Is(err, ErrNoBracket) && (fa == 0 || fb == 0 || (fa > 0) == (fb > 0)) {
				return // tanh rounded to the same sign at both ends
			}
			t.Fatalf("Brent(%g, %g) for root %g: %v", a, b, r, err)
		}
		if x < a || x > b {
			t.Fatalf("root %g outside [%g, %g]", x, a, b)
		}
		if d := math.Abs(x - r); d > 1e-12*math.Max(1, math.Abs(r)) && math.Tanh(x-r) != 0 {
			t.Fatalf("root %g, want %g (tanh %g)", x, r, math.Tanh(x-r))
		}
	})
}

func TestBracket(t *testing.T) {
	inc := func(x float64) (float64, error) { return x - 7.5, nil }
	dec := func(x float64) (float64, error) { return 7.5 - x, nil }
	for _, c := range []struct {
		name       string
		f          func(float64) (float64, error)
		increasing bool
		x0         float64
	}{
		{"increasing from below", inc, true, 0},
		{"increasing from above", inc, true, 20},
		{"decreasing from below", dec, false, 0},
		{"decreasing from above", dec, false, 20},
	} {
		f0, _ := c.f(c.x0)
		lo, hi, flo, fhi, err := Bracket(c.f, c.x0, f0, 1, 2, -100, 100, c.increasing)
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		if !(lo < 7.5 && 7.5 < hi) || (flo > 0) == (fhi > 0) {
			t.Errorf("%s: [%g, %g] with f %g, %g does not bracket 7.5", c.name, lo, hi, flo, fhi)
		}
		if r, err := Brent(c.f, lo, hi, flo, fhi, 1e-14, 100); err != nil || math.Abs(r-7.5) > 1e-13 {
			t.Errorf("%s: Brent on the bracket gives %g, %v", c.name, r, err)
		}
	}
	// Fixed steps (grow = 1) visit every step: from 0 in steps of 1 the bracket is [7, 8].
	if lo, hi, _, _, err := Bracket(inc, 0, -7.5, 1, 1, -100, 100, true); err != nil || lo != 7 || hi != 8 {
		t.Errorf("fixed steps: [%g, %g], %v", lo, hi, err)
	}
	if _, _, _, _, err := Bracket(inc, 0, -7.5, 1, 2, -100, 5, true); !errors.Is(err, ErrNoBracket) {
		t.Errorf("limit reached: %v", err)
	}
	if lo, hi, _, _, err := Bracket(inc, 7.5, 0, 1, 2, -100, 100, true); err != nil || lo != 7.5 || hi != 7.5 {
		t.Errorf("root at x0: [%g, %g], %v", lo, hi, err)
	}
	if _, _, _, _, err := Bracket(inc, 0, -7.5, 0, 2, -100, 100, true); !errors.Is(err, ErrNoBracket) {
		t.Errorf("zero step accepted: %v", err)
	}
	boom := errors.New("boom")
	bad := func(float64) (float64, error) { return 0, boom }
	if _, _, _, _, err := Bracket(bad, 0, -1, 1, 2, -100, 100, true); !errors.Is(err, boom) {
		t.Errorf("error from f not passed on: %v", err)
	}
}

// TestBracketBounded checks that Bracket stops, with ErrNoBracket, when a fixed step cannot
// move x (x0 = 1e20, step 1) and when an unbounded range holds no sign change; before the
// evaluation limit the first case looped for ever. NaN from f matches check.ErrNoConvergence.
func TestBracketBounded(t *testing.T) {
	evals := 0
	neg := func(float64) (float64, error) { evals++; return -1, nil }
	if _, _, _, _, err := Bracket(neg, 1e20, -1, 1, 1, 0, math.Inf(1), true); !errors.Is(err, ErrNoBracket) || evals != 0 {
		t.Errorf("step below the resolution: %v after %d evaluations", err, evals)
	}
	evals = 0
	if _, _, _, _, err := Bracket(neg, 0, -1, 1, 1, 0, math.Inf(1), true); !errors.Is(err, ErrNoBracket) || evals > maxBracketEvals {
		t.Errorf("unbounded range: %v after %d evaluations", err, evals)
	}
	// A growing step that starts below the resolution grows until it moves x.
	inc := func(x float64) (float64, error) { return x - 2e20, nil }
	if lo, hi, _, _, err := Bracket(inc, 1e20, -1e20, 1, 2, 0, 1e21, true); err != nil || !(lo < 2e20 && 2e20 <= hi) {
		t.Errorf("growing step from below the resolution: [%g, %g], %v", lo, hi, err)
	}
	nan := func(float64) (float64, error) { return math.NaN(), nil }
	if _, _, _, _, err := Bracket(nan, 0, -1, 1, 2, -10, 10, true); !errors.Is(err, check.ErrNoConvergence) {
		t.Errorf("NaN from f: %v", err)
	}
}
