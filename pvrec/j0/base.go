package j0

import (
	"fmt"
	"math"

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
// cm/s. NiEff and Doping are taken from b's equilibrium (NiEff = sqrt(n0 p0), Doping = the
// majority density), so that NiEff²/Doping is the equilibrium minority density with band-gap
// narrowing and degeneracy. The arguments are checked by J0.
func NewBase(b *recomb.Bulk, w, tau, d, s float64) (Base, error) {
	if b == nil {
		return Base{}, fmt.Errorf("j0: NewBase: bulk b is nil")
	}
	eq := b.Equilibrium()
	return Base{NiEff: eq.NiEff, Doping: math.Max(eq.N0, eq.P0), Width: w, Tau: tau, D: d, S: s}, nil
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
		if math.IsNaN(f.v) || math.IsInf(f.v, 0) || f.v <= 0 {
			return fmt.Errorf("j0: %s: %s must be finite and > 0 %s, got %g", fn, f.name, f.unit, f.v)
		}
	}
	if needS && (math.IsNaN(b.S) || b.S < 0) {
		return fmt.Errorf("j0: %s: rear recombination velocity S must be >= 0 cm/s (or +Inf), got %g", fn, b.S)
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
	return q * b.minority() * b.D / l * g, nil
}

// J0LongBase returns the long-base limit W >> L of J0 in A/cm^2, J0 = q (ni,eff²/N) D/L,
// independent of W and S. It returns an error for invalid NiEff, Doping, Tau or D (Width is
// not used but must be valid too, for one rule on all of Base).
func (b Base) J0LongBase() (float64, error) {
	if err := b.validate("J0LongBase", false); err != nil {
		return 0, err
	}
	return q * b.minority() * math.Sqrt(b.D/b.Tau), nil
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
		return q * b.minority() * b.D / b.Width, nil
	}
	return q * b.minority() * (b.S + b.Width/b.Tau) / (1 + b.S*b.Width/b.D), nil
}
