package profile

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"gonum.org/v1/gonum/integrate/quad"
)

// SheetRelTol is the relative tolerance to which SheetResistance and SheetResistanceFunc
// integrate the sheet conductance: the 16-point Gauss–Legendre result of every panel is
// accepted when it differs from the 8-point result by less than SheetRelTol times the panel's
// share of the total. The difference overestimates the error of the 16-point result, which
// is returned, by orders of magnitude for smooth profiles.
const SheetRelTol = 1e-8

// Limits of the adaptive integration.
const (
	sheetFuncPanels = 64      // initial panels of SheetResistanceFunc
	sheetScanPoints = 4096    // grid of the junction search of SheetResistanceFunc
	sheetMaxDepth   = 40      // bisections of one panel before giving up
	sheetMaxEvals   = 4000000 // evaluations of the mobility before giving up
)

// Sheet is a sheet resistance with the quantities of its computation.
type Sheet struct {
	Rsh    float64 // sheet resistance, Ω/sq
	RelErr float64 // estimated relative error of Rsh from the integration (an upper estimate), dimensionless
	XjCm   float64 // depth at which the layer ends, cm: the first junction (net doping reaches zero), or the end of the profile
}

// SheetResistance returns the sheet resistance of a diffused layer of dopant type dop
// (silicon.Donor for an n-type layer) whose dopant density in cm^-3 is given at depths in cm
// by the arrays depthCm and density, on a uniform background of the other dopant type of
// density background in cm^-3, in material m: at its temperature, with the mobilities of its
// model set (Material.Mobilities; see the package documentation for the integral).
//
// Between samples the density is interpolated linearly in its logarithm (exact for
// exponential tails; linearly where a sample is 0). The layer runs from depthCm[0] (normally
// 0, the surface) to the first depth where the density falls to the background, located
// exactly under this interpolation, or to the last sample. Each interval is integrated
// adaptively to SheetRelTol; the error of the result is thus that of the data and their
// sampling, not of the quadrature.
//
// It returns an error for a nil m, an invalid dop, arrays of different lengths or
// fewer than 2 samples, depths not finite, not increasing, negative or beyond MaxDepthCm,
// densities or a background not finite, negative or above silicon.AtomDensity (range errors
// for the bounds), a surface density not above the
// background (no layer), or an error of the mobility model.
func SheetResistance(m *silicon.Material, dop silicon.Dopant, depthCm, density []float64, background float64) (Sheet, error) {
	in, err := newIntegrand(m, dop, background)
	if err != nil {
		return Sheet{}, err
	}
	if len(depthCm) != len(density) {
		return Sheet{}, fmt.Errorf("profile: depth and density arrays differ in length (%d and %d)", len(depthCm), len(density))
	}
	if len(depthCm) < 2 {
		return Sheet{}, fmt.Errorf("profile: need at least 2 samples, got %d", len(depthCm))
	}
	for i, x := range depthCm {
		if math.IsNaN(x) || math.IsInf(x, 0) || x < 0 {
			return Sheet{}, fmt.Errorf("profile: depth must be finite and >= 0 cm (index %d: %g)", i, x)
		}
		if x > MaxDepthCm {
			return Sheet{}, check.Rangef("SheetResistance", "depth", x, 0, MaxDepthCm,
				"profile: depth %g cm beyond MaxDepthCm = %g cm (index %d)", x, MaxDepthCm, i)
		}
		if i > 0 && !(x > depthCm[i-1]) {
			return Sheet{}, fmt.Errorf("profile: depth must increase (index %d: %g after %g)", i, x, depthCm[i-1])
		}
		if v := density[i]; math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
			return Sheet{}, fmt.Errorf("profile: density must be finite and >= 0 cm^-3 (index %d: %g)", i, v)
		} else if v > silicon.AtomDensity {
			return Sheet{}, check.Rangef("SheetResistance", "density", v, 0, silicon.AtomDensity,
				"profile: density %g cm^-3 above the silicon atom density %g cm^-3 (index %d)", v, silicon.AtomDensity, i)
		}
	}
	if !(density[0] > background) {
		return Sheet{}, fmt.Errorf("profile: surface density %g cm^-3 does not exceed the background %g cm^-3: no %s layer",
			density[0], background, dop)
	}
	// Intervals of the layer, the last one cut at the junction.
	type seg struct{ a, b, na, nb float64 }
	var segs []seg
	xj := depthCm[len(depthCm)-1]
	for i := 0; i+1 < len(depthCm); i++ {
		a, b, na, nb := depthCm[i], depthCm[i+1], density[i], density[i+1]
		if nb <= background {
			// Junction inside [a, b]: solve N(x) = background under the interpolation.
			var s float64
			if na > 0 && nb > 0 {
				s = math.Log(background/na) / math.Log(nb/na)
			} else {
				s = (na - background) / (na - nb)
			}
			xj = a + s*(b-a)
			// The segment ends at xj; na, nb stay those of [a, b], which define the
			// interpolation.
			segs = append(segs, seg{a, xj, na, nb})
			break
		}
		segs = append(segs, seg{a, b, na, nb})
	}
	total := xj - depthCm[0]
	// The interpolated density on the original interval [a0, b0] with end values n0, n1.
	interp := func(x, a0, b0, n0, n1 float64) float64 {
		s := (x - a0) / (b0 - a0)
		if n0 > 0 && n1 > 0 {
			return n0 * math.Exp(s*math.Log(n1/n0))
		}
		return n0 + s*(n1-n0)
	}
	// First pass: one 16-point estimate per interval sets the absolute tolerance.
	fs := make([]func(float64) float64, len(segs))
	first := make([]float64, len(segs))
	var est float64
	for k, sg := range segs {
		b0 := depthCm[k+1]
		fs[k] = func(x float64) float64 { return in.sigma(interp(x, depthCm[k], b0, sg.na, sg.nb)) }
		first[k] = in.fixed(fs[k], sg.a, sg.b, 16)
		est += first[k]
	}
	if in.err != nil {
		return Sheet{}, in.err
	}
	var g, errSum float64
	for k, sg := range segs {
		v, e := in.adapt(fs[k], sg.a, sg.b, first[k], SheetRelTol*math.Abs(est)*(sg.b-sg.a)/total, 0)
		g += v
		errSum += e
		if in.err != nil {
			return Sheet{}, in.err
		}
	}
	return in.result(g, errSum, xj)
}

// SheetResistanceFunc returns the sheet resistance of a diffused layer of dopant type dop whose
// dopant density in cm^-3 at depth x in cm is density(x), for 0 <= x <= depthCm, on a uniform
// background of the other dopant type of density background in cm^-3, in material m: at its
// temperature, with the mobilities of its model set (see the package documentation for the
// integral).
//
// The layer ends at the first junction, density(x) = background, found by a scan of 4096
// equal steps refined by bisection to the resolution of float64, or at depthCm. The integral
// over [0, xj] is computed adaptively to SheetRelTol, starting from 64 equal panels; density
// must be smooth on that scale or the adaptive refinement has to find its features (a
// feature narrower than xj/64 between Gauss nodes can be missed).
//
// It returns an error for a nil m or density, an invalid dop, depthCm not finite and > 0 or
// beyond MaxDepthCm, a background not finite, negative or above silicon.AtomDensity, a
// density value not finite, negative or above the atom density (naming the depth), a surface
// density not above the background, an integral that does not reach the tolerance, or an
// error of the mobility model.
func SheetResistanceFunc(m *silicon.Material, dop silicon.Dopant, density func(xCm float64) float64, depthCm, background float64) (Sheet, error) {
	in, err := newIntegrand(m, dop, background)
	if err != nil {
		return Sheet{}, err
	}
	if density == nil {
		return Sheet{}, fmt.Errorf("profile: SheetResistanceFunc needs a non-nil density function")
	}
	if err := checkLength("profile: SheetResistanceFunc", "depth depthCm", depthCm, false); err != nil {
		return Sheet{}, err
	}
	var ferr error
	dens := func(x float64) float64 {
		v := density(x)
		if ferr == nil {
			if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
				ferr = fmt.Errorf("profile: density(%g cm) = %g; must be finite and >= 0 cm^-3", x, v)
			} else if v > silicon.AtomDensity {
				ferr = check.Rangef("SheetResistanceFunc", "density", v, 0, silicon.AtomDensity,
					"profile: density(%g cm) = %g cm^-3 above the silicon atom density %g cm^-3", x, v, silicon.AtomDensity)
			}
		}
		return v
	}
	if n0 := dens(0); ferr != nil {
		return Sheet{}, ferr
	} else if !(n0 > background) {
		return Sheet{}, fmt.Errorf("profile: surface density %g cm^-3 does not exceed the background %g cm^-3: no %s layer",
			n0, background, dop)
	}
	// Junction search.
	xj := depthCm
	h := depthCm / sheetScanPoints
	for i := 1; i <= sheetScanPoints; i++ {
		x := float64(i) * h
		if i == sheetScanPoints {
			x = depthCm
		}
		if dens(x) <= background {
			lo, hi := x-h, x
			for k := 0; k < 200 && hi-lo > 4e-16*hi; k++ {
				mid := 0.5 * (lo + hi)
				if dens(mid) > background {
					lo = mid
				} else {
					hi = mid
				}
			}
			xj = 0.5 * (lo + hi)
			break
		}
		if ferr != nil {
			return Sheet{}, ferr
		}
	}
	if ferr != nil {
		return Sheet{}, ferr
	}
	f := func(x float64) float64 { return in.sigma(dens(x)) }
	w := xj / sheetFuncPanels
	var first [sheetFuncPanels]float64
	var est float64
	for i := range first {
		first[i] = in.fixed(f, float64(i)*w, float64(i+1)*w, 16)
		est += first[i]
	}
	if in.err != nil || ferr != nil {
		return Sheet{}, firstErr(ferr, in.err)
	}
	var g, errSum float64
	for i := range first {
		v, e := in.adapt(f, float64(i)*w, float64(i+1)*w, first[i], SheetRelTol*math.Abs(est)/sheetFuncPanels, 0)
		g += v
		errSum += e
		if in.err != nil || ferr != nil {
			return Sheet{}, firstErr(ferr, in.err)
		}
	}
	return in.result(g, errSum, xj)
}

// SheetOf returns the sheet resistance of the surface layer of p, from the surface to its
// junction, in material m (its temperature and its model set's mobilities), computed by
// SheetResistanceFunc (see the package documentation). p must be a layer of one dopant type
// on a uniform background of the other type (such as Sum{Erfc{...}, Uniform{...}} or a
// Tabulated profile on a Uniform background): the density of the other type must be the
// same at the surface and at p.Extent().
//
// It returns an error wrapping ErrNoJunction for a profile without junction (the sheet
// resistance of a high–low junction's layer is not separable from the wafer's), an error if
// the background is not uniform, or an error of p or of SheetResistanceFunc.
func SheetOf(p Profile, m *silicon.Material) (Sheet, error) {
	if m == nil {
		return Sheet{}, fmt.Errorf("profile: SheetOf needs a non-nil *silicon.Material")
	}
	maj, err := Majority(p)
	if err != nil {
		return Sheet{}, err
	}
	xj, err := JunctionDepth(p)
	if err != nil {
		return Sheet{}, err
	}
	other := func(x float64) (float64, float64, error) {
		nd, na, err := p.Dopants(x)
		if maj == silicon.Donor {
			return nd, na, err
		}
		return na, nd, err
	}
	_, bg0, err := other(0)
	if err != nil {
		return Sheet{}, err
	}
	ext := math.Max(p.Extent(), xj)
	_, bg1, err := other(ext)
	if err != nil {
		return Sheet{}, err
	}
	if math.Abs(bg1-bg0) > 1e-12*math.Max(bg0, bg1) {
		return Sheet{}, fmt.Errorf("profile: SheetOf: background of the other dopant type is not uniform (%g cm^-3 at the surface, %g cm^-3 at %g cm)", bg0, bg1, ext)
	}
	var ferr error
	dens := func(x float64) float64 {
		v, _, err := other(x)
		if err != nil {
			if ferr == nil {
				ferr = err
			}
			return math.NaN()
		}
		return v
	}
	s, err := SheetResistanceFunc(m, maj, dens, ext, bg0)
	if ferr != nil {
		return Sheet{}, ferr
	}
	return s, err
}

// firstErr returns the first non-nil error.
func firstErr(errs ...error) error {
	for _, e := range errs {
		if e != nil {
			return e
		}
	}
	return nil
}

// integrand evaluates the conductivity of the layer and integrates it; it records the first
// error of the mobility model.
type integrand struct {
	mat   *silicon.Material
	dop   silicon.Dopant
	bg    float64
	err   error
	evals int
	x8    [8]float64 // Gauss–Legendre nodes and weights on [−1, 1]
	w8    [8]float64
	x16   [16]float64
	w16   [16]float64
}

func newIntegrand(m *silicon.Material, dop silicon.Dopant, background float64) (*integrand, error) {
	if m == nil {
		return nil, fmt.Errorf("profile: sheet resistance needs a non-nil *silicon.Material")
	}
	if dop != silicon.Donor && dop != silicon.Acceptor {
		return nil, fmt.Errorf("profile: dopant type dop = %v is not silicon.Donor or silicon.Acceptor", dop)
	}
	if err := checkDensity("profile: sheet resistance", "background density", background); err != nil {
		return nil, err
	}
	in := &integrand{mat: m, dop: dop, bg: background}
	quad.Legendre{}.FixedLocations(in.x8[:], in.w8[:], -1, 1)
	quad.Legendre{}.FixedLocations(in.x16[:], in.w16[:], -1, 1)
	return in, nil
}

// sigma returns the conductivity q μmaj (n − bg) in S/cm at dopant density n (0 at or below
// the background).
func (in *integrand) sigma(n float64) float64 {
	net := n - in.bg
	if !(net > 0) || in.err != nil {
		return 0
	}
	in.evals++
	var mun, mup float64
	var err error
	if in.dop == silicon.Donor {
		mun, mup, err = in.mat.Mobilities(net, 0, n, in.bg)
	} else {
		mun, mup, err = in.mat.Mobilities(0, net, in.bg, n)
	}
	if err != nil {
		in.err = fmt.Errorf("profile: mobility at density %g cm^-3: %w", n, err)
		return 0
	}
	mu := mun
	if in.dop == silicon.Acceptor {
		mu = mup
	}
	return silicon.ElementaryCharge * mu * net
}

// fixed returns the n-point (8 or 16) Gauss–Legendre estimate of ∫_a^b f.
func (in *integrand) fixed(f func(float64) float64, a, b float64, n int) float64 {
	xs, ws := in.x8[:], in.w8[:]
	if n == 16 {
		xs, ws = in.x16[:], in.w16[:]
	}
	c, r := 0.5*(a+b), 0.5*(b-a)
	var s float64
	for i, x := range xs {
		s += ws[i] * f(c+r*x)
	}
	return s * r
}

// adapt integrates f over [a, b], whose 16-point estimate is i16, to absolute tolerance tol
// by bisection, returning the 16-point estimate and the sum of the |16-point − 8-point|
// differences of accepted panels.
func (in *integrand) adapt(f func(float64) float64, a, b, i16, tol float64, depth int) (float64, float64) {
	i8 := in.fixed(f, a, b, 8)
	d := math.Abs(i16 - i8)
	if in.err != nil {
		return 0, 0
	}
	if d <= tol || b-a <= 4e-16*math.Abs(b) {
		return i16, d
	}
	if depth >= sheetMaxDepth || in.evals > sheetMaxEvals {
		in.err = fmt.Errorf("profile: sheet conductance on [%g, %g] cm not integrated to tolerance %g S (difference %g S)",
			a, b, tol, d)
		return 0, 0
	}
	m := 0.5 * (a + b)
	l, el := in.adapt(f, a, m, in.fixed(f, a, m, 16), 0.5*tol, depth+1)
	r, er := in.adapt(f, m, b, in.fixed(f, m, b, 16), 0.5*tol, depth+1)
	return l + r, el + er
}

// result packs the sheet conductance g (S) and its error estimate.
func (in *integrand) result(g, errSum, xj float64) (Sheet, error) {
	if !(g > 0) || math.IsInf(g, 0) || math.IsInf(1/g, 0) {
		return Sheet{}, fmt.Errorf("profile: sheet conductance %g S is not finite and > 0 (or too small for a finite Rsh)", g)
	}
	return Sheet{Rsh: 1 / g, RelErr: errSum / g, XjCm: xj}, nil
}
