package cell

import (
	"math"
	"testing"

	"github.com/pvrec/pvrec/pvrec/recomb"
)

// unit maps any finite float to [0, 1) (for fuzz arguments).
func unit(x float64) float64 { return math.Mod(math.Abs(x), 1) }

// FuzzOperatingPoints fuzzes the inversions of a cell with J0 parts (J0 from 1e-16 to 1e-9
// A/cm^2), Jph from 1e-4 to 0.1 A/cm^2, Rs from 0 to 2 Ω·cm², with or without an intrinsic base
// (default material, 300 K): the open circuit carries J_rec = Jph (1e-11 relative) and, without
// bulk recombination, has the ideal-diode Voc (1e-13); the point at a terminal voltage v in
// [−Jph·Rs, 1.05 Voc] meets v (V_i − J Rs = v to 1e-12 V) with J below Jph; no point of the
// curve exceeds the maximum power.
func FuzzOperatingPoints(f *testing.F) {
	for _, s := range []struct {
		lj0, ljsc, rs, v float64
		bulk             bool
	}{{0.5, 0.8, 0.25, 0.9, true}, {0, 0, 0, 0, false}, {0.99, 0.99, 0.99, 0.99, true}, {0.2, 0.1, 0.6, 0.3, false}, {0.7, 0.95, 0.01, 1.04, true}} {
		f.Add(s.lj0, s.ljsc, s.rs, s.v, s.bulk)
	}
	m, err := defaultMaterial()
	if err != nil {
		f.Fatal(err)
	}
	f.Fuzz(func(t *testing.T, lj0, ljsc, rsu, vu float64, bulk bool) {
		for _, x := range []float64{lj0, ljsc, rsu, vu} {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				t.Skip()
			}
		}
		j0 := math.Pow(10, -16+7*unit(lj0))
		jsc := math.Pow(10, -4+3*unit(ljsc))
		rs := 2 * unit(rsu)
		d := j0Design(m, j0, jsc, rs)
		if bulk {
			d.Base.Mechanisms = []recomb.Mechanism{recomb.NewIntrinsic()}
		}
		dev := mustDevice(t, d)
		oc, err := dev.OpenCircuit()
		if err != nil {
			t.Fatalf("J0=%g Jsc=%g Rs=%g: %v", j0, jsc, rs, err)
		}
		b, err := dev.RecombinationAtExcess(oc.Dn)
		if err != nil {
			t.Fatal(err)
		}
		if e := relErr(b.Total, jsc); e > 1e-11 {
			t.Errorf("J0=%g Jsc=%g: J_rec at the open circuit %.15g, want Jsc (rel %g)", j0, jsc, b.Total, e)
		}
		if !bulk {
			want, err := IdealDiodeVoc(j0, jsc, 1, m)
			if err != nil {
				t.Fatal(err)
			}
			if e := relErr(oc.V, want); e > 1e-13 {
				t.Errorf("J0=%g Jsc=%g: Voc %.15g V, ideal diode %.15g V", j0, jsc, oc.V, want)
			}
		}
		v := -jsc*rs + unit(vu)*(1.05*oc.V+jsc*rs)
		p, err := dev.OperatingPoint(v)
		if err != nil {
			t.Fatalf("J0=%g Jsc=%g Rs=%g v=%g: %v", j0, jsc, rs, v, err)
		}
		if math.Abs(p.Vi-p.J*rs-v) > 1e-12 || !(p.J <= jsc) {
			t.Errorf("J0=%g Jsc=%g Rs=%g: at v = %.15g V, Vi − J Rs = %.15g V, J = %g", j0, jsc, rs, v, p.Vi-p.J*rs, p.J)
		}
		mp, err := dev.MaxPower()
		if err != nil {
			t.Fatalf("J0=%g Jsc=%g Rs=%g: %v", j0, jsc, rs, err)
		}
		if p.P > mp.P*(1+1e-12) {
			t.Errorf("J0=%g Jsc=%g Rs=%g: P(%g V) = %g above Pmp = %g", j0, jsc, rs, v, p.P, mp.P)
		}
	})
}

// FuzzIdealDiodeFF fuzzes the inversion in IdealDiodeFF over normalised voc from 0.01 to 43
// (below Eg/kT at 300 K): the FF lies in (1/4, 1) (a linear diode gives 1/4), rises with voc,
// and for voc >= 10 agrees with Green's FF0 to 2e-4 (M. A. Green, Solid-State Electronics 24,
// 788 (1981); accuracy as in TestGreenFillFactor, value from memory).
func FuzzIdealDiodeFF(f *testing.F) {
	for _, s := range []float64{0, 0.1, 0.3, 0.6, 0.99} {
		f.Add(s)
	}
	m, err := defaultMaterial()
	if err != nil {
		f.Fatal(err)
	}
	f.Fuzz(func(t *testing.T, x float64) {
		if math.IsNaN(x) || math.IsInf(x, 0) {
			t.Skip()
		}
		u := 0.01 + 42.99*unit(x)
		ff, err := IdealDiodeFF(u*m.Vt(), 1, m)
		if err != nil {
			t.Fatalf("voc = %g: %v", u, err)
		}
		up, err := IdealDiodeFF(1.001*u*m.Vt(), 1, m)
		if err != nil {
			t.Fatal(err)
		}
		if !(ff > 0.25 && ff < 1 && up > ff) {
			t.Errorf("voc = %g: FF = %.15g, at 1.001 voc %.15g", u, ff, up)
		}
		if g := (u - math.Log(u+0.72)) / (u + 1); u >= 10 && math.Abs(g-ff) > 2e-4 {
			t.Errorf("voc = %g: FF = %.6f, Green FF0 %.6f", u, ff, g)
		}
	})
}
