package silicon_test

import (
	"fmt"
	"log"

	"github.com/pvrec/pvrec/pvrec/silicon"
)

func ExampleModelSet_At() {
	m, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(m)
	fmt.Printf("kT/q = %.3f mV, Eg = %.4f eV, ni = %.3g cm^-3\n", 1e3*m.Vt(), m.Eg(), m.Ni())
	fmt.Printf("Nc = %.3g cm^-3, Nv = %.3g cm^-3\n", m.Nc(), m.Nv())
	// Output:
	// Si 300.00 K: Eg Pässler2002, DOS Green1990, ni Couderc2014, BGN Schenk1998, Fermi–Dirac, complete ionisation, μ Klaassen1992
	// kT/q = 25.852 mV, Eg = 1.1243 eV, ni = 9.67e+09 cm^-3
	// Nc = 2.86e+19 cm^-3, Nv = 3.1e+19 cm^-3
}

func ExampleModelSet() {
	// A researcher's variation: Boltzmann statistics with an apparent BGN, and the 300 K
	// intrinsic density of Altermatt et al. (2003).
	ms := silicon.DefaultModelSet()
	ms.Statistics = silicon.Boltzmann
	ms.BGN = silicon.NewKlaassenSlotboomDeGraaff1992()
	ms.Intrinsic = silicon.NewAltermatt2003()
	m, err := ms.At(300)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(m)
	// Altermatt2003 holds at 300 K only:
	_, err = ms.At(310)
	fmt.Println(err)
	// Output:
	// Si 300.00 K: Eg Pässler2002, DOS Green1990, ni Altermatt2003, BGN KlaassenSlotboomDeGraaff1992, Boltzmann, complete ionisation, μ Klaassen1992
	// silicon: Altermatt2003: temperature T = 310 K outside the model's window [299.99, 300.01] K
}

func ExampleMaterial_Equilibrium() {
	m, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, nd := range []float64{1e15, 1e19, 1e20} {
		e, err := m.Equilibrium(nd, 0)
		if err != nil {
			fmt.Println(err)
			return
		}
		fmt.Printf("Nd = %.0e: n0 = %.3e, p0 = %.3e cm^-3, ΔEg = %.1f meV, ni,eff = %.3e cm^-3, EF − Ec = %+.1f meV\n",
			nd, e.N0, e.P0, 1e3*e.DeltaEg, e.NiEff, 1e3*e.EFMinusEc)
	}
	// Output:
	// Nd = 1e+15: n0 = 1.000e+15, p0 = 9.863e+04 cm^-3, ΔEg = 1.4 meV, ni,eff = 9.931e+09 cm^-3, EF − Ec = -265.3 meV
	// Nd = 1e+19: n0 = 1.000e+19, p0 = 6.627e+01 cm^-3, ΔEg = 53.8 meV, ni,eff = 2.574e+10 cm^-3, EF − Ec = -24.0 meV
	// Nd = 1e+20: n0 = 1.000e+20, p0 = 6.598e+00 cm^-3, ΔEg = 81.1 meV, ni,eff = 2.569e+10 cm^-3, EF − Ec = +62.9 meV
}

func ExampleMaterial_NiEff() {
	m, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		fmt.Println(err)
		return
	}
	// A p-type wafer (Na = 1e16 cm^-3) under injection Δn = 1e15 cm^-3.
	const na, dn = 1e16, 1e15
	e, err := m.Equilibrium(0, na)
	if err != nil {
		fmt.Println(err)
		return
	}
	nie, err := m.NiEff(e.N0+dn, e.P0+dn, e.NdIon, e.NaIon)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("ni = %.4e, ni,eff = %.4e cm^-3\n", m.Ni(), nie)
	// Output:
	// ni = 9.6660e+09, ni,eff = 1.0523e+10 cm^-3
}

func ExampleCouderc2014() {
	ni := silicon.NewCouderc2014()
	for _, t := range []float64{250, 300, 350} {
		v, err := ni.Ni(t)
		if err != nil {
			fmt.Println(err)
			return
		}
		fmt.Printf("ni(%g K) = %.3g cm^-3\n", t, v)
	}
	// Output:
	// ni(250 K) = 6.82e+07 cm^-3
	// ni(300 K) = 9.67e+09 cm^-3
	// ni(350 K) = 3.51e+11 cm^-3
}

// The model set of hand calculations: ni,eff = ni = 1e10 cm^-3 at any doping, so n0 p0 = ni².
func ExampleSimpleModelSet() {
	si, err := silicon.SimpleModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	eq, err := si.Equilibrium(0, 1e16)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("p0 = %.3g, n0 = %.3g, ni,eff = %.3g cm^-3\n", eq.P0, eq.N0, eq.NiEff)
	// Output:
	// p0 = 1e+16, n0 = 1e+04, ni,eff = 1e+10 cm^-3
}
