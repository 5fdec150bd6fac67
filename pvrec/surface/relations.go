package surface

import (
	"fmt"

	"github.com/pvrec/pvrec/pvrec/silicon"
)

// SeffFromJ0s returns the effective surface recombination velocity Seff in cm/s of a surface
// with surface saturation current density j0s (A/cm^2, finite, >= 0) at bulk state b:
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
func SeffFromJ0s(j0s float64, b Bulk) (float64, error) {
	if err := checkNonNeg("j0s", "A/cm^2", j0s); err != nil {
		return 0, err
	}
	x, err := b.npExcess()
	if err != nil {
		return 0, err
	}
	return j0s * x / (silicon.ElementaryCharge * b.NiEff * b.NiEff * b.Dn), nil
}

// J0sFromSeff returns the surface saturation current density J0s in A/cm^2 of a surface with
// effective surface recombination velocity seff (cm/s, finite, >= 0) at bulk state b, the
// inverse of SeffFromJ0s (same form and assumptions):
//
//	J0s = q Seff ni,eff² Δn / (n p − ni,eff²).
func J0sFromSeff(seff float64, b Bulk) (float64, error) {
	if err := checkNonNeg("seff", "cm/s", seff); err != nil {
		return 0, err
	}
	x, err := b.npExcess()
	if err != nil {
		return 0, err
	}
	return silicon.ElementaryCharge * seff * b.NiEff * b.NiEff * b.Dn / x, nil
}

// Model is a surface whose recombination is described by an effective surface recombination
// velocity at a bulk state: ConstantSeff, ConstantJ0s and ExtendedSRH implement it.
type Model interface {
	// Seff returns the effective surface recombination velocity in cm/s at bulk state b,
	// referred to the edge of the space-charge region.
	Seff(b Bulk) (float64, error)
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

// Seff returns m.S in cm/s after checking b and m.S.
func (m ConstantSeff) Seff(b Bulk) (float64, error) {
	if err := checkNonNeg("ConstantSeff.S", "cm/s", m.S); err != nil {
		return 0, err
	}
	if err := b.Validate(); err != nil {
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

// Seff returns SeffFromJ0s(m.J0s, b) in cm/s.
func (m ConstantJ0s) Seff(b Bulk) (float64, error) {
	if err := checkNonNeg("ConstantJ0s.J0s", "A/cm^2", m.J0s); err != nil {
		return 0, err
	}
	return SeffFromJ0s(m.J0s, b)
}
