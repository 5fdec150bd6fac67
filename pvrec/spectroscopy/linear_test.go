package spectroscopy

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// The line of a noise-free single-level curve in silicon without band-gap narrowing has the
// closed-form intercept and slope of Line's doc comment (derived from the SRH lifetime of
// Shockley and Read (1952) and Hall (1952); the p-type form is that of J. D. Murphy et al.,
// J. Appl. Phys. 111, 113709 (2012)), High = τn0 + τp0, and At(true level) returns the true
// τn0, τp0 and k. Tolerance 1e-8 of the larger coefficient: the form neglects n0/p0 = 1e-12
// (p0/n0 in n-type), and the fit rounds.
func TestLineClosedForm(t *testing.T) {
	m := simple(t)
	vth := silicon.NewGreen1990ThermalVelocity()
	ve, vh, err := vth.At(300)
	if err != nil {
		t.Fatal(err)
	}
	const tn, tp = 2e-5, 1e-4
	for _, tc := range []struct {
		name   string
		nd, na float64
		e      float64 // Et − Ei, eV
		deep   bool
	}{
		{"p-type, deep", 0, 1e16, 0.1, true},
		{"p-type, upper half", 0, 1e16, 0.35, false},
		{"p-type, lower half", 0, 1e15, -0.3, true},
		{"n-type, deep", 1e15, 0, -0.05, true},
		{"n-type, lower half", 1e15, 0, -0.3, false},
	} {
		t.Run(tc.name, func(t *testing.T) {
			b := bulk(t, m, tc.nd, tc.na)
			lvl := recomb.SRH{Level: recomb.FromEi(tc.e), TauN0: tn, TauP0: tp}
			l, err := Linearise(synthetic(t, b, lvl, logspace(1e12, 1e17, 40), 0, 1), vth)
			if err != nil {
				t.Fatal(err)
			}
			n1, p1 := m.Ni()*math.Exp(tc.e/m.Vt()), m.Ni()*math.Exp(-tc.e/m.Vt())
			eq := b.Equilibrium()
			var i0, s0 float64
			if tc.na > 0 {
				i0 = tn*(1+p1/eq.P0) + tp*n1/eq.P0
				s0 = tp*(1-n1/eq.P0) - tn*p1/eq.P0
			} else {
				i0 = tp*(1+n1/eq.N0) + tn*p1/eq.N0
				s0 = tn*(1-p1/eq.N0) - tp*n1/eq.N0
			}
			scale := math.Max(math.Abs(i0), math.Abs(s0))
			if math.Abs(l.Intercept-i0) > 1e-8*scale || math.Abs(l.Slope-s0) > 1e-8*scale {
				t.Errorf("intercept %g s, slope %g s; closed form %g, %g s", l.Intercept, l.Slope, i0, s0)
			}
			if !near(l.High, tn+tp, 1e-8) {
				t.Errorf("High = %g s, want τn0 + τp0 = %g s", l.High, tn+tp)
			}
			if l.PType != (tc.na > 0) || l.Flags != 0 {
				t.Errorf("PType %v, flags %v (%q)", l.PType, l.Flags, l.Reasons)
			}
			if tc.deep {
				// the deep reading neglects n1/p0 and p1/p0 (n-type: /n0)
				maj := math.Max(eq.N0, eq.P0)
				tol := 2 * (tp/tn + tn/tp) * (n1 + p1) / maj
				if !l.Deep || !near(l.DeepTauN0, tn, tol) || !near(l.DeepTauP0, tp, tol) || !near(l.DeepK, tp/tn*vh/ve, 2*tol) {
					t.Errorf("deep: %v τn0 = %g, τp0 = %g s, k = %g; want %g, %g s, %g (tol %g)", l.Deep, l.DeepTauN0, l.DeepTauP0, l.DeepK, tn, tp, tp/tn*vh/ve, tol)
				}
			}
			srh, k, err := l.At(lvl.Level)
			if err != nil {
				t.Fatal(err)
			}
			if !near(srh.TauN0, tn, 1e-7) || !near(srh.TauP0, tp, 1e-7) || !near(k, tp/tn*vh/ve, 1e-7) {
				t.Errorf("At(true level): τn0 = %g, τp0 = %g s, k = %g", srh.TauN0, srh.TauP0, k)
			}
		})
	}
}

// Every solution of At reproduces the whole curve (τ is linear in X for every level): the
// one-parameter family of exact fits of a single curve. Derived here (no source).
func TestLineAtFamily(t *testing.T) {
	b := bulk(t, simple(t), 0, 1e16)
	c := synthetic(t, b, recomb.SRH{Level: recomb.FromEi(-0.2), TauN0: 5e-5, TauP0: 5e-3}, logspace(1e13, 1e17, 25), 0, 1)
	l, err := Linearise(c, silicon.ThermalVelocity{})
	if err != nil {
		t.Fatal(err)
	}
	solved := 0
	for e := -0.5; e <= 0.5; e += 0.05 {
		srh, _, err := l.At(recomb.FromEi(e))
		if errors.Is(err, pvrec.ErrOutOfRange) {
			continue
		}
		if err != nil {
			t.Fatal(err)
		}
		solved++
		tau, err := b.Lifetimes(srh, c.Dn)
		if err != nil {
			t.Fatal(err)
		}
		for i := range tau {
			if !near(tau[i], c.Tau[i], 1e-9) {
				t.Errorf("Et − Ei = %.2f eV, Δn = %g: τ = %g s, curve %g s", e, c.Dn[i], tau[i], c.Tau[i])
				break
			}
		}
	}
	if solved < 5 {
		t.Errorf("only %d levels solve the line", solved)
	}
}

// Curves that are not a line (two levels) are flagged; the line of a shallow level is not
// read as a deep one; bad input gives errors.
func TestLineFlagsAndErrors(t *testing.T) {
	m := material(t, 300)
	two := recomb.Sum{recomb.IronBoronPair(1e12), recomb.InterstitialIron(3e11)}
	l, err := Linearise(curvesOf(t, two, sample{300, 0, 1e15})[0], silicon.ThermalVelocity{})
	if err != nil {
		t.Fatal(err)
	}
	if l.Flags&PoorFit == 0 {
		t.Errorf("two levels: flags %v, want PoorFit", l.Flags)
	}
	b := bulk(t, simple(t), 0, 1e15)
	shallow := recomb.SRH{Level: recomb.FromEi(0.4), TauN0: 1e-5, TauP0: 1e-5} // n1 ≈ 5e16 > p0
	l, err = Linearise(synthetic(t, b, shallow, logspace(1e12, 1e16, 20), 0, 1), silicon.ThermalVelocity{})
	if err != nil {
		t.Fatal(err)
	}
	if l.Deep || l.DeepK != 0 || len(l.Reasons) != 1 || !strings.Contains(l.Reasons[0], "not the line of a deep level") {
		t.Errorf("shallow level: Deep %v, k %g, reasons %q", l.Deep, l.DeepK, l.Reasons)
	}
	if _, _, err := (Line{}).At(recomb.FromEi(0)); err == nil {
		t.Error("At of the zero Line: no error")
	}
	if _, _, err := l.At(recomb.AboveEv(2)); !errors.Is(err, pvrec.ErrOutOfRange) {
		t.Errorf("At above Ec: got %v, want a range error", err)
	}
	if _, _, err := l.At(recomb.Level{E: 0.1}); err == nil {
		t.Error("At of a level without reference: no error")
	}
	if _, err := Linearise(Curve{Bulk: bulk(t, m, 0, 1e16)}, silicon.ThermalVelocity{}); err == nil {
		t.Error("empty curve: no error")
	}
}
