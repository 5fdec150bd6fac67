package lifetime

import (
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/stat"

	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// logs returns ln y, NaN where y <= 0.
func logs(y []float64) []float64 {
	l := make([]float64, len(y))
	for i, v := range y {
		l[i] = math.NaN()
		if v > 0 {
			l[i] = math.Log(v)
		}
	}
	return l
}

func uniformTimes(n int, dt float64) []float64 {
	t := make([]float64, n)
	for i := range t {
		t[i] = float64(i) * dt
	}
	return t
}

// TestDerivativeExact: the local parabola is exact for polynomials of degree <= 2 in its
// variable: ln y for a positive exponential decay (any window, centred or shifted), y itself
// where y <= 0 occurs (definition of least squares).
func TestDerivativeExact(t *testing.T) {
	n := 200
	ts := uniformTimes(n, 1e-6)
	exp := make([]float64, n)
	par := make([]float64, n)
	for i, x := range ts {
		exp[i] = 1e15 * math.Exp(-x/3e-5)
		u := x - 1e-4
		par[i] = -3e8*u*u - 1 // negative throughout
	}
	d := make([]float64, n)
	for _, k := range []int{2, 7, 40} {
		smoothDerivative(ts, exp, logs(exp), nil, k, d)
		for i := range d {
			if want := -exp[i] / 3e-5; math.Abs(d[i]/want-1) > 1e-9 {
				t.Fatalf("k %d, point %d: exponential derivative %g, want %g", k, i, d[i], want)
			}
		}
		smoothDerivative(ts, par, logs(par), nil, k, d)
		for i, x := range ts {
			if want := -6e8 * (x - 1e-4); math.Abs(d[i]-want) > 1e-6*6e8*1e-4 {
				t.Fatalf("k %d, point %d: parabola derivative %g, want %g", k, i, d[i], want)
			}
		}
	}
}

// TestDerivativeUniformPath: the closed-form slope for equal steps is the general fit (the
// times jittered by 1e-7 relative force the general path; agreement to 1e-5).
func TestDerivativeUniformPath(t *testing.T) {
	n := 300
	ts := uniformTimes(n, 1e-6)
	jit := append([]float64(nil), ts...)
	y := make([]float64, n)
	rng := rand.New(rand.NewPCG(3, 4))
	for i := range ts {
		jit[i] += 1e-13 * rng.Float64()
		y[i] = 1e15 * math.Exp(-ts[i]/5e-5) * (1 + 0.01*math.Sin(float64(i)))
	}
	if !newDerivative(ts, y, logs(y)).uniform || newDerivative(jit, y, logs(y)).uniform {
		t.Fatal("uniform-step detection")
	}
	a, b := make([]float64, n), make([]float64, n)
	smoothDerivative(ts, y, logs(y), nil, 9, a)
	smoothDerivative(jit, y, logs(y), nil, 9, b)
	for i := range a {
		if math.Abs(a[i]-b[i]) > 1e-5*math.Abs(a[i]) {
			t.Fatalf("point %d: %g with equal steps, %g with the general fit", i, a[i], b[i])
		}
	}
}

// TestDerivativeNoise: on white noise of standard deviation σ the centred estimate has standard
// deviation σ sqrt(3/(k(k+1)(2k+1)))/Δt (least squares, Savitzky and Golay 1964); checked
// within 10 % on 20,000 samples (the estimates of overlapping windows are correlated, which
// leaves about 2,000 independent ones, a 3 % sampling error).
func TestDerivativeNoise(t *testing.T) {
	n, k, dt, sigma := 20000, 4, 1e-6, 1e12
	ts := uniformTimes(n, dt)
	rng := rand.New(rand.NewPCG(5, 6))
	y := make([]float64, n)
	for i := range y {
		y[i] = sigma * rng.NormFloat64()
	}
	d := make([]float64, n)
	smoothDerivative(ts, y, logs(y), nil, k, d)
	got := stat.StdDev(d[k:n-k], nil)
	want := sigma * math.Sqrt(3/float64(k*(k+1)*(2*k+1))) / dt
	if math.Abs(got/want-1) > 0.1 {
		t.Errorf("noise of the derivative %g, want %g", got, want)
	}
}

// TestWaferTable: every column of the table and its inverse agree with direct evaluation to
// tableTol at points between the nodes, for n- and p-type wafers with and without an
// intrinsic mechanism.
func TestWaferTable(t *testing.T) {
	m, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		nd, na, lo, hi float64
		intr           recomb.Mechanism
		column         bool // the table holds an intrinsic column
	}{
		{1e15, 0, 1e10, 1e18, recomb.NewIntrinsic(), true},
		{0, 1.5e16, 1e13, 2e16, recomb.NewIntrinsic(), true},
		{0, 1e18, 1e14, 1e15, nil, false},
		{1e15, 0, 1e12, 1e16, recomb.Sum{}, false}, // a rate of 0: nothing to subtract
	} {
		b, err := recomb.NewBulk(m, c.nd, c.na)
		if err != nil {
			t.Fatal(err)
		}
		tab, err := newWaferTable(b, c.intr, c.lo, c.hi)
		if err != nil {
			t.Fatal(err)
		}
		if tab.intrinsic != c.column {
			t.Errorf("Nd %g, Na %g: intrinsic column %v", c.nd, c.na, tab.intrinsic)
		}
		e := tableEval{b: b, mat: m, mob: m.Models().Mobility, eq: equilibriumPoint(b), intrinsic: c.intr}
		rng := rand.New(rand.NewPCG(7, 8))
		for range 200 {
			x := math.Log(c.lo) + rng.Float64()*math.Log(c.hi/c.lo)
			v, err := e.at(math.Exp(x))
			if err != nil {
				t.Fatal(err)
			}
			for col := range nCol {
				if col == colIntr && !tab.intrinsic {
					continue
				}
				if d := math.Abs(tab.at(col, x) - v[col]); d > tableTol {
					t.Fatalf("Nd %g, Na %g, Δn %g: column %d off by %g", c.nd, c.na, math.Exp(x), col, d)
				}
			}
			if d := math.Abs(tab.excess(v[colY]) - x); d > tableTol {
				t.Fatalf("Nd %g, Na %g, Δn %g: inverse off by %g", c.nd, c.na, math.Exp(x), d)
			}
		}
	}
}
