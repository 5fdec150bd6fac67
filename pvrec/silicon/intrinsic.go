package silicon

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// Validity and evaluation shared by the power-law-times-Arrhenius fits of ni:
// ni = a (T/300 K)^e exp(−ta/T).
func arrheniusNi(model string, t, a, e, ta, tmin, tmax float64) (float64, error) {
	if err := check.Temperature("silicon", t); err != nil {
		return 0, err
	}
	if err := check.Window("silicon", model, t, tmin, tmax); err != nil {
		return 0, err
	}
	return checkNi(model, t, a*math.Pow(t/300, e)*math.Exp(-ta/t))
}

// checkNi returns ni, or an error if the model's parameters made it non-finite or <= 0.
func checkNi(model string, t, ni float64) (float64, error) {
	if !(ni > 0) || math.IsInf(ni, 0) || ni > AtomDensity {
		return 0, fmt.Errorf("silicon: %s: parameters give ni = %g cm^-3 at T = %g K; want finite, > 0 and below the atom density %g cm^-3", model, ni, t, AtomDensity)
	}
	return ni, nil
}

// MisiakosTsamakis1993 is the fit of the intrinsic carrier density of silicon measured by
// K. Misiakos and D. Tsamakis, "Accurate measurements of the silicon intrinsic carrier
// density from 78 to 340 K", J. Appl. Phys. 74, 3293 (1993):
//
//	ni(T) = A (T/300 K)^Exp exp(−TA/T),
//
// with A = 5.29e19 cm^-3, Exp = 2.54, TA = 6726 K (9.70e9 cm^-3 at 300 K, the paper's
// headline value). Valid for TMin <= T <= TMax, by default the measured 78–340 K.
type MisiakosTsamakis1993 struct {
	A    float64 // prefactor, cm^-3
	Exp  float64 // temperature exponent, dimensionless
	TA   float64 // activation temperature, K
	TMin float64 // lower end of the validity range, K
	TMax float64 // upper end of the validity range, K
}

// NewMisiakosTsamakis1993 returns MisiakosTsamakis1993 with the paper's parameters.
func NewMisiakosTsamakis1993() MisiakosTsamakis1993 {
	return MisiakosTsamakis1993{A: 5.29e19, Exp: 2.54, TA: 6726, TMin: 78, TMax: 340}
}

// String returns "MisiakosTsamakis1993".
func (MisiakosTsamakis1993) String() string { return "MisiakosTsamakis1993" }

// Ni returns ni in cm^-3 at temperature t in K, or an error outside [TMin, TMax].
func (m MisiakosTsamakis1993) Ni(t float64) (float64, error) {
	return arrheniusNi(m.String(), t, m.A, m.Exp, m.TA, m.TMin, m.TMax)
}

// SproulGreen1991 is the fit of the intrinsic carrier density of silicon of A. B. Sproul and
// M. A. Green, "Improved value for the silicon intrinsic carrier concentration from 275 to
// 375 K", J. Appl. Phys. 70, 846 (1991):
//
//	ni(T) = A (T/300 K)^Exp exp(−TA/T),
//
// with A = 9.38e19 cm^-3, Exp = 2, TA = 6884 K (value from memory). The paper's headline value
// is 1.00e10 cm^-3 at 300 K; the fit as given here evaluates to 1.015e10 cm^-3 there, a 1.5 %
// difference that the rounding of its coefficients does not explain. Valid for
// TMin <= T <= TMax, by default the measured 275–375 K.
type SproulGreen1991 struct {
	A    float64 // prefactor, cm^-3
	Exp  float64 // temperature exponent, dimensionless
	TA   float64 // activation temperature, K
	TMin float64 // lower end of the validity range, K
	TMax float64 // upper end of the validity range, K
}

// NewSproulGreen1991 returns SproulGreen1991 with the parameters given in the type's comment.
func NewSproulGreen1991() SproulGreen1991 {
	return SproulGreen1991{A: 9.38e19, Exp: 2, TA: 6884, TMin: 275, TMax: 375}
}

// String returns "SproulGreen1991".
func (SproulGreen1991) String() string { return "SproulGreen1991" }

// Ni returns ni in cm^-3 at temperature t in K, or an error outside [TMin, TMax].
func (m SproulGreen1991) Ni(t float64) (float64, error) {
	return arrheniusNi(m.String(), t, m.A, m.Exp, m.TA, m.TMin, m.TMax)
}

// Altermatt2003 is the intrinsic carrier density of silicon at 300 K of P. P. Altermatt,
// A. Schenk, F. Geelhaar and G. Heiser, "Reassessment of the intrinsic carrier density in
// crystalline silicon in view of band-gap narrowing", J. Appl. Phys. 93, 1598 (2003):
// ni = 9.65e9 cm^-3 at 300 K. The paper states no temperature dependence of its own, so the
// model is valid only within ±0.01 K of T (300 K) and returns an error elsewhere; for other
// temperatures use Couderc2014, which reproduces this value at 300 K.
type Altermatt2003 struct {
	Value float64 // intrinsic carrier density at T, cm^-3
	T     float64 // the temperature at which Value holds, K
}

// NewAltermatt2003 returns Altermatt2003{Value: 9.65e9, T: 300}.
func NewAltermatt2003() Altermatt2003 { return Altermatt2003{Value: 9.65e9, T: 300} }

// altermattTolK is the accepted |t − T| of Altermatt2003, K.
const altermattTolK = 0.01

// String returns "Altermatt2003".
func (Altermatt2003) String() string { return "Altermatt2003" }

// Ni returns m.Value in cm^-3 for |t − m.T| <= 0.01 K, and an error otherwise.
func (m Altermatt2003) Ni(t float64) (float64, error) {
	if err := check.Temperature("silicon", t); err != nil {
		return 0, err
	}
	if err := check.Window("silicon", m.String(), t, m.T-altermattTolK, m.T+altermattTolK); err != nil {
		return 0, err
	}
	return checkNi(m.String(), t, m.Value)
}

// Couderc2014 is the intrinsic carrier density of silicon of R. Couderc, M. Amara and
// M. Lemiti, "Reassessment of the intrinsic carrier density temperature dependence in
// crystalline silicon", J. Appl. Phys. 115, 093705 (2014):
//
//	ni(T) = A T^Exp exp(−Eg(T)/(2kT)),  T in K,
//
// with Eg(T) from Pässler's model (Passler2002), A = 1.541e15 cm^-3 K^-1.712 and Exp = 1.712.
// With NewPassler2002 it gives 9.666e9 cm^-3 at 300 K, the paper's 9.65e9 cm^-3 (equal to
// Altermatt2003) to 0.2 %, within the ±0.3 % that the three-decimal rounding of Exp allows.
//
// Valid for TMin <= T <= TMax, by default 78–500 K: our choice (78 K is the lowest temperature
// of the Misiakos & Tsamakis data the paper compares with; the paper's own stated range is not
// recorded here), further limited by Gap's range.
type Couderc2014 struct {
	A    float64     // prefactor, cm^-3 K^-Exp
	Exp  float64     // temperature exponent, dimensionless
	Gap  Passler2002 // band-gap model the fit was made with
	TMin float64     // lower end of the validity range, K
	TMax float64     // upper end of the validity range, K
}

// NewCouderc2014 returns Couderc2014 with the paper's parameters and NewPassler2002's gap.
func NewCouderc2014() Couderc2014 {
	return Couderc2014{A: 1.541e15, Exp: 1.712, Gap: NewPassler2002(), TMin: 78, TMax: 500}
}

// String returns "Couderc2014".
func (Couderc2014) String() string { return "Couderc2014" }

// Ni returns ni in cm^-3 at temperature t in K, or an error outside [TMin, TMax] or outside
// the gap model's range.
func (m Couderc2014) Ni(t float64) (float64, error) {
	if err := check.Temperature("silicon", t); err != nil {
		return 0, err
	}
	if err := check.Window("silicon", m.String(), t, m.TMin, m.TMax); err != nil {
		return 0, err
	}
	eg, err := m.Gap.Eg(t)
	if err != nil {
		return 0, err
	}
	return checkNi(m.String(), t, m.A*math.Pow(t, m.Exp)*math.Exp(-eg/(2*BoltzmannEV*t)))
}

// FixedNi is a temperature-independent intrinsic carrier density for hand calculations:
// ni(T) = Value for every 0 < T <= MeltingPoint. NewFixedNi returns 1.00e10 cm^-3, the 300 K value of
// A. B. Sproul and M. A. Green, J. Appl. Phys. 70, 846 (1991) and the round number of hand
// calculations; use it only at the temperature its value belongs to.
type FixedNi struct {
	Value float64 // intrinsic carrier density, cm^-3
}

// NewFixedNi returns FixedNi{Value: 1.00e10}.
func NewFixedNi() FixedNi { return FixedNi{Value: 1.00e10} }

// String returns "FixedNi(1e+10 cm^-3)" with the model's value.
func (m FixedNi) String() string { return fmt.Sprintf("FixedNi(%g cm^-3)", m.Value) }

// Ni returns m.Value in cm^-3 for 0 < t <= MeltingPoint, and an error for an invalid t, a
// t above the melting point, or a non-finite or non-positive Value.
func (m FixedNi) Ni(t float64) (float64, error) {
	if err := checkSolid("FixedNi", t); err != nil {
		return 0, err
	}
	return checkNi(m.String(), t, m.Value)
}
