package uncertainty_test

import (
	"errors"
	"fmt"
	"math"
	"reflect"
	"strings"
	"testing"

	"gonum.org/v1/gonum/stat"
	"gonum.org/v1/gonum/stat/distuv"

	"github.com/pvrec/pvrec/pvrec/j0"
	"github.com/pvrec/pvrec/pvrec/profile"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/uncertainty"
)

// linear is the toy function y = 2 + 3 x0 − 0.5 x1 with x0 ~ N(1, 0.2) and x1 ~ U(10, 14):
// mean 2 + 3·1 − 0.5·12 = −1, variance 9·0.04 + 0.25·16/12 = 0.36 + 1/3 (textbook: the
// variance of a sum of independent terms and of a uniform, (b − a)²/12).
var (
	linearInputs = []uncertainty.Input{
		{Name: "a", Dist: distuv.Normal{Mu: 1, Sigma: 0.2}},
		{Name: "b", Dist: distuv.Uniform{Min: 10, Max: 14}},
	}
	linearMean = -1.0
	linearVar  = 0.36 + 1.0/3
)

func linear(x []float64) (float64, error) { return 2 + 3*x[0] - 0.5*x[1], nil }

// TestMonteCarloLinear: mean and variance of the toy function within three of their standard
// errors (the run is seeded, so the check is deterministic; a 3σ band would fail for 0.3 % of
// seeds). The standard error of the sample variance is estimated as sqrt((m4 − s⁴)/N), m4
// the sample fourth central moment (large-sample result, e.g. A. Stuart and J. K. Ord,
// Kendall's Advanced Theory of Statistics, vol. 1; value from memory).
func TestMonteCarloLinear(t *testing.T) {
	mc := uncertainty.MonteCarlo{Inputs: linearInputs, Seed: 42, MaxSamples: 20000}
	r, err := mc.Run(linear)
	if err != nil {
		t.Fatal(err)
	}
	if r.N != 20000 || r.Drawn != 20000 || r.Failed != 0 || r.Converged {
		t.Fatalf("N %d, drawn %d, failed %d, converged %v", r.N, r.Drawn, r.Failed, r.Converged)
	}
	if d := math.Abs(r.Mean - linearMean); d > 3*r.StdErr {
		t.Errorf("mean %g, want %g ± 3·%g", r.Mean, linearMean, r.StdErr)
	}
	if want := math.Sqrt(linearVar / float64(r.N)); math.Abs(r.StdErr-want) > 0.02*want {
		t.Errorf("standard error %g, want σ/√N = %g", r.StdErr, want)
	}
	v := r.Values()
	m4 := stat.Moment(4, v, nil)
	s2 := r.Std * r.Std
	seVar := math.Sqrt((m4 - s2*s2) / float64(r.N))
	if d := math.Abs(s2 - linearVar); d > 3*seVar {
		t.Errorf("variance %g, want %g ± 3·%g", s2, linearVar, seVar)
	}
	// Percentiles are those of the samples, monotonic, and the median near the mean (the
	// distribution is symmetric).
	for i, p := range r.Percentiles {
		if q, err := r.Quantile(p.P); err != nil || q != p.Value {
			t.Errorf("percentile %g: %g, Quantile %g (%v)", p.P, p.Value, q, err)
		}
		if i > 0 && p.Value < r.Percentiles[i-1].Value {
			t.Errorf("percentiles not monotonic: %v", r.Percentiles)
		}
	}
	if med := r.Percentiles[2]; med.P != 0.5 || math.Abs(med.Value-linearMean) > 0.02 {
		t.Errorf("median %v", med)
	}
}

// TestMonteCarloCoverage: over many seeds, the interval mean ± standard error covers the true
// mean in about 68.3 % of the runs (the standard normal's P(|z| < 1); 400 runs give a binomial
// standard deviation of 2.3 %, the band is ±4 of them).
func TestMonteCarloCoverage(t *testing.T) {
	const runs = 400
	covered := 0
	for seed := range uint64(runs) {
		r, err := uncertainty.MonteCarlo{Inputs: linearInputs, Seed: seed, MaxSamples: 500, Workers: 1}.Run(linear)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(r.Mean-linearMean) < r.StdErr {
			covered++
		}
	}
	if frac := float64(covered) / runs; math.Abs(frac-0.6827) > 4*math.Sqrt(0.6827*0.3173/runs) {
		t.Errorf("mean ± standard error covers the true mean in %.1f %% of runs, want 68.3 %%", 100*frac)
	}
}

// TestMonteCarloWorkers: the same seed gives the same result, bit for bit, on 1, 2 and 7
// workers, with failures and a tolerance that stops the run.
func TestMonteCarloWorkers(t *testing.T) {
	mc := uncertainty.MonteCarlo{Inputs: linearInputs, Seed: 7, RelTol: 0.01, Batch: 100, MaxSamples: 100000}
	f := func(x []float64) (float64, error) {
		if x[0] < 0.6 {
			return 0, errors.New("a below 0.6")
		}
		return linear(x)
	}
	var ref uncertainty.MCResult
	for _, w := range []int{1, 2, 7} {
		mc.Workers = w
		r, err := mc.Run(f)
		if err != nil {
			t.Fatal(err)
		}
		if !r.Converged || r.StdErr > mc.RelTol*math.Abs(r.Mean) || r.Drawn%mc.Batch != 0 || r.Drawn >= mc.MaxSamples {
			t.Errorf("workers %d: converged %v, stderr %g, drawn %d", w, r.Converged, r.StdErr, r.Drawn)
		}
		if r.Failed == 0 {
			t.Errorf("workers %d: no failures (the test wants some)", w)
		}
		for i := range r.Failures {
			r.Failures[i].Err = nil // distinct error values with the same message
		}
		if w == 1 {
			ref = r
			continue
		}
		if !reflect.DeepEqual(r, ref) {
			t.Errorf("workers %d: result differs from 1 worker: N %d vs %d, mean %v vs %v", w, r.N, ref.N, r.Mean, ref.Mean)
		}
	}
}

// TestMonteCarloConvergence: the standard error falls like 1/√N, so halving RelTol needs about
// four times the samples; the run stops at the first batch boundary where the tolerance holds.
func TestMonteCarloConvergence(t *testing.T) {
	n := map[float64]int{}
	for _, tol := range []float64{0.02, 0.01} {
		r, err := uncertainty.MonteCarlo{Inputs: linearInputs, Seed: 3, RelTol: tol, Batch: 50, MaxSamples: 1_000_000}.Run(linear)
		if err != nil {
			t.Fatal(err)
		}
		if !r.Converged || r.StdErr > tol*math.Abs(r.Mean) {
			t.Fatalf("tol %g: converged %v, relative standard error %g", tol, r.Converged, r.StdErr/math.Abs(r.Mean))
		}
		n[tol] = r.N
	}
	if ratio := float64(n[0.01]) / float64(n[0.02]); ratio < 3.5 || ratio > 4.5 {
		t.Errorf("samples for tol 0.02 and 0.01: %d, %d (ratio %g, want ≈ 4)", n[0.02], n[0.01], ratio)
	}
	// AbsTol works for a mean of zero, where a relative tolerance cannot.
	zero := func(x []float64) (float64, error) { return x[0] - 1, nil }
	r, err := uncertainty.MonteCarlo{Inputs: linearInputs, AbsTol: 0.01}.Run(zero)
	if err != nil || !r.Converged || r.StdErr > 0.01 {
		t.Errorf("AbsTol: %v, converged %v, stderr %g", err, r.Converged, r.StdErr)
	}
	// A tolerance not met by MaxSamples: Converged false, no error.
	r, err = uncertainty.MonteCarlo{Inputs: linearInputs, RelTol: 1e-6, MaxSamples: 1000}.Run(linear)
	if err != nil || r.Converged || r.Drawn != 1000 {
		t.Errorf("unmet tolerance: %v, converged %v, drawn %d", err, r.Converged, r.Drawn)
	}
}

// TestMonteCarloInvalidMass: a distribution that puts mass where the input is invalid
// (a normal thickness with 2.3 % below zero): the failures are counted and grouped with the
// index of the first, whose inputs Draw reproduces; with MinSuccess above the success
// fraction the run fails with ErrTooFewSuccesses and still reports the failures.
func TestMonteCarloInvalidMass(t *testing.T) {
	thick := []uncertainty.Input{{Name: "thickness", Unit: "cm", Dist: distuv.Normal{Mu: 1e-4, Sigma: 0.5e-4}}}
	f := func(x []float64) (float64, error) {
		if x[0] <= 0 {
			return 0, fmt.Errorf("thickness must be > 0 cm")
		}
		return 1 / x[0], nil
	}
	mc := uncertainty.MonteCarlo{Inputs: thick, Seed: 1, MaxSamples: 5000}
	r, err := mc.Run(f)
	if err != nil {
		t.Fatal(err)
	}
	if r.Failed == 0 || r.N+r.Failed != r.Drawn || len(r.Failures) != 1 || r.Failures[0].Count != r.Failed {
		t.Fatalf("failed %d of %d, groups %v", r.Failed, r.Drawn, r.Failures)
	}
	// 2.28 % of N(1, 0.5) lies below 0 (standard normal table, Φ(−2)); binomial band ±4σ.
	if frac, p := float64(r.Failed)/float64(r.Drawn), 0.02275; math.Abs(frac-p) > 4*math.Sqrt(p*(1-p)/float64(r.Drawn)) {
		t.Errorf("failure fraction %g, want ≈ %g", frac, p)
	}
	x, err := mc.Draw(r.Failures[0].First)
	if err != nil || x[0] > 0 {
		t.Errorf("Draw(first failure) = %v, %v; want a thickness <= 0", x, err)
	}
	for _, s := range r.Samples[:10] {
		if x, _ := mc.Draw(s.Index); x[0] != s.X[0] {
			t.Errorf("Draw(%d) = %v, sample has %v", s.Index, x, s.X)
		}
	}
	mc.MinSuccess = 0.99
	r, err = mc.Run(f)
	if !errors.Is(err, uncertainty.ErrTooFewSuccesses) || r.Failed == 0 || !strings.Contains(err.Error(), "thickness must be > 0") {
		t.Errorf("MinSuccess 0.99: %v (failed %d)", err, r.Failed)
	}
	// Panics, NaN and +Inf results are failures, grouped across workers.
	bad := func(x []float64) (float64, error) {
		switch {
		case x[0] < 0.7:
			panic("low a")
		case x[0] < 0.75:
			return math.NaN(), nil
		case x[0] > 1.4:
			return math.Inf(1), nil
		}
		return x[0], nil
	}
	r, err = uncertainty.MonteCarlo{Inputs: linearInputs, MaxSamples: 2000, MinSuccess: 0.5, Workers: 3}.Run(bad)
	if err != nil || len(r.Failures) != 3 || !strings.Contains(r.Failures[0].Message, "panicked: low a") {
		t.Errorf("bad results: %v, failures %v", err, r.Failures)
	}
	// Everything failing: an error, and the run stops after the first batch past MinSamples.
	r, err = uncertainty.MonteCarlo{Inputs: linearInputs}.Run(func([]float64) (float64, error) { return 0, errors.New("no") })
	if !errors.Is(err, uncertainty.ErrTooFewSuccesses) || r.Drawn != 256 || r.Failures[0].Count != 256 {
		t.Errorf("all failing: %v, drawn %d", err, r.Drawn)
	}
}

// TestMonteCarloBadSettings: invalid settings are errors naming the field.
func TestMonteCarloBadSettings(t *testing.T) {
	ok := func(x []float64) (float64, error) { return x[0], nil }
	for _, c := range []struct {
		mc   uncertainty.MonteCarlo
		want string
	}{
		{uncertainty.MonteCarlo{}, "Inputs is empty"},
		{uncertainty.MonteCarlo{Inputs: []uncertainty.Input{{Name: "x"}}}, "Dist is nil"},
		{uncertainty.MonteCarlo{Inputs: []uncertainty.Input{{Name: "x", Dist: distuv.Normal{Mu: math.NaN(), Sigma: 1}}}}, "want finite"},
		{uncertainty.MonteCarlo{Inputs: linearInputs, MaxSamples: -1}, "MaxSamples"},
		{uncertainty.MonteCarlo{Inputs: linearInputs, MaxSamples: 1e8}, "MaxSamples"},
		{uncertainty.MonteCarlo{Inputs: linearInputs, MinSamples: -1}, "MinSamples"},
		{uncertainty.MonteCarlo{Inputs: linearInputs, MinSamples: 200, MaxSamples: 100}, "MinSamples"},
		{uncertainty.MonteCarlo{Inputs: linearInputs, Batch: -1}, "Batch"},
		{uncertainty.MonteCarlo{Inputs: linearInputs, MinSuccess: 1.5}, "MinSuccess"},
		{uncertainty.MonteCarlo{Inputs: linearInputs, MinSuccess: math.NaN()}, "MinSuccess"},
		{uncertainty.MonteCarlo{Inputs: linearInputs, RelTol: -1}, "RelTol"},
		{uncertainty.MonteCarlo{Inputs: linearInputs, AbsTol: math.Inf(1)}, "AbsTol"},
		{uncertainty.MonteCarlo{Inputs: linearInputs, Percentiles: []float64{0.5, 2}}, "Percentiles[1]"},
	} {
		if _, err := c.mc.Run(ok); err == nil || !strings.Contains(err.Error(), c.want) {
			t.Errorf("%+v: error %v, want one naming %s", c.mc, err, c.want)
		}
	}
	if _, err := (uncertainty.MonteCarlo{Inputs: linearInputs}).Run(nil); err == nil {
		t.Errorf("nil f: no error")
	}
	if _, err := (uncertainty.MonteCarlo{Inputs: linearInputs}).Draw(-1); err == nil {
		t.Errorf("Draw(-1): no error")
	}
	var empty uncertainty.MCResult
	if _, err := empty.Quantile(0.5); err == nil {
		t.Errorf("Quantile of an empty result: no error")
	}
	if _, err := empty.Input(0); err == nil {
		t.Errorf("Input(0) of an empty result: no error")
	}
}

// TestMonteCarloJ0InvalidDensity: a J0 Monte Carlo whose surface-density distribution has
// 2.3 % of its mass below zero (invented uncertainty): the failing samples form one group
// (their messages differ only in the offending value) counting every failure.
func TestMonteCarloJ0InvalidDensity(t *testing.T) {
	models, err := j0.DefaultModels(300)
	if err != nil {
		t.Fatal(err)
	}
	solver := j0.NewSolver(models)
	mc := uncertainty.MonteCarlo{
		Inputs:     []uncertainty.Input{{Name: "surface density", Unit: "cm^-3", Dist: distuv.Normal{Mu: 1e20, Sigma: 0.5e20}}},
		Seed:       5,
		MaxSamples: 512,
	}
	r, err := mc.Run(func(x []float64) (float64, error) {
		res, err := solver.Solve(j0.Region{
			Profile: profile.Sum{profile.Erfc{Dopant: silicon.Donor, Surface: x[0], Length: 0.36e-4}, profile.Uniform{Dopant: silicon.Acceptor, N: 1.5e16}},
			Surface: j0.FixedS(1e4),
		})
		return res.J0, err
	})
	if err != nil {
		t.Fatal(err)
	}
	if r.Failed == 0 || len(r.Failures) != 1 || r.Failures[0].Count != r.Failed || r.N+r.Failed != 512 {
		t.Fatalf("failed %d, groups %v", r.Failed, r.Failures)
	}
	if x, _ := mc.Draw(r.Failures[0].First); x[0] > 0 {
		t.Errorf("first failure at surface density %g", x[0])
	}
	t.Logf("%s", r.Failures[0])
}

// TestOpenUnit: the uniforms lie strictly inside (0, 1) for the extreme random words (the
// top 52 bits all 0 or all 1), and u(^r) = 1 − u(r) exactly (the cells' midpoints are
// symmetric about 1/2). With 53 bits, (2^53 − 1 + 0.5)·2^−53 rounded to exactly 1.
func TestOpenUnit(t *testing.T) {
	for _, r := range []uint64{0, 1, 1<<12 - 1, 1 << 12, 1<<63 - 1, 1 << 63, math.MaxUint64 - 1<<12, math.MaxUint64 - 1, math.MaxUint64, 0x9e3779b97f4a7c15} {
		u := uncertainty.OpenUnit(r)
		if !(u > 0 && u < 1) {
			t.Errorf("OpenUnit(%#x) = %v, want in (0, 1)", r, u)
		}
		if v := uncertainty.OpenUnit(^r); v != 1-u {
			t.Errorf("OpenUnit(^%#x) = %v, want 1 − %v", r, v, u)
		}
	}
	if u := uncertainty.OpenUnit(math.MaxUint64); u != 1-0x1p-53 {
		t.Errorf("largest uniform %v, want 1 − 2^−53", u)
	}
	if u := uncertainty.OpenUnit(0); u != 0x1p-53 {
		t.Errorf("smallest uniform %v, want 2^−53", u)
	}
}

// TestMonteCarloBadDistributions: distributions with invalid parameters (gonum's distuv
// panics on some, reverses or gives non-finite quantiles on others) are errors naming the
// input by index and name from Run, Draw and Sensitivity.Run, never panics; a zero-width
// input is a constant and works.
func TestMonteCarloBadDistributions(t *testing.T) {
	ok := func(x []float64) (float64, error) { return 1 + x[0]*x[0], nil }
	for _, c := range []struct {
		d    uncertainty.Distribution
		want string
	}{
		{distuv.Beta{Alpha: 0, Beta: 1}, "panicked"},
		{distuv.Gamma{Alpha: -1, Beta: 1}, "panicked"},
		{distuv.Uniform{Min: 2, Max: 1}, "non-decreasing"},
		{distuv.Normal{Mu: 1, Sigma: -1}, "non-decreasing"},
		{distuv.Weibull{K: 0, Lambda: 1}, "want finite"},
	} {
		in := []uncertainty.Input{{Name: "good", Dist: distuv.Normal{Mu: 1, Sigma: 0.1}}, {Name: "bad", Dist: c.d}}
		mc := uncertainty.MonteCarlo{Inputs: in, MaxSamples: 100}
		_, err1 := mc.Run(ok)
		_, err2 := mc.Draw(0)
		_, err3 := uncertainty.Sensitivity{Inputs: in}.Run(ok)
		for k, err := range []error{err1, err2, err3} {
			if err == nil || !strings.Contains(err.Error(), `Inputs[1] ("bad")`) || !strings.Contains(err.Error(), c.want) {
				t.Errorf("%#v, call %d: error %v, want one naming Inputs[1] (\"bad\") and %q", c.d, k, err, c.want)
			}
		}
	}
	// Zero width: a constant input, swing and variance share 0 (not NaN).
	in := []uncertainty.Input{{Name: "a", Dist: distuv.Normal{Mu: 2, Sigma: 0.1}}, {Name: "c", Dist: distuv.Normal{Mu: 3, Sigma: 0}}}
	f := func(x []float64) (float64, error) { return x[0] * x[1], nil }
	r, err := uncertainty.MonteCarlo{Inputs: in, MaxSamples: 300}.Run(f)
	if err != nil || r.Samples[0].X[1] != 3 {
		t.Errorf("zero-width Monte Carlo: %v", err)
	}
	s, err := uncertainty.Sensitivity{Inputs: in}.Run(f)
	if err != nil {
		t.Fatal(err)
	}
	if c := s.Effects[1]; c.Name != "c" || c.Share != 0 || c.Swing != 0 || s.Effects[0].Share != 1 {
		t.Errorf("zero-width sensitivity: %+v", s.Effects)
	}
}

// TestMonteCarloRunningStats: the running mean and standard deviation agree with gonum's
// two-pass stat.MeanStdDev of the results, also for results with a large offset (1e9 plus a
// spread of 1e-3, where a naive Σx² − N·mean² loses every digit).
func TestMonteCarloRunningStats(t *testing.T) {
	in := []uncertainty.Input{{Name: "x", Dist: distuv.Normal{Mu: 0, Sigma: 1e-3}}}
	r, err := uncertainty.MonteCarlo{Inputs: in, Seed: 9, MaxSamples: 5000}.Run(func(x []float64) (float64, error) { return 1e9 + x[0], nil })
	if err != nil {
		t.Fatal(err)
	}
	m, s := stat.MeanStdDev(r.Values(), nil)
	if math.Abs(r.Mean-m) > 1e-15*m || math.Abs(r.Std-s) > 1e-6*s {
		t.Errorf("running mean %.17g std %.17g, two-pass %.17g %.17g", r.Mean, r.Std, m, s)
	}
}
