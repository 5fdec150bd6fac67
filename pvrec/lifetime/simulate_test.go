package lifetime_test

import (
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"github.com/pvrec/pvrec/pvrec/lifetime"
)

// TestSimulateDecay: in the dark dΔn/dt = −Δn/τ(Δn) integrates to
// t = ∫ τ(Δn) d ln Δn from Δn(t) to Δn(0) (separation of variables); the times at which the
// simulated trace passes its Δn values agree with that integral, evaluated by Gauss–Legendre
// quadrature (gonum/integrate/quad), to 1e-6 of the lifetime.
func TestSimulateDecay(t *testing.T) {
	b := wafer(t, 1e15, 0)
	s := j0sSample(b, 30e-15)
	tr := transientTrace(t, s, 2000)
	dn0, err := lifetime.ExcessFromConductance(b, width, tr.Conductance[0])
	if err != nil {
		t.Fatal(err)
	}
	tau0 := mustLifetime(t, s, 1e15)
	for _, i := range []int{100, 700, 1999} {
		dn, err := lifetime.ExcessFromConductance(b, width, tr.Conductance[i])
		if err != nil {
			t.Fatal(err)
		}
		got := quad.Fixed(func(u float64) float64 {
			tau, err := s.Lifetime(math.Exp(u))
			if err != nil {
				t.Fatal(err)
			}
			return tau
		}, math.Log(dn), math.Log(dn0), 200, nil, 0)
		if math.Abs(got-tr.Time[i]) > 1e-6*tau0 {
			t.Errorf("point %d: Δn %g at t = %.9g s, the integral gives %.9g s", i, dn, tr.Time[i], got)
		}
	}
}

// TestSimulateStiff: under slowly changing light the exponential steps taken over long sample
// intervals agree with Runge–Kutta steps on a grid fine enough not to need them (property:
// two integrators, one trace), to 4e-6 relative, the bound c (ΔG/G)²/2 of the exponential
// step's Newton error with c <= 2 and ΔG/G <= 0.2 % (see simLightChange).
func TestSimulateStiff(t *testing.T) {
	b := wafer(t, 0, 1e16)
	s := j0sSample(b, 10e-15)
	tau0 := mustLifetime(t, s, 1e15)
	suns := func(x float64) float64 { return 3 * math.Exp(-x/(1e4*tau0)) } // 1 % per 100 tau0
	dn0, err := s.SteadyStateSuns(3, optics)
	if err != nil {
		t.Fatal(err)
	}
	coarse, err := s.Simulate(optics, times(11, 1000*tau0), suns, dn0) // steps of 100 tau0
	if err != nil {
		t.Fatal(err)
	}
	fine, err := s.Simulate(optics, times(10*200+1, 1000*tau0), suns, dn0) // 0.5 tau0, below 20 Runge–Kutta steps
	if err != nil {
		t.Fatal(err)
	}
	for i := range coarse.Time {
		if c, f := coarse.Conductance[i], fine.Conductance[200*i]; relErr(c, f) > 4e-6 {
			t.Errorf("t = %.4g s: %.8g S with exponential steps, %.8g S with Runge–Kutta", coarse.Time[i], c, f)
		}
	}
}

// TestSimulateErrors: invalid arguments are named.
func TestSimulateErrors(t *testing.T) {
	s := j0sSample(wafer(t, 1e15, 0), 1e-14)
	one := func(float64) float64 { return 1 }
	for _, c := range []struct {
		name string
		s    lifetime.Sample
		o    lifetime.Optics
		t    []float64
		suns func(float64) float64
		dn0  float64
		want string
	}{
		{"zero sample", lifetime.Sample{}, optics, times(5, 1), one, 0, "Sample.Wafer"},
		{"one time", s, optics, []float64{0}, one, 0, "at least 2 times"},
		{"times", s, optics, []float64{0, 1, 1}, one, 0, "t[2]"},
		{"NaN time", s, optics, []float64{0, math.NaN()}, one, 0, "t[1]"},
		{"dn0", s, optics, times(5, 1e-3), one, -1, "dn0"},
		{"optics", s, lifetime.Optics{}, times(5, 1e-3), one, 0, "Optics.FluxPerSun"},
		{"negative light", s, optics, times(5, 1e-3), func(float64) float64 { return -1 }, 0, "suns("},
		{"NaN light", s, optics, times(5, 1e-3), func(float64) float64 { return math.NaN() }, 0, "suns("},
	} {
		_, err := c.s.Simulate(c.o, c.t, c.suns, c.dn0)
		if err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%s: error %v, want one naming %q", c.name, err, c.want)
		}
	}
}
