package lifetime_test

import (
	"math"
	"testing"

	"github.com/pvrec/pvrec/pvrec/lifetime"
	"github.com/pvrec/pvrec/pvrec/recomb"
)

// analysis returns the analysis of samples of wafer b in mode m with the test optics and the
// intrinsic model subtracted.
func analysis(b *recomb.Bulk, m lifetime.Mode) lifetime.Analysis {
	return lifetime.Analysis{Wafer: b, W: width, Mode: m, Optics: optics, Intrinsic: recomb.NewIntrinsic()}
}

// times returns n equally spaced times from 0 to end, s.
func times(n int, end float64) []float64 {
	t := make([]float64, n)
	for i := range t {
		t[i] = end * float64(i) / float64(n-1)
	}
	return t
}

// Synthetic measurements of a sample (forward model, Sample.Simulate). tau0 is τeff at
// Δn = 1e15 cm^-3, the time scale of the traces.

// transientTrace: a free decay from Δn = 3e16 cm^-3 over 4 tau0, n points (with n = 5000
// at least 20 samples per lifetime at the start, as the adaptive smoothing needs).
func transientTrace(t testing.TB, s lifetime.Sample, n int) lifetime.Trace {
	t.Helper()
	tau0 := mustLifetime(t, s, 1e15)
	tr, err := s.Simulate(lifetime.Optics{}, times(n, 4*tau0), nil, 3e16)
	if err != nil {
		t.Fatal(err)
	}
	return tr
}

// qssTrace: a slowly decaying flash, 30 suns · exp(−t/(300 tau0)) over 12 flash time
// constants, starting in the steady state; quasi-static to about tau0/(300 tau0) = 0.3 %.
func qssTrace(t testing.TB, s lifetime.Sample, n int) lifetime.Trace {
	t.Helper()
	tau0 := mustLifetime(t, s, 1e15)
	tf := 300 * tau0
	suns := func(x float64) float64 { return 30 * math.Exp(-x/tf) }
	dn0, err := s.SteadyStateSuns(30, optics)
	if err != nil {
		t.Fatal(err)
	}
	tr, err := s.Simulate(optics, times(n, 12*tf), suns, dn0)
	if err != nil {
		t.Fatal(err)
	}
	return tr
}

// flashTrace: a flash rising on 0.2 tau0 and decaying as fast as the lifetime,
// 50 suns · (1 − exp(−t/(0.2 tau0))) exp(−t/tau0), from the dark, over 10 tau0: far from both
// the quasi-steady state and a free decay (n = 7500 gives the 30 samples per local time scale
// that the adaptive smoothing needs at the peak).
func flashTrace(t testing.TB, s lifetime.Sample, n int) lifetime.Trace {
	t.Helper()
	tau0 := mustLifetime(t, s, 1e15)
	suns := func(x float64) float64 { return 50 * -math.Expm1(-x/(0.2*tau0)) * math.Exp(-x/tau0) }
	tr, err := s.Simulate(optics, times(n, 10*tau0), suns, 0)
	if err != nil {
		t.Fatal(err)
	}
	return tr
}
