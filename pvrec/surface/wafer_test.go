package surface

import (
	"math"
	"testing"

	"github.com/pvrec/pvrec/pvrec/internal/reftable"
)

// TestLifetimeReference: fundamental-mode roots of Sproul's equation, A. B. Sproul,
// J. Appl. Phys. 76, 2851 (1994), against mpmath at 40 digits
// (testdata/reference/surface_sproul.py), for hi = Si W/D from 1e-6 to 1e7 including asymmetric
// wafers. Tolerance 1e-13 relative in τs: the root is solved to a few ulp in x.
func TestLifetimeReference(t *testing.T) {
	const w, d = 0.018, 30.0 // 180 µm, cm^2/s
	rows := reftable.Load(t, "surface_sproul").Rows
	if len(rows) < 60 {
		t.Fatalf("only %d rows", len(rows))
	}
	for _, row := range rows {
		h1, h2, want := reftable.Float(t, row[0]), reftable.Float(t, row[1]), reftable.Float(t, row[3])
		for _, swap := range []bool{false, true} {
			s1, s2 := h1*d/w, h2*d/w
			if swap {
				s1, s2 = s2, s1
			}
			ts, err := Lifetime(w, d, s1, s2)
			if err != nil {
				t.Fatal(err)
			}
			if e := relErr(ts*d/(w*w), want); e > 1e-13 {
				t.Errorf("h = %g, %g: τs D/W² = %.16g, want %.16g (%.2g)", h1, h2, ts*d/(w*w), want, e)
			}
		}
	}
}

// TestSproulApproximation: Sproul's approximation τs ≈ W/(2S) + W²/(π² D) (Sproul 1994, stated
// accuracy about 5 %, value from memory) against the exact solution over hi = S W/D from 1e-6
// to 1e6: the largest deviation is between 5.0 % and 5.1 % and lies near S W/D = 5
// (our computation, which reproduces Sproul's statement).
func TestSproulApproximation(t *testing.T) {
	const w, d = 0.02, 10.0
	worst, at := 0.0, 0.0
	for lh := -6.0; lh <= 6; lh += 0.01 {
		h := math.Pow(10, lh)
		s := h * d / w
		ex, err1 := Lifetime(w, d, s, s)
		ap, err2 := LifetimeSproul(w, d, s)
		if err1 != nil || err2 != nil {
			t.Fatal(err1, err2)
		}
		if e := relErr(ap, ex); e > worst {
			worst, at = e, h
		}
	}
	if !(worst > 0.050 && worst < 0.051) || !(at > 3 && at < 8) {
		t.Errorf("largest deviation %.4f at S W/D = %.3g; want 5.0–5.1 %% near 5", worst, at)
	}
	// One-sided wafer by mirror symmetry (derived): exact τs(W; S, 0) = τs(2W; S, S).
	for _, s := range []float64{1, 100, 1e4, math.Inf(1)} {
		a, _ := Lifetime(w, d, s, 0)
		b, _ := Lifetime(2*w, d, s, s)
		if relErr(a, b) > 1e-13 {
			t.Errorf("S = %g: one-sided %.15g, mirrored %.15g", s, a, b)
		}
	}
}

// TestLowSApproximation: τs ≈ W/(S1+S2) has the relative error h1h2/(h1+h2) − (h1+h2)/3 to first
// order (derived in LifetimeLowS), with a remainder below (h1+h2)².
func TestLowSApproximation(t *testing.T) {
	const w, d = 0.018, 30.0
	for _, h := range [][2]float64{{1e-4, 0}, {1e-3, 1e-3}, {0.01, 0.05}, {0.02, 0}, {0.03, 0.001}, {0.1, 0.1}} {
		s1, s2 := h[0]*d/w, h[1]*d/w
		ex, err1 := Lifetime(w, d, s1, s2)
		ap, err2 := LifetimeLowS(w, s1, s2)
		if err1 != nil || err2 != nil {
			t.Fatal(err1, err2)
		}
		sum, prod := h[0]+h[1], h[0]*h[1]
		pred := prod/sum - sum/3
		if e := ap/ex - 1; math.Abs(e-pred) > sum*sum {
			t.Errorf("h = %v: error %.6g, first-order prediction %.6g", h, e, pred)
		}
	}
	if ts, _ := LifetimeLowS(0.018, 0, 0); !math.IsInf(ts, 1) {
		t.Errorf("S = 0: %g, want +Inf", ts)
	}
}

// TestLifetimeLimits: closed forms of the exact equation (Sproul 1994): x = π for two
// ideal sinks (τs = W²/(π² D)), x = π/2 for one sink and one perfect surface (4W²/(π² D)),
// no surface recombination gives τs = +Inf; τs falls monotonically with S.
func TestLifetimeLimits(t *testing.T) {
	const w, d = 0.016, 25.0
	inf := math.Inf(1)
	lim, _ := LifetimeDiffusionLimit(w, d)
	for _, c := range []struct {
		s1, s2, want float64
	}{
		{inf, inf, w * w / (math.Pi * math.Pi * d)},
		{inf, 0, 4 * w * w / (math.Pi * math.Pi * d)},
		{0, inf, 4 * w * w / (math.Pi * math.Pi * d)},
		{0, 0, inf},
		{1e15, 1e15, lim}, // x = π(1 − 2/h) to first order: 6e-12 relative here
	} {
		got, err := Lifetime(w, d, c.s1, c.s2)
		if err != nil || relErr(got, c.want) > 1e-9 {
			t.Errorf("S = %g, %g: τs = %g, %v; want %g", c.s1, c.s2, got, err, c.want)
		}
	}
	prev := inf
	for s := 1e-3; s < 1e9; s *= 3 {
		ts, _ := Lifetime(w, d, s, s/2)
		if !(ts < prev) {
			t.Errorf("S = %g: τs = %g not below %g", s, ts, prev)
		}
		prev = ts
	}
	// Effective lifetime: harmonic sum with the bulk; +Inf bulk gives τs.
	ts, _ := Lifetime(w, d, 10, 20)
	te, err := EffectiveLifetime(1e-3, w, d, 10, 20)
	if err != nil || relErr(te, 1/(1/1e-3+1/ts)) > 1e-15 {
		t.Errorf("EffectiveLifetime = %g, %v", te, err)
	}
	if te, _ := EffectiveLifetime(inf, w, d, 10, 20); te != ts {
		t.Errorf("EffectiveLifetime(+Inf bulk) = %g, want %g", te, ts)
	}
	if te, _ := EffectiveLifetime(2e-3, w, d, 0, 0); te != 2e-3 {
		t.Errorf("EffectiveLifetime(S = 0) = %g, want τb", te)
	}
}

func TestWaferErrors(t *testing.T) {
	nan := math.NaN()
	for name, f := range map[string]func() (float64, error){
		"w zero":        func() (float64, error) { return Lifetime(0, 30, 1, 1) },
		"w NaN":         func() (float64, error) { return Lifetime(nan, 30, 1, 1) },
		"d negative":    func() (float64, error) { return Lifetime(0.02, -1, 1, 1) },
		"d Inf":         func() (float64, error) { return Lifetime(0.02, math.Inf(1), 1, 1) },
		"s1 negative":   func() (float64, error) { return Lifetime(0.02, 30, -1, 1) },
		"s2 NaN":        func() (float64, error) { return Lifetime(0.02, 30, 1, nan) },
		"tauBulk zero":  func() (float64, error) { return EffectiveLifetime(0, 0.02, 30, 1, 1) },
		"tauBulk NaN":   func() (float64, error) { return EffectiveLifetime(nan, 0.02, 30, 1, 1) },
		"Sproul s NaN":  func() (float64, error) { return LifetimeSproul(0.02, 30, nan) },
		"LowS Inf":      func() (float64, error) { return LifetimeLowS(0.02, math.Inf(1), 0) },
		"LowS w":        func() (float64, error) { return LifetimeLowS(-1, 1, 0) },
		"LowS s2":       func() (float64, error) { return LifetimeLowS(0.02, 1, -2) },
		"Diffusion d 0": func() (float64, error) { return LifetimeDiffusionLimit(0.02, 0) },
	} {
		if v, err := f(); err == nil {
			t.Errorf("%s: no error (got %g)", name, v)
		}
	}
}
