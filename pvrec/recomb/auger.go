package recomb

import (
	"github.com/pvrec/pvrec/pvrec/internal/check"

	"fmt"
	"math"
)

// Richter2012 is the Auger part of the parameterisation of intrinsic recombination in
// crystalline silicon of A. Richter, S. W. Glunz, F. Werner, J. Schmidt and A. Cuevas,
// "Improved quantitative description of Auger recombination in crystalline silicon",
// Phys. Rev. B 86, 165202 (2012), the package's default Auger model:
//
//	R = (n p − ni,eff²) (Cn g_eeh n0 + Cp g_ehh p0 + Ca Δn^CaExp),
//	g_eeh = 1 + Geeh (1 − tanh((n0/N0eeh)^Eeeh)),
//	g_ehh = 1 + Gehh (1 − tanh((p0/N0ehh)^Eehh)),
//
// with the Coulomb-enhancement factors g_eeh, g_ehh, the equilibrium densities n0, p0 and the
// excess density Δn. The paper's intrinsic rate adds B_rel B_low (n p − ni,eff²), which is
// the separate mechanism Trupke2003 here (see Intrinsic). NewRichter2012 returns the
// published parameters: Cn = 2.5e-31 cm⁶/s, Cp = 8.5e-32 cm⁶/s, Ca = 3.0e-29 cm^5.76/s,
// CaExp = 0.92, Geeh = 13, N0eeh = 3.3e17 cm^-3, Eeeh = 0.66, Gehh = 7.5, N0ehh = 7.0e17
// cm^-3, Eehh = 0.63.
//
// Validity. The parameterisation was fitted to lifetime data measured near 300 K on lowly to
// highly doped silicon at low to high injection (see the paper for the data). At the highest
// doping it tends to the constant coefficients Cn, Cp (g → 1), close to DziewiorSchmid1977,
// and it is evaluated at any doping and injection without error. Rate accepts TMin <= T <= TMax, by default 290–310 K (our choice: room
// temperature around the paper's 300 K), and returns an error outside it
// (errors.Is(err, ErrOutOfRange)).
type Richter2012 struct {
	Cn    float64 // electron–electron–hole Auger coefficient, cm⁶/s
	Cp    float64 // electron–hole–hole Auger coefficient, cm⁶/s
	Ca    float64 // ambipolar coefficient of the injection term, cm^(3+3·CaExp)/s
	CaExp float64 // exponent of Δn in the injection term, dimensionless
	Geeh  float64 // amplitude of the eeh Coulomb enhancement, dimensionless
	N0eeh float64 // density scale of the eeh enhancement, cm^-3
	Eeeh  float64 // exponent of the eeh enhancement, dimensionless
	Gehh  float64 // amplitude of the ehh Coulomb enhancement, dimensionless
	N0ehh float64 // density scale of the ehh enhancement, cm^-3
	Eehh  float64 // exponent of the ehh enhancement, dimensionless

	TMin, TMax float64 // temperature window, K
}

// NewRichter2012 returns Richter2012 with the published parameters (see the type) and the
// window 290–310 K.
func NewRichter2012() Richter2012 {
	return Richter2012{
		Cn: 2.5e-31, Cp: 8.5e-32, Ca: 3.0e-29, CaExp: 0.92,
		Geeh: 13, N0eeh: 3.3e17, Eeeh: 0.66,
		Gehh: 7.5, N0ehh: 7.0e17, Eehh: 0.63,
		TMin: 290, TMax: 310,
	}
}

// String returns "Richter2012".
func (Richter2012) String() string { return "Richter2012" }

// Rate returns the net Auger rate in cm^-3 s^-1 at s (see Richter2012), or an error for an
// invalid state or parameters or T outside [TMin, TMax].
func (m Richter2012) Rate(s State) (float64, error) {
	if err := s.Validate(); err != nil {
		return 0, err
	}
	if err := m.validate(); err != nil {
		return 0, err
	}
	if err := check.Window("recomb", "Richter2012", s.T, m.TMin, m.TMax); err != nil {
		return 0, err
	}
	geeh := 1 + m.Geeh*(1-math.Tanh(powPos(s.N0/m.N0eeh, m.Eeeh)))
	gehh := 1 + m.Gehh*(1-math.Tanh(powPos(s.P0/m.N0ehh, m.Eehh)))
	c := m.Cn*geeh*s.N0 + m.Cp*gehh*s.P0 + m.Ca*powPos(s.Dn, m.CaExp)
	return rate("Richter2012", c*s.Excess)
}

func (m Richter2012) validate() error {
	for _, f := range [...]struct {
		name string
		v    float64
		pos  bool
	}{
		{"Cn", m.Cn, false}, {"Cp", m.Cp, false}, {"Ca", m.Ca, false}, {"CaExp", m.CaExp, true},
		{"Geeh", m.Geeh, false}, {"N0eeh", m.N0eeh, true}, {"Eeeh", m.Eeeh, true},
		{"Gehh", m.Gehh, false}, {"N0ehh", m.N0ehh, true}, {"Eehh", m.Eehh, true},
	} {
		if math.IsNaN(f.v) || math.IsInf(f.v, 0) || f.v < 0 || (f.pos && f.v == 0) {
			want := ">= 0"
			if f.pos {
				want = "> 0"
			}
			return fmt.Errorf("recomb: Richter2012: parameter %s = %g must be finite and %s", f.name, f.v, want)
		}
	}
	return nil
}

// KerrCuevas2002 is the Auger part of the general parameterisation of intrinsic recombination
// of M. J. Kerr and A. Cuevas, "General parameterization of Auger recombination in
// crystalline silicon", J. Appl. Phys. 91, 2473 (2002):
//
//	R = (n p − ni,eff²) (Cn n0^En + Cp p0^Ep + Ca Δn^Ea),
//
// with Cn = 1.8e-24, En = 0.65, Cp = 6e-25, Ep = 0.65, Ca = 3e-27, Ea = 0.8 (cm^-3 and s
// units; each term in cm³/s). The paper's intrinsic lifetime adds the radiative term
// 9.5e-15 (n p − ni²) (see NewKerrCuevas2002Intrinsic). Fitted to lifetime data near 300 K
// over wide ranges of doping and injection (see the paper); Rate accepts TMin <= T <= TMax, by default
// 290–310 K (our choice), and returns an error outside it (errors.Is(err, ErrOutOfRange)).
type KerrCuevas2002 struct {
	Cn, En float64 // electron-density term: coefficient (cm^(3+3En)/s) and exponent
	Cp, Ep float64 // hole-density term: coefficient (cm^(3+3Ep)/s) and exponent
	Ca, Ea float64 // injection term: coefficient (cm^(3+3Ea)/s) and exponent

	TMin, TMax float64 // temperature window, K
}

// NewKerrCuevas2002 returns KerrCuevas2002 with the published parameters (see the type) and the
// window 290–310 K.
func NewKerrCuevas2002() KerrCuevas2002 {
	return KerrCuevas2002{Cn: 1.8e-24, En: 0.65, Cp: 6e-25, Ep: 0.65, Ca: 3e-27, Ea: 0.8, TMin: 290, TMax: 310}
}

// String returns "KerrCuevas2002".
func (KerrCuevas2002) String() string { return "KerrCuevas2002" }

// Rate returns the net Auger rate in cm^-3 s^-1 at s (see KerrCuevas2002), or an error for an
// invalid state or parameters or T outside [TMin, TMax].
func (m KerrCuevas2002) Rate(s State) (float64, error) {
	if err := s.Validate(); err != nil {
		return 0, err
	}
	for _, f := range [...]struct {
		name string
		v    float64
	}{{"Cn", m.Cn}, {"En", m.En}, {"Cp", m.Cp}, {"Ep", m.Ep}, {"Ca", m.Ca}, {"Ea", m.Ea}} {
		if err := check.NonNegative("recomb: KerrCuevas2002 parameter", f.name, f.v, ""); err != nil {
			return 0, err
		}
	}
	if err := check.Window("recomb", "KerrCuevas2002", s.T, m.TMin, m.TMax); err != nil {
		return 0, err
	}
	c := m.Cn*powPos(s.N0, m.En) + m.Cp*powPos(s.P0, m.Ep) + m.Ca*powPos(s.Dn, m.Ea)
	return rate("KerrCuevas2002", c*s.Excess)
}

// Altermatt1997 is the Coulomb-enhanced Auger recombination of lowly injected silicon at 300 K
// of P. P. Altermatt, J. Schmidt, G. Heiser and A. G. Aberle, "Assessment and
// parameterisation of Coulomb-enhanced Auger recombination coefficients in lowly injected
// crystalline silicon", J. Appl. Phys. 82, 4938 (1997):
//
//	R = (n p − ni,eff²) (Cn g_eeh n0 + Cp g_ehh p0),
//	g_eeh = 1 + Geeh (1 − tanh((n0/N0eeh)^Eeeh)),
//	g_ehh = 1 + Gehh (1 − tanh((p0/N0ehh)^Eehh)),
//
// with Cn = 2.8e-31 and Cp = 9.9e-32 cm⁶/s (the coefficients of DziewiorSchmid1977),
// Geeh = Gehh = 44, N0eeh = 3.3e17 and N0ehh = 7.0e17 cm^-3, Eeeh = 0.34, Eehh = 0.29 (the
// 300 K parameters; value from memory). The paper also gives a temperature dependence, which
// is not implemented (not reproduced with confidence).
//
// Validity: 300 K, low injection. Rate accepts TMin <= T <= TMax (default 290–310 K, our
// choice) and Δn <= MaxInjection·(n0 + p0) (default 0.1, our choice of "low injection"), and
// returns an error otherwise (errors.Is(err, ErrOutOfRange)).
type Altermatt1997 struct {
	Cn, Cp            float64 // Auger coefficients without enhancement, cm⁶/s
	Geeh, N0eeh, Eeeh float64 // eeh enhancement: amplitude, density scale (cm^-3), exponent
	Gehh, N0ehh, Eehh float64 // ehh enhancement: amplitude, density scale (cm^-3), exponent
	MaxInjection      float64 // largest accepted Δn/(n0 + p0), dimensionless
	TMin, TMax        float64 // temperature window, K
}

// NewAltermatt1997 returns Altermatt1997 with the 300 K parameters (see the type).
func NewAltermatt1997() Altermatt1997 {
	return Altermatt1997{
		Cn: 2.8e-31, Cp: 9.9e-32,
		Geeh: 44, N0eeh: 3.3e17, Eeeh: 0.34,
		Gehh: 44, N0ehh: 7.0e17, Eehh: 0.29,
		MaxInjection: 0.1, TMin: 290, TMax: 310,
	}
}

// String returns "Altermatt1997".
func (Altermatt1997) String() string { return "Altermatt1997" }

// Rate returns the net Auger rate in cm^-3 s^-1 at s (see Altermatt1997), or an error for an
// invalid state or parameters, T outside [TMin, TMax] or Δn above the low-injection limit.
func (m Altermatt1997) Rate(s State) (float64, error) {
	if err := s.Validate(); err != nil {
		return 0, err
	}
	for _, f := range [...]struct {
		name string
		v    float64
	}{{"Cn", m.Cn}, {"Cp", m.Cp}, {"Geeh", m.Geeh}, {"Gehh", m.Gehh}, {"MaxInjection", m.MaxInjection}} {
		if err := check.NonNegative("recomb: Altermatt1997 parameter", f.name, f.v, ""); err != nil {
			return 0, err
		}
	}
	for _, f := range [...]struct {
		name string
		v    float64
	}{{"N0eeh", m.N0eeh}, {"Eeeh", m.Eeeh}, {"N0ehh", m.N0ehh}, {"Eehh", m.Eehh}} {
		if err := check.Positive("recomb: Altermatt1997 parameter", f.name, f.v, ""); err != nil {
			return 0, err
		}
	}
	if err := check.Window("recomb", "Altermatt1997", s.T, m.TMin, m.TMax); err != nil {
		return 0, err
	}
	if s.Dn > m.MaxInjection*(s.N0+s.P0) {
		lim := m.MaxInjection * (s.N0 + s.P0)
		return 0, check.Rangef("Altermatt1997", "excess density Δn", s.Dn, 0, lim,
			"recomb: Altermatt1997: excess density Δn = %g cm^-3 above the low-injection limit %g·(n0 + p0) = %g cm^-3",
			s.Dn, m.MaxInjection, lim)
	}
	geeh := 1 + m.Geeh*(1-math.Tanh(powPos(s.N0/m.N0eeh, m.Eeeh)))
	gehh := 1 + m.Gehh*(1-math.Tanh(powPos(s.P0/m.N0ehh, m.Eehh)))
	return rate("Altermatt1997", (m.Cn*geeh*s.N0+m.Cp*gehh*s.P0)*s.Excess)
}

// DziewiorSchmid1977 is Auger recombination with the constant coefficients of J. Dziewior and
// W. Schmid, "Auger coefficients for highly doped and highly excited silicon", Appl. Phys.
// Lett. 31, 346 (1977):
//
//	R = (n p − ni,eff²) (Cn n + Cp p),   Cn = 2.8e-31 cm⁶/s,  Cp = 9.9e-32 cm⁶/s.
//
// The coefficients were measured on heavily doped silicon (dopant densities above about
// 1e18 cm^-3), where Coulomb enhancement is screened; at lower doping they underestimate
// Auger recombination (see Richter2012, Altermatt1997). The model is evaluated at any state;
// the user is responsible for applying it where it holds.
type DziewiorSchmid1977 struct {
	Cn float64 // electron–electron–hole coefficient, cm⁶/s
	Cp float64 // electron–hole–hole coefficient, cm⁶/s
}

// NewDziewiorSchmid1977 returns DziewiorSchmid1977{Cn: 2.8e-31, Cp: 9.9e-32}.
func NewDziewiorSchmid1977() DziewiorSchmid1977 { return DziewiorSchmid1977{Cn: 2.8e-31, Cp: 9.9e-32} }

// String returns "DziewiorSchmid1977".
func (DziewiorSchmid1977) String() string { return "DziewiorSchmid1977" }

// Rate returns (n p − ni,eff²)(Cn n + Cp p) in cm^-3 s^-1, or an error for an invalid state or
// parameters.
func (m DziewiorSchmid1977) Rate(s State) (float64, error) {
	return constantAuger("DziewiorSchmid1977", m.Cn, m.Cp, s)
}

// ConstantAuger is Auger recombination with constant, user-chosen coefficients,
// R = (n p − ni,eff²)(Cn n + Cp p), in cm⁶/s, at any state.
type ConstantAuger struct {
	Cn float64 // electron–electron–hole coefficient, cm⁶/s, finite and >= 0
	Cp float64 // electron–hole–hole coefficient, cm⁶/s, finite and >= 0
}

// String returns "ConstantAuger(Cn=…, Cp=… cm⁶/s)" with the model's values.
func (m ConstantAuger) String() string {
	return fmt.Sprintf("ConstantAuger(Cn=%g, Cp=%g cm⁶/s)", m.Cn, m.Cp)
}

// Rate returns (n p − ni,eff²)(Cn n + Cp p) in cm^-3 s^-1, or an error for an invalid state or
// parameters.
func (m ConstantAuger) Rate(s State) (float64, error) {
	return constantAuger("ConstantAuger", m.Cn, m.Cp, s)
}

func constantAuger(model string, cn, cp float64, s State) (float64, error) {
	if err := s.Validate(); err != nil {
		return 0, err
	}
	if !(cn >= 0 && cp >= 0) || math.IsInf(cn+cp, 0) { // names are built on the error path only
		if err := check.NonNegative("recomb: "+model, "Cn", cn, "cm⁶/s"); err != nil {
			return 0, err
		}
		return 0, check.NonNegative("recomb: "+model, "Cp", cp, "cm⁶/s")
	}
	return rate(model, (cn*s.N+cp*s.P)*s.Excess)
}

// powPos returns x^a for finite x >= 0 and finite a > 0 (0 for x = 0) as exp(a ln x). The
// hot Auger rates call it instead of math.Pow, which handles every special case of its
// arguments and costs about three times as much; the relative error, a few times 1e-16 ·
// |a ln x|, stays below 1e-14 for the densities of silicon.
func powPos(x, a float64) float64 {
	if x == 0 {
		return 0
	}
	return math.Exp(a * math.Log(x))
}
