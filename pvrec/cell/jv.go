package cell

import (
	"errors"
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/internal/roots"
	"github.com/pvrec/pvrec/pvrec/recomb"
)

// Point is one operating point of a cell.
type Point struct {
	V  float64 // terminal voltage, V
	J  float64 // current density delivered by the cell (generator convention), A/cm^2
	P  float64 // power density V·J delivered, W/cm^2
	Vi float64 // internal voltage, the quasi-Fermi level separation in the base, V (V + J Rs)
	Dn float64 // base excess carrier density Δn, cm^-3
}

// Curve is a J–V curve as plain slices of equal length, ready for plots.Series
// (X: V, Y: J or P), in order of rising voltage.
type Curve struct {
	V  []float64 // terminal voltage, V
	J  []float64 // current density delivered, A/cm^2
	P  []float64 // power density delivered, W/cm^2
	Vi []float64 // internal voltage (quasi-Fermi level separation in the base), V
	Dn []float64 // base excess carrier density, cm^-3
}

// Numerical settings of the operating-point solvers (all in x = ln Δn).
const (
	xTol      = 1e-12 // Brent tolerance on x for Voc and terminal voltages: Voc to ~1e-14 V
	mppTol    = 1e-9  // Brent tolerance on x at the maximum-power point (P is flat there; Vmp to ~1e-11 V)
	mppStep   = 1e-5  // central-difference step in x for dP/dx (truncation and rounding both ~1e-10 relative)
	dnProbe   = 1e14  // Δn at which the J0 equivalent for the first Voc estimate is taken, cm^-3
	maxBrentI = 200   // Brent iteration limit
)

var (
	xMin = math.Log(math.SmallestNonzeroFloat64) // smallest x searched
	xMax = math.Log(recomb.MaxExcess)            // largest x searched
)

// point returns the operating point at base excess density dn.
func (d *Device) point(dn float64) (Point, error) {
	vi, jrec, err := d.eval(dn, nil)
	if err != nil {
		return Point{}, err
	}
	j := d.jsc - jrec
	v := vi - j*d.rs
	return Point{V: v, J: j, P: v * j, Vi: vi, Dn: dn}, nil
}

// solveX returns the root x = ln Δn of f, which rises with x, searched outward from x0 and
// refined by Brent's method to xTol. fmt.Sprintf(what, arg) names the quantity in errors (it
// is formatted only on the error path, so that a solve does not allocate).
func solveX(f func(x float64) (float64, error), x0 float64, what string, arg float64) (float64, error) {
	x0 = math.Max(xMin, math.Min(xMax, x0))
	f0, err := f(x0)
	if err != nil {
		return 0, err
	}
	lo, hi, flo, fhi, err := roots.Bracket(f, x0, f0, 0.02, 2, xMin, xMax, true)
	if errors.Is(err, roots.ErrNoBracket) {
		return 0, check.Rangef("cell", "excess carrier density Δn", math.NaN(), 0, recomb.MaxExcess,
			"cell: %s needs a base excess density Δn above recomb.MaxExcess = %g cm^-3 (%v)", fmt.Sprintf(what, arg), recomb.MaxExcess, err)
	}
	if err != nil {
		return 0, err
	}
	x, err := roots.Brent(f, lo, hi, flo, fhi, xTol, maxBrentI)
	if err != nil {
		return 0, brentErr(fmt.Sprintf(what, arg), err)
	}
	return x, nil
}

// brentErr turns an error of roots into one matching pvrec.ErrNoConvergence (errors of the
// models pass unchanged).
func brentErr(what string, err error) error {
	if errors.Is(err, check.ErrNoConvergence) || errors.Is(err, roots.ErrNoBracket) {
		return check.NoConvergence("cell: %s: %v", what, err)
	}
	return err
}

// OpenCircuit returns the open-circuit point, where the recombination current equals Jsc:
// J_rec(Δn) = Jsc, solved for x = ln Δn with a bracketed Brent root to 1e-12 in x (Voc to
// about 1e-14 V). Voc is the implied voltage of the base there, ImpliedVoc(d.Bulk(), Dn). It
// returns an error for the zero Device, an open circuit above recomb.MaxExcess (matching
// pvrec.ErrOutOfRange), or an error of a model.
func (d *Device) OpenCircuit() (Point, error) {
	if d == nil || d.bulk == nil {
		return Point{}, errZeroDevice
	}
	// First estimate: the J0 equivalent at dnProbe gives Voc = Vt ln(1 + Jsc/J0).
	vi, jrec, err := d.eval(dnProbe, nil)
	if err != nil {
		return Point{}, err
	}
	eq, vt := d.bulk.Equilibrium(), d.mat.Vt()
	x0 := xMax
	if jrec > 0 {
		j0 := jrec / math.Expm1(vi/vt)
		x0 = math.Log(nominalExcess(eq, vt, vt*math.Log1p(d.jsc/j0)))
	}
	f := func(x float64) (float64, error) {
		_, jrec, err := d.eval(math.Exp(x), nil)
		return jrec - d.jsc, err
	}
	x, err := solveX(f, x0, "the open circuit at Jsc = %g A/cm^2", d.jsc)
	if err != nil {
		return Point{}, err
	}
	p, err := d.point(math.Exp(x))
	if err != nil {
		return Point{}, err
	}
	p.J, p.P, p.V = 0, 0, p.Vi // J_rec = Jsc to the root's tolerance: no current flows
	return p, nil
}

// Voc returns the open-circuit voltage in V, OpenCircuit().V.
func (d *Device) Voc() (float64, error) {
	p, err := d.OpenCircuit()
	return p.V, err
}

// OperatingPoint returns the operating point at terminal voltage v in V (finite, >= −Jsc·Rs:
// the models describe forward internal bias, Δn >= 0), solving
//
//	v = V_i(Δn) − (Jsc − J_rec(Δn)) Rs
//
// for x = ln Δn with a bracketed Brent root to 1e-12 in x (the right side rises with Δn). It
// returns an error matching pvrec.ErrOutOfRange for a v below −Jsc·Rs or one that needs Δn
// above recomb.MaxExcess, an error matching pvrec.ErrNoConvergence if the root fails, or an
// error of a model; never an unconverged point.
func (d *Device) OperatingPoint(v float64) (Point, error) {
	if d == nil || d.bulk == nil {
		return Point{}, errZeroDevice
	}
	return d.operatingPoint(v, math.NaN(), math.NaN())
}

// operatingPoint is OperatingPoint with an optional previous point (vPrev, viPrev; NaN for
// none) whose internal voltage shifted by v − vPrev is the first estimate.
func (d *Device) operatingPoint(v, vPrev, viPrev float64) (Point, error) {
	if err := check.Finite("cell: OperatingPoint", "terminal voltage v", v, "V"); err != nil {
		return Point{}, err
	}
	vmin := -d.jsc * d.rs
	if v < vmin {
		return Point{}, check.Rangef("cell", "terminal voltage v", v, vmin, math.NaN(),
			"cell: terminal voltage v = %g V is below −Jsc·Rs = %g V: the cell would be in reverse internal bias (Δn < 0), which the quasi-neutral base does not describe", v, vmin)
	}
	if v == vmin {
		return d.point(0)
	}
	vi := v + d.jsc*d.rs // the internal voltage if no current were lost to recombination
	if !math.IsNaN(vPrev) {
		vi = viPrev + (v - vPrev)
	}
	eq, vt := d.bulk.Equilibrium(), d.mat.Vt()
	x0 := xMin
	if dn := nominalExcess(eq, vt, math.Max(vi, 0)); dn > 0 {
		x0 = math.Log(dn)
	}
	f := func(x float64) (float64, error) {
		vi, jrec, err := d.eval(math.Exp(x), nil)
		return vi - (d.jsc-jrec)*d.rs - v, err
	}
	x, err := solveX(f, x0, "terminal voltage v = %g V", v)
	if err != nil {
		return Point{}, err
	}
	p, err := d.point(math.Exp(x))
	p.V, p.P = v, v*p.J // the root meets v to ~1e-14 V; report the voltage asked for
	return p, err
}

// ShortCircuit returns the short-circuit point, OperatingPoint(0): J = Jsc exactly without
// series resistance (J_rec(0) = 0), slightly less with it.
func (d *Device) ShortCircuit() (Point, error) {
	if d == nil || d.bulk == nil {
		return Point{}, errZeroDevice
	}
	if d.rs == 0 {
		return d.point(0)
	}
	return d.operatingPoint(0, math.NaN(), math.NaN())
}

// MaxPower returns the maximum-power point: the root of dP/dx, x = ln Δn, with P = V J the
// delivered power density, by Brent's method on a bracket searched outward from one unit of
// x below the open circuit; dP/dx is a central difference with a step of 1e-5 in x. Vmp and
// Jmp are accurate to about 1e-9 relative, Pmp to rounding (P is stationary there). It
// returns an error for the zero Device, an error of a model, or one matching
// pvrec.ErrNoConvergence if no maximum is bracketed (a J–V curve without an interior maximum).
func (d *Device) MaxPower() (Point, error) {
	if d == nil || d.bulk == nil {
		return Point{}, errZeroDevice
	}
	oc, err := d.OpenCircuit()
	if err != nil {
		return Point{}, err
	}
	return d.maxPower(oc)
}

// maxPower is MaxPower given the open-circuit point.
func (d *Device) maxPower(oc Point) (Point, error) {
	power := func(x float64) (float64, error) {
		vi, jrec, err := d.eval(math.Exp(x), nil)
		j := d.jsc - jrec
		return (vi - j*d.rs) * j, err
	}
	// g = dP/dx falls through zero at the maximum: the root of −g rises.
	g := func(x float64) (float64, error) {
		hi, err := power(x + mppStep)
		if err != nil {
			return 0, err
		}
		lo, err := power(x - mppStep)
		return -(hi - lo) / (2 * mppStep), err
	}
	xoc := math.Log(oc.Dn)
	x0 := xoc - 1
	g0, err := g(x0)
	if err != nil {
		return Point{}, err
	}
	// dP/dV > 0 at every V <= Voc/2 for a concave J–V curve; searching 100 units of x
	// (a factor e^100 in Δn) below the open circuit covers any cell.
	what := "the maximum-power point"
	lo, hi, glo, ghi, err := roots.Bracket(g, x0, g0, 0.25, 2, xoc-100, xoc-mppStep, true)
	if err != nil {
		return Point{}, brentErr(what, err)
	}
	x, err := roots.Brent(g, lo, hi, glo, ghi, mppTol, maxBrentI)
	if err != nil {
		return Point{}, brentErr(what, err)
	}
	return d.point(math.Exp(x))
}

// MaxCurvePoints is the largest number of points Curve and CurveAt compute: a J–V curve of a
// million points is far beyond any use, and a larger request is an error, not minutes of work.
const MaxCurvePoints = 1000000

// Curve returns the J–V curve with n points (2 <= n <= MaxCurvePoints) from short circuit to open circuit
// (both included, solved as in ShortCircuit and OpenCircuit). The points between them are at
// evenly spaced internal voltages (up to the injection dependence of ni,eff, which shifts
// them by far less than the spacing), parameterised by Δn without a root each: with series
// resistance the terminal voltages are then not evenly spaced. It returns an error for the
// zero Device, n < 2, or an error of a model.
func (d *Device) Curve(n int) (Curve, error) {
	if d == nil || d.bulk == nil {
		return Curve{}, errZeroDevice
	}
	if n < 2 {
		return Curve{}, fmt.Errorf("cell: Curve: number of points n must be >= 2, got %d", n)
	}
	if n > MaxCurvePoints {
		return Curve{}, fmt.Errorf("cell: Curve: n = %d points, more than MaxCurvePoints = %d", n, MaxCurvePoints)
	}
	sc, err := d.ShortCircuit()
	if err != nil {
		return Curve{}, err
	}
	oc, err := d.OpenCircuit()
	if err != nil {
		return Curve{}, err
	}
	c := Curve{V: make([]float64, n), J: make([]float64, n), P: make([]float64, n), Vi: make([]float64, n), Dn: make([]float64, n)}
	eq, vt := d.bulk.Equilibrium(), d.mat.Vt()
	u0, u1 := nominalVoltage(eq, vt, sc.Dn), nominalVoltage(eq, vt, oc.Dn)
	for k := range n {
		p := sc
		switch {
		case k == n-1:
			p = oc
		case k > 0:
			u := u0 + (u1-u0)*float64(k)/float64(n-1)
			if p, err = d.point(nominalExcess(eq, vt, u)); err != nil {
				return Curve{}, err
			}
		}
		c.V[k], c.J[k], c.P[k], c.Vi[k], c.Dn[k] = p.V, p.J, p.P, p.Vi, p.Dn
	}
	return c, nil
}

// CurveAt returns the J–V curve at the terminal voltages v (V, each finite and >= −Jsc·Rs),
// each point solved as in OperatingPoint, the previous point giving the first estimate. It
// returns an error naming the voltage for a point the models do not allow (see
// OperatingPoint), or for the zero Device or an empty v.
func (d *Device) CurveAt(v []float64) (Curve, error) {
	if d == nil || d.bulk == nil {
		return Curve{}, errZeroDevice
	}
	if len(v) == 0 {
		return Curve{}, fmt.Errorf("cell: CurveAt: no voltages")
	}
	if len(v) > MaxCurvePoints {
		return Curve{}, fmt.Errorf("cell: CurveAt: %d voltages, more than MaxCurvePoints = %d", len(v), MaxCurvePoints)
	}
	n := len(v)
	c := Curve{V: make([]float64, n), J: make([]float64, n), P: make([]float64, n), Vi: make([]float64, n), Dn: make([]float64, n)}
	vPrev, viPrev := math.NaN(), math.NaN()
	for k, vk := range v {
		p, err := d.operatingPoint(vk, vPrev, viPrev)
		if err != nil {
			return Curve{}, fmt.Errorf("%w (point %d)", err, k)
		}
		c.V[k], c.J[k], c.P[k], c.Vi[k], c.Dn[k] = p.V, p.J, p.P, p.Vi, p.Dn
		if p.Dn > 0 {
			vPrev, viPrev = p.V, p.Vi
		}
	}
	return c, nil
}
