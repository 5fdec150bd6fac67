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

// MinExcess is the smallest excess carrier density, in cm^-3, that SteadyStateExcess searches:
// below it a steady state is of no practical interest and lifetimes lose meaning. The top of
// the search is recomb.MaxExcess.
const MinExcess = 1e-6

// GenerationRate returns the volume-averaged generation rate in cm^-3 s^-1 of a wafer of
// thickness w in cm (finite, > 0) that collects the photogenerated current density jph in
// A/cm^2 (finite, >= 0): G = Jph/(q W). This is the usual link between a one-sun-like current
// (about 0.04 A/cm^2 for silicon; common practice, no source) and the steady-state excess
// carrier density of a lifetime sample under uniform generation.
func GenerationRate(jph, w float64) (float64, error) {
	if err := check.NonNegative("lifetime: GenerationRate", "current density jph", jph, "A/cm^2"); err != nil {
		return 0, err
	}
	if err := check.Positive("lifetime: GenerationRate", "thickness w", w, "cm"); err != nil {
		return 0, err
	}
	g := jph / (silicon.ElementaryCharge * w)
	if err := check.Result("lifetime: GenerationRate", "G", g, "cm^-3 s^-1"); err != nil {
		return 0, err
	}
	return g, nil
}

// SteadyStateExcess returns the excess carrier density Δn in cm^-3 at which recombination
// balances the generation rate g in cm^-3 s^-1 (finite, >= 0):
//
//	Δn / τ(Δn) = g,
//
// where tau returns the effective lifetime in s at Δn (bulk, surfaces, or both, e.g.
// func(dn float64) (float64, error) { return bulk.Lifetime(m, dn) }). The balance is solved
// in ln Δn by Brent's method within [MinExcess, recomb.MaxExcess] cm^-3, assuming the recombination
// rate Δn/τ(Δn) increases with Δn (true of every mechanism in recomb and surface; if it does
// not, the root returned is one of several). It returns 0 for g = 0, and an error naming g
// if the balance lies outside the searched range or tau fails or returns a non-positive or
// non-finite lifetime.
func SteadyStateExcess(g float64, tau func(dn float64) (float64, error)) (float64, error) {
	if math.IsNaN(g) || math.IsInf(g, 0) || g < 0 {
		return 0, fmt.Errorf("lifetime: SteadyStateExcess: generation rate g must be finite and >= 0 cm^-3 s^-1, got %g", g)
	}
	if tau == nil {
		return 0, fmt.Errorf("lifetime: SteadyStateExcess: lifetime function tau is nil")
	}
	if g == 0 {
		return 0, nil
	}
	// f(x) = ln(R(e^x)/g) with R = Δn/τ, increasing in x.
	f := func(x float64) (float64, error) {
		dn := math.Exp(x)
		t, err := tau(dn)
		if err != nil {
			return 0, fmt.Errorf("lifetime: SteadyStateExcess: at Δn = %g cm^-3: %w", dn, err)
		}
		if math.IsNaN(t) || math.IsInf(t, 0) || t <= 0 {
			return 0, fmt.Errorf("lifetime: SteadyStateExcess: lifetime %g s at Δn = %g cm^-3 must be finite and > 0", t, dn)
		}
		return x - math.Log(t) - math.Log(g), nil
	}
	// Bracket the balance by decades outward from Δn = 1e15 cm^-3 (a typical reporting
	// level), so that tau is evaluated only near the answer and never far outside a lifetime
	// model's own validity range unless the answer lies there.
	xmin, xmax := math.Log(MinExcess), math.Log(recomb.MaxExcess)
	x0 := math.Log(1e15)
	f0, err := f(x0)
	if err != nil {
		return 0, err
	}
	lo, hi, flo, fhi, err := roots.Bracket(f, x0, f0, math.Ln10, 1, xmin, xmax, true)
	if errors.Is(err, roots.ErrNoBracket) {
		where := fmt.Sprintf("above Δn = %g cm^-3", recomb.MaxExcess)
		if f0 > 0 {
			where = fmt.Sprintf("below Δn = %g cm^-3", MinExcess)
		}
		return 0, fmt.Errorf("lifetime: SteadyStateExcess: g = %g cm^-3 s^-1 balances %s", g, where)
	}
	if err != nil {
		return 0, err
	}
	x, err := roots.Solve(f, lo, hi, flo, fhi, 1e-13, 300)
	if err != nil {
		return 0, fmt.Errorf("lifetime: SteadyStateExcess: g = %g cm^-3 s^-1: %w", g, err)
	}
	return math.Exp(x), nil
}
