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
// immutable and safe for concurrent use: NewTabulated copies the data in and Data copies them
// out. A zero Tabulated (or a nil *Tabulated) holds no data: Density and Dopants return an
// error, Extent returns 0 and Data nil.
//
// Cost: an evaluation takes a binary search, O(log n) in the n rows; JunctionDepth, Dose and
// SheetOf visit every row, so their cost grows linearly. For a million rows (some 50 MB with
// the CSV reader's data), measured on one core: JunctionDepth 0.05 s, Dose 1.5 s, SheetOf 5 s,
// SheetResistance on the arrays 10 s.
type Tabulated struct {
	dopant  silicon.Dopant
	depth   []float64 // cm, strictly increasing
	density []float64 // cm^-3, > 0
	logN    interp.PiecewiseLinear
}

// NewTabulated returns the Tabulated profile of dopant d with densities density (cm^-3,
// finite, > 0 and at most silicon.AtomDensity) at depths depth (cm, finite, >= 0, at most
// MaxDepthCm, strictly increasing; at least two). The slices are copied. It returns an error
// naming the first offending row (0-based).
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
		if x > MaxDepthCm {
			return nil, check.Rangef("NewTabulated", "depth", x, 0, MaxDepthCm,
				"profile: NewTabulated: row %d: depth %g cm beyond MaxDepthCm = %g cm", i, x, MaxDepthCm)
		}
		if i > 0 && !(x > depth[i-1]) {
			return nil, fmt.Errorf("profile: NewTabulated: row %d: depth must increase (%g cm after %g cm)", i, x, depth[i-1])
		}
		if math.IsNaN(n) || math.IsInf(n, 0) || n <= 0 {
			return nil, fmt.Errorf("profile: NewTabulated: row %d: density must be finite and > 0 cm^-3, got %g", i, n)
		}
		if n > silicon.AtomDensity {
			return nil, check.Rangef("NewTabulated", "density", n, 0, silicon.AtomDensity,
				"profile: NewTabulated: row %d: density %g cm^-3 above the silicon atom density %g cm^-3", i, n, silicon.AtomDensity)
		}
		logs[i] = math.Log(n)
	}
	if err := t.logN.Fit(t.depth, logs); err != nil {
		return nil, fmt.Errorf("profile: NewTabulated: %w", err)
	}
	return t, nil
}

// empty reports whether t holds no data (a zero or nil Tabulated).
func (t *Tabulated) empty() bool { return t == nil || len(t.depth) < 2 }

// Dopant returns the dopant type of t (0 for a zero Tabulated).
func (t *Tabulated) Dopant() silicon.Dopant {
	if t == nil {
		return 0
	}
	return t.dopant
}

// Data returns copies of the tabulated depths (cm) and densities (cm^-3); nil for a zero
// Tabulated.
func (t *Tabulated) Data() (depth, density []float64) {
	if t.empty() {
		return nil, nil
	}
	return append([]float64(nil), t.depth...), append([]float64(nil), t.density...)
}

// Density returns the interpolated density in cm^-3 at depth x in cm (see Tabulated), or an
// error for an invalid x or a zero Tabulated.
func (t *Tabulated) Density(x float64) (float64, error) {
	if t.empty() {
		return 0, fmt.Errorf("profile: Tabulated: no data (a zero value); build one with NewTabulated")
	}
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

// Extent returns the last tabulated depth in cm (0 for a zero Tabulated).
func (t *Tabulated) Extent() float64 {
	if t.empty() {
		return 0
	}
	return t.depth[len(t.depth)-1]
}

// String returns e.g. "Tabulated(donor, 120 rows to 1.2e-04 cm)".
func (t *Tabulated) String() string {
	if t.empty() {
		return "Tabulated(no data)"
	}
	return fmt.Sprintf("Tabulated(%v, %d rows to %.3g cm)", t.dopant, len(t.depth), t.Extent())
}
