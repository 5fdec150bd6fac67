package j0

import (
	"errors"
	"fmt"
	"math"
	"reflect"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/profile"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Region is a quasi-neutral doped region for the J0 solvers: the doping profile below the
// front surface (x = 0), the front surface's recombination and the far boundary.
type Region struct {
	Profile profile.Profile // doping profile; its majority type at x = 0 is the region's type
	Surface Surface         // front surface recombination velocity model (required; FixedS(0) for an ideal surface)
	// Depth is the far boundary in cm. 0 means the front edge of the space-charge region of
	// the profile's first junction at zero bias (see SpaceChargeRegion): the J0 of an emitter.
	// A positive depth is used as given: the J0 of a high–low junction (a surface field
	// region) or of a region cut at a chosen depth; the net doping must keep its sign to it.
	// It may not exceed profile.MaxDepthCm.
	Depth float64
}

// Solver is the numerical J0 solver for a heavily doped, quasi-neutral region (see Solve).
// The zero values of RelTol, MaxNodes and InitialStep select the defaults. A Solver is a
// value, safe for concurrent use. The zero Solver has no Models: Solve returns an error.
//
// MaxNodes bounds the work from the first mesh on: an InitialStep so small that the initial
// mesh would not leave room for a second one within MaxNodes is an error before anything is
// solved. Time and memory grow linearly with the nodes (about a microsecond and 200 bytes per
// node and mesh with the default models).
type Solver struct {
	Models              // physical models
	RelTol      float64 // relative change of J0 between successive meshes at which refinement stops; 0: 1e-3
	MaxNodes    int     // largest mesh, nodes; 0: 4097
	InitialStep float64 // largest change of ln|net doping| per cell of the initial mesh; 0: 2
}

// NewSolver returns a Solver with models m and the default tolerance and mesh settings.
func NewSolver(m Models) Solver { return Solver{Models: m} }

// Result is the outcome of Solver.Solve. Currents are in A/cm^2, depths in cm. The parts
// JSurface + JAuger + JSRH + JRadiative add up to J0 (to rounding); J0 and its parts are
// extrapolated from the last two meshes, the Nodes and Cells are those of the finest mesh.
type Result struct {
	J0         float64 // saturation current density of the region, A/cm^2
	JSurface   float64 // part recombined at the front surface, A/cm^2
	JAuger     float64 // part recombined by Auger recombination in the region, A/cm^2
	JSRH       float64 // part recombined by SRH recombination in the region, A/cm^2
	JRadiative float64 // part recombined radiatively in the region, A/cm^2
	ErrEst     float64 // estimated discretisation error of J0, A/cm^2 (see Solve)
	JFinest    float64 // J0 of the finest mesh itself, before extrapolation, A/cm^2 (the Cells add up to it less the surface part)

	Majority       silicon.Dopant // majority dopant of the region (its type)
	Depth          float64        // far boundary, cm
	Junction       float64        // metallurgical junction depth, cm; 0 if the profile has none
	SurfaceDensity float64        // majority dopant density at the surface, cm^-3
	S              float64        // surface recombination velocity used, cm/s

	Nodes  []Node // the final mesh, from the surface to the far boundary
	Cells  []Cell // recombination in each cell of the final mesh (the depth distribution)
	Meshes int    // number of meshes solved
	Evals  int    // number of local model evaluations
}

// Node is one node of the final mesh.
type Node struct {
	X        float64 // depth, cm
	U        float64 // normalised minority excess u = Δn_min/n_min0 at J0's definition (u = 1 at the far boundary), dimensionless
	Minority float64 // equilibrium minority-carrier density n_min0, cm^-3
	D        float64 // minority-carrier diffusivity, cm²/s
	Tau      float64 // low-injection minority-carrier lifetime n_min0/c (+Inf without bulk recombination), s
}

// Cell is the recombination in one cell [X0, X1] of the final mesh, as current densities in
// A/cm^2 (divide by X1 − X0 for the density per depth in A/cm^3).
type Cell struct {
	X0, X1                float64 // cell bounds, cm
	Auger, SRH, Radiative float64 // recombination current density in the cell by mechanism, A/cm^2
}

// Total returns Auger + SRH + Radiative in A/cm^2.
func (c Cell) Total() float64 { return c.Auger + c.SRH + c.Radiative }

// setup is a region prepared for solving.
type setup struct {
	ev       *evaluator
	w        float64 // far boundary, cm
	xj       float64
	ns, s    float64
	maj      silicon.Dopant
	relTol   float64
	maxNodes int
	step     float64
}

// prepare validates r and finds the region's type, far boundary and surface velocity.
func (s Solver) prepare(r Region) (*setup, error) {
	if err := s.Models.validate(); err != nil {
		return nil, err
	}
	if isNil(r.Profile) {
		return nil, fmt.Errorf("j0: Region.Profile is nil")
	}
	if isNil(r.Surface) {
		return nil, fmt.Errorf("j0: Region.Surface is nil (use FixedS(0) for an ideal surface)")
	}
	if math.IsNaN(r.Depth) || math.IsInf(r.Depth, 0) || r.Depth < 0 {
		return nil, fmt.Errorf("j0: Region.Depth must be finite and >= 0 cm, got %g", r.Depth)
	}
	if r.Depth > profile.MaxDepthCm {
		return nil, check.Rangef("Region", "Depth", r.Depth, 0, profile.MaxDepthCm,
			"j0: Region.Depth = %g cm beyond profile.MaxDepthCm = %g cm", r.Depth, profile.MaxDepthCm)
	}
	st := &setup{relTol: s.RelTol, maxNodes: s.MaxNodes, step: s.InitialStep}
	if st.relTol == 0 {
		st.relTol = 1e-3
	}
	if !(st.relTol > 0 && st.relTol < 1) {
		return nil, fmt.Errorf("j0: Solver.RelTol must be in (0, 1), got %g", s.RelTol)
	}
	if st.maxNodes == 0 {
		st.maxNodes = 4097
	}
	if st.maxNodes < 3 {
		return nil, fmt.Errorf("j0: Solver.MaxNodes must be >= 3, got %d", s.MaxNodes)
	}
	if st.step == 0 {
		st.step = 2
	}
	if !(st.step > 0) || math.IsInf(st.step, 0) {
		return nil, fmt.Errorf("j0: Solver.InitialStep must be finite and > 0, got %g", s.InitialStep)
	}
	maj, err := profile.Majority(r.Profile)
	if err != nil {
		return nil, fmt.Errorf("j0: %w", err)
	}
	st.maj = maj
	xj, err := profile.JunctionDepth(r.Profile)
	switch {
	case err == nil:
		st.xj = xj
	case errors.Is(err, profile.ErrNoJunction):
		if r.Depth == 0 {
			return nil, fmt.Errorf("j0: Region.Depth is 0 (the space-charge region's edge) but %w; give the depth of the high–low junction", err)
		}
	default:
		return nil, fmt.Errorf("j0: %w", err)
	}
	if r.Depth > 0 {
		if st.xj > 0 && r.Depth >= st.xj {
			return nil, fmt.Errorf("j0: Region.Depth = %g cm reaches the junction at %g cm; the region must be quasi-neutral", r.Depth, st.xj)
		}
		st.w = r.Depth
	} else {
		sc, err := spaceCharge(r.Profile, s.Material, st.xj)
		if err != nil {
			return nil, err
		}
		st.w = sc.Front
	}
	nd, na, err := r.Profile.Dopants(0)
	if err != nil {
		return nil, fmt.Errorf("j0: %w", err)
	}
	st.ns = nd
	if maj == silicon.Acceptor {
		st.ns = na
	}
	st.s, err = r.Surface.Velocity(st.ns)
	if err != nil {
		return nil, err
	}
	if math.IsNaN(st.s) || st.s < 0 {
		return nil, fmt.Errorf("j0: surface model %v gives S = %g cm/s at ns = %g cm^-3; want >= 0", r.Surface, st.s, st.ns)
	}
	st.ev = newEvaluator(s.Models, r.Profile, maj)
	return st, nil
}

// isNil reports whether v is nil or holds a nil pointer, map, slice or function (whose
// methods would panic; an empty profile.Sum is not nil, but a nil one is undoped silicon and
// is kept).
func isNil(v any) bool {
	if v == nil {
		return true
	}
	switch rv := reflect.ValueOf(v); rv.Kind() {
	case reflect.Pointer, reflect.Map, reflect.Func, reflect.Chan:
		return rv.IsNil()
	}
	return false
}

// Solve returns J0 of region r with its breakdown and depth distribution.
//
// Equations. In the quasi-neutral region under low injection the majority carriers stay in
// equilibrium and the minority carriers (density n_min0(x)(1 + u) with u the normalised
// excess) obey
//
//	d/dx (a du/dx) = c u,   a = D_min n_min0,   c = R/u,
//
// with n_min0 = ni,eff²/n_maj0 from the material (band-gap narrowing and degeneracy), D_min
// from the minority mobility, and c the low-injection recombination of the Auger, SRH and
// radiative mechanisms (see the models); the current of minority carriers toward the surface
// is q a du/dx, which includes the drift in the effective fields of the doping gradient and
// of the narrowing. The boundary conditions are a du/dx = S n_min0 u at the surface (u = 0 if
// S = +Inf) and u = 1 at the far boundary; J0 = q a du/dx there, the current for
// n p/ni,eff² − 1 = 1 at the far boundary.
//
// Discretisation: a locally exact (exponentially fitted) finite-volume scheme. On each cell
// the coefficients are taken as a = a0 exp(λ s), log-linear between the nodes, and
// c/a = k², constant at the geometric mean of the nodes; the cell's equation then has
// constant coefficients, u″ + λ u′ − k² u = 0, whose exact solution gives the fluxes at the
// cell's ends as functions of the node values. For k → 0 these are the Scharfetter–Gummel
// fluxes (D. L. Scharfetter and H. K. Gummel, IEEE Trans. Electron Devices 16, 64 (1969))
// of minority carriers drifting in the effective field; for a uniform region the scheme is
// exact on any mesh. Flux continuity at the nodes gives a symmetric, diagonally dominant
// tridiagonal system (an M-matrix), solved by the Thomas algorithm without pivoting, which is
// stable for such matrices (N. J. Higham, Accuracy and Stability of Numerical Algorithms,
// 2nd ed., SIAM 2002, on tridiagonal systems), here written as a recursion of positive terms
// for the excess of each pivot over its coupling, without subtractions, so that J0 keeps
// full precision however fine the mesh. The error is of second order in the cell size.
//
// Mesh control. The initial mesh adapts to the profile: nodes are placed so that ln|N|, N the
// net doping, changes by at most InitialStep per cell (and at least four cells span the
// region); cells over which ln a or ln(c/a) still change by more than 3 InitialStep are then
// bisected. Every cell is then bisected in turn, reusing the evaluated nodes, and each mesh
// is solved. Since the scheme is of second order, the Richardson extrapolation J0 = J_fine +
// (J_fine − J_coarse)/3 of each pair of successive meshes is of higher order (L. F.
// Richardson, Phil. Trans. R. Soc. A 210, 307 (1911)). Refinement stops when two successive
// extrapolations differ by less than RelTol (relative) and the observed convergence is that
// of a second-order scheme (successive differences falling by a factor between 2 and 8, or
// the finest mesh alone converged to RelTol); at least three meshes are solved. J0 is the
// last extrapolation and ErrEst the difference between the last two, a conservative
// estimate (it is the error estimate of the previous extrapolation).
//
// Breakdown: the recombination in each cell is the difference of its end fluxes, exact for
// the cell model and computed without cancellation, shared among the mechanisms in
// proportion to c_m u at the cell's nodes (trapezoid weights); the surface part is
// q S n_min0(0) u(0). The parts are extrapolated like J0, so that they add up to it.
//
// It returns an error for invalid models or region, a far boundary beyond the junction, an
// error of a model, or an error matching pvrec.ErrNoConvergence: without a Result if the
// initial mesh leaves no room for a second mesh within MaxNodes (an InitialStep too small for
// MaxNodes), with the Result and its error estimate if the mesh reaches MaxNodes before J0
// meets RelTol (the estimate is then the difference of the last two extrapolations, or of the
// last two meshes when only two were solved).
func (s Solver) Solve(r Region) (Result, error) {
	// The tridiagonal system is solved by the hand-written recursion of positive terms (see
	// work.solve), not gonum's banded Cholesky (mat.BandCholesky), which would allocate per
	// solve and form its pivots by subtraction, losing digits on fine meshes.
	st, err := s.prepare(r)
	if err != nil {
		return Result{}, err
	}
	xs, err := initialMeshMax(r.Profile, st.w, st.step, st.maxNodes)
	if err != nil {
		return Result{}, err
	}
	nodes := make([]local, len(xs))
	for i, x := range xs {
		if nodes[i], err = st.ev.eval(x); err != nil {
			return Result{}, err
		}
	}
	if nodes, err = st.preRefine(nodes); err != nil {
		return Result{}, err
	}
	if 2*len(nodes)-1 > st.maxNodes {
		return Result{}, check.NoConvergence("j0: the initial mesh of %d nodes (InitialStep %g) leaves no room for a second mesh within MaxNodes = %d: no error estimate is possible; raise MaxNodes or InitialStep",
			len(nodes), st.step, st.maxNodes)
	}
	var ws work
	var hist []meshSol // solutions of the meshes so far
	for {
		j, err := ws.solve(nodes, st.s)
		if err != nil {
			return Result{}, err
		}
		hist = append(hist, meshSol{j: j, parts: st.parts(&ws, nodes)})
		k := len(hist) - 1
		if k >= 2 {
			j0, j1, j2 := hist[k-2].j, hist[k-1].j, hist[k].j
			r1, r2 := richardson(j0, j1), richardson(j1, j2)
			change := math.Abs(r2 - r1)
			asymptotic := math.Abs(j2-j1) <= st.relTol*math.Abs(j2) // the finest mesh alone is converged
			if d := j2 - j1; d != 0 {
				if rho := (j1 - j0) / d; rho >= 2 && rho <= 8 {
					asymptotic = true // second-order convergence observed
				}
			}
			if change <= st.relTol*math.Abs(r2) && asymptotic {
				return st.result(&ws, nodes, hist, change), nil
			}
		}
		if 2*len(nodes)-1 > st.maxNodes {
			// Error estimate: the difference of the last two extrapolations, or with only two
			// meshes that of the meshes themselves (the larger, conservative choice).
			est := math.Abs(hist[k].j - hist[k-1].j)
			res := st.result(&ws, nodes, hist, est)
			if k >= 2 {
				res.ErrEst = math.Abs(res.J0 - richardson(hist[k-2].j, hist[k-1].j))
			}
			return res, check.NoConvergence("j0: mesh refinement did not reach the tolerance: J0 = %g A/cm^2 with estimated error %.2g (relative) at %d nodes (MaxNodes %d)",
				res.J0, res.ErrEst/math.Abs(res.J0), len(nodes), st.maxNodes)
		}
		if nodes, err = st.bisect(nodes, nil); err != nil {
			return Result{}, err
		}
	}
}

// meshSol is the solution of one mesh: J0 (A/cm^2) and its parts (surface, Auger, SRH,
// radiative; A/cm^2).
type meshSol struct {
	j     float64
	parts [4]float64
}

// richardson returns the Richardson extrapolation of a second-order quantity from its values
// on a mesh (coarse) and on the mesh with every cell bisected (fine).
func richardson(coarse, fine float64) float64 { return fine + (fine-coarse)/3 }

// bisect returns nodes with the midpoint of every cell i with split[i] (of all cells if
// split is nil) inserted and evaluated.
func (st *setup) bisect(nodes []local, split []bool) ([]local, error) {
	out := make([]local, 0, 2*len(nodes)-1)
	for i := range nodes {
		if i > 0 && (split == nil || split[i-1]) {
			mid, err := st.ev.eval(0.5 * (nodes[i-1].x + nodes[i].x))
			if err != nil {
				return nil, err
			}
			out = append(out, mid)
		}
		out = append(out, nodes[i])
	}
	return out, nil
}

// preRefine bisects the cells over which ln a or ln κ change by more than
// preRefineFactor·step, for up to six passes.
func (st *setup) preRefine(nodes []local) ([]local, error) {
	lim := preRefineFactor * st.step
	for pass := 0; pass < 6; pass++ {
		split := make([]bool, len(nodes)-1)
		any := false
		for i := range split {
			l, r := nodes[i], nodes[i+1]
			da := math.Abs(math.Log(r.a / l.a))
			dk := 0.0
			if l.kappa > 0 && r.kappa > 0 {
				dk = math.Abs(math.Log(r.kappa / l.kappa))
			}
			if da > lim || dk > lim {
				split[i], any = true, true
			}
		}
		if !any || len(nodes)+len(split) > st.maxNodes {
			return nodes, nil
		}
		var err error
		if nodes, err = st.bisect(nodes, split); err != nil {
			return nil, err
		}
	}
	return nodes, nil
}

// preRefineFactor is the ratio of the largest change of ln a or ln κ over a cell to the
// initial step of ln N before a cell is bisected by preRefine.
const preRefineFactor = 3.0

// maxInitialNodes bounds the initial mesh of the integral forms (Transparent, Gummel), which
// take no MaxNodes of their own: 65537 nodes, 16 times the default MaxNodes.
const maxInitialNodes = 1<<16 + 1

// initialMesh is initialMeshMax with the bound maxInitialNodes.
func initialMesh(p profile.Profile, w, step float64) ([]float64, error) {
	return initialMeshMax(p, w, step, maxInitialNodes)
}

// initialMeshMax returns nodes on [0, w] that equidistribute |d ln|N|/dx| / step + 4/w, from
// 48 samples of the net doping N, or an error, before allocating them, if they would be more
// than maxNodes.
func initialMeshMax(p profile.Profile, w, step float64, maxNodes int) ([]float64, error) {
	const samples = 48
	const minCells = 4
	g := make([]float64, samples+1)
	for i := range g {
		n, err := profile.Net(p, w*float64(i)/samples)
		if err != nil {
			return nil, fmt.Errorf("j0: %w", err)
		}
		if n == 0 {
			return nil, fmt.Errorf("j0: net doping is zero at depth %g cm inside the region", w*float64(i)/samples)
		}
		g[i] = math.Log(math.Abs(n))
	}
	cum := make([]float64, samples+1)
	for i := 1; i <= samples; i++ {
		cum[i] = cum[i-1] + math.Abs(g[i]-g[i-1])/step + float64(minCells)/samples
	}
	cells := math.Max(math.Ceil(cum[samples]-1e-9), minCells)
	if !(cells+1 <= float64(maxNodes)) { // also +Inf and NaN, before any allocation
		return nil, check.NoConvergence("j0: Solver.InitialStep = %g gives an initial mesh of %.3g nodes, more than the node limit %d (Solver.MaxNodes for Solve, %d for the integral forms); raise InitialStep",
			step, cells+1, maxNodes, maxInitialNodes)
	}
	n := int(cells)
	xs := make([]float64, n+1)
	k := 0
	for j := 1; j < n; j++ {
		target := cum[samples] * float64(j) / float64(n)
		for cum[k+1] < target {
			k++
		}
		t := (target - cum[k]) / (cum[k+1] - cum[k])
		xs[j] = w * (float64(k) + t) / samples
	}
	xs[n] = w
	return xs, nil
}

// work holds the cell coefficients and the solution of one mesh, reused across meshes.
type work struct {
	g   []cellCoef
	eps []float64 // excess of the elimination pivots over the coupling to the next node
	u   []float64 // solution u at the nodes
}

// cellCoef are the end fluxes (a du/dx) of a cell as linear functions of its node values,
// split into a diffusive part and a non-negative recombination part:
//
//	G0 = b (u1 − u0) − r0 u0,   G1 = b (u1 − u0) + r1 u1,   G1 − G0 = r0 u0 + r1 u1,
//
// so that the recombination in the cell, G1 − G0, is formed without cancellation.
type cellCoef struct{ b, r0, r1 float64 }

// coef returns the exact end-flux coefficients of the cell between l and r (see Solve):
// with t = ln(a1/a0)/2, K = (k h)² and X = sqrt(t² + K),
//
//	b = sqrt(a0 a1) X/sinh X / h,   r0 = a0 φ(t, X, K)/h,   r1 = a1 φ(−t, X, K)/h,
//	φ(t, X, K) = t + X coth X − e^t X/sinh X  (= 0 for K = 0, the Scharfetter–Gummel limit).
func coef(l, r local) cellCoef {
	h := r.x - l.x
	t := 0.5 * math.Log(r.a/l.a)
	k2 := 0.0
	if l.kappa > 0 && r.kappa > 0 {
		k2 = h * h * math.Sqrt(l.kappa*r.kappa)
	}
	x := math.Hypot(t, math.Sqrt(k2))
	return cellCoef{
		b:  math.Sqrt(l.a*r.a) * xcsch(x) / h,
		r0: l.a * phi(t, x, k2) / h,
		r1: r.a * phi(-t, x, k2) / h,
	}
}

// Taylor coefficients of X coth X = Σ cothCoef[n] X^{2n} and X/sinh X = Σ cschCoef[n] X^{2n}
// (from the Bernoulli numbers: 2^{2n} B_{2n}/(2n)! and (2 − 2^{2n}) B_{2n}/(2n)!, evaluated
// with mpmath at 40 digits).
var (
	cothCoef = [...]float64{1, 0.33333333333333333333, -0.022222222222222222222, 0.0021164021164021164021,
		-0.00021164021164021164021, 0.000021377799155576933355, -2.1644042808063972085e-6,
		2.19259478518737778e-7, -2.2214608789979679076e-8, 2.2507846516808992854e-9,
		-2.2805151204592182866e-10, 2.3106432599002624097e-11, -2.3411706819824883959e-12,
		2.3721017400233654295e-13, -2.4034415333307706179e-14, 2.4351954029183368731e-15,
		-2.4673688045172074706e-16, 2.499967277122080898e-17, -2.5329964357406348315e-18,
		2.5664619702826286611e-19, -2.6003696460137273589e-20}
	cschCoef = [...]float64{1, -0.16666666666666666667, 0.019444444444444444444, -0.0020502645502645502646,
		0.00020998677248677248677, -0.000021336045641601197157, 2.1633474427786597099e-6,
		-2.1923271344567640864e-7, 2.2213930853920414559e-8, -2.2507674795567867297e-9,
		2.2805107707218211705e-10, -2.3106421580996967376e-11, 2.3411704028931946797e-12,
		-2.3721016693292246369e-13, 2.4034415154237357638e-14, -2.4351953983824319684e-15,
		2.4673688033682493368e-16, -2.4999672768310464029e-17, 2.5329964356669149327e-18,
		-2.5664619702639551926e-19, 2.600369646008997314e-20}
)

// phi returns φ(t, X, K) = t + X coth X − e^t X/sinh X for X = sqrt(t² + K), K >= 0, without
// the cancellation of the direct formula (φ is of order K while its terms are of order 1).
// For X < 1 it sums the series φ = K Σ_{n>=1} (c_n − e^t s_n) (z^n − t^{2n})/(z − t²),
// z = X², whose terms fall by about z/π² each; otherwise it uses, with δ = X − |t| =
// K/(X + |t|) and E = 1 − e^{−2X},
//
//	t >= 0:  φ = [(X + t)(1 − e^{−δ}) − δ e^{−δ} + δ e^{−2X}] / E,
//	t < 0:   φ = [δ − e^{t−X} (δ + (X − t)(1 − e^{−δ}))] / E,
//
// exact rearrangements that lose at most a factor of about ten in relative precision.
func phi(t, x, k2 float64) float64 {
	if k2 == 0 {
		return 0
	}
	if x < 1 {
		z, w := x*x, t*t
		et := math.Exp(t)
		d := 1.0 // (z^n − w^n)/(z − w) for n = 1
		wn := w  // w^n
		var sum float64
		for n := 1; n < len(cothCoef); n++ {
			term := (cothCoef[n] - et*cschCoef[n]) * d
			sum += term
			if math.Abs(term) <= 1e-17*math.Abs(sum) {
				break
			}
			d = z*d + wn
			wn *= w
		}
		return k2 * sum
	}
	at := math.Abs(t)
	delta := k2 / (x + at)
	e := -math.Expm1(-2 * x)
	om := -math.Expm1(-delta) // 1 − e^{−δ}
	if t >= 0 {
		return ((x+t)*om - delta*math.Exp(-delta) + delta*math.Exp(-2*x)) / e
	}
	return (delta - math.Exp(t-x)*(delta+(x-t)*om)) / e
}

// xcsch returns x / sinh x (1 at x = 0) for x >= 0.
func xcsch(x float64) float64 {
	switch {
	case x < 1e-4:
		return 1 - x*x/6
	case x > 20:
		e := math.Exp(-x)
		return 2 * x * e / (1 - e*e)
	}
	return x / math.Sinh(x)
}

// solve solves the mesh's equations with surface velocity sv (cm/s) and returns J0 in A/cm^2.
//
// The system is the symmetric tridiagonal M-matrix of the flux balances, with off-diagonal
// −b_i and diagonal b_{i−1} + b_i plus the non-negative recombination terms. It is solved
// by the Thomas algorithm written for the excess ε_i of each pivot over b_i, which satisfies
//
//	ε_0 = r0_0 + S n_min0(0),   ε_i = r1_{i−1} + r0_i + b_{i−1} ε_{i−1}/(b_{i−1} + ε_{i−1}),
//
// a recursion of positive terms (the discrete admittance seen from the far boundary); then
// u_i = u_{i+1} b_i/(b_i + ε_i) from u_n = 1, and J0/q = r1_{n−1} + b_{n−1} ε_{n−1}/(b_{n−1} +
// ε_{n−1}). No step subtracts, so J0 and u keep full relative precision on any mesh.
func (ws *work) solve(nodes []local, sv float64) (float64, error) {
	n := len(nodes) - 1 // cells; unknowns u_0 … u_{n−1}, u_n = 1
	ws.g = grow(ws.g, n)
	ws.eps = growF(ws.eps, n)
	ws.u = growF(ws.u, n+1)
	for i := 0; i < n; i++ {
		ws.g[i] = coef(nodes[i], nodes[i+1])
	}
	// coupled returns b ε/(b + ε), the admittance passed through a cell of coupling b.
	coupled := func(b, e float64) float64 { return b / (1 + b/e) }
	ws.eps[0] = ws.g[0].r0 + sv*nodes[0].nmin // +Inf for an ohmic contact
	for i := 1; i < n; i++ {
		ws.eps[i] = ws.g[i-1].r1 + ws.g[i].r0 + coupled(ws.g[i-1].b, ws.eps[i-1])
	}
	last := ws.g[n-1]
	j := silicon.ElementaryCharge * (last.r1 + coupled(last.b, ws.eps[n-1]))
	if math.IsNaN(j) || math.IsInf(j, 0) {
		return 0, fmt.Errorf("j0: the discrete system gives J0 = %g A/cm^2 (coefficients not finite)", j)
	}
	ws.u[n] = 1
	for i := n - 1; i >= 0; i-- {
		ws.u[i] = ws.u[i+1] / (1 + ws.eps[i]/ws.g[i].b)
	}
	return j, nil
}

func growF(s []float64, n int) []float64 {
	if cap(s) < n {
		return make([]float64, n)
	}
	return s[:n]
}

func grow(s []cellCoef, n int) []cellCoef {
	if cap(s) < n {
		return make([]cellCoef, n)
	}
	return s[:n]
}

// parts returns the surface, Auger, SRH and radiative parts of J0 in A/cm^2 on the mesh
// just solved by ws (see Solve for the breakdown).
func (st *setup) parts(ws *work, nodes []local) [4]float64 {
	var p [4]float64
	st.cells(ws, nodes, func(_ int, c Cell) {
		p[1] += c.Auger
		p[2] += c.SRH
		p[3] += c.Radiative
	})
	p[0] = st.surfaceJ(ws, nodes)
	return p
}

// surfaceJ returns the current density recombined at the front surface in A/cm^2.
func (st *setup) surfaceJ(ws *work, nodes []local) float64 {
	u := ws.u
	if math.IsInf(st.s, 1) {
		c := ws.g[0] // flux into the contact: G0 of the first cell, with u_0 = 0
		return silicon.ElementaryCharge * c.b * u[1]
	}
	return silicon.ElementaryCharge * st.s * nodes[0].nmin * u[0]
}

// cells calls f with the recombination of each cell of the mesh just solved by ws.
func (st *setup) cells(ws *work, nodes []local, f func(i int, c Cell)) {
	q := silicon.ElementaryCharge
	u := ws.u
	for i := 0; i+1 < len(nodes); i++ {
		c := ws.g[i]
		rec := q * (c.r0*u[i] + c.r1*u[i+1])
		l, r := nodes[i], nodes[i+1]
		var w [nMech]float64
		var wt float64
		for m := range w {
			w[m] = l.c[m]*u[i] + r.c[m]*u[i+1]
			wt += w[m]
		}
		cell := Cell{X0: l.x, X1: r.x}
		if wt > 0 {
			cell.Auger, cell.SRH, cell.Radiative = rec*w[mAuger]/wt, rec*w[mSRH]/wt, rec*w[mRad]/wt
		}
		f(i, cell)
	}
}

// result packs the solution: J0 and its parts extrapolated from the last two meshes of hist,
// the nodes and cells of the finest mesh (just solved by ws).
func (st *setup) result(ws *work, nodes []local, hist []meshSol, errEst float64) Result {
	k := len(hist) - 1
	fine := hist[k]
	ext := fine.parts
	j := fine.j
	if k >= 1 {
		coarse := hist[k-1]
		j = richardson(coarse.j, fine.j)
		for m := range ext {
			ext[m] = richardson(coarse.parts[m], fine.parts[m])
		}
	}
	res := Result{
		J0: j, JSurface: ext[0], JAuger: ext[1], JSRH: ext[2], JRadiative: ext[3],
		ErrEst: errEst, JFinest: fine.j,
		Majority: st.maj, Depth: st.w, Junction: st.xj,
		SurfaceDensity: st.ns, S: st.s, Meshes: len(hist), Evals: st.ev.evals,
		Nodes: make([]Node, len(nodes)), Cells: make([]Cell, len(nodes)-1),
	}
	for i, l := range nodes {
		tau := math.Inf(1)
		if l.ct > 0 {
			tau = l.nmin / l.ct
		}
		res.Nodes[i] = Node{X: l.x, U: ws.u[i], Minority: l.nmin, D: l.d, Tau: tau}
	}
	st.cells(ws, nodes, func(i int, c Cell) { res.Cells[i] = c })
	return res
}
