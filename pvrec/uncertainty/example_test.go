package uncertainty_test

import (
	"fmt"
	"log"
	"math"

	"gonum.org/v1/gonum/stat/distuv"

	"github.com/pvrec/pvrec/pvrec/j0"
	"github.com/pvrec/pvrec/pvrec/profile"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/uncertainty"
)

// The model spread of the J0 of a heavily doped phosphorus emitter (erfc, 2e20 cm^-3 at the
// surface, L = 0.3 µm, on a 1.5e16 cm^-3 boron wafer, S = 1e4 cm/s; invented example):
// every published model combination valid at 300 K, and where the default lies among them.
func ExampleSpread() {
	members, err := uncertainty.Members(uncertainty.Case{T: 300, Dopant: silicon.Donor})
	if err != nil {
		log.Fatal(err)
	}
	region := j0.Region{
		Profile: profile.Sum{
			profile.Erfc{Dopant: silicon.Donor, Surface: 2e20, Length: 0.3e-4},
			profile.Uniform{Dopant: silicon.Acceptor, N: 1.5e16},
		},
		Surface: j0.FixedS(1e4),
	}
	r, err := uncertainty.Spread(members, 0, func(m uncertainty.Member) (float64, error) {
		mat, err := m.Set.At(300)
		if err != nil {
			return 0, err
		}
		res, err := j0.NewSolver(j0.Models{Material: mat, Auger: m.Auger, Radiative: m.Radiative}).Solve(region)
		return res.J0 * 1e15, err // fA/cm²
	})
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("%d members, %d failed\n", len(r.Members), r.Failed)
	fmt.Printf("J0 %.1f … %.1f fA/cm²; default %.1f fA/cm², rank %d\n", r.Min, r.Max, r.DefaultValue, r.DefaultRank)
	fmt.Println("largest:", r.Members[r.MaxIndex].Name)
	// Output:
	// 20 members, 0 failed
	// J0 51.9 … 306.4 fA/cm²; default 68.2 fA/cm², rank 10
	// largest: ni Couderc2014, BGN KlaassenSlotboomDeGraaff1992 (Boltzmann), μ Klaassen1992, Richter2012 + Trupke2003
}

// The surface-limited lifetime τ = W/(2S) of a wafer (the limit of small S; e.g. A. B. Sproul,
// J. Appl. Phys. 76, 2851 (1994)) with an uncertain thickness and surface recombination
// velocity (invented uncertainties): Monte Carlo until the standard error of the mean is
// below 0.5 %. The tolerance controls the mean only: the ends of the 95 % interval below
// rest on ~45 samples in each tail and are uncertain by ~2.7 times the mean's standard error
// (see MonteCarlo.RelTol).
func ExampleMonteCarlo_Run() {
	mc := uncertainty.MonteCarlo{
		Inputs: []uncertainty.Input{
			{Name: "W", Unit: "cm", Dist: distuv.Normal{Mu: 180e-4, Sigma: 5e-4}},
			{Name: "S", Unit: "cm/s", Dist: distuv.LogNormal{Mu: math.Log(10), Sigma: 0.2}},
		},
		Seed:   1,
		RelTol: 0.005,
	}
	r, err := mc.Run(func(x []float64) (float64, error) { return x[0] / (2 * x[1]) * 1e3, nil }) // ms
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("%d samples, converged %v\n", r.N, r.Converged)
	fmt.Printf("τ = %.3f ± %.3f ms (mean ± standard deviation)\n", r.Mean, r.Std)
	fmt.Printf("95 %% interval %.3f … %.3f ms\n", r.Percentiles[0].Value, r.Percentiles[4].Value)
	// Output:
	// 1792 samples, converged true
	// τ = 0.910 ± 0.183 ms (mean ± standard deviation)
	// 95 % interval 0.608 … 1.293 ms
}

// Which input of τ = W/(2S) to measure better first: the tornado and the variance shares.
func ExampleSensitivity_Run() {
	s := uncertainty.Sensitivity{
		Inputs: []uncertainty.Input{
			{Name: "W", Unit: "cm", Dist: distuv.Normal{Mu: 180e-4, Sigma: 5e-4}},
			{Name: "S", Unit: "cm/s", Dist: distuv.LogNormal{Mu: math.Log(10), Sigma: 0.2}},
		},
	}
	r, err := s.Run(func(x []float64) (float64, error) { return x[0] / (2 * x[1]) * 1e3, nil })
	if err != nil {
		log.Fatal(err)
	}
	for _, e := range r.Effects {
		fmt.Printf("%s: τ %.3f … %.3f ms, elasticity %+.3f, variance share %.2f\n", e.Name, e.Low, e.High, e.Elasticity, e.Share)
	}
	// Output:
	// S: τ 1.098 … 0.738 ms, elasticity -1.000, variance share 0.98
	// W: τ 0.875 … 0.925 ms, elasticity +1.000, variance share 0.02
}

// Elasticities of a power law are its exponents.
func ExampleElasticities() {
	f := func(x []float64) (float64, error) { return math.Pow(x[0], 2) / math.Sqrt(x[1]), nil }
	e, err := uncertainty.Elasticities(f, []float64{3, 7}, []string{"a", "b"}, 0)
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("%.6f\n", e)
	// Output:
	// [2.000000 -0.500000]
}
