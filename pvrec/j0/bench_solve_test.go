package j0

import (
	"testing"

	"github.com/pvrec/pvrec/pvrec/profile"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// benchEmitter is the benchmark case: a 1 µm erfc phosphorus emitter (surface 1e20
// cm^-3, L = 0.36 µm, junction at 0.97 µm on a 1.5e16 cm^-3 boron wafer), S = 1e4 cm/s.
var benchEmitter = Region{
	Profile: profile.Sum{profile.Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.36e-4}, profile.Uniform{Dopant: silicon.Acceptor, N: 1.5e16}},
	Surface: FixedS(1e4),
}

func benchSolve(b *testing.B, m Models) {
	s := NewSolver(m)
	res, err := s.Solve(benchEmitter)
	if err != nil {
		b.Fatal(err)
	}
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := s.Solve(benchEmitter); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(len(res.Nodes)), "nodes")
	b.ReportMetric(float64(res.Evals), "evals")
}

// BenchmarkSolveSimple: one J0 solve converged to 1e-3 with SimpleModels (issue target: under
// 100 µs on one core). Run with: go test -run NONE -bench Solve -cpu 1 ./pvrec/j0/
func BenchmarkSolveSimple(b *testing.B) { benchSolve(b, mustModels(b, SimpleModels)) }

// BenchmarkSolveDefault: the same with DefaultModels (Klaassen, Schenk, Fermi–Dirac, Richter;
// issue target: under 300 µs on one core).
func BenchmarkSolveDefault(b *testing.B) { benchSolve(b, mustModels(b, defaultModels)) }

// BenchmarkSweep10000: 10,000 emitters (surface density and depth varied) with the default
// models on all cores (GOMAXPROCS; issue target: seconds on two cores). Run with:
// go test -run NONE -bench Sweep10000 -benchtime 1x ./pvrec/j0/
func BenchmarkSweep10000(b *testing.B) {
	s := NewSolver(mustModels(b, defaultModels))
	const n = 10000
	regions := make([]Region, n)
	for i := range regions {
		ns := 1e19 * (1 + float64(i%100)/5)   // 1e19 … 2.1e20 cm^-3
		l := 0.1e-4 * (1 + float64(i/100)/25) // 0.1 … 0.5 µm
		regions[i] = Region{Profile: profile.Sum{profile.Erfc{Dopant: silicon.Donor, Surface: ns, Length: l}, profile.Uniform{Dopant: silicon.Acceptor, N: 1.5e16}}, Surface: DefaultSurface()}
	}
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		_, errs := s.SolveAll(regions, 0)
		for _, err := range errs {
			if err != nil {
				b.Fatal(err)
			}
		}
	}
}

// BenchmarkIntegralForms: the transparent-region limit and the Gummel formula of the
// benchmark emitter with the default models.
func BenchmarkIntegralForms(b *testing.B) {
	s := NewSolver(mustModels(b, defaultModels))
	b.Run("Transparent", func(b *testing.B) {
		for i := 0; i < b.N; i++ {
			if _, err := s.Transparent(benchEmitter); err != nil {
				b.Fatal(err)
			}
		}
	})
	b.Run("Gummel", func(b *testing.B) {
		for i := 0; i < b.N; i++ {
			if _, err := s.Gummel(benchEmitter); err != nil {
				b.Fatal(err)
			}
		}
	})
}
