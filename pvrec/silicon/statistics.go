package silicon

import "fmt"

// Statistics selects the carrier statistics: Boltzmann or Fermi–Dirac. The zero value is
// invalid, so that a ModelSet must choose one explicitly.
type Statistics uint8

const (
	// Boltzmann statistics: n = Nc exp(η_n), p = Nv exp(η_p); valid for non-degenerate
	// carriers (n << Nc, p << Nv).
	Boltzmann Statistics = iota + 1
	// FermiDirac statistics: n = Nc F_{1/2}(η_n), p = Nv F_{1/2}(η_p), with F_{1/2} from
	// package fermi (normalised so that F_{1/2}(η) → e^η as η → −∞).
	FermiDirac
)

// String returns "Boltzmann" or "Fermi–Dirac".
func (s Statistics) String() string {
	switch s {
	case Boltzmann:
		return "Boltzmann"
	case FermiDirac:
		return "Fermi–Dirac"
	}
	return fmt.Sprintf("Statistics(%d)", uint8(s))
}

func (s Statistics) valid() bool { return s == Boltzmann || s == FermiDirac }

// CompleteIonization is the Ionization model in which every dopant is ionised:
// ndIon = nd, naIon = na. It is the only Ionization model the package provides: the
// incomplete-ionisation model of P. P. Altermatt, A. Schenk, B. Schmithüsen and G. Heiser,
// J. Appl. Phys. 100, 113714 and 113715 (2006), is left out because its parameters could
// not be reconstructed with confidence. Another model can be supplied through the
// Ionization interface; Material.Equilibrium then solves charge neutrality with it.
type CompleteIonization struct{}

// String returns "complete ionisation".
func (CompleteIonization) String() string { return "complete ionisation" }

// Ionized returns nd and na unchanged, after checking that t is a temperature of solid
// silicon (0 < t <= MeltingPoint) and nd, na valid densities (finite, >= 0, at most
// AtomDensity); etaN and etaP are not used.
func (CompleteIonization) Ionized(t, nd, na, etaN, etaP float64) (ndIon, naIon float64, err error) {
	if err := checkSolid("CompleteIonization", t); err != nil {
		return 0, 0, err
	}
	if err := checkAtoms("density nd", nd); err != nil {
		return 0, 0, err
	}
	if err := checkAtoms("density na", na); err != nil {
		return 0, 0, err
	}
	return nd, na, nil
}
