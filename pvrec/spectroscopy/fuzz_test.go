package spectroscopy

import (
	"math"
	"math/rand/v2"
	"testing"

	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// fuzzCurves returns two curves (300 and 350 K, Na = 1e16 cm^-3, 12 points) of the level
// Et − Ei = e with k = 10^logk, each lifetime multiplied by exp(noise·N(0, 1)) (seeded), the
// whole curve of the second sample scrambled if scramble: invented data, clean or hostile.
func fuzzCurves(t *testing.T, seed uint64, e, logk, noise float64, scramble bool) []Curve {
	dn := logspace(1e13, 1e16, 12)
	rng := rand.New(rand.NewPCG(seed, 7))
	var cs []Curve
	for j, temp := range []float64{300, 350} {
		b := bulk(t, material(t, temp), 0, 1e16)
		m := invented(t, e, math.Pow(10, logk))
		tau := make([]float64, len(dn))
		for i, d := range dn {
			v, err := b.Lifetime(m, d)
			if err != nil {
				return nil
			}
			tau[i] = v * math.Exp(noise*rng.NormFloat64())
		}
		if scramble && j == 1 {
			rng.Shuffle(len(tau), func(a, b int) { tau[a], tau[b] = tau[b], tau[a] })
		}
		cs = append(cs, Curve{Bulk: b, Dn: dn, Tau: tau})
	}
	return cs
}

// checkFinite fails on any NaN or infinite number in r.
func checkResult(t *testing.T, r Result) {
	t.Helper()
	vals := []float64{r.Et, r.EtLow, r.EtHigh, r.EtErr, r.K, r.KLow, r.KHigh, r.LnKErr, r.CorrEtK, r.Cost, r.Scatter,
		r.Alternative.Et, r.Alternative.K, r.Alternative.Cost, r.Alternative.Chi2}
	for _, s := range r.Samples {
		vals = append(vals, s.TauN0, s.LnTauN0Err, s.TauP0, s.SigmaNNt, s.Cost, s.RMS, s.DurbinWatson)
	}
	for _, iv := range r.Region {
		vals = append(vals, iv.Lo, iv.Hi)
	}
	for i, v := range vals {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			t.Fatalf("value %d of the Result is %g: %+v", i, v, r)
		}
	}
	if !(r.EtLow <= r.Et && r.Et <= r.EtHigh) || !(r.KLow <= r.K && r.K <= r.KHigh) || r.K <= 0 {
		t.Fatalf("estimate outside its interval: Et %g [%g, %g], k %g [%g, %g]", r.Et, r.EtLow, r.EtHigh, r.K, r.KLow, r.KHigh)
	}
	if len(r.Reasons) != countFlags(r.Flags) || len(r.Region) == 0 || r.Alternative.Chi2 < -1e-6 {
		t.Fatalf("flags %v with reasons %q, region %v, alternative %+v", r.Flags, r.Reasons, r.Region, r.Alternative)
	}
}

// Fit on clean, noisy and scrambled curves never panics, and returns either an error or a
// finite Result whose estimates lie in their intervals and in the gap.
func FuzzFit(f *testing.F) {
	f.Add(uint64(1), 0.3, 0.2, 0.02, false)
	f.Add(uint64(2), -0.4, 3.0, 0.0, false)
	f.Add(uint64(3), 0.0, -4.0, 0.5, true)
	f.Add(uint64(4), 0.55, 5.0, 3.0, false)
	f.Fuzz(func(t *testing.T, seed uint64, e, logk, noise float64, scramble bool) {
		if !(math.Abs(e) <= 0.55) || !(math.Abs(logk) <= 6) || !(noise >= 0 && noise <= 5) {
			t.Skip()
		}
		cs := fuzzCurves(t, seed, e, logk, noise, scramble)
		if cs == nil {
			t.Skip()
		}
		r, err := Fit(cs, Options{})
		if err != nil {
			return
		}
		checkResult(t, r)
		p, err := newProblem(cs, Options{})
		if err != nil {
			t.Fatal(err)
		}
		if r.Et < p.lo || r.Et > p.hi {
			t.Fatalf("Et = %g eV outside the gap [%g, %g]", r.Et, p.lo, p.hi)
		}
	})
}

// Linearise on the same curves never panics and returns an error or finite coefficients;
// At never panics.
func FuzzLinearise(f *testing.F) {
	f.Add(uint64(1), 0.3, 0.2, 0.02, false, -0.2)
	f.Add(uint64(5), 0.0, -2.0, 1.0, true, 0.5)
	f.Fuzz(func(t *testing.T, seed uint64, e, logk, noise float64, scramble bool, at float64) {
		if !(math.Abs(e) <= 0.55) || !(math.Abs(logk) <= 6) || !(noise >= 0 && noise <= 5) {
			t.Skip()
		}
		cs := fuzzCurves(t, seed, e, logk, noise, scramble)
		if cs == nil {
			t.Skip()
		}
		l, err := Linearise(cs[1], silicon.ThermalVelocity{})
		if err != nil {
			return
		}
		for _, v := range []float64{l.Intercept, l.Slope, l.InterceptErr, l.SlopeErr, l.High, l.DeepK, l.RMS, l.DurbinWatson} {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				t.Fatalf("Line has %g: %+v", v, l)
			}
		}
		if srh, k, err := l.At(recomb.FromEi(at)); err == nil && !(srh.TauN0 > 0 && srh.TauP0 > 0 && k > 0 && !math.IsInf(k, 0)) {
			t.Fatalf("At(%g) = %+v, %g", at, srh, k)
		}
	})
}

// ConvertLevel round-trips every level in the gap between every pair of references and
// refuses the others, without panicking.
func FuzzConvertLevel(f *testing.F) {
	f.Add(0.38, uint8(1), uint8(3))
	f.Add(-2.0, uint8(3), uint8(2))
	f.Add(0.0, uint8(0), uint8(9))
	m, err := silicon.DefaultModelSet().At(300)
	if err != nil {
		f.Fatal(err)
	}
	f.Fuzz(func(t *testing.T, e float64, from, to uint8) {
		l := recomb.Level{E: e, Ref: recomb.EnergyRef(from)}
		c, err := ConvertLevel(l, m, recomb.EnergyRef(to))
		if err != nil {
			return
		}
		back, err := ConvertLevel(c, m, l.Ref)
		if err != nil || math.Abs(back.E-e) > 1e-12 {
			t.Fatalf("%v → %v → %v (%v)", l, c, back, err)
		}
	})
}
