package uncertainty

import (
	"encoding/binary"
	"fmt"
	"math"
	"math/rand/v2"
	"slices"
	"strings"

	"gonum.org/v1/gonum/stat"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/sweep"
)

// Distribution is the probability distribution of an uncertain input, in the input's unit.
// distuv.Normal, distuv.LogNormal and distuv.Uniform of gonum.org/v1/gonum/stat/distuv
// satisfy it (as do its other continuous distributions). Quantile is called only with
// 0 < p < 1. The distribution's own random source (Src) is not used: samples are drawn by
// inverse transform from this package's seeded streams.
type Distribution interface {
	Quantile(p float64) float64 // the value below which a fraction p of the distribution lies
	StdDev() float64            // the standard deviation (used by Sensitivity for the variance shares)
}

// Input is an uncertain input of a computation: a name, its unit and its distribution. For
// example a calibration factor of a measured profile, log-normal with median 1 and 5 %
// spread, is Input{Name: "profile scale", Unit: "1", Dist: distuv.LogNormal{Mu: 0, Sigma: 0.05}}.
type Input struct {
	Name string       // name, for reports and figures, e.g. "thickness"
	Unit string       // unit, e.g. "cm" (plain text, for labels)
	Dist Distribution // distribution of the input (required)
}

// Defaults and limits of MonteCarlo.
const (
	defaultMaxSamples = 10000
	defaultMinSamples = 100
	defaultBatch      = 256
	defaultMinSuccess = 0.95
	// maxSamples bounds MaxSamples: every sample is kept (its inputs and result), and 1e7 of
	// them is already about a gigabyte with a few inputs (our choice).
	maxSamples = 10_000_000
)

// defaultPercentiles are the probabilities of MCResult.Percentiles when
// MonteCarlo.Percentiles is nil: the median, the central 68 % (±1σ of a normal) and 95 %
// intervals.
var defaultPercentiles = []float64{0.025, 0.16, 0.5, 0.84, 0.975}

// MonteCarlo is the propagation of input distributions through a computation by Monte Carlo
// sampling (see Run). The zero values of its numeric fields select the defaults given with
// each; Inputs is required.
//
// Reproducibility: the inputs of sample i are the Quantiles of uniforms drawn from a ChaCha8
// stream seeded by (Seed, i) alone, and the stopping rules are tested only between batches of
// Batch samples, so that the samples, their number and every statistic are the same, bit for
// bit, for any Workers.
type MonteCarlo struct {
	Inputs []Input // the uncertain inputs, in the order of f's argument x
	Seed   uint64  // seed of the random streams; the same seed gives the same samples

	MaxSamples int // largest number of samples drawn, at most 1e7; 0: 10000
	MinSamples int // samples drawn before a tolerance may stop the run or too few successes fail it; 0: 100 (or MaxSamples if smaller)
	Batch      int // samples evaluated between tests of the stopping rules; 0: 256

	// RelTol and AbsTol are the target standard error of the mean: the run stops when
	// StdErr <= max(AbsTol, RelTol·|Mean|). RelTol is relative (e.g. 0.001), AbsTol in the
	// result's unit. With both 0, MaxSamples samples are drawn. They control the mean only:
	// percentiles far in the tails rest on the few samples beyond them and need many more
	// samples. For a normal result the standard error of P2.5 or P97.5 is about 2.7 σ/√N,
	// 2.7 times the mean's (the asymptotic variance of a sample p-quantile, p(1 − p)/(N g²),
	// g the density there, a textbook result; value from memory), and a 95 % interval from a
	// run stopped at ~2000 samples rests on ~50 samples in each tail; for such intervals set
	// MaxSamples (e.g. 1e5 or more, common practice, no source) without a tolerance, or check
	// that another Seed gives the same ends.
	RelTol, AbsTol float64

	// MinSuccess is the fraction of samples that must succeed, in (0, 1]; 0: 0.95 (our choice,
	// common practice, no source). The statistics describe the successful samples only, that
	// is the inputs conditional on the computation accepting them, so a distribution that puts
	// much mass where an input is invalid (a negative thickness) must not pass unnoticed.
	MinSuccess float64

	Percentiles []float64 // probabilities in [0, 1] of the reported percentiles; nil: 0.025, 0.16, 0.5, 0.84, 0.975
	Workers     int       // goroutines evaluating samples; <= 0: all cores
}

// Sample is one successful Monte Carlo sample.
type Sample struct {
	Index int       // sample index (its random stream; MonteCarlo.Draw(Index) gives X again)
	X     []float64 // the inputs, in the order of MonteCarlo.Inputs, in their units
	Value float64   // the computation's result, in its unit
}

// Percentile is a percentile of the results: a fraction P of the samples lie at or below Value.
type Percentile struct {
	P     float64 // probability, in [0, 1]
	Value float64 // the percentile, in the result's unit
}

// MCResult is the outcome of MonteCarlo.Run. The statistics are over the N successful samples,
// in the result's unit.
type MCResult struct {
	Inputs      []Input      // the inputs sampled (MonteCarlo.Inputs)
	N           int          // successful samples
	Drawn       int          // samples drawn and evaluated: N + Failed
	Mean        float64      // sample mean
	Std         float64      // sample standard deviation (with N − 1)
	StdErr      float64      // standard error of the mean, Std/√N
	Percentiles []Percentile // empirical percentiles (gonum stat.Quantile, stat.Empirical)
	Samples     []Sample     // the successful samples, in index order
	Failed      int          // samples whose evaluation failed
	Failures    []Failure    // the failed samples grouped by message (numbers aside), most frequent first
	Converged   bool         // a tolerance (RelTol or AbsTol) on the mean's standard error was requested and met (it says nothing of the percentiles)
}

// settings are the effective parameters of a run.
type settings struct {
	max, min, batch int
	minSuccess      float64
	percentiles     []float64
}

// validate returns the effective settings or an error naming the offending field.
func (mc MonteCarlo) validate() (settings, error) {
	const ctx = "uncertainty: MonteCarlo"
	if _, err := validInputs(ctx, mc.Inputs, checkedP); err != nil {
		return settings{}, err
	}
	s := settings{max: mc.MaxSamples, min: mc.MinSamples, batch: mc.Batch, minSuccess: mc.MinSuccess, percentiles: mc.Percentiles}
	switch {
	case s.max < 0 || s.max > maxSamples:
		return s, fmt.Errorf("%s: MaxSamples must be in [0, %d] (0: %d), got %d", ctx, maxSamples, defaultMaxSamples, s.max)
	case s.min < 0:
		return s, fmt.Errorf("%s: MinSamples must be >= 0, got %d", ctx, s.min)
	case s.batch < 0:
		return s, fmt.Errorf("%s: Batch must be >= 0, got %d", ctx, s.batch)
	case !(s.minSuccess >= 0 && s.minSuccess <= 1):
		return s, fmt.Errorf("%s: MinSuccess must be in (0, 1] (0: %g), got %g", ctx, float64(defaultMinSuccess), s.minSuccess)
	}
	if err := check.NonNegative(ctx, "RelTol", mc.RelTol, ""); err != nil {
		return s, err
	}
	if err := check.NonNegative(ctx, "AbsTol", mc.AbsTol, "(the result's unit)"); err != nil {
		return s, err
	}
	if s.max == 0 {
		s.max = defaultMaxSamples
	}
	if s.min == 0 {
		s.min = min(defaultMinSamples, s.max)
	}
	if s.min > s.max {
		return s, fmt.Errorf("%s: MinSamples = %d exceeds MaxSamples = %d", ctx, s.min, s.max)
	}
	if s.batch == 0 {
		s.batch = defaultBatch
	}
	if s.minSuccess == 0 {
		s.minSuccess = defaultMinSuccess
	}
	if s.percentiles == nil {
		s.percentiles = defaultPercentiles
	}
	for i, p := range s.percentiles {
		if !(p >= 0 && p <= 1) {
			return s, fmt.Errorf("%s: Percentiles[%d] must be a probability in [0, 1], got %g", ctx, i, p)
		}
	}
	return s, nil
}

// checkedP are the probabilities at which validInputs checks every distribution: the median
// and the tornado's default quantiles (≈ ±1σ of a normal).
var checkedP = []float64{defaultLow, 0.5, defaultHigh}

// validInputs returns an error naming Inputs[i] unless every input has a distribution whose
// quantiles at ps (increasing) are finite, non-decreasing (a reversed distribution such as
// distuv.Uniform{Min: 2, Max: 1} fails) and computed without a panic (gonum's distuv panics
// on out-of-range parameters, e.g. distuv.Beta{Alpha: 0}). It returns the quantiles, one row
// per input. A zero-width distribution (all quantiles equal, e.g. Sigma 0) is a constant
// input and passes.
func validInputs(ctx string, in []Input, ps []float64) ([][]float64, error) {
	if len(in) == 0 {
		return nil, fmt.Errorf("%s: Inputs is empty (no uncertain input)", ctx)
	}
	qs := make([][]float64, len(in))
	for i, x := range in {
		if x.Dist == nil {
			return nil, fmt.Errorf("%s: Inputs[%d] (%s): Dist is nil", ctx, i, quoted(x.Name))
		}
		qs[i] = make([]float64, len(ps))
		for k, p := range ps {
			q, err := quantile(ctx, i, x, p)
			if err != nil {
				return nil, err
			}
			if k > 0 && q < qs[i][k-1] {
				return nil, fmt.Errorf("%s: Inputs[%d] (%s): the distribution's quantile at %g is %g, below %g at %g: want non-decreasing quantiles (reversed parameters, e.g. Min > Max?)",
					ctx, i, quoted(x.Name), p, q, qs[i][k-1], ps[k-1])
			}
			qs[i][k] = q
		}
	}
	return qs, nil
}

// quantile returns Inputs[i]'s Quantile(p), or an error naming it if the distribution panics
// (the panic becomes the error) or gives a value that is not finite.
func quantile(ctx string, i int, in Input, p float64) (float64, error) {
	return distCall(ctx, i, in, fmt.Sprintf("Quantile(%g)", p), func() float64 { return in.Dist.Quantile(p) })
}

// distCall returns f(), a call of Inputs[i]'s distribution named what, or an error naming the
// input if f panics or returns a value that is not finite.
func distCall(ctx string, i int, in Input, what string, f func() float64) (v float64, err error) {
	defer func() {
		if p := recover(); p != nil {
			v, err = 0, fmt.Errorf("%s: Inputs[%d] (%s): the distribution panicked in %s: %v (check its parameters)", ctx, i, quoted(in.Name), what, p)
		}
	}()
	v = f()
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, fmt.Errorf("%s: Inputs[%d] (%s): the distribution's %s is %g; want finite (check its parameters)", ctx, i, quoted(in.Name), what, v)
	}
	return v, nil
}

// Draw returns the inputs of sample i (>= 0), in the order of Inputs: the same values Run
// evaluates for that sample, for example to reproduce a failure (Failure.First). It returns an
// error for invalid Inputs or i < 0, or if a distribution gives a non-finite value.
func (mc MonteCarlo) Draw(i int) ([]float64, error) {
	if _, err := validInputs("uncertainty: MonteCarlo.Draw", mc.Inputs, checkedP); err != nil {
		return nil, err
	}
	if i < 0 {
		return nil, fmt.Errorf("uncertainty: MonteCarlo.Draw: sample index i must be >= 0, got %d", i)
	}
	x := make([]float64, len(mc.Inputs))
	if err := mc.draw(i, x); err != nil {
		return nil, err
	}
	return x, nil
}

// draw fills x with the inputs of sample i.
func (mc MonteCarlo) draw(i int, x []float64) error {
	var seed [32]byte
	binary.LittleEndian.PutUint64(seed[0:], mc.Seed)
	binary.LittleEndian.PutUint64(seed[8:], uint64(i))
	// ChaCha8 (a cryptographic generator) makes the streams of neighbouring (Seed, i)
	// independent without a hand-made seed hash.
	rng := rand.NewChaCha8(seed)
	for j, in := range mc.Inputs {
		u := openUnit(rng.Uint64())
		v, err := quantile("uncertainty: MonteCarlo", j, in, u)
		if err != nil {
			return err
		}
		x[j] = v
	}
	return nil
}

// openUnit maps 64 random bits to a uniform in the open interval (0, 1): the midpoints
// (k + 1/2)/2^52 of 2^52 equal cells, k the top 52 bits, so that no quantile is taken at 0
// or 1 (−Inf or +Inf for unbounded distributions). With 52 bits k + 1/2 < 2^52 is exact in a
// float64 (53-bit significand), so u lies in [2^−53, 1 − 2^−53]; with 53 bits, k + 1/2 rounds
// for k >= 2^52 and k = 2^53 − 1 gives exactly 1.
func openUnit(r uint64) float64 {
	return (float64(r>>12) + 0.5) * 0x1p-52
}

// Run draws samples of the inputs, evaluates f(x) for each (concurrently on Workers
// goroutines; f must be safe for concurrent use and receives its own copy of x) and returns
// the statistics of the results. The method is the propagation of distributions by Monte
// Carlo of JCGM 101:2008 ("Supplement 1 to the GUM"), with inputs drawn independently by
// inverse transform (Distribution.Quantile of a uniform).
//
// Stopping rules, tested after each batch of Batch samples (and never within one):
//   - once at least MinSamples samples are drawn, if fewer than MinSuccess of the samples
//     drawn succeeded, Run stops with an error matching ErrTooFewSuccesses;
//   - once at least MinSamples (and 2) samples succeeded, if a tolerance is set and
//     StdErr <= max(AbsTol, RelTol·|Mean|), Run stops with Converged = true;
//   - after MaxSamples samples, Run stops (Converged = false if a tolerance was set and not met).
//
// A sample fails when a distribution gives a non-finite input, or f returns an error, panics
// (the panic becomes its error) or returns a value that is not finite or beyond 1e100 in
// magnitude; failures are counted and grouped by message (numbers aside, see Failure) with the
// first sample's index (MCResult.Failures), never dropped. With fewer than 2 successes Run
// returns an error matching ErrTooFewSuccesses. With an ErrTooFewSuccesses error the result so
// far is returned too: the counts, samples and failures, and (with 2 or more successes) the
// mean and standard deviation of the successful samples, without percentiles. Run returns an
// error naming the field for invalid settings, an empty Inputs or a nil f.
func (mc MonteCarlo) Run(f func(x []float64) (float64, error)) (MCResult, error) {
	s, err := mc.validate()
	if err != nil {
		return MCResult{}, err
	}
	if f == nil {
		return MCResult{}, fmt.Errorf("uncertainty: MonteCarlo.Run: function f is nil")
	}
	tol := mc.RelTol > 0 || mc.AbsTol > 0
	r := MCResult{Inputs: mc.Inputs}
	var acc running
	var failures []Failure
	for r.Drawn < s.max {
		start, n := r.Drawn, min(s.batch, s.max-r.Drawn)
		batch, errs := sweep.Run(n, mc.Workers, func(k int) (Sample, error) {
			smp := Sample{Index: start + k, X: make([]float64, len(mc.Inputs))}
			v, err := evaluate(func() (float64, error) {
				if err := mc.draw(smp.Index, smp.X); err != nil {
					return 0, err
				}
				return f(slices.Clone(smp.X))
			})
			smp.Value = v
			return smp, err
		})
		for k, smp := range batch {
			if errs != nil && errs[k] != nil {
				r.Failed++
				continue
			}
			r.Samples = append(r.Samples, smp)
			acc.add(smp.Value)
		}
		if errs != nil {
			failures = groupFailures(errs, start, failures)
		}
		r.Drawn += n
		r.N = acc.n
		if r.N >= 2 {
			r.Mean, r.Std, r.StdErr = acc.stats()
		}
		if r.Drawn >= s.min && float64(r.N) < s.minSuccess*float64(r.Drawn) {
			break
		}
		if tol && r.N >= max(s.min, 2) && r.StdErr <= max(mc.AbsTol, mc.RelTol*math.Abs(r.Mean)) {
			r.Converged = true
			break
		}
	}
	sortFailures(failures)
	r.Failures = failures
	if r.N < 2 || float64(r.N) < s.minSuccess*float64(r.Drawn) {
		first := ""
		if len(failures) > 0 {
			first = fmt.Sprintf(" (most frequent: %s)", failures[0])
		}
		return r, fmt.Errorf("%w: %d of %d samples succeeded, below MonteCarlo.MinSuccess = %g (and at least 2 are needed)%s",
			ErrTooFewSuccesses, r.N, r.Drawn, s.minSuccess, first)
	}
	sorted := r.Values()
	slices.Sort(sorted)
	r.Percentiles = make([]Percentile, len(s.percentiles))
	for i, p := range s.percentiles {
		r.Percentiles[i] = Percentile{P: p, Value: stat.Quantile(p, stat.Empirical, sorted, nil)}
	}
	return r, nil
}

// running is the running mean and sum of squared deviations M2 of the results, updated once
// per successful sample in index order (so the same for any number of workers) by Welford's
// recurrence (B. P. Welford, Technometrics 4, 419 (1962)) on the results less the first one
// (shifted data: a mean far from zero compared with the spread costs no digits, see T. F.
// Chan, G. H. Golub and R. J. LeVeque, Am. Stat. 37, 242 (1983)). The stopping rule then
// costs O(1) per batch, where recomputing stat.MeanStdDev over all results after each batch
// cost O(N²) for a run. Hand-written because gonum/stat has no streaming mean and variance.
type running struct {
	n               int
	shift, mean, m2 float64 // mean is that of x − shift
}

// add adds the result x.
func (a *running) add(x float64) {
	if a.n == 0 {
		a.shift = x
	}
	a.n++
	y := x - a.shift
	d := y - a.mean
	a.mean += d / float64(a.n)
	a.m2 += d * (y - a.mean)
}

// stats returns the mean, the standard deviation (with n − 1) and the standard error of the
// mean; n must be >= 2.
func (a running) stats() (mean, std, stdErr float64) {
	std = math.Sqrt(max(a.m2, 0) / float64(a.n-1))
	return a.shift + a.mean, std, std / math.Sqrt(float64(a.n))
}

// Values returns the results of the successful samples in index order (a new slice), e.g. for
// a histogram.
func (r MCResult) Values() []float64 {
	out := make([]float64, len(r.Samples))
	for i, s := range r.Samples {
		out[i] = s.Value
	}
	return out
}

// Input returns input j of the successful samples in index order (a new slice), e.g. for a
// scatter plot of the result against it, or an error if j is not an input index.
func (r MCResult) Input(j int) ([]float64, error) {
	if j < 0 || j >= len(r.Inputs) {
		return nil, fmt.Errorf("uncertainty: MCResult.Input: index j = %d outside [0, %d)", j, len(r.Inputs))
	}
	out := make([]float64, len(r.Samples))
	for i, s := range r.Samples {
		if j >= len(s.X) {
			return nil, fmt.Errorf("uncertainty: MCResult.Input: sample %d has %d inputs, want > %d", s.Index, len(s.X), j)
		}
		out[i] = s.X[j]
	}
	return out, nil
}

// Quantile returns the empirical p-quantile of the successful results (gonum stat.Quantile,
// stat.Empirical), for p in [0, 1], or an error for an invalid p or a result without samples.
func (r MCResult) Quantile(p float64) (float64, error) {
	if !(p >= 0 && p <= 1) {
		return 0, fmt.Errorf("uncertainty: MCResult.Quantile: probability p must be in [0, 1], got %g", p)
	}
	if len(r.Samples) == 0 {
		return 0, fmt.Errorf("uncertainty: MCResult.Quantile: the result has no samples")
	}
	v := r.Values()
	slices.Sort(v)
	return stat.Quantile(p, stat.Empirical, v, nil), nil
}

// String returns a summary: the sample counts, mean ± standard error, standard deviation, the
// percentiles (%.6g) and the failure groups.
func (r MCResult) String() string {
	var b strings.Builder
	fmt.Fprintf(&b, "Monte Carlo: %d of %d samples succeeded", r.N, r.Drawn)
	if r.Converged {
		b.WriteString(" (converged)")
	}
	fmt.Fprintf(&b, "\nmean %.6g ± %.2g (standard error), standard deviation %.6g\n", r.Mean, r.StdErr, r.Std)
	for _, p := range r.Percentiles {
		fmt.Fprintf(&b, "P%g %.6g\n", 100*p.P, p.Value)
	}
	for _, f := range r.Failures {
		fmt.Fprintf(&b, "failed: %s\n", f)
	}
	return b.String()
}
