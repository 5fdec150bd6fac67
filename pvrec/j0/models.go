package j0

import (
	"fmt"
	"strings"

	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Models is the choice of physical models for the region solvers: the material (band gap,
// ni, band-gap narrowing, statistics, at its temperature), the minority-carrier mobility
// and the bulk recombination mechanisms, each a plain value the user can swap for a simpler
// one (FixedNi, NoNarrowing, Boltzmann, ConstantMobility or Masetti1983, ConstantAuger) to
// compare with hand calculations. A nil mechanism is switched off. Models is safe for
// concurrent use when its models are (all pvrec models are values).
type Models struct {
	Material  *silicon.Material // material at its temperature (required)
	Mobility  silicon.Mobility  // carrier mobilities (minority carrier's used); nil: the material's ModelSet.Mobility
	Auger     recomb.Mechanism  // Auger recombination, e.g. recomb.Richter2012; nil: none
	SRH       recomb.Mechanism  // Shockley–Read–Hall recombination, e.g. recomb.SRH; nil: none
	Radiative recomb.Mechanism  // radiative recombination, e.g. recomb.Trupke2003; nil: none
}

// DefaultModels returns the default models at temperature t in K: silicon.DefaultModelSet
// (Schenk 1998 BGN with Fermi–Dirac statistics, Klaassen 1992 mobility), Richter 2012 Auger
// and Trupke 2003 radiative recombination, without SRH recombination (no defect is assumed;
// set SRH to add one). Richter's and Trupke's parameters hold near 300 K, so the solvers
// return an error outside their 290–310 K window. It returns an error of ModelSet.At.
func DefaultModels(t float64) (Models, error) {
	m, err := silicon.DefaultModelSet().At(t)
	if err != nil {
		return Models{}, fmt.Errorf("j0: DefaultModels: %w", err)
	}
	return Models{
		Material:  m,
		Auger:     recomb.NewRichter2012(),
		Radiative: recomb.NewTrupke2003(),
	}, nil
}

// SimpleModels returns the hand-calculation models at 300 K: a fixed ni = 1e10 cm^-3
// (silicon.NewFixedNi) with a fixed gap, no band-gap narrowing, Boltzmann statistics,
// Masetti 1983 mobility (its 295–305 K window) and Auger recombination with the constant
// coefficients of Dziewior and Schmid 1977 (recomb.DziewiorSchmid1977), without SRH or
// radiative recombination. With these every local quantity has a closed form:
// minority density ni²/N, lifetime 1/(Cn N²) (n-type) or 1/(Cp N²) (p-type).
func SimpleModels() (Models, error) {
	ms := silicon.SimpleModelSet()
	ms.Gap = silicon.NewFixedGap()
	ms.Mobility = silicon.NewMasetti1983()
	m, err := ms.At(300)
	if err != nil {
		return Models{}, fmt.Errorf("j0: SimpleModels: %w", err)
	}
	return Models{Material: m, Auger: recomb.NewDziewiorSchmid1977()}, nil
}

// String returns the material and the models, e.g. "Si 300.00 K: Eg Pässler2002, …,
// μ Klaassen1992; Auger Richter2012; SRH none; radiative Trupke2003", to stamp results
// (nb.Footer accepts it). A mobility that overrides the material's is named after it.
func (m Models) String() string {
	name := func(v any) string {
		if v == nil {
			return "none"
		}
		if s, ok := v.(fmt.Stringer); ok {
			return s.String()
		}
		return strings.TrimPrefix(fmt.Sprintf("%T", v), "recomb.")
	}
	mat := "no material"
	if m.Material != nil {
		mat = m.Material.String()
	}
	mob := ""
	if m.Mobility != nil {
		mob = "; mobility " + name(m.Mobility)
	}
	return fmt.Sprintf("%s%s; Auger %s; SRH %s; radiative %s",
		mat, mob, name(m.Auger), name(m.SRH), name(m.Radiative))
}

func (m Models) validate() error {
	if m.Material == nil {
		return fmt.Errorf("j0: Models.Material is nil (use DefaultModels or silicon.ModelSet.At)")
	}
	return nil
}

// mobility returns the mobility model in force: Mobility, or the material's.
func (m Models) mobility() silicon.Mobility {
	if m.Mobility != nil {
		return m.Mobility
	}
	return m.Material.Models().Mobility
}
