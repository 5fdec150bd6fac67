package spectroscopy

import (
	"errors"
	"math"
	"testing"

	"github.com/pvrec/pvrec/pvrec"
	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// The unit lifetimes a, b (τ = τp0 a + τn0 b) reproduce the SRH closed form at every
// injection, and its limits: at low injection in p-type τ → τn0 (1 + p1/p0) + τp0 n1/p0 (n0
// neglected), at high injection τ → τn0 + τp0. Shockley and Read (1952), Hall (1952); the
// limits follow from the expression (derived). Tolerance 1e-12: rounding of a few operations.
func TestUnitsClosedForm(t *testing.T) {
	m := simple(t)
	const tn, tp = 1e-5, 3e-4
	for _, tc := range []struct {
		name   string
		nd, na float64
	}{{"p-type 1e16", 0, 1e16}, {"n-type 1e15", 1e15, 0}} {
		b := bulk(t, m, tc.nd, tc.na)
		dn := logspace(1e6, 1e20, 15)
		pc, err := prepare(Curve{Bulk: b, Dn: dn, Tau: dn}, 0, silicon.NewGreen1990ThermalVelocity())
		if err != nil {
			t.Fatal(err)
		}
		a, bb := make([]float64, len(dn)), make([]float64, len(dn))
		for _, e := range []float64{-0.45, -0.2, 0, 0.1, 0.3, 0.5} {
			if err := pc.units(recomb.FromIntrinsic, e, a, bb); err != nil {
				t.Fatal(err)
			}
			for i, d := range dn {
				got := tp*a[i] + tn*bb[i]
				if want := closedForm(b, e, tn, tp, d); !near(got, want, 1e-12) {
					t.Errorf("%s, Et − Ei = %g eV, Δn = %g: τ = %g s, closed form %g s", tc.name, e, d, got, want)
				}
			}
			eq := b.Equilibrium()
			n1, p1 := m.Ni()*math.Exp(e/m.Vt()), m.Ni()*math.Exp(-e/m.Vt())
			if tc.na > 0 {
				lli := tn*(1+p1/eq.P0) + tp*n1/eq.P0
				// the neglected terms are τp0 (Δn + n0)/p0 and τ·(Δn + n0)/p0 (derived), so the
				// relative error is at most (1 + τp0/τn0)(Δn + n0)/p0, 3.1e-9 here
				tol := (1 + tp/tn) * (dn[0] + eq.N0) / eq.P0
				if got := tp*a[0] + tn*bb[0]; !near(got, lli, tol) {
					t.Errorf("%s, Et − Ei = %g eV: low-injection τ = %g s, want %g s (tol %g)", tc.name, e, got, lli, tol)
				}
			}
			hli := tn + tp
			last := len(dn) - 1
			// relative corrections of order (n0 + p0 + n1 + p1)/Δn
			tol := 2 * (eq.N0 + eq.P0 + n1 + p1) / dn[last]
			if got := tp*a[last] + tn*bb[last]; !near(got, hli, tol) {
				t.Errorf("%s, Et − Ei = %g eV: high-injection τ = %g s, want τn0 + τp0 = %g s (tol %g)", tc.name, e, got, hli, tol)
			}
		}
	}
}

// rss returns the exact ln τn0 and a zero cost for data of the model itself
// (common practice, no source: the least-squares constant is the mean).
func TestRSSExact(t *testing.T) {
	a := []float64{1, 2, 3, 4}
	b := []float64{0.5, 0.1, 3, 7}
	const kappa, tn = 2.5, 1e-4
	y := make([]float64, len(a))
	for i := range a {
		y[i] = math.Log(tn * (kappa*a[i] + b[i]))
	}
	c, lt := rss(y, a, b, kappa)
	if c > 1e-28 || !near(math.Exp(lt), tn, 1e-14) {
		t.Errorf("rss = %g, τn0 = %g s; want 0 and %g s", c, math.Exp(lt), tn)
	}
	y[0] += 0.1 // residuals 0.1 − 0.025 and −0.025 (×3): cost 0.0075
	if c, _ := rss(y, a, b, kappa); !near(c, 0.0075, 1e-12) {
		t.Errorf("rss = %g, want 0.0075", c)
	}
}

// The mirror symmetry of SRH at one temperature (derived in the package doc): a level in the
// upper half with n1 and the level in the lower half with p1' = κ n1 (κ = τp0/τn0), with the
// same τn0 and τp0, give the same lifetime at every doping of either type and every
// injection, up to the neglected τn0 p1 and τp0 n1' against τ (n0 + p0 + Δn) (below 1e-8
// here). The reason Fit flags BranchesNotSeparated for curves at one temperature.
func TestMirrorSymmetry(t *testing.T) {
	m := simple(t)
	const tn, tp = 2e-5, 6e-5
	const e = 0.25 // upper level, eV above Ei
	n1 := m.Ni() * math.Exp(e/m.Vt())
	mirror := -m.Vt() * math.Log(tp/tn*n1/m.Ni()) // p1' = ni exp(−e'/kT) = κ n1
	up := recomb.SRH{Level: recomb.FromEi(e), TauN0: tn, TauP0: tp}
	down := recomb.SRH{Level: recomb.FromEi(mirror), TauN0: tn, TauP0: tp}
	for _, dop := range [][2]float64{{0, 1e15}, {0, 1e16}, {0, 1e17}, {1e15, 0}, {1e17, 0}} {
		b := bulk(t, m, dop[0], dop[1])
		for _, dn := range logspace(1e12, 1e17, 11) {
			tu, err := b.Lifetime(up, dn)
			if err != nil {
				t.Fatal(err)
			}
			td, err := b.Lifetime(down, dn)
			if err != nil {
				t.Fatal(err)
			}
			if !near(td, tu, 1e-8) {
				t.Errorf("Nd, Na = %g, Δn = %g: upper level τ = %g s, mirror (Et − Ei = %.4f eV) τ = %g s", dop, dn, tu, mirror, td)
			}
		}
	}
}

// ConvertLevel moves a level between references without moving it: the SRH rate of the
// converted level equals the original's (to rounding), and conversions round-trip; a level
// outside the gap is a range error. Property (no source).
func TestConvertLevel(t *testing.T) {
	m := material(t, 300)
	b := bulk(t, m, 0, 1e16)
	s, err := b.State(1e14)
	if err != nil {
		t.Fatal(err)
	}
	refs := []recomb.EnergyRef{recomb.FromValence, recomb.FromConduction, recomb.FromIntrinsic}
	for _, l := range []recomb.Level{recomb.AboveEv(0.38), recomb.BelowEc(0.26), recomb.FromEi(-0.1), recomb.FromEi(0.5)} {
		r0, err := recomb.SRH{Level: l, TauN0: 1e-5, TauP0: 1e-4}.Rate(s)
		if err != nil {
			t.Fatal(err)
		}
		for _, ref := range refs {
			c, err := ConvertLevel(l, m, ref)
			if err != nil {
				t.Fatal(err)
			}
			if c.Ref != ref {
				t.Errorf("ConvertLevel(%v, %d) = %v: wrong reference", l, ref, c)
			}
			r, err := recomb.SRH{Level: c, TauN0: 1e-5, TauP0: 1e-4}.Rate(s)
			if err != nil {
				t.Fatal(err)
			}
			if !near(r, r0, 1e-11) {
				t.Errorf("%v as %v: rate %g, want %g", l, c, r, r0)
			}
			back, err := ConvertLevel(c, m, l.Ref)
			if err != nil || math.Abs(back.E-l.E) > 1e-14 {
				t.Errorf("%v → %v → %v (%v)", l, c, back, err)
			}
		}
	}
	if _, err := ConvertLevel(recomb.AboveEv(1.5), m, recomb.FromIntrinsic); !errors.Is(err, pvrec.ErrOutOfRange) {
		t.Errorf("level above Ec: got %v, want a range error", err)
	}
	for _, bad := range []struct {
		l   recomb.Level
		m   *silicon.Material
		ref recomb.EnergyRef
	}{
		{recomb.Level{E: 0.3}, m, recomb.FromIntrinsic},
		{recomb.AboveEv(math.NaN()), m, recomb.FromIntrinsic},
		{recomb.AboveEv(0.3), nil, recomb.FromIntrinsic},
		{recomb.AboveEv(0.3), &silicon.Material{}, recomb.FromIntrinsic},
		{recomb.AboveEv(0.3), m, 0},
	} {
		if _, err := ConvertLevel(bad.l, bad.m, bad.ref); err == nil {
			t.Errorf("ConvertLevel(%v, %v, %d): no error", bad.l, bad.m, bad.ref)
		}
	}
}

// The unit lifetimes computed from the relations of recomb.Level equal the lifetimes of
// recomb.SRH itself, the forward model, with one time constant 1 s and the other 1e-100 s
// (negligible), for every reference, with band-gap narrowing and Fermi–Dirac statistics, at
// several temperatures and both types. Tolerance 1e-12: rounding of the two evaluations.
func TestUnitsMatchRecomb(t *testing.T) {
	for _, temp := range []float64{250, 300, 400} {
		m := material(t, temp)
		for _, dop := range [][2]float64{{0, 1e16}, {3e15, 0}, {0, 1e18}} {
			b := bulk(t, m, dop[0], dop[1])
			dn := logspace(1e10, 1e18, 9)
			pc, err := prepare(Curve{Bulk: b, Dn: dn, Tau: dn}, 0, silicon.NewGreen1990ThermalVelocity())
			if err != nil {
				t.Fatal(err)
			}
			a, bb := make([]float64, len(dn)), make([]float64, len(dn))
			for _, l := range []recomb.Level{recomb.AboveEv(0.05), recomb.AboveEv(0.38), recomb.BelowEc(0.26), recomb.BelowEc(0.02), recomb.FromEi(-0.3), recomb.FromEi(0.1)} {
				if err := pc.units(l.Ref, l.E, a, bb); err != nil {
					t.Fatal(err)
				}
				for i, s := range pc.states {
					ta, err := recomb.Lifetime(recomb.SRH{Level: l, TauN0: 1e-100, TauP0: 1}, s)
					if err != nil {
						t.Fatal(err)
					}
					tb, err := recomb.Lifetime(recomb.SRH{Level: l, TauN0: 1, TauP0: 1e-100}, s)
					if err != nil {
						t.Fatal(err)
					}
					if !near(a[i], ta, 1e-12) || !near(bb[i], tb, 1e-12) {
						t.Errorf("T = %g K, Nd, Na = %g, level %v, Δn = %g: a, b = %g, %g s; recomb.SRH gives %g, %g s", temp, dop, l, s.Dn, a[i], bb[i], ta, tb)
					}
				}
			}
		}
	}
}
