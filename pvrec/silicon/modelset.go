package silicon

import (
	"fmt"
	"math"
	"reflect"
	"strings"
)

// ModelSet is the user-editable choice of material models: a plain value that can be copied
// and changed field by field ("what if the gap were Green's?") before it is fixed at a
// temperature by At. Every field must be set; DefaultModelSet fills them all. The models must
// be values, not pointers (At refuses pointers), so that a Material cannot change after At.
//
// How the models combine: the intrinsic density ni is taken from Intrinsic alone, and the band
// gap from Gap alone; Nc and Nv enter only through the Fermi–Dirac degeneracy of the carriers.
// The statistics use the gap implied by the three, Eg,stat = kT ln(Nc Nv/ni²), narrowed by
// BGN, so that both statistics reduce to n0 p0 = ni² exp(ΔEg/kT) for non-degenerate carriers
// whatever the pairing of models. Gap's Eg is reported by Material.Eg for band-edge
// referencing; it does not enter the carrier densities.
type ModelSet struct {
	Gap        Bandgap          // band gap of undoped silicon versus temperature
	DOS        DensityOfStates  // effective densities of states Nc, Nv
	Intrinsic  IntrinsicDensity // intrinsic carrier density ni
	BGN        BandgapNarrowing // band-gap narrowing ΔEg (doping and, for some models, carriers)
	Statistics Statistics       // Boltzmann or FermiDirac
	Ionization Ionization       // dopant ionisation; CompleteIonization{} for complete ionisation
	Mobility   Mobility         // carrier mobilities μn, μp (majority, minority, carrier–carrier)
}

// DefaultModelSet returns the package's default models: band gap Passler2002, densities of
// states Green1990DOS, intrinsic density Couderc2014, band-gap narrowing Schenk1998,
// Fermi–Dirac statistics, complete ionisation and mobility Klaassen1992. Its validity range is the intersection of
// the models' ranges, 200–500 K with the default parameters.
func DefaultModelSet() ModelSet {
	return ModelSet{
		Gap:        NewPassler2002(),
		DOS:        NewGreen1990DOS(),
		Intrinsic:  NewCouderc2014(),
		BGN:        defaultBGN(),
		Statistics: FermiDirac,
		Ionization: CompleteIonization{},
		Mobility:   NewKlaassen1992(),
	}
}

// String returns the models' short names, e.g. "Eg Pässler2002, DOS Green1990,
// ni Couderc2014, BGN Schenk1998, Fermi–Dirac, complete ionisation, μ Klaassen1992".
func (ms ModelSet) String() string {
	return fmt.Sprintf("Eg %s, DOS %s, ni %s, BGN %s, %s, %s, μ %s",
		modelName(ms.Gap), modelName(ms.DOS), modelName(ms.Intrinsic), modelName(ms.BGN),
		ms.Statistics, modelName(ms.Ionization), modelName(ms.Mobility))
}

// modelName returns the model's String() if it has one, else its Go type.
func modelName(m any) string {
	switch v := m.(type) {
	case nil:
		return "<nil>"
	case fmt.Stringer:
		return v.String()
	}
	return strings.TrimPrefix(fmt.Sprintf("%T", m), "silicon.")
}

// validate returns an error naming the first unset field or pointer model.
func (ms ModelSet) validate() error {
	for _, f := range [...]struct {
		name  string
		model any
	}{{"Gap", ms.Gap}, {"DOS", ms.DOS}, {"Intrinsic", ms.Intrinsic}, {"BGN", ms.BGN}, {"Ionization", ms.Ionization}, {"Mobility", ms.Mobility}} {
		if f.model != nil && reflect.ValueOf(f.model).Kind() == reflect.Pointer {
			return fmt.Errorf("silicon: ModelSet.%s is a pointer (%T); pass the model by value, so that the Material cannot change after At", f.name, f.model)
		}
	}
	switch {
	case ms.Gap == nil:
		return fmt.Errorf("silicon: ModelSet.Gap is nil")
	case ms.DOS == nil:
		return fmt.Errorf("silicon: ModelSet.DOS is nil")
	case ms.Intrinsic == nil:
		return fmt.Errorf("silicon: ModelSet.Intrinsic is nil")
	case ms.BGN == nil:
		return fmt.Errorf("silicon: ModelSet.BGN is nil (use NoNarrowing for none)")
	case !ms.Statistics.valid():
		return fmt.Errorf("silicon: ModelSet.Statistics = %v is not Boltzmann or FermiDirac", ms.Statistics)
	case ms.Ionization == nil:
		return fmt.Errorf("silicon: ModelSet.Ionization is nil (use CompleteIonization{})")
	case ms.Mobility == nil:
		return fmt.Errorf("silicon: ModelSet.Mobility is nil (use ConstantMobility for hand calculations)")
	}
	return nil
}

// At evaluates the temperature-dependent models at temperature t in K and returns the
// immutable Material that caches them. It returns an error if a field of ms is unset or a
// pointer, if t is NaN, infinite or <= 0, if t is above MeltingPoint or outside a model's
// validity range (errors.Is(err, pvrec.ErrOutOfRange)), or if a model returns a non-finite
// or non-positive value.
func (ms ModelSet) At(t float64) (*Material, error) {
	if err := ms.validate(); err != nil {
		return nil, err
	}
	if err := checkSolid("ModelSet.At", t); err != nil {
		return nil, err
	}
	eg, err := ms.Gap.Eg(t)
	if err != nil {
		return nil, err
	}
	if !(eg > 0) || math.IsInf(eg, 0) {
		return nil, fmt.Errorf("silicon: Gap model %s gives Eg = %g eV at T = %g K; want finite > 0", modelName(ms.Gap), eg, t)
	}
	nc, nv, err := ms.DOS.NcNv(t)
	if err != nil {
		return nil, err
	}
	if !(nc > 0 && nv > 0) || math.IsInf(nc, 0) || math.IsInf(nv, 0) {
		return nil, fmt.Errorf("silicon: DOS model %s gives Nc = %g, Nv = %g cm^-3 at T = %g K; want finite > 0", modelName(ms.DOS), nc, nv, t)
	}
	ni, err := ms.Intrinsic.Ni(t)
	if err != nil {
		return nil, err
	}
	if !(ni > 0) || math.IsInf(ni, 0) {
		return nil, fmt.Errorf("silicon: Intrinsic model %s gives ni = %g cm^-3 at T = %g K; want finite > 0", modelName(ms.Intrinsic), ni, t)
	}
	vt := BoltzmannEV * t
	// Reduced statistical gap ln(Nc Nv / ni²), computed in logs so that tiny ni at low T
	// cannot underflow.
	gap0 := math.Log(nc) + math.Log(nv) - 2*math.Log(ni)
	if !(gap0 > 0) {
		return nil, fmt.Errorf("silicon: models give ni = %g cm^-3 >= sqrt(Nc Nv) = %g cm^-3 at T = %g K", ni, math.Sqrt(nc)*math.Sqrt(nv), t)
	}
	// Evaluate the mobility model once at low doping so that a temperature outside its range
	// fails here rather than deep inside a solver.
	if _, _, err := ms.Mobility.Mobilities(Point{T: t}); err != nil {
		return nil, err
	}
	_, complete := ms.Ionization.(CompleteIonization)
	return &Material{
		ms: ms, t: t, vt: vt, eg: eg, nc: nc, nv: nv, ni: ni,
		gap0: gap0, complete: complete,
	}, nil
}
