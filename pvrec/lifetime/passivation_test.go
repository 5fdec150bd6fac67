package lifetime

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
	"github.com/pvrec/pvrec/pvrec/surface"
)

// passivationWafer is notebook 04's invented wafer: p-type 1.5e16 cm^-3, 180 µm, intrinsic
// bulk, default model set at 300 K.
func passivationWafer(t testing.TB) Sample {
	t.Helper()
	si, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		t.Fatal(err)
	}
	b, err := recomb.NewBulk(si, 0, 1.5e16)
	if err != nil {
		t.Fatal(err)
	}
	return Sample{Wafer: b, W: 180e-4, Bulk: recomb.NewIntrinsic()}
}

// dielectric is the invented dielectric of notebook 04 with fixed charge qf and constant Dit.
func dielectric(qf, dit float64) surface.ExtendedSRH {
	return surface.NewExtendedSRH(surface.ConstantDit{D: dit}, surface.ConstantSigma(1e-14), surface.ConstantSigma(1e-16), qf)
}

func synthetic(t testing.TB, s Sample, m surface.ExtendedSRH, dn []float64) []float64 {
	t.Helper()
	s.Front = m
	tau := make([]float64, len(dn))
	for i, x := range dn {
		v, err := s.Lifetime(x)
		if err != nil {
			t.Fatal(err)
		}
		tau[i] = v
	}
	return tau
}

func logGrid(lo, hi float64, n int) []float64 {
	out := make([]float64, n)
	for i := range out {
		out[i] = lo * math.Pow(hi/lo, float64(i)/float64(n-1))
	}
	return out
}

// TestFitPassivationRoundTrip: the fit recovers Qf and Dit within 10 % (issue 14's target) from
// noise-free τeff(Δn) of the forward model over 1e13–1e17 cm^-3, over a grid of true values of
// both signs, from one documented starting point (Qf = −1e12 cm^-2, Dit = 1e11 cm^-2 eV^-1).
func TestFitPassivationRoundTrip(t *testing.T) {
	s := passivationWafer(t)
	dn := logGrid(1e13, 1e17, 30)
	for _, qf := range []float64{-3e12, -1e12, 1e12} {
		for _, dit := range []float64{3e10, 3e11} {
			tau := synthetic(t, s, dielectric(qf, dit), dn)
			fit, err := FitPassivation(s, dn, tau, PassivationOptions{Start: dielectric(-1e12, 1e11)})
			if err != nil {
				t.Fatalf("Qf %g, Dit %g: %v", qf, dit, err)
			}
			gotDit := 1e11 * fit.DitFactor
			if e := math.Abs(fit.Qf/qf - 1); e > 0.10 {
				t.Errorf("Qf %g, Dit %g: fitted Qf = %.4g (%.1f %% off), warnings %v", qf, dit, fit.Qf, 100*e, fit.Warnings)
			}
			if e := math.Abs(gotDit/dit - 1); e > 0.10 {
				t.Errorf("Qf %g, Dit %g: fitted Dit = %.4g (%.1f %% off), warnings %v", qf, dit, gotDit, 100*e, fit.Warnings)
			}
			if !(fit.RMS < 1e-3) {
				t.Errorf("Qf %g, Dit %g: rms %g of a noise-free fit", qf, dit, fit.RMS)
			}
		}
	}
}

// TestFitPassivationDeterministicAndDegenerate: the same data give the same fit; low-injection
// data alone of an accumulated surface leave Qf and Dit correlated (Seff ∝ Dit/Qf² there;
// derived from the extended SRH model in strong accumulation), which the fit must say.
func TestFitPassivationDeterministicAndDegenerate(t *testing.T) {
	s := passivationWafer(t)
	dn := logGrid(1e13, 1e17, 20)
	tau := synthetic(t, s, dielectric(-2e12, 1e11), dn)
	o := PassivationOptions{Start: dielectric(-1e12, 1e11)}
	a, err1 := FitPassivation(s, dn, tau, o)
	b, err2 := FitPassivation(s, dn, tau, o)
	if err1 != nil || err2 != nil || a.Qf != b.Qf || a.DitFactor != b.DitFactor {
		t.Errorf("not deterministic: %v %v, %g/%g, %g/%g", err1, err2, a.Qf, b.Qf, a.DitFactor, b.DitFactor)
	}
	low := logGrid(1e12, 5e13, 12)
	tl := synthetic(t, s, dielectric(-2e12, 1e11), low)
	f, err := FitPassivation(s, low, tl, PassivationOptions{Start: dielectric(-1e12, 1e11), DnMin: 1e12})
	if err != nil {
		t.Fatal(err)
	}
	if f.Reliable || len(f.Warnings) == 0 {
		t.Errorf("low-injection-only fit claims to be reliable: ρ = %g, %+v", f.CorrQfDit, f.Warnings)
	}
}

func TestFitPassivationBadInput(t *testing.T) {
	s := passivationWafer(t)
	dn := logGrid(1e13, 1e17, 10)
	tau := synthetic(t, s, dielectric(-1e12, 1e11), dn)
	good := PassivationOptions{Start: dielectric(-1e12, 1e11)}
	nan := append([]float64(nil), tau...)
	nan[3] = math.NaN()
	for name, c := range map[string]struct {
		s       Sample
		dn, tau []float64
		o       PassivationOptions
	}{
		"zero sample":     {Sample{}, dn, tau, good},
		"no Dit":          {s, dn, tau, PassivationOptions{}},
		"NaN lifetime":    {s, dn, nan, good},
		"lengths":         {s, dn, tau[:5], good},
		"too few points":  {s, dn[:3], tau[:3], good},
		"window":          {s, dn, tau, PassivationOptions{Start: good.Start, DnMin: 1e17, DnMax: 1e16}},
		"free ratio, tab": {s, dn, tau, PassivationOptions{Start: surface.NewExtendedSRH(surface.ConstantDit{D: 1e11}, surface.TabulatedSigma{}, surface.ConstantSigma(1e-16), -1e12), FreeSigmaRatio: true}},
	} {
		if _, err := FitPassivation(c.s, c.dn, c.tau, c.o); err == nil {
			t.Errorf("%s: no error", name)
		}
	}
	// A start outside the model's range is the model's range error.
	_, err := FitPassivation(s, dn, tau, PassivationOptions{Start: dielectric(-5e13, 1e11)})
	if !errors.Is(err, pvrec.ErrOutOfRange) {
		t.Errorf("start Qf = -5e13: err = %v, want ErrOutOfRange", err)
	}
}

// BenchmarkFitPassivation is one two-parameter fit on 30 points.
func BenchmarkFitPassivation(b *testing.B) {
	s := passivationWafer(b)
	dn := logGrid(1e13, 1e17, 30)
	tau := synthetic(b, s, dielectric(-1e12, 3e11), dn)
	o := PassivationOptions{Start: dielectric(-1e12, 1e11)}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := FitPassivation(s, dn, tau, o); err != nil {
			b.Fatal(err)
		}
	}
}

// TestFitPassivationNoisy: with invented, seeded 0.5 % noise on τeff, where the data determine
// both parameters (Response above MinResponse), the fit is within 10 % of the truth and the
// truth within four standard errors of the fit (the errors are not too optimistic).
func TestFitPassivationNoisy(t *testing.T) {
	s := passivationWafer(t)
	dn := logGrid(1e13, 1e17, 30)
	rng := rand.New(rand.NewPCG(7, 11))
	for _, c := range [][2]float64{{-1e12, 3e11}, {-5e11, 1e12}} {
		tau := synthetic(t, s, dielectric(c[0], c[1]), dn)
		for i := range tau {
			tau[i] *= 1 + 0.005*rng.NormFloat64()
		}
		fit, err := FitPassivation(s, dn, tau, PassivationOptions{Start: dielectric(-1e12, 1e11)})
		if err != nil {
			t.Fatal(err)
		}
		if !fit.Reliable {
			t.Errorf("Qf %g, Dit %g: unreliable: %v", c[0], c[1], fit.Warnings)
			continue
		}
		dit, ditErr := 1e11*fit.DitFactor, 1e11*fit.DitFactorErr
		if math.Abs(fit.Qf/c[0]-1) > 0.1 || math.Abs(dit/c[1]-1) > 0.1 {
			t.Errorf("Qf %g, Dit %g: fitted %g, %g", c[0], c[1], fit.Qf, dit)
		}
		if math.Abs(fit.Qf-c[0]) > 4*fit.QfErr || math.Abs(dit-c[1]) > 4*ditErr {
			t.Errorf("Qf %g, Dit %g: fitted %g ± %g, %g ± %g: truth beyond 4 σ", c[0], c[1], fit.Qf, fit.QfErr, dit, ditErr)
		}
	}
}
