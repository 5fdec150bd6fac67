package silicon

import (
	"fmt"
	"math"
)

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
	if err := checkTemperature(pt.T); err != nil {
		return err
	}
	for _, f := range []struct {
		name string
		v    float64
	}{{"Nd", pt.Nd}, {"Na", pt.Na}, {"N", pt.N}, {"P", pt.P}} {
		if err := checkDensity(f.name, f.v); err != nil {
			return err
		}
	}
	return nil
}

// checkTemperature returns an error unless t is a finite, positive temperature in K.
func checkTemperature(t float64) error {
	if math.IsNaN(t) || math.IsInf(t, 0) || t <= 0 {
		return fmt.Errorf("silicon: temperature T must be finite and > 0 K, got %g", t)
	}
	return nil
}

// checkDensity returns an error unless v is a finite, non-negative density in cm^-3.
func checkDensity(name string, v float64) error {
	if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
		return fmt.Errorf("silicon: density %s must be finite and >= 0 cm^-3, got %g", name, v)
	}
	return nil
}
