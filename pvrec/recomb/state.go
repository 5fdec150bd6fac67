package recomb

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// State is the quasi-neutral carrier state of uniformly doped silicon at one excess carrier
// density: the one value at which bulk mechanisms (Mechanism.Rate) and surface models
// (package surface) are evaluated, and from which implied voltages follow. Bulk.State fills
// it consistently; it is the way to build one. Densities are in cm^-3.
//
// A hand-made State must have Excess = N·P − NiEff²; the mechanisms use N, P and Excess as
// given, which is how detailed balance is guaranteed (the j0 solver relies on this: a
// mechanism's rate is Excess times a coefficient of the other fields). Off quasi-neutrality
// (inside a space-charge region) N and P need not equal N0 + Dn and P0 + Dn; the surface
// models and ImpliedVoc assume they do. Validate checks a hand-made State; every Rate calls it.
type State struct {
	T      float64 // temperature, K
	Vt     float64 // thermal voltage kT/q, V
	Nc, Nv float64 // effective densities of states, cm^-3
	Ni     float64 // intrinsic density without narrowing, cm^-3
	NdIon  float64 // ionised donor density, cm^-3
	NaIon  float64 // ionised acceptor density, cm^-3
	N0, P0 float64 // thermal-equilibrium electron and hole densities, cm^-3
	Dn     float64 // excess carrier density Δn = Δp, cm^-3
	N, P   float64 // electron and hole densities, cm^-3
	NiEff  float64 // effective intrinsic density at (N, P), cm^-3
	Excess float64 // N·P − NiEff², cm^-6, computed without cancellation (see Bulk.State)
}

// Validate returns an error naming the first field of s that is NaN, infinite or out of
// range: T finite, > 0 and at most the melting point of silicon; Vt = kT/q (to 1e-6
// relative, so a Vt typed to five digits passes); Nc, Nv, Ni and NiEff > 0; every density
// finite, >= 0 and at most the atomic density of silicon (5e22 cm^-3); Excess finite. It does not allocate when s is valid. The
// zero State is invalid.
func (s State) Validate() error {
	if err := check.Temperature("recomb: State", s.T); err != nil {
		return err
	}
	if vt := silicon.BoltzmannEV * s.T; !(math.Abs(s.Vt-vt) <= 1e-6*vt) {
		return fmt.Errorf("recomb: State: Vt = %g V must be kT/q = %g V at T = %g K", s.Vt, vt, s.T)
	}
	for _, f := range [...]struct {
		name string
		v    float64
	}{{"Nc", s.Nc}, {"Nv", s.Nv}, {"Ni", s.Ni}, {"NiEff", s.NiEff}} {
		if err := check.Positive("recomb: State", f.name, f.v, "cm^-3"); err != nil {
			return err
		}
		if err := check.Density("recomb: State", f.name, f.v); err != nil {
			return err
		}
	}
	for _, f := range [...]struct {
		name string
		v    float64
	}{{"NdIon", s.NdIon}, {"NaIon", s.NaIon}, {"N0", s.N0}, {"P0", s.P0}, {"Dn", s.Dn}, {"N", s.N}, {"P", s.P}} {
		if err := check.Density("recomb: State", f.name, f.v); err != nil {
			return err
		}
	}
	return check.Finite("recomb: State", "Excess (n p − ni,eff²)", s.Excess, "cm^-6")
}

// PType reports whether the state is p-type (P0 >= N0).
func (s State) PType() bool { return s.P0 >= s.N0 }

// ImpliedVoc returns the implied open-circuit voltage in V of the state, the separation of
// the quasi-Fermi levels,
//
//	q iVoc = kT ln(n p / ni,eff²),
//
// computed as Vt · log1p(Excess/NiEff²) so that it keeps full relative accuracy for small Δn
// (iVoc → 0 linearly as Δn → 0). Band-gap narrowing (also its injection dependence) and
// degeneracy enter through NiEff. It returns an error for an invalid state (see Validate).
func (s State) ImpliedVoc() (float64, error) {
	if err := s.Validate(); err != nil {
		return 0, err
	}
	return s.Vt * math.Log1p(s.Excess/(s.NiEff*s.NiEff)), nil
}
