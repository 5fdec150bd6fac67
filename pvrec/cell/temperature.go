package cell

import (
	"fmt"
	"strings"

	"github.com/pvrec/pvrec/pvrec/internal/check"
)

// DefaultTempStep is the temperature step in K of TemperatureCoefficients when it is given 0:
// 5 K, so that T ± 5 K stays inside the 290–310 K window of the default intrinsic
// recombination (Richter2012, Trupke2003) for any T from 295 to 305 K (25 °C included).
const DefaultTempStep = 5

// scaling holds the factors by which At carries the parts given as numbers from the design's
// temperature T0 to T.
type scaling struct {
	t0, t float64
	ni    float64 // ni(T)/ni(T0)
	ni2   float64 // (ni(T)/ni(T0))²
}

// notes returns the sentences that say how the parts of d were carried to s.t.
func (s *scaling) notes(d Design) []string {
	if s.t == s.t0 {
		return nil
	}
	var out []string
	var numbers, regions, surfaces []string
	for side, parts := range [2][]Part{d.Front, d.Rear} {
		for i, p := range parts {
			name := p.Name
			if name == "" {
				name = fmt.Sprintf("part %d", i+1)
			}
			name = sideName(side) + ": " + name
			switch {
			case p.Surface != nil:
				surfaces = append(surfaces, name)
			case p.Region != nil:
				regions = append(regions, name)
			case p.J0 > 0:
				numbers = append(numbers, name)
			}
		}
	}
	if len(numbers) > 0 {
		out = append(out, fmt.Sprintf("J0 given as numbers at %.2f K (%s) scaled to %.2f K by ni²(T)/ni²(T0) = %.4g, assuming every other factor of J0 (diffusivity, lifetime, band-gap narrowing) independent of T",
			s.t0, strings.Join(numbers, ", "), s.t, s.ni2))
	}
	if d.J02 > 0 {
		out = append(out, fmt.Sprintf("J02 scaled by ni(T)/ni(T0) = %.4g (recombination in the space-charge region ∝ ni)", s.ni))
	}
	if len(regions) > 0 {
		out = append(out, fmt.Sprintf("regions re-solved at %.2f K (%s)", s.t, strings.Join(regions, ", ")))
	}
	if len(surfaces) > 0 {
		out = append(out, fmt.Sprintf("surface models evaluated at %.2f K as they model it (%s); a ConstantJ0s or ConstantSeff keeps its value", s.t, strings.Join(surfaces, ", ")))
	}
	out = append(out, "Jsc, Rs, Rsh and Pin held at their design values")
	return out
}

// At returns the device rebuilt at temperature t in K: the material's model set evaluated at
// t (silicon.ModelSet.At), the Region parts re-solved there (a j0.ModelSurface front surface
// follows the new material), the base and the surface and bulk models evaluated in it as
// they model temperature, and the parts given as numbers at the design's temperature T0
// scaled by a documented assumption:
//
//	J0(T) = J0(T0) · ni²(T)/ni²(T0)   (J0 given as a number: every factor but ni² independent of T),
//	J02(T) = J02(T0) · ni(T)/ni(T0)   (space-charge-region recombination ∝ ni),
//
// with ni the material's intrinsic density (without narrowing); Jsc, Rs, Rsh and Pin keep
// their values (no optics or transport model here). The result's Notes say so. It returns an
// error for the zero Device or an error of the material or of a region's solver; models with a
// temperature window (Richter2012, Trupke2003: 290–310 K) fail later, when evaluated, with an
// error matching pvrec.ErrOutOfRange.
func (d *Device) At(t float64) (*Device, error) {
	if d == nil || d.bulk == nil {
		return nil, errZeroDevice
	}
	ref := d.design.Material
	m, err := ref.Models().At(t)
	if err != nil {
		return nil, fmt.Errorf("cell: At(%g K): %w", t, err)
	}
	r := m.Ni() / ref.Ni()
	return build(d.design, m, &scaling{t0: ref.T(), t: t, ni: r, ni2: r * r})
}

// TempCoefficients are the temperature coefficients of a cell near its temperature T, by
// central differences over T ± Step with the whole model set re-evaluated at each temperature
// (Device.At, whose assumptions for parts given as numbers are in Notes).
type TempCoefficients struct {
	T    float64 // temperature, K
	Step float64 // step of the central differences, K

	Voc, FF, Efficiency float64 // values at T: V, dimensionless, dimensionless

	DVoc float64 // dVoc/dT, V/K
	DFF  float64 // dFF/dT, 1/K
	DEta float64 // dη/dT (absolute efficiency per kelvin), 1/K

	RelVoc float64 // (1/Voc) dVoc/dT, 1/K
	RelFF  float64 // (1/FF) dFF/dT, 1/K
	RelEta float64 // (1/η) dη/dT, 1/K

	Notes []string // how the parts were carried to T ± Step
}

// TemperatureCoefficients returns the temperature coefficients of Voc, FF and efficiency at
// the device's temperature T by central differences, (X(T + h) − X(T − h))/(2h), with step
// h in K (finite, > 0; 0 means DefaultTempStep), from Solve at T and at T ± h (At). The error
// of the difference is h² X‴/6 (X‴ the third derivative in T): for Voc about 1e-5 relative at
// h = 5 K with the default models (Voc‴ ≈ 6e-9 V/K³, from ni's T^1.712 and the curvature of
// the gap), falling as h²; parts solved to a relative tolerance (Region J0s, Solver.RelTol)
// add a noise of up to about Vt·RelTol/(2h) to dVoc/dT. It returns an error for the zero Device, an invalid step,
// or an error of At or Solve (a model outside its temperature window at T ± h gives one
// matching pvrec.ErrOutOfRange: choose a smaller step).
func (d *Device) TemperatureCoefficients(step float64) (TempCoefficients, error) {
	if d == nil || d.bulk == nil {
		return TempCoefficients{}, errZeroDevice
	}
	if step == 0 {
		step = DefaultTempStep
	}
	if err := check.Positive("cell: TemperatureCoefficients", "step", step, "K"); err != nil {
		return TempCoefficients{}, err
	}
	t := d.mat.T()
	mid, err := d.Solve()
	if err != nil {
		return TempCoefficients{}, err
	}
	var side [2]Result
	var notes []string
	for i, ti := range [2]float64{t - step, t + step} {
		di, err := d.At(ti)
		if err != nil {
			return TempCoefficients{}, err
		}
		if side[i], err = di.Solve(); err != nil {
			return TempCoefficients{}, fmt.Errorf("cell: TemperatureCoefficients at %g K: %w", ti, err)
		}
		if i == 1 {
			notes = side[i].Notes
		}
	}
	c := TempCoefficients{
		T: t, Step: step, Voc: mid.Voc, FF: mid.FF, Efficiency: mid.Efficiency,
		DVoc:  (side[1].Voc - side[0].Voc) / (2 * step),
		DFF:   (side[1].FF - side[0].FF) / (2 * step),
		DEta:  (side[1].Efficiency - side[0].Efficiency) / (2 * step),
		Notes: notes,
	}
	c.RelVoc, c.RelFF, c.RelEta = c.DVoc/c.Voc, c.DFF/c.FF, c.DEta/c.Efficiency
	return c, nil
}

// String returns the coefficients as a table with units (mV/K, %/K).
func (c TempCoefficients) String() string {
	s := fmt.Sprintf("temperature coefficients at %.2f K (central differences over ±%g K)\n", c.T, c.Step)
	s += fmt.Sprintf("  dVoc/dT  %.3f mV/K  (%.3f %%/K)\n", 1e3*c.DVoc, 100*c.RelVoc)
	s += fmt.Sprintf("  dFF/dT   %.4f %%abs/K (%.3f %%/K)\n", 100*c.DFF, 100*c.RelFF)
	s += fmt.Sprintf("  dη/dT    %.4f %%abs/K (%.3f %%/K)\n", 100*c.DEta, 100*c.RelEta)
	for _, n := range c.Notes {
		s += "note: " + n + "\n"
	}
	return s
}
