package j0

import (
	"fmt"
	"math"
)

// Surface is a model of the front surface of a doped region: the surface recombination
// velocity S of minority carriers in cm/s as a function of the surface dopant density ns in
// cm^-3 (the density of the region's majority dopant at x = 0), so that the surface
// recombination current is q S Δn_min(0). S may be +Inf (an ohmic contact: Δn_min(0) = 0).
type Surface interface {
	Velocity(ns float64) (float64, error)
}

// FixedS is a surface recombination velocity in cm/s (>= 0, or +Inf for an ohmic contact)
// independent of the surface dopant density.
type FixedS float64

// Velocity returns s in cm/s, or an error if s is NaN or negative.
func (s FixedS) Velocity(ns float64) (float64, error) {
	if math.IsNaN(float64(s)) || s < 0 {
		return 0, fmt.Errorf("j0: FixedS: surface recombination velocity must be >= 0 cm/s (or +Inf), got %g", float64(s))
	}
	return float64(s), nil
}

// String returns e.g. "S=1000 cm/s".
func (s FixedS) String() string { return fmt.Sprintf("S=%g cm/s", float64(s)) }

// PowerLawS is a surface recombination velocity that grows as a power of the surface dopant
// density,
//
//	S(ns) = S1 · (ns / N1)^Exp,   capped at Max if Max > 0.
//
// This form is the package's own; DefaultSurface fills it with values of our own choosing.
type PowerLawS struct {
	S1  float64 // S at ns = N1, cm/s, finite and >= 0
	N1  float64 // reference surface density, cm^-3, finite and > 0
	Exp float64 // exponent, dimensionless, finite and >= 0
	Max float64 // upper limit of S, cm/s; 0 means none
}

// DefaultSurface returns the package's default front surface, PowerLawS{S1: 1e3 cm/s,
// N1: 1e19 cm^-3, Exp: 1}: S grows in proportion to the surface dopant density, 1e3 cm/s at
// 1e19 cm^-3 and 1e4 cm/s at 1e20 cm^-3. These numbers are OUR OWN CHOICE, not taken from or
// fitted to any paper: the order of magnitude of a well-passivated diffused surface as
// commonly quoted (common practice, no source). Replace them with a parameterisation fitted
// to your own passivation.
func DefaultSurface() PowerLawS { return PowerLawS{S1: 1e3, N1: 1e19, Exp: 1} }

// Velocity returns S(ns) in cm/s, or an error for an invalid ns or parameters.
func (p PowerLawS) Velocity(ns float64) (float64, error) {
	if math.IsNaN(ns) || math.IsInf(ns, 0) || ns < 0 {
		return 0, fmt.Errorf("j0: PowerLawS: surface density ns must be finite and >= 0 cm^-3, got %g", ns)
	}
	for _, f := range [...]struct {
		name, unit string
		v          float64
		pos        bool
	}{{"S1", "cm/s", p.S1, false}, {"N1", "cm^-3", p.N1, true}, {"Exp", "", p.Exp, false}, {"Max", "cm/s", p.Max, false}} {
		if math.IsNaN(f.v) || math.IsInf(f.v, 0) || f.v < 0 || (f.pos && f.v == 0) {
			return 0, fmt.Errorf("j0: PowerLawS: parameter %s = %g %s must be finite and >= 0 (N1 > 0)", f.name, f.v, f.unit)
		}
	}
	s := p.S1 * math.Pow(ns/p.N1, p.Exp)
	if p.Max > 0 && s > p.Max {
		s = p.Max
	}
	if math.IsInf(s, 0) {
		return 0, fmt.Errorf("j0: PowerLawS: S overflows at ns = %g cm^-3", ns)
	}
	return s, nil
}

// String returns e.g. "PowerLawS(1000 cm/s·(ns/1e+19 cm^-3)^1)".
func (p PowerLawS) String() string {
	s := fmt.Sprintf("PowerLawS(%g cm/s·(ns/%g cm^-3)^%g", p.S1, p.N1, p.Exp)
	if p.Max > 0 {
		s += fmt.Sprintf(", max %g cm/s", p.Max)
	}
	return s + ")"
}

// SurfaceFunc adapts a function of the surface dopant density ns (cm^-3) returning S in cm/s
// to the Surface interface.
type SurfaceFunc func(ns float64) (float64, error)

// Velocity returns f(ns).
func (f SurfaceFunc) Velocity(ns float64) (float64, error) { return f(ns) }

// String returns "SurfaceFunc".
func (SurfaceFunc) String() string { return "SurfaceFunc" }
