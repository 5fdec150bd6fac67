package uncertainty_test

import (
	"testing"

	"gonum.org/v1/gonum/stat/distuv"

	"github.com/pvrec/pvrec/pvrec/j0"
	"github.com/pvrec/pvrec/pvrec/profile"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/uncertainty"
)

// BenchmarkMonteCarloJ0: 10,000 Monte Carlo J0 solves of an erfc phosphorus emitter with the
// default models, its surface density scaled by a log-normal calibration factor (5 %), its
// depth L normal (0.36 ± 0.02 µm) and its surface recombination velocity log-normal around
// 1e4 cm/s (invented uncertainties; issue target: under 3 s on two cores). Run with:
// go test -run NONE -bench MonteCarloJ0 -benchtime 1x -cpu 2 ./pvrec/uncertainty/
func BenchmarkMonteCarloJ0(b *testing.B) {
	models, err := j0.DefaultModels(300)
	if err != nil {
		b.Fatal(err)
	}
	solver := j0.NewSolver(models)
	f := func(x []float64) (float64, error) {
		r, err := solver.Solve(j0.Region{
			Profile: profile.Sum{
				profile.Erfc{Dopant: silicon.Donor, Surface: 1e20 * x[0], Length: x[1]},
				profile.Uniform{Dopant: silicon.Acceptor, N: 1.5e16},
			},
			Surface: j0.FixedS(x[2]),
		})
		return r.J0, err
	}
	mc := uncertainty.MonteCarlo{
		Inputs: []uncertainty.Input{
			{Name: "calibration factor", Unit: "1", Dist: distuv.LogNormal{Mu: 0, Sigma: 0.05}},
			{Name: "L", Unit: "cm", Dist: distuv.Normal{Mu: 0.36e-4, Sigma: 0.02e-4}},
			{Name: "S", Unit: "cm/s", Dist: distuv.LogNormal{Mu: 9.2103, Sigma: 0.3}},
		},
		Seed:       1,
		MaxSamples: 10000,
	}
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		r, err := mc.Run(f)
		if err != nil {
			b.Fatal(err)
		}
		if r.N != 10000 {
			b.Fatalf("%d samples", r.N)
		}
	}
}

// BenchmarkSpreadJ0: the model spread (20 members) of the J0 of a heavily doped emitter at
// 300 K on all cores (issue target: under 50 ms). Run with:
// go test -run NONE -bench SpreadJ0 -cpu 2 ./pvrec/uncertainty/
func BenchmarkSpreadJ0(b *testing.B) {
	members, err := uncertainty.Members(uncertainty.Case{T: 300, Dopant: silicon.Donor})
	if err != nil {
		b.Fatal(err)
	}
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := uncertainty.Spread(members, 0, memberJ0); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkMonteCarloTrivial: 1e6 samples of a trivial function (the identity of a normal
// input), the cost of the Monte Carlo machinery itself per sample: drawing, evaluation on the
// workers, running statistics and the final percentiles. It reports ns/sample. Run with:
// go test -run NONE -bench MonteCarloTrivial -benchtime 1x -cpu 2 ./pvrec/uncertainty/
func BenchmarkMonteCarloTrivial(b *testing.B) {
	const n = 1_000_000
	mc := uncertainty.MonteCarlo{
		Inputs:     []uncertainty.Input{{Name: "x", Dist: distuv.Normal{Mu: 1, Sigma: 0.1}}},
		Seed:       1,
		MaxSamples: n,
	}
	f := func(x []float64) (float64, error) { return x[0], nil }
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		r, err := mc.Run(f)
		if err != nil {
			b.Fatal(err)
		}
		if r.N != n {
			b.Fatalf("%d samples", r.N)
		}
	}
	b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N*n), "ns/sample")
}
