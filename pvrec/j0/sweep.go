package j0

import "github.com/pvrec/pvrec/pvrec/sweep"

// SolveAll solves every region with s concurrently on workers goroutines (all cores if
// workers <= 0) and returns the results and errors in the order of regions (see sweep.Run; a panic in one solve becomes that region's error).
func (s Solver) SolveAll(regions []Region, workers int) ([]Result, []error) {
	return sweep.Run(len(regions), workers, func(i int) (Result, error) { return s.Solve(regions[i]) })
}
