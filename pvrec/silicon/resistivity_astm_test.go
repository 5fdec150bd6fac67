package silicon

import "math"

// Closed-form conversions between resistivity and dopant density of ASTM F723 ("Standard
// practice for conversion between resistivity and dopant density for boron-doped,
// phosphorus-doped, and arsenic-doped silicon"), which fit the NBS measurements of
// W. R. Thurber, R. L. Mattis, Y. M. Liu and J. J. Filliben, J. Electrochem. Soc. 127, 1807
// (1980) (phosphorus) and 127, 2291 (1980) (boron), at 300 K (the measurements are at 23 °C,
// corrected). Coefficients are values from memory; they are cross-checked in
// TestASTMOracleConsistency, where the separately fitted forward and inverse formulas agree
// to within 3 % (the precision quoted here for the oracle) at 1e14–1e20 cm^-3, which a
// misremembered coefficient would very unlikely survive.
// They serve only as an independent oracle in the tests.

// astmBoronDensity returns the boron density in cm^-3 of p-type silicon of resistivity rho in
// Ω·cm (ASTM F723, boron, resistivity to density).
func astmBoronDensity(rho float64) float64 {
	return 1.330e16/rho + 1.082e17/(rho*(1+math.Pow(54.56*rho, 1.105)))
}

// astmBoronResistivity returns the resistivity in Ω·cm of p-type silicon with boron density n
// in cm^-3 (ASTM F723, boron, density to resistivity).
func astmBoronResistivity(n float64) float64 {
	return 1.305e16/n + 1.133e17/(n*(1+math.Pow(2.58e-19*n, -0.737)))
}

// astmPhosphorusDensity returns the phosphorus density in cm^-3 of n-type silicon of
// resistivity rho in Ω·cm (ASTM F723, phosphorus, resistivity to density).
func astmPhosphorusDensity(rho float64) float64 {
	x := math.Log10(rho)
	z := (-3.1083 + x*(-3.2626+x*(-1.2196+x*(-0.13923)))) /
		(1 + x*(1.0265+x*(0.38755+x*0.041833)))
	return 6.242e18 / rho * math.Pow(10, z)
}

// astmPhosphorusResistivity returns the resistivity in Ω·cm of n-type silicon with phosphorus
// density n in cm^-3 (ASTM F723, phosphorus, density to resistivity).
func astmPhosphorusResistivity(n float64) float64 {
	y := math.Log10(n) - 16
	z := (-3.0769 + y*(2.2108+y*(-0.62272+y*0.057501))) /
		(1 + y*(-0.68157+y*(0.19833+y*(-0.018376))))
	return 6.242e18 / n * math.Pow(10, z)
}
