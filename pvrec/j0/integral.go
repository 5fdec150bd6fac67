package j0

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/integrate/quad"

	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Estimate is J0 of a region from one of the integral forms (Solver.Transparent and
// Solver.Gummel), with its breakdown. Currents are in A/cm^2.
type Estimate struct {
	J0         float64 // saturation current density, A/cm^2
	JSurface   float64 // part recombined at the front surface, A/cm^2
	JAuger     float64 // Auger part, A/cm^2
	JSRH       float64 // SRH part, A/cm^2
	JRadiative float64 // radiative part, A/cm^2
	Gummel     float64 // ∫ dx/(D_min n_min0) = ∫ N/(ni,eff² D) dx over the region, cm²·s
	Depth      float64 // far boundary, cm
}

// integralCellPoints is the number of Gauss–Legendre points per cell of the integral forms.
const integralCellPoints = 6

// integrals returns, over the region of st, ∫ c_m dx for each mechanism (cm^-2 s^-1, per unit
// u) and ∫ dx/a (cm² s), by 6-point Gauss–Legendre quadrature (nodes and weights from gonum
// integrate/quad) on each cell of a profile-adapted mesh (the initial mesh of Solve), and the
// local coefficients at the surface. Against 12 points on cells 16 times finer, the relative
// error is below 1e-11 for the recombination integrals and 1e-5 for the Gummel integral (whose
// integrand has the kinks of the mobility model) on the emitters of the tests.
func (st *setup) integrals(r Region) (c [nMech]float64, gummel float64, surf local, err error) {
	xs, err := initialMesh(r.Profile, st.w, st.step)
	if err != nil {
		return c, 0, local{}, err
	}
	if surf, err = st.ev.eval(0); err != nil {
		return c, 0, local{}, err
	}
	var nodes, weights [integralCellPoints]float64
	quad.Legendre{}.FixedLocations(nodes[:], weights[:], -1, 1)
	for i := 1; i < len(xs); i++ {
		mid, half := 0.5*(xs[i-1]+xs[i]), 0.5*(xs[i]-xs[i-1])
		for k, t := range nodes {
			l, err := st.ev.eval(mid + half*t)
			if err != nil {
				return c, 0, local{}, err
			}
			w := weights[k] * half
			for m := range c {
				c[m] += w * l.c[m]
			}
			gummel += w / l.a
		}
	}
	return c, gummel, surf, nil
}

// Transparent returns the transparent-region limit of J0 of region r: the minority-carrier
// excess is taken as uniform, u = 1 (n p = 2 ni,eff² everywhere, no transport limitation),
// so that J0 is the recombination integral in thermal-equilibrium densities plus the
// surface term,
//
//	J0 = q S n_min0(0) + q ∫_0^W R(u = 1) dx,   R(u = 1) = Σ_m R_m at n p − ni,eff² = n0 p0,
//
// the limit of Solve for a region much thinner than its diffusion lengths and a surface with
// S n_min0(0) ≪ (D n_min0/W) (common practice, no source; it follows from Solve's equations
// when a → ∞). It overestimates J0 otherwise. The integral is computed by 6-point
// Gauss–Legendre quadrature (gonum) on each cell of the profile-adapted initial mesh of
// Solve. It returns an error for S = +Inf (the limit is infinite), and the errors of Solve's
// set-up and of the models.
func (s Solver) Transparent(r Region) (Estimate, error) {
	st, err := s.prepare(r)
	if err != nil {
		return Estimate{}, err
	}
	if math.IsInf(st.s, 1) {
		return Estimate{}, fmt.Errorf("j0: Transparent: the transparent limit is infinite for S = +Inf (an ohmic contact)")
	}
	c, g, surf, err := st.integrals(r)
	if err != nil {
		return Estimate{}, err
	}
	q := silicon.ElementaryCharge
	e := Estimate{
		JSurface: q * st.s * surf.nmin, JAuger: q * c[mAuger], JSRH: q * c[mSRH], JRadiative: q * c[mRad],
		Gummel: g, Depth: st.w,
	}
	e.J0 = e.JSurface + e.JAuger + e.JSRH + e.JRadiative
	return e, nil
}

// Gummel returns J0 of region r from the transparent-emitter formula with the Gummel-number
// integral: without bulk recombination the minority-carrier flux is the same at every depth,
// and integrating a du/dx = F from the surface, where F = S n_min0(0) u(0), to the far
// boundary, where u = 1, gives
//
//	J0 = q / ( ∫_0^W N/(ni,eff² D) dx + N(0)/(ni,eff²(0) S) ),   N/ni,eff² = 1/n_min0,
//
// (the transparent-emitter model; reference from memory: M. A. Shibib, F. A. Lindholm and
// F. Therez, IEEE Trans. Electron Devices 26, 959 (1979)), with D the minority-carrier
// diffusivity and n_min0 from the material (band-gap narrowing and degeneracy). It is the
// limit of Solve without bulk recombination (Auger, SRH and radiative recombination in the
// region are neglected), so it underestimates J0 when the region's bulk recombines. The
// Gummel integral is computed as in Transparent; S = +Inf gives q/∫, S = 0 gives 0. It
// returns the errors of Solve's set-up and of the models.
func (s Solver) Gummel(r Region) (Estimate, error) {
	st, err := s.prepare(r)
	if err != nil {
		return Estimate{}, err
	}
	_, g, surf, err := st.integrals(r)
	if err != nil {
		return Estimate{}, err
	}
	den := g
	if !math.IsInf(st.s, 1) {
		den += 1 / (st.s * surf.nmin)
	}
	j := silicon.ElementaryCharge / den
	return Estimate{J0: j, JSurface: j, Gummel: g, Depth: st.w}, nil
}
