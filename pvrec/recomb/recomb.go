package recomb

import (
	"github.com/pvrec/pvrec/pvrec/internal/check"

	"fmt"
	"math"
	"strings"
)

// Mechanism is a bulk recombination mechanism. Rate returns the net recombination
// rate R in cm^-3 s^-1 at the carrier state s in the form R = s.Excess · c(s), where
// s.Excess = n p − ni,eff² and the coefficient c depends on the other fields of s but not on
// Excess. So R vanishes in thermal equilibrium (detailed balance), is positive under
// injection, and R/Excess at Δn = 0 is the low-injection recombination coefficient (which the
// j0 solvers rely on; every implementation must keep this form).
// The lifetime of the mechanism is Δn/R (see Lifetime). Implementations are values, safe for
// concurrent use, and return an error for an invalid state, invalid parameters or a state
// outside their validity range.
type Mechanism interface {
	Rate(s State) (float64, error)
}

// Lifetime returns the lifetime τ = Δn/R in s of mechanism m at state s, for s.Dn > 0.
// It returns +Inf if R = 0 (a mechanism that is switched off, such as a defect density of
// zero), and an error for s.Dn <= 0 (the lifetime at Δn = 0 is a limit, not a ratio), an
// error of m, or a negative or non-finite R.
func Lifetime(m Mechanism, s State) (float64, error) {
	if m == nil {
		return 0, fmt.Errorf("recomb: Lifetime: mechanism m is nil")
	}
	if !(s.Dn > 0) || math.IsInf(s.Dn, 0) {
		return 0, fmt.Errorf("recomb: Lifetime: excess carrier density Δn must be finite and > 0 cm^-3, got %g", s.Dn)
	}
	r, err := m.Rate(s)
	if err != nil {
		return 0, err
	}
	switch {
	case r == 0:
		return math.Inf(1), nil
	case !(r > 0) || math.IsInf(r, 0):
		return 0, fmt.Errorf("recomb: Lifetime: %s gives rate R = %g cm^-3 s^-1 at Δn = %g cm^-3; want finite and > 0",
			name(m), r, s.Dn)
	}
	tau := s.Dn / r
	if math.IsInf(tau, 0) || tau > check.MaxMagnitude { // a rate too small to give a physical lifetime
		return 0, check.Result("recomb: Lifetime of "+name(m), "τ", tau, "s")
	}
	return tau, nil
}

// Sum is the sum of independent mechanisms, itself a Mechanism: the effective bulk
// lifetime 1/τ = Σ 1/τ_i is Lifetime(Sum{...}, s). An empty Sum has rate 0.
type Sum []Mechanism

// Rate returns the sum of the rates of the mechanisms in cm^-3 s^-1, or the first error.
func (m Sum) Rate(s State) (float64, error) {
	var r float64
	for i, mech := range m {
		if mech == nil {
			return 0, fmt.Errorf("recomb: Sum: mechanism %d is nil", i)
		}
		ri, err := mech.Rate(s)
		if err != nil {
			return 0, err
		}
		r += ri
	}
	return rate("Sum", r)
}

// String returns the names of the mechanisms joined by " + ", e.g.
// "Intrinsic(Richter2012 + Trupke2003) + Fe_i".
func (m Sum) String() string {
	parts := make([]string, len(m))
	for i, mech := range m {
		parts[i] = name(mech)
	}
	return strings.Join(parts, " + ")
}

// Intrinsic is the intrinsic recombination of silicon, Auger plus radiative, as one named
// mechanism: R = R_Auger + R_rad. NewIntrinsic returns the default pairing of
// A. Richter, S. W. Glunz, F. Werner, J. Schmidt and A. Cuevas, Phys. Rev. B 86, 165202
// (2012): Richter2012 Auger with the radiative coefficient B_low of Trupke2003 (without the
// relative coefficient B_rel, see Trupke2003).
type Intrinsic struct {
	Auger     Mechanism // Auger mechanism, e.g. Richter2012
	Radiative Mechanism // radiative mechanism, e.g. Trupke2003
}

// NewIntrinsic returns Intrinsic{Auger: NewRichter2012(), Radiative: NewTrupke2003()}.
func NewIntrinsic() Intrinsic {
	return Intrinsic{Auger: NewRichter2012(), Radiative: NewTrupke2003()}
}

// NewKerrCuevas2002Intrinsic returns the intrinsic recombination of M. J. Kerr and A. Cuevas,
// J. Appl. Phys. 91, 2473 (2002): KerrCuevas2002 Auger with the constant radiative coefficient
// B = 9.5e-15 cm³/s (of H. Schlangenotto, H. Maeder and W. Gerlach, Phys. Status Solidi A 21,
// 357 (1974)) that their parameterisation includes.
func NewKerrCuevas2002Intrinsic() Intrinsic {
	return Intrinsic{Auger: NewKerrCuevas2002(), Radiative: ConstantRadiative{B: 9.5e-15, EscapeFraction: 1}}
}

// Rate returns R_Auger + R_rad in cm^-3 s^-1, or an error if a part is nil or fails.
func (m Intrinsic) Rate(s State) (float64, error) {
	if m.Auger == nil || m.Radiative == nil {
		return 0, fmt.Errorf("recomb: Intrinsic: Auger and Radiative must both be set")
	}
	ra, err := m.Auger.Rate(s)
	if err != nil {
		return 0, err
	}
	rr, err := m.Radiative.Rate(s)
	if err != nil {
		return 0, err
	}
	return rate("Intrinsic", ra+rr)
}

// String returns "Intrinsic(Richter2012 + Trupke2003)" with the parts' names.
func (m Intrinsic) String() string {
	return fmt.Sprintf("Intrinsic(%s + %s)", name(m.Auger), name(m.Radiative))
}

// name returns the String of m if it has one, else its Go type.
func name(m any) string {
	switch v := m.(type) {
	case nil:
		return "<nil>"
	case fmt.Stringer:
		return v.String()
	}
	return strings.TrimPrefix(fmt.Sprintf("%T", m), "recomb.")
}

// DiffusionLength returns the diffusion length L = sqrt(D τ) in cm for lifetime tau in s and
// diffusivity d in cm²/s (both finite and > 0; tau = +Inf gives L = +Inf). Use the minority
// diffusivity in low injection and silicon.AmbipolarDiffusivity otherwise (textbook relation, e.g.
// S. M. Sze and K. K. Ng, Physics of Semiconductor Devices, 3rd ed., Wiley 2007).
func DiffusionLength(tau, d float64) (float64, error) {
	if math.IsNaN(tau) || tau <= 0 {
		return 0, fmt.Errorf("recomb: DiffusionLength: lifetime tau must be > 0 s, got %g", tau)
	}
	if err := check.Positive("recomb: DiffusionLength", "diffusivity d", d, "cm²/s"); err != nil {
		return 0, err
	}
	if math.IsInf(tau, 1) {
		return math.Inf(1), nil
	}
	if err := check.Positive("recomb: DiffusionLength", "lifetime tau", tau, "s"); err != nil {
		return 0, err
	}
	return math.Sqrt(d * tau), nil
}

// rate returns r, or an error if the rate of model overflowed (NaN, ±Inf or beyond
// check.MaxMagnitude): the last check of every Rate. It formats only on the error path.
func rate(model string, r float64) (float64, error) {
	if math.IsNaN(r) || math.IsInf(r, 0) || math.Abs(r) > check.MaxMagnitude {
		return 0, check.Result("recomb: "+model, "rate R", r, "cm^-3 s^-1")
	}
	return r, nil
}
