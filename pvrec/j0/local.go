package j0

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/profile"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Mechanism indices of the recombination breakdown.
const (
	mAuger = iota
	mSRH
	mRad
	nMech
)

// local holds the low-injection transport and recombination coefficients of the region at
// one depth, in the variable u = Δn_min/n_min0 (the normalised minority excess):
//
//	flux toward the surface  F = a du/dx,       a = D_min n_min0        (cm^-1 s^-1)
//	recombination rate       R = c u,           c = Σ_m R_m(Excess = n0 p0)  (cm^-3 s^-1)
type local struct {
	x     float64        // depth, cm
	nmin  float64        // equilibrium minority-carrier density n_min0, cm^-3
	d     float64        // minority-carrier diffusivity, cm²/s
	a     float64        // D_min · n_min0, cm^-1 s^-1
	c     [nMech]float64 // recombination rate per unit u of each mechanism, cm^-3 s^-1
	ct    float64        // Σ c, cm^-3 s^-1
	kappa float64        // ct / a, cm^-2 (1/L² of the local diffusion length)
}

// evaluator computes local coefficients of one region.
type evaluator struct {
	m     Models
	p     profile.Profile
	maj   silicon.Dopant
	mech  [nMech]recomb.Mechanism
	state recomb.State // template with the material's constants
	evals int          // number of local evaluations (for the Result)
}

func newEvaluator(m Models, p profile.Profile, maj silicon.Dopant) *evaluator {
	mat := m.Material
	return &evaluator{
		m: m, p: p, maj: maj,
		mech:  [nMech]recomb.Mechanism{m.Auger, m.SRH, m.Radiative},
		state: recomb.State{T: mat.T(), Vt: mat.Vt(), Nc: mat.Nc(), Nv: mat.Nv(), Ni: mat.Ni()},
	}
}

// eval returns the local coefficients at depth x.
//
// Low injection: the majority carriers stay at their equilibrium density n_maj0 and the
// minority density is n_min0 (1 + u), so that n p − ni,eff² = n0 p0 u exactly. Every bulk
// mechanism is proportional to n p − ni,eff² (recomb.Mechanism) with a coefficient
// evaluated at the carrier densities; in the limit of low injection these are n0 and p0.
// The coefficient c = R/u is therefore the mechanism's rate at the equilibrium state with
// Excess set to n0 p0 (u = 1) and Δn = 0.
//
// The minority carriers are non-degenerate, so that their current is q μ n_min0 kT/q du/dx
// exactly (drift in the effective fields of doping, narrowing and majority degeneracy
// included through n_min0(x)), with D = μ kT/q.
func (e *evaluator) eval(x float64) (local, error) {
	e.evals++
	nd, na, err := e.p.Dopants(x)
	if err != nil {
		return local{}, fmt.Errorf("j0: at depth %g cm: %w", x, err)
	}
	eq, err := e.m.Material.Equilibrium(nd, na)
	if err != nil {
		return local{}, fmt.Errorf("j0: at depth %g cm: %w", x, err)
	}
	mun, mup, err := e.m.mobility().Mobilities(silicon.Point{T: e.state.T, Nd: eq.NdIon, Na: eq.NaIon, N: eq.N0, P: eq.P0})
	if err != nil {
		return local{}, fmt.Errorf("j0: at depth %g cm: %w", x, err)
	}
	l := local{x: x}
	var mu float64
	if e.maj == silicon.Donor {
		if !(eq.N0 > eq.P0) {
			return local{}, fmt.Errorf("j0: at depth %g cm the region is not n-type (n0 = %g, p0 = %g cm^-3): the far boundary lies beyond the junction", x, eq.N0, eq.P0)
		}
		l.nmin, mu = eq.P0, mup
	} else {
		if !(eq.P0 > eq.N0) {
			return local{}, fmt.Errorf("j0: at depth %g cm the region is not p-type (n0 = %g, p0 = %g cm^-3): the far boundary lies beyond the junction", x, eq.N0, eq.P0)
		}
		l.nmin, mu = eq.N0, mun
	}
	l.d = mu * e.state.Vt
	l.a = l.d * l.nmin
	s := e.state
	s.NdIon, s.NaIon = eq.NdIon, eq.NaIon
	s.N0, s.P0, s.N, s.P, s.Dn = eq.N0, eq.P0, eq.N0, eq.P0, 0
	s.NiEff = eq.NiEff
	s.Excess = eq.N0 * eq.P0
	for k, m := range e.mech {
		if m == nil {
			continue
		}
		r, err := m.Rate(s)
		if err != nil {
			return local{}, fmt.Errorf("j0: at depth %g cm: %w", x, err)
		}
		if !(r >= 0) || math.IsInf(r, 0) {
			return local{}, fmt.Errorf("j0: at depth %g cm: %v gives a recombination rate %g cm^-3 s^-1 in low injection; want finite and >= 0", x, m, r)
		}
		l.c[k] = r
		l.ct += r
	}
	if !(l.a > 0) || math.IsInf(l.a, 0) || !(l.nmin > 0) {
		return local{}, fmt.Errorf("j0: at depth %g cm: minority density %g cm^-3 and diffusivity %g cm²/s not usable", x, l.nmin, l.d)
	}
	l.kappa = l.ct / l.a
	return l, nil
}
