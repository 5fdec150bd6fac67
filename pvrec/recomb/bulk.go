package recomb

import (
	"errors"
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// MaxExcess is the largest excess carrier density, in cm^-3, of a Bulk's states: far above
// any injection a silicon device reaches (the top of the range over which pvrec is tested;
// common practice, no source). Bulk.State returns a range error above it, and the inversions
// of the lifetime and cell packages search no higher.
const MaxExcess = 1e21

var errZeroBulk = errors.New("recomb: Bulk is not initialised (build it with NewBulk)")

// Bulk is uniformly doped silicon at one temperature: a material, its dopant densities and
// its thermal equilibrium, computed once by NewBulk. It is the one description of a wafer in
// pvrec: its State method gives the quasi-neutral carrier state at an excess carrier density
// Δn, at which every Mechanism (package recomb) and every surface model (package surface) is
// evaluated, and which the lifetime and cell packages build on. A Bulk is immutable and safe
// for concurrent use. The zero Bulk is not usable: its methods return an error.
type Bulk struct {
	mat    *silicon.Material
	nd, na float64             // dopant densities, cm^-3
	eq     silicon.Equilibrium // thermal equilibrium
	nie0   float64             // mat.NiEff at equilibrium, the reference of injection-dependent ni,eff
	n0p0   float64             // N0·P0 = ni,eff² in equilibrium, cm^-6
}

// NewBulk returns the Bulk of material m with donor density nd and acceptor density na in
// cm^-3 (finite, >= 0; compensation allowed). It returns an error for a nil m, invalid
// densities, or an error of the material's equilibrium solver (wrapped).
func NewBulk(m *silicon.Material, nd, na float64) (*Bulk, error) {
	if m == nil {
		return nil, fmt.Errorf("recomb: NewBulk: material m is nil")
	}
	if err := check.Density("recomb: NewBulk", "donor density nd", nd); err != nil {
		return nil, err
	}
	if err := check.Density("recomb: NewBulk", "acceptor density na", na); err != nil {
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

// Material returns the material of b (nil for the zero Bulk).
func (b *Bulk) Material() *silicon.Material {
	if b == nil {
		return nil
	}
	return b.mat
}

// Dopants returns the donor and acceptor densities of b in cm^-3, as given to NewBulk (0, 0
// for the zero Bulk).
func (b *Bulk) Dopants() (nd, na float64) {
	if b == nil {
		return 0, 0
	}
	return b.nd, b.na
}

// Equilibrium returns the thermal-equilibrium state of b (the zero value for the zero Bulk).
func (b *Bulk) Equilibrium() silicon.Equilibrium {
	if b == nil {
		return silicon.Equilibrium{}
	}
	return b.eq
}

// State returns the carrier state of b at excess carrier density dn = Δn in cm^-3 (finite,
// 0 <= dn <= MaxExcess) in quasi-neutrality: n = n0 + Δn, p = p0 + Δn, with ni,eff evaluated by the material
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
	if b == nil || b.mat == nil {
		return State{}, errZeroBulk
	}
	if err := check.Density("recomb: State", "excess carrier density Δn", dn); err != nil {
		return State{}, err
	}
	if dn > MaxExcess {
		return State{}, check.Range("recomb", "Bulk.State", "excess carrier density Δn", "cm^-3", dn, 0, MaxExcess)
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
func (b *Bulk) Lifetime(m Mechanism, dn float64) (float64, error) {
	s, err := b.State(dn)
	if err != nil {
		return 0, err
	}
	return Lifetime(m, s)
}

// Lifetimes returns the lifetimes τ = Δn/R in s of mechanism m in b at each excess carrier
// density of dn (cm^-3, each finite and > 0), in a new slice. It stops at the first error.
func (b *Bulk) Lifetimes(m Mechanism, dn []float64) ([]float64, error) {
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
