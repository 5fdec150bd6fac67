package j0

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"gonum.org/v1/gonum/unit/constant"
)

// q is the elementary charge in C (exact SI value).
const q = float64(constant.ElementaryCharge)

// Base is a uniformly doped, quasi-neutral base region of width W between the edge of the
// junction's space-charge region (x = 0) and a rear surface with recombination velocity S,
// in which minority carriers have lifetime τ and diffusivity D (low injection). Solving the
// minority-carrier diffusion equation with Δn(0) set by the junction voltage and
// D dΔn/dx = −S Δn at x = W gives the saturation current density (textbook result; see the
// package documentation)
//
//	J0 = q (ni,eff²/N) (D/L) · (S L/D + tanh(W/L)) / (1 + (S L/D) tanh(W/L)),   L = sqrt(D τ),
//
// where ni,eff²/N is the equilibrium minority-carrier density. With S = +Inf (an ohmic rear
// contact) the factor is coth(W/L); with S = D/L it is 1 whatever W (the rear then acts as an
// infinitely deep base). See J0LongBase and J0ThinBase for the limits.
type Base struct {
	NiEff  float64 // effective intrinsic carrier density ni,eff, cm^-3, finite and > 0
	Doping float64 // majority-carrier (net dopant) density N, cm^-3, finite and > 0
	Width  float64 // base width W, cm, finite and > 0
	Tau    float64 // minority-carrier lifetime τ, s, finite and > 0
	D      float64 // minority-carrier diffusivity D, cm²/s, finite and > 0
	S      float64 // rear surface recombination velocity S, cm/s, >= 0 (+Inf for an ohmic contact)
}

// NewBase returns the Base of the uniformly doped bulk b with width w in cm, minority
// lifetime tau in s, minority diffusivity d in cm²/s and rear recombination velocity s in
// cm/s (+Inf for an ohmic rear contact). NiEff and Doping are taken from b's equilibrium
// (NiEff = sqrt(n0 p0), Doping = the majority density), so that NiEff²/Doping is the
// equilibrium minority density with band-gap narrowing and degeneracy. It returns an error
// for a nil or zero b or an invalid argument (as J0 checks them).
func NewBase(b *recomb.Bulk, w, tau, d, s float64) (Base, error) {
	if b == nil {
		return Base{}, fmt.Errorf("j0: NewBase: bulk b is nil")
	}
	eq := b.Equilibrium()
	base := Base{NiEff: eq.NiEff, Doping: math.Max(eq.N0, eq.P0), Width: w, Tau: tau, D: d, S: s}
	if err := base.validate("NewBase", true); err != nil {
		return Base{}, err
	}
	return base, nil
}

// String returns a short description, e.g. "Base(W=0.018 cm, τ=0.001 s, D=30 cm²/s, S=10 cm/s)".
func (b Base) String() string {
	return fmt.Sprintf("Base(W=%g cm, τ=%g s, D=%g cm²/s, S=%g cm/s)", b.Width, b.Tau, b.D, b.S)
}

func (b Base) validate(fn string, needS bool) error {
	for _, f := range [...]struct {
		name, unit string
		v          float64
	}{
		{"NiEff", "cm^-3", b.NiEff}, {"Doping", "cm^-3", b.Doping}, {"Width", "cm", b.Width},
		{"Tau", "s", b.Tau}, {"D", "cm²/s", b.D},
	} {
		if !(f.v > 0) || math.IsInf(f.v, 0) || f.v > check.MaxMagnitude || f.v < check.MinPositive { // names on the error path only
			return check.Positive("j0: Base."+fn, f.name, f.v, f.unit)
		}
	}
	if b.NiEff > check.MaxDensity || b.Doping > check.MaxDensity {
		if err := check.Density("j0: Base."+fn, "NiEff", b.NiEff); err != nil {
			return err
		}
		return check.Density("j0: Base."+fn, "Doping", b.Doping)
	}
	if needS {
		return check.NonNegativeOrInf("j0: Base."+fn, "rear recombination velocity S", b.S, "cm/s")
	}
	return nil
}

// minority returns ni,eff²/N in cm^-3 without overflowing ni,eff².
func (b Base) minority() float64 { return b.NiEff * (b.NiEff / b.Doping) }

// J0 returns the saturation current density of the base in A/cm^2 in the general form (see
// Base), for any W/L. It returns an error for a field that is NaN, infinite (except S) or out
// of range.
func (b Base) J0() (float64, error) {
	if err := b.validate("J0", true); err != nil {
		return 0, err
	}
	l := math.Sqrt(b.D * b.Tau)
	th := math.Tanh(b.Width / l)
	r := b.S * l / b.D
	var g float64
	if math.IsInf(r, 1) { // S = +Inf, or so large that S L/D overflows: coth(W/L)
		g = 1 / th
	} else {
		g = (r + th) / (1 + r*th)
	}
	return current("Base.J0", q*b.minority()*b.D/l*g)
}

// J0LongBase returns the long-base limit W >> L of J0 in A/cm^2, J0 = q (ni,eff²/N) D/L,
// independent of W and S. It returns an error for invalid NiEff, Doping, Tau or D (Width is
// not used but must be valid too, for one rule on all of Base).
func (b Base) J0LongBase() (float64, error) {
	if err := b.validate("J0LongBase", false); err != nil {
		return 0, err
	}
	return current("Base.J0LongBase", q*b.minority()*math.Sqrt(b.D/b.Tau))
}

// J0ThinBase returns the thin-base limit W << L of J0 in A/cm^2,
//
//	J0 = q (ni,eff²/N) (S + W/τ) / (1 + S W/D),
//
// the first order of the general form in W/L. It gives q (ni,eff²/N) W/τ for a passivated rear
// (S = 0; recombination in the base volume) and q (ni,eff²/N) D/W for an ohmic rear
// (S = +Inf; the short-base diode). It returns an error for invalid fields.
func (b Base) J0ThinBase() (float64, error) {
	if err := b.validate("J0ThinBase", true); err != nil {
		return 0, err
	}
	if math.IsInf(b.S, 1) {
		return current("Base.J0ThinBase", q*b.minority()*b.D/b.Width)
	}
	return current("Base.J0ThinBase", q*b.minority()*(b.S+b.Width/b.Tau)/(1+b.S*b.Width/b.D))
}

// current returns a computed current density j in A/cm^2, or an error if it overflowed (NaN,
// ±Inf or beyond check.MaxMagnitude); it formats only on the error path.
func current(fn string, j float64) (float64, error) {
	if math.IsNaN(j) || math.IsInf(j, 0) || math.Abs(j) > check.MaxMagnitude {
		return 0, check.Result("j0: "+fn, "J0", j, "A/cm^2")
	}
	return j, nil
}
