package spectroscopy

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strings"

	"gonum.org/v1/gonum/diff/fd"
	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/stat/distuv"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/sweep"
)

// Flags say what a fit could not establish. Each set flag has a sentence in Reasons.
type Flags uint8

const (
	// BranchesNotSeparated: levels in the other half of the gap (across Ei) fit the data as
	// well: part of the 95 % profile-likelihood region lies there (see Result.Region and
	// Result.Alternative).
	BranchesNotSeparated Flags = 1 << iota
	// EtNotDetermined: the 95 % interval of Et is wider than ±0.05 eV or reaches a band edge,
	// the 95 % region has separate intervals in the same half of the gap, or the Jacobian
	// cannot resolve Et.
	EtNotDetermined
	// KNotDetermined: k lies at an end of [KMin, KMax], its 95 % interval is wider than a
	// factor 10 either way, or the Jacobian cannot resolve it.
	KNotDetermined
	// PoorFit: the residuals of a curve are systematic (Durbin–Watson statistic below 1 with
	// an rms above NoiseFloor): one level does not describe its shape.
	PoorFit
	// NoCommonLevel: each curve alone is fitted much better than all together (F test at the
	// 99 % level): the curves do not share one level.
	NoCommonLevel
	// PointsExcluded: the subtraction of Curve.Subtract left points out.
	PointsExcluded
)

// flagNames are in bit order.
var flagNames = [...]string{"BranchesNotSeparated", "EtNotDetermined", "KNotDetermined", "PoorFit", "NoCommonLevel", "PointsExcluded"}

// String returns the names of the set flags joined by "|", e.g. "EtNotDetermined|PoorFit",
// or "none".
func (f Flags) String() string {
	var parts []string
	for i, n := range flagNames {
		if f&(1<<i) != 0 {
			parts = append(parts, n)
		}
	}
	if len(parts) == 0 {
		return "none"
	}
	return strings.Join(parts, "|")
}

// Interval is a closed range [Lo, Hi] of level energies in eV.
type Interval struct {
	Lo, Hi float64 // eV
}

// Branch is the best single level in the other half of the gap from Result.Level (across Ei).
type Branch struct {
	Et   float64 // level energy, eV, counted as Result.Ref says
	K    float64 // σn/σp
	Cost float64 // residual sum of squares of ln τ
	// Chi2 is (Cost − Result.Cost)/Result.Scatter²: below χ²₁(0.95) = 3.84 the data cannot
	// tell this branch from the best (BranchesNotSeparated).
	Chi2 float64
}

// Sample is the part of a Result that belongs to one curve.
type Sample struct {
	TauN0 float64 // electron capture time constant τn0 = 1/(σn vth,n Nt), s
	// LnTauN0Err is the standard error of ln τn0 from the covariance (with Et and k).
	LnTauN0Err float64
	TauP0      float64 // hole capture time constant τp0 = k (vth,n/vth,p) τn0, s
	SigmaNNt   float64 // σn·Nt = 1/(τn0 vth,n), cm^-1
	Cost       float64 // this curve's part of Result.Cost
	RMS        float64 // rms of its residuals of ln τ (relative scatter)
	// DurbinWatson is Σ (r_i − r_{i−1})² / Σ r_i² of its residuals in order of Δn: about 2
	// for independent noise, well below 2 for a systematic misfit (J. Durbin and
	// G. S. Watson, Biometrika 37, 409 (1950)); 2 when the residuals are zero.
	DurbinWatson float64
	Excluded     []int // indices into the curve's Dn of the points left out by the subtraction
}

// Result is a single-level SRH fit to one or more lifetime curves (see Fit).
type Result struct {
	Ref   recomb.EnergyRef // reference of the energies (Options.Ref)
	Level recomb.Level     // the fitted level, Et counted from Ref
	Et    float64          // level energy, eV, counted from Ref
	// EtLow and EtHigh bound the 95 % profile-likelihood interval of Et around Et, eV: the
	// energies at which the best fit over k and τn0 costs at most χ²₁(0.95) Scatter² more.
	EtLow, EtHigh float64
	// EtErr is the standard error of Et from the covariance s² (JᵀJ)⁻¹ at the optimum, eV
	// (linearised: quote the profile interval); half the range searched when the Jacobian
	// cannot resolve Et.
	EtErr float64
	K     float64 // ratio of capture cross sections k = σn/σp
	// KLow and KHigh bound the 95 % interval of k, ln k ± 1.96 LnKErr, within [KMin, KMax];
	// the whole range when k is not determined.
	KLow, KHigh float64
	// LnKErr is the standard error of ln k from the covariance; half the ln-k range searched
	// when the Jacobian cannot resolve k.
	LnKErr float64
	// CorrEtK is the correlation of Et and ln k in the covariance (0 if either is not
	// resolved).
	CorrEtK float64
	Samples []Sample // per curve, in input order
	Cost    float64  // residual sum of squares of ln τ over all points
	N       int      // number of points fitted
	Dof     int      // degrees of freedom N − (2 + number of curves)
	// Scatter is the relative scatter s the statistics use, max(sqrt(Cost/Dof), NoiseFloor).
	Scatter float64
	// Region is the 95 % profile-likelihood region of Et over the whole gap, as disjoint
	// intervals in increasing order; the one containing Et is [EtLow, EtHigh].
	Region      []Interval
	Alternative Branch   // the best level across Ei
	Flags       Flags    // what the data could not establish
	Reasons     []string // one sentence per flag
}

// Reliable reports whether no flag other than PointsExcluded is set: the data determine Et
// and k, in one half of the gap, with a single level that fits every curve.
func (r Result) Reliable() bool { return r.Flags&^PointsExcluded == 0 }

// SRH returns the fitted level as the recomb.SRH model of curve i (its τn0 and τp0), to
// evaluate the fitted curve with recomb.Bulk.Lifetimes. It returns an error for a Result not
// made by Fit, an index out of range, or time constants that are not finite and > 0.
func (r Result) SRH(i int) (recomb.SRH, error) {
	if r.Level.Ref == 0 {
		return recomb.SRH{}, errors.New("spectroscopy: Result.SRH: the Result is not from Fit")
	}
	if i < 0 || i >= len(r.Samples) {
		return recomb.SRH{}, fmt.Errorf("spectroscopy: Result.SRH: curve index %d not in [0, %d)", i, len(r.Samples))
	}
	m := recomb.SRH{Level: r.Level, TauN0: r.Samples[i].TauN0, TauP0: r.Samples[i].TauP0}
	if err := check.Positive("spectroscopy: Result.SRH", "TauN0", m.TauN0, "s"); err != nil {
		return recomb.SRH{}, err
	}
	if err := check.Positive("spectroscopy: Result.SRH", "TauP0", m.TauP0, "s"); err != nil {
		return recomb.SRH{}, err
	}
	return m, nil
}

// Fit fits a single Shockley–Read–Hall level to the lifetime curves by least squares on
// ln τ: the level energy Et (eV, counted as Options.Ref says), the ratio k = σn/σp shared by
// all curves, and one τn0 per curve, since τn0 = 1/(σn vth,n Nt) differs between samples of
// different defect density and temperature (the product σn·Nt is reported per curve). The
// model is recomb.SRH at each curve's recomb.State, with τp0 = k (vth,n/vth,p) τn0, so band-gap
// narrowing and the material's statistics enter as in the forward model.
//
// Method (derived here; the approach follows the lifetime spectroscopy of S. Rein, T. Rehrl,
// W. Warta and S. W. Glunz, J. Appl. Phys. 91, 2059 (2002)). For fixed Et and k, ln τ is
// ln τn0 plus a function of the data, so each τn0 has a closed-form optimum and the fit is a
// search over (Et, ln k) only. Default starting points: the local minima (the six lowest in
// each half of the gap, below and above Ei) of the profile cost over a grid of 161 energies
// spanning the gap, each minimised over 41 values of ln k spanning [KMin, KMax] and refined
// by golden-section search; Options.Starts are added. Each start is polished within its half
// by the Nelder–Mead simplex method (J. A. Nelder and R. Mead, Comput. J. 7, 308 (1965));
// the best half gives the Result, the other its Alternative. The search is deterministic
// (no random numbers).
//
// Uncertainty: Scatter s = max(rms, NoiseFloor); the covariance s² (JᵀJ)⁻¹ with the Jacobian J
// of the residuals in (Et, ln k, ln τn0 per curve) by central differences (gonum/diff/fd)
// gives the errors of k and τn0; the interval of Et is the profile-likelihood one (threshold
// χ²₁(0.95) s², common practice, no source), which follows the strongly non-linear
// dependence on Et. Flags and Reasons say when the branches are not separated, Et or k is not
// determined, a curve is not fitted by one level, or the curves share no level.
//
// It returns an error for no curves, a bad curve (a nil or zero Bulk, Dn and Tau of
// different lengths, fewer than MinPoints points or MinPoints − 1 distinct Δn, a Dn or Tau
// that is NaN, infinite or <= 0, a Dn above recomb.MaxExcess, too many points removed by the
// subtraction, a temperature outside the thermal-velocity window), invalid Options (a starting point outside the gap or k range is a range
// error, errors.Is(err, pvrec.ErrOutOfRange)), an error of the recombination models, or an
// optimisation that does not converge (errors.Is(err, pvrec.ErrNoConvergence)).
func Fit(curves []Curve, opt Options) (Result, error) {
	p, err := newProblem(curves, opt)
	if err != nil {
		return Result{}, err
	}
	lnks := linspace(p.lnKMin, p.lnKMax, fitKPoints)
	es := linspace(p.lo, p.hi, fitEtPoints)
	prof, err := p.profileGrid(es, lnks)
	if err != nil {
		return Result{}, err
	}
	w := p.newWork()

	// The best joint fit in each half: polished from every local minimum of the profile grid
	// (at most maxStarts per half, the lowest) and from the user's starts.
	type cand struct{ e, lnk, cost float64 }
	starts := make([][]cand, 2)
	for i, e := range es {
		if (i == 0 || prof[i].cost <= prof[i-1].cost) && (i == len(es)-1 || prof[i].cost <= prof[i+1].cost) {
			starts[p.half(e)] = append(starts[p.half(e)], cand{e, prof[i].lnk, prof[i].cost})
		}
	}
	for s := 0; s < 2; s++ {
		sort.SliceStable(starts[s], func(a, b int) bool { return starts[s][a].cost < starts[s][b].cost })
		if len(starts[s]) > maxStarts {
			starts[s] = starts[s][:maxStarts]
		}
		if len(starts[s]) == 0 { // the half's best grid point lies at Ei, or the half is narrower than a grid step
			a, b := p.halfRange(s)
			best := -1
			for i, e := range es {
				if p.half(e) == s && (best < 0 || prof[i].cost < prof[best].cost) {
					best = i
				}
			}
			if best >= 0 {
				starts[s] = append(starts[s], cand{es[best], prof[best].lnk, prof[best].cost})
			} else {
				starts[s] = append(starts[s], cand{(a + b) / 2, 0, math.Inf(1)})
			}
		}
	}
	for _, st := range opt.Starts {
		starts[p.half(st.Et)] = append(starts[p.half(st.Et)], cand{st.Et, math.Log(st.K), math.Inf(1)})
	}
	var halves [2]*cand
	var minima []profPoint // every polished minimum, for the region
	for s := 0; s < 2; s++ {
		a, b := p.halfRange(s)
		for _, st := range starts[s] {
			e, lnk, c, err := p.polish(w, -1, st.e, st.lnk, a, b)
			if err != nil {
				return Result{}, err
			}
			minima = append(minima, profPoint{e, c})
			if halves[s] == nil || c < halves[s].cost {
				halves[s] = &cand{e, lnk, c}
			}
		}
	}
	bi := 0
	if halves[1].cost < halves[0].cost {
		bi = 1
	}
	best, alt := halves[bi], halves[1-bi]

	r := Result{Ref: p.ref, Level: recomb.Level{E: best.e, Ref: p.ref}, Et: best.e, K: math.Exp(best.lnk),
		Cost: best.cost, N: p.n, Dof: p.n - 2 - len(p.curves)}
	r.Scatter = math.Max(math.Sqrt(best.cost/float64(r.Dof)), NoiseFloor)
	chi2 := distuv.ChiSquared{K: 1}.Quantile(confidenceLevel)
	z := distuv.UnitNormal.Quantile(0.5 + confidenceLevel/2)
	threshold := best.cost + chi2*r.Scatter*r.Scatter
	r.Alternative = Branch{Et: alt.e, K: math.Exp(alt.lnk), Cost: alt.cost,
		Chi2: (alt.cost - best.cost) / (r.Scatter * r.Scatter)}

	// Per-curve parts at the optimum.
	if err := p.fill(w, best.e, -1); err != nil {
		return Result{}, err
	}
	lnT := make([]float64, len(p.curves))
	var excluded, poor []string // per-curve notes for the flags
	for j, c := range p.curves {
		kappa := r.K * c.ratio
		cost, lt := rss(c.y, w.a[j], w.b[j], kappa)
		lnT[j] = lt
		res := make([]float64, len(c.y))
		for i := range c.y {
			res[i] = c.y[i] - lt - math.Log(kappa*w.a[j][i]+w.b[j][i])
		}
		tn := math.Exp(lt)
		smp := Sample{TauN0: tn, TauP0: kappa * tn, SigmaNNt: 1 / (tn * c.ve), Cost: cost,
			RMS: math.Sqrt(cost / float64(len(c.y))), DurbinWatson: durbinWatson(res),
			Excluded: append([]int(nil), c.excluded...)}
		if err := check.Result("spectroscopy: Fit", fmt.Sprintf("τn0 of curve %d", j), tn, "s"); err != nil {
			return Result{}, err
		}
		if len(c.excluded) > 0 {
			excluded = append(excluded, fmt.Sprintf("%d of curve %d", len(c.excluded), j))
		}
		if smp.DurbinWatson < dwThreshold && smp.RMS > NoiseFloor {
			poor = append(poor, fmt.Sprintf("curve %d (Durbin–Watson %.2f, rms %.3g)", j, smp.DurbinWatson, smp.RMS))
		}
		r.Samples = append(r.Samples, smp)
	}
	if len(excluded) > 0 {
		r.Flags |= PointsExcluded
		r.Reasons = append(r.Reasons, fmt.Sprintf("the subtraction left out points (%s; see Samples[i].Excluded)", strings.Join(excluded, ", ")))
	}
	if len(poor) > 0 {
		r.Flags |= PoorFit
		r.Reasons = append(r.Reasons, fmt.Sprintf("the residuals are systematic in %s: one level does not describe the shape", strings.Join(poor, ", ")))
	}

	// Covariance from the Jacobian.
	eEdge := !(best.e-p.lo > 1e-3 && p.hi-best.e > 1e-3)
	kEdge := !(best.lnk-p.lnKMin > 1e-3 && p.lnKMax-best.lnk > 1e-3)
	eFree, kFree := !eEdge, !kEdge
	cov, err := p.covariance(w, best.e, best.lnk, lnT, &eFree, &kFree, r.Scatter)
	if err != nil {
		return Result{}, err
	}
	m := len(p.curves)
	r.EtErr, r.LnKErr = (p.hi-p.lo)/2, (p.lnKMax-p.lnKMin)/2
	r.KLow, r.KHigh = p.kMin, p.kMax
	if cov != nil {
		if eFree {
			r.EtErr = math.Sqrt(cov.At(0, 0))
		}
		if kFree {
			r.LnKErr = math.Sqrt(cov.At(1, 1))
			r.KLow = math.Max(p.kMin, math.Exp(best.lnk-z*r.LnKErr))
			r.KHigh = math.Min(p.kMax, math.Exp(best.lnk+z*r.LnKErr))
		}
		if eFree && kFree {
			r.CorrEtK = cov.At(0, 1) / (r.EtErr * r.LnKErr)
		}
		for j := 0; j < m; j++ {
			r.Samples[j].LnTauN0Err = math.Sqrt(cov.At(2+j, 2+j))
		}
	}

	// The profile-likelihood region of Et.
	pts := make([]profPoint, 0, len(es)+2)
	for i, e := range es {
		pts = append(pts, profPoint{e, prof[i].cost})
	}
	pts = append(pts, minima...)
	sort.Slice(pts, func(i, j int) bool { return pts[i].e < pts[j].e })
	r.Region, err = p.region(w, pts, lnks, threshold)
	if err != nil {
		return Result{}, err
	}
	r.EtLow, r.EtHigh = best.e, best.e
	for _, iv := range r.Region {
		if iv.Lo <= best.e && best.e <= iv.Hi {
			r.EtLow, r.EtHigh = iv.Lo, iv.Hi
		}
	}

	// Flags.
	bestSide := p.half(best.e)
	var sameSide, otherSide bool // an interval of the region (besides the best's) on either side of Ei
	for _, iv := range r.Region {
		if p.half(iv.Lo) != bestSide || p.half(iv.Hi) != bestSide {
			otherSide = true
		} else if !(iv.Lo <= best.e && best.e <= iv.Hi) {
			sameSide = true
		}
	}
	if otherSide || (alt.cost <= threshold && (alt.e < r.EtLow || alt.e > r.EtHigh)) {
		r.Flags |= BranchesNotSeparated
		r.Reasons = append(r.Reasons, fmt.Sprintf("the 95 %% region of Et, %s eV (%s), reaches both halves of the gap (Ei at %.3f eV; best across it Et = %.3f eV, k = %.3g, Δχ² = %.2f): the data do not separate the branches",
			formatRegion(r.Region), refName(p.ref), p.mid, alt.e, r.Alternative.K, r.Alternative.Chi2))
	}
	switch {
	case eEdge:
		r.Flags |= EtNotDetermined
		r.Reasons = append(r.Reasons, fmt.Sprintf("Et = %.3f eV (%s) lies at a band edge: only a bound", r.Et, refName(p.ref)))
	case !eFree:
		r.Flags |= EtNotDetermined
		r.Reasons = append(r.Reasons, fmt.Sprintf("the lifetimes do not depend on Et near Et = %.3f eV (%s; the Jacobian does not resolve it): Et is not determined", r.Et, refName(p.ref)))
	case sameSide:
		r.Flags |= EtNotDetermined
		r.Reasons = append(r.Reasons, fmt.Sprintf("the 95 %% region of Et falls apart into separate intervals in the same half of the gap (%s eV, %s): the data do not tell them apart", formatRegion(r.Region), refName(p.ref)))
	case r.EtLow <= p.lo || r.EtHigh >= p.hi || (r.EtHigh-r.EtLow)/2 > determinedEt:
		r.Flags |= EtNotDetermined
		r.Reasons = append(r.Reasons, fmt.Sprintf("the 95 %% interval of Et is [%.3f, %.3f] eV (%s): Et is not determined to ±%g eV", r.EtLow, r.EtHigh, refName(p.ref), determinedEt))
	}
	switch {
	case kEdge:
		r.Flags |= KNotDetermined
		r.Reasons = append(r.Reasons, fmt.Sprintf("k = %.3g lies at an end of the range searched [%g, %g]: only a bound", r.K, p.kMin, p.kMax))
	case !kFree || z*r.LnKErr > determinedLnK:
		r.Flags |= KNotDetermined
		r.Reasons = append(r.Reasons, fmt.Sprintf("the 95 %% interval of k is [%.3g, %.3g]: k is not determined to a factor 10", r.KLow, r.KHigh))
	}
	if m > 1 {
		alone := 0.0
		for j := range p.curves {
			c := math.Min(r.Samples[j].Cost, prof.curveMin(j))
			_, _, cj, err := p.polishFrom(w, j, prof, es)
			if err != nil {
				return Result{}, err
			}
			alone += math.Min(c, cj)
		}
		d1, d2 := float64(2*m-2), float64(p.n-3*m)
		f := ((best.cost - alone) / d1) / math.Max(alone/d2, NoiseFloor*NoiseFloor)
		if fc := (distuv.F{D1: d1, D2: d2}).Quantile(fTestLevel); f > fc {
			r.Flags |= NoCommonLevel
			r.Reasons = append(r.Reasons, fmt.Sprintf("each curve alone is fitted far better than all together (F = %.3g > %.3g, the 99 %% point): the curves do not share one level", f, fc))
		}
	}
	return r, nil
}

// profRow is one energy of the profile grid: the best joint ln k and cost, and each curve's.
type profRow struct {
	lnk, cost float64
	curveLnK  []float64
	curveCost []float64
}

type profile []profRow

// curveMin returns the smallest grid cost of curve j.
func (pr profile) curveMin(j int) float64 {
	c := math.Inf(1)
	for _, row := range pr {
		c = math.Min(c, row.curveCost[j])
	}
	return c
}

// profileGrid returns the profile rows at energies es, with ln k searched over lnks,
// evaluated concurrently (package sweep).
func (p *problem) profileGrid(es, lnks []float64) (profile, error) {
	rows, errs := sweep.Run(len(es), p.workers, func(i int) (profRow, error) {
		w := p.newWork()
		if err := p.fill(w, es[i], -1); err != nil {
			return profRow{}, err
		}
		var r profRow
		r.lnk, r.cost, _ = p.bestK(w, -1, lnks)
		for j := range p.curves {
			lk, c, _ := p.bestK(w, j, lnks)
			r.curveLnK = append(r.curveLnK, lk)
			r.curveCost = append(r.curveCost, c)
		}
		return r, nil
	})
	if err := firstError(errs); err != nil {
		return nil, err
	}
	return rows, nil
}

// firstError returns the first non-nil error of errs.
func firstError(errs []error) error {
	for _, err := range errs {
		if err != nil {
			return err
		}
	}
	return nil
}

// half returns 0 for an energy e (in Ref) in the lower half of its coordinate range (below
// the intrinsic level in coordinate order) and 1 above.
func (p *problem) half(e float64) int {
	if e < p.mid {
		return 0
	}
	return 1
}

// halfRange returns the coordinate range of half s.
func (p *problem) halfRange(s int) (a, b float64) {
	if s == 0 {
		return p.lo, p.mid
	}
	return p.mid, p.hi
}

// polishFrom polishes the fit of curve j alone from its best profile-grid point, over the
// whole gap.
func (p *problem) polishFrom(w *work, j int, prof profile, es []float64) (e, lnk, c float64, err error) {
	best := 0
	for i := range prof {
		if prof[i].curveCost[j] < prof[best].curveCost[j] {
			best = i
		}
	}
	return p.polish(w, j, es[best], prof[best].curveLnK[j], p.lo, p.hi)
}

// polish minimises the cost of curve j (all curves for j < 0) over E in [a, b] and ln k in
// [lnKMin, lnKMax] from (e0, lnk0) by Nelder–Mead (nelderMead), in the unbounded coordinates u, v of
// E = a + (b − a) σ(u), ln k = lnKMin + (lnKMax − lnKMin) σ(v), σ the logistic function.
func (p *problem) polish(w *work, j int, e0, lnk0, a, b float64) (e, lnk, c float64, err error) {
	// The coordinates are clamped to ±25 (σ within 1.4e-11 of 0 or 1), so that the cost is
	// flat beyond and the simplex shrinks onto a minimum at a bound instead of drifting.
	sig := func(u float64) float64 { return 1 / (1 + math.Exp(-math.Min(math.Max(u, -25), 25))) }
	toE := func(u float64) float64 { return a + (b-a)*sig(u) }
	toK := func(v float64) float64 { return p.lnKMin + (p.lnKMax-p.lnKMin)*sig(v) }
	logit := func(x, lo, hi float64) float64 {
		f := math.Min(math.Max((x-lo)/(hi-lo), 1e-9), 1-1e-9)
		return math.Log(f / (1 - f))
	}
	var ferr error
	f := func(x []float64) float64 {
		if err := p.fill(w, toE(x[0]), j); err != nil {
			if ferr == nil {
				ferr = err
			}
			return math.Inf(1)
		}
		return p.cost(w, j, toK(x[1]))
	}
	x, fx, ok := nelderMead(f, []float64{logit(e0, a, b), logit(lnk0, p.lnKMin, p.lnKMax)})
	if ferr != nil {
		return 0, 0, 0, ferr
	}
	if !ok {
		return 0, 0, 0, check.NoConvergence("spectroscopy: Fit: Nelder–Mead did not converge in %d evaluations from Et = %g eV, k = %g (reached Et = %g eV, k = %g)",
			nmMaxEvals, e0, math.Exp(lnk0), toE(x[0]), math.Exp(toK(x[1])))
	}
	return toE(x[0]), toK(x[1]), fx, nil
}

// covariance returns s² (JᵀJ)⁻¹ in the parameters (E, ln k, ln τn0 of each curve), with J the
// Jacobian of the residuals at the optimum (central differences), or nil if it is singular
// even without E and ln k. Parameters with *eFree or *kFree false are held fixed (their rows
// and columns are zero); a Jacobian that does not resolve E, and then ln k, sets them false.
func (p *problem) covariance(w *work, e, lnk float64, lnT []float64, eFree, kFree *bool, s float64) (*mat.SymDense, error) {
	m := len(p.curves)
	np := 2 + m
	all := append([]float64{e, lnk}, lnT...)
	var idx []int // parameters varied by the differences: those not already fixed
	for i := 0; i < np; i++ {
		if (i == 0 && !*eFree) || (i == 1 && !*kFree) {
			continue
		}
		idx = append(idx, i)
	}
	var ferr error
	x := append([]float64(nil), all...)
	resid := func(y, v []float64) {
		for a, i := range idx {
			x[i] = v[a]
		}
		if err := p.fill(w, x[0], -1); err != nil {
			if ferr == nil {
				ferr = err
			}
			for i := range y {
				y[i] = 0
			}
			return
		}
		k := math.Exp(x[1])
		i := 0
		for j, c := range p.curves {
			for q := range c.y {
				y[i] = c.y[q] - x[2+j] - math.Log(k*c.ratio*w.a[j][q]+w.b[j][q])
				i++
			}
		}
	}
	v0 := make([]float64, len(idx))
	for a, i := range idx {
		v0[a] = all[i]
	}
	jac := mat.NewDense(p.n, len(idx), nil)
	fd.Jacobian(jac, resid, v0, &fd.JacobianSettings{Formula: fd.Central})
	if ferr != nil {
		return nil, ferr
	}
	for {
		var cols, params []int // columns of jac and the parameters they belong to
		for a, i := range idx {
			if (i == 0 && !*eFree) || (i == 1 && !*kFree) {
				continue
			}
			cols, params = append(cols, a), append(params, i)
		}
		if cov, ok := invertNormal(jac, cols, s); ok {
			out := mat.NewSymDense(np, nil)
			for a, pa := range params {
				for b := a; b < len(params); b++ {
					out.SetSym(pa, params[b], cov.At(a, b))
				}
			}
			return out, nil
		}
		switch {
		case *eFree:
			*eFree = false
		case *kFree:
			*kFree = false
		default:
			return nil, nil
		}
	}
}

// invertNormal returns s² (JᵀJ)⁻¹ over the columns free of jac, computed with the columns
// scaled to unit norm, or false if that matrix is not positive definite or its condition
// number exceeds 1e12 (the parameters are then not resolved by the data).
func invertNormal(jac *mat.Dense, free []int, s float64) (*mat.SymDense, bool) {
	n, _ := jac.Dims()
	q := len(free)
	scale := make([]float64, q)
	sub := mat.NewDense(n, q, nil)
	for a, f := range free {
		col := mat.Col(nil, f, jac)
		nrm := 0.0
		for _, v := range col {
			nrm += v * v
		}
		nrm = math.Sqrt(nrm)
		if !(nrm > 0) || math.IsInf(nrm, 0) {
			return nil, false
		}
		scale[a] = nrm
		for i, v := range col {
			sub.Set(i, a, v/nrm)
		}
	}
	var jtj mat.SymDense
	jtj.SymOuterK(1, sub.T())
	var ch mat.Cholesky
	if !ch.Factorize(&jtj) || !(ch.Cond() < 1e12) {
		return nil, false
	}
	var inv mat.SymDense
	if err := ch.InverseTo(&inv); err != nil {
		return nil, false
	}
	out := mat.NewSymDense(q, nil)
	for a := 0; a < q; a++ {
		for b := a; b < q; b++ {
			out.SetSym(a, b, s*s*inv.At(a, b)/(scale[a]*scale[b]))
		}
	}
	return out, true
}

// profPoint is a level energy with its profile cost.
type profPoint struct{ e, cost float64 }

// region returns the intervals of E where the profile cost is at most threshold, from the
// sorted points pts; each end between a point inside and one outside is found by bisection of
// the profile to intervalTolEt.
func (p *problem) region(w *work, pts []profPoint, lnks []float64, threshold float64) ([]Interval, error) {
	profileAt := func(e float64) (float64, error) {
		if err := p.fill(w, e, -1); err != nil {
			return 0, err
		}
		_, c, _ := p.bestK(w, -1, lnks)
		return c, nil
	}
	cross := func(in, out float64) (float64, error) {
		for math.Abs(out-in) > intervalTolEt {
			mid := (in + out) / 2
			c, err := profileAt(mid)
			if err != nil {
				return 0, err
			}
			if c <= threshold {
				in = mid
			} else {
				out = mid
			}
		}
		return in, nil
	}
	var out []Interval
	for i := 0; i < len(pts); i++ {
		if pts[i].cost > threshold {
			continue
		}
		start := i
		for i+1 < len(pts) && pts[i+1].cost <= threshold {
			i++
		}
		lo, hi := p.lo, p.hi
		var err error
		if start > 0 {
			if lo, err = cross(pts[start].e, pts[start-1].e); err != nil {
				return nil, err
			}
		}
		if i+1 < len(pts) {
			if hi, err = cross(pts[i].e, pts[i+1].e); err != nil {
				return nil, err
			}
		}
		out = append(out, Interval{Lo: lo, Hi: hi})
	}
	return out, nil
}

// durbinWatson returns Σ (r_i − r_{i−1})² / Σ r_i², or 2 (the value of independent noise)
// if the residuals are all zero.
func durbinWatson(r []float64) float64 {
	var num, den float64
	for i, v := range r {
		den += v * v
		if i > 0 {
			d := v - r[i-1]
			num += d * d
		}
	}
	if !(den > 0) {
		return 2
	}
	return num / den
}

// formatRegion returns the intervals as "[-0.178, -0.177] ∪ [0.249, 0.250]".
func formatRegion(region []Interval) string {
	parts := make([]string, len(region))
	for i, iv := range region {
		parts[i] = fmt.Sprintf("[%.3f, %.3f]", iv.Lo, iv.Hi)
	}
	return strings.Join(parts, " ∪ ")
}
