package lifetime

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/interp"

	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Columns of a waferTable, each a function of x = ln Δn (Δn in cm^-3).
const (
	colY    = iota // ln(Δn (μn + μp)), the photoconductance per q W, in ln(cm^-1 V^-1 s^-1)
	colVoc         // ln iVoc, iVoc in V
	colIntr        // ln(1/τ) of the intrinsic mechanism, τ in s (unused without one)
	colKS          // ln((n p − ni,eff²)/(Δn ni,eff²)), in ln cm^3: N + Δn over ni,eff²
	colDa          // ln of the ambipolar diffusivity, cm²/s
	nCol
)

// Accuracy and limits of a waferTable.
const (
	tableTol       = 1e-7 // largest error of every column (absolute, in ln, i.e. relative) and of the inverse (in ln Δn)
	tableStart     = 8    // initial nodes per decade
	tableMaxDecade = 512  // give up beyond this density
)

// waferTable tabulates the state of one wafer that the analysis of a trace needs at every
// point (the inverse of the photoconductance, iVoc, the intrinsic lifetime, ni,eff and the
// ambipolar diffusivity) on [dnMin, dnMax], so that a 10,000-point trace costs a few spline
// evaluations per point instead of a state, a mobility and a recombination rate. Columns are
// interpolated by cubic Hermite polynomials in x = ln Δn on an equally spaced grid
// (gonum/interp.PiecewiseCubic), with slopes from fourth-order finite differences of the
// nodes, so that the interpolation error is O(h⁴) like a cubic spline's while the fit costs
// O(n) (gonum's NotAKnotCubic solves its banded system as a dense one, O(n³), which made the
// table cost more than the analysis); the inverse of colY is the Hermite interpolant of x
// against colY with slopes 1/colY'. The grid is refined by inserting the midpoints until
// every column and the inverse agree with direct evaluation at the midpoints to tableTol.
// silicon.SumMobilityTable tabulates the mobility sum alone, so it does not serve here.
type waferTable struct {
	xMin, xMax float64
	yMin, yMax float64 // range of colY
	col        [nCol]interp.PiecewiseCubic
	inv        interp.PiecewiseCubic // x as a function of colY
	intrinsic  bool                  // colIntr holds an intrinsic lifetime (false: none, or a rate of 0)
	nodes      int
}

// tableEval evaluates the columns at one Δn directly from the wafer and its models.
type tableEval struct {
	b         *recomb.Bulk
	mat       *silicon.Material
	mob       silicon.Mobility
	eq        silicon.Point
	intrinsic recomb.Mechanism // nil for none
}

func (e tableEval) at(dn float64) ([nCol]float64, error) {
	var v [nCol]float64
	st, err := e.b.State(dn)
	if err != nil {
		return v, err
	}
	mu, err := silicon.SumMobility(e.mob, e.eq, dn)
	if err != nil {
		return v, err
	}
	voc, err := st.ImpliedVoc()
	if err != nil {
		return v, err
	}
	if !(voc > 0) || !(st.Excess > 0) {
		return v, fmt.Errorf("lifetime: wafer state at Δn = %g cm^-3 has iVoc = %g V, n p − ni,eff² = %g cm^-6: not injected", dn, voc, st.Excess)
	}
	v[colY] = math.Log(dn * mu)
	v[colVoc] = math.Log(voc)
	v[colIntr] = math.Inf(-1)
	if e.intrinsic != nil {
		tau, err := recomb.Lifetime(e.intrinsic, st)
		if err != nil {
			return v, err
		}
		v[colIntr] = -math.Log(tau) // −Inf for a rate of 0
	}
	v[colKS] = math.Log(st.Excess / dn / st.NiEff / st.NiEff)
	dnD, dpD, err := silicon.Diffusivities(e.mat, e.mob, st.N, st.P, st.NdIon, st.NaIon)
	if err != nil {
		return v, err
	}
	da, err := silicon.AmbipolarDiffusivity(dnD, dpD, st.N, st.P)
	if err != nil {
		return v, err
	}
	v[colDa] = math.Log(da)
	return v, nil
}

// newWaferTable tabulates wafer b with intrinsic mechanism intr (nil for none) on
// [dnMin, dnMax] cm^-3 (0 < dnMin < dnMax <= recomb.MaxExcess).
func newWaferTable(b *recomb.Bulk, intr recomb.Mechanism, dnMin, dnMax float64) (*waferTable, error) {
	mat := b.Material()
	e := tableEval{b: b, mat: mat, mob: mat.Models().Mobility, eq: equilibriumPoint(b), intrinsic: intr}
	xMin, xMax := math.Log(dnMin), math.Log(dnMax)
	n := max(int(math.Ceil((xMax-xMin)/math.Ln10*tableStart)), 4) // intervals
	xs := make([]float64, n+1)
	vs := make([][nCol]float64, n+1)
	for i := range xs {
		xs[i] = xMin + (xMax-xMin)*float64(i)/float64(n)
		dn := math.Exp(xs[i])
		switch i {
		case 0:
			dn = dnMin
		case n:
			xs[i], dn = xMax, dnMax
		}
		v, err := e.at(dn)
		if err != nil {
			return nil, fmt.Errorf("lifetime: tabulating the wafer: %w", err)
		}
		vs[i] = v
	}
	// The intrinsic column is used only if every node has a finite intrinsic rate; a
	// mechanism with a rate of 0 everywhere (recomb.Sum{}) subtracts nothing.
	t := &waferTable{xMin: xMin, xMax: xMax, intrinsic: intr != nil && !math.IsInf(vs[0][colIntr], -1)}
	decades := (xMax - xMin) / math.Ln10
	for {
		if err := t.fit(xs, vs); err != nil {
			return nil, err
		}
		mids := make([][nCol]float64, len(xs)-1)
		worst := 0.0
		for i := range mids {
			xm := 0.5 * (xs[i] + xs[i+1])
			v, err := e.at(math.Exp(xm))
			if err != nil {
				return nil, fmt.Errorf("lifetime: tabulating the wafer: %w", err)
			}
			if !(v[colY] > vs[i][colY] && v[colY] < vs[i+1][colY]) {
				return nil, fmt.Errorf("lifetime: the photoconductance of the wafer does not rise with Δn near %.3g cm^-3 (mobility model %v)", math.Exp(xm), e.mob)
			}
			mids[i] = v
			for c := range nCol {
				if c == colIntr && !t.intrinsic {
					continue
				}
				worst = math.Max(worst, math.Abs(t.col[c].Predict(xm)-v[c]))
			}
			worst = math.Max(worst, math.Abs(t.inv.Predict(v[colY])-xm))
		}
		if worst <= tableTol {
			t.nodes = len(xs)
			return t, nil
		}
		if float64(len(xs)-1) > decades*tableMaxDecade {
			return nil, fmt.Errorf("lifetime: tabulating the wafer: interpolation error %.2g above %g with %d nodes per decade", worst, tableTol, tableMaxDecade)
		}
		// Insert the midpoints, already evaluated, as new nodes.
		nx := make([]float64, 0, 2*len(xs)-1)
		nv := make([][nCol]float64, 0, 2*len(xs)-1)
		for i := range xs {
			nx, nv = append(nx, xs[i]), append(nv, vs[i])
			if i < len(mids) {
				nx, nv = append(nx, 0.5*(xs[i]+xs[i+1])), append(nv, mids[i])
			}
		}
		xs, vs = nx, nv
	}
}

// fit fits the interpolants of t to the equally spaced nodes xs (at least 5) with values vs.
func (t *waferTable) fit(xs []float64, vs [][nCol]float64) error {
	n := len(xs)
	h := (xs[n-1] - xs[0]) / float64(n-1)
	ys := make([]float64, n)
	ds := make([]float64, n)
	var dy []float64 // slopes of colY, for the inverse
	for c := range nCol {
		if c == colIntr && !t.intrinsic {
			continue
		}
		for i := range xs {
			ys[i] = vs[i][c]
			if c == colIntr && math.IsInf(ys[i], 0) {
				return fmt.Errorf("lifetime: the intrinsic recombination rate vanishes at Δn = %.3g cm^-3 but not everywhere", math.Exp(xs[i]))
			}
		}
		slopes(ys, h, ds)
		t.col[c].FitWithDerivatives(xs, ys, ds)
		if c == colY {
			dy = append([]float64(nil), ds...)
		}
	}
	for i := range xs {
		ys[i] = vs[i][colY]
		if !(dy[i] > 0) || (i > 0 && !(ys[i] > ys[i-1])) {
			return fmt.Errorf("lifetime: the photoconductance of the wafer does not rise with Δn near %.3g cm^-3", math.Exp(xs[i]))
		}
		ds[i] = 1 / dy[i]
	}
	t.yMin, t.yMax = ys[0], ys[n-1]
	t.inv.FitWithDerivatives(ys, xs, ds)
	return nil
}

// slopes stores in d the fourth-order finite-difference derivatives of the equally spaced
// values f (step h, len(f) >= 5): central five-point differences inside, the one-sided
// five-point formulas at the two first and last nodes.
func slopes(f []float64, h float64, d []float64) {
	n := len(f)
	c := 1 / (12 * h)
	d[0] = c * (-25*f[0] + 48*f[1] - 36*f[2] + 16*f[3] - 3*f[4])
	d[1] = c * (-3*f[0] - 10*f[1] + 18*f[2] - 6*f[3] + f[4])
	for i := 2; i < n-2; i++ {
		d[i] = c * (f[i-2] - 8*f[i-1] + 8*f[i+1] - f[i+2])
	}
	d[n-2] = c * (3*f[n-1] + 10*f[n-2] - 18*f[n-3] + 6*f[n-4] - f[n-5])
	d[n-1] = c * (25*f[n-1] - 48*f[n-2] + 36*f[n-3] - 16*f[n-4] + 3*f[n-5])
}

// excess returns x = ln Δn at y = ln(Δn (μn + μp)), for y within [t.yMin, t.yMax].
func (t *waferTable) excess(y float64) float64 {
	return clamp(t.inv.Predict(y), t.xMin, t.xMax)
}

// at returns column c at x = ln Δn within [t.xMin, t.xMax].
func (t *waferTable) at(c int, x float64) float64 {
	return t.col[c].Predict(clamp(x, t.xMin, t.xMax))
}

// clamp returns x limited to [lo, hi] for finite x (plain comparisons: math.Min and math.Max
// handle NaN and signed zeros, which cost time on this hot path and cannot occur here).
func clamp(x, lo, hi float64) float64 {
	if x < lo {
		return lo
	}
	if x > hi {
		return hi
	}
	return x
}
