package silicon

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/fermi"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// Diffusivity returns the diffusivity D = μ kT/q in cm²/s of non-degenerate carriers with
// mobility mu in cm²/(V·s) at temperature t in K (the Einstein relation; for example
// 1414 cm²/(V·s) gives 36.55 cm²/s at 300 K). It returns an error for mu not finite and
// >= 0 or an invalid t, and a range error above MeltingPoint. For degenerate carriers use
// DiffusivityFD or Diffusivities.
func Diffusivity(mu, t float64) (float64, error) {
	if err := checkSolid("Diffusivity", t); err != nil {
		return 0, err
	}
	if err := check.NonNegative("silicon", "mobility mu", mu, "cm²/(V·s)"); err != nil {
		return 0, err
	}
	return mu * (BoltzmannEV * t), nil // below mu·0.15: cannot overflow
}

// DiffusivityFD returns the diffusivity in cm²/s of carriers with mobility mu in cm²/(V·s) at
// temperature t in K and density n in cm^-3 in a parabolic band of effective density of
// states nEff in cm^-3, by the Einstein relation generalised to Fermi–Dirac statistics,
//
//	D = μ (kT/q) F_{1/2}(η)/F_{−1/2}(η),   n = nEff F_{1/2}(η),
//
// which follows from D/μ = (n/q)/(dn/dEF) (see for example S. M. Sze and K. K. Ng, Physics of
// Semiconductor Devices, 3rd ed., Wiley 2007). The factor exceeds 1 and tends to 1
// for n << nEff (it is 1 + n/(2^{3/2} nEff) to first order); at n = nEff it is 1.344.
// It returns an error for invalid mu, t, n or nEff (nEff must be finite and > 0), or if the
// result is not representable (mobilities and densities beyond any physical value).
func DiffusivityFD(mu, t, n, nEff float64) (float64, error) {
	d, err := Diffusivity(mu, t)
	if err != nil {
		return 0, err
	}
	if err := check.Density("silicon", "density n", n); err != nil {
		return 0, err
	}
	if err := check.Positive("silicon", "effective density of states nEff", nEff, "cm^-3"); err != nil {
		return 0, err
	}
	return checkDiffusivity(d * degeneracyFactor(n/nEff))
}

// checkDiffusivity returns d, or an error if it is not finite (it overflowed).
func checkDiffusivity(d float64) (float64, error) {
	if math.IsInf(d, 0) || math.IsNaN(d) {
		return 0, fmt.Errorf("silicon: diffusivity %g cm²/s not representable (mobility or density far beyond physical values)", d)
	}
	return d, nil
}

// degeneracyFactor returns F_{1/2}(η)/F_{−1/2}(η) with F_{1/2}(η) = y, for y >= 0 finite.
// Below y = 1e-12 the first-order term y/2^{3/2} is below 4e-13 and the factor rounds to
// 1 + y/2^{3/2}, returned without inverting F_{1/2}.
func degeneracyFactor(y float64) float64 {
	if y < 1e-12 {
		return 1 + y/(2*math.Sqrt2)
	}
	eta, err := fermi.InvHalf(y)
	if err != nil { // unreachable for finite y > 0
		return math.NaN()
	}
	return y / fermi.MinusHalf(eta)
}

// Diffusivities returns the electron and hole diffusivities Dn and Dp in cm²/s in material mat
// at electron and hole densities n and p and ionised donor and acceptor densities nd and na
// (all cm^-3), with mobilities from mob at Point{mat.T(), nd, na, n, p}. Under the material's
// Fermi–Dirac statistics the Einstein relation carries the degeneracy factor of DiffusivityFD
// with Nc and Nv of mat (band-gap narrowing shifts the band edges but does not change
// D/μ, which depends only on n/Nc); under Boltzmann statistics D = μ kT/q.
// It returns an error for a nil or zero mat, a nil mob, invalid densities (finite, >= 0, at
// most AtomDensity), an error of the mobility model, or mobilities not finite and > 0.
func Diffusivities(mat *Material, mob Mobility, n, p, nd, na float64) (dn, dp float64, err error) {
	if err := mat.ready("Diffusivities"); err != nil {
		return 0, 0, err
	}
	if mob == nil {
		return 0, 0, fmt.Errorf("silicon: Diffusivities needs a non-nil Mobility")
	}
	if err := checkDensities(n, p, nd, na); err != nil {
		return 0, 0, err
	}
	pt := Point{T: mat.t, Nd: nd, Na: na, N: n, P: p}
	mun, mup, err := mob.Mobilities(pt)
	if err != nil {
		return 0, 0, err
	}
	if err := checkMobilityResult(modelName(mob), pt, mun, mup); err != nil {
		return 0, 0, err
	}
	dn, dp = mun*mat.vt, mup*mat.vt
	if mat.ms.Statistics == FermiDirac {
		dn *= degeneracyFactor(n / mat.nc)
		dp *= degeneracyFactor(p / mat.nv)
	}
	if dn, err = checkDiffusivity(dn); err != nil {
		return 0, 0, err
	}
	if dp, err = checkDiffusivity(dp); err != nil {
		return 0, 0, err
	}
	return dn, dp, nil
}

// Diffusivities returns the electron and hole diffusivities Dn and Dp in cm²/s at electron and
// hole densities n and p and ionised donor and acceptor densities nd and na (all cm^-3), with
// the material's own mobility model (its ModelSet's Mobility): the package function
// Diffusivities(m, m.Models().Mobility, n, p, nd, na).
func (m *Material) Diffusivities(n, p, nd, na float64) (dn, dp float64, err error) {
	if err := m.ready("Material.Diffusivities"); err != nil {
		return 0, 0, err
	}
	return Diffusivities(m, m.ms.Mobility, n, p, nd, na)
}

// AmbipolarDiffusivity returns the ambipolar diffusivity in cm²/s of excess carriers in a
// quasi-neutral region with electron and hole diffusivities dn and dp in cm²/s and electron
// and hole densities n and p in cm^-3,
//
//	Da = (n + p)/(n/Dp + p/Dn),
//
// (W. van Roosbroeck, Phys. Rev. 91, 282 (1953); for example S. M. Sze and K. K. Ng, Physics
// of Semiconductor Devices, 3rd ed., Wiley 2007). It tends to the minority-carrier diffusivity
// in low injection and to 2 Dn Dp/(Dn + Dp) in high injection; being a weighted harmonic mean
// of Dn and Dp it lies between them, and it is computed so that no intermediate overflows.
// It returns an error for diffusivities not finite and > 0, for invalid densities, or for
// n = p = 0.
func AmbipolarDiffusivity(dn, dp, n, p float64) (float64, error) {
	if err := check.Positive("silicon", "diffusivity Dn", dn, "cm²/s"); err != nil {
		return 0, err
	}
	if err := check.Positive("silicon", "diffusivity Dp", dp, "cm²/s"); err != nil {
		return 0, err
	}
	if err := check.Density("silicon", "density n", n); err != nil {
		return 0, err
	}
	if err := check.Density("silicon", "density p", p); err != nil {
		return 0, err
	}
	if n == 0 && p == 0 {
		return 0, fmt.Errorf("silicon: ambipolar diffusivity undefined for n = p = 0")
	}
	// Da = 1/(a/Dp + b/Dn) with the weights a = n/(n + p), b = p/(n + p) formed from the
	// ratio of the smaller density to the larger (so that n + p cannot overflow); n or p = 0
	// gives Dn or Dp exactly.
	switch {
	case n == 0:
		return dn, nil
	case p == 0:
		return dp, nil
	}
	var a, b float64
	if n >= p {
		r := p / n
		a, b = 1/(1+r), r/(1+r)
	} else {
		r := n / p
		a, b = r/(1+r), 1/(1+r)
	}
	return 1 / (a/dp + b/dn), nil
}
