package cell

import (
	"errors"
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/internal/roots"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// ImpliedVoc returns the implied open-circuit voltage in V of the quasi-neutral bulk b at
// excess carrier density dn = Δn in cm^-3 (finite, >= 0),
//
//	q iVoc = kT ln(n p / ni,eff²),  n = n0 + Δn,  p = p0 + Δn,
//
// with ni,eff from b's material at (n, p), so band-gap narrowing (also its injection
// dependence) and degeneracy are included. It is recomb.State.ImpliedVoc of b.State(dn),
// which keeps full relative accuracy for small Δn (iVoc → 0 linearly as Δn → 0). It returns
// an error for a nil b, invalid dn (above recomb.MaxExcess included), or an error of the
// material (wrapped).
func ImpliedVoc(b *recomb.Bulk, dn float64) (float64, error) {
	if b == nil {
		return 0, fmt.Errorf("cell: ImpliedVoc: bulk b is nil")
	}
	if err := check.Density("cell: ImpliedVoc", "excess carrier density Δn", dn); err != nil {
		return 0, err
	}
	s, err := b.State(dn)
	if err != nil {
		return 0, fmt.Errorf("cell: ImpliedVoc: %w", err)
	}
	v, err := s.ImpliedVoc()
	if err != nil {
		return 0, fmt.Errorf("cell: ImpliedVoc: %w", err)
	}
	return v, nil
}

// ExcessFromImpliedVoc returns the excess carrier density Δn in cm^-3 at which the bulk b has
// implied open-circuit voltage voc in V (finite, >= 0), the inverse of ImpliedVoc; voc = 0
// gives Δn = 0.
//
// Method: when ni,eff does not depend on injection the inverse has the closed form
// Δn = 2c/(b + sqrt(b² + 4c)) with b = n0 + p0 and c = n0 p0 expm1(q voc/kT) (the stable root
// of Δn² + bΔn − c = 0). With injection-dependent band-gap narrowing this is the starting
// point: a bracket on ln Δn is grown geometrically from it until ImpliedVoc − voc changes
// sign, and the root is refined by Brent's method to a relative accuracy of about 1e-15 in
// Δn. It returns an error for a nil b, invalid voc, a voc that needs Δn > recomb.MaxExcess,
// or an error of the material.
func ExcessFromImpliedVoc(b *recomb.Bulk, voc float64) (float64, error) {
	if b == nil || b.Material() == nil {
		return 0, fmt.Errorf("cell: ExcessFromImpliedVoc: bulk b is nil or not built by recomb.NewBulk")
	}
	if math.IsNaN(voc) || math.IsInf(voc, 0) || voc < 0 {
		return 0, fmt.Errorf("cell: ExcessFromImpliedVoc: implied voltage voc must be finite and >= 0 V, got %g", voc)
	}
	if voc == 0 {
		return 0, nil
	}
	eq := b.Equilibrium()
	// f(x) = iVoc(e^x) − voc, increasing in x = ln Δn.
	f := func(x float64) (float64, error) {
		s, err := b.State(math.Exp(x))
		if err != nil {
			return 0, fmt.Errorf("cell: ExcessFromImpliedVoc: %w", err)
		}
		v, err := s.ImpliedVoc()
		if err != nil {
			return 0, fmt.Errorf("cell: ExcessFromImpliedVoc: %w", err)
		}
		return v - voc, nil
	}
	dn0 := nominalExcess(eq, b.Material().Vt(), voc)
	if dn0 > recomb.MaxExcess {
		return 0, fmt.Errorf("cell: ExcessFromImpliedVoc: voc = %g V needs Δn above recomb.MaxExcess = %g cm^-3", voc, recomb.MaxExcess)
	}
	if !(dn0 > 0) {
		return 0, fmt.Errorf("cell: ExcessFromImpliedVoc: voc = %g V gives Δn = %g cm^-3, not representable", voc, dn0)
	}
	xmax := math.Log(recomb.MaxExcess)
	x0 := math.Log(dn0)
	f0, err := f(x0)
	if err != nil {
		return 0, err
	}
	if f0 == 0 {
		return dn0, nil
	}
	// Bracket the root outward from the closed-form start in steps of 1e-3 in ln Δn, doubled
	// each time (the start is usually within a few kT of the answer).
	lo, hi, flo, fhi, err := roots.Bracket(f, x0, f0, 1e-3, 2, math.Log(math.SmallestNonzeroFloat64), xmax, true)
	if errors.Is(err, roots.ErrNoBracket) {
		return 0, fmt.Errorf("cell: ExcessFromImpliedVoc: voc = %g V needs Δn above recomb.MaxExcess = %g cm^-3 (%v)", voc, recomb.MaxExcess, err)
	}
	if err != nil {
		return 0, err
	}
	if flo == 0 {
		return math.Exp(lo), nil
	}
	if fhi == 0 {
		return math.Exp(hi), nil
	}
	// Brent's method on [lo, hi] in x = ln Δn; f rises by kT/q to 2kT/q per unit of x, so an
	// absolute tolerance of 1e-15 in x is as accurate as Δn can be represented.
	x, err := roots.Brent(f, lo, hi, flo, fhi, 1e-15, 200)
	if err != nil {
		return 0, fmt.Errorf("cell: ExcessFromImpliedVoc: voc = %g V: %w", voc, err)
	}
	return math.Exp(x), nil
}

// nominalExcess returns the excess carrier density in cm^-3 at which a bulk with equilibrium
// densities eq.N0, eq.P0 would have implied voltage v in V (>= 0) if ni,eff did not depend on
// injection: the stable root Δn = 2c/(b + sqrt(b² + 4c)) of Δn² + bΔn − c = 0, b = n0 + p0,
// c = n0 p0 expm1(v/vt). It returns +Inf when c overflows.
func nominalExcess(eq silicon.Equilibrium, vt, v float64) float64 {
	bb := eq.N0 + eq.P0
	c := eq.N0 * eq.P0 * math.Expm1(v/vt)
	if math.IsInf(c, 1) {
		return math.Inf(1)
	}
	return 2 * c / (bb + math.Sqrt(bb*bb+4*c))
}

// nominalVoltage is the inverse of nominalExcess: vt ln(1 + Δn (n0 + p0 + Δn)/(n0 p0)) in V.
func nominalVoltage(eq silicon.Equilibrium, vt, dn float64) float64 {
	return vt * math.Log1p(dn*(eq.N0+eq.P0+dn)/(eq.N0*eq.P0))
}

// IdealDiodeVoc returns the open-circuit voltage in V of an ideal diode with saturation
// current density j0 in A/cm^2 (finite, > 0), short-circuit current density jsc in A/cm^2
// (finite, >= 0) and ideality factor ideality (finite, > 0; 1 for an ideal diode) in
// material m, at m's temperature:
//
//	Voc = n_id (kT/q) ln(1 + Jsc/J0),
//
// computed with log1p so that small Jsc/J0 keeps full accuracy. A junction cannot separate
// its quasi-Fermi levels by more than the band gap, so a Voc at or above m.Eg() (Jsc/J0 absurdly
// large) is an error, not a number. It returns an error for a nil m or invalid arguments.
func IdealDiodeVoc(j0, jsc, ideality float64, m *silicon.Material) (float64, error) {
	if m == nil {
		return 0, fmt.Errorf("cell: IdealDiodeVoc: material m is nil")
	}
	if err := check.Positive("cell: IdealDiodeVoc", "saturation current density j0", j0, "A/cm^2"); err != nil {
		return 0, err
	}
	if err := check.NonNegative("cell: IdealDiodeVoc", "short-circuit current density jsc", jsc, "A/cm^2"); err != nil {
		return 0, err
	}
	if err := check.Positive("cell: IdealDiodeVoc", "ideality factor", ideality, ""); err != nil {
		return 0, err
	}
	v := ideality * m.Vt() * math.Log1p(jsc/j0)
	if !(v < m.Eg()) {
		return 0, fmt.Errorf("cell: IdealDiodeVoc: Jsc/J0 = %g/%g A/cm^2 gives Voc = %g V, not below the band gap %.4g eV: no junction reaches it",
			jsc, j0, v, m.Eg())
	}
	return v, nil
}

// J0FromVoc returns the saturation current density J0 in A/cm^2 of an ideal diode with
// open-circuit voltage voc in V (finite, 0 < voc < m.Eg()), short-circuit current density
// jsc in A/cm^2 (finite, > 0) and ideality factor ideality (finite, > 0) in material m, at
// m's temperature, the inverse of IdealDiodeVoc:
//
//	J0 = Jsc / (exp(q Voc/(n_id kT)) − 1),
//
// computed with expm1. It returns an error for a nil m, invalid arguments or a J0 that
// underflows to 0.
func J0FromVoc(voc, jsc, ideality float64, m *silicon.Material) (float64, error) {
	if m == nil {
		return 0, fmt.Errorf("cell: J0FromVoc: material m is nil")
	}
	if err := check.Positive("cell: J0FromVoc", "open-circuit voltage voc", voc, "V"); err != nil {
		return 0, err
	}
	if !(voc < m.Eg()) {
		return 0, fmt.Errorf("cell: J0FromVoc: open-circuit voltage voc = %g V must be below the band gap %.4g eV", voc, m.Eg())
	}
	if err := check.Positive("cell: J0FromVoc", "short-circuit current density jsc", jsc, "A/cm^2"); err != nil {
		return 0, err
	}
	if err := check.Positive("cell: J0FromVoc", "ideality factor", ideality, ""); err != nil {
		return 0, err
	}
	j0 := jsc / math.Expm1(voc/(ideality*m.Vt()))
	if err := check.Result("cell: J0FromVoc", "J0", j0, "A/cm^2"); err != nil {
		return 0, err
	}
	if !(j0 > 0) {
		return 0, fmt.Errorf("cell: J0FromVoc: J0 underflows for voc = %g V, ideality %g at T = %g K", voc, ideality, m.T())
	}
	return j0, nil
}

// IdealDiodeFF returns the fill factor (dimensionless) of an ideal diode without series or
// shunt resistance, J = Jsc − J0 (exp(qV/(n_id kT)) − 1), with open-circuit voltage voc in V
// (finite, 0 < voc < m.Eg()) and ideality factor ideality (finite, > 0) in material m, at m's
// temperature. With v = V/(n_id kT/q), the maximum-power voltage solves
//
//	(1 + v_mp) exp(v_mp) = exp(v_oc)   (v_mp = W(e^(v_oc+1)) − 1, W the Lambert function),
//
// and FF = v_mp (1 − expm1(v_mp)/expm1(v_oc))/v_oc (the exact single-diode fill factor, e.g.
// M. A. Green, Solar Cells: Operating Principles, Technology and System Applications,
// Prentice-Hall 1982). v_mp is found by Brent's method on v + ln(1 + v) = v_oc in (0, v_oc), to
// rounding. It returns an error for a nil m or invalid arguments.
func IdealDiodeFF(voc, ideality float64, m *silicon.Material) (float64, error) {
	if m == nil {
		return 0, fmt.Errorf("cell: IdealDiodeFF: material m is nil")
	}
	if err := check.Positive("cell: IdealDiodeFF", "open-circuit voltage voc", voc, "V"); err != nil {
		return 0, err
	}
	if !(voc < m.Eg()) {
		return 0, fmt.Errorf("cell: IdealDiodeFF: open-circuit voltage voc = %g V must be below the band gap %.4g eV", voc, m.Eg())
	}
	if err := check.Positive("cell: IdealDiodeFF", "ideality factor", ideality, ""); err != nil {
		return 0, err
	}
	u := voc / (ideality * m.Vt())
	f := func(v float64) (float64, error) { return v + math.Log1p(v) - u, nil }
	vm, err := roots.Brent(f, 0, u, -u, math.Log1p(u), 0, maxBrentI)
	if err != nil {
		return 0, check.NoConvergence("cell: IdealDiodeFF: voc = %g V: %v", voc, err)
	}
	return vm * (1 - math.Expm1(vm)/math.Expm1(u)) / u, nil
}
