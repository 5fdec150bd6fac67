package silicon_test

import (
	"errors"
	"fmt"

	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Converting between resistivity and dopant density at 300 K: the dopant density of common
// wafers, and back.
func ExampleDopingFromResistivity() {
	mat, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		fmt.Println(err)
		return
	}
	mob := silicon.NewKlaassen1992()
	for _, w := range []struct {
		rho float64
		dop silicon.Dopant
	}{{1, silicon.Acceptor}, {10, silicon.Acceptor}, {1, silicon.Donor}, {3, silicon.Donor}} {
		n, err := silicon.DopingFromResistivity(mat, mob, w.rho, w.dop, 0)
		if err != nil {
			fmt.Println(err)
			return
		}
		fmt.Printf("%4.1f Ω·cm %-8s: %.3g cm^-3\n", w.rho, w.dop, n)
	}
	// Compensated: 1 Ω·cm n-type made with 1e15 cm^-3 of boron present.
	nd, _ := silicon.DopingFromResistivity(mat, mob, 1, silicon.Donor, 1e15)
	fmt.Printf("compensated: Nd = %.3g cm^-3 with Na = 1e15 cm^-3\n", nd)
	// No doping gives 1e7 Ω·cm at 300 K: intrinsic silicon has about 3.4e5 Ω·cm.
	_, err = silicon.DopingFromResistivity(mat, mob, 1e7, silicon.Donor, 0)
	fmt.Println(errors.Is(err, silicon.ErrNoDoping))
	// Output:
	//  1.0 Ω·cm acceptor: 1.5e+16 cm^-3
	// 10.0 Ω·cm acceptor: 1.36e+15 cm^-3
	//  1.0 Ω·cm donor   : 4.94e+15 cm^-3
	//  3.0 Ω·cm donor   : 1.55e+15 cm^-3
	// compensated: Nd = 6.06e+15 cm^-3 with Na = 1e15 cm^-3
	// true
}

// The resistivity of doped silicon, n-type, p-type and compensated.
func ExampleResistivityFromDoping() {
	mat, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		fmt.Println(err)
		return
	}
	mob := silicon.NewKlaassen1992()
	for _, d := range [][2]float64{{1e15, 0}, {0, 1e16}, {2e16, 1e16}} {
		rho, err := silicon.ResistivityFromDoping(mat, mob, d[0], d[1])
		if err != nil {
			fmt.Println(err)
			return
		}
		fmt.Printf("Nd = %.0e, Na = %.0e cm^-3: %.3f Ω·cm\n", d[0], d[1], rho)
	}
	// Output:
	// Nd = 1e+15, Na = 0e+00 cm^-3: 4.582 Ω·cm
	// Nd = 0e+00, Na = 1e+16 cm^-3: 1.454 Ω·cm
	// Nd = 2e+16, Na = 1e+16 cm^-3: 0.609 Ω·cm
}
