package surface

import (
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec/recomb"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// TestSeffJ0sRoundTrip: J0sFromSeff and SeffFromJ0s are inverses (round trip Seff → J0s →
// Seff, issue 6) over both polarities, the Δn and doping range, with the default
// material (carrier-dependent BGN, so ni,eff ≠ ni,eff0). Tolerance: a few ulp.
func TestSeffJ0sRoundTrip(t *testing.T) {
	mat := defaultMaterial(t)
	for _, dop := range gridDop {
		for _, pType := range []bool{true, false} {
			nd, na := dop, 0.0
			if pType {
				nd, na = 0, dop
			}
			for _, dn := range gridDn {
				b := mustBulk(t, mat, nd, na, dn)
				for _, s := range []float64{0, 1e-3, 1, 10, 1e3, 1e5, 1e7} {
					j, err := J0sFromSeff(s, b)
					if err != nil {
						t.Fatal(err)
					}
					s2, err := SeffFromJ0s(j, b)
					if err != nil {
						t.Fatal(err)
					}
					if relErr(s2, s) > 1e-14 {
						t.Errorf("dop %g Δn %g: Seff %g → J0s %g → %g", dop, dn, s, j, s2)
					}
				}
			}
		}
	}
}

// TestCuevasMacdonaldForm: with an injection-independent ni (no BGN, Boltzmann) the relation
// is Seff = J0s (n0 + p0 + Δn)/(q ni²), and it approaches the form Seff = J0s (N + Δn)/(q ni²)
// of A. Cuevas and D. Macdonald, Solar Energy 76, 255 (2004), to within twice the minority
// equilibrium density (n0 + p0 = N + 2 n0 for p-type), 2 n0/(N + Δn) relative.
func TestCuevasMacdonaldForm(t *testing.T) {
	mat := refMaterial(t)
	const j0s = 10e-15 // 10 fA/cm^2
	for _, c := range []struct{ nd, na, dn float64 }{
		{0, 1e16, 1e15}, {0, 1e14, 1e12}, {1e18, 0, 1e12}, {1e15, 0, 1e17}, {0, 1e10, 1e9},
	} {
		b := mustBulk(t, mat, c.nd, c.na, c.dn)
		s, err := SeffFromJ0s(j0s, b)
		if err != nil {
			t.Fatal(err)
		}
		ni := 1e10
		exact := j0s * (b.N0 + b.P0 + c.dn) / (silicon.ElementaryCharge * ni * ni)
		if relErr(s, exact) > 1e-14 {
			t.Errorf("%+v: Seff %.15g, want %.15g", c, s, exact)
		}
		N := math.Abs(c.nd - c.na)
		cm := j0s * (N + c.dn) / (silicon.ElementaryCharge * ni * ni)
		minority := math.Min(b.N0, b.P0)
		if relErr(s, cm) > 2*minority/(N+c.dn)+1e-14 {
			t.Errorf("%+v: Seff %.15g vs Cuevas–Macdonald form %.15g", c, s, cm)
		}
	}
}

// TestConstantModels: ConstantSeff returns its S; ConstantJ0s follows SeffFromJ0s.
func TestConstantModels(t *testing.T) {
	b := mustBulk(t, defaultMaterial(t), 0, 1e16, 1e15)
	s, err := ConstantSeff{S: 12}.Seff(b)
	if err != nil || s != 12 {
		t.Errorf("ConstantSeff: %g, %v", s, err)
	}
	s, err = ConstantJ0s{J0s: 1e-14}.Seff(b)
	want, _ := SeffFromJ0s(1e-14, b)
	if err != nil || s != want {
		t.Errorf("ConstantJ0s: %g, %v; want %g", s, err, want)
	}
	for _, m := range []Model{ConstantSeff{S: 1}, ConstantJ0s{J0s: 1e-14}, NewExtendedSRH(ConstantDit{1e10}, ConstantSigma(1e-16), ConstantSigma(1e-16), -1e12)} {
		if m.String() == "" {
			t.Errorf("%T: empty String", m)
		}
	}
	if got := (ConstantSeff{S: 10}).String(); got != "ConstantSeff(10 cm/s)" {
		t.Errorf("String = %q", got)
	}
}

func TestRelationErrors(t *testing.T) {
	b := mustBulk(t, defaultMaterial(t), 0, 1e16, 1e15)
	bad := b
	bad.Dn = -1
	for name, f := range map[string]func() (float64, error){
		"SeffFromJ0s NaN":   func() (float64, error) { return SeffFromJ0s(math.NaN(), b) },
		"SeffFromJ0s neg":   func() (float64, error) { return SeffFromJ0s(-1, b) },
		"SeffFromJ0s bulk":  func() (float64, error) { return SeffFromJ0s(1e-14, bad) },
		"J0sFromSeff Inf":   func() (float64, error) { return J0sFromSeff(math.Inf(1), b) },
		"J0sFromSeff bulk":  func() (float64, error) { return J0sFromSeff(1, recomb.State{}) },
		"ConstantSeff neg":  func() (float64, error) { return ConstantSeff{S: -1}.Seff(b) },
		"ConstantSeff bulk": func() (float64, error) { return ConstantSeff{S: 1}.Seff(bad) },
		"ConstantJ0s NaN":   func() (float64, error) { return ConstantJ0s{J0s: math.NaN()}.Seff(b) },
		"np − ni² not positive": func() (float64, error) {
			x := b
			x.NiEff = 1e18 // a BGN model raising ni,eff far faster than n p
			x.Excess = x.N*x.P - x.NiEff*x.NiEff
			return SeffFromJ0s(1e-14, x)
		},
	} {
		v, err := f()
		if err == nil {
			t.Errorf("%s: no error (got %g)", name, v)
		} else if !strings.HasPrefix(err.Error(), "surface: ") {
			t.Errorf("%s: %q lacks the package prefix", name, err)
		}
	}
}
