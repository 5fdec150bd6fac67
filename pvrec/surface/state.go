package surface

import (
	"fmt"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/recomb"
)

// Every model of this package is evaluated at the quasi-neutral state of the wafer at the edge
// of the surface space-charge region, a recomb.State (from recomb.Bulk.State), to which Seff
// and J0s are referred. Assumptions shared by everything here: injection is uniform up to the
// space-charge region (Δn is the same for electrons and holes), and ni,eff does not vary
// across the space-charge region (it keeps its value at the region's edge).

// excess returns n p − ni,eff² of s in cm^-6 (the cancellation-free value recomb.Bulk.State
// computes), after checking that s is valid and injected: Δn > 0 and n p − ni,eff² > 0 (not
// positive only if a band-gap narrowing model raised ni,eff with injection faster than n p).
func excess(s recomb.State) (float64, error) {
	if err := s.Validate(); err != nil {
		return 0, fmt.Errorf("surface: %w", err)
	}
	if err := check.Positive("surface: state", "excess carrier density Δn", s.Dn, "cm^-3"); err != nil {
		return 0, err
	}
	if !(s.Excess > 0) {
		return 0, fmt.Errorf("surface: n p − ni,eff² = %g cm^-6 is not positive at Δn = %g cm^-3 (ni,eff = %g cm^-3)",
			s.Excess, s.Dn, s.NiEff)
	}
	return s.Excess, nil
}
