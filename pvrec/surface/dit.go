package surface

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// Energies of interface states are given as e = E − Ei in eV, measured from the effective
// intrinsic level Ei of the bulk: the level at which the SRH emission densities equal ni,eff,
// n1 = ni,eff exp(e/kT) and p1 = ni,eff exp(−e/kT). In silicon Ei lies within about 1 meV
// of midgap. The conduction- and valence-band edges are at e = kT ln(Nc/ni,eff) and
// e = −kT ln(Nv/ni,eff) (about ±0.56 eV at 300 K); ExtendedSRH integrates between them.

// DitDistribution is the energy distribution of interface-state density of a
// dielectric–silicon interface.
type DitDistribution interface {
	// Density returns Dit in cm^-2 eV^-1 at e = E − Ei in eV (finite, >= 0).
	Density(e float64) float64
	// Breakpoints returns the energies (E − Ei, eV) at which Density has a kink, a step or a
	// feature narrower than kT, so that the integration over energy puts panel ends there.
	// It may return nil for a distribution smooth on the scale of kT.
	Breakpoints() []float64
	// String returns a short description, e.g. "ConstantDit(1e+11 cm^-2 eV^-1)".
	String() string
}

// CrossSection is the energy dependence of a capture cross section of interface states.
type CrossSection interface {
	// Sigma returns the capture cross section in cm^2 (finite, > 0) at e = E − Ei in eV.
	Sigma(e float64) float64
	// Breakpoints is as for DitDistribution.
	Breakpoints() []float64
	// String returns a short description.
	String() string
}

// ConstantDit is an energy-independent interface-state density D in cm^-2 eV^-1 across the
// whole gap.
type ConstantDit struct {
	D float64 // interface-state density, cm^-2 eV^-1
}

// Density returns m.D.
func (m ConstantDit) Density(e float64) float64 { return m.D }

// Breakpoints returns nil.
func (ConstantDit) Breakpoints() []float64 { return nil }

// String returns e.g. "ConstantDit(1e+11 cm^-2 eV^-1)".
func (m ConstantDit) String() string { return fmt.Sprintf("ConstantDit(%g cm^-2 eV^-1)", m.D) }

// UShapedDit is the U-shaped interface-state density typical of thermally oxidised and
// dielectric-passivated silicon, a flat midgap level rising exponentially towards both
// band edges:
//
//	Dit(e) = Mid + TailC exp((e − Ec)/WidthC) + TailV exp((Ev − e)/WidthV),
//
// so that Dit is about Mid + TailC at the conduction-band edge e = Ec and Mid + TailV at the
// valence-band edge e = Ev (the other tail adds TailV exp(−(Ec − Ev)/WidthV), negligible for
// widths of a tenth of the gap). The shape is the common description (no source); its parameters
// are the user's. Energies are E − Ei in eV.
type UShapedDit struct {
	Mid    float64 // midgap density, cm^-2 eV^-1
	TailC  float64 // excess density at the conduction-band edge, cm^-2 eV^-1
	TailV  float64 // excess density at the valence-band edge, cm^-2 eV^-1
	Ec     float64 // conduction-band edge position E − Ei, eV (about +0.56 in silicon at 300 K)
	Ev     float64 // valence-band edge position E − Ei, eV (about −0.56 in silicon at 300 K)
	WidthC float64 // characteristic energy of the conduction-band tail, eV (> 0)
	WidthV float64 // characteristic energy of the valence-band tail, eV (> 0)
}

// Density returns Dit in cm^-2 eV^-1 at e = E − Ei in eV. The distribution describes the
// gap: more than ditEdgeMargin = 0.5 eV outside [Ev, Ec] it keeps its value there, so that it
// never overflows (the integral of ExtendedSRH stays within a few kT of the edges). It returns
// 0 for malformed parameters, which Validate reports (ExtendedSRH calls it).
func (m UShapedDit) Density(e float64) float64 {
	if !m.ok() {
		return 0
	}
	e = math.Max(m.Ev-ditEdgeMargin, math.Min(m.Ec+ditEdgeMargin, e))
	return m.Mid + m.TailC*math.Exp((e-m.Ec)/m.WidthC) + m.TailV*math.Exp((m.Ev-e)/m.WidthV)
}

// ditEdgeMargin is how far beyond its band edges, in eV, UShapedDit follows its formula.
const ditEdgeMargin = 0.5

// minTailWidth is the narrowest tail UShapedDit accepts, eV: 1 meV, far below kT at any
// temperature of interest (our bound, so that exp((e − Ec)/WidthC) cannot overflow).
const minTailWidth = 1e-3

// ok reports whether Validate would accept m, without building an error: Density is evaluated
// at every quadrature node.
func (m UShapedDit) ok() bool {
	return m.Mid >= 0 && m.TailC >= 0 && m.TailV >= 0 &&
		m.Mid <= check.MaxMagnitude && m.TailC <= check.MaxMagnitude && m.TailV <= check.MaxMagnitude &&
		m.WidthC >= minTailWidth && m.WidthV >= minTailWidth && m.WidthC <= check.MaxMagnitude && m.WidthV <= check.MaxMagnitude &&
		m.Ev < m.Ec && !math.IsInf(m.Ec-m.Ev, 0)
}

// Validate returns an error unless the densities are finite and >= 0, the widths finite and
// at least 1 meV, and Ev < Ec.
func (m UShapedDit) Validate() error {
	for _, f := range [...]struct {
		name string
		v    float64
	}{{"Mid", m.Mid}, {"TailC", m.TailC}, {"TailV", m.TailV}} {
		if err := check.NonNegative("surface: UShapedDit", f.name, f.v, "cm^-2 eV^-1"); err != nil {
			return err
		}
	}
	for _, f := range [...]struct {
		name string
		v    float64
	}{{"WidthC", m.WidthC}, {"WidthV", m.WidthV}} {
		if err := check.Positive("surface: UShapedDit", f.name, f.v, "eV"); err != nil {
			return err
		}
		if f.v < minTailWidth {
			return check.Range("surface", "UShapedDit", f.name, "eV", f.v, minTailWidth, math.Inf(1))
		}
	}
	if !(m.Ev < m.Ec) || math.IsInf(m.Ec-m.Ev, 0) {
		return fmt.Errorf("surface: UShapedDit: band edges must be finite with Ev < Ec, got Ev = %g, Ec = %g eV", m.Ev, m.Ec)
	}
	return nil
}

// Breakpoints returns nil: the exponential tails are smooth for the integration rule.
func (UShapedDit) Breakpoints() []float64 { return nil }

// String returns e.g. "UShapedDit(mid 1e+10, tails 1e+13/1e+13 cm^-2 eV^-1)".
func (m UShapedDit) String() string {
	return fmt.Sprintf("UShapedDit(mid %g, tails %g/%g cm^-2 eV^-1)", m.Mid, m.TailC, m.TailV)
}

// GaussianDit is a Gaussian band of interface states, such as the Pb-centre bands of
// oxidised silicon:
//
//	Dit(e) = Peak exp(−(e − E0)² / (2 Width²)),
//
// with the total density Peak·Width·sqrt(2π) cm^-2. Energies are E − Ei in eV.
type GaussianDit struct {
	Peak  float64 // peak density, cm^-2 eV^-1
	E0    float64 // peak position E − Ei, eV
	Width float64 // standard deviation, eV (> 0)
}

// Density returns Dit in cm^-2 eV^-1 at e = E − Ei in eV, or 0 for malformed parameters,
// which Validate reports (ExtendedSRH calls it).
func (m GaussianDit) Density(e float64) float64 {
	if !(m.Peak >= 0 && m.Peak <= check.MaxMagnitude && m.Width >= check.MinPositive && m.Width <= check.MaxMagnitude &&
		math.Abs(m.E0) <= check.MaxMagnitude) { // what Validate checks, without building an error
		return 0
	}
	z := (e - m.E0) / m.Width
	return m.Peak * math.Exp(-0.5*z*z)
}

// Validate returns an error unless Peak is finite and >= 0, E0 finite and Width finite and > 0.
func (m GaussianDit) Validate() error {
	if err := check.NonNegative("surface: GaussianDit", "Peak", m.Peak, "cm^-2 eV^-1"); err != nil {
		return err
	}
	if err := check.Finite("surface: GaussianDit", "E0", m.E0, "eV"); err != nil {
		return err
	}
	return check.Positive("surface: GaussianDit", "Width", m.Width, "eV")
}

// Breakpoints returns E0 + k·Width for k = −8..8, so that panels are no wider than Width
// near the peak; beyond 8 widths Dit has fallen below 1.3e-14 of its peak.
func (m GaussianDit) Breakpoints() []float64 {
	b := make([]float64, 0, 17)
	for k := -8; k <= 8; k++ {
		b = append(b, m.E0+float64(k)*m.Width)
	}
	return b
}

// String returns e.g. "GaussianDit(1e+12 cm^-2 eV^-1 at 0.25 eV, width 0.1 eV)".
func (m GaussianDit) String() string {
	return fmt.Sprintf("GaussianDit(%g cm^-2 eV^-1 at %g eV, width %g eV)", m.Peak, m.E0, m.Width)
}

// TabulatedDit is an interface-state density given at energies E (E − Ei, eV, strictly
// increasing, at least two) with densities D (cm^-2 eV^-1, finite, >= 0), such as a measured
// Dit(E). Between nodes it is interpolated linearly; outside [E[0], E[len−1]] it is zero.
// Make one with NewTabulatedDit, which checks and copies the table; the table cannot be
// changed afterwards (Energies, Densities and Breakpoints return copies), so a model holding
// it is immune to later changes of the caller's slices. The zero TabulatedDit is empty: its
// Validate reports it, and its Density is 0.
type TabulatedDit struct {
	e []float64 // energies E − Ei, eV, strictly increasing
	d []float64 // interface-state densities at E, cm^-2 eV^-1
}

// NewTabulatedDit returns a TabulatedDit with copies of e and d, or an error naming the first
// bad entry.
func NewTabulatedDit(e, d []float64) (TabulatedDit, error) {
	m := TabulatedDit{e: append([]float64(nil), e...), d: append([]float64(nil), d...)}
	if err := m.Validate(); err != nil {
		return TabulatedDit{}, err
	}
	return m, nil
}

// Energies returns a copy of the table's energies E − Ei in eV.
func (m TabulatedDit) Energies() []float64 { return append([]float64(nil), m.e...) }

// Densities returns a copy of the table's densities in cm^-2 eV^-1.
func (m TabulatedDit) Densities() []float64 { return append([]float64(nil), m.d...) }

// Validate returns an error unless the table is well formed (see TabulatedDit).
func (m TabulatedDit) Validate() error {
	return validateTable("TabulatedDit", "D", "cm^-2 eV^-1", m.e, m.d, false)
}

// Density returns the interpolated Dit in cm^-2 eV^-1 at e = E − Ei in eV, 0 outside the
// table, and 0 for a malformed table (Validate reports it; ExtendedSRH calls Validate).
func (m TabulatedDit) Density(e float64) float64 {
	if len(m.e) < 2 || len(m.e) != len(m.d) {
		return 0
	}
	if e < m.e[0] || e > m.e[len(m.e)-1] {
		return 0
	}
	i, t := locate(m.e, e)
	return m.d[i] + t*(m.d[i+1]-m.d[i])
}

// Breakpoints returns a copy of the table's energies.
func (m TabulatedDit) Breakpoints() []float64 { return m.Energies() }

// String returns e.g. "TabulatedDit(25 points, -0.5..0.5 eV)".
func (m TabulatedDit) String() string {
	if len(m.e) == 0 {
		return "TabulatedDit(empty)"
	}
	return fmt.Sprintf("TabulatedDit(%d points, %g..%g eV)", len(m.e), m.e[0], m.e[len(m.e)-1])
}

// DitSum is the sum of several interface-state distributions, e.g. a U-shaped continuum and
// a Gaussian band.
type DitSum []DitDistribution

// Density returns the sum of the members' densities in cm^-2 eV^-1 (NaN if a member is nil).
func (s DitSum) Density(e float64) float64 {
	var sum float64
	for _, m := range s {
		if m == nil {
			return 0 // Validate reports the nil member
		}
		sum += m.Density(e)
	}
	return sum
}

// Breakpoints returns the union of the members' breakpoints.
func (s DitSum) Breakpoints() []float64 {
	var b []float64
	for _, m := range s {
		if m != nil {
			b = append(b, m.Breakpoints()...)
		}
	}
	return b
}

// String returns the members' descriptions joined by " + ".
func (s DitSum) String() string {
	parts := make([]string, len(s))
	for i, m := range s {
		if m == nil {
			parts[i] = "<nil>"
		} else {
			parts[i] = m.String()
		}
	}
	return strings.Join(parts, " + ")
}

// Validate returns an error if a member is nil or fails its own Validate method.
func (s DitSum) Validate() error {
	for i, m := range s {
		if m == nil {
			return fmt.Errorf("surface: DitSum[%d] is nil", i)
		}
		if v, ok := m.(interface{ Validate() error }); ok {
			if err := v.Validate(); err != nil {
				return err
			}
		}
	}
	return nil
}

// ConstantSigma is an energy-independent capture cross section in cm^2.
type ConstantSigma float64

// Sigma returns the cross section in cm^2.
func (s ConstantSigma) Sigma(e float64) float64 { return float64(s) }

// Breakpoints returns nil.
func (ConstantSigma) Breakpoints() []float64 { return nil }

// String returns e.g. "1e-16 cm^2".
func (s ConstantSigma) String() string { return fmt.Sprintf("%g cm^2", float64(s)) }

// TabulatedSigma is a capture cross section given at energies E (E − Ei, eV, strictly
// increasing, at least two) with values S (cm^2, finite, > 0). Between nodes it is
// interpolated linearly in log σ (cross sections span decades); outside the table it keeps
// the end values. Make one with NewTabulatedSigma, which checks and copies the table; it
// cannot be changed afterwards (Energies, Values and Breakpoints return copies). The zero
// TabulatedSigma is empty: Validate reports it, and its Sigma is 0.
type TabulatedSigma struct {
	e []float64 // energies E − Ei, eV, strictly increasing
	s []float64 // capture cross sections at E, cm^2
}

// NewTabulatedSigma returns a TabulatedSigma with copies of e and sigma, or an error naming
// the first bad entry.
func NewTabulatedSigma(e, sigma []float64) (TabulatedSigma, error) {
	m := TabulatedSigma{e: append([]float64(nil), e...), s: append([]float64(nil), sigma...)}
	if err := m.Validate(); err != nil {
		return TabulatedSigma{}, err
	}
	return m, nil
}

// Energies returns a copy of the table's energies E − Ei in eV.
func (m TabulatedSigma) Energies() []float64 { return append([]float64(nil), m.e...) }

// Values returns a copy of the table's cross sections in cm^2.
func (m TabulatedSigma) Values() []float64 { return append([]float64(nil), m.s...) }

// Validate returns an error unless the table is well formed (see TabulatedSigma).
func (m TabulatedSigma) Validate() error {
	return validateTable("TabulatedSigma", "S", "cm^2", m.e, m.s, true)
}

// Sigma returns the interpolated cross section in cm^2 at e = E − Ei in eV (0 for a
// malformed table, which Validate reports; ExtendedSRH calls Validate).
func (m TabulatedSigma) Sigma(e float64) float64 {
	n := len(m.e)
	if n < 2 || n != len(m.s) {
		return 0
	}
	switch {
	case e <= m.e[0]:
		return m.s[0]
	case e >= m.e[n-1]:
		return m.s[n-1]
	}
	i, t := locate(m.e, e)
	return m.s[i] * math.Pow(m.s[i+1]/m.s[i], t)
}

// Breakpoints returns a copy of the table's energies.
func (m TabulatedSigma) Breakpoints() []float64 { return m.Energies() }

// String returns e.g. "TabulatedSigma(5 points)".
func (m TabulatedSigma) String() string { return fmt.Sprintf("TabulatedSigma(%d points)", len(m.e)) }

// locate returns i and t in [0, 1] with x = e[i] + t (e[i+1] − e[i]), for e[0] <= x <= e[n−1].
func locate(e []float64, x float64) (int, float64) {
	i := sort.SearchFloat64s(e, x) - 1 // e[i] < x <= e[i+1]
	if i < 0 {
		i = 0
	}
	if i > len(e)-2 {
		i = len(e) - 2
	}
	return i, (x - e[i]) / (e[i+1] - e[i])
}

// validateTable checks a table of values v at strictly increasing finite energies e.
func validateTable(model, vname, unit string, e, v []float64, positive bool) error {
	if len(e) < 2 {
		return fmt.Errorf("surface: %s: need at least 2 energies, got %d", model, len(e))
	}
	if len(e) != len(v) {
		return fmt.Errorf("surface: %s: %d energies but %d values of %s", model, len(e), len(v), vname)
	}
	for i := range e {
		if math.IsNaN(e[i]) || math.IsInf(e[i], 0) {
			return fmt.Errorf("surface: %s: energy E[%d] = %g eV is not finite", model, i, e[i])
		}
		if i > 0 && !(e[i] > e[i-1]) {
			return fmt.Errorf("surface: %s: energies must increase strictly (E[%d] = %g after %g eV)", model, i, e[i], e[i-1])
		}
		bad := math.IsNaN(v[i]) || math.IsInf(v[i], 0) || v[i] < 0 || (positive && v[i] == 0) || v[i] > check.MaxMagnitude
		if bad {
			want := ">= 0"
			if positive {
				want = "> 0"
			}
			return fmt.Errorf("surface: %s: %s[%d] = %g %s must be finite and %s", model, vname, i, v[i], unit, want)
		}
	}
	return nil
}

// ScaledDit is a distribution of interface states multiplied by a factor: Dit(E) = Factor ·
// Of.Density(E), with Of's breakpoints. It is how a fit scales a Dit of a fixed shape (see
// lifetime.FitPassivation). The zero ScaledDit is invalid (Validate reports it).
type ScaledDit struct {
	Of     DitDistribution // the distribution's shape
	Factor float64         // dimensionless, finite and >= 0
}

// Density returns Factor·Of.Density(e) in cm^-2 eV^-1, or 0 for a malformed ScaledDit (see
// Validate).
func (m ScaledDit) Density(e float64) float64 {
	if m.Of == nil || !(m.Factor >= 0) || m.Factor > check.MaxMagnitude {
		return 0
	}
	return m.Factor * m.Of.Density(e)
}

// Breakpoints returns the breakpoints of Of.
func (m ScaledDit) Breakpoints() []float64 {
	if m.Of == nil {
		return nil
	}
	return m.Of.Breakpoints()
}

// Validate returns an error for a nil Of, a Factor that is not finite and >= 0, or an error of
// Of's own Validate.
func (m ScaledDit) Validate() error {
	if m.Of == nil {
		return fmt.Errorf("surface: ScaledDit.Of is nil")
	}
	if err := check.NonNegative("surface: ScaledDit", "Factor", m.Factor, ""); err != nil {
		return err
	}
	if v, ok := m.Of.(interface{ Validate() error }); ok {
		return v.Validate()
	}
	return nil
}

// String returns e.g. "3.2 × ConstantDit(1e+11 cm^-2 eV^-1)".
func (m ScaledDit) String() string { return fmt.Sprintf("%.4g × %v", m.Factor, m.Of) }
