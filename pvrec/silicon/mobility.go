package silicon

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// Mobility is a model of the drift mobilities of electrons and holes in silicon.
//
// Mobilities returns the electron and hole mobilities mun and mup in cm²/(V·s) at pt: the
// temperature, the ionised dopant densities (which scatter both carriers, whichever is the
// majority) and the free-carrier densities (which enter through electron–hole scattering and
// screening in models that have them). A model that does not depend on a field of pt ignores
// it, but every model validates pt (see Point.Validate) and returns an error outside its
// validity range (errors.Is(err, pvrec.ErrOutOfRange)).
type Mobility interface {
	Mobilities(pt Point) (mun, mup float64, err error)
}

// ConstantMobility is a mobility that depends on nothing: mun = Electron and mup = Hole at
// every valid Point. It is meant for hand calculations and for tests of code that takes a
// Mobility. NewConstantMobility returns the lattice mobilities of undoped silicon at 300 K of
// D. B. M. Klaassen, Solid-State Electron. 35, 953 (1992), 1414 and 470.5 cm²/(V·s).
type ConstantMobility struct {
	Electron float64 // electron mobility, cm²/(V·s), finite and > 0
	Hole     float64 // hole mobility, cm²/(V·s), finite and > 0
}

// NewConstantMobility returns ConstantMobility{Electron: 1414, Hole: 470.5}, Klaassen's
// lattice mobilities at 300 K (see ConstantMobility).
func NewConstantMobility() ConstantMobility {
	return ConstantMobility{Electron: 1414, Hole: 470.5}
}

// String returns "ConstantMobility(1414, 470.5 cm²/Vs)" with the model's values.
func (m ConstantMobility) String() string {
	return fmt.Sprintf("ConstantMobility(%g, %g cm²/Vs)", m.Electron, m.Hole)
}

// Mobilities returns m.Electron and m.Hole in cm²/(V·s) for any valid pt, and an error for
// an invalid pt or for a non-finite or non-positive parameter.
func (m ConstantMobility) Mobilities(pt Point) (mun, mup float64, err error) {
	if err := pt.Validate(); err != nil {
		return 0, 0, err
	}
	if !(m.Electron > 0) || !(m.Hole > 0) || m.Electron > check.MaxMagnitude || m.Hole > check.MaxMagnitude {
		return 0, 0, fmt.Errorf("silicon: %s: mobilities must be finite and > 0 cm²/(V·s), at most %g", m, float64(check.MaxMagnitude))
	}
	return m.Electron, m.Hole, nil
}

// checkMobilityPoint validates pt for a mobility model with temperature range [tmin, tmax] K
// and density range [0, nmax] cm^-3 for the dopant and carrier densities.
func checkMobilityPoint(model string, pt Point, tmin, tmax, nmax float64) error {
	if err := pt.Validate(); err != nil {
		return err
	}
	if err := check.Window("silicon", model, pt.T, tmin, tmax); err != nil {
		return err
	}
	switch {
	case !(pt.Nd <= nmax):
		return check.Range("silicon", model, "donor density Nd", "cm^-3", pt.Nd, 0, nmax)
	case !(pt.Na <= nmax):
		return check.Range("silicon", model, "acceptor density Na", "cm^-3", pt.Na, 0, nmax)
	case !(pt.N <= nmax):
		return check.Range("silicon", model, "electron density N", "cm^-3", pt.N, 0, nmax)
	case !(pt.P <= nmax):
		return check.Range("silicon", model, "hole density P", "cm^-3", pt.P, 0, nmax)
	}
	return nil
}

// checkMobilityResult returns an error unless mun and mup are finite and positive, which
// catches user-edited parameters that make a model meaningless.
func checkMobilityResult(model string, pt Point, mun, mup float64) error {
	if !(mun > 0) || !(mup > 0) || math.IsInf(mun, 0) || math.IsInf(mup, 0) {
		return fmt.Errorf("silicon: %s: parameters give mobilities mun = %g, mup = %g cm²/(V·s) at %+v; want finite > 0",
			model, mun, mup, pt)
	}
	return nil
}
