package j0

import (
	"runtime"
	"sync"
	"sync/atomic"
)

// Sweep evaluates f(i) for i = 0, …, n−1 concurrently on workers goroutines (runtime.GOMAXPROCS(0),
// that is all cores, if workers <= 0) and returns the results and errors in index order:
// out[i], errs[i] belong to f(i), whatever the scheduling, so that the output is
// deterministic. f must be safe for concurrent use (the pvrec models and a Solver are). errs
// is nil if every call succeeded. It is the helper for sweeps over profiles or parameter
// sets, for example:
//
//	res, errs := j0.Sweep(len(surfaceDensities), 0, func(i int) (j0.Result, error) {
//		r := region
//		r.Profile = profile.Sum{profile.Erfc{Dopant: silicon.Donor, Surface: surfaceDensities[i], Length: l}, bg}
//		return solver.Solve(r)
//	})
func Sweep[R any](n, workers int, f func(i int) (R, error)) (out []R, errs []error) {
	if n <= 0 {
		return nil, nil
	}
	if workers <= 0 {
		workers = runtime.GOMAXPROCS(0)
	}
	if workers > n {
		workers = n
	}
	out = make([]R, n)
	all := make([]error, n)
	var next atomic.Int64
	var failed atomic.Bool
	var wg sync.WaitGroup
	for w := 0; w < workers; w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for {
				i := int(next.Add(1) - 1)
				if i >= n {
					return
				}
				out[i], all[i] = f(i)
				if all[i] != nil {
					failed.Store(true)
				}
			}
		}()
	}
	wg.Wait()
	if failed.Load() {
		errs = all
	}
	return out, errs
}

// SolveAll solves every region with s concurrently on workers goroutines (all cores if
// workers <= 0) and returns the results and errors in the order of regions (see Sweep).
func (s Solver) SolveAll(regions []Region, workers int) ([]Result, []error) {
	return Sweep(len(regions), workers, func(i int) (Result, error) { return s.Solve(regions[i]) })
}
