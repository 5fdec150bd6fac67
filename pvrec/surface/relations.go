package surface

import (
	"fmt"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// SeffFromJ0s returns the effective surface recombination velocity Seff in cm/s of a surface
// with surface saturation current density j0s (A/cm^2, finite, >= 0) at the quasi-neutral bulk state s:
//
//	Seff = J0s (n p − ni,eff²) / (q ni,eff² Δn),   n = n0 + Δn, p = p0 + Δn,
//
// which for an injection-independent ni,eff is Seff = J0s (n0 + p0 + Δn) / (q ni,eff²).
// With the minority equilibrium density neglected it is the relation
// Seff = J0s (N + Δn)/(q ni²) of A. Cuevas and D. Macdonald, "Measuring and interpreting the
// lifetime of silicon wafers", Solar Energy 76, 255 (2004).
//
// Form and assumptions. Both quantities are referred to the edge of the surface space-charge
// region, as discussed by K. R. McIntosh and L. E. Black, "On effective surface recombination
// parameters", J. Appl. Phys. 116, 014503 (2014): Seff = Us/Δn and J0s = q Us ni,eff²/(n p −
// ni,eff²), with Us the surface recombination rate (cm^-2 s^-1), n p the product at that edge
// and ni,eff the bulk value there (attribution of this form to that paper from memory). The
// relation is then exact for any Us; J0s is independent of Δn only for a surface whose Us is
// proportional to n p − ni,eff² (an inverted or strongly accumulated surface in low injection,
// or a diffused region).
func SeffFromJ0s(j0s float64, s recomb.State) (float64, error) {
	if err := check.NonNegative("surface: SeffFromJ0s", "j0s", j0s, "A/cm^2"); err != nil {
		return 0, err
	}
	x, err := excess(s)
	if err != nil {
		return 0, err
	}
	v := j0s * x / (silicon.ElementaryCharge * s.NiEff * s.NiEff * s.Dn)
	if err := check.Result("surface: SeffFromJ0s", "Seff", v, "cm/s"); err != nil {
		return 0, err
	}
	return v, nil
}

// J0sFromSeff returns the surface saturation current density J0s in A/cm^2 of a surface with
// effective surface recombination velocity seff (cm/s, finite, >= 0) at the quasi-neutral state s, the
// inverse of SeffFromJ0s (same form and assumptions):
//
//	J0s = q Seff ni,eff² Δn / (n p − ni,eff²).
func J0sFromSeff(seff float64, s recomb.State) (float64, error) {
	if err := check.NonNegative("surface: J0sFromSeff", "seff", seff, "cm/s"); err != nil {
		return 0, err
	}
	x, err := excess(s)
	if err != nil {
		return 0, err
	}
	v := silicon.ElementaryCharge * seff * s.NiEff * s.NiEff * s.Dn / x
	if err := check.Result("surface: J0sFromSeff", "J0s", v, "A/cm^2"); err != nil {
		return 0, err
	}
	return v, nil
}

// Model is a surface whose recombination is described by an effective surface recombination
// velocity at the quasi-neutral state of the wafer next to it (a recomb.State, the one wafer
// state of pvrec): ConstantSeff, ConstantJ0s and ExtendedSRH implement it. To use a Model as
// the front surface of a diffused region in the J0 solver, see j0.ModelSurface.
type Model interface {
	// Seff returns the effective surface recombination velocity in cm/s at the quasi-neutral
	// bulk state s (from recomb.Bulk.State),
	// referred to the edge of the space-charge region.
	Seff(s recomb.State) (float64, error)
	// String returns a short name of the model and its parameters.
	String() string
}

// ConstantSeff is a surface with an injection-independent effective surface recombination
// velocity S in cm/s (finite, >= 0). It is a description, not a published model.
type ConstantSeff struct {
	S float64 // effective surface recombination velocity, cm/s
}

// String returns e.g. "ConstantSeff(10 cm/s)".
func (m ConstantSeff) String() string { return fmt.Sprintf("ConstantSeff(%g cm/s)", m.S) }

// Seff returns m.S in cm/s after checking s and m.S.
func (m ConstantSeff) Seff(s recomb.State) (float64, error) {
	if err := check.NonNegative("surface", "ConstantSeff.S", m.S, "cm/s"); err != nil {
		return 0, err
	}
	if _, err := excess(s); err != nil {
		return 0, err
	}
	return m.S, nil
}

// ConstantJ0s is a surface with an injection-independent surface saturation current density
// J0s in A/cm^2 (finite, >= 0), the usual description of a diffused or inverted surface. Its
// Seff follows from SeffFromJ0s and rises with Δn. A description, not a published model.
type ConstantJ0s struct {
	J0s float64 // surface saturation current density, A/cm^2
}

// String returns e.g. "ConstantJ0s(1e-14 A/cm^2)".
func (m ConstantJ0s) String() string { return fmt.Sprintf("ConstantJ0s(%g A/cm^2)", m.J0s) }

// Seff returns SeffFromJ0s(m.J0s, s) in cm/s.
func (m ConstantJ0s) Seff(s recomb.State) (float64, error) {
	if err := check.NonNegative("surface", "ConstantJ0s.J0s", m.J0s, "A/cm^2"); err != nil {
		return 0, err
	}
	return SeffFromJ0s(m.J0s, s)
}
