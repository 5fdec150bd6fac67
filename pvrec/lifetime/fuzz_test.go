package lifetime_test

import (
	"math"
	"math/rand/v2"
	"testing"

	"github.com/pvrec/pvrec/pvrec/lifetime"
	"github.com/pvrec/pvrec/pvrec/surface"
)

// FuzzExcessFromConductance: the inversion returns a Δn that Conductance maps back to the
// photoconductance, or an error; never NaN or a panic.
func FuzzExcessFromConductance(f *testing.F) {
	f.Add(1e-3, 1e15, 0.0)
	f.Add(10.0, 0.0, 1e17)
	f.Add(1e-12, 1e10, 1e10)
	f.Add(1e3, 1e19, 0.0)
	f.Fuzz(func(t *testing.T, sigma, nd, na float64) {
		if !(nd >= 0 && nd <= 1e20) || !(na >= 0 && na <= 1e20) {
			return
		}
		b := wafer(t, nd, na)
		dn, err := lifetime.ExcessFromConductance(b, width, sigma)
		if err != nil {
			return
		}
		if math.IsNaN(dn) || dn < 0 {
			t.Fatalf("σ %g: Δn %g", sigma, dn)
		}
		if dn == 0 {
			if sigma != 0 {
				t.Fatalf("σ %g: Δn 0", sigma)
			}
			return
		}
		c, err := lifetime.Conductance(b, width, dn)
		if err != nil || math.Abs(c/sigma-1) > 1e-10 {
			t.Fatalf("σ %g S: Δn %g cm^-3 maps back to %g S (%v)", sigma, dn, c, err)
		}
	})
}

// FuzzSeffFromLifetime: the closed-form inverse of Sproul's relation returns a Seff that the
// forward relation (surface.EffectiveLifetime) maps back to τeff, or an error.
func FuzzSeffFromLifetime(f *testing.F) {
	f.Add(1e-3, 5e-3, 0.018, 25.0)
	f.Add(1e-6, math.Inf(1), 0.018, 12.0)
	f.Add(2e-3, 2e-3, 0.01, 30.0)
	f.Fuzz(func(t *testing.T, tauEff, tauBulk, w, d float64) {
		s, err := lifetime.SeffFromLifetime(tauEff, tauBulk, w, d)
		if err != nil {
			return
		}
		if math.IsNaN(s) || s < 0 || math.IsInf(s, 0) {
			t.Fatalf("Seff %g", s)
		}
		back, err := surface.EffectiveLifetime(tauBulk, w, d, s, s)
		if err != nil {
			return // e.g. w or d beyond what the forward solver accepts
		}
		if h := s * w / d; h < 1e8 && math.Abs(back/tauEff-1) > 1e-8 {
			t.Fatalf("τeff %g s, τbulk %g s, W %g cm, D %g: Seff %g cm/s gives back %g s", tauEff, tauBulk, w, d, s, back)
		}
	})
}

// FuzzAnalyze: the analysis of any short decay or flash, with noise, returns finite results or
// an error; never NaN or a panic.
func FuzzAnalyze(f *testing.F) {
	f.Add(uint16(50), 1e-4, 1e-3, 0.01, uint8(0), uint64(1))
	f.Add(uint16(5), 1e-6, 1e-9, 0.5, uint8(1), uint64(2))
	f.Add(uint16(300), 1e-3, 10.0, 0.0, uint8(2), uint64(3))
	f.Add(uint16(40), 1e-5, 1e-2, 2.0, uint8(2), uint64(4))
	b := wafer(f, 1e15, 0)
	f.Fuzz(func(t *testing.T, n uint16, tau, sigma0, noise float64, mode uint8, seed uint64) {
		if n > 2000 || !(tau > 0) || math.IsInf(tau, 0) || math.IsNaN(sigma0) || math.IsInf(sigma0, 0) || !(noise >= 0) || noise > 10 {
			return
		}
		rng := rand.New(rand.NewPCG(seed, 7))
		tr := lifetime.Trace{Unit: lifetime.Suns}
		for i := range int(n) {
			x := float64(i) / float64(max(n, 1))
			tr.Time = append(tr.Time, 5*tau*x)
			tr.Conductance = append(tr.Conductance, sigma0*math.Exp(-5*x)*(1+noise*rng.NormFloat64()))
			tr.Illumination = append(tr.Illumination, math.Exp(-5*x))
		}
		a := analysis(b, lifetime.Mode(mode%3+1))
		r, err := a.Analyze(tr)
		if err != nil {
			return
		}
		for i := range r.Dn {
			for _, v := range []float64{r.Dn[i], r.TauEff[i], r.IVoc[i], r.Suns[i]} {
				if math.IsNaN(v) || math.IsInf(v, 0) || v <= 0 {
					t.Fatalf("point %d: Δn %g, τ %g, iVoc %g, suns %g", i, r.Dn[i], r.TauEff[i], r.IVoc[i], r.Suns[i])
				}
			}
		}
		if fit, err := r.J0s(lifetime.J0sOptions{DnMin: 1e12, DnMax: 1e17}); err == nil {
			if math.IsNaN(fit.J0s) || math.IsNaN(fit.J0sErr) || math.IsNaN(fit.Intercept) {
				t.Fatalf("J0s fit %+v", fit)
			}
		}
		if v, err := r.ImpliedVoc(1); err == nil && (math.IsNaN(v) || math.IsInf(v, 0)) {
			t.Fatalf("iVoc %g", v)
		}
	})
}
