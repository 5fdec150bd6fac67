package lifetime

import (
	"fmt"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// OneSunFlux is a photon flux per sun of 2.497e17 cm^-2 s^-1: the flux that, fully absorbed,
// generates 40 mA/cm^2 (0.04 A/cm^2 / q), the one-sun-like photocurrent pvrec's notebooks use
// for silicon (common practice, no source; it is a round number near the generation of a
// well-absorbing wafer under a standard spectrum, not a value computed from one). Pass it, or
// your own calibration, as Optics.FluxPerSun: pvrec applies no default.
const OneSunFlux = 0.04 / silicon.ElementaryCharge

// Optics describes how light generates carriers in a lifetime sample: the photon flux of one
// sun and the fraction of it the wafer absorbs, so that a light intensity of X suns gives the
// volume-averaged generation rate
//
//	G = X · FluxPerSun · Absorbed / W
//
// (definition; uniform generation across the wafer assumed, as in the quasi-steady-state and
// generalised analyses of H. Nagel, C. Berge and A. G. Aberle, J. Appl. Phys. 86, 6218
// (1999), whose optical factor Absorbed is). Both fields are inputs; the zero Optics is
// rejected with an error naming the field.
type Optics struct {
	FluxPerSun float64 // photon flux of one sun incident on the sample, cm^-2 s^-1 (finite, > 0), e.g. OneSunFlux
	Absorbed   float64 // fraction of the incident photons that generate an electron–hole pair in the wafer, (0, 1]
}

// check returns an error naming the first invalid field of o.
func (o Optics) check(ctx string) error {
	if err := check.Positive("lifetime: "+ctx, "Optics.FluxPerSun", o.FluxPerSun, "cm^-2 s^-1"); err != nil {
		return err
	}
	if !(o.Absorbed > 0 && o.Absorbed <= 1) {
		return fmt.Errorf("lifetime: %s: Optics.Absorbed (absorbed fraction) must lie in (0, 1], got %g", ctx, o.Absorbed)
	}
	return nil
}

// Generation returns the volume-averaged generation rate G = suns · FluxPerSun · Absorbed / w
// in cm^-3 s^-1 of a wafer of thickness w in cm (finite, > 0) under suns suns (finite, >= 0).
// It returns an error naming an invalid field of o or argument.
func (o Optics) Generation(suns, w float64) (float64, error) {
	if err := o.check("Optics.Generation"); err != nil {
		return 0, err
	}
	if err := check.NonNegative("lifetime: Optics.Generation", "light intensity suns", suns, "suns"); err != nil {
		return 0, err
	}
	if err := check.Positive("lifetime: Optics.Generation", "thickness w", w, "cm"); err != nil {
		return 0, err
	}
	return suns * o.FluxPerSun * o.Absorbed / w, nil
}

// Photocurrent returns the photogenerated current density at one sun, Jph = q · FluxPerSun ·
// Absorbed in A/cm^2 (the short-circuit current density of an ideal device on the sample), or
// an error naming an invalid field of o.
func (o Optics) Photocurrent() (float64, error) {
	if err := o.check("Optics.Photocurrent"); err != nil {
		return 0, err
	}
	return silicon.ElementaryCharge * o.FluxPerSun * o.Absorbed, nil
}
