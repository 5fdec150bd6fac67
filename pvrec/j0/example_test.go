package j0_test

import (
	"fmt"
	"log"
	"math"

	"github.com/pvrec/pvrec/pvrec/j0"
)

// The base J0 of a 180 µm, 1 Ω·cm-like p-type wafer with a 1 ms electron lifetime, for a
// well-passivated rear, a poorly passivated one and an ohmic contact (invented example values).
func ExampleBase_J0() {
	for _, s := range []float64{1, 100, math.Inf(1)} {
		b := j0.Base{NiEff: 1e10, Doping: 1.5e16, Width: 180e-4, Tau: 1e-3, D: 30, S: s}
		v, err := b.J0()
		if err != nil {
			log.Fatal(err)
		}
		fmt.Printf("S = %g cm/s: J0,base = %.2f fA/cm²\n", s, v*1e15)
	}
	// Output:
	// S = 1 cm/s: J0,base = 20.21 fA/cm²
	// S = 100 cm/s: J0,base = 118.86 fA/cm²
	// S = +Inf cm/s: J0,base = 1786.60 fA/cm²
}
