package spectroscopy

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Options are the settings of Fit and SolutionSurface. The zero Options is the documented
// default of every field.
type Options struct {
	// Ref is the reference from which the level's energy is counted and held fixed across
	// curves (recomb.FromValence, FromConduction or FromIntrinsic); 0 means
	// recomb.FromIntrinsic, Et − Ei, the axis of the usual solution-surface plots. Within
	// one temperature the three are the same level (recomb.Level shares band-gap narrowing
	// between the bands); for curves at several temperatures the choice is a model
	// assumption: the level keeps its distance from that reference as the gap changes.
	Ref recomb.EnergyRef
	// KMin and KMax bound the searched ratio k = σn/σp of capture cross sections
	// (dimensionless); 0 means 1e-5 and 1e5. 1e-10 <= KMin < KMax <= 1e10.
	KMin, KMax float64
	// VTh gives the thermal velocities that relate k to the capture time constants,
	// τp0/τn0 = k vth,n/vth,p, and τn0 to σn·Nt; the zero value means
	// silicon.NewGreen1990ThermalVelocity().
	VTh silicon.ThermalVelocity
	// Starts are starting points added to the default ones of Fit (the local minima of its
	// profile grid in each half of the gap); each must lie in the gap of every curve and in
	// [KMin, KMax] (a range error otherwise).
	Starts []Start
	// EtPoints and KPoints are the grid of SolutionSurface: Et over the gap and log10 k over
	// [KMin, KMax], both ends included; 0 means 200 and 200, otherwise 2 to MaxGridPoints.
	EtPoints, KPoints int
	// Workers is the number of goroutines of the grid evaluations (package sweep); <= 0 means
	// all cores. Results do not depend on it.
	Workers int
}

// Start is a starting point of Fit: a level energy Et in eV counted as Options.Ref says,
// and a capture-cross-section ratio K = σn/σp.
type Start struct {
	Et float64 // level energy, eV
	K  float64 // σn/σp, dimensionless
}

// MaxGridPoints is the largest number of grid points along either axis of SolutionSurface.
const MaxGridPoints = 1000

// Defaults of Options (our choices, common practice, no source): the k range covers the
// capture-cross-section ratios of the levels in recomb's catalogue (about 1.7 and 700) with
// wide margins.
const (
	defaultKMin     = 1e-5
	defaultKMax     = 1e5
	defaultGrid     = 200
	limitKMin       = 1e-10
	limitKMax       = 1e10
	fitEtPoints     = 161 // profile grid of Fit over the gap (7 meV steps in silicon at 300 K)
	fitKPoints      = 41  // k grid of each profile point: a quarter decade over the default range
	maxStarts       = 6   // local minima of the profile polished per half of the gap
	edgeInset       = 1e-6
	profileTolLnK   = 1e-4              // golden-section tolerance of the best ln k at one Et
	intervalTolEt   = 1e-4              // tolerance of the ends of the profile-likelihood region, eV
	determinedEt    = 0.05              // Et is "determined" if the 95 % interval is at most ±0.05 eV
	determinedLnK   = 2.302585092994046 // k is "determined" if its 95 % interval is at most ×/÷ 10
	dwThreshold     = 1.0               // Durbin–Watson statistic below which residuals are systematic
	confidenceLevel = 0.95
	fTestLevel      = 0.99
)

// problem is a set of prepared curves with the settings of one analysis.
type problem struct {
	curves         []*curve
	ref            recomb.EnergyRef
	lo, hi, mid    float64 // range of E (inset from the band edges) and Ei, eV, in Ref
	lnKMin, lnKMax float64
	kMin, kMax     float64
	n              int // points of all curves
	workers        int
}

// newProblem checks opt and curves and prepares them.
func newProblem(curves []Curve, opt Options) (*problem, error) {
	if len(curves) == 0 {
		return nil, fmt.Errorf("spectroscopy: no curves")
	}
	p := &problem{ref: opt.Ref, kMin: opt.KMin, kMax: opt.KMax, workers: opt.Workers}
	if p.ref == 0 {
		p.ref = recomb.FromIntrinsic
	}
	if p.ref != recomb.FromValence && p.ref != recomb.FromConduction && p.ref != recomb.FromIntrinsic {
		return nil, fmt.Errorf("spectroscopy: Options.Ref = %d is not a reference (use recomb.FromValence, FromConduction or FromIntrinsic)", opt.Ref)
	}
	if p.kMin == 0 {
		p.kMin = defaultKMin
	}
	if p.kMax == 0 {
		p.kMax = defaultKMax
	}
	for _, f := range [...]struct {
		name string
		v    float64
	}{{"KMin", p.kMin}, {"KMax", p.kMax}} {
		if err := check.Finite("spectroscopy: Options", f.name, f.v, ""); err != nil {
			return nil, err
		}
		if !(f.v >= limitKMin && f.v <= limitKMax) {
			return nil, check.Range("spectroscopy", "Options", f.name, "", f.v, limitKMin, limitKMax)
		}
	}
	if !(p.kMin < p.kMax) {
		return nil, fmt.Errorf("spectroscopy: Options: KMin = %g must be below KMax = %g", p.kMin, p.kMax)
	}
	p.lnKMin, p.lnKMax = math.Log(p.kMin), math.Log(p.kMax)
	vth := opt.VTh
	if vth == (silicon.ThermalVelocity{}) {
		vth = silicon.NewGreen1990ThermalVelocity()
	}
	p.lo, p.hi = math.Inf(-1), math.Inf(1)
	for i, c := range curves {
		pc, err := prepare(c, i, vth)
		if err != nil {
			return nil, err
		}
		lo, hi, mid := pc.span(p.ref)
		if i == 0 {
			p.mid = mid
		}
		p.lo, p.hi = math.Max(p.lo, lo), math.Min(p.hi, hi)
		p.curves = append(p.curves, pc)
		p.n += len(pc.y)
	}
	p.lo += edgeInset
	p.hi -= edgeInset
	if !(p.lo < p.mid && p.mid < p.hi) {
		return nil, fmt.Errorf("spectroscopy: the gaps of the curves (at their temperatures, counted from %s) share no range around Ei: [%g, %g] eV",
			refName(p.ref), p.lo, p.hi)
	}
	for i, s := range opt.Starts {
		if err := check.Finite("spectroscopy: Options", fmt.Sprintf("Starts[%d].Et", i), s.Et, "eV"); err != nil {
			return nil, err
		}
		if !(s.Et >= p.lo && s.Et <= p.hi) {
			return nil, check.Rangef("Options", fmt.Sprintf("Starts[%d].Et", i), s.Et, p.lo, p.hi,
				"spectroscopy: Options: starting point Starts[%d].Et = %g eV (%s) lies outside the gap [%g, %g] eV", i, s.Et, refName(p.ref), p.lo, p.hi)
		}
		if !(s.K >= p.kMin && s.K <= p.kMax) {
			return nil, check.Range("spectroscopy", "Options", fmt.Sprintf("Starts[%d].K", i), "", s.K, p.kMin, p.kMax)
		}
	}
	return p, nil
}

// refName names a reference for messages.
func refName(r recomb.EnergyRef) string {
	switch r {
	case recomb.FromValence:
		return "Et − Ev"
	case recomb.FromConduction:
		return "Ec − Et"
	}
	return "Et − Ei"
}

// gridPoints returns n, or def for n = 0, checked against [2, MaxGridPoints].
func gridPoints(name string, n, def int) (int, error) {
	if n == 0 {
		return def, nil
	}
	if n < 2 || n > MaxGridPoints {
		return 0, check.Range("spectroscopy", "Options", name, "", float64(n), 2, MaxGridPoints)
	}
	return n, nil
}

// linspace returns n >= 2 points from lo to hi, both included.
func linspace(lo, hi float64, n int) []float64 {
	xs := make([]float64, n)
	for i := range xs {
		xs[i] = lo + (hi-lo)*float64(i)/float64(n-1)
	}
	xs[n-1] = hi
	return xs
}

// work holds the unit lifetimes of every curve at one level energy (see curve.units); one
// per goroutine.
type work struct {
	a, b [][]float64
	e    float64
}

func (p *problem) newWork() *work {
	w := &work{a: make([][]float64, len(p.curves)), b: make([][]float64, len(p.curves)), e: math.NaN()}
	for j, c := range p.curves {
		w.a[j] = make([]float64, len(c.y))
		w.b[j] = make([]float64, len(c.y))
	}
	return w
}

// fill computes the unit lifetimes of curve j (of every curve for j < 0) at energy e (eV,
// in Ref). The lifetimes of every curve are kept for the next call at the same e.
func (p *problem) fill(w *work, e float64, j int) error {
	if j >= 0 {
		w.e = math.NaN()
		return p.curves[j].units(p.ref, e, w.a[j], w.b[j])
	}
	if e == w.e {
		return nil
	}
	for i, c := range p.curves {
		if err := c.units(p.ref, e, w.a[i], w.b[i]); err != nil {
			w.e = math.NaN()
			return err
		}
	}
	w.e = e
	return nil
}

// cost returns the residual sum of squares of curve j (or of all curves for j < 0) at
// ln k = lnk, with the unit lifetimes of w.
func (p *problem) cost(w *work, j int, lnk float64) float64 {
	k := math.Exp(lnk)
	if j >= 0 {
		c, _ := rss(p.curves[j].y, w.a[j], w.b[j], k*p.curves[j].ratio)
		return c
	}
	var sum float64
	for i, c := range p.curves {
		r, _ := rss(c.y, w.a[i], w.b[i], k*c.ratio)
		sum += r
	}
	return sum
}

// bestK returns the ln k in [lnKMin, lnKMax] that minimises the cost of curve j (all curves
// for j < 0) at the level of w, its cost, and whether it lies at an end of the range (so that
// it is only a bound): the best of the grid lnks, refined by golden-section search between its
// neighbours to profileTolLnK.
func (p *problem) bestK(w *work, j int, lnks []float64) (lnk, c float64, edge bool) {
	return p.bestKOf(w, j, lnks, nil)
}

// bestKOf is bestK with the costs at lnks given (computed if nil).
func (p *problem) bestKOf(w *work, j int, lnks, costs []float64) (lnk, c float64, edge bool) {
	best, cb := 0, math.Inf(1)
	for i, x := range lnks {
		v := 0.0
		if costs != nil {
			v = costs[i]
		} else {
			v = p.cost(w, j, x)
		}
		if v < cb {
			best, cb = i, v
		}
	}
	lo, hi := lnks[max(best-1, 0)], lnks[min(best+1, len(lnks)-1)]
	x, fx := golden(func(x float64) float64 { return p.cost(w, j, x) }, lo, hi, profileTolLnK)
	lnk, c = lnks[best], cb
	if fx < cb {
		lnk, c = x, fx
	}
	edge = lnk-p.lnKMin < 2*profileTolLnK || p.lnKMax-lnk < 2*profileTolLnK
	return lnk, c, edge
}

// golden returns the minimum of f on [lo, hi] by golden-section search to tolerance tol (the
// bracket ends are candidates too, so a minimum at an end is found).
func golden(f func(float64) float64, lo, hi, tol float64) (x, fx float64) {
	const r = 0.6180339887498949 // (√5 − 1)/2
	a, b := lo, hi
	c, d := b-r*(b-a), a+r*(b-a)
	fc, fd := f(c), f(d)
	for b-a > tol {
		if fc <= fd {
			b, d, fd = d, c, fc
			c = b - r*(b-a)
			fc = f(c)
		} else {
			a, c, fc = c, d, fd
			d = a + r*(b-a)
			fd = f(d)
		}
	}
	x, fx = c, fc
	if fd < fx {
		x, fx = d, fd
	}
	for _, e := range [...]float64{lo, hi} {
		if v := f(e); v < fx {
			x, fx = e, v
		}
	}
	return x, fx
}
