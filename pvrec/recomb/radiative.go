package recomb

import (
	"github.com/pvrec/pvrec/pvrec/internal/check"

	"fmt"
	"math"
	"strings"
)

// RelativeRadiative is a model of the relative radiative coefficient B_rel(n, p, T) =
// B(n, p, T)/B_low(T), which describes the reduction of radiative recombination by screening
// at high carrier densities (dimensionless, in (0, 1]). BRel takes the electron and hole
// densities in cm^-3 and the temperature in K.
//
// The package ships no implementation: the parameterisation of P. P. Altermatt et al.
// (NUSOD 2005) is left out because its parameters could not be reproduced with confidence.
// A user who has them can supply it here.
type RelativeRadiative interface {
	BRel(n, p, t float64) (float64, error)
}

// Trupke2003 is band-to-band radiative recombination with the low-injection coefficient
// B_low of T. Trupke, M. A. Green, P. Würfel, P. P. Altermatt, A. Wang, J. Zhao and R. Corkish,
// "Temperature dependence of the radiative recombination coefficient of intrinsic crystalline
// silicon", J. Appl. Phys. 94, 4930 (2003):
//
//	R = f_esc · B_rel(n, p, T) · B_low · (n p − ni,eff²),
//
// with B_low = 4.73e-15 cm³/s at 300 K, B_rel = 1 unless Rel is set, and f_esc the
// photon-recycling factor: the fraction of radiative events whose photon is not reabsorbed in
// the device (1 for no photon recycling, which is how lifetime parameterisations such as
// Richter2012's use B).
//
// Validity. B_low is Trupke's 300 K value; the temperature dependence that Trupke et al.
// measured (and the later one of H. T. Nguyen et al., J. Appl. Phys. 115, 043710 (2014)) is
// not implemented because we could not reproduce its numbers with confidence. The model
// therefore accepts only TMin <= T <= TMax, by default 290–310 K (our choice: room temperature
// around the 300 K of the value); a user who knows B_low at another temperature sets BLow and
// the window. Rate returns an error outside it (errors.Is(err, ErrOutOfRange)).
type Trupke2003 struct {
	BLow           float64           // low-injection radiative coefficient B_low, cm³/s
	EscapeFraction float64           // photon-recycling factor f_esc: fraction of radiative events not reabsorbed, in [0, 1]
	Rel            RelativeRadiative // relative coefficient B_rel(n, p, T); nil means B_rel = 1
	TMin, TMax     float64           // temperature window in which BLow applies, K
}

// NewTrupke2003 returns Trupke2003{BLow: 4.73e-15, EscapeFraction: 1, TMin: 290, TMax: 310}.
func NewTrupke2003() Trupke2003 {
	return Trupke2003{BLow: 4.73e-15, EscapeFraction: 1, TMin: 290, TMax: 310}
}

// String returns "Trupke2003", followed by the photon-recycling factor if it is not 1 and by
// the B_rel model if one is set, e.g. "Trupke2003(f_esc=0.8)".
func (m Trupke2003) String() string {
	s := "Trupke2003"
	var mods []string
	if m.EscapeFraction != 1 {
		mods = append(mods, fmt.Sprintf("f_esc=%g", m.EscapeFraction))
	}
	if m.Rel != nil {
		mods = append(mods, "B_rel "+name(m.Rel))
	}
	if len(mods) > 0 {
		s += "(" + strings.Join(mods, ", ") + ")"
	}
	return s
}

// Rate returns the net radiative rate in cm^-3 s^-1 at s (see Trupke2003). It returns an
// error for an invalid state or parameters, an error of Rel, or T outside [TMin, TMax].
func (m Trupke2003) Rate(s State) (float64, error) {
	if err := s.Validate(); err != nil {
		return 0, err
	}
	if err := check.Positive("recomb: Trupke2003", "BLow", m.BLow, "cm³/s"); err != nil {
		return 0, err
	}
	if err := checkEscape("Trupke2003", m.EscapeFraction); err != nil {
		return 0, err
	}
	if err := check.Window("recomb", "Trupke2003", s.T, m.TMin, m.TMax); err != nil {
		return 0, err
	}
	b := m.BLow * m.EscapeFraction
	if m.Rel != nil {
		rel, err := m.Rel.BRel(s.N, s.P, s.T)
		if err != nil {
			return 0, err
		}
		if !(rel > 0 && rel <= 1) {
			return 0, fmt.Errorf("recomb: Trupke2003: B_rel model %s gives %g; want in (0, 1]", name(m.Rel), rel)
		}
		b *= rel
	}
	return rate("Trupke2003", b*s.Excess)
}

// ConstantRadiative is band-to-band radiative recombination with a constant coefficient B,
// R = f_esc B (n p − ni,eff²), at any temperature (the coefficient is the user's: it applies
// at the temperature it was measured at). Kerr and Cuevas's parameterisation uses it with
// B = 9.5e-15 cm³/s (see NewKerrCuevas2002Intrinsic).
type ConstantRadiative struct {
	B              float64 // radiative coefficient, cm³/s, finite and > 0
	EscapeFraction float64 // photon-recycling factor: fraction of radiative events not reabsorbed, in [0, 1]
}

// String returns "Radiative(B=9.5e-15 cm³/s)" with the model's B (and f_esc if not 1).
func (m ConstantRadiative) String() string {
	if m.EscapeFraction != 1 {
		return fmt.Sprintf("Radiative(B=%g cm³/s, f_esc=%g)", m.B, m.EscapeFraction)
	}
	return fmt.Sprintf("Radiative(B=%g cm³/s)", m.B)
}

// Rate returns f_esc B (n p − ni,eff²) in cm^-3 s^-1, or an error for an invalid state or
// parameters.
func (m ConstantRadiative) Rate(s State) (float64, error) {
	if err := s.Validate(); err != nil {
		return 0, err
	}
	if err := check.Positive("recomb: ConstantRadiative", "B", m.B, "cm³/s"); err != nil {
		return 0, err
	}
	if err := checkEscape("ConstantRadiative", m.EscapeFraction); err != nil {
		return 0, err
	}
	return rate("ConstantRadiative", m.B*m.EscapeFraction*s.Excess)
}

func checkEscape(model string, f float64) error {
	if !(f >= 0 && f <= 1) || math.IsNaN(f) {
		return fmt.Errorf("recomb: %s: photon-recycling factor EscapeFraction must be in [0, 1], got %g", model, f)
	}
	return nil
}
