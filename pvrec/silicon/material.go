package silicon

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/fermi"
)

// Material is silicon described by a ModelSet at one temperature, with the
// temperature-dependent quantities (Vt, Eg, Nc, Nv, ni) evaluated once by ModelSet.At.
// It is immutable and safe for concurrent use: ModelSet.At refuses pointer models, so the
// caller cannot change a model after the material is fixed (a model value that holds slices
// or maps, as none of this package's do, must not be modified after At).
// Later packages take a *Material and call NiEff and Equilibrium in hot loops.
//
// Only ModelSet.At makes a usable Material. A zero Material (or a nil *Material) is not
// one: its accessors (T, Vt, Eg, Nc, Nv, Ni, StatGap) return 0, Models returns the zero
// ModelSet, String says so, and every method with an error result returns an error.
type Material struct {
	ms       ModelSet
	t        float64 // temperature, K
	vt       float64 // kT/q, V
	eg       float64 // band gap from ms.Gap, eV
	nc, nv   float64 // effective densities of states, cm^-3
	ni       float64 // intrinsic density from ms.Intrinsic, cm^-3
	gap0     float64 // reduced statistical gap ln(Nc Nv / ni²), dimensionless
	complete bool    // ms.Ionization is CompleteIonization
}

// ready returns an error unless m was made by ModelSet.At; method names the caller.
func (m *Material) ready(method string) error {
	if m != nil && m.vt > 0 {
		return nil
	}
	return fmt.Errorf("silicon: %s: the Material is nil or a zero value; make one with ModelSet.At", method)
}

// T returns the temperature in K.
func (m *Material) T() float64 { return m.t }

// Vt returns the thermal voltage kT/q in V.
func (m *Material) Vt() float64 { return m.vt }

// Eg returns the band gap of undoped silicon, without narrowing, from the Gap model in eV.
// It does not enter the carrier densities (see ModelSet).
func (m *Material) Eg() float64 { return m.eg }

// Nc returns the conduction-band effective density of states in cm^-3.
func (m *Material) Nc() float64 { return m.nc }

// Nv returns the valence-band effective density of states in cm^-3.
func (m *Material) Nv() float64 { return m.nv }

// Ni returns the intrinsic carrier density from the Intrinsic model in cm^-3.
func (m *Material) Ni() float64 { return m.ni }

// StatGap returns the gap that the carrier statistics use, kT ln(Nc Nv / ni²) in eV, before
// band-gap narrowing (see ModelSet). It differs from Eg by a few meV when Intrinsic, DOS and
// Gap come from different papers.
func (m *Material) StatGap() float64 { return m.gap0 * m.vt }

// Models returns a copy of the model set.
func (m *Material) Models() ModelSet { return m.ms }

// String returns the temperature and the models, e.g. "Si 300.00 K: Eg Pässler2002,
// DOS Green1990, ni Couderc2014, BGN Schenk1998, Fermi–Dirac, complete ionisation", to stamp
// results.
func (m *Material) String() string {
	if m.ready("") != nil {
		return "Si: zero Material (no model set; make one with ModelSet.At)"
	}
	return fmt.Sprintf("Si %.2f K: %s", m.t, m.ms)
}

// DeltaEg returns the band-gap narrowing in eV of the BGN model at n, p, nd, na (cm^-3, with
// nd, na the ionised dopant densities; finite, >= 0 and at most AtomDensity) and the
// material's temperature. It returns an error for invalid densities (a range error above
// AtomDensity), an error of the model, or a narrowing that is not finite or that closes the
// statistical gap (ΔEg >= StatGap, which no silicon model can mean).
func (m *Material) DeltaEg(n, p, nd, na float64) (float64, error) {
	if err := m.ready("Material.DeltaEg"); err != nil {
		return 0, err
	}
	if err := checkDensities(n, p, nd, na); err != nil {
		return 0, err
	}
	d, err := m.deltaEg(n, p, nd, na)
	if err != nil {
		return 0, err
	}
	return d, m.checkGap(d, n, p, nd, na)
}

// checkGap returns an error if the narrowing d (eV) closes the statistical gap.
func (m *Material) checkGap(d, n, p, nd, na float64) error {
	if d < m.StatGap() {
		return nil
	}
	return fmt.Errorf("silicon: BGN model %s gives ΔEg = %g eV at n = %g, p = %g, Nd = %g, Na = %g cm^-3, not below the gap Eg,stat = %g eV",
		modelName(m.ms.BGN), d, n, p, nd, na, m.StatGap())
}

// deltaEg is DeltaEg without the validation of the densities and the gap, for the solvers.
func (m *Material) deltaEg(n, p, nd, na float64) (float64, error) {
	d, err := m.ms.BGN.DeltaEg(Point{T: m.t, Nd: nd, Na: na, N: n, P: p})
	if err != nil {
		return 0, err
	}
	if math.IsNaN(d) || math.IsInf(d, 0) {
		return 0, fmt.Errorf("silicon: BGN model %s gives non-finite ΔEg = %g eV at n = %g, p = %g, Nd = %g, Na = %g cm^-3",
			modelName(m.ms.BGN), d, n, p, nd, na)
	}
	return d, nil
}

// NiEff returns the effective intrinsic carrier density ni,eff in cm^-3 at electron and hole
// densities n and p and ionised donor and acceptor densities nd and na (all cm^-3, finite,
// >= 0 and at most AtomDensity; under complete ionisation nd and na are the dopant densities):
//
//	ni,eff² = ni² exp(ΔEg/kT) γn γp,
//	γn = F_{1/2}(ηn)/exp(ηn) with n = Nc F_{1/2}(ηn),  γp likewise with p and Nv,
//
// where ΔEg is the BGN model at Point{T, nd, na, n, p}. Under Boltzmann statistics γn = γp = 1;
// under Fermi–Dirac statistics γ <= 1 describes the degeneracy of the carriers (γ → 1 for
// n << Nc). In equilibrium n0 p0 = ni,eff²; out of equilibrium n p = ni,eff² exp((EFn − EFp)/kT),
// the form in which recombination models use it. NiEff does not recompute any
// temperature-dependent quantity; it costs one BGN evaluation and, under Fermi–Dirac statistics,
// up to two inversions of F_{1/2}. It returns the errors of DeltaEg, or an error if ni,eff is
// not representable.
func (m *Material) NiEff(n, p, nd, na float64) (float64, error) {
	if err := m.ready("Material.NiEff"); err != nil {
		return 0, err
	}
	if err := checkDensities(n, p, nd, na); err != nil {
		return 0, err
	}
	d, err := m.deltaEg(n, p, nd, na)
	if err != nil {
		return 0, err
	}
	if err := m.checkGap(d, n, p, nd, na); err != nil {
		return 0, err
	}
	x := d / (2 * m.vt)
	if m.ms.Statistics == FermiDirac {
		x += 0.5 * (logDegeneracy(n/m.nc) + logDegeneracy(p/m.nv))
	}
	nie := m.ni * math.Exp(x)
	if !(nie > 0) || math.IsInf(nie, 0) {
		return 0, fmt.Errorf("silicon: NiEff = %g cm^-3 not representable at n = %g, p = %g, Nd = %g, Na = %g cm^-3",
			nie, n, p, nd, na)
	}
	return nie, nil
}

// logDegeneracy returns ln γ = ln(F_{1/2}(η)/exp(η)) with η = F_{1/2}^{-1}(y), for reduced
// density y = n/Nc >= 0 (finite). For y < 1e-17, γ = 1 − y/2^{3/2} + O(y²) rounds to 1. For
// y < 1e-3 it uses the series F_{1/2}(η) = u S(u), S(u) = Σ_{k>=1} (−u)^{k−1}/k^{3/2}, u = e^η
// (the standard series F_j(η) = −Li_{j+1}(−e^η) of the polylogarithm), so that γ = S(u), with
// u found by the fixed-point iteration u ← y/S(u); this is faster than the general inversion
// and free of the cancellation in ln y − η. Otherwise it inverts with fermi.InvHalf.
func logDegeneracy(y float64) float64 {
	switch {
	case y < 1e-17:
		return 0
	case y < 1e-3:
		// Each iteration multiplies the relative error of u by about u/2^{3/2} < 4e-4, so
		// four iterations from u = y (error ~y/3) reach rounding.
		u := y
		for i := 0; i < 4; i++ {
			u = y / (1 + seriesSMinus1(u))
		}
		return math.Log1p(seriesSMinus1(u))
	}
	eta, err := fermi.InvHalf(y)
	if err != nil { // unreachable for finite y > 0
		return math.NaN()
	}
	return math.Log(y) - eta
}

// seriesSMinus1 returns S(u) − 1 = Σ_{k=2}^{7} (−u)^{k−1}/k^{3/2}; for u < 1e-3 the omitted
// terms are below 1e-22.
func seriesSMinus1(u float64) float64 {
	const (
		c2 = 0.35355339059327373 // 2^{−3/2}
		c3 = 0.19245008972987526 // 3^{−3/2}
		c4 = 0.125               // 4^{−3/2}
		c5 = 0.08944271909999159 // 5^{−3/2}
		c6 = 0.06804138174397717 // 6^{−3/2}
		c7 = 0.05399492471560388 // 7^{−3/2}
	)
	return u * (-c2 + u*(c3+u*(-c4+u*(c5+u*(-c6+u*c7)))))
}

// Mobilities returns the electron and hole mobilities μn, μp in cm²/(V·s) of the model set's
// Mobility model at the material's temperature, for carrier densities n, p and ionised dopant
// densities nd, na in cm^-3 (finite, >= 0, at most AtomDensity). It returns an error for
// invalid densities, an error of the model, or an error if the model gives a mobility that is
// not finite and > 0.
func (m *Material) Mobilities(n, p, nd, na float64) (mun, mup float64, err error) {
	if err := m.ready("Material.Mobilities"); err != nil {
		return 0, 0, err
	}
	if err := checkDensities(n, p, nd, na); err != nil {
		return 0, 0, err
	}
	pt := Point{T: m.t, Nd: nd, Na: na, N: n, P: p}
	mun, mup, err = m.ms.Mobility.Mobilities(pt)
	if err != nil {
		return 0, 0, err
	}
	if err := checkMobilityResult(modelName(m.ms.Mobility), pt, mun, mup); err != nil {
		return 0, 0, err
	}
	return mun, mup, nil
}
