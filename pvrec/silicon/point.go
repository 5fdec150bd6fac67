package silicon

import "github.com/pvrec/pvrec/pvrec/internal/check"

// Point is the local state of silicon at which a density-dependent model is evaluated:
// temperature, ionised dopant densities and free-carrier densities.
//
// All densities are in cm^-3 and must be finite and non-negative; T is in K and must be
// finite and positive. Models that do not depend on a field ignore it.
type Point struct {
	T  float64 // temperature, K
	Nd float64 // ionised donor density, cm^-3
	Na float64 // ionised acceptor density, cm^-3
	N  float64 // free-electron density, cm^-3
	P  float64 // free-hole density, cm^-3
}

// Validate returns an error naming the first field of pt that is NaN, infinite or out of
// range (T <= 0 or a negative density).
func (pt Point) Validate() error {
	if err := check.Temperature("silicon", pt.T); err != nil {
		return err
	}
	if err := check.Density("silicon", "density Nd", pt.Nd); err != nil {
		return err
	}
	if err := check.Density("silicon", "density Na", pt.Na); err != nil {
		return err
	}
	if err := check.Density("silicon", "density N", pt.N); err != nil {
		return err
	}
	return check.Density("silicon", "density P", pt.P)
}

// checkDensities validates the carrier and ionised dopant densities n, p, nd, na (cm^-3) of
// Material's methods, naming the first invalid one: each finite, >= 0 and at most AtomDensity.
func checkDensities(n, p, nd, na float64) error {
	if err := checkAtoms("density n", n); err != nil {
		return err
	}
	if err := checkAtoms("density p", p); err != nil {
		return err
	}
	if err := checkAtoms("density nd", nd); err != nil {
		return err
	}
	return checkAtoms("density na", na)
}

// checkAtoms returns an error unless v is a finite density >= 0 cm^-3, and a range error
// if it exceeds the silicon atom density; name is a constant such as "density n".
func checkAtoms(name string, v float64) error {
	if err := check.Density("silicon", name, v); err != nil {
		return err
	}
	if v > AtomDensity {
		return check.Rangef("silicon", name, v, 0, AtomDensity,
			"silicon: %s = %g cm^-3 above the silicon atom density %g cm^-3", name, v, AtomDensity)
	}
	return nil
}
