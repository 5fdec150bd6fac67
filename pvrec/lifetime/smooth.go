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
// 2 s² (k Δt/τc)²/10 relative in ln Δn (the cubic term the parabola omits), and relative to
// 1/τeff = G/Δn − d ln Δn/dt it is that times τeff/τc. A decay from high injection is fast at
// its start and slow at its end, so no single k suits a whole trace. By default
// (Analysis.HalfWidth = 0) the window is therefore adapted to each point: its half-width spans
// SmoothingFraction of T = τc sqrt(τc/τeff) (windowScale), which makes the bias of 1/τeff
// about 5e-4 s² everywhere: T = τc in a free decay, and T grows where the light holds the
// sample near its quasi-steady state and the derivative is only a small correction; the
// half-width stays between 2 points and MaxHalfWidth(n). T is estimated from the derivative
// itself, starting with the widest window and refining twice (each refinement shrinks a window
// that is too wide by about SmoothingFraction), at every (MaxHalfWidth/8)-th point, and each
// point takes the window of the nearest such estimate (our choice of method, no source).

// SmoothingFraction is the half-width of the adaptive smoothing window as a fraction of the
// time scale T of windowScale: 0.05, for a relative bias of 1/τeff of about 5e-4 s² with
// s = d ln τeff/d ln Δn (2e-3 where Auger recombination dominates, s = −2), while a window of
// ±0.05 T still averages 0.1 T/Δt points (our choice, no source).
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
	ly      []float64 // ln y where y > 0
	bad     []int     // bad[i]: number of points with y <= 0 among the first i
	uniform bool
	step    float64 // the common step when uniform, s
	// With equal steps, prefix sums of u = ln y − (its mean) (0 where y <= 0): sum[m] = Σ u_l
	// and moment[m] = Σ l u_l over l < m, so that a centred window's Σ j u_{i+j} costs O(1).
	sum, moment []float64
}

// newDerivative prepares the derivative of (t, y) with ly[i] = ln y[i] where y[i] > 0 (any
// value elsewhere; the caller has the logarithms already).
func newDerivative(t, y, ly []float64) derivative {
	n := len(t)
	d := derivative{t: t, y: y, ly: ly, bad: make([]int, n+1), uniform: true, step: (t[n-1] - t[0]) / float64(n-1)}
	for i := range n {
		if i > 0 && d.uniform {
			d.uniform = math.Abs(t[i]-t[i-1]-d.step) <= uniformStepTol*d.step
		}
		d.bad[i+1] = d.bad[i]
		if !(y[i] > 0) {
			d.bad[i+1]++
		}
	}
	if d.uniform {
		// Rounding: |moment| <= n² max|u|/2, so a window's sum carries an absolute error of
		// about 1e-16 n² max|u| (max|u| ≈ 5, the spread of ln Δn), and the slope an error of
		// about 1.5e-16 n² max|u|/(Δt k³). Where the adaptive rule sets k, k >= 0.05 τeff/Δt,
		// so relative to 1/τeff this is below 3e-15 n² max|u|/k²: under 1e-6 for traces of up
		// to 10,000 points, growing as n² beyond.
		var mean float64
		good := n - d.bad[n]
		for i := range n {
			if y[i] > 0 {
				mean += ly[i] / float64(good)
			}
		}
		d.sum, d.moment = make([]float64, n+1), make([]float64, n+1)
		for i := range n {
			u := 0.0
			if y[i] > 0 {
				u = ly[i] - mean
			}
			d.sum[i+1] = d.sum[i] + u
			d.moment[i+1] = d.moment[i] + float64(i)*u
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
	logs := d.bad[hi+1] == d.bad[lo]
	if logs {
		v, scale = d.ly, d.y[i]
	}
	if d.uniform && lo == i-k && logs {
		// Σ_{|j|<=k} j u_{i+j} from the prefix sums.
		s := (d.moment[hi+1] - d.moment[lo]) - float64(i)*(d.sum[hi+1]-d.sum[lo])
		return scale * 3 * s / (d.step * float64(k*(k+1)*(2*k+1)))
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

// windowScale returns the time scale T of the adaptive window at a point with excess density
// dn, derivative d = dΔn/dt and generation rate g (0 in the dark), s: T = τc sqrt(τc/τeff)
// with τc = Δn/|dΔn/dt| and τeff = Δn/(G − dΔn/dt), which is τc for a free decay, longer
// than τc in a quasi-steady state (there the derivative is a small correction to G) and +Inf
// at the peak of a flash (dΔn/dt = 0; the window is then capped).
func windowScale(dn, d, g float64) float64 {
	net := g - d // Δn/τeff
	if !(net > 0) || d == 0 {
		if d == 0 && net > 0 {
			return math.Inf(1)
		}
		return 0 // the formula does not apply: the smallest window
	}
	tc := math.Abs(dn / d)
	return tc * math.Sqrt(net/math.Abs(d))
}

// smoothDerivative stores in dst the smoothed dy/dt at each point of (t, y), with ly the
// logarithms of the positive y: with the fixed half-width k if k > 0, else with the adaptive
// window described above (windowScale, with g the generation rate; nil for none). With the
// adaptive window it
// returns, per point, whether the sampling is too coarse for it (the window wanted fewer than
// 2 points each side and was widened to 2); nil with a fixed k.
func smoothDerivative(t, y, ly, g []float64, k int, dst []float64) (coarse []bool) {
	d := newDerivative(t, y, ly)
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
		gen := 0.0
		if g != nil {
			gen = g[i]
		}
		for range smoothingRefinements {
			want := SmoothingFraction * windowScale(y[i], d.at(i, k), gen) / step
			k = int(math.Round(math.Min(math.Max(want, 2), float64(kmax))))
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
