package lifetime_test

import (
	"fmt"
	"log"
	"math"
	"strings"

	"github.com/pvrec/pvrec/pvrec/lifetime"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/surface"
)

// The effective lifetime of an invented symmetric sample: 180 µm of 1e15 cm^-3 n-type silicon
// with intrinsic bulk recombination and 10 fA/cm² on each surface, exact and in the J0s form.
func ExampleSample_Lifetime() {
	si, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	wafer, err := recomb.NewBulk(si, 1e15, 0)
	if err != nil {
		log.Fatal(err)
	}
	s := lifetime.Sample{Wafer: wafer, W: 180e-4, Bulk: recomb.NewIntrinsic(), Front: surface.ConstantJ0s{J0s: 10e-15}}
	for _, dn := range []float64{1e14, 1e15, 1e16} {
		exact, err := s.Lifetime(dn)
		if err != nil {
			log.Fatal(err)
		}
		j0s, err := s.LifetimeJ0s(dn)
		if err != nil {
			log.Fatal(err)
		}
		fmt.Printf("Δn = %.0e cm^-3: τeff = %.3f ms (J0s form %.3f ms)\n", dn, 1e3*exact, 1e3*j0s)
	}
	// Output:
	// Δn = 1e+14 cm^-3: τeff = 11.572 ms (J0s form 11.570 ms)
	// Δn = 1e+15 cm^-3: τeff = 6.321 ms (J0s form 6.319 ms)
	// Δn = 1e+16 cm^-3: τeff = 1.043 ms (J0s form 1.043 ms)
}

// iVoc at one sun and the implied fill factor of an invented sample with an extended-SRH
// dielectric on a 1.5e16 cm^-3 p-type wafer.
func ExampleSample_ImpliedJV() {
	si, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	wafer, err := recomb.NewBulk(si, 0, 1.5e16)
	if err != nil {
		log.Fatal(err)
	}
	dielectric := surface.NewExtendedSRH(surface.ConstantDit{D: 1e11}, surface.ConstantSigma(1e-14), surface.ConstantSigma(1e-16), -2e12)
	s := lifetime.Sample{Wafer: wafer, W: 180e-4, Bulk: recomb.NewIntrinsic(), Front: dielectric}
	optics := lifetime.Optics{FluxPerSun: lifetime.OneSunFlux, Absorbed: 0.95} // invented
	voc, err := s.ImpliedVoc(1, optics)
	if err != nil {
		log.Fatal(err)
	}
	jv, err := s.ImpliedJV(optics, 100)
	if err != nil {
		log.Fatal(err)
	}
	mp, err := jv.MaxPower()
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("iVoc = %.1f mV, implied FF = %.2f %%, at %.1f mV\n", 1e3*voc, 100*mp.FF, 1e3*mp.V)
	// Output:
	// iVoc = 714.4 mV, implied FF = 85.16 %, at 633.0 mV
}

// Analyse a synthetic free decay of an invented sample with 15 fA/cm² per side: τeff at
// 1e15 cm^-3, iVoc there, and J0s per side by the Kane–Swanson fit.
func ExampleAnalysis_Analyze() {
	si, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	wafer, err := recomb.NewBulk(si, 1e15, 0)
	if err != nil {
		log.Fatal(err)
	}
	s := lifetime.Sample{Wafer: wafer, W: 180e-4, Bulk: recomb.NewIntrinsic(), Front: surface.ConstantJ0s{J0s: 15e-15}}
	t := make([]float64, 4000)
	for i := range t {
		t[i] = 20e-3 * float64(i) / float64(len(t)-1) // 20 ms
	}
	trace, err := s.Simulate(lifetime.Optics{}, t, nil, 3e16) // the forward model's trace, noise-free
	if err != nil {
		log.Fatal(err)
	}
	a := lifetime.Analysis{Wafer: wafer, W: 180e-4, Mode: lifetime.Transient, Intrinsic: recomb.NewIntrinsic()}
	r, err := a.Analyze(trace)
	if err != nil {
		log.Fatal(err)
	}
	tau, err := r.LifetimeAt(1e15)
	if err != nil {
		log.Fatal(err)
	}
	fit, err := r.J0s(lifetime.J0sOptions{})
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("%d points analysed, %d warnings\n", len(r.Dn), len(r.Warnings))
	fmt.Printf("τeff(1e15 cm^-3) = %.3f ms\n", 1e3*tau)
	fmt.Printf("J0s = %.2f ± %.2f fA/cm^2 per side from %d points in [%.0e, %.0e] cm^-3\n",
		1e15*fit.PerSide, 1e15*fit.J0sErr/2, fit.N, fit.DnMin, fit.DnMax)
	// Output:
	// 4000 points analysed, 0 warnings
	// τeff(1e15 cm^-3) = 4.390 ms
	// J0s = 15.01 ± 0.00 fA/cm^2 per side from 1046 points in [1e+15, 1e+16] cm^-3
}

// Read a trace in the package's CSV format (docs/lifetime-csv.md): a detector signal with its
// calibration, times in µs, illumination in suns.
func ExampleReadTrace() {
	const file = `# invented example
calibration = 0, 0.004, 0.0002
time (us), signal (V), illumination (suns)
0, 2.50, 1.00
10, 2.45, 0.98
20, 2.40, 0.96
30, 2.35, 0.94
40, 2.30, 0.92
`
	tr, err := lifetime.ReadTrace(strings.NewReader(file))
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("%d points, %g s to %g s, Δσ from %.4g to %.4g S, illumination in %v\n",
		len(tr.Time), tr.Time[0], tr.Time[len(tr.Time)-1], tr.Conductance[0], tr.Conductance[len(tr.Time)-1], tr.Unit)
	// Output:
	// 5 points, 0 s to 4e-05 s, Δσ from 0.01125 to 0.01026 S, illumination in suns
}

// Δn of a wafer from its photoconductance, with the injection-dependent mobility sum.
func ExampleExcessFromConductance() {
	si, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	wafer, err := recomb.NewBulk(si, 0, 1e16)
	if err != nil {
		log.Fatal(err)
	}
	for _, sigma := range []float64{1e-4, 1e-2} {
		dn, err := lifetime.ExcessFromConductance(wafer, 180e-4, sigma)
		if err != nil {
			log.Fatal(err)
		}
		fmt.Printf("Δσ = %g S: Δn = %.3g cm^-3\n", sigma, dn)
	}
	// Output:
	// Δσ = 0.0001 S: Δn = 2.26e+13 cm^-3
	// Δσ = 0.01 S: Δn = 2.3e+15 cm^-3
}

// Seff of each surface of a symmetric sample from its effective lifetime, with an assumed bulk
// lifetime and with an infinite one (the upper bound).
func ExampleSeffFromLifetime() {
	for _, tb := range []float64{5e-3, math.Inf(1)} {
		s, err := lifetime.SeffFromLifetime(1e-3, tb, 180e-4, 12)
		if err != nil {
			log.Fatal(err)
		}
		fmt.Printf("τbulk = %g s: Seff = %.2f cm/s\n", tb, s)
	}
	// Output:
	// τbulk = 0.005 s: Seff = 7.21 cm/s
	// τbulk = +Inf s: Seff = 9.02 cm/s
}

// A processed τeff(Δn) table (docs/lifetime-csv.md) read and analysed: τeff at 1e15 cm^-3 and
// iVoc there, with no trace behind it.
func ExampleAnalysis_AnalyzeTable() {
	const file = `# invented curve
Δn (cm^-3), τeff (us)
5e14, 655
8e14, 652
1e15, 650
1.2e15, 648
2e15, 640
`
	tb, err := lifetime.ReadTable(strings.NewReader(file))
	if err != nil {
		log.Fatal(err)
	}
	si, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	wafer, err := recomb.NewBulk(si, 0, 1.5e16)
	if err != nil {
		log.Fatal(err)
	}
	a := lifetime.Analysis{Wafer: wafer, W: 180e-4, Intrinsic: recomb.NewIntrinsic()}
	r, err := a.AnalyzeTable(tb)
	if err != nil {
		log.Fatal(err)
	}
	tau, err := r.LifetimeAt(1e15)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("τeff(1e15 cm^-3) = %.0f µs, iVoc there = %.1f mV, %d warnings\n", 1e6*tau, 1e3*r.IVoc[2], len(r.Warnings))
	// Output:
	// τeff(1e15 cm^-3) = 650 µs, iVoc there = 663.4 mV, 0 warnings
}
