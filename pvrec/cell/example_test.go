package cell_test

import (
	"fmt"
	"log"

	"github.com/pvrec/pvrec/pvrec/cell"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// The implied Voc of a boron-doped wafer at 300 K for a few excess carrier densities, with the
// default material model set (band-gap narrowing and degeneracy in ni,eff).
func ExampleImpliedVoc() {
	mat, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	bulk, err := recomb.NewBulk(mat, 0, 1.5e16)
	if err != nil {
		log.Fatal(err)
	}
	for _, dn := range []float64{1e14, 1e15, 1e16} {
		v, err := cell.ImpliedVoc(bulk, dn)
		if err != nil {
			log.Fatal(err)
		}
		fmt.Printf("Δn = %.0e cm^-3: iVoc = %.1f mV\n", dn, v*1e3)
	}
	// Output:
	// Δn = 1e+14 cm^-3: iVoc = 602.5 mV
	// Δn = 1e+15 cm^-3: iVoc = 663.4 mV
	// Δn = 1e+16 cm^-3: iVoc = 733.6 mV
}

// The excess carrier density that an implied Voc of 700 mV stands for.
func ExampleExcessFromImpliedVoc() {
	mat, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	bulk, err := recomb.NewBulk(mat, 0, 1.5e16)
	if err != nil {
		log.Fatal(err)
	}
	dn, err := cell.ExcessFromImpliedVoc(bulk, 0.700)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("Δn = %.3g cm^-3\n", dn)
	// Output:
	// Δn = 3.58e+15 cm^-3
}

// The open-circuit voltage of a cell with J0 = 100 fA/cm² and Jsc = 40 mA/cm² at 25 °C.
func ExampleIdealDiodeVoc() {
	si, err := silicon.DefaultModelSet().At(298.15) // the temperature comes with the material
	if err != nil {
		log.Fatal(err)
	}
	v, err := cell.IdealDiodeVoc(100e-15, 40e-3, 1, si)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("Voc = %.1f mV\n", v*1e3)
	// Output:
	// Voc = 686.4 mV
}

// The saturation current density that a measured Voc of 720 mV at Jsc = 41 mA/cm² implies.
func ExampleJ0FromVoc() {
	si, err := silicon.DefaultModelSet().At(298.15)
	if err != nil {
		log.Fatal(err)
	}
	j0, err := cell.J0FromVoc(0.720, 41e-3, 1, si)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("J0 = %.1f fA/cm²\n", j0*1e15)
	// Output:
	// J0 = 27.7 fA/cm²
}
