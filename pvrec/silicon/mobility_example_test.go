package silicon_test

import (
	"fmt"

	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Majority- and minority-carrier mobilities at 300 K from Klaassen's unified model: at
// 1e19 cm^-3 minority electrons in p-type silicon move faster than majority electrons in
// n-type silicon.
func ExampleKlaassen1992() {
	m := silicon.NewKlaassen1992()
	for _, n := range []float64{1e15, 1e17, 1e19} {
		maj, _, _ := m.Mobilities(silicon.Point{T: 300, Nd: n, N: n})
		min, _, err := m.Mobilities(silicon.Point{T: 300, Na: n, P: n})
		if err != nil {
			fmt.Println(err)
			return
		}
		fmt.Printf("N = %.0e cm^-3: electrons %6.1f (majority) %6.1f (minority) cm²/Vs\n", n, maj, min)
	}
	// Output:
	// N = 1e+15 cm^-3: electrons 1362.1 (majority) 1331.7 (minority) cm²/Vs
	// N = 1e+17 cm^-3: electrons  721.3 (majority)  665.6 (minority) cm²/Vs
	// N = 1e+19 cm^-3: electrons  114.8 (majority)  188.2 (minority) cm²/Vs
}

// Masetti's room-temperature fits for phosphorus- and arsenic-doped silicon differ at high
// doping only.
func ExampleMasetti1983() {
	p, as := silicon.NewMasetti1983(), silicon.NewMasetti1983Arsenic()
	for _, n := range []float64{1e16, 1e20} {
		pt := silicon.Point{T: 300, Nd: n, N: n}
		mp, _, _ := p.Mobilities(pt)
		ma, _, _ := as.Mobilities(pt)
		fmt.Printf("Nd = %.0e cm^-3: %s %.1f, %s %.1f cm²/Vs\n", n, p, mp, as, ma)
	}
	// Output:
	// Nd = 1e+16 cm^-3: Masetti1983 1183.8, Masetti1983(As) 1176.8 cm²/Vs
	// Nd = 1e+20 cm^-3: Masetti1983 73.2, Masetti1983(As) 60.9 cm²/Vs
}

// Minority-carrier diffusivities in an n+ emitter region and a p-type base, with the
// degeneracy correction of the Einstein relation for the majority electrons of the emitter.
func ExampleDiffusivities() {
	mat, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		fmt.Println(err)
		return
	}
	mob := silicon.NewKlaassen1992()
	dn, dp, _ := silicon.Diffusivities(mat, mob, 1e20, 1e3, 1e20, 0) // n+ region
	fmt.Printf("n+ 1e20: Dn = %.2f, Dp = %.2f cm²/s\n", dn, dp)
	dn, dp, _ = silicon.Diffusivities(mat, mob, 1e5, 1e16, 0, 1e16) // p-type base
	fmt.Printf("p 1e16:  Dn = %.2f, Dp = %.2f cm²/s\n", dn, dp)
	da, _ := silicon.AmbipolarDiffusivity(dn, dp, 1e15, 1.1e16) // base with Δn = 1e15
	fmt.Printf("ambipolar at Δn = 1e15: %.2f cm²/s\n", da)
	// Output:
	// n+ 1e20: Dn = 4.06, Dp = 3.24 cm²/s
	// p 1e16:  Dn = 28.54, Dp = 11.10 cm²/s
	// ambipolar at Δn = 1e15: 25.23 cm²/s
}

// The sum of the mobilities versus excess carrier density in a 1e15 cm^-3 p-type wafer, as
// used to convert photoconductance into Δn: tabulate once, then evaluate cheaply.
func ExampleSumMobilityTable() {
	mob := silicon.NewKlaassen1992()
	wafer := silicon.Point{T: 300, Na: 1e15, P: 1e15, N: 9.3e4} // equilibrium state
	tab, err := silicon.NewSumMobilityTable(mob, wafer, 1e12, 1e17, 1e-6)
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, dn := range []float64{1e13, 1e15, 1e16, 1e17} {
		s, _ := tab.At(dn)
		fmt.Printf("Δn = %.0e cm^-3: μn+μp = %.1f cm²/Vs\n", dn, s)
	}
	// Output:
	// Δn = 1e+13 cm^-3: μn+μp = 1793.2 cm²/Vs
	// Δn = 1e+15 cm^-3: μn+μp = 1756.6 cm²/Vs
	// Δn = 1e+16 cm^-3: μn+μp = 1572.4 cm²/Vs
	// Δn = 1e+17 cm^-3: μn+μp = 1127.4 cm²/Vs
}

// The same table from the material: its temperature, mobility model and the wafer's
// equilibrium state come from the *Material, so nothing is typed twice.
func ExampleMaterial_SumMobilityTable() {
	si, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		fmt.Println(err)
		return
	}
	tab, err := si.SumMobilityTable(0, 1e15, 1e12, 1e17, 1e-6) // p-type wafer, Na = 1e15 cm^-3
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, dn := range []float64{1e13, 1e17} {
		s, _ := tab.At(dn)
		fmt.Printf("Δn = %.0e cm^-3: μn+μp = %.1f cm²/Vs\n", dn, s)
	}
	// Output:
	// Δn = 1e+13 cm^-3: μn+μp = 1793.2 cm²/Vs
	// Δn = 1e+17 cm^-3: μn+μp = 1127.4 cm²/Vs
}
