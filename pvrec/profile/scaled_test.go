package profile

import (
	"errors"
	"math"
	"strings"
	"testing"

	"github.com/pvrec/pvrec/pvrec/internal/check"
	"github.com/pvrec/pvrec/pvrec/silicon"
)

// TestScaledDefinition checks Scaled against its definition on an Erfc, whose closed form
// N = Ns erfc(x/L) (Sze and Ng 2007) gives every scaled density, dose and junction exactly:
// identity, density factor, stretch, a positive shift (surface value held above it) and an
// etch-back (negative shift).
func TestScaledDefinition(t *testing.T) {
	const ns, l = 1e20, 0.3e-4
	e := Erfc{Dopant: silicon.Donor, Surface: ns, Length: l}
	want := func(c, stretch, shift, x float64) float64 {
		return c * ns * math.Erfc(math.Max(0, (x-shift)/stretch)/l)
	}
	for _, tc := range []struct{ c, stretch, shift float64 }{
		{1, 1, 0}, {1.2, 1, 0}, {1, 1.1, 0}, {0.8, 0.9, 0.05e-4}, {1, 1, -0.1e-4}, {1.5, 1.3, -0.02e-4},
	} {
		s := Scaled{Profile: e, Density: tc.c, Stretch: tc.stretch, Shift: tc.shift}
		for _, x := range []float64{0, 0.01e-4, 0.05e-4, 0.2e-4, 0.6e-4, 1.5e-4} {
			nd, na, err := s.Dopants(x)
			if err != nil {
				t.Fatal(err)
			}
			if w := want(tc.c, tc.stretch, tc.shift, x); relDiff(nd, w) > 1e-14 || na != 0 {
				t.Errorf("%v at x = %g cm: nd, na = %g, %g, want %g, 0", s, x, nd, na, w)
			}
		}
		// Dose of the layer: c·Ns·(stretch·L·∫_a^∞ erfc(u) du + the held surface layer), with
		// ∫_a^∞ erfc(u) du = ierfc(a) = exp(−a²)/√π − a erfc(a) (M. Abramowitz and I. A.
		// Stegun, Handbook of Mathematical Functions, 1964, §7.2) and a = max(0, −shift)/(stretch·L).
		a := math.Max(0, -tc.shift) / (tc.stretch * l)
		ierfc := math.Exp(-a*a)/math.SqrtPi - a*math.Erfc(a)
		wantDose := tc.c * ns * (tc.stretch*l*ierfc + math.Max(0, tc.shift))
		got, err := Dose(s, silicon.Donor, 0, s.Extent())
		if err != nil {
			t.Fatal(err)
		}
		if relDiff(got, wantDose) > 1e-9 {
			t.Errorf("Dose(%v) = %.12g cm^-2, want %.12g", s, got, wantDose)
		}
		// The junction with a background moves with the scaled profile.
		const nbg = 1e16
		xj, err := JunctionDepth(Sum{s, Uniform{Dopant: silicon.Acceptor, N: nbg}})
		if err != nil {
			t.Fatal(err)
		}
		wantXj := tc.shift + tc.stretch*l*math.Erfcinv(nbg/(tc.c*ns))
		if relDiff(xj, wantXj) > 1e-12 {
			t.Errorf("junction of %v: %.15g cm, want %.15g", s, xj, wantXj)
		}
	}
}

// TestScaledBadInput checks the errors: zero value, nil profile, factors out of range,
// densities beyond the atom density, and the wrapped profile's own errors passed on.
func TestScaledBadInput(t *testing.T) {
	e := Erfc{Dopant: silicon.Donor, Surface: 1e20, Length: 0.3e-4}
	for _, tc := range []struct {
		s    Scaled
		want string
	}{
		{Scaled{}, "Profile is nil"},
		{Scaled{Profile: e, Stretch: 1}, "Density"},
		{Scaled{Profile: e, Density: 1}, "Stretch"},
		{Scaled{Profile: e, Density: -1, Stretch: 1}, "Density"},
		{Scaled{Profile: e, Density: math.NaN(), Stretch: 1}, "Density"},
		{Scaled{Profile: e, Density: 2e3, Stretch: 1}, "MaxScale"},
		{Scaled{Profile: e, Density: 1, Stretch: math.Inf(1)}, "Stretch"},
		{Scaled{Profile: e, Density: 1, Stretch: 1, Shift: 11}, "MaxDepthCm"},
		{Scaled{Profile: e, Density: 1, Stretch: 1, Shift: math.NaN()}, "Shift"},
		{Scaled{Profile: e, Density: 600, Stretch: 1}, "atomic density"},
		{Scaled{Profile: Erfc{Dopant: silicon.Donor, Surface: 1e20}, Density: 1, Stretch: 1}, "Length"},
	} {
		_, _, err := tc.s.Dopants(0)
		if err == nil || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%v.Dopants(0): err %v, want one naming %q", tc.s, err, tc.want)
		}
		if tc.s.validate() != nil && tc.s.Extent() != 0 {
			t.Errorf("%v.Extent() = %g for invalid parameters, want 0", tc.s, tc.s.Extent())
		}
	}
	if _, _, err := (Scaled{Profile: e, Density: 2e3, Stretch: 1}).Dopants(0); !errors.Is(err, check.ErrOutOfRange) {
		t.Errorf("factor beyond MaxScale: err %v, want ErrOutOfRange", err)
	}
	if _, _, err := (Scaled{Profile: e, Density: 1, Stretch: 1}).Dopants(-1e-4); err == nil {
		t.Error("negative depth: no error")
	}
}
