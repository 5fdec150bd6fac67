package surface_test

import (
	"fmt"
	"log"

	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/surface"
)

// An invented dielectric on an invented wafer: fixed charge −2e12 cm^-2, a U-shaped Dit with
// 5e10 cm^-2 eV^-1 at midgap, on 1e16 cm^-3 p-type silicon at Δn = 1e15 cm^-3.
func ExampleExtendedSRH_Solve() {
	si, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	dit := surface.UShapedDit{Mid: 5e10, TailC: 5e12, TailV: 5e12, Ec: 0.56, Ev: -0.56, WidthC: 0.1, WidthV: 0.1}
	m := surface.NewExtendedSRH(dit, surface.ConstantSigma(1e-15), surface.ConstantSigma(1e-16), -2e12)
	wafer, err := recomb.NewBulk(si, 0, 1e16) // the wafer: 1e16 cm^-3 p-type
	if err != nil {
		log.Fatal(err)
	}
	b, err := wafer.State(1e15) // its quasi-neutral state at Δn = 1e15 cm^-3
	if err != nil {
		log.Fatal(err)
	}
	r, err := m.Solve(b)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("%v, band bending %.0f mV\n", r.Regime, 1e3*r.Psi)
	fmt.Printf("ps = %.2g cm^-3, ns = %.2g cm^-3\n", r.Ps, r.Ns)
	fmt.Printf("Seff = %.2g cm/s, J0s = %.2g fA/cm^2\n", r.Seff, 1e15*r.J0s)
	// Output:
	// accumulation, band bending -180 mV
	// ps = 1.2e+19 cm^-3, ns = 9.3e+11 cm^-3
	// Seff = 6.4 cm/s, J0s = 10 fA/cm^2
}

// Seff(Δn) of the same interface with the charge of the interface states included.
func ExampleExtendedSRH_Curve() {
	si, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	m := surface.NewExtendedSRH(surface.ConstantDit{D: 5e10}, surface.ConstantSigma(1e-15), surface.ConstantSigma(1e-16), -2e12)
	m.ChargedStates = true
	wafer, err := recomb.NewBulk(si, 0, 1e16)
	if err != nil {
		log.Fatal(err)
	}
	rs, err := m.Curve(wafer, []float64{1e13, 1e15, 1e17})
	if err != nil {
		log.Fatal(err)
	}
	for _, r := range rs {
		fmt.Printf("Δn = %.0e cm^-3: Seff = %.2g cm/s, J0s = %.2g fA/cm^2\n", r.State.Dn, r.Seff, 1e15*r.J0s)
	}
	// Output:
	// Δn = 1e+13 cm^-3: Seff = 0.44 cm/s, J0s = 0.77 fA/cm^2
	// Δn = 1e+15 cm^-3: Seff = 0.48 cm/s, J0s = 0.77 fA/cm^2
	// Δn = 1e+17 cm^-3: Seff = 4.7 cm/s, J0s = 1 fA/cm^2
}

// Convert a surface saturation current density into Seff and back.
func ExampleSeffFromJ0s() {
	si, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	wafer, err := recomb.NewBulk(si, 0, 1e16) // 1e16 cm^-3 p-type
	if err != nil {
		log.Fatal(err)
	}
	b, err := wafer.State(1e15) // Δn = 1e15 cm^-3
	if err != nil {
		log.Fatal(err)
	}
	s, err := surface.SeffFromJ0s(10e-15, b) // 10 fA/cm^2
	if err != nil {
		log.Fatal(err)
	}
	j, err := surface.J0sFromSeff(s, b)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("Seff = %.2f cm/s, back to J0s = %.1f fA/cm^2\n", s, 1e15*j)
	// Output:
	// Seff = 6.20 cm/s, back to J0s = 10.0 fA/cm^2
}

// Effective lifetime of a 180 µm wafer with 2 ms bulk lifetime and 5 and 20 cm/s surfaces.
func ExampleEffectiveLifetime() {
	const w, d = 180e-4, 30.0 // cm, cm^2/s (electrons in 1e16 cm^-3 p-type, about)
	tau, err := surface.EffectiveLifetime(2e-3, w, d, 5, 20)
	if err != nil {
		log.Fatal(err)
	}
	ts, _ := surface.Lifetime(w, d, 5, 20)
	low, _ := surface.LifetimeLowS(w, 5, 20)
	fmt.Printf("τeff = %.3f ms, τs = %.3f ms (low-S limit W/(S1+S2) = %.3f ms)\n", 1e3*tau, 1e3*ts, 1e3*low)
	// Output:
	// τeff = 0.530 ms, τs = 0.722 ms (low-S limit W/(S1+S2) = 0.720 ms)
}

// Sproul's approximation against the exact fundamental mode for a symmetric wafer.
func ExampleLifetimeSproul() {
	const w, d = 180e-4, 30.0
	for _, s := range []float64{10, 1e3, 1e5} {
		ex, _ := surface.Lifetime(w, d, s, s)
		ap, _ := surface.LifetimeSproul(w, d, s)
		fmt.Printf("S = %6.0f cm/s: exact %.4g s, Sproul %.4g s\n", s, ex, ap)
	}
	// Output:
	// S =     10 cm/s: exact 0.0009009 s, Sproul 0.0009011 s
	// S =   1000 cm/s: exact 9.917e-06 s, Sproul 1.009e-05 s
	// S = 100000 cm/s: exact 1.168e-06 s, Sproul 1.184e-06 s
}
