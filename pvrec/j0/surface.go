package j0

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/surface"
)

// Surface is a model of the front surface of a doped region: the surface recombination
// velocity S of minority carriers in cm/s as a function of the surface dopant density ns in
// cm^-3 (the density of the region's majority dopant at x = 0), so that the surface
// recombination current is q S Δn_min(0). S may be +Inf (an ohmic contact: Δn_min(0) = 0).
// A passivation model of package surface becomes a Surface through ModelSurface.
type Surface interface {
	Velocity(ns float64) (float64, error)
}

// FixedS is a surface recombination velocity in cm/s (>= 0, or +Inf for an ohmic contact)
// independent of the surface dopant density.
type FixedS float64

// Velocity returns s in cm/s (+Inf for an ohmic contact), or an error if s is NaN, negative
// or finite beyond check.MaxMagnitude.
func (s FixedS) Velocity(ns float64) (float64, error) {
	if err := check.NonNegativeOrInf("j0: FixedS", "surface recombination velocity", float64(s), "cm/s"); err != nil {
		return 0, err
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
	}{{"S1", "cm/s", p.S1}, {"Exp", "", p.Exp}, {"Max", "cm/s", p.Max}} {
		if err := check.NonNegative("j0: PowerLawS parameter", f.name, f.v, f.unit); err != nil {
			return 0, err
		}
	}
	if err := check.Positive("j0: PowerLawS parameter", "N1", p.N1, "cm^-3"); err != nil {
		return 0, err
	}
	s := p.S1 * math.Pow(ns/p.N1, p.Exp)
	if p.Max > 0 && s > p.Max {
		s = p.Max
	}
	if math.IsNaN(s) || math.IsInf(s, 0) || s > check.MaxMagnitude {
		return 0, check.Result("j0: PowerLawS", fmt.Sprintf("S at ns = %g cm^-3", ns), s, "cm/s")
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

// Velocity returns f(ns) in cm/s (+Inf allowed, an ohmic contact), or an error for a nil f,
// an error of f, or a value of f that is NaN, negative or finite beyond check.MaxMagnitude.
func (f SurfaceFunc) Velocity(ns float64) (float64, error) {
	if f == nil {
		return 0, fmt.Errorf("j0: SurfaceFunc is nil")
	}
	v, err := f(ns)
	if err != nil {
		return 0, err
	}
	if err := check.NonNegativeOrInf("j0: SurfaceFunc", fmt.Sprintf("S(ns = %g cm^-3)", ns), v, "cm/s"); err != nil {
		return 0, err
	}
	return v, nil
}

// String returns "SurfaceFunc".
func (SurfaceFunc) String() string { return "SurfaceFunc" }

// LowInjection is the ratio Δn/ns at which ModelSurface evaluates its surface model: the
// minority carriers at the surface of a diffused region are in low injection, and every
// surface.Model's Seff is independent of Δn there (common practice, no source).
const LowInjection = 1e-6

// ModelSurface adapts a passivation model of package surface (an Seff at the quasi-neutral
// state of the silicon next to the surface) to the front Surface of a J0 region:
//
//	Velocity(ns) = Model.Seff(state of silicon uniformly doped with Dopant at ns, Δn = LowInjection·ns),
//
// the minority-carrier surface recombination velocity that the J0 solver multiplies with the
// minority excess density at x = 0. Material is the region's material (the solver's
// Models.Material), Dopant the region's majority dopant at the surface (silicon.Donor for an
// n+ emitter).
//
// Where this is physically meaningful, and where it is not:
//   - surface.ConstantSeff is S itself at any ns: always meaningful, and the same as FixedS.
//   - surface.ConstantJ0s gives S = J0s (ns + Δn)/(q ni,eff²(ns)), the Seff of a J0s referred to
//     the surface of the heavily doped region: meaningful where the J0s was measured on that
//     doping, not a J0s measured on a lightly doped wafer.
//   - surface.ExtendedSRH holds only for a non-degenerate surface (ns <= surface.MaxDopant =
//     1e18 cm^-3, Boltzmann statistics in the space-charge region) and returns an error
//     (pvrec.ErrOutOfRange) above it, that is for most diffused emitters; and its Dit, σ and Qf,
//     fitted on lifetime samples, describe a diffused surface only if the dielectric and the
//     surface preparation are the same. It serves lightly doped surface fields and floating
//     junctions, and comparisons; for a heavily doped surface use a FixedS or PowerLawS
//     fitted to your own diffused samples.
//
// Velocity builds the wafer state on every call (an equilibrium solve); the solvers call it
// once per region. The zero ModelSurface returns an error.
type ModelSurface struct {
	Model    surface.Model     // passivation model
	Material *silicon.Material // material of the region
	Dopant   silicon.Dopant    // majority dopant of the region at the surface
}

// Velocity returns the Seff of m.Model in cm/s at the low-injection state of silicon doped
// with m.Dopant at ns (cm^-3, finite, > 0), or an error for a nil Model or Material, an
// invalid ns or Dopant, or an error of the model (wrapped).
func (m ModelSurface) Velocity(ns float64) (float64, error) {
	if m.Model == nil || m.Material == nil {
		return 0, fmt.Errorf("j0: ModelSurface: Model and Material must both be set")
	}
	if err := check.Positive("j0: ModelSurface", "surface dopant density ns", ns, "cm^-3"); err != nil {
		return 0, err
	}
	var nd, na float64
	switch m.Dopant {
	case silicon.Donor:
		nd = ns
	case silicon.Acceptor:
		na = ns
	default:
		return 0, fmt.Errorf("j0: ModelSurface: Dopant must be silicon.Donor or silicon.Acceptor, got %v", m.Dopant)
	}
	b, err := recomb.NewBulk(m.Material, nd, na)
	if err != nil {
		return 0, fmt.Errorf("j0: ModelSurface: %w", err)
	}
	s, err := b.State(LowInjection * ns)
	if err != nil {
		return 0, fmt.Errorf("j0: ModelSurface: %w", err)
	}
	v, err := m.Model.Seff(s)
	if err != nil {
		return 0, fmt.Errorf("j0: ModelSurface %v at ns = %g cm^-3: %w", m.Model, ns, err)
	}
	return v, nil
}

// String returns e.g. "ModelSurface(ConstantSeff(10 cm/s))".
func (m ModelSurface) String() string {
	if m.Model == nil {
		return "ModelSurface(<nil>)"
	}
	return "ModelSurface(" + m.Model.String() + ")"
}
