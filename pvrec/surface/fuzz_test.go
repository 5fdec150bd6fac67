package surface

import (
	"math"
	"testing"

	"github.com/pvrec/pvrec/pvrec/recomb"
)

// FuzzSurfacePotential fuzzes the surface-potential solve of ExtendedSRH over fixed charge,
// doping, injection, polarity, interface-state charge, Dit and cross-section ratio. It must
// never panic or return NaN; inside the range (|Qf| <= 1e13 cm^-2, dopants 1e14–1e18,
// Δn 1e12–1e17 cm^-3, with margins) it must converge, with charge neutrality to ResidualTol and
// ns ps = n p; any error outside the validity range must be pvrec.ErrOutOfRange or an input error.
//
//	go test -fuzz FuzzSurfacePotential -fuzztime 30s ./pvrec/surface/
func FuzzSurfacePotential(f *testing.F) {
	for _, s := range []struct {
		qf, lgDop, lgDn float64
		pType, charged  bool
		lgRatio, lgDit  float64
	}{
		{0, 16, 15, true, false, 0, 11},
		{-1e12, 16, 15, true, true, 1, 11},
		{1e13, 14, 12, true, true, -2, 12},
		{-1e13, 18, 17, false, true, 2, 13},
		{3e11, 15, 13, false, false, 0, 10},
		{-1e10, 17, 12, false, true, -1, 12.5},
		{2e13, 16, 15, true, false, 0, 11}, // out of range
		{math.NaN(), 16, 15, true, false, 0, 11},
		{1e12, 19, 15, true, true, 0, 11},
		{1e12, 16, -400, true, true, 0, 11},
	} {
		f.Add(s.qf, s.lgDop, s.lgDn, s.pType, s.charged, s.lgRatio, s.lgDit)
	}
	mat := defaultMaterial(f)
	f.Fuzz(func(t *testing.T, qf, lgDop, lgDn float64, pType, charged bool, lgRatio, lgDit float64) {
		dop, dn := math.Pow(10, lgDop), math.Pow(10, lgDn)
		nd, na := dop, 0.0
		if pType {
			nd, na = 0, dop
		}
		w, err := recomb.NewBulk(mat, nd, na)
		if err != nil {
			return // invalid densities; NewBulk's own checks are tested in recomb
		}
		b, err := w.State(dn)
		if err != nil {
			return
		}
		ratio := math.Pow(10, lgRatio)
		dit := UShapedDit{Mid: math.Pow(10, lgDit), TailC: 1e13, TailV: 1e13, Ec: 0.56, Ev: -0.56, WidthC: 0.1, WidthV: 0.1}
		m := NewExtendedSRH(dit, ConstantSigma(1e-16*ratio), ConstantSigma(1e-16/ratio), qf)
		m.ChargedStates = charged
		r, err := m.Solve(b)
		inRange := math.Abs(qf) <= MaxFixedCharge && lgDop >= 13 && lgDop <= 18 && lgDn >= 10 && lgDn <= 17.5 &&
			math.Abs(lgRatio) <= 4 && lgDit >= 0 && lgDit <= 14
		if err != nil {
			if inRange {
				t.Fatalf("Qf %g, dop %g (p=%v), Δn %g, charged %v, σ ratio %g, Dit %g: %v", qf, dop, pType, dn, charged, ratio, dit.Mid, err)
			}
			return
		}
		for _, v := range []float64{r.Psi, r.Ns, r.Ps, r.Qit, r.Qs, r.Us, r.Seff, r.J0s} {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				t.Fatalf("non-finite result %+v", r)
			}
		}
		if math.Abs(r.Qf+r.Qit+r.Qs) > ResidualTol*(math.Abs(r.Qf)+math.Abs(r.Qit)+math.Abs(r.Qs)) {
			t.Fatalf("residual %g at %+v", r.Qf+r.Qit+r.Qs, r)
		}
		if relErr(r.Ns*r.Ps, b.N*b.P) > 1e-12 {
			t.Fatalf("ns ps = %g, n p = %g", r.Ns*r.Ps, b.N*b.P)
		}
		if r.Seff < 0 || r.J0s < 0 {
			t.Fatalf("negative Seff %g or J0s %g", r.Seff, r.J0s)
		}
	})
}

// FuzzLifetime fuzzes the fundamental-mode root of Sproul's equation. It must never
// panic; for valid input τs must lie above both of its lower bounds, the diffusion limit
// W²/(π² D) (two ideal sinks) and the uniform-Δn value W/(S1 + S2) (the carrier profile can
// only dip towards the surfaces). Accuracy is checked by TestLifetimeReference.
//
//	go test -fuzz FuzzLifetime -fuzztime 30s ./pvrec/surface/
func FuzzLifetime(f *testing.F) {
	f.Add(0.018, 30.0, 10.0, 10.0)
	f.Add(0.018, 30.0, 1e7, 0.0)
	f.Add(0.02, 1.0, 1e-9, 3e-9)
	f.Add(0.01, 50.0, math.Inf(1), 5.0)
	f.Add(0.0, 30.0, 1.0, 1.0)
	f.Fuzz(func(t *testing.T, w, d, s1, s2 float64) {
		ts, err := Lifetime(w, d, s1, s2)
		if err != nil {
			return
		}
		if math.IsNaN(ts) || ts <= 0 {
			t.Fatalf("τs = %g for w %g d %g s %g %g", ts, w, d, s1, s2)
		}
		if math.IsInf(ts, 1) {
			if s1+s2 > 0 && w*(s1+s2)/d > 1e-300 {
				t.Fatalf("τs = +Inf with S = %g, %g", s1, s2)
			}
			return
		}
		lim := w * w / (math.Pi * math.Pi * d)
		low := w / (s1 + s2)
		if ts < lim*(1-1e-12) || ts < low*(1-1e-12) {
			t.Fatalf("w %g d %g s %g %g: τs = %g below bounds %g, %g", w, d, s1, s2, ts, lim, low)
		}
	})
}
