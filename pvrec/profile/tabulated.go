package profile

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/interp"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Tabulated is a measured profile of one dopant, such as a SIMS or ECV profile: densities
// at increasing depths, interpolated linearly in the logarithm of the density (so that an
// exponential tail between two points is reproduced exactly), with gonum's
// interp.PiecewiseLinear. Above the first depth and beyond the last one the density holds its
// value at that end. Noisy and non-monotonic densities are taken as they are: no smoothing.
// Add a background with Sum; the junction then lies where the tabulated density first falls
// below the background (see JunctionDepth).
//
// Build one with NewTabulated, or read one with ReadCSV and Measured.Profile. A Tabulated is
// immutable and safe for concurrent use.
type Tabulated struct {
	dopant  silicon.Dopant
	depth   []float64 // cm, strictly increasing
	density []float64 // cm^-3, > 0
	logN    interp.PiecewiseLinear
}

// NewTabulated returns the Tabulated profile of dopant d with densities density (cm^-3,
// finite and > 0) at depths depth (cm, finite, >= 0, strictly increasing; at least two).
// The slices are copied. It returns an error naming the first offending row (0-based).
func NewTabulated(d silicon.Dopant, depth, density []float64) (*Tabulated, error) {
	if d != silicon.Donor && d != silicon.Acceptor {
		return nil, fmt.Errorf("profile: NewTabulated: dopant d must be silicon.Donor or silicon.Acceptor, got %d", d)
	}
	if len(depth) != len(density) {
		return nil, fmt.Errorf("profile: NewTabulated: %d depths but %d densities", len(depth), len(density))
	}
	if len(depth) < 2 {
		return nil, fmt.Errorf("profile: NewTabulated: %d rows, want at least 2", len(depth))
	}
	t := &Tabulated{
		dopant:  d,
		depth:   append([]float64(nil), depth...),
		density: append([]float64(nil), density...),
	}
	logs := make([]float64, len(density))
	for i := range depth {
		x, n := depth[i], density[i]
		if math.IsNaN(x) || math.IsInf(x, 0) || x < 0 {
			return nil, fmt.Errorf("profile: NewTabulated: row %d: depth must be finite and >= 0 cm, got %g", i, x)
		}
		if i > 0 && !(x > depth[i-1]) {
			return nil, fmt.Errorf("profile: NewTabulated: row %d: depth must increase (%g cm after %g cm)", i, x, depth[i-1])
		}
		if math.IsNaN(n) || math.IsInf(n, 0) || n <= 0 {
			return nil, fmt.Errorf("profile: NewTabulated: row %d: density must be finite and > 0 cm^-3, got %g", i, n)
		}
		logs[i] = math.Log(n)
	}
	if err := t.logN.Fit(t.depth, logs); err != nil {
		return nil, fmt.Errorf("profile: NewTabulated: %w", err)
	}
	return t, nil
}

// Dopant returns the dopant type of t.
func (t *Tabulated) Dopant() silicon.Dopant { return t.dopant }

// Data returns copies of the tabulated depths (cm) and densities (cm^-3).
func (t *Tabulated) Data() (depth, density []float64) {
	return append([]float64(nil), t.depth...), append([]float64(nil), t.density...)
}

// Density returns the interpolated density in cm^-3 at depth x in cm (see Tabulated), or an
// error for an invalid x.
func (t *Tabulated) Density(x float64) (float64, error) {
	if err := check.NonNegative("profile: Tabulated", "depth x", x, "cm"); err != nil {
		return 0, err
	}
	n := len(t.depth)
	switch {
	case x <= t.depth[0]:
		return t.density[0], nil
	case x >= t.depth[n-1]:
		return t.density[n-1], nil
	}
	return math.Exp(t.logN.Predict(x)), nil
}

// Dopants returns the interpolated density in cm^-3 at depth x in cm as donor or acceptor
// density, or an error for an invalid x.
func (t *Tabulated) Dopants(x float64) (nd, na float64, err error) {
	v, err := t.Density(x)
	if err != nil {
		return 0, 0, err
	}
	return split("Tabulated", t.dopant, v)
}

// Extent returns the last tabulated depth in cm.
func (t *Tabulated) Extent() float64 { return t.depth[len(t.depth)-1] }

// String returns e.g. "Tabulated(donor, 120 rows to 1.2e-04 cm)".
func (t *Tabulated) String() string {
	return fmt.Sprintf("Tabulated(%v, %d rows to %.3g cm)", t.dopant, len(t.depth), t.Extent())
}
