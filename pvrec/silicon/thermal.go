package silicon

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// ThermalVelocity gives the mean thermal velocities of electrons and holes,
//
//	vth(T) = vth(300 K) · sqrt(T / 300 K),
//
// the temperature dependence of a constant effective mass (common practice, no source). It is
// the one thermal-velocity notion of pvrec: SRH defects (package recomb) and the extended SRH
// interface model (package surface) both hold one.
// NewGreen1990ThermalVelocity returns the 300 K values of M. A. Green, "Intrinsic
// concentration, effective densities of states, and effective mass in silicon", J. Appl.
// Phys. 67, 2944 (1990): 2.046e7 cm/s for electrons and 1.688e7 cm/s for holes (value from
// memory). Green also tabulates the temperature dependence of the thermal-velocity effective
// masses; it is not reproduced here, so away from 300 K the values are approximate.
type ThermalVelocity struct {
	Electron300 float64 // electron thermal velocity at 300 K, cm/s
	Hole300     float64 // hole thermal velocity at 300 K, cm/s
}

// NewGreen1990ThermalVelocity returns ThermalVelocity{Electron300: 2.046e7, Hole300: 1.688e7}.
func NewGreen1990ThermalVelocity() ThermalVelocity {
	return ThermalVelocity{Electron300: 2.046e7, Hole300: 1.688e7}
}

// String returns "vth(2.046e+07, 1.688e+07 cm/s at 300 K)" with the model's values.
func (v ThermalVelocity) String() string {
	return fmt.Sprintf("vth(%g, %g cm/s at 300 K)", v.Electron300, v.Hole300)
}

// Temperature window of ThermalVelocity.At, K: the constant-mass scaling is a usable estimate
// over the range of the default model set's band gap (Passler2002, up to 500 K) down to
// liquid-nitrogen temperature (our choice; common practice, no source).
const (
	ThermalVelocityTMin = 77
	ThermalVelocityTMax = 500
)

// At returns the electron and hole thermal velocities in cm/s at temperature t in K, or an
// error for t outside [ThermalVelocityTMin, ThermalVelocityTMax] (errors.Is(err,
// pvrec.ErrOutOfRange)) or velocities that are not finite and > 0 (the zero value is
// invalid: use NewGreen1990ThermalVelocity).
func (v ThermalVelocity) At(t float64) (ve, vh float64, err error) {
	if err := check.Temperature("silicon: ThermalVelocity", t); err != nil {
		return 0, 0, err
	}
	if err := check.Window("silicon", "ThermalVelocity", t, ThermalVelocityTMin, ThermalVelocityTMax); err != nil {
		return 0, 0, err
	}
	if err := check.Positive("silicon: ThermalVelocity", "Electron300 (unset? use NewGreen1990ThermalVelocity)", v.Electron300, "cm/s"); err != nil {
		return 0, 0, err
	}
	if err := check.Positive("silicon: ThermalVelocity", "Hole300 (unset? use NewGreen1990ThermalVelocity)", v.Hole300, "cm/s"); err != nil {
		return 0, 0, err
	}
	f := math.Sqrt(t / 300)
	return v.Electron300 * f, v.Hole300 * f, nil
}
