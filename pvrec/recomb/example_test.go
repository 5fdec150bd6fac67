package recomb_test

import (
	"fmt"
	"log"

	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// The intrinsic lifetime limit (Richter2012 Auger + Trupke2003 radiative) of phosphorus-doped
// silicon at 300 K, with the default material model set.
func ExampleBulk_Lifetime() {
	mat, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	bulk, err := recomb.NewBulk(mat, 1e16, 0) // Nd = 1e16 cm^-3
	if err != nil {
		log.Fatal(err)
	}
	intr := recomb.NewIntrinsic()
	for _, dn := range []float64{1e14, 1e15, 1e16} {
		tau, err := bulk.Lifetime(intr, dn)
		if err != nil {
			log.Fatal(err)
		}
		fmt.Printf("Δn = %.0e cm^-3: τ_intr = %.3g ms\n", dn, tau*1e3)
	}
	// Output:
	// Δn = 1e+14 cm^-3: τ_intr = 2.7 ms
	// Δn = 1e+15 cm^-3: τ_intr = 2.37 ms
	// Δn = 1e+16 cm^-3: τ_intr = 0.957 ms
}

// An effective bulk lifetime: the intrinsic limit plus interstitial iron, in boron-doped
// silicon.
func ExampleSum() {
	mat, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	bulk, err := recomb.NewBulk(mat, 0, 1e16) // Na = 1e16 cm^-3
	if err != nil {
		log.Fatal(err)
	}
	eff := recomb.Sum{recomb.NewIntrinsic(), recomb.InterstitialIron(1e11)}
	tau, err := bulk.Lifetime(eff, 1e15)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("%v: τeff = %.3g µs\n", eff, tau*1e6)
	// Output:
	// Intrinsic(Richter2012 + Trupke2003) + Fe_i(1e+11 cm^-3): τeff = 699 µs
}

// A Shockley–Read–Hall level given by its capture time constants: in high injection the
// lifetime tends to τn0 + τp0.
func ExampleSRH() {
	mat, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	bulk, err := recomb.NewBulk(mat, 0, 1e15)
	if err != nil {
		log.Fatal(err)
	}
	srh := recomb.SRH{Level: recomb.BelowEc(0.26), TauN0: 10e-6, TauP0: 30e-6}
	for _, dn := range []float64{1e12, 1e17} {
		tau, err := bulk.Lifetime(srh, dn)
		if err != nil {
			log.Fatal(err)
		}
		fmt.Printf("Δn = %.0e cm^-3: τ_SRH = %.3g µs\n", dn, tau*1e6)
	}
	// Output:
	// Δn = 1e+12 cm^-3: τ_SRH = 47.8 µs
	// Δn = 1e+17 cm^-3: τ_SRH = 40.2 µs
}

// The iron concentration from lifetimes measured before and after dissociating the
// iron–boron pairs (invented example values).
func ExampleIronBoron_Concentration() {
	mat, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	bulk, err := recomb.NewBulk(mat, 0, 1.5e16) // 1 Ω·cm boron-doped
	if err != nil {
		log.Fatal(err)
	}
	fe := recomb.NewIronBoron()
	co, err := fe.Crossover(bulk)
	if err != nil {
		log.Fatal(err)
	}
	c, err := fe.Concentration(bulk, 1e13, 120e-6, 15e-6) // τ before 120 µs, after 15 µs at Δn = 1e13
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("crossover at Δn = %.2g cm^-3; [Fe] = %.2g cm^-3\n", co, c)
	// Output:
	// crossover at Δn = 1.9e+14 cm^-3; [Fe] = 1e+11 cm^-3
}

// The diffusion length of minority electrons from a lifetime and a diffusivity.
func ExampleDiffusionLength() {
	l, err := recomb.DiffusionLength(1e-3, 30) // τ = 1 ms, D = 30 cm²/s
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("L = %.0f µm\n", l*1e4)
	// Output:
	// L = 1732 µm
}

// A three-charge-state (amphoteric) defect with invented levels and capture time constants in
// boron-doped silicon: its lifetime and its charge-state fractions at two injection levels.
func ExampleAmphoteric() {
	mat, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	bulk, err := recomb.NewBulk(mat, 0, 1e16)
	if err != nil {
		log.Fatal(err)
	}
	d := recomb.Amphoteric{ // invented example values
		Level1: recomb.AboveEv(0.35), Level2: recomb.BelowEc(0.40),
		TauN1: 1e-5, TauP1: 1e-3, TauN2: 1e-3, TauP2: 1e-5,
	}
	for _, dn := range []float64{1e13, 1e16} {
		s, err := bulk.State(dn)
		if err != nil {
			log.Fatal(err)
		}
		tau, err := recomb.Lifetime(d, s)
		if err != nil {
			log.Fatal(err)
		}
		fp, f0, fm, err := d.Fractions(s)
		if err != nil {
			log.Fatal(err)
		}
		fmt.Printf("Δn = %.0e cm^-3: τ = %.3g µs, f+ = %.2f, f0 = %.2f, f− = %.2f\n", dn, tau*1e6, fp, f0, fm)
	}
	// Output:
	// Δn = 1e+13 cm^-3: τ = 11 µs, f+ = 0.91, f0 = 0.09, f− = 0.00
	// Δn = 1e+16 cm^-3: τ = 342 µs, f+ = 0.02, f0 = 0.98, f− = 0.00
}
