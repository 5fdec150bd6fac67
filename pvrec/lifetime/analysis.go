package lifetime

import (
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/floats"
	"gonum.org/v1/gonum/stat"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Mode is the analysis of a photoconductance trace: how τeff follows from Δn(t) and the
// generation G(t), after H. Nagel, C. Berge and A. G. Aberle, "Generalized analysis of
// quasi-steady-state and quasi-transient measurements of carrier lifetimes in
// semiconductors", J. Appl. Phys. 86, 6218 (1999), from the continuity equation of the
// wafer-averaged excess density, dΔn/dt = G − Δn/τeff.
type Mode uint8

const (
	// QSS is the quasi-steady-state analysis, τeff = Δn/G: valid when the illumination changes
	// slowly compared with τeff (dΔn/dt ≪ G).
	QSS Mode = iota + 1
	// Transient is the analysis of a free decay, τeff = −Δn/(dΔn/dt): valid where the light
	// is off (points with illumination > 0 are excluded).
	Transient
	// Generalised is the generalised analysis of Nagel, Berge and Aberle (1999),
	// τeff = Δn/(G − dΔn/dt), valid for any time dependence of the illumination (points
	// where G − dΔn/dt < MinNetGeneration·G, such as the rising edge of a flash, are excluded).
	Generalised
)

// String returns "QSS", "transient" or "generalised".
func (m Mode) String() string {
	switch m {
	case QSS:
		return "QSS"
	case Transient:
		return "transient"
	case Generalised:
		return "generalised"
	}
	return fmt.Sprintf("Mode(%d)", uint8(m))
}

// Default range of excess carrier densities of an analysis (Analysis.DnMin, DnMax), cm^-3:
// our choice (no source), the injection levels of lifetime samples over which pvrec's
// analysis is tested. Points outside are excluded, with a warning.
const (
	DefaultDnMin = 1e10
	DefaultDnMax = 1e18
)

// LocalWindow is the half-width, in decades, of the local fits of Result.ImpliedVoc (in suns)
// and Result.LifetimeAt (in Δn): the points within ±0.1 decade of the requested value enter a
// least-squares straight line (our choice, no source).
const LocalWindow = 0.1

// Analysis holds the inputs of the analysis of a measurement of a lifetime sample: the wafer,
// its thickness, the analysis mode, the optics and the intrinsic recombination to subtract.
// It is a value; build it as a struct literal. The zero Analysis is rejected with an error
// naming the missing field.
type Analysis struct {
	Wafer *recomb.Bulk // the wafer: material (mobility model, ni,eff), dopants, equilibrium
	W     float64      // thickness, cm (finite, > 0)
	Mode  Mode         // QSS, Transient or Generalised (for traces; ignored by AnalyzeTable)
	// Optics converts the illumination into a generation rate (needed by QSS and Generalised)
	// and defines one sun for Result.Suns, ImpliedVoc and ImpliedJV. The zero Optics is
	// allowed for Transient traces and tables; those results then carry no suns.
	Optics Optics
	// Intrinsic is the recombination subtracted from 1/τeff by Result.J0s and the
	// low-injection check, e.g. recomb.NewIntrinsic(); nil subtracts nothing and makes
	// Result.J0s return an error (use recomb.Sum{} to fit without a subtraction).
	Intrinsic recomb.Mechanism
	// HalfWidth fixes the half-width k of the smoothing window of dΔn/dt, in points (the fit
	// uses 2k+1 points, k >= 2); 0 selects the adaptive window (SmoothingFraction of the local
	// time scale, at most MaxHalfWidth points), the right choice for most traces.
	HalfWidth int
	// DnMin and DnMax bound the accepted excess carrier densities, cm^-3; 0 selects
	// DefaultDnMin and DefaultDnMax. Points outside are excluded and reported.
	DnMin, DnMax float64
}

// check validates the fields of a that every analysis needs.
func (a Analysis) check(ctx string) error {
	if err := checkWafer(ctx, a.Wafer, a.W); err != nil {
		return fmt.Errorf("%w (Analysis.Wafer, Analysis.W)", err)
	}
	lo, hi := a.dnRange()
	if !(lo > 0 && hi > lo && hi <= recomb.MaxExcess) {
		return fmt.Errorf("lifetime: %s: need 0 < Analysis.DnMin < Analysis.DnMax <= %g cm^-3, got %g, %g", ctx, recomb.MaxExcess, a.DnMin, a.DnMax)
	}
	if a.Optics != (Optics{}) {
		if err := a.Optics.check(ctx); err != nil {
			return err
		}
	}
	return nil
}

// dnRange returns the accepted Δn range with defaults applied.
func (a Analysis) dnRange() (lo, hi float64) {
	lo, hi = a.DnMin, a.DnMax
	if lo == 0 {
		lo = DefaultDnMin
	}
	if hi == 0 {
		hi = DefaultDnMax
	}
	return lo, hi
}

// Exclusion counts the points an analysis left out for one reason.
type Exclusion struct {
	Reason string // why, e.g. "photoconductance <= 0"
	Count  int    // number of points
	First  int    // index in the trace or table of the first of them
	Line   int    // file line of that point (0 if the data did not come from a file)
}

// String returns e.g. "12 point(s) from line 40: photoconductance <= 0".
func (e Exclusion) String() string {
	where := fmt.Sprintf("index %d", e.First)
	if e.Line > 0 {
		where = fmt.Sprintf("line %d", e.Line)
	}
	return fmt.Sprintf("%d point(s) from %s: %s", e.Count, where, e.Reason)
}

// Reasons for excluding points.
const (
	reasonNonPositive = "photoconductance <= 0"
	reasonBelow       = "Δn below Analysis.DnMin"
	reasonAbove       = "Δn above Analysis.DnMax"
	reasonDark        = "no illumination (the QSS analysis needs G > 0)"
	reasonLit         = "illuminated (the transient analysis needs the light off)"
	reasonRising      = "Δn not decaying (dΔn/dt >= 0)"
	reasonDenominator = "G − dΔn/dt below MinNetGeneration·G (ill-conditioned, e.g. the rising edge of a flash)"
)

// MinNetGeneration is the smallest net generation G − dΔn/dt, as a fraction of G, at which the
// generalised analysis keeps a point: below it τeff is the small difference of two large terms
// and any error of the derivative is amplified more than tenfold (the rising edge of a flash;
// our choice, no source). Points in the dark (G = 0) need dΔn/dt < 0.
const MinNetGeneration = 0.1

// excluder collects exclusions by reason, in the order they first occur.
type excluder struct {
	list  []Exclusion
	lines []int
}

func (e *excluder) add(i int, reason string) {
	for k := range e.list {
		if e.list[k].Reason == reason {
			e.list[k].Count++
			return
		}
	}
	line := 0
	if i < len(e.lines) {
		line = e.lines[i]
	}
	e.list = append(e.list, Exclusion{Reason: reason, Count: 1, First: i, Line: line})
}

// count returns the number of points excluded for the given reasons.
func (e *excluder) count(reasons ...string) int {
	n := 0
	for _, x := range e.list {
		for _, r := range reasons {
			if x.Reason == r {
				n += x.Count
			}
		}
	}
	return n
}

// WarningKind classifies a Warning.
type WarningKind uint8

const (
	// RisingAtLowInjection: the apparent lifetime (less the intrinsic part) rises steeply
	// towards low injection, the signature of minority-carrier trapping or of depletion-region
	// modulation, which inflate photoconductance there.
	RisingAtLowInjection WarningKind = iota + 1
	// OutsideRange: points with Δn outside the analysis range were excluded.
	OutsideRange
	// FewFitPoints: a fitting window holds fewer than MinFitPoints points.
	FewFitPoints
	// WindowNotCovered: the data do not cover the whole fitting window.
	WindowNotCovered
	// NonUniformInjection: the surfaces are so recombinative that the J0s fit's correction for
	// the Δn profile across the wafer is large (StrongCorrection) or fails for some points.
	NonUniformInjection
	// NegativeIntercept: the J0s fit's intercept (bulk SRH) is significantly below zero.
	NegativeIntercept
	// AboveIntrinsicLimit: τeff exceeds the intrinsic lifetime (Analysis.Intrinsic) at some
	// points, which no sample can: the thickness, doping or optics of the analysis are wrong,
	// or an artefact inflates the photoconductance.
	AboveIntrinsicLimit
	// CoarseSampling: the trace is sampled too coarsely for the adaptive smoothing window at
	// some retained points (fewer than 1.5/SmoothingFraction samples per local time scale).
	CoarseSampling
)

// Warning is a caveat about a result that the user must see; analyses return warnings as
// data and never print them.
type Warning struct {
	Kind    WarningKind // what kind of caveat, for callers that branch on it
	Message string      // a sentence saying what was found, where, and what it may mean
}

// String returns the message.
func (w Warning) String() string { return w.Message }

// RisingSlope is the slope below which Analyze and AnalyzeTable warn of a lifetime rising
// towards low injection (RisingAtLowInjection): −0.5, for the slope d ln(τext x)/d ln Δn over
// the lowest decade of the data, with τext the extrinsic lifetime (1/τeff less the intrinsic
// rate) and x = (n p − ni,eff²)/(q ni,eff² Δn W) the abscissa of the J0s fit. A surface of
// constant J0s keeps τext x constant; trapping and depletion-region modulation make the
// apparent τ ∝ 1/Δn at low injection, a slope of −1, while Shockley–Read–Hall centres change
// it more gently (our choice, no source).
const RisingSlope = -0.5

// Result is the analysed measurement: one entry per retained point, in the order of the
// trace or table, plus the points excluded and the warnings. Its methods derive J0s, Seff,
// iVoc at a given intensity and the implied J–V curve. A Result from Analyze or AnalyzeTable
// is immutable; the zero Result's methods return an error.
type Result struct {
	Mode     Mode        // the analysis (0 for a table)
	Time     []float64   // time of each point, s (nil for a table)
	Dn       []float64   // excess carrier density, cm^-3
	TauEff   []float64   // effective lifetime, s
	IVoc     []float64   // implied open-circuit voltage, V
	Suns     []float64   // implied suns: the recombination rate Δn/τeff over the one-sun generation (nil without Optics)
	Index    []int       // index of each point in the trace or table
	Excluded []Exclusion // points left out, by reason
	Warnings []Warning   // caveats about the whole result

	a   Analysis
	tab *waferTable
	x   []float64 // ln Δn of each point
}

// Analyze analyses the photoconductance trace tr with the analysis a:
//
//  1. Δn of every point from its photoconductance, Δσ W = q (μn + μp)(Δn) Δn W,
//     self-consistently with the injection-dependent mobility sum (as ExcessFromConductance;
//     through a table of the wafer accurate to 1e-7);
//  2. dΔn/dt by the smoothing derivative (local least-squares parabola over 2k+1 points, k
//     adapted to the local time scale or fixed by a.HalfWidth; see SmoothingFraction) for
//     Transient and Generalised;
//  3. G = illumination · flux · a.Optics.Absorbed / W and τeff by a.Mode (Nagel, Berge and
//     Aberle 1999);
//  4. iVoc (recomb.State.ImpliedVoc) and the implied suns of every retained point.
//
// Points are excluded, and counted by reason in Result.Excluded, where Δσ <= 0, where Δn lies
// outside [a.DnMin, a.DnMax], and where the mode's formula does not apply (no light in QSS,
// light on or Δn rising in Transient, G − dΔn/dt below MinNetGeneration·G in Generalised);
// excluded points still serve as neighbours of the smoothing (with Δn = Δσ/(q W (μn + μp))
// at the mobility of the nearest end of the table where Δσ <= 0 or Δn is out of range).
// Result.Warnings reports points outside the range, τeff above the intrinsic limit, a
// lifetime rising towards low injection (RisingSlope) and coarse sampling (CoarseSampling).
//
// It returns an error naming the field or point for an invalid a or tr: a trace shorter than
// MinTracePoints or than the smoothing window, lengths that differ, times that are not finite
// or do not increase, non-finite photoconductance, illumination that is negative or not
// finite, no illumination for QSS or Generalised (or zero illumination everywhere for QSS),
// or no point left.
func (a Analysis) Analyze(tr Trace) (*Result, error) {
	const ctx = "Analysis.Analyze"
	if err := a.check(ctx); err != nil {
		return nil, err
	}
	if a.Mode < QSS || a.Mode > Generalised {
		return nil, fmt.Errorf("lifetime: %s: Analysis.Mode must be QSS, Transient or Generalised, got %v", ctx, a.Mode)
	}
	n := len(tr.Time)
	if err := checkTrace(ctx, tr, a.Mode); err != nil {
		return nil, err
	}
	if k := a.HalfWidth; k != 0 && (k < 2 || 2*k+1 > n) {
		return nil, fmt.Errorf("lifetime: %s: smoothing half-width Analysis.HalfWidth = %d needs k >= 2 and 2k+1 <= %d points (or 0 for the adaptive window)", ctx, k, n)
	}
	light := a.Mode != Transient
	if light {
		if err := a.Optics.check(ctx); err != nil {
			return nil, fmt.Errorf("%w (the %v analysis needs the generation rate)", err, a.Mode)
		}
	}

	tab, err := a.traceTable(tr.Conductance)
	if err != nil {
		return nil, fmt.Errorf("lifetime: %s: %w", ctx, err)
	}
	ex := excluder{lines: tr.Lines}
	qw := silicon.ElementaryCharge * a.W
	mu0 := math.Exp(tab.at(colY, tab.xMin) - tab.xMin) // μn + μp at the ends of the table
	mu1 := math.Exp(tab.at(colY, tab.xMax) - tab.xMax)
	dn := make([]float64, n)
	x := make([]float64, n) // ln Δn where Δn > 0
	// Why each point is excluded before the lifetime (0: retained so far).
	const (
		keep uint8 = iota
		nonPositive
		below
		above
	)
	why := [...]string{nonPositive: reasonNonPositive, below: reasonBelow, above: reasonAbove}
	state := make([]uint8, n)
	for i, sigma := range tr.Conductance {
		y := math.Log(sigma / qw)
		switch {
		case !(sigma > 0):
			dn[i], state[i] = sigma/(qw*mu0), nonPositive
		case y < tab.yMin-tableTol:
			dn[i], state[i] = sigma/(qw*mu0), below
			x[i] = y - math.Log(mu0)
		case y > tab.yMax+tableTol:
			dn[i], state[i] = sigma/(qw*mu1), above
			x[i] = y - math.Log(mu1)
		default:
			x[i] = tab.excess(y)
			dn[i] = math.Exp(x[i])
		}
	}
	perPhoton := a.Optics.Absorbed / a.W // generation rate per incident photon flux, cm^-1
	if tr.Unit == Suns {
		perPhoton *= a.Optics.FluxPerSun
	}
	var gen []float64 // generation rate, cm^-3 s^-1 (nil without light)
	if light {
		gen = make([]float64, n)
		for i, l := range tr.Illumination {
			gen[i] = l * perPhoton
		}
	}
	var deriv []float64
	var coarse []bool
	if a.Mode != QSS {
		deriv = make([]float64, n)
		coarse = smoothDerivative(tr.Time, dn, x, gen, a.HalfWidth, deriv)
	}
	var nCoarse int
	cmin, cmax := math.Inf(1), 0.0
	r := &Result{Mode: a.Mode, a: a, tab: tab, Time: make([]float64, 0, n), Index: make([]int, 0, n),
		Dn: make([]float64, 0, n), x: make([]float64, 0, n), TauEff: make([]float64, 0, n)}
	for i := range n {
		if state[i] != keep {
			ex.add(i, why[state[i]])
			continue
		}
		var g float64
		if gen != nil {
			g = gen[i]
		}
		var tau float64
		switch a.Mode {
		case QSS:
			if !(g > 0) {
				ex.add(i, reasonDark)
				continue
			}
			tau = dn[i] / g
		case Transient:
			if tr.Illumination != nil && tr.Illumination[i] > 0 {
				ex.add(i, reasonLit)
				continue
			}
			if !(deriv[i] < 0) {
				ex.add(i, reasonRising)
				continue
			}
			tau = -dn[i] / deriv[i]
		case Generalised:
			den := g - deriv[i]
			if !(den > 0) || den < MinNetGeneration*g {
				ex.add(i, reasonDenominator)
				continue
			}
			tau = dn[i] / den
		}
		if coarse != nil && coarse[i] {
			nCoarse++
			cmin, cmax = math.Min(cmin, dn[i]), math.Max(cmax, dn[i])
		}
		r.Time = append(r.Time, tr.Time[i])
		r.Index = append(r.Index, i)
		r.Dn = append(r.Dn, dn[i])
		r.x = append(r.x, x[i])
		r.TauEff = append(r.TauEff, tau)
	}
	if err := r.finish(ctx, &ex); err != nil {
		return nil, err
	}
	if nCoarse > 0 {
		r.Warnings = append(r.Warnings, Warning{Kind: CoarseSampling, Message: fmt.Sprintf(
			"%d point(s) with Δn from %.3g to %.3g cm^-3 have fewer than %.0f samples per local time scale Δn/|dΔn/dt|: the smoothing window is wider than %g of it there and τeff may be biased; record the trace with a finer time step",
			nCoarse, cmin, cmax, 1.5/SmoothingFraction, SmoothingFraction)})
	}
	return r, nil
}

// checkTrace validates tr for an analysis in mode m.
func checkTrace(ctx string, tr Trace, m Mode) error {
	n := len(tr.Time)
	if n < MinTracePoints {
		return fmt.Errorf("lifetime: %s: trace has %d points, need at least %d", ctx, n, MinTracePoints)
	}
	if len(tr.Conductance) != n || (tr.Illumination != nil && len(tr.Illumination) != n) {
		return fmt.Errorf("lifetime: %s: trace has %d times, %d photoconductances and %d illuminations", ctx, n, len(tr.Conductance), len(tr.Illumination))
	}
	at := func(i int) string {
		if i < len(tr.Lines) {
			return fmt.Sprintf("point %d (line %d)", i, tr.Lines[i])
		}
		return fmt.Sprintf("point %d", i)
	}
	lit := false
	for i := range n {
		// Check without formatting; build the message only for a bad point.
		t, c := tr.Time[i], tr.Conductance[i]
		if math.IsNaN(t) || math.IsInf(t, 0) {
			return fmt.Errorf("lifetime: %s: time at %s must be finite, got %g s", ctx, at(i), t)
		}
		if i > 0 && !(t > tr.Time[i-1]) {
			return fmt.Errorf("lifetime: %s: time must increase: %g s at %s after %g s", ctx, t, at(i), tr.Time[i-1])
		}
		if math.IsNaN(c) || math.IsInf(c, 0) {
			return fmt.Errorf("lifetime: %s: photoconductance at %s must be finite, got %g S", ctx, at(i), c)
		}
		if tr.Illumination != nil {
			l := tr.Illumination[i]
			if !(l >= 0) || math.IsInf(l, 0) {
				return fmt.Errorf("lifetime: %s: illumination at %s must be finite and >= 0, got %g", ctx, at(i), l)
			}
			lit = lit || l > 0
		}
	}
	if tr.Illumination != nil && tr.Unit != Suns && tr.Unit != PhotonFlux {
		return fmt.Errorf("lifetime: %s: Trace.Unit %v is neither Suns nor PhotonFlux", ctx, tr.Unit)
	}
	if m != Transient && tr.Illumination == nil {
		return fmt.Errorf("lifetime: %s: the %v analysis needs the trace's illumination column", ctx, m)
	}
	if m == QSS && !lit {
		return fmt.Errorf("lifetime: %s: illumination is zero at all %d points: the QSS analysis needs light (use Transient for a free decay)", ctx, n)
	}
	return nil
}

// traceTable tabulates the wafer over the Δn range of the photoconductances sigma, within the
// analysis range.
func (a Analysis) traceTable(sigma []float64) (*waferTable, error) {
	lo, hi := a.dnRange()
	smin, smax := math.Inf(1), 0.0
	for _, s := range sigma {
		if s > 0 {
			smin, smax = math.Min(smin, s), math.Max(smax, s)
		}
	}
	if smax == 0 {
		return nil, fmt.Errorf("no point with photoconductance > 0")
	}
	dmin, err := a.bound(smin, lo, hi)
	if err != nil {
		return nil, err
	}
	dmax, err := a.bound(smax, lo, hi)
	if err != nil {
		return nil, err
	}
	return a.table(dmin, dmax)
}

// bound returns Δn at photoconductance s clamped to [lo, hi].
func (a Analysis) bound(s, lo, hi float64) (float64, error) {
	g0, err := Conductance(a.Wafer, a.W, lo)
	if err != nil {
		return 0, err
	}
	g1, err := Conductance(a.Wafer, a.W, hi)
	if err != nil {
		return 0, err
	}
	switch {
	case s <= g0:
		return lo, nil
	case s >= g1:
		return hi, nil
	}
	return ExcessFromConductance(a.Wafer, a.W, s)
}

// table tabulates the wafer on [dmin, dmax] widened to at least 1 % around its centre.
func (a Analysis) table(dmin, dmax float64) (*waferTable, error) {
	lo, hi := a.dnRange()
	if dmax < 1.01*dmin {
		c := math.Sqrt(dmin * dmax)
		dmin, dmax = math.Max(c/1.005, lo), math.Min(c*1.005, hi)
		if dmax < 1.01*dmin { // at an end of the range
			dmin, dmax = math.Max(dmax/1.01, lo), math.Min(dmin*1.01, hi)
		}
	}
	return newWaferTable(a.Wafer, a.Intrinsic, dmin, dmax)
}

// AnalyzeTable analyses a processed τeff(Δn) table tb with the analysis a (a.Mode and
// a.HalfWidth are not used): it computes iVoc and, with a.Optics, the implied suns of every
// point, so that the Result's methods (J0s, Seff, ImpliedVoc, ImpliedJV) apply as for a trace.
// Points with Δn outside [a.DnMin, a.DnMax] are excluded and reported. It returns an error
// for an invalid a, an empty table, lengths that differ, a Δn or τeff that is not finite and
// > 0 (naming the point and line), or no point left.
func (a Analysis) AnalyzeTable(tb Table) (*Result, error) {
	const ctx = "Analysis.AnalyzeTable"
	if err := a.check(ctx); err != nil {
		return nil, err
	}
	n := len(tb.Dn)
	if n == 0 || len(tb.TauEff) != n {
		return nil, fmt.Errorf("lifetime: %s: table has %d Δn and %d τeff values, want the same number > 0", ctx, n, len(tb.TauEff))
	}
	lo, hi := a.dnRange()
	dmin, dmax := math.Inf(1), 0.0
	for i := range n {
		at := fmt.Sprintf(" at point %d", i)
		if i < len(tb.Lines) {
			at = fmt.Sprintf(" at point %d (line %d)", i, tb.Lines[i])
		}
		if err := check.Positive("lifetime: "+ctx, "Δn"+at, tb.Dn[i], "cm^-3"); err != nil {
			return nil, err
		}
		if err := check.Positive("lifetime: "+ctx, "τeff"+at, tb.TauEff[i], "s"); err != nil {
			return nil, err
		}
		if d := tb.Dn[i]; d >= lo && d <= hi {
			dmin, dmax = math.Min(dmin, d), math.Max(dmax, d)
		}
	}
	ex := excluder{lines: tb.Lines}
	r := &Result{a: a}
	for i, d := range tb.Dn {
		switch {
		case d < lo:
			ex.add(i, reasonBelow)
		case d > hi:
			ex.add(i, reasonAbove)
		default:
			r.Index = append(r.Index, i)
			r.Dn = append(r.Dn, d)
			r.x = append(r.x, math.Log(d))
			r.TauEff = append(r.TauEff, tb.TauEff[i])
		}
	}
	if len(r.Dn) > 0 {
		tab, err := a.table(dmin, dmax)
		if err != nil {
			return nil, fmt.Errorf("lifetime: %s: %w", ctx, err)
		}
		r.tab = tab
	}
	if err := r.finish(ctx, &ex); err != nil {
		return nil, err
	}
	return r, nil
}

// finish computes iVoc and suns of the retained points and the warnings.
func (r *Result) finish(ctx string, ex *excluder) error {
	r.Excluded = ex.list
	if len(r.Dn) == 0 {
		return fmt.Errorf("lifetime: %s: no point left after the exclusions: %v", ctx, r.Excluded)
	}
	r.IVoc = make([]float64, len(r.Dn))
	for i, x := range r.x {
		r.IVoc[i] = math.Exp(r.tab.at(colVoc, x))
	}
	if o := r.a.Optics; o != (Optics{}) {
		g1 := o.FluxPerSun * o.Absorbed / r.a.W // one-sun generation, cm^-3 s^-1
		r.Suns = make([]float64, len(r.Dn))
		for i := range r.Dn {
			r.Suns[i] = r.Dn[i] / r.TauEff[i] / g1
		}
	}
	if c := ex.count(reasonBelow, reasonAbove); c > 0 {
		lo, hi := r.a.dnRange()
		r.Warnings = append(r.Warnings, Warning{Kind: OutsideRange, Message: fmt.Sprintf(
			"%d point(s) with Δn outside the analysis range [%g, %g] cm^-3 were excluded (Analysis.DnMin, DnMax)", c, lo, hi)})
	}
	if r.tab.intrinsic {
		var n int
		lo, hi := math.Inf(1), 0.0
		for i, x := range r.x {
			if -math.Log(r.TauEff[i]) < r.tab.at(colIntr, x) { // 1/τeff below the intrinsic rate
				n++
				lo, hi = math.Min(lo, r.Dn[i]), math.Max(hi, r.Dn[i])
			}
		}
		if n > 0 {
			r.Warnings = append(r.Warnings, Warning{Kind: AboveIntrinsicLimit, Message: fmt.Sprintf(
				"%d point(s) with Δn from %.3g to %.3g cm^-3 have τeff above the intrinsic lifetime, which no sample can: check the thickness, doping and optics of the analysis, or look for trapping",
				n, lo, hi)})
		}
	}
	if w, ok := r.risingCheck(); ok {
		r.Warnings = append(r.Warnings, w)
	}
	return nil
}

// risingCheck fits ln(τext x) against ln Δn over the lowest decade of the data (see
// RisingSlope) and returns a warning if the slope is below RisingSlope.
func (r *Result) risingCheck() (Warning, bool) {
	lo := math.Inf(1)
	for _, d := range r.Dn {
		lo = math.Min(lo, d)
	}
	var xs, ys []float64
	for i, d := range r.Dn {
		if d > 10*lo {
			continue
		}
		rate := 1 / r.TauEff[i]
		if r.tab.intrinsic {
			rate -= math.Exp(r.tab.at(colIntr, r.x[i]))
		}
		if rate > 0 {
			xs, ys = append(xs, r.x[i]), append(ys, r.tab.at(colKS, r.x[i])-math.Log(rate))
		}
	}
	if len(xs) < MinFitPoints || floats.Max(xs)-floats.Min(xs) < 0.5*math.Ln10 {
		return Warning{}, false
	}
	_, slope := stat.LinearRegression(xs, ys, nil, false)
	if !(slope < RisingSlope) {
		return Warning{}, false
	}
	return Warning{Kind: RisingAtLowInjection, Message: fmt.Sprintf(
		"the lifetime rises towards low injection faster than a constant J0s or a Shockley–Read–Hall centre would make it (slope %.2f of ln(τ (N + Δn)) against ln Δn, Δn from %.3g to %.3g cm^-3): minority-carrier trapping or depletion-region modulation may inflate the photoconductance there; leave that range out of fits",
		slope, lo, 10*lo)}, true
}

// ready returns an error for a Result that did not come from Analyze or AnalyzeTable.
func (r *Result) ready(ctx string) error {
	if r == nil || r.tab == nil || len(r.Dn) == 0 {
		return fmt.Errorf("lifetime: %s: the Result is empty (make it with Analysis.Analyze or AnalyzeTable)", ctx)
	}
	return nil
}

// localLine returns the value at x0 of the least-squares straight line through the points
// (xs[i], ys[i]) with |xs[i] − x0| <= hw, which must number at least three and lie on both
// sides of x0 (or at it).
func localLine(xs, ys []float64, x0, hw float64) (float64, error) {
	var sx, sy []float64
	below, above := false, false
	for i, x := range xs {
		if math.Abs(x-x0) <= hw {
			sx, sy = append(sx, x-x0), append(sy, ys[i])
			below, above = below || x <= x0, above || x >= x0
		}
	}
	if len(sx) < 3 || !below || !above {
		return 0, fmt.Errorf("%d point(s) within the window (at least 3 needed, on both sides)", len(sx))
	}
	alpha, _ := stat.LinearRegression(sx, sy, nil, false)
	return alpha, nil
}

// LifetimeAt returns the effective lifetime in s at excess carrier density dn in cm^-3 (finite,
// > 0), from the least-squares line of ln τeff against ln Δn through the points within
// ±LocalWindow decade of dn (at least three, on both sides): a noise-tolerant reading of the
// curve at a reporting level such as 1e15 cm^-3. It returns an error if the data do not cover dn.
func (r *Result) LifetimeAt(dn float64) (float64, error) {
	if err := r.ready("Result.LifetimeAt"); err != nil {
		return 0, err
	}
	if err := check.Positive("lifetime: Result.LifetimeAt", "excess carrier density dn", dn, "cm^-3"); err != nil {
		return 0, err
	}
	ys := make([]float64, len(r.TauEff))
	for i, t := range r.TauEff {
		ys[i] = math.Log(t)
	}
	v, err := localLine(r.x, ys, math.Log(dn), LocalWindow*math.Ln10)
	if err != nil {
		return 0, fmt.Errorf("lifetime: Result.LifetimeAt(%g cm^-3): the data do not cover it: %w", dn, err)
	}
	return math.Exp(v), nil
}

// ImpliedVoc returns the implied open-circuit voltage in V at a light intensity of suns suns
// (finite, > 0), from the least-squares line of iVoc against ln(suns) through the points
// whose implied suns lie within ±LocalWindow decade of it (at least three, on both sides;
// iVoc is close to linear in ln suns). It returns an error without Optics or if the data do
// not cover suns.
func (r *Result) ImpliedVoc(suns float64) (float64, error) {
	if err := r.ready("Result.ImpliedVoc"); err != nil {
		return 0, err
	}
	if err := check.Positive("lifetime: Result.ImpliedVoc", "light intensity suns", suns, "suns"); err != nil {
		return 0, err
	}
	if r.Suns == nil {
		return 0, fmt.Errorf("lifetime: Result.ImpliedVoc: the analysis had no Optics, so the data carry no suns")
	}
	xs := make([]float64, len(r.Suns))
	for i, s := range r.Suns {
		xs[i] = math.Log(s)
	}
	v, err := localLine(xs, r.IVoc, math.Log(suns), LocalWindow*math.Ln10)
	if err != nil {
		lo, hi := math.Exp(floats.Min(xs)), math.Exp(floats.Max(xs))
		return 0, fmt.Errorf("lifetime: Result.ImpliedVoc(%g suns): the data (%.3g to %.3g suns) do not cover it: %w", suns, lo, hi, err)
	}
	return v, nil
}

// ImpliedJV returns the implied J–V curve at one sun of the measured sample: at each point,
// V = iVoc and J = Jph (1 − suns), with Jph = a.Optics.Photocurrent() and suns the implied
// suns (the recombination current q W Δn/τeff over Jph; by superposition, as in
// Sample.ImpliedJV), sorted by V; Voc is ImpliedVoc(1). It returns an error without Optics
// or if the data do not reach one sun.
func (r *Result) ImpliedJV() (JV, error) {
	if err := r.ready("Result.ImpliedJV"); err != nil {
		return JV{}, err
	}
	if r.Suns == nil {
		return JV{}, fmt.Errorf("lifetime: Result.ImpliedJV: the analysis had no Optics, so the data carry no suns")
	}
	jph, err := r.a.Optics.Photocurrent()
	if err != nil {
		return JV{}, err
	}
	voc, err := r.ImpliedVoc(1)
	if err != nil {
		return JV{}, fmt.Errorf("lifetime: Result.ImpliedJV: %w", err)
	}
	idx := make([]int, len(r.IVoc))
	for i := range idx {
		idx[i] = i
	}
	sort.SliceStable(idx, func(a, b int) bool { return r.IVoc[idx[a]] < r.IVoc[idx[b]] })
	c := JV{V: make([]float64, len(idx)), J: make([]float64, len(idx)), Jsc: jph, Voc: voc}
	for k, i := range idx {
		c.V[k], c.J[k] = r.IVoc[i], jph*(1-r.Suns[i])
	}
	return c, nil
}
