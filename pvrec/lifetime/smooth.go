package lifetime

import "math"

// Smoothing of the time derivative. The transient and generalised analyses need dΔn/dt of a
// measured, noisy Δn(t). The package estimates it by local least squares: at each point a
// parabola is fitted to the 2k+1 nearest samples in index (the window is shifted, not
// shortened, at the ends of the trace, so that every fit has 2k+1 points) and its slope at the
// point is the derivative. For equally spaced samples and a centred window this is the
// Savitzky–Golay derivative filter (A. Savitzky and M. J. E. Golay, Anal. Chem. 36, 1627
// (1964)); the fit itself is defined for any spacing. The parabola is fitted to ln Δn, and
// dΔn/dt = Δn · d ln Δn/dt, wherever the window holds only Δn > 0 (to Δn itself where noise
// takes it to zero or below): ln Δn of a decay with constant lifetime is a straight line, so
// the fit in ln Δn has no bias there and a bias several times smaller than the fit in Δn
// where τeff changes with Δn.
//
// The window trades noise for bias. For white noise of standard deviation σ on the fitted
// values and equal steps Δt, the slope's noise is σ sqrt(3/(k(k+1)(2k+1)))/Δt; its bias, for
// a decay with local time scale τc = Δn/|dΔn/dt| and s = d ln τeff/d ln Δn, is about
// 2 s² (k Δt/τc)²/10 relative in ln Δn (the cubic term the parabola omits). A decay from high injection is fast at its start and slow at its end, so no single k
// suits a whole trace. By default (Analysis.HalfWidth = 0) the window is therefore adapted to
// each point: its half-width spans SmoothingFraction of the local τc (a bias of about
// 5e-4 s²; under illumination τc is Δn/max(|dΔn/dt|, G), so that it stays near τeff at the
// peak of a flash),
// between 2 points and MaxHalfWidth(n) points. τc is estimated from the derivative itself,
// starting with the widest window and refining twice, each refinement shrinking a window that
// is too wide by about SmoothingFraction, at every (MaxHalfWidth/8)-th point, and each point
// takes the window of the nearest such estimate (our choice of method, no source).

// SmoothingFraction is the half-width of the adaptive smoothing window as a fraction of the
// local time scale Δn/|dΔn/dt|: 0.05, for a relative bias of the derivative of about 5e-4 s²
// with s = d ln τeff/d ln Δn (2e-3 where Auger recombination dominates, s = −2), while a
// window of ±0.05 τc still averages 2·0.05 τc/Δt points (our choice, no source).
const SmoothingFraction = 0.05

// MaxHalfWidth returns the largest half-width k of the adaptive smoothing window for a trace of
// n points: n/100 (a window of 2 % of the trace), at least 2 and at most 100 (our choice, no
// source: wide enough to average a hundred-odd points on long, slowly varying traces).
func MaxHalfWidth(n int) int { return min(max(n/100, 2), 100) }

// smoothingRefinements is the number of adaptive refinements after the widest window.
const smoothingRefinements = 2

// uniformStepTol is the relative spread of the time steps below which a trace counts as
// equally spaced, so that centred windows use the closed-form Savitzky–Golay slope (which then
// differs from the general fit by about this relative amount).
const uniformStepTol = 1e-9

// derivative estimates dy/dt of a trace (t strictly increasing, len(t) >= 5) by the local
// least-squares parabola, fitted to ln y where the window holds only y > 0 and to y otherwise.
type derivative struct {
	t, y    []float64
	ly      []float64 // ln y (NaN where y <= 0)
	bad     []int     // bad[i]: number of points with y <= 0 among the first i
	uniform bool
	step    float64 // the common step when uniform, s
}

func newDerivative(t, y []float64) derivative {
	n := len(t)
	d := derivative{t: t, y: y, ly: make([]float64, n), bad: make([]int, n+1), uniform: true, step: (t[n-1] - t[0]) / float64(n-1)}
	for i := range n {
		if i > 0 && d.uniform {
			d.uniform = math.Abs(t[i]-t[i-1]-d.step) <= uniformStepTol*d.step
		}
		d.bad[i+1] = d.bad[i]
		if y[i] > 0 {
			d.ly[i] = math.Log(y[i])
		} else {
			d.ly[i] = math.NaN()
			d.bad[i+1]++
		}
	}
	return d
}

// at returns dy/dt at point i from the parabola fitted to the 2k+1 points around it
// (2 <= k, 2k+1 <= len(t)): y_i times the slope of the fit to ln y if all of them are
// positive, the slope of the fit to y otherwise.
func (d derivative) at(i, k int) float64 {
	n := len(d.t)
	lo := min(max(i-k, 0), n-2*k-1)
	hi := lo + 2*k
	v, scale := d.y, 1.0
	if d.bad[hi+1] == d.bad[lo] {
		v, scale = d.ly, d.y[i]
	}
	if d.uniform && lo == i-k {
		// Centred window on equal steps: the parabola's slope at the centre is that of the
		// straight-line fit, Σ j (v_{i+j} − v_{i−j}) / (Δt Σ_{|j|<=k} j²).
		var s float64
		for j := 1; j <= k; j++ {
			s += float64(j) * (v[i+j] - v[i-j])
		}
		return scale * 3 * s / (d.step * float64(k*(k+1)*(2*k+1)))
	}
	h := math.Max(d.t[i]-d.t[lo], d.t[hi]-d.t[i])
	var q quadFit
	for j := lo; j <= hi; j++ {
		q.add((d.t[j]-d.t[i])/h, v[j])
	}
	_, c1, _, _ := q.solve() // 2k+1 >= 5 distinct times: never singular
	return scale * c1 / h
}

// smoothDerivative stores in dst the smoothed dy/dt at each point of (t, y): with the fixed
// half-width k if k > 0, else with the adaptive window described above, whose time scale is
// y/max(|dy/dt|, g) with g the generation rate (nil for none): near the peak of a flash, where
// dy/dt vanishes, the window follows the lifetime y/g instead. With the adaptive window it
// returns, per point, whether the sampling is too coarse for it (the window wanted fewer than
// 2 points each side and was widened to 2); nil with a fixed k.
func smoothDerivative(t, y, g []float64, k int, dst []float64) (coarse []bool) {
	d := newDerivative(t, y)
	n := len(t)
	if k > 0 {
		for i := range n {
			dst[i] = d.at(i, k)
		}
		return nil
	}
	// The window of each point follows from estimates of τc at every m-th point (τc changes
	// little over m points, a small fraction of any window), refined from the widest window.
	kmax := MaxHalfWidth(n)
	m := max(kmax/8, 1)
	ks := make([]int, (n-1)/m+1)
	few := make([]bool, len(ks))
	for p := range ks {
		i := p * m
		a, b := max(i-1, 0), min(i+1, n-1)
		step := (t[b] - t[a]) / float64(b-a) // local sampling step
		k := kmax
		rate := 0.0
		if g != nil {
			rate = g[i]
		}
		for range smoothingRefinements {
			want := SmoothingFraction * math.Abs(y[i]) / math.Max(math.Abs(d.at(i, k)), rate) / step
			k = min(max(int(math.Round(want)), 2), kmax)
			few[p] = want < 1.5
		}
		ks[p] = k
	}
	coarse = make([]bool, n)
	for i := range n {
		p := min((i+m/2)/m, len(ks)-1)
		dst[i] = d.at(i, ks[p])
		coarse[i] = few[p]
	}
	return coarse
}
