package lifetime

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/floats"
	"gonum.org/v1/gonum/stat"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// MinFitPoints is the number of points below which a fit (Result.J0s, the low-injection check)
// warns of a fitting window with too few points (FewFitPoints; our choice, no source).
// Result.J0s needs at least 3.
const MinFitPoints = 10

// J0sOptions are the options of Result.J0s. The zero value selects the default window and the
// correction for non-uniform Δn.
type J0sOptions struct {
	// DnMin and DnMax bound the fitting window, cm^-3 (0 < DnMin < DnMax); both 0 select
	// DefaultJ0sWindow of the wafer.
	DnMin, DnMax float64
	// Uniform fits the uniform-Δn form as it stands, without the correction for the Δn
	// profile that recombining surfaces cause (see Result.J0s).
	Uniform bool
}

// DefaultJ0sWindow returns the default J0s fitting window of wafer b, cm^-3: one decade from
// max(N, 1e15 cm^-3), with N the majority-carrier density of b in equilibrium (our choice,
// no source). Above N the abscissa (N + Δn) of the fit changes by a factor of 5.5 across the
// window, so the slope is well determined; staying above 1e15 cm^-3 keeps the fit clear of
// the low-injection range, where bulk Shockley–Read–Hall recombination changes with Δn and
// trapping artefacts appear. It returns 0, 0 for a nil b.
func DefaultJ0sWindow(b *recomb.Bulk) (dnMin, dnMax float64) {
	if b == nil {
		return 0, 0
	}
	eq := b.Equilibrium()
	lo := math.Max(math.Max(eq.N0, eq.P0), 1e15)
	return lo, 10 * lo
}

// J0sFit is the result of the Kane–Swanson fit of Result.J0s.
type J0sFit struct {
	J0s          float64   // total surface saturation current density, front + rear, A/cm^2
	J0sErr       float64   // standard error of J0s, A/cm^2
	PerSide      float64   // J0s/2: the J0s of each surface of a symmetric sample, A/cm^2
	Intercept    float64   // intercept 1/τSRH, the injection-independent bulk recombination rate, s^-1
	InterceptErr float64   // standard error of the intercept, s^-1
	TauSRH       float64   // 1/Intercept, s (+Inf if the intercept is <= 0)
	DnMin, DnMax float64   // the fitting window, cm^-3
	N            int       // number of points fitted
	Correction   float64   // largest relative increase of a point's surface rate by the non-uniform-Δn correction (0 with Uniform)
	Warnings     []Warning // caveats: few points, window not covered, negative intercept, strong correction
}

// StrongCorrection is the size of the non-uniform-Δn correction of Result.J0s (J0sFit.Correction)
// above which it warns (NonUniformInjection): 5 %, where the correction's reliance on the
// diffusivity model and on equal surfaces starts to matter (our choice, no source).
const StrongCorrection = 0.05

// J0s extracts the total surface saturation current density of the sample by the slope method
// of D. E. Kane and R. M. Swanson, "Measurement of the emitter saturation current by a
// contactless photoconductivity decay method", 18th IEEE PVSC, 578 (1985): over the window of
// o (default DefaultJ0sWindow), the least-squares line
//
//	1/τeff − 1/τintrinsic = 1/τSRH + J0s · x,   x = (n p − ni,eff²)/(q ni,eff² Δn W),
//
// with τintrinsic from a.Intrinsic and x, which is (N + Δn)/(q ni,eff² W) for an
// injection-independent ni,eff, evaluated at each point's state with ni,eff at the injected
// state. Using x rather than Δn as the abscissa, and subtracting the intrinsic recombination
// rather than Auger alone in high injection, is what the J0s form of Sample.LifetimeJ0s implies
// (surface.SeffFromJ0s summed over both surfaces, uniform Δn); we derived it so and do not
// attribute it to a particular later paper. The slope is J0s (front + rear), the intercept the
// bulk Shockley–Read–Hall rate, assumed independent of Δn in the window; their standard errors
// are those of ordinary least squares (gonum/stat for the line).
//
// Correction for non-uniform Δn (unless o.Uniform). Recombining surfaces draw a Δn profile
// across the wafer, and the measured surface rate 1/τs is that of the fundamental mode
// (Sproul 1994; Sample.Lifetime), lower than the uniform form 2 Seff/W by about Seff W/(6 D):
// the uniform fit underestimates J0s by that much (2 % for Seff W/D = 0.12). The fit therefore
// replaces each rate r = 1/τeff − 1/τintrinsic − 1/τSRH by the uniform-form rate of the same
// surfaces, 2 Seff(r)/W, with Seff(r) from SeffFromLifetime (exact inverse for a symmetric
// sample, with the ambipolar diffusivity at the point), and refits, iterating on 1/τSRH until
// it settles; for J0s surfaces the corrected fit is exact. We derived this correction from
// Sproul's relation; it assumes equal surfaces. Points whose rate reaches the diffusion limit
// are left out and reported.
//
// J0sFit.Warnings reports fewer than MinFitPoints points, data that do not cover the window,
// a negative intercept (beyond two standard errors and 1 % of the fitted rates), and a
// correction above StrongCorrection. It returns an error for an analysis without Intrinsic,
// an invalid window, fewer than three points in it, or a correction that does not settle
// (pvrec.ErrNoConvergence).
//
// J0sFit.TauSRH is +Inf when the intercept is not positive (no bulk SRH resolved).
func (r *Result) J0s(o J0sOptions) (J0sFit, error) {
	const ctx = "Result.J0s"
	if err := r.ready(ctx); err != nil {
		return J0sFit{}, err
	}
	if r.a.Intrinsic == nil {
		return J0sFit{}, fmt.Errorf("lifetime: %s: Analysis.Intrinsic is nil: set the intrinsic recombination to subtract (recomb.NewIntrinsic(), or recomb.Sum{} for none)", ctx)
	}
	lo, hi := o.DnMin, o.DnMax
	if lo == 0 && hi == 0 {
		lo, hi = DefaultJ0sWindow(r.a.Wafer)
	}
	if !(lo > 0) || !(hi > lo) || math.IsInf(hi, 0) {
		return J0sFit{}, fmt.Errorf("lifetime: %s: fitting window needs 0 < DnMin < DnMax finite, got [%g, %g] cm^-3", ctx, lo, hi)
	}
	qw := silicon.ElementaryCharge * r.a.W
	var xs, ys, ds []float64
	for i, d := range r.Dn {
		if d < lo || d > hi {
			continue
		}
		y := 1 / r.TauEff[i]
		if r.tab.intrinsic {
			y -= math.Exp(r.tab.at(colIntr, r.x[i]))
		}
		xs = append(xs, math.Exp(r.tab.at(colKS, r.x[i]))/qw)
		ys = append(ys, y)
		ds = append(ds, math.Exp(r.tab.at(colDa, r.x[i])))
	}
	f := J0sFit{DnMin: lo, DnMax: hi, N: len(xs)}
	if f.N < 3 {
		return J0sFit{}, fmt.Errorf("lifetime: %s: %d point(s) in the fitting window [%g, %g] cm^-3, need at least 3", ctx, f.N, lo, hi)
	}
	if floats.Max(xs) == floats.Min(xs) {
		return J0sFit{}, fmt.Errorf("lifetime: %s: the %d points in the fitting window share one abscissa", ctx, f.N)
	}
	f.Intercept, f.J0s = stat.LinearRegression(xs, ys, nil, false)
	zs := ys
	if !o.Uniform {
		var err error
		var dropped int
		if xs, zs, dropped, err = r.correct(xs, ys, ds, &f); err != nil {
			return J0sFit{}, fmt.Errorf("lifetime: %s: %w", ctx, err)
		}
		if dropped > 0 {
			f.Warnings = append(f.Warnings, Warning{Kind: NonUniformInjection, Message: fmt.Sprintf(
				"%d point(s) of the fitting window have a surface rate at the diffusion limit W²/(π² D) and were left out", dropped)})
		}
	}
	mx := stat.Mean(xs, nil)
	var sxx, ss float64
	for i, x := range xs {
		sxx += (x - mx) * (x - mx)
		e := zs[i] - f.Intercept - f.J0s*x
		ss += e * e
	}
	s2 := ss / float64(f.N-2)
	f.J0sErr = math.Sqrt(s2 / sxx)
	f.InterceptErr = math.Sqrt(s2 * (1/float64(f.N) + mx*mx/sxx))
	f.PerSide = f.J0s / 2
	f.TauSRH = math.Inf(1)
	if f.Intercept > 0 {
		f.TauSRH = 1 / f.Intercept
	}
	if f.N < MinFitPoints {
		f.Warnings = append(f.Warnings, Warning{Kind: FewFitPoints, Message: fmt.Sprintf(
			"only %d points in the fitting window [%g, %g] cm^-3 (fewer than %d): the J0s and its error are unreliable", f.N, lo, hi, MinFitPoints)})
	}
	if dmin, dmax := floats.Min(r.Dn), floats.Max(r.Dn); dmin > lo || dmax < hi {
		f.Warnings = append(f.Warnings, Warning{Kind: WindowNotCovered, Message: fmt.Sprintf(
			"the data (Δn from %.3g to %.3g cm^-3) do not cover the whole fitting window [%.3g, %.3g] cm^-3", dmin, dmax, lo, hi)})
	}
	if f.Intercept < -2*f.InterceptErr && -f.Intercept > 0.01*stat.Mean(ys, nil) {
		f.Warnings = append(f.Warnings, Warning{Kind: NegativeIntercept, Message: fmt.Sprintf(
			"the intercept 1/τSRH = %.3g ± %.2g s^-1 is negative: the intrinsic model overestimates the recombination of this wafer, or J0s changes with Δn in the window", f.Intercept, f.InterceptErr)})
	}
	if f.Correction > StrongCorrection {
		f.Warnings = append(f.Warnings, Warning{Kind: NonUniformInjection, Message: fmt.Sprintf(
			"the correction for non-uniform Δn raises surface rates by up to %.1f %%: the J0s relies on the diffusivity model and on equal surfaces", 100*f.Correction)})
	}
	return f, nil
}

// Iterations of the non-uniform-Δn correction of Result.J0s: it stops when 1/τSRH changes by
// less than correctionTol of the largest fitted rate (far below any fit's standard error).
const (
	correctionTol     = 1e-9
	maxCorrectionIter = 100
)

// correct applies the non-uniform-Δn correction of Result.J0s to the points (xs, ys) with
// ambipolar diffusivities ds, starting from the uniform fit in f, and leaves the corrected fit
// in f. It returns the abscissae and corrected rates of the points it kept and the number it
// left out at the diffusion limit.
func (r *Result) correct(xs, ys, ds []float64, f *J0sFit) (kx, zs []float64, dropped int, err error) {
	w := r.a.W
	scale := floats.Norm(ys, math.Inf(1)) // size of the rates, s^-1
	for iter := 0; iter < maxCorrectionIter; iter++ {
		kx, zs, dropped = kx[:0], zs[:0], 0
		corr := 0.0
		for i, y := range ys {
			rate := y - f.Intercept // the surface rate, given the current 1/τSRH
			z := rate
			if rate > 0 {
				s, why := seffSymmetric(1/rate, math.Inf(1), w, ds[i])
				if why != "" {
					dropped++
					continue
				}
				z = 2 * s / w
				corr = math.Max(corr, z/rate-1)
			}
			kx, zs = append(kx, xs[i]), append(zs, z+f.Intercept)
		}
		if len(kx) < 3 || floats.Max(kx) == floats.Min(kx) {
			return nil, nil, 0, fmt.Errorf("%d point(s) left after the correction for non-uniform Δn, need at least 3", len(kx))
		}
		prev := f.Intercept
		f.Intercept, f.J0s = stat.LinearRegression(kx, zs, nil, false)
		f.N, f.Correction = len(kx), corr
		if math.Abs(f.Intercept-prev) <= correctionTol*scale {
			return kx, zs, dropped, nil
		}
	}
	return nil, nil, 0, check.NoConvergence("the correction for non-uniform Δn did not settle in %d iterations (1/τSRH = %g s^-1)", maxCorrectionIter, f.Intercept)
}

// seffSymmetric returns Seff of each surface of a symmetric wafer, or the reason it has none.
func seffSymmetric(tauEff, tauBulk, w, d float64) (float64, string) {
	rate := 1/tauEff - 1/tauBulk
	switch {
	case rate < 0:
		return 0, "τeff above the bulk lifetime"
	case rate == 0:
		return 0, ""
	}
	alpha := math.Sqrt(rate / d)
	z := alpha * w / 2
	if !(z < math.Pi/2) {
		return 0, "surface lifetime at or below the diffusion limit W²/(π² D)"
	}
	return alpha * d * math.Tan(z), ""
}

// SeffFromLifetime returns the effective surface recombination velocity Seff in cm/s of each
// surface of a symmetric wafer of thickness w in cm (finite, > 0) and carrier diffusivity d
// in cm²/s (finite, > 0) whose effective lifetime is tauEff in s (finite, > 0) with bulk
// lifetime tauBulk in s (> 0; +Inf gives the upper bound of Seff, all recombination taken as
// surface recombination). It inverts the exact fundamental mode (A. B. Sproul, J. Appl. Phys.
// 76, 2851 (1994); surface.Lifetime) in closed form:
//
//	1/τs = 1/τeff − 1/τbulk = D α²,   Seff = α D tan(α W/2).
//
// It returns 0 for τeff = τbulk, and an error for invalid arguments, τeff > τbulk, or a
// surface lifetime at or below the diffusion limit W²/(π² D), which no finite Seff reaches
// (errors.Is(err, pvrec.ErrOutOfRange)).
func SeffFromLifetime(tauEff, tauBulk, w, d float64) (float64, error) {
	const ctx = "lifetime: SeffFromLifetime"
	if err := check.Positive(ctx, "effective lifetime tauEff", tauEff, "s"); err != nil {
		return 0, err
	}
	if err := check.PositiveOrInf(ctx, "bulk lifetime tauBulk", tauBulk, "s"); err != nil {
		return 0, err
	}
	if err := check.Positive(ctx, "thickness w", w, "cm"); err != nil {
		return 0, err
	}
	if err := check.Positive(ctx, "diffusivity d", d, "cm²/s"); err != nil {
		return 0, err
	}
	s, why := seffSymmetric(tauEff, tauBulk, w, d)
	switch {
	case why == "":
		return s, nil
	case tauEff > tauBulk:
		return 0, fmt.Errorf("%s: effective lifetime %g s exceeds the bulk lifetime %g s", ctx, tauEff, tauBulk)
	}
	lim := w * w / (math.Pi * math.Pi * d)
	ts := 1 / (1/tauEff - 1/tauBulk)
	return 0, check.Rangef("SeffFromLifetime", "surface lifetime", ts, lim, math.Inf(1),
		"%s: surface lifetime %g s is at or below the diffusion limit W²/(π² D) = %g s: no finite Seff gives it", ctx, ts, lim)
}

// SeffCurve is Seff(Δn) of a measured symmetric sample (Result.Seff).
type SeffCurve struct {
	Dn       []float64   // excess carrier density, cm^-3
	Seff     []float64   // effective surface recombination velocity of each surface, cm/s
	Index    []int       // index of each point among the Result's points
	Excluded []Exclusion // points without a Seff, by reason (First indexes the Result's points)
}

// Seff returns the effective surface recombination velocity of each surface of the measured
// sample, taken as symmetric, at every point: SeffFromLifetime with τbulk of the mechanism
// bulk at the point's state and the ambipolar diffusivity there. With bulk = recomb.Sum{} (no
// bulk recombination, τbulk = +Inf) it gives the upper bound of Seff. Points where τeff
// exceeds τbulk or the surface lifetime reaches the diffusion limit are excluded and
// reported. It returns an error for a nil bulk or an error of the bulk mechanism.
func (r *Result) Seff(bulk recomb.Mechanism) (SeffCurve, error) {
	const ctx = "Result.Seff"
	if err := r.ready(ctx); err != nil {
		return SeffCurve{}, err
	}
	if bulk == nil {
		return SeffCurve{}, fmt.Errorf("lifetime: %s: bulk mechanism is nil (recomb.Sum{} for the upper bound with no bulk recombination)", ctx)
	}
	var c SeffCurve
	var ex excluder
	for i, d := range r.Dn {
		st, err := r.a.Wafer.State(d)
		if err != nil {
			return SeffCurve{}, fmt.Errorf("lifetime: %s: %w", ctx, err)
		}
		tb, err := recomb.Lifetime(bulk, st)
		if err != nil {
			return SeffCurve{}, fmt.Errorf("lifetime: %s: bulk at Δn = %g cm^-3: %w", ctx, d, err)
		}
		s, why := seffSymmetric(r.TauEff[i], tb, r.a.W, math.Exp(r.tab.at(colDa, r.x[i])))
		if why != "" {
			ex.add(i, why)
			continue
		}
		c.Dn, c.Seff, c.Index = append(c.Dn, d), append(c.Seff, s), append(c.Index, i)
	}
	c.Excluded = ex.list
	return c, nil
}
