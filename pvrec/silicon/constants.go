package silicon

import (
	"gonum.org/v1/gonum/unit/constant"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// Physical constants used by the package, from the exact SI values (CODATA 2018) in
// gonum.org/v1/gonum/unit/constant.
const (
	// BoltzmannJ is the Boltzmann constant k, J/K.
	BoltzmannJ = float64(constant.Boltzmann)
	// ElementaryCharge is the elementary charge q, C.
	ElementaryCharge = float64(constant.ElementaryCharge)
	// BoltzmannEV is k/q, the Boltzmann constant in eV/K (equivalently, the thermal
	// voltage per kelvin in V/K): 8.617333262e-5.
	BoltzmannEV = BoltzmannJ / ElementaryCharge
	// VacuumPermittivity is ε0 in F/cm, from gonum's 8.854187817620389e-12 F/m (the pre-2019
	// exact value; CODATA 2018's differs by 6e-10 relative, far below any model's precision).
	VacuumPermittivity = float64(constant.ElectricConstant) / 100
	// RelativePermittivity is the static relative permittivity of silicon at room
	// temperature, 11.9, as tabulated by S. M. Sze and K. K. Ng, Physics of Semiconductor
	// Devices, 3rd ed. (Wiley, 2007), Appendix G (value from memory of that table; 11.7 is
	// also in common use). Space-charge calculations (surface, j0) take it as their default.
	RelativePermittivity = 11.9

	// AtomDensity is the density of silicon atoms, 5.0e22 cm^-3 (handbook value: 8 atoms per
	// cubic cell of 0.5431 nm). No dopant or carrier density in silicon can exceed it: every
	// density-dependent function of this package refuses densities above it
	// (errors.Is(err, pvrec.ErrOutOfRange)), and so do the profiles of package profile.
	AtomDensity = check.MaxDensity // one value, shared with the validators of internal/check

	// MeltingPoint is the melting point of silicon, 1687 K (1414 °C; handbook value): the upper
	// end of every temperature range of this package, since the models describe solid
	// silicon. Temperature-dependent functions refuse T above it (errors.Is(err,
	// pvrec.ErrOutOfRange)) even where their formula would still evaluate.
	MeltingPoint = 1687.0
)

// ThermalVoltage returns the thermal voltage kT/q in V at temperature t in K
// (25.852 mV at 300 K), for 0 < t <= MeltingPoint. It returns an error, naming t, if t is
// NaN, infinite or <= 0, and a range error (errors.Is(err, pvrec.ErrOutOfRange)) above the
// melting point.
func ThermalVoltage(t float64) (float64, error) {
	if err := checkSolid("ThermalVoltage", t); err != nil {
		return 0, err
	}
	return BoltzmannEV * t, nil
}

// checkSolid returns an error unless t is a valid temperature in K of solid silicon,
// 0 < t <= MeltingPoint; fn names the caller (a constant, so nothing is built per call).
func checkSolid(fn string, t float64) error {
	if err := check.Temperature("silicon", t); err != nil {
		return err
	}
	return check.Window("silicon", fn, t, 0, MeltingPoint)
}
