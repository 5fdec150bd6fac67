package profile_test

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/profile"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// The sheet resistance of a Gaussian phosphorus emitter (surface density 2e20 cm^-3,
// characteristic depth 0.25 µm) diffused into a 1.5e16 cm^-3 boron-doped wafer, with
// the default model set's (Klaassen's) mobilities at 300 K.
func ExampleSheetResistanceFunc() {
	si, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		fmt.Println(err)
		return
	}
	ns, l := 2e20, 0.25e-4 // cm^-3, cm
	gauss := func(x float64) float64 { u := x / l; return ns * math.Exp(-u*u) }
	s, err := profile.SheetResistanceFunc(si, silicon.Donor, gauss, 1e-4, 1.5e16)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("Rsh = %.1f Ω/sq, junction at %.3f µm\n", s.Rsh, s.XjCm*1e4)
	// Output:
	// Rsh = 20.1 Ω/sq, junction at 0.770 µm
}

// The same emitter from tabulated depth and density (3 significant digits), as from a
// measured profile: the junction lies between the last two samples.
func ExampleSheetResistance() {
	depth := []float64{0, 0.05e-4, 0.1e-4, 0.2e-4, 0.3e-4, 0.4e-4, 0.5e-4, 0.6e-4, 0.7e-4, 0.8e-4}        // cm
	nd := []float64{2e20, 1.92e20, 1.70e20, 1.05e20, 4.74e19, 1.55e19, 3.66e18, 6.30e17, 7.87e16, 7.1e15} // cm^-3
	si, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		fmt.Println(err)
		return
	}
	s, err := profile.SheetResistance(si, silicon.Donor, depth, nd, 1.5e16)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("Rsh = %.1f Ω/sq, layer to %.2f µm\n", s.Rsh, s.XjCm*1e4)
	// Output:
	// Rsh = 20.4 Ω/sq, layer to 0.77 µm
}

// A measured profile whose density calibration is 10 % high and whose depth scale is 5 %
// short: the scaled layer's dose is 1.1 × 1.05 times the measured one (invented emitter).
func ExampleScaled() {
	measured := profile.Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.3e-4}
	s := profile.Scaled{Profile: measured, Density: 1.1, Stretch: 1.05}
	d0, err := measured.Dose()
	if err != nil {
		fmt.Println(err)
		return
	}
	d1, err := profile.Dose(s, silicon.Donor, 0, s.Extent())
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("dose %.3g -> %.3g cm^-2 (ratio %.3f)\n", d0, d1, d1/d0)
	// Output:
	// dose 1.69e+15 -> 1.95e+15 cm^-2 (ratio 1.155)
}
