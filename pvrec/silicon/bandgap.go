package silicon

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// Passler2002 is the dispersion-related ("Δ") model of the temperature dependence of the
// fundamental band gap of R. Pässler, "Dispersion-related description of temperature
// dependencies of band gaps in semiconductors", Phys. Rev. B 66, 085201 (2002):
//
//	Eg(T) = Eg0 − αΘ [ (1 − 3Δ²)/(exp(Θ/T) − 1)
//	                 + (3Δ²/2) ( (1 + π²/(3(1+Δ²)) x² + ((3Δ²−1)/4) x³ + (8/3) x⁴ + x⁶)^(1/6) − 1 ) ],
//	x = 2T/Θ,
//
// with Eg0 the gap at 0 K, α the high-temperature limit of −dEg/dT, Θ an effective phonon
// temperature and Δ the phonon dispersion coefficient. NewPassler2002 returns Pässler's
// parameters for silicon (Eg0 = 1.1701 eV, α = 3.23e-4 eV/K, Θ = 446 K, Δ = 0.51; value from
// memory, cross-checked: they give Eg(300 K) = 1.12426 eV, matching the 1.1242 eV of
// M. A. Green, J. Appl. Phys. 67, 2944 (1990), and, combined with Couderc2014, the 9.65e9 cm^-3
// of Couderc et al. to 0.2 %).
//
// Valid for 0 < T <= TMax. The formula is smooth from 0 K upwards; TMax = 500 K is our choice
// (the range over which silicon gap data are usually fitted), not a limit stated in the paper.
// The model is a value and safe for concurrent use.
type Passler2002 struct {
	Eg0   float64 // band gap at 0 K, eV
	Alpha float64 // high-temperature slope α = −dEg/dT as T → ∞, eV/K
	Theta float64 // effective phonon temperature Θ, K
	Delta float64 // phonon dispersion coefficient Δ, dimensionless
	TMax  float64 // upper end of the validity range, K
}

// NewPassler2002 returns Passler2002 with Pässler's parameters for silicon (see the type).
func NewPassler2002() Passler2002 {
	return Passler2002{Eg0: 1.1701, Alpha: 3.23e-4, Theta: 446, Delta: 0.51, TMax: 500}
}

// String returns "Pässler2002".
func (Passler2002) String() string { return "Pässler2002" }

// Eg returns the band gap in eV at temperature t in K. It returns an error for t <= 0, NaN,
// infinite, or above TMax.
func (m Passler2002) Eg(t float64) (float64, error) {
	if err := check.Temperature("silicon", t); err != nil {
		return 0, err
	}
	if err := check.Window("silicon", m.String(), t, 0, m.TMax); err != nil {
		return 0, err
	}
	d2 := m.Delta * m.Delta
	x := 2 * t / m.Theta
	x2 := x * x
	poly := 1 + math.Pi*math.Pi/(3*(1+d2))*x2 + (3*d2-1)/4*x2*x + 8.0/3*x2*x2 + x2*x2*x2
	// Expm1 keeps the Bose–Einstein term accurate at low T, where exp(Θ/T) is huge
	// (the term then tends to 0 without overflow trouble: 1/+Inf = 0).
	be := (1 - 3*d2) / math.Expm1(m.Theta/t)
	disp := 1.5 * d2 * (math.Pow(poly, 1.0/6) - 1)
	eg := m.Eg0 - m.Alpha*m.Theta*(be+disp)
	if math.IsNaN(eg) || math.IsInf(eg, 0) {
		return 0, fmt.Errorf("silicon: %s: parameters give non-finite Eg = %g eV at T = %g K", m, eg, t)
	}
	return eg, nil
}

// FixedGap is a temperature-independent band gap for hand calculations: Eg(T) = Value for
// every 0 < T <= MeltingPoint. NewFixedGap returns 1.1242 eV, the 300 K value of M. A. Green, J. Appl. Phys.
// 67, 2944 (1990); use it only at the temperature its value belongs to.
type FixedGap struct {
	Value float64 // band gap, eV
}

// NewFixedGap returns FixedGap{Value: 1.1242}, Green's 300 K gap (see FixedGap).
func NewFixedGap() FixedGap { return FixedGap{Value: 1.1242} }

// String returns "FixedGap(1.1242 eV)" with the model's value.
func (m FixedGap) String() string { return fmt.Sprintf("FixedGap(%g eV)", m.Value) }

// Eg returns m.Value in eV for 0 < t <= MeltingPoint, and an error for an invalid t, a t
// above the melting point, or a Value not finite and > 0 (the zero FixedGap).
func (m FixedGap) Eg(t float64) (float64, error) {
	if err := checkSolid("FixedGap", t); err != nil {
		return 0, err
	}
	if err := check.Positive("silicon: FixedGap", "band gap Value", m.Value, "eV"); err != nil {
		return 0, err
	}
	return m.Value, nil
}
