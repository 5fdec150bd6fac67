package spectroscopy

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/stat"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// Line is the linearised form of one SRH lifetime curve: τSRH against the ratio X of the
// minority to the majority carrier density, X = n/p in p-type and X = p/n in n-type
// silicon, which for a single level is a straight line (J. D. Murphy, K. Bothe, R. Krain,
// V. V. Voronkov and R. J. Falster, J. Appl. Phys. 111, 113709 (2012), for p-type; the
// n-type form follows by exchanging the carriers). From the SRH lifetime with the minority
// equilibrium density negligible (n0 ≪ p0 in p-type, p0 ≪ n0 in n-type) and ni,eff
// independent of injection (derived here),
//
//	p-type: τ = τn0 (1 + p1/p0) + τp0 n1/p0 + X [τp0 (1 − n1/p0) − τn0 p1/p0],
//	n-type: τ = τp0 (1 + n1/n0) + τn0 p1/n0 + X [τn0 (1 − p1/n0) − τp0 n1/n0],
//
// so the intercept is the low-injection lifetime, Intercept + Slope = τn0 + τp0 is the
// high-injection one (X → 1), and for a deep level (n1, p1 ≪ the majority density) the
// intercept and the slope are the two capture time constants themselves. For any other
// level, At gives the τn0, τp0 and k that reproduce the line.
type Line struct {
	PType bool      // the wafer is p-type (X = n/p); else n-type (X = p/n)
	X     []float64 // the carrier-density ratios of the points, dimensionless, increasing
	Tau   []float64 // τSRH at X (after Curve.Subtract), s
	// Intercept and Slope are those of the least-squares line τ = Intercept + Slope·X, with
	// weights 1/τ² (equal relative errors), in s; InterceptErr and SlopeErr their standard
	// errors, with the scatter taken as at least NoiseFloor.
	Intercept, Slope, InterceptErr, SlopeErr float64
	High                                     float64 // Intercept + Slope, the lifetime at X = 1 (τn0 + τp0), s
	// Deep says whether the line is that of a deep level: Intercept and Slope both > 0. Then
	// DeepTauN0, DeepTauP0 (s) are τn0 and τp0 of a deep level (in p-type τn0 = Intercept,
	// τp0 = Slope; in n-type the reverse) and DeepK = σn/σp = (τp0/τn0)(vth,p/vth,n); all
	// three are 0 when Deep is false.
	Deep                        bool
	DeepTauN0, DeepTauP0, DeepK float64
	RMS                         float64 // rms of the relative residuals (τ − line)/τ
	// DurbinWatson is that of the relative residuals in order of X (see Sample).
	DurbinWatson float64
	Flags        Flags    // PoorFit (the points do not lie on a line: not one level) and PointsExcluded
	Reasons      []string // one sentence per flag, and one if Deep is false
	Excluded     []int    // indices into the curve's Dn of the points left out by the subtraction
	c            *curve
}

// Linearise returns the linearised form of curve c (see Line), with the thermal velocities
// vth (the zero value means silicon.NewGreen1990ThermalVelocity()) to turn τp0/τn0 into k.
// It returns an error for a curve that Fit refuses, or for points whose X do not spread.
func Linearise(c Curve, vth silicon.ThermalVelocity) (Line, error) {
	if vth == (silicon.ThermalVelocity{}) {
		vth = silicon.NewGreen1990ThermalVelocity()
	}
	pc, err := prepare(c, 0, vth)
	if err != nil {
		return Line{}, err
	}
	n := len(pc.y)
	l := Line{PType: pc.states[0].PType(), X: make([]float64, n), Tau: append([]float64(nil), pc.tau...),
		Excluded: append([]int(nil), pc.excluded...), c: pc}
	w := make([]float64, n)
	for i, s := range pc.states {
		l.X[i] = ratioX(s)
		w[i] = 1 / (l.Tau[i] * l.Tau[i])
	}
	l.Intercept, l.Slope = stat.LinearRegression(l.X, l.Tau, w, false)
	var sw, swx float64
	for i := range w {
		sw += w[i]
		swx += w[i] * l.X[i]
	}
	xm := swx / sw
	var sxx float64
	rel := make([]float64, n)
	var rr float64
	for i, x := range l.X {
		sxx += w[i] * (x - xm) * (x - xm)
		rel[i] = (l.Tau[i] - l.Intercept - l.Slope*x) / l.Tau[i]
		rr += rel[i] * rel[i]
	}
	if !(sxx > 0) || math.IsInf(l.Intercept+l.Slope, 0) || math.IsNaN(l.Intercept+l.Slope) {
		return Line{}, fmt.Errorf("spectroscopy: Linearise: the carrier-density ratios X of the points do not spread (%g to %g): no line", l.X[0], l.X[n-1])
	}
	s2 := math.Max(rr/float64(n-2), NoiseFloor*NoiseFloor)
	l.SlopeErr = math.Sqrt(s2 / sxx)
	l.InterceptErr = math.Sqrt(s2 * (1/sw + xm*xm/sxx))
	l.High = l.Intercept + l.Slope
	l.RMS = math.Sqrt(rr / float64(n))
	l.DurbinWatson = durbinWatson(rel)
	for _, v := range [...]float64{l.Intercept, l.Slope, l.InterceptErr, l.SlopeErr} {
		if err := check.Result("spectroscopy: Linearise", "line coefficient", v, "s"); err != nil {
			return Line{}, err
		}
	}
	if len(l.Excluded) > 0 {
		l.Flags |= PointsExcluded
		l.Reasons = append(l.Reasons, fmt.Sprintf("the subtraction left out %d point(s)", len(l.Excluded)))
	}
	if l.DurbinWatson < dwThreshold && l.RMS > NoiseFloor {
		l.Flags |= PoorFit
		l.Reasons = append(l.Reasons, fmt.Sprintf("the points do not lie on a line (Durbin–Watson %.2f, rms %.3g): more than one level, or a level whose n1, p1 change with injection", l.DurbinWatson, l.RMS))
	}
	if l.Intercept > 0 && l.Slope > 0 {
		l.Deep = true
		l.DeepTauN0, l.DeepTauP0 = l.Intercept, l.Slope
		if !l.PType {
			l.DeepTauN0, l.DeepTauP0 = l.Slope, l.Intercept
		}
		l.DeepK = l.DeepTauP0 / l.DeepTauN0 / pc.ratio
	} else {
		l.Reasons = append(l.Reasons, fmt.Sprintf("intercept %.3g s and slope %.3g s are not both positive: not the line of a deep level", l.Intercept, l.Slope))
	}
	return l, nil
}

// At returns the SRH level lvl with the capture time constants τn0, τp0 (s) whose lifetime
// equals the line (its Intercept and Slope) at the first and the last point of the curve, and
// its k = σn/σp, so that
// sweeping lvl over the gap traces the solution curve k(Et) of the line (compare Locus).
// The lifetimes are those of recomb.SRH at the curve's states, so band-gap narrowing enters.
// It returns an error for a Line not made by Linearise or an invalid level, and a range error
// (errors.Is(err, pvrec.ErrOutOfRange)) where no positive τn0, τp0 reproduce the line: the
// line has no solution at that level.
func (l Line) At(lvl recomb.Level) (srh recomb.SRH, k float64, err error) {
	if l.c == nil {
		return recomb.SRH{}, 0, errors.New("spectroscopy: Line.At: the Line is not from Linearise")
	}
	if _, err := ConvertLevel(lvl, l.c.bulk.Material(), recomb.FromIntrinsic); err != nil {
		return recomb.SRH{}, 0, err
	}
	var a, b [2]float64
	ends := &curve{states: []recomb.State{l.c.states[0], l.c.states[len(l.c.states)-1]},
		g: []float64{l.c.g[0], l.c.g[len(l.c.g)-1]}, eiv: l.c.eiv, eg: l.c.eg, vt: l.c.vt}
	if err := ends.units(lvl.Ref, lvl.E, a[:], b[:]); err != nil {
		return recomb.SRH{}, 0, err
	}
	a0, a1, b0, b1 := a[0], a[1], b[0], b[1]
	t0 := l.Intercept + l.Slope*ratioX(ends.states[0])
	t1 := l.Intercept + l.Slope*ratioX(ends.states[1])
	det := a0*b1 - a1*b0
	noSolution := func(tn, tp float64) error {
		return check.Rangef("Line.At", "defect level", lvl.E, math.NaN(), math.NaN(),
			"spectroscopy: Line.At: no positive τn0, τp0 at %v reproduce the line (τn0 = %g s, τp0 = %g s)", lvl, tn, tp)
	}
	if !(math.Abs(det) > 1e-12*(math.Abs(a0*b1)+math.Abs(a1*b0))) {
		return recomb.SRH{}, 0, noSolution(math.NaN(), math.NaN())
	}
	tp := (t0*b1 - t1*b0) / det
	tn := (a0*t1 - a1*t0) / det
	if check.Positive("", "", tn, "") != nil || check.Positive("", "", tp, "") != nil {
		return recomb.SRH{}, 0, noSolution(tn, tp)
	}
	srh = recomb.SRH{Level: lvl, TauN0: tn, TauP0: tp}
	k = tp / tn / l.c.ratio
	if err := check.Result("spectroscopy: Line.At", "k", k, ""); err != nil {
		return recomb.SRH{}, 0, err
	}
	return srh, k, nil
}

// ratioX returns the minority-to-majority density ratio X of state s: n/p in p-type, p/n in
// n-type.
func ratioX(s recomb.State) float64 {
	if s.PType() {
		return s.N / s.P
	}
	return s.P / s.N
}
