package spectroscopy

import (
	"math"

	"gonum.org/v1/gonum/optimize"
)

// Settings of nelderMead.
const (
	nmStep     = 0.1   // initial simplex: the start plus nmStep along each axis
	nmFTolAbs  = 1e-15 // convergence: the best value fell by at most nmFTolAbs + nmFTolRel·|f|
	nmFTolRel  = 1e-9  // over nmStall iterations (a flat valley is as good as a point on the scale of the statistics)
	nmStall    = 50
	nmMaxEvals = 4000
)

// nelderMead minimises f from x0 by the simplex method of J. A. Nelder and R. Mead,
// Comput. J. 7, 308 (1965), as gonum's optimize.NelderMead implements it (its dimension-
// dependent coefficients), starting from the simplex of x0 and nmStep along each axis. It
// stops when the best value has fallen by at most nmFTolAbs + nmFTolRel |f| over nmStall
// iterations, and returns the best point, its value and true; or the best point so far and
// false when nmMaxEvals evaluations did not converge. It is deterministic.
func nelderMead(f func([]float64) float64, x0 []float64) (x []float64, fx float64, ok bool) {
	n := len(x0)
	vertices := make([][]float64, n+1)
	values := make([]float64, n+1)
	for i := range vertices {
		vertices[i] = append([]float64(nil), x0...)
		if i > 0 {
			vertices[i][i-1] += nmStep
		}
		values[i] = f(vertices[i])
	}
	res, err := optimize.Minimize(optimize.Problem{Func: f}, x0,
		&optimize.Settings{FuncEvaluations: nmMaxEvals,
			Converger: &optimize.FunctionConverge{Absolute: nmFTolAbs, Relative: nmFTolRel, Iterations: nmStall}},
		&optimize.NelderMead{InitialVertices: vertices, InitialValues: values})
	if res == nil {
		return x0, math.Inf(1), false
	}
	return res.X, res.F, err == nil && res.Status != optimize.FunctionEvaluationLimit
}
