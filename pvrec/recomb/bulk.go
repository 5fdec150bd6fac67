package recomb

import (
	"errors"
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Material is what the bulk mechanisms need from the material model set at one temperature.
// *silicon.Material, returned by silicon.ModelSet.At, satisfies it; tests may supply a fake.
//
// NiEff takes ionised dopant densities, as silicon.Material.NiEff documents; Equilibrium takes
// dopant densities and reports the ionised ones.
type Material interface {
	T() float64  // temperature, K
	Vt() float64 // thermal voltage kT/q, V
	Nc() float64 // conduction-band effective density of states, cm^-3
	Nv() float64 // valence-band effective density of states, cm^-3
	Ni() float64 // intrinsic density without narrowing, cm^-3
	// NiEff returns ni,eff in cm^-3 at free-carrier densities n, p and ionised dopant
	// densities nd, na (cm^-3).
	NiEff(n, p, nd, na float64) (float64, error)
	// Equilibrium returns the thermal-equilibrium state for dopant densities nd, na (cm^-3).
	Equilibrium(nd, na float64) (silicon.Equilibrium, error)
}

var _ Material = (*silicon.Material)(nil)

// Bulk is uniformly doped silicon at one temperature: a Material, its dopant densities and its
// thermal equilibrium, computed once by NewBulk. Its State method gives the carrier state at
// an excess carrier density Δn, at which every BulkRecombination is evaluated. A Bulk is
// immutable and safe for concurrent use if its Material is (as *silicon.Material is).
type Bulk struct {
	mat    Material
	nd, na float64             // dopant densities, cm^-3
	eq     silicon.Equilibrium // thermal equilibrium
	nie0   float64             // mat.NiEff at equilibrium, the reference of injection-dependent ni,eff
	n0p0   float64             // N0·P0 = ni,eff² in equilibrium, cm^-6
}

// NewBulk returns the Bulk of material m with donor density nd and acceptor density na in
// cm^-3 (finite, >= 0; compensation allowed). It returns an error for a nil m, invalid
// densities, or an error of the material's equilibrium solver (wrapped).
func NewBulk(m Material, nd, na float64) (*Bulk, error) {
	if m == nil {
		return nil, fmt.Errorf("recomb: NewBulk: material m is nil")
	}
	if err := checkDensity("donor density nd", nd); err != nil {
		return nil, err
	}
	if err := checkDensity("acceptor density na", na); err != nil {
		return nil, err
	}
	eq, err := m.Equilibrium(nd, na)
	if err != nil {
		return nil, fmt.Errorf("recomb: NewBulk: %w", err)
	}
	nie0, err := m.NiEff(eq.N0, eq.P0, eq.NdIon, eq.NaIon)
	if err != nil {
		return nil, fmt.Errorf("recomb: NewBulk: %w", err)
	}
	n0p0 := eq.N0 * eq.P0
	if !(n0p0 > 0) || math.IsInf(n0p0, 0) || !(nie0 > 0) || math.IsInf(nie0, 0) {
		return nil, fmt.Errorf("recomb: NewBulk: equilibrium n0 = %g, p0 = %g cm^-3, ni,eff = %g cm^-3 not usable", eq.N0, eq.P0, nie0)
	}
	return &Bulk{mat: m, nd: nd, na: na, eq: eq, nie0: nie0, n0p0: n0p0}, nil
}

// Material returns the material of b.
func (b *Bulk) Material() Material { return b.mat }

// Dopants returns the donor and acceptor densities of b in cm^-3, as given to NewBulk.
func (b *Bulk) Dopants() (nd, na float64) { return b.nd, b.na }

// Equilibrium returns the thermal-equilibrium state of b.
func (b *Bulk) Equilibrium() silicon.Equilibrium { return b.eq }

// State returns the carrier state of b at excess carrier density dn = Δn in cm^-3 (finite,
// >= 0) in quasi-neutrality: n = n0 + Δn, p = p0 + Δn, with ni,eff evaluated by the material
// at (n, p), so that injection-dependent band-gap narrowing (Schenk's) and carrier degeneracy
// enter.
//
// Precision near equilibrium. The driving term n p − ni,eff² is never formed as a difference
// of the two large products. With q = ni,eff(n, p)/ni,eff(n0, p0), the ratio of two values of
// the same function of the material, and ni,eff² := n0 p0 q² (which equals the material's
// ni,eff² up to the equilibrium solver's tolerance, and is exactly n0 p0 at Δn = 0),
//
//	n p − ni,eff² = Δn (n0 + p0 + Δn) − n0 p0 (q − 1)(q + 1).
//
// Without injection dependence q = 1 exactly and the excess is the first term, accurate to
// rounding for any Δn; with it, q − 1 carries an absolute error of a few 1e-16 from rounding,
// which is negligible beside Δn (n0 + p0) for the Δn >= 1e8 cm^-3 of interest. State.NiEff
// is the equilibrium ni,eff times q.
//
// It returns an error for invalid dn, an error of the material (wrapped) or a non-finite state.
func (b *Bulk) State(dn float64) (State, error) {
	if err := checkDensity("excess carrier density Δn", dn); err != nil {
		return State{}, err
	}
	eq := b.eq
	n, p := eq.N0+dn, eq.P0+dn
	nie, err := b.mat.NiEff(n, p, eq.NdIon, eq.NaIon)
	if err != nil {
		return State{}, fmt.Errorf("recomb: State(Δn = %g cm^-3): %w", dn, err)
	}
	q := nie / b.nie0
	excess := dn*(eq.N0+eq.P0+dn) - b.n0p0*((q-1)*(q+1))
	s := State{
		T: b.mat.T(), Vt: b.mat.Vt(),
		Nc: b.mat.Nc(), Nv: b.mat.Nv(), Ni: b.mat.Ni(),
		NdIon: eq.NdIon, NaIon: eq.NaIon,
		N0: eq.N0, P0: eq.P0, Dn: dn, N: n, P: p,
		NiEff:  eq.NiEff * q,
		Excess: excess,
	}
	if math.IsNaN(excess) || math.IsInf(excess, 0) || !(s.NiEff > 0) || math.IsInf(s.NiEff, 0) {
		return State{}, fmt.Errorf("recomb: State(Δn = %g cm^-3): non-finite state (n p − ni,eff² = %g, ni,eff = %g)", dn, excess, s.NiEff)
	}
	return s, nil
}

// Lifetime returns the lifetime τ = Δn/R in s of mechanism m in b at excess carrier density
// dn in cm^-3 (finite, > 0). See the package function Lifetime for special cases.
func (b *Bulk) Lifetime(m BulkRecombination, dn float64) (float64, error) {
	s, err := b.State(dn)
	if err != nil {
		return 0, err
	}
	return Lifetime(m, s)
}

// Lifetimes returns the lifetimes τ = Δn/R in s of mechanism m in b at each excess carrier
// density of dn (cm^-3, each finite and > 0), in a new slice. It stops at the first error.
func (b *Bulk) Lifetimes(m BulkRecombination, dn []float64) ([]float64, error) {
	out := make([]float64, len(dn))
	for i, d := range dn {
		tau, err := b.Lifetime(m, d)
		if err != nil {
			return nil, fmt.Errorf("%w (point %d)", err, i)
		}
		out[i] = tau
	}
	return out, nil
}

// State is the local carrier state at which a BulkRecombination is evaluated. Bulk.State
// fills it consistently; a hand-made State must satisfy N = N0 + Dn, P = P0 + Dn and
// Excess = N·P − NiEff² (the mechanisms use Excess as given, which is how detailed balance
// is guaranteed). Densities are in cm^-3.
type State struct {
	T      float64 // temperature, K
	Vt     float64 // thermal voltage kT/q, V
	Nc, Nv float64 // effective densities of states, cm^-3
	Ni     float64 // intrinsic density without narrowing, cm^-3
	NdIon  float64 // ionised donor density, cm^-3
	NaIon  float64 // ionised acceptor density, cm^-3
	N0, P0 float64 // thermal-equilibrium electron and hole densities, cm^-3
	Dn     float64 // excess carrier density Δn, cm^-3
	N, P   float64 // electron and hole densities, cm^-3
	NiEff  float64 // effective intrinsic density at (N, P), cm^-3
	Excess float64 // N·P − NiEff², cm^-6, computed without cancellation (see Bulk.State)
}

// check returns an error naming the first field of s, among those every mechanism uses, that
// is NaN, infinite or out of range.
func (s State) check() error {
	if math.IsNaN(s.T) || math.IsInf(s.T, 0) || s.T <= 0 {
		return fmt.Errorf("recomb: State temperature T must be finite and > 0 K, got %g", s.T)
	}
	for _, f := range [...]struct {
		name string
		v    float64
	}{{"N0", s.N0}, {"P0", s.P0}, {"Dn", s.Dn}, {"N", s.N}, {"P", s.P}} {
		if math.IsNaN(f.v) || math.IsInf(f.v, 0) || f.v < 0 {
			return fmt.Errorf("recomb: State density %s must be finite and >= 0 cm^-3, got %g", f.name, f.v)
		}
	}
	if math.IsNaN(s.Excess) || math.IsInf(s.Excess, 0) {
		return fmt.Errorf("recomb: State Excess (n p − ni,eff²) must be finite, got %g", s.Excess)
	}
	return nil
}

// checkDensity returns an error unless v is a finite, non-negative density in cm^-3.
func checkDensity(name string, v float64) error {
	if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
		return fmt.Errorf("recomb: %s must be finite and >= 0 cm^-3, got %g", name, v)
	}
	return nil
}

// checkPositive returns an error unless v is finite and > 0.
func checkPositive(what, name string, v float64, unit string) error {
	if math.IsNaN(v) || math.IsInf(v, 0) || v <= 0 {
		return fmt.Errorf("recomb: %s: %s must be finite and > 0 %s, got %g", what, name, unit, v)
	}
	return nil
}

// checkNonNegative returns an error unless v is finite and >= 0.
func checkNonNegative(what, name string, v float64, unit string) error {
	if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
		return fmt.Errorf("recomb: %s: %s must be finite and >= 0 %s, got %g", what, name, unit, v)
	}
	return nil
}

// ErrOutOfRange is reported (through errors.Is) by every error of this package for an
// argument outside a model's validity range, as opposed to an argument that is invalid for any
// model (NaN, infinite, negative density, T <= 0).
var ErrOutOfRange = errors.New("recomb: argument outside the model's validity range")

// rangeError is an error outside a validity range; errors.Is(err, ErrOutOfRange) is true.
type rangeError struct{ msg string }

func (e *rangeError) Error() string        { return e.msg }
func (e *rangeError) Is(target error) bool { return target == ErrOutOfRange }

// outOfRange returns a rangeError with a formatted message (which must start with "recomb: ").
func outOfRange(format string, a ...any) error {
	return &rangeError{msg: fmt.Sprintf(format, a...)}
}

// checkWindow returns an error unless tmin <= t <= tmax (the model's temperature window).
func checkWindow(model string, t, tmin, tmax float64) error {
	if !(t >= tmin && t <= tmax) {
		return outOfRange("recomb: %s: temperature T = %g K outside the model's window [%g, %g] K", model, t, tmin, tmax)
	}
	return nil
}
