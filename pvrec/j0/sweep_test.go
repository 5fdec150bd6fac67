package j0

import (
	"testing"
)

// TestSolveAllDeterministic checks that SolveAll returns the sequential results, bit
// for bit, in input order, for any number of workers, and report each error at its index.
func TestSolveAllDeterministic(t *testing.T) {
	s := NewSolver(mustModels(t, SimpleModels))
	var regions []Region
	for i := 0; i < 40; i++ {
		ns := 1e19 * float64(1+i%7)
		regions = append(regions, Region{Profile: emitter(ns, 0.1e-4*float64(1+i%5), 1e16), Surface: FixedS(float64(10 * i))})
	}
	regions[13].Surface = nil // an error at index 13
	want := make([]float64, len(regions))
	for i, r := range regions {
		res, err := s.Solve(r)
		if (err != nil) != (i == 13) {
			t.Fatalf("region %d: err %v", i, err)
		}
		want[i] = res.J0
	}
	for _, workers := range []int{0, 1, 2, 3, 64} {
		got, errs := s.SolveAll(regions, workers)
		if len(got) != len(regions) || len(errs) != len(regions) {
			t.Fatalf("workers %d: %d results, %d errors", workers, len(got), len(errs))
		}
		for i := range got {
			if got[i].J0 != want[i] || (errs[i] != nil) != (i == 13) {
				t.Errorf("workers %d, region %d: J0 %g (want %g), err %v", workers, i, got[i].J0, want[i], errs[i])
			}
		}
	}
}
