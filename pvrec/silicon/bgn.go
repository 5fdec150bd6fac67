package silicon

import (
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// This file holds the band-gap narrowing (BGN) models that depend on the dopant densities
// only, and the zero model. The injection-dependent default, Schenk1998, is in bgn_schenk.go.
//
// Apparent versus physical BGN. An "apparent" BGN ΔEg,app is what is extracted from measured
// n0 p0 = ni,eff² = ni² exp(ΔEg,app/kT) when the carriers are treated with Boltzmann statistics;
// it lumps the true (physical) narrowing and the Fermi–Dirac degeneracy of the majority
// carriers together, and it is tied to the value of ni used in the extraction. It must be used
// with Boltzmann statistics. A "physical" BGN is the shift of the band edges themselves and must
// be used with Fermi–Dirac statistics; then ΔEg,app ≈ ΔEg + kT ln γ with γ = F_{1/2}(η)/e^η <= 1
// for the majority band, so the two differ by a few meV at 1e19 cm^-3 and by some 30 meV at
// 1e20 cm^-3.

// defaultBGN returns the package's default band-gap narrowing model, Schenk1998 with its
// published parameters.
func defaultBGN() BandgapNarrowing { return NewSchenk1998() }

// Compile-time checks that every model implements BandgapNarrowing.
var (
	_ BandgapNarrowing = NoNarrowing{}
	_ BandgapNarrowing = SlotboomDeGraaff1976{}
	_ BandgapNarrowing = KlaassenSlotboomDeGraaff1992{}
	_ BandgapNarrowing = DelAlamoSwanson1987{}
	_ BandgapNarrowing = Schenk1998{}
)

// bgnCheckDensities validates pt and refuses densities above the silicon atom density
// AtomDensity.
func bgnCheckDensities(model string, pt Point) error {
	if err := pt.Validate(); err != nil {
		return err
	}
	if v := pt.Nd + pt.Na; v > AtomDensity {
		return check.Range("silicon", model, "Nd + Na", "cm^-3", v, 0, AtomDensity)
	}
	if pt.N > AtomDensity {
		return check.Range("silicon", model, "N", "cm^-3", pt.N, 0, AtomDensity)
	}
	if pt.P > AtomDensity {
		return check.Range("silicon", model, "P", "cm^-3", pt.P, 0, AtomDensity)
	}
	return nil
}

// NoNarrowing is the absence of band-gap narrowing, ΔEg = 0 at every valid point: for hand
// calculations and for isolating the effect of BGN. It suits either statistics.
type NoNarrowing struct{}

// String returns "NoNarrowing".
func (NoNarrowing) String() string { return "NoNarrowing" }

// DeltaEg returns 0 eV, or an error (from pt.Validate, naming the field) for an invalid pt.
func (NoNarrowing) DeltaEg(pt Point) (float64, error) {
	if err := pt.Validate(); err != nil {
		return 0, err
	}
	return 0, nil
}

// slotboomForm returns E1 [x + sqrt(x² + C)] with x = ln(n/n0), in the unit of e1, for n >= 0,
// n0 > 0, C >= 0. For x < 0 it uses the equal form E1 C / (sqrt(x² + C) − x), free of the
// cancellation of the direct form, so that the result tends smoothly to 0 as n → 0.
func slotboomForm(e1, n0, c, n float64) float64 {
	if n == 0 {
		return 0
	}
	x := math.Log(n / n0)
	s := math.Sqrt(x*x + c)
	if x >= 0 {
		return e1 * (x + s)
	}
	return e1 * c / (s - x)
}

// slotboomDeltaEg is the shared body of the two Slotboom–de Graaff forms; ctx is
// "silicon: " followed by the model's name (a constant, so that nothing is built per call).
func slotboomDeltaEg(model, ctx string, e1, n0, c float64, pt Point) (float64, error) {
	if err := bgnCheckDensities(model, pt); err != nil {
		return 0, err
	}
	if err := check.NonNegative(ctx, "parameter E1", e1, "eV"); err != nil {
		return 0, err
	}
	if err := check.Positive(ctx, "parameter N0", n0, "cm^-3"); err != nil {
		return 0, err
	}
	if err := check.NonNegative(ctx, "parameter C", c, ""); err != nil {
		return 0, err
	}
	return slotboomForm(e1, n0, c, pt.Nd+pt.Na), nil
}

// SlotboomDeGraaff1976 is the apparent band-gap narrowing of J. W. Slotboom and
// H. C. de Graaff, "Measurements of bandgap narrowing in Si bipolar transistors",
// Solid-State Electron. 19, 857 (1976), fitted to the electrical (Boltzmann) narrowing
// measured in the boron-doped bases of n-p-n transistors:
//
//	ΔEg = E1 [ln(N/N0) + sqrt(ln²(N/N0) + C)],   N = Nd + Na,
//
// with E1 = 9 meV, N0 = 1e17 cm^-3, C = 0.5. It is an apparent BGN: use it with Boltzmann
// statistics. It was measured on p-type (base) silicon near room temperature and has no
// temperature dependence; it is commonly applied to n-type silicon too, and it is
// superseded by the authors' re-fit KlaassenSlotboomDeGraaff1992, which lies below it at every
// density.
//
// N is the total ionised dopant density Nd + Na (for compensated silicon the ionised impurities
// of both kinds perturb the band edges; common practice, no source). The formula is evaluated
// for any N from 0 (where ΔEg = 0) up to the silicon atom density 5e22 cm^-3; outside the
// measured range it is an extrapolation, returned without error. T, N and P are not used.
type SlotboomDeGraaff1976 struct {
	E1 float64 // energy scale E1, eV
	N0 float64 // reference density N0, cm^-3
	C  float64 // constant C, dimensionless
}

// NewSlotboomDeGraaff1976 returns the published parameters E1 = 9 meV, N0 = 1e17 cm^-3, C = 0.5.
func NewSlotboomDeGraaff1976() SlotboomDeGraaff1976 {
	return SlotboomDeGraaff1976{E1: 9e-3, N0: 1e17, C: 0.5}
}

// String returns "SlotboomDeGraaff1976".
func (SlotboomDeGraaff1976) String() string { return "SlotboomDeGraaff1976" }

// DeltaEg returns the apparent BGN in eV at N = pt.Nd + pt.Na. It returns an error for an
// invalid pt (naming the field), for a density above 5e22 cm^-3 (errors.Is(err,
// pvrec.ErrOutOfRange)), or for invalid parameters (E1 < 0, N0 <= 0, C < 0, or not finite).
func (m SlotboomDeGraaff1976) DeltaEg(pt Point) (float64, error) {
	return slotboomDeltaEg("SlotboomDeGraaff1976", "silicon: SlotboomDeGraaff1976", m.E1, m.N0, m.C, pt)
}

// KlaassenSlotboomDeGraaff1992 is the unified apparent band-gap narrowing of
// D. B. M. Klaassen, J. W. Slotboom and H. C. de Graaff, "Unified apparent bandgap narrowing in
// n- and p-type silicon", Solid-State Electron. 35, 125 (1992): the form of
// SlotboomDeGraaff1976 re-fitted to electrical data of both n- and p-type silicon:
//
//	ΔEg = E1 [ln(N/N0) + sqrt(ln²(N/N0) + C)],   N = Nd + Na,
//
// with E1 = 6.92 meV, N0 = 1.3e17 cm^-3, C = 0.5. It is an apparent BGN: use it with Boltzmann
// statistics (and with the ni of the analysis it comes from; an apparent BGN shifts with the ni
// assumed when it was extracted). One curve serves both n- and p-type silicon; it was fitted to
// room-temperature data of heavily doped silicon and has no temperature dependence.
//
// N is the total ionised dopant density Nd + Na (common practice, no source). The formula is
// evaluated for any N from 0 (where ΔEg = 0) up to 5e22 cm^-3; outside the fitted range it is an
// extrapolation, returned without error. T, N and P are not used.
type KlaassenSlotboomDeGraaff1992 struct {
	E1 float64 // energy scale E1, eV
	N0 float64 // reference density N0, cm^-3
	C  float64 // constant C, dimensionless
}

// NewKlaassenSlotboomDeGraaff1992 returns the published parameters E1 = 6.92 meV,
// N0 = 1.3e17 cm^-3, C = 0.5.
func NewKlaassenSlotboomDeGraaff1992() KlaassenSlotboomDeGraaff1992 {
	return KlaassenSlotboomDeGraaff1992{E1: 6.92e-3, N0: 1.3e17, C: 0.5}
}

// String returns "KlaassenSlotboomDeGraaff1992".
func (KlaassenSlotboomDeGraaff1992) String() string { return "KlaassenSlotboomDeGraaff1992" }

// DeltaEg returns the apparent BGN in eV at N = pt.Nd + pt.Na. It returns an error for an
// invalid pt (naming the field), for a density above 5e22 cm^-3 (errors.Is(err,
// pvrec.ErrOutOfRange)), or for invalid parameters (E1 < 0, N0 <= 0, C < 0, or not finite).
func (m KlaassenSlotboomDeGraaff1992) DeltaEg(pt Point) (float64, error) {
	return slotboomDeltaEg("KlaassenSlotboomDeGraaff1992", "silicon: KlaassenSlotboomDeGraaff1992", m.E1, m.N0, m.C, pt)
}

// DelAlamoSwanson1987 is the apparent band-gap narrowing of heavily doped n-type silicon of
// J. A. del Alamo and R. M. Swanson, "Measurement of steady-state minority-carrier transport
// parameters in heavily doped n-type silicon", IEEE Trans. Electron Devices 34, 1580
// (1987), from minority-hole transport measured in heavily doped n-type layers:
//
//	ΔEg = E1 ln(N/N0)  for N > N0,   ΔEg = 0 for N <= N0,   N = Nd + Na,
//
// with E1 = 18.7 meV and N0 = 7e17 cm^-3. It is an apparent BGN: use it with Boltzmann
// statistics. It is a room-temperature fit for heavily doped n-type silicon, with no
// temperature dependence; below the onset N0 it gives no narrowing at all.
//
// N is the total ionised dopant density Nd + Na, which equals Nd in the uncompensated n-type
// samples the fit comes from (common practice, no source). The formula is evaluated for any
// n-type point up to 5e22 cm^-3; p-type points (Na > Nd), where an n-type fit is meaningless,
// return an error. T, N and P are not used.
type DelAlamoSwanson1987 struct {
	E1 float64 // slope E1, eV
	N0 float64 // onset density N0, cm^-3
}

// NewDelAlamoSwanson1987 returns the published parameters E1 = 18.7 meV, N0 = 7e17 cm^-3.
func NewDelAlamoSwanson1987() DelAlamoSwanson1987 {
	return DelAlamoSwanson1987{E1: 18.7e-3, N0: 7e17}
}

// String returns "DelAlamoSwanson1987".
func (DelAlamoSwanson1987) String() string { return "DelAlamoSwanson1987" }

// DeltaEg returns the apparent BGN in eV at N = pt.Nd + pt.Na. It returns an error for an
// invalid pt (naming the field), for a density above 5e22 cm^-3 or a p-type point with
// Na > Nd (both errors.Is(err, pvrec.ErrOutOfRange)), or for invalid parameters (E1 < 0, N0 <= 0,
// or not finite).
func (m DelAlamoSwanson1987) DeltaEg(pt Point) (float64, error) {
	const model = "DelAlamoSwanson1987"
	if err := bgnCheckDensities(model, pt); err != nil {
		return 0, err
	}
	if pt.Na > pt.Nd {
		return 0, check.Rangef(model, "acceptor density Na", pt.Na, 0, pt.Nd,
			"silicon: %s: fit for n-type silicon, got p-type point with Na = %g > Nd = %g cm^-3", model, pt.Na, pt.Nd)
	}
	if err := check.NonNegative("silicon: "+model, "parameter E1", m.E1, "eV"); err != nil {
		return 0, err
	}
	if err := check.Positive("silicon: "+model, "parameter N0", m.N0, "cm^-3"); err != nil {
		return 0, err
	}
	n := pt.Nd + pt.Na
	if n <= m.N0 {
		return 0, nil
	}
	return m.E1 * math.Log(n/m.N0), nil
}
