package j0_test

import (
	"fmt"
	"log"

	"github.com/pvrec/pvrec/pvrec/j0"
	"github.com/pvrec/pvrec/pvrec/profile"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/sweep"
)

// The J0 of a phosphorus emitter (erfc, 1e20 cm^-3 at the surface, L = 0.36 µm) on a
// 1.5e16 cm^-3 boron wafer behind a surface with S = 1e4 cm/s, with the default models, and
// its breakdown (invented example values).
func ExampleSolver_Solve() {
	models, err := j0.DefaultModels(300)
	if err != nil {
		log.Fatal(err)
	}
	region := j0.Region{
		Profile: profile.Sum{
			profile.Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.36e-4},
			profile.Uniform{Dopant: silicon.Acceptor, N: 1.5e16},
		},
		Surface: j0.FixedS(1e4),
	}
	r, err := j0.NewSolver(models).Solve(region)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("J0 = %.1f fA/cm², estimated error below 1e-3: %v\n", r.J0*1e15, r.ErrEst < 1e-3*r.J0)
	fmt.Printf("surface %.1f, Auger %.1f, radiative %.2f fA/cm²\n", r.JSurface*1e15, r.JAuger*1e15, r.JRadiative*1e15)
	fmt.Printf("region 0 to %.3f µm (junction at %.3f µm), %d nodes\n", r.Depth*1e4, r.Junction*1e4, len(r.Nodes))
	// Output:
	// J0 = 61.6 fA/cm², estimated error below 1e-3: true
	// surface 8.7, Auger 52.9, radiative 0.03 fA/cm²
	// region 0 to 0.859 µm (junction at 0.965 µm), 33 nodes
}

// The integral forms bracket the numerical J0 of a shallow, lightly doped emitter: the
// transparent-region limit (u = 1 everywhere) from above, the transparent-emitter (Gummel)
// formula, which neglects the bulk, from below.
func ExampleSolver_Transparent() {
	models, err := j0.DefaultModels(300)
	if err != nil {
		log.Fatal(err)
	}
	region := j0.Region{
		Profile: profile.Sum{
			profile.Erfc{Dopant: silicon.Donor, Surface: 2e19, Length: 0.1e-4},
			profile.Uniform{Dopant: silicon.Acceptor, N: 1e16},
		},
		Surface: j0.DefaultSurface(),
	}
	s := j0.NewSolver(models)
	num, _ := s.Solve(region)
	tr, _ := s.Transparent(region)
	g, _ := s.Gummel(region)
	fmt.Printf("Gummel %.2f <= Solve %.2f <= Transparent %.2f fA/cm²\n", g.J0*1e15, num.J0*1e15, tr.J0*1e15)
	// Output:
	// Gummel 12.52 <= Solve 15.51 <= Transparent 15.58 fA/cm²
}

// A sweep (package sweep) of the surface concentration of an emitter, solved on all cores, with the results
// in input order.
func Example_sweep() {
	models, err := j0.DefaultModels(300)
	if err != nil {
		log.Fatal(err)
	}
	s := j0.NewSolver(models)
	ns := []float64{1e19, 3e19, 1e20, 3e20}
	res, errs := sweep.Run(len(ns), 0, func(i int) (j0.Result, error) {
		return s.Solve(j0.Region{
			Profile: profile.Sum{
				profile.Erfc{Dopant: silicon.Donor, Surface: ns[i], Length: 0.2e-4},
				profile.Uniform{Dopant: silicon.Acceptor, N: 1e16},
			},
			Surface: j0.DefaultSurface(),
		})
	})
	if errs != nil {
		log.Fatal(errs)
	}
	for i, r := range res {
		fmt.Printf("Ns = %.0e cm^-3: J0 = %.1f fA/cm²\n", ns[i], r.J0*1e15)
	}
	// Output:
	// Ns = 1e+19 cm^-3: J0 = 13.1 fA/cm²
	// Ns = 3e+19 cm^-3: J0 = 22.4 fA/cm²
	// Ns = 1e+20 cm^-3: J0 = 41.5 fA/cm²
	// Ns = 3e+20 cm^-3: J0 = 55.5 fA/cm²
}

// The space-charge region of an emitter at zero bias, which bounds its quasi-neutral part.
func ExampleSpaceChargeRegion() {
	m, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		log.Fatal(err)
	}
	p := profile.Sum{
		profile.Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.36e-4},
		profile.Uniform{Dopant: silicon.Acceptor, N: 1.5e16},
	}
	sc, err := j0.SpaceChargeRegion(p, m)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("junction %.3f µm, depleted from %.3f to %.3f µm, Vbi = %.3f V\n", sc.Junction*1e4, sc.Front*1e4, sc.Back*1e4, sc.Vbi)
	// Output:
	// junction 0.965 µm, depleted from 0.859 to 1.187 µm, Vbi = 0.774 V
}
