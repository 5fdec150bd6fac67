package profile

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// MaxScale is the largest density factor and depth-scale factor that Scaled accepts: 1e3,
// far beyond any calibration error of a measured profile (our choice), so that scaled
// extents and doses stay finite.
const MaxScale = 1e3

// Scaled is a profile with recalibrated density and depth scales, for the uncertainty of a
// measured profile (a calibration factor of the density, an error of the depth scale, a
// misplaced surface) or a what-if on an analytic one:
//
//	N_scaled(x) = Density · N((x − Shift) / Stretch)   for x >= max(0, Shift),
//	N_scaled(x) = Density · N(0)                         for 0 <= x < Shift,
//
// for the donor and the acceptor density alike. Stretch > 1 makes the profile deeper
// (Stretch = 1.05: the depth scale was 5 % short); a positive Shift moves it deeper, the
// first Shift cm holding the surface density; a negative Shift removes the top |Shift| cm,
// as an etch-back would. Scaled{Profile: p, Density: 1, Stretch: 1} is p. The dose of the
// layer scales as Density·Stretch (for Shift = 0); the junction with a background moves with
// the scaled profile. Wrap only the diffused part of a region, not its background:
// Sum{Scaled{Profile: measured, Density: c, Stretch: 1}, Uniform{...}}.
//
// Density and Stretch must be finite, > 0 and at most MaxScale, |Shift| at most MaxDepthCm;
// the scaled densities may not exceed the silicon atom density. The zero Scaled (no profile,
// zero factors) is invalid: its methods return errors (Extent returns 0).
type Scaled struct {
	Profile Profile // the profile to scale (required)
	Density float64 // density factor, dimensionless, > 0 (1: as given)
	Stretch float64 // depth-scale factor, dimensionless, > 0 (1: as given)
	Shift   float64 // depth shift, cm: > 0 deeper, < 0 the top |Shift| removed (0: as given)
}

func (s Scaled) validate() error {
	const ctx = "profile: Scaled"
	if s.Profile == nil {
		return fmt.Errorf("%s: Profile is nil", ctx)
	}
	if err := check.Positive(ctx, "density factor Density", s.Density, ""); err != nil {
		return err
	}
	if s.Density > MaxScale {
		return check.Rangef(ctx, "density factor Density", s.Density, 0, MaxScale,
			"%s: density factor Density = %g beyond MaxScale = %g", ctx, s.Density, MaxScale)
	}
	if err := check.Positive(ctx, "depth-scale factor Stretch", s.Stretch, ""); err != nil {
		return err
	}
	if s.Stretch > MaxScale {
		return check.Rangef(ctx, "depth-scale factor Stretch", s.Stretch, 0, MaxScale,
			"%s: depth-scale factor Stretch = %g beyond MaxScale = %g", ctx, s.Stretch, MaxScale)
	}
	if err := check.Finite(ctx, "depth shift Shift", s.Shift, "cm"); err != nil {
		return err
	}
	if math.Abs(s.Shift) > MaxDepthCm {
		return check.Rangef(ctx, "depth shift Shift", s.Shift, -MaxDepthCm, MaxDepthCm,
			"%s: depth shift Shift = %g cm beyond ±MaxDepthCm = %g cm", ctx, s.Shift, MaxDepthCm)
	}
	return nil
}

// inner maps a depth x >= 0 of the scaled profile to the depth of the wrapped one.
func (s Scaled) inner(x float64) float64 { return math.Max(0, (x-s.Shift)/s.Stretch) }

// outer maps a depth of the wrapped profile to the depth of the scaled one.
func (s Scaled) outer(x float64) float64 { return s.Shift + s.Stretch*x }

// Dopants returns the scaled donor and acceptor densities in cm^-3 at depth x in cm, or an
// error for an invalid x or parameters, an error of the wrapped profile, or a range error if
// a scaled density exceeds the silicon atom density.
func (s Scaled) Dopants(x float64) (nd, na float64, err error) {
	if err := check.NonNegative("profile: Scaled", "depth x", x, "cm"); err != nil {
		return 0, 0, err
	}
	if err := s.validate(); err != nil {
		return 0, 0, err
	}
	d, a, err := s.Profile.Dopants(s.inner(x))
	if err != nil {
		return 0, 0, fmt.Errorf("profile: Scaled: %w", err)
	}
	nd, na = s.Density*d, s.Density*a
	if err := checkDensity("profile: Scaled", "scaled donor density", nd); err != nil {
		return 0, 0, err
	}
	if err := checkDensity("profile: Scaled", "scaled acceptor density", na); err != nil {
		return 0, 0, err
	}
	return nd, na, nil
}

// Extent returns max(0, Shift + Stretch·Extent of the wrapped profile) in cm; 0 for invalid
// parameters.
func (s Scaled) Extent() float64 {
	if s.validate() != nil {
		return 0
	}
	return math.Max(0, s.outer(s.Profile.Extent()))
}

// String returns e.g. "Scaled(Erfc(donor 1e+20 cm^-3, L=1e-05 cm) × 1.1, depth × 1, shift 0 cm)".
func (s Scaled) String() string {
	return fmt.Sprintf("Scaled(%v × %g, depth × %g, shift %g cm)", s.Profile, s.Density, s.Stretch, s.Shift)
}

// mapDepths returns the wrapped profile's depths xs mapped to the scaled profile's depths,
// those beyond the surface only, with the kink at Shift when it lies inside the silicon.
func (s Scaled) mapDepths(xs []float64) []float64 {
	out := make([]float64, 0, len(xs)+1)
	if s.Shift > 0 {
		out = append(out, s.Shift)
	}
	for _, x := range xs {
		if y := s.outer(x); y >= 0 {
			out = append(out, y)
		}
	}
	return out
}
