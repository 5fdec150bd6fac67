package silicon

// Bandgap is a model of the (undoped, unnarrowed) band gap of silicon versus temperature.
type Bandgap interface {
	// Eg returns the band gap in eV at temperature t in K, or an error outside the
	// model's validity range or for invalid t.
	Eg(t float64) (float64, error)
}

// DensityOfStates is a model of the effective densities of states of the conduction and
// valence bands versus temperature.
type DensityOfStates interface {
	// NcNv returns Nc and Nv in cm^-3 at temperature t in K.
	NcNv(t float64) (nc, nv float64, err error)
}

// IntrinsicDensity is a model of the intrinsic carrier density ni of undoped silicon
// versus temperature (no band-gap narrowing, Boltzmann statistics).
type IntrinsicDensity interface {
	// Ni returns ni in cm^-3 at temperature t in K.
	Ni(t float64) (float64, error)
}

// BandgapNarrowing is a model of the reduction of the band gap by doping (and, for some
// models, by free carriers).
type BandgapNarrowing interface {
	// DeltaEg returns the band-gap narrowing in eV (>= 0 for physical inputs) at pt.
	// Models calibrated as "apparent" BGN with Boltzmann statistics say so in their
	// doc comment.
	DeltaEg(pt Point) (float64, error)
}

// Ionization is a model of the ionised fraction of the dopants.
type Ionization interface {
	// Ionized returns the ionised donor and acceptor densities ndIon <= nd and naIon <= na
	// in cm^-3, at temperature t in K, for total donor and acceptor densities nd and na in
	// cm^-3, when the Fermi level lies etaN·kT above the (narrowed) conduction-band edge and
	// etaP·kT below the (narrowed) valence-band edge. ndIon must not increase with etaN and
	// naIon must not decrease as etaP falls (as the Fermi level rises).
	Ionized(t, nd, na, etaN, etaP float64) (ndIon, naIon float64, err error)
}
