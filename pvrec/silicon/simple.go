package silicon

// SimpleModelSet returns the model set of hand calculations and closed-form reference tables:
// DefaultModelSet with Boltzmann statistics, a constant intrinsic density (NewFixedNi,
// ni = 1e10 cm^-3) and no band-gap narrowing, so that ni,eff = ni and n0 p0 = ni² exactly;
// the band gap, densities of states, ionisation and mobility stay those of DefaultModelSet.
// At 300 K it has Nc = 2.86e19 and Nv = 3.10e19 cm^-3 (Green1990). It is the material of the
// mpmath reference tables in testdata/reference and of textbook checks; it is not a model of
// real silicon (no narrowing, a round ni).
func SimpleModelSet() ModelSet {
	ms := DefaultModelSet()
	ms.Statistics = Boltzmann
	ms.Intrinsic = NewFixedNi()
	ms.BGN = NoNarrowing{}
	return ms
}
