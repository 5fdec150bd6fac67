package uncertainty

import (
	"fmt"
	"math"
	"slices"
	"sort"
	"strings"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/sweep"
)

// Defaults of the sensitivities.
const (
	defaultRelStep = 0.01 // step h in ln x of the elasticities
	defaultLow     = 0.16 // tornado's low quantile, ≈ −1σ of a normal
	defaultHigh    = 0.84 // tornado's high quantile, ≈ +1σ of a normal
)

// Elasticities returns the elasticity E_i = ∂ln|f|/∂ln|x_i| of f at x0 for each input, by the
// central difference in ln x,
//
//	E_i = (ln|f(…, x_i e^h, …)| − ln|f(…, x_i e^−h, …)|) / (2h),
//
// which is exact (to rounding) for a power law f ∝ x_i^a (derivation, no source needed). The
// other inputs are held at x0. The 1 + 2·len(x0) evaluations run on all cores; f must be safe for
// concurrent use and receives its own copy of x. relStep is h, in (0, 1]; 0: 0.01. Choose h
// well above the relative noise ε of f (a solver's tolerance): the error of E from noise is
// about ε/h, the truncation error O(h²) for a smooth f.
//
// names (nil, or one per input) name the inputs in errors. Elasticities returns an error naming
// the input for an x0_i that is zero (the elasticity is undefined there), not finite or beyond
// 1e100 in magnitude; an error if f fails at any point (naming the input and the point), if
// f(x0) is 0 or if f changes sign within the step (ln|f| is undefined); and an error for an
// invalid relStep, mismatched names, an empty x0 or a nil f.
func Elasticities(f func(x []float64) (float64, error), x0 []float64, names []string, relStep float64) ([]float64, error) {
	const ctx = "uncertainty: Elasticities"
	h, err := validLocal(ctx, f, x0, names, relStep)
	if err != nil {
		return nil, err
	}
	pts := elasticityPoints(x0, h)
	vals, err := evaluateAll(ctx, f, pts, names, 0)
	if err != nil {
		return nil, err
	}
	return elasticities(ctx, vals, names, h)
}

// validLocal checks the arguments of a local sensitivity and returns the step h.
func validLocal(ctx string, f func([]float64) (float64, error), x0 []float64, names []string, relStep float64) (float64, error) {
	switch {
	case f == nil:
		return 0, fmt.Errorf("%s: function f is nil", ctx)
	case len(x0) == 0:
		return 0, fmt.Errorf("%s: x0 is empty (no input)", ctx)
	case names != nil && len(names) != len(x0):
		return 0, fmt.Errorf("%s: %d names for %d inputs", ctx, len(names), len(x0))
	}
	for i, x := range x0 {
		if err := check.Finite(ctx, "input "+inputName(names, i), x, ""); err != nil {
			return 0, err
		}
		if x == 0 {
			return 0, fmt.Errorf("%s: input %s is 0: its elasticity d ln f/d ln x is undefined (shift the input's origin, e.g. use T in K or 1 + δ)", ctx, inputName(names, i))
		}
	}
	h := relStep
	if h == 0 {
		h = defaultRelStep
	}
	if !(h > 0 && h <= 1) {
		return 0, fmt.Errorf("%s: relStep must be in (0, 1] (0: %g), got %g", ctx, float64(defaultRelStep), relStep)
	}
	return h, nil
}

// inputName returns names[i] quoted (see quoted), or "x[i]" without names.
func inputName(names []string, i int) string {
	if i < len(names) && names[i] != "" {
		return quoted(names[i])
	}
	return fmt.Sprintf("x[%d]", i)
}

// quoted returns s quoted for an error message, cut to its first 40 characters.
func quoted(s string) string {
	if r := []rune(s); len(r) > 40 {
		s = string(r[:40]) + "…"
	}
	return fmt.Sprintf("%q", s)
}

// elasticityPoints returns x0 followed, for each input i, by x0 with x_i e^h and x_i e^−h.
func elasticityPoints(x0 []float64, h float64) [][]float64 {
	// A hand-written central difference, not gonum's diff/fd: all points are evaluated at once
	// in parallel through sweep.Run (fd evaluates serially or with its own concurrency), an error
	// names the input and point that failed, and the steps are in ln x (x e^±h), where fd steps
	// in x.
	pts := [][]float64{slices.Clone(x0)}
	for i := range x0 {
		for _, s := range []float64{h, -h} {
			x := slices.Clone(x0)
			x[i] *= math.Exp(s)
			pts = append(pts, x)
		}
	}
	return pts
}

// elasticities returns the elasticities from f at elasticityPoints (the first len(x0)*2+1 vals).
func elasticities(ctx string, vals []float64, names []string, h float64) ([]float64, error) {
	f0 := vals[0]
	if f0 == 0 {
		return nil, fmt.Errorf("%s: f is 0 at x0: the elasticity d ln f/d ln x is undefined", ctx)
	}
	n := (len(vals) - 1) / 2
	out := make([]float64, n)
	for i := range out {
		fp, fm := vals[1+2*i], vals[2+2*i]
		if fp == 0 || fm == 0 || (fp > 0) != (f0 > 0) || (fm > 0) != (f0 > 0) {
			return nil, fmt.Errorf("%s: input %s: f changes sign or reaches 0 within the step (f = %g, %g, %g at x e^−h, x, x e^h): ln|f| is undefined; use a smaller relStep",
				ctx, inputName(names, i), fm, f0, fp)
		}
		// The difference of logarithms, not the log of fp/fm, which can underflow.
		out[i] = (math.Log(math.Abs(fp)) - math.Log(math.Abs(fm))) / (2 * h)
	}
	return out, nil
}

// evaluateAll evaluates f at every point on workers goroutines and returns the values, or the
// error of the first point that failed, naming the input it varies: after the nominal point
// come two points per input for the elasticities and, in Sensitivity.Run, two per input for the
// tornado.
func evaluateAll(ctx string, f func([]float64) (float64, error), pts [][]float64, names []string, workers int) ([]float64, error) {
	vals, errs := sweep.Run(len(pts), workers, func(k int) (float64, error) {
		return evaluate(func() (float64, error) { return f(slices.Clone(pts[k])) })
	})
	for k, err := range errs {
		if err == nil {
			continue
		}
		if k == 0 {
			return nil, fmt.Errorf("%s: f at the nominal inputs: %w", ctx, err)
		}
		i := ((k - 1) / 2) % len(pts[0])
		return nil, fmt.Errorf("%s: f with input %s = %g (the others nominal): %w", ctx, inputName(names, i), pts[k][i], err)
	}
	return vals, nil
}

// Sensitivity is the one-at-a-time sensitivity analysis of a computation around nominal inputs
// (see Run): elasticities, the tornado (the result with each input at a low and a high quantile
// of its distribution, the others nominal) and each input's first-order share of the result's
// variance. The zero values of RelStep, Low and High select the defaults; Inputs is required.
type Sensitivity struct {
	Inputs  []Input   // the uncertain inputs, in the order of f's argument x (their distributions give the tornado's values and σ)
	Nominal []float64 // nominal inputs, one per input, none 0; nil: each distribution's median Quantile(0.5)
	RelStep float64   // step h in ln x of the elasticities, in (0, 1]; 0: 0.01 (see Elasticities)
	Low     float64   // probability of the tornado's low input value, in (0, High); 0: 0.16
	High    float64   // probability of the tornado's high input value, in (Low, 1); 0: 0.84 (Low and High 0.16 and 0.84 are ±1σ of a normal)
	Workers int       // goroutines evaluating f; <= 0: all cores
}

// Effect is the effect of one input on the result, a bar of a tornado chart. Inputs are in
// their units, results in the result's unit.
type Effect struct {
	Name       string  // the input's name
	Unit       string  // the input's unit
	Index      int     // the input's index in Sensitivity.Inputs
	X0         float64 // nominal input
	XLow       float64 // input at the low quantile (Sensitivity.Low) of its distribution
	XHigh      float64 // input at the high quantile (Sensitivity.High)
	Low        float64 // result with the input at XLow, the others nominal
	High       float64 // result with the input at XHigh, the others nominal
	Swing      float64 // |High − Low|, the tornado's ranking key
	Elasticity float64 // ∂ln|f|/∂ln|x| at the nominal inputs, dimensionless
	RelSigma   float64 // relative standard deviation of the input, σ/|X0| (Distribution.StdDev)
	Share      float64 // first-order share of the result's variance, (Elasticity·RelSigma)²/Σ, in [0, 1]; 0 for all if Σ = 0
}

// SensitivityResult is the outcome of Sensitivity.Run.
type SensitivityResult struct {
	Nominal float64   // the result at the nominal inputs
	X0      []float64 // the nominal inputs
	Effects []Effect  // one per input, ranked by decreasing Swing (ties: input order), the tornado from top to bottom
	// RelStd is the first-order relative standard uncertainty of the result,
	// sqrt(Σ (Elasticity·RelSigma)²): the law of propagation of uncertainty for independent
	// inputs (JCGM 100:2008, the GUM, eq. (10)) written with elasticities.
	RelStd float64
}

// Run evaluates f at the nominal inputs, at x_i e^±h for each input (the elasticities, see
// Elasticities) and at each input's Low and High quantiles with the others nominal (the
// tornado), 1 + 4·len(Inputs) evaluations, concurrently; f must be safe for concurrent use and
// receives its own copy of x. The shares rank the inputs by their first-order contribution to the
// variance of the result, (E_i σ_i/x_i)² normalised to sum 1: the input with the largest share
// is the one to measure better first. One-at-a-time sensitivity and the tornado chart are
// common practice (no source); the shares are the terms of the law of propagation of
// uncertainty (JCGM 100:2008), valid where f is close to linear in ln x over ±σ.
//
// Every evaluation must succeed: Run returns an error naming the input and its value if f
// fails anywhere, and the errors of Elasticities; also an error naming the field for an empty
// Inputs, a nil Dist, a Nominal of the wrong length, invalid Low, High or RelStep, a standard
// deviation that is not finite and >= 0, and for a nil f.
func (s Sensitivity) Run(f func(x []float64) (float64, error)) (SensitivityResult, error) {
	const ctx = "uncertainty: Sensitivity"
	if len(s.Inputs) == 0 {
		return SensitivityResult{}, fmt.Errorf("%s: Inputs is empty (no uncertain input)", ctx)
	}
	lo, hi := s.Low, s.High
	if lo == 0 {
		lo = defaultLow
	}
	if hi == 0 {
		hi = defaultHigh
	}
	if !(lo > 0 && lo < hi && hi < 1) {
		return SensitivityResult{}, fmt.Errorf("%s: want 0 < Low < High < 1 (0: %g and %g), got Low = %g, High = %g", ctx, float64(defaultLow), float64(defaultHigh), s.Low, s.High)
	}
	// The quantiles used, in increasing order: each input's Low, median and High.
	ps := []float64{lo, 0.5, hi}
	if hi <= 0.5 {
		ps = []float64{lo, hi, 0.5}
	} else if lo >= 0.5 {
		ps = []float64{0.5, lo, hi}
	}
	qs, err := validInputs(ctx, s.Inputs, ps)
	if err != nil {
		return SensitivityResult{}, err
	}
	at := func(i int, p float64) float64 { return qs[i][slices.Index(ps, p)] }
	n := len(s.Inputs)
	names := make([]string, n)
	for i, in := range s.Inputs {
		names[i] = in.Name
	}
	x0 := slices.Clone(s.Nominal)
	switch {
	case x0 == nil:
		x0 = make([]float64, n)
		for i := range s.Inputs {
			x0[i] = at(i, 0.5)
		}
	case len(x0) != n:
		return SensitivityResult{}, fmt.Errorf("%s: %d Nominal values for %d Inputs", ctx, len(x0), n)
	}
	h, err := validLocal(ctx, f, x0, names, s.RelStep)
	if err != nil {
		return SensitivityResult{}, err
	}
	effects := make([]Effect, n)
	pts := elasticityPoints(x0, h)
	for i, in := range s.Inputs {
		sd, err := distCall(ctx, i, in, "StdDev()", in.Dist.StdDev)
		if err != nil {
			return SensitivityResult{}, err
		}
		if sd < 0 {
			return SensitivityResult{}, fmt.Errorf("%s: Inputs[%d] (%s): the distribution's standard deviation is %g; want >= 0 (check its parameters)", ctx, i, quoted(in.Name), sd)
		}
		e := Effect{Name: in.Name, Unit: in.Unit, Index: i, X0: x0[i], XLow: at(i, lo), XHigh: at(i, hi), RelSigma: sd / math.Abs(x0[i])}
		for _, x := range []float64{e.XLow, e.XHigh} {
			p := slices.Clone(x0)
			p[i] = x
			pts = append(pts, p)
		}
		if err := check.Result(ctx, fmt.Sprintf("relative standard deviation of Inputs[%d] (%s)", i, quoted(in.Name)), e.RelSigma, ""); err != nil {
			return SensitivityResult{}, err
		}
		effects[i] = e
	}
	vals, err := evaluateAll(ctx, f, pts, names, s.Workers)
	if err != nil {
		return SensitivityResult{}, err
	}
	el, err := elasticities(ctx, vals[:1+2*n], names, h)
	if err != nil {
		return SensitivityResult{}, err
	}
	var sum float64
	for i := range effects {
		e := &effects[i]
		e.Elasticity = el[i]
		e.Low, e.High = vals[1+2*n+2*i], vals[2+2*n+2*i]
		e.Swing = math.Abs(e.High - e.Low)
		sum += (e.Elasticity * e.RelSigma) * (e.Elasticity * e.RelSigma)
	}
	if math.IsInf(sum, 0) || math.IsNaN(sum) {
		return SensitivityResult{}, fmt.Errorf("%s: the first-order variance Σ (Elasticity·RelSigma)² is %g; want finite (an input with a huge elasticity or relative spread; use a larger RelStep or smaller spreads)", ctx, sum)
	}
	if sum > 0 {
		for i := range effects {
			e := &effects[i]
			e.Share = (e.Elasticity * e.RelSigma) * (e.Elasticity * e.RelSigma) / sum
		}
	}
	sort.SliceStable(effects, func(i, j int) bool { return effects[i].Swing > effects[j].Swing })
	return SensitivityResult{Nominal: vals[0], X0: x0, Effects: effects, RelStd: math.Sqrt(sum)}, nil
}

// String returns a plain-text table of the effects in rank order: input, nominal, low and high
// values and results, elasticity and variance share (%.4g).
func (r SensitivityResult) String() string {
	var b strings.Builder
	fmt.Fprintf(&b, "nominal result %.6g, first-order relative standard uncertainty %.3g\n", r.Nominal, r.RelStd)
	fmt.Fprintf(&b, "%-20s %11s %11s %11s %11s %11s %11s %8s\n", "input", "nominal", "x low", "x high", "f low", "f high", "elasticity", "share")
	for _, e := range r.Effects {
		name := e.Name
		if e.Unit != "" {
			name += " (" + e.Unit + ")"
		}
		fmt.Fprintf(&b, "%-20s %11.4g %11.4g %11.4g %11.4g %11.4g %11.4g %8.3f\n", name, e.X0, e.XLow, e.XHigh, e.Low, e.High, e.Elasticity, e.Share)
	}
	return b.String()
}
