package fermi_test

import (
	"fmt"
	"math"

	"github.com/pvrec/pvrec/pvrec/fermi"
)

// The reduced electron density n/Nc of a parabolic band at a few reduced Fermi levels
// η = (E_F − E_C)/kT, against the Boltzmann approximation e^η. (Values agree with mpmath's
// −polylog(3/2, −e^η) and −polylog(1/2, −e^η) to all digits shown.)
func ExampleHalf() {
	for _, eta := range []float64{-10, -2, 0, 2, 10} {
		fmt.Printf("η = %3g: F_1/2 = %.9g, F_-1/2 = %.9g, F_1/2/e^η = %.4f\n",
			eta, fermi.Half(eta), fermi.MinusHalf(eta), fermi.Half(eta)/math.Exp(eta))
	}
	// Output:
	// η = -10: F_1/2 = 4.53992011e-05, F_-1/2 = 4.53984724e-05, F_1/2/e^η = 1.0000
	// η =  -2: F_1/2 = 0.129298513, F_-1/2 = 0.123665622, F_1/2/e^η = 0.9554
	// η =   0: F_1/2 = 0.765147025, F_-1/2 = 0.604898643, F_1/2/e^η = 0.7651
	// η =   2: F_1/2 = 2.82372128, F_-1/2 = 1.46429459, F_1/2/e^η = 0.3821
	// η =  10: F_1/2 = 24.084657, F_-1/2 = 3.55277924, F_1/2/e^η = 0.0011
}

// The reduced Fermi level of a degenerate electron gas with n = 5 Nc (mpmath findroot:
// η = 3.26953602807470...), and the error for an impossible density.
func ExampleInvHalf() {
	eta, err := fermi.InvHalf(5)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("η = %.10f, F_1/2(η) = %.12f\n", eta, fermi.Half(eta))

	_, err = fermi.InvHalf(-1)
	fmt.Println(err)
	// Output:
	// η = 3.2695360281, F_1/2(η) = 5.000000000000
	// fermi: InvHalf: y must be finite and > 0, got -1
}
