package surface

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/internal/roots"
)

// Wafer lifetimes. The fundamental mode of the decay of excess carriers in a wafer of
// thickness W with diffusivity D, bulk lifetime τb and surfaces of recombination velocity S1
// (front, x = 0) and S2 (back, x = W) is exp(−t/τeff) with
//
//	1/τeff = 1/τb + 1/τs,   1/τs = D α²,
//	tan(α W) = α D (S1 + S2) / (α² D² − S1 S2),   0 < α W < π,
//
// from A. B. Sproul, "Dimensionless solution of the equation describing the effect of surface
// recombination on carrier decay in semiconductors", J. Appl. Phys. 76, 2851 (1994); for
// S1 = S2 = S it reduces to tan(α W/2) = S/(α D). It describes a transient decay after the
// higher modes have died out, with Δn-independent D and S; a quasi-steady-state measurement
// with uniform generation sees nearly the same τeff when S W/D is small.

// maxAlphaIter bounds the root-finder iterations of Lifetime.
const maxAlphaIter = 200

// Lifetime returns the surface-limited lifetime τs = 1/(D α²) in s of the fundamental
// mode (Sproul 1994, see above) of a wafer of thickness w (cm, finite, > 0) and carrier
// diffusivity d (cm^2/s, finite, > 0; the minority-carrier diffusivity in low injection, the
// ambipolar one in high injection), with surface recombination velocities s1 and s2 (cm/s,
// >= 0; +Inf is allowed and means an ideal sink, Δn = 0 at that surface). It returns +Inf
// for s1 = s2 = 0.
//
// Method: the dimensionless root x = α W of
// (x² − h1 h2) sin x − (h1 + h2) x cos x = 0, with hi = Si W/D, written in ui = hi/(1+hi) so
// that Si = +Inf is exact, is found by Brent's bracketed method on (0, π), where it is the
// only root (the Robin eigenvalues of the slab lie one in each interval (kπ, (k+1)π)), to a
// relative accuracy of 1e-14 in x.
func Lifetime(w, d, s1, s2 float64) (float64, error) {
	x, err := fundamentalRoot(w, d, s1, s2)
	if err != nil {
		return 0, err
	}
	if x == 0 {
		return math.Inf(1), nil
	}
	return seconds("Lifetime", w*w/(d*x*x))
}

// EffectiveLifetime returns the effective lifetime τeff in s of the fundamental mode,
// 1/τeff = 1/τb + 1/τs with τs from Lifetime(w, d, s1, s2), for bulk lifetime tauBulk
// (s, > 0, +Inf allowed for a perfect bulk). Arguments and source as for Lifetime.
func EffectiveLifetime(tauBulk, w, d, s1, s2 float64) (float64, error) {
	if math.IsNaN(tauBulk) || !(tauBulk > 0) {
		return 0, fmt.Errorf("surface: bulk lifetime tauBulk must be > 0 s (or +Inf), got %g", tauBulk)
	}
	ts, err := Lifetime(w, d, s1, s2)
	if err != nil {
		return 0, err
	}
	return seconds("EffectiveLifetime", 1/(1/tauBulk+1/ts))
}

// LifetimeSproul returns the approximation of A. B. Sproul, J. Appl. Phys. 76, 2851
// (1994) to the surface-limited lifetime of a symmetric wafer (both surfaces with s), in s:
//
//	τs ≈ W/(2S) + W²/(D π²),
//
// which joins the low-S limit W/(2S) to the diffusion limit W²/(π² D). Sproul states an
// accuracy of about 5 % for all S (value from memory); against Lifetime the largest
// deviation is 5.06 %, at S W/D ≈ 5. A wafer with one surface at s and the other at S = 0 is
// half of a symmetric wafer of thickness 2W (mirror symmetry), so for it use
// LifetimeSproul(2w, d, s) = W/S + 4 W²/(D π²), with the same accuracy. Arguments as for
// Lifetime (s may be +Inf); it returns +Inf for s = 0.
func LifetimeSproul(w, d, s float64) (float64, error) {
	if err := checkWafer(w, d, s, s); err != nil {
		return 0, err
	}
	if s == 0 {
		return math.Inf(1), nil
	}
	return seconds("LifetimeSproul", w/(2*s)+w*w/(d*math.Pi*math.Pi))
}

// LifetimeLowS returns the low-S limit of the surface-limited lifetime,
// τs ≈ W/(S1 + S2) in s (uniform Δn across the wafer), for w in cm (> 0) and s1, s2 in cm/s
// (finite, >= 0). Its relative error, from the expansion of the exact equation (Sproul 1994,
// above) for small hi = Si W/D, is τs,approx/τs − 1 ≈ h1 h2/(h1 + h2) − (h1 + h2)/3 (−h/6 for
// a symmetric wafer), so it underestimates τs by less than 1 % when (S1 + S2) W/D < 0.03. It
// returns +Inf for s1 = s2 = 0.
func LifetimeLowS(w, s1, s2 float64) (float64, error) {
	if err := check.Positive("surface", "thickness w", w, "cm"); err != nil {
		return 0, err
	}
	if err := check.NonNegative("surface", "s1", s1, "cm/s"); err != nil {
		return 0, err
	}
	if err := check.NonNegative("surface", "s2", s2, "cm/s"); err != nil {
		return 0, err
	}
	if s1+s2 == 0 {
		return math.Inf(1), nil
	}
	return seconds("LifetimeLowS", w/(s1+s2))
}

// LifetimeDiffusionLimit returns the limit of the surface-limited lifetime for
// S1 = S2 → ∞, τs = W²/(π² D) in s (Sproul 1994): no passivation can make τs shorter. For
// w in cm and d in cm^2/s (finite, > 0).
func LifetimeDiffusionLimit(w, d float64) (float64, error) {
	if err := checkWafer(w, d, 0, 0); err != nil {
		return 0, err
	}
	return seconds("LifetimeDiffusionLimit", w*w/(d*math.Pi*math.Pi))
}

// checkWafer validates the arguments of the wafer-lifetime functions.
func checkWafer(w, d, s1, s2 float64) error {
	if err := check.Positive("surface", "thickness w", w, "cm"); err != nil {
		return err
	}
	if err := check.Positive("surface", "diffusivity d", d, "cm^2/s"); err != nil {
		return err
	}
	for _, s := range [...]struct {
		name string
		v    float64
	}{{"s1", s1}, {"s2", s2}} {
		if math.IsNaN(s.v) || s.v < 0 {
			return fmt.Errorf("surface: %s must be >= 0 cm/s (or +Inf), got %g", s.name, s.v)
		}
	}
	return nil
}

// fundamentalRoot returns x = α W of the fundamental mode (0 for s1 = s2 = 0).
func fundamentalRoot(w, d, s1, s2 float64) (float64, error) {
	if err := checkWafer(w, d, s1, s2); err != nil {
		return 0, err
	}
	u := func(s float64) float64 {
		if math.IsInf(s, 1) {
			return 1
		}
		h := s * w / d
		return h / (1 + h)
	}
	u1, u2 := u(s1), u(s2)
	switch {
	case u1 == 0 && u2 == 0:
		return 0, nil
	case u1 == 1 && u2 == 1:
		return math.Pi, nil
	}
	// f(x)·(1−u1)(1−u2) with hi = ui/(1−ui): finite for ui = 1, < 0 for x → 0+, > 0 at π.
	a := (1 - u1) * (1 - u2)
	p := u1 * u2
	s := u1*(1-u2) + u2*(1-u1)
	f := func(x float64) (float64, error) {
		return (x*x*a-p)*math.Sin(x) - s*x*math.Cos(x), nil
	}
	// Lower end: f(x) ≈ −(p + s) x < 0 for small x; x0 ≈ sqrt(h1 + h2) for small h, so start
	// a decade below that estimate (and never above π/2).
	lo := math.Pi / 2
	if a > 0 { // a = 0 when one surface is an ideal sink; then the root is in [π/2, π)
		lo = math.Min(lo, 0.1*math.Sqrt((s+p)/a))
	}
	flo, _ := f(lo)
	for k := 0; flo >= 0 && k < 60; k++ {
		lo /= 16
		flo, _ = f(lo)
	}
	hi := math.Pi
	fhi, _ := f(hi)
	if !(flo < 0) || !(fhi > 0) {
		return 0, fmt.Errorf("surface: fundamental-mode root not bracketed for w = %g cm, d = %g cm^2/s, s1 = %g, s2 = %g cm/s: %w",
			w, d, s1, s2, check.ErrNoConvergence)
	}
	x, err := roots.Solve(f, lo, hi, flo, fhi, 0, maxAlphaIter)
	if err != nil {
		return 0, fmt.Errorf("surface: fundamental mode for w = %g cm, d = %g cm^2/s, s1 = %g, s2 = %g cm/s: %w", w, d, s1, s2, err)
	}
	return x, nil
}

// seconds returns a computed lifetime v in s, or an error if it overflowed (see
// check.Result); it formats only on the error path.
func seconds(fn string, v float64) (float64, error) {
	if math.IsNaN(v) || math.IsInf(v, 0) || math.Abs(v) > check.MaxMagnitude {
		return 0, check.Result("surface: "+fn, "lifetime", v, "s")
	}
	return v, nil
}
