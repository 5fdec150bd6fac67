package lifetime

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/stat"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/internal/roots"
)

// JV is an implied current–voltage curve at one sun: the photogenerated current less the
// recombination current at each implied voltage, in the generator convention (J > 0 between
// short and open circuit). Sample.ImpliedJV and Result.ImpliedJV build one.
type JV struct {
	V   []float64 // implied voltage (quasi-Fermi-level separation), V
	J   []float64 // current density, A/cm^2
	Jsc float64   // short-circuit current density, the one-sun photocurrent, A/cm^2
	Voc float64   // implied open-circuit voltage at one sun, V
}

// MaxPower is the maximum power point of a JV curve and its fill factor.
type MaxPower struct {
	V  float64 // voltage at the maximum power point, V
	J  float64 // current density there, A/cm^2
	P  float64 // maximum power density V·J, W/cm^2
	FF float64 // fill factor P/(Jsc·Voc), dimensionless
}

// MPPWindow is the half-width in V of the voltage window of JV.MaxPower: the points within
// ±30 mV of the largest sampled power enter the local diode fit (our choice, no source; about
// ±1.2 kT/q at 300 K, over which the local ideality factor of a silicon sample hardly changes).
const MPPWindow = 0.03

// MaxPower returns the maximum power point of c and the implied fill factor
// FF = Pmax/(Jsc Voc). Around the largest sampled power V·J, the recombination current
// Jsc − J of the points within ±MPPWindow is fitted by a local diode law
// Jsc − J = exp(a + b V) (least squares in ln(Jsc − J), gonum/stat), and the maximum of
// V (Jsc − exp(a + b V)), where Jsc = exp(a + b V)(1 + b V), is solved by Brent's method. The
// fit is exact for a recombination current exponential in V (any ideality factor; the ideal
// diode's J0 (exp(qV/kT) − 1) is one to within exp(−qVmpp/kT)) and, being a fit, tolerates
// noise; where the local ideality changes across the window the error is of second order. The points
// need not be sorted. It returns an error for fewer than three points, lengths that differ,
// non-finite values, Jsc or Voc not finite and > 0, no positive power, fewer than three points
// with J < Jsc in the window or none on one side of the largest power (the curve does not
// reach past the maximum power point), or a window whose fit has no maximum inside it.
func (c JV) MaxPower() (MaxPower, error) {
	const ctx = "lifetime: JV.MaxPower"
	n := len(c.V)
	if n < 3 || len(c.J) != n {
		return MaxPower{}, fmt.Errorf("%s: need at least 3 (V, J) points of equal number, got %d V and %d J", ctx, n, len(c.J))
	}
	if err := check.Positive(ctx, "JV.Jsc", c.Jsc, "A/cm^2"); err != nil {
		return MaxPower{}, err
	}
	if err := check.Positive(ctx, "JV.Voc", c.Voc, "V"); err != nil {
		return MaxPower{}, err
	}
	m, pm := -1, 0.0
	for i := range n {
		if math.IsNaN(c.V[i]) || math.IsInf(c.V[i], 0) || math.IsNaN(c.J[i]) || math.IsInf(c.J[i], 0) {
			return MaxPower{}, fmt.Errorf("%s: point %d (V = %g V, J = %g A/cm^2) is not finite", ctx, i, c.V[i], c.J[i])
		}
		if p := c.V[i] * c.J[i]; p > pm {
			m, pm = i, p
		}
	}
	if m < 0 {
		return MaxPower{}, fmt.Errorf("%s: no point with positive power V·J", ctx)
	}
	vm := c.V[m]
	var xs, ys []float64
	below, above := 0, 0
	lo, hi := vm, vm
	for i := range n {
		v, jr := c.V[i], c.Jsc-c.J[i]
		if math.Abs(v-vm) > MPPWindow || !(jr > 0) {
			continue
		}
		xs, ys = append(xs, v), append(ys, math.Log(jr))
		lo, hi = math.Min(lo, v), math.Max(hi, v)
		switch {
		case v < vm:
			below++
		case v > vm:
			above++
		}
	}
	if len(xs) < 3 || below == 0 || above == 0 {
		return MaxPower{}, fmt.Errorf("%s: the largest power, %g W/cm^2 at %g V (point %d), has %d point(s) below and %d above it within ±%g V: the curve does not bracket the maximum power point",
			ctx, pm, vm, m, below, above, MPPWindow)
	}
	a, b := stat.LinearRegression(xs, ys, nil, false)
	if !(b > 0) {
		return MaxPower{}, fmt.Errorf("%s: the recombination current does not rise with V near %g V", ctx, vm)
	}
	// f(V) = exp(a + b V)(1 + b V) − Jsc rises with V for b V > −1.
	f := func(v float64) (float64, error) { return math.Exp(a+b*v)*(1+b*v) - c.Jsc, nil }
	flo, _ := f(lo)
	fhi, _ := f(hi)
	v, err := roots.Solve(f, lo, hi, flo, fhi, 1e-12, 200)
	if err != nil {
		return MaxPower{}, fmt.Errorf("%s: the local diode fit has no maximum power point within %g–%g V: %w", ctx, lo, hi, err)
	}
	j := c.Jsc - math.Exp(a+b*v)
	return MaxPower{V: v, J: j, P: v * j, FF: v * j / (c.Jsc * c.Voc)}, nil
}
