package recomb

import (
	"math"
	"strings"
	"testing"
)

// TestAmphotericLimits: when one transition lies at a band edge and its capture that leads
// into the third charge state is switched off (time constant 1e20 s), the defect never reaches
// that state and Amphoteric reduces to single-level SRH through the other transition (limit
// derived from the rate of Sah & Shockley, Phys. Rev. 109, 1103 (1958)). Tolerance 1e-9: the
// neglected terms are of order (τ/1e20 s)·(majority/minority density) <= 1e-25·1e12 and
// ni²/(Nc p) or ni²/(Nv n), far below it.
func TestAmphotericLimits(t *testing.T) {
	mat := newFixed()
	for _, d := range []struct{ nd, na float64 }{{0, 1e16}, {1e15, 0}} {
		b, err := NewBulk(mat, d.nd, d.na)
		if err != nil {
			t.Fatal(err)
		}
		for _, dn := range []float64{1e10, 1e14, 1e17} {
			s, err := b.State(dn)
			if err != nil {
				t.Fatal(err)
			}
			lvl := FromEi(-0.1)
			// (0/−) at the conduction-band edge: D− never forms.
			a := Amphoteric{Level1: lvl, Level2: BelowEc(0), TauN1: 1e-5, TauP1: 3e-5, TauN2: 1e20, TauP2: 4e-5}
			srh := SRH{Level: lvl, TauN0: 1e-5, TauP0: 3e-5}
			if got, want := mustRate(t, a, s), mustRate(t, srh, s); relErr(got, want) > 1e-9 {
				t.Errorf("%+v Δn=%g: (0/−) at Ec: R = %g, SRH %g", d, dn, got, want)
			}
			// (+/0) at the valence-band edge: D+ never forms.
			a = Amphoteric{Level1: AboveEv(0), Level2: lvl, TauN1: 1e-5, TauP1: 1e20, TauN2: 2e-5, TauP2: 4e-5}
			srh = SRH{Level: lvl, TauN0: 2e-5, TauP0: 4e-5}
			if got, want := mustRate(t, a, s), mustRate(t, srh, s); relErr(got, want) > 1e-9 {
				t.Errorf("%+v Δn=%g: (+/0) at Ev: R = %g, SRH %g", d, dn, got, want)
			}
		}
	}
}

// TestAmphotericEquilibriumOccupation: in thermal equilibrium the steady-state fractions are
// the Fermi–Dirac occupations, f0/f+ = n0/n1₁ and f−/f0 = n0/n1₂ (detailed balance), and the
// net rate is zero.
func TestAmphotericEquilibriumOccupation(t *testing.T) {
	mat := newFixed()
	a := Amphoteric{Level1: AboveEv(0.3), Level2: BelowEc(0.35), TauN1: 1e-6, TauP1: 5e-5, TauN2: 7e-5, TauP2: 2e-6}
	for _, d := range []struct{ nd, na float64 }{{0, 1e15}, {1e16, 0}, {0, 0}} {
		b, err := NewBulk(mat, d.nd, d.na)
		if err != nil {
			t.Fatal(err)
		}
		s, err := b.State(0)
		if err != nil {
			t.Fatal(err)
		}
		fp, f0, fm, err := a.Fractions(s)
		if err != nil {
			t.Fatal(err)
		}
		if relErr(fp+f0+fm, 1) > 1e-15 {
			t.Errorf("%+v: fractions sum to %.17g", d, fp+f0+fm)
		}
		n11, _, _ := a.Level1.n1p1(s)
		n12, _, _ := a.Level2.n1p1(s)
		if relErr(f0/fp, s.N/n11) > 1e-12 || relErr(fm/f0, s.N/n12) > 1e-12 {
			t.Errorf("%+v: f0/f+ = %g (want %g), f−/f0 = %g (want %g)", d, f0/fp, s.N/n11, fm/f0, s.N/n12)
		}
		if r := mustRate(t, a, s); r != 0 {
			t.Errorf("%+v: equilibrium rate %g, want 0", d, r)
		}
	}
}

// TestAmphotericPositiveAndBadInput: finite, positive rates on a grid; errors for bad input.
func TestAmphotericPositiveAndBadInput(t *testing.T) {
	mat := newFixed()
	a := Amphoteric{Level1: AboveEv(0.2), Level2: BelowEc(0.2), TauN1: 1e-6, TauP1: 1e-4, TauN2: 1e-4, TauP2: 1e-6}
	for _, na := range []float64{0, 1e12, 1e16, 1e20} {
		b, err := NewBulk(mat, 0, na)
		if err != nil {
			t.Fatal(err)
		}
		for _, dn := range []float64{1e8, 1e12, 1e16, 1e19} {
			tau, err := b.Lifetime(a, dn)
			if err != nil || !(tau > 0) || math.IsInf(tau, 0) {
				t.Errorf("Na=%g Δn=%g: τ = %g, %v", na, dn, tau, err)
			}
		}
	}
	b, _ := NewBulk(mat, 0, 1e16)
	s, _ := b.State(1e14)
	for name, m := range map[string]Amphoteric{
		"TauN1": {Level1: AboveEv(0.2), Level2: BelowEc(0.2), TauN1: 0, TauP1: 1, TauN2: 1, TauP2: 1},
		"TauP2": {Level1: AboveEv(0.2), Level2: BelowEc(0.2), TauN1: 1, TauP1: 1, TauN2: 1, TauP2: math.NaN()},
		"gap":   {Level1: AboveEv(-0.1), Level2: BelowEc(0.2), TauN1: 1, TauP1: 1, TauN2: 1, TauP2: 1},
		"Ref":   {Level1: Level{E: 0.2}, Level2: BelowEc(0.2), TauN1: 1, TauP1: 1, TauN2: 1, TauP2: 1},
	} {
		if _, err := m.Rate(s); err == nil || !strings.HasPrefix(err.Error(), "recomb: ") {
			t.Errorf("%s: error %v", name, err)
		}
	}
}

func mustRate(t *testing.T, m Mechanism, s State) float64 {
	t.Helper()
	r, err := m.Rate(s)
	if err != nil {
		t.Fatal(err)
	}
	return r
}
