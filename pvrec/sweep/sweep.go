// Package sweep evaluates a function over an index range concurrently, with results in input
// order, for parameter sweeps of any pvrec computation (J0 over profiles, Seff over fixed
// charge, τeff over samples). It is plain Go with no physics; the sweeps of the notebooks and
// of j0.Solver.SolveAll go through it.
//
// A panic in one evaluation becomes that item's error (with the goroutine's stack in the
// message), so a long sweep in a notebook loses one point, not the kernel.
package sweep

import (
	"fmt"
	"runtime"
	"runtime/debug"
	"sync"
	"sync/atomic"
)

// Run evaluates f(i) for i = 0, …, n−1 concurrently on workers goroutines
// (runtime.GOMAXPROCS(0), that is all cores, if workers <= 0) and returns the results and
// errors in index order: out[i], errs[i] belong to f(i), whatever the scheduling, so that the
// output is deterministic. f must be safe for concurrent use (the pvrec models are). errs is
// nil if every call succeeded; otherwise it has length n with nil at the successful indices.
// A panic in f(i) is recovered and reported as errs[i] (the zero R as out[i]), naming the
// index and the panic value, followed by the stack. n <= 0 returns nil, nil; a nil f gives
// an error at every index.
//
// Example, J0 of emitters of several surface densities:
//
//	res, errs := sweep.Run(len(ns), 0, func(i int) (j0.Result, error) {
//		r := region
//		r.Profile = profile.Sum{profile.Erfc{Dopant: silicon.Donor, Surface: ns[i], Length: l}, bg}
//		return solver.Solve(r)
//	})
func Run[R any](n, workers int, f func(i int) (R, error)) (out []R, errs []error) {
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
				out[i], all[i] = call(f, i)
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

// call returns f(i), turning a panic into an error.
func call[R any](f func(int) (R, error), i int) (r R, err error) {
	if f == nil {
		return r, fmt.Errorf("sweep: item %d: function f is nil", i)
	}
	defer func() {
		if p := recover(); p != nil {
			var zero R
			r, err = zero, fmt.Errorf("sweep: item %d panicked: %v\n%s", i, p, debug.Stack())
		}
	}()
	return f(i)
}
