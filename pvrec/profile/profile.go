package profile

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Profile is a doping profile: the donor and acceptor densities of silicon versus the depth x
// below the front surface (x = 0). Uniform, Erfc, Gaussian, Sum, Scaled and Tabulated implement it;
// a user type may too.
type Profile interface {
	// Dopants returns the donor and acceptor densities nd, na in cm^-3 at depth x in cm
	// (finite, >= 0). It returns an error for an invalid x or invalid parameters.
	Dopants(x float64) (nd, na float64, err error)
	// Extent returns a depth in cm (finite, >= 0) that holds every feature of the profile:
	// beyond it the densities change by less than 1e-15 of their largest value. A uniform
	// profile has extent 0. Searches (junction depth, dose) look no deeper.
	Extent() float64
}

// MaxDepthCm is the largest depth and length in cm that the package accepts in profile
// parameters (Erfc.Length, Gaussian.Length and Center), tabulated and CSV depths, the bounds
// of Dose and the layers of SheetResistance: 10 cm, a hundred times the thickness of the
// thickest wafers (our choice), so that extents, doses and sheet conductances stay finite and
// meaningful. Dopants accepts any finite depth x >= 0.
const MaxDepthCm = 10.0

// checkDensity returns an error unless v is a finite density >= 0 cm^-3 and at most the
// silicon atom density (a range error); ctx and name are constants.
func checkDensity(ctx, name string, v float64) error {
	if err := check.Density(ctx, name, v); err != nil {
		return err
	}
	if v > silicon.AtomDensity {
		return check.Rangef(ctx, name, v, 0, silicon.AtomDensity,
			"%s: %s = %g cm^-3 above the silicon atom density %g cm^-3", ctx, name, v, silicon.AtomDensity)
	}
	return nil
}

// checkLength returns an error unless v is a finite length > 0 cm (>= 0 if zero is true) and
// at most MaxDepthCm (a range error); ctx and name are constants.
func checkLength(ctx, name string, v float64, zero bool) error {
	var err error
	if zero {
		err = check.NonNegative(ctx, name, v, "cm")
	} else {
		err = check.Positive(ctx, name, v, "cm")
	}
	if err != nil {
		return err
	}
	if v > MaxDepthCm {
		return check.Rangef(ctx, name, v, 0, MaxDepthCm,
			"%s: %s = %g cm beyond MaxDepthCm = %g cm", ctx, name, v, MaxDepthCm)
	}
	return nil
}

// Net returns the net doping nd − na in cm^-3 of p at depth x in cm: positive in n-type,
// negative in p-type silicon. It returns an error of p.
func Net(p Profile, x float64) (float64, error) {
	if p == nil {
		return 0, fmt.Errorf("profile: Net: profile p is nil")
	}
	nd, na, err := p.Dopants(x)
	if err != nil {
		return 0, err
	}
	return nd - na, nil
}

// split returns (n, 0) for a donor and (0, n) for an acceptor, or an error for an invalid
// dopant.
func split(model string, d silicon.Dopant, n float64) (nd, na float64, err error) {
	switch d {
	case silicon.Donor:
		return n, 0, nil
	case silicon.Acceptor:
		return 0, n, nil
	}
	return 0, 0, fmt.Errorf("profile: %s: Dopant must be silicon.Donor or silicon.Acceptor, got %d", model, d)
}

// Uniform is a constant dopant density N of one type at every depth: a wafer's background
// doping, or a uniformly doped region for hand calculations.
//
// The zero Uniform has no valid Dopant: its Dopants returns an error.
type Uniform struct {
	Dopant silicon.Dopant // silicon.Donor or silicon.Acceptor
	N      float64        // dopant density, cm^-3, finite, >= 0 and at most silicon.AtomDensity
}

// Dopants returns N as donor or acceptor density in cm^-3 at any valid depth x in cm.
func (u Uniform) Dopants(x float64) (nd, na float64, err error) {
	if err := check.NonNegative("profile: Uniform", "depth x", x, "cm"); err != nil {
		return 0, 0, err
	}
	if err := checkDensity("profile: Uniform", "density N", u.N); err != nil {
		return 0, 0, err
	}
	return split("Uniform", u.Dopant, u.N)
}

// Extent returns 0: a uniform profile has no feature.
func (Uniform) Extent() float64 { return 0 }

// String returns e.g. "Uniform(acceptor 1e+16 cm^-3)".
func (u Uniform) String() string { return fmt.Sprintf("Uniform(%v %g cm^-3)", u.Dopant, u.N) }

// Erfc is the complementary-error-function profile of a diffusion from a constant surface
// source,
//
//	N(x) = Surface · erfc(x / Length),
//
// with Length = 2 sqrt(D t) for a constant diffusivity D and diffusion time t (the textbook
// solution of Fick's second law, e.g. S. M. Sze and K. K. Ng, Physics of Semiconductor
// Devices, 3rd ed., Wiley 2007). Its dose is Surface · Length / sqrt(π) (see Dose). Add a
// background with Sum. The zero Erfc is invalid (zero Length): its methods return errors.
type Erfc struct {
	Dopant  silicon.Dopant // silicon.Donor or silicon.Acceptor
	Surface float64        // surface density N(0), cm^-3, finite, >= 0 and at most silicon.AtomDensity
	Length  float64        // characteristic length, cm, finite, > 0 and at most MaxDepthCm
}

func (e Erfc) validate() error {
	if err := checkDensity("profile: Erfc", "surface density Surface", e.Surface); err != nil {
		return err
	}
	return checkLength("profile: Erfc", "characteristic length Length", e.Length, false)
}

// Dopants returns the density of the profile in cm^-3 at depth x in cm, as donor or acceptor
// density, or an error for invalid x or parameters.
func (e Erfc) Dopants(x float64) (nd, na float64, err error) {
	if err := check.NonNegative("profile: Erfc", "depth x", x, "cm"); err != nil {
		return 0, 0, err
	}
	if err := e.validate(); err != nil {
		return 0, 0, err
	}
	return split("Erfc", e.Dopant, e.Surface*math.Erfc(x/e.Length))
}

// Extent returns 6.5 Length (erfc(6.5) = 4e-20); 0 for invalid parameters.
func (e Erfc) Extent() float64 {
	if e.validate() != nil {
		return 0
	}
	return 6.5 * e.Length
}

// Dose returns the dose ∫₀^∞ N dx = Surface·Length/sqrt(π) in cm^-2, or an error for invalid
// parameters.
func (e Erfc) Dose() (float64, error) {
	if err := e.validate(); err != nil {
		return 0, err
	}
	return e.Surface * e.Length / math.SqrtPi, nil
}

// String returns e.g. "Erfc(donor 1e+20 cm^-3, L=1e-05 cm)".
func (e Erfc) String() string {
	return fmt.Sprintf("Erfc(%v %g cm^-3, L=%g cm)", e.Dopant, e.Surface, e.Length)
}

// Gaussian is the Gaussian profile of a diffusion from a limited source (Center = 0) or of an
// ion implantation (Center = projected range),
//
//	N(x) = Peak · exp(−((x − Center) / Length)²),
//
// with Length = 2 sqrt(D t) for a drive-in from a surface source (textbook solution of
// Fick's second law, e.g. Sze and Ng 2007, see Erfc) and Length = sqrt(2) ΔRp for an implant
// of straggle ΔRp. Only depths x >= 0 belong to the silicon; Dose integrates over them. The
// zero Gaussian is invalid (zero Length): its methods return errors.
type Gaussian struct {
	Dopant silicon.Dopant // silicon.Donor or silicon.Acceptor
	Peak   float64        // peak density, cm^-3, finite, >= 0 and at most silicon.AtomDensity
	Center float64        // depth of the peak, cm, finite, |Center| <= MaxDepthCm (negative: above the surface)
	Length float64        // characteristic length, cm, finite, > 0 and at most MaxDepthCm
}

func (g Gaussian) validate() error {
	if err := checkDensity("profile: Gaussian", "peak density Peak", g.Peak); err != nil {
		return err
	}
	if err := check.Finite("profile: Gaussian", "peak depth Center", g.Center, "cm"); err != nil {
		return err
	}
	if math.Abs(g.Center) > MaxDepthCm {
		return check.Rangef("profile: Gaussian", "peak depth Center", g.Center, -MaxDepthCm, MaxDepthCm,
			"profile: Gaussian: peak depth Center = %g cm beyond ±MaxDepthCm = %g cm", g.Center, MaxDepthCm)
	}
	return checkLength("profile: Gaussian", "characteristic length Length", g.Length, false)
}

// Dopants returns the density of the profile in cm^-3 at depth x in cm, as donor or acceptor
// density, or an error for invalid x or parameters.
func (g Gaussian) Dopants(x float64) (nd, na float64, err error) {
	if err := check.NonNegative("profile: Gaussian", "depth x", x, "cm"); err != nil {
		return 0, 0, err
	}
	if err := g.validate(); err != nil {
		return 0, 0, err
	}
	z := (x - g.Center) / g.Length
	return split("Gaussian", g.Dopant, g.Peak*math.Exp(-z*z))
}

// Extent returns max(0, Center + 6.5 Length) (exp(−6.5²) = 4e-19); 0 for invalid parameters.
func (g Gaussian) Extent() float64 {
	if g.validate() != nil {
		return 0
	}
	return math.Max(0, g.Center+6.5*g.Length)
}

// Dose returns the dose in the silicon, ∫₀^∞ N dx = Peak·Length·(sqrt(π)/2)·(1 + erf(Center/Length))
// in cm^-2, or an error for invalid parameters.
func (g Gaussian) Dose() (float64, error) {
	if err := g.validate(); err != nil {
		return 0, err
	}
	return g.Peak * g.Length * math.SqrtPi / 2 * math.Erfc(-g.Center/g.Length), nil
}

// String returns e.g. "Gaussian(acceptor 1e+19 cm^-3 at 0 cm, L=5e-05 cm)".
func (g Gaussian) String() string {
	return fmt.Sprintf("Gaussian(%v %g cm^-3 at %g cm, L=%g cm)", g.Dopant, g.Peak, g.Center, g.Length)
}

// Sum is the superposition of profiles: the donor and acceptor densities of its terms add.
// A diffusion on a wafer is Sum{Erfc{...}, Uniform{...}}, with the background of either type.
// An empty (or nil) Sum is undoped silicon.
type Sum []Profile

// Dopants returns the summed donor and acceptor densities in cm^-3 at depth x in cm, or the
// first error of a term, or a range error if a sum exceeds the silicon atom density.
func (s Sum) Dopants(x float64) (nd, na float64, err error) {
	if err := check.NonNegative("profile: Sum", "depth x", x, "cm"); err != nil {
		return 0, 0, err
	}
	for i, p := range s {
		if p == nil {
			return 0, 0, fmt.Errorf("profile: Sum: term %d is nil", i)
		}
		d, a, err := p.Dopants(x)
		if err != nil {
			return 0, 0, fmt.Errorf("profile: Sum term %d: %w", i, err)
		}
		nd += d
		na += a
	}
	if err := checkDensity("profile: Sum", "summed donor density", nd); err != nil {
		return 0, 0, err
	}
	if err := checkDensity("profile: Sum", "summed acceptor density", na); err != nil {
		return 0, 0, err
	}
	return nd, na, nil
}

// Extent returns the largest extent of the terms.
func (s Sum) Extent() float64 {
	var e float64
	for _, p := range s {
		if p != nil {
			e = math.Max(e, p.Extent())
		}
	}
	return e
}

// String returns the terms joined by " + ".
func (s Sum) String() string {
	out := ""
	for i, p := range s {
		if i > 0 {
			out += " + "
		}
		out += fmt.Sprint(p)
	}
	return out
}

// termGrid is the number of search points per analytic term.
const termGrid = 64

// searchPoints returns depths in cm that resolve the features of p: termGrid equal steps over
// each analytic term's feature range and the data depths of tabulated terms; nil for an
// unknown Profile type (the caller then uses a fine uniform grid) or a uniform one.
func searchPoints(p Profile) (xs []float64, known bool) {
	span := func(a, b float64) []float64 {
		out := make([]float64, termGrid+1)
		for i := range out {
			out[i] = a + (b-a)*float64(i)/termGrid
		}
		return out
	}
	switch v := p.(type) {
	case Uniform:
		return nil, true
	case Erfc:
		return span(0, v.Extent()), true
	case Gaussian:
		return span(math.Max(0, v.Center-6.5*v.Length), v.Extent()), true
	case *Tabulated:
		// A copy: the callers append to and sort the result, which must not touch the data.
		return append([]float64(nil), v.depth...), true
	case Sum:
		for _, t := range v {
			if t == nil {
				continue
			}
			k, ok := searchPoints(t)
			if !ok {
				return nil, false
			}
			xs = append(xs, k...)
		}
		return xs, true
	case Scaled:
		if v.validate() != nil {
			return nil, false
		}
		k, ok := searchPoints(v.Profile)
		if !ok {
			return nil, false
		}
		return v.mapDepths(k), true
	}
	return nil, false
}

// knots returns the depths in cm at which p has kinks (the data depths of tabulated profiles),
// so that quadratures can split there.
func knots(p Profile) []float64 {
	switch v := p.(type) {
	case *Tabulated:
		if v.empty() {
			return nil
		}
		return v.depth
	case Sum:
		var k []float64
		for _, t := range v {
			k = append(k, knots(t)...)
		}
		return k
	case Scaled:
		if v.validate() != nil {
			return nil
		}
		return v.mapDepths(knots(v.Profile))
	}
	return nil
}
