package lifetime

import (
	"errors"
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/internal/roots"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// equilibriumPoint returns the equilibrium of b as the silicon.Point at which the mobility
// sum is evaluated (ionised dopants and equilibrium carriers).
func equilibriumPoint(b *recomb.Bulk) silicon.Point {
	eq := b.Equilibrium()
	return silicon.Point{T: b.Material().T(), Nd: eq.NdIon, Na: eq.NaIon, N: eq.N0, P: eq.P0}
}

// checkWafer returns an error for a missing wafer or an invalid thickness.
func checkWafer(ctx string, b *recomb.Bulk, w float64) error {
	if b == nil || b.Material() == nil {
		return fmt.Errorf("lifetime: %s: wafer is not set (build it with recomb.NewBulk)", ctx)
	}
	return check.Positive("lifetime: "+ctx, "thickness w", w, "cm")
}

// Conductance returns the excess sheet photoconductance in S of wafer b of thickness w in cm
// (finite, > 0) carrying the uniform excess carrier density dn in cm^-3 (finite,
// 0 <= dn <= recomb.MaxExcess):
//
//	Δσ W = q (μn + μp)(Δn) Δn W,
//
// with the mobility sum of the material's mobility model at the injected state
// (silicon.SumMobility; injection and doping dependent). This is the quantity an inductive
// or contact-free photoconductance measurement of a wafer yields, in siemens (the sheet
// conductance, σ times thickness). It returns an error for invalid arguments or an error of
// the mobility model.
func Conductance(b *recomb.Bulk, w, dn float64) (float64, error) {
	if err := checkWafer("Conductance", b, w); err != nil {
		return 0, err
	}
	if err := check.Density("lifetime: Conductance", "excess carrier density Δn", dn); err != nil {
		return 0, err
	}
	if dn > recomb.MaxExcess {
		return 0, check.Range("lifetime", "Conductance", "excess carrier density Δn", "cm^-3", dn, 0, recomb.MaxExcess)
	}
	mu, err := silicon.SumMobility(b.Material().Models().Mobility, equilibriumPoint(b), dn)
	if err != nil {
		return 0, fmt.Errorf("lifetime: Conductance: %w", err)
	}
	return silicon.ElementaryCharge * mu * dn * w, nil
}

// ExcessFromConductance returns the excess carrier density Δn in cm^-3 of wafer b of
// thickness w in cm (finite, > 0) with the excess sheet photoconductance sigma in S (finite,
// >= 0), the inverse of Conductance: the solution of
//
//	sigma = q (μn + μp)(Δn) Δn W
//
// self-consistent with the injection-dependent mobility sum of the material's mobility
// model. Method: Brent's method on ln Δn + ln(μn + μp)(Δn) = ln(sigma/(q W)), which
// increases with Δn for any mobility that falls more slowly than 1/Δn, bracketed outward from
// the low-injection estimate sigma/(q W (μn + μp)(0)), to a relative accuracy of about 1e-13
// in Δn. sigma = 0 gives 0. It returns an error for invalid arguments, a sigma that needs
// Δn outside [MinExcess, recomb.MaxExcess] (errors.Is(err, pvrec.ErrOutOfRange)), or an error
// of the mobility model.
func ExcessFromConductance(b *recomb.Bulk, w, sigma float64) (float64, error) {
	if err := checkWafer("ExcessFromConductance", b, w); err != nil {
		return 0, err
	}
	if err := check.NonNegative("lifetime: ExcessFromConductance", "photoconductance sigma", sigma, "S"); err != nil {
		return 0, err
	}
	if sigma == 0 {
		return 0, nil
	}
	mob, eq := b.Material().Models().Mobility, equilibriumPoint(b)
	y := math.Log(sigma / (silicon.ElementaryCharge * w))
	f := func(x float64) (float64, error) {
		mu, err := silicon.SumMobility(mob, eq, math.Exp(x))
		if err != nil {
			return 0, fmt.Errorf("lifetime: ExcessFromConductance: %w", err)
		}
		return x + math.Log(mu) - y, nil
	}
	mu0, err := silicon.SumMobility(mob, eq, 0)
	if err != nil {
		return 0, fmt.Errorf("lifetime: ExcessFromConductance: %w", err)
	}
	xmin, xmax := math.Log(MinExcess), math.Log(recomb.MaxExcess)
	x0 := y - math.Log(mu0)
	if !(x0 >= xmin && x0 <= xmax) {
		return 0, check.Rangef("ExcessFromConductance", "photoconductance sigma", sigma, math.NaN(), math.NaN(),
			"lifetime: ExcessFromConductance: photoconductance %g S in %g cm needs Δn = %.3g cm^-3, outside [%g, %g] cm^-3",
			sigma, w, math.Exp(x0), MinExcess, recomb.MaxExcess)
	}
	f0, err := f(x0)
	if err != nil {
		return 0, err
	}
	lo, hi, flo, fhi, err := roots.Bracket(f, x0, f0, 0.1, 2, xmin, xmax, true)
	if errors.Is(err, roots.ErrNoBracket) {
		return 0, check.Rangef("ExcessFromConductance", "photoconductance sigma", sigma, math.NaN(), math.NaN(),
			"lifetime: ExcessFromConductance: photoconductance %g S in %g cm needs Δn outside [%g, %g] cm^-3", sigma, w, MinExcess, recomb.MaxExcess)
	}
	if err != nil {
		return 0, err
	}
	x, err := roots.Solve(f, lo, hi, flo, fhi, 1e-14, 200)
	if err != nil {
		return 0, fmt.Errorf("lifetime: ExcessFromConductance: photoconductance %g S: %w", sigma, err)
	}
	return math.Exp(x), nil
}
