package uncertainty_test

import (
	"math"
	"reflect"
	"slices"
	"testing"

	"gonum.org/v1/gonum/stat/distuv"

	"github.com/pvrec/pvrec/pvrec/uncertainty"
)

// FuzzMonteCarlo: for any settings, the stopping rules and statistics keep their invariants:
// the counts add up, the run stops at a batch boundary or at MaxSamples, Converged means the
// tolerance holds, the percentiles are monotonic and within the samples' range, the mean lies
// within it too, and 1 and 3 workers give the same result.
func FuzzMonteCarlo(f *testing.F) {
	f.Add(uint64(1), 500, 0, 0, 0.01, 0.0, 0.0)
	f.Add(uint64(2), 3000, 50, 7, 0.0, 0.001, 0.3)
	f.Add(uint64(3), 10, 10, 1, 1.0, 0.0, 0.9)
	f.Add(uint64(4), 1, 1, 1, 0.0, 0.0, 0.0)
	f.Fuzz(func(t *testing.T, seed uint64, maxN, minN, batch int, relTol, absTol, failBelow float64) {
		if maxN > 5000 || batch > 5000 { // keep each case fast
			return
		}
		mc := uncertainty.MonteCarlo{
			Inputs:     []uncertainty.Input{{Name: "u", Dist: distuv.Uniform{Min: 0, Max: 1}}, {Name: "z", Dist: distuv.Normal{Mu: 0, Sigma: 1}}},
			Seed:       seed,
			MaxSamples: maxN, MinSamples: minN, Batch: batch, RelTol: relTol, AbsTol: absTol,
			MinSuccess: 0.01,
		}
		fn := func(x []float64) (float64, error) {
			if x[0] < failBelow {
				return math.NaN(), nil
			}
			return math.Exp(x[1]), nil
		}
		mc.Workers = 1
		r, err := mc.Run(fn)
		mc.Workers = 3
		r3, err3 := mc.Run(fn)
		if (err == nil) != (err3 == nil) || r.N != r3.N || r.Mean != r3.Mean || r.Std != r3.Std || !reflect.DeepEqual(r.Percentiles, r3.Percentiles) {
			t.Fatalf("workers 1 and 3 differ: %v / %v, N %d / %d, mean %v / %v", err, err3, r.N, r3.N, r.Mean, r3.Mean)
		}
		if err != nil {
			return // invalid settings or too few successes: an error, checked elsewhere
		}
		if r.N+r.Failed != r.Drawn || len(r.Samples) != r.N || r.N < 2 {
			t.Fatalf("counts: N %d + failed %d != drawn %d (%d samples)", r.N, r.Failed, r.Drawn, len(r.Samples))
		}
		b := batch
		if b == 0 {
			b = 256
		}
		mx := maxN
		if mx == 0 {
			mx = 10000
		}
		if r.Drawn > mx || (r.Drawn%b != 0 && r.Drawn != mx) {
			t.Fatalf("drawn %d with batch %d, max %d", r.Drawn, b, mx)
		}
		if r.Converged && r.StdErr > max(absTol, relTol*math.Abs(r.Mean)) {
			t.Fatalf("converged with stderr %g > tolerance", r.StdErr)
		}
		v := r.Values()
		lo, hi := slices.Min(v), slices.Max(v)
		if !(r.Mean >= lo*(1-1e-12) && r.Mean <= hi*(1+1e-12)) || r.Std < 0 || math.IsNaN(r.StdErr) {
			t.Fatalf("mean %g outside [%g, %g] or std %g", r.Mean, lo, hi, r.Std)
		}
		for i, p := range r.Percentiles {
			if p.Value < lo || p.Value > hi || (i > 0 && p.Value < r.Percentiles[i-1].Value) {
				t.Fatalf("percentiles %v outside [%g, %g] or not monotonic", r.Percentiles, lo, hi)
			}
		}
	})
}

// FuzzElasticities: the elasticities of f = c x0^a x1^b are a and b at any x0 of either sign,
// to the rounding of ln f divided by 2h.
func FuzzElasticities(f *testing.F) {
	f.Add(2.0, -0.5, 3.0, 7.0, 0.01)
	f.Add(0.0, 1.0, -1e-5, 1e18, 0.5)
	f.Add(10.0, -10.0, 1.5, 0.3, 1e-4)
	f.Fuzz(func(t *testing.T, a, b, x0, x1, h float64) {
		// exp of the summed logarithms: separate powers could pass through subnormal
		// intermediates (x^a below 2.2e-308) and lose precision there.
		fn := func(x []float64) (float64, error) {
			return 1.7 * math.Exp(a*math.Log(math.Abs(x[0]))+b*math.Log(math.Abs(x[1]))), nil
		}
		if l := a*math.Log(math.Abs(x0)) + b*math.Log(math.Abs(x1)); math.Abs(l)+(math.Abs(a)+math.Abs(b))*max(h, 0.01) > 700 {
			return // f near the end of the float range at a point of the difference
		}
		e, err := uncertainty.Elasticities(fn, []float64{x0, x1}, nil, h)
		if err != nil {
			return // zero or non-finite inputs, invalid step, or f out of range: errors
		}
		h0 := h
		if h0 == 0 {
			h0 = 0.01
		}
		// ln f is accurate to about 1e-15 of max(1, |ln f|); the quotient divides that by 2h.
		lf := math.Abs(math.Log(1.7)) + math.Abs(a*math.Log(math.Abs(x0))) + math.Abs(b*math.Log(math.Abs(x1))) + math.Abs(a)*h0 + math.Abs(b)*h0
		tol := 1e-14 * (1 + lf) / h0
		if math.Abs(e[0]-a) > tol*(1+math.Abs(a)) || math.Abs(e[1]-b) > tol*(1+math.Abs(b)) {
			t.Fatalf("elasticities %v, want [%g %g] (tol %g)", e, a, b, tol)
		}
	})
}
