package silicon

import (
	"errors"
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// Conductivity returns the conductivity σ = q (n μn + p μp) in S/cm at pt, with the
// mobilities of mob (cm²/(V·s)) and the carrier densities pt.N, pt.P (cm^-3). It returns an
// error for an invalid pt (see Point.Validate) or carrier densities above AtomDensity, an
// error from mob, or mobilities not finite and > 0.
func Conductivity(mob Mobility, pt Point) (float64, error) {
	if mob == nil {
		return 0, fmt.Errorf("silicon: Conductivity needs a non-nil Mobility")
	}
	if err := pt.Validate(); err != nil {
		return 0, err
	}
	if err := checkAtoms("density N", pt.N); err != nil {
		return 0, err
	}
	if err := checkAtoms("density P", pt.P); err != nil {
		return 0, err
	}
	mun, mup, err := mob.Mobilities(pt)
	if err != nil {
		return 0, err
	}
	if err := checkMobilityResult(modelName(mob), pt, mun, mup); err != nil {
		return 0, err
	}
	s := ElementaryCharge * (pt.N*mun + pt.P*mup)
	if math.IsInf(s, 0) {
		return 0, fmt.Errorf("silicon: conductivity not representable with mobilities mun = %g, mup = %g cm²/(V·s)", mun, mup)
	}
	return s, nil
}

// Resistivity returns the resistivity 1/σ in Ω·cm at pt (see Conductivity). It returns the
// errors of Conductivity, or an error if pt.N = pt.P = 0 or the carriers are so few that 1/σ
// is not representable (infinite resistivity).
func Resistivity(mob Mobility, pt Point) (float64, error) {
	s, err := Conductivity(mob, pt)
	if err != nil {
		return 0, err
	}
	if r := 1 / s; s > 0 && !math.IsInf(r, 0) {
		return r, nil
	}
	return 0, fmt.Errorf("silicon: resistivity infinite: too few free carriers (N = %g, P = %g cm^-3)", pt.N, pt.P)
}

// ResistivityFromDoping returns the resistivity in Ω·cm of silicon in thermal equilibrium in
// material mat with donor and acceptor densities nd and na in cm^-3 (finite, >= 0;
// compensation allowed): the carrier and ionised dopant densities of mat.Equilibrium(nd, na)
// and the mobilities of mob at them. It returns an error for invalid densities or an error of
// the equilibrium solver or of mob.
func ResistivityFromDoping(mat *Material, mob Mobility, nd, na float64) (float64, error) {
	if err := mat.ready("ResistivityFromDoping"); err != nil {
		return 0, err
	}
	eq, err := mat.Equilibrium(nd, na)
	if err != nil {
		return 0, err
	}
	return Resistivity(mob, Point{T: mat.T(), Nd: eq.NdIon, Na: eq.NaIon, N: eq.N0, P: eq.P0})
}

// ErrNoDoping is reported (through errors.Is) by DopingFromResistivity when no dopant density
// gives the requested resistivity.
var ErrNoDoping = errors.New("silicon: no dopant density gives this resistivity")

// Search range of DopingFromResistivity.
const (
	// ResistivityNMax is the largest total dopant density Nd + Na, in cm^-3, that
	// DopingFromResistivity considers.
	ResistivityNMax = 1e21
	// resistivityNetMinRel is the smallest net doping considered, relative to ni.
	resistivityNetMinRel = 1e-3
	// resistivityScanStep is the step of the bracketing scan in ln(net doping): 4 per decade.
	resistivityScanStep = math.Ln10 / 4
	// resistivityTol is the absolute tolerance on ln(net doping) of the root.
	resistivityTol = 1e-12
)

// DopingFromResistivity returns the density in cm^-3 of dopant dop that gives silicon in
// material mat the resistivity rho in Ω·cm, in the presence of a compensating density comp in
// cm^-3 of the other dopant type (0 for uncompensated silicon), using ResistivityFromDoping.
//
// Method: with N the sought density, the net doping N − comp is searched between 1e-3·ni and
// ResistivityNMax − 2·comp (so that Nd + Na <= ResistivityNMax). A scan in steps of a quarter
// decade, from high doping downwards, brackets the first crossing of ln ρ − ln rho, which
// Brent's method then locates to a relative accuracy of about 1e-12 in the net doping.
// Scanning from high doping selects the root on the side of higher doping where there are
// two: in p-type silicon, ρ rises from the intrinsic value to a maximum (μn + μp)/(2√(μn μp))
// ≈ 1.15 times higher before it falls with doping, because μn > μp.
//
// It returns an error wrapping ErrNoDoping, which states the achievable range, when rho is
// below the resistivity at the largest density or above the largest resistivity found (nearly
// intrinsic silicon); an error for rho not finite and > 0, an invalid dop, or comp invalid or
// not below ResistivityNMax/2; or an error of the equilibrium solver or of mob.
func DopingFromResistivity(mat *Material, mob Mobility, rho float64, dop Dopant, comp float64) (float64, error) {
	if err := mat.ready("DopingFromResistivity"); err != nil {
		return 0, err
	}
	if mob == nil {
		return 0, fmt.Errorf("silicon: DopingFromResistivity needs a non-nil Mobility")
	}
	if err := check.Positive("silicon: DopingFromResistivity", "resistivity rho", rho, "Ω·cm"); err != nil {
		return 0, err
	}
	if dop != Donor && dop != Acceptor {
		return 0, fmt.Errorf("silicon: DopingFromResistivity: dopant type dop = %v is not Donor or Acceptor", dop)
	}
	if err := check.Density("silicon: DopingFromResistivity", "compensating density comp", comp); err != nil {
		return 0, err
	}
	netHi := ResistivityNMax - 2*comp
	netLo := resistivityNetMinRel * mat.Ni()
	if !(netHi > netLo) {
		return 0, fmt.Errorf("silicon: DopingFromResistivity: compensating density comp = %g cm^-3 must be below %g cm^-3",
			comp, 0.5*ResistivityNMax)
	}
	lnRho := math.Log(rho)
	// density returns the sought density at x = ln(net doping), clamped so that rounding
	// cannot push Nd + Na above ResistivityNMax.
	density := func(x float64) float64 { return math.Min(comp+math.Exp(x), ResistivityNMax-comp) }
	// f(x) = ln ρ − ln rho; ρ falls with doping on the branch we want.
	f := func(x float64) (float64, error) {
		nd, na := density(x), comp
		if dop == Acceptor {
			nd, na = comp, nd
		}
		r, err := ResistivityFromDoping(mat, mob, nd, na)
		if err != nil {
			return 0, err
		}
		return math.Log(r) - lnRho, nil
	}
	xLo, xHi := math.Log(netLo), math.Log(netHi)
	fHi, err := f(xHi)
	if err != nil {
		return 0, err
	}
	if fHi > 0 {
		return 0, fmt.Errorf("%w: resistivity rho = %g Ω·cm is below %g Ω·cm, the resistivity at %s density %g cm^-3 (comp = %g cm^-3)",
			ErrNoDoping, rho, math.Exp(fHi+lnRho), dop, density(xHi), comp)
	}
	// Scan downwards; xs, fs keep the scan for the refinement of the maximum below.
	xs, fs := []float64{xHi}, []float64{fHi}
	for a, fa := xHi, fHi; a > xLo; {
		b := math.Max(a-resistivityScanStep, xLo)
		fb, err := f(b)
		if err != nil {
			return 0, err
		}
		if fb >= 0 {
			x, err := brentRoot(f, b, a, fb, fa, resistivityTol)
			if err != nil {
				return 0, err
			}
			return density(x), nil
		}
		xs, fs = append(xs, b), append(fs, fb)
		a, fa = b, fb
	}
	// No crossing on the grid. ρ may still exceed rho between two grid points near its
	// maximum (p-type silicon near intrinsic): refine the largest grid value by golden-section
	// search on its neighbouring interval, and if the maximum reaches rho, take the root on the
	// high-doping side of it.
	k := 0
	for i := range fs {
		if fs[i] > fs[k] {
			k = i
		}
	}
	if k > 0 && k < len(xs)-1 {
		xm, fm, err := goldenMax(f, xs[k+1], xs[k-1])
		if err != nil {
			return 0, err
		}
		if fm >= 0 {
			x, err := brentRoot(f, xm, xs[k-1], fm, fs[k-1], resistivityTol)
			if err != nil {
				return 0, err
			}
			return density(x), nil
		}
		fs[k] = math.Max(fs[k], fm)
	}
	return 0, fmt.Errorf("%w: resistivity rho = %g Ω·cm is above %g Ω·cm, the largest found for %s densities from %g to %g cm^-3 (comp = %g cm^-3, nearly intrinsic silicon)",
		ErrNoDoping, rho, math.Exp(fs[k]+lnRho), dop, density(xLo), density(xHi), comp)
}

// goldenMax returns the position and value of the maximum of f on [a, b] by golden-section
// search (J. Kiefer, Proc. Am. Math. Soc. 4, 502 (1953)) to an absolute tolerance of 1e-9 in
// x. f must be unimodal on [a, b]. Hand-written because gonum's optimize package minimises
// functions of vectors and has no bracketed scalar search.
func goldenMax(f func(float64) (float64, error), a, b float64) (float64, float64, error) {
	const r = 0.6180339887498949 // (√5 − 1)/2
	c, d := b-r*(b-a), a+r*(b-a)
	fc, err := f(c)
	if err != nil {
		return 0, 0, err
	}
	fd, err := f(d)
	if err != nil {
		return 0, 0, err
	}
	for b-a > 1e-9 {
		if fc > fd {
			b, d, fd = d, c, fc
			c = b - r*(b-a)
			if fc, err = f(c); err != nil {
				return 0, 0, err
			}
		} else {
			a, c, fc = c, d, fd
			d = a + r*(b-a)
			if fd, err = f(d); err != nil {
				return 0, 0, err
			}
		}
	}
	if fc > fd {
		return c, fc, nil
	}
	return d, fd, nil
}
