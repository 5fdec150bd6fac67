package spectroscopy

import (
	"math"
	"sort"
)

// Settings of nelderMead.
const (
	nmStep     = 0.1   // initial simplex: the start plus nmStep along each axis
	nmXTol     = 1e-8  // convergence: simplex diameter (max-norm) at most this
	nmFTolAbs  = 1e-15 // and spread of values at most nmFTolAbs + nmFTolRel·|f_best|
	nmFTolRel  = 1e-12
	nmMaxEvals = 4000
	nmStall    = 50   // or: the best value fell by at most nmStallTol·|f| + nmFTolAbs in nmStall iterations
	nmStallTol = 1e-9 // (a flat valley, where every point is as good on the scale of the statistics)
)

// nelderMead minimises f from x0 by the simplex method of J. A. Nelder and R. Mead,
// Comput. J. 7, 308 (1965), with the standard coefficients (reflection 1, expansion 2,
// contraction 1/2, shrink 1/2) and the acceptance rules of J. C. Lagarias, J. A. Reeds,
// M. H. Wright and P. E. Wright, SIAM J. Optim. 9, 112 (1998). It stops when the simplex is
// smaller than nmXTol and its values agree to nmFTolAbs + nmFTolRel |f|, or when the best
// value has fallen by at most nmStallTol |f| + nmFTolAbs over nmStall iterations (a flat
// valley), and returns the best vertex, its value and true; or the best vertex so far and
// false after nmMaxEvals evaluations. It is deterministic.
//
// It is written here because gonum/optimize (whose NelderMead would serve) imports
// golang.org/x/tools through stat/distmv, a module this one does not require.
func nelderMead(f func([]float64) float64, x0 []float64) (x []float64, fx float64, ok bool) {
	n := len(x0)
	v := make([][]float64, n+1)
	fv := make([]float64, n+1)
	for i := range v {
		v[i] = append([]float64(nil), x0...)
		if i > 0 {
			v[i][i-1] += nmStep
		}
		fv[i] = f(v[i])
	}
	evals := n + 1
	idx := make([]int, n+1)
	cen := make([]float64, n)
	xr, xe, xc := make([]float64, n), make([]float64, n), make([]float64, n)
	along := func(dst []float64, t float64) { // dst = cen + t (cen − worst)
		w := v[idx[n]]
		for j := range dst {
			dst[j] = cen[j] + t*(cen[j]-w[j])
		}
	}
	var history []float64 // best value at each iteration
	for {
		for i := range idx {
			idx[i] = i
		}
		sort.SliceStable(idx, func(a, b int) bool { return fv[idx[a]] < fv[idx[b]] })
		best, worst := idx[0], idx[n]
		diam := 0.0
		for _, i := range idx[1:] {
			for j := range x0 {
				diam = math.Max(diam, math.Abs(v[i][j]-v[best][j]))
			}
		}
		if diam <= nmXTol && fv[worst]-fv[best] <= nmFTolAbs+nmFTolRel*math.Abs(fv[best]) {
			return v[best], fv[best], true
		}
		history = append(history, fv[best])
		if k := len(history) - 1 - nmStall; k >= 0 && history[k]-fv[best] <= nmFTolAbs+nmStallTol*math.Abs(fv[best]) {
			return v[best], fv[best], true
		}
		if evals >= nmMaxEvals {
			return v[best], fv[best], false
		}
		for j := range cen {
			cen[j] = 0
			for _, i := range idx[:n] {
				cen[j] += v[i][j] / float64(n)
			}
		}
		fb, fs, fw := fv[best], fv[idx[n-1]], fv[worst]
		along(xr, 1)
		fr := f(xr)
		evals++
		switch {
		case fr < fb: // expand
			along(xe, 2)
			fe := f(xe)
			evals++
			if fe < fr {
				copy(v[worst], xe)
				fv[worst] = fe
			} else {
				copy(v[worst], xr)
				fv[worst] = fr
			}
		case fr < fs: // accept the reflection
			copy(v[worst], xr)
			fv[worst] = fr
		default: // contract outside (fr < fw) or inside, else shrink towards the best
			t := -0.5
			if fr < fw {
				t = 0.5
			}
			along(xc, t)
			fc := f(xc)
			evals++
			if (t > 0 && fc <= fr) || (t < 0 && fc < fw) {
				copy(v[worst], xc)
				fv[worst] = fc
				continue
			}
			for _, i := range idx[1:] {
				for j := range v[i] {
					v[i][j] = v[best][j] + 0.5*(v[i][j]-v[best][j])
				}
				fv[i] = f(v[i])
				evals++
			}
		}
	}
}
