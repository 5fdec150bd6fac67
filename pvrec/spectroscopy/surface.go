package spectroscopy

import (
	"math"

	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/sweep"
)

// Locus is the defect parameter solution of one curve over the Et grid of a Surface: at
// each energy the k and τn0 that fit the curve best, and what is left; and the whole cost
// map over (Et, k).
type Locus struct {
	K     []float64 // best k = σn/σp at each Et (refined between grid values of k)
	TauN0 []float64 // τn0 at (Et, K), s
	Cost  []float64 // residual sum of squares of ln τ at (Et, K)
	// AtEdge[i] is true where K[i] lies at an end of [KMin, KMax]: there the data only bound
	// k, and the locus leaves the searched range.
	AtEdge []bool
	// Map is the residual sum of squares of ln τ, with τn0 at its optimum, at every grid point:
	// Map[i][j] at k = 10^LogK[i] and Et[j].
	Map [][]float64
}

// Surface is the defect parameter solution surface (DPSS) of S. Rein, T. Rehrl, W. Warta and
// S. W. Glunz, J. Appl. Phys. 91, 2059 (2002) (also S. Rein, Lifetime Spectroscopy, Springer
// 2005): for each curve, the locus of (Et, k) that fits it over the whole gap, in both halves,
// and the sum of the curves' cost maps, whose minimum is where the loci intersect, the level
// that fits every curve. It is data for a plot: a heat map of Joint or of a Loci[c].Map
// over Et (x) and LogK (y), with the loci (Et, K) drawn on it.
type Surface struct {
	Ref  recomb.EnergyRef // reference of the energies (Options.Ref)
	Et   []float64        // level energies of the grid, eV, counted from Ref, increasing, spanning the shared gap
	LogK []float64        // log10 k of the grid, increasing, spanning [KMin, KMax]
	Loci []Locus          // per curve, in input order
	// Joint is the sum of the curves' maps, Joint[i][j] at LogK[i], Et[j]: each curve keeps its
	// own τn0, k and Et are shared.
	Joint [][]float64
	// BestEt and BestK are the grid point of least Joint cost (eV from Ref; σn/σp). Fit refines
	// it and says how well it is determined.
	BestEt, BestK float64
}

// SolutionSurface returns the defect parameter solution surface of the curves on a grid of
// Options.EtPoints level energies over the gap shared by the curves (from a band edge to the
// other, 1 µeV inside) and Options.KPoints values of log10 k over [KMin, KMax], both ends
// included. The model, the cost (residual sum of squares of ln τ) and the closed-form τn0 are
// those of Fit; at each Et the best k of each curve is refined between grid values by
// golden-section search to 1e-4 in ln k. Rows of Et are evaluated concurrently with package
// sweep on Options.Workers goroutines; the result does not depend on their number.
//
// It returns the errors of Fit for bad curves or Options, a range error
// (errors.Is(err, pvrec.ErrOutOfRange)) for a grid of fewer than 2 or more than MaxGridPoints
// points along an axis, or an error of the recombination models.
func SolutionSurface(curves []Curve, opt Options) (Surface, error) {
	nE, err := gridPoints("EtPoints", opt.EtPoints, defaultGrid)
	if err != nil {
		return Surface{}, err
	}
	nK, err := gridPoints("KPoints", opt.KPoints, defaultGrid)
	if err != nil {
		return Surface{}, err
	}
	p, err := newProblem(curves, opt)
	if err != nil {
		return Surface{}, err
	}
	es := linspace(p.lo, p.hi, nE)
	lnks := linspace(p.lnKMin, p.lnKMax, nK)
	m := len(p.curves)
	type column struct {
		cost  [][]float64 // per curve, per k
		lnk   []float64   // per curve
		lnT   []float64
		best  []float64
		edge  []bool
		joint []float64 // per k
	}
	cols, errs := sweep.Run(nE, p.workers, func(i int) (column, error) {
		w := p.newWork()
		if err := p.fill(w, es[i], -1); err != nil {
			return column{}, err
		}
		col := column{cost: make([][]float64, m), lnk: make([]float64, m), lnT: make([]float64, m),
			best: make([]float64, m), edge: make([]bool, m), joint: make([]float64, nK)}
		for j, c := range p.curves {
			col.cost[j] = make([]float64, nK)
			for q, lk := range lnks {
				v, _ := rss(c.y, w.a[j], w.b[j], math.Exp(lk)*c.ratio)
				col.cost[j][q] = v
				col.joint[q] += v
			}
			col.lnk[j], col.best[j], col.edge[j] = p.bestKOf(w, j, lnks, col.cost[j])
			_, col.lnT[j] = rss(c.y, w.a[j], w.b[j], math.Exp(col.lnk[j])*c.ratio)
		}
		return col, nil
	})
	if err := firstError(errs); err != nil {
		return Surface{}, err
	}
	s := Surface{Ref: p.ref, Et: es, LogK: make([]float64, nK), Loci: make([]Locus, m), Joint: matrix(nK, nE)}
	for q, lk := range lnks {
		s.LogK[q] = lk / math.Ln10
	}
	for j := range s.Loci {
		s.Loci[j] = Locus{K: make([]float64, nE), TauN0: make([]float64, nE), Cost: make([]float64, nE),
			AtEdge: make([]bool, nE), Map: matrix(nK, nE)}
	}
	bestCost := math.Inf(1)
	for i, col := range cols {
		for j := range s.Loci {
			l := &s.Loci[j]
			l.K[i], l.TauN0[i], l.Cost[i], l.AtEdge[i] = math.Exp(col.lnk[j]), math.Exp(col.lnT[j]), col.best[j], col.edge[j]
			for q := range lnks {
				l.Map[q][i] = col.cost[j][q]
			}
		}
		for q := range lnks {
			s.Joint[q][i] = col.joint[q]
			if col.joint[q] < bestCost {
				bestCost, s.BestEt, s.BestK = col.joint[q], es[i], math.Exp(lnks[q])
			}
		}
	}
	return s, nil
}

// matrix returns rows × cols zeros.
func matrix(rows, cols int) [][]float64 {
	m := make([][]float64, rows)
	for i := range m {
		m[i] = make([]float64, cols)
	}
	return m
}
