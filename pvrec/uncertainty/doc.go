// Package uncertainty answers "how sure is this number?" for any pvrec result: a function of
// a model set and of its inputs, evaluated over a family of published model sets (model
// spread), over distributions of its inputs (Monte Carlo), and one input at a time around
// nominal values (sensitivities). It knows no physics of its own: the computation is the
// caller's function, typically a J0 solve, an implied Voc or a lifetime at one injection.
//
// # Model spread
//
// Members(Case) returns the default family of model choices valid for a case (temperature,
// n+ or p+ region, arsenic or not): every combination of the published intrinsic-density,
// band-gap-narrowing (with its statistics), mobility and intrinsic-recombination models of
// packages silicon and recomb, with incompatible pairs excluded by documented rules (see
// Members). Spread(members, workers, f) evaluates f for each Member concurrently and reports
// each result, the range, and the rank and position of the default member within it.
// Swaps(members) groups the members that differ from the default in one Role only (ni, BGN,
// mobility, recombination): the one-at-a-time model spread, which says which choice matters.
//
// # Monte Carlo propagation of input distributions
//
// MonteCarlo{Inputs, Seed, ...}.Run(f) draws the inputs from their distributions (any
// Distribution: distuv.Normal, LogNormal, Uniform of gonum.org/v1/gonum/stat/distuv), evaluates
// f on all cores and returns the mean, standard deviation, standard error of the mean,
// percentiles and every sample. It stops at a requested standard error (RelTol, AbsTol) or
// after MaxSamples. Results are reproducible bit for bit from the seed for any number of
// workers: the inputs of sample i depend only on (Seed, i), and the stopping rules are tested
// only between fixed-size batches.
//
// # Sensitivities
//
// Elasticities(f, x0, names, relStep) gives d ln f/d ln x_i by a central difference in ln x
// (exact for power laws). Sensitivity{Inputs, Nominal, ...}.Run(f) adds the tornado (the result
// with each input at a low and a high quantile of its distribution, the others nominal), a
// ranking by swing, and each input's first-order share of the result's variance, which says
// which input to measure better first. Results are plain slices of structs (Effect, Sample,
// MemberResult) that figure code can draw without importing this package.
//
// # Failures
//
// A member or sample whose evaluation fails (an error, a panic, a result that is not finite or
// beyond 1e100) is counted and reported, grouped by message (numbers aside, see Failure) with
// its count and the index of the first (Failure), never dropped. Spread fails with
// ErrTooFewSuccesses when no member succeeds, MonteCarlo.Run when fewer than MinSuccess
// (default 95 %) of the samples succeed; the statistics describe the successful evaluations
// only.
//
// # Methods and sources
//
//   - Propagation of distributions by Monte Carlo: JCGM 101:2008, "Evaluation of measurement
//     data — Supplement 1 to the 'Guide to the expression of uncertainty in measurement' —
//     Propagation of distributions using a Monte Carlo method". Our stopping rule (a target
//     standard error of the mean, tested between batches) is in its spirit but is our own,
//     not its adaptive procedure.
//   - Sampling by inverse transform, u ~ U(0, 1) mapped by the quantile function, with
//     uniforms from math/rand/v2's ChaCha8 seeded by (Seed, sample index).
//   - Mean and standard deviation (N − 1): gonum stat.MeanStdDev; standard error of the mean
//     σ/√N (J. R. Taylor, An Introduction to Error Analysis, 2nd ed., University Science Books,
//     1997, §4.4); percentiles: gonum stat.Quantile with stat.Empirical on the sorted results.
//   - Elasticities by central differences in ln x: exact for power laws (derivation).
//   - One-at-a-time sensitivity and the tornado chart: common practice (no source).
//   - First-order variance shares and RelStd: the law of propagation of uncertainty for
//     independent inputs, JCGM 100:2008 (the GUM), eq. (10), with sensitivity coefficients
//     written as elasticities.
//
// Model sources are those of packages silicon and recomb (docs/model-catalogue.md).
package uncertainty
