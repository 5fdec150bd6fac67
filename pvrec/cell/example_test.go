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

// demoDesign is an invented cell design (no real device): a p-type base, a front emitter
// with a contacted fraction, a passivated rear with point contacts, all given as J0s, and a
// little series resistance, at 25 °C.
func demoDesign() cell.Design {
	si, err := silicon.DefaultModelSet().At(298.15)
	if err != nil {
		log.Fatal(err)
	}
	return cell.Design{
		Material: si,
		Base:     cell.Base{Thickness: 160e-4, Na: 1.5e16, Mechanisms: []recomb.Mechanism{recomb.NewIntrinsic()}},
		Front: []cell.Part{
			{Name: "emitter, passivated", Fraction: 0.97, J0: 35e-15},
			{Name: "emitter, under metal", Fraction: 0.03, J0: 900e-15, Contact: true},
		},
		Rear: []cell.Part{
			{Name: "dielectric", Fraction: 0.98, J0: 8e-15},
			{Name: "point contacts", Fraction: 0.02, J0: 500e-15, Contact: true},
		},
		Rs:  0.5,  // Ω·cm²
		Jsc: 0.04, // A/cm^2, an input: no optics here
	}
}

// Voc, fill factor and efficiency of an invented cell design.
func ExampleNew() {
	dev, err := cell.New(demoDesign())
	if err != nil {
		log.Fatal(err)
	}
	r, err := dev.Solve()
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("Voc = %.1f mV, Jsc = %.2f mA/cm², FF = %.2f %%, pFF = %.2f %%, η = %.2f %%\n",
		1e3*r.Voc, 1e3*r.Jsc, 100*r.FF, 100*r.PFF, 100*r.Efficiency)
	// Output:
	// Voc = 691.2 mV, Jsc = 40.00 mA/cm², FF = 81.89 %, pFF = 84.55 %, η = 22.64 %
}

// What each part of the invented design costs: the cell solved again with that part perfect.
func ExampleDevice_Losses() {
	dev, err := cell.New(demoDesign())
	if err != nil {
		log.Fatal(err)
	}
	l, err := dev.Losses()
	if err != nil {
		log.Fatal(err)
	}
	for _, t := range l.Terms[:3] {
		fmt.Printf("%-28s ΔVoc = %5.2f mV  Δη = %.2f %%abs\n", t.Name, 1e3*t.DVoc, 100*t.DEta)
	}
	fmt.Printf("FF lost to Rs: %.2f %%abs\n", 100*l.FFLossRs)
	// Output:
	// series Rs                    ΔVoc =  0.00 mV  Δη = 0.73 %abs
	// front: emitter, passivated   ΔVoc = 13.29 mV  Δη = 0.53 %abs
	// front: emitter, under metal  ΔVoc =  9.97 mV  Δη = 0.39 %abs
	// FF lost to Rs: 2.66 %abs
}

// The recombination budget of the invented design at its open circuit: each part's J0
// equivalent and share.
func ExampleDevice_RecombinationAtExcess() {
	dev, err := cell.New(demoDesign())
	if err != nil {
		log.Fatal(err)
	}
	oc, err := dev.OpenCircuit()
	if err != nil {
		log.Fatal(err)
	}
	b, err := dev.RecombinationAtExcess(oc.Dn)
	if err != nil {
		log.Fatal(err)
	}
	for i, t := range b.Terms {
		fmt.Printf("%-42s %5.1f fA/cm²  %4.1f %%\n", t.Name, 1e15*t.J0, 100*b.Share(i))
	}
	// Output:
	// front: emitter, passivated                  34.0 fA/cm²  41.0 %
	// front: emitter, under metal                 27.0 fA/cm²  32.6 %
	// rear: dielectric                             7.8 fA/cm²   9.5 %
	// rear: point contacts                        10.0 fA/cm²  12.1 %
	// base: Intrinsic(Richter2012 + Trupke2003)    4.1 fA/cm²   4.9 %
}

// A J–V curve ready for plotting (plain slices), from short circuit to open circuit.
func ExampleDevice_Curve() {
	dev, err := cell.New(demoDesign())
	if err != nil {
		log.Fatal(err)
	}
	c, err := dev.Curve(5)
	if err != nil {
		log.Fatal(err)
	}
	for k := range c.V {
		fmt.Printf("V = %5.1f mV  J = %6.3f mA/cm²  P = %5.2f mW/cm²\n", 1e3*c.V[k], 1e3*c.J[k], 1e3*c.P[k])
	}
	// Output:
	// V =   0.0 mV  J = 40.000 mA/cm²  P =  0.00 mW/cm²
	// V = 167.9 mV  J = 40.000 mA/cm²  P =  6.71 mW/cm²
	// V = 335.7 mV  J = 40.000 mA/cm²  P = 13.43 mW/cm²
	// V = 503.6 mV  J = 39.942 mA/cm²  P = 20.11 mW/cm²
	// V = 691.2 mV  J =  0.000 mA/cm²  P =  0.00 mW/cm²
}

// Temperature coefficients of the invented design near 25 °C, the model set re-evaluated at
// 25 ± 5 °C and the J0s given as numbers scaled as ni².
func ExampleDevice_TemperatureCoefficients() {
	dev, err := cell.New(demoDesign())
	if err != nil {
		log.Fatal(err)
	}
	tc, err := dev.TemperatureCoefficients(0)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("dVoc/dT = %.2f mV/K, dη/dT = %.3f %%/K (relative)\n", 1e3*tc.DVoc, 100*tc.RelEta)
	// Output:
	// dVoc/dT = -2.01 mV/K, dη/dT = -0.385 %/K (relative)
}

// The intrinsic limit of an undoped 110 µm wafer at 25 °C for Jsc = 43.31 mA/cm² (the
// Lambertian Jsc of Richter, Hermle and Glunz, IEEE J. Photovolt. 3, 1184 (2013); value from
// memory), without photon recycling.
func ExampleDesign_IntrinsicLimit() {
	si, err := silicon.DefaultModelSet().At(298.15)
	if err != nil {
		log.Fatal(err)
	}
	d := cell.Design{Material: si, Base: cell.Base{Thickness: 110e-4}, Jsc: 43.31e-3}
	dev, err := cell.New(d.IntrinsicLimit())
	if err != nil {
		log.Fatal(err)
	}
	r, err := dev.Solve()
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("Voc = %.1f mV, FF = %.2f %%, η = %.2f %%\n", 1e3*r.Voc, 100*r.FF, 100*r.Efficiency)
	// Output:
	// Voc = 759.9 mV, FF = 88.96 %, η = 29.28 %
}

// The fill factor of an ideal diode with Voc = 700 mV at 25 °C.
func ExampleIdealDiodeFF() {
	si, err := silicon.DefaultModelSet().At(298.15)
	if err != nil {
		log.Fatal(err)
	}
	ff, err := cell.IdealDiodeFF(0.700, 1, si)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("FF = %.2f %%\n", 100*ff)
	// Output:
	// FF = 84.66 %
}

// J–V points of the invented design at chosen terminal voltages: each point is a bracketed
// root that meets the voltage with the series resistance included.
func ExampleDevice_CurveAt() {
	dev, err := cell.New(demoDesign())
	if err != nil {
		log.Fatal(err)
	}
	c, err := dev.CurveAt([]float64{0, 0.55, 0.60, 0.65})
	if err != nil {
		log.Fatal(err)
	}
	for k := range c.V {
		fmt.Printf("V = %.2f V  J = %6.3f mA/cm²  internal %.1f mV\n", c.V[k], 1e3*c.J[k], 1e3*c.Vi[k])
	}
	// Output:
	// V = 0.00 V  J = 40.000 mA/cm²  internal 20.0 mV
	// V = 0.55 V  J = 39.649 mA/cm²  internal 569.8 mV
	// V = 0.60 V  J = 37.633 mA/cm²  internal 618.8 mV
	// V = 0.65 V  J = 26.588 mA/cm²  internal 663.3 mV
}
