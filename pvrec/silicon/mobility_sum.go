package silicon

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/interp"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// SumMobility returns μn + μp in cm²/(V·s) of a wafer in equilibrium state eq (temperature,
// ionised dopants and equilibrium carrier densities n0 = eq.N, p0 = eq.P) carrying the excess
// carrier density dn in cm^-3 (Δn = Δp, quasi-neutral): the mobilities of mob at
// Point{eq.T, eq.Nd, eq.Na, n0 + Δn, p0 + Δn}. This is the factor relating photoconductance to
// Δn, Δσ = q Δn (μn + μp) W. It returns an error for an invalid eq (see Point.Validate), dn
// not finite and >= 0, carrier densities above AtomDensity, an error of mob, or mobilities
// not finite and > 0.
func SumMobility(mob Mobility, eq Point, dn float64) (float64, error) {
	if mob == nil {
		return 0, fmt.Errorf("silicon: SumMobility needs a non-nil Mobility")
	}
	if err := eq.Validate(); err != nil {
		return 0, err
	}
	if err := check.Density("silicon: SumMobility", "excess carrier density dn", dn); err != nil {
		return 0, err
	}
	pt := eq
	pt.N += dn
	pt.P += dn
	if err := checkAtoms("density N + dn", pt.N); err != nil {
		return 0, err
	}
	if err := checkAtoms("density P + dn", pt.P); err != nil {
		return 0, err
	}
	mun, mup, err := mob.Mobilities(pt)
	if err != nil {
		return 0, err
	}
	if err := checkMobilityResult(modelName(mob), pt, mun, mup); err != nil {
		return 0, err
	}
	return mun + mup, nil
}

// SumMobility returns μn + μp in cm²/(V·s) of the material's mobility model (its ModelSet's
// Mobility) at its temperature, for silicon with donor and acceptor densities nd and na in
// cm^-3 (finite, >= 0) in thermal equilibrium carrying the excess carrier density dn in cm^-3
// (Δn = Δp, quasi-neutral, finite, >= 0): the package function SumMobility at the ionised
// dopant and carrier densities of m.Equilibrium(nd, na). Each call solves the equilibrium
// (about a microsecond); for many Δn of one wafer use m.SumMobilityTable. It returns an error
// of Equilibrium, for an invalid dn, or an error of the mobility model.
func (m *Material) SumMobility(nd, na, dn float64) (float64, error) {
	if err := m.ready("Material.SumMobility"); err != nil {
		return 0, err
	}
	eq, err := m.equilibriumPoint(nd, na)
	if err != nil {
		return 0, err
	}
	return SumMobility(m.ms.Mobility, eq, dn)
}

// SumMobilityTable returns the SumMobilityTable of m.SumMobility(nd, na, Δn) for
// dnMin <= Δn <= dnMax (cm^-3) to relative tolerance relTol: NewSumMobilityTable with the
// material's mobility model at the equilibrium state of m.Equilibrium(nd, na). It returns the
// errors of Equilibrium and NewSumMobilityTable.
func (m *Material) SumMobilityTable(nd, na, dnMin, dnMax, relTol float64) (*SumMobilityTable, error) {
	if err := m.ready("Material.SumMobilityTable"); err != nil {
		return nil, err
	}
	eq, err := m.equilibriumPoint(nd, na)
	if err != nil {
		return nil, err
	}
	return NewSumMobilityTable(m.ms.Mobility, eq, dnMin, dnMax, relTol)
}

// equilibriumPoint returns the Point of silicon with dopant densities nd, na (cm^-3) in
// thermal equilibrium at the material's temperature: ionised dopants and n0, p0.
func (m *Material) equilibriumPoint(nd, na float64) (Point, error) {
	eq, err := m.Equilibrium(nd, na)
	if err != nil {
		return Point{}, err
	}
	return Point{T: m.t, Nd: eq.NdIon, Na: eq.NaIon, N: eq.N0, P: eq.P0}, nil
}

// SumMobilities evaluates SumMobility at each excess carrier density of dn (cm^-3) and returns
// the results in cm²/(V·s), stored in dst if it has the length of dn (otherwise in a new
// slice). It costs one evaluation of mob per point; for repeated use on one wafer a
// SumMobilityTable is much cheaper. On error it returns the error of the first failing point.
func SumMobilities(mob Mobility, eq Point, dn, dst []float64) ([]float64, error) {
	if len(dst) != len(dn) {
		dst = make([]float64, len(dn))
	}
	for i, d := range dn {
		s, err := SumMobility(mob, eq, d)
		if err != nil {
			return nil, fmt.Errorf("silicon: SumMobilities: dn[%d]: %w", i, err)
		}
		dst[i] = s
	}
	return dst, nil
}

// SumMobilityTable is SumMobility of one wafer tabulated against ln Δn on a range [dnMin, dnMax] and
// interpolated by a not-a-knot cubic spline (gonum.org/v1/gonum/interp.NotAKnotCubic), for
// analyses that need μn + μp at thousands of excess carrier densities. NewSumMobilityTable
// refines the grid until the interpolation error, checked against direct evaluation at every
// interval midpoint, is below the requested tolerance. A table is immutable and safe for
// concurrent use. Only NewSumMobilityTable (or Material.SumMobilityTable) makes a usable
// table: on a zero or nil table, At and Eval return an error.
type SumMobilityTable struct {
	model        string
	eq           Point
	dnMin, dnMax float64
	lnMin, lnMax float64
	relErr       float64 // largest relative error found at the midpoints
	nodes        int
	spline       interp.NotAKnotCubic
}

// Limits of the table construction.
const (
	sumTableStartPerDecade = 8    // initial grid density, nodes per decade of Δn
	sumTableMaxPerDecade   = 1024 // give up beyond this density
	sumTableDefaultTol     = 1e-6 // relative tolerance when the caller passes 0
)

// NewSumMobilityTable tabulates SumMobility(mob, eq, Δn) for dnMin <= Δn <= dnMax (cm^-3,
// 0 < dnMin < dnMax, finite) to within relative tolerance relTol (1e-12 <= relTol <= 0.01; 0
// selects 1e-6), starting at 8 nodes per decade and doubling until the largest relative error
// at the interval midpoints is below relTol. The error between midpoints of a smooth curve is
// of the same order. It returns an error for invalid arguments, an error of mob, or if
// 1024 nodes per decade do not reach relTol (a curve that is not smooth in ln Δn).
func NewSumMobilityTable(mob Mobility, eq Point, dnMin, dnMax, relTol float64) (*SumMobilityTable, error) {
	if mob == nil {
		return nil, fmt.Errorf("silicon: NewSumMobilityTable needs a non-nil Mobility")
	}
	if err := eq.Validate(); err != nil {
		return nil, err
	}
	if !(dnMin > 0) || math.IsInf(dnMax, 0) || !(dnMax > dnMin) {
		return nil, fmt.Errorf("silicon: NewSumMobilityTable: need 0 < dnMin < dnMax finite, got dnMin = %g, dnMax = %g cm^-3", dnMin, dnMax)
	}
	if relTol == 0 {
		relTol = sumTableDefaultTol
	}
	if !(relTol >= 1e-12 && relTol <= 0.01) {
		return nil, fmt.Errorf("silicon: NewSumMobilityTable: relTol must lie in [1e-12, 0.01] (or be 0 for 1e-6), got %g", relTol)
	}
	t := &SumMobilityTable{model: modelName(mob), eq: eq, dnMin: dnMin, dnMax: dnMax,
		lnMin: math.Log(dnMin), lnMax: math.Log(dnMax)}
	decades := (t.lnMax - t.lnMin) / math.Ln10
	for per := sumTableStartPerDecade; per <= sumTableMaxPerDecade; per *= 2 {
		n := max(int(math.Ceil(decades*float64(per))), 4) // intervals
		h := (t.lnMax - t.lnMin) / float64(n)
		xs := make([]float64, n+1)
		ys := make([]float64, n+1)
		for i := range xs {
			xs[i] = t.lnMin + float64(i)*h
			if i == n {
				xs[i] = t.lnMax
			}
			d := math.Exp(xs[i])
			if i == 0 {
				d = dnMin
			} else if i == n {
				d = dnMax
			}
			s, err := SumMobility(mob, eq, d)
			if err != nil {
				return nil, err
			}
			ys[i] = s
		}
		if err := t.spline.Fit(xs, ys); err != nil {
			return nil, fmt.Errorf("silicon: NewSumMobilityTable: %w", err)
		}
		worst := 0.0
		for i := 0; i < n; i++ {
			x := xs[i] + 0.5*h
			s, err := SumMobility(mob, eq, math.Exp(x))
			if err != nil {
				return nil, err
			}
			worst = math.Max(worst, math.Abs(t.spline.Predict(x)-s)/s)
		}
		if worst <= relTol {
			t.relErr, t.nodes = worst, n+1
			return t, nil
		}
	}
	return nil, fmt.Errorf("silicon: NewSumMobilityTable: %s: relative tolerance %g not reached with %d nodes per decade",
		t.model, relTol, sumTableMaxPerDecade)
}

// String returns a description such as "μn+μp table, Klaassen1992, Δn 1e+12–1e+17 cm^-3,
// 41 nodes, max rel. error 3.1e-07".
func (t *SumMobilityTable) String() string {
	if t == nil || t.nodes == 0 {
		return "μn+μp table (zero value)"
	}
	return fmt.Sprintf("μn+μp table, %s, Δn %g–%g cm^-3, %d nodes, max rel. error %.2g",
		t.model, t.dnMin, t.dnMax, t.nodes, t.relErr)
}

// Range returns the range of excess carrier densities [dnMin, dnMax] of the table, cm^-3.
// A zero or nil table has the range [0, 0].
func (t *SumMobilityTable) Range() (dnMin, dnMax float64) {
	if t == nil {
		return 0, 0
	}
	return t.dnMin, t.dnMax
}

// RelErr returns the largest relative interpolation error found at the interval midpoints
// when the table was built (dimensionless); 0 for a zero or nil table.
func (t *SumMobilityTable) RelErr() float64 {
	if t == nil {
		return 0
	}
	return t.relErr
}

// At returns μn + μp in cm²/(V·s) at excess carrier density dn in cm^-3. It returns an error
// (errors.Is(err, pvrec.ErrOutOfRange)) for dn outside the table's Range, or NaN, and an
// error for a zero or nil table.
func (t *SumMobilityTable) At(dn float64) (float64, error) {
	if t == nil || t.nodes == 0 {
		return 0, fmt.Errorf("silicon: SumMobilityTable.At: the table is nil or a zero value; make one with NewSumMobilityTable")
	}
	if !(dn >= t.dnMin && dn <= t.dnMax) {
		return 0, check.Range("silicon", "SumMobilityTable", "excess carrier density dn", "cm^-3", dn, t.dnMin, t.dnMax)
	}
	x := math.Log(dn)
	// Rounding of the logarithm must not step outside the spline's knots.
	x = math.Min(math.Max(x, t.lnMin), t.lnMax)
	return t.spline.Predict(x), nil
}

// Eval evaluates At at each excess carrier density of dn (cm^-3) and returns the results in
// cm²/(V·s), stored in dst if it has the length of dn (otherwise in a new slice).
func (t *SumMobilityTable) Eval(dn, dst []float64) ([]float64, error) {
	if len(dst) != len(dn) {
		dst = make([]float64, len(dn))
	}
	for i, d := range dn {
		s, err := t.At(d)
		if err != nil {
			return nil, fmt.Errorf("silicon: SumMobilityTable.Eval: dn[%d]: %w", i, err)
		}
		dst[i] = s
	}
	return dst, nil
}
