package j0

import (
	"errors"
	"math"
	"testing"

	"github.com/pvrec/pvrec/pvrec/profile"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// stepJunction is an abrupt junction: donors nd above xj, acceptors na below.
type stepJunction struct{ nd, na, xj float64 }

func (s stepJunction) Dopants(x float64) (float64, float64, error) {
	if x < s.xj {
		return s.nd, 0, nil
	}
	return 0, s.na, nil
}
func (s stepJunction) Extent() float64 { return 2 * s.xj }

// gradedJunction is a linearly graded junction of gradient a (cm^-4) at xj, to depth 3 xj.
type gradedJunction struct{ a, xj float64 }

func (g gradedJunction) Dopants(x float64) (float64, float64, error) {
	n := g.a * (g.xj - math.Min(x, 3*g.xj))
	if n > 0 {
		return n, 0, nil
	}
	return 0, -n, nil
}
func (g gradedJunction) Extent() float64 { return 3 * g.xj }

// TestSpaceChargeAbrupt checks SpaceChargeRegion on abrupt junctions against the depletion
// approximation of the textbooks (S. M. Sze and K. K. Ng, Physics of Semiconductor Devices,
// 3rd ed., Wiley 2007, chapter 2):
//
//	W = sqrt(2 ε Vbi (Na + Nd)/(q Na Nd)),  xj − xn = W Na/(Na + Nd),  Vbi = Vt ln(Na Nd/ni²).
//
// The tabulation resolves the step to 1e-6 xj, so the tolerance is 1e-4.
func TestSpaceChargeAbrupt(t *testing.T) {
	m := mustModels(t, SimpleModels).Material
	eps := silicon.RelativePermittivity * eps0
	q := silicon.ElementaryCharge
	for _, tc := range []struct{ nd, na, xj float64 }{
		{1e18, 1e16, 1e-4}, {1e17, 1e17, 0.5e-4}, {1e16, 1e15, 3e-4}, {1e19, 1e18, 0.2e-4},
	} {
		sc, err := SpaceChargeRegion(stepJunction{tc.nd, tc.na, tc.xj}, m)
		if err != nil {
			t.Fatal(err)
		}
		vbi := m.Vt() * math.Log(tc.nd*tc.na/(m.Ni()*m.Ni()))
		w := math.Sqrt(2 * eps * vbi * (tc.na + tc.nd) / (q * tc.na * tc.nd))
		xn := w * tc.na / (tc.na + tc.nd)
		xp := w * tc.nd / (tc.na + tc.nd)
		if relDiff(tc.xj-sc.Front, xn) > 1e-4 || relDiff(sc.Back-tc.xj, xp) > 1e-4 || relDiff(sc.Vbi, vbi) > 1e-6 || relDiff(sc.Junction, tc.xj) > 1e-12 {
			t.Errorf("%+v: xn %g xp %g Vbi %g, want %g %g %g", tc, tc.xj-sc.Front, sc.Back-tc.xj, sc.Vbi, xn, xp, vbi)
		}
		if relDiff(sc.Charge, tc.nd*xn) > 1e-4 {
			t.Errorf("%+v: charge %g, want %g", tc, sc.Charge, tc.nd*xn)
		}
	}
}

// TestSpaceChargeGraded checks a linearly graded junction, N = a (xj − x), against the
// textbook depletion approximation (Sze and Ng 2007, chapter 2): symmetric, W = (12 ε Vbi/(q
// a))^(1/3), Vbi = 2 Vt ln(a W/(2 ni)), solved here by fixed-point iteration. The
// interpolation is exact for a linear profile, so the tolerance is 1e-6.
func TestSpaceChargeGraded(t *testing.T) {
	m := mustModels(t, SimpleModels).Material
	eps := silicon.RelativePermittivity * eps0
	q := silicon.ElementaryCharge
	for _, a := range []float64{1e20, 1e22, 1e24} {
		g := gradedJunction{a: a, xj: 2e-4}
		sc, err := SpaceChargeRegion(g, m)
		if err != nil {
			t.Fatal(err)
		}
		w := 1e-5
		for k := 0; k < 200; k++ {
			vbi := 2 * m.Vt() * math.Log(a*w/(2*m.Ni()))
			w = math.Cbrt(12 * eps * vbi / (q * a))
		}
		if relDiff(sc.Back-sc.Front, w) > 1e-6 || relDiff(g.xj-sc.Front, w/2) > 1e-6 {
			t.Errorf("a = %g: edges %g, %g (width %g), want width %g, symmetric", a, sc.Front, sc.Back, sc.Back-sc.Front, w)
		}
	}
}

// TestSpaceChargeErrors checks the failure modes: no junction, and a surface layer too thin
// to hold the depletion charge.
func TestSpaceChargeErrors(t *testing.T) {
	m := mustModels(t, SimpleModels).Material
	if _, err := SpaceChargeRegion(profile.Uniform{Dopant: silicon.Donor, N: 1e16}, m); !errors.Is(err, profile.ErrNoJunction) {
		t.Errorf("uniform: err %v", err)
	}
	if _, err := SpaceChargeRegion(stepJunction{nd: 1e15, na: 1e18, xj: 1e-6}, m); err == nil {
		t.Errorf("fully depleted layer: no error")
	}
	if _, err := SpaceChargeRegion(nil, m); err == nil {
		t.Errorf("nil profile: no error")
	}
}
