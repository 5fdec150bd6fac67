package silicon_test

import (
	"fmt"

	"github.com/pvrec/pvrec/pvrec/silicon"
)

// The default band-gap narrowing depends on the free carriers as well as on the doping:
// injecting electron–hole pairs into a lightly doped base narrows the gap further.
func ExampleSchenk1998() {
	bgn := silicon.NewSchenk1998()
	for _, dn := range []float64{0, 1e15, 1e16, 1e17} {
		// p-type base, 1e16 cm^-3 boron, 300 K, with injection dn (cm^-3).
		pt := silicon.Point{T: 300, Na: 1e16, P: 1e16 + dn, N: 1e4 + dn}
		d, err := bgn.DeltaEg(pt)
		if err != nil {
			fmt.Println(err)
			return
		}
		fmt.Printf("Δn = %5.0e cm^-3: ΔEg = %5.2f meV\n", dn, 1e3*d)
	}
	// Output:
	// Δn = 0e+00 cm^-3: ΔEg =  4.27 meV
	// Δn = 1e+15 cm^-3: ΔEg =  4.40 meV
	// Δn = 1e+16 cm^-3: ΔEg =  5.54 meV
	// Δn = 1e+17 cm^-3: ΔEg = 11.63 meV
}

// Schenk's model gives the shifts of both band edges, as Fermi–Dirac statistics need them.
func ExampleSchenk1998_BandEdgeShifts() {
	pt := silicon.Point{T: 300, Nd: 1e19, N: 1e19, P: 10} // n+ emitter, equilibrium
	dEc, dEv, err := silicon.NewSchenk1998().BandEdgeShifts(pt)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("Ec down %.1f meV, Ev up %.1f meV, ΔEg %.1f meV\n", 1e3*dEc, 1e3*dEv, 1e3*(dEc+dEv))
	// Output:
	// Ec down 33.1 meV, Ev up 20.8 meV, ΔEg 53.8 meV
}

// The doping-only models are apparent BGNs, to be used with Boltzmann statistics. A copy with
// one parameter changed is a new model ("what if E1 were 10% larger?").
func ExampleKlaassenSlotboomDeGraaff1992() {
	k := silicon.NewKlaassenSlotboomDeGraaff1992()
	k2 := k
	k2.E1 *= 1.1
	pt := silicon.Point{T: 300, Nd: 1e19, N: 1e19}
	d, _ := k.DeltaEg(pt)
	d2, _ := k2.DeltaEg(pt)
	a, _ := silicon.NewDelAlamoSwanson1987().DeltaEg(pt)
	fmt.Printf("%v: %.1f meV (E1 +10%%: %.1f meV); %v: %.1f meV\n",
		k, 1e3*d, 1e3*d2, silicon.NewDelAlamoSwanson1987(), 1e3*a)
	// Output:
	// KlaassenSlotboomDeGraaff1992: 60.5 meV (E1 +10%: 66.6 meV); DelAlamoSwanson1987: 49.7 meV
}
