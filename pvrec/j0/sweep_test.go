package j0

import (
	"errors"
	"fmt"
	"testing"

	"github.com/pvrec/pvrec/pvrec/profile"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// TestSweepDeterministic checks that Sweep and SolveAll return the sequential results, bit
// for bit, in input order, for any number of workers, and report each error at its index.
func TestSweepDeterministic(t *testing.T) {
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
	out, errs := Sweep(5, 2, func(i int) (int, error) { return i * i, nil })
	if errs != nil || fmt.Sprint(out) != "[0 1 4 9 16]" {
		t.Errorf("Sweep = %v, %v", out, errs)
	}
	_, errs = Sweep(3, 0, func(i int) (int, error) {
		if i == 1 {
			return 0, errors.New("boom")
		}
		return i, nil
	})
	if errs == nil || errs[0] != nil || errs[1] == nil || errs[2] != nil {
		t.Errorf("Sweep errors = %v", errs)
	}
	if out, errs := Sweep(0, 0, func(int) (int, error) { return 0, nil }); out != nil || errs != nil {
		t.Errorf("empty Sweep = %v, %v", out, errs)
	}
	_ = silicon.Donor
	_ = profile.Sum{}
}
