package spectroscopy

import (
	"fmt"
	"math"
	"sort"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// MinPoints is the fewest points a curve must keep (after the subtraction of Curve.Subtract),
// with at least MinPoints − 1 distinct injection levels: a single level has three parameters
// per curve (Et, k, τn0), so fewer points leave no residual to judge the fit by (our choice;
// common practice, no source).
const MinPoints = 5

// MaxSubtractedShare is the largest share of the recombination 1/τ at a point that the
// subtraction of Curve.Subtract may remove: where 1/τsub > MaxSubtractedShare · 1/τ the
// difference 1/τ − 1/τsub amplifies the relative error of τ more than twofold, and the point
// is left out (and reported). Our choice (common practice, no source).
const MaxSubtractedShare = 0.5

// NoiseFloor is the smallest relative scatter of lifetimes (standard deviation of ln τ) that
// the statistics assume, 0.1 %: no lifetime measurement is more precise, so confidence
// intervals, the branch test and the misfit tests never claim more than such data would
// support, and noise-free synthetic curves are not judged by their rounding errors (our
// choice; common practice, no source).
const NoiseFloor = 1e-3

// Curve is one measured lifetime curve τ(Δn) of one wafer, the input of Fit,
// SolutionSurface and Linearise. Tau is the Shockley–Read–Hall lifetime of the defect
// sought; if it still contains other known recombination (intrinsic, say), Subtract names it
// and the analysis removes it. The slices are read, never kept or changed.
type Curve struct {
	// Bulk is the wafer: material (temperature, model set) and dopants, from recomb.NewBulk.
	Bulk *recomb.Bulk
	// Dn are the excess carrier densities Δn, cm^-3, each finite, > 0 and at most
	// recomb.MaxExcess, in any order.
	Dn []float64
	// Tau are the lifetimes at Dn, s, each finite and > 0.
	Tau []float64
	// Subtract, if not nil, is recombination included in Tau that is removed before the
	// analysis, τSRH = 1/(1/τ − 1/τsub) with τsub its lifetime in Bulk at Δn (for example
	// recomb.NewIntrinsic()). Points where it is more than MaxSubtractedShare of 1/τ are left
	// out and reported (Result.Samples[i].Excluded, Line.Excluded).
	Subtract recomb.Mechanism
}

// curve is a Curve checked and prepared for the fits: its points sorted by Δn, the states of
// its Bulk there and the logarithm of τSRH.
type curve struct {
	states   []recomb.State // quasi-neutral states at the kept points, by increasing Δn
	g        []float64      // Δn/(n p − ni,eff²) at the states, cm^3
	y        []float64      // ln τSRH at the kept points
	tau      []float64      // τSRH, s
	excluded []int          // input indices left out by the subtraction
	ratio    float64        // vth,n/vth,p at the curve's temperature
	ve       float64        // vth,n, cm/s
	eiv, eg  float64        // Ei − Ev and Ec − Ev of the statistics, eV (as recomb.Level)
	vt       float64        // kT/q, V
	bulk     *recomb.Bulk
}

// bandEdges returns Ei − Ev and Ec − Ev in eV of material m's statistics, the edges against
// which recomb.Level places a level: Ei − Ev = kT ln(Nv/ni), Ec − Ei = kT ln(Nc/ni).
func bandEdges(m *silicon.Material) (eiv, eg float64, err error) {
	if m == nil || !(m.Vt() > 0) {
		return 0, 0, fmt.Errorf("spectroscopy: the material is nil or a zero value; make one with silicon.ModelSet.At")
	}
	eiv = m.Vt() * math.Log(m.Nv()/m.Ni())
	eg = eiv + m.Vt()*math.Log(m.Nc()/m.Ni())
	return eiv, eg, nil
}

// prepare checks curve c (number i of the input, for messages) and returns it prepared,
// with the thermal velocities vth at its temperature.
func prepare(c Curve, i int, vth silicon.ThermalVelocity) (*curve, error) {
	ctx := fmt.Sprintf("spectroscopy: curve %d", i)
	if c.Bulk == nil || c.Bulk.Material() == nil {
		return nil, fmt.Errorf("%s: Bulk is nil or a zero value (build it with recomb.NewBulk)", ctx)
	}
	if len(c.Dn) != len(c.Tau) {
		return nil, fmt.Errorf("%s: %d densities Dn but %d lifetimes Tau", ctx, len(c.Dn), len(c.Tau))
	}
	if len(c.Dn) < MinPoints {
		return nil, fmt.Errorf("%s: %d points; a single-level fit needs at least %d", ctx, len(c.Dn), MinPoints)
	}
	m := c.Bulk.Material()
	eiv, eg, err := bandEdges(m)
	if err != nil {
		return nil, err
	}
	ve, vh, err := vth.At(m.T())
	if err != nil {
		return nil, fmt.Errorf("%s: %w", ctx, err)
	}
	order := make([]int, len(c.Dn))
	for k := range order {
		order[k] = k
	}
	for k, dn := range c.Dn {
		if err := check.Positive(ctx, fmt.Sprintf("Dn[%d]", k), dn, "cm^-3"); err != nil {
			return nil, err
		}
		if dn > recomb.MaxExcess {
			return nil, check.Range("spectroscopy", fmt.Sprintf("curve %d", i), fmt.Sprintf("Dn[%d]", k), "cm^-3", dn, 0, recomb.MaxExcess)
		}
		if err := check.Positive(ctx, fmt.Sprintf("Tau[%d]", k), c.Tau[k], "s"); err != nil {
			return nil, err
		}
	}
	sort.SliceStable(order, func(a, b int) bool { return c.Dn[order[a]] < c.Dn[order[b]] })
	p := &curve{ratio: ve / vh, ve: ve, eiv: eiv, eg: eg, vt: m.Vt(), bulk: c.Bulk}
	for _, k := range order {
		s, err := c.Bulk.State(c.Dn[k])
		if err != nil {
			return nil, fmt.Errorf("%s: point %d: %w", ctx, k, err)
		}
		tau := c.Tau[k]
		if c.Subtract != nil {
			tsub, err := recomb.Lifetime(c.Subtract, s)
			if err != nil {
				return nil, fmt.Errorf("%s: point %d: subtraction: %w", ctx, k, err)
			}
			share := tau / tsub // +Inf τsub (no recombination) gives 0
			if !(share <= MaxSubtractedShare) {
				p.excluded = append(p.excluded, k)
				continue
			}
			tau /= 1 - share
		}
		p.states = append(p.states, s)
		p.g = append(p.g, s.Dn/s.Excess)
		p.tau = append(p.tau, tau)
		p.y = append(p.y, math.Log(tau))
	}
	sort.Ints(p.excluded)
	if len(p.states) < MinPoints {
		return nil, fmt.Errorf("%s: %d of %d points left after subtracting %v (%d where it removes more than %g of 1/τ); a single-level fit needs at least %d",
			ctx, len(p.states), len(c.Dn), c.Subtract, len(p.excluded), MaxSubtractedShare, MinPoints)
	}
	distinct := 1
	for k := 1; k < len(p.states); k++ {
		if p.states[k].Dn != p.states[k-1].Dn {
			distinct++
		}
	}
	if distinct < MinPoints-1 {
		return nil, fmt.Errorf("%s: %d distinct injection levels; a single-level fit needs at least %d", ctx, distinct, MinPoints-1)
	}
	return p, nil
}

// span returns the range [lo, hi] of level energies E in eV, counted as ref says, that lie in
// the gap of c, and the intrinsic level Ei in the same coordinate.
func (c *curve) span(ref recomb.EnergyRef) (lo, hi, mid float64) {
	switch ref {
	case recomb.FromValence:
		return 0, c.eg, c.eiv
	case recomb.FromConduction:
		return 0, c.eg, c.eg - c.eiv
	}
	return -c.eiv, c.eg - c.eiv, 0
}

// units fills a[i] and b[i] with the lifetimes in s at state i of unit capture time
// constants: τ = τp0 a + τn0 b for any τn0, τp0, at the level of energy e in eV counted as
// ref says. The SRH lifetime of recomb.SRH,
//
//	τ = Δn (τp0 (n + n1) + τn0 (p + p1)) / (n p − ni,eff²),
//
// is linear in (τn0, τp0): a = (n + n1) Δn/(n p − ni,eff²), b = (p + p1) Δn/(n p − ni,eff²),
// with n1 = ni,eff exp((Et − Ei)/kT) and p1 = ni,eff²/n1 at each state, the relations of
// recomb.Level (which give the same n1, p1 for every reference); n1 and p1 cost one exp per
// level instead of one per point. TestUnitsMatchRecomb checks them against recomb.SRH.
func (c *curve) units(ref recomb.EnergyRef, e float64, a, b []float64) error {
	x, err := c.boltzmann(recomb.Level{E: e, Ref: ref})
	if err != nil {
		return err
	}
	for i, s := range c.states {
		n1, p1 := s.NiEff*x, s.NiEff/x
		a[i], b[i] = (s.N+n1)*c.g[i], (s.P+p1)*c.g[i]
		if !(a[i] > 0 && b[i] > 0) || math.IsInf(a[i]+b[i], 0) {
			return fmt.Errorf("spectroscopy: SRH lifetimes of unit time constants at %v, Δn = %g cm^-3 are not usable (%g, %g s)", recomb.Level{E: e, Ref: ref}, s.Dn, a[i], b[i])
		}
	}
	return nil
}

// boltzmann returns exp((Et − Ei)/kT) of level l at the curve's temperature, or an error for
// a level outside the gap.
func (c *curve) boltzmann(l recomb.Level) (float64, error) {
	var ei float64 // Et − Ei
	switch l.Ref {
	case recomb.FromValence:
		ei = l.E - c.eiv
	case recomb.FromConduction:
		ei = c.eg - l.E - c.eiv
	default:
		ei = l.E
	}
	if !(ei >= -c.eiv && ei <= c.eg-c.eiv) {
		return 0, check.Rangef("SRH", "defect level Et − Ev", ei+c.eiv, 0, c.eg,
			"spectroscopy: defect level %v lies outside the gap (Et − Ev = %g eV, Ec − Ev = %g eV)", l, ei+c.eiv, c.eg)
	}
	return math.Exp(ei / c.vt), nil
}

// rss returns the residual sum of squares of y_i − ln τn0 − ln(κ a_i + b_i) with ln τn0 at its
// least-squares value (the mean of y_i − ln(κ a_i + b_i)), and that ln τn0. Residuals are
// summed after a shift by the first one, so the sum keeps its precision for small scatter.
func rss(y, a, b []float64, kappa float64) (cost, lnTauN0 float64) {
	var s, s2, e0 float64
	for i := range y {
		e := y[i] - math.Log(kappa*a[i]+b[i])
		if i == 0 {
			e0 = e
		}
		d := e - e0
		s += d
		s2 += d * d
	}
	mean := s / float64(len(y))
	return math.Max(s2-s*mean, 0), e0 + mean
}

// ConvertLevel returns level l counted from reference ref (recomb.FromValence,
// FromConduction or FromIntrinsic), at the statistical band edges of material m that
// recomb.Level uses: Ec − Ev = kT ln(Nc Nv/ni²), Ei − Ev = kT ln(Nv/ni). For example the
// fitted level of a Result, counted from the intrinsic level, as a depth below Ec. It returns
// an error for a nil or zero m, a level whose Ref is not set or whose energy is not finite, an
// unknown ref, or a level outside the gap (errors.Is(err, pvrec.ErrOutOfRange)).
func ConvertLevel(l recomb.Level, m *silicon.Material, ref recomb.EnergyRef) (recomb.Level, error) {
	eiv, eg, err := bandEdges(m)
	if err != nil {
		return recomb.Level{}, err
	}
	if err := check.Finite("spectroscopy: ConvertLevel", "level energy E", l.E, "eV"); err != nil {
		return recomb.Level{}, err
	}
	var etv float64 // Et − Ev
	switch l.Ref {
	case recomb.FromValence:
		etv = l.E
	case recomb.FromConduction:
		etv = eg - l.E
	case recomb.FromIntrinsic:
		etv = eiv + l.E
	default:
		return recomb.Level{}, fmt.Errorf("spectroscopy: ConvertLevel: level %v: reference Ref not set (use recomb.AboveEv, BelowEc or FromEi)", l)
	}
	if !(etv >= 0 && etv <= eg) {
		return recomb.Level{}, check.Rangef("ConvertLevel", "defect level Et − Ev", etv, 0, eg,
			"spectroscopy: ConvertLevel: level %v lies outside the gap (Et − Ev = %g eV, Ec − Ev = %g eV)", l, etv, eg)
	}
	switch ref {
	case recomb.FromValence:
		return recomb.AboveEv(etv), nil
	case recomb.FromConduction:
		return recomb.BelowEc(eg - etv), nil
	case recomb.FromIntrinsic:
		return recomb.FromEi(etv - eiv), nil
	}
	return recomb.Level{}, fmt.Errorf("spectroscopy: ConvertLevel: unknown reference %d (use recomb.FromValence, FromConduction or FromIntrinsic)", ref)
}
