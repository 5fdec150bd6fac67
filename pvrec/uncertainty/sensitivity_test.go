package uncertainty_test

import (
	"errors"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/stat/distuv"

	"github.com/pvrec/pvrec/pvrec/uncertainty"
)

// TestElasticitiesPowerLaw: for f = 3 x0^2.5 x1^−0.7 x2 (x2 negative) the elasticities are the
// exponents, exactly but for rounding: ln f is computed to ~1e-16 relative, divided by 2h.
func TestElasticitiesPowerLaw(t *testing.T) {
	f := func(x []float64) (float64, error) {
		return 3 * math.Pow(x[0], 2.5) * math.Pow(x[1], -0.7) * x[2], nil
	}
	want := []float64{2.5, -0.7, 1}
	for _, h := range []float64{0, 1e-3, 0.1, 1} {
		e, err := uncertainty.Elasticities(f, []float64{2e-4, 1e16, -3}, []string{"w", "N", "s"}, h)
		if err != nil {
			t.Fatal(err)
		}
		for i := range want {
			if math.Abs(e[i]-want[i]) > 1e-10 {
				t.Errorf("h %g: elasticity %d = %.15g, want %g", h, i, e[i], want[i])
			}
		}
	}
}

// TestElasticitiesErrors: undefined elasticities are errors naming the input.
func TestElasticitiesErrors(t *testing.T) {
	id := func(x []float64) (float64, error) { return x[0] + x[1], nil }
	for _, c := range []struct {
		f     func([]float64) (float64, error)
		x0    []float64
		names []string
		h     float64
		want  string
	}{
		{id, []float64{1, 0}, []string{"a", "dose"}, 0, `"dose" is 0`},
		{id, []float64{1, math.NaN()}, nil, 0, "input x[1] must be finite"},
		{id, []float64{1, -1}, nil, 0, "f is 0 at x0"},
		{id, []float64{1, -0.999}, nil, 0.1, "changes sign"},
		{id, []float64{1, 1}, []string{"a"}, 0, "1 names for 2 inputs"},
		{id, nil, nil, 0, "x0 is empty"},
		{id, []float64{1, 1}, nil, -1, "relStep"},
		{id, []float64{1, 1}, nil, 2, "relStep"},
		{nil, []float64{1, 1}, nil, 0, "f is nil"},
		{func(x []float64) (float64, error) {
			if x[1] > 1 {
				return 0, errors.New("too thick")
			}
			return 1, nil
		}, []float64{1, 1}, []string{"a", "w"}, 0, `input "w" = 1.0100501670841682 (the others nominal): too thick`},
	} {
		if _, err := uncertainty.Elasticities(c.f, c.x0, c.names, c.h); err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%v: error %v, want %q", c.x0, err, c.want)
		}
	}
}

// TestSensitivityLinear: for y = x0 + 10 x1 with x0 ~ N(5, 1), x1 ~ U(1, 2) the tornado values
// are f at the distributions' 16 % and 84 % quantiles, the ranking is by swing, and the
// first-order standard uncertainty equals the exact one of a linear function,
// sqrt(1 + 100/12) (the law of propagation of uncertainty is exact for linear f; JCGM
// 100:2008), to the O(h²) of the difference quotient.
func TestSensitivityLinear(t *testing.T) {
	n0, u1 := distuv.Normal{Mu: 5, Sigma: 1}, distuv.Uniform{Min: 1, Max: 2}
	s := uncertainty.Sensitivity{Inputs: []uncertainty.Input{{Name: "a", Unit: "V", Dist: n0}, {Name: "b", Dist: u1}}, Nominal: []float64{5, 1.5}}
	f := func(x []float64) (float64, error) { return x[0] + 10*x[1], nil }
	for _, w := range []int{1, 3} {
		s.Workers = w
		r, err := s.Run(f)
		if err != nil {
			t.Fatal(err)
		}
		if r.Nominal != 20 || len(r.Effects) != 2 {
			t.Fatalf("nominal %g, %d effects", r.Nominal, len(r.Effects))
		}
		b, a := r.Effects[0], r.Effects[1] // b swings 10·(0.84−0.16) = 6.8, a 2·0.994 = 1.99
		if b.Name != "b" || b.Index != 1 || a.Name != "a" || a.Unit != "V" {
			t.Fatalf("ranking %q, %q", b.Name, a.Name)
		}
		if b.XLow != u1.Quantile(0.16) || b.XHigh != u1.Quantile(0.84) || b.Low != 5+10*b.XLow || b.High != 5+10*b.XHigh {
			t.Errorf("b tornado %+v", b)
		}
		if a.XLow != n0.Quantile(0.16) || math.Abs(a.Swing-2*0.9944578832097531) > 1e-12 { // Φ⁻¹(0.84) = 0.99446 (normal table)
			t.Errorf("a tornado %+v", a)
		}
		// Elasticities x_i (∂f/∂x_i)/f: 5/20 and 15/20.
		if math.Abs(a.Elasticity-0.25) > 1e-4 || math.Abs(b.Elasticity-0.75) > 1e-4 {
			t.Errorf("elasticities %g, %g", a.Elasticity, b.Elasticity)
		}
		exact := math.Sqrt(1 + 100.0/12)
		if got := r.RelStd * r.Nominal; math.Abs(got-exact) > 1e-4*exact {
			t.Errorf("first-order standard uncertainty %g, exact %g", got, exact)
		}
		if math.Abs(a.Share+b.Share-1) > 1e-12 || math.Abs(b.Share-100.0/12/(1+100.0/12)) > 1e-4 {
			t.Errorf("shares %g, %g", a.Share, b.Share)
		}
		if str := r.String(); !strings.Contains(str, "a (V)") {
			t.Errorf("String:\n%s", str)
		}
	}
	// Nominal nil: the medians.
	s.Nominal = nil
	if r, err := s.Run(f); err != nil || r.X0[0] != 5 || r.X0[1] != 1.5 {
		t.Errorf("median nominal: %v, %v", r.X0, err)
	}
}

// TestSensitivityErrors: bad settings and failing evaluations are errors naming the input.
func TestSensitivityErrors(t *testing.T) {
	in := []uncertainty.Input{{Name: "w", Dist: distuv.Normal{Mu: 1, Sigma: 0.5}}}
	f := func(x []float64) (float64, error) {
		if x[0] < 0.6 {
			return 0, errors.New("w too small")
		}
		return x[0], nil
	}
	for _, c := range []struct {
		s    uncertainty.Sensitivity
		want string
	}{
		{uncertainty.Sensitivity{}, "Inputs is empty"},
		{uncertainty.Sensitivity{Inputs: in, Nominal: []float64{1, 2}}, "2 Nominal values for 1 Inputs"},
		{uncertainty.Sensitivity{Inputs: in, Nominal: []float64{0}}, `"w" is 0`},
		{uncertainty.Sensitivity{Inputs: in, Low: 0.9}, "Low"},
		{uncertainty.Sensitivity{Inputs: in, High: 1}, "High"},
		{uncertainty.Sensitivity{Inputs: []uncertainty.Input{{Name: "w", Dist: distuv.Normal{Mu: 1, Sigma: -1}}}}, "non-decreasing"},
		{uncertainty.Sensitivity{Inputs: in, Low: 0.2}, `input "w" = 0.579`},
	} {
		if _, err := c.s.Run(f); err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%+v: error %v, want %q", c.s, err, c.want)
		}
	}
	if _, err := (uncertainty.Sensitivity{Inputs: in}).Run(nil); err == nil {
		t.Errorf("nil f: no error")
	}
}
