package profile

import (
	"errors"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

const q = silicon.ElementaryCharge

func rel(got, want float64) float64 { return math.Abs(got-want) / math.Abs(want) }

// materialWith returns the default model set at 300 K with mobility model mob.
func materialWith(tb testing.TB, mob silicon.Mobility) *silicon.Material {
	tb.Helper()
	ms := silicon.DefaultModelSet()
	ms.Mobility = mob
	m, err := ms.At(300)
	if err != nil {
		tb.Fatal(err)
	}
	return m
}

// TestSheetUniform checks a uniform layer against the textbook closed form
// Rsh = 1/(q μ N W) (for example Sze and Ng, Physics of Semiconductor Devices, 2007), to
// 1e-12.
func TestSheetUniform(t *testing.T) {
	mat := materialWith(t, silicon.NewKlaassen1992())
	for _, c := range []struct {
		dop silicon.Dopant
		n   float64
	}{{silicon.Donor, 1e19}, {silicon.Acceptor, 3e18}, {silicon.Donor, 1e16}} {
		w := 1e-4 // 1 µm
		mun, mup, _ := mat.Mobilities(c.n, 0, c.n, 0)
		if c.dop == silicon.Acceptor {
			mun, mup, _ = mat.Mobilities(0, c.n, 0, c.n)
		}
		mu := mun
		if c.dop == silicon.Acceptor {
			mu = mup
		}
		want := 1 / (q * mu * c.n * w)
		s, err := SheetResistance(mat, c.dop, []float64{0, w}, []float64{c.n, c.n}, 0)
		if err != nil {
			t.Fatal(err)
		}
		if rel(s.Rsh, want) > 1e-12 || s.XjCm != w {
			t.Errorf("%s %g: Rsh = %g, want %g Ω/sq (xj %g)", c.dop, c.n, s.Rsh, want, s.XjCm)
		}
		sf, err := SheetResistanceFunc(mat, c.dop, func(float64) float64 { return c.n }, w, 0)
		if err != nil {
			t.Fatal(err)
		}
		if rel(sf.Rsh, want) > 1e-12 {
			t.Errorf("%s %g func: Rsh = %g, want %g Ω/sq", c.dop, c.n, sf.Rsh, want)
		}
	}
	// 1e19 cm^-3 phosphorus, 1 µm: about 54 Ω/sq with μn ≈ 115 cm²/Vs (common practice, no source).
	s, _ := SheetResistance(mat, silicon.Donor, []float64{0, 1e-4}, []float64{1e19, 1e19}, 0)
	if s.Rsh < 50 || s.Rsh > 58 {
		t.Errorf("1e19, 1 µm: %g Ω/sq", s.Rsh)
	}
}

// TestSheetExponential checks an exponential profile N = Ns exp(−x/L) on a background Nbg with
// a constant mobility against the closed form
//
//	1/Rsh = q μ (L (Ns − Nbg) − Nbg xj),  xj = L ln(Ns/Nbg),
//
// (elementary integral). Log-linear interpolation is exact for it, so five samples suffice;
// tolerance 1e-10 for the quadrature and the junction.
func TestSheetExponential(t *testing.T) {
	mob := silicon.NewConstantMobility()
	mat := materialWith(t, mob)
	ns, l := 1e20, 0.1e-4
	for _, bg := range []float64{0, 1e15, 1e18} {
		for _, dop := range []silicon.Dopant{silicon.Donor, silicon.Acceptor} {
			mu := mob.Electron
			if dop == silicon.Acceptor {
				mu = mob.Hole
			}
			depth := 30 * l
			xj := depth
			g := q * mu * ns * l * (1 - math.Exp(-depth/l))
			if bg > 0 {
				xj = l * math.Log(ns/bg)
				g = q * mu * (l*(ns-bg) - bg*xj)
			}
			xs := []float64{0, 0.7 * l, 5 * l, 12 * l, depth}
			ys := make([]float64, len(xs))
			for i, x := range xs {
				ys[i] = ns * math.Exp(-x/l)
			}
			s, err := SheetResistance(mat, dop, xs, ys, bg)
			if err != nil {
				t.Fatal(err)
			}
			if rel(s.Rsh, 1/g) > 1e-10 || rel(s.XjCm, xj) > 1e-10 || s.RelErr > 1e-8 {
				t.Errorf("arrays %s bg %g: Rsh = %.12g, want %.12g; xj = %g, want %g; RelErr %g", dop, bg, s.Rsh, 1/g, s.XjCm, xj, s.RelErr)
			}
			sf, err := SheetResistanceFunc(mat, dop, func(x float64) float64 { return ns * math.Exp(-x/l) }, depth, bg)
			if err != nil {
				t.Fatal(err)
			}
			if rel(sf.Rsh, 1/g) > 1e-10 || rel(sf.XjCm, xj) > 1e-10 {
				t.Errorf("func %s bg %g: Rsh = %.12g, want %.12g; xj = %g, want %g", dop, bg, sf.Rsh, 1/g, sf.XjCm, xj)
			}
		}
	}
}

// TestSheetGaussian checks a Gaussian phosphorus profile with Klaassen mobilities on a boron
// background against an independent reference: a single 2000-point Gauss–Legendre rule over
// [0, xj] with the analytic junction xj = L √ln(Ns/Nbg) (converged to about 1e-14 for this
// smooth integrand). Tolerance 1e-8, SheetRelTol. A finely sampled array version agrees to
// 1e-5, the error of log-linear interpolation of a Gaussian with 4001 samples.
func TestSheetGaussian(t *testing.T) {
	mat := materialWith(t, silicon.NewKlaassen1992())
	ns, l, bg := 2e20, 0.25e-4, 1.5e16
	n := func(x float64) float64 { u := x / l; return ns * math.Exp(-u*u) }
	xj := l * math.Sqrt(math.Log(ns/bg))
	ref := quad.Fixed(func(x float64) float64 {
		v := n(x)
		mun, _, err := mat.Mobilities(v-bg, 0, v, bg)
		if err != nil {
			t.Fatal(err)
		}
		return q * mun * (v - bg)
	}, 0, xj, 2000, quad.Legendre{}, 0)
	s, err := SheetResistanceFunc(mat, silicon.Donor, n, 4*l, bg)
	if err != nil {
		t.Fatal(err)
	}
	if rel(s.Rsh, 1/ref) > 1e-8 || rel(s.XjCm, xj) > 1e-12 {
		t.Errorf("func: Rsh = %.12g, reference %.12g Ω/sq; xj = %g, want %g", s.Rsh, 1/ref, s.XjCm, xj)
	}
	xs := make([]float64, 4001)
	ys := make([]float64, len(xs))
	for i := range xs {
		xs[i] = 4 * l * float64(i) / 4000
		ys[i] = n(xs[i])
	}
	sa, err := SheetResistance(mat, silicon.Donor, xs, ys, bg)
	if err != nil {
		t.Fatal(err)
	}
	if rel(sa.Rsh, 1/ref) > 1e-5 || rel(sa.XjCm, xj) > 1e-5 {
		t.Errorf("arrays: Rsh = %.8g, reference %.8g Ω/sq; xj = %g, want %g", sa.Rsh, 1/ref, sa.XjCm, xj)
	}
	// Properties: a deeper or more doped profile conducts better.
	deeper, _ := SheetResistanceFunc(mat, silicon.Donor, func(x float64) float64 { return n(x / 1.5) }, 6*l, bg)
	if !(deeper.Rsh < s.Rsh) {
		t.Errorf("deeper profile: %g Ω/sq not below %g", deeper.Rsh, s.Rsh)
	}
}

// TestSheetBadInput checks the errors.
func TestSheetBadInput(t *testing.T) {
	mat := materialWith(t, silicon.NewKlaassen1992())
	nan := math.NaN()
	for _, c := range []struct {
		xs, ys []float64
		bg     float64
		word   string
	}{
		{[]float64{0, 1e-4}, []float64{1e19}, 0, "length"},
		{[]float64{0}, []float64{1e19}, 0, "at least 2"},
		{[]float64{0, 1e-4, 1e-4}, []float64{1e19, 1e18, 1e17}, 0, "increase"},
		{[]float64{-1e-5, 1e-4}, []float64{1e19, 1e18}, 0, "depth"},
		{[]float64{0, nan}, []float64{1e19, 1e18}, 0, "depth"},
		{[]float64{0, 1e-4}, []float64{1e19, nan}, 0, "density"},
		{[]float64{0, 1e-4}, []float64{1e19, -1}, 0, "density"},
		{[]float64{0, 1e-4}, []float64{1e15, 1e14}, 1e16, "surface"},
		{[]float64{0, 1e-4}, []float64{1e19, 1e18}, -1, "background"},
		{[]float64{0, 1e-4}, []float64{1e19, 1e18}, math.Inf(1), "background"},
		{[]float64{0, 1e-4}, []float64{5e21, 1e18}, 0, "mobility"}, // above Klaassen's NMax
	} {
		_, err := SheetResistance(mat, silicon.Donor, c.xs, c.ys, c.bg)
		if err == nil || !strings.HasPrefix(err.Error(), "profile: ") || !strings.Contains(err.Error(), c.word) {
			t.Errorf("%v %v bg %g: error %v, want one with %q", c.xs, c.ys, c.bg, err, c.word)
		}
	}
	good := func(x float64) float64 { return 1e19 * math.Exp(-x/1e-5) }
	masetti := materialWith(t, silicon.NewMasetti1983())
	for _, c := range []struct {
		mat   *silicon.Material
		dop   silicon.Dopant
		f     func(float64) float64
		depth float64
		word  string
	}{
		{nil, silicon.Donor, good, 1e-4, "Material"},
		{mat, 0, good, 1e-4, "dop"},
		{mat, silicon.Donor, nil, 1e-4, "density function"},
		{mat, silicon.Donor, good, 0, "depth"},
		{mat, silicon.Donor, good, math.Inf(1), "depth"},
		{mat, silicon.Donor, func(x float64) float64 { return nan }, 1e-4, "density("},
		{mat, silicon.Donor, func(x float64) float64 {
			if x > 5e-5 {
				return -1
			}
			return 1e19
		}, 1e-4, "density("},
		{masetti, silicon.Donor, func(float64) float64 { return 5e21 }, 1e-4, "outside validity range"},
	} {
		_, err := SheetResistanceFunc(c.mat, c.dop, c.f, c.depth, 0)
		if err == nil || !strings.HasPrefix(err.Error(), "profile: ") || !strings.Contains(err.Error(), c.word) {
			t.Errorf("%q: error %v", c.word, err)
		}
	}
	// Masetti's fit ends at 1e21 cm^-3 (its NMax): the mobility's range error comes through.
	_, err := SheetResistanceFunc(masetti, silicon.Donor, func(float64) float64 { return 5e21 }, 1e-4, 0)
	if !errors.Is(err, pvrec.ErrOutOfRange) {
		t.Errorf("Masetti at 5e21 cm^-3: %v does not match pvrec.ErrOutOfRange", err)
	}
}

// BenchmarkSheetResistanceFunc measures the Gaussian emitter of ExampleSheetResistanceFunc.
func BenchmarkSheetResistanceFunc(b *testing.B) {
	mat := materialWith(b, silicon.NewKlaassen1992())
	ns, l := 2e20, 0.25e-4
	gauss := func(x float64) float64 { u := x / l; return ns * math.Exp(-u*u) }
	for b.Loop() {
		if _, err := SheetResistanceFunc(mat, silicon.Donor, gauss, 1e-4, 1.5e16); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSheetResistance200 measures a tabulated profile of 200 samples.
func BenchmarkSheetResistance200(b *testing.B) {
	mat := materialWith(b, silicon.NewKlaassen1992())
	ns, l := 2e20, 0.25e-4
	xs, ys := make([]float64, 200), make([]float64, 200)
	for i := range xs {
		xs[i] = 1e-4 * float64(i) / 199
		u := xs[i] / l
		ys[i] = ns * math.Exp(-u*u)
	}
	for b.Loop() {
		if _, err := SheetResistance(mat, silicon.Donor, xs, ys, 1.5e16); err != nil {
			b.Fatal(err)
		}
	}
}
