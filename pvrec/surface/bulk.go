package surface

import (
	"errors"
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Physical constants from gonum.org/v1/gonum/unit/constant.

// ErrOutOfRange is reported (through errors.Is) by every error of this package for an
// argument outside a model's validity range, as opposed to an argument that is invalid for
// any model (NaN, infinite, negative).
var ErrOutOfRange = errors.New("surface: argument outside the model's validity range")

// ErrNoConvergence is reported (through errors.Is) when a root finder of this package could
// not meet its tolerance; the result is then withheld rather than returned inaccurate.
var ErrNoConvergence = errors.New("surface: solver did not converge")

// Bulk is the quasi-neutral state of the wafer at the edge of the surface space-charge
// region, to which Seff and J0s are referred: equilibrium densities, excess density and the
// effective intrinsic densities. Build it with NewBulk from a *silicon.Material; a literal is
// valid too for hand calculations if N0·P0 = NiEff0² and all fields are set.
//
// Assumptions shared by everything in this package: injection is uniform up to the
// space-charge region (Δn is the same for electrons and holes), and ni,eff does not vary
// across the space-charge region (it keeps its value at the region's edge).
type Bulk struct {
	Nd, Na float64 // ionised donor and acceptor densities, cm^-3
	N0, P0 float64 // equilibrium electron and hole densities, cm^-3
	Dn     float64 // excess carrier density Δn = Δp, cm^-3 (> 0)
	NiEff0 float64 // effective intrinsic density in equilibrium, sqrt(N0 P0), cm^-3
	NiEff  float64 // effective intrinsic density at the injected state (n0+Δn, p0+Δn), cm^-3
	Vt     float64 // thermal voltage kT/q, V
	Nc, Nv float64 // effective densities of states, cm^-3 (set the band edges for the Dit integral)
}

// NewBulk returns the bulk state of silicon m with donor and acceptor densities nd and na
// (cm^-3, finite, >= 0, compensation allowed) at excess carrier density dn (cm^-3, finite,
// > 0). The equilibrium densities come from m.Equilibrium (the material's statistics,
// ionisation and band-gap narrowing); NiEff is m.NiEff at (n0+Δn, p0+Δn), so that
// carrier-dependent band-gap narrowing is included at the injected state.
func NewBulk(m *silicon.Material, nd, na, dn float64) (Bulk, error) {
	if m == nil {
		return Bulk{}, fmt.Errorf("surface: material m is nil")
	}
	if err := checkNonNeg("nd", "cm^-3", nd); err != nil {
		return Bulk{}, err
	}
	if err := checkNonNeg("na", "cm^-3", na); err != nil {
		return Bulk{}, err
	}
	if err := checkPos("dn", "cm^-3", dn); err != nil {
		return Bulk{}, err
	}
	eq, err := m.Equilibrium(nd, na)
	if err != nil {
		return Bulk{}, fmt.Errorf("surface: bulk equilibrium: %w", err)
	}
	nie, err := m.NiEff(eq.N0+dn, eq.P0+dn, eq.NdIon, eq.NaIon)
	if err != nil {
		return Bulk{}, fmt.Errorf("surface: bulk ni,eff at Δn = %g cm^-3: %w", dn, err)
	}
	b := Bulk{
		Nd: eq.NdIon, Na: eq.NaIon, N0: eq.N0, P0: eq.P0, Dn: dn,
		NiEff0: eq.NiEff, NiEff: nie, Vt: m.Vt(), Nc: m.Nc(), Nv: m.Nv(),
	}
	if _, err := b.npExcess(); err != nil {
		return Bulk{}, err
	}
	return b, nil
}

// Validate returns an error naming the first field of b that is NaN, infinite, negative, or
// zero where a positive value is needed.
func (b Bulk) Validate() error {
	for _, f := range [...]struct {
		name, unit string
		v          float64
		pos        bool
	}{
		{"Bulk.Nd", "cm^-3", b.Nd, false}, {"Bulk.Na", "cm^-3", b.Na, false},
		{"Bulk.N0", "cm^-3", b.N0, true}, {"Bulk.P0", "cm^-3", b.P0, true},
		{"Bulk.Dn", "cm^-3", b.Dn, true}, {"Bulk.NiEff0", "cm^-3", b.NiEff0, true},
		{"Bulk.NiEff", "cm^-3", b.NiEff, true}, {"Bulk.Vt", "V", b.Vt, true},
		{"Bulk.Nc", "cm^-3", b.Nc, true}, {"Bulk.Nv", "cm^-3", b.Nv, true},
	} {
		var err error
		if f.pos {
			err = checkPos(f.name, f.unit, f.v)
		} else {
			err = checkNonNeg(f.name, f.unit, f.v)
		}
		if err != nil {
			return err
		}
	}
	return nil
}

// N returns the electron density n0 + Δn at the edge of the space-charge region, cm^-3.
func (b Bulk) N() float64 { return b.N0 + b.Dn }

// P returns the hole density p0 + Δn at the edge of the space-charge region, cm^-3.
func (b Bulk) P() float64 { return b.P0 + b.Dn }

// PType reports whether the wafer is p-type (p0 >= n0).
func (b Bulk) PType() bool { return b.P0 >= b.N0 }

// npExcess returns n p − ni,eff² at the edge of the space-charge region, cm^-6, computed as
// Δn (n0 + p0 + Δn) + (ni,eff0 − ni,eff)(ni,eff0 + ni,eff) so that it keeps full relative
// accuracy at small Δn. It returns an error if b is invalid or the product is not positive
// (possible only if the BGN model raises ni,eff with injection faster than n p grows).
func (b Bulk) npExcess() (float64, error) {
	if err := b.Validate(); err != nil {
		return 0, err
	}
	x := b.Dn*(b.N0+b.P0+b.Dn) + (b.NiEff0-b.NiEff)*(b.NiEff0+b.NiEff)
	if !(x > 0) || math.IsInf(x, 0) {
		return 0, fmt.Errorf("surface: n p − ni,eff² = %g cm^-6 is not positive and finite at Δn = %g cm^-3 (ni,eff0 = %g, ni,eff = %g cm^-3)",
			x, b.Dn, b.NiEff0, b.NiEff)
	}
	return x, nil
}

// checkNonNeg returns an error unless v is finite and >= 0.
func checkNonNeg(name, unit string, v float64) error {
	if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
		return fmt.Errorf("surface: %s must be finite and >= 0 %s, got %g", name, unit, v)
	}
	return nil
}

// checkPos returns an error unless v is finite and > 0.
func checkPos(name, unit string, v float64) error {
	if math.IsNaN(v) || math.IsInf(v, 0) || !(v > 0) {
		return fmt.Errorf("surface: %s must be finite and > 0 %s, got %g", name, unit, v)
	}
	return nil
}

// checkFinite returns an error unless v is finite.
func checkFinite(name, unit string, v float64) error {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return fmt.Errorf("surface: %s must be finite %s, got %g", name, unit, v)
	}
	return nil
}

// rangeError returns an error wrapping ErrOutOfRange.
func rangeError(model, arg, unit string, v, lo, hi float64) error {
	return fmt.Errorf("surface: %s: %s = %g %s outside validity range [%g, %g] %s: %w",
		model, arg, v, unit, lo, hi, unit, ErrOutOfRange)
}
